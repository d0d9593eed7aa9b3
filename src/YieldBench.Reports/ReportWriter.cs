using YieldBench.Core.Review;
using YieldBench.Reports.Kinetics;
using YieldBench.Reports.Output;
using YieldBench.Reports.Parts;

namespace YieldBench.Reports;

/// <summary>
/// The review's report: its parts (data files, the meeting page, charts, workbook, console summary) written into one folder by
/// <see cref="ReportPipeline"/> — whole or not at all, with a manifest (<see cref="ManifestName"/>) listing this tool's
/// files so a later run replaces them and leaves everything else alone.
/// </summary>
public static class ReportWriter
{
    /// <summary>The manifest file listing this tool's files in the folder.</summary>
    public const string ManifestName = ReportFolder.ManifestName;

    /// <summary>Relative path of the workbook.</summary>
    public const string WorkbookName = "report.xlsx";

    /// <summary>Relative path of the one-page review for the meeting room.</summary>
    public const string PageName = Html.HtmlReport.FileName;

    /// <summary>Relative paths of the data files.</summary>
    public static class DataFiles
    {
        /// <summary>One row per lot used.</summary>
        public const string Lots = "data/lots.csv";

        /// <summary>Group summaries.</summary>
        public const string Groups = "data/groups.csv";

        /// <summary>Odd-lot flags.</summary>
        public const string Flags = "data/flags.csv";

        /// <summary>One row per lot to look at (the Follow-up sheet).</summary>
        public const string FollowUp = "data/follow-up.csv";

        /// <summary>Intake issues.</summary>
        public const string IntakeIssues = "data/intake-issues.csv";

        /// <summary>Kinetics per lot (when logs were read).</summary>
        public const string Kinetics = "data/" + KineticsCsv.FileName;

        /// <summary>Every kinetics finding with its details and log row (when logs were read).</summary>
        public const string KineticsFindings = "data/kinetics-findings.csv";

        /// <summary>The house-factor section, which <c>yieldbench plan --factor-file</c> reads back.</summary>
        public const string HouseFactor = "data/" + HouseFactorJson.FileName;
    }

    /// <summary>The parts of a report, in the order their jobs start (the workbook first: it waits for the charts).</summary>
    /// <param name="console">Where the console summary goes once the report is in place; null: no summary.</param>
    public static IReadOnlyList<IReportPart> Parts(TextWriter? console = null) =>
        [new WorkbookPart(), new DataFilesPart(), new PagePart(), new ChartsPart(), new ConsolePart(console)];

    /// <summary>The files a report of <paramref name="review"/> holds (the parts' files and the manifest), sorted.</summary>
    public static IReadOnlyList<string> Files(ReviewResult review) => ReportPipeline.Files(review, Parts());

    /// <summary>
    /// Writes the whole report into <paramref name="folder"/>; <paramref name="progress"/> hears each step
    /// (<see cref="ReportPipeline.WriteStep"/>, then <see cref="ReportPipeline.SwapStep"/>), <paramref name="console"/>
    /// gets the summary.
    /// </summary>
    /// <exception cref="ReportFolderException">The folder cannot take a report (not ours, or one of ours would write over a file of the user's).</exception>
    public static ReportOutput Write(ReviewResult review, string folder, IProgress<string>? progress = null, TextWriter? console = null) =>
        ReportPipeline.Write(review, folder, Parts(console), progress);

    /// <summary>
    /// Builds and discards a one-cell workbook and a small chart, so that the workbook and chart code are compiled
    /// while the inputs are read (a command calls this on a spare thread; it writes no file and holds no state).
    /// </summary>
    public static void WarmUp()
    {
        using (var workbook = new ClosedXML.Excel.XLWorkbook())
        {
            workbook.AddWorksheet("warm-up").Cell(1, 1).Value = 1;
            using var sink = new MemoryStream();
            workbook.SaveAs(sink);
        }

        Charts.ReportFonts.EnsureRegistered();
        var plot = new ScottPlot.Plot();
        plot.Add.Scatter(new double[] { 0, 1 }, new double[] { 0, 1 });
        plot.Title("warm-up");
        plot.GetImageBytes(64, 48, ScottPlot.ImageFormat.Png);
    }

    /// <summary>The files an earlier run listed in the folder's manifest (empty when none).</summary>
    public static IReadOnlyList<string> ReadManifest(string folder) => ReportFolder.ReadManifest(folder);
}
