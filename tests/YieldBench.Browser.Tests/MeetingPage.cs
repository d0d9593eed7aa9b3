using System.Globalization;
using System.Text.Json.Nodes;
using YieldBench.Cli;

namespace YieldBench.Browser.Tests;

/// <summary>Skips a browser test, with the reason, where no browser is installed (unless <see cref="Chromium.RequireVariable"/> is 1).</summary>
public sealed class BrowserFactAttribute : FactAttribute
{
    public BrowserFactAttribute()
    {
        if (Chromium.Find() is null && Environment.GetEnvironmentVariable(Chromium.RequireVariable) != "1")
        {
            Skip = "No chromium on PATH: install Debian's chromium (apt-get install chromium) to check report.html in a real browser; .ci/run installs it.";
        }
    }
}

/// <summary>
/// Runs the demo review once (as <c>yieldbench review --out DIR</c> would) and opens a headless browser on a page
/// session for the tests of one class. Screenshots and PDFs go to <see cref="Artifacts"/> for a person to look at.
/// </summary>
public sealed class MeetingPage : IAsyncLifetime
{
    /// <summary>Where the screenshot, the PDFs and the measured figures are kept: YIELDBENCH_BROWSER_ARTIFACTS, else a folder beside the tests.</summary>
    public static string Artifacts { get; } = Environment.GetEnvironmentVariable("YIELDBENCH_BROWSER_ARTIFACTS") is { Length: > 0 } a
        ? Path.GetFullPath(a)
        : Path.Combine(AppContext.BaseDirectory, "browser-artifacts");

    private Chromium? browser;

    public string Root { get; } = Directory.CreateTempSubdirectory("yb-browser-").FullName;

    public string Output => Path.Combine(Root, "review");

    public string PagePath => Path.Combine(Output, "report.html");

    public Uri PageUrl => new(PagePath);

    /// <summary>What the review printed.</summary>
    public string Console { get; private set; } = string.Empty;

    public int ExitCode { get; private set; }

    public DevTools Page { get; private set; } = null!;

    public string BrowserLog => browser?.Log ?? string.Empty;

    public async Task InitializeAsync()
    {
        Directory.CreateDirectory(Artifacts);
        var output = new StringWriter(CultureInfo.InvariantCulture);
        var error = new StringWriter(CultureInfo.InvariantCulture);
        ExitCode = YieldBenchApp.Run(["review", "--out", Output], new CliContext(output, error, IsTerminal: false, Root));
        Console = output + error.ToString();
        if (Chromium.Find() is not { } executable)
        {
            return;
        }

        browser = await Chromium.Start(executable);
        Page = await browser.OpenPage();
        foreach (string domain in new[] { "Page", "Runtime", "Log", "Network" })
        {
            await Page.Send(domain + ".enable");
        }
    }

    /// <summary>Fails with a plain reason when no browser could be started (the tests skip before this unless a browser is required).</summary>
    public void RequireBrowser() =>
        Assert.True(browser is not null, $"No chromium on PATH (or in {Chromium.ExecutableVariable}); install Debian's chromium to check report.html in a browser.");

    /// <summary>Sets the viewport, loads the page afresh and returns the event position before the load.</summary>
    public async Task<int> Load(int width = 1280, int height = 720, bool scripts = true)
    {
        await Page.Send("Emulation.setDeviceMetricsOverride", new JsonObject { ["width"] = width, ["height"] = height, ["deviceScaleFactor"] = 1, ["mobile"] = false });
        await Page.Send("Emulation.setScriptExecutionDisabled", new JsonObject { ["value"] = !scripts });
        int mark = Page.EventCount;
        await Page.Send("Page.navigate", new JsonObject { ["url"] = PageUrl.AbsoluteUri });
        await Page.WaitFor("Page.loadEventFired", mark);
        return mark;
    }

    /// <summary>Console errors, uncaught exceptions and error log entries (blocked loads, policy violations) since <paramref name="mark"/>.</summary>
    public IReadOnlyList<string> Errors(int mark) =>
        Page.EventsSince(mark).Select(e => e.Method switch
        {
            "Runtime.exceptionThrown" => "exception: " + e.Params.GetProperty("exceptionDetails"),
            "Runtime.consoleAPICalled" when e.Params.GetProperty("type").GetString() is "error" or "assert" => "console: " + e.Params.GetProperty("args"),
            "Log.entryAdded" when e.Params.GetProperty("entry").GetProperty("level").GetString() == "error" => "log: " + e.Params.GetProperty("entry").GetProperty("text").GetString(),
            _ => null,
        }).OfType<string>().ToArray();

    /// <summary>Every URL the page asked for since <paramref name="mark"/>.</summary>
    public IReadOnlyList<string> Requests(int mark) =>
        Page.EventsSince(mark).Where(e => e.Method == "Network.requestWillBeSent")
            .Select(e => e.Params.GetProperty("request").GetProperty("url").GetString() ?? string.Empty).ToArray();

    public async Task DisposeAsync()
    {
        if (browser is not null)
        {
            await Page.DisposeAsync();
            await browser.DisposeAsync();
        }

        try
        {
            Directory.Delete(Root, recursive: true);
        }
        catch (IOException)
        {
        }
    }
}
