using MathNet.Numerics.Distributions;

namespace YieldBench.Core.Statistics;

/// <summary>A Theil–Sen line y = Intercept + Slope·x with Sen's confidence interval for the slope.</summary>
/// <param name="Slope">Median of the pairwise slopes (yⱼ − yᵢ)/(xⱼ − xᵢ) over pairs with xᵢ ≠ xⱼ.</param>
/// <param name="Intercept">median(y) − Slope·median(x).</param>
/// <param name="SlopeInterval">Sen's (1968) distribution-free interval for the slope.</param>
/// <param name="N">Number of points.</param>
/// <param name="Pairs">Number of pairs with distinct x (the slopes the median was taken over).</param>
/// <param name="Note">Why the line could not be fitted, or null.</param>
public sealed record TheilSenLine(double Slope, double Intercept, Interval SlopeInterval, int N, long Pairs, string? Note)
{
    /// <summary>True when slope and intercept are numbers.</summary>
    public bool IsDefined => !double.IsNaN(Slope);

    /// <summary>The line's value at x.</summary>
    public double Predict(double x) => Intercept + (Slope * x);
}

/// <summary>
/// Theil–Sen regression (Theil 1950; Sen 1968). The slope is the exact median of the pairwise slopes; the
/// interval takes the order statistics of the slopes at ranks ⌊(N ∓ z·σ)/2⌉ with
/// σ² = [n(n−1)(2n+5) − Σₓ t(t−1)(2t+5) − Σᵧ t(t−1)(2t+5)]/18 over tie groups in x and in y (Sen 1968, eq. 2.6,
/// as scipy 1.10 <c>theilslopes</c>, rounding half to even). Policies: fewer than two points, or all x equal, give
/// NaN with a note.
/// Up to <see cref="DirectLimit"/> points every slope is formed and the needed ones selected (quickselect). Beyond it each needed order statistic is
/// selected exactly in expected O(n log n) time per round: the number of slopes ≤ t equals a count of inversions
/// between the x order and the order of y − t·x (merge sort), a seeded random sample of slopes gives a first bracket,
/// interpolation on the counts narrows it until few slopes remain inside, and those are listed and sorted.
/// </summary>
public static class TheilSen
{
    /// <summary>
    /// Largest n fitted by forming all n(n−1)/2 slopes. Above it the selector is faster (at 900 points, the size of a
    /// backtest fold of 1,000 lots, about a quarter of the review's CPU went into forming slopes) and gives the same
    /// slopes (tests compare both with the sorted definition up to 1,400 points; docs/performance.md).
    /// </summary>
    public const int DirectLimit = 200;

    /// <summary>
    /// Fits the line. <paramref name="level"/> in (0, 1) is the slope interval's coverage (default 0.95).
    /// <paramref name="seed"/> drives only the sampling used to bracket order statistics for large n; the result
    /// is the same for every seed. With <paramref name="withInterval"/> false the slope interval is not computed
    /// (undefined in the result), which saves two of the four order-statistic selections when only the line is needed.
    /// </summary>
    public static TheilSenLine Fit(IReadOnlyList<double> x, IReadOnlyList<double> y, double level = 0.95, int seed = 1, bool withInterval = true)
    {
        ArgumentNullException.ThrowIfNull(x);
        ArgumentNullException.ThrowIfNull(y);
        if (x.Count != y.Count)
        {
            throw new ArgumentException($"x has {x.Count} values and y has {y.Count}; they must pair up.", nameof(y));
        }

        Bootstrap.CheckLevel(level);
        int n = x.Count;
        for (int i = 0; i < n; i++)
        {
            if (double.IsNaN(x[i]) || double.IsNaN(y[i]))
            {
                throw new ArgumentException("The points hold NaN; filter missing values before fitting.", nameof(x));
            }
        }

        // x values equal but for floating-point noise (24.999999999999996 and 25, as sugar conversions and addition
        // balances produce) are ties: compared unrounded they make pairs with slopes of ±10¹⁴ that mean nothing.
        var snapped = x.Select(SnapNoise).ToArray();
        x = snapped;
        var xs = Descriptive.ToSortedArray(x);
        long tiedXPairs = TiedPairs(xs);
        long pairs = ((long)n * (n - 1) / 2) - tiedXPairs;
        if (n < 2 || pairs == 0)
        {
            return new TheilSenLine(double.NaN, double.NaN, Interval.Undefined(level), n, 0, n < 2 ? "fewer than two points" : "all x values are equal");
        }

        Func<long, long, double[]> select = n <= DirectLimit ? DirectSelector(snapped, y.ToArray(), pairs) : new SlopeSelector(x, y, seed).SelectRange;
        double slope;
        if (pairs % 2 == 1)
        {
            slope = select((pairs + 1) / 2, (pairs + 1) / 2)[0];
        }
        else
        {
            var middle = select(pairs / 2, (pairs / 2) + 1);
            slope = 0.5 * (middle[0] + middle[1]);
        }

        double intercept = Descriptive.Median(y) - (slope * Descriptive.MedianOfSorted(xs));
        if (!withInterval)
        {
            return new TheilSenLine(slope, intercept, Interval.Undefined(level), n, pairs, null);
        }

        double sigmaSquared = ((double)n * (n - 1) * ((2.0 * n) + 5) - TieTerm(xs) - TieTerm(Descriptive.ToSortedArray(y))) / 18.0;
        double z = Normal.InvCDF(0, 1, (1 - level) / 2);
        double sigma = Math.Sqrt(Math.Max(0, sigmaSquared));

        // 0-based ranks as scipy: upper = min(round((N − zσ)/2), N − 1), lower = max(round((N + zσ)/2) − 1, 0), z < 0.
        long upper = Math.Min((long)Math.Round((pairs - (z * sigma)) / 2.0, MidpointRounding.ToEven), pairs - 1);
        long lower = Math.Max((long)Math.Round((pairs + (z * sigma)) / 2.0, MidpointRounding.ToEven) - 1, 0);
        var interval = new Interval(select(lower + 1, lower + 1)[0], select(upper + 1, upper + 1)[0], level);
        return new TheilSenLine(slope, intercept, interval, n, pairs, null);
    }

    /// <summary>Significant digits x is rounded to before pairs are formed (measurements carry four or fewer).</summary>
    public const int SignificantDigitsOfX = 12;

    private static double SnapNoise(double v)
    {
        if (v == 0 || !double.IsFinite(v))
        {
            return v;
        }

        int magnitude = (int)Math.Floor(Math.Log10(Math.Abs(v))) + 1;
        int decimals = SignificantDigitsOfX - magnitude;
        return decimals is >= 0 and <= 15 ? Math.Round(v, decimals, MidpointRounding.ToEven) : v;
    }

    private static Func<long, long, double[]> DirectSelector(double[] x, double[] y, long pairs)
    {
        int n = x.Length;
        var a = new double[pairs];
        int m = 0;
        for (int i = 0; i < n; i++)
        {
            double xi = x[i], yi = y[i];
            for (int j = i + 1; j < n; j++)
            {
                if (xi != x[j])
                {
                    a[m++] = (y[j] - yi) / (x[j] - xi);
                }
            }
        }

        // Selection, not a sort: the fit needs two to four order statistics of up to a million slopes, and the house
        // factor's nested backtests fit some hundred lines (docs/performance.md). The values are the sort's exactly.
        return (kLow, kHigh) =>
        {
            var result = new double[kHigh - kLow + 1];
            for (int r = 0; r < result.Length; r++)
            {
                // After selecting rank k every later slope sits to its right, so the next rank is the least of those.
                int k = (int)(kLow - 1) + r;
                int from = r == 0 ? 0 : k;
                result[r] = Descriptive.SelectInPlace(a.AsSpan(from), k - from);
            }

            return result;
        };
    }

    private static long TiedPairs(double[] sorted)
    {
        long total = 0;
        int i = 0;
        while (i < sorted.Length)
        {
            int j = i;
            while (j + 1 < sorted.Length && sorted[j + 1] == sorted[i])
            {
                j++;
            }

            long t = j - i + 1;
            total += t * (t - 1) / 2;
            i = j + 1;
        }

        return total;
    }

    private static double TieTerm(double[] sorted)
    {
        double total = 0;
        int i = 0;
        while (i < sorted.Length)
        {
            int j = i;
            while (j + 1 < sorted.Length && sorted[j + 1] == sorted[i])
            {
                j++;
            }

            double t = j - i + 1;
            total += t * (t - 1) * ((2 * t) + 5);
            i = j + 1;
        }

        return total;
    }

    /// <summary>Exact order statistics of the pairwise slopes without forming them all.</summary>
    internal sealed class SlopeSelector
    {
        private readonly double[] px;
        private readonly double[] py;
        private readonly long tiedXPairs;
        private readonly double[] sample;
        private readonly long pairs;
        private readonly double minSlope;
        private readonly double maxSlope;
        private readonly double[] keys;
        private readonly double[] buffer;
        private readonly double maxAbsY;
        private readonly double maxAbsX;
        private readonly double minGapX;
        private (double Lo, long CLo, double Hi, long CHi)? extremes;

        public SlopeSelector(IReadOnlyList<double> x, IReadOnlyList<double> y, int seed)
        {
            int n = x.Count;

            // Points in x order, ties in x by descending y, so every tied-x pair is an inversion of y − t·x
            // at every t and can be subtracted as a constant.
            var xa = x.ToArray();
            var ya = y.ToArray();
            var order = new int[n];
            for (int i = 0; i < n; i++)
            {
                order[i] = i;
            }

            Array.Sort(order, (a, b) =>
            {
                int c = xa[a].CompareTo(xa[b]);
                if (c == 0)
                {
                    c = ya[b].CompareTo(ya[a]);
                }

                return c != 0 ? c : a.CompareTo(b);
            });
            px = new double[n];
            py = new double[n];
            for (int i = 0; i < n; i++)
            {
                px[i] = xa[order[i]];
                py[i] = ya[order[i]];
            }
            tiedXPairs = TiedPairs(px);
            pairs = ((long)n * (n - 1) / 2) - tiedXPairs;
            keys = new double[n];
            buffer = new double[n];
            maxAbsY = py.Max(Math.Abs);
            maxAbsX = px.Max(Math.Abs);
            minGapX = double.PositiveInfinity;
            for (int i = 1; i < n; i++)
            {
                if (px[i] > px[i - 1])
                {
                    minGapX = Math.Min(minGapX, px[i] - px[i - 1]);
                }
            }

            // The extreme slopes join neighbouring distinct x values (a slope across a gap averages those inside it).
            minSlope = double.PositiveInfinity;
            maxSlope = double.NegativeInfinity;
            int g = 0;
            while (g < n)
            {
                int gEnd = g;
                while (gEnd + 1 < n && px[gEnd + 1] == px[g])
                {
                    gEnd++;
                }

                int h = gEnd + 1;
                if (h < n)
                {
                    int hEnd = h;
                    while (hEnd + 1 < n && px[hEnd + 1] == px[h])
                    {
                        hEnd++;
                    }

                    // Group g runs from its highest y (index g) to its lowest (gEnd); likewise group h.
                    double dx = px[h] - px[g];
                    maxSlope = Math.Max(maxSlope, (py[h] - py[gEnd]) / dx);
                    minSlope = Math.Min(minSlope, (py[hEnd] - py[g]) / dx);
                }

                g = gEnd + 1;
            }

            var random = new Random(seed);
            int size = Math.Min(4 * n, 200_000);
            var s = new List<double>(size);
            while (s.Count < size)
            {
                int i = random.Next(n), j = random.Next(n);
                if (px[i] != px[j])
                {
                    s.Add((py[j] - py[i]) / (px[j] - px[i]));
                }
            }

            s.Sort();
            sample = s.ToArray();
        }

        /// <summary>The k-th smallest slope, 1 ≤ k ≤ pairs.</summary>
        public double Select(long k) => SelectRange(k, k)[0];

        /// <summary>The kLow-th to kHigh-th smallest slopes (a short run of ranks, e.g. the two middle ones), ascending.</summary>
        public double[] SelectRange(long kLow, long kHigh)
        {
            int n = px.Length;
            long window = Math.Max(4L * n, 4096);
            var (lo, cLo, hi, cHi) = Extremes(kLow, kHigh);

            // Bracket: CountAtOrBelow(lo) < kLow and kHigh ≤ CountAtOrBelow(hi).
            double q = (double)kLow / pairs;
            double spread = 4 * Math.Sqrt(q * (1 - q) / sample.Length) + (2.0 / sample.Length);
            TryNarrow(Descriptive.QuantileOfSorted(sample, Math.Max(0, q - spread)), kLow, kHigh, ref lo, ref cLo, ref hi, ref cHi);
            TryNarrow(Descriptive.QuantileOfSorted(sample, Math.Min(1, q + spread)), kLow, kHigh, ref lo, ref cLo, ref hi, ref cHi);

            for (int round = 0; round < 200 && cHi - cLo > window; round++)
            {
                long before = cHi - cLo;
                double fraction = (((kLow + kHigh) / 2.0) - cLo) / (cHi - cLo);
                double half = (double)(window / 4) / (cHi - cLo);
                double t1 = lo + ((hi - lo) * Math.Max(0, fraction - half));
                double t2 = lo + ((hi - lo) * Math.Min(1, fraction + half));
                TryNarrow(t1, kLow, kHigh, ref lo, ref cLo, ref hi, ref cHi);
                TryNarrow(t2, kLow, kHigh, ref lo, ref cLo, ref hi, ref cHi);
                if (cHi - cLo > before / 2)
                {
                    // Interpolation stalls on a point mass of tied slopes (common with rounded data): probe just
                    // either side of a sampled slope inside the bracket, which closes the bracket on the mass at once.
                    if (SampledSlopeInside(lo, hi) is { } tied)
                    {
                        double eps = TieWidth(tied);
                        TryNarrow(tied - eps, kLow, kHigh, ref lo, ref cLo, ref hi, ref cHi);
                        TryNarrow(tied + eps, kLow, kHigh, ref lo, ref cLo, ref hi, ref cHi);
                    }

                    if (cHi - cLo > before / 2)
                    {
                        TryNarrow(lo + ((hi - lo) / 2), kLow, kHigh, ref lo, ref cLo, ref hi, ref cHi);
                    }
                }

                if (hi - lo <= 2 * TieWidth(hi))
                {
                    break;
                }
            }

            var result = new double[kHigh - kLow + 1];
            if (cHi - cLo > window)
            {
                // Every slope left in the bracket lies within the tie width: they are one tied value; take one of them.
                var any = ListBetween(lo, hi, limit: 1);
                Array.Fill(result, any.Count > 0 ? any[0] : hi);
                return result;
            }

            var inside = ListBetween(lo, hi, limit: int.MaxValue);
            inside.Sort();
            for (long k = kLow; k <= kHigh; k++)
            {
                result[k - kLow] = inside[(int)Math.Clamp(k - cLo - 1, 0, inside.Count - 1)];
            }

            return result;
        }

        /// <summary>
        /// A bracket holding every slope: the extremes with a margin, their counts taken rather than assumed, because
        /// comparing y − t·x for t within rounding noise of a slope is unreliable. Computed once.
        /// </summary>
        private (double Lo, long CLo, double Hi, long CHi) Extremes(long kLow, long kHigh)
        {
            if (extremes is { } known && known.CLo < kLow && known.CHi >= kHigh)
            {
                return known;
            }

            // Widen until the bracket holds the wanted ranks. Counts at slopes far beyond every real slope are not
            // exact in floating point, so "all pairs inside" is not required: holding kLow..kHigh is what selection needs.
            double spanMargin = 1e-6 * Math.Max(1, Math.Max(Math.Abs(minSlope), Math.Abs(maxSlope)));
            for (int attempt = 0; ; attempt++)
            {
                double lo = minSlope - spanMargin, hi = maxSlope + spanMargin;
                long cLo = CountAtOrBelow(lo), cHi = CountAtOrBelow(hi);
                if ((cLo < kLow && cHi >= kHigh) || attempt >= 40)
                {
                    extremes = (lo, cLo, hi, cHi);
                    return extremes.Value;
                }

                spanMargin *= 1000;
            }
        }

        /// <summary>
        /// Half-width within which two slopes count as tied: comparisons of y − t·x are trusted only when t is farther
        /// than this from a slope, given the keys' magnitude and the smallest gap between distinct x values.
        /// </summary>
        private double TieWidth(double slope) => Math.Max(1e-13 * (maxAbsY + (Math.Abs(slope) * maxAbsX)) / minGapX, 1e-300);

        private double? SampledSlopeInside(double lo, double hi)
        {
            int a = Array.BinarySearch(sample, lo);
            a = a < 0 ? ~a : a;
            while (a < sample.Length && sample[a] <= lo)
            {
                a++;
            }

            int b = a;
            while (b < sample.Length && sample[b] <= hi)
            {
                b++;
            }

            return b > a ? sample[a + ((b - a) / 2)] : null;
        }

        private void TryNarrow(double t, long kLow, long kHigh, ref double lo, ref long cLo, ref double hi, ref long cHi)
        {
            if (!(t > lo && t < hi))
            {
                return;
            }

            long c = CountAtOrBelow(t);
            if (c < kLow)
            {
                lo = t;
                cLo = c;
            }
            else if (c >= kHigh)
            {
                hi = t;
                cHi = c;
            }

            // Otherwise t falls between the wanted ranks; the bracket is already about as tight as they allow.
        }

        /// <summary>Number of pairs with distinct x whose slope is at most t.</summary>
        private long CountAtOrBelow(double t)
        {
            for (int i = 0; i < px.Length; i++)
            {
                keys[i] = py[i] - (t * px[i]);
            }

            // Pair i &lt; j (in x order) has slope ≤ t exactly when keyⱼ ≤ keyᵢ: count such non-strict inversions.
            return CountInversions(keys, buffer, 0, keys.Length) - tiedXPairs;
        }

        /// <summary>Sorts a[from..to) ascending and returns the number of pairs i &lt; j with a[i] ≥ a[j].</summary>
        private static long CountInversions(double[] a, double[] tmp, int from, int to)
        {
            int len = to - from;
            if (len < 2)
            {
                return 0;
            }

            int mid = from + (len / 2);
            long count = CountInversions(a, tmp, from, mid) + CountInversions(a, tmp, mid, to);
            int i = from, j = mid, o = from;
            while (i < mid && j < to)
            {
                if (a[j] <= a[i])
                {
                    count += mid - i;
                    tmp[o++] = a[j++];
                }
                else
                {
                    tmp[o++] = a[i++];
                }
            }

            while (i < mid)
            {
                tmp[o++] = a[i++];
            }

            while (j < to)
            {
                tmp[o++] = a[j++];
            }

            Array.Copy(tmp, from, a, from, len);
            return count;
        }

        /// <summary>Slopes s with lo &lt; s ≤ hi, listed in time proportional to their number (plus exact duplicates).</summary>
        private List<double> ListBetween(double lo, double hi, int limit)
        {
            int n = px.Length;

            // With a = y − lo·x and b = y − hi·x, a pair has lo < slope ≤ hi exactly when one point has the smaller a
            // and the larger-or-equal b (the x order then follows, since (a_q − a_p) − (b_q − b_p) = (hi − lo)(x_q − x_p)).
            // So order the points by a (ties by b) and list the non-strict inversions of b by merge sort.
            var a = new double[n];
            var b = new double[n];
            for (int i = 0; i < n; i++)
            {
                a[i] = py[i] - (lo * px[i]);
                b[i] = py[i] - (hi * px[i]);
            }

            var idx = Enumerable.Range(0, n).OrderBy(i => a[i]).ThenBy(i => b[i]).ToArray();
            var result = new List<double>();
            ListInversions(idx, new int[n], a, b, 0, n, result, limit);
            return result;
        }

        private void ListInversions(int[] idx, int[] tmp, double[] a, double[] b, int from, int to, List<double> result, int limit)
        {
            int len = to - from;
            if (len < 2 || result.Count >= limit)
            {
                return;
            }

            int mid = from + (len / 2);
            ListInversions(idx, tmp, a, b, from, mid, result, limit);
            ListInversions(idx, tmp, a, b, mid, to, result, limit);
            int i = from, j = mid, o = from;
            while (i < mid && j < to)
            {
                if (b[idx[j]] <= b[idx[i]])
                {
                    int q = idx[j];
                    for (int r = i; r < mid; r++)
                    {
                        int p = idx[r];

                        // p has the smaller-or-equal a. Requiring the x order too makes the listed set exactly the
                        // pairs counted at hi and not at lo, even where rounding blurs a near-tie.
                        if (a[p] < a[q] && px[p] < px[q])
                        {
                            result.Add((py[q] - py[p]) / (px[q] - px[p]));
                            if (result.Count >= limit)
                            {
                                return;
                            }
                        }
                    }

                    tmp[o++] = idx[j++];
                }
                else
                {
                    tmp[o++] = idx[i++];
                }
            }

            while (i < mid)
            {
                tmp[o++] = idx[i++];
            }

            while (j < to)
            {
                tmp[o++] = idx[j++];
            }

            Array.Copy(tmp, from, idx, from, len);
        }
    }
}
