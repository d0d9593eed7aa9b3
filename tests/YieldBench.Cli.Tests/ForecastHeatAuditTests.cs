using YieldBench.Core.Forecast;
using YieldBench.Intake;

namespace YieldBench.Cli.Tests;

/// <summary>
/// The forecast's heat balance on the demo's harvest in progress (docs/methods.md Part 5, "Temperature and heat"),
/// against a recomputation in python from the methods text: tests/YieldBench.Core.Tests/Fixtures/forecast-heat-audit.py.
/// </summary>
public class ForecastHeatAuditTests
{
    [Fact]
    public void Each_running_lots_reachable_temperature_and_cooling_power_rest_on_one_heat_balance_of_its_own_record()
    {
        // Given the demo's history and harvest in progress, and from the running lots' sheet (demo-data/running) each lot's
        // starting sugar (°Brix), must volume (L), and its last logged °Brix and °C
        string demo = Path.Combine(AppContext.BaseDirectory, "demo-data");
        var options = new IntakeOptions { WorkingDirectory = demo };
        var past = IntakeReader.Read([Path.Combine(demo, "history")], options);
        var now = IntakeReader.Read([Path.Combine(demo, "running")], options with { RunningLots = true });
        (string Lot, double StartBrix, double VolumeL, double LastBrix, double LastC)[] records =
        [
            ("26-001", 25.1, 4000, 10.0, 28.2), ("26-002", 25.8, 680, 11.1, 32.3), ("26-003", 22.5, 7750, 19.8, 13.2),
            ("26-004", 23.7, 1360, 20.6, 25.4), ("26-005", 27.5, 680, 14.1, 30.9), ("26-006", 26.7, 7750, 18.2, 40.5),
            ("26-007", 21.8, 200, 19.7, 16.4), ("26-008", 21.8, 440, 19.7, 15.5), ("26-009", 24.4, 1360, 20.1, 27.6),
            ("26-010", 21.1, 1650, 20.1, 14.9),
        ];

        // When the lots are forecast
        var report = ForecastRunner.Run(past.Lots, past.Logs, now.RunningLots, now.Logs, ForecastSettings.Default);

        // Then for every lot, with q the sugar per °Brix of fall (g/L), kW = mu_m q V / 180.16 × 100.4 / 3600 and
        // reachable = last °C + q / 180.16 × 100.4 / (rho cp) × (last °Brix − F): eliminating q, the reachable temperature is
        // last °C + kW × 3600 / (mu_m V) / (rho cp) × (last °Brix − F). rho cp is the must's at its fitted start, which the
        // outputs do not give; taken at the record's starting sugar instead (rho = SG × 0.99820, SG from the NBS cubic; cp the
        // Choi & Okos model at 20 °C), it moves by 0.3 % per °Brix, so the two agree to 0.1 K (python: within 0.05 K)
        Assert.Equal(records.Length, report.Lots.Count);
        foreach (var r in records)
        {
            var f = report.Lots.Single(l => l.Course.LotId == r.Lot);
            double ratePerHour = f.PeakRateBrixPerDay / 24;
            double heatPerBrixKjPerL = f.CoolingKw!.Value * 3600 / (ratePerHour * r.VolumeL);
            double expected = r.LastC + heatPerBrixKjPerL / (MustDensity(r.StartBrix) * MustHeatCapacity(r.StartBrix)) * (r.LastBrix - f.SettlesAtBrix);
            Assert.True(Math.Abs(f.ReachableC!.Value - expected) <= 0.1, $"{r.Lot}: reachable {f.ReachableC:0.000} °C, heat balance of its record {expected:0.000} °C");
        }
    }

    /// <summary>kg/L: SG 20/20 from °Brix by bisection on the NBS-fitted cubic (docs/methods.md Part 1 §1) × 0.99820.</summary>
    private static double MustDensity(double brix)
    {
        static double Cubic(double s) => ((182.4601 * s - 775.6821) * s + 1262.7794) * s - 669.5622;
        double lo = 0.95, hi = 1.3;
        for (int i = 0; i < 100; i++)
        {
            double mid = (lo + hi) / 2;
            (lo, hi) = Cubic(mid) < brix ? (mid, hi) : (lo, mid);
        }

        return (lo + hi) / 2 * 0.99820;
    }

    /// <summary>kJ/(kg·K): Choi &amp; Okos (1986) water and carbohydrate at 20 °C, mass fractions 1 − °Brix/100 and °Brix/100.</summary>
    private static double MustHeatCapacity(double brix)
    {
        const double t = 20;
        double water = 4.1762 - 9.0864e-5 * t + 5.4731e-6 * t * t;
        double carbohydrate = 1.5488 + 1.9625e-3 * t - 5.9399e-6 * t * t;
        return (1 - brix / 100) * water + brix / 100 * carbohydrate;
    }
}
