using MathNet.Numerics.Distributions;

namespace YieldBench.Core.HouseFactor;

/// <summary>A held-out error (actual − predicted, % v/v) with the season and strain of its lot.</summary>
/// <param name="Error">Actual − predicted, % v/v.</param>
/// <param name="Season">The lot's season.</param>
/// <param name="Strain">The lot's strain.</param>
public readonly record struct SeasonError(double Error, int Season, string Strain);

/// <summary>
/// Held-out errors under the one-way random-effects model e = μ + c + ε (Searle, Casella &amp; McCulloch 1992,
/// <i>Variance Components</i>, §3.5–3.6): c is a shift shared by the lots of one strain in one season (a cluster —
/// they share the vintage and the strain's behaviour in it), with variance σ²_b; ε is the lot's own error, with
/// variance σ²_w. Lots of the same season are therefore not counted as independent.
/// <para>
/// Estimates are the ANOVA (method-of-moments) ones for unbalanced clusters: MSW = Σ(e − ē_g)²/(n − G),
/// MSB = Σ n_g(ē_g − ē)²/(G − 1), n₀ = (n − Σn_g²/n)/(G − 1), σ²_w = MSW, σ²_b = max(0, (MSB − MSW)/n₀). The mean
/// ē (each lot weighted once) has variance σ²_w/n + σ²_b·Σn_g²/n². A lot of a season not yet seen has error
/// e_new − ē with variance V = σ²_w + σ²_b + Var(ē), and its interval is ē ± t_ν·√V, with ν the
/// Welch–Satterthwaite degrees of freedom of V as a combination of MSW (n − G df) and MSB (G − 1 df) (Satterthwaite
/// 1946, <i>Biometrics Bulletin</i> 2:110): few seasons give few degrees of freedom and a wider interval.
/// </para>
/// <para>
/// With one cluster, or clusters of one lot each, the between-cluster variance cannot be separated: σ²_b = 0,
/// σ²_w is the sample variance (n − 1) and ν = n − 1, the usual prediction interval for an independent sample.
/// </para>
/// </summary>
/// <param name="Count">Errors used.</param>
/// <param name="Clusters">Strain × season clusters among them.</param>
/// <param name="Seasons">Seasons among them.</param>
/// <param name="Mean">Mean error ē, % v/v (positive: wines came out stronger than predicted).</param>
/// <param name="WithinVariance">σ²_w, (% v/v)².</param>
/// <param name="BetweenVariance">σ²_b, (% v/v)².</param>
/// <param name="VarianceOfMean">Var(ē), (% v/v)².</param>
/// <param name="DegreesOfFreedom">ν of the predictive variance (NaN when undefined).</param>
public sealed record SeasonErrorModel(
    int Count,
    int Clusters,
    int Seasons,
    double Mean,
    double WithinVariance,
    double BetweenVariance,
    double VarianceOfMean,
    double DegreesOfFreedom)
{
    /// <summary>Fewest errors for an interval (default rule; fewer give no interval and the output says so).</summary>
    public const int MinimumErrors = 10;

    /// <summary>Standard error of the mean, % v/v.</summary>
    public double StandardErrorOfMean => Math.Sqrt(VarianceOfMean);

    /// <summary>Standard deviation of a new season's lot's error about <see cref="Mean"/>, % v/v.</summary>
    public double PredictiveSd => Math.Sqrt(WithinVariance + BetweenVariance + VarianceOfMean);

    /// <summary>True when there are enough errors for intervals.</summary>
    public bool HasIntervals => Count >= MinimumErrors && DegreesOfFreedom >= 1 && double.IsFinite(PredictiveSd);

    /// <summary>Fits the model to held-out errors, clustered by strain × season.</summary>
    public static SeasonErrorModel Of(IReadOnlyList<SeasonError> errors)
    {
        ArgumentNullException.ThrowIfNull(errors);
        var values = new double[errors.Count];
        var keys = new Dictionary<(int, string), int>();
        var cluster = new int[errors.Count];
        var seasons = new HashSet<int>();
        for (int i = 0; i < errors.Count; i++)
        {
            values[i] = errors[i].Error;
            var key = (errors[i].Season, errors[i].Strain);
            if (!keys.TryGetValue(key, out int id))
            {
                keys[key] = id = keys.Count;
            }

            cluster[i] = id;
            seasons.Add(errors[i].Season);
        }

        return Of(values, cluster, seasons.Count);
    }

    /// <summary>
    /// Fits the model to values with a cluster id each (0-based, dense); <paramref name="seasons"/> is only recorded.
    /// </summary>
    public static SeasonErrorModel Of(IReadOnlyList<double> values, IReadOnlyList<int> cluster, int seasons)
    {
        ArgumentNullException.ThrowIfNull(values);
        ArgumentNullException.ThrowIfNull(cluster);
        int n = values.Count;
        if (n == 0)
        {
            return new SeasonErrorModel(0, 0, seasons, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN);
        }

        int g = 0;
        foreach (int c in cluster)
        {
            g = Math.Max(g, c + 1);
        }

        var size = new int[g];
        var sum = new double[g];
        double total = 0;
        for (int i = 0; i < n; i++)
        {
            size[cluster[i]]++;
            sum[cluster[i]] += values[i];
            total += values[i];
        }

        double mean = total / n;
        int used = size.Count(s => s > 0);
        double ssw = 0;
        for (int i = 0; i < n; i++)
        {
            double d = values[i] - (sum[cluster[i]] / size[cluster[i]]);
            ssw += d * d;
        }

        if (used < 2 || n - used < 1)
        {
            // No between-cluster variance can be separated: an independent sample.
            double ss = values.Sum(v => (v - mean) * (v - mean));
            double s2 = n >= 2 ? ss / (n - 1) : double.NaN;
            return new SeasonErrorModel(n, used, seasons, mean, s2, 0, s2 / n, n >= 2 ? n - 1 : double.NaN);
        }

        double ssb = 0, sumSquares = 0;
        for (int c = 0; c < g; c++)
        {
            if (size[c] == 0)
            {
                continue;
            }

            double d = (sum[c] / size[c]) - mean;
            ssb += size[c] * d * d;
            sumSquares += (double)size[c] * size[c];
        }

        double msw = ssw / (n - used);
        double msb = ssb / (used - 1);
        double n0 = (n - (sumSquares / n)) / (used - 1);
        double between = Math.Max(0, (msb - msw) / n0);
        double k = sumSquares / ((double)n * n);
        double varianceOfMean = (msw / n) + (between * k);
        double df;
        if (between > 0)
        {
            // V = σ²_w(1 + 1/n) + σ²_b(1 + k) = a·MSW + b·MSB.
            double b = (1 + k) / n0;
            double a = 1 + (1.0 / n) - b;
            double v = (a * msw) + (b * msb);
            df = v * v / ((a * a * msw * msw / (n - used)) + (b * b * msb * msb / (used - 1)));
        }
        else
        {
            df = n - used;
        }

        return new SeasonErrorModel(n, used, seasons, mean, msw, between, varianceOfMean, df);
    }

    /// <summary>The error quantile at probability p ∈ (0, 1) for a lot of a new season: ē + t_ν(p)·√V; NaN without intervals.</summary>
    public double Quantile(double p)
    {
        if (double.IsNaN(p) || p <= 0 || p >= 1)
        {
            throw new ArgumentOutOfRangeException(nameof(p), p, "A probability must be strictly between 0 and 1.");
        }

        return HasIntervals ? Mean + (StudentT.InvCDF(0, 1, DegreesOfFreedom, p) * PredictiveSd) : double.NaN;
    }

    /// <summary>The two-sided error band at <paramref name="level"/> (e.g. 0.8): (quantile((1 − level)/2), quantile((1 + level)/2)).</summary>
    public (double Low, double High) Band(double level) => (Quantile((1 - level) / 2), Quantile((1 + level) / 2));
}
