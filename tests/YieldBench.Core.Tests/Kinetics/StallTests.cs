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

    [Fact]
    public void A_stall_after_which_the_log_goes_dry_is_reported_but_not_counted_as_stuck()
    {
        // Given a ferment that stalls near 6 °Brix for four days and then finishes
        var log = Regular("T-101", 2025, Day0, 24.0, [24.0, 18.0, 12.0, 6.0, 5.9, 5.9, 5.8, 5.8, 3.0, 0.5, -1.0]);

        // When analysed
        var review = KineticsAnalysis.Run([Lot()], [log], KineticsSettings.Default);

        // Then the stall (day 3 → day 6, 0.2 °Brix in 72 h) is reported as stalled-then-finished, not stuck: after it the
        // ferment picked up again, fastest over 72 h from day 7 to day 10 (5.8 → −1.0 °Brix, 2.27 °Brix/day, above the
        // 1.0 restart rate); dryness is reached (hand-worked) 0.5 / 1.5 × 24 h = 8 h after day 9, i.e. 10 October 16:00
        var lot = Assert.Single(review.Lots);
        Assert.Null(lot.Stuck);
        Assert.Equal(Day0.AddDays(6), lot.StalledThenFinished!.End);
        Assert.Contains(KineticsCodes.StalledThenFinished, lot.Flags);
        Assert.DoesNotContain(KineticsCodes.Stuck, lot.Flags);
        var f = Assert.Single(review.Findings, x => x.Code == KineticsCodes.StalledThenFinished);
        Assert.Contains("then it picked up again (2.27 °Brix/day over 72 h) and the log reached 0.0 °Brix afterwards (2025-10-10 16:00), so it is not counted as stuck.", f.Message);
    }

    [Fact]
    public void A_slow_end_that_only_slows_further_is_neither_stuck_nor_stalled()
    {
        // Given a white whose tail slows as its sugar runs out — 0.9 → 0.25 °Brix over days 7–10 (0.22 °Brix/day, under the
        // stall rate) — and then reaches dry without ever picking up again
        var log = Regular("T-101", 2025, Day0, 24.0, [22.0, 18.0, 14.0, 10.0, 6.0, 3.0, 1.5, 0.9, 0.6, 0.4, 0.25, 0.1, -0.1]);

        // When analysed
        var lot = Assert.Single(KineticsAnalysis.Run([Lot(colour: YieldBench.Core.Lots.WineColour.White, residualSugarGl: 1.2)], [log], KineticsSettings.Default).Lots);

        // Then nothing is flagged: a tail is not a stall
        Assert.Null(lot.Stuck);
        Assert.Null(lot.StalledThenFinished);
        Assert.Empty(lot.Flags);
    }

    [Fact]
    public void A_stall_is_not_stuck_when_the_lab_found_the_wine_dry()
    {
        // Given a log that ends on a stall at 1.5 °Brix, and a lab residual sugar of 2.1 g/L (within the 4 g/L dry limit)
        var log = Regular("T-101", 2025, Day0, 24.0, [24.0, 18.0, 11.0, 5.0, 1.6, 1.5, 1.5, 1.5, 1.5]);

        // When analysed
        var lot = Assert.Single(KineticsAnalysis.Run([Lot(residualSugarGl: 2.1)], [log], KineticsSettings.Default).Lots);

        // Then the lot finished after the log ended: not stuck, and with no restart seen not stalled-then-finished either
        Assert.Null(lot.Stuck);
        Assert.Null(lot.StalledThenFinished);
        Assert.DoesNotContain(KineticsCodes.Stuck, lot.Flags);
    }

    [Fact]
    public void Whites_are_judged_sluggish_against_their_own_lower_rate()
    {
        // Given a slow ferment running at 0.4 °Brix/day above 5 °Brix, after a peak of 2 °Brix/day
        var brix = new[] { 22.0, 21.0, 19.0, 17.0, 16.6, 16.2, 15.8, 15.4 };
        var settings = KineticsSettings.Default;

        // When analysed as a red and as a white lot
        var red = Assert.Single(KineticsAnalysis.Run([Lot(startingBrix: 22)], [Regular("T-101", 2025, Day0, 24.0, brix)], settings).Lots);
        var white = Assert.Single(KineticsAnalysis.Run([Lot(colour: YieldBench.Core.Lots.WineColour.White, startingBrix: 22)], [Regular("T-101", 2025, Day0, 24.0, brix)], settings).Lots);

        // Then only the red is sluggish: 0.4 is under the red threshold of 0.5 but not under the white 0.25
        Assert.Equal(0.4, red.Sluggish!.MeanRateBrixPerDay, 9);
        Assert.Null(white.Sluggish);
        Assert.Equal(0.25, settings.SluggishRateFor(YieldBench.Core.Lots.WineColour.Rose));
    }

    [Fact]
    public void The_climb_to_full_speed_is_not_judged_as_sluggish()
    {
        // Given a red lot that leaves the lag slowly (0.75 °Brix/day for two days) before running at 5 °Brix/day
        var log = Regular("T-101", 2025, Day0, 24.0, [24.0, 22.9, 22.15, 21.4, 16.4, 11.4, 6.4, 1.4, -1.0]);

        // When analysed
        var lot = Assert.Single(KineticsAnalysis.Run([Lot()], [log], KineticsSettings.Default).Lots);

        // Then the slow stretch before the fastest point is not called sluggish
        Assert.Null(lot.Sluggish);
        Assert.Empty(lot.Flags);
    }
}
