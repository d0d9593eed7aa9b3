namespace YieldBench.Core.HouseFactor;

/// <summary>
/// Prediction intervals from held-out errors (error = actual − predicted, % v/v), by the finite-sample quantile of
/// split-conformal and jackknife prediction (Vovk, Gammerman &amp; Shafer 2005, <i>Algorithmic Learning in a Random
/// World</i>; Lei, G'Sell, Rinaldo, Tibshirani &amp; Wasserman 2018, <i>JASA</i> 113:1094; Barber, Candès, Ramdas &amp;
/// Tibshirani 2021, <i>Ann. Statist.</i> 49:486): with n sorted errors r₍₁₎ ≤ … ≤ r₍ₙ₎, the upper bound at
/// probability p is r₍⌈(n+1)p⌉₎ and the lower bound at p is r₍⌊(n+1)p⌋₎. When that order statistic does not exist
/// (too few errors for the level asked) the bound is NaN and callers say so.
/// </summary>
public static class HeldOutErrors
{
    /// <summary>Upper bound at probability p ∈ (0, 1) of the sorted errors, or NaN when n is too small.</summary>
    public static double UpperOfSorted(IReadOnlyList<double> sorted, double p)
    {
        ArgumentNullException.ThrowIfNull(sorted);
        CheckP(p);
        int n = sorted.Count;
        int k = (int)Math.Ceiling(((n + 1) * p) - 1e-9);
        return k >= 1 && k <= n ? sorted[k - 1] : double.NaN;
    }

    /// <summary>Lower bound at probability p ∈ (0, 1) of the sorted errors, or NaN when n is too small.</summary>
    public static double LowerOfSorted(IReadOnlyList<double> sorted, double p)
    {
        ArgumentNullException.ThrowIfNull(sorted);
        CheckP(p);
        int n = sorted.Count;
        int k = (int)Math.Floor(((n + 1) * p) + 1e-9);
        return k >= 1 && k <= n ? sorted[k - 1] : double.NaN;
    }

    /// <summary>Fewest errors for which a two-sided interval at <paramref name="level"/> exists: ⌈2/(1 − level)⌉ − 1.</summary>
    public static int MinimumForTwoSided(double level)
    {
        CheckP(level);
        return (int)Math.Ceiling((2.0 / (1 - level)) - 1e-9) - 1;
    }

    /// <summary>Fewest errors for which a one-sided bound at <paramref name="confidence"/> exists: ⌈1/(1 − c)⌉ − 1.</summary>
    public static int MinimumForOneSided(double confidence)
    {
        CheckP(confidence);
        return (int)Math.Ceiling((1.0 / (1 - confidence)) - 1e-9) - 1;
    }

    private static void CheckP(double p)
    {
        if (double.IsNaN(p) || p <= 0 || p >= 1)
        {
            throw new ArgumentOutOfRangeException(nameof(p), p, "A probability for an interval must be strictly between 0 and 1.");
        }
    }
}

/// <summary>A predicted alcohol with its two-sided prediction intervals (NaN bounds when the errors are too few).</summary>
/// <param name="Predicted">Point prediction, % v/v.</param>
/// <param name="Low80">Lower bound of the 80 % interval, % v/v.</param>
/// <param name="High80">Upper bound of the 80 % interval, % v/v.</param>
/// <param name="Low95">Lower bound of the 95 % interval, % v/v.</param>
/// <param name="High95">Upper bound of the 95 % interval, % v/v.</param>
/// <param name="ErrorCount">Held-out errors the intervals rest on.</param>
public sealed record AlcoholEstimate(double Predicted, double Low80, double High80, double Low95, double High95, int ErrorCount)
{
    /// <summary>The estimate at <paramref name="predicted"/> with intervals from the sorted held-out errors.</summary>
    public static AlcoholEstimate From(double predicted, IReadOnlyList<double> sortedErrors)
    {
        ArgumentNullException.ThrowIfNull(sortedErrors);
        return new AlcoholEstimate(
            predicted,
            predicted + HeldOutErrors.LowerOfSorted(sortedErrors, 0.10),
            predicted + HeldOutErrors.UpperOfSorted(sortedErrors, 0.90),
            predicted + HeldOutErrors.LowerOfSorted(sortedErrors, 0.025),
            predicted + HeldOutErrors.UpperOfSorted(sortedErrors, 0.975),
            sortedErrors.Count);
    }
}
