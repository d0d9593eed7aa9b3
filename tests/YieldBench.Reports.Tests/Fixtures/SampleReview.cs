using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Units;

namespace YieldBench.Reports.Tests.Fixtures;

/// <summary>
/// A small invented review: three invented strains (codes ST-A, ST-B, ST-C) over two seasons, one lot with text that
/// a spreadsheet would run as a formula, a lot above the theoretical yield (L010), a lot not dry (L005), and two
/// intake issues.
/// </summary>
internal static class SampleReview
{
    public const string InjectedNote = "=HYPERLINK(\"http://example.invalid\",\"click\")";

    public static ReviewResult Build(bool withIssues = true) => Build(withIssues, []);

    private static ReviewResult Build(bool withIssues, IReadOnlyList<FermentationLog> logs, ReviewSettings? settings = null)
    {
        var lots = new List<Lot>();
        var rng = new Random(7);
        string[] strains = ["ST-A", "ST-B", "ST-C"];
        double[] factor = [0.590, 0.600, 0.580];
        int n = 0;
        foreach (int season in new[] { 2024, 2025 })
        {
            for (int s = 0; s < strains.Length; s++)
            {
                for (int k = 0; k < 6; k++)
                {
                    n++;
                    double brix = 21.5 + (0.5 * k) + (0.3 * s) + (0.2 * (season - 2024));
                    double abv = Math.Round((factor[s] * brix) + ((rng.NextDouble() - 0.5) * 0.3), 2);

                    // Planted: lot L010 holds more alcohol than its sugar can give; lot L005 did not finish.
                    if (n == 10)
                    {
                        abv = Math.Round(0.68 * brix, 2);
                    }

                    lots.Add(new Lot
                    {
                        LotId = $"L{n:000}",
                        Season = season,
                        Strain = strains[s],
                        StartingSugar = SugarReading.FromBrix(brix),
                        FinalAlcohol = AlcoholContent.FromPercentVolume(abv),
                        Vessel = k % 2 == 0 ? "tank" : "barrel",
                        Variety = s == 2 ? "Pinot noir" : "Chardonnay",
                        ResidualSugarGl = n == 5 ? 12.0 : 1.5,
                        YanMgL = 180 + (10 * k),
                        Notes = n == 3 ? InjectedNote : (n == 4 ? "-5 L topped" : null),
                        Source = new SourceRef($"lots-{season}.csv", null, k + 2 + (6 * s)),
                    });
                }
            }
        }

        var issues = withIssues
            ? new List<IntakeIssue>
            {
                new("lots-2025.csv", null, 30, "final_abv", "13,2%", "not-a-number", "'13,2%' is not a number; write 13.2.", IssueSeverity.Error),
                new("lots-2024.csv", null, 9, "strain", "@ST-A", "strain-looks-like-formula", "+ check the strain cell", IssueSeverity.Warning),
            }
            : [];
        var inputs = new SeasonSet
        {
            Lots = lots,
            Logs = logs,
            Issues = issues,
            Files = [new InputFile("lots-2024.csv", new string('a', 64), 1234), new InputFile("lots-2025.csv", new string('b', 64), 2345)],
        };
        return ReviewRunner.Run(inputs, settings ?? new ReviewSettings(), "9.9.9-test");
    }

    /// <summary>
    /// The sample review with invented logs for two lots, so kinetics data, charts and sheets are made too: L005 (2024)
    /// stalls at 10.6 °Brix, L020 (2025) ferments through 41 °C.
    /// </summary>
    public static ReviewResult WithLogs() => WithLogs(new ReviewSettings());

    /// <summary>As <see cref="WithLogs()"/>, reviewed with <paramref name="settings"/>.</summary>
    public static ReviewResult WithLogs(ReviewSettings settings)
    {
        FermentationLog Log(string id, int season, double step, double[] brix, double[] temps) =>
            new(id, season, brix.Select((b, i) => new LogReading(Kinetics.KineticsReportData.Start.AddHours(i * step), SugarReading.FromBrix(b), temps[i], new SourceRef("logs.csv", null, i + 2))).ToArray());
        var logs = new[]
        {
            Log("L005", 2024, 24, [24.0, 22.5, 19.5, 16.0, 13.0, 11.0, 10.8, 10.7, 10.6, 10.6], [13, 15, 17, 18, 18, 17, 16, 15, 15, 15]),
            Log("L020", 2025, 12, [24.0, 23.0, 20.0, 15.5, 10.5, 6.0, 2.5, 0.0, -1.2], [24, 27, 31, 35, 38, 41, 38, 33, 28]),
        };
        return Build(withIssues: true, logs, settings);
    }
}
