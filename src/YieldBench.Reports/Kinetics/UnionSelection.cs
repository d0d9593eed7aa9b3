using System.Runtime.InteropServices;

namespace YieldBench.Reports.Kinetics;

/// <summary>
/// Order statistics of the union of two samples, one in any order and one ascending, found by selection rather than by
/// sorting: a three-way quickselect over the unordered sample that counts the ascending one by binary search, and
/// splits a set of wanted ranks at each partition so that several ranks cost about one selection. The values are
/// those a full sort of the union would put at the ranks (for samples without NaN; ties are equal values).
/// </summary>
internal static class UnionSelection
{
    /// <summary>Below this many unordered values a segment is sorted and read by bisection instead.</summary>
    private const int SortBelow = 24;

    /// <summary>
    /// Fills <paramref name="results"/>[i] with the <paramref name="ranks"/>[i]-th smallest (0-based) value of the union
    /// of <paramref name="unordered"/> (permuted in place) and <paramref name="ascending"/>. The ranks may come in any
    /// order and repeat, and must lie in [0, n); neither sample may hold NaN.
    /// </summary>
    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    public static void OrderStatistics(Span<double> unordered, ReadOnlySpan<double> ascending, ReadOnlySpan<int> ranks, Span<double> results)
    {
        if (results.Length < ranks.Length)
        {
            throw new ArgumentException("Fewer result places than ranks.", nameof(results));
        }

        int n = unordered.Length + ascending.Length;
        int m = ranks.Length;
        foreach (int rank in ranks)
        {
            if (rank < 0 || rank >= n)
            {
                throw new ArgumentOutOfRangeException(nameof(ranks), rank, $"A rank must lie within the union of {n} values.");
            }
        }

        // The ranks in ascending order (insertion sort: a handful of ranks per call), remembering where each came from.
        Span<int> sorted = m <= 16 ? stackalloc int[m] : new int[m];
        Span<int> from = m <= 16 ? stackalloc int[m] : new int[m];
        for (int i = 0; i < m; i++)
        {
            int j = i;
            while (j > 0 && sorted[j - 1] > ranks[i])
            {
                sorted[j] = sorted[j - 1];
                from[j] = from[j - 1];
                j--;
            }

            sorted[j] = ranks[i];
            from[j] = i;
        }

        Span<double> values = m <= 16 ? stackalloc double[m] : new double[m];

        // About twice the depth a balanced split reaches; past it the segment is sorted (a guard, as introsort has).
        int depth = 2 * (64 - System.Numerics.BitOperations.LeadingZeroCount((ulong)Math.Max(unordered.Length, 1)));
        Select(unordered, ascending, 0, sorted, values, depth);
        for (int i = 0; i < m; i++)
        {
            results[from[i]] = values[i];
        }
    }

    /// <summary>As <see cref="OrderStatistics(Span{double}, ReadOnlySpan{double}, ReadOnlySpan{int}, Span{double})"/> with the ascending sample in a list.</summary>
    public static void OrderStatistics(Span<double> unordered, List<double> ascending, ReadOnlySpan<int> ranks, Span<double> results) =>
        OrderStatistics(unordered, CollectionsMarshal.AsSpan(ascending), ranks, results);

    /// <summary>The k-th smallest (0-based) of the union of two ascending samples, by bisection on how many come from each.</summary>
    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    public static double OfSorted(ReadOnlySpan<double> a, ReadOnlySpan<double> b, int k)
    {
        // Take i from a and k + 1 − i from b: the smallest i for which a's next value is not below b's last taken one.
        int lo = Math.Max(0, k + 1 - b.Length), hi = Math.Min(k + 1, a.Length);
        while (lo < hi)
        {
            int i = (lo + hi) / 2;
            if (a[i] < b[k - i])
            {
                lo = i + 1;
            }
            else
            {
                hi = i;
            }
        }

        int fromB = k + 1 - lo;
        return Math.Max(lo > 0 ? a[lo - 1] : double.NegativeInfinity, fromB > 0 ? b[fromB - 1] : double.NegativeInfinity);
    }

    // The wanted ranks count from the start of the union; `below` values of it lie below both segments.
    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    private static void Select(Span<double> a, ReadOnlySpan<double> b, int below, ReadOnlySpan<int> ranks, Span<double> results, int depth)
    {
        while (ranks.Length > 0)
        {
            if (a.Length == 0)
            {
                for (int i = 0; i < ranks.Length; i++)
                {
                    results[i] = b[ranks[i] - below];
                }

                return;
            }

            if (a.Length < SortBelow || depth-- <= 0)
            {
                a.Sort();
                for (int i = 0; i < ranks.Length; i++)
                {
                    results[i] = OfSorted(a, b, ranks[i] - below);
                }

                return;
            }

            double pivot = MedianOfThree(a[0], a[a.Length / 2], a[^1]);

            // Three-way partition: [0, lt) below the pivot, [lt, gt) equal to it, [gt, end) above.
            int lt = 0, at = 0, gt = a.Length;
            while (at < gt)
            {
                double v = a[at];
                if (v < pivot)
                {
                    (a[lt], a[at]) = (a[at], a[lt]);
                    lt++;
                    at++;
                }
                else if (v > pivot)
                {
                    gt--;
                    (a[gt], a[at]) = (a[at], a[gt]);
                }
                else
                {
                    at++;
                }
            }

            int bLess = LowerBound(b, pivot), bUpTo = UpperBound(b, pivot);
            int less = lt + bLess, upTo = gt + bUpTo;

            // Ranks below the pivot's run go left, those within it are the pivot, the rest go right.
            int leftCount = 0;
            while (leftCount < ranks.Length && ranks[leftCount] - below < less)
            {
                leftCount++;
            }

            int equalEnd = leftCount;
            while (equalEnd < ranks.Length && ranks[equalEnd] - below < upTo)
            {
                results[equalEnd++] = pivot;
            }

            // The side below the pivot by recursion, the side above in this loop (the depth guard bounds both).
            Select(a[..lt], b[..bLess], below, ranks[..leftCount], results[..leftCount], depth);
            a = a[gt..];
            b = b[bUpTo..];
            below += upTo;
            ranks = ranks[equalEnd..];
            results = results[equalEnd..];
        }
    }

    private static double MedianOfThree(double x, double y, double z) =>
        x < y ? (y < z ? y : x < z ? z : x) : (x < z ? x : y < z ? z : y);

    /// <summary>First index whose value is not below <paramref name="v"/>.</summary>
    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    private static int LowerBound(ReadOnlySpan<double> b, double v)
    {
        int lo = 0, hi = b.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (b[mid] < v)
            {
                lo = mid + 1;
            }
            else
            {
                hi = mid;
            }
        }

        return lo;
    }

    /// <summary>First index whose value is above <paramref name="v"/>.</summary>
    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    private static int UpperBound(ReadOnlySpan<double> b, double v)
    {
        int lo = 0, hi = b.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (b[mid] <= v)
            {
                lo = mid + 1;
            }
            else
            {
                hi = mid;
            }
        }

        return lo;
    }
}
