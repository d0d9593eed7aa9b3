using YieldBench.Core.Kinetics;

namespace YieldBench.Core.Forecast;

/// <summary>A finished lot's log as the forecast learns from it: the whole-course fit, the temperature fit and what happened.</summary>
public sealed record PastLot
{
    /// <summary>The course read.</summary>
    public required LotCourse Course { get; init; }

    /// <summary>Whole-course fit of the modified Gompertz, or null when the log does not pin it down.</summary>
    public CurveFit? Gompertz { get; init; }

    /// <summary>Whole-course fit of the modified logistic, or null.</summary>
    public CurveFit? Logistic { get; init; }

    /// <summary>The fit of the given form.</summary>
    public CurveFit? FitOf(SigmoidModel model) => model == SigmoidModel.Gompertz ? Gompertz : Logistic;

    /// <summary>Hours to one-third depletion of the lot record's starting sugar, as logged (interpolated), or null.</summary>
    public double? OneThirdHours { get; init; }

    /// <summary>Hours to the dry reading, as logged, or null when the log never reached it.</summary>
    public double? DryHours { get; init; }

    /// <summary>Highest logged temperature, °C, or null.</summary>
    public double? PeakC { get; init; }

    /// <summary>Hours of the highest logged temperature, or null.</summary>
    public double? PeakHours { get; init; }
}

/// <summary>
/// A lot's temperatures on the fitted sugar course: T(t) = Ta + (P − Ta)·s(t − d), where s is the consumption rate
/// divided by its maximum (0 to 1): the must climbs from its own temperature toward the peak P in step with the rate,
/// d hours behind it.
/// </summary>
/// <param name="MustC">Ta: the must's temperature with no fermentation heat, °C.</param>
/// <param name="PeakC">P: the temperature at the fastest rate, °C.</param>
/// <param name="DelayHours">d, h.</param>
/// <param name="Rmse">Root mean square residual, °C.</param>
/// <param name="Points">Readings fitted.</param>
public sealed record TemperatureFit(double MustC, double PeakC, double DelayHours, double Rmse, int Points);

/// <summary>Reads what happened in a log: one-third depletion, dryness and the peak temperature.</summary>
public static class LoggedEvents
{
    /// <summary>Hours at which the logged sugar first reaches <paramref name="level"/> (interpolated), or null.</summary>
    public static double? FirstCrossing(double[] hours, double[] brix, double level)
    {
        ArgumentNullException.ThrowIfNull(hours);
        ArgumentNullException.ThrowIfNull(brix);
        if (brix.Length == 0)
        {
            return null;
        }

        if (brix[0] <= level)
        {
            return hours[0];
        }

        for (int i = 1; i < brix.Length; i++)
        {
            if (brix[i] <= level)
            {
                return hours[i - 1] + ((hours[i] - hours[i - 1]) * (brix[i - 1] - level) / (brix[i - 1] - brix[i]));
            }
        }

        return null;
    }

    /// <summary>The one-third level: (1 − share) × the lot record's starting sugar, °Brix.</summary>
    public static double DepletionLevel(LotCourse course, ForecastSettings settings) => (1.0 - settings.DepletionShare) * course.StartBrix;

    /// <summary>The past lot with its fits (both forms) and events.</summary>
    public static PastLot Read(LotCourse course, ForecastSettings settings)
    {
        ArgumentNullException.ThrowIfNull(course);
        ArgumentNullException.ThrowIfNull(settings);
        double? peak = null, peakAt = null;
        for (int i = 0; i < course.TempC.Length; i++)
        {
            if (peak is null || course.TempC[i] > peak)
            {
                (peak, peakAt) = (course.TempC[i], course.TempHours[i]);
            }
        }

        return new PastLot
        {
            Course = course,
            Gompertz = CourseFit.Fit(SigmoidModel.Gompertz, course.SugarHours, course.SugarBrix),
            Logistic = CourseFit.Fit(SigmoidModel.Logistic, course.SugarHours, course.SugarBrix),
            OneThirdHours = FirstCrossing(course.SugarHours, course.SugarBrix, DepletionLevel(course, settings)),
            DryHours = FirstCrossing(course.SugarHours, course.SugarBrix, settings.Kinetics.DryBrix),
            PeakC = peak,
            PeakHours = peakAt,
        };
    }

    /// <summary>
    /// Least-squares (Ta, P) of the temperature readings on the fitted course for a delay d; null with fewer than
    /// four temperature readings or when the rate does not vary over them.
    /// </summary>
    public static TemperatureFit? FitTemperature(LotCourse course, CurveFit fit, double delayHours)
    {
        ArgumentNullException.ThrowIfNull(course);
        ArgumentNullException.ThrowIfNull(fit);
        if (course.TempC.Length < 4)
        {
            return null;
        }

        var sums = default(LinearSums);
        for (int i = 0; i < course.TempC.Length; i++)
        {
            double s = SigmoidShape.Slope(fit.Model, fit.Kappa, fit.LagHours, course.TempHours[i] - delayHours) / fit.Kappa;
            sums.Add(1.0 - s, s, course.TempC[i]);
        }

        double det = (sums.S11 * sums.S22) - (sums.S12 * sums.S12);
        if (!(det > 1e-9 * Math.Max(1.0, sums.S11 * sums.S22)))
        {
            return null;
        }

        double ta = ((sums.S22 * sums.S1Y) - (sums.S12 * sums.S2Y)) / det;
        double p = ((sums.S11 * sums.S2Y) - (sums.S12 * sums.S1Y)) / det;
        double ss = sums.SYY - (2 * ((ta * sums.S1Y) + (p * sums.S2Y))) + (ta * ta * sums.S11) + (2 * ta * p * sums.S12) + (p * p * sums.S22);
        return new TemperatureFit(ta, p, delayHours, Math.Sqrt(Math.Max(ss, 0) / sums.N), sums.N);
    }
}
