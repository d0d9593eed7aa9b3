namespace YieldBench.Scenario;

/// <summary>Settings of a scenario generation. The defaults make the demo scenario.</summary>
public sealed record ScenarioOptions
{
    /// <summary>Seed of every random draw.</summary>
    public ulong Seed { get; init; } = 20231;

    /// <summary>The seasons to make.</summary>
    public IReadOnlyList<SeasonProfile> Seasons { get; init; } = Catalog.DemoSeasons;

    /// <summary>Share of lots (besides probe lots) with a twice-daily hand-read fermentation log, 0–1.</summary>
    public double LogShare { get; init; } = 0.6;

    /// <summary>Lots per season whose log is a dense probe record (every 15 minutes).</summary>
    public int ProbeLotsPerSeason { get; init; } = 1;

    /// <summary>When true, the demo's planted cases are placed (needs the demo seasons 2023–2025).</summary>
    public bool PlantCases { get; init; } = true;

    /// <summary>When true, the next season's harvest in progress is made as well (needs the demo seasons; see <see cref="ScenarioData.Running"/>).</summary>
    public bool RunningHarvest { get; init; }

    /// <summary>The demo scenario's options.</summary>
    public static ScenarioOptions Demo { get; } = new() { RunningHarvest = true };
}
