using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Intake.Tests;

/// <summary>How lab exports and hand-kept cellar sheets write values the lab could not or did not quantify.</summary>
public class LabExportTests
{
    [Theory]
    [InlineData("<1")]
    [InlineData("< 0.5 g/L")]
    [InlineData("ND")]
    [InlineData("n.d.")]
    [InlineData("<LOD")]
    [InlineData("dry")]
    [InlineData("sec")]
    public void A_residual_sugar_below_the_labs_limit_keeps_the_lot_and_is_said(string rs)
    {
        // Given a lab export whose residual sugar is written as the lab's "below limit" notation
        using var folder = new TestFolder();
        folder.Text("lab-2024.csv", $"Lot,Yeast,Brix,Alcohol,RS g/L\nL1,QX-7,24.0,14.1,{rs}\nL2,QX-7,23.0,13.5,1.2\n");

        // When it is read
        var set = folder.Read("lab-2024.csv");

        // Then both lots are used; the first has no residual sugar (taken as dry by the review) and one warning says why
        Assert.Equal(["L1", "L2"], set.Lots.Select(l => l.LotId));
        Assert.Null(set.Lots[0].ResidualSugarGl);
        Assert.Equal(1.2, set.Lots[1].ResidualSugarGl);
        var issue = Assert.Single(set.Issues, i => i.Code == IssueCodes.BelowLabLimit);
        Assert.Equal(IssueSeverity.Warning, issue.Severity);
        Assert.Equal((2, "RS g/L", rs), (issue.Row, issue.Column, issue.Value));
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
    }

    [Fact]
    public void A_lab_limit_above_the_dryness_limit_leaves_the_lot_out_with_the_reason()
    {
        // Given a residual sugar recorded only as "<10" (an off-dry wine could be below it)
        using var folder = new TestFolder();
        folder.Text("lab-2024.csv", "Lot,Yeast,Brix,Alcohol,RS g/L\nL1,QX-7,24.0,14.1,<10\n");

        // When it is read
        var set = folder.Read("lab-2024.csv");

        // Then the lot is left out, and the message says a limit of 10 g/L cannot tell dry from stopped short
        Assert.Empty(set.Lots);
        var issue = Assert.Single(set.Issues, i => i.Code == IssueCodes.BelowLabLimit);
        Assert.Equal(IssueSeverity.Error, issue.Severity);
        Assert.Contains("below 10 g/L", issue.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Hydrometer_readings_noted_as_SG_before_the_number_are_read_in_a_column_with_no_stated_scale()
    {
        // Given a log whose Reading column notes every gravity as "SG 1.045", down to below 1
        using var folder = new TestFolder();
        folder.Text("log-2025.csv", "Lot,Date,Reading\nW1,2025-09-20,SG 1.098\nW1,2025-09-23,SG 1.060\nW1,2025-09-26,SG: 1.012\nW1,2025-09-29,sg 0.996\n");

        // When it is read
        var set = folder.Read("log-2025.csv");

        // Then all four readings are used, in SG, the column's scale said once from its values
        var log = Assert.Single(set.Logs);
        Assert.Equal([1.098, 1.060, 1.012, 0.996], log.Readings.Select(r => Math.Round(r.Sugar!.Value.SpecificGravity, 3)));
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
        Assert.Single(set.Issues, i => i.Code == IssueCodes.UnitFromValues);
    }

    [Fact]
    public void A_reading_written_in_another_scale_than_its_column_is_still_refused()
    {
        // Given a gravity column with one reading noted as "Bx 12"
        using var folder = new TestFolder();
        folder.Text("log-2025.csv", "Lot,Date,Reading\nW1,2025-09-20,SG 1.098\nW1,2025-09-23,Bx 12\nW1,2025-09-26,1.012\n");

        // When it is read
        var set = folder.Read("log-2025.csv");

        // Then that reading is reported, naming the unit written and the column's, and the others are used
        var issue = Assert.Single(set.Issues, i => i.Severity == IssueSeverity.Error);
        Assert.Equal((IssueCodes.UnitInCellDiffers, 3, "Bx 12"), (issue.Code, issue.Row, issue.Value));
        Assert.Equal(2, Assert.Single(set.Logs).Readings.Count);
    }

    [Fact]
    public void Dates_a_spreadsheet_saved_to_csv_as_serial_numbers_are_read_as_dates()
    {
        // Given a lots CSV whose inoculation dates are the spreadsheet's day numbers (45920 is 2025-09-20 in the 1900
        // date system: Excel DATE(2025,9,20), common practice), one with a time of day
        using var folder = new TestFolder();
        folder.Text("lots-2025.csv", "Lot,Yeast,SG,ABV,Inoculated\nW1,WR-1,1.098,13.6,45920\nW2,WR-1,1.102,14.0,45921.375\n");

        // When it is read
        var set = folder.Read("lots-2025.csv");

        // Then the dates are read, with no issue
        Assert.Equal([new DateTime(2025, 9, 20), new DateTime(2025, 9, 21, 9, 0, 0)], set.Lots.Select(l => l.InoculationDate));
        Assert.DoesNotContain(set.Issues, i => i.Code == IssueCodes.NotADate);
    }

    [Fact]
    public void A_must_density_noted_in_thousandths_is_read_as_specific_gravity_and_said()
    {
        // Given a French cellar export whose "Densité moût" holds 1090, 1104 (SG 1.090, 1.104) with no unit, tab-separated
        using var folder = new TestFolder();
        folder.Text("cave-2024.csv", "Lot\tLevure\tDensité moût\tTAV (% vol)\n24-01\tLV-21\t1090\t12,6\n24-02\tLV-21\t1104\t14,3\n");

        // When it is read
        var set = folder.Read("cave-2024.csv");

        // Then the lots are used at SG 1.090 and 1.104 (kept as SG), and the reading of the column is said once
        Assert.Equal([1.090, 1.104], set.Lots.Select(l => Math.Round(l.StartingSugar.SpecificGravity, 4)));
        Assert.Equal([1.090, 1.104], set.Lots.Select(l => l.RecordedStartingSugar.Value));
        var issue = Assert.Single(set.Issues, i => i.Code == IssueCodes.UnitFromValues);
        Assert.Contains("SG × 1000", issue.Message, StringComparison.Ordinal);
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
    }

    [Fact]
    public void A_log_of_densities_in_thousandths_down_to_below_1000_is_read_as_specific_gravity()
    {
        // Given a log whose density column runs from 1092 down to 994 (SG 1.092 to 0.994)
        using var folder = new TestFolder();
        folder.Text("suivi-2024.csv", "Lot;Date;Density\n24-01;2024-09-10;1092\n24-01;2024-09-14;1040\n24-01;2024-09-20;994\n");

        // When it is read
        var set = folder.Read("suivi-2024.csv");

        // Then every reading is used, as SG
        Assert.Equal([1.092, 1.040, 0.994], Assert.Single(set.Logs).Readings.Select(r => Math.Round(r.Sugar!.Value.SpecificGravity, 4)));
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
    }

    [Fact]
    public void A_spanish_lots_sheet_in_baume_is_read_from_its_own_headers()
    {
        // Given a Spanish cellar's lots with Baumé, a water addition and a sowing (inoculation) date
        using var folder = new TestFolder();
        folder.Text("lotes.csv", "Lote;Añada;Depósito;Levadura;Grado Baumé;Volumen (L);Agua añadida (L);Grado alcohólico;Azúcares residuales (g/L);Fecha siembra\n"
            + "0121;2023;D1;TN-5;13,4;5000;0;14,3;1,8;2023-09-06\n");

        // When it is read
        var set = folder.Read("lotes.csv");

        // Then every column is mapped to its field and the lot is read with its values
        Assert.DoesNotContain(set.Issues, i => i.Code == IssueCodes.ColumnNotUsed);
        var lot = Assert.Single(set.Lots);
        Assert.Equal(("0121", 2023, "D1", "TN-5", 14.3, 1.8), (lot.LotId, lot.Season, lot.Vessel, lot.Strain, lot.FinalAlcohol.PercentVolume, lot.ResidualSugarGl));
        Assert.Equal((13.4, SugarScale.Baume), (lot.RecordedStartingSugar.Value, lot.RecordedStartingSugar.Scale));
        Assert.Equal(new DateTime(2023, 9, 6), lot.InoculationDate);
        Assert.Equal((5000.0, 0.0), (lot.Additions.MustVolumeL, lot.Additions.WaterAddedL));
    }

    [Fact]
    public void An_italian_sheet_with_must_and_wine_groups_is_read_from_its_own_headers()
    {
        // Given an Italian lab book: "Mosto" over must sugar (g/L), water and sucrose; "Vino" over alcohol and residual sugar
        using var folder = new TestFolder();
        folder.Text("cantina-2024.csv", ",,,Mosto,,,Vino,\nLotto,Vasca,Lievito,Zuccheri (g/L),Acqua aggiunta (L),Saccarosio (kg),Alcol (% vol),Zuccheri residui (g/L)\n"
            + "IT01,V1,VR-8,228,0,0,13.3,1.5\n");

        // When it is read
        var set = folder.Read("cantina-2024.csv");

        // Then must sugar is the starting sugar in g/L and the wine's sugar the residual sugar
        Assert.DoesNotContain(set.Issues, i => i.Code == IssueCodes.ColumnNotUsed);
        var lot = Assert.Single(set.Lots);
        Assert.Equal((228.0, SugarScale.GramsPerLitre), (lot.RecordedStartingSugar.Value, lot.RecordedStartingSugar.Scale));
        Assert.Equal((13.3, 1.5, "V1", "VR-8"), (lot.FinalAlcohol.PercentVolume, lot.ResidualSugarGl, lot.Vessel, lot.Strain));
    }

    [Fact]
    public void A_log_whose_lot_id_lost_its_leading_zero_names_the_lot_it_may_be()
    {
        // Given lots typed as text "0122" and a log where the same id was typed as a number, 122
        using var folder = new TestFolder();
        folder.Text("lots-2023.csv", "Lot,Yeast,Brix,Alcohol\n0122,QX-7,24.0,14.1\n");
        folder.Text("log-2023.csv", "Lot,Date,Brix\n122,2023-09-06,24.0\n122,2023-09-12,0.5\n");

        // When both are read
        var set = folder.Read("lots-2023.csv", "log-2023.csv");

        // Then the log is not joined by a guess, and the warning names lot 0122 and the fix
        var issue = Assert.Single(set.Issues, i => i.Code == IssueCodes.LogWithoutLot);
        Assert.Contains("Lot '0122' differs only in leading zeros", issue.Message, StringComparison.Ordinal);
        Assert.DoesNotContain(set.Logs, l => l.LotId == "0122");
    }

    [Fact]
    public void A_lot_split_into_two_tanks_under_one_id_is_reported_with_how_to_keep_both()
    {
        // Given lot 22CS03 entered twice, once for tank T3A and once for T3B
        using var folder = new TestFolder();
        folder.Text("lab-2022.csv", "Lot,Tank,Yeast,Brix,Alcohol\n22CS03,T3A,BK-11,25.4,15.0\n22CS03,T3B,BK-11,25.4,15.0\n");

        // When it is read
        var set = folder.Read("lab-2022.csv");

        // Then the first is kept, and the error on the second names both tanks and a split id to give
        Assert.Equal("T3A", Assert.Single(set.Lots).Vessel);
        var issue = Assert.Single(set.Issues, i => i.Code == IssueCodes.DuplicateLot);
        Assert.Equal(3, issue.Row);
        Assert.Contains("different vessels (T3A and T3B)", issue.Message, StringComparison.Ordinal);
        Assert.Contains("22CS03-T3B", issue.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("Mon 8am", "is not a date: it names a day of the week but no date")]
    [InlineData("9/15 8am", "is not a date: it has a day and month but no year")]
    [InlineData("someday", "is not a date. Write dates")]
    public void An_inoculation_written_without_a_full_date_says_what_it_lacks(string text, string expected)
    {
        // Given a running-lots table whose inoculation is typed as on a whiteboard
        using var folder = new TestFolder();
        folder.Text("now-2026.csv", $"Lot,Yeast,Brix,Inoculated\nR1,QX-7,24.8,{text}\n");

        // When it is read as lots still fermenting
        var set = folder.Read(new IntakeOptions { RunningLots = true }, "now-2026.csv");

        // Then the lot is used without an inoculation date, and the warning says what the text lacks
        Assert.Null(Assert.Single(set.RunningLots).InoculationDate);
        var issue = Assert.Single(set.Issues, i => i.Code == IssueCodes.NotADate);
        Assert.Contains("inoculation_date " + expected, issue.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void An_Austrian_lots_sheet_in_KMW_is_read_through_Oechsle()
    {
        // Given a lots table whose must weight is in °KMW (°Babo), as Austrian and Italian cellars record it (invented lots)
        using var folder = new TestFolder();
        folder.Text("lese-2024.csv", "Los;Hefe;Mostgewicht (°KMW);Alkohol % vol\nL1;AT-3;19,5;13,2\nL2;AT-3;21,0;14,1\n");

        // When it is read
        var set = folder.Read("lese-2024.csv");

        // Then both lots are used with the °Brix of their °KMW (through °Oe = KMW·(0.022·KMW + 4.54)), the recorded
        // value keeps its scale, and no unit had to be guessed from the values (°KMW overlaps °Brix)
        Assert.Equal(2, set.Lots.Count);
        Assert.Equal(SugarReading.FromKmw(19.5).Brix, set.Lots[0].StartingSugar.Brix, 1e-9);
        Assert.Equal(SugarReading.FromOechsle(21.0 * ((0.022 * 21.0) + 4.54)).Brix, set.Lots[1].StartingSugar.Brix, 1e-9);
        Assert.Equal(SugarScale.Kmw, set.Lots[0].StartingSugarScale);
        Assert.DoesNotContain(set.Issues, i => i.Code == IssueCodes.UnitFromValues || i.Severity == IssueSeverity.Error);
    }

    [Fact]
    public void Season_headings_dividing_one_sheet_give_the_season_of_the_lots_below_them()
    {
        // Given one lots sheet with no season column, divided by heading rows "Vintage 2023" and "2024 harvest"
        using var folder = new TestFolder();
        folder.Text("ferment records.csv", "Lot,Yeast,Brix,Alc %\nVintage 2023,,,\nH1,HG-2,24.0,14.1\nH2,HG-5,23.0,13.5\n,,,\n2024 harvest,,,\nH1,HG-2,25.0,14.7\n");

        // When it is read
        var set = folder.Read("ferment records.csv");

        // Then each lot takes the season of the heading above it (H1 is two lots, one per season), and each heading
        // is said once and counted with the summary rows (structure), so no row is left out and check reports none
        Assert.Equal([("H1", 2023), ("H2", 2023), ("H1", 2024)], set.Lots.Select(l => (l.LotId, l.Season)));
        Assert.Equal([2, 6], set.Issues.Where(i => i.Code == IssueCodes.SeasonHeading).Select(i => i.Row ?? 0));
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
        var account = Assert.Single(set.Accounts);
        Assert.Equal((6, 3, 0, 1, 2), (account.RowsRead, account.LotsUsed, account.RowsReported, account.BlankRowsSkipped, account.SummaryRowsSkipped));
        Assert.True(account.Balances);
        Assert.False(IntakeReport.AnyRowLeftOut(set));
    }

    [Theory]
    [InlineData("2023")]
    [InlineData("Tank 2023 topped up")]
    public void A_year_without_a_season_word_is_no_season_heading(string text)
    {
        Assert.Null(RowAccounting.SeasonHeading([text, null, null]));
    }

    [Fact]
    public void A_lab_export_with_units_under_its_headers_states_the_units_of_residual_sugar_ta_and_yan()
    {
        // Given a tab-separated lab export with a UTF-8 byte-order mark, a "Sample ID" column, and the units in a
        // second row: g/L under RS and TA, mg/L under YAN, % under a second sheet's RS
        using var folder = new TestFolder();
        folder.Text("lims 2024.txt", "\uFEFFSample ID\tStrain\tBrix\tEthanol\tRS\tTA\tYAN\n\t\t°Bx\t% v/v\tg/L\tg/L\tmg/L\nK24-01\tKR-3\t24.1\t14.2\t1.5\t6.1\t210\n");
        folder.Text("lims pct 2024.txt", "Sample ID\tStrain\tBrix\tEthanol\tRS\n\t\t°Bx\t% v/v\t%\nK24-02\tKR-3\t24.1\t14.2\t0.15\n");

        // When they are read
        var set = folder.Read("lims 2024.txt", "lims pct 2024.txt");

        // Then the sample id is the lot, no unit is said to be assumed, and RS in % is g per 100 mL (0.15 % = 1.5 g/L)
        Assert.Equal(["K24-01", "K24-02"], set.Lots.Select(l => l.LotId));
        Assert.DoesNotContain(set.Issues, i => i.Code == IssueCodes.UnitAssumed);
        Assert.Equal([1.5, 1.5], set.Lots.Select(l => l.ResidualSugarGl));
        Assert.Equal((6.1, 210.0), (set.Lots[0].TaGl, set.Lots[0].YanMgL));
    }

    [Theory]
    [InlineData("n/a")]
    [InlineData("-")]
    [InlineData("NA")]
    [InlineData("\u2014")]
    public void A_mark_for_not_measured_is_an_empty_value_not_a_lost_lot(string mark)
    {
        // Given a lab export writing a mark instead of residual sugar, pH and YAN it did not measure
        using var folder = new TestFolder();
        folder.Text("lab-2024.csv", $"Lot,Yeast,Brix,Alcohol % v/v,RS g/L,pH,YAN mg/L\nL1,QX-7,24.0,14.1,{mark},{mark},{mark}\n");

        // When it is read
        var set = folder.Read("lab-2024.csv");

        // Then the lot is used with those values empty, and nothing is reported (as for empty cells)
        var lot = Assert.Single(set.Lots);
        Assert.Equal((null, null, null), (lot.ResidualSugarGl, lot.Ph, lot.YanMgL));
        Assert.Empty(set.Issues);
    }

    [Fact]
    public void A_mark_for_not_measured_in_a_required_value_is_a_missing_value()
    {
        // Given a lot whose final alcohol is "n/a"
        using var folder = new TestFolder();
        folder.Text("lab-2024.csv", "Lot,Yeast,Brix,Alcohol\nL1,QX-7,24.0,n/a\n");

        // When it is read
        var set = folder.Read("lab-2024.csv");

        // Then the lot is left out as missing its alcohol, the value shown as written
        var issue = Assert.Single(set.Issues);
        Assert.Equal((IssueCodes.MissingValue, "n/a"), (issue.Code, issue.Value));
    }

    [Fact]
    public void Must_sugar_written_as_potential_alcohol_is_read_through_the_eu_convention()
    {
        // Given a French cellar's "Degré potentiel (% vol)" of 13.5 and 14.0: 227.2 and 235.6 g/L of sugar at 16.83 g/L
        // per % vol (OIV/EU convention), which the OIV must table puts at about 24.3 and 25.0 °Brix
        using var folder = new TestFolder();
        folder.Text("cave-2024.csv", "Lot;Levure;Degré potentiel (% vol);TAV (% vol)\nA1;LV-21;13,5;13,2\nA2;LV-21;14,0;13,6\n");

        // When it is read
        var set = folder.Read("cave-2024.csv");

        // Then the starting sugar is that sugar, kept as g/L
        Assert.Equal([227.2, 235.6], set.Lots.Select(l => Math.Round(l.RecordedStartingSugar.Value, 1)));
        Assert.All(set.Lots, l => Assert.Equal(SugarScale.GramsPerLitre, l.RecordedStartingSugar.Scale));
        Assert.Equal([227.2, 235.6], set.Lots.Select(l => Math.Round(l.StartingSugar.GramsPerLitre, 1)));
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
        Assert.Contains(set.Mappings, m => m.Field == "starting_sugar" && m.Unit == "% vol potential");
    }

    [Fact]
    public void A_potential_alcohol_worked_out_beside_the_brix_gives_way_to_the_brix()
    {
        // Given a lab book with "Potential alcohol" (the sheet's own Brix × 0.55) left of the Brix it was worked from
        using var folder = new TestFolder();
        folder.Text("lab-2024.csv", "Lot,Yeast,Potential alcohol,Brix,Alcohol % v/v\nA1,QX-7,13.2,24.0,14.1\n");

        // When it is read
        var set = folder.Read("lab-2024.csv");

        // Then the Brix is the starting sugar, and the potential alcohol is named as the column not read
        Assert.Equal(24.0, Assert.Single(set.Lots).StartingSugar.Brix);
        var dup = Assert.Single(set.Issues, i => i.Code == IssueCodes.DuplicateColumn);
        Assert.Equal("Potential alcohol", dup.Column);
        Assert.Contains("sugar reading 'Brix', which was read instead", dup.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Alcohol_and_temperature_written_in_degrees_are_read_but_a_bare_degree_on_sugar_is_not_a_scale()
    {
        // Given alcohol written "13,5°" and "13.8 °" in a decimal-comma file, and one starting sugar written "24°"
        using var folder = new TestFolder();
        folder.Text("cave-2024.csv", "Lot;Levure;Brix;TAV (% vol);Temp. max (°C)\nA1;LV-21;23,1;13,5°;26°\nA2;LV-21;23,6;13.8 °;27,5\nA3;LV-21;24°;14,0;25\n");

        // When it is read
        var set = folder.Read("cave-2024.csv");

        // Then the alcohols and the "26°" peak (°C, the column's own) are read, and the sugar's degree is refused as
        // naming no scale the column is read in
        Assert.Equal([13.5, 13.8], set.Lots.Select(l => l.FinalAlcohol.PercentVolume));
        Assert.Equal([26.0, 27.5], set.Lots.Select(l => l.PeakFermentationTempC));
        var issue = Assert.Single(set.Issues, i => i.Severity == IssueSeverity.Error);
        Assert.Equal((IssueCodes.UnitInCellDiffers, 4, "24°"), (issue.Code, issue.Row, issue.Value));
    }
}
