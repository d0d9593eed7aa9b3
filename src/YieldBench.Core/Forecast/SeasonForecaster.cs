using MathNet.Numerics;

namespace YieldBench.Core.Forecast;

/// <summary>
/// Forecasts lots running in the same season together: each lot's grid posterior depends on the season shift δ (a
/// common time scale: a faster season raises every lot's rate by e^δ and shortens its lag by e^−δ), δ has the history's
/// season spread as its prior, and its posterior comes from every lot's readings at once. Pure and deterministic; runs
/// on the calling thread (the backtest runs its seasons and cuts side by side instead).
/// </summary>
public static class SeasonForecaster
{
    /// <summary>Nodes of the 7-point Gauss–Hermite rule (weight e^(−x²); Abramowitz &amp; Stegun 1964, Table 25.10).</summary>
    internal static readonly double[] HermiteNodes = [-2.651961356835233, -1.673551628767471, -0.816287882858965, 0, 0.816287882858965, 1.673551628767471, 2.651961356835233];

    /// <summary>Weights of the 7-point Gauss–Hermite rule.</summary>
    internal static readonly double[] HermiteWeights = [0.000971781245099519, 0.054515582819127, 0.425607252610128, 0.810264617556807, 0.425607252610128, 0.054515582819127, 0.000971781245099519];

    /// <summary>
    /// Forecasts every course (all of one season). <paramref name="now"/> is the moment the readings stand at (the
    /// last reading of all lots when null, per lot); <paramref name="withCurves"/> adds the chart courses.
    /// </summary>
    public static (IReadOnlyList<LotForecast> Lots, double Shift, double ShiftSd) Run(ForecastModel model, IReadOnlyList<LotCourse> courses, ForecastSettings settings, DateTime? now, bool withCurves)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(courses);
        ArgumentNullException.ThrowIfNull(settings);
        // The lots' grids, and below their summaries, are each independent: with the chart courses (the running lots)
        // they are made side by side, each into its own slot; the backtest runs its (season, cut) jobs side by side
        // instead.
        var posts = new LotPosterior[courses.Count];
        For(withCurves, courses.Count, i => posts[i] = LotPosterior.Build(courses[i], model, settings));

        // The season shift. Each lot's log evidence is nearly quadratic in δ: three evaluations (δ = −τ, 0, τ) give its
        // slope and curvature, and with the N(0, τ²) prior a Gaussian approximation of δ's posterior. Seven
        // Gauss–Hermite nodes of that Gaussian carry the exact posterior: each node's weight is corrected by the ratio
        // of the exact posterior (prior × every lot's evidence there) to the approximation.
        double tau = Math.Max(model.SeasonSpread, 1e-6);
        var (_, probe) = ShiftPosterior(posts, [-tau, 0, tau], tau);
        double precision = 1 / (tau * tau), slope = 0;
        foreach (var e in probe)
        {
            slope += (e[2] - e[0]) / (2 * tau);
            precision += Math.Max(0, -(e[2] - (2 * e[1]) + e[0]) / (tau * tau));
        }

        double approxMean = slope / precision, approxSd = 1 / Math.Sqrt(precision);
        var deltas = HermiteNodes.Select(x => approxMean + (Math.Sqrt(2) * approxSd * x)).ToArray();
        var (exact, evidence) = ShiftPosterior(posts, deltas, tau);
        var logCorrected = new double[deltas.Length];
        for (int i = 0; i < deltas.Length; i++)
        {
            // Weight of node i: its Gauss–Hermite weight × exact posterior ÷ approximating density (both up to constants).
            double z = (deltas[i] - approxMean) / approxSd;
            logCorrected[i] = Math.Log(HermiteWeights[i]) + exact[i] + (0.5 * z * z);
        }

        var shiftWeight = Normalise(logCorrected);

        double shift = deltas.Select((d, i) => d * shiftWeight[i]).Sum();
        double shiftSd = Math.Sqrt(deltas.Select((d, i) => (d - shift) * (d - shift) * shiftWeight[i]).Sum());

        var result = new LotForecast[courses.Count];
        For(withCurves, courses.Count, j =>
        {
            var p = posts[j];
            var w = new double[p.Nodes];
            var priors = new double[p.Nodes];
            for (int d = 0; d < deltas.Length; d++)
            {
                if (shiftWeight[d] < 1e-12)
                {
                    continue;
                }

                p.LogPriors(p.ShiftedPrior(deltas[d]), priors);
                for (int k = 0; k < p.Nodes; k++)
                {
                    w[k] += shiftWeight[d] * Math.Exp(p.LogLik[k] + priors[k] + p.LogCell - evidence[j][d]);
                }
            }

            double total = w.Sum();
            for (int k = 0; k < w.Length; k++)
            {
                w[k] /= total;
            }

            double nowHours = now is { } t ? p.Course.HoursOf(t) : LastHours(p.Course);
            result[j] = PosteriorSummary.Summarise(p, w, nowHours, shift, settings, withCurves);
        });

        return (result, shift, shiftSd);
    }

    private static void For(bool sideBySide, int count, Action<int> body)
    {
        if (sideBySide)
        {
            Parallel.For(0, count, body);
            return;
        }

        for (int i = 0; i < count; i++)
        {
            body(i);
        }
    }

    /// <summary>The log posterior of δ on the given nodes (prior N(0, τ²), unnormalised) and each lot's log evidence at each node.</summary>
    private static (double[] Weights, double[][] Evidence) ShiftPosterior(LotPosterior[] posts, double[] deltas, double tau)
    {
        var evidence = new double[posts.Length][];
        for (int j = 0; j < posts.Length; j++)
        {
            var p = posts[j];
            var e = new double[deltas.Length];
            var terms = new double[p.Nodes];
            for (int d = 0; d < deltas.Length; d++)
            {
                double max = double.NegativeInfinity;
                p.LogPriors(p.ShiftedPrior(deltas[d]), terms);
                for (int k = 0; k < p.Nodes; k++)
                {
                    terms[k] += p.LogLik[k];
                    max = Math.Max(max, terms[k]);
                }

                double s = 0;
                for (int k = 0; k < p.Nodes; k++)
                {
                    s += Math.Exp(terms[k] - max);
                }

                e[d] = max + Math.Log(s) + p.LogCell;
            }

            evidence[j] = e;
        }

        var logShift = new double[deltas.Length];
        for (int d = 0; d < deltas.Length; d++)
        {
            logShift[d] = -0.5 * (deltas[d] / tau) * (deltas[d] / tau);
            foreach (var e in evidence)
            {
                logShift[d] += e[d];
            }
        }

        return (logShift, evidence);
    }

    /// <summary>The hours of a course's last reading (0 when it has none).</summary>
    public static double LastHours(LotCourse c) =>
        Math.Max(c.SugarHours.Length > 0 ? c.SugarHours[^1] : 0, c.TempHours.Length > 0 ? c.TempHours[^1] : 0);

    private static double[] Normalise(double[] logs)
    {
        double max = logs.Max();
        var w = logs.Select(v => Math.Exp(v - max)).ToArray();
        double s = w.Sum();
        return w.Select(v => v / s).ToArray();
    }

    /// <summary>Φ, the standard normal distribution function.</summary>
    internal static double Phi(double z) => 0.5 * SpecialFunctions.Erfc(-z / Math.Sqrt(2));

    /// <summary>φ, the standard normal density.</summary>
    internal static double PhiDensity(double z) => Math.Exp(-0.5 * z * z) / Math.Sqrt(2 * Math.PI);
}
