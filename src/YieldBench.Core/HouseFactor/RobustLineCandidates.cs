using YieldBench.Core.Conversion;
using YieldBench.Core.Statistics;

namespace YieldBench.Core.HouseFactor;

/// <summary>
/// abv = b × °Brix with b from Huber M-estimation through the origin (<see cref="RobustRegression.Huber"/>, k = 1.345,
/// the MASS <c>rlm</c> algorithm): a pooled factor in which lots with large residuals get less weight. With a single
/// training lot the factor is that lot's own ratio.
/// </summary>
public sealed class RobustOriginLineCandidate : ICandidateTrainer
{
    /// <inheritdoc />
    public string Id => "pooled-huber-origin";

    /// <inheritdoc />
    public string Name => "Pooled robust line through the origin (Huber)";

    /// <inheritdoc />
    public string Description => "final alcohol = factor × starting °Brix, the factor fitted to all lots by Huber regression so that odd lots weigh less.";

    /// <inheritdoc />
    public int Complexity => 1;

    /// <inheritdoc />
    public bool IsCostly => true;

    /// <inheritdoc />
    public IAbvPredictor Train(IReadOnlyList<LotConversion> lots, int seed)
    {
        ArgumentNullException.ThrowIfNull(lots);
        if (lots.Count < 2)
        {
            return SugarLines.Single(0, lots[0].AbvPerBrix, lots.Count);
        }

        var design = new double[lots.Count, 1];
        for (int i = 0; i < lots.Count; i++)
        {
            design[i, 0] = lots[i].EffectiveStartingBrix;
        }

        var fit = RobustRegression.Huber(design, lots.Select(l => l.Lot.FinalAlcohol.PercentVolume).ToArray(), ["starting_brix"]);
        return SugarLines.Single(0, fit.Coefficients[0], lots.Count);
    }
}

/// <summary>
/// abv = a + b × °Brix by Theil–Sen (<see cref="TheilSen.Fit"/>): the slope is the median pairwise slope, the
/// intercept median(abv) − b·median(°Brix). When every training lot has the same °Brix the slope is undefined and the
/// pooled median factor through the origin is used instead. Above <see cref="MaximumTrainingLots"/> lots the line is
/// fitted to a seeded sample of that many (<see cref="TrainingSample"/>): the median of 2·10⁸ pairwise slopes is as
/// good a slope as the median of 4·10⁹ to a few thousandths of a % v/v at the usual sugars, at a fifth of the cost.
/// </summary>
public sealed class TheilSenLineCandidate : ICandidateTrainer
{
    /// <summary>Most lots the line is fitted to; more are sampled down to this many.</summary>
    public const int MaximumTrainingLots = 20_000;

    /// <inheritdoc />
    public string Id => "pooled-theil-sen";

    /// <inheritdoc />
    public string Name => "Pooled robust line with intercept (Theil–Sen)";

    /// <inheritdoc />
    public string Description => "final alcohol = intercept + slope × starting °Brix, fitted to all lots by Theil–Sen (median of pairwise slopes).";

    /// <inheritdoc />
    public int Complexity => 2;

    /// <inheritdoc />
    public bool IsCostly => true;

    /// <inheritdoc />
    public IAbvPredictor Train(IReadOnlyList<LotConversion> lots, int seed)
    {
        ArgumentNullException.ThrowIfNull(lots);
        int count = lots.Count;
        var fitted = TrainingSample.Of(lots, MaximumTrainingLots, seed);
        var line = TheilSen.Fit(fitted.Select(l => l.EffectiveStartingBrix).ToArray(), fitted.Select(l => l.Lot.FinalAlcohol.PercentVolume).ToArray(), 0.95, seed, withInterval: false);
        return line.IsDefined
            ? SugarLines.Single(line.Intercept, line.Slope, count)
            : SugarLines.Single(0, Descriptive.Median(lots.Select(l => l.AbvPerBrix)), count);
    }
}
