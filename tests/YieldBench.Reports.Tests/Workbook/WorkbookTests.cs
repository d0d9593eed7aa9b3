using System.Globalization;
using YieldBench.Core.Lots;
using System.Data;
using ClosedXML.Excel;
using DocumentFormat.OpenXml.Packaging;
using DocumentFormat.OpenXml.Validation;
using ExcelDataReader;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Tests.Fixtures;
using YieldBench.Reports.Workbook;
using C = DocumentFormat.OpenXml.Drawing.Charts;

namespace YieldBench.Reports.Tests.Workbook;

/// <summary>Builds the sample workbook once for the tests that only read it (charts take seconds to draw).</summary>
public sealed class WorkbookFixture : IDisposable
{
    private readonly TempFolder folder = new();

    public WorkbookFixture()
    {
        Review = SampleReview.Build();
        Charts = ReviewCharts.WriteAll(Review, folder["charts"]);
        Bytes = WorkbookWriter.Build(Review, Charts);
        PictureFree = WorkbookWriter.Build(Review, Charts, includePictures: false);
    }

    public Core.Review.ReviewResult Review { get; }

    public IReadOnlyList<ChartFile> Charts { get; }

    public byte[] Bytes { get; }

    public byte[] PictureFree { get; }

    public byte[] BuildAgain() => WorkbookWriter.Build(SampleReview.Build(), Charts);

    public void Dispose() => folder.Dispose();
}

public sealed class WorkbookTests(WorkbookFixture fixture) : IClassFixture<WorkbookFixture>
{
    private (byte[] Bytes, IReadOnlyList<ChartFile> Charts) Build(bool pictures = true) =>
        (pictures ? fixture.Bytes : fixture.PictureFree, fixture.Charts);

    [Fact]
    public void The_workbook_passes_the_Open_XML_validator_with_no_errors()
    {
        // Given a workbook with the native chart and every PNG chart
        var (bytes, _) = Build();

        // When the Open XML SDK 2.20 validator checks it (Office 2019 rules)
        using var doc = SpreadsheetDocument.Open(new MemoryStream(bytes), false);
        var errors = new OpenXmlValidator(DocumentFormat.OpenXml.FileFormatVersions.Office2019).Validate(doc)
            .Select(e => $"{e.Part?.Uri} {e.Path?.XPath}: {e.Description}").ToArray();

        // Then it finds nothing
        Assert.Empty(errors);
    }

    [Fact]
    public void The_sheets_are_in_the_documented_order()
    {
        // Given a workbook
        var (bytes, _) = Build();

        // When its sheet names are read
        using var doc = SpreadsheetDocument.Open(new MemoryStream(bytes), false);
        string[] names = doc.WorkbookPart!.Workbook.Sheets!.Elements<DocumentFormat.OpenXml.Spreadsheet.Sheet>().Select(s => s.Name!.Value!).ToArray();

        // Then they are ours, in reading order: the decisions and the lots to look at first (no kinetics sheets without logs)
        Assert.Equal(
            [
                "Overview", "Follow-up", "Lots", "Strain comparison", "House factor", "Planner",
                "By strain", "By vessel", "By sugar band", "By variety", "By season", "Strain by vessel", "Strain by season",
                "Intake issues", "Methods and cautions",
            ],
            names);
    }

    [Fact]
    public void The_lots_sheet_reads_back_with_the_values_of_the_review()
    {
        // Given a workbook of a review
        var review = fixture.Review;
        var (bytes, _) = Build();

        // When the lots sheet is read with a managed reader (no libgdiplus needed even with pictures)
        var lots = ReadSheet(bytes, "Lots");

        // Then every lot is there, grouped by strain, with its numbers unchanged
        Assert.Equal(review.Lots.Count, lots.Rows.Count - 1);
        Assert.Equal("Lot", lots.Rows[0][0]);
        Assert.Equal("Flags", lots.Rows[0][3]);
        Assert.Equal("Starting sugar after additions (°Brix)", lots.Rows[0][4]);
        var first = review.Lots.Where(l => l.Lot.Strain == "ST-A").OrderBy(l => l.Lot.Season).ThenBy(l => l.Lot.LotId, StringComparer.Ordinal).First();
        Assert.Equal(first.Lot.LotId, lots.Rows[1][0]);
        Assert.Equal("ST-A", lots.Rows[1][2]);
        Assert.Equal(first.EffectiveStartingBrix, (double)lots.Rows[1][4], 12);
        Assert.Equal(first.Lot.FinalAlcohol.PercentVolume, (double)lots.Rows[1][5], 12);
        Assert.Equal(first.AbvPerBrix, (double)lots.Rows[1][6], 12);
        Assert.Equal(2024.0, (double)lots.Rows[1][1]);
    }

    [Fact]
    public void A_formula_looking_note_is_stored_as_text_not_as_a_formula()
    {
        // Given a lot whose note looks like a formula
        var (bytes, _) = Build();

        // When the lots sheet's cells are inspected in the package
        using var doc = SpreadsheetDocument.Open(new MemoryStream(bytes), false);
        var part = SheetPart(doc, "Lots");
        int formulas = part.Worksheet.Descendants<DocumentFormat.OpenXml.Spreadsheet.CellFormula>().Count();
        var lots = ReadSheet(bytes, "Lots");

        // Then no cell holds a formula and the note reads back as the same text
        Assert.Equal(0, formulas);
        Assert.Contains(lots.Rows.Cast<DataRow>(), r => Equals(r[35], SampleReview.InjectedNote));
    }

    [Fact]
    public void The_native_chart_has_one_series_per_strain_bound_to_the_lots_sheet()
    {
        // Given a workbook
        var (bytes, _) = Build();

        // When the overview's chart part is read
        using var doc = SpreadsheetDocument.Open(new MemoryStream(bytes), false);
        var drawings = SheetPart(doc, "Overview").DrawingsPart!;
        var chart = drawings.ChartParts.Single().ChartSpace;
        var series = chart.Descendants<C.ScatterChartSeries>().ToArray();
        var names = series.Select(s => s.SeriesText!.Descendants<C.NumericValue>().Single().Text).ToArray();
        var xRefs = series.Select(s => s.GetFirstChild<C.XValues>()!.Descendants<C.Formula>().Single().Text).ToArray();
        var yRefs = series.Select(s => s.GetFirstChild<C.YValues>()!.Descendants<C.Formula>().Single().Text).ToArray();

        // Then each strain is a block of rows of columns E (starting sugar) and F (final alcohol) of 'Lots'
        Assert.Equal(["ST-A", "ST-B", "ST-C"], names);
        Assert.Equal(["'Lots'!$E$2:$E$13", "'Lots'!$E$14:$E$25", "'Lots'!$E$26:$E$37"], xRefs);
        Assert.Equal(["'Lots'!$F$2:$F$13", "'Lots'!$F$14:$F$25", "'Lots'!$F$26:$F$37"], yRefs);
    }

    [Fact]
    public void Every_chart_is_placed_as_a_picture_and_the_key_ones_on_the_overview()
    {
        // Given a workbook and its charts
        var (bytes, charts) = Build();

        // When the pictures of each sheet are counted
        using var doc = SpreadsheetDocument.Open(new MemoryStream(bytes), false);
        int Pictures(string sheet) => SheetPart(doc, sheet).DrawingsPart?.WorksheetDrawing?.Descendants<DocumentFormat.OpenXml.Drawing.Spreadsheet.Picture>().Count() ?? 0;

        // Then the overview shows the two charts that answer its questions without logs (alcohol against sugar, the
        // strains compared), and each other chart is on the sheet it explains: the lots sheet its alcohol-vs-sugar
        // chart, the strain comparison its three factor charts, the house-factor sheet its two backtest charts, the
        // planner its planning chart
        Assert.Equal(8, charts.Count);
        Assert.Equal(2, Pictures("Overview"));
        Assert.Equal(1, Pictures("Lots"));
        Assert.Equal(3, Pictures("Strain comparison"));
        Assert.Equal(2, Pictures("House factor"));
        Assert.Equal(1, Pictures("Planner"));
        Assert.Equal(0, Pictures("Methods and cautions"));
    }

    [Fact]
    public void Every_picture_part_holds_the_bytes_of_the_chart_it_shows()
    {
        // Given a workbook whose pictures went in as stand-ins filled when the package was finished
        var (bytes, charts) = Build();
        using var doc = SpreadsheetDocument.Open(new MemoryStream(bytes), false);
        int checkedPictures = 0;
        foreach (var sheet in doc.WorkbookPart!.WorksheetParts)
        {
            if (sheet.DrawingsPart is not { } drawings)
            {
                continue;
            }

            foreach (var picture in drawings.WorksheetDrawing!.Descendants<DocumentFormat.OpenXml.Drawing.Spreadsheet.Picture>())
            {
                // When each picture's image part is read and matched to its chart by the picture's description
                string title = picture.NonVisualPictureProperties!.NonVisualDrawingProperties!.Description!.Value!;
                var chart = Assert.Single(charts, c => c.Title == title);
                var part = (ImagePart)drawings.GetPartById(picture.BlipFill!.Blip!.Embed!.Value!);
                using var content = new MemoryStream();
                using (var stream = part.GetStream())
                {
                    stream.CopyTo(content);
                }

                // Then the part holds exactly the chart's PNG
                Assert.Equal(File.ReadAllBytes(chart.Path), content.ToArray());
                checkedPictures++;
            }
        }

        Assert.Equal(9, checkedPictures);
    }

    [Fact]
    public void The_same_review_gives_the_same_workbook_bytes()
    {
        // Given one review built twice, from scratch
        var (first, _) = Build();
        var second = fixture.BuildAgain();

        // When compared byte for byte
        // Then they are identical (fixed package times, fixed zip entry times, no clock inside)
        Assert.Equal(first.Length, second.Length);
        Assert.True(first.AsSpan().SequenceEqual(second), "workbook bytes differ between runs");
    }

    [Fact]
    public void The_package_carries_no_clock_time()
    {
        // Given a workbook
        var (bytes, _) = Build();

        // When its package properties and zip entry times are read
        using var doc = SpreadsheetDocument.Open(new MemoryStream(bytes), false);
        using var zip = new System.IO.Compression.ZipArchive(new MemoryStream(bytes));

        // Then they carry the fixed values
        Assert.Equal(WorkbookWriter.FixedTimestamp, doc.PackageProperties.Created!.Value.ToUniversalTime());
        Assert.All(zip.Entries, e => Assert.Equal(1980, e.LastWriteTime.Year));
    }

    [Fact]
    public void A_picture_free_workbook_reopens_in_ClosedXML_with_the_values()
    {
        // Given the workbook without pictures (ClosedXML needs libgdiplus to open one with pictures)
        var review = fixture.Review;
        var (bytes, _) = Build(pictures: false);

        // When ClosedXML opens it
        using var wb = new XLWorkbook(new MemoryStream(bytes));
        var lots = wb.Worksheet("Lots");

        // Then the header is frozen, filtered, and the values are there with their formats
        Assert.Equal(1, lots.SheetView.SplitRow);
        Assert.True(lots.AutoFilter.IsEnabled);
        Assert.Equal(review.Lots.Count + 1, lots.LastRowUsed()!.RowNumber());
        Assert.Equal("0.00", lots.Cell(2, 5).Style.NumberFormat.Format);
        var overview = wb.Worksheet("Overview");
        Assert.StartsWith("Review of lots-2024.csv, lots-2025.csv (seasons 2024–2025)", overview.Cell(1, 1).GetString(), StringComparison.Ordinal);
        var used = overview.Column(1).CellsUsed().Single(c => c.GetString() == "Lots used");
        Assert.Equal(review.Lots.Count, used.CellRight().GetValue<int>());
    }

    [Fact]
    public void The_methods_sheet_records_each_input_file_with_its_SHA_256_the_settings_and_the_version()
    {
        // Given a workbook of a review of two files
        var (bytes, _) = Build();

        // When the methods sheet is read
        var methods = ReadSheet(bytes, "Methods and cautions");
        var cells = methods.Rows.Cast<DataRow>().SelectMany(r => r.ItemArray).OfType<string>().ToArray();

        // Then each file and its hash are there, with the version, the seed and the cautions
        Assert.Contains("lots-2024.csv", cells);
        Assert.Contains(new string('a', 64), cells);
        Assert.Contains(new string('b', 64), cells);
        Assert.Contains("YieldBench 9.9.9-test", cells);
        Assert.Contains("20261", cells);
        Assert.Contains(cells, c => c.StartsWith("This is an estimate from past lots, not a label statement", StringComparison.Ordinal));
        Assert.Contains(cells, c => c.Contains("OIV-MA-AS2-02", StringComparison.Ordinal));
    }

    [Fact]
    public void The_overview_counts_lots_issues_and_flags_as_the_review_does()
    {
        // Given a workbook of the sample review
        var review = fixture.Review;
        var (bytes, _) = Build();

        // When the overview's label/value pairs are read
        var overview = ReadSheet(bytes, "Overview");
        var pairs = overview.Rows.Cast<DataRow>()
            .Where(r => r[0] is string && r[1] is not DBNull)
            .GroupBy(r => (string)r[0]).ToDictionary(g => g.Key, g => g.First()[1]);

        // Then the counts match the review (36 lots, 1 row left out, 2 issues, the flagged lots: one line each)
        Assert.Equal(36.0, Convert.ToDouble(pairs["Lots used"], System.Globalization.CultureInfo.InvariantCulture));
        Assert.Equal(1.0, Convert.ToDouble(pairs["Rows left out"], System.Globalization.CultureInfo.InvariantCulture));
        Assert.Equal(2.0, Convert.ToDouble(pairs["Intake issues"], System.Globalization.CultureInfo.InvariantCulture));
        int flagged = review.Lots.Count(l => review.Strains.Flags.Any(f => f.LotKey == l.Lot.Key));
        Assert.True(flagged >= 2);
        var texts = overview.Rows.Cast<DataRow>().Select(r => r[0]).OfType<string>().ToArray();
        Assert.Contains(texts, t => t.StartsWith($"{flagged} lots, one line each", StringComparison.Ordinal));
        Assert.Equal(flagged, review.Findings.Count);
        Assert.All(review.Findings, f => Assert.Contains(texts, t => t.StartsWith($"{f.Key} {f.Strain} (", StringComparison.Ordinal)));
        Assert.Equal("2024, 2025", pairs["Seasons"]);
    }

    [Fact]
    public void Flagged_lots_are_highlighted_on_the_lots_sheet_and_others_are_not()
    {
        // Given a picture-free workbook reopened in ClosedXML
        var review = fixture.Review;
        var (bytes, _) = Build(pictures: false);
        using var wb = new XLWorkbook(new MemoryStream(bytes));
        var lots = wb.Worksheet("Lots");

        // When each row's fill is compared with the strain review's flags
        for (int row = 2; row <= review.Lots.Count + 1; row++)
        {
            var key = new LotKey(lots.Cell(row, 2).GetValue<int>(), lots.Cell(row, 1).GetString());
            bool flagged = review.Strains.Flags.Any(f => f.LotKey == key);
            var fill = lots.Cell(row, 1).Style.Fill.BackgroundColor;

            // Then flagged rows carry the highlight colour and the others none
            Assert.Equal(flagged, fill.HasValue && (fill.Color.R, fill.Color.G, fill.Color.B) == (0xFB, 0xE8, 0xC4));
        }
    }

    [Fact]
    public void The_native_chart_points_at_the_lots_rows_that_hold_its_values()
    {
        // Given the workbook with pictures (its lots rows streamed into the package)
        using var doc = SpreadsheetDocument.Open(new MemoryStream(fixture.Bytes), false);
        var series = SheetPart(doc, WorkbookWriter.Sheets.Overview).DrawingsPart!.ChartParts.Single().ChartSpace.Descendants<C.ScatterChartSeries>().ToArray();
        var lots = WorkbookTests.ReadSheet(fixture.Bytes, WorkbookWriter.Sheets.Lots);

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
    public void Column_letters_follow_the_spreadsheet_scheme()
    {
        // Given column numbers
        // When converted
        // Then 1 → A, 26 → Z, 27 → AA, 702 → ZZ, 703 → AAA
        Assert.Equal("A", WorkbookWriter.ColumnLetter(1));
        Assert.Equal("Z", WorkbookWriter.ColumnLetter(26));
        Assert.Equal("AA", WorkbookWriter.ColumnLetter(27));
        Assert.Equal("ZZ", WorkbookWriter.ColumnLetter(702));
        Assert.Equal("AAA", WorkbookWriter.ColumnLetter(703));
    }

    internal static DataTable ReadSheet(byte[] bytes, string sheet)
    {
        // ExcelDataReader asks for code page 1252 even for .xlsx; .NET ships it behind this provider.
        System.Text.Encoding.RegisterProvider(System.Text.CodePagesEncodingProvider.Instance);
        using var reader = ExcelReaderFactory.CreateReader(new MemoryStream(bytes));
        do
        {
            if (reader.Name != sheet)
            {
                continue;
            }

            var table = new DataTable(sheet);
            for (int c = 0; c < reader.FieldCount; c++)
            {
                table.Columns.Add("c" + c, typeof(object));
            }

            while (reader.Read())
            {
                var values = new object[reader.FieldCount];
                for (int c = 0; c < reader.FieldCount; c++)
                {
                    values[c] = reader.GetValue(c) ?? DBNull.Value;
                }

                table.Rows.Add(values);
            }

            return table;
        }
        while (reader.NextResult());
        throw new InvalidOperationException("no sheet " + sheet);
    }

    private static WorksheetPart SheetPart(SpreadsheetDocument doc, string name)
    {
        var sheet = doc.WorkbookPart!.Workbook.Sheets!.Elements<DocumentFormat.OpenXml.Spreadsheet.Sheet>().First(s => s.Name == name);
        return (WorksheetPart)doc.WorkbookPart.GetPartById(sheet.Id!);
    }
}
