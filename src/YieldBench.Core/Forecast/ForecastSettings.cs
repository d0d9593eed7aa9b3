using System.Globalization;
using YieldBench.Core.Kinetics;

namespace YieldBench.Core.Forecast;

/// <summary>Settings of the in-season forecast. Every default and its source is in docs/methods.md ("In-season forecast").</summary>
public sealed record ForecastSettings
{
    /// <summary>Default settings.</summary>
    public static ForecastSettings Default { get; } = new();

    /// <summary>Central share of the forecast intervals (default 0.80).</summary>
    public double IntervalLevel { get; init; } = 0.80;

    /// <summary>Share of the lot record's starting sugar consumed at the nutrient moment (default 1/3, common practice).</summary>
    public double DepletionShare { get; init; } = 1.0 / 3.0;

    /// <summary>Kinetics settings: dry reading, temperature thresholds, heat of fermentation and must heat capacity.</summary>
    public KineticsSettings Kinetics { get; init; } = KineticsSettings.Default;

    /// <summary>Sugar readings after which each logged lot is cut in the backtest (default 2, 3, 4, 6).</summary>
    public IReadOnlyList<int> BacktestCuts { get; init; } = [2, 3, 4, 6];

    /// <summary>Least season-to-season spread of the log time scale (default 0.10: a season may run about 10 % faster or slower; our definition).</summary>
    public double MinSeasonSpread { get; init; } = 0.10;

    /// <summary>Fewest past lots of a strain for a prior of its own; fewer and the strain is pooled with the others (default 3).</summary>
    public int MinStrainLots { get; init; } = 3;

    /// <summary>Sigmoid form: null chooses the one that fits the history better (median log ratio of residual sums of squares).</summary>
    public SigmoidModel? Model { get; init; }

    /// <summary>Points per axis of the posterior grid (default 11).</summary>
    public int GridPoints { get; init; } = 11;

    /// <summary>Half-width of the posterior grid, in posterior standard deviations (default 4.5).</summary>
    public double GridHalfWidth { get; init; } = 4.5;

    /// <summary>Hours ahead searched for the most informative next reading (default 48).</summary>
    public double NextReadingHorizonHours { get; init; } = 48.0;

    /// <summary>Problems with the settings, as sentences; empty when they are usable.</summary>
    public IReadOnlyList<string> Problems()
    {
        var p = new List<string>(Kinetics.Problems());
        string F(double v) => v.ToString(CultureInfo.InvariantCulture);
        if (!(IntervalLevel > 0 && IntervalLevel < 1))
        {
            p.Add($"IntervalLevel must lie between 0 and 1 (it is {F(IntervalLevel)}).");
        }

        if (!(DepletionShare > 0 && DepletionShare < 1))
        {
            p.Add($"DepletionShare must lie between 0 and 1 (it is {F(DepletionShare)}).");
        }

        if (BacktestCuts.Count == 0 || BacktestCuts.Any(c => c < 1))
        {
            p.Add("BacktestCuts must name one or more reading counts of at least 1.");
        }

        if (!(MinSeasonSpread >= 0) || double.IsInfinity(MinSeasonSpread))
        {
            p.Add($"MinSeasonSpread must be 0 or more (it is {F(MinSeasonSpread)}).");
        }

        if (MinStrainLots < 1)
        {
            p.Add("MinStrainLots must be at least 1.");
        }

        if (GridPoints < 5 || GridPoints > 201)
        {
            p.Add("GridPoints must be between 5 and 201.");
        }

        if (!(GridHalfWidth >= 2 && GridHalfWidth <= 10))
        {
            p.Add("GridHalfWidth must be between 2 and 10 standard deviations.");
        }

        if (!(NextReadingHorizonHours > 0) || double.IsInfinity(NextReadingHorizonHours))
        {
            p.Add("NextReadingHorizonHours must be a positive number.");
        }

        return p;
    }
}
