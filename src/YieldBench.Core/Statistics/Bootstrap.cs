namespace YieldBench.Core.Statistics;

/// <summary>
/// Percentile bootstrap intervals (Efron &amp; Tibshirani 1993, ch. 13): resample the values with replacement,
/// take the statistic of each resample, and report the type-7 quantiles (1 − level)/2 and (1 + level)/2 of those
/// statistics. The generator is <see cref="Random"/>(seed), so the same values, resample count and seed give the same
/// interval. Percentile, not BCa: the median's bootstrap distribution is discrete and BCa's acceleration adds little.
/// </summary>
public static class Bootstrap
{
    /// <summary>Fewest resamples accepted: below about 1,000 the tail quantiles of a 95 % interval wander visibly.</summary>
    public const int MinResamples = 200;

    /// <summary>
    /// Percentile bootstrap interval of the median. <paramref name="level"/> in (0, 1), typically 0.95;
    /// <paramref name="resamples"/> ≥ 200 (2,000 or more for reports). Undefined (NaN ends) when there are fewer than
    /// two values; a zero-width interval when all values are equal.
    /// Cost O(resamples · n): the values are sorted once and each resample's median is the value at the median of
    /// its drawn ranks, because drawing ranks into a sorted array preserves order.
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
        var ranks = new int[n];
        var medians = new double[resamples];
        for (int b = 0; b < resamples; b++)
        {
            for (int i = 0; i < n; i++)
            {
                ranks[i] = random.Next(n);
            }

            if (n % 2 == 1)
            {
                medians[b] = x[SelectInPlace(ranks, n / 2)];
            }
            else
            {
                int upper = SelectInPlace(ranks, n / 2);

                // After selection every rank left of n/2 is at most the upper one; the largest of them is the lower middle.
                int lower = ranks[0];
                for (int i = 1; i < n / 2; i++)
                {
                    lower = Math.Max(lower, ranks[i]);
                }

                medians[b] = 0.5 * (x[lower] + x[upper]);
            }
        }

        Array.Sort(medians);
        double tail = (1 - level) / 2;
        return new Interval(Descriptive.QuantileOfSorted(medians, tail), Descriptive.QuantileOfSorted(medians, 1 - tail), level);
    }

    internal static void CheckLevel(double level)
    {
        if (double.IsNaN(level) || level <= 0 || level >= 1)
        {
            throw new ArgumentOutOfRangeException(nameof(level), level, "A confidence level must be between 0 and 1, e.g. 0.95.");
        }
    }

    /// <summary>Hoare quickselect: puts the k-th smallest (0-based) at index k and returns it.</summary>
    private static int SelectInPlace(int[] a, int k)
    {
        int lo = 0, hi = a.Length - 1;
        while (lo < hi)
        {
            int pivot = a[lo + ((hi - lo) / 2)];
            int i = lo, j = hi;
            while (i <= j)
            {
                while (a[i] < pivot)
                {
                    i++;
                }

                while (a[j] > pivot)
                {
                    j--;
                }

                if (i <= j)
                {
                    (a[i], a[j]) = (a[j], a[i]);
                    i++;
                    j--;
                }
            }

            if (k <= j)
            {
                hi = j;
            }
            else if (k >= i)
            {
                lo = i;
            }
            else
            {
                break;
            }
        }

        return a[k];
    }
}
