using System.Globalization;
using System.IO.Compression;
using ClosedXML.Excel;
using DocumentFormat.OpenXml.Packaging;
using DocumentFormat.OpenXml.Validation;
using YieldBench.Reports.Kinetics;
using YieldBench.Reports.Tables;
using YieldBench.Reports.Tests.Kinetics;
using YieldBench.Reports.Workbook;

namespace YieldBench.Reports.Tests.Workbook;

public sealed class StreamedTableTests
{
    private const string Sheet = "Table";
    private const string Highlight = "FBE8C4";

    private static readonly DateTime When = new(2024, 9, 14, 7, 45, 0);

    // Every kind of cell the report tables hold, with empty cells, highlighted rows and awkward text.
    private static ReportTable Sample()
    {
        var t = new ReportTable(
        [
            new("lot", "Lot", CellKind.Text),
            new("season", "Season", CellKind.Integer),
            new("brix", "Starting sugar (°Brix)", CellKind.Number, "0.00"),
            new("abv", "Final alcohol (% v/v)", CellKind.Number),
            new("share", "Share within tolerance", CellKind.Share),
            new("at", "Inoculated", CellKind.DateTime),
            new("stuck", "Stuck", CellKind.Boolean),
            new("readings", "Readings", CellKind.Integer),
            new("note", "Note", CellKind.Text),
        ]);
        string longNote = "A note long enough to make the column wrap, because it runs past the widest column of seventy characters.";
        t.Add(["L-001", 2024, 23.456, 13.2, 0.875, When, true, 12L, "plain"]);
        t.Add([string.Empty, 2024, double.NaN, 12.9, 0.5, null, false, null, "=SUM(A1:A9)"], highlight: true);
        t.Add(["L-003", 2025, 21.0, double.PositiveInfinity, 0.0, When.AddDays(1), null, 3L, longNote]);
        t.Add(["L-004", 2025, -0.125, 1e-7, 1.0, When.AddHours(36.5), true, long.MaxValue / 1024, "  spaced  "], highlight: true);
        t.Add([null, null, 1234567.891, 14.0, double.NaN, null, null, 0L, "tab\there, line\nbreak, grape 🍇, café"]);
        t.Add(["L-006", int.MaxValue, 0.1 + 0.2, -3.5, 0.3333333333333333, When.AddMinutes(1), false, 7L, "+1 starts like a number"], highlight: true);
        t.Add(["L-007", -1, 24.0, 14.0, 0.25, When.AddYears(-3), true, 1L, "@ and - and ' lead"]);
        return t;
    }

    // A caption above the table and two rows below it, as the sheets lay them out.
    private static byte[] Workbook(ReportTable table, StreamedTables? streamed, bool freezeAndFilter = true, Action<IXLWorksheet, SheetLayout.Placement>? after = null)
    {
        var register = streamed ?? new StreamedTables(int.MaxValue);
        using var wb = new XLWorkbook();
        var ws = wb.AddWorksheet(Sheet);
        SheetLayout.SetHeading(ws.Cell(1, 1), "Caption above the table", 13);
        var placed = SheetLayout.WriteTable(ws, table, 3, 2, freezeAndFilter, setColumnWidths: true, streamed);
        SheetLayout.SetText(ws.Cell(placed.LastRow + 2, 2), "Below the table");
        ws.Cell(placed.LastRow + 3, 3).SetValue(42.5);
        ws.Cell(placed.LastRow + 3, 3).Style.NumberFormat.Format = "0.0";
        after?.Invoke(ws, placed);
        using var ms = new MemoryStream();
        wb.SaveAs(ms);
        return WorkbookWriter.Finish(ms.ToArray(), register, null);
    }

    private static string Describe(IXLCell cell)
    {
        var style = cell.Style;
        string fill = style.Fill.BackgroundColor.HasValue && style.Fill.PatternType == XLFillPatternValues.Solid
            ? style.Fill.BackgroundColor.Color.ToArgb().ToString("X8", CultureInfo.InvariantCulture)
            : "none";
        string value = cell.IsEmpty() ? "(empty)" : Convert.ToString(cell.Value, CultureInfo.InvariantCulture) ?? "(null)";
        return $"{cell.Address} {cell.DataType} [{value}] formula={cell.HasFormula} format='{style.NumberFormat.Format}'/{style.NumberFormat.NumberFormatId} fill={fill} wrap={style.Alignment.WrapText} bold={style.Font.Bold} valign={style.Alignment.Vertical}";
    }

    private static string[] Cells(IXLWorksheet ws, int lastRow, int lastColumn)
    {
        var cells = new List<string>();
        for (int r = 1; r <= lastRow; r++)
        {
            for (int c = 1; c <= lastColumn; c++)
            {
                cells.Add(Describe(ws.Cell(r, c)));
            }
        }

        return cells.ToArray();
    }

    [Fact]
    public void A_streamed_table_reopens_in_ClosedXML_exactly_as_the_cell_by_cell_one()
    {
        // Given one table written cell by cell and written streamed (threshold below its 7 rows)
        var table = Sample();
        var streamed = new StreamedTables(rowThreshold: 3);
        byte[] cellByCell = Workbook(table, streamed: null);
        byte[] streamedBytes = Workbook(table, streamed);
        Assert.Single(streamed.Bodies);

        // When both are reopened in ClosedXML
        using var a = new XLWorkbook(new MemoryStream(cellByCell));
        using var b = new XLWorkbook(new MemoryStream(streamedBytes));
        var wa = a.Worksheet(Sheet);
        var wb = b.Worksheet(Sheet);

        // Then every cell (value, type, number format, fill, wrap, bold), the widths, freeze and filter are the same
        Assert.Equal(Cells(wa, 14, 11), Cells(wb, 14, 11));
        Assert.Equal(
            Enumerable.Range(1, 11).Select(c => wa.Column(c).Width).ToArray(),
            Enumerable.Range(1, 11).Select(c => wb.Column(c).Width).ToArray());
        Assert.Equal(3, wb.SheetView.SplitRow);
        Assert.Equal(wa.SheetView.SplitRow, wb.SheetView.SplitRow);
        Assert.True(wb.AutoFilter.IsEnabled);
        Assert.Equal("B3:J10", wb.AutoFilter.Range.RangeAddress.ToString());
        Assert.Equal(wa.AutoFilter.Range.RangeAddress.ToString(), wb.AutoFilter.Range.RangeAddress.ToString());
        Assert.Equal(13, wb.LastRowUsed()!.RowNumber());
    }

    [Fact]
    public void Streamed_cells_keep_their_values_formats_and_highlights()
    {
        // Given the table written streamed
        byte[] bytes = Workbook(Sample(), new StreamedTables(rowThreshold: 2));

        // When it is reopened in ClosedXML
        using var wb = new XLWorkbook(new MemoryStream(bytes));
        var ws = wb.Worksheet(Sheet);

        // Then the header is bold, the numbers and dates are exact with their formats, text stays text, empties stay empty
        Assert.Equal("Lot", ws.Cell(3, 2).GetString());
        Assert.True(ws.Cell(3, 2).Style.Font.Bold);
        Assert.Equal("L-001", ws.Cell(4, 2).GetString());
        Assert.Equal(23.456, ws.Cell(4, 4).GetDouble());
        Assert.Equal("0.00", ws.Cell(4, 4).Style.NumberFormat.Format);
        Assert.Equal("0.0%", ws.Cell(4, 6).Style.NumberFormat.Format);
        Assert.Equal(When, ws.Cell(4, 7).GetDateTime());
        Assert.Equal("yyyy-mm-dd hh:mm", ws.Cell(4, 7).Style.NumberFormat.Format);
        Assert.Equal(XLDataType.DateTime, ws.Cell(4, 7).DataType);
        Assert.Equal("yes", ws.Cell(4, 8).GetString());
        Assert.Equal(XLDataType.Text, ws.Cell(4, 8).DataType);
        Assert.Equal(12.0, ws.Cell(4, 9).GetDouble());
        Assert.Equal(0.1 + 0.2, ws.Cell(9, 4).GetDouble(), 15);
        Assert.Equal(int.MaxValue, ws.Cell(9, 3).GetDouble());
        Assert.Equal(3.0, ws.Cell(6, 9).GetDouble());
        Assert.Equal(1e-7, ws.Cell(7, 5).GetDouble());
        Assert.Equal(When.AddHours(36.5), ws.Cell(7, 7).GetDateTime());

        // NaN, infinity and null are empty cells; a highlighted row is shaded even where it is empty
        Assert.True(ws.Cell(5, 4).IsEmpty());
        Assert.True(ws.Cell(6, 5).IsEmpty());
        Assert.True(ws.Cell(8, 2).IsEmpty());
        Assert.Equal(Highlight, ws.Cell(5, 4).Style.Fill.BackgroundColor.Color.ToArgb().ToString("X8", CultureInfo.InvariantCulture)[2..]);
        Assert.Equal(Highlight, ws.Cell(5, 2).Style.Fill.BackgroundColor.Color.ToArgb().ToString("X8", CultureInfo.InvariantCulture)[2..]);
        Assert.False(ws.Cell(4, 2).Style.Fill.BackgroundColor.HasValue && ws.Cell(4, 2).Style.Fill.PatternType == XLFillPatternValues.Solid);

        // Text keeps its spaces, tabs, line breaks and characters beyond the basic plane; the long note wraps
        Assert.Equal("  spaced  ", ws.Cell(7, 10).GetString());
        Assert.Equal("tab\there, line\nbreak, grape 🍇, café", ws.Cell(8, 10).GetString());
        Assert.True(ws.Cell(6, 10).Style.Alignment.WrapText);
        Assert.False(ws.Cell(6, 2).Style.Alignment.WrapText);
    }

    [Fact]
    public void Text_that_looks_like_a_formula_stays_text_in_a_streamed_table()
    {
        // Given a streamed table with a note starting with '='
        byte[] bytes = Workbook(Sample(), new StreamedTables(rowThreshold: 2));

        // When the sheet part is inspected and the cell reopened
        using var doc = SpreadsheetDocument.Open(new MemoryStream(bytes), false);
        var part = doc.WorkbookPart!.WorksheetParts.Single();
        int formulas = part.Worksheet.Descendants<DocumentFormat.OpenXml.Spreadsheet.CellFormula>().Count();
        var note = part.Worksheet.Descendants<DocumentFormat.OpenXml.Spreadsheet.Cell>().Single(c => c.CellReference == "J5");
        using var wb = new XLWorkbook(new MemoryStream(bytes));

        // Then no cell holds a formula, the note is an inline string and reads back as the same text
        Assert.Equal(0, formulas);
        Assert.Equal(DocumentFormat.OpenXml.Spreadsheet.CellValues.InlineString, note.DataType!.Value);
        Assert.Equal("=SUM(A1:A9)", wb.Worksheet(Sheet).Cell("J5").GetString());
        Assert.False(wb.Worksheet(Sheet).Cell("J5").HasFormula);
    }

    [Fact]
    public void Characters_XML_cannot_carry_are_stripped_and_the_file_still_opens()
    {
        // Given text with control characters, a lone surrogate and U+FFFF, in a streamed and a cell-by-cell table
        var table = new ReportTable([new("note", "Note", CellKind.Text), new("n", "N", CellKind.Integer)]);
        table.Add(["bell\u0007 and nul\u0000 here", 1]);
        table.Add(["lone \uD800 surrogate, \uFFFF end\u001F", 2]);
        table.Add(["fine", 3]);
        byte[] streamedBytes = Workbook(table, new StreamedTables(rowThreshold: 2));
        byte[] cellByCell = Workbook(table, streamed: null);

        // When both are reopened
        using var s = new XLWorkbook(new MemoryStream(streamedBytes));
        using var c = new XLWorkbook(new MemoryStream(cellByCell));

        // Then both show the text without those characters
        Assert.Equal("bell and nul here", s.Worksheet(Sheet).Cell(4, 2).GetString());
        Assert.Equal("lone  surrogate,  end", s.Worksheet(Sheet).Cell(5, 2).GetString());
        Assert.Equal("bell and nul here", c.Worksheet(Sheet).Cell(4, 2).GetString());
        Assert.Equal("lone  surrogate,  end", c.Worksheet(Sheet).Cell(5, 2).GetString());
    }

    [Fact]
    public void Rows_go_in_right_after_an_open_sheet_data_tag_in_the_default_namespace()
    {
        // Given a sheet part whose data begins with the template rows (no heading row before them), in the default
        // namespace, with a row attribute to carry over and a row after the table
        const string Main = StreamedSheet.MainNamespace;
        string xml = $"<?xml version=\"1.0\" encoding=\"utf-8\"?><worksheet xmlns=\"{Main}\"><dimension ref=\"A1:A9\"/><sheetData>"
            + "<row r=\"1\" spans=\"1:2\"><c r=\"A1\" s=\"0\"/><c r=\"B1\" s=\"3\"/></row>"
            + "<row r=\"2\" spans=\"1:2\"><c r=\"A2\" s=\"4\"/><c r=\"B2\" s=\"5\"/></row>"
            + "<row r=\"9\"><c r=\"A9\" t=\"inlineStr\"><is><t>after</t></is></c></row></sheetData></worksheet>";
        var table = new ReportTable([new("a", "A", CellKind.Text), new("b", "B", CellKind.Number)]);
        table.Add(["x & y < z", 1.5]);
        table.Add([null, double.NaN], highlight: true);
        table.Add(["\"quoted\" > it", null]);
        var output = new MemoryStream();

        // When the table's rows are streamed in
        StreamedSheet.Write(new MemoryStream(System.Text.Encoding.UTF8.GetBytes(xml)), output, "S", [new DeferredBody("S", 1, 1, table)]);
        var doc = System.Xml.Linq.XDocument.Parse(System.Text.Encoding.UTF8.GetString(output.ToArray()));
        System.Xml.Linq.XNamespace ns = Main;
        var rows = doc.Descendants(ns + "row").ToArray();
        string Cells(int i) => string.Join(" | ", rows[i].Elements(ns + "c").Select(c => $"{(string?)c.Attribute("r")} s={(string?)c.Attribute("s")} {c.Value}"));

        // Then the XML is well formed, the rows are 1–3 then 9, each keeps the template's spans, styles follow the
        // highlight (style 0 left out, empty cells only where styled) and the text is escaped
        Assert.Equal(new[] { "1", "2", "3", "9" }, rows.Select(r => (string?)r.Attribute("r") ?? "none").ToArray());
        Assert.All(rows.Take(3), r => Assert.Equal("1:2", (string?)r.Attribute("spans")));
        Assert.Equal("A1 s= x & y < z | B1 s=3 1.5", Cells(0));
        Assert.Equal("A2 s=4  | B2 s=5 ", Cells(1));
        Assert.Equal("A3 s= \"quoted\" > it | B3 s=3 ", Cells(2));
        Assert.Equal("after", rows[3].Value);
        Assert.Equal("A1:B9", (string?)doc.Descendants(ns + "dimension").Single().Attribute("ref"));
    }

    [Fact]
    public void XmlSafe_removes_only_what_XML_cannot_carry()
    {
        // Given text with valid and invalid characters
        // When made safe
        // Then tab, line breaks and surrogate pairs stay; control characters, unpaired surrogates and U+FFFE/U+FFFF go
        Assert.Equal("a\tb\nc\rd", SheetLayout.XmlSafe("a\tb\nc\rd"));
        Assert.Equal("🍇", SheetLayout.XmlSafe("🍇"));
        Assert.Equal("ab", SheetLayout.XmlSafe("a\u0001b"));
        Assert.Equal("ab", SheetLayout.XmlSafe("a\uDC00b"));
        Assert.Equal("ab", SheetLayout.XmlSafe("a\uD800b"));
        Assert.Equal("a", SheetLayout.XmlSafe("a\uD800"));
        Assert.Equal("ab", SheetLayout.XmlSafe("\uFFFEa\uFFFFb"));
        Assert.Same("plain", SheetLayout.XmlSafe("plain"));
    }

    [Fact]
    public void Streamed_numbers_are_written_in_round_trip_precision()
    {
        // Given a streamed table with 0.1 + 0.2 (0.30000000000000004), a long past 15 digits and a date (ClosedXML
        // writes and reads 15 significant digits, so the package itself is read here)
        byte[] bytes = Workbook(Sample(), new StreamedTables(rowThreshold: 2));

        // When the stored values are read from the package
        using var doc = SpreadsheetDocument.Open(new MemoryStream(bytes), false);
        var cells = doc.WorkbookPart!.WorksheetParts.Single().Worksheet.Descendants<DocumentFormat.OpenXml.Spreadsheet.Cell>()
            .ToDictionary(c => c.CellReference!.Value!, c => c.CellValue?.Text);

        var texts = doc.WorkbookPart!.WorksheetParts.Single().Worksheet.Descendants<DocumentFormat.OpenXml.Spreadsheet.Cell>()
            .Where(c => c.InlineString is not null).ToDictionary(c => c.CellReference!.Value!, c => c.InlineString!.Text!);

        // Then they parse back to the very same doubles, and a date is its serial number; only text with meaningful
        // whitespace is marked to keep it; empty text is no value
        Assert.Null(texts["J4"].Space);
        Assert.Equal(DocumentFormat.OpenXml.SpaceProcessingModeValues.Preserve, texts["J7"].Space!.Value);
        Assert.Equal(DocumentFormat.OpenXml.SpaceProcessingModeValues.Preserve, texts["J8"].Space!.Value);
        Assert.False(texts.ContainsKey("B5"));
        Assert.Null(cells["B5"]);
        Assert.Equal(0.1 + 0.2, double.Parse(cells["D9"]!, CultureInfo.InvariantCulture));
        Assert.Equal(0.3333333333333333, double.Parse(cells["F9"]!, CultureInfo.InvariantCulture));
        Assert.Equal(When.AddHours(36.5).ToOADate(), double.Parse(cells["G7"]!, CultureInfo.InvariantCulture));
        Assert.Equal("9007199254740991", cells["I7"]);
    }

    [Fact]
    public void The_dimension_covers_the_streamed_rows()
    {
        // Given a streamed table of 7 rows from B4, with rows written below it
        byte[] bytes = Workbook(Sample(), new StreamedTables(rowThreshold: 2));

        // When the sheet part's dimension is read
        using var doc = SpreadsheetDocument.Open(new MemoryStream(bytes), false);
        var dimension = doc.WorkbookPart!.WorksheetParts.Single().Worksheet.Descendants<DocumentFormat.OpenXml.Spreadsheet.SheetDimension>().Single();

        // Then it spans the caption, the table and the rows below
        Assert.Equal("A1:J13", dimension.Reference!.Value);
    }

    [Fact]
    public void A_streamed_table_at_the_end_of_its_sheet_widens_the_dimension_to_its_last_row()
    {
        // Given a streamed table with nothing below it (ClosedXML's dimension ends at the template rows)
        var table = Sample();
        var streamed = new StreamedTables(rowThreshold: 2);
        using var wb = new XLWorkbook();
        var ws = wb.AddWorksheet(Sheet);
        SheetLayout.WriteTable(ws, table, 1, 1, freezeAndFilter: true, setColumnWidths: true, streamed);
        using var ms = new MemoryStream();
        wb.SaveAs(ms);
        byte[] bytes = WorkbookWriter.Finish(ms.ToArray(), streamed, null);

        // When the dimension and the last row are read
        using var doc = SpreadsheetDocument.Open(new MemoryStream(bytes), false);
        var worksheet = doc.WorkbookPart!.WorksheetParts.Single().Worksheet;
        var rows = worksheet.Descendants<DocumentFormat.OpenXml.Spreadsheet.Row>().Select(r => r.RowIndex!.Value).ToArray();

        // Then the dimension ends at row 8 and the rows run 1 to 8 in order, once each
        Assert.Equal("A1:I8", worksheet.Descendants<DocumentFormat.OpenXml.Spreadsheet.SheetDimension>().Single().Reference!.Value);
        Assert.Equal(Enumerable.Range(1, 8).Select(i => (uint)i).ToArray(), rows);
    }

    [Fact]
    public void Two_streamed_tables_on_one_sheet_keep_the_rows_between_them()
    {
        // Given two streamed tables one above the other, with a caption between
        var first = Sample();
        var second = new ReportTable([new("code", "Code", CellKind.Text), new("count", "Count", CellKind.Integer)]);
        for (int i = 0; i < 5; i++)
        {
            second.Add(["C" + i.ToString(CultureInfo.InvariantCulture), i * 10], highlight: i == 3);
        }

        var streamed = new StreamedTables(rowThreshold: 2);
        using var wb = new XLWorkbook();
        var ws = wb.AddWorksheet(Sheet);
        var one = SheetLayout.WriteTable(ws, first, 1, 1, freezeAndFilter: false, setColumnWidths: true, streamed);
        SheetLayout.SetText(ws.Cell(one.LastRow + 2, 1), "Between");
        var two = SheetLayout.WriteTable(ws, second, one.LastRow + 3, 1, freezeAndFilter: false, setColumnWidths: true, streamed);
        SheetLayout.SetText(ws.Cell(two.LastRow + 1, 1), "End");
        using var ms = new MemoryStream();
        wb.SaveAs(ms);
        byte[] bytes = WorkbookWriter.Finish(ms.ToArray(), streamed, null);

        // When reopened
        using var back = new XLWorkbook(new MemoryStream(bytes));
        var sheet = back.Worksheet(Sheet);

        // Then each table's rows, the caption between and the last line are where they were placed
        Assert.Equal("L-007", sheet.Cell(8, 1).GetString());
        Assert.Equal("Between", sheet.Cell(10, 1).GetString());
        Assert.Equal("Code", sheet.Cell(11, 1).GetString());
        Assert.Equal("C0", sheet.Cell(12, 1).GetString());
        Assert.Equal(40.0, sheet.Cell(16, 2).GetDouble());
        Assert.Equal(Highlight, sheet.Cell(15, 2).Style.Fill.BackgroundColor.Color.ToArgb().ToString("X8", CultureInfo.InvariantCulture)[2..]);
        Assert.Equal("End", sheet.Cell(17, 1).GetString());
    }

    [Fact]
    public void A_cell_written_inside_a_streamed_table_is_refused_with_the_sheet_and_row()
    {
        // Given a streamed table (rows 4–10) and a cell that another writer put at row 6
        var ex = Assert.Throws<InvalidOperationException>(() =>
            Workbook(Sample(), new StreamedTables(rowThreshold: 2), after: (ws, _) => ws.Cell(6, 2).SetValue("in the way")));

        // Then the message names the sheet, the row and the table's rows
        Assert.Contains("'Table'", ex.Message, StringComparison.Ordinal);
        Assert.Contains("row 6", ex.Message, StringComparison.Ordinal);
        Assert.Contains("4–10", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_cell_beside_a_template_row_is_refused()
    {
        // Given a streamed table in columns B–J and a cell at L4, on its first template row
        var ex = Assert.Throws<InvalidOperationException>(() =>
            Workbook(Sample(), new StreamedTables(rowThreshold: 2), after: (ws, _) => ws.Cell(4, 12).SetValue(1)));

        // Then the message names the cell and the table's columns
        Assert.Contains("L4", ex.Message, StringComparison.Ordinal);
        Assert.Contains("B–J", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_streamed_workbook_passes_the_Open_XML_validator()
    {
        // Given a streamed table
        byte[] bytes = Workbook(Sample(), new StreamedTables(rowThreshold: 2));

        // When the Open XML SDK validator checks it
        using var doc = SpreadsheetDocument.Open(new MemoryStream(bytes), false);
        var errors = new OpenXmlValidator(DocumentFormat.OpenXml.FileFormatVersions.Office2019).Validate(doc)
            .Select(e => $"{e.Part?.Uri} {e.Path?.XPath}: {e.Description}").ToArray();

        // Then it finds nothing
        Assert.Empty(errors);
    }

    [Fact]
    public void Streaming_gives_the_same_bytes_each_time()
    {
        // Given one table streamed twice
        byte[] first = Workbook(Sample(), new StreamedTables(rowThreshold: 2));
        byte[] second = Workbook(Sample(), new StreamedTables(rowThreshold: 2));

        // Then the packages are identical, and differ from the cell-by-cell package (the comparison can tell them apart)
        Assert.True(first.AsSpan().SequenceEqual(second), "streamed workbook bytes differ between runs");
        Assert.False(first.AsSpan().SequenceEqual(Workbook(Sample(), streamed: null)));
    }

    [Fact]
    public void The_template_rows_leave_no_strings_behind()
    {
        // Given a streamed table
        byte[] bytes = Workbook(Sample(), new StreamedTables(rowThreshold: 2));

        // When the shared strings are read
        using var zip = new ZipArchive(new MemoryStream(bytes));
        using var reader = new StreamReader(zip.GetEntry("xl/sharedStrings.xml")!.Open());
        var sst = System.Xml.Linq.XDocument.Parse(reader.ReadToEnd()).Root!;
        var texts = sst.Elements().Select(e => e.Value).ToArray();

        // Then they are the caption, the headings and the rows below the table only (the data are inline strings)
        Assert.Equal(["Caption above the table", "Lot", "Season", "Starting sugar (°Brix)", "Final alcohol (% v/v)", "Share within tolerance", "Inoculated", "Stuck", "Readings", "Note", "Below the table"], texts);
        Assert.Equal(texts.Length.ToString(CultureInfo.InvariantCulture), (string?)sst.Attribute("count"));
    }

    [Fact]
    public void A_streamed_kinetics_sheet_reopens_as_the_cell_by_cell_one()
    {
        // Given the kinetics sheet filled cell by cell and with its longer tables streamed (threshold 2: the 4-lot table)
        var whole = KineticsReportData.FullReview();
        var review = whole.Kinetics!;
        byte[] Build(StreamedTables? streamed, out int lastRow)
        {
            var register = streamed ?? new StreamedTables(int.MaxValue);
            using var wb = new XLWorkbook();
            lastRow = KineticsSheet.Fill(wb.AddWorksheet(KineticsSheet.SheetName), review, whole.Strains, streamed);
            using var ms = new MemoryStream();
            wb.SaveAs(ms);
            return WorkbookWriter.Finish(ms.ToArray(), register, null);
        }

        var streamed = new StreamedTables(rowThreshold: 2);
        byte[] cellByCell = Build(null, out int lastA);
        byte[] streamedBytes = Build(streamed, out int lastB);
        Assert.Contains(streamed.Bodies, b => b.Table.Columns.Count == KineticsTables.LotColumns.Count);

        // When both are reopened
        using var a = new XLWorkbook(new MemoryStream(cellByCell));
        using var b = new XLWorkbook(new MemoryStream(streamedBytes));
        var wa = a.Worksheet(KineticsSheet.SheetName);
        var wb2 = b.Worksheet(KineticsSheet.SheetName);
        int columns = KineticsTables.LotColumns.Count + 1;

        // Then every cell, width and the last row agree
        Assert.Equal(lastA, lastB);
        Assert.Equal(wa.LastRowUsed()!.RowNumber(), lastB);
        Assert.Equal(Cells(wa, lastA + 1, columns), Cells(wb2, lastB + 1, columns));
        Assert.Equal(
            Enumerable.Range(1, columns).Select(c => wa.Column(c).Width).ToArray(),
            Enumerable.Range(1, columns).Select(c => wb2.Column(c).Width).ToArray());
    }
}
