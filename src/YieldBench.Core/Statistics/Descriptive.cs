namespace YieldBench.Core.Statistics;

/// <summary>
/// Order statistics. Policy for degenerate input (pinned by tests): an empty sample gives NaN; NaN values are
/// not allowed (callers filter them) and throw <see cref="ArgumentException"/>.
/// </summary>
public static class Descriptive
{
    /// <summary>Median of an unsorted sample (copies it). NaN when empty.</summary>
    public static double Median(IEnumerable<double> values)
    {
        var a = values.ToArray();
        foreach (double v in a)
        {
            if (double.IsNaN(v))
            {
                throw new ArgumentException("The sample holds NaN; filter missing values before computing statistics.", nameof(values));
            }
        }

        // Selection instead of a full sort: the same order statistics, O(n) expected.
        return MedianInPlace(a);
    }

    /// <summary>Median of an ascending-sorted array. NaN when empty.</summary>
    public static double MedianOfSorted(IReadOnlyList<double> sorted)
    {
        int n = sorted.Count;
        if (n == 0)
        {
            return double.NaN;
        }

        return n % 2 == 1 ? sorted[n / 2] : 0.5 * (sorted[(n / 2) - 1] + sorted[n / 2]);
    }

    /// <summary>
    /// Quantile by Hyndman–Fan definition 7 (R's default <c>quantile(type = 7)</c>, Excel's QUANTILE.INC):
    /// h = (n − 1)·p, linear interpolation between the order statistics around h. NaN when empty.
    /// </summary>
    public static double QuantileOfSorted(IReadOnlyList<double> sorted, double p)
    {
        if (p is < 0 or > 1 || double.IsNaN(p))
        {
            throw new ArgumentOutOfRangeException(nameof(p), p, "A quantile's probability must be between 0 and 1.");
        }

        int n = sorted.Count;
        if (n == 0)
        {
            return double.NaN;
        }

        double h = (n - 1) * p;
        int lo = (int)Math.Floor(h);
        int hi = Math.Min(lo + 1, n - 1);
        return sorted[lo] + ((h - lo) * (sorted[hi] - sorted[lo]));
    }

    /// <summary>Quantile (Hyndman–Fan type 7) of an unsorted sample.</summary>
    public static double Quantile(IEnumerable<double> values, double p)
    {
        if (p is < 0 or > 1 || double.IsNaN(p))
        {
            throw new ArgumentOutOfRangeException(nameof(p), p, "A quantile's probability must be between 0 and 1.");
        }

        var a = values.ToArray();
        foreach (double v in a)
        {
            RejectNaN(v, nameof(values));
        }

        int n = a.Length;
        if (n == 0)
        {
            return double.NaN;
        }

        // The two order statistics around h by selection, not a sort (the house factor scores some thousand backtests).
        double h = (n - 1) * p;
        int lo = (int)Math.Floor(h);
        double low = SelectInPlace(a, lo);
        double high = lo + 1 < n ? SelectInPlace(a.AsSpan(lo + 1), 0) : low;
        return low + ((h - lo) * (high - low));
    }

    /// <summary>Arithmetic mean. NaN when empty.</summary>
    public static double Mean(IEnumerable<double> values)
    {
        double sum = 0;
        int n = 0;
        foreach (double v in values)
        {
            RejectNaN(v, nameof(values));
            sum += v;
            n++;
        }

        return n == 0 ? double.NaN : sum / n;
    }

    /// <summary>
    /// Sample standard deviation with the n − 1 denominator (R <c>sd</c>, Excel STDEV.S), by the two-pass formula
    /// for accuracy. NaN when fewer than two values; 0 when all values are equal.
    /// </summary>
    public static double StandardDeviation(IEnumerable<double> values)
    {
        var a = values as IReadOnlyList<double> ?? values.ToArray();
        if (a.Count < 2)
        {
            foreach (double v in a)
            {
                RejectNaN(v, nameof(values));
            }

            return double.NaN;
        }

        double mean = Mean(a);
        double ss = 0;
        foreach (double v in a)
        {
            double d = v - mean;
            ss += d * d;
        }

        return Math.Sqrt(ss / (a.Count - 1));
    }

    /// <summary>
    /// Interquartile range Q3 − Q1 with quantiles of Hyndman–Fan type 7. NaN when empty; 0 for one value.
    /// </summary>
    public static double InterquartileRange(IEnumerable<double> values)
    {
        var a = ToSortedArray(values);
        return QuantileOfSorted(a, 0.75) - QuantileOfSorted(a, 0.25);
    }

    private static void RejectNaN(double v, string name)
    {
        if (double.IsNaN(v))
        {
            throw new ArgumentException("The sample holds NaN; filter missing values before computing statistics.", name);
        }
    }

    /// <summary>
    /// Median of <paramref name="scratch"/> by selection (Hoare's quickselect, median-of-three pivots), O(n) expected
    /// instead of a sort's O(n log n). Reorders the array. NaN when empty; the values must not hold NaN.
    /// </summary>
    public static double MedianInPlace(double[] scratch)
    {
        ArgumentNullException.ThrowIfNull(scratch);
        int n = scratch.Length;
        if (n == 0)
        {
            return double.NaN;
        }

        double upper = SelectInPlace(scratch, n / 2);
        if (n % 2 == 1)
        {
            return upper;
        }

        // After selection every value left of n/2 is at most the upper middle; the largest of them is the lower middle.
        double lower = scratch[0];
        for (int i = 1; i < n / 2; i++)
        {
            lower = Math.Max(lower, scratch[i]);
        }

        return 0.5 * (lower + upper);
    }

    /// <summary>
    /// Places the k-th smallest (0-based) value at index k, smaller ones before it, larger after; returns it. The values
    /// must not hold NaN.
    /// </summary>
    public static double SelectInPlace(Span<double> a, int k) => SelectInPlace<double>(a, k);

    /// <summary>
    /// Hoare's quickselect with median-of-three pivots for any ordered numbers (ranks, counts, values): places the
    /// k-th smallest (0-based) at index k, smaller ones before it, larger after; returns it.
    /// </summary>
    internal static T SelectInPlace<T>(Span<T> a, int k)
        where T : struct, System.Numerics.IComparisonOperators<T, T, bool>
    {
        ArgumentOutOfRangeException.ThrowIfNegative(k);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(k, a.Length);
        int lo = 0, hi = a.Length - 1;
        while (hi > lo)
        {
            int mid = lo + ((hi - lo) / 2);
            if (a[mid] < a[lo])
            {
                (a[mid], a[lo]) = (a[lo], a[mid]);
            }

            if (a[hi] < a[lo])
            {
                (a[hi], a[lo]) = (a[lo], a[hi]);
            }

            if (a[hi] < a[mid])
            {
                (a[hi], a[mid]) = (a[mid], a[hi]);
            }

            T pivot = a[mid];
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

    /// <summary>Copies and sorts, rejecting NaN.</summary>
    public static double[] ToSortedArray(IEnumerable<double> values)
    {
        var a = values.ToArray();
        bool ascending = true;
        for (int i = 0; i < a.Length; i++)
        {
            if (double.IsNaN(a[i]))
            {
                throw new ArgumentException("The sample holds NaN; filter missing values before computing statistics.", nameof(values));
            }

            ascending &= i == 0 || a[i - 1] <= a[i];
        }

        // Statistics are often asked of values already sorted (a group summary sorts once and hands the sorted copy to
        // each estimator); the check costs one pass where the sort cost n log n.
        if (!ascending)
        {
            Array.Sort(a);
        }

        return a;
    }
}
