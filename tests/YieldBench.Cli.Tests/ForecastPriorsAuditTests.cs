using System.Globalization;
using YieldBench.Core.Forecast;
using YieldBench.Intake;

namespace YieldBench.Cli.Tests;

/// <summary>
/// The forecast's rate and lag priors (docs/methods.md Part 5, "Priors from the history" and "Seasons") against a
/// recomputation in python from the methods text: tests/YieldBench.Core.Tests/Fixtures/forecast-priors-audit.py (its
/// header gives the commands), from the per-lot Zwietering fits that scipy made in forecast-course-audit.py
/// (kinetics-audit/*-courses.csv, forecast-priors-audit/corrowind-courses.csv), on the demo history and the invented
/// Corrowind Vineyard and Brackenfold Cellars (no YAN recorded; one vessel type per colour). Recorded values:
/// forecast-priors-audit/*.csv.
/// </summary>
public class ForecastPriorsAuditTests
{
    public static TheoryData<string, string> Cellars => new()
    {
        { "demo.csv", "demo-data/history" },
        { "corrowind.csv", "tests/YieldBench.Core.Tests/Fixtures/corrowind-input" },
        { "brackenfold.csv", "tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/brackenfold-input" },
    };

    [Theory]
    [MemberData(nameof(Cellars))]
    public void The_rate_and_lag_regression_its_scatter_and_the_season_spread_are_the_recomputation_from_the_methods_text(string expectedFile, string history)
    {
        // Given a cellar's finished lots and logs, and python's priors from scipy's fits of the same logs
        string root = Root();
        var past = IntakeReader.Read([Path.Combine(root, history)], new IntakeOptions { WorkingDirectory = root });
        var expected = File.ReadAllLines(Path.Combine(root, "tests", "YieldBench.Core.Tests", "Fixtures", "forecast-priors-audit", expectedFile))
            .Skip(1).Select(l => l.Split(',')).ToDictionary(r => r[0], r => r.Skip(1).Where(v => v.Length > 0).Select(v => double.Parse(v, CultureInfo.InvariantCulture)).ToArray());

        // When the forecast learns its model from the history
        var model = ForecastRunner.Run(past.Lots, past.Logs, [], [], ForecastSettings.Default).Model;

        // Then the regression's slopes, the share set aside, the scatter (pooled and per colour), each season's shift and
        // the spread between seasons are python's, and so is every past lot's predicted (log μm, λ) (strain intercept plus
        // covariates). The two sides fit each log on their own (the fits agree to 1e-6 relative in κ and 1e-4 h in the
        // lag), so values agree to 1e-4 relative and 1e-3 h in a predicted lag
        var problems = new List<string>();
        void Check(string what, double python, double tool, double tolerance)
        {
            if (!(Math.Abs(python - tool) <= tolerance * Math.Max(1, Math.Abs(python))))
            {
                problems.Add($"{what}: python {python.ToString("R", CultureInfo.InvariantCulture)}, tool {tool.ToString("R", CultureInfo.InvariantCulture)}");
            }
        }

        // (the slopes only where the columns are independent: Brackenfold has one vessel type per colour, so its usual
        // vessel peak is fixed by the strain columns and only the predictions below are determined)
        if (expected.TryGetValue("rate_temperature_slope", out var slope))
        {
            Check("rate_temperature_slope", slope[0], model.RateTemperatureSlope, 1e-4);
            Check("rate_nitrogen_slope", expected["rate_nitrogen_slope"][0], model.RateNitrogenSlope, 1e-4);
        }

        Check("rate_outlier_share", expected["rate_outlier_share"][0], model.RateOutlierShare, 1e-9);
        void CheckCov(string what, (double Vmm, double Vml, double Vll) tool)
        {
            var e = expected[what];
            Check(what + " mm", e[0], tool.Vmm, 1e-4 * e[0]);
            Check(what + " ml", e[1], tool.Vml, 1e-4 * Math.Sqrt(e[0] * e[2]));
            Check(what + " ll", e[2], tool.Vll, 1e-4 * e[2]);
        }

        CheckCov("within", model.Within);
        foreach (var colour in new[] { "red", "white" })
        {
            Assert.Equal(expected.ContainsKey("within_" + colour), model.WithinByColour.ContainsKey(colour));
            if (model.WithinByColour.TryGetValue(colour, out var v))
            {
                CheckCov("within_" + colour, v);
            }
        }

        Check("season_spread", expected["season_spread"][0], model.SeasonSpread, 1e-4);
        Assert.Equal(expected.Keys.Where(k => k.StartsWith("season_shift_", StringComparison.Ordinal)).Order(), model.SeasonShifts.Keys.Select(s => "season_shift_" + s).Order());
        foreach (var (season, shift) in model.SeasonShifts)
        {
            Check("season_shift_" + season, expected["season_shift_" + season][0], shift, 1e-4);
        }

        var courses = LotCourses.FromHistory(past.Lots, past.Logs).ToDictionary(c => c.LotId);
        var priors = expected.Where(kv => kv.Key.StartsWith("prior_", StringComparison.Ordinal)).ToArray();
        Assert.NotEmpty(priors);
        foreach (var (name, e) in priors)
        {
            var prior = model.RatePriorFor(courses[name["prior_".Length..]]);
            Check(name + " log mu", e[0], prior.LogMu, 1e-4);
            Check(name + " lag", e[1], prior.Lag, 1e-4);
        }

        Assert.True(problems.Count == 0, string.Join(Environment.NewLine, problems.Take(20)));
    }

    private static string Root()
    {
        string? root = AppContext.BaseDirectory;
        while (root is not null && !File.Exists(Path.Combine(root, "YieldBench.sln")))
        {
            root = Path.GetDirectoryName(root);
        }

        return root ?? throw new InvalidOperationException("repository root not found");
    }
}
