using YieldBench.Core.Kinetics;
using static YieldBench.Core.Tests.Kinetics.KineticsTestData;

namespace YieldBench.Core.Tests.Kinetics;

public class StallTests
{
    private static readonly DateTime Day0 = At("2025-10-01 08:00");

    [Fact]
    public void A_log_that_stalls_above_dryness_is_stuck_and_sluggish()
    {
        // Given daily readings that run normally to 8 °Brix, then creep 8.0 → 7.8 over four days, and a lab RS of 45 g/L
        var log = Regular("T-101", 2025, Day0, 24.0, [24.0, 20.0, 14.0, 8.0, 7.9, 7.9, 7.8, 7.8]);

        // When analysed with the defaults (stuck: under 0.25 °Brix/day for 72 h above 0 °Brix; sluggish: under 1.0 for 48 h above 5)
        var review = KineticsAnalysis.Run([Lot(residualSugarGl: 45.0)], [log], KineticsSettings.Default);

        // Then (hand-worked) the first 72 h window under the rate ends on day 6: 8.0 → 7.8 is 0.2 °Brix in 3 days = 0.067 °Brix/day;
        // the first 48 h sluggish window ends on day 5: 8.0 → 7.9 = 0.05 °Brix/day
        var lot = Assert.Single(review.Lots);
        Assert.NotNull(lot.Stuck);
        Assert.Equal(Day0.AddDays(3), lot.Stuck!.Start);
        Assert.Equal(Day0.AddDays(6), lot.Stuck.End);
        Assert.Equal(0.2 / 3.0, lot.Stuck.MeanRateBrixPerDay, 9);
        Assert.Equal(Day0.AddDays(5), lot.Sluggish!.End);
        Assert.Equal(0.05, lot.Sluggish.MeanRateBrixPerDay, 9);
        Assert.Equal(["stuck", "sluggish", "not-dry-at-log-end"], lot.Flags);
        var f = Assert.Single(review.Findings, x => x.Code == "stuck");
        Assert.Equal(
            "Lot 2025/T-101: sugar went from 8.0 to 7.8 °Brix between 2025-10-04 08:00 and 2025-10-07 08:00 (0.07 °Brix/day, under 0.25 for 72 h while above 0.0 °Brix). The lab recorded 45.0 g/L residual sugar, above the 4.0 g/L dry limit.",
            f.Message);
        Assert.Equal(8, f.Source!.Row);
    }

    [Fact]
    public void A_healthy_ferment_is_neither_stuck_nor_sluggish()
    {
        // Given a steady 3 °Brix/day run to dryness
        var log = Regular("T-101", 2025, Day0, 24.0, [24.0, 21.0, 18.0, 15.0, 12.0, 9.0, 6.0, 3.0, 0.0, -1.0, -1.2]);

        // When analysed
        var lot = Assert.Single(KineticsAnalysis.Run([Lot()], [log], KineticsSettings.Default).Lots);

        // Then no stall is found: the slow tail sits below the sugar thresholds
        Assert.Null(lot.Stuck);
        Assert.Null(lot.Sluggish);
        Assert.Empty(lot.Flags);
    }

    [Fact]
    public void A_slow_start_counts_as_lag_not_as_a_stall()
    {
        // Given three days with no drop after inoculation, then a normal ferment
        var log = Regular("T-101", 2025, Day0, 24.0, [24.0, 24.0, 23.9, 23.8, 20.0, 14.0, 8.0, 3.0, 0.0, -1.0]);

        // When analysed
        var lot = Assert.Single(KineticsAnalysis.Run([Lot(inoculation: Day0)], [log], KineticsSettings.Default).Lots);

        // Then (hand-worked) the lag ends where 23.0 is crossed between 23.8 (72 h) and 20.0 (96 h): 72 + 0.8 / 3.8 × 24 = 77.05 h;
        // no stall window lies after it
        Assert.Equal(72.0 + (0.8 / 3.8 * 24.0), lot.LagHours!.Value, 9);
        Assert.Null(lot.Stuck);
        Assert.Null(lot.Sluggish);
    }

    [Fact]
    public void The_stall_rules_follow_the_settings()
    {
        // Given a lot slowing to 1.5 °Brix/day at 12 °Brix (not sluggish under the 1.0 °Brix/day default)
        var log = Regular("T-101", 2025, Day0, 24.0, [24.0, 20.0, 15.0, 12.0, 10.5, 9.0, 7.5]);
        var strict = KineticsSettings.Default with { SluggishRateBrixPerDay = 2.0 };

        // When analysed with the default and with a 2.0 °Brix/day sluggish rate
        var byDefault = Assert.Single(KineticsAnalysis.Run([Lot()], [log], KineticsSettings.Default).Lots);
        var byStrict = Assert.Single(KineticsAnalysis.Run([Lot()], [log], strict).Lots);

        // Then only the stricter rule calls it sluggish; its first window ends on day 5 (12.0 → 9.0 over 48 h)
        Assert.Null(byDefault.Sluggish);
        Assert.Equal(Day0.AddDays(5), byStrict.Sluggish!.End);
        Assert.Equal(1.5, byStrict.Sluggish.MeanRateBrixPerDay, 9);
    }
}
