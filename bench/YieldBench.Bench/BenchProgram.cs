using System.Diagnostics;
using System.Globalization;
using System.Runtime.InteropServices;
using System.Text;
using System.Text.Json;
using YieldBench.Core.Review;
using YieldBench.Intake;
using YieldBench.Reports;
using YieldBench.Scenario;

namespace YieldBench.Bench;

/// <summary>One measured run, as a child process reports it.</summary>
internal sealed record RunResult(
    string Name,
    int Lots,
    long LogReadings,
    long LogReadingsUsed,
    long InputBytes,
    double GenerateSeconds,
    IReadOnlyList<StageTiming> Stages,
    double TotalSeconds,
    long ProcessPeakWorkingSetBytes,
    int IntakeIssues,
    int IntakeErrors,
    string? Unfinished = null);

/// <summary>
/// The scale benchmark. <c>run</c> (the default) measures the demo review and generated data sets of 1k, 10k and 100k
/// lots, each in a fresh child process so that peak memory belongs to one run; <c>gen</c> and <c>measure</c> are the
/// child steps. Results go to the console and to bench/results/ (ignored by git); docs/performance.md records them.
/// </summary>
internal static class BenchProgram
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;
    private static readonly JsonSerializerOptions Json = new() { WriteIndented = false };

    public static int Run(string[] args, TextWriter output, TextWriter error)
    {
        string mode = args.Length > 0 && !args[0].StartsWith("--", StringComparison.Ordinal) ? args[0] : "run";
        var opts = ParseOptions(args.SkipWhile(a => !a.StartsWith("--", StringComparison.Ordinal)).ToArray());
        switch (mode)
        {
            case "gen":
                output.WriteLine(JsonSerializer.Serialize(Generate(int.Parse(opts["lots"], Inv), opts["dir"]), Json));
                return 0;
            case "measure":
                output.WriteLine(JsonSerializer.Serialize(Measure(opts["name"], opts["inputs"].Split('|'), opts["out"], int.Parse(opts.GetValueOrDefault("lots", "0"), Inv), long.Parse(opts.GetValueOrDefault("readings", "0"), Inv), double.Parse(opts.GetValueOrDefault("gen-seconds", "0"), Inv), opts.GetValueOrDefault("reports", "yes") == "yes"), Json));
                return 0;
            case "run":
                return Orchestrate(opts, output, error);
            case "compare":
                return Compare.Run(opts, FindRoot(), output, error);
            default:
                error.WriteLine("usage: YieldBench.Bench [run] [--sizes 1000,10000,100000] [--work DIR] [--results DIR] [--demo DIR] [--budget SECONDS per run] [--skip-demo yes]; measure --name N --inputs 'a|b' --out DIR [--reports no] (one run, for profiling); compare [--sizes 1000,10000,100000] [--runs 3] [--peer DIR] [--python PATH] [--peer-budget SECONDS] [--tool PATH | --build tool|self-contained] [--alone yes|no] (the peer and YieldBench side by side as processes)");
                return 2;
        }
    }

    private static Dictionary<string, string> ParseOptions(string[] args)
    {
        var d = new Dictionary<string, string>(StringComparer.Ordinal);
        for (int i = 0; i + 1 < args.Length; i += 2)
        {
            d[args[i].TrimStart('-')] = args[i + 1];
        }

        return d;
    }

    private static int Orchestrate(Dictionary<string, string> opts, TextWriter output, TextWriter error)
    {
        string root = FindRoot();
        var sizes = opts.GetValueOrDefault("sizes", "1000,10000,100000").Split(',', StringSplitOptions.RemoveEmptyEntries).Select(s => int.Parse(s, Inv)).ToArray();
        string work = Path.GetFullPath(opts.GetValueOrDefault("work", Path.Combine(Path.GetTempPath(), "yieldbench-bench")));
        string results = Path.GetFullPath(opts.GetValueOrDefault("results", Path.Combine(root, "bench", "results")));
        string demo = Path.GetFullPath(opts.GetValueOrDefault("demo", Path.Combine(root, "demo-data", "history")));
        var budget = TimeSpan.FromSeconds(double.Parse(opts.GetValueOrDefault("budget", "1800"), Inv));
        Directory.CreateDirectory(work);
        Directory.CreateDirectory(results);
        var runs = new List<RunResult>();

        CommandTiming? command = null;
        if (opts.GetValueOrDefault("skip-demo", "no") != "yes")
        {
            output.WriteLine($"bench: demo review of {demo}");
            runs.Add(Measured(["measure", "--name", "demo", "--inputs", demo, "--out", Path.Combine(work, "demo-report")], budget, error));
            output.WriteLine("bench: the review command on the demo data, as a user runs it (3 times)");
            command = TimeCommand(demo, Path.Combine(work, "demo-command"), 3, error);
        }

        foreach (int n in sizes)
        {
            string dir = Path.Combine(work, $"lots-{n}");
            output.WriteLine($"bench: generating {n} lots into {dir}");
            var gen = Child<GenResult>(["gen", "--lots", n.ToString(Inv), "--dir", dir], error);
            output.WriteLine($"bench: measuring {n} lots ({gen.Readings} log readings, {gen.Bytes / 1e6:0.0} MB of CSV)");
            runs.Add(Measured(["measure", "--name", $"{n} lots", "--inputs", string.Join('|', gen.LogsPaths.Prepend(gen.LotsPath)), "--out", Path.Combine(dir, "report"), "--lots", n.ToString(Inv), "--readings", gen.Readings.ToString(Inv), "--gen-seconds", gen.Seconds.ToString("R", Inv)], budget, error));
        }

        string table = Table(runs) + (command is null ? string.Empty : "\n" + command.Describe() + "\n");
        output.Write(table);
        File.WriteAllText(Path.Combine(results, "results.md"), Machine() + "\n" + table);
        File.WriteAllText(Path.Combine(results, "results.json"), JsonSerializer.Serialize(runs, new JsonSerializerOptions { WriteIndented = true }));
        output.WriteLine($"bench: results in {results}");
        return 0;
    }

    private sealed record GenResult(int Lots, long Readings, long Bytes, double Seconds, string LotsPath, IReadOnlyList<string> LogsPaths);

    private static GenResult Generate(int lots, string dir)
    {
        var watch = Stopwatch.StartNew();
        if (Directory.Exists(dir))
        {
            Directory.Delete(dir, recursive: true);
        }

        var scenario = ScenarioGenerator.Generate(ScaleFiles.Options(lots));
        var (lotsPath, logsPaths, readings) = ScaleFiles.Write(scenario, dir);
        long bytes = new FileInfo(lotsPath).Length + logsPaths.Sum(p => new FileInfo(p).Length);
        return new GenResult(lots, readings, bytes, watch.Elapsed.TotalSeconds, lotsPath, logsPaths);
    }

    private static RunResult Measure(string name, string[] inputs, string outDir, int lots, long readings, double genSeconds, bool reports)
    {
        var files = inputs.SelectMany<string, string>(p => Directory.Exists(p)
                ? Directory.GetFiles(p).Where(f => IntakeReader.Extensions.Contains(Path.GetExtension(f).ToLowerInvariant())).Order(StringComparer.Ordinal)
                : [p])
            .ToArray();
        long inputBytes = files.Sum(f => new FileInfo(f).Length);
        using var clock = new StageClock { Finished = t => Console.Error.WriteLine("stage\t" + JsonSerializer.Serialize(t, Json)) };

        // The floor: only reading the bytes and finding the line ends, nothing parsed.
        clock.Start("read floor (bytes only)");
        long lines = 0;
        foreach (var f in files)
        {
            lines += File.ReadAllBytes(f).AsSpan().Count((byte)'\n');
        }

        GC.KeepAlive(lines);

        Console.Error.WriteLine("start\t" + JsonSerializer.Serialize(new RunResult(name, lots, readings, 0, inputBytes, genSeconds, [], 0, 0, 0, 0), Json));
        clock.Start("read (intake)");
        var set = IntakeReader.Read(inputs, new IntakeOptions());
        // The same candidates as the review command, the multi-variable model included.
        var review = ReviewRunner.Run(set, new ReviewSettings(), "bench", [new YieldBench.Modeling.MultiVariableCandidate()], clock);
        if (reports)
        {
            ReportWriter.Write(review, outDir, clock);
        }

        clock.Stop();

        var stages = clock.Stages;
        double total = stages.Skip(1).Sum(s => s.Seconds);
        using var self = Process.GetCurrentProcess();
        return new RunResult(
            name,
            lots > 0 ? lots : set.Lots.Count,
            readings > 0 ? readings : set.Logs.Sum(l => (long)l.Readings.Count),
            set.Logs.Sum(l => (long)l.Readings.Count),
            inputBytes,
            genSeconds,
            stages,
            total,
            self.PeakWorkingSet64,
            set.Issues.Count,
            set.Issues.Count(i => i.Severity == YieldBench.Core.Lots.IssueSeverity.Error));
    }

    /// <summary>
    /// Runs a measuring child with a time budget. Finished stages arrive on its standard error as they end; when the
    /// budget runs out the child is stopped and the run is reported with the stages it finished and the one it was in.
    /// </summary>
    private static RunResult Measured(string[] args, TimeSpan budget, TextWriter error)
    {
        var start = ChildStart(args);
        start.RedirectStandardError = true;
        using var p = Process.Start(start) ?? throw new InvalidOperationException("Could not start the child process.");
        var stages = new List<StageTiming>();
        RunResult? header = null;
        var stderrDone = new ManualResetEventSlim();
        p.ErrorDataReceived += (_, e) =>
        {
            if (e.Data is null)
            {
                stderrDone.Set();
                return;
            }

            var parts = e.Data.Split('\t', 2);
            lock (stages)
            {
                if (parts.Length == 2 && parts[0] == "stage")
                {
                    stages.Add(JsonSerializer.Deserialize<StageTiming>(parts[1], Json)!);
                    error.WriteLine($"bench:   {stages[^1].Name}: {stages[^1].Seconds:0.00} s wall, {stages[^1].CpuSeconds:0.00} s CPU");
                }
                else if (parts.Length == 2 && parts[0] == "start")
                {
                    header = JsonSerializer.Deserialize<RunResult>(parts[1], Json);
                }
                else
                {
                    error.WriteLine(e.Data);
                }
            }
        };
        p.BeginErrorReadLine();
        var stdout = p.StandardOutput.ReadToEndAsync();
        if (!p.WaitForExit(budget))
        {
            p.Kill(entireProcessTree: true);
            p.WaitForExit();
            stderrDone.Wait(TimeSpan.FromSeconds(10));
            lock (stages)
            {
                var h = header ?? throw new InvalidOperationException("The child reported nothing before its budget ran out.");
                string unfinished = string.Create(Inv, $"stopped after {budget.TotalMinutes:0} min; finished {stages.Count} stage(s)");
                return h with { Stages = stages.ToArray(), TotalSeconds = stages.Skip(1).Sum(s => s.Seconds), Unfinished = unfinished };
            }
        }

        p.WaitForExit();
        stderrDone.Wait(TimeSpan.FromSeconds(10));
        if (p.ExitCode != 0)
        {
            // A library failure at scale is a result to report, with the stages that did finish.
            lock (stages)
            {
                var h = header ?? throw new InvalidOperationException($"child '{string.Join(' ', args)}' exited {p.ExitCode} before starting");
                return h with { Stages = stages.ToArray(), TotalSeconds = stages.Skip(1).Sum(s => s.Seconds), Unfinished = string.Create(Inv, $"the run failed (exit {p.ExitCode}) after {stages.Count} stage(s); its error is printed above") };
            }
        }

        string last = stdout.Result.Split('\n', StringSplitOptions.RemoveEmptyEntries)[^1];
        return JsonSerializer.Deserialize<RunResult>(last, Json) ?? throw new InvalidOperationException("Empty child result.");
    }

    /// <summary>Wall time and peak resident memory of the review command as a process, over several runs.</summary>
    private sealed record CommandTiming(string Command, IReadOnlyList<double> WallSeconds, IReadOnlyList<long> PeakBytes)
    {
        public string Describe() => string.Create(Inv,
            $"The review command on the demo data as a process (`{Command}`): wall {string.Join(", ", WallSeconds.Select(w => w.ToString("0.00", Inv)))} s (best {WallSeconds.Min():0.00} s), peak resident memory {PeakBytes.Max() / 1048576.0:0} MB.");
    }

    /// <summary>
    /// Runs <c>yieldbench review</c> (the Release build next to this benchmark's) on the demo data and times it from
    /// process start to exit, start-up and JIT included; peak memory is the largest resident size seen while it runs.
    /// </summary>
    private static CommandTiming TimeCommand(string demo, string outDir, int repeats, TextWriter error)
    {
        string cli = Path.Combine(FindRoot(), "src", "YieldBench.Cli", "bin", BuildConfiguration(), "net10.0", "yieldbench.dll");
        if (!File.Exists(cli))
        {
            throw new InvalidOperationException($"The review command is not built at {cli}; build it first: dotnet build -c {BuildConfiguration()}");
        }

        var walls = new List<double>();
        var peaks = new List<long>();
        for (int i = 0; i < repeats; i++)
        {
            // The dotnet host runs the command's dll, as `dotnet yieldbench.dll` (this benchmark may itself run from its apphost).
            string host = Environment.ProcessPath is { } self && Path.GetFileNameWithoutExtension(self) == "dotnet"
                ? self
                : Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") ?? "dotnet";
            var start = new ProcessStartInfo(host) { UseShellExecute = false, RedirectStandardOutput = true, RedirectStandardError = true };
            foreach (var a in new[] { cli, "review", demo, "--out", outDir, "--quiet" })
            {
                start.ArgumentList.Add(a);
            }

            var watch = Stopwatch.StartNew();
            using var p = Process.Start(start) ?? throw new InvalidOperationException("Could not start the review command.");
            var stdout = p.StandardOutput.ReadToEndAsync();
            var stderr = p.StandardError.ReadToEndAsync();
            long peak = 0;
            while (!p.WaitForExit(5))
            {
                try
                {
                    p.Refresh();
                    peak = Math.Max(peak, Math.Max(p.PeakWorkingSet64, p.WorkingSet64));
                }
                catch (InvalidOperationException)
                {
                    break;
                }
            }

            p.WaitForExit();
            walls.Add(watch.Elapsed.TotalSeconds);
            peaks.Add(peak);
            if (p.ExitCode > 1)
            {
                error.WriteLine(stdout.Result + stderr.Result);
                throw new InvalidOperationException($"The review command exited {p.ExitCode}.");
            }

            error.WriteLine(string.Create(Inv, $"bench:   review command run {i + 1}: {walls[^1]:0.00} s wall, {peak / 1048576.0:0} MB peak"));
        }

        return new CommandTiming($"dotnet src/YieldBench.Cli/bin/{BuildConfiguration()}/net10.0/yieldbench.dll review demo-data/history --out DIR --quiet", walls, peaks);
    }

    private static string BuildConfiguration() =>
        AppContext.BaseDirectory.Contains($"{Path.DirectorySeparatorChar}Debug{Path.DirectorySeparatorChar}", StringComparison.Ordinal) ? "Debug" : "Release";

    private static ProcessStartInfo ChildStart(string[] args)
    {
        string host = Environment.ProcessPath ?? throw new InvalidOperationException("No process path.");
        var start = new ProcessStartInfo(host) { RedirectStandardOutput = true, UseShellExecute = false };
        if (Path.GetFileNameWithoutExtension(host) == "dotnet")
        {
            start.ArgumentList.Add(typeof(BenchProgram).Assembly.Location);
        }

        foreach (var a in args)
        {
            start.ArgumentList.Add(a);
        }

        return start;
    }

    private static T Child<T>(string[] args, TextWriter error)
    {
        var start = ChildStart(args);
        using var p = Process.Start(start) ?? throw new InvalidOperationException("Could not start the child process.");
        string text = p.StandardOutput.ReadToEnd();
        p.WaitForExit();
        if (p.ExitCode != 0)
        {
            error.WriteLine(text);
            throw new InvalidOperationException($"child '{string.Join(' ', args)}' exited {p.ExitCode}");
        }

        string last = text.Split('\n', StringSplitOptions.RemoveEmptyEntries)[^1];
        return JsonSerializer.Deserialize<T>(last, Json) ?? throw new InvalidOperationException("Empty child result.");
    }

    private static string Table(IReadOnlyList<RunResult> runs)
    {
        var sb = new StringBuilder();
        sb.Append("| run | lots | log readings used | input MB | stage | wall s | CPU s | peak working set MB | allocated MB |\n");
        sb.Append("|---|---|---|---|---|---|---|---|---|\n");
        foreach (var r in runs)
        {
            foreach (var s in r.Stages)
            {
                sb.Append(Inv, $"| {r.Name} | {r.Lots} | {r.LogReadingsUsed} | {r.InputBytes / 1e6:0.00} | {s.Name} | {s.Seconds:0.000} | {s.CpuSeconds:0.000} | {s.PeakWorkingSetBytes / 1048576.0:0} | {s.AllocatedBytes / 1048576.0:0} |\n");
            }

            sb.Append(Inv, $"| **{r.Name}** | {r.Lots} | {r.LogReadingsUsed} | {r.InputBytes / 1e6:0.00} | **total (read to workbook)**; intake issues {r.IntakeIssues} ({r.IntakeErrors} errors){(r.Unfinished is null ? "" : "; NOT FINISHED: " + r.Unfinished)} | **{r.TotalSeconds:0.000}** | {r.Stages.Skip(1).Sum(s => s.CpuSeconds):0.000} | **{r.ProcessPeakWorkingSetBytes / 1048576.0:0}** (process peak) | |\n");
        }

        return sb.ToString();
    }

    private static string Machine()
    {
        string load = File.Exists("/proc/loadavg") ? File.ReadAllText("/proc/loadavg").Trim() : "unknown";
        return string.Create(Inv, $"Machine: {Environment.ProcessorCount} cores, {GC.GetGCMemoryInfo().TotalAvailableMemoryBytes / 1073741824.0:0.0} GiB available to .NET, {RuntimeInformation.OSDescription}, {RuntimeInformation.FrameworkDescription}, server GC {System.Runtime.GCSettings.IsServerGC}; load average at the end {load}\n");
    }

    private static string FindRoot()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "YieldBench.sln")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName ?? Environment.CurrentDirectory;
    }
}
