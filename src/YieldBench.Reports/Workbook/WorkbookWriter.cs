using System.Globalization;
using ClosedXML.Excel;
using DocumentFormat.OpenXml.Packaging;
using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Review.Strains;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Kinetics;
using YieldBench.Reports.Output;
using YieldBench.Reports.Tables;

namespace YieldBench.Reports.Workbook;

/// <summary>
/// Writes report.xlsx: ClosedXML lays out the sheets, then the Open XML SDK adds the native alcohol-vs-sugar chart
/// (bound to the lots sheet's cells) and the PNG charts as pictures, and the package is normalised so the same review
/// gives the same bytes. Tables longer than <see cref="StreamedTables.DefaultRowThreshold"/> rows (the lots of a large
/// review, its kinetics per lot) never become ClosedXML cells: their rows are streamed into the package in the last
/// step (<see cref="StreamedSheet"/>), which keeps the workbook's time and memory near-linear in the lots.
/// </summary>
public static class WorkbookWriter
{
    /// <summary>Sheet names, in workbook order (plain words of our own).</summary>
    public static class Sheets
    {
        /// <summary>Overview.</summary>
        public const string Overview = "Overview";

        /// <summary>Every lot.</summary>
        public const string Lots = "Lots";

        /// <summary>The strain comparison.</summary>
        public const string StrainComparison = "Strain comparison";

        /// <summary>Flagged lots by severity with reasons and follow-ups.</summary>
        public const string FollowUp = "Follow-up";

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

        /// <summary>House factor backtest and recommendation.</summary>
        public const string HouseFactor = "House factor";

        /// <summary>Planner table.</summary>
        public const string Planner = "Planner";

        /// <summary>Kinetics (when logs exist).</summary>
        public const string Kinetics = KineticsSheet.SheetName;

        /// <summary>Intake issues.</summary>
        public const string IntakeIssues = "Intake issues";

        /// <summary>Methods, settings, inputs and cautions.</summary>
        public const string Methods = "Methods and cautions";
    }

    /// <summary>Pixel size pictures are shown at in the workbook (half the PNG's 1600×1000).</summary>
    public const int PictureWidthPx = 800;

    /// <summary>Picture height in the workbook, px.</summary>
    public const int PictureHeightPx = 500;

    /// <summary>A fixed creation time for the package properties, so no clock value enters the file.</summary>
    public static DateTime FixedTimestamp { get; } = new(2000, 1, 1, 0, 0, 0, DateTimeKind.Utc);

    /// <summary>Writes a workbook laid out by <see cref="Layout"/> atomically to <paramref name="path"/>.</summary>
    internal static void Write(LaidOutWorkbook layout, IReadOnlyList<ChartFile> charts, string path) =>
        AtomicFile.Write(path, stream => Finish(layout, charts, includePictures: true, stream));

    /// <summary>Writes the workbook atomically to <paramref name="path"/>.</summary>
    /// <remarks>The package goes straight into the file as it is compressed (the bytes of <see cref="Build(ReviewResult, IReadOnlyList{ChartFile}, bool)"/>).</remarks>
    public static void Write(ReviewResult review, IReadOnlyList<ChartFile> charts, string path)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(charts);
        AtomicFile.Write(path, stream => Build(review, charts, includePictures: true, StreamedTables.DefaultRowThreshold, stream));
    }

    /// <summary>The workbook's bytes.</summary>
    public static byte[] Build(ReviewResult review, IReadOnlyList<ChartFile> charts, bool includePictures = true) =>
        Build(review, charts, includePictures, StreamedTables.DefaultRowThreshold);

    /// <summary>The workbook's bytes, streaming every table with more than <paramref name="streamRowThreshold"/> rows.</summary>
    internal static byte[] Build(ReviewResult review, IReadOnlyList<ChartFile> charts, bool includePictures, int streamRowThreshold)
    {
        using var output = new MemoryStream();
        Build(review, charts, includePictures, streamRowThreshold, output);
        return output.ToArray();
    }

    /// <summary>Writes the workbook to <paramref name="output"/> (seekable).</summary>
    internal static void Build(ReviewResult review, IReadOnlyList<ChartFile> charts, bool includePictures, int streamRowThreshold, Stream output)
    {
        ArgumentNullException.ThrowIfNull(charts);
        Finish(Layout(review, streamRowThreshold), charts, includePictures, output);
    }

    /// <summary>
    /// The first half of <see cref="Write"/>: everything but the pictures, which need the charts. It reads only the
    /// review, so it can run while the charts are drawn; <paramref name="tables"/> shares the per-lot tables with the
    /// data files (null: built here).
    /// </summary>
    internal static LaidOutWorkbook Layout(ReviewResult review, int streamRowThreshold = StreamedTables.DefaultRowThreshold, SharedTables? tables = null)
    {
        ArgumentNullException.ThrowIfNull(review);
        tables ??= new SharedTables(review);
        var streamed = new StreamedTables(streamRowThreshold);
        var lotsOrder = ReviewTables.InStrainOrder(review).Select(l => l.Conversion).ToArray();
        byte[] laidOut;
        var pictureRows = new Dictionary<string, int>(StringComparer.Ordinal);
        using (var wb = new XLWorkbook())
        {
            wb.Properties.Author = "YieldBench";
            wb.Properties.Title = "YieldBench review";
            wb.Properties.Created = FixedTimestamp;
            wb.Properties.Modified = FixedTimestamp;

            var overview = wb.Worksheets.Add(Sheets.Overview);
            WriteOverview(overview, review);

            var lots = wb.Worksheets.Add(Sheets.Lots);
            var lotsPlaced = SheetLayout.WriteTable(lots, tables.LotsByStrain, 1, 1, freezeAndFilter: true, setColumnWidths: true, streamed);
            pictureRows[Sheets.Lots] = lotsPlaced.LastRow + 2;

            foreach (var (grouping, sheetName) in Sheets.Groupings)
            {
                var sheet = wb.Worksheets.Add(sheetName);
                var placedGroups = SheetLayout.WriteTable(sheet, ReviewTables.Groups(review, grouping, withNote: true), 1, 1, freezeAndFilter: true, setColumnWidths: true, streamed);
                pictureRows[sheetName] = placedGroups.LastRow + 2;
            }

            var comparison = wb.Worksheets.Add(Sheets.StrainComparison);
            pictureRows[Sheets.StrainComparison] = WriteComparison(comparison, review);

            var followUp = wb.Worksheets.Add(Sheets.FollowUp);
            var placedFlags = WriteFollowUp(followUp, review, streamed);
            pictureRows[Sheets.FollowUp] = placedFlags + 2;

            var house = wb.Worksheets.Add(Sheets.HouseFactor);
            pictureRows[Sheets.HouseFactor] = WriteHouseFactor(house, review);

            var planner = wb.Worksheets.Add(Sheets.Planner);
            pictureRows[Sheets.Planner] = WritePlanner(planner, review);

            if (review.Kinetics is { } kineticsReview)
            {
                var kinetics = wb.Worksheets.Add(Sheets.Kinetics);
                int lastKineticsRow = KineticsSheet.Fill(kinetics, kineticsReview, null, streamed, tables.KineticsLots);
                pictureRows[Sheets.Kinetics] = lastKineticsRow + 2;
            }

            var issues = wb.Worksheets.Add(Sheets.IntakeIssues);
            var placed = SheetLayout.WriteTable(issues, ReviewTables.IntakeIssues(review), 1, 1, freezeAndFilter: true, setColumnWidths: true, streamed);
            pictureRows[Sheets.IntakeIssues] = placed.LastRow + 2;

            var methods = wb.Worksheets.Add(Sheets.Methods);
            WriteMethods(methods, review);

            using var ms = new MemoryStream();
            wb.SaveAs(ms);
            laidOut = ms.ToArray();
        }

        return new LaidOutWorkbook(laidOut, streamed, pictureRows, lotsOrder);
    }

    /// <summary>The second half of <see cref="Write"/>: the pictures and native chart go in and the package is written to <paramref name="output"/> (seekable).</summary>
    /// <remarks>
    /// Each picture goes in as an empty stand-in part; the package is given chart i's bytes
    /// (<paramref name="pictureBytes"/>, by default the chart's file) when it writes that part, so the PNGs are never
    /// held by the packaging library and a chart still being drawn holds up only the last parts.
    /// </remarks>
    internal static void Finish(LaidOutWorkbook layout, IReadOnlyList<ChartFile> charts, bool includePictures, Stream output, Func<int, byte[]>? pictureBytes = null)
    {
        ArgumentNullException.ThrowIfNull(layout);
        ArgumentNullException.ThrowIfNull(charts);
        var lotsOrder = layout.LotsOrder;
        var pictureRows = new Dictionary<string, int>(layout.PictureRows, StringComparer.Ordinal);
        pictureBytes ??= i => File.ReadAllBytes(charts[i].Path);

        // Zip entry name of each picture part → the chart it shows.
        var pictures = new Dictionary<string, int>(StringComparer.Ordinal);
        void Picture(WorksheetPart sheet, int chart, DrawingPlace place, uint drawingId)
        {
            var part = OpenXmlDrawings.PlacePicture(sheet, [], charts[chart].Title, place, drawingId);
            pictures.Add(part.Uri.OriginalString.TrimStart('/'), chart);
        }

        Finish(layout.LaidOut, layout.Streamed, output, wbPart =>
        {
            uint drawingId = 2;
            var overviewPart = SheetPart(wbPart, Sheets.Overview);
            if (lotsOrder.Count > 0)
            {
                OpenXmlDrawings.AddScatterChart(overviewPart, AlcoholVsSugarChart(lotsOrder), new DrawingPlace(5, 1, 900, 560), drawingId++);
            }

            if (includePictures)
            {
                int overviewRow = 32;
                int slot = 0;
                for (int i = 0; i < charts.Count; i++)
                {
                    var chart = charts[i];
                    if (chart.OnOverview)
                    {
                        // Two pictures side by side, rows of about 26 default-height rows each.
                        int col = 5 + ((slot % 2) * 14);
                        int row = overviewRow + ((slot / 2) * 27);
                        Picture(overviewPart, i, new DrawingPlace(col, row, PictureWidthPx, PictureHeightPx), drawingId++);
                        slot++;
                    }

                    if (chart.Sheet is { } sheetName && pictureRows.TryGetValue(sheetName, out int at))
                    {
                        Picture(SheetPart(wbPart, sheetName), i, new DrawingPlace(0, at, PictureWidthPx, PictureHeightPx), drawingId++);
                        pictureRows[sheetName] = at + 27;
                    }
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

            drawings?.Invoke(wbPart);
            doc.PackageProperties.Created = FixedTimestamp;
            doc.PackageProperties.Modified = FixedTimestamp;
            doc.PackageProperties.Creator = "YieldBench";
            doc.PackageProperties.LastModifiedBy = "YieldBench";
        }

        // Read where the SDK left it rather than copied out again.
        DeterministicZip.Normalise(new MemoryStream(package.GetBuffer(), 0, (int)package.Length, writable: false), output, streamedSheets, partBytes);
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

    private static void WriteOverview(IXLWorksheet ws, ReviewResult review)
    {
        var o = review.Overview;
        ws.Column(1).Width = 34;
        ws.Column(2).Width = 22;
        ws.Column(3).Width = 14;
        ws.Column(4).Width = 14;
        int r = 1;
        SheetLayout.SetHeading(ws.Cell(r++, 1), o.Title, 18);
        SheetLayout.SetText(ws.Cell(r++, 1), "Tool version " + review.ToolVersion);
        SheetLayout.SetText(ws.Cell(r, 1), "Predicted alcohol here is an estimate, not a label statement; fermentation heat and CO2 are hazards. See Cautions below.");
        ws.Cell(r++, 1).Style.Font.Italic = true;
        r++;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "Inputs", 13);
        Pair(ws, ref r, "Input files", o.Inputs.Files);
        Pair(ws, ref r, "Lots used", o.Inputs.LotsUsed);
        Pair(ws, ref r, "Rows left out (see Intake issues)", o.Inputs.RowsLeftOut);
        Pair(ws, ref r, "Intake issues", o.Inputs.Issues);
        Pair(ws, ref r, "Seasons", o.Inputs.Seasons.Count == 0 ? "none" : string.Join(", ", o.Inputs.Seasons));
        Pair(ws, ref r, "Fermentation logs", o.Inputs.Logs);
        r++;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "Strains ranked by conversion adjusted for starting sugar", 13);
        SheetLayout.SetText(ws.Cell(r, 1), "Strain");
        SheetLayout.SetText(ws.Cell(r, 2), "Adjusted factor (% v/v per °Brix)");
        SheetLayout.SetText(ws.Cell(r, 3), "Interval low");
        SheetLayout.SetText(ws.Cell(r, 4), "Interval high");
        ws.Range(r, 1, r, 4).Style.Font.Bold = true;
        ws.Range(r, 1, r, 4).Style.Alignment.WrapText = true;
        r++;
        foreach (var s in o.Strains.Ranking)
        {
            SheetLayout.SetText(ws.Cell(r, 1), s.Strain);
            foreach (var (col, v) in new[] { (2, s.Adjusted?.Factor ?? s.RawMedian), (3, s.Adjusted?.FactorInterval.Low ?? double.NaN), (4, s.Adjusted?.FactorInterval.High ?? double.NaN) })
            {
                if (double.IsFinite(v))
                {
                    ws.Cell(r, col).SetValue(v);
                    ws.Cell(r, col).Style.NumberFormat.Format = "0.0000";
                }
            }

            r++;
        }

        foreach (var sentence in o.Strains.Sentences.Take(3))
        {
            SheetLayout.SetText(ws.Cell(r, 1), sentence);
            ws.Cell(r, 1).Style.Alignment.WrapText = true;
            ws.Range(r, 1, r, 4).Merge();
            ws.Row(r).Height = 45;
            r++;
        }

        r++;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "House conversion factor", 13);
        if (o.HouseFactor is { } h)
        {
            Pair(ws, ref r, "Recommended", h.Candidate);
            Pair(ws, ref r, "Backtest", h.Scheme);
            PairNumber(ws, ref r, "Mean absolute error (% v/v)", h.Mae, "0.00");
            PairNumber(ws, ref r, "Within label tolerance, " + h.Regime, h.ShareWithinTolerance, "0%");
            PairNumber(ws, ref r, "80 % band from (% v/v)", h.Band80.Low, "+0.00;-0.00;0.00");
            PairNumber(ws, ref r, "80 % band to (% v/v)", h.Band80.High, "+0.00;-0.00;0.00");
            PairNumber(ws, ref r, "95 % band from (% v/v)", h.Band95.Low, "+0.00;-0.00;0.00");
            PairNumber(ws, ref r, "95 % band to (% v/v)", h.Band95.High, "+0.00;-0.00;0.00");
            SheetLayout.SetText(ws.Cell(r, 1), h.Explanation);
            ws.Cell(r, 1).Style.Alignment.WrapText = true;
            ws.Range(r, 1, r, 4).Merge();
            ws.Row(r).Height = 75;
            r++;
        }
        else
        {
            SheetLayout.SetText(ws.Cell(r++, 1), "No recommendation: " + string.Join(" ", o.NoRecommendation.DefaultIfEmpty("too few lots to choose.")));
        }

        r++;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "Lots to look at", 13);
        Pair(ws, ref r, "Flagged lots, strain review or kinetics (highlighted on Lots)", o.Lots.Flagged);
        foreach (var c in o.Lots.ByWorstSeverity)
        {
            Pair(ws, ref r, "  worst flag: " + ReviewTexts.Severity(c.Severity) + " (see Follow-up)", c.Lots);
        }

        if (o.Kinetics is { } k)
        {
            Pair(ws, ref r, "  with a kinetics flag (see Kinetics)", k.Flagged);
        }
        r++;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "Cautions", 13);
        foreach (var caution in o.Cautions)
        {
            SheetLayout.SetText(ws.Cell(r, 1), caution);
            ws.Cell(r, 1).Style.Alignment.WrapText = true;
            ws.Range(r, 1, r, 4).Merge();
            ws.Row(r).Height = 48;
            r++;
        }
    }

    private static int WriteComparison(IXLWorksheet ws, ReviewResult review)
    {
        var c = review.Strains.Comparison;
        int r = 1;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "Strain comparison on " + c.Measure, 13);
        foreach (var sentence in c.Sentences)
        {
            SheetLayout.SetText(ws.Cell(r++, 1), sentence);
        }

        var kw = c.KruskalWallis;
        SheetLayout.SetText(ws.Cell(r++, 1), string.Create(
            CultureInfo.InvariantCulture,
            $"Kruskal–Wallis across {c.Strains.Count} strains: H = {kw.H:0.00}, {kw.DegreesOfFreedom} degrees of freedom, {YieldBench.Core.PValues.Text(kw.P)}, {kw.N} lots.{(kw.Note is null ? string.Empty : " " + kw.Note)}"));
        if (c.RankingsDisagree)
        {
            SheetLayout.SetText(ws.Cell(r++, 1), "Raw medians and the adjusted comparison put a different strain first: the raw ranking is confounded with starting sugar (or vessel).");
            ws.Cell(r - 1, 1).Style.Font.Bold = true;
        }

        r++;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "Strains ranked by adjusted conversion" + (c.AdjustedForVessel ? " (adjusted for starting sugar and vessel)" : " (adjusted for starting sugar)"), 12);
        var ranking = SheetLayout.WriteTable(ws, ReviewTables.StrainRanking(review), r, 1, freezeAndFilter: false);
        r = ranking.LastRow + 2;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "Adjusted differences in alcohol at the same starting sugar (shaded: interval excludes 0)", 12);
        var diffs = SheetLayout.WriteTable(ws, ReviewTables.AdjustedDifferences(review), r, 1, freezeAndFilter: false);
        r = diffs.LastRow + 2;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "Pairwise Hodges–Lehmann shifts of the raw factor (shaded: Holm-adjusted p below 0.05)", 12);
        var pairs = SheetLayout.WriteTable(ws, ReviewTables.PairwiseShifts(review), r, 1, freezeAndFilter: false);
        r = pairs.LastRow + 2;
        foreach (var note in review.Strains.Notes)
        {
            SheetLayout.SetText(ws.Cell(r++, 1), note);
        }

        return r + 1;
    }

    private static int WriteFollowUp(IXLWorksheet ws, ReviewResult review, StreamedTables streamed)
    {
        var placed = SheetLayout.WriteTable(ws, ReviewTables.FollowUp(review), 1, 1, freezeAndFilter: true, setColumnWidths: true, streamed);
        return placed.LastRow;
    }

    private static int WriteHouseFactor(IXLWorksheet ws, ReviewResult review)
    {
        var h = review.HouseFactor;
        int r = 1;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "House conversion factor: candidates judged by backtest against " + h.Regime.Name, 13);
        foreach (var line in h.Explanation.Concat(h.ImportanceSentence is null ? [] : [h.ImportanceSentence]))
        {
            SheetLayout.SetText(ws.Cell(r++, 1), line);
        }

        r++;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "Recommendation", 12);
        var rec = SheetLayout.WriteTable(ws, ReviewTables.Recommendations(review), r, 1, freezeAndFilter: false);
        r = rec.LastRow + 2;
        if (h.Coverage is { } coverage)
        {
            SheetLayout.SetHeading(ws.Cell(r++, 1), "How often the intervals held on a season they had not seen (" + coverage.Method + ")", 12);
            var covered = SheetLayout.WriteTable(ws, ReviewTables.IntervalCoverage(review), r, 1, freezeAndFilter: false);
            r = covered.LastRow + 2;
        }

        if (h.FlaggedLots.Count > 0)
        {
            SheetLayout.SetHeading(ws.Cell(r++, 1), h.FlaggedLotsIncluded
                ? "Lots flagged as likely errors or not dry (included: the setting to include them is on)"
                : "Lots flagged as likely errors or not dry (left out of training, selection and intervals; a setting includes them)", 12);
            var flagged = SheetLayout.WriteTable(ws, ReviewTables.HouseFactorFlaggedLots(review), r, 1, freezeAndFilter: false);
            r = flagged.LastRow + 2;
            SheetLayout.SetHeading(ws.Cell(r++, 1), "Both versions: flagged lots left out and included", 12);
            var versions = SheetLayout.WriteTable(ws, ReviewTables.HouseFactorVersions(review), r, 1, freezeAndFilter: false);
            r = versions.LastRow + 2;
        }

        SheetLayout.SetHeading(ws.Cell(r++, 1), "Every candidate", 12);
        var cand = SheetLayout.WriteTable(ws, ReviewTables.HouseCandidates(review), r, 1, freezeAndFilter: false);
        r = cand.LastRow + 2;
        foreach (var note in h.Notes)
        {
            SheetLayout.SetText(ws.Cell(r++, 1), note);
        }

        return r + 1;
    }

    private static int WritePlanner(IXLWorksheet ws, ReviewResult review)
    {
        int r = 1;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "Planner: the highest harvest sugar that keeps the predicted alcohol under a target", 13);
        foreach (var caution in review.HouseFactor.Cautions)
        {
            SheetLayout.SetText(ws.Cell(r++, 1), caution);
        }

        r++;
        var placed = SheetLayout.WriteTable(ws, ReviewTables.Planner(review), r, 1, freezeAndFilter: false);
        return placed.LastRow + 2;
    }

    private static void WriteMethods(IXLWorksheet ws, ReviewResult review)
    {
        int r = 1;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "Methods and cautions", 14);
        SheetLayout.SetText(ws.Cell(r++, 1), "YieldBench " + review.ToolVersion);
        r++;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "Cautions", 12);
        foreach (var caution in ReviewTexts.Cautions)
        {
            SheetLayout.SetText(ws.Cell(r++, 1), caution);
        }

        r++;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "Formulas and their sources", 12);
        var formulas = SheetLayout.WriteTable(ws, MethodsTable.Formulas(review), r, 1, freezeAndFilter: false);
        r = formulas.LastRow + 2;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "Settings", 12);
        var settings = SheetLayout.WriteTable(ws, MethodsTable.Settings(review), r, 1, freezeAndFilter: false);
        r = settings.LastRow + 2;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "Input files", 12);
        var files = SheetLayout.WriteTable(ws, ReviewTables.InputFiles(review), r, 1, freezeAndFilter: false);
        r = files.LastRow + 2;
        SheetLayout.SetHeading(ws.Cell(r++, 1), "Rows read per file and sheet", 12);
        SheetLayout.WriteTable(ws, ReviewTables.RowAccounts(review), r, 1, freezeAndFilter: false);

        // The tables above share columns; keep the first three wide enough for formulas and sources.
        ws.Column(1).Width = Math.Max(ws.Column(1).Width, 40);
        ws.Column(2).Width = Math.Min(Math.Max(ws.Column(2).Width, 60), 90);
        ws.Column(3).Width = Math.Min(Math.Max(ws.Column(3).Width, 60), 90);
        ws.Range(1, 2, r + 200, 3).Style.Alignment.WrapText = true;
    }

    private static void Pair(IXLWorksheet ws, ref int r, string label, object value)
    {
        SheetLayout.SetText(ws.Cell(r, 1), label);
        switch (value)
        {
            case int i:
                ws.Cell(r, 2).SetValue(i);
                break;
            default:
                SheetLayout.SetText(ws.Cell(r, 2), Convert.ToString(value, CultureInfo.InvariantCulture) ?? string.Empty);
                break;
        }

        r++;
    }

    private static void PairNumber(IXLWorksheet ws, ref int r, string label, double value, string format)
    {
        SheetLayout.SetText(ws.Cell(r, 1), label);
        if (double.IsFinite(value))
        {
            ws.Cell(r, 2).SetValue(value);
            ws.Cell(r, 2).Style.NumberFormat.Format = format;
        }
        else
        {
            SheetLayout.SetText(ws.Cell(r, 2), "too few lots");
        }

        r++;
    }
}

/// <summary>A workbook ClosedXML has laid out, waiting for its pictures (<see cref="WorkbookWriter.Finish(LaidOutWorkbook, IReadOnlyList{ChartFile}, bool, Stream)"/>).</summary>
/// <param name="LaidOut">The package ClosedXML saved (streamed tables as their template rows).</param>
/// <param name="Streamed">The tables whose rows go in when the package is finished.</param>
/// <param name="PictureRows">Per sheet, the row below its content where its first picture goes.</param>
/// <param name="LotsOrder">The lots in the lots sheet's order (the native chart's series follow it).</param>
internal sealed record LaidOutWorkbook(byte[] LaidOut, StreamedTables Streamed, IReadOnlyDictionary<string, int> PictureRows, IReadOnlyList<LotConversion> LotsOrder);
