using YieldBench.Core.Kinetics;
using static YieldBench.Core.Tests.Kinetics.KineticsTestData;

namespace YieldBench.Core.Tests.Kinetics;

public class RateAndTimingTests
{
    // Made-up twice-daily readings that cross midnight and the end of September.
    private static readonly (string, double?, double?)[] Rows =
    [
        ("2025-09-30 20:00", 24.0, 18.0),
        ("2025-10-01 08:00", 22.5, 21.0),
        ("2025-10-01 20:00", 19.5, 25.0),
        ("2025-10-02 08:00", 15.0, 28.0),
        ("2025-10-03 08:00", 5.0, 27.0),
        ("2025-10-04 08:00", -0.5, 22.0),
    ];

    private static LotKinetics Analyse(DateTime? inoculation = null)
    {
        var review = KineticsAnalysis.Run([Lot(inoculation: inoculation)], [Log("T-101", 2025, Rows)], KineticsSettings.Default);
        return Assert.Single(review.Lots);
    }

    [Fact]
    public void Rates_between_readings_use_the_real_time_across_midnight_and_a_month_end()
    {
        // Given readings 12 h apart across midnight of 30 September
        // When the lot is analysed
        var lot = Analyse();

        // Then (hand-worked) 24.0 → 22.5 in 12 h is 0.125 °Brix/h = 3.0 °Brix/day,
        // 22.5 → 19.5 in 12 h is 6.0 °Brix/day, and 15.0 → 5.0 over the 24 h to 3 October is 10.0 °Brix/day
        Assert.Equal(5, lot.Rates.Count);
        Assert.Equal(12.0, lot.Rates[0].ElapsedHours, 9);
        Assert.Equal(0.125, lot.Rates[0].BrixPerHour, 9);
        Assert.Equal(3.0, lot.Rates[0].BrixPerDay, 9);
        Assert.Equal(6.0, lot.Rates[1].BrixPerDay, 9);
        Assert.Equal(24.0, lot.Rates[3].ElapsedHours, 9);
        Assert.Equal(10.0, lot.Rates[3].BrixPerDay, 9);
    }

    [Fact]
    public void The_maximum_rate_is_placed_at_the_middle_of_its_interval()
    {
        // Given the same log; hand-worked rates 3, 6, 9, 10, 5.5 °Brix/day
        // When analysed (a sparse log: rates between readings)
        var lot = Analyse();

        // Then the maximum is 10 °Brix/day, midway between 2 Oct 08:00 and 3 Oct 08:00
        Assert.Equal(RateMethod.BetweenReadings, lot.MaxRateMethod);
        Assert.False(lot.Dense);
        Assert.Equal(10.0, lot.MaxRateBrixPerDay!.Value, 9);
        Assert.Equal(At("2025-10-02 20:00"), lot.MaxRateAt);
    }

    [Fact]
    public void One_third_depletion_is_interpolated_between_the_readings_that_bracket_it()
    {
        // Given a start of 24.0 °Brix, one-third is gone at 16.0 °Brix
        // When analysed
        var lot = Analyse();

        // Then (hand-worked) it falls between 19.5 (1 Oct 20:00) and 15.0 (2 Oct 08:00):
        // (19.5 − 16) / (19.5 − 15) × 12 h = 9.333 h after 20:00 → 2 Oct 05:20, 33.333 h after the first reading
        Assert.Equal(16.0, lot.OneThirdBrix, 9);
        Assert.Equal(33.0 + (1.0 / 3.0), lot.OneThirdHours!.Value, 6);
        Assert.InRange((lot.OneThirdAt!.Value - At("2025-10-02 05:20")).TotalSeconds, -1.0, 1.0);
    }

    [Fact]
    public void One_third_depletion_is_measured_from_the_lots_starting_sugar_and_from_the_first_reading_beside_it()
    {
        // Given a lot whose record gives 25.5 °Brix, logged from a first reading of 24.0 °Brix (taken after the sugar had
        // started to fall)
        var review = KineticsAnalysis.Run([Lot(startingBrix: 25.5)], [Log("T-101", 2025, Rows)], KineticsSettings.Default);
        var lot = Assert.Single(review.Lots);

        // When one-third is measured from the lot's 25.5: two-thirds is 17.0 °Brix, between 19.5 (1 Oct 20:00) and 15.0
        // (2 Oct 08:00): (19.5 − 17) / 4.5 × 12 h = 6.667 h after 20:00, 30.667 h after the first reading; from the first
        // reading, 16.0 °Brix at 33.333 h as before (hand-worked)
        // Then both are given, the lot's first, 2.67 h earlier
        Assert.Equal(OneThirdBasis.LotRecord, lot.OneThirdBasis);
        Assert.Equal(25.5, lot.LotStartingBrix);
        Assert.Equal(17.0, lot.OneThirdBrix, 9);
        Assert.Equal(30.0 + (2.0 / 3.0), lot.OneThirdHours!.Value, 6);
        Assert.Equal(16.0, lot.OneThirdFirstReadingBrix, 9);
        Assert.Equal(33.0 + (1.0 / 3.0), lot.OneThirdFirstReadingHours!.Value, 6);
        Assert.Equal(24.0, lot.StartingBrix);
    }

    [Fact]
    public void Time_to_dryness_is_interpolated_to_the_dry_reading()
    {
        // Given the log falls from 5.0 (3 Oct 08:00) to −0.5 °Brix (4 Oct 08:00)
        // When analysed with the default dry reading of 0 °Brix
        var lot = Analyse();

        // Then (hand-worked) 0 °Brix is reached 5.0 / 5.5 × 24 h = 21.818 h after 3 Oct 08:00, i.e. 60 + 21.818 h after the start
        Assert.Equal(81.818181818, lot.HoursToDry!.Value, 6);
        Assert.Equal(81.818181818 / 24.0, lot.DaysToDry!.Value, 6);
        Assert.Equal(84.0, lot.DurationHours, 9);
        Assert.DoesNotContain("not-dry-at-log-end", lot.Flags);
    }

    [Fact]
    public void Dryness_not_reached_is_reported_with_the_last_reading()
    {
        // Given a log that ends at 1.5 °Brix
        var log = Log("T-101", 2025, ("2025-09-30 20:00", 24.0, null), ("2025-10-01 20:00", 18.0, null), ("2025-10-02 20:00", 1.5, null));

        // When analysed
        var review = KineticsAnalysis.Run([Lot(residualSugarGl: 21.0)], [log], KineticsSettings.Default);

        // Then there is no dry time and the finding names the last reading and the lab's residual sugar
        var lot = Assert.Single(review.Lots);
        Assert.Null(lot.HoursToDry);
        Assert.Contains("not-dry-at-log-end", lot.Flags);
        var f = Assert.Single(review.Findings, x => x.Code == "not-dry-at-log-end");
        Assert.Equal("Lot 2025/T-101: the log ends at 1.5 °Brix on 2025-10-02 20:00, above the dry reading of 0.0 °Brix; the lab recorded 21.0 g/L residual sugar, above the 4.0 g/L dry limit.", f.Message);
        Assert.Equal(4, f.Source!.Row);
    }

    [Fact]
    public void A_log_that_stops_before_dry_on_a_lot_the_lab_found_dry_is_a_finding_not_a_flag()
    {
        // Given the same log ending at 1.5 °Brix, on a lot whose lab residual sugar is 1.2 g/L (within the 4 g/L dry limit)
        var log = Log("T-101", 2025, ("2025-09-30 20:00", 24.0, null), ("2025-10-01 20:00", 18.0, null), ("2025-10-02 20:00", 1.5, null));

        // When analysed
        var review = KineticsAnalysis.Run([Lot(residualSugarGl: 1.2)], [log], KineticsSettings.Default);

        // Then it has no dry time from the log, carries no not-dry flag, and the finding says the lot finished after its log
        var lot = Assert.Single(review.Lots);
        Assert.Null(lot.HoursToDry);
        Assert.DoesNotContain("not-dry-at-log-end", lot.Flags);
        Assert.DoesNotContain(review.Findings, x => x.Code == "not-dry-at-log-end");
        var f = Assert.Single(review.Findings, x => x.Code == "log-ended-before-dry");
        Assert.Equal("Lot 2025/T-101: the log ends at 1.5 °Brix on 2025-10-02 20:00, above the dry reading of 0.0 °Brix, but the lab recorded 1.2 g/L residual sugar, within the 4.0 g/L dry limit: the lot finished after its last reading.", f.Message);
    }

    [Fact]
    public void A_configured_dry_reading_moves_the_dry_time()
    {
        // Given dryness set at −0.5 °Brix
        var settings = KineticsSettings.Default with { DryBrix = -0.5 };

        // When analysed
        var lot = Assert.Single(KineticsAnalysis.Run([Lot()], [Log("T-101", 2025, Rows)], settings).Lots);

        // Then it is reached exactly at the last reading, 84 h after the first
        Assert.Equal(84.0, lot.HoursToDry!.Value, 9);
    }

    [Fact]
    public void Lag_runs_from_the_first_reading_to_a_sustained_one_degree_drop()
    {
        // Given no inoculation time: the origin is the first reading
        // When analysed
        var lot = Analyse();

        // Then (hand-worked) 23.0 °Brix is crossed (24 − 23) / (24 − 22.5) × 12 h = 8 h after the first reading
        Assert.Equal(TimeOrigin.FirstReading, lot.OriginKind);
        Assert.Equal(8.0, lot.LagHours!.Value, 9);
        Assert.Equal(At("2025-10-01 04:00"), lot.LagEnd);
    }

    [Fact]
    public void Lag_runs_from_inoculation_when_it_is_recorded()
    {
        // Given inoculation 6 h before the first reading
        // When analysed
        var lot = Analyse(At("2025-09-30 14:00"));

        // Then the lag is 6 + 8 = 14 h and every time is counted from inoculation
        Assert.Equal(TimeOrigin.Inoculation, lot.OriginKind);
        Assert.Equal(14.0, lot.LagHours!.Value, 9);
        Assert.Equal(33.0 + (1.0 / 3.0) + 6.0, lot.OneThirdHours!.Value, 6);
        Assert.Equal(90.0, lot.DurationHours, 9);
    }

    [Theory]
    [InlineData("2024-09-30 14:00", 365)] // the inoculation's year typed one too low: a year before the first reading
    [InlineData("2025-07-20 14:00", 72)] // more than the 60 days no first reading waits for
    [InlineData("2025-11-15 14:00", -46)] // a first reading more than 31 days before the inoculation
    public void An_inoculation_too_far_from_the_log_is_set_aside_and_said_with_its_gap(string inoculation, int days)
    {
        // Given the inoculation recorded far from the log's first reading (2025-09-30 20:00)
        var review = KineticsAnalysis.Run([Lot(inoculation: At(inoculation))], [Log("T-101", 2025, Rows)], KineticsSettings.Default);

        // When analysed
        var lot = Assert.Single(review.Lots);

        // Then the clock starts at the first reading, as with no inoculation (the lag of 8 h worked by hand above), and
        // a finding names the lot, the gap in days and what to check
        Assert.Equal(TimeOrigin.FirstReading, lot.OriginKind);
        Assert.Equal(8.0, lot.LagHours!.Value, 9);
        var finding = Assert.Single(review.Findings, f => f.Code == KineticsCodes.InoculationFarFromLog);
        string gap = days > 0 ? $"{days} days after" : $"{-days} days before";
        Assert.Contains($"Lot 2025/T-101: the log's first reading (2025-09-30 20:00) is {gap} the recorded inoculation", finding.Message, StringComparison.Ordinal);
        Assert.Contains("Check the year", finding.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("2025-08-01 20:00")] // 60 days before the first reading: still this ferment's clock
    [InlineData("2025-10-31 20:00")] // 31 days after it (a juice reading a month before inoculation)
    public void An_inoculation_within_the_bounds_still_starts_the_clock(string inoculation)
    {
        var review = KineticsAnalysis.Run([Lot(inoculation: At(inoculation))], [Log("T-101", 2025, Rows)], KineticsSettings.Default);
        Assert.Equal(TimeOrigin.Inoculation, Assert.Single(review.Lots).OriginKind);
        Assert.DoesNotContain(review.Findings, f => f.Code == KineticsCodes.InoculationFarFromLog);
    }

    [Fact]
    public void A_dip_that_recovers_does_not_end_the_lag()
    {
        // Given a reading that dips 1.2 °Brix and then reads back at the start (a misread sample), before the real drop
        var log = Log("T-101", 2025,
            ("2025-10-01 00:00", 24.0, null),
            ("2025-10-01 12:00", 22.8, null),
            ("2025-10-02 00:00", 23.8, null),
            ("2025-10-02 12:00", 21.8, null),
            ("2025-10-03 00:00", 16.0, null));

        // When analysed
        var lot = Assert.Single(KineticsAnalysis.Run([Lot()], [log], KineticsSettings.Default).Lots);

        // Then the lag ends only on the sustained drop: 23.0 between 23.8 (24 h) and 21.8 (36 h): 24 + 0.8 / 2.0 × 12 = 28.8 h
        Assert.Equal(28.8, lot.LagHours!.Value, 9);
    }

    [Fact]
    public void The_smoothed_rate_of_a_local_linear_fit_matches_a_hand_worked_slope()
    {
        // Given readings at 0, 1, 2, 3 h of 10, 9, 7, 6 °Brix and a 2 h window (±1 h)
        double[] h = [0, 1, 2, 3];
        double[] b = [10, 9, 7, 6];

        // When the smoothed rates are computed
        var r = KineticsAnalysis.LocalLinearRates(h, b, 2.0);

        // Then at 1 h the window holds 0–2 h: slope = Σ(x − x̄)(y − ȳ)/Σ(x − x̄)² = (−1·1.333 + 1·−1.667)/2 = −1.5 °Brix/h → 36 °Brix/day;
        // at 2 h: points 1–3, slope (−1·1.333 + 1·−1.667)/2 = −1.5 again; the end points have only two neighbours in the window
        Assert.Null(r[0]);
        Assert.Equal(36.0, r[1]!.Value, 9);
        Assert.Equal(36.0, r[2]!.Value, 9);
        Assert.Null(r[3]);
    }

    [Fact]
    public void Dense_probe_logs_take_their_maximum_from_the_smoothed_rate()
    {
        // Given a 10-minute probe log falling 0.2 °Brix/h (4.8 °Brix/day) with seeded ±0.05 °Brix noise
        var rng = new Random(11);
        var brix = Enumerable.Range(0, 6 * 48).Select(i => 24.0 - (0.2 * i / 6.0) + (0.05 * Gaussian(rng))).ToArray();
        var log = Regular("T-101", 2025, At("2025-10-01 00:00"), 1.0 / 6.0, brix);

        // When analysed
        var lot = Assert.Single(KineticsAnalysis.Run([Lot()], [log], KineticsSettings.Default).Lots);

        // Then the log counts as dense, the maximum comes from the 12 h local fit and sits close to 4.8 °Brix/day,
        // while a single 10-minute interval would show a far noisier rate
        Assert.True(lot.Dense);
        Assert.Equal(RateMethod.LocalLinearFit, lot.MaxRateMethod);
        Assert.InRange(lot.MaxRateBrixPerDay!.Value, 4.8, 5.2);
        Assert.True(lot.Rates.Max(r => r.BrixPerDay) > 10.0);
    }
}
