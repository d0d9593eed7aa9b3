namespace YieldBench.Cli;

/// <summary>
/// Where the bundled demo sits beside the tool: the finished seasons in demo-data/history (what <c>review</c> reads with
/// no inputs) and the harvest in progress in demo-data/running (what <c>forecast</c> adds). Paths are relative to the
/// tool's folder, so reports name the files "demo-data/history/…" wherever the tool is installed.
/// </summary>
internal static class DemoPaths
{
    /// <summary>The finished seasons and their logs, relative to the tool's folder.</summary>
    public static string History { get; } = Path.Combine("demo-data", "history");

    /// <summary>The harvest in progress, relative to the tool's folder.</summary>
    public static string Running { get; } = Path.Combine("demo-data", "running");

    /// <summary>A demo folder's full path in the tool's folder.</summary>
    public static string Full(string relative) => Path.Combine(AppContext.BaseDirectory, relative);
}
