using YieldBench.Core.Kinetics;
using static YieldBench.Core.Tests.Kinetics.KineticsTestData;

namespace YieldBench.Core.Tests.Kinetics;

public class ZwieteringFitTests
{
    // Invented "true" parameters: 25 °Brix consumed, 0.30 °Brix/h at the steepest, 15 h lag.
    private const double A = 25.0, Mu = 0.30, Lambda = 15.0;

    private static (double[] T, double[] Y) Synthetic(SigmoidModel model, int seed, double noiseSd)
    {
        var rng = new Random(seed);
        var t = Enumerable.Range(0, 29).Select(i => i * 6.0).ToArray();
        var y = t.Select(x => ZwieteringFit.Evaluate(model, A, Mu, Lambda, x) + (noiseSd * Gaussian(rng))).ToArray();
        return (t, y);
    }

    [Theory]
    [InlineData(SigmoidModel.Gompertz)]
    [InlineData(SigmoidModel.Logistic)]
    public void The_fit_recovers_the_parameters_of_noisy_synthetic_data(SigmoidModel model)
    {
        // Given 29 readings 6 h apart from the curve with seeded Gaussian noise, sd 0.15 °Brix (a hydrometer's reading error)
        var (t, y) = Synthetic(model, 7, 0.15);

        // When fitted
        var result = ZwieteringFit.Fit(model, t, y);

        // Then A is within 2 %, μm within 8 %, λ within 2 h, and the RMSE is near the noise level
        Assert.True(result.Succeeded, result.Reason);
        var fit = result.Fit!;
        Assert.InRange(fit.AsymptoteBrix, A * 0.98, A * 1.02);
        Assert.InRange(fit.MaxRateBrixPerHour, Mu * 0.92, Mu * 1.08);
        Assert.InRange(fit.LagHours, Lambda - 2.0, Lambda + 2.0);
        Assert.InRange(fit.Rmse, 0.07, 0.25);
        Assert.True(fit.RSquared > 0.999);
        Assert.Equal(29, fit.Points);
        Assert.Equal(fit.MaxRateBrixPerHour * 24.0, fit.MaxRateBrixPerDay, 12);
    }

    // Sugar consumed (°Brix) every 6 h from Gompertz(A 25, μm 0.30, λ 15) plus Gaussian noise sd 0.15, rounded to 0.01.
    // Generated and fitted with scipy 1.10.1 / numpy 1.24.2 (Debian python3-scipy 1.10.1-2, `apt-get install python3-scipy`):
    //   rng = numpy.random.default_rng(2025); y = round(gomp(t, 25, 0.30, 15) + rng.normal(0, 0.15, 29), 2)
    //   scipy.optimize.curve_fit(f, t, y, p0=[25, 0.3, 15], method="lm", xtol=ftol=gtol=1e-14)
    private static readonly double[] OracleY =
    [
        -0.04, 0.66, 1.17, 1.96, 2.93, 4.84, 6.24, 8.14, 10.00, 11.72, 13.33, 15.04, 16.45, 17.74, 18.53, 19.70, 20.50, 21.76,
        21.83, 22.64, 22.63, 23.19, 23.33, 23.83, 24.28, 24.05, 24.44, 24.56, 24.64,
    ];

    [Theory]
    [InlineData(SigmoidModel.Gompertz, 24.97966501, 0.30320166, 15.45343277, 0.17150414, 0.99960062)]
    [InlineData(SigmoidModel.Logistic, 24.05716655, 0.31003137, 18.43444130, 0.58524424, 0.99534934)]
    public void The_fit_agrees_with_scipy_curve_fit_on_the_same_data(SigmoidModel model, double a, double mu, double lambda, double rmse, double r2)
    {
        // Given the oracle data set above
        var t = Enumerable.Range(0, 29).Select(i => i * 6.0).ToArray();

        // When fitted here
        var fit = ZwieteringFit.Fit(model, t, OracleY).Fit!;

        // Then the least-squares optimum is scipy's (Levenberg–Marquardt, MINPACK) to 1e-5 relative
        Assert.Equal(a, fit.AsymptoteBrix, a * 1e-5);
        Assert.Equal(mu, fit.MaxRateBrixPerHour, mu * 1e-5);
        Assert.Equal(lambda, fit.LagHours, lambda * 1e-5);
        Assert.Equal(rmse, fit.Rmse, 1e-6);
        Assert.Equal(r2, fit.RSquared, 1e-7);
    }

    [Theory]
    [InlineData(SigmoidModel.Gompertz)]
    [InlineData(SigmoidModel.Logistic)]
    public void Noise_free_data_is_recovered_almost_exactly(SigmoidModel model)
    {
        // Given the exact curve
        var (t, y) = Synthetic(model, 1, 0.0);

        // When fitted
        var fit = ZwieteringFit.Fit(model, t, y).Fit!;

        // Then the parameters come back to 1e-5
        Assert.Equal(A, fit.AsymptoteBrix, 5);
        Assert.Equal(Mu, fit.MaxRateBrixPerHour, 5);
        Assert.Equal(Lambda, fit.LagHours, 5);
    }

    [Fact]
    public void The_curves_have_the_properties_Zwietering_defines_them_by()
    {
        // Given Zwietering et al. (1990): at t = λ the Gompertz form equals A·exp(−e) and the logistic form A/(1 + e²);
        // the steepest slope is μm, reached at t = λ + A/(μm·e) (Gompertz) and t = λ + A/(2μm) (logistic)
        double tiG = Lambda + (A / (Mu * Math.E));
        double tiL = Lambda + (A / (2.0 * Mu));
        double h = 1e-4;
        double Slope(SigmoidModel m, double t) => (ZwieteringFit.Evaluate(m, A, Mu, Lambda, t + h) - ZwieteringFit.Evaluate(m, A, Mu, Lambda, t - h)) / (2 * h);

        // When evaluated
        // Then each property holds
        Assert.Equal(A * Math.Exp(-Math.E), ZwieteringFit.Evaluate(SigmoidModel.Gompertz, A, Mu, Lambda, Lambda), 12);
        Assert.Equal(A / (1.0 + (Math.E * Math.E)), ZwieteringFit.Evaluate(SigmoidModel.Logistic, A, Mu, Lambda, Lambda), 12);
        Assert.Equal(Mu, Slope(SigmoidModel.Gompertz, tiG), 6);
        Assert.Equal(Mu, Slope(SigmoidModel.Logistic, tiL), 6);
        Assert.True(Slope(SigmoidModel.Gompertz, tiG + 5) < Mu && Slope(SigmoidModel.Gompertz, tiG - 5) < Mu);
    }

    [Theory]
    [InlineData(SigmoidModel.Gompertz, 10.0)]
    [InlineData(SigmoidModel.Gompertz, 60.0)]
    [InlineData(SigmoidModel.Logistic, 10.0)]
    [InlineData(SigmoidModel.Logistic, 60.0)]
    public void The_analytic_derivatives_agree_with_finite_differences(SigmoidModel model, double t)
    {
        // Given a point on the curve
        const double e = 1e-6;
        double V(double a, double mu, double l) => ZwieteringFit.Evaluate(model, a, mu, l, t);

        // When the analytic gradient is compared with central differences
        var (dA, dMu, dL) = ZwieteringFit.Gradient(model, A, Mu, Lambda, t);

        // Then they agree to 1e-6
        Assert.Equal((V(A + e, Mu, Lambda) - V(A - e, Mu, Lambda)) / (2 * e), dA, 6);
        Assert.Equal((V(A, Mu + e, Lambda) - V(A, Mu - e, Lambda)) / (2 * e), dMu, 6);
        Assert.Equal((V(A, Mu, Lambda + e) - V(A, Mu, Lambda - e)) / (2 * e), dL, 6);
    }

    [Fact]
    public void A_short_log_gets_an_explained_fallback()
    {
        // Given four readings
        double[] t = [0, 24, 48, 72];
        double[] y = [0, 5, 12, 18];

        // When fitted
        var result = ZwieteringFit.Fit(SigmoidModel.Gompertz, t, y);

        // Then no fit is given and the reason says why
        Assert.False(result.Succeeded);
        Assert.Equal("no sigmoid fit: 4 sugar readings, at least 6 are needed", result.Reason);
    }

    [Fact]
    public void A_log_with_too_little_consumption_gets_an_explained_fallback()
    {
        // Given six readings that consume only 1.2 °Brix
        double[] t = [0, 12, 24, 36, 48, 60];
        double[] y = [0, 0.1, 0.3, 0.6, 0.9, 1.2];

        // When fitted
        var result = ZwieteringFit.Fit(SigmoidModel.Logistic, t, y);

        // Then no fit is given and the reason names the amounts
        Assert.Equal("no sigmoid fit: only 1.2 °Brix consumed in the log, at least 3.0 are needed", result.Reason);
    }

    [Fact]
    public void A_log_still_falling_in_a_straight_line_gets_an_asymptote_beyond_the_last_reading()
    {
        // Given sugar consumed in a straight line, 0.1 °Brix/h for 108 h, with no plateau yet
        var t = Enumerable.Range(0, 10).Select(i => i * 12.0).ToArray();
        var y = t.Select(x => 0.1 * x).ToArray();

        // When fitted by the Gompertz form
        var result = ZwieteringFit.Fit(SigmoidModel.Gompertz, t, y);

        // Then the curve places the end of fermentation beyond the data (A above the 10.8 °Brix consumed so far)
        // and its steepest rate at or above the line's 0.1 °Brix/h
        Assert.True(result.Succeeded, result.Reason);
        Assert.True(result.Fit!.AsymptoteBrix > 10.8);
        Assert.True(result.Fit.MaxRateBrixPerHour >= 0.1);
        Assert.True(result.Fit.Rmse < 0.5);
    }

    [Fact]
    public void The_analysis_fits_both_forms_to_each_log_in_hours_from_the_origin()
    {
        // Given a log sampled every 6 h from an invented Gompertz ferment starting at 24 °Brix and running to −1 °Brix
        var (t, y) = Synthetic(SigmoidModel.Gompertz, 3, 0.1);
        var brix = y.Select(c => 24.0 - c).ToArray();
        var log = Regular("T-101", 2025, At("2025-10-01 06:00"), 6.0, brix);

        // When analysed
        var lot = Assert.Single(KineticsAnalysis.Run([Lot()], [log], KineticsSettings.Default).Lots);

        // Then the Gompertz fit returns the lag and rate in hours from the first reading
        Assert.True(lot.Gompertz.Succeeded, lot.Gompertz.Reason);
        Assert.True(lot.Logistic.Succeeded, lot.Logistic.Reason);
        Assert.InRange(lot.Gompertz.Fit!.LagHours, Lambda - 2.5, Lambda + 2.5);
        Assert.InRange(lot.Gompertz.Fit.MaxRateBrixPerDay, Mu * 24 * 0.9, Mu * 24 * 1.1);
        Assert.True(lot.Gompertz.Fit.Rmse < lot.Logistic.Fit!.Rmse);
    }
}
