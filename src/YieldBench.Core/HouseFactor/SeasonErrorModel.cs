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
/// ē (each lot weighted once) has variance σ²_w/n + σ²_b·Σn_g²/n² (the standard error of a mean of clustered values).
/// </para>
/// <para>
/// For a lot of a season not yet seen the errors are read as what they are here: with S ≥ 2 seasons they come from
/// leave-one-season-out, where season s is predicted by a model of the other S − 1, so its shift is compared with the
/// mean of theirs: its cluster mean carries u_s − ū₋ₛ = S/(S − 1)·(u_s − ū), and the ANOVA σ²_b estimates
/// (S/(S − 1))² times the season-to-season variance τ². Hence τ² = σ²_b·((S − 1)/S)². The model used next season
/// is fitted on all S seasons, so a new season's lot has error variance V = σ²_w(1 + 1/n) + τ²(1 + 1/S) about ē,
/// and its interval is ē ± t_ν·√V, with ν the Welch–Satterthwaite degrees of freedom of V as a combination of MSW
/// (n − G df) and MSB (G − 1 df) (Satterthwaite 1946, <i>Biometrics Bulletin</i> 2:110): few seasons give few
/// degrees of freedom and a wider interval.
/// </para>
/// <para>
/// With one season, one cluster, or clusters of one lot each, the between-cluster variance cannot be separated:
/// the errors are taken as an independent sample (σ²_w the sample variance, τ² = 0, ν = n − 1), the usual
/// prediction interval ē ± t_{n−1}·s·√(1 + 1/n).
/// </para>
/// </summary>
/// <param name="Count">Errors used.</param>
/// <param name="Clusters">Strain × season clusters among them.</param>
/// <param name="Seasons">Seasons among them.</param>
/// <param name="Mean">Mean error ē, % v/v (positive: wines came out stronger than predicted).</param>
/// <param name="WithinVariance">σ²_w, (% v/v)².</param>
/// <param name="BetweenVariance">σ²_b of the errors as given, (% v/v)².</param>
/// <param name="VarianceOfMean">Var(ē) = σ²_w/n + σ²_b·Σn_g²/n², (% v/v)².</param>
/// <param name="SeasonVariance">τ², the season-to-season variance a new season brings, (% v/v)².</param>
/// <param name="PredictiveVariance">V, the variance of a new season's lot's error about ē, (% v/v)².</param>
/// <param name="DegreesOfFreedom">ν of <paramref name="PredictiveVariance"/> (NaN when undefined).</param>
public sealed record SeasonErrorModel(
    int Count,
    int Clusters,
    int Seasons,
    double Mean,
    double WithinVariance,
    double BetweenVariance,
    double VarianceOfMean,
    double SeasonVariance,
    double PredictiveVariance,
    double DegreesOfFreedom)
{
    /// <summary>Fewest errors for an interval (default rule; fewer give no interval and the output says so).</summary>
    public const int MinimumErrors = 10;

    /// <summary>Standard error of the mean, % v/v.</summary>
    public double StandardErrorOfMean => Math.Sqrt(VarianceOfMean);

    /// <summary>Standard deviation of a new season's lot's error about <see cref="Mean"/>, % v/v.</summary>
    public double PredictiveSd => Math.Sqrt(PredictiveVariance);

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
    /// Fits the model to values with a cluster id each (0-based, dense) drawn from <paramref name="seasons"/> seasons.
    /// </summary>
    public static SeasonErrorModel Of(IReadOnlyList<double> values, IReadOnlyList<int> cluster, int seasons)
    {
        ArgumentNullException.ThrowIfNull(values);
        ArgumentNullException.ThrowIfNull(cluster);
        int n = values.Count;
        if (n == 0)
        {
            return new SeasonErrorModel(0, 0, seasons, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN);
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

        if (used < 2 || n - used < 1 || seasons < 2)
        {
            // No between-cluster variance can be separated: an independent sample.
            double ss = values.Sum(v => (v - mean) * (v - mean));
            double s2 = n >= 2 ? ss / (n - 1) : double.NaN;
            return new SeasonErrorModel(n, used, seasons, mean, s2, 0, s2 / n, 0, s2 * (1 + (1.0 / n)), n >= 2 ? n - 1 : double.NaN);
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
        double varianceOfMean = (msw / n) + (between * sumSquares / ((double)n * n));

        // Leave-one-season-out inflates the season component by (S/(S − 1))² (see the class notes).
        double shrink = (seasons - 1.0) / seasons;
        double seasonVariance = between * shrink * shrink;
        double predictive = (msw * (1 + (1.0 / n))) + (seasonVariance * (1 + (1.0 / seasons)));
        double df;
        if (seasonVariance > 0)
        {
            // V = a·MSW + b·MSB with τ² = shrink²·(MSB − MSW)/n₀.
            double b = shrink * shrink * (1 + (1.0 / seasons)) / n0;
            double a = 1 + (1.0 / n) - b;
            df = predictive * predictive / ((a * a * msw * msw / (n - used)) + (b * b * msb * msb / (used - 1)));
        }
        else
        {
            df = n - used;
        }

        return new SeasonErrorModel(n, used, seasons, mean, msw, between, varianceOfMean, seasonVariance, predictive, df);
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
