using System.Diagnostics;
using System.Security.Cryptography;

namespace YieldBench.Cli.Tests;

/// <summary>
/// The tool run as a user runs it, in a process of its own, and stopped part way: by a stop signal (SIGTERM, handled
/// as Ctrl-C's SIGINT is) and by a kill
/// that gives it no chance to tidy up (SIGKILL). The report folder must be whole or untouched whatever the moment.
/// </summary>
public sealed class KilledRunTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("yieldbench-killed-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public void A_review_stopped_at_any_moment_leaves_the_report_folder_whole_or_as_it_was()
    {
        if (OperatingSystem.IsWindows())
        {
            return; // Signals are POSIX; the staging swap itself is tested in-process on every platform.
        }

        // Given a finished report of the demo (every output is deterministic, so a finished rerun is byte-identical)
        string report = Path.Combine(_dir, "report");
        var (first, firstSaid) = RunToEnd("review", "--out", report, "--quiet");
        Assert.True(first == ExitCodes.Success, $"exit {first}: {firstSaid}");
        var before = Snapshot(report);
        Assert.Contains("report.xlsx", before.Keys);

        // When a review is asked to stop part way (just after it starts reading) by SIGTERM, which takes the same path as
        // Ctrl-C's SIGINT (a test run in the background inherits SIGINT ignored, as the shell sets it for background jobs)
        var (stopped, said) = Stop("SIGTERM", TimeSpan.FromSeconds(0.2));

        // Then it says so in plain words, with no stack trace, and ends as the signal asks
        Assert.True(stopped == 143, $"exit {stopped} after SIGTERM; standard error: {said}");
        Assert.Contains(YieldBenchApp.StoppedMessage("a stop signal"), Cli.Flat(said), StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", said, StringComparison.Ordinal);
        AssertWholeOrAsItWas(report, before);

        // And reviews killed outright at several moments leave it whole or as it was each time
        foreach (double seconds in new[] { 0, 0.5, 1, 2, 3, 5 })
        {
            var (killed, killedSaid) = Stop("SIGKILL", TimeSpan.FromSeconds(seconds));
            // 137 killed; -1 finished before the moment came; 0 finished in the instant between that check and the
            // signal (a finished process can still be signalled until it is reaped) — the folder is checked either way
            Assert.True(killed is 137 or -1 or 0, $"exit {killed} after {seconds} s: {killedSaid}");
            AssertWholeOrAsItWas(report, before);
        }

        // And the next run puts back a report a kill left set aside, and clears away every unfinished copy
        var (last, lastSaid) = RunToEnd("review", "--out", report, "--quiet");
        Assert.True(last == ExitCodes.Success, $"exit {last}: {lastSaid}");
        Assert.Equal(before, Snapshot(report));
        Assert.Equal(["report"], Directory.GetFileSystemEntries(_dir).Select(Path.GetFileName));
    }

    private void AssertWholeOrAsItWas(string report, Dictionary<string, string> before)
    {
        if (Directory.Exists(report))
        {
            var now = Snapshot(report);
            var differ = before.Keys.Union(now.Keys).Where(k => before.GetValueOrDefault(k) != now.GetValueOrDefault(k)).Order(StringComparer.Ordinal).ToArray();
            Assert.True(differ.Length == 0, "files that differ from the finished report: " + string.Join(", ", differ)
                + "; beside it: " + string.Join(", ", Directory.GetFileSystemEntries(_dir).Select(Path.GetFileName)));
        }
        else
        {
            // Killed between the two renames of the swap: the previous report waits under its hidden name.
            string aside = Assert.Single(Directory.GetDirectories(_dir, ".report.yieldbench-previous-*"));
            Assert.Equal(before, Snapshot(aside));
        }
    }

    /// <summary>Every file below <paramref name="folder"/> by relative path, with its SHA-256.</summary>
    private static Dictionary<string, string> Snapshot(string folder) =>
        Directory.EnumerateFiles(folder, "*", SearchOption.AllDirectories)
            .ToDictionary(f => Path.GetRelativePath(folder, f).Replace('\\', '/'), f => Convert.ToHexString(SHA256.HashData(File.ReadAllBytes(f))));

    private (int Exit, string Error) RunToEnd(params string[] args)
    {
        using var process = Start(args);
        _ = process.StandardOutput.ReadToEndAsync();
        var error = process.StandardError.ReadToEndAsync();
        Assert.True(process.WaitForExit(TimeSpan.FromMinutes(5)), "the review took more than 5 minutes");
        return (process.ExitCode, error.Result);
    }

    /// <summary>
    /// Starts a review of the demo and sends <paramref name="signal"/> <paramref name="after"/> the review said its first
    /// stage (so the tool is running its own code, whatever the machine's load), unless it finished before.
    /// </summary>
    private (int Exit, string Error) Stop(string signal, TimeSpan after)
    {
        using var process = Start("review", "--out", Path.Combine(_dir, "report"));
        var error = new System.Text.StringBuilder();
        using var started = new ManualResetEventSlim();
        process.ErrorDataReceived += (_, e) =>
        {
            if (e.Data is null)
            {
                return;
            }

            lock (error)
            {
                error.AppendLine(e.Data);
            }

            if (e.Data.StartsWith("review: ", StringComparison.Ordinal))
            {
                started.Set();
            }
        };
        process.BeginErrorReadLine();
        _ = process.StandardOutput.ReadToEndAsync();
        bool running = started.Wait(TimeSpan.FromMinutes(2)) && !process.WaitForExit(after);
        if (running)
        {
            Assert.Equal(0, Kill(process.Id, signal == "SIGTERM" ? 15 : 9));
        }

        Assert.True(process.WaitForExit(TimeSpan.FromMinutes(5)), "the review did not stop");
        process.WaitForExit();
        lock (error)
        {
            return (running ? process.ExitCode : -1, error.ToString());
        }
    }

    /// <summary>POSIX kill(2): sends a signal (15 SIGTERM, 9 SIGKILL) without needing a kill program on the machine.</summary>
    [System.Runtime.InteropServices.DllImport("libc", EntryPoint = "kill", SetLastError = true)]
    private static extern int Kill(int pid, int signal);

    private Process Start(params string[] args)
    {
        // The tool as built beside the tests (yieldbench.dll, with the demo data copied next to it).
        var start = new ProcessStartInfo("dotnet")
        {
            WorkingDirectory = _dir,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        start.ArgumentList.Add(typeof(YieldBenchApp).Assembly.Location);
        foreach (string a in args)
        {
            start.ArgumentList.Add(a);
        }

        return Process.Start(start)!;
    }
}
