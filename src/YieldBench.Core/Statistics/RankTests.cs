using MathNet.Numerics;
using MathNet.Numerics.Distributions;

namespace YieldBench.Core.Statistics;

/// <summary>Result of a Kruskal–Wallis test. H and P are NaN when the test is undefined; <see cref="Note"/> says why.</summary>
/// <param name="H">Tie-corrected H statistic.</param>
/// <param name="DegreesOfFreedom">Number of non-empty groups − 1.</param>
/// <param name="P">Upper-tail chi-square p-value.</param>
/// <param name="N">Total number of values.</param>
/// <param name="Note">Why the test could not be made, or null.</param>
public sealed record KruskalWallisResult(double H, int DegreesOfFreedom, double P, int N, string? Note);

/// <summary>Result of a two-sided Mann–Whitney (Wilcoxon rank-sum) test of a against b.</summary>
/// <param name="U">U of the first sample: the number of pairs (aᵢ, bⱼ) with aᵢ &gt; bⱼ, ties counting one half.</param>
/// <param name="Z">Normal score with tie and continuity correction (NaN when every value is tied).</param>
/// <param name="P">Two-sided p-value.</param>
/// <param name="Exact">True when P comes from the exact null distribution of U.</param>
/// <param name="Note">Why the test could not be made, or null.</param>
public sealed record MannWhitneyResult(double U, double Z, double P, bool Exact, string? Note);

/// <summary>Hodges–Lehmann shift of a over b: the median of all differences aᵢ − bⱼ, with its distribution-free interval.</summary>
/// <param name="Shift">Median of the n·m differences.</param>
/// <param name="Interval">Moses' distribution-free confidence interval (order statistics of the differences).</param>
/// <param name="Exact">True when the interval's ranks come from the exact distribution of U.</param>
public sealed record HodgesLehmannResult(double Shift, Interval Interval, bool Exact);

/// <summary>
/// Rank tests. Ties get mid-ranks. Policies: empty groups are ignored by Kruskal–Wallis; fewer than two non-empty
/// groups, or all values equal, give NaN with a note; Mann–Whitney needs at least one value in each sample.
/// </summary>
public static class RankTests
{
    /// <summary>
    /// Samples this small (both sizes) and free of ties get exact p-values and interval ranks for Mann–Whitney;
    /// larger or tied samples use the normal approximation. (scipy 1.10's <c>method="auto"</c> goes exact when either
    /// sample has at most 8 values; requiring both keeps the exact table small for a strain of thousands of lots.)
    /// </summary>
    public const int ExactLimit = 8;

    /// <summary>
    /// Kruskal–Wallis H test across groups (Kruskal &amp; Wallis 1952): H = [12/(N(N+1)) Σ Rᵢ²/nᵢ − 3(N+1)] / C with the
    /// tie correction C = 1 − Σ(t³ − t)/(N³ − N), referred to χ² with (groups − 1) degrees of freedom (MathNet).
    /// </summary>
    public static KruskalWallisResult KruskalWallis(IReadOnlyList<IReadOnlyList<double>> groups)
    {
        ArgumentNullException.ThrowIfNull(groups);
        var used = groups.Where(g => g.Count > 0).ToArray();
        int n = used.Sum(g => g.Count);
        if (used.Length < 2)
        {
            return new KruskalWallisResult(double.NaN, Math.Max(0, used.Length - 1), double.NaN, n, "fewer than two groups hold values");
        }

        var all = new List<(double Value, int Group)>(n);
        for (int g = 0; g < used.Length; g++)
        {
            foreach (double v in used[g])
            {
                RejectNaN(v);
                all.Add((v, g));
            }
        }

        var ranks = MidRanks(all.Select(t => t.Value).ToArray(), out double tieSum);
        var rankSums = new double[used.Length];
        for (int i = 0; i < n; i++)
        {
            rankSums[all[i].Group] += ranks[i];
        }

        double correction = 1 - (tieSum / (((double)n * n * n) - n));
        int df = used.Length - 1;
        if (correction <= 0)
        {
            return new KruskalWallisResult(double.NaN, df, double.NaN, n, "all values are equal, so ranks cannot separate the groups");
        }

        double sum = 0;
        for (int g = 0; g < used.Length; g++)
        {
            sum += rankSums[g] * rankSums[g] / used[g].Count;
        }

        double h = ((12.0 / (n * (n + 1.0)) * sum) - (3.0 * (n + 1))) / correction;
        // The upper tail straight from the survival function, Q(df/2, H/2) (regularised upper incomplete gamma): 1 − CDF
        // loses every digit once the CDF rounds to 1 (H above about 60 with 4 degrees of freedom) and would print p = 0.
        double p = SpecialFunctions.GammaUpperRegularized(df / 2.0, Math.Max(0, h) / 2.0);
        return new KruskalWallisResult(h, df, p, n, null);
    }

    /// <summary>
    /// Two-sided Mann–Whitney U test. Exact when both samples have at most <see cref="ExactLimit"/> values and there
    /// are no ties: p = min(1, 2·P(U ≥ max(U, nm − U))). Otherwise z = (|U − nm/2| − ½)/σ with
    /// σ² = nm/12 · [(N + 1) − Σ(t³ − t)/(N(N − 1))], p = 2(1 − Φ(z)) = erfc(z/√2), from the survival function (as scipy 1.10 <c>mannwhitneyu</c> with
    /// <c>method="asymptotic"</c>).
    /// </summary>
    public static MannWhitneyResult MannWhitney(IReadOnlyList<double> a, IReadOnlyList<double> b)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        if (a.Count == 0 || b.Count == 0)
        {
            return new MannWhitneyResult(double.NaN, double.NaN, double.NaN, false, "each sample needs at least one value");
        }

        var pooled = a.Concat(b).ToArray();
        foreach (double v in pooled)
        {
            RejectNaN(v);
        }

        var ranks = MidRanks(pooled, out double tieSum);
        double r1 = 0;
        for (int i = 0; i < a.Count; i++)
        {
            r1 += ranks[i];
        }

        double n1 = a.Count, n2 = b.Count, nn = n1 + n2;
        double u = r1 - (n1 * (n1 + 1) / 2);
        double mu = n1 * n2 / 2;
        double variance = n1 * n2 / 12 * ((nn + 1) - (tieSum / (nn * (nn - 1))));
        double z = variance > 0 ? (Math.Abs(u - mu) - 0.5) / Math.Sqrt(variance) : double.NaN;
        if (tieSum == 0 && a.Count <= ExactLimit && b.Count <= ExactLimit)
        {
            var dist = ExactUDistribution(a.Count, b.Count);
            int big = (int)Math.Round(Math.Max(u, (n1 * n2) - u));
            double upper = 0;
            for (int k = big; k < dist.Length; k++)
            {
                upper += dist[k];
            }

            return new MannWhitneyResult(u, z, Math.Min(1, 2 * upper), true, null);
        }

        if (double.IsNaN(z))
        {
            return new MannWhitneyResult(u, z, 1, false, "all values are equal");
        }

        // Two-sided normal tail from its survival function: 2·(1 − Φ(z)) = erfc(z/√2), exact to the last digit far out
        // in the tail where 1 − Φ(z) underflows to 0.
        double p = Math.Min(1, SpecialFunctions.Erfc(Math.Max(0, z) / Math.Sqrt(2)));
        return new MannWhitneyResult(u, z, p, false, null);
    }

    /// <summary>
    /// Hodges–Lehmann estimate of the shift a − b (median of all aᵢ − bⱼ), found by sorted-matrix selection in
    /// O((n + m) log² (n + m)) without forming the n·m differences, and Moses' distribution-free interval
    /// [D₍q₎, D₍nm+1−q₎] over the sorted differences D. q is the exact lower α/2 quantile of U (as R
    /// <c>qwilcox</c>, floored at 1) when the exact rule of <see cref="MannWhitney"/> applies, else
    /// q = max(1, ⌈nm/2 − ½ − z₁₋α/₂·σ⌉) with σ from the tie-corrected variance of U. NaN when a sample is empty.
    /// </summary>
    public static HodgesLehmannResult HodgesLehmann(IReadOnlyList<double> a, IReadOnlyList<double> b, double level = 0.95)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        Bootstrap.CheckLevel(level);
        if (a.Count == 0 || b.Count == 0)
        {
            return new HodgesLehmannResult(double.NaN, Interval.Undefined(level), false);
        }

        var sa = Descriptive.ToSortedArray(a);
        var sb = Descriptive.ToSortedArray(b);
        long total = (long)sa.Length * sb.Length;
        double shift = total % 2 == 1
            ? KthDifference(sa, sb, (total + 1) / 2)
            : 0.5 * (KthDifference(sa, sb, total / 2) + KthDifference(sa, sb, (total / 2) + 1));

        MidRanks(sa.Concat(sb).ToArray(), out double tieSum);
        bool exact = tieSum == 0 && sa.Length <= ExactLimit && sb.Length <= ExactLimit;
        double alpha = 1 - level;
        long q;
        if (exact)
        {
            var dist = ExactUDistribution(sa.Length, sb.Length);
            double cumulative = 0;
            q = 0;
            while (q < dist.Length)
            {
                cumulative += dist[q];
                if (cumulative >= (alpha / 2) - 1e-12)
                {
                    break;
                }

                q++;
            }
        }
        else
        {
            double nn = sa.Length + sb.Length;
            double sigma = Math.Sqrt(total / 12.0 * ((nn + 1) - (tieSum / (nn * (nn - 1)))));
            double z = Normal.InvCDF(0, 1, 1 - (alpha / 2));
            q = (long)Math.Ceiling((total / 2.0) - 0.5 - (z * sigma));
        }

        q = Math.Clamp(q, 1, total);
        var interval = new Interval(KthDifference(sa, sb, q), KthDifference(sa, sb, total + 1 - q), level);
        return new HodgesLehmannResult(shift, interval, exact);
    }

    /// <summary>Mid-ranks (1-based) of the values in input order; <paramref name="tieSum"/> = Σ(t³ − t) over tie groups.</summary>
    internal static double[] MidRanks(double[] values, out double tieSum)
    {
        int n = values.Length;
        var order = Enumerable.Range(0, n).ToArray();
        Array.Sort(values.ToArray(), order);
        var ranks = new double[n];
        tieSum = 0;
        int i = 0;
        while (i < n)
        {
            int j = i;
            while (j + 1 < n && values[order[j + 1]] == values[order[i]])
            {
                j++;
            }

            double rank = ((i + j) / 2.0) + 1;
            for (int k = i; k <= j; k++)
            {
                ranks[order[k]] = rank;
            }

            double t = j - i + 1;
            tieSum += (t * t * t) - t;
            i = j + 1;
        }

        return ranks;
    }

    /// <summary>Null probabilities P(U = u), u = 0..nm, of the Mann–Whitney U for sizes n and m without ties.</summary>
    internal static double[] ExactUDistribution(int n, int m)
    {
        // f(i, j, u): arrangements of i a's and j b's with U = u. f(i, j, u) = f(i − 1, j, u − j) + f(i, j − 1, u).
        var f = new double[n + 1, m + 1, (n * m) + 1];
        for (int j = 0; j <= m; j++)
        {
            f[0, j, 0] = 1;
        }

        for (int i = 1; i <= n; i++)
        {
            f[i, 0, 0] = 1;
            for (int j = 1; j <= m; j++)
            {
                for (int u = 0; u <= i * j; u++)
                {
                    double v = f[i, j - 1, u];
                    if (u >= j)
                    {
                        v += f[i - 1, j, u - j];
                    }

                    f[i, j, u] = v;
                }
            }
        }

        double total = 0;
        var p = new double[(n * m) + 1];
        for (int u = 0; u <= n * m; u++)
        {
            total += f[n, m, u];
        }

        for (int u = 0; u <= n * m; u++)
        {
            p[u] = f[n, m, u] / total;
        }

        return p;
    }

    /// <summary>k-th smallest (1-based) of aᵢ − bⱼ over sorted a and b.</summary>
    private static double KthDifference(double[] a, double[] b, long k)
    {
        int rows = a.Length, cols = b.Length;
        var first = new int[rows];
        var last = Enumerable.Repeat(cols - 1, rows).ToArray();

        // Column c holds b in descending order, so a[r] − b[cols − 1 − c] rises along the row.
        // Entries of row r below t are the b with a[r] − b < t; as a[r] grows that set shrinks from the top of b,
        // so one pointer into b (ascending) serves every row: count = cols − (first index with a[r] − b[idx] < t).
        void Count(double t, bool strict, long[] counts)
        {
            int p = 0;
            for (int r = 0; r < rows; r++)
            {
                while (p < cols && !(strict ? a[r] - b[p] < t : a[r] - b[p] <= t))
                {
                    p++;
                }

                counts[r] = cols - p;
            }
        }

        return SortedMatrixSelection.Select(rows, first, last, (r, c) => a[r] - b[cols - 1 - c], k, Count);
    }

    private static void RejectNaN(double v)
    {
        if (double.IsNaN(v))
        {
            throw new ArgumentException("The sample holds NaN; filter missing values before testing.");
        }
    }
}
