using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Kinetics;

public class OddLogTests
{
    [Fact]
    public void Odd_logs_never_throw_and_every_fit_either_succeeds_or_says_why()
    {
        // Given 300 seeded random logs: 2–40 readings, random gaps (some equal, some reversed), sugar that wanders up and
        // down between −3 and 30 °Brix, temperatures with gaps
        var rng = new Random(20261);
        var lots = new List<YieldBench.Core.Conversion.LotConversion>();
        var logs = new List<FermentationLog>();
        for (int k = 0; k < 300; k++)
        {
            string id = $"Z-{k}";
            lots.Add(KineticsTestData.Lot(id, colour: (WineColour)(k % 4), inoculation: k % 3 == 0 ? KineticsTestData.At("2025-10-01 00:00") : null));
            int n = rng.Next(2, 41);
            var t = KineticsTestData.At("2025-10-01 06:00");
            double b = 5 + (rng.NextDouble() * 25);
            var readings = new List<LogReading>();
            for (int i = 0; i < n; i++)
            {
                t = t.AddHours(rng.Next(-6, 30));
                b = Math.Clamp(b - (rng.NextDouble() * 4) + 1, -3, 30);
                readings.Add(new LogReading(t, SugarReading.FromBrix(b), rng.Next(5) == 0 ? null : 10 + (rng.NextDouble() * 30)));
            }

            logs.Add(new FermentationLog(id, 2025, readings));
        }

        // When analysed
        var review = KineticsAnalysis.Run(lots, logs, KineticsSettings.Default);

        // Then every lot with at least two distinct sugar times is analysed, and each fit has a value or a reason
        Assert.Equal(300, review.Lots.Count + review.Findings.Count(f => f.Code == "too-few-sugar-readings"));
        Assert.All(review.Lots, l =>
        {
            Assert.True(l.Gompertz.Succeeded ^ (l.Gompertz.Reason is not null));
            Assert.True(l.Logistic.Succeeded ^ (l.Logistic.Reason is not null));
            Assert.All(l.Rates, r => Assert.True(r.ElapsedHours > 0));
            Assert.True(l.HoursAboveDanger <= l.HoursAboveCaution + 1e-9);
        });
    }
}
