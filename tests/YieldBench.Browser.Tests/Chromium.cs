using System.Diagnostics;
using System.Net.Http;
using System.Text.Json;

namespace YieldBench.Browser.Tests;

/// <summary>
/// A headless Chromium started for the tests, with a fresh profile and no network services, reached over its DevTools
/// port. Only a browser already installed is used (Debian's <c>chromium</c>); nothing is downloaded.
/// </summary>
internal sealed class Chromium : IAsyncDisposable
{
    /// <summary>Set to 1 (as .ci/run does) to fail instead of skip when no browser is installed.</summary>
    public const string RequireVariable = "YIELDBENCH_REQUIRE_BROWSER";

    /// <summary>Names a browser executable to use instead of looking for one on PATH.</summary>
    public const string ExecutableVariable = "YIELDBENCH_CHROMIUM";

    private readonly Process process;
    private readonly string profile;
    private readonly List<string> log = [];

    private Chromium(Process process, string profile)
    {
        this.process = process;
        this.profile = profile;
    }

    /// <summary>The browser's own messages on stderr so far (for a failure message).</summary>
    public string Log
    {
        get
        {
            lock (log)
            {
                return string.Join("\n", log.TakeLast(40));
            }
        }
    }

    /// <summary>The browser to use: <see cref="ExecutableVariable"/>, else chromium (or a Chrome) on PATH; null when none.</summary>
    public static string? Find()
    {
        if (Environment.GetEnvironmentVariable(ExecutableVariable) is { Length: > 0 } given)
        {
            return File.Exists(given) ? given : null;
        }

        var folders = (Environment.GetEnvironmentVariable("PATH") ?? string.Empty).Split(Path.PathSeparator, StringSplitOptions.RemoveEmptyEntries);
        foreach (string name in new[] { "chromium", "chromium-browser", "google-chrome", "google-chrome-stable" })
        {
            foreach (string folder in folders)
            {
                string path = Path.Combine(folder, name);
                if (File.Exists(path))
                {
                    return path;
                }
            }
        }

        return null;
    }

    /// <summary>Starts the browser headless and returns it once its DevTools port answers.</summary>
    public static async Task<Chromium> Start(string executable)
    {
        string profile = Directory.CreateTempSubdirectory("yb-chromium-").FullName;
        var start = new ProcessStartInfo(executable)
        {
            RedirectStandardError = true,
            RedirectStandardOutput = true,
            UseShellExecute = false,
        };
        foreach (string a in new[]
        {
            "--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking",
            "--disable-component-update", "--disable-sync", "--disable-extensions", "--disable-default-apps", "--hide-scrollbars",
            "--mute-audio", "--user-data-dir=" + profile, "--remote-debugging-port=0", "--remote-allow-origins=*", "about:blank",
        })
        {
            start.ArgumentList.Add(a);
        }

        var process = Process.Start(start) ?? throw new InvalidOperationException($"{executable} did not start.");
        var browser = new Chromium(process, profile);
        var listening = new TaskCompletionSource<string>(TaskCreationOptions.RunContinuationsAsynchronously);
        process.ErrorDataReceived += (_, e) =>
        {
            if (e.Data is null)
            {
                listening.TrySetException(new InvalidOperationException("The browser closed its error stream before it listened:\n" + browser.Log));
                return;
            }

            lock (browser.log)
            {
                browser.log.Add(e.Data);
            }

            const string Marker = "DevTools listening on ";
            int at = e.Data.IndexOf(Marker, StringComparison.Ordinal);
            if (at >= 0)
            {
                listening.TrySetResult(e.Data[(at + Marker.Length)..].Trim());
            }
        };
        process.OutputDataReceived += (_, _) => { };
        process.BeginErrorReadLine();
        process.BeginOutputReadLine();
        try
        {
            string browserSocket = await listening.Task.WaitAsync(TimeSpan.FromSeconds(90));
            browser.Port = new Uri(browserSocket).Port;
            return browser;
        }
        catch
        {
            await browser.DisposeAsync();
            throw;
        }
    }

    /// <summary>The DevTools port.</summary>
    public int Port { get; private set; }

    /// <summary>Opens a DevTools session on the browser's first page.</summary>
    public async Task<DevTools> OpenPage()
    {
        using var http = new HttpClient { Timeout = TimeSpan.FromSeconds(30) };
        for (int attempt = 0; ; attempt++)
        {
            string list = await http.GetStringAsync(new Uri($"http://127.0.0.1:{Port}/json/list"));
            using var targets = JsonDocument.Parse(list);
            foreach (var t in targets.RootElement.EnumerateArray())
            {
                if (t.GetProperty("type").GetString() == "page" && t.TryGetProperty("webSocketDebuggerUrl", out var url))
                {
                    return await DevTools.Connect(new Uri(url.GetString()!));
                }
            }

            if (attempt > 50)
            {
                throw new InvalidOperationException("The browser has no page to drive:\n" + list);
            }

            await Task.Delay(200);
        }
    }

    public async ValueTask DisposeAsync()
    {
        try
        {
            if (!process.HasExited)
            {
                process.Kill(entireProcessTree: true);
                await process.WaitForExitAsync().WaitAsync(TimeSpan.FromSeconds(20));
            }
        }
        catch (Exception e) when (e is InvalidOperationException or TimeoutException or System.ComponentModel.Win32Exception)
        {
            // Already gone, or it would not die in time; the profile folder may then stay behind in the temp folder.
        }

        process.Dispose();
        try
        {
            Directory.Delete(profile, recursive: true);
        }
        catch (IOException)
        {
        }
        catch (UnauthorizedAccessException)
        {
        }
    }
}
