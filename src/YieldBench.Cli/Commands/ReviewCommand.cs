using System.CommandLine;
using System.Globalization;
using YieldBench.Cli.CommandLine;
using YieldBench.Core.HouseFactor;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Units;
using YieldBench.Intake;
using YieldBench.Modeling;
using YieldBench.Reports;
using YieldBench.Reports.Output;

namespace YieldBench.Cli.Commands;

/// <summary><c>yieldbench review</c>: read, analyse, write every report file, print a summary.</summary>
internal static class ReviewCommand
{
    /// <summary>Default output folder.</summary>
    public const string DefaultOutput = "yieldbench-report";

    public static Command Create(CliContext context)
    {
        var inputs = new Argument<string[]>("inputs") { Description = "Lot and log files or folders (.xlsx, .xls, .ods, .csv, .txt, .tsv). None: the bundled demo data.", Arity = ArgumentArity.ZeroOrMore };
        var output = new Option<string>("--out") { Description = "Output folder (created when missing; this tool's files in it are replaced).", DefaultValueFactory = _ => DefaultOutput };
        var quiet = new Option<bool>("--quiet") { Description = "Print nothing but errors (on standard error)." };
        var columns = new Option<string[]>("--column") { Description = "Map a field to a header, FIELD=HEADER (repeatable), e.g. --column strain=Levure.", AllowMultipleArgumentsPerToken = false };
        var mapping = new Option<string?>("--mapping") { Description = "A column-mapping file: one FIELD = HEADER a line." };
        var season = UsageChecks.SeasonOption("Season (vintage year) for files whose season no column, sheet or file name gives.");
        var regime = new Option<string>("--regime") { Description = "Label tolerance the backtest is scored against: us, eu, or custom:TOLERANCE (% v/v, e.g. custom:0.8).", DefaultValueFactory = _ => "us" };
        var threshold = UsageChecks.DecimalOption("--threshold", "Alcohol (% v/v) for the wrong-side-of-threshold share (default 14).", "14.5");
        var seed = UsageChecks.SeedOption("Seed for every random step (default 20261).");
        var classLine = new Option<string?>("--class-line") { Description = "Alcohol (% v/v) a stated value may not cross in the label scoring, or 'none' (default: the regime's own; US 16, the tax-class boundary since 2018; 14 for the rule before)." };
        var includeFlagged = new Option<bool>("--include-flagged-lots") { Description = "Let lots flagged as likely errors or not fermented to dryness teach the house factor (by default they are left out; both versions are reported)." };
        var fahrenheit = new Option<bool>("--fahrenheit") { Description = "Show temperatures in °F (charts, workbook, page, console and data files, whose temperature columns then end in _f)." };
        var command = new Command("review", "Review finished lots: conversion by strain, odd lots, house factor, kinetics; writes a workbook, charts and data files.");
        command.Arguments.Add(inputs);
        foreach (var option in new Option[] { output, quiet, columns, mapping, season, regime, threshold, seed, includeFlagged, classLine, fahrenheit })
        {
            command.Options.Add(option);
        }

        command.SetAction(parse => Run(
            context,
            new Request(
                parse.GetValue(inputs) ?? [],
                parse.GetValue(output) ?? DefaultOutput,
                parse.GetValue(quiet),
                parse.GetValue(columns) ?? [],
                parse.GetValue(mapping),
                parse.GetValue(season),
                parse.GetValue(regime) ?? "us",
                parse.GetValue(threshold),
                parse.GetValue(seed),
                parse.GetValue(includeFlagged),
                parse.GetValue(classLine),
                parse.GetValue(fahrenheit))));
        return command;
    }

    /// <summary>What the user asked for.</summary>
    internal sealed record Request(
        IReadOnlyList<string> Inputs,
        string Output,
        bool Quiet,
        IReadOnlyList<string> Columns,
        string? Mapping,
        int? Season,
        string Regime,
        double? Threshold,
        int? Seed,
        bool IncludeFlaggedLots = false,
        string? ClassLine = null,
        bool Fahrenheit = false);

    internal static int Run(CliContext context, Request request)
    {
        var console = new ConsoleReport(context, request.Quiet);
        if (!TryParseRegime(request.Regime, out var regime, out string? regimeError))
        {
            context.Error.WriteLine(regimeError);
            return ExitCodes.Usage;
        }

        if (request.ClassLine is { } classLine)
        {
            string c = classLine.Trim();
            if (string.Equals(c, "none", StringComparison.OrdinalIgnoreCase))
            {
                regime = regime.WithNoCrossingLine(null);
            }
            else if (UsageChecks.TryDecimal(c, out double line) && line > 0 && line <= 25)
            {
                regime = regime.WithNoCrossingLine(line);
            }
            else
            {
                context.Error.WriteLine($"--class-line {classLine} is not understood; give an alcohol above 0 and at most 25 % v/v (e.g. --class-line 16), or 'none'.");
                return ExitCodes.Usage;
            }
        }

        if (request.Threshold is { } t && (double.IsNaN(t) || t <= 0 || t > 25))
        {
            context.Error.WriteLine($"--threshold {t.ToString(CultureInfo.InvariantCulture)} is outside 0–25 % v/v; give the alcohol that matters for your labels, e.g. --threshold 14.");
            return ExitCodes.Usage;
        }

        var inputs = request.Inputs.ToList();
        string inputRoot = context.WorkingDirectory;
        if ((UsageChecks.Inputs("review", inputs, context.WorkingDirectory)
            ?? UsageChecks.Columns("review", request.Columns)
            ?? UsageChecks.MappingFile("review", request.Mapping, context.WorkingDirectory)) is { } usage)
        {
            TextWrap.WriteLine(context.Error, usage);
            return ExitCodes.Usage;
        }

        if (inputs.Count == 0)
        {
            string demo = DemoPaths.Full(DemoPaths.History);
            if (!Directory.Exists(demo))
            {
                context.Error.WriteLine($"No inputs given and the bundled demo data is missing ({demo}); give lot files or folders to review.");
                return ExitCodes.Usage;
            }

            // Read relative to the tool's folder, so reports name the files "demo-data/history/…" wherever the tool is installed.
            inputRoot = AppContext.BaseDirectory;
            inputs.Add(DemoPaths.History);
            console.Line(ReportTexts.DemoDataNotice);
        }

        string outFolder = Path.GetFullPath(request.Output, context.WorkingDirectory);
        if (((ReportFolder.Problem(outFolder, inputs.Select(i => Path.GetFullPath(i, inputRoot))) is { } clash ? "review: " + clash : null)
            ?? UsageChecks.WritableFolder("review", outFolder, request.Output)) is { } outProblem)
        {
            TextWrap.WriteLine(context.Error, outProblem);
            return ExitCodes.Usage;
        }

        console.Stage("reading inputs");
        // Reading the inputs keeps one core busy; the other compiles the workbook and chart code meanwhile (about 0.3 s
        // off the demo review, docs/performance.md). The warm-up writes nothing; it is awaited before the reports are
        // written (or before returning early), so a failure in it is not hidden; when the command fails before then, that
        // failure is the one reported.
        var warmUp = Task.Run(ReportWriter.WarmUp);
        var options = new IntakeOptions
        {
            ColumnMappings = request.Columns,
            MappingFile = request.Mapping is null ? null : Path.GetFullPath(request.Mapping, context.WorkingDirectory),
            Season = request.Season,
            WorkingDirectory = inputRoot,
        };
        var set = IntakeReader.Read(inputs, options);

        // The hashed file list is what was really read (folders expanded): check it too before writing anything.
        if (ReportFolder.Problem(outFolder, set.Files.Select(f => Path.GetFullPath(f.Path, inputRoot))) is { } fileClash)
        {
            warmUp.GetAwaiter().GetResult();
            TextWrap.WriteLine(context.Error, "review: " + fileClash);
            return ExitCodes.Usage;
        }

        var settings = new ReviewSettings
        {
            Seed = request.Seed ?? new ReviewSettings().Seed,
            TemperatureUnit = request.Fahrenheit ? TemperatureUnit.Fahrenheit : TemperatureUnit.Celsius,
            HouseFactor = new HouseFactorSettings
            {
                Regime = regime,
                ThresholdAbv = request.Threshold ?? new HouseFactorSettings().ThresholdAbv,
                IncludeFlaggedLots = request.IncludeFlaggedLots,
            },
        };
        var review = ReviewRunner.Run(set, settings, YieldBenchApp.Version, [new MultiVariableCandidate()], new Progress(console));
        console.Stage("writing reports");
        warmUp.GetAwaiter().GetResult();
        try
        {
            console.ShowPathAs(outFolder, request.Output);
            ReportWriter.Write(review, outFolder, new Progress(console), console.SummaryWriter);
        }
        catch (ReportFolderException e)
        {
            console.Done();
            TextWrap.WriteLine(context.Error, "review: " + e.Message);
            return ExitCodes.Usage;
        }

        console.Notices(set, Path.Combine(request.Output, "data", "intake-issues.csv"));
        bool leftOut = set.Issues.Any(i => i.Severity == IssueSeverity.Error);
        return leftOut || set.Lots.Count == 0 ? ExitCodes.InputProblems : ExitCodes.Success;
    }

    /// <summary>Parses <c>us</c>, <c>eu</c> or <c>custom:TOLERANCE</c>.</summary>
    internal static bool TryParseRegime(string text, out LabelRegime regime, out string? error)
    {
        string t = text.Trim().ToLowerInvariant();
        regime = LabelRegime.UnitedStates;
        error = null;
        switch (t)
        {
            case "us":
                return true;
            case "eu":
                regime = LabelRegime.EuropeanUnion;
                return true;
        }

        if (t.StartsWith("custom:", StringComparison.Ordinal)
            && double.TryParse(t["custom:".Length..], NumberStyles.Float, CultureInfo.InvariantCulture, out double tolerance)
            && tolerance > 0 && tolerance <= 5)
        {
            regime = LabelRegime.UserDefined(tolerance);
            return true;
        }

        error = $"--regime '{text}' is not understood; use us, eu, or custom:TOLERANCE with a tolerance above 0 and at most 5 % v/v (e.g. custom:0.8).";
        return false;
    }

    private sealed class Progress(ConsoleReport console) : IProgress<string>
    {
        public void Report(string value) => console.Stage(value);
    }
}

/// <summary>
/// What the review command prints: on a terminal, one progress line rewritten in place; when redirected, one plain
/// line per stage; with --quiet, nothing but errors.
/// </summary>
internal sealed class ConsoleReport(CliContext context, bool quiet)
{
    private int width;

    /// <summary>The command's output.</summary>
    public TextWriter Out => context.Out;

    public void Line(string text)
    {
        if (!quiet)
        {
            Clear();
            TextWrap.WriteLine(context.Out, text);
        }
    }

    /// <summary>A progress line, on standard error (results go to standard output).</summary>
    public void Stage(string name)
    {
        if (quiet)
        {
            return;
        }

        if (context.IsTerminal)
        {
            string text = "review: " + name + "…";
            context.Error.Write("\r" + text.PadRight(width));
            width = text.Length;
        }
        else
        {
            context.Error.WriteLine("review: " + name);
        }
    }

    /// <summary>
    /// What intake found that changes the numbers, said on the console after the summary: rows left out (on standard
    /// error, also with --quiet), and lots whose additions could not be corrected for lack of a must volume.
    /// </summary>
    public void Notices(SeasonSet set, string issuesFile)
    {
        int errors = set.Issues.Count(i => i.Severity == IssueSeverity.Error);
        if (errors > 0)
        {
            Clear();
            TextWrap.WriteLine(context.Error, $"review: {errors.ToString(CultureInfo.InvariantCulture)} input error(s): rows or files were left out; each is in {UsageChecks.Shown(issuesFile)} with its fix.");
        }

        if (set.Lots.Count == 0)
        {
            // A report of no lot says nothing about strains or factors; say why, also with --quiet.
            Clear();
            TextWrap.WriteLine(context.Error, $"review: no lot could be used, so nothing was reviewed ({set.Accounts.Sum(a => a.RowsReported).ToString(CultureInfo.InvariantCulture)} row(s) left out). The first problems:");
            foreach (var issue in set.Issues.OrderBy(i => i.Severity == IssueSeverity.Error ? 0 : 1).Take(5))
            {
                TextWrap.WriteLine(context.Error, "  " + IntakeReport.Describe(issue));
            }

            if (set.Issues.Count == 0)
            {
                context.Error.WriteLine("  the inputs hold no lots table (a header naming lot, strain, starting sugar and final alcohol).");
            }
        }

        int uncorrected = set.Issues.Count(i => i.Code == IssueCodes.AdditionsWithoutVolume);
        if (uncorrected > 0 && !quiet)
        {
            Clear();
            TextWrap.WriteLine(context.Out, $"Additions not corrected: {uncorrected.ToString(CultureInfo.InvariantCulture)} lot(s) record water or sugar added but no must volume, so their starting sugar could not be corrected and their factors are off by the additions (listed in {UsageChecks.Shown(issuesFile)}).");
        }
    }

    public void Done() => Clear();

    /// <summary>Where the report's console part prints its summary: the output (once the progress line is cleared), or nowhere with --quiet.</summary>
    public TextWriter? SummaryWriter => quiet ? null : new ClearingWriter(this);

    /// <summary>A full path the summary prints, and how the user gave it (shown instead).</summary>
    public (string Full, string Shown)? PathShown { get; private set; }

    /// <summary>Makes the summary show <paramref name="full"/> as the user gave it.</summary>
    public void ShowPathAs(string full, string shown) => PathShown = (full, UsageChecks.Shown(shown));

    private void Clear()
    {
        if (context.IsTerminal && width > 0)
        {
            context.Error.Write("\r" + new string(' ', width) + "\r");
            width = 0;
        }
    }
}

/// <summary>
/// Clears the progress line before the first summary line, then writes to the command's output, each line wrapped to
/// fit the terminal (<see cref="TextWrap"/>).
/// </summary>
internal sealed class ClearingWriter(ConsoleReport console) : TextWriter
{
    private readonly System.Text.StringBuilder line = new();
    private bool cleared;

    public override System.Text.Encoding Encoding => System.Text.Encoding.UTF8;

    public override void Write(char value)
    {
        if (value == '\n')
        {
            EndLine();
            return;
        }

        if (value != '\r')
        {
            line.Append(value);
        }
    }

    public override void Write(string? value)
    {
        foreach (char c in value ?? "")
        {
            Write(c);
        }
    }

    public override void WriteLine(string? value)
    {
        Write(value);
        EndLine();
    }

    public override void WriteLine() => EndLine();

    /// <summary>Writes a line begun but not ended; an ended line is written as it ends.</summary>
    public override void Flush()
    {
        if (line.Length > 0)
        {
            EndLine();
        }
    }

    private void EndLine()
    {
        if (!cleared)
        {
            console.Done();
            cleared = true;
        }

        string text = line.ToString();
        if (console.PathShown is var (full, shown))
        {
            // Paths as the user gave them (relative to where they stand), not as resolved.
            text = text.Replace(full, shown, StringComparison.Ordinal);
        }

        TextWrap.WriteLine(console.Out, text);
        line.Clear();
    }
}
