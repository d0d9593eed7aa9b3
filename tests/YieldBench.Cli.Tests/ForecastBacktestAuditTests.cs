using System.Globalization;
using YieldBench.Core.Forecast;
using YieldBench.Intake;

namespace YieldBench.Cli.Tests;

/// <summary>
/// The forecast backtest's truths, cuts and baselines (docs/methods.md Part 5, "The backtest") against a recomputation in
/// python from the methods text: tests/YieldBench.Core.Tests/Fixtures/forecast-backtest-audit.py (its header gives the
/// commands), on the demo history (135 logs), the invented Corrowind Vineyard (120 logs, corrowind-cellar.py) and
/// Brackenfold Cellars (78 logs in °Brix and SG, a lot with no inoculation time, brackenfold-cellar.py). Recorded values:
/// forecast-backtest-audit/*.csv, one row per lot, target and cut scored. The model's own forecasts are not recomputed
/// here (the course fits and the heat balance they rest on have audits of their own).
/// </summary>
public class ForecastBacktestAuditTests
{
    public static TheoryData<string, string, string> Cellars => new()
    {
        { "demo.csv", "demo-data/history", "demo-data/running" },
        { "corrowind.csv", "tests/YieldBench.Core.Tests/Fixtures/corrowind-input", "tests/YieldBench.Core.Tests/Fixtures/corrowind-running" },
        { "brackenfold.csv", "tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/brackenfold-input", "" },
    };

    [Theory]
    [MemberData(nameof(Cellars))]
    public void Every_scored_case_has_the_truth_and_the_baselines_recomputed_from_the_methods_text(string expectedFile, string history, string running)
    {
        // Given a cellar's finished lots and logs, and python's list of the cases the backtest should score
        string root = Root();
        var options = new IntakeOptions { WorkingDirectory = root };
        var past = IntakeReader.Read([Path.Combine(root, history)], options);
        var now = running.Length == 0 ? null : IntakeReader.Read([Path.Combine(root, running)], options with { RunningLots = true });
        var expected = File.ReadAllLines(Path.Combine(root, "tests", "YieldBench.Core.Tests", "Fixtures", "forecast-backtest-audit", expectedFile))
            .Skip(1).Select(l => l.Split(',')).ToArray();

        // When the forecast is run, and with it the backtest (each season held out, cuts after 2, 3, 4 and 6 readings)
        var report = ForecastRunner.Run(past.Lots, past.Logs, now?.RunningLots ?? [], now?.Logs ?? [], ForecastSettings.Default);
        var cases = report.Backtest.Cases.ToDictionary(c => (c.Season, c.LotId, c.Target, c.Readings));

        // Then the same cases are scored (a target still ahead at the cut), and each has python's truth (interpolated
        // crossing hour, highest logged °C) and baselines (the line through the last two readings; the strain's median),
        // to 1e-5 h and 1e-6 °C. Lots with a recorded addition start from lots.csv's effective °Brix at two decimals in
        // python, which moves the one-third level by up to 0.0033 °Brix: 0.05 h at the slowest demo rate (0.1 h allowed,
        // also for the strain medians of one-third, which such lots enter), more for a line extrapolated from two nearly
        // level readings (1 h; the peak line's half-start time moves with it, 0.05 °C)
        Assert.Equal(expected.Length, cases.Count);
        var problems = new List<string>();
        foreach (var e in expected)
        {
            var key = (int.Parse(e[0], CultureInfo.InvariantCulture), e[1], e[2], int.Parse(e[3], CultureInfo.InvariantCulture));
            if (!cases.TryGetValue(key, out var c))
            {
                problems.Add($"{key}: not scored by the tool");
                continue;
            }

            bool addition = e[4] == "true";
            void Check(string what, double python, double tool, double tolerance)
            {
                if (!(Math.Abs(python - tool) <= tolerance))
                {
                    problems.Add($"{key} {what}: python {python.ToString("R", CultureInfo.InvariantCulture)}, tool {tool.ToString("R", CultureInfo.InvariantCulture)}");
                }
            }

            double exact = c.Target == "peak_temp" ? 1e-6 : 1e-5;
            Check("truth", Parse(e[5]), c.Truth, addition && c.Target == "one_third" ? 0.1 : exact);
            bool lineIsMedian = e[6] == e[7];
            Check("line", Parse(e[6]), c.Line, lineIsMedian && c.Target == "one_third" ? 0.1 : !addition ? exact : c.Target == "peak_temp" ? 0.05 : 1.0);
            Check("strain median", Parse(e[7]), c.StrainMedian, c.Target == "one_third" ? 0.1 : exact);
        }

        Assert.True(problems.Count == 0, string.Join(Environment.NewLine, problems.Take(20)));
    }

    private static double Parse(string s) => double.Parse(s, CultureInfo.InvariantCulture);

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
