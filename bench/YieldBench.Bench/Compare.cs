using System.Diagnostics;
using System.Globalization;
using System.Text;

namespace YieldBench.Bench;

/// <summary>
/// <c>compare</c>: YieldBench and the hand-written pandas review (the peer) side by side, as whole processes on the same
/// generated files, each run timed by GNU time (<c>/usr/bin/time</c>: wall, user + system CPU, peak resident memory).
/// The two commands alternate (peer, YieldBench, peer, ...) so that drift in the machine's speed falls on both; medians
/// and the ratio peer ÷ YieldBench are printed. Also timed, YieldBench alone: the demo review, the forecast on the demo,
/// and the scale set of 100,000 lots with about a million log readings. docs/performance.md records a run.
/// </summary>
internal static class Compare
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>One timed process.</summary>
    private sealed record Timing(double Wall, double Cpu, double PeakMb, int Exit, bool Finished);

    public static int Run(Dictionary<string, string> opts, string root, TextWriter output, TextWriter error)
    {
        var sizes = opts.GetValueOrDefault("sizes", "1000,10000,100000").Split(',', StringSplitOptions.RemoveEmptyEntries).Select(s => int.Parse(s, Inv)).ToArray();
        int runs = int.Parse(opts.GetValueOrDefault("runs", "3"), Inv);
        string work = Path.GetFullPath(opts.GetValueOrDefault("work", Path.Combine(Path.GetTempPath(), "yieldbench-compare")));
        string peer = Path.GetFullPath(opts.GetValueOrDefault("peer", Path.Combine(root, "..", "shared", "peer")));
        string python = opts.GetValueOrDefault("python", "/usr/bin/python3");
        var peerBudget = TimeSpan.FromSeconds(double.Parse(opts.GetValueOrDefault("peer-budget", "900"), Inv));
        string results = Path.GetFullPath(opts.GetValueOrDefault("results", Path.Combine(root, "bench", "results")));
        Directory.CreateDirectory(work);
        Directory.CreateDirectory(results);
        if (!File.Exists(Path.Combine(peer, "review_peer.py")))
        {
            error.WriteLine($"compare: the peer's review_peer.py is not in {peer}; give its folder with --peer DIR");
            return 2;
        }

        // The tool as a user installs it: published for this platform, compiled ahead of time (the csproj's setting);
        // with --build self-contained, README.md's self-contained build (framework and tool in one composite image).
        string tool = opts.GetValueOrDefault("tool", string.Empty);
        string build = opts.GetValueOrDefault("build", "tool");
        if (build is not ("tool" or "self-contained"))
        {
            error.WriteLine($"compare: --build {build} is not known; use tool or self-contained");
            return 2;
        }

        if (tool.Length == 0)
        {
            tool = Path.Combine(work, build, "yieldbench");
            string[] publishArgs = ["dotnet", "publish", Path.Combine(root, "src", "YieldBench.Cli"), "-c", "Release", "--use-current-runtime",
                .. build == "self-contained" ? new[] { "--self-contained", "-p:PublishReadyToRunComposite=true" } : [], "-o", Path.GetDirectoryName(tool)!];
            output.WriteLine("compare: publishing the tool (" + string.Join(' ', publishArgs[..2]) + " src/YieldBench.Cli " + string.Join(' ', publishArgs[3..^2]) + ")");
            var publish = Time(publishArgs, work, TimeSpan.FromMinutes(30), error);
            if (publish.Exit != 0)
            {
                error.WriteLine("compare: publishing the tool failed");
                return 1;
            }
        }

        var rows = new StringBuilder();
        rows.Append("| input | peer wall s | peer CPU s | peer peak MB | YieldBench wall s | YieldBench CPU s | YieldBench peak MB | peer ÷ YieldBench (wall) |\n");
        rows.Append("|---|---|---|---|---|---|---|---|\n");
        foreach (int n in sizes)
        {
            string file = Path.Combine(work, n <= 1000 ? $"lots-{n}.xlsx" : $"lots-{n}.csv");
            if (!File.Exists(file))
            {
                output.WriteLine($"compare: generating {file} (make_lots.py {n})");
                Time([python, Path.Combine(peer, "make_lots.py"), n.ToString(Inv), file], work, TimeSpan.FromMinutes(10), error);
            }

            // The peer is O(n²) in time and memory (scipy's Theil–Sen): large sets get one run within the budget.
            int peerRuns = n >= 100_000 ? 1 : runs;
            var peerTimes = new List<Timing>();
            var ybTimes = new List<Timing>();
            for (int r = 0; r < Math.Max(runs, peerRuns); r++)
            {
                if (r < peerRuns)
                {
                    peerTimes.Add(Time([python, Path.Combine(peer, "review_peer.py"), Path.Combine(work, $"peer-{n}"), file], work, peerBudget, error));
                    output.WriteLine($"compare: {n} lots, peer run {r + 1}: {Describe(peerTimes[^1])}");
                }

                ybTimes.Add(Time([tool, "review", file, "--out", Path.Combine(work, $"yb-{n}"), "--quiet"], work, TimeSpan.FromMinutes(30), error));
                output.WriteLine($"compare: {n} lots, YieldBench run {r + 1}: {Describe(ybTimes[^1])}");
            }

            rows.Append(Inv, $"| {n:N0} lots ({Path.GetExtension(file)}) | {Cell(peerTimes, t => t.Wall)} | {Cell(peerTimes, t => t.Cpu)} | {Cell(peerTimes, t => t.PeakMb, "0")} | {Cell(ybTimes, t => t.Wall)} | {Cell(ybTimes, t => t.Cpu)} | {Cell(ybTimes, t => t.PeakMb, "0")} | {Ratio(peerTimes, ybTimes)} |\n");
        }

        // YieldBench alone: the demo review and forecast (bundled with the tool) and the scale set with logs.
        var alone = new StringBuilder();
        alone.Append("| command | wall s (median) | CPU s | peak MB | runs |\n|---|---|---|---|---|\n");
        void Alone(string name, string[] command, int count)
        {
            var t = Enumerable.Range(0, count).Select(_ => Time(command, work, TimeSpan.FromMinutes(30), error)).ToList();
            output.WriteLine($"compare: {name}: {string.Join("; ", t.Select(Describe))}");
            alone.Append(Inv, $"| {name} | {Cell(t, x => x.Wall)} | {Cell(t, x => x.Cpu)} | {Cell(t, x => x.PeakMb, "0")} | {t.Count} |\n");
        }

        if (opts.GetValueOrDefault("alone", "yes") == "yes")
        {
            Alone("review of the demo (222 lots, 135 logs, every chart)", [tool, "review", Path.Combine(root, "demo-data", "history"), "--out", Path.Combine(work, "yb-demo"), "--quiet"], Math.Max(runs, 5));
            Alone("forecast on the demo", [tool, "forecast", "--out", Path.Combine(work, "yb-forecast"), "--quiet"], Math.Max(runs, 5));
            string scale = Path.Combine(work, "scale-100000");
            if (!File.Exists(Path.Combine(scale, "lots.csv")))
            {
                output.WriteLine("compare: generating the scale set (100,000 lots with logs)");
                var gen = Time([Environment.ProcessPath!, .. Environment.ProcessPath!.EndsWith("dotnet", StringComparison.Ordinal) ? new[] { typeof(Compare).Assembly.Location } : [], "gen", "--lots", "100000", "--dir", scale], work, TimeSpan.FromMinutes(20), error);
                if (gen.Exit != 0)
                {
                    error.WriteLine("compare: generating the scale set failed");
                    return 1;
                }
            }

            Alone("review of 100,000 lots with 1,055,364 log readings (.csv)", [tool, "review", scale, "--out", Path.Combine(work, "yb-scale"), "--quiet"], runs);
        }

        string load = File.Exists("/proc/loadavg") ? File.ReadAllText("/proc/loadavg").Trim() : "unknown";
        string text = string.Create(Inv, $"""
            Side by side, whole processes (GNU time: wall; CPU = user + system; peak = maximum resident set), {DateTime.UtcNow:yyyy-MM-dd HH:mm} UTC.
            Machine: {Environment.ProcessorCount} cores, {System.Runtime.InteropServices.RuntimeInformation.OSDescription}, {System.Runtime.InteropServices.RuntimeInformation.FrameworkDescription}; load average at the end: {load}.
            Peer: {python} review_peer.py OUTDIR FILE; YieldBench: {tool} review FILE --out DIR --quiet. Medians of the runs (min–max in brackets).

            {rows}
            {alone}
            """);
        output.Write(text);
        File.WriteAllText(Path.Combine(results, "compare.md"), text);
        output.WriteLine($"compare: results in {Path.Combine(results, "compare.md")}");
        return 0;
    }

    private static string Describe(Timing t) => t.Finished
        ? string.Create(Inv, $"{t.Wall:0.00} s wall, {t.Cpu:0.00} s CPU, {t.PeakMb:0} MB{(t.Exit != 0 ? $", exit {t.Exit}" : "")}")
        : string.Create(Inv, $"stopped at the budget after {t.Wall:0} s");

    private static string Cell(IReadOnlyList<Timing> times, Func<Timing, double> get, string format = "0.00")
    {
        if (times.Count == 0)
        {
            return "—";
        }

        var v = times.Select(get).Order().ToArray();
        string median = Median(v).ToString(format, Inv);
        string note = times.Any(t => !t.Finished) ? " (stopped at the budget)" : times.Any(t => t.Exit != 0) ? $" (failed: exit {times.First(t => t.Exit != 0).Exit})" : string.Empty;
        return v.Length == 1 ? median + note : string.Create(Inv, $"{median} ({v[0].ToString(format, Inv)}–{v[^1].ToString(format, Inv)}){note}");
    }

    private static string Ratio(IReadOnlyList<Timing> peer, IReadOnlyList<Timing> yb)
    {
        double ratio = Median(peer.Select(t => t.Wall).ToArray()) / Median(yb.Select(t => t.Wall).ToArray());
        // A peer run that failed or was stopped gives only a lower bound: YieldBench is at least this much faster.
        bool bound = peer.Any(t => !t.Finished || t.Exit != 0);
        return string.Create(Inv, $"{(bound ? "≥ " : "")}{ratio:0.0}×{(bound ? " (the peer did not finish)" : "")}");
    }

    private static double Median(double[] v)
    {
        var s = v.Order().ToArray();
        return s.Length == 0 ? double.NaN : s.Length % 2 == 1 ? s[s.Length / 2] : 0.5 * (s[(s.Length / 2) - 1] + s[s.Length / 2]);
    }

    /// <summary>Runs a command under GNU time within a budget; its output is kept in a log beside the work folder.</summary>
    private static Timing Time(string[] command, string work, TimeSpan budget, TextWriter error)
    {
        string stats = Path.Combine(work, "time.txt");
        File.Delete(stats);
        var start = new ProcessStartInfo("/usr/bin/time") { UseShellExecute = false, RedirectStandardOutput = true, RedirectStandardError = true, WorkingDirectory = work };
        foreach (string a in new[] { "-f", "%e %U %S %M", "-o", stats }.Concat(command))
        {
            start.ArgumentList.Add(a);
        }

        using var p = Process.Start(start) ?? throw new InvalidOperationException("Could not start /usr/bin/time.");
        var stdout = p.StandardOutput.ReadToEndAsync();
        var stderr = p.StandardError.ReadToEndAsync();
        var watch = Stopwatch.StartNew();
        if (!p.WaitForExit(budget))
        {
            p.Kill(entireProcessTree: true);
            p.WaitForExit();
            return new Timing(watch.Elapsed.TotalSeconds, double.NaN, double.NaN, -1, false);
        }

        p.WaitForExit();
        File.AppendAllText(Path.Combine(work, "commands.log"), string.Join(' ', command) + "\n" + stdout.Result + stderr.Result + "\n");
        var last = File.ReadAllLines(stats).Last(l => l.Length > 0).Split(' ');
        if (p.ExitCode != 0)
        {
            error.WriteLine($"compare: exit {p.ExitCode}: {string.Join(' ', command)} (output in {Path.Combine(work, "commands.log")})");
        }

        return new Timing(
            double.Parse(last[0], Inv),
            double.Parse(last[1], Inv) + double.Parse(last[2], Inv),
            double.Parse(last[3], Inv) / 1024,
            p.ExitCode,
            true);
    }
}
