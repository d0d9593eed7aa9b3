using YieldBench.Core.Conversion;
using YieldBench.Core.HouseFactor;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Review.Strains;
using YieldBench.Core.Units;

namespace YieldBench.Core.Review;

/// <summary>Settings of a review. Every default is documented in docs/methods.md with its source.</summary>
public sealed record ReviewSettings
{
    /// <summary>Seed for every random step (bootstrap, model training); same seed, same numbers.</summary>
    public int Seed { get; init; } = 20261;

    /// <summary>How fermentable sugar is obtained from °Brix.</summary>
    public SugarModel SugarModel { get; init; } = SugarModel.Default;

    /// <summary>Groupings, interval and odd-lot detector settings of the strain review.</summary>
    public StrainReviewSettings Strains { get; init; } = new();

    /// <summary>House-factor candidates, label regime, threshold and planner targets.</summary>
    public HouseFactorSettings HouseFactor { get; init; } = new();

    /// <summary>Kinetics thresholds (dryness, stalls, temperatures, heat constants).</summary>
    public KineticsSettings Kinetics { get; init; } = KineticsSettings.Default;

    /// <summary>
    /// The unit the outputs show temperatures in (charts, workbook, page, console, data files); the review itself
    /// computes and keeps °C.
    /// </summary>
    public TemperatureUnit TemperatureUnit { get; init; } = TemperatureUnit.Celsius;
}
