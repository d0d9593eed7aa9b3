using System.CommandLine;
using System.Globalization;
using YieldBench.Cli.CommandLine;
using YieldBench.Core.Forecast;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;
using YieldBench.Intake;
using YieldBench.Reports.Forecast;
using YieldBench.Reports.Output;

namespace YieldBench.Cli.Commands;

/// <summary>
/// <c>yieldbench forecast [HISTORY…] --running FILE… [--out DIR]</c>: learn how each strain ferments from the finished
/// lots and logs, backtest that by leaving each season out, forecast the lots still fermenting, print it in plain words
/// and write forecast.json, forecast.xlsx and a chart per lot.
/// </summary>
internal static class ForecastCommand
{
    /// <summary>Default output folder.</summary>
    public const string DefaultOutput = "yieldbench-forecast";

    /// <summary>The command's name, as messages start.</summary>
    private const string Name = "forecast";

    /// <summary>Said when no inputs are given.</summary>
    public const string DemoNotice =
        "No inputs given: forecasting the bundled demo's harvest in progress from its three past seasons (an invented winery, invented strain codes; not real data).";

    public static Command Create(CliContext context)
    {
        var history = new Argument<string[]>("history") { Description = "Finished lots and their logs (what review reads): files or folders. None, with no --running: the bundled demo.", Arity = ArgumentArity.ZeroOrMore };
        var running = new Option<string[]>("--running") { Description = "Lots still fermenting and their logs: a lots table (lot, strain, starting sugar; no final alcohol needed) and logs, files or folders.", AllowMultipleArgumentsPerToken = true };
        var output = new Option<string>("--out") { Description = "Output folder (created when missing; this command's files in it are replaced, others left alone).", DefaultValueFactory = _ => DefaultOutput };
        var quiet = new Option<bool>("--quiet") { Description = "Print nothing but errors." };
        var columns = new Option<string[]>("--column") { Description = "Map a field to a header, FIELD=HEADER (repeatable), for history and running files alike.", AllowMultipleArgumentsPerToken = false };
        var mapping = new Option<string?>("--mapping") { Description = "A column-mapping file: one FIELD = HEADER a line." };
        var season = UsageChecks.SeasonOption("Season (vintage year) for files whose season no column, sheet or file name gives (history and running files alike).");
        var fahrenheit = new Option<bool>("--fahrenheit") { Description = "Show temperatures in °F (console, charts and workbook; forecast.json keeps °C, its keys end in _c)." };
        var command = new Command("forecast", "Forecast lots still fermenting from the cellar's own history: one-third depletion, dryness, peak temperature, cooling, stuck risk; with a backtest.");
        command.Arguments.Add(history);
        foreach (var option in new Option[] { running, output, quiet, columns, mapping, season, fahrenheit })
        {
            command.Options.Add(option);
        }

        command.SetAction(parse => Run(context, new Request(
            parse.GetValue(history) ?? [],
            parse.GetValue(running) ?? [],
            parse.GetValue(output) ?? DefaultOutput,
            parse.GetValue(quiet),
            parse.GetValue(columns) ?? [],
            parse.GetValue(mapping),
            parse.GetValue(season),
            parse.GetValue(fahrenheit))));
        return command;
    }

    /// <summary>What the user asked for.</summary>
    internal sealed record Request(IReadOnlyList<string> History, IReadOnlyList<string> Running, string Output, bool Quiet, IReadOnlyList<string> Columns, string? Mapping, int? Season = null, bool Fahrenheit = false)
    {
        /// <summary>The unit temperatures are shown in.</summary>
        public TemperatureUnit Unit => Fahrenheit ? TemperatureUnit.Fahrenheit : TemperatureUnit.Celsius;
    }

    /// <summary>
    /// A --running input that is a history input, lies inside a history folder or holds a history input, or null. Read
    /// both ways, finished lots would be forecast as running (or running lots read as finished lots missing their
    /// final alcohol): a folder is read with its subfolders.
    /// </summary>
    private static string? Overlap(IReadOnlyList<string> history, IReadOnlyList<string> running, string root)
    {
        static bool Within(string inner, string outer) =>
            string.Equals(inner, outer, StringComparison.Ordinal)
            || inner.StartsWith(Path.TrimEndingDirectorySeparator(outer) + Path.DirectorySeparatorChar, StringComparison.Ordinal);

        foreach (string r in running)
        {
            string rf = Path.TrimEndingDirectorySeparator(Path.GetFullPath(r, root));
            foreach (string h in history)
            {
                string hf = Path.TrimEndingDirectorySeparator(Path.GetFullPath(h, root));
                if (Within(rf, hf) || Within(hf, rf))
                {
                    string how = string.Equals(rf, hf, StringComparison.Ordinal) ? "is also given as history"
                        : Within(rf, hf) ? $"lies in the history's '{h}'" : $"holds the history's '{h}'";
                    return $"{Name}: --running '{r}' {how}, so finished lots would be read as running or running lots as finished; keep the lots still fermenting in a folder of their own, apart from the history.";
                }
            }
        }

        return null;
    }

    internal static int Run(CliContext context, Request request)
    {
        void Say(string line)
        {
            if (!request.Quiet)
            {
                TextWrap.WriteLine(context.Out, UsageChecks.Shown(line));
            }
        }

        int Usage(string message)
        {
            TextWrap.WriteLine(context.Error, UsageChecks.Shown(message));
            return ExitCodes.Usage;
        }

        var history = request.History.ToList();
        var running = request.Running.ToList();
        if ((UsageChecks.Inputs(Name, history, context.WorkingDirectory)
            ?? UsageChecks.Inputs(Name, running, context.WorkingDirectory)
            ?? UsageChecks.Columns(Name, request.Columns)
            ?? UsageChecks.MappingFile(Name, request.Mapping, context.WorkingDirectory)) is { } usage)
        {
            return Usage(usage);
        }

        string root = context.WorkingDirectory;
        bool demoRun = history.Count == 0 && running.Count == 0;
        if (demoRun)
        {
            string demo = DemoPaths.Full(DemoPaths.History);
            string demoRunning = DemoPaths.Full(DemoPaths.Running);
            if (!Directory.Exists(demo) || !Directory.Exists(demoRunning))
            {
                return Usage($"{Name}: no inputs given and the bundled demo data is missing ({demo}, {demoRunning}); give the history and --running files.");
            }

            root = AppContext.BaseDirectory;
            history.Add(DemoPaths.History);
            running.Add(DemoPaths.Running);
        }
        else if (running.Count == 0)
        {
            return Usage($"{Name}: the lots still fermenting are missing; give them with --running FILE… (a lots table and their logs).");
        }
        else if (history.Count == 0)
        {
            return Usage($"{Name}: the history is missing; give the past seasons' lots and logs (what review reads) before --running.");
        }

        if (Overlap(history, running, root) is { } overlap)
        {
            return Usage(overlap);
        }

        string outFolder = Path.GetFullPath(request.Output, context.WorkingDirectory);
        if (((ReportFolder.Problem(outFolder, history.Concat(running).Select(i => Path.GetFullPath(i, root))) is { } clash ? $"{Name}: " + clash : null)
            ?? UsageChecks.WritableFolder(Name, outFolder, request.Output)) is { } outProblem)
        {
            return Usage(outProblem);
        }

        if (demoRun)
        {
            Say(DemoNotice);
        }

        var options = new IntakeOptions
        {
            ColumnMappings = request.Columns,
            MappingFile = request.Mapping is null ? null : Path.GetFullPath(request.Mapping, context.WorkingDirectory),
            Season = request.Season,
            WorkingDirectory = root,
        };
        // Reading the inputs keeps one core busy; the other loads and compiles the workbook and chart code meanwhile
        // (it writes nothing; it is awaited before the files are written, or before returning early, so a failure in it
        // is not hidden).
        var warmUp = Task.Run(ForecastOutput.WarmUp);
        var past = IntakeReader.Read(history, options);
        var now = IntakeReader.Read(running, options with { RunningLots = true });
        if (ReportFolder.Problem(outFolder, past.Files.Concat(now.Files).Select(f => Path.GetFullPath(f.Path, root))) is { } fileClash)
        {
            warmUp.GetAwaiter().GetResult();
            return Usage($"{Name}: " + fileClash);
        }

        ReportIssues(context, request.Quiet, past, now, Path.Combine(request.Output, ForecastWorkbook.FileName));
        if (now.RunningLots.Count == 0)
        {
            warmUp.GetAwaiter().GetResult();
            TextWrap.WriteLine(context.Error, $"{Name}: no running lot could be read from the --running files (a lots table with lot id, strain and starting sugar is needed; the issues above say why).");
            return ExitCodes.InputProblems;
        }

        ForecastReport report;
        try
        {
            report = ForecastRunner.Run(past.Lots, past.Logs, now.RunningLots, now.Logs, ForecastSettings.Default);
        }
        catch (ArgumentException e)
        {
            warmUp.GetAwaiter().GetResult();
            TextWrap.WriteLine(context.Error, UsageChecks.Shown($"{Name}: the forecast cannot be made: {e.Message.Split(" (Parameter", StringSplitOptions.None)[0]}"));
            return ExitCodes.InputProblems;
        }

        warmUp.GetAwaiter().GetResult();
        ReportOutput written;
        try
        {
            written = ForecastOutput.Write(report, outFolder, past.Issues.Concat(now.Issues).ToArray(), request.Unit);
        }
        catch (ReportFolderException e)
        {
            return Usage($"{Name}: " + e.Message);
        }

        foreach (var line in ConsoleLines(report, written, context.WorkingDirectory, request.Unit))
        {
            Say(line);
        }


        bool leftOut = past.Issues.Concat(now.Issues).Any(i => i.Severity == IssueSeverity.Error);
        return leftOut ? ExitCodes.InputProblems : ExitCodes.Success;
    }

    /// <summary>
    /// Intake issues: every issue of the running files (they are what is forecast), each with its place and fix (errors
    /// on standard error, notes on standard output unless quiet); the history's are counted, and all are in the
    /// workbook's "Intake issues" sheet.
    /// </summary>
    private static void ReportIssues(CliContext context, bool quiet, SeasonSet past, SeasonSet now, string workbook)
    {
        int errors = past.Issues.Count(i => i.Severity == IssueSeverity.Error);
        int warnings = past.Issues.Count - errors;
        if (errors > 0)
        {
            TextWrap.WriteLine(context.Error, $"{Name}: {errors.ToString(CultureInfo.InvariantCulture)} input error(s) in the history: rows or files were left out; each is in {UsageChecks.Shown(workbook)}, sheet \"Intake issues\", with its fix.");
        }

        if (warnings > 0 && !quiet)
        {
            TextWrap.WriteLine(context.Out, $"History: {warnings.ToString(CultureInfo.InvariantCulture)} intake warning(s), rows used; each with its fix in {UsageChecks.Shown(workbook)}, sheet \"Intake issues\".");
        }

        // The running files' issues after the history's counts, under a heading of their own, so none reads as the
        // history's.
        var shown = now.Issues.Where(i => i.Severity == IssueSeverity.Error || !quiet).ToArray();
        if (shown.Length > 0 && !quiet)
        {
            TextWrap.WriteLine(context.Out, $"Running lots' files: {shown.Length.ToString(CultureInfo.InvariantCulture)} intake issue(s), each with its place and fix:");
        }

        foreach (var i in shown)
        {
            bool error = i.Severity == IssueSeverity.Error;
            TextWrap.WriteLine(error ? context.Error : context.Out, UsageChecks.Shown($"{Name}: {IntakeReport.Describe(i)}"));
        }
    }

    /// <summary>
    /// The console's lines: the to-do list (one line a lot, what cannot wait first, then today, tomorrow and later;
    /// <see cref="ForecastActions"/>), each lot in plain words when the cellar has at most
    /// <see cref="ForecastActions.DetailUpTo"/> running lots (else where they are), the backtest in short, the basis,
    /// the files, the cautions.
    /// </summary>
    internal static IReadOnlyList<string> ConsoleLines(ForecastReport report, ReportOutput written, string workingDirectory, TemperatureUnit unit = TemperatureUnit.Celsius)
    {
        var lines = new List<string>();
        // The folder as the user would type it: relative below the working folder, whole elsewhere (not ../../../tmp/x).
        string relative = Path.GetRelativePath(workingDirectory, written.Folder);
        string shown = relative == ".." || relative.StartsWith(".." + Path.DirectorySeparatorChar, StringComparison.Ordinal) || Path.IsPathRooted(relative) ? written.Folder : relative;
        string detail = $"{Path.Combine(shown, ForecastWorkbook.FileName)}, sheet \"Forecast\", and {Path.Combine(shown, ForecastJson.FileName)}";
        lines.AddRange(ForecastActions.Lines(report, detail, unit));
        lines.Add(string.Empty);
        if (report.Lots.Count <= ForecastActions.DetailUpTo)
        {
            lines.Add("Each lot in full:");
            foreach (var lot in report.Lots)
            {
                lines.AddRange(ForecastSentences.Lot(lot, unit, report.Now));
            }
        }
        else
        {
            lines.Add($"Each lot in full (one-third, dryness, peak and reachable heat, cooling power, stuck risk, basis; more than {ForecastActions.DetailUpTo} lots, so not printed here): {detail}.");
        }

        lines.Add(string.Empty);
        lines.AddRange(ForecastSentences.Backtest(report.Backtest, unit));
        lines.Add(string.Empty);
        lines.AddRange(ForecastSentences.Basis(report, unit));
        lines.AddRange(ForecastSentences.Notes(report.Notes));

        lines.Add(string.Empty);
        int charts = written.Files.Count(w => w.EndsWith(".png", StringComparison.Ordinal));
        lines.Add($"Wrote {Path.Combine(shown, ForecastJson.FileName)}, {Path.Combine(shown, ForecastWorkbook.FileName)} and {charts} chart(s) in {Path.Combine(shown, ForecastOutput.ChartsFolder)}.");
        lines.Add("Cautions:");
        lines.AddRange(ForecastSentences.Cautions.Select(c => "  " + c));
        return lines;
    }
}
