using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Forecast;
using YieldBench.Core.Kinetics;
using YieldBench.Intake;

namespace YieldBench.Cli.Tests;

/// <summary>
/// The review's per-lot fermentation kinetics and per-strain summaries (docs/methods.md Part 4) against a recomputation
/// in python from the methods text, with scipy 1.10.1's <c>curve_fit</c> for the Zwietering fits:
/// tests/YieldBench.Core.Tests/Fixtures/kinetics-audit.py (its header gives the commands), on the demo's 135 logs and
/// on an invented cellar's 78 (Brackenfold Cellars, made by brackenfold-cellar.py beside it: SG logs, an hourly probe
/// log, two readings at one time, a lot with no inoculation time, a red past 40 °C, a stuck white, a red that stalls
/// and then finishes, a white that idles above 5 °Brix). The recorded values are
/// kinetics-audit/demo.csv and kinetics-audit/brackenfold.csv.
/// </summary>
public class KineticsAuditTests
{
    public static TheoryData<string, string[]> Cellars => new()
    {
        { "demo.csv", ["demo-data/history"] },
        { "brackenfold.csv", ["tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/brackenfold-input"] },
    };

    [Theory]
    [MemberData(nameof(Cellars))]
    public void Every_lots_kinetics_and_each_strains_medians_are_the_recomputation_from_the_methods_text(string expectedFile, string[] inputs)
    {
        // Given a cellar's lots and logs, and the python recomputation of each lot's measures
        string root = Root();
        var set = IntakeReader.Read(inputs.Select(i => Path.Combine(root, i)).ToArray(), new IntakeOptions { WorkingDirectory = root });
        var (rows, strains) = Expected(Path.Combine(root, "tests", "YieldBench.Core.Tests", "Fixtures", "kinetics-audit", expectedFile));

        // When the kinetics are analysed as the review does
        var lots = set.Lots.Select(l => ConversionFactors.For(l, SugarModel.Default)).ToArray();
        var review = KineticsAnalysis.Run(lots, set.Logs, KineticsSettings.Default);

        // Then every lot with a log is recomputed, and each measure agrees. Times to 1e-4 h, rates to 1e-6 °Brix/day and
        // temperatures to 1e-6 °C (python prints ten digits); the one-third time of a lot with a recorded addition to
        // 0.2 h, since python starts it from lots.csv's effective °Brix at two decimals (0.005 °Brix at the slowest demo
        // rate, 0.05 °Brix/h, is 0.07 h). The fits: scipy's least-squares optimum to 1e-5 relative (both solvers stop
        // near, not at, it), and the RMSE to 1e-6 °Brix.
        Assert.Equal(rows.Count, review.Lots.Count);
        var problems = new List<string>();
        foreach (var e in rows)
        {
            var k = review.Lots.Single(l => l.LotKey.Season == int.Parse(e["season"], CultureInfo.InvariantCulture) && l.LotKey.LotId == e["lot_id"]);
            void Check(string column, double? actual, double tolerance, bool relative = false)
            {
                double? expected = e[column] == "" ? null : double.Parse(e[column], CultureInfo.InvariantCulture);
                double allowed = relative && expected is { } x ? Math.Abs(x) * tolerance : tolerance;
                if (expected is null != actual is null || (expected is { } a && actual is { } b && Math.Abs(a - b) > allowed))
                {
                    problems.Add($"{k.LotKey} {column}: python {e[column]}, tool {actual?.ToString("R", CultureInfo.InvariantCulture) ?? "none"}");
                }
            }

            Assert.Equal(e["strain"], k.Lot.Strain);
            Check("lag_h", k.LagHours, 1e-4);
            Check("one_third_h", k.OneThirdHours, e["start_from"] == "record" ? 1e-4 : 0.2);
            Check("one_third_first_reading_h", k.OneThirdFirstReadingHours, 1e-4);
            Check("days_to_dry", k.DaysToDry, 1e-5);
            Check("duration_h", k.DurationHours, 1e-4);
            Check("max_rate_brix_per_day", k.MaxRateBrixPerDay, 1e-6);
            Check("median_spacing_h", k.MedianSpacingHours, 1e-4);
            Check("peak_temp_c", k.PeakTemperatureC, 1e-6);
            Check("time_above_caution_h", k.HoursAboveCaution, 1e-4);
            Check("time_above_danger_h", k.HoursAboveDanger, 1e-4);
            Check("potential_peak_temp_c", k.PotentialPeak?.PotentialTemperatureC, 1e-5);
            Check("heat_removed_k", k.HeatRemovedK, 1e-5);
            Check("gompertz_a_brix", k.Gompertz.Fit?.AsymptoteBrix, 1e-5, relative: true);
            Check("gompertz_mu_brix_per_h", k.Gompertz.Fit?.MaxRateBrixPerHour, 1e-5, relative: true);
            Check("gompertz_lambda_h", k.Gompertz.Fit?.LagHours, 1e-5, relative: true);
            Check("gompertz_rmse_brix", k.Gompertz.Fit?.Rmse, 1e-6);
            Check("logistic_a_brix", k.Logistic.Fit?.AsymptoteBrix, 1e-5, relative: true);
            Check("logistic_mu_brix_per_h", k.Logistic.Fit?.MaxRateBrixPerHour, 1e-5, relative: true);
            Check("logistic_lambda_h", k.Logistic.Fit?.LagHours, 1e-5, relative: true);
            Check("logistic_rmse_brix", k.Logistic.Fit?.Rmse, 1e-6);

            // The sluggish window, and the stall as stuck or as stalled-then-finished (its hours from time zero, its rate)
            double? H(DateTime? at) => at is { } a ? (a - k.Origin).TotalHours : null;
            Check("sluggish_from_h", H(k.Sluggish?.Start), 1e-4);
            Check("sluggish_to_h", H(k.Sluggish?.End), 1e-4);
            Check("sluggish_rate", k.Sluggish?.MeanRateBrixPerDay, 1e-6);
            var stall = k.Stuck ?? k.StalledThenFinished;
            if (e["stuck"] != (k.Stuck is not null ? "true" : "false") || e["stalled_then_finished"] != (k.StalledThenFinished is not null ? "true" : "false"))
            {
                problems.Add($"{k.LotKey}: python stuck {e["stuck"]}, stalled then finished {e["stalled_then_finished"]}; tool {k.Stuck is not null}, {k.StalledThenFinished is not null}");
            }
            else if (stall is not null)
            {
                Check("stall_from_h", H(stall.Start), 1e-4);
                Check("stall_to_h", H(stall.End), 1e-4);
            }
        }

        // And each strain's median and type-7 quartiles of maximum rate, lag, days to dry and peak temperature are numpy's
        foreach (var s in review.Strains)
        {
            foreach (var (name, m) in new[] { ("max_rate_brix_per_day", s.MaxRateBrixPerDay), ("lag_h", s.LagHours), ("days_to_dry", s.DaysToDry), ("peak_temp_c", s.PeakTemperatureC) })
            {
                var x = strains[(s.Strain, name)];
                if (x.N != m.N || Math.Abs(x.Median - m.Median) > 1e-4 || Math.Abs(x.Q1 - m.Q1) > 1e-4 || Math.Abs(x.Q3 - m.Q3) > 1e-4)
                {
                    problems.Add($"{s.Strain} {name}: python n {x.N} median {x.Median} quartiles {x.Q1}-{x.Q3}; tool n {m.N} median {m.Median} quartiles {m.Q1}-{m.Q3}");
                }
            }
        }

        // And each strain's count of sluggish and of stuck lots is the count of python's
        foreach (var s in review.Strains)
        {
            var mine = rows.Where(r => r["strain"] == s.Strain).ToList();
            if (s.Lots != mine.Count || s.SluggishLots != mine.Count(r => r["sluggish_from_h"] != "") || s.StuckLots != mine.Count(r => r["stuck"] == "true"))
            {
                problems.Add($"{s.Strain}: python {mine.Count} lots, {mine.Count(r => r["sluggish_from_h"] != "")} sluggish, {mine.Count(r => r["stuck"] == "true")} stuck; tool {s.Lots}, {s.SluggishLots}, {s.StuckLots}");
            }
        }

        Assert.Equal(strains.Count, review.Strains.Count * 4);
        Assert.True(problems.Count == 0, string.Join(Environment.NewLine, problems));
    }

    public static TheoryData<string, string[]> Courses => new()
    {
        { "demo-courses.csv", ["demo-data/history"] },
        { "brackenfold-courses.csv", ["tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/brackenfold-input"] },
    };

    [Theory]
    [MemberData(nameof(Courses))]
    public void The_forecasts_fit_of_every_past_log_is_scipys_least_squares_optimum(string expectedFile, string[] inputs)
    {
        // Given a cellar's past lots and logs, and for each log and sigmoid the four-parameter least-squares fit that
        // forecast-course-audit.py found with scipy's curve_fit (docs/methods.md Part 5, "The sugar course")
        string root = Root();
        var set = IntakeReader.Read(inputs.Select(i => Path.Combine(root, i)).ToArray(), new IntakeOptions { WorkingDirectory = root });
        var lines = File.ReadAllLines(Path.Combine(root, "tests", "YieldBench.Core.Tests", "Fixtures", "kinetics-audit", expectedFile));
        var header = lines[0].Split(',');
        var rows = lines.Skip(1).Select(l => header.Zip(l.Split(',')).ToDictionary(p => p.First, p => p.Second)).ToList();

        // When the forecast fits each past log by variable projection (grid, then Nelder–Mead)
        var courses = LotCourses.FromHistory(set.Lots, set.Logs);

        // Then the same logs are fitted or refused, on the same readings, and each fit is scipy's optimum: the sum of
        // squares to 1e-8 relative (they differ by at most 5e-10 on both cellars), the must and the settling point to
        // 1e-4 °Brix, κ to 1e-5 relative and the lag to 1e-3 h
        Assert.Equal(rows.Count, courses.Count * 2);
        var problems = new List<string>();
        foreach (var e in rows)
        {
            var course = courses.Single(c => c.Season == int.Parse(e["season"], CultureInfo.InvariantCulture) && c.LotId == e["lot_id"]);
            var model = e["model"] == "gompertz" ? SigmoidModel.Gompertz : SigmoidModel.Logistic;
            var fit = CourseFit.Fit(model, course.SugarHours, course.SugarBrix);
            string at = $"{course.Season}/{course.LotId} {e["model"]}";
            if (e["start_brix"] == "" || fit is null)
            {
                if (e["start_brix"] == "" != fit is null)
                {
                    problems.Add($"{at}: python {(e["start_brix"] == "" ? "no fit" : "a fit")}, tool {(fit is null ? "no fit" : "a fit")}");
                }

                continue;
            }

            double ss = D(e["sum_of_squares"]);
            if (fit.Points != int.Parse(e["points"], CultureInfo.InvariantCulture) || Math.Abs(fit.SumOfSquares - ss) > 1e-8 * ss
                || Math.Abs(fit.StartBrix - D(e["start_brix"])) > 1e-4 || Math.Abs(fit.FinalBrix - D(e["final_brix"])) > 1e-4
                || Math.Abs(fit.Kappa - D(e["kappa_per_h"])) > 1e-5 * D(e["kappa_per_h"]) || Math.Abs(fit.LagHours - D(e["lag_h"])) > 1e-3)
            {
                problems.Add($"{at}: python S0 {e["start_brix"]} F {e["final_brix"]} κ {e["kappa_per_h"]} λ {e["lag_h"]} SS {e["sum_of_squares"]} n {e["points"]}; " +
                    $"tool {fit.StartBrix:R} {fit.FinalBrix:R} {fit.Kappa:R} {fit.LagHours:R} {fit.SumOfSquares:R} {fit.Points}");
            }
        }

        Assert.True(problems.Count == 0, string.Join(Environment.NewLine, problems));
    }

    private static (List<Dictionary<string, string>> Rows, Dictionary<(string, string), (int N, double Median, double Q1, double Q3)> Strains) Expected(string path)
    {
        var lines = File.ReadAllLines(path);
        var header = lines[0].Split(',');
        var rows = lines.Skip(1).Where(l => !l.StartsWith('#'))
            .Select(l => header.Zip(l.Split(',')).ToDictionary(p => p.First, p => p.Second)).ToList();
        var strains = lines.Where(l => l.StartsWith('#') && !l.StartsWith("#strain", StringComparison.Ordinal)).Select(l => l[1..].Split(','))
            .ToDictionary(p => (p[0], p[1]), p => (int.Parse(p[2], CultureInfo.InvariantCulture), D(p[3]), D(p[4]), D(p[5])));
        return (rows, strains);
    }

    private static double D(string s) => double.Parse(s, CultureInfo.InvariantCulture);

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
