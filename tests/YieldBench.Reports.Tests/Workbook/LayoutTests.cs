using System.Globalization;
using DocumentFormat.OpenXml.Packaging;
using DocumentFormat.OpenXml.Spreadsheet;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Tables;
using YieldBench.Reports.Tests.Fixtures;
using YieldBench.Reports.Workbook;

namespace YieldBench.Reports.Tests.Workbook;

/// <summary>The workbook lays itself out: every cell's text fits its cell at the widths and heights the workbook states.</summary>
public sealed class LayoutTests
{
    private static readonly Lazy<byte[]> Workbook = new(() =>
    {
        using var folder = new TempFolder();
        var review = SampleReview.WithLogs();
        var charts = ReviewCharts.WriteAll(review, folder["charts"]);
        return WorkbookWriter.Build(review, charts, includePictures: false);
    });

    // The demo data reviewed (without the multi-variable candidate, which lives in another project), temperatures in
    // °F: the real lengths of a winery's texts and the °F headings. Pictures are left out: they do not change the cells.
    private static readonly Lazy<byte[]> DemoWorkbook = new(() =>
    {
        string history = Path.Combine(Conventions.ForbiddenCallTests.RepoRoot(), "demo-data", "history");
        var set = YieldBench.Intake.IntakeReader.Read([history], new YieldBench.Intake.IntakeOptions { WorkingDirectory = Conventions.ForbiddenCallTests.RepoRoot() });
        var review = Core.Review.ReviewRunner.Run(set, new Core.Review.ReviewSettings { TemperatureUnit = Core.Units.TemperatureUnit.Fahrenheit }, "9.9.9-test");
        return WorkbookWriter.Build(review, [], includePictures: false);
    });

    private static readonly TextMeasure Measure = new();

    /// <summary>Every written cell of every sheet, with the room the sheet gives it, as the package states it.</summary>
    private static IEnumerable<(string Sheet, string Address, string Text, bool Wrap, double Size, bool Bold, double WidthPx, double HeightPt, bool Numeric)> Cells(byte[] bytes)
    {
        using var doc = SpreadsheetDocument.Open(new MemoryStream(bytes), false);
        var wb = doc.WorkbookPart!;
        var styles = wb.WorkbookStylesPart!.Stylesheet;
        var fonts = styles.Fonts!.Elements<Font>().ToArray();
        var xfs = styles.CellFormats!.Elements<CellFormat>().ToArray();
        var numberFormats = styles.NumberingFormats?.Elements<NumberingFormat>().ToDictionary(n => n.NumberFormatId!.Value, n => n.FormatCode!.Value!) ?? [];
        var shared = wb.SharedStringTablePart?.SharedStringTable.Elements<SharedStringItem>().Select(i => i.InnerText).ToArray() ?? [];
        foreach (var sheet in wb.Workbook.Sheets!.Elements<Sheet>())
        {
            var ws = ((WorksheetPart)wb.GetPartById(sheet.Id!)).Worksheet;
            double defaultHeight = ws.GetFirstChild<SheetFormatProperties>()?.DefaultRowHeight?.Value ?? 15;
            var widths = new Dictionary<int, double>();
            foreach (var col in ws.Descendants<Column>())
            {
                for (uint c = col.Min!.Value; c <= col.Max!.Value; c++)
                {
                    widths[(int)c] = col.Width!.Value;
                }
            }

            double Px(int column) => TextMeasure.TextPixels(widths.GetValueOrDefault(column, 8.43)) ;
            var merged = ws.Descendants<MergeCell>().Select(m => m.Reference!.Value!.Split(':')).ToDictionary(p => p[0], p => p[1]);
            var rows = ws.Descendants<Row>().ToArray();
            var filled = rows.SelectMany(r => r.Elements<Cell>().Where(c => c.CellValue is not null || c.InlineString is not null).Select(c => c.CellReference!.Value!)).ToHashSet();
            foreach (var row in rows)
            {
                double height = row.Height?.Value ?? defaultHeight;
                foreach (var cell in row.Elements<Cell>())
                {
                    string reference = cell.CellReference!.Value!;
                    string? text = cell.DataType?.Value == CellValues.SharedString ? (cell.CellValue is { } index ? shared[int.Parse(index.Text, CultureInfo.InvariantCulture)] : null)
                        : cell.DataType?.Value == CellValues.InlineString ? cell.InlineString!.InnerText
                        : null;
                    var xf = xfs[(int)(cell.StyleIndex?.Value ?? 0)];
                    var font = fonts[(int)(xf.FontId?.Value ?? 0)];
                    double size = font.FontSize?.Val?.Value ?? 11;
                    bool bold = font.Bold is not null;
                    bool wrap = xf.Alignment?.WrapText?.Value ?? false;
                    var (column, rowNumber) = StreamedSheet.ParseReference(reference);
                    // An indent (ECMA-376: each level is three spaces of the body font) takes room from the text.
                    double indent = (xf.Alignment?.Indent?.Value ?? 0) * Measure.Width("   ");
                    double width = Px(column) - indent;
                    if (merged.TryGetValue(reference, out var end))
                    {
                        int last = StreamedSheet.ParseReference(end).Column;
                        width = TextMeasure.TextPixels(Enumerable.Range(column, last - column + 1).Sum(c => widths.GetValueOrDefault(c, 8.43)));
                    }
                    else if (!wrap && text is not null)
                    {
                        // Text that does not wrap may run on over empty cells to its right, and only over them.
                        for (int c = column + 1; !filled.Contains(WorkbookWriter.ColumnLetter(c) + rowNumber.ToString(CultureInfo.InvariantCulture)) && c < column + 40; c++)
                        {
                            width += widths.GetValueOrDefault(c, 8.43) * TextMeasure.PixelsPerWidthUnit;
                        }
                    }

                    if (text is not null)
                    {
                        yield return (sheet.Name!.Value!, reference, text, wrap, size, bold, width, height, false);
                    }
                    else if (cell.DataType?.Value != CellValues.SharedString && cell.CellValue is { } v && double.TryParse(v.Text, NumberStyles.Float, CultureInfo.InvariantCulture, out double number))
                    {
                        uint id = xf.NumberFormatId?.Value ?? 0;
                        string format = numberFormats.GetValueOrDefault(id) ?? (id == 0 ? "General" : "0");
                        string shown = format.StartsWith('[') ? (number < 0.0001 ? "< 0.0001" : number.ToString(ReportColumn.PlainSection(format), CultureInfo.InvariantCulture))
                            : format.Contains('y', StringComparison.Ordinal) ? "2000-01-01 00:00"
                            : format == "General" ? number.ToString("G10", CultureInfo.InvariantCulture)
                            : number.ToString(format.Replace("\\", string.Empty, StringComparison.Ordinal), CultureInfo.InvariantCulture);
                        yield return (sheet.Name!.Value!, reference, shown, false, size, bold, Px(column), height, true);
                    }
                }
            }
        }
    }

    [Theory]
    [InlineData("sample")]
    [InlineData("demo")]
    public void No_table_heading_wraps_to_more_than_four_lines(string workbook)
    {
        // Given every bold body-size cell that wraps (the tables' headings; section titles are larger)
        var measure = new TextMeasure();
        var headings = Cells(workbook == "demo" ? DemoWorkbook.Value : Workbook.Value).Where(c => c.Bold && c.Wrap && c.Size == TextMeasure.BodySize).ToArray();
        Assert.Contains(headings, c => c.Text == "95 % of lots: high (% v/v)");

        // When each is measured at the width its column was given
        var tall = headings.Where(c => measure.Lines(c.Text, c.WidthPx, c.Size, bold: true) > SheetPlan.MostHeadingLines)
            .Select(c => $"{c.Sheet}!{c.Address}: {measure.Lines(c.Text, c.WidthPx, c.Size, bold: true)} lines in {c.WidthPx:0} px: '{c.Text}'").ToArray();

        // Then none takes more than four lines (the Overview's "95 % of lots: high (% v/v)" took six in a 46 px column,
        // and made its table's header row six lines tall)
        Assert.True(tall.Length == 0, string.Join("\n", tall));
    }

    [Fact]
    public void A_text_column_right_of_a_number_column_starts_one_indent_in_and_others_do_not()
    {
        // Given the demo's workbook, whose Overview factor table has "Held-out lots scored" (numbers, right-aligned)
        // followed by "Ranges from" (text), and "Strain" (text) first
        using var doc = SpreadsheetDocument.Open(new MemoryStream(DemoWorkbook.Value), false);
        var wb = doc.WorkbookPart!;
        var xfs = wb.WorkbookStylesPart!.Stylesheet.CellFormats!.Elements<CellFormat>().ToArray();
        var shared = wb.SharedStringTablePart!.SharedStringTable.Elements<SharedStringItem>().Select(i => i.InnerText).ToArray();
        var sheet = wb.Workbook.Sheets!.Elements<Sheet>().First();
        var cells = ((WorksheetPart)wb.GetPartById(sheet.Id!)).Worksheet.Descendants<Cell>().ToArray();
        string? Text(Cell c) => c.DataType?.Value == CellValues.SharedString && c.CellValue is { } v ? shared[int.Parse(v.Text, CultureInfo.InvariantCulture)] : c.InlineString?.InnerText;
        uint Indent(Cell c) => xfs[(int)(c.StyleIndex?.Value ?? 0)].Alignment?.Indent?.Value ?? 0;
        Cell Below(Cell header) => cells.First(c => c.CellReference!.Value == WorkbookWriter.ColumnLetter(StreamedSheet.ParseReference(header.CellReference!.Value!).Column) + (StreamedSheet.ParseReference(header.CellReference!.Value!).Row + 1).ToString(CultureInfo.InvariantCulture));

        // When the headings and the first row under them are read
        var ranges = cells.First(c => Text(c) == "Ranges from");
        var strain = cells.First(c => Text(c) == "Strain");

        // Then the text after the numbers is indented one level, heading and values alike (before: "218all 218 lots…"
        // in LibreOffice), and the first column is not
        Assert.Equal((1u, 1u), (Indent(ranges), Indent(Below(ranges))));
        Assert.StartsWith("all ", Text(Below(ranges)), StringComparison.Ordinal);
        Assert.Equal((0u, 0u), (Indent(strain), Indent(Below(strain))));
    }

    [Theory]
    [InlineData("sample")]
    [InlineData("demo")]
    public void Every_written_cell_fits_its_cell_at_the_computed_width_and_height(string workbook)
    {
        // Given the sample workbook with logs (or the demo's, in °F), and the shipped font the layout measured with
        var measure = new TextMeasure();
        var cells = Cells(workbook == "demo" ? DemoWorkbook.Value : Workbook.Value).ToArray();

        // When each cell's text is measured again: wrapped text for its lines against its row's height, other text and
        // numbers for their width against the room they have
        var misfits = new List<string>();
        foreach (var c in cells)
        {
            if (c.Wrap)
            {
                int lines = measure.Lines(c.Text, c.WidthPx, c.Size, c.Bold);
                double needed = lines * TextMeasure.LineHeight(c.Size);
                if (needed > c.HeightPt + 0.01)
                {
                    misfits.Add($"{c.Sheet}!{c.Address}: {lines} line(s) need {needed:0.0} pt, the row has {c.HeightPt:0.0}: '{c.Text}'");
                }
            }
            else if (measure.Width(c.Text, c.Size, c.Bold) > c.WidthPx + 0.5)
            {
                misfits.Add($"{c.Sheet}!{c.Address}: {measure.Width(c.Text, c.Size, c.Bold):0} px wide in {c.WidthPx:0} px: '{c.Text}'");
            }

            if (!c.Wrap && TextMeasure.LineHeight(c.Size) > c.HeightPt + 0.01)
            {
                misfits.Add($"{c.Sheet}!{c.Address}: a {c.Size} pt line in a row of {c.HeightPt:0.0} pt");
            }
        }

        // Then nothing runs into another cell or is cut off (and the check saw the whole workbook, tables included)
        Assert.Empty(misfits);
        Assert.True(cells.Length > 1000, $"{cells.Length} cells");
        Assert.Contains(cells, c => c.Wrap && c.Sheet == WorkbookWriter.Sheets.FollowUp);
        Assert.Contains(cells, c => c.Numeric && c.Sheet == WorkbookWriter.Sheets.KineticsByLot);
    }

    [Fact]
    public void The_check_catches_text_too_long_for_its_cell()
    {
        // Given a measure and a cell of 10 width units holding a 40-character word, and one wrapped over 3 lines in a default row
        var measure = new TextMeasure();
        string word = new('W', 40);
        double px = TextMeasure.TextPixels(10);

        // Then the word is wider than the cell, and three lines need more than a 15 pt row
        Assert.True(measure.Width(word) > px);
        Assert.True(measure.Lines("one two three four five six seven eight nine ten eleven twelve", px) * TextMeasure.LineHeight(10) > 15);
    }

    [Fact]
    public void Every_table_sheet_freezes_and_filters_its_header_and_every_sheet_prints_landscape_one_page_wide()
    {
        // Given the sample workbook with logs
        using var doc = SpreadsheetDocument.Open(new MemoryStream(Workbook.Value), false);
        var wb = doc.WorkbookPart!;
        string[] tableSheets = [WorkbookWriter.Sheets.FollowUp, WorkbookWriter.Sheets.Lots, WorkbookWriter.Sheets.KineticsByLot, WorkbookWriter.Sheets.IntakeIssues, .. WorkbookWriter.Sheets.Groupings.Select(g => g.Sheet)];
        var printAreas = wb.Workbook.DefinedNames!.Elements<DefinedName>().Where(d => d.Name == "_xlnm.Print_Area").Select(d => (int)d.LocalSheetId!.Value).ToHashSet();
        var titles = wb.Workbook.DefinedNames!.Elements<DefinedName>().Where(d => d.Name == "_xlnm.Print_Titles").Select(d => (int)d.LocalSheetId!.Value).ToHashSet();
        var sheets = wb.Workbook.Sheets!.Elements<Sheet>().ToArray();

        for (int i = 0; i < sheets.Length; i++)
        {
            var ws = ((WorksheetPart)wb.GetPartById(sheets[i].Id!)).Worksheet;
            var setup = ws.GetFirstChild<PageSetup>()!;

            // Then every sheet prints landscape, fitted to one page wide, within a print area
            Assert.Equal(OrientationValues.Landscape, setup.Orientation!.Value);
            Assert.Equal(1u, setup.FitToWidth?.Value ?? 1u); // 1 is the attribute's default, written by leaving it out
            Assert.Equal(0u, setup.FitToHeight?.Value);
            Assert.True(ws.GetFirstChild<SheetProperties>()?.PageSetupProperties?.FitToPage?.Value, sheets[i].Name);
            Assert.Contains(i, printAreas);

            // And the table sheets freeze their header row, filter it and repeat it on every printed page
            if (tableSheets.Contains(sheets[i].Name!.Value))
            {
                var pane = ws.Descendants<Pane>().Single();
                Assert.Equal(1.0, pane.VerticalSplit!.Value);
                Assert.NotNull(ws.GetFirstChild<AutoFilter>());
                Assert.Contains(i, titles);
            }
        }

        Assert.Contains(sheets, s => s.Name == WorkbookWriter.Sheets.KineticsByLot);
    }
}
