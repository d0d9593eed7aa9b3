using YieldBench.Core.Kinetics;

namespace YieldBench.Core.Forecast;

/// <summary>A lot's whole course fitted: °Brix(t) = S0 − (S0 − F)·h(t; κ, λ).</summary>
/// <param name="Model">Sigmoid form.</param>
/// <param name="StartBrix">S0: the must before fermentation, °Brix.</param>
/// <param name="FinalBrix">F: where the hydrometer settles, °Brix.</param>
/// <param name="Kappa">κ = μm/(S0 − F): steepest share consumed per hour.</param>
/// <param name="LagHours">λ: Zwietering's lag, h from the course's origin.</param>
/// <param name="Rmse">Root mean square residual, °Brix.</param>
/// <param name="Points">Readings fitted.</param>
public sealed record CurveFit(SigmoidModel Model, double StartBrix, double FinalBrix, double Kappa, double LagHours, double Rmse, int Points)
{
    /// <summary>μm: steepest consumption, °Brix/h.</summary>
    public double MaxRateBrixPerHour => Kappa * (StartBrix - FinalBrix);

    /// <summary>°Brix on the fitted curve at <paramref name="hours"/>.</summary>
    public double BrixAt(double hours) => StartBrix - ((StartBrix - FinalBrix) * SigmoidShape.Value(Model, Kappa, LagHours, hours));

    /// <summary>Consumption rate on the fitted curve, °Brix/h.</summary>
    public double RateAt(double hours) => (StartBrix - FinalBrix) * SigmoidShape.Slope(Model, Kappa, LagHours, hours);

    /// <summary>Sum of squared residuals.</summary>
    public double SumOfSquares => Rmse * Rmse * Points;
}

/// <summary>
/// Fits a whole sugar course by variable projection: for each (κ, λ) the two linear parameters S0 and F are the
/// least-squares solution, so only κ and λ are searched (a grid, then Nelder–Mead on log κ and λ). Pure.
/// </summary>
public static class CourseFit
{
    /// <summary>Fewest readings fitted: four parameters and two degrees of freedom.</summary>
    public const int MinimumPoints = 6;

    /// <summary>Fits the model; null when the log has too few readings or too little fall to pin four parameters.</summary>
    public static CurveFit? Fit(SigmoidModel model, double[] hours, double[] brix, double minFallBrix = 3.0)
    {
        ArgumentNullException.ThrowIfNull(hours);
        ArgumentNullException.ThrowIfNull(brix);
        int n = hours.Length;
        if (n < MinimumPoints || brix.Max() - brix.Min() < minFallBrix)
        {
            return null;
        }

        // A dense probe log is searched on the means of runs of consecutive readings (at most 240 of them); the final
        // fit is then made on every reading.
        var (th, tb) = Thinned(hours, brix, 240);
        double t0 = hours[0], t1 = hours[^1], span = Math.Max(t1 - t0, 1.0);
        double best = double.PositiveInfinity, bk = 0, bl = 0;
        const int steps = 16;
        for (int i = 0; i <= steps; i++)
        {
            double logK = Math.Log(0.5 / span) + (i * (Math.Log(40.0) / steps));
            for (int j = 0; j <= steps; j++)
            {
                double lambda = t0 - (0.3 * span) + (j * 1.0 * span / steps);
                double ss = Projected(model, th, tb, Math.Exp(logK), lambda, out _, out _);
                if (ss < best)
                {
                    (best, bk, bl) = (ss, logK, lambda);
                }
            }
        }

        var (logKappa, lag) = NelderMead((a, b) => Projected(model, th, tb, Math.Exp(a), b, out _, out _), bk, bl, Math.Log(40.0) / steps, span / steps);
        if (th.Length < n)
        {
            (logKappa, lag) = NelderMead((a, b) => Projected(model, hours, brix, Math.Exp(a), b, out _, out _), logKappa, lag, 0.02, span / 200);
        }

        double kappa = Math.Exp(logKappa);
        double sumSq = Projected(model, hours, brix, kappa, lag, out double s0, out double f);
        if (!double.IsFinite(sumSq) || !(s0 > f) || !Plausible(s0, f, brix))
        {
            return null;
        }

        return new CurveFit(model, s0, f, kappa, lag, Math.Sqrt(sumSq / n), n);
    }

    /// <summary>Most °Brix the fitted must may lie above the log's highest reading (a first reading taken a day late).</summary>
    public const double MostStartAboveReadings = 8.0;

    /// <summary>
    /// A fit is kept only when its must and settling point are sugars a hydrometer reads (−6 to 50 °Brix, as
    /// <see cref="Units.SugarReading"/>) and its must lies at most <see cref="MostStartAboveReadings"/> above the highest
    /// reading. A log that falls in a straight line, or stops long before dry, can be fitted by a sigmoid whose must lies
    /// far above anything measured (100 °Brix was seen): such a curve says nothing about the lot.
    /// </summary>
    private static bool Plausible(double s0, double f, double[] brix) =>
        s0 <= Units.SugarReading.MaxBrix && f >= Units.SugarReading.MinBrix && s0 <= brix.Max() + MostStartAboveReadings;

    private static (double[] Hours, double[] Brix) Thinned(double[] hours, double[] brix, int most)
    {
        int n = hours.Length;
        if (n <= most)
        {
            return (hours, brix);
        }

        var th = new double[most];
        var tb = new double[most];
        for (int g = 0; g < most; g++)
        {
            int from = (int)((long)g * n / most), to = (int)((long)(g + 1) * n / most);
            double sh = 0, sb = 0;
            for (int i = from; i < to; i++)
            {
                sh += hours[i];
                sb += brix[i];
            }

            th[g] = sh / (to - from);
            tb[g] = sb / (to - from);
        }

        return (th, tb);
    }

    /// <summary>Sum of squares at (κ, λ) with S0 and F solved by least squares.</summary>
    public static double Projected(SigmoidModel model, double[] hours, double[] brix, double kappa, double lambda, out double s0, out double f)
    {
        // y = S0·(1 − h) + F·h: normal equations of the two columns (each h worked out once, kept for the residuals).
        int n = hours.Length;
        Span<double> hs = n <= 512 ? stackalloc double[n] : new double[n];
        double a11 = 0, a12 = 0, a22 = 0, b1 = 0, b2 = 0;
        for (int i = 0; i < n; i++)
        {
            double h = SigmoidShape.Value(model, kappa, lambda, hours[i]);
            hs[i] = h;
            double g = 1.0 - h;
            a11 += g * g;
            a12 += g * h;
            a22 += h * h;
            b1 += g * brix[i];
            b2 += h * brix[i];
        }

        double det = (a11 * a22) - (a12 * a12);
        if (!(det > 1e-12 * Math.Max(1.0, a11 * a22)))
        {
            s0 = f = double.NaN;
            return double.PositiveInfinity;
        }

        s0 = ((a22 * b1) - (a12 * b2)) / det;
        f = ((a11 * b2) - (a12 * b1)) / det;
        double ss = 0;
        for (int i = 0; i < n; i++)
        {
            double r = brix[i] - (s0 - ((s0 - f) * hs[i]));
            ss += r * r;
        }

        return ss;
    }

    /// <summary>Nelder–Mead (Nelder &amp; Mead 1965) in two dimensions with the usual coefficients 1, 2, ½, ½.</summary>
    internal static (double X, double Y) NelderMead(Func<double, double, double> f, double x0, double y0, double dx, double dy, int maxIterations = 400, double sizeTolerance = 1e-9, double valueTolerance = 0)
    {
        var p = new (double X, double Y, double V)[3];
        p[0] = (x0, y0, f(x0, y0));
        p[1] = (x0 + dx, y0, f(x0 + dx, y0));
        p[2] = (x0, y0 + dy, f(x0, y0 + dy));
        for (int it = 0; it < maxIterations; it++)
        {
            SortThree(p);
            double size = Math.Abs(p[1].X - p[0].X) + Math.Abs(p[2].X - p[0].X) + ((Math.Abs(p[1].Y - p[0].Y) + Math.Abs(p[2].Y - p[0].Y)) / Math.Max(dy, 1e-9) * dx);
            if (size < sizeTolerance * Math.Max(1.0, dx) || Math.Abs(p[2].V - p[0].V) <= Math.Max(valueTolerance, 1e-14 * Math.Max(1e-12, Math.Abs(p[0].V))))
            {
                break;
            }

            double cx = (p[0].X + p[1].X) / 2, cy = (p[0].Y + p[1].Y) / 2;
            (double X, double Y, double V) At(double t) => (cx + (t * (p[2].X - cx)), cy + (t * (p[2].Y - cy)), f(cx + (t * (p[2].X - cx)), cy + (t * (p[2].Y - cy))));
            var r = At(-1);
            if (r.V < p[0].V)
            {
                var e = At(-2);
                p[2] = e.V < r.V ? e : r;
            }
            else if (r.V < p[1].V)
            {
                p[2] = r;
            }
            else
            {
                var c = r.V < p[2].V ? At(-0.5) : At(0.5);
                if (c.V < Math.Min(r.V, p[2].V))
                {
                    p[2] = c;
                }
                else
                {
                    for (int k = 1; k < 3; k++)
                    {
                        double x = (p[0].X + p[k].X) / 2, y = (p[0].Y + p[k].Y) / 2;
                        p[k] = (x, y, f(x, y));
                    }
                }
            }
        }

        SortThree(p);
        return (p[0].X, p[0].Y);
    }

    /// <summary>Orders the simplex by value with the three compare-and-swaps Array.Sort uses for three items.</summary>
    private static void SortThree((double X, double Y, double V)[] p)
    {
        static void SwapIfGreater((double X, double Y, double V)[] p, int i, int j)
        {
            if (p[i].V.CompareTo(p[j].V) > 0)
            {
                (p[i], p[j]) = (p[j], p[i]);
            }
        }

        SwapIfGreater(p, 0, 1);
        SwapIfGreater(p, 0, 2);
        SwapIfGreater(p, 1, 2);
    }
}
