using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;

namespace YieldBench.Core.Review;

/// <summary>Runs every analysis on a season set and assembles the <see cref="ReviewResult"/>. Pure: no I/O.</summary>
public static class ReviewRunner
{
    /// <summary>Runs the review.</summary>
    public static ReviewResult Run(SeasonSet inputs, ReviewSettings settings, string toolVersion)
    {
        ArgumentNullException.ThrowIfNull(inputs);
        ArgumentNullException.ThrowIfNull(settings);
        var lots = inputs.Lots.Select(l => ConversionFactors.For(l, settings.SugarModel)).ToArray();
        return new ReviewResult { Inputs = inputs, Settings = settings, Lots = lots, ToolVersion = toolVersion };
    }
}
