using ClosedXML.Excel;
using DocumentFormat.OpenXml.Packaging;
using YieldBench.Core.Conversion;
using YieldBench.Core.Review;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Kinetics;
using YieldBench.Reports.Output;
using YieldBench.Reports.Tables;

namespace YieldBench.Reports.Workbook;

/// <summary>
/// Writes report.xlsx: ClosedXML lays out the sheets (<see cref="WorkbookSheets"/>, each a <see cref="SheetPlan"/> that
/// sizes its columns and rows from its text), then the Open XML SDK adds the native alcohol-vs-sugar chart (bound to the
/// lots sheet's cells) and the PNG charts as pictures, and the package is normalised so the same review gives the same
/// bytes. Every table's rows are streamed into the package as it is finished (<see cref="StreamedSheet"/>), never held
/// as ClosedXML cells, which keeps the workbook's time and memory near-linear in the lots.
/// </summary>
public static class WorkbookWriter
{
    /// <summary>Sheet names, in workbook order (plain words of our own).</summary>
    public static class Sheets
    {
        /// <summary>Overview: the decisions first.</summary>
        public const string Overview = "Overview";

        /// <summary>One row per lot to look at.</summary>
        public const string FollowUp = "Follow-up";

        /// <summary>Every lot.</summary>
        public const string Lots = "Lots";

        /// <summary>The strain comparison.</summary>
        public const string StrainComparison = "Strain comparison";

        /// <summary>House factor backtest and recommendation.</summary>
        public const string HouseFactor = "House factor";

        /// <summary>Planner table.</summary>
        public const string Planner = "Planner";

        /// <summary>Kinetics by strain and findings (when logs exist).</summary>
        public const string Kinetics = KineticsSheet.SheetName;

        /// <summary>Kinetics of every lot with a log (when logs exist).</summary>
        public const string KineticsByLot = "Kinetics by lot";

        /// <summary>One sheet per grouping of the strain review, in report order.</summary>
        public static IReadOnlyList<(string Grouping, string Sheet)> Groupings { get; } =
        [
            (Core.Review.Strains.Groupings.Strain, "By strain"),
            (Core.Review.Strains.Groupings.Vessel, "By vessel"),
            (Core.Review.Strains.Groupings.SugarBand, "By sugar band"),
            (Core.Review.Strains.Groupings.Variety, "By variety"),
            (Core.Review.Strains.Groupings.Season, "By season"),
            (Core.Review.Strains.Groupings.StrainByVessel, "Strain by vessel"),
            (Core.Review.Strains.Groupings.StrainBySeason, "Strain by season"),
        ];

        /// <summary>Intake issues.</summary>
        public const string IntakeIssues = "Intake issues";

        /// <summary>Methods, settings, inputs and cautions.</summary>
        public const string Methods = "Methods and cautions";
    }

    /// <summary>
    /// Pixel size pictures are shown at in the workbook (0.65 of the PNG's 1600×1000): about the width of a landscape A4
    /// page at 100 %, so each chart fills the page it starts (each starts one; see <see cref="Layout"/>).
    /// </summary>
    public const int PictureWidthPx = 1040;

    /// <summary>Picture height in the workbook, px.</summary>
    public const int PictureHeightPx = 650;

    /// <summary>Rows of the default height (20 px) a picture takes with a gap below it.</summary>
    public const int PictureRows = 34;

    /// <summary>Size of the native chart on the overview, px, and the rows it takes with a gap.</summary>
    public const int NativeChartWidthPx = PictureWidthPx, NativeChartHeightPx = PictureHeightPx, NativeChartRows = PictureRows;

    /// <summary>A fixed creation time for the package properties, so no clock value enters the file.</summary>
    public static DateTime FixedTimestamp { get; } = new(2000, 1, 1, 0, 0, 0, DateTimeKind.Utc);

    /// <summary>Writes the workbook atomically to <paramref name="path"/>.</summary>
    public static void Write(ReviewResult review, IReadOnlyList<ChartFile> charts, string path)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(charts);
        AtomicFile.Write(path, stream => Finish(Layout(review, charts), charts, includePictures: true, stream));
    }

    /// <summary>The workbook's bytes.</summary>
    public static byte[] Build(ReviewResult review, IReadOnlyList<ChartFile> charts, bool includePictures = true)
    {
        ArgumentNullException.ThrowIfNull(charts);
        using var output = new MemoryStream();
        Finish(Layout(review, includePictures ? charts : []), charts, includePictures, output);
        return output.ToArray();
    }

    /// <summary>
    /// The first half of writing: every sheet laid out by ClosedXML, its tables registered for streaming, the rows below
    /// each sheet's content kept for the pictures of <paramref name="charts"/> (and the print areas made to cover
    /// them). It needs the charts' plan, not their pictures, so it runs while they are drawn.
    /// </summary>
    internal static LaidOutWorkbook Layout(ReviewResult review, IReadOnlyList<ChartFile> charts, SharedTables? tables = null)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(charts);
        tables ??= new SharedTables(review);
        var streamed = new StreamedTables();
        var lotsOrder = ReviewTables.InStrainOrder(review).Select(l => l.Conversion).ToArray();
        var measure = new TextMeasure();
        var pictureRows = new Dictionary<string, int>(StringComparer.Ordinal);
        byte[] laidOut;
        using (var wb = NewWorkbook(review.Overview.Title))
        {
            foreach (var plan in WorkbookSheets.All(review, tables))
            {
                var ws = wb.Worksheets.Add(plan.Name);
                int below = plan.Render(ws, streamed, measure) + 1;
                pictureRows[plan.Name] = below;
                int pictures = charts.Count(c => plan.Name == Sheets.Overview ? c.OnOverview : c.Sheet == plan.Name);
                int native = plan.Name == Sheets.Overview && lotsOrder.Length > 0 ? NativeChartRows : 0;
                if (pictures + native > 0)
                {
                    SheetPlan.ExtendPrintArea(ws, below + native + (pictures * PictureRows), SheetPlan.ColumnsFor(ws, Math.Max(PictureWidthPx, native > 0 ? NativeChartWidthPx : 0)));

                    // Each chart starts a printed page (a chart is most of a landscape page): none is cut in two.
                    // A break after row r starts the next page at row r + 1.
                    int start = below;
                    foreach (int rows in Enumerable.Repeat(NativeChartRows, native > 0 ? 1 : 0).Concat(Enumerable.Repeat(PictureRows, pictures)))
                    {
                        ws.PageSetup.AddHorizontalPageBreak(start - 1);
                        start += rows;
                    }
                }
            }

            using var ms = new MemoryStream();
            wb.SaveAs(ms);
            laidOut = ms.ToArray();
        }

        return new LaidOutWorkbook(laidOut, streamed, pictureRows, lotsOrder);
    }

    /// <summary>
    /// A workbook of <paramref name="sheets"/> alone (no pictures), laid out and finished as the review's is: the
    /// workbook's font, fixed package properties, tables streamed, same input, same bytes.
    /// </summary>
    internal static byte[] Build(IEnumerable<SheetPlan> sheets, string title)
    {
        ArgumentNullException.ThrowIfNull(sheets);
        var streamed = new StreamedTables();
        var measure = new TextMeasure();
        using var wb = NewWorkbook(title);
        foreach (var plan in sheets)
        {
            plan.Render(wb.Worksheets.Add(plan.Name), streamed, measure);
        }

        using var ms = new MemoryStream();
        wb.SaveAs(ms);
        return Finish(ms.ToArray(), streamed, drawings: null);
    }

    private static XLWorkbook NewWorkbook(string title)
    {
        var wb = new XLWorkbook();
        wb.Properties.Author = "YieldBench";
        wb.Properties.Title = title;
        wb.Properties.Created = FixedTimestamp;
        wb.Properties.Modified = FixedTimestamp;
        wb.Style.Font.FontName = TextMeasure.FontName;
        wb.Style.Font.FontSize = TextMeasure.BodySize;
        return wb;
    }

    /// <summary>The second half of writing: the pictures and native chart go in and the package is written to <paramref name="output"/> (seekable).</summary>
    /// <remarks>
    /// Pictures are stacked below each sheet's content (the overview's below the native chart). Each goes in as an empty
    /// stand-in part; the package is given chart i's bytes (<paramref name="pictureBytes"/>, by default the chart's file)
    /// when it writes that part, so the PNGs are never held by the packaging library and a chart still being drawn holds
    /// up only the last parts.
    /// </remarks>
    internal static void Finish(LaidOutWorkbook layout, IReadOnlyList<ChartFile> charts, bool includePictures, Stream output, Func<int, byte[]>? pictureBytes = null)
    {
        ArgumentNullException.ThrowIfNull(layout);
        ArgumentNullException.ThrowIfNull(charts);
        var lotsOrder = layout.LotsOrder;
        var next = new Dictionary<string, int>(layout.PictureRows, StringComparer.Ordinal);
        pictureBytes ??= i => File.ReadAllBytes(charts[i].Path);

        // Zip entry name of each picture part → the chart it shows.
        var pictures = new Dictionary<string, int>(StringComparer.Ordinal);
        Finish(layout.LaidOut, layout.Streamed, output, wbPart =>
        {
            uint drawingId = 2;
            void Place(string sheet, int chart)
            {
                int row = next[sheet];
                var part = OpenXmlDrawings.PlacePicture(SheetPart(wbPart, sheet), [], charts[chart].Title, new DrawingPlace(0, row - 1, PictureWidthPx, PictureHeightPx), drawingId++);
                pictures.Add(part.Uri.OriginalString.TrimStart('/'), chart);
                next[sheet] = row + PictureRows;
            }

            if (lotsOrder.Count > 0)
            {
                int row = next[Sheets.Overview];
                OpenXmlDrawings.AddScatterChart(SheetPart(wbPart, Sheets.Overview), AlcoholVsSugarChart(lotsOrder), new DrawingPlace(0, row - 1, NativeChartWidthPx, NativeChartHeightPx), drawingId++);
                next[Sheets.Overview] = row + NativeChartRows;
            }

            if (!includePictures)
            {
                return;
            }

            for (int i = 0; i < charts.Count; i++)
            {
                if (charts[i].OnOverview)
                {
                    Place(Sheets.Overview, i);
                }

                if (charts[i].Sheet is { } sheet && sheet != Sheets.Overview && next.ContainsKey(sheet))
                {
                    Place(sheet, i);
                }
            }
        },
        name => pictures.TryGetValue(name, out int chart) ? pictureBytes(chart) : null);
    }

    /// <summary>
    /// Finishes a package ClosedXML saved: <paramref name="drawings"/> adds to it through the Open XML SDK, the package
    /// properties get fixed values, and the package is normalised with the rows of <paramref name="streamed"/> written
    /// into their sheets. Until then those sheets hold only their template rows, so the SDK loads small sheet parts even
    /// where it adds pictures.
    /// </summary>
    internal static byte[] Finish(byte[] laidOut, StreamedTables streamed, Action<WorkbookPart>? drawings)
    {
        using var output = new MemoryStream();
        Finish(laidOut, streamed, output, drawings);
        return output.ToArray();
    }

    /// <summary>As <see cref="Finish(byte[], StreamedTables, Action{WorkbookPart}?)"/>, the package written to <paramref name="output"/> (seekable).</summary>
    /// <param name="laidOut">The package ClosedXML saved.</param>
    /// <param name="streamed">The tables whose rows go into their sheets.</param>
    /// <param name="output">Where the package goes (seekable).</param>
    /// <param name="drawings">Adds pictures and charts through the Open XML SDK (null: none).</param>
    /// <param name="partBytes">The content of a part added as a stand-in, by zip entry name (null for every other part).</param>
    internal static void Finish(byte[] laidOut, StreamedTables streamed, Stream output, Action<WorkbookPart>? drawings, Func<string, byte[]?>? partBytes = null)
    {
        ArgumentNullException.ThrowIfNull(laidOut);
        ArgumentNullException.ThrowIfNull(streamed);
        ArgumentNullException.ThrowIfNull(output);
        using var package = new MemoryStream();
        package.Write(laidOut);
        var streamedSheets = new Dictionary<string, (string Sheet, IReadOnlyList<DeferredBody> Bodies)>(StringComparer.Ordinal);
        using (var doc = SpreadsheetDocument.Open(package, isEditable: true))
        {
            // The package is compressed once, when it is normalised; compressing the new parts here is wasted work.
            doc.CompressionOption = System.IO.Packaging.CompressionOption.NotCompressed;
            var wbPart = doc.WorkbookPart ?? throw new InvalidOperationException("ClosedXML wrote no workbook part.");
            foreach (var (sheetName, bodies) in streamed.BySheet())
            {
                streamedSheets[SheetPart(wbPart, sheetName).Uri.OriginalString.TrimStart('/')] = (sheetName, bodies);
            }

            DefaultFont(wbPart);
            drawings?.Invoke(wbPart);
            doc.PackageProperties.Created = FixedTimestamp;
            doc.PackageProperties.Modified = FixedTimestamp;
            doc.PackageProperties.Creator = "YieldBench";
            doc.PackageProperties.LastModifiedBy = "YieldBench";
        }

        // Read where the SDK left it rather than copied out again.
        DeterministicZip.Normalise(new MemoryStream(package.GetBuffer(), 0, (int)package.Length, writable: false), output, streamedSheets, partBytes);
    }

    /// <summary>
    /// Makes the package's default font (the first, which ClosedXML always writes as Calibri 11) the workbook's font at
    /// its body size. Spreadsheet applications size a column width unit by the default font's digit, so the columns
    /// are then as wide as <see cref="TextMeasure"/> reckons them, rather than sized by a font the workbook never shows.
    /// </summary>
    private static void DefaultFont(WorkbookPart wbPart)
    {
        var font = wbPart.WorkbookStylesPart?.Stylesheet?.Fonts?.Elements<DocumentFormat.OpenXml.Spreadsheet.Font>().FirstOrDefault();
        if (font is null)
        {
            return;
        }

        font.FontSize = new DocumentFormat.OpenXml.Spreadsheet.FontSize { Val = TextMeasure.BodySize };
        font.FontName = new DocumentFormat.OpenXml.Spreadsheet.FontName { Val = TextMeasure.FontName };
        wbPart.WorkbookStylesPart!.Stylesheet!.Save();
    }

    /// <summary>The native chart: one series per strain, bound to the lots sheet's starting-sugar and alcohol columns.</summary>
    public static ScatterChartSpec AlcoholVsSugarChart(IReadOnlyList<LotConversion> lotsByStrain)
    {
        ArgumentNullException.ThrowIfNull(lotsByStrain);
        string xCol = ColumnLetter(ReviewTables.LotColumnNumber(ReviewTables.StartingBrix));
        string yCol = ColumnLetter(ReviewTables.LotColumnNumber(ReviewTables.FinalAbv));
        var series = new List<ScatterSeriesSpec>();
        int row = 2;
        int index = 0;
        foreach (var group in lotsByStrain.GroupBy(l => l.Lot.Strain, StringComparer.Ordinal))
        {
            var members = group.ToArray();
            int first = row, last = row + members.Length - 1;
            series.Add(new ScatterSeriesSpec(
                group.Key,
                $"'{Sheets.Lots}'!${xCol}${first}:${xCol}${last}",
                $"'{Sheets.Lots}'!${yCol}${first}:${yCol}${last}",
                members.Select(m => m.EffectiveStartingBrix).ToArray(),
                members.Select(m => m.Lot.FinalAlcohol.PercentVolume).ToArray(),
                ChartPalette.ForIndex(index).ToHex().TrimStart('#')[..6]));
            row = last + 1;
            index++;
        }

        var xs = lotsByStrain.Select(l => l.EffectiveStartingBrix).Where(double.IsFinite).ToArray();
        var ys = lotsByStrain.Select(l => l.Lot.FinalAlcohol.PercentVolume).Where(double.IsFinite).ToArray();
        return new ScatterChartSpec(
            "Final alcohol vs starting sugar (follows the Lots sheet)",
            "Starting sugar after additions (°Brix)",
            "Final alcohol (% v/v)",
            series,
            xs.Length == 0 ? null : (Math.Floor(xs.Min()) - 1, Math.Ceiling(xs.Max()) + 1),
            ys.Length == 0 ? null : (Math.Floor(ys.Min()) - 1, Math.Ceiling(ys.Max()) + 1));
    }

    /// <summary>Spreadsheet column letters of a 1-based column number (1 → A, 27 → AA).</summary>
    public static string ColumnLetter(int column)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(column, 1);
        string s = string.Empty;
        while (column > 0)
        {
            int m = (column - 1) % 26;
            s = (char)('A' + m) + s;
            column = (column - 1) / 26;
        }

        return s;
    }

    private static WorksheetPart SheetPart(WorkbookPart wb, string name)
    {
        var sheet = wb.Workbook.Sheets!.Elements<DocumentFormat.OpenXml.Spreadsheet.Sheet>().First(s => s.Name == name);
        return (WorksheetPart)wb.GetPartById(sheet.Id!);
    }
}

/// <summary>A workbook ClosedXML has laid out, waiting for its pictures (<see cref="WorkbookWriter.Finish(LaidOutWorkbook, IReadOnlyList{ChartFile}, bool, Stream, Func{int, byte[]}?)"/>).</summary>
/// <param name="LaidOut">The package ClosedXML saved (tables as their template rows).</param>
/// <param name="Streamed">The tables whose rows go in when the package is finished.</param>
/// <param name="PictureRows">Per sheet, the 1-based row below its content where its first picture goes.</param>
/// <param name="LotsOrder">The lots in the lots sheet's order (the native chart's series follow it).</param>
internal sealed record LaidOutWorkbook(byte[] LaidOut, StreamedTables Streamed, IReadOnlyDictionary<string, int> PictureRows, IReadOnlyList<LotConversion> LotsOrder);
