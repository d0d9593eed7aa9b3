using YieldBench.Core.Conversion;
using YieldBench.Core.HouseFactor;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Review.Strains;

namespace YieldBench.Core.Review;

/// <summary>
/// The single, immutable result of a review. Renderers only lay out what this holds; they compute no statistics, joins
/// or orders (the per-lot view, the figures and the overview are here for them).
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

    /// <summary>Each lot's whole review (measures, robust z, flags, kinetics, worst severity), in the order of <see cref="Lots"/>.</summary>
    public required IReadOnlyList<LotReview> LotReviews { get; init; }

    /// <summary>Every follow-up item: the strain review's flags, then the kinetics follow-ups (<see cref="KineticsFollowUps"/>).</summary>
    public required IReadOnlyList<LotFlag> FollowUps { get; init; }

    /// <summary>One line per lot to look at: most serious first, then by season and lot.</summary>
    public required IReadOnlyList<LotFinding> Findings { get; init; }

    /// <summary>The strain order, box-plot numbers, ranking and strain courses the renderers lay out.</summary>
    public required ReviewFigures Figures { get; init; }

    /// <summary>The review at a glance: headline numbers and plain sentences, format-neutral.</summary>
    public required ReviewOverview Overview { get; init; }

    /// <summary>The tool version that produced the review.</summary>
    public required string ToolVersion { get; init; }
}
