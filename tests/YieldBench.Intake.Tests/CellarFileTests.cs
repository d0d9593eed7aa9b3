using System.Text;
using ClosedXML.Excel;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Intake.Tests;

/// <summary>Layouts found in cellar files kept by hand: percent formats, hidden sheets, units in cells and rows, notes.</summary>
public class CellarFileTests
{
    private static readonly object?[] Header = ["Lot", "Strain", "Brix", "ABV", "RS (g/L)"];

    [Fact]
    public void A_percent_formatted_alcohol_is_read_as_the_percentage_the_sheet_shows()
    {
        // Given a sheet whose alcohol cells hold 0.138 shown as "13.8%", next to a plain 14.1 in the same column
        using var folder = new TestFolder();
        string path = folder.PathOf("lots 2024.xlsx");
        using (var wb = new XLWorkbook())
        {
            var ws = wb.Worksheets.Add("2024");
            Workbooks.Fill(ws, Header, ["P-1", "QV-7", 23.5, 0.138, 1.2], ["P-2", "QV-7", 24.0, 14.1, 1.0]);
            ws.Cell(2, 4).Style.NumberFormat.Format = "0.0%";
            ws.Cell(3, 4).Style.NumberFormat.Format = "0.0";
            wb.SaveAs(path);
        }

        // When it is read
        var set = folder.Read("lots 2024.xlsx");

        // Then the percent cell is 13.8 % v/v, not 0.138 % v/v, and the plain cell is left as it is
        Assert.Equal([13.8, 14.1], set.Lots.Select(l => l.FinalAlcohol.PercentVolume));
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
    }

    [Fact]
    public void A_notes_column_on_every_tanks_sheet_is_said_once_naming_the_other_sheets()
    {
        // Given a lots sheet and one log sheet per tank, each log with a "Notes" column no field reads
        using var folder = new TestFolder();
        string path = folder.PathOf("board 2026.xlsx");
        using (var wb = new XLWorkbook())
        {
            Workbooks.Fill(wb.Worksheets.Add("Lots"), ["Lot", "Strain", "Brix", "ABV"], ["T1", "QV-7", 24.0, 14.1], ["T2", "QV-7", 23.6, 13.9], ["T3", "QV-7", 23.1, 13.6]);
            foreach (string tank in new[] { "T1", "T2", "T3" })
            {
                Workbooks.Fill(wb.Worksheets.Add(tank), ["Lot", "Timestamp", "Brix", "Temp (°C)", "Notes"],
                    [tank, "2026-09-10 08:00", 23.0, 18.5, "pumped over"], [tank, "2026-09-11 08:00", 19.5, 22.0, null]);
            }

            wb.SaveAs(path);
        }

        // When it is read
        var set = folder.Read("board 2026.xlsx");

        // Then one column-not-used warning stands for the three sheets, at the first, naming the other two
        var notes = set.Issues.Where(i => i.Code == IssueCodes.ColumnNotUsed).ToArray();
        var only = Assert.Single(notes);
        Assert.Equal(("T1", "Notes"), (only.Sheet, only.Column));
        Assert.EndsWith("The same column on 2 more sheet(s) of this file was not read either: \"T2\", \"T3\".", only.Message, StringComparison.Ordinal);
        Assert.Equal(3, set.Logs.Count);
    }

    [Fact]
    public void Headers_merged_down_over_a_units_row_leave_it_a_units_row()
    {
        // Given Lot and Yeast merged down over the units row (°Bx, % v/v, g/L under the other headers)
        using var folder = new TestFolder();
        string path = folder.PathOf("lots 2025.xlsx");
        using (var wb = new XLWorkbook())
        {
            var ws = wb.Worksheets.Add("Lots");
            Workbooks.Fill(ws, ["Lot", "Yeast", "Start sugar", "Alcohol", "RS"], [null, null, "°Bx", "% v/v", "g/L"],
                ["U1", "QX-7", 24.1, 14.2, 1.1], ["U2", "QX-9", 23.5, 13.8, 0.9]);
            ws.Range("A1:A2").Merge();
            ws.Range("B1:B2").Merge();
            wb.SaveAs(path);
        }

        // When it is read
        var set = folder.Read("lots 2025.xlsx");

        // Then row 2 is the units row (not a lot of three errors), both lots are used, and the merged header blocks,
        // which give no data row their value, raise no merged-cells warning
        Assert.Equal(["U1", "U2"], set.Lots.Select(l => l.LotId));
        Assert.Equal([IssueCodes.UnitsRowRead], set.Issues.Select(i => i.Code));
        Assert.Equal((2, 2, 0), (set.Accounts[0].RowsRead, set.Accounts[0].LotsUsed, set.Accounts[0].RowsReported));
    }

    [Fact]
    public void Group_labels_over_two_header_rows_tell_the_musts_sugar_from_the_wines()
    {
        // Given a lab book with "Must" merged over Brix and pH and "Wine" merged over Alc, RS and Brix
        using var folder = new TestFolder();
        string path = folder.PathOf("lab book.xlsx");
        using (var wb = new XLWorkbook())
        {
            var ws = wb.Worksheets.Add("Vintage 2025");
            Workbooks.Fill(ws, [null, null, "Must", null, "Wine", null, null], ["Lot", "Yeast", "Brix", "pH", "Alc", "RS", "Brix"],
                ["V1", "QX-7", 24.1, 3.5, 14.0, 1.2, -1.6], ["V2", "QX-7", 25.0, 3.4, 14.6, 1.0, -1.8]);
            ws.Range("C1:D1").Merge();
            ws.Range("E1:G1").Merge();
            wb.SaveAs(path);
        }

        // When it is read
        var set = folder.Read("lab book.xlsx");

        // Then the first Brix is the starting sugar and the second the final sugar (before, the second was a duplicate
        // of the first and not read), each mapping named with its group
        Assert.Equal([24.1, 25.0], set.Lots.Select(l => l.StartingSugar.Brix));
        Assert.Equal([-1.6, -1.8], set.Lots.Select(l => l.FinalSugar!.Value.Brix));
        Assert.Contains(set.Mappings, m => m.Field == "final_sugar" && m.Header == "Wine Brix");
        Assert.Contains(set.Mappings, m => m.Field == "starting_sugar" && m.Header == "Must Brix");
        Assert.DoesNotContain(set.Issues, i => i.Code == IssueCodes.DuplicateColumn);
    }

    [Theory]
    [InlineData("0.0%", true)]
    [InlineData("0.00 %", true)]
    [InlineData("0.0\"%\"", false)]
    [InlineData("0.0\\%", false)]
    [InlineData("0.00", false)]
    [InlineData("General", false)]
    public void Only_a_percent_sign_outside_quotes_and_escapes_makes_a_percent_format(string format, bool percent)
    {
        // Given an Excel number format (a quoted or escaped % is literal text: ECMA-376 Part 1, number formats, §18.8.30–31, from memory)
        // When it is classified, Then only a bare % scales the value by 100
        Assert.Equal(percent, WorkbookSource.IsPercentFormat(format));
    }

    [Fact]
    public void A_hidden_sheet_is_not_read_and_is_reported()
    {
        // Given a workbook whose hidden sheet holds old workings laid out like lots
        using var folder = new TestFolder();
        string path = folder.PathOf("lots 2022.xlsx");
        using (var wb = new XLWorkbook())
        {
            Workbooks.Fill(wb.Worksheets.Add("2022"), Header, ["H-1", "RC-11", 24.0, 14.0, 1.0]);
            var old = wb.Worksheets.Add("old calc");
            Workbooks.Fill(old, Header, ["H-9", "RC-11", 50.0, 3.0, 1.0]);
            old.Hide();
            wb.SaveAs(path);
        }

        // When it is read
        var set = folder.Read("lots 2022.xlsx");

        // Then only the visible lot is used, and the hidden sheet is named in a warning and in the accounts
        Assert.Equal(["H-1"], set.Lots.Select(l => l.LotId));
        var issue = Assert.Single(set.Issues);
        Assert.Equal(("hidden-sheet-skipped", "old calc", IssueSeverity.Warning), (issue.Code, issue.Sheet, issue.Severity));
        Assert.Equal("The sheet is hidden in the workbook, so it was not read. If it holds lots or readings, unhide it and check again.", issue.Message);
        Assert.Contains(set.Accounts, a => a.Sheet == "old calc" && a.Kind == "hidden" && a.RowsRead == 0);
    }

    [Fact]
    public void A_unit_written_in_the_cell_is_accepted_when_it_is_the_columns_unit()
    {
        // Given values typed with their units, in columns whose headers say the same units
        using var folder = new TestFolder();
        string name = folder.Text("lots 2024.csv",
            "Lot,Strain,Brix,ABV,RS,YAN,Must volume (gal)\n" +
            "U-1,QV-7,24.5 Bx,13.8 %vol,1.4 g/L,180 ppm,500 gal\n" +
            "U-2,QV-7,23.0 °Brix,13.1%,2 g/l,210 mg/L,400 gal\n");

        // When it is read
        var set = folder.Read(name);

        // Then the numbers are used as written; 500 US gal = 1892.705892 L (NIST Handbook 44, Appendix C: 3.785411784 L)
        Assert.Equal(2, set.Lots.Count);
        var u = set.Lots[0];
        Assert.Equal((24.5, 13.8, 1.4, 180.0), (u.StartingSugar.Brix, u.FinalAlcohol.PercentVolume, u.ResidualSugarGl!.Value, u.YanMgL!.Value));
        Assert.Equal(1892.705892, u.Additions.MustVolumeL!.Value, 9);
        Assert.Equal((23.0, 13.1, 2.0), (set.Lots[1].StartingSugar.Brix, set.Lots[1].FinalAlcohol.PercentVolume, set.Lots[1].ResidualSugarGl!.Value));
        Assert.DoesNotContain(set.Issues, i => i.Code is "not-a-number" or "unit-in-cell-differs");
    }

    [Fact]
    public void A_unit_in_the_cell_that_differs_from_the_columns_is_reported_and_never_converted_silently()
    {
        // Given an SG typed into a °Brix column and a °F reading typed into a °C column
        using var folder = new TestFolder();
        string name = folder.Text("lots 2024.csv",
            "Lot,Strain,Brix,ABV,RS (g/L),Mean temp (°C)\n" +
            "X-1,QV-7,1.095 SG,13.0,1.0,20\n" +
            "X-2,QV-7,24.0,14.0,1.0,75 F\n");

        // When it is read
        var set = folder.Read(name);

        // Then the SG row is left out with an error, and the °F value is left empty with a warning
        var sg = Assert.Single(set.Issues, i => i.Row == 2);
        Assert.Equal(("unit-in-cell-differs", "Brix", "1.095 SG", IssueSeverity.Error), (sg.Code, sg.Column, sg.Value, sg.Severity));
        Assert.Equal("starting_sugar is written with the unit 'SG', but the column is read in °Brix, so the value was not used. Convert it to °Brix, or write the number alone and state the unit in the header.", sg.Message);
        var f = Assert.Single(set.Issues, i => i.Row == 3);
        Assert.Equal(("unit-in-cell-differs", IssueSeverity.Warning), (f.Code, f.Severity));
        Assert.StartsWith("mean_temp_c is written with the unit 'F', but the column is read in °C", f.Message, StringComparison.Ordinal);
        var lot = Assert.Single(set.Lots);
        Assert.Equal(("X-2", (double?)null), (lot.LotId, lot.MeanFermentationTempC));
    }

    [Fact]
    public void A_units_row_under_the_header_gives_the_columns_units_and_is_not_a_lot()
    {
        // Given a header without units and, under it, a row of units only (°Oe and US gallons)
        using var folder = new TestFolder();
        string path = folder.PathOf("lots 2023.xlsx");
        Workbooks.WriteClosedXml(path, ("2023", [
            ["Lot #", "Yeast strain", "Must weight", "Final alc", "Must volume", "Notes"],
            [null, null, "°Oe", "% v/v", "gal", null],
            ["W-1", "BX-4", 95.0, 13.0, 500.0, "cool ferment"],
        ]));

        // When it is read
        var set = folder.Read("lots 2023.xlsx");

        // Then the units row sets °Oechsle and gallons, with one warning naming its row, and it is not counted as read
        var lot = Assert.Single(set.Lots);
        Assert.Equal(new RecordedSugar(95.0, SugarScale.Oechsle), lot.RecordedStartingSugar);
        // 95 °Oe = SG 1.095; ASBC Plato polynomial (−616.868 + 1111.14 SG − 630.272 SG² + 135.997 SG³, python3) gives 22.673 °Brix
        Assert.Equal(22.673, lot.StartingSugar.Brix, 0.03);
        Assert.Equal(1892.705892, lot.Additions.MustVolumeL!.Value, 9);
        var issue = Assert.Single(set.Issues);
        Assert.Equal(("units-row-read", 2, IssueSeverity.Warning), (issue.Code, issue.Row, issue.Severity));
        Assert.Equal("The row under the header holds only units; they were read as the columns' units, and the row is not a lot.", issue.Message);
        var account = Assert.Single(set.Accounts);
        Assert.Equal((1, 1, true), (account.RowsRead, account.LotsUsed, account.Balances));
    }

    [Fact]
    public void A_note_row_between_lots_is_one_warning_instead_of_an_error_per_empty_column()
    {
        // Given a lots sheet with a free-text note typed on its own row between two lots
        using var folder = new TestFolder();
        string path = folder.PathOf("lots 2023.xlsx");
        Workbooks.WriteClosedXml(path, ("2023", [
            Header,
            ["N-1", "RC-11", 24.0, 14.0, 1.0],
            ["note: tank 4 cooled overnight"],
            ["N-2", "RC-11", 23.0, 13.5, 1.0],
        ]));

        // When it is read
        var set = folder.Read("lots 2023.xlsx");

        // Then both lots are used and the note row is left out with a single warning holding its text
        Assert.Equal(["N-1", "N-2"], set.Lots.Select(l => l.LotId));
        var issue = Assert.Single(set.Issues);
        Assert.Equal(("note-row-skipped", 3, "note: tank 4 cooled overnight", IssueSeverity.Warning), (issue.Code, issue.Row, issue.Value, issue.Severity));
        Assert.Equal("The row holds only a note, not a lot; it was left out. Move notes to a notes column to keep them with their lot.", issue.Message);
        var account = Assert.Single(set.Accounts);
        Assert.Equal((3, 2, 1, true), (account.RowsRead, account.LotsUsed, account.RowsReported, account.Balances));
    }

    [Fact]
    public void A_lot_row_with_only_its_id_is_still_reported_as_missing_values()
    {
        // Given a lot id typed without any other value (one word, not a note)
        using var folder = new TestFolder();
        string name = folder.Text("lots 2023.csv", "Lot,Strain,Brix,ABV\nM-1,RC-11,24,14\nM-2,,,\n");

        // When it is read
        var set = folder.Read(name);

        // Then the missing required values are errors as before
        Assert.Equal(3, set.Issues.Count(i => i.Code == "missing-value" && i.Row == 3));
    }

    [Fact]
    public void Residual_sugar_headed_with_a_percent_sign_is_read_as_grams_per_100_mL()
    {
        // Given residual sugar recorded as a percentage (g per 100 mL; 0.25 % = 2.5 g/L, common practice)
        using var folder = new TestFolder();
        string name = folder.Text("lots 2015.csv", "Lot,Strain,Brix,ABV,RS %\nR-1,RC-11,24,14,0.25\nR-2,RC-11,24,14,0.09\n");

        // When it is read
        var set = folder.Read(name);

        // Then it is held as 2.5 g/L, the mapping says so, and no "unit-assumed" g/L warning misleads
        Assert.Equal([2.5, 0.9], set.Lots.Select(l => l.ResidualSugarGl!.Value));
        Assert.Equal("g/100 mL", Assert.Single(set.Mappings, m => m.Field == "residual_sugar_gl").Unit);
        Assert.DoesNotContain(set.Issues, i => i.Code == "unit-assumed");
    }

    [Fact]
    public void A_semicolon_export_with_French_headers_and_decimal_commas_is_read()
    {
        // Given a Windows-1252 CSV from a European cellar program with French headers
        using var folder = new TestFolder();
        string name = folder.Text("export 2019.csv",
            "Lot;Levure;Degré Brix;Alcool (% vol);Sucres résiduels (g/l);Cuve\r\n19-01;LM-2;24,3;14,2;1,8;Cuve béton\r\n",
            Encoding.Latin1);

        // When it is read
        var set = folder.Read(name);

        // Then every field is matched and the decimal commas are read
        var lot = Assert.Single(set.Lots);
        Assert.Equal(("LM-2", 24.3, 14.2, 1.8, "Cuve béton"), (lot.Strain, lot.StartingSugar.Brix, lot.FinalAlcohol.PercentVolume, lot.ResidualSugarGl!.Value, lot.Vessel));
        Assert.Equal(["encoding-assumed"], set.Issues.Select(i => i.Code));
    }

    [Fact]
    public void A_dotted_abbreviation_of_residual_sugar_is_matched()
    {
        // Given the header "R.S. g/L"
        using var folder = new TestFolder();
        string name = folder.Text("lots 2023.csv", "Lot,Strain,Brix,ABV,R.S. g/L\nD-1,RC-11,24,14,3.2\n");

        // When it is read, Then it is the residual sugar in g/L
        var set = folder.Read(name);
        Assert.Equal(3.2, Assert.Single(set.Lots).ResidualSugarGl!.Value, 12);
        Assert.Empty(set.Issues);
    }

    [Fact]
    public void A_log_sheet_named_lot_and_the_id_is_the_log_of_that_lot()
    {
        // Given a lots sheet and one log sheet per lot, named "Lot 23-004" and "Batch #7" as cellars often name them
        using var folder = new TestFolder();
        string path = folder.PathOf("ferments 2023.xlsx");
        Workbooks.WriteClosedXml(path,
            ("Lots", [["Lot", "Strain", "Brix", "ABV", "RS (g/L)"], ["23-004", "RC-11", 24.0, 14.0, 1.0], ["7", "RC-11", 23.0, 13.5, 1.0]]),
            ("Lot 23-004", [["Date", "Brix", "Temp (°C)"], [new DateTime(2023, 9, 10), 24.0, 18.0], [new DateTime(2023, 9, 11), 21.5, 20.0]]),
            ("Batch #7", [["Date", "Brix", "Temp (°C)"], [new DateTime(2023, 9, 10), 23.0, 18.0]]),
            ("Lot 99", [["Date", "Brix", "Temp (°C)"], [new DateTime(2023, 9, 10), 23.0, 18.0]]));

        // When it is read
        var set = folder.Read("ferments 2023.xlsx");

        // Then the first two logs join their lots; a sheet whose id matches no lot keeps its full name in the warning
        Assert.Equal(["23-004", "7", "Lot 99"], set.Logs.Select(l => l.LotId));
        var orphan = Assert.Single(set.Issues, i => i.Code == "log-without-lot");
        Assert.Equal("Lot 99", orphan.Value);
        Assert.DoesNotContain(set.Issues, i => i.Code == "lots-without-log");
    }

    [Fact]
    public void A_percent_sign_on_residual_sugar_means_grams_per_100_mL_and_on_a_volume_is_reported()
    {
        // Given residual sugar percent-formatted (0.0015 shown as 0.15 %, i.e. 1.5 g/L, common practice) and a
        // must volume typed as "12%"
        using var folder = new TestFolder();
        string path = folder.PathOf("lots 2024.xlsx");
        using (var wb = new XLWorkbook())
        {
            var ws = wb.Worksheets.Add("2024");
            Workbooks.Fill(ws, ["Lot", "Strain", "Brix", "ABV", "RS (g/L)", "Must volume (L)"], ["Q-1", "QV-7", 24.0, 14.0, 0.0015, "12%"]);
            ws.Cell(2, 5).Style.NumberFormat.Format = "0.00%";
            wb.SaveAs(path);
        }

        // When it is read
        var set = folder.Read("lots 2024.xlsx");

        // Then the sugar is 1.5 g/L, and the volume is refused with a message naming the unit
        Assert.Empty(set.Lots);
        var issue = Assert.Single(set.Issues, i => i.Code == "unit-in-cell-differs");
        Assert.Equal(("Must volume (L)", "12%", IssueSeverity.Error), (issue.Column, issue.Value, issue.Severity));
        Assert.Equal("must_volume_l is written with the unit '%', but the column is read in L, so the value was not used. Convert it to L, or write the number alone and state the unit in the header.", issue.Message);

        // And with the volume corrected the lot is used with 1.5 g/L
        using (var wb = new XLWorkbook(path))
        {
            wb.Worksheet("2024").Cell(2, 6).SetValue(1200);
            wb.Save();
        }

        Assert.Equal(1.5, Assert.Single(folder.Read("lots 2024.xlsx").Lots).ResidualSugarGl!.Value, 12);
    }

    [Fact]
    public void In_a_decimal_comma_file_a_dot_grouping_thousands_is_ambiguous_but_a_gravity_is_not()
    {
        // Given a semicolon CSV with decimal commas, a must volume written "1.200" and an SG column written with dots
        using var folder = new TestFolder();
        string name = folder.Text("export 2019.csv",
            "Lot;Levure;Densité moût (SG);Alcool (% vol);Volume (L);Eau ajoutée (L)\r\n" +
            "19-01;LM-2;1.095;12,9;1.200;0\r\n" +
            "19-02;LM-2;1.101;13,8;950;20,5\r\n");

        // When it is read
        var set = folder.Read(name);

        // Then "1.200" is not guessed (1200 or 1.2 L), while 1.101 is read as a gravity and the water added is matched
        var issue = Assert.Single(set.Issues);
        Assert.Equal(("ambiguous-number", 2, "Volume (L)", IssueSeverity.Error), (issue.Code, issue.Row, issue.Column, issue.Severity));
        Assert.Equal("must_volume_l could be 1200 (dot as thousands separator, as this decimal-comma file may use) or 1.200 (decimal point). Write it without a thousands separator.", issue.Message);
        var lot = Assert.Single(set.Lots);
        Assert.Equal((SugarScale.SpecificGravity, 950.0, 20.5), (lot.StartingSugarScale, lot.Additions.MustVolumeL!.Value, lot.Additions.WaterAddedL!.Value));
        // SG 1.10101 is 24 °Brix (Zoecklein et al., Wine Analysis and Production, Appendix I, Table I-1), so 1.101 is just under 24
        Assert.Equal(24.0, lot.StartingSugar.Brix, 0.05);
    }

    [Fact]
    public void Strain_codes_typed_in_other_cases_or_punctuation_are_one_strain_with_a_warning()
    {
        // Given one strain typed four ways and a vessel typed two ways
        using var folder = new TestFolder();
        string name = folder.Text("lots 2022.csv",
            "Lot,Strain,Vessel,Brix,ABV,RS (g/L)\n" +
            "C-1,RC-11,Tank,24,14.1,1\nC-2,rc-11,tank,23,13.6,1\nC-3,RC-11,Tank,25,14.8,1\nC-4,RC 11,Tank,24.5,14.4,1\nC-5,QV-7,barrel,24,14,1\n");

        // When it is read
        var set = folder.Read(name);

        // Then the most used spelling is kept for every lot, and each unified group is named in one warning
        Assert.Equal(["RC-11", "RC-11", "RC-11", "RC-11", "QV-7"], set.Lots.Select(l => l.Strain));
        Assert.Equal(["Tank", "Tank", "Tank", "Tank", "barrel"], set.Lots.Select(l => l.Vessel));
        var issues = set.Issues.Where(i => i.Code == "spelling-unified").ToList();
        Assert.Equal(2, issues.Count);
        Assert.Equal("strain 'rc-11' (1 lot), 'RC 11' (1 lot) differ from 'RC-11' (2 lots) only in case, spaces or punctuation, so they were read as 'RC-11'. If they are different, give them codes that differ in letters or digits.", issues[0].Message);
        Assert.Equal(IssueSeverity.Warning, issues[0].Severity);
        Assert.StartsWith("vessel 'tank' (1 lot) differs from 'Tank' (3 lots) only in case, spaces or punctuation, so it was read as 'Tank'.", issues[1].Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Varieties_and_blocks_typed_in_other_cases_or_punctuation_are_one_group_with_a_warning()
    {
        // Given one variety typed three ways and a block typed two ways (the review groups lots by both)
        using var folder = new TestFolder();
        string name = folder.Text("lots 2022.csv",
            "Lot,Strain,Variety,Block,Brix,ABV\n" +
            "C-1,RC-11,Pinot Noir,B1,24,14.1\nC-2,RC-11,pinot noir,b1,23,13.6\nC-3,RC-11,Pinot Noir,B1,25,14.8\nC-4,RC-11,Pinot-Noir,B2,24.5,14.4\n");

        // When it is read
        var set = folder.Read(name);

        // Then each takes its most used spelling, named once per group
        Assert.Equal(["Pinot Noir", "Pinot Noir", "Pinot Noir", "Pinot Noir"], set.Lots.Select(l => l.Variety));
        Assert.Equal(["B1", "B1", "B1", "B2"], set.Lots.Select(l => l.Block));
        var issues = set.Issues.Where(i => i.Code == "spelling-unified").ToList();
        Assert.Equal(["variety", "block"], issues.Select(i => i.Column));
        Assert.Equal("variety 'pinot noir' (1 lot), 'Pinot-Noir' (1 lot) differ from 'Pinot Noir' (2 lots) only in case, spaces or punctuation, so they were read as 'Pinot Noir'. If they are different, give them names that differ in letters or digits.", issues[0].Message);
    }

    [Fact]
    public void An_alcohol_typed_as_a_fraction_is_refused_with_a_hint_of_the_percentage()
    {
        // Given 14.1 % typed as 0.141 in a plain (not percent-formatted) cell
        using var folder = new TestFolder();
        string name = folder.Text("lots 2022.csv", "Lot,Strain,Brix,ABV,RS (g/L)\nF-1,RC-11,24,0.141,1\n");

        // When it is read
        var set = folder.Read(name);

        // Then it is not guessed: the row is left out, and the message suggests the percentage
        Assert.Empty(set.Lots);
        var issue = Assert.Single(set.Issues);
        Assert.Equal("out-of-range", issue.Code);
        Assert.Equal("final_abv 0.141 % v/v is outside the plausible range 3 to 20 % v/v. Check the value and its unit. It looks like a fraction: if it means 14.1 % v/v, write 14.1 (or format the cell as a percentage).", issue.Message);
    }

    [Fact]
    public void A_legacy_xls_keeps_its_percent_formats_and_hidden_sheets()
    {
        // Given the committed Excel 97–2003 file (Corpus/README.md says how it was made)
        using var folder = new TestFolder();
        File.Copy(Path.Combine(AppContext.BaseDirectory, "Corpus", "percent-and-hidden-2021.xls"), folder.PathOf("percent-and-hidden-2021.xls"));

        // When it is read
        var set = folder.Read("percent-and-hidden-2021.xls");

        // Then 0.142 shown as 14.2 % is 14.2 % v/v and the hidden sheet is skipped with its warning
        Assert.Equal([("X21-01", 14.2), ("X21-02", 13.4)], set.Lots.Select(l => (l.LotId, l.FinalAlcohol.PercentVolume)));
        Assert.Equal(["hidden-sheet-skipped"], set.Issues.Select(i => i.Code));
        Assert.Equal("old calc", set.Issues[0].Sheet);
    }

    [Fact]
    public void Two_header_rows_typed_without_merging_take_each_columns_header_from_the_row_it_is_in()
    {
        // Given "Lot" and "Yeast" typed in the upper row only, beside "Must" over Brix and "Wine" over Alc and RS,
        // whose headers are in the lower row (nothing merged)
        using var folder = new TestFolder();
        folder.Text("lab book 2025.csv", "Lot,Yeast,Must,Wine,\n,,Brix,Alc,RS\nV1,QX-7,24.1,14.0,1.2\nV2,QX-7,25.0,14.6,1.0\n");

        // When it is read
        var set = folder.Read("lab book 2025.csv");

        // Then the lower row is the header, each empty cell taking the header above it, and both lots are read
        Assert.Equal(["V1", "V2"], set.Lots.Select(l => l.LotId));
        Assert.Equal([24.1, 25.0], set.Lots.Select(l => l.StartingSugar.Brix));
        Assert.Equal([1.2, 1.0], set.Lots.Select(l => l.ResidualSugarGl));
        Assert.Contains(set.Mappings, m => m.Field == "strain" && m.Header == "Yeast");
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
    }
}
