using YieldBench.Core.Conversion;
using YieldBench.Core.HouseFactor;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Review.Strains;

namespace YieldBench.Core.Review;

/// <summary>
/// The single, immutable result of a review. Renderers only lay out what this holds; they never compute statistics.
/// </summary>
public sealed record ReviewResult
{
    /// <summary>What intake produced (lots, logs, issues, accounting, files).</summary>
    public required SeasonSet Inputs { get; init; }

    /// <summary>Settings the review ran with.</summary>
    public required ReviewSettings Settings { get; init; }

    /// <summary>Every lot used, with its conversion measures, in input order.</summary>
    public required IReadOnlyList<LotConversion> Lots { get; init; }

    /// <summary>Group summaries, the strain comparison, per-lot robust scores and odd-lot flags.</summary>
    public required StrainReview Strains { get; init; }

    /// <summary>The house-factor candidates, backtests, recommendation and planner table.</summary>
    public required HouseFactorReview HouseFactor { get; init; }

    /// <summary>Kinetics and heat of the lots that have a fermentation log; null when no log was read.</summary>
    public KineticsReview? Kinetics { get; init; }

    /// <summary>The tool version that produced the review.</summary>
    public required string ToolVersion { get; init; }
}
