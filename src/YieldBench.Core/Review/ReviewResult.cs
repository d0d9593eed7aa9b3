using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;

namespace YieldBench.Core.Review;

/// <summary>
/// The single, immutable result of a review. Renderers only lay out what this holds; they never compute statistics.
/// Sections are added here as the analyses that fill them are built.
/// </summary>
public sealed record ReviewResult
{
    /// <summary>What intake produced (lots, logs, issues, accounting, files).</summary>
    public required SeasonSet Inputs { get; init; }

    /// <summary>Settings the review ran with.</summary>
    public required ReviewSettings Settings { get; init; }

    /// <summary>Every lot used, with its conversion measures, in input order.</summary>
    public required IReadOnlyList<LotConversion> Lots { get; init; }

    /// <summary>The tool version that produced the review.</summary>
    public required string ToolVersion { get; init; }
}
