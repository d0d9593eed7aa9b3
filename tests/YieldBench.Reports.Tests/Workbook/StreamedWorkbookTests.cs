using System.Data;
using System.Globalization;
using ClosedXML.Excel;
using DocumentFormat.OpenXml.Packaging;
using DocumentFormat.OpenXml.Validation;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Tests.Fixtures;
using YieldBench.Reports.Workbook;
using C = DocumentFormat.OpenXml.Drawing.Charts;

namespace YieldBench.Reports.Tests.Workbook;

/// <summary>The sample workbook built as usual and with every table of more than two rows streamed.</summary>
public sealed class StreamedWorkbookFixture : IDisposable
{
    public const int Threshold = 2;

    private readonly TempFolder folder = new();

    public StreamedWorkbookFixture()
    {
        Review = SampleReview.Build();
        Charts = ReviewCharts.WriteAll(Review, folder["charts"]);
        CellByCell = WorkbookWriter.Build(Review, Charts, includePictures: false);
        Streamed = WorkbookWriter.Build(Review, Charts, includePictures: false, Threshold);
        StreamedWithPictures = WorkbookWriter.Build(Review, Charts, includePictures: true, Threshold);
    }

    public Core.Review.ReviewResult Review { get; }

    public IReadOnlyList<ChartFile> Charts { get; }

    public byte[] CellByCell { get; }

    public byte[] Streamed { get; }

    public byte[] StreamedWithPictures { get; }

    public void Dispose() => folder.Dispose();
}

public sealed class StreamedWorkbookTests(StreamedWorkbookFixture fixture) : IClassFixture<StreamedWorkbookFixture>
{
    private static string Describe(IXLCell cell)
    {
        var style = cell.Style;
        string fill = style.Fill.BackgroundColor.HasValue && style.Fill.PatternType == XLFillPatternValues.Solid
            ? style.Fill.BackgroundColor.Color.ToArgb().ToString("X8", CultureInfo.InvariantCulture)
            : "none";
        string value = cell.IsEmpty() ? "(empty)" : Convert.ToString(cell.Value, CultureInfo.InvariantCulture) ?? "(null)";
        return $"{cell.Address} {cell.DataType} [{value}] formula={cell.HasFormula} format='{style.NumberFormat.Format}' fill={fill} wrap={style.Alignment.WrapText} bold={style.Font.Bold}";
    }

    private static WorksheetPart SheetPart(SpreadsheetDocument doc, string name)
    {
        var sheet = doc.WorkbookPart!.Workbook.Sheets!.Elements<DocumentFormat.OpenXml.Spreadsheet.Sheet>().First(s => s.Name == name);
        return (WorksheetPart)doc.WorkbookPart.GetPartById(sheet.Id!);
    }

    [Fact]
    public void The_long_tables_of_the_sample_are_really_streamed()
    {
        // Given the workbook built with a threshold of two rows
        // When the lots sheet part is inspected
        using var doc = SpreadsheetDocument.Open(new MemoryStream(fixture.Streamed), false);
        var cells = SheetPart(doc, WorkbookWriter.Sheets.Lots).Worksheet.Descendants<DocumentFormat.OpenXml.Spreadsheet.Cell>().ToArray();
        using var usual = SpreadsheetDocument.Open(new MemoryStream(fixture.CellByCell), false);
        var usualCells = SheetPart(usual, WorkbookWriter.Sheets.Lots).Worksheet.Descendants<DocumentFormat.OpenXml.Spreadsheet.Cell>().ToArray();

        // Then its text cells are inline strings (the streamed writer's), where the usual build has shared strings only
        Assert.Contains(cells, c => c.DataType?.Value == DocumentFormat.OpenXml.Spreadsheet.CellValues.InlineString);
        Assert.DoesNotContain(usualCells, c => c.DataType?.Value == DocumentFormat.OpenXml.Spreadsheet.CellValues.InlineString);
    }

    [Fact]
    public void Every_sheet_reopens_in_ClosedXML_as_in_the_cell_by_cell_workbook()
    {
        // Given the usual and the streamed workbook of one review
        using var a = new XLWorkbook(new MemoryStream(fixture.CellByCell));
        using var b = new XLWorkbook(new MemoryStream(fixture.Streamed));

        // When every sheet is compared cell by cell
        Assert.Equal(a.Worksheets.Select(w => w.Name).ToArray(), b.Worksheets.Select(w => w.Name).ToArray());
        foreach (var wa in a.Worksheets)
        {
            var wb = b.Worksheet(wa.Name);
            int rows = wa.LastRowUsed()!.RowNumber() + 1;
            int columns = wa.LastColumnUsed()!.ColumnNumber() + 1;

            // Then values, types, formats, fills, widths, freeze and filters agree
            Assert.Equal(rows, wb.LastRowUsed()!.RowNumber() + 1);
            for (int r = 1; r <= rows; r++)
            {
                for (int c = 1; c <= columns; c++)
                {
                    Assert.Equal(Describe(wa.Cell(r, c)), Describe(wb.Cell(r, c)));
                }
            }

            Assert.Equal(
                Enumerable.Range(1, columns).Select(c => wa.Column(c).Width).ToArray(),
                Enumerable.Range(1, columns).Select(c => wb.Column(c).Width).ToArray());
            Assert.Equal(wa.SheetView.SplitRow, wb.SheetView.SplitRow);
            Assert.Equal(wa.AutoFilter.IsEnabled, wb.AutoFilter.IsEnabled);
            if (wa.AutoFilter.IsEnabled)
            {
                Assert.Equal(wa.AutoFilter.Range.RangeAddress.ToString(), wb.AutoFilter.Range.RangeAddress.ToString());
            }
        }
    }

    [Fact]
    public void The_native_chart_points_at_the_streamed_lots_rows_that_hold_its_values()
    {
        // Given the streamed workbook with pictures
        using var doc = SpreadsheetDocument.Open(new MemoryStream(fixture.StreamedWithPictures), false);
        var series = SheetPart(doc, WorkbookWriter.Sheets.Overview).DrawingsPart!.ChartParts.Single().ChartSpace.Descendants<C.ScatterChartSeries>().ToArray();
        var lots = WorkbookTests.ReadSheet(fixture.StreamedWithPictures, WorkbookWriter.Sheets.Lots);

        // When each series' X and Y ranges are resolved against the lots sheet
        Assert.Equal(3, series.Length);
        foreach (var s in series)
        {
            foreach (var values in new C.NumberReference[] { s.GetFirstChild<C.XValues>()!.NumberReference!, s.GetFirstChild<C.YValues>()!.NumberReference! })
            {
                string range = values.Formula!.Text;
                var m = System.Text.RegularExpressions.Regex.Match(range, @"^'Lots'!\$([A-Z]+)\$(\d+):\$\1\$(\d+)$");
                Assert.True(m.Success, range);
                int column = StreamedSheet.ParseReference(m.Groups[1].Value + "1").Column - 1;
                int first = int.Parse(m.Groups[2].Value, CultureInfo.InvariantCulture), last = int.Parse(m.Groups[3].Value, CultureInfo.InvariantCulture);
                var cached = values.NumberingCache!.Elements<C.NumericPoint>().Select(p => double.Parse(p.NumericValue!.Text, CultureInfo.InvariantCulture)).ToArray();

                // Then the cells there hold the chart's cached values, row for row
                Assert.Equal(last - first + 1, cached.Length);
                for (int i = 0; i < cached.Length; i++)
                {
                    Assert.Equal(cached[i], Convert.ToDouble(lots.Rows[first - 1 + i][column], CultureInfo.InvariantCulture));
                }
            }
        }
    }

    [Fact]
    public void The_streamed_workbook_with_pictures_passes_the_Open_XML_validator()
    {
        // Given the streamed workbook with every picture (the lots sheet's picture was added before its rows)
        using var doc = SpreadsheetDocument.Open(new MemoryStream(fixture.StreamedWithPictures), false);

        // When the validator checks it
        var errors = new OpenXmlValidator(DocumentFormat.OpenXml.FileFormatVersions.Office2019).Validate(doc)
            .Select(e => $"{e.Part?.Uri} {e.Path?.XPath}: {e.Description}").ToArray();

        // Then it finds nothing, and the lots sheet still has its picture
        Assert.Empty(errors);
        Assert.Single(SheetPart(doc, WorkbookWriter.Sheets.Lots).DrawingsPart!.WorksheetDrawing!.Descendants<DocumentFormat.OpenXml.Drawing.Spreadsheet.Picture>());
    }

    [Fact]
    public void The_streamed_lots_sheet_reads_back_with_a_managed_reader_as_the_usual_one()
    {
        // Given both workbooks
        // When their lots sheets are read with ExcelDataReader
        var usual = WorkbookTests.ReadSheet(fixture.CellByCell, WorkbookWriter.Sheets.Lots);
        var streamed = WorkbookTests.ReadSheet(fixture.StreamedWithPictures, WorkbookWriter.Sheets.Lots);

        // Then every row holds the same values (numbers to 14 significant digits: the usual build stores 15)
        Assert.Equal(fixture.Review.Lots.Count + 1, streamed.Rows.Count);
        Assert.Equal(usual.Rows.Count, streamed.Rows.Count);
        for (int r = 0; r < usual.Rows.Count; r++)
        {
            for (int c = 0; c < usual.Columns.Count; c++)
            {
                object x = usual.Rows[r][c], y = streamed.Rows[r][c];
                if (x is double dx)
                {
                    double dy = Assert.IsType<double>(y);
                    Assert.True(Math.Abs(dx - dy) <= 1e-14 * Math.Max(1, Math.Abs(dx)), $"row {r + 1}, column {c + 1}: {dx:R} vs {dy:R}");
                }
                else
                {
                    Assert.Equal(x, y);
                }
            }
        }
    }

    [Fact]
    public void The_same_review_gives_the_same_streamed_bytes()
    {
        // Given the review built again from scratch and streamed
        byte[] again = WorkbookWriter.Build(SampleReview.Build(), fixture.Charts, includePictures: true, StreamedWorkbookFixture.Threshold);

        // Then the bytes are identical
        Assert.True(fixture.StreamedWithPictures.AsSpan().SequenceEqual(again), "streamed workbook bytes differ between runs");
    }
}
