using YieldBench.Core.Kinetics;

namespace YieldBench.Core.Forecast;

/// <summary>
/// The Zwietering et al. (1990) sigmoids scaled to run from 0 to 1: h(t) = y(t)/A, with κ = μm/A the steepest
/// fraction consumed per hour and λ the lag. The sugar course is °Brix(t) = S0 − (S0 − F)·h(t): S0 the must before
/// fermentation, F where the hydrometer settles. The steepest slope of h is κ, so the steepest consumption is
/// μm = κ·(S0 − F). Same curves as <see cref="ZwieteringFit.Evaluate"/> (a test checks it).
/// </summary>
public static class SigmoidShape
{
    // exp(50) is flat to machine precision; capping avoids ∞·0 (as the kinetics fit does).
    private const double ExponentCap = 50.0;

    /// <summary>h(t) in (0, 1).</summary>
    public static double Value(SigmoidModel model, double kappa, double lambda, double t)
    {
        if (model == SigmoidModel.Gompertz)
        {
            double u = Math.Min(ExponentCap, (kappa * Math.E * (lambda - t)) + 1.0);
            return Math.Exp(-Math.Exp(u));
        }

        double v = Math.Min(ExponentCap, (4.0 * kappa * (lambda - t)) + 2.0);
        return 1.0 / (1.0 + Math.Exp(v));
    }

    /// <summary>dh/dt at t, per hour (largest, κ, at the steepest point).</summary>
    public static double Slope(SigmoidModel model, double kappa, double lambda, double t)
    {
        if (model == SigmoidModel.Gompertz)
        {
            double u = Math.Min(ExponentCap, (kappa * Math.E * (lambda - t)) + 1.0);
            double eu = Math.Exp(u);
            return Math.Exp(-eu) * eu * kappa * Math.E;
        }

        double v = Math.Min(ExponentCap, (4.0 * kappa * (lambda - t)) + 2.0);
        double h = 1.0 / (1.0 + Math.Exp(v));
        return 4.0 * kappa * h * (1.0 - h);
    }

    /// <summary>The time at which h reaches <paramref name="share"/> (0 &lt; share &lt; 1).</summary>
    public static double TimeAt(SigmoidModel model, double kappa, double lambda, double share)
    {
        if (model == SigmoidModel.Gompertz)
        {
            return lambda - ((Math.Log(-Math.Log(share)) - 1.0) / (kappa * Math.E));
        }

        return lambda - ((Math.Log((1.0 / share) - 1.0) - 2.0) / (4.0 * kappa));
    }

    /// <summary>The time of the steepest slope (where the rate, and the temperature it drives, peak).</summary>
    public static double SteepestAt(SigmoidModel model, double kappa, double lambda) =>
        model == SigmoidModel.Gompertz ? lambda + (1.0 / (kappa * Math.E)) : lambda + (1.0 / (2.0 * kappa));
}
