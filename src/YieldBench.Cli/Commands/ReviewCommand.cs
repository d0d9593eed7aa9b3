using System.CommandLine;
using System.Globalization;
using YieldBench.Core.HouseFactor;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
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
        var inputs = new Argument<string[]>("inputs") { Description = "Lot and log files or folders (.xlsx, .xls, .csv). None: the bundled demo data.", Arity = ArgumentArity.ZeroOrMore };
        var output = new Option<string>("--out") { Description = "Output folder (created when missing; this tool's files in it are replaced).", DefaultValueFactory = _ => DefaultOutput };
        var quiet = new Option<bool>("--quiet") { Description = "Print nothing but errors." };
        var columns = new Option<string[]>("--column") { Description = "Map a field to a header, FIELD=HEADER (repeatable), e.g. --column strain=Levure.", AllowMultipleArgumentsPerToken = false };
        var mapping = new Option<string?>("--mapping") { Description = "A column-mapping file: one FIELD = HEADER a line." };
        var season = new Option<int?>("--season") { Description = "Season (vintage year) for files whose season no column, sheet or file name gives." };
        var regime = new Option<string>("--regime") { Description = "Label tolerance the backtest is scored against: us, eu, or custom:TOLERANCE (% v/v, e.g. custom:0.8).", DefaultValueFactory = _ => "us" };
        var threshold = new Option<double?>("--threshold") { Description = "Alcohol (% v/v) for the wrong-side-of-threshold share (default 14)." };
        var seed = new Option<int?>("--seed") { Description = "Seed for every random step (default 20261)." };
        var classLine = new Option<string?>("--class-line") { Description = "Alcohol (% v/v) a stated value may not cross in the label scoring, or 'none' (default: the regime's own; US 16, the tax-class boundary since 2018; 14 for the rule before)." };
        var includeFlagged = new Option<bool>("--include-flagged-lots") { Description = "Let lots flagged as likely errors or not fermented to dryness teach the house factor (by default they are left out; both versions are reported)." };
        var command = new Command("review", "Review finished lots: conversion by strain, odd lots, house factor, kinetics; writes a workbook, charts and data files.");
        command.Arguments.Add(inputs);
        foreach (var option in new Option[] { output, quiet, columns, mapping, season, regime, threshold, seed, includeFlagged, classLine })
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
                parse.GetValue(classLine))));
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
        string? ClassLine = null);

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
            else if (double.TryParse(c, NumberStyles.Float, CultureInfo.InvariantCulture, out double line) && line > 0 && line <= 25)
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
        if (inputs.Count == 0)
        {
            string demo = Path.Combine(AppContext.BaseDirectory, "demo-data");
            if (!Directory.Exists(demo))
            {
                context.Error.WriteLine($"No inputs given and the bundled demo data is missing ({demo}); give lot files or folders to review.");
                return ExitCodes.Usage;
            }

            // Read relative to the tool's folder, so reports name the files "demo-data/…" wherever the tool is installed.
            inputRoot = AppContext.BaseDirectory;
            inputs.Add("demo-data");
            console.Line(ReportTexts.DemoDataNotice);
        }

        string outFolder = Path.GetFullPath(request.Output, context.WorkingDirectory);
        if (ReportFolder.Problem(outFolder, inputs.Select(i => Path.GetFullPath(i, inputRoot))) is { } clash)
        {
            context.Error.WriteLine(clash);
            return ExitCodes.Usage;
        }

        console.Stage("reading inputs");
        // Reading the inputs keeps one core busy; the other compiles the workbook and chart code meanwhile (about 0.3 s
        // off the demo review, docs/performance.md). The warm-up writes nothing; it is awaited before the reports are
        // written, so a failure in it is not hidden.
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
            context.Error.WriteLine(fileClash);
            return ExitCodes.Usage;
        }

        var settings = new ReviewSettings
        {
            Seed = request.Seed ?? new ReviewSettings().Seed,
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
            ReportWriter.Write(review, outFolder, new Progress(console), console.SummaryWriter);
        }
        catch (ReportFolderException e)
        {
            console.Done();
            context.Error.WriteLine(e.Message);
            return ExitCodes.Usage;
        }

        bool leftOut = set.Issues.Any(i => i.Severity == IssueSeverity.Error);
        return leftOut ? ExitCodes.InputProblems : ExitCodes.Success;
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
            context.Out.WriteLine(text);
        }
    }

    public void Stage(string name)
    {
        if (quiet)
        {
            return;
        }

        if (context.IsTerminal)
        {
            string text = "review: " + name + "…";
            context.Out.Write("\r" + text.PadRight(width));
            width = text.Length;
        }
        else
        {
            context.Out.WriteLine("review: " + name);
        }
    }

    public void Done() => Clear();

    /// <summary>Where the report's console part prints its summary: the output (once the progress line is cleared), or nowhere with --quiet.</summary>
    public TextWriter? SummaryWriter => quiet ? null : new ClearingWriter(this);

    private void Clear()
    {
        if (context.IsTerminal && width > 0)
        {
            context.Out.Write("\r" + new string(' ', width) + "\r");
            width = 0;
        }
    }
}

/// <summary>Clears the progress line before the first summary line, then writes to the command's output.</summary>
internal sealed class ClearingWriter(ConsoleReport console) : TextWriter
{
    private bool cleared;

    public override System.Text.Encoding Encoding => System.Text.Encoding.UTF8;

    public override void Write(char value)
    {
        Clear();
        console.Out.Write(value);
    }

    public override void WriteLine(string? value)
    {
        Clear();
        console.Out.WriteLine(value);
    }

    private void Clear()
    {
        if (!cleared)
        {
            console.Done();
            cleared = true;
        }
    }
}
