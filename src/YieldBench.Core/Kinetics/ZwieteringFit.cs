namespace YieldBench.Core.Kinetics;

/// <summary>The two sigmoid forms of Zwietering et al. (1990), reparameterised with biologically meaningful parameters.</summary>
public enum SigmoidModel
{
    /// <summary>Modified Gompertz: y = A·exp{−exp[μm·e/A·(λ − t) + 1]}.</summary>
    Gompertz,

    /// <summary>Modified logistic: y = A / {1 + exp[4μm/A·(λ − t) + 2]}.</summary>
    Logistic,
}

/// <summary>Fitted parameters of a Zwietering sigmoid of sugar consumed (°Brix) against time (h).</summary>
/// <param name="Model">Which form.</param>
/// <param name="AsymptoteBrix">A: sugar consumed at the end, °Brix (the hydrometer runs below 0 °Brix, so A may exceed the start).</param>
/// <param name="MaxRateBrixPerHour">μm: steepest consumption rate, °Brix/h.</param>
/// <param name="LagHours">λ: where the tangent at the steepest point meets zero consumption, h from the origin.</param>
/// <param name="Rmse">Root mean square residual, °Brix.</param>
/// <param name="RSquared">1 − SSres/SStot.</param>
/// <param name="Points">Readings fitted.</param>
/// <param name="Iterations">Levenberg–Marquardt iterations.</param>
public sealed record SigmoidFit(SigmoidModel Model, double AsymptoteBrix, double MaxRateBrixPerHour, double LagHours, double Rmse, double RSquared, int Points, int Iterations)
{
    /// <summary>μm in °Brix/day.</summary>
    public double MaxRateBrixPerDay => MaxRateBrixPerHour * 24.0;

    /// <summary>Predicted sugar consumed at <paramref name="hours"/>, °Brix.</summary>
    public double Predict(double hours) => ZwieteringFit.Evaluate(Model, AsymptoteBrix, MaxRateBrixPerHour, LagHours, hours);
}

/// <summary>A fit, or the reason none is given.</summary>
/// <param name="Fit">The fit, or null.</param>
/// <param name="Reason">Why there is no fit (a sentence), or null.</param>
public sealed record SigmoidFitResult(SigmoidFit? Fit, string? Reason)
{
    /// <summary>True when a fit is given.</summary>
    public bool Succeeded => Fit is not null;
}

/// <summary>
/// Fits the Zwietering et al. (1990) modified Gompertz or logistic curve by Levenberg–Marquardt with analytic
/// derivatives and box bounds (checked against scipy's curve_fit in the tests).
/// </summary>
public static class ZwieteringFit
{
    // exp(50) ≈ 5e21: beyond it the curve is flat to machine precision, and clamping avoids ∞·0 in the derivatives.
    private const double ExponentCap = 50.0;

    /// <summary>Value of the model at t (h).</summary>
    public static double Evaluate(SigmoidModel model, double a, double mu, double lambda, double t)
    {
        if (model == SigmoidModel.Gompertz)
        {
            double u = Math.Min(ExponentCap, (mu * Math.E / a * (lambda - t)) + 1.0);
            return a * Math.Exp(-Math.Exp(u));
        }

        double v = Math.Min(ExponentCap, (4.0 * mu / a * (lambda - t)) + 2.0);
        return a / (1.0 + Math.Exp(v));
    }

    /// <summary>Partial derivatives (∂/∂A, ∂/∂μm, ∂/∂λ) of the model at t.</summary>
    public static (double dA, double dMu, double dLambda) Gradient(SigmoidModel model, double a, double mu, double lambda, double t)
    {
        var (_, dA, dMu, dLambda) = ValueAndGradient(model, a, mu, lambda, t);
        return (dA, dMu, dLambda);
    }

    /// <summary>The model's value and partial derivatives at t, sharing the exponentials.</summary>
    internal static (double Value, double dA, double dMu, double dLambda) ValueAndGradient(SigmoidModel model, double a, double mu, double lambda, double t)
    {
        double d = lambda - t;
        if (model == SigmoidModel.Gompertz)
        {
            double u = Math.Min(ExponentCap, (mu * Math.E / a * d) + 1.0);
            double eu = Math.Exp(u);
            double g = Math.Exp(-eu);
            double geu = g * eu;
            return (a * g, g + (geu * mu * Math.E * d / a), -geu * Math.E * d, -geu * mu * Math.E);
        }

        double v = Math.Min(ExponentCap, (4.0 * mu / a * d) + 2.0);
        double q = Math.Exp(v);
        double s = 1.0 / (1.0 + q);
        double dydv = -a * q * s * s;
        return (a * s, s + (dydv * (-4.0 * mu * d / (a * a))), dydv * (4.0 * d / a), dydv * (4.0 * mu / a));
    }

    /// <summary>
    /// Fits the model to sugar consumed (°Brix) against time (h from the origin). Never throws on data it cannot fit:
    /// the result then carries the reason.
    /// </summary>
    /// <param name="model">Which sigmoid.</param>
    /// <param name="hours">Times, h, ascending.</param>
    /// <param name="consumedBrix">Sugar consumed since the start, °Brix.</param>
    /// <param name="minPoints">Fewest points accepted.</param>
    /// <param name="minConsumedBrix">Least total consumption accepted, °Brix.</param>
    public static SigmoidFitResult Fit(SigmoidModel model, IReadOnlyList<double> hours, IReadOnlyList<double> consumedBrix, int minPoints = 6, double minConsumedBrix = 3.0)
    {
        ArgumentNullException.ThrowIfNull(hours);
        ArgumentNullException.ThrowIfNull(consumedBrix);
        if (hours.Count != consumedBrix.Count)
        {
            throw new ArgumentException("Times and values must have the same length.", nameof(consumedBrix));
        }

        int n = hours.Count;
        if (n < minPoints)
        {
            return new(null, $"no sigmoid fit: {n} sugar readings, at least {minPoints} are needed");
        }

        double yMax = consumedBrix.Max();
        if (yMax < minConsumedBrix)
        {
            return new(null, $"no sigmoid fit: only {yMax:0.0} °Brix consumed in the log, at least {minConsumedBrix:0.0} are needed");
        }

        double tMin = hours[0], tMax = hours[n - 1];
        double span = Math.Max(tMax - tMin, 1e-6);

        // Start from the data: A at the largest consumption, μm at the steepest chord, λ where that chord's tangent meets zero.
        double mu0 = 0, tAt = tMin, yAt = 0;
        for (int i = 1; i < n; i++)
        {
            double dt = hours[i] - hours[i - 1];
            if (dt <= 0)
            {
                continue;
            }

            double slope = (consumedBrix[i] - consumedBrix[i - 1]) / dt;
            if (slope > mu0)
            {
                mu0 = slope;
                tAt = 0.5 * (hours[i] + hours[i - 1]);
                yAt = 0.5 * (consumedBrix[i] + consumedBrix[i - 1]);
            }
        }

        if (!(mu0 > 0))
        {
            return new(null, "no sigmoid fit: the sugar never fell between readings");
        }

        double a0 = yMax * 1.02;
        double lambda0 = Math.Clamp(tAt - (yAt / mu0), tMin - span, tMax);
        double[] lower = [yMax * 0.5, mu0 * 1e-3, tMin - span];
        double[] upper = [yMax * 3.0, mu0 * 20.0, tMax];
        var t = hours.ToArray();
        var y = consumedBrix.ToArray();
        var (p, iterations, converged) = LevenbergMarquardt(model, t, y, [a0, mu0, lambda0], lower, upper);
        if (!converged)
        {
            return new(null, $"no sigmoid fit: Levenberg–Marquardt did not converge (no settled optimum after {iterations} iterations)");
        }

        if (p.Any(v => !double.IsFinite(v)))
        {
            return new(null, "no sigmoid fit: the solver returned non-finite parameters");
        }

        for (int k = 0; k < 3; k++)
        {
            double tol = 1e-6 * Math.Max(1.0, Math.Abs(upper[k] - lower[k]));
            if (Math.Abs(p[k] - lower[k]) < tol || Math.Abs(p[k] - upper[k]) < tol)
            {
                string name = k switch { 0 => "asymptote A", 1 => "maximum rate μm", _ => "lag λ" };
                return new(null, $"no sigmoid fit: the {name} ran to the edge of its allowed range, so the log does not pin it down");
            }
        }

        double mean = consumedBrix.Average();
        double ssRes = 0, ssTot = 0;
        for (int i = 0; i < n; i++)
        {
            double r = consumedBrix[i] - Evaluate(model, p[0], p[1], p[2], hours[i]);
            ssRes += r * r;
            ssTot += (consumedBrix[i] - mean) * (consumedBrix[i] - mean);
        }

        return new(new SigmoidFit(model, p[0], p[1], p[2], Math.Sqrt(ssRes / n), ssTot > 0 ? 1.0 - (ssRes / ssTot) : double.NaN, n, iterations), null);
    }

    /// <summary>Most iterations of <see cref="LevenbergMarquardt"/>.</summary>
    public const int MaximumIterations = 500;

    /// <summary>
    /// Levenberg–Marquardt for the three parameters (Marquardt 1963; Moré 1978 for the scaling and stopping rules, as
    /// MINPACK's lmder that scipy's curve_fit calls): each step solves (JᵀJ + μ·diag(JᵀJ))·δ = Jᵀr by Cholesky, the
    /// trial point is clipped to the box, a step that lowers the sum of squares is taken and μ shrinks tenfold,
    /// otherwise μ grows tenfold. It stops when the relative decrease of the sum of squares and the relative step both
    /// fall below 1e-14 (scipy's tolerances in the reference fits), or when no step can lower the sum any more.
    /// Written out for three parameters because a general solver allocated vectors and matrices on every evaluation,
    /// the largest cost of a review with tens of thousands of logs.
    /// </summary>
    private static (double[] P, int Iterations, bool Converged) LevenbergMarquardt(SigmoidModel model, double[] t, double[] y, double[] start, double[] lower, double[] upper)
    {
        const double tolerance = 1e-14;
        int n = t.Length;
        var p = new double[3];
        for (int k = 0; k < 3; k++)
        {
            p[k] = Math.Clamp(start[k], lower[k], upper[k]);
        }

        double ssr = SumOfSquares(model, t, y, p);
        double damping = 1e-3;
        Span<double> jtj = stackalloc double[9];
        Span<double> g = stackalloc double[3];
        Span<double> a = stackalloc double[9];
        Span<double> step = stackalloc double[3];
        var trial = new double[3];
        for (int iter = 1; iter <= MaximumIterations; iter++)
        {
            jtj.Clear();
            g.Clear();
            for (int i = 0; i < n; i++)
            {
                var (value, d0, d1, d2) = ValueAndGradient(model, p[0], p[1], p[2], t[i]);
                double r = y[i] - value;
                jtj[0] += d0 * d0; jtj[1] += d0 * d1; jtj[2] += d0 * d2;
                jtj[4] += d1 * d1; jtj[5] += d1 * d2; jtj[8] += d2 * d2;
                g[0] += d0 * r; g[1] += d1 * r; g[2] += d2 * r;
            }

            jtj[3] = jtj[1]; jtj[6] = jtj[2]; jtj[7] = jtj[5];
            if (!(double.IsFinite(jtj[0]) && double.IsFinite(jtj[4]) && double.IsFinite(jtj[8])))
            {
                return (p, iter, false);
            }

            while (true)
            {
                jtj.CopyTo(a);
                for (int k = 0; k < 3; k++)
                {
                    a[(k * 3) + k] += damping * Math.Max(jtj[(k * 3) + k], 1e-300);
                }

                if (!SolveSymmetric3(a, g, step))
                {
                    damping *= 10;
                    if (damping > 1e20)
                    {
                        return (p, iter, true);
                    }

                    continue;
                }

                for (int k = 0; k < 3; k++)
                {
                    trial[k] = Math.Clamp(p[k] + step[k], lower[k], upper[k]);
                }

                double trialSsr = SumOfSquares(model, t, y, trial);
                if (double.IsFinite(trialSsr) && trialSsr < ssr)
                {
                    double relativeDecrease = (ssr - trialSsr) / Math.Max(ssr, 1e-300);
                    double relativeStep = 0;
                    for (int k = 0; k < 3; k++)
                    {
                        relativeStep = Math.Max(relativeStep, Math.Abs(trial[k] - p[k]) / (Math.Abs(p[k]) + tolerance));
                    }

                    Array.Copy(trial, p, 3);
                    ssr = trialSsr;
                    damping = Math.Max(damping / 10, 1e-15);
                    if (relativeDecrease <= tolerance && relativeStep <= 1e-10)
                    {
                        return (p, iter, true);
                    }

                    break;
                }

                damping *= 10;
                if (damping > 1e20)
                {
                    // No step in any direction lowers the sum of squares: p is the optimum to machine precision.
                    return (p, iter, true);
                }
            }
        }

        return (p, MaximumIterations, false);
    }

    private static double SumOfSquares(SigmoidModel model, double[] t, double[] y, double[] p)
    {
        double sum = 0;
        for (int i = 0; i < t.Length; i++)
        {
            double r = y[i] - Evaluate(model, p[0], p[1], p[2], t[i]);
            sum += r * r;
        }

        return sum;
    }

    /// <summary>Solves the symmetric 3×3 system a·x = b by Cholesky; false when a is not positive definite.</summary>
    private static bool SolveSymmetric3(Span<double> a, ReadOnlySpan<double> b, Span<double> x)
    {
        double l00 = a[0];
        if (!(l00 > 0))
        {
            return false;
        }

        l00 = Math.Sqrt(l00);
        double l10 = a[3] / l00, l20 = a[6] / l00;
        double d11 = a[4] - (l10 * l10);
        if (!(d11 > 0))
        {
            return false;
        }

        double l11 = Math.Sqrt(d11);
        double l21 = (a[7] - (l20 * l10)) / l11;
        double d22 = a[8] - (l20 * l20) - (l21 * l21);
        if (!(d22 > 0))
        {
            return false;
        }

        double l22 = Math.Sqrt(d22);
        double z0 = b[0] / l00;
        double z1 = (b[1] - (l10 * z0)) / l11;
        double z2 = (b[2] - (l20 * z0) - (l21 * z1)) / l22;
        x[2] = z2 / l22;
        x[1] = (z1 - (l21 * x[2])) / l11;
        x[0] = (z0 - (l10 * x[1]) - (l20 * x[2])) / l00;
        return double.IsFinite(x[0]) && double.IsFinite(x[1]) && double.IsFinite(x[2]);
    }
}
