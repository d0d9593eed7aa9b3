using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.Optimization;

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
/// Fits the Zwietering et al. (1990) modified Gompertz or logistic curve by Levenberg–Marquardt
/// (MathNet.Numerics <see cref="LevenbergMarquardtMinimizer"/>) with analytic derivatives and box bounds.
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
        double d = lambda - t;
        if (model == SigmoidModel.Gompertz)
        {
            double u = Math.Min(ExponentCap, (mu * Math.E / a * d) + 1.0);
            double eu = Math.Exp(u);
            double g = Math.Exp(-eu);
            double geu = g * eu;
            return (g + (geu * mu * Math.E * d / a), -geu * Math.E * d, -geu * mu * Math.E);
        }

        double v = Math.Min(ExponentCap, (4.0 * mu / a * d) + 2.0);
        double q = Math.Exp(v);
        double s = 1.0 / (1.0 + q);
        double dydv = -a * q * s * s;
        return (s + (dydv * (-4.0 * mu * d / (a * a))), dydv * (4.0 * d / a), dydv * (4.0 * mu / a));
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
        Statistics.MathNetSetup.SingleThreaded();
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
        var lower = Vector<double>.Build.DenseOfArray([yMax * 0.5, mu0 * 1e-3, tMin - span]);
        var upper = Vector<double>.Build.DenseOfArray([yMax * 3.0, mu0 * 20.0, tMax]);
        var x = Vector<double>.Build.DenseOfEnumerable(hours);
        var y = Vector<double>.Build.DenseOfEnumerable(consumedBrix);

        Vector<double> F(Vector<double> p, Vector<double> t) =>
            Vector<double>.Build.Dense(t.Count, i => Evaluate(model, p[0], p[1], p[2], t[i]));

        Matrix<double> J(Vector<double> p, Vector<double> t)
        {
            var m = Matrix<double>.Build.Dense(t.Count, 3);
            for (int i = 0; i < t.Count; i++)
            {
                var (dA, dMu, dL) = Gradient(model, p[0], p[1], p[2], t[i]);
                m[i, 0] = dA;
                m[i, 1] = dMu;
                m[i, 2] = dL;
            }

            return m;
        }

        NonlinearMinimizationResult result;
        try
        {
            var objective = ObjectiveFunction.NonlinearModel(F, J, x, y);
            var solver = new LevenbergMarquardtMinimizer(maximumIterations: 500);
            result = solver.FindMinimum(objective, Vector<double>.Build.DenseOfArray([a0, mu0, lambda0]), lower, upper);
        }
        catch (Exception ex) when (ex is ArithmeticException or ArgumentException or InvalidOperationException or MathNet.Numerics.NonConvergenceException or OptimizationException)
        {
            return new(null, $"no sigmoid fit: the solver failed ({ex.GetType().Name})");
        }

        if (result.ReasonForExit is ExitCondition.ExceedIterations or ExitCondition.InvalidValues or ExitCondition.ManuallyStopped)
        {
            return new(null, $"no sigmoid fit: Levenberg–Marquardt did not converge ({result.ReasonForExit} after {result.Iterations} iterations)");
        }

        var p = result.MinimizingPoint;
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

        return new(new SigmoidFit(model, p[0], p[1], p[2], Math.Sqrt(ssRes / n), ssTot > 0 ? 1.0 - (ssRes / ssTot) : double.NaN, n, result.Iterations), null);
    }
}
