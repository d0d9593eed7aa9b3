using YieldBench.Core.Lots;

namespace YieldBench.Intake.Tests;

/// <summary>What is read from the corpus's awkward inputs, value by value (the corpus test checks codes and counts).</summary>
public class HostileInputTests
{
    private static string Files => Path.Combine(DocumentationTests.RepoRoot(), "tests", "YieldBench.Intake.Tests", "Regression", "files");

    private static Task<SeasonSet> Read(string name) => RegressionCorpusTests.ReadWithin(Files, name);

    [Fact]
    public async Task An_ods_file_reads_numbers_percentages_errors_and_formulas_without_a_result()
    {
        // Given a hand-made .ods: a formula with no stored result, an error result, a percentage, a hidden sheet and
        // an empty tail repeated a million times
        var set = await Read("hand-made-2023.ods");

        // Then the percentage is read as shown, the two bad cells are reported by name, and the hidden sheet is not read
        var lot = Assert.Single(set.Lots);
        Assert.Equal(("A-03", 14.9), (lot.LotId, lot.FinalAlcohol.PercentVolume));
        var formula = Assert.Single(set.Issues, i => i.Code == "formula-without-value");
        Assert.Equal((2, "RS (g/L)"), (formula.Row, formula.Column));
        Assert.StartsWith("residual_sugar_gl holds the formula =[.D2]*0.05 but no stored result", formula.Message, StringComparison.Ordinal);
        Assert.Contains(set.Issues, i => i.Code == "error-cell" && i.Row == 3 && i.Value == "#DIV/0!");
        Assert.Contains(set.Accounts, a => a.Sheet == "Hidden workings" && a.Kind == "hidden");
        Assert.Equal(3, set.Accounts.Single(a => a.Sheet == "Lots").RowsRead);
    }

    [Fact]
    public async Task Ods_text_keeps_its_spaces_tabs_and_paragraphs_but_not_its_comments()
    {
        var set = await Read("ods-text-forms-2023.ods");
        var lot = set.Lots.Single(l => l.LotId == "A-01");
        Assert.Equal("two   spaces\ttab\nsecond paragraph", lot.Notes);
        Assert.Equal(new DateTime(2023, 9, 3, 8, 30, 0), lot.InoculationDate);
    }

    [Fact]
    public async Task An_xlsx_formula_without_a_stored_result_is_reported_not_read_as_empty()
    {
        var set = await Read("formula-without-value-2023.xlsx");

        // The residual sugar formula is an error (it would have read as dry); the cached alcohol of A-04 is used
        Assert.Equal(["A-04"], set.Lots.Select(l => l.LotId));
        Assert.Equal(14.04, set.Lots[0].FinalAlcohol.PercentVolume, 10);
        var rs = set.Issues.Single(i => i.Row == 2);
        Assert.Equal(("formula-without-value", IssueSeverity.Error, "=ROUND(D2*0.05,2)"), (rs.Code, rs.Severity, rs.Value));
        Assert.EndsWith("Open the file in a spreadsheet program and save it, which stores the results, or type the value.", rs.Message, StringComparison.Ordinal);
        Assert.Contains(set.Issues, i => i.Row == 6 && i.Column == "pH" && i.Message.StartsWith("ph holds the formula =(shared with a cell above)", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData("utf16le-no-bom-2023.csv", "UTF-16 text (little-endian)")]
    [InlineData("utf16be-no-bom-2023.csv", "UTF-16 text (big-endian)")]
    [InlineData("utf32-bom-2023.csv", null)]
    public async Task Unicode_text_without_a_byte_order_mark_or_in_utf32_is_read_not_refused_as_binary(string name, string? said)
    {
        // Given the same three lots written as UTF-16 without a mark, or as UTF-32 with one
        var set = await Read(name);

        // Then the lots and their accented note are read, and a guessed encoding is said
        Assert.Equal(["A-01", "A-02", "A-03"], set.Lots.Select(l => l.LotId));
        Assert.Equal("levée à froid 12 °C", set.Lots[2].Notes);
        if (said is null)
        {
            Assert.Empty(set.Issues);
        }
        else
        {
            Assert.Contains(said, Assert.Single(set.Issues, i => i.Code == "encoding-assumed").Message, StringComparison.Ordinal);
        }
    }

    [Fact]
    public async Task A_file_whose_content_is_not_what_its_name_says_is_read_by_its_content_or_refused_with_the_fix()
    {
        // Given a tab-separated export named .xls, an .xls workbook named .xlsx and a web page named .xls
        var text = await Read("tab-text-named-2023.xls");
        var old = await Read("old-workbook-named-xlsx-2023.xlsx");
        var page = await Read("web-page-named-2023.xls");

        // Then the first two are read, each with a warning saying what the file holds
        Assert.Equal(["A-01", "A-02", "A-03"], text.Lots.Select(l => l.LotId));
        Assert.StartsWith("The file is named .xls but holds text (a CSV or tab-separated table", Assert.Single(text.Issues).Message, StringComparison.Ordinal);
        Assert.Equal(3, old.Lots.Count);
        Assert.StartsWith("The file is named .xlsx but holds an Excel 97–2003 workbook (.xls); it was read as one.", Assert.Single(old.Issues).Message, StringComparison.Ordinal);

        // And the web page is refused with what to do
        var refused = Assert.Single(page.Issues);
        Assert.Equal(("not-a-workbook", IssueSeverity.Error), (refused.Code, refused.Severity));
        Assert.EndsWith("it was not read. Open it in a spreadsheet program and save it as .xlsx.", refused.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("merged-cells-2023.xlsx")]
    [InlineData("merged-cells-2023.ods")]
    [InlineData("merged-cells-2023.xls")]
    public async Task A_strain_merged_over_three_lots_is_read_for_each_with_a_warning_naming_the_block(string name)
    {
        // Given a strain merged over rows 3-5 (stored once, in C3) under a title merged across the sheet
        var set = await Read(name);

        // Then each of the three lots has the strain shown, the fourth its own
        Assert.Equal(["A-01 QX-7", "A-02 QX-7", "A-03 QX-7", "A-04 QX-9"], set.Lots.Select(l => l.LotId + " " + l.Strain));

        // And one warning names the block, its first cell and the value, and says how to undo it; the title gives none
        var merged = Assert.Single(set.Issues);
        Assert.Equal(("merged-cells", IssueSeverity.Warning, "Lots", 3, "C", "QX-7"), (merged.Code, merged.Severity, merged.Sheet, merged.Row, merged.Column, merged.Value));
        Assert.Equal("The cells C3:C5 are merged: a spreadsheet program shows their value once, but the file stores it only in the first cell, so it was read for each of rows 3–5. If that is wrong, unmerge the cells and type each row's own value.", merged.Message);
    }

    [Theory]
    [InlineData("merged-header-2026.xlsx", "A3:A5")]
    [InlineData("merged-header-2026.ods", null)]
    public async Task Headers_merged_down_over_the_second_header_row_are_read_without_a_warning(string name, string? dataBlock)
    {
        // Given a log whose Lot, Date and Time headers are merged down two rows beside "Must" over Brix and Temp
        // (and, in the .xlsx, the lot id merged over its three data rows)
        var set = await Read(name);

        // Then the header is read (Must Temp °C is the temperature, Cap Temp °C the duplicate), every reading is lot M1's
        Assert.Equal([(23.5, 18.0), (21.0, 22.0), (17.2, 25.5)], Assert.Single(set.Logs, l => l.LotId == "M1").Readings.Select(r => (r.Sugar!.Value.Brix, r.TemperatureC!.Value)));
        Assert.Contains(set.Issues, i => i.Code == "duplicate-column" && i.Column == "Cap Temp °C");

        // And only a block reaching the data rows is warned of; the header blocks give no data row their value
        var merged = set.Issues.Where(i => i.Code == "merged-cells").ToList();
        Assert.Equal(dataBlock is null ? [] : [dataBlock], merged.Select(i => i.Message.Split(' ')[2]));
    }

    [Fact]
    public async Task Control_characters_are_settled_in_the_values_and_shown_written_out_in_issues()
    {
        var tab = await Read("vertical-tab-in-strain-2023.csv");
        Assert.Equal(("QX 7", "first\nsecond line"), (tab.Lots[0].Strain, tab.Lots[0].Notes));

        var esc = await Read("escape-in-strain-2023.csv");
        Assert.Equal("QX-7 [31m", esc.Lots[0].Strain);
        var settled = Assert.Single(esc.Issues, i => i.Code == "text-settled");
        Assert.Equal("QX-7<U+001B>[31m", settled.Value);

        var number = await Read("escape-in-number-2023.csv");
        Assert.Equal("2<U+001B>[2J4.0", Assert.Single(number.Issues, i => i.Code == "not-a-number").Value);
    }

    [Fact]
    public async Task A_text_longer_than_a_cell_holds_is_cut_with_a_warning_and_a_long_value_is_shortened_in_its_issue()
    {
        var note = await Read("long-note-2023.csv");
        Assert.Equal(32_767, note.Lots[0].Notes!.Length);
        Assert.StartsWith("notes is 40,000 characters long", Assert.Single(note.Issues, i => i.Code == "text-too-long").Message, StringComparison.Ordinal);

        var number = await Read("long-number-cell-2023.csv");
        var issue = Assert.Single(number.Issues, i => i.Code == "not-a-number");
        Assert.EndsWith("… (40,000 characters in all)", issue.Value, StringComparison.Ordinal);
        Assert.True(issue.Value!.Length < 600);
    }

    [Fact]
    public async Task Logger_timestamps_with_a_zone_are_read_as_the_clock_time_written()
    {
        var set = await Read("log-timestamps-offset-2023.xlsx");
        Assert.All(set.Logs.SelectMany(l => l.Readings), r => Assert.Equal(new TimeSpan(8, 0, 0), r.Timestamp.TimeOfDay));
        var zone = Assert.Single(set.Issues);
        Assert.Equal(("time-zone-not-applied", "Timestamp", 2), (zone.Code, zone.Column, zone.Row));
    }

    [Fact]
    public async Task A_reading_dated_1900_is_left_out_and_its_row_counted_as_reported()
    {
        var set = await Read("log-reading-dated-1900-2023.xlsx");
        var l1 = set.Logs.Single(l => l.LotId == "L-1");
        Assert.Equal(2, l1.Readings.Count);
        var issue = Assert.Single(set.Issues);
        Assert.Equal(("reading-date-implausible", "Log", 3, "1900-01-01 08:00"), (issue.Code, issue.Sheet, issue.Row, issue.Value));
        var log = set.Accounts.Single(a => a.Sheet == "Log");
        Assert.Equal((5, 4, 1), (log.RowsRead, log.LogReadingsUsed, log.RowsReported));
    }

    [Fact]
    public async Task Everyday_headers_map_to_their_fields_with_their_units()
    {
        var set = await Read("everyday-headers-2023.csv");
        var lot = set.Lots.Single(l => l.LotId == "A-01");
        Assert.Equal("Tank 3", lot.Vessel);
        // US gallon = 3.785411784 L exactly (NIST Handbook 44, Appendix C)
        Assert.Equal((1892.705892, 37.85411784), (lot.Additions.MustVolumeL!.Value, lot.Additions.WaterAddedL!.Value));
    }

    [Fact]
    public async Task A_row_split_by_an_unquoted_thousands_comma_is_reported_whole()
    {
        var set = await Read("unquoted-thousands-2023.csv");
        var issue = Assert.Single(set.Issues, i => i.Code == "extra-fields");
        Assert.Equal((3, "A-02 | 2023 | QX-9 | 23.1 | 13.4 | 4 | 500"), (issue.Row, issue.Value));
        Assert.StartsWith("The row has 7 fields but the header 6", issue.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_dot_thousands_in_a_semicolon_file_that_settles_nothing_is_never_guessed()
    {
        var unsettled = await Read("semicolon-dot-thousands-2023.csv");
        var issue = unsettled.Issues.First(i => i.Code == "ambiguous-number");
        Assert.Equal("must_volume_l could be 4200 (dot as thousands separator, as files from European spreadsheets write it) or 4.200 (decimal point); nothing else in this file settles which. Write it without a thousands separator.", issue.Message);

        // A file whose other numbers use a decimal point reads 4.200 as 4.2
        var settled = await Read("semicolon-decimal-point-2023.csv");
        Assert.Equal(4.2, settled.Lots[0].Additions.MustVolumeL!.Value, 10);
    }

    [Fact]
    public async Task Impossible_combinations_name_the_values()
    {
        var rs = Assert.Single((await Read("residual-above-start-2023.csv")).Issues);
        Assert.StartsWith("The residual sugar, 280 g/L, is more than the must held at the start (", rs.Message, StringComparison.Ordinal);

        var sugar = (await Read("sugar-added-implausible-2023.csv")).Issues;
        // 1000 L at 24 °Brix weigh 1100 kg and hold 264 kg of solids; with 900 kg of sucrose: 1164 / 2000 = 58 °Brix
        Assert.StartsWith("900 kg of sugar added to 1000 L of must at 24 °Brix would make a must of more than 50 °Brix", sugar[0].Message, StringComparison.Ordinal);
        Assert.Equal(("Sugar added (kg)", "Water added (L)"), (sugar[0].Column, sugar[1].Column));
        Assert.StartsWith("5000 L of water added to 1000 L of must at 23.1 °Brix would make a must of 4.2 °Brix", sugar[1].Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_message_with_a_control_character_is_shown_whole_without_overflow()
    {
        // Found by the fuzz harness: a reader's exception message holding a control character, shown without a limit
        string shown = TextSettling.ForDisplay("bad byte \u0001 here", int.MaxValue);
        Assert.Equal("bad byte <U+0001> here", shown);
    }
}
