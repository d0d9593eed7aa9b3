namespace YieldBench.Core.Statistics;

/// <summary>
/// Percentile bootstrap intervals (Efron &amp; Tibshirani 1993, ch. 13): resample the values with replacement,
/// take the statistic of each resample, and report the type-7 quantiles (1 − level)/2 and (1 + level)/2 of those
/// statistics. The generator is <see cref="Random"/>(seed), so the same values, resample count and seed give the same
/// interval. Percentile, not BCa: the median's bootstrap distribution is discrete and BCa's acceleration adds little.
/// </summary>
public static class Bootstrap
{
    /// <summary>Largest n resampled literally; above it each resample's median is drawn from its exact law.</summary>
    public const int DirectLimit = 50;

    /// <summary>Fewest resamples accepted: below about 1,000 the tail quantiles of a 95 % interval wander visibly.</summary>
    public const int MinResamples = 200;

    /// <summary>
    /// Percentile bootstrap interval of the median. <paramref name="level"/> in (0, 1), typically 0.95;
    /// <paramref name="resamples"/> ≥ 200 (2,000 or more for reports). Undefined (NaN ends) when there are fewer than
    /// two values; a zero-width interval when all values are equal.
    /// The values are sorted once; a resample's median is then the value at the median of its drawn ranks, because
    /// drawing ranks into a sorted array preserves order. Up to <see cref="DirectLimit"/> values the n ranks of each
    /// resample are drawn (O(resamples · n)). Above it the median rank is drawn directly from its law, in O(1) per
    /// resample: a drawn rank is ⌊n·U⌋ with U uniform, so the m-th smallest of n drawn ranks is ⌊n·U₍ₘ₎⌋ where the
    /// uniform order statistic U₍ₘ₎ ~ Beta(m, n + 1 − m); for even n the next one is U₍ₘ₎ + (1 − U₍ₘ₎)·Beta(1, n − m).
    /// Both ways sample the same bootstrap distribution; only the random stream differs.
    /// </summary>
    public static Interval MedianInterval(IEnumerable<double> values, int resamples, double level, int seed)
    {
        if (resamples < MinResamples)
        {
            throw new ArgumentOutOfRangeException(nameof(resamples), resamples, $"Use at least {MinResamples} resamples.");
        }

        CheckLevel(level);
        var x = Descriptive.ToSortedArray(values);
        int n = x.Length;
        if (n < 2)
        {
            return Interval.Undefined(level);
        }

        var random = new Random(seed);
        var medians = n <= DirectLimit ? ResampledMedians(x, resamples, random) : MedianLawMedians(x, resamples, random);
        double tail = (1 - level) / 2;

        // The two quantiles by selection (Descriptive.Quantile): the values a sort would give, without sorting.
        return new Interval(Descriptive.Quantile(medians, tail), Descriptive.Quantile(medians, 1 - tail), level);
    }

    private static double[] ResampledMedians(double[] x, int resamples, Random random)
    {
        int n = x.Length;
        var counts = new int[n];
        var medians = new double[resamples];
        for (int b = 0; b < resamples; b++)
        {
            // The drawn ranks are counted, not stored and selected: their middle one(s) are where the running count
            // first passes the middle (the same ranks a selection gives, in O(n) with no reordering).
            Array.Clear(counts);
            for (int i = 0; i < n; i++)
            {
                counts[random.Next(n)]++;
            }

            int upper = RankAt(counts, n / 2);
            medians[b] = n % 2 == 1 ? x[upper] : 0.5 * (x[RankAt(counts, (n / 2) - 1)] + x[upper]);
        }

        return medians;
    }

    /// <summary>The k-th smallest (0-based) of the ranks counted in <paramref name="counts"/>.</summary>
    private static int RankAt(int[] counts, int k)
    {
        int seen = 0;
        for (int r = 0; r < counts.Length; r++)
        {
            seen += counts[r];
            if (seen > k)
            {
                return r;
            }
        }

        throw new InvalidOperationException("Fewer ranks were counted than asked for.");
    }

    private static double[] MedianLawMedians(double[] x, int resamples, Random random)
    {
        int n = x.Length;
        int m = (n + 1) / 2;
        var medians = new double[resamples];
        int Rank(double u) => Math.Min(n - 1, (int)Math.Floor(n * u));
        for (int b = 0; b < resamples; b++)
        {
            double u = MathNet.Numerics.Distributions.Beta.Sample(random, m, n + 1 - m);
            if (n % 2 == 1)
            {
                medians[b] = x[Rank(u)];
            }
            else
            {
                double next = u + ((1 - u) * MathNet.Numerics.Distributions.Beta.Sample(random, 1, n - m));
                medians[b] = 0.5 * (x[Rank(u)] + x[Rank(next)]);
            }
        }

        return medians;
    }

    internal static void CheckLevel(double level)
    {
        if (double.IsNaN(level) || level <= 0 || level >= 1)
        {
            throw new ArgumentOutOfRangeException(nameof(level), level, "A confidence level must be between 0 and 1, e.g. 0.95.");
        }
    }
}
