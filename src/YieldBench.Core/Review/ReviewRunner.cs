using YieldBench.Core.Conversion;
using YieldBench.Core.HouseFactor;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Review.Strains;

namespace YieldBench.Core.Review;

/// <summary>Runs every analysis on a season set and assembles the <see cref="ReviewResult"/>. Pure: no I/O.</summary>
public static class ReviewRunner
{
    /// <summary>
    /// The review stages, in the order progress reports them. Kinetics starts beside the strain review; the house
    /// factor starts after it, because the lots the strain review flags as likely errors or not dry are left out of it
    /// (by default), and it is reported last, when the review waits for what is left of it.
    /// </summary>
    public static IReadOnlyList<string> Stages { get; } = ["conversion factors", "strain review", "kinetics", "house factor"];

    /// <summary>Runs the review.</summary>
    /// <param name="inputs">What intake produced.</param>
    /// <param name="settings">Review settings.</param>
    /// <param name="toolVersion">Version recorded in the outputs.</param>
    /// <param name="extraCandidates">House-factor candidates from outside Core (the multi-variable model); may be empty.</param>
    /// <param name="progress">Told the name of each stage as it starts; may be null.</param>
    public static ReviewResult Run(
        SeasonSet inputs,
        ReviewSettings settings,
        string toolVersion,
        IReadOnlyList<ICandidateTrainer>? extraCandidates = null,
        IProgress<string>? progress = null)
    {
        ArgumentNullException.ThrowIfNull(inputs);
        ArgumentNullException.ThrowIfNull(settings);
        progress?.Report(Stages[0]);
        var lots = inputs.Lots.Select(l => ConversionFactors.For(l, settings.SugarModel)).ToArray();

        // The analyses share only the (immutable) lots, and each is seeded on its own, so running kinetics beside the
        // strain review and the house factor gives the same results as running it after them.
        progress?.Report(Stages[1]);
        var kineticsTask = inputs.Logs.Count > 0
            ? Task.Run<KineticsReview?>(() => KineticsAnalysis.Run(lots, inputs.Logs, settings.Kinetics with { SentenceUnit = settings.TemperatureUnit }))
            : Task.FromResult<KineticsReview?>(null);
        var strains = StrainReviewer.Run(lots, settings.Strains, settings.Seed, settings.SugarModel);
        if (inputs.Logs.Count > 0)
        {
            progress?.Report(Stages[2]);
        }

        progress?.Report(Stages[3]);
        var house = HouseFactorAnalysis.Run(lots, strains.Flags, settings.HouseFactor, extraCandidates ?? [], settings.Seed);
        var kinetics = kineticsTask.GetAwaiter().GetResult();

        var lotReviews = LotReviews.Build(lots, strains, kinetics, out var followUps, settings.TemperatureUnit);
        var figures = ReviewFigures.Build(lots, strains, kinetics, house.Planning);
        return new ReviewResult
        {
            Inputs = inputs,
            Settings = settings,
            Lots = lots,
            Strains = strains,
            HouseFactor = house,
            Kinetics = kinetics,
            LotReviews = lotReviews,
            Findings = lotReviews.Select(l => l.Finding).OfType<LotFinding>().OrderByDescending(f => f.Severity).ThenBy(f => f.Key).ToArray(),
            FollowUps = followUps,
            Figures = figures,
            Overview = ReviewOverview.Build(inputs, settings.HouseFactor, strains, house, kinetics, lotReviews, figures),
            ToolVersion = toolVersion,
        };
    }
}
