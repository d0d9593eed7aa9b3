namespace YieldBench.Core.HouseFactor;

/// <summary>One group's estimate before and after shrinkage.</summary>
/// <param name="Group">Group name (strain).</param>
/// <param name="Count">Values in the group.</param>
/// <param name="RawMean">The group's own mean.</param>
/// <param name="SamplingVariance">Variance of the group mean: pooled within-group variance ÷ count.</param>
/// <param name="ShrinkageWeight">B = v ÷ (v + τ²), in [0, 1]: the share of the way the mean moves toward the overall mean.</param>
/// <param name="Shrunk">The empirical-Bayes estimate μ + (1 − B)(raw − μ).</param>
public sealed record ShrunkGroup(string Group, int Count, double RawMean, double SamplingVariance, double ShrinkageWeight, double Shrunk);

/// <summary>The result of shrinking group means toward their overall mean.</summary>
/// <param name="OverallMean">μ, the random-effects weighted mean of the group means.</param>
/// <param name="BetweenVariance">τ², the between-group variance (DerSimonian–Laird, truncated at 0).</param>
/// <param name="WithinVariance">Pooled within-group variance s²_w.</param>
/// <param name="Groups">Groups in the order given.</param>
public sealed record ShrinkageResult(double OverallMean, double BetweenVariance, double WithinVariance, IReadOnlyList<ShrunkGroup> Groups);

/// <summary>
/// Empirical-Bayes shrinkage of group means (normal–normal model): group mean yⱼ with sampling variance
/// vⱼ = s²_w / nⱼ, true means drawn from N(μ, τ²). τ² by the DerSimonian–Laird method of moments
/// (DerSimonian &amp; Laird 1986, <i>Controlled Clinical Trials</i> 7:177):
/// wⱼ = 1/vⱼ, ȳ = Σwⱼyⱼ/Σwⱼ, Q = Σwⱼ(yⱼ − ȳ)², τ² = max(0, (Q − (k − 1)) / (Σwⱼ − Σwⱼ²/Σwⱼ)).
/// μ = Σyⱼ/(vⱼ + τ²) ÷ Σ1/(vⱼ + τ²); the posterior mean (BLUP) is μ + τ²/(τ² + vⱼ)·(yⱼ − μ).
/// The pooled within-group variance is used for every group (not each group's own) so a 3-lot group's noisy
/// variance cannot make it look precise; small groups therefore move more.
/// </summary>
public static class EmpiricalBayesShrinkage
{
    /// <summary>
    /// Shrinks the means of the given groups. Each group needs at least one finite value; with fewer than two groups
    /// nothing can be estimated between groups and every group gets the overall mean (τ² = 0).
    /// </summary>
    public static ShrinkageResult Shrink(IReadOnlyList<(string Group, IReadOnlyList<double> Values)> groups)
    {
        ArgumentNullException.ThrowIfNull(groups);
        if (groups.Count == 0 || groups.Any(g => g.Values.Count == 0))
        {
            throw new ArgumentException("Every group needs at least one value.", nameof(groups));
        }

        if (groups.SelectMany(g => g.Values).Any(v => !double.IsFinite(v)))
        {
            throw new ArgumentException("Values must be finite; filter missing values first.", nameof(groups));
        }

        var means = groups.Select(g => g.Values.Average()).ToArray();
        var counts = groups.Select(g => g.Values.Count).ToArray();
        double ss = 0;
        int df = 0;
        for (int j = 0; j < groups.Count; j++)
        {
            double m = means[j];
            ss += groups[j].Values.Sum(v => (v - m) * (v - m));
            df += counts[j] - 1;
        }

        double within;
        if (df > 0)
        {
            within = ss / df;
        }
        else
        {
            // Every group holds one value: no within-group spread exists, so the spread of all values stands in for it.
            var all = groups.SelectMany(g => g.Values).ToArray();
            double mean = all.Average();
            within = all.Length > 1 ? all.Sum(v => (v - mean) * (v - mean)) / (all.Length - 1) : 0;
        }

        var v = counts.Select(n => within / n).ToArray();
        int k = groups.Count;
        double tau2 = 0;
        if (k >= 2 && within > 0)
        {
            var w = v.Select(x => 1.0 / x).ToArray();
            double sw = w.Sum();
            double ybar = w.Zip(means, (a, b) => a * b).Sum() / sw;
            double q = w.Zip(means, (a, b) => a * (b - ybar) * (b - ybar)).Sum();
            double c = sw - (w.Sum(x => x * x) / sw);
            tau2 = Math.Max(0, (q - (k - 1)) / c);
        }

        double mu;
        if (within > 0 || tau2 > 0)
        {
            var re = v.Select(x => 1.0 / (x + tau2)).ToArray();
            mu = re.Zip(means, (a, b) => a * b).Sum() / re.Sum();
        }
        else
        {
            mu = means.Zip(counts, (m, n) => m * n).Sum() / counts.Sum();
        }

        var result = new ShrunkGroup[k];
        for (int j = 0; j < k; j++)
        {
            double b = (v[j] + tau2) > 0 ? v[j] / (v[j] + tau2) : 0;
            if (k < 2)
            {
                b = 1;
            }

            result[j] = new ShrunkGroup(groups[j].Group, counts[j], means[j], v[j], b, mu + ((1 - b) * (means[j] - mu)));
        }

        return new ShrinkageResult(mu, tau2, within, result);
    }
}
