using YieldBench.Core.Review;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Data;
using YieldBench.Reports.Kinetics;
using YieldBench.Reports.Output;
using YieldBench.Reports.Tables;
using YieldBench.Reports.Workbook;

namespace YieldBench.Reports;

/// <summary>What a report run wrote.</summary>
/// <param name="Folder">Output folder (full path).</param>
/// <param name="Files">Files written, relative to <paramref name="Folder"/>, with '/' separators, sorted.</param>
/// <param name="Removed">Files of an earlier run that this run no longer makes and removed, relative, sorted.</param>
public sealed record ReportOutput(string Folder, IReadOnlyList<string> Files, IReadOnlyList<string> Removed);

/// <summary>
/// Writes every output of a review into one folder: data files, PNG charts and report.xlsx. Each file is written
/// atomically; a manifest (<see cref="ManifestName"/>) lists what was written so a later run replaces its own files
/// and removes the ones it no longer makes, and never touches anything else in the folder.
/// </summary>
public static class ReportWriter
{
    /// <summary>The manifest file listing this tool's files in the folder.</summary>
    public const string ManifestName = "yieldbench-files.txt";

    /// <summary>Relative path of the workbook.</summary>
    public const string WorkbookName = "report.xlsx";

    /// <summary>Relative paths of the data files.</summary>
    public static class DataFiles
    {
        /// <summary>One row per lot used.</summary>
        public const string Lots = "data/lots.csv";

        /// <summary>Group summaries.</summary>
        public const string Groups = "data/groups.csv";

        /// <summary>Odd-lot flags.</summary>
        public const string Flags = "data/flags.csv";

        /// <summary>Intake issues.</summary>
        public const string IntakeIssues = "data/intake-issues.csv";

        /// <summary>Kinetics per lot (when logs were read).</summary>
        public const string Kinetics = "data/" + KineticsCsv.FileName;

        /// <summary>The house-factor section, which <c>yieldbench plan --factor-file</c> reads back.</summary>
        public const string HouseFactor = "data/" + HouseFactorJson.FileName;
    }

    /// <summary>Progress step of <see cref="Write"/> in which the data files, the charts and the workbook's layout are made side by side.</summary>
    public const string ParallelStep = "data files, charts and workbook layout";

    /// <summary>Progress step of <see cref="Write"/> in which the workbook gets its pictures and is written.</summary>
    public const string WorkbookStep = "workbook";

    /// <summary>
    /// Writes everything; <paramref name="progress"/> hears the name of each step (<see cref="ParallelStep"/>, then
    /// <see cref="WorkbookStep"/>). The data files, the charts and the workbook do not depend on one another until the
    /// workbook's pictures: they are made at the same time, each on its own thread (the charts on several). The
    /// workbook is laid out and its sheets written while the charts are drawn; each picture goes in when the package
    /// reaches it, after every sheet, once its chart exists. The second step is what remains of the workbook after
    /// the data files and charts are done. Each output's bytes and the manifest do not depend on which thread
    /// finished first.
    /// </summary>
    public static ReportOutput Write(ReviewResult review, string folder, IProgress<string>? progress = null)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(folder);
        string root = Path.GetFullPath(folder);
        Directory.CreateDirectory(root);
        var previous = ReadManifest(root);
        var tables = new SharedTables(review);
        var written = new List<string>();

        progress?.Report(ParallelStep);
        string chartFolder = Path.Combine(root, "charts");
        var plan = ReviewCharts.Plan(review, chartFolder).ToList();
        int reviewCharts = plan.Count;
        IReadOnlyList<int> kineticsFirst = [];
        if (review.Kinetics is not null)
        {
            var (kinetics, first) = KineticsCharts.Plan(review, chartFolder);

            // The overview keeps to the charts that explain the review at a glance; per-lot kinetics charts stay on their sheet.
            kineticsFirst = first;
            plan.AddRange(kinetics.Select(c => c with { File = c.File with { OnOverview = Path.GetFileName(c.File.Path) == "kinetics-strain-curves.png" } }));
        }

        // Each chart's job, and the moment it is drawn: the workbook waits for a chart only when it needs its picture.
        var charts = plan.Select(c => c.File).ToArray();
        var drawn = plan.Select(_ => new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously)).ToArray();
        var jobs = plan.Select((c, i) => (Func<ChartFile>)(() =>
        {
            c.Job();
            drawn[i].SetResult();
            return charts[i];
        })).ToArray();
        byte[] Picture(int i)
        {
            drawn[i].Task.GetAwaiter().GetResult();
            return File.ReadAllBytes(charts[i].Path);
        }

        var dataFiles = Started(() => WriteDataFiles(review, root, tables));
        var laidOut = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        var workbook = Started(() =>
        {
            LaidOutWorkbook layout;
            try
            {
                layout = WorkbookWriter.Layout(review, tables: tables);
            }
            finally
            {
                laidOut.SetResult();
            }

            // The workbook replaces an earlier one only when the data files were written too (every chart was, or a
            // picture would have failed it).
            WorkbookWriter.Write(layout, charts, Picture, () => dataFiles.GetAwaiter().GetResult(), Full(root, WorkbookName));
            return true;
        });
        bool chartsDrawn = false;
        try
        {
            // The review's charts, then the kinetics charts (their two largest first), in two batches as WriteAll and RenderFiles draw them.
            ChartImage.RenderAll(jobs[..reviewCharts]);
            if (reviewCharts < jobs.Length)
            {
                ChartImage.RenderAll(jobs[reviewCharts..], kineticsFirst);
            }

            chartsDrawn = true;
        }
        catch (Exception e)
        {
            // A chart that was never drawn must not keep the workbook waiting for its picture.
            foreach (var d in drawn)
            {
                d.TrySetException(e);
            }

            throw;
        }
        finally
        {
            // Nothing keeps writing into the folder after this method returns, whatever failed.
            WaitQuietly(dataFiles);
            WaitQuietly(laidOut.Task);
            if (!chartsDrawn || !dataFiles.IsCompletedSuccessfully)
            {
                WaitQuietly(workbook);
            }
        }

        written.AddRange(dataFiles.GetAwaiter().GetResult());
        written.AddRange(charts.Select(c => Relative(root, c.Path)));

        progress?.Report(WorkbookStep);
        workbook.GetAwaiter().GetResult();
        written.Add(WorkbookName);

        var files = written.Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).ToArray();
        var removed = new List<string>();
        foreach (var old in previous.Except(files, StringComparer.Ordinal).Order(StringComparer.Ordinal))
        {
            string path = Full(root, old);
            if (File.Exists(path))
            {
                File.Delete(path);
                removed.Add(old);
            }
        }

        AtomicFile.WriteAllText(Path.Combine(root, ManifestName), string.Join("\n", files.Prepend(ManifestName)) + "\n");
        return new ReportOutput(root, files, removed);
    }

    /// <summary>Writes the data files (tables streamed straight to their files) and returns their relative paths.</summary>
    internal static IReadOnlyList<string> WriteDataFiles(ReviewResult review, string root, SharedTables tables)
    {
        var written = new List<string>();

        // Tables stream straight to their files: at 100,000 lots a whole file held as one string cost hundreds of MB.
        void Table(string relative, ReportTable table)
        {
            CsvText.WriteFile(table, Full(root, relative));
            written.Add(relative);
        }

        Table(DataFiles.Lots, tables.Lots);
        Table(DataFiles.Groups, ReviewTables.Groups(review));
        Table(DataFiles.Flags, ReviewTables.Flags(review));
        Table(DataFiles.IntakeIssues, ReviewTables.IntakeIssues(review));
        AtomicFile.WriteAllText(Full(root, DataFiles.HouseFactor), HouseFactorJson.Write(review.HouseFactor));
        written.Add(DataFiles.HouseFactor);
        if (tables.KineticsLots is { } kinetics)
        {
            // The table of KineticsCsv.WriteFile, shared with the kinetics sheet.
            Table(DataFiles.Kinetics, kinetics);
        }

        return written;
    }

    /// <summary>Runs <paramref name="work"/> on a thread of its own (not the pool's: the charts keep the pool's threads busy).</summary>
    private static Task<T> Started<T>(Func<T> work) =>
        Task.Factory.StartNew(work, CancellationToken.None, TaskCreationOptions.LongRunning, TaskScheduler.Default);

    /// <summary>Waits for <paramref name="task"/> to end; its failure, if any, is reported by whoever reads its result.</summary>
    private static void WaitQuietly(Task task)
    {
        try
        {
            task.Wait();
        }
        catch (AggregateException)
        {
            // Read again (and rethrown unwrapped) where the result is used, unless an earlier failure is on its way.
        }
    }

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
    public static IReadOnlyList<string> ReadManifest(string folder)
    {
        string path = Path.Combine(Path.GetFullPath(folder), ManifestName);
        if (!File.Exists(path))
        {
            return [];
        }

        // Only plain relative paths inside the folder are honoured, so an edited manifest cannot reach outside it.
        return File.ReadAllLines(path)
            .Select(l => l.Trim())
            .Where(l => l.Length > 0 && l != ManifestName && !l.Contains("..", StringComparison.Ordinal) && !Path.IsPathRooted(l))
            .ToArray();
    }

    private static string Full(string root, string relative) => Path.Combine(root, relative.Replace('/', Path.DirectorySeparatorChar));

    private static string Relative(string root, string full) => Path.GetRelativePath(root, full).Replace(Path.DirectorySeparatorChar, '/');
}
