using MathNet.Numerics;

namespace YieldBench.Core.Forecast;

/// <summary>
/// Forecasts lots running in the same season together: each lot's grid posterior depends on the season shift δ (a
/// common time scale: a faster season raises every lot's rate by e^δ and shortens its lag by e^−δ), δ has the history's
/// season spread as its prior, and its posterior comes from every lot's readings at once. Pure and deterministic.
/// </summary>
public static class SeasonForecaster
{
    private const int ShiftNodes = 11;
    private const double ShiftHalfWidth = 6.0;

    /// <summary>
    /// Forecasts every course (all of one season). <paramref name="now"/> is the moment the readings stand at (the
    /// last reading of all lots when null, per lot); <paramref name="withCurves"/> adds the chart courses.
    /// </summary>
    public static (IReadOnlyList<LotForecast> Lots, double Shift, double ShiftSd) Run(ForecastModel model, IReadOnlyList<LotCourse> courses, ForecastSettings settings, DateTime? now, bool withCurves)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(courses);
        ArgumentNullException.ThrowIfNull(settings);
        var posts = new LotPosterior[courses.Count];
        Parallel.For(0, courses.Count, i => posts[i] = LotPosterior.Build(courses[i], model, settings));

        // The season shift: a grid over ±6 prior sd, then grids over ±4 posterior sd until the grid's step is small
        // against the spread it finds; each lot's evidence at each δ.
        double tau = Math.Max(model.SeasonSpread, 1e-6);
        double centre = 0, half = tau * ShiftHalfWidth;
        double[] deltas = [];
        double[] shiftWeight = [];
        double[][] evidence = [];
        for (int stage = 0; stage < 5; stage++)
        {
            double c0 = centre, h0 = half;
            deltas = Enumerable.Range(0, ShiftNodes).Select(i => c0 + (h0 * ((2.0 * i / (ShiftNodes - 1)) - 1))).ToArray();
            (shiftWeight, evidence) = ShiftPosterior(posts, deltas, tau);
            double step = deltas[1] - deltas[0];
            double m = deltas.Select((d, i) => d * shiftWeight[i]).Sum();
            double sd = Math.Sqrt(deltas.Select((d, i) => (d - m) * (d - m) * shiftWeight[i]).Sum());
            if (step <= sd)
            {
                break;
            }

            centre = m;
            half = 4.0 * Math.Max(sd, step / 4.0);
        }

        double shift = deltas.Select((d, i) => d * shiftWeight[i]).Sum();
        double shiftSd = Math.Sqrt(deltas.Select((d, i) => (d - shift) * (d - shift) * shiftWeight[i]).Sum());

        var result = new LotForecast[courses.Count];
        Parallel.For(0, courses.Count, j =>
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

    /// <summary>The posterior of δ on the given nodes (prior N(0, τ²)) and each lot's log evidence at each node.</summary>
    private static (double[] Weights, double[][] Evidence) ShiftPosterior(LotPosterior[] posts, double[] deltas, double tau)
    {
        var evidence = new double[posts.Length][];
        Parallel.For(0, posts.Length, j =>
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
        });

        var logShift = new double[deltas.Length];
        for (int d = 0; d < deltas.Length; d++)
        {
            logShift[d] = -0.5 * (deltas[d] / tau) * (deltas[d] / tau);
            foreach (var e in evidence)
            {
                logShift[d] += e[d];
            }
        }

        return (Normalise(logShift), evidence);
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
