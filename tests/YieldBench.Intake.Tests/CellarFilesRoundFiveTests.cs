using YieldBench.Core.Lots;

namespace YieldBench.Intake.Tests;

/// <summary>
/// Cellar files of an invented US estate (Quillon Ridge Cellars, strains QX-14, QX-22) in shapes a new user brought:
/// several tanks' logs stacked in one sheet, gallons, pounds and kilolitres, lab values written as bounds.
/// </summary>
public class CellarFilesRoundFiveTests
{
    private const string Lots = "Lot,Vintage,Yeast,Brix at crush,Inoculated,Alc %\n"
        + "25-QR-01,2025,QX-14,24.6,2025-10-04,14.1\n25-QR-02,2025,QX-14,25.8,2025-10-05,14.3\n25-QR-03,2025,QX-22,22.1,2025-10-06,12.9\n";

    [Fact]
    public void Tank_logs_stacked_in_one_sheet_under_lot_headings_are_read_as_each_lots_log()
    {
        // Given lots and one log sheet with no lot column holding three tanks' readings one block under another, each
        // block under a row naming its lot (the first above the header), the header typed again under the others
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2025.csv", Lots);
        var log = folder.Text("stacked-log.csv",
            "Ferment log 2025\n25-QR-01\nDate,Time,Brix,Temp °F\n5-Oct,08:00,24.6,62\n6-Oct,08:00,22.0,70\n7-Oct,08:00,17.5,78\n\n"
            + "25-QR-02\nDate,Time,Brix,Temp °F\n6-Oct,08:00,25.8,60\n7-Oct,08:00,24.0,66\n\n"
            + "25-QR-03\nDate,Time,Brix,Temp °F\n7-Oct,08:00,22.1,55\n8-Oct,08:00,21.5,56\n");

        // When both are read
        var set = folder.Read(lots, log);

        // Then each block is its lot's log, dated in the lot's year (before, every reading was refused and the headings
        // and repeated headers were not-a-date errors)
        var logs = set.Logs.ToDictionary(l => l.LotId);
        Assert.Equal(["25-QR-01", "25-QR-02", "25-QR-03"], logs.Keys.Order());
        Assert.Equal([24.6, 22.0, 17.5], logs["25-QR-01"].Readings.Select(r => Math.Round(r.Sugar!.Value.Brix, 6)));
        Assert.Equal([new DateTime(2025, 10, 6, 8, 0, 0), new DateTime(2025, 10, 7, 8, 0, 0)], logs["25-QR-02"].Readings.Select(r => r.Timestamp));
        Assert.Equal(13.333333, Math.Round(logs["25-QR-03"].Readings[1].TemperatureC!.Value, 6)); // (56 − 32) × 5/9
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);

        // and the layout is said once, naming each heading's lot and row and the repeated headers
        var said = Assert.Single(set.Issues, i => i.Code == IssueCodes.LogBlocks);
        Assert.Equal((IssueSeverity.Warning, 2, "25-QR-01"), (said.Severity, said.Row, said.Value));
        Assert.Equal(
            "The log has no lot column and holds its readings in blocks, each under a row naming its lot: '25-QR-01' (row 2, above the header), '25-QR-02' (row 8), '25-QR-03' (row 13). "
            + "Each reading was read as the lot of the heading above it, and the headings were counted with the summary rows. The header typed again (rows 9, 14) was passed over as structure. "
            + "If a heading names a tank rather than the lot, write the lot's id in it; or add a Lot column.",
            said.Message);

        // and every row balances: 7 readings, 2 blank rows, 2 headings and 2 repeated headers
        var account = Assert.Single(set.Accounts, a => a.File == log);
        Assert.Equal((13, 7, 0, 2, 4), (account.RowsRead, account.LogReadingsUsed, account.RowsReported, account.BlankRowsSkipped, account.SummaryRowsSkipped));
    }

    [Fact]
    public void Stacked_blocks_without_a_repeated_header_take_their_lot_from_a_heading_after_a_blank_row_and_a_note_stays_no_heading()
    {
        // Given a log whose blocks are headed only by a tank-board name after a blank row; the first readings sit under
        // the header with no heading (they are the sheet's own lot), and a note without a digit lies between readings
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2025.csv", Lots);
        var log = folder.Text("25-QR-01.csv",
            "Date,Time,SG,Temp\n2025-10-05,08:00,1.102,17\n2025-10-06,08:00,1.090,21\n\n25-QR-02\n2025-10-06,08:00,1.108,16\n2025-10-07,08:00,1.100,19\n\nracked\n2025-10-08,08:00,1.085,23\n");

        // When read
        var set = folder.Read(lots, log);

        // Then the readings above the heading are the sheet's lot, those below it 25-QR-02's; the lone word "racked"
        // (no digit) is no heading: its row is reported as before and the reading under it stays 25-QR-02's
        var logs = set.Logs.ToDictionary(l => l.LotId);
        Assert.Equal(2, logs["25-QR-01"].Readings.Count);
        Assert.Equal(3, logs["25-QR-02"].Readings.Count);
        var said = Assert.Single(set.Issues, i => i.Code == IssueCodes.LogBlocks);
        Assert.Contains("'25-QR-02' (row 5)", said.Message, StringComparison.Ordinal);
        Assert.Contains("(the readings above the first heading as '25-QR-01', the sheet's name)", said.Message, StringComparison.Ordinal);
        Assert.Single(set.Issues, i => i.Row == 9 && i.Value == "racked");
    }

    [Fact]
    public void A_header_typed_again_in_a_one_lot_log_is_structure_not_a_row_left_out()
    {
        // Given a one-lot log (named by its file) whose header is typed again half way down, as a sheet pasted in two goes
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2025.csv", Lots);
        var log = folder.Text("25-QR-03.csv", "Date,Time,Brix,Temp\n2025-10-07,08:00,22.1,13\n2025-10-08,08:00,21.0,14\nDate,Time,Brix,Temp\n2025-10-09,08:00,19.0,15\n");

        // When read
        var set = folder.Read(lots, log);

        // Then its three readings are used and the repeated header is counted as structure, said once (before: a
        // not-a-date error and check's exit code 1)
        Assert.Equal(3, Assert.Single(set.Logs).Readings.Count);
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
        var said = Assert.Single(set.Issues, i => i.Code == IssueCodes.LogBlocks);
        Assert.Equal(4, said.Row);
        Assert.StartsWith("The header is typed again at row 4 ", said.Message, StringComparison.Ordinal);
        var account = Assert.Single(set.Accounts, a => a.File == log);
        Assert.Equal((4, 3, 0, 1), (account.RowsRead, account.LogReadingsUsed, account.RowsReported, account.SummaryRowsSkipped));
    }

    [Fact]
    public void A_us_cellar_book_in_gallons_pounds_and_kilolitres_with_thousands_separators_is_read_in_litres_and_kilograms()
    {
        // Given a comma-separated export of a US cellar book: must volume headed "Must vol (gal)" (its "vol" is a unit
        // word, so only "Must" was left and the column was not read), "Must (L)" on a second sheet's shape, water in
        // gallons, sugar headed "Sugar (lb)", a tank size without unit whose cells say "1,500 gal", "5 kL", "50 hL" or
        // nothing, a "Capacity (kL)" column, and volumes written "1,250", "10 000" and with a thin space
        using var folder = new TestFolder();
        var lots = folder.Text("quillon-2025.csv",
            "Lot,Vintage,Yeast,Tank size,Must vol (gal),Water (gal),Sugar (lb),Brix at crush,Alc %,RS g/L\n"
            + "25-QR-01,2025,QX-14,\"1,500 gal\",\"1,250\",0,0,24.6,14.1,0.4\n"
            + "25-QR-02,2025,QX-14,5 kL,\"1,100\",40,0,25.8,14.3,trace\n"
            + "25-QR-03,2025,QX-22,50 hL,\"10 000\",0,220,20.4,13.0,0.6\n"
            + "25-QR-04,2025,QX-22,2000,1\u2009400,0,0,22.1,12.9,0.8\n");
        var other = folder.Text("quillon-2024.csv", "Lot,Vintage,Yeast,Must (L),Capacity (kL),Brix,Alc\n24-QR-01,2024,QX-14,4200,5,24.0,14.0\n");

        // When read
        var set = folder.Read(lots, other);

        // Then every volume is in litres (US gallon 3.785411784 L exactly, NIST Handbook 44 App. C) and the sugar in kg
        // (lb 0.45359237 kg exactly); "trace" residual sugar is below the lab's limit, as "ND" is
        var byId = set.Lots.ToDictionary(l => l.LotId);
        Assert.Equal(4731.76473, Math.Round(byId["25-QR-01"].Additions.MustVolumeL!.Value, 5)); // 1250 × 3.785411784
        Assert.Equal(151.41647, Math.Round(byId["25-QR-02"].Additions.WaterAddedL!.Value, 5)); // 40 × 3.785411784
        Assert.Equal(37854.11784, Math.Round(byId["25-QR-03"].Additions.MustVolumeL!.Value, 5));
        Assert.Equal(99.79032, Math.Round(byId["25-QR-03"].Additions.SugarAddedKg!.Value, 5)); // 220 × 0.45359237
        Assert.Equal(5299.57650, Math.Round(byId["25-QR-04"].Additions.MustVolumeL!.Value, 5));
        Assert.Equal([5678.117676, 5000, 5000, 2000], new[] { "25-QR-01", "25-QR-02", "25-QR-03", "25-QR-04" }.Select(id => Math.Round(byId[id].VesselCapacityL!.Value, 6)));
        Assert.Null(byId["25-QR-02"].ResidualSugarGl);
        Assert.Equal((4200.0, 5000.0), (byId["24-QR-01"].Additions.MustVolumeL, byId["24-QR-01"].VesselCapacityL));
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error || i.Code == IssueCodes.ColumnNotUsed || i.Code == IssueCodes.AdditionsWithoutVolume);

        // and the two judgements are said once for their column, naming the first value
        var units = Assert.Single(set.Issues, i => i.Code == IssueCodes.UnitInCellDiffers);
        Assert.Equal((IssueSeverity.Warning, 2, "Tank size", "1,500 gal"), (units.Severity, units.Row, units.Column, units.Value));
        Assert.Equal("3 value(s) of the column, whose header gives no unit, are written with a unit of their own (the first, '1,500 gal' at row 2, = 5678.12 L); each was converted from the unit it states to L. "
            + "Values written without a unit were read in L. State the unit in the header, or write every value in one unit.", units.Message);
        var grouped = set.Issues.Where(i => i.Code == IssueCodes.AmbiguousNumber).ToList();
        Assert.Equal(["Must vol (gal)", "Tank size"], grouped.Select(i => i.Column).Order());
        Assert.All(grouped, i => Assert.Equal(IssueSeverity.Warning, i.Severity));
        Assert.StartsWith("2 value(s) of the column are written with a comma before groups of three digits (the first, '1,250' at row 2).",
            Assert.Single(grouped, i => i.Column == "Must vol (gal)").Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_comma_before_three_digits_stays_ambiguous_where_the_file_writes_decimal_commas_or_no_decimals()
    {
        // Given a comma-separated file whose decimals are written with a comma ("24,6" quoted), and one with no
        // decimal at all, each with a must volume "1,250"
        using var folder = new TestFolder();
        var commas = folder.Text("a-2025.csv", "Lot,Yeast,Must volume (L),Brix,Alc\n25-A,QX-14,\"1,250\",\"24,6\",14\n");
        var plain = folder.Text("b-2025.csv", "Lot,Yeast,Must volume (L),Brix,Alc\n25-B,QX-14,\"1,250\",24,14\n");

        // When read
        var set = folder.Read(commas, plain);

        // Then neither is guessed: each is ambiguous-number at its cell, as before
        Assert.Equal(2, set.Issues.Count(i => i.Code == IssueCodes.AmbiguousNumber && i.Value == "1,250" && i.Row == 2));
    }

    [Fact]
    public void A_lab_value_written_as_a_bound_says_it_is_no_measurement()
    {
        // Given a final alcohol written ">15" (beyond the lab's range) and one "< 3"
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2025.csv", "Lot,Yeast,Brix,Alc\n25-A,QX-14,27.2,>15\n25-B,QX-14,24.0,< 3\n");

        // When read
        var set = folder.Read(lots);

        // Then both rows are left out with a message that names the bound and what to enter
        var above = Assert.Single(set.Issues, i => i.Value == ">15");
        Assert.Equal((IssueSeverity.Error, IssueCodes.NotANumber), (above.Severity, above.Code));
        Assert.Equal("final_abv is written as a bound ('>15'): the value lies above 15, not at it, so it is no measurement to compute with. Enter the lab's number (a value beyond its range is measured again after dilution).", above.Message);
        Assert.Contains("lies below 3, not at it", Assert.Single(set.Issues, i => i.Value == "< 3").Message, StringComparison.Ordinal);
        Assert.Empty(set.Lots);
    }

    [Fact]
    public void Dates_with_month_names_in_french_german_spanish_and_italian_are_read()
    {
        // Given a French semicolon file of lots inoculated "12 sept. 2025", "3 octobre 2025", "1er oct. 2025",
        // "5. März 2025", "5 de octubre de 2025" and "7 settembre 2025 14:30", and a log dated "13-sept.", "14 sept",
        // "15 septembre", "16. Sept." and "17 okt." with no year
        using var folder = new TestFolder();
        var lots = folder.Text("cave-2025.csv", "Lot;Levure;Brix;TAV;Levurage\n25-F1;QX-14;24,1;14,0;12 sept. 2025\n25-F2;QX-14;23,5;13,6;3 octobre 2025\n"
            + "25-F3;QX-22;22,0;12,8;1er oct. 2025\n25-F4;QX-22;22,4;13,0;5. März 2025\n25-F5;QX-22;22,4;13,0;5 de octubre de 2025\n25-F6;QX-22;22,4;13,0;7 settembre 2025 14:30\n");
        var log = folder.Text("journal.csv", "Lot;Date;Densité;Temp\n25-F1;13-sept.;1098;18\n25-F1;14 sept;1085;22\n25-F1;15 septembre;1060;25\n25-F1;16. Sept.;1040;24\n25-F1;17 okt.;1030;22\n");

        // When read
        var set = folder.Read(lots, log);

        // Then every date is read (before, each foreign month name was not-a-date: the inoculation left empty, the
        // log's reading left out)
        Assert.Equal(
            [new DateTime(2025, 9, 12), new DateTime(2025, 10, 3), new DateTime(2025, 10, 1), new DateTime(2025, 3, 5), new DateTime(2025, 10, 5), new DateTime(2025, 9, 7, 14, 30, 0)],
            set.Lots.OrderBy(l => l.LotId, StringComparer.Ordinal).Select(l => l.InoculationDate!.Value));
        Assert.Equal([13, 14, 15, 16, 17], Assert.Single(set.Logs).Readings.Select(r => r.Timestamp.Day));
        Assert.Equal(10, set.Logs[0].Readings[^1].Timestamp.Month);
        Assert.DoesNotContain(set.Issues, i => i.Code is IssueCodes.NotADate || i.Severity == IssueSeverity.Error);
    }

    [Fact]
    public void A_variety_heading_over_its_lots_in_a_table_with_no_variety_column_names_their_variety()
    {
        // Given a lots table with no variety column, its lots grouped under rows "Syrah" and, after a blank row,
        // "Pinot noir"; and a note typed under a lot
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2025.csv", "Lot,Yeast,Brix,Alc\nSyrah,,,\n25-SY-01,QX-14,25.1,14.5\n25-SY-02,QX-31,24.8,14.2\n\nPinot noir,,,\n25-PN-01,QX-22,23.0,13.3\ntopped up weekly,,,\n25-PN-02,QX-22,23.4,13.6\n");

        // When read
        var set = folder.Read(lots);

        // Then the headings name the variety of the lots below them (before, each was a lot with three missing-value
        // errors), the note stays a note row, and every row balances
        Assert.Equal(["Syrah", "Syrah", "Pinot noir", "Pinot noir"], set.Lots.Select(l => l.Variety));
        var headings = set.Issues.Where(i => i.Code == IssueCodes.GroupHeading).ToList();
        Assert.Equal([(2, "Syrah"), (6, "Pinot noir")], headings.Select(i => (i.Row!.Value, i.Value!)));
        Assert.Equal("The row holds only 'Syrah' over lots, and the table has no variety column: it was read as a heading naming the variety of the lots below it, up to the next such heading, and counted with the summary rows. "
            + "If it names something else (a block, a grower), add a column for it.", headings[0].Message);
        Assert.Single(set.Issues, i => i.Code == IssueCodes.NoteRowSkipped && i.Row == 8);
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
        var account = Assert.Single(set.Accounts);
        Assert.Equal((8, 4, 1, 1, 2), (account.RowsRead, account.LotsUsed, account.RowsReported, account.BlankRowsSkipped, account.SummaryRowsSkipped));
    }

    [Fact]
    public void Formula_errors_in_a_legacy_xls_are_error_cells_as_in_xlsx_not_empty_values()
    {
        // Given the committed Excel 97–2003 workbook (Corpus/README.md says how it was made): on its second sheet, lot
        // 25-X1's residual sugar is #DIV/0! and 25-X2's pH #N/A
        using var folder = new TestFolder();
        File.Copy(Path.Combine(AppContext.BaseDirectory, "Corpus", "formula-errors-2025.xls"), folder.PathOf("formula-errors-2025.xls"));

        // When it is read
        var set = folder.Read("formula-errors-2025.xls");

        // Then the residual sugar error leaves 25-X1 out (before, it was read as empty: 0 g/L, a dry wine) and the pH
        // error is a warning leaving only the pH empty, each named with its sheet, row, column and error text
        Assert.Equal(["25-X2", "25-X3"], set.Lots.Select(l => l.LotId));
        var errors = set.Issues.Where(i => i.Code == IssueCodes.ErrorCell).ToList();
        Assert.Equal([("Lots 2025", 2, "RS (g/L)", "#DIV/0!", IssueSeverity.Error), ("Lots 2025", 3, "pH", "#N/A", IssueSeverity.Warning)],
            errors.Select(i => (i.Sheet!, i.Row!.Value, i.Column!, i.Value!, i.Severity)));
        Assert.Null(set.Lots[0].Ph);
        Assert.Equal(3.4, set.Lots[1].Ph);
    }

    [Fact]
    public void A_compound_file_that_cannot_be_followed_gives_no_error_cells_and_no_exception()
    {
        // Given the compound-file header alone, one with a sector size no file uses, and a workbook whose FAT points
        // past its end
        byte[] header = new byte[512];
        WorkbookSource.CompoundFileMagic.CopyTo(header, 0);
        byte[] oddSectors = (byte[])header.Clone();
        oddSectors[0x1E] = 10;
        byte[] valid = File.ReadAllBytes(Path.Combine(AppContext.BaseDirectory, "Corpus", "formula-errors-2025.xls"));
        byte[] cut = valid[..1024];

        // When the workbook stream is looked for, then nothing is found and nothing throws
        Assert.Null(XlsErrorCells.WorkbookStream(oddSectors));
        Assert.Null(XlsErrorCells.WorkbookStream(header));
        Assert.Null(XlsErrorCells.WorkbookStream(cut));
        Assert.NotNull(XlsErrorCells.WorkbookStream(valid));
    }

    [Fact]
    public void Additions_kept_on_a_sheet_of_their_own_are_one_error_naming_each_lots_water_and_sugar()
    {
        // Given a lots file and an additions file, a row per addition: water in litres and gallons, sucrose in kg and
        // pounds, and a nutrient
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2025.csv", "Lot,Vintage,Yeast,Must volume (L),Brix,Alc\n25-A1,2025,QX-14,4000,26.5,14.6\n25-A2,2025,QX-14,3000,20.5,12.9\n");
        var additions = folder.Text("additions-2025.csv",
            "Date,Lot,Addition,Amount\n2025-10-03,25-A1,water,120 L\n2025-10-03,25-A1,Water,10 gal\n2025-10-03,25-A2,sucrose,25 kg\n2025-10-04,25-A2,Sucrose,11 lb\n2025-10-04,25-A2,DAP,30 g/hL\n");

        // When read
        var set = folder.Read(lots, additions);

        // Then the additions sheet is one error (before: three missing-column errors, one saying the lots might still
        // be fermenting) naming each lot's total — 120 L + 10 US gal = 157.9 L; 25 kg + 11 lb = 29.99 kg — and the
        // additions that do not enter the review; its rows are left out and the lots are read as before
        var said = Assert.Single(set.Issues, i => i.File == additions && i.Severity == IssueSeverity.Error);
        Assert.Equal((IssueCodes.AdditionsApart, 1, "Addition"), (said.Code, said.Row, said.Column));
        Assert.Equal("The sheet keeps additions apart from the lots, a row per addition (Lot, Addition, Amount); YieldBench reads a lot's water and sugar additions from columns of the lots table "
            + "('Water added (L)', 'Sugar added (kg)', with the must volume before them), so none of its rows was read and the lots are reviewed on their measured sugar. "
            + "Write each lot's total in those columns: 25-A1: water 157.9 L; 25-A2: sugar 29.99 kg. Other additions (DAP) do not enter the review.", said.Message);
        Assert.Equal(2, set.Lots.Count);
        var account = Assert.Single(set.Accounts, a => a.File == additions);
        Assert.Equal((5, 0, 5), (account.RowsRead, account.LotsUsed, account.RowsReported));
    }

    [Fact]
    public void Temperatures_written_with_their_unit_under_a_header_without_one_are_converted()
    {
        // Given a log headed "Temp" whose cells say their scale ("62°F", "75 F"), and one of plain °F numbers beside a
        // reading written "18°C"
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2025.csv", Lots);
        var f = folder.Text("25-QR-01.csv", "When,Brix,Temp\n5-Oct 08:00,24.6,62°F\n6-Oct 08:00,22.0,75 F\n");
        var mixed = folder.Text("25-QR-02.csv", "When,Brix,Temp\n6-Oct 08:00,25.8,60\n7-Oct 08:00,24.0,66\n8-Oct 08:00,20.1,18°C\n");

        // When read
        var set = folder.Read(lots, f, mixed);

        // Then each reading keeps its temperature, converted from the unit its cell states, (62 − 32) × 5/9 = 16.67 °C
        // (before, every such reading was refused as unit-in-cell-differs), and the plain numbers are read as °F
        var logs = set.Logs.ToDictionary(l => l.LotId);
        Assert.Equal([16.666667, 23.888889], logs["25-QR-01"].Readings.Select(r => Math.Round(r.TemperatureC!.Value, 6)));
        Assert.Equal([15.555556, 18.888889, 18.0], logs["25-QR-02"].Readings.Select(r => Math.Round(r.TemperatureC!.Value, 6)));
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
        var said = Assert.Single(set.Issues, i => i.File == mixed && i.Code == IssueCodes.UnitInCellDiffers);
        Assert.Contains("(the first, '18°C' at row 4, = 18 °C)", said.Message, StringComparison.Ordinal);
        Assert.Contains("Values written without a unit were read in °F.", said.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_log_named_with_its_tank_and_lot_id_is_that_lots_log_and_a_bare_number_names_no_lot()
    {
        // Given lots 25-QR-01 … 25-QR-03 and lot "4", a stacked log whose first heading is "Tank T1 - 25-QR-01", a
        // sheet-like log file named "Tank 4", and a heading naming two lots
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2025.csv", Lots + "4,2025,QX-22,22.0,2025-10-06,12.8\n");
        var log = folder.Text("stacked.csv", "Tank T1 - 25-QR-01\nDate,Time,Brix\n2025-10-05,08:00,24.6\n2025-10-06,08:00,22.0\n\n"
            + "25-QR-02 or 25-QR-03\nDate,Time,Brix\n2025-10-06,08:00,25.8\n2025-10-07,08:00,24.0\n");
        var tank = folder.Text("Tank 4.csv", "Date,Time,Brix\n2025-10-07,08:00,22.0\n2025-10-08,08:00,21.0\n");

        // When read
        var set = folder.Read(lots, log, tank);

        // Then the first block is 25-QR-01's log, said once (before, it was a log-without-lot); a heading holding two
        // lot ids and a name whose only number is "4" are joined to no lot
        Assert.Equal(2, Assert.Single(set.Logs, l => l.LotId == "25-QR-01").Readings.Count);
        var said = Assert.Single(set.Issues, i => i.Code == IssueCodes.LotIdInName);
        Assert.Equal((IssueSeverity.Warning, "Tank T1 - 25-QR-01", 3), (said.Severity, said.Value, said.Row));
        Assert.Equal("The log named 'Tank T1 - 25-QR-01' matches no lot by its whole name, but holds the id of lot '25-QR-01' as a word: it was read as that lot's log. If it is not, name the log by its lot's id alone.", said.Message);
        Assert.Equal(["25-QR-02 or 25-QR-03", "Tank 4"], set.Issues.Where(i => i.Code == IssueCodes.LogWithoutLot).Select(i => i.Value).Order(StringComparer.Ordinal));
    }

    [Fact]
    public void Us_timestamps_on_a_twelve_hour_clock_are_read_and_settle_the_columns_day_month_order()
    {
        // Given a log exported from a US spreadsheet: "10/5/2025 8:00 AM", "5:00 PM", "12:30 AM", "12:15 PM", "Oct 6,
        // 2025 8:00 AM" and two-digit years on a 24-hour clock, every slash date reading both ways
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2025.csv", Lots);
        var log = folder.Text("log.csv", "Lot,Timestamp,Brix\n25-QR-01,10/5/2025 8:00 AM,24.6\n25-QR-01,10/5/2025 5:00 PM,23.9\n25-QR-01,10/6/2025 12:30 AM,23.0\n"
            + "25-QR-01,10/6/2025 12:15 p.m.,22.0\n25-QR-02,\"Oct 6, 2025 8:00 AM\",25.8\n25-QR-03,10/7/25 08:00,22.1\n25-QR-03,10/8/25 08:00,21.5\n");

        // When read
        var set = folder.Read(lots, log);

        // Then every reading is kept at its hour (before, each AM/PM time was not-a-date and the rest ambiguous), the
        // slash dates read month first because that gathers them within days (said once for the column)
        var logs = set.Logs.ToDictionary(l => l.LotId);
        Assert.Equal([new DateTime(2025, 10, 5, 8, 0, 0), new DateTime(2025, 10, 5, 17, 0, 0), new DateTime(2025, 10, 6, 0, 30, 0), new DateTime(2025, 10, 6, 12, 15, 0)],
            logs["25-QR-01"].Readings.Select(r => r.Timestamp));
        Assert.Equal(new DateTime(2025, 10, 6, 8, 0, 0), Assert.Single(logs["25-QR-02"].Readings).Timestamp);
        Assert.Equal([new DateTime(2025, 10, 7, 8, 0, 0), new DateTime(2025, 10, 8, 8, 0, 0)], logs["25-QR-03"].Readings.Select(r => r.Timestamp));
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
        var order = Assert.Single(set.Issues, i => i.Code == IssueCodes.DateOrderFromSpan && i.File == log);
        Assert.Equal("10/5/2025 8:00 AM", order.Value);
        Assert.Contains("They were read month first (month/day): so they fall within 1 day, as one season's dates do", order.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_block_heading_with_a_dash_between_its_words_is_still_a_heading()
    {
        // Given a stacked log whose second heading is "25-QR-02 – Pinot Noir" (four words and a dash)
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2025.csv", Lots);
        var log = folder.Text("stacked.csv", "25-QR-01\nDate,Time,Brix\n2025-10-05,08:00,24.6\n2025-10-06,08:00,22.0\n\n"
            + "25-QR-02 \u2013 Pinot Noir\nDate,Time,Brix\n2025-10-06,08:00,25.8\n2025-10-07,08:00,24.0\n");

        // When read
        var set = folder.Read(lots, log);

        // Then it heads its block (before, a dash counted as a fifth word: the heading and the repeated header were
        // not-a-date errors and the readings were taken for 25-QR-01's), and names lot 25-QR-02 as a word
        Assert.Equal(2, Assert.Single(set.Logs, l => l.LotId == "25-QR-02").Readings.Count);
        Assert.Equal(2, Assert.Single(set.Logs, l => l.LotId == "25-QR-01").Readings.Count);
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
        Assert.Single(set.Issues, i => i.Code == IssueCodes.LotIdInName && i.Value == "25-QR-02 \u2013 Pinot Noir");
    }
}
