namespace YieldBench.Core.Statistics;

/// <summary>
/// Selects the k-th smallest entry of an implicit matrix whose rows are each sorted ascending, without forming the
/// matrix. This is the row-bound narrowing scheme of Johnson &amp; Mizoguchi (1978) as used by Croux &amp; Rousseeuw
/// (1992) for Qn: each round takes the weighted median of the rows' middle candidates as a trial value, counts the
/// entries below and at it by binary search in every row, and discards the rows' parts that cannot hold the answer.
/// The weighted median guarantees that a fixed share of the candidates goes each round, so the cost is
/// O(R log R log C) for R rows of up to C columns, with O(R) memory.
/// </summary>
internal static class SortedMatrixSelection
{
    /// <summary>
    /// The k-th smallest (1-based) entry. Row r holds columns <paramref name="firstColumn"/>[r] ..
    /// <paramref name="lastColumn"/>[r] (inclusive; empty when last &lt; first), and
    /// <paramref name="entry"/>(r, c) must be non-decreasing in c.
    /// </summary>
    /// <param name="rows">Number of rows.</param>
    /// <param name="firstColumn">First column of each row.</param>
    /// <param name="lastColumn">Last column of each row (inclusive).</param>
    /// <param name="entry">The entry at (row, column).</param>
    /// <param name="k">Rank wanted, 1-based.</param>
    /// <param name="countRows">
    /// Optional fast counter: given t and strictness, fills for every row the number of its entries below t (or at
    /// or below t). Without it each row is binary-searched; with a monotone two-pointer counter a round costs O(R + C).
    /// </param>
    public static double Select(int rows, int[] firstColumn, int[] lastColumn, Func<int, int, double> entry, long k, Action<double, bool, long[]>? countRows = null)
    {
        long total = 0;
        for (int r = 0; r < rows; r++)
        {
            total += Math.Max(0, lastColumn[r] - firstColumn[r] + 1);
        }

        if (k < 1 || k > total)
        {
            throw new ArgumentOutOfRangeException(nameof(k), k, $"The rank must be between 1 and {total}.");
        }

        // Candidate bounds per row (inclusive); entries left of lo are known to be below the answer, right of hi above.
        var lo = (int[])firstColumn.Clone();
        var hi = (int[])lastColumn.Clone();
        var below = new long[rows];
        var atOrBelow = new long[rows];
        var trialValues = new double[rows];
        var trialWeights = new long[rows];

        while (true)
        {
            long candidates = 0;
            int m = 0;
            for (int r = 0; r < rows; r++)
            {
                if (lo[r] <= hi[r])
                {
                    long w = hi[r] - lo[r] + 1;
                    candidates += w;
                    trialValues[m] = entry(r, lo[r] + ((hi[r] - lo[r]) / 2));
                    trialWeights[m] = w;
                    m++;
                }
            }

            if (candidates <= Math.Max(rows, 64))
            {
                return SelectAmongCandidates(rows, firstColumn, lo, hi, entry, k);
            }

            double trial = WeightedHighMedian(trialValues, trialWeights, m);
            long sumBelow = 0, sumAtOrBelow = 0;
            if (countRows is null)
            {
                for (int r = 0; r < rows; r++)
                {
                    below[r] = CountBelow(r, firstColumn[r], lastColumn[r], entry, trial, strict: true);
                    atOrBelow[r] = CountBelow(r, firstColumn[r], lastColumn[r], entry, trial, strict: false);
                }
            }
            else
            {
                countRows(trial, true, below);
                countRows(trial, false, atOrBelow);
            }

            for (int r = 0; r < rows; r++)
            {
                sumBelow += below[r];
                sumAtOrBelow += atOrBelow[r];
            }

            if (k <= sumBelow)
            {
                for (int r = 0; r < rows; r++)
                {
                    hi[r] = Math.Min(hi[r], firstColumn[r] + (int)below[r] - 1);
                }
            }
            else if (k > sumAtOrBelow)
            {
                for (int r = 0; r < rows; r++)
                {
                    lo[r] = Math.Max(lo[r], firstColumn[r] + (int)atOrBelow[r]);
                }
            }
            else
            {
                return trial;
            }
        }
    }

    private static double SelectAmongCandidates(int rows, int[] firstColumn, int[] lo, int[] hi, Func<int, int, double> entry, long k)
    {
        long discardedBelow = 0;
        var values = new List<double>();
        for (int r = 0; r < rows; r++)
        {
            int last = Math.Max(lo[r] - 1, firstColumn[r] - 1);
            discardedBelow += last - firstColumn[r] + 1;
            for (int c = lo[r]; c <= hi[r]; c++)
            {
                values.Add(entry(r, c));
            }
        }

        values.Sort();
        return values[(int)(k - discardedBelow - 1)];
    }

    /// <summary>Number of entries in the row below (strict) or at-or-below the value, by binary search.</summary>
    private static long CountBelow(int r, int first, int last, Func<int, int, double> entry, double value, bool strict)
    {
        int a = first, b = last + 1;
        while (a < b)
        {
            int mid = a + ((b - a) / 2);
            double e = entry(r, mid);
            bool inside = strict ? e < value : e <= value;
            if (inside)
            {
                a = mid + 1;
            }
            else
            {
                b = mid;
            }
        }

        return a - first;
    }

    /// <summary>
    /// Smallest value whose cumulative weight exceeds half the total (weighted high median), by three-way
    /// partitioning selection: O(m) expected per call, where sorting made it O(m log m) and the largest cost of Qn at
    /// 100,000 values. Reorders the arrays' first m items.
    /// </summary>
    internal static double WeightedHighMedian(double[] values, long[] weights, int m)
    {
        long total = 0;
        for (int i = 0; i < m; i++)
        {
            total += weights[i];
        }

        int lo = 0, hi = m - 1;
        long before = 0; // weight of the values known to be below every value in [lo, hi]
        while (lo < hi)
        {
            int mid = lo + ((hi - lo) / 2);
            double a = values[lo], b = values[mid], c = values[hi];
            double pivot = a < b ? (b < c ? b : (a < c ? c : a)) : (a < c ? a : (b < c ? c : b));

            // Dutch-flag partition of [lo, hi]: < pivot, then == pivot, then > pivot.
            int lt = lo, i = lo, gt = hi;
            long weightBelow = 0, weightEqual = 0;
            while (i <= gt)
            {
                double v = values[i];
                if (v < pivot)
                {
                    weightBelow += weights[i];
                    Swap(values, weights, lt++, i++);
                }
                else if (v > pivot)
                {
                    Swap(values, weights, i, gt--);
                }
                else
                {
                    weightEqual += weights[i];
                    i++;
                }
            }

            if (2 * (before + weightBelow) > total)
            {
                hi = lt - 1;
            }
            else if (2 * (before + weightBelow + weightEqual) > total)
            {
                return pivot;
            }
            else
            {
                before += weightBelow + weightEqual;
                lo = gt + 1;
            }
        }

        return values[lo];
    }

    private static void Swap(double[] values, long[] weights, int a, int b)
    {
        (values[a], values[b]) = (values[b], values[a]);
        (weights[a], weights[b]) = (weights[b], weights[a]);
    }
}
