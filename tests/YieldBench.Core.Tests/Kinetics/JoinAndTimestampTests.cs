using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;
using static YieldBench.Core.Tests.Kinetics.KineticsTestData;

namespace YieldBench.Core.Tests.Kinetics;

public class JoinAndTimestampTests
{
    [Fact]
    public void A_reversed_timestamp_is_reported_and_the_readings_are_sorted()
    {
        // Given a log whose third row was typed with the wrong day (it reads earlier than the row above it)
        var log = Log("T-101", 2025,
            ("2025-10-01 08:00", 24.0, null),
            ("2025-10-02 08:00", 20.0, null),
            ("2025-09-30 08:00", 24.2, null),
            ("2025-10-03 08:00", 14.0, null));

        // When analysed
        var review = KineticsAnalysis.Run([Lot()], [log], KineticsSettings.Default);

        // Then the row is reported with its place, and the analysis runs on the sorted readings
        var f = Assert.Single(review.Findings, x => x.Code == "out-of-order-timestamp");
        Assert.Equal(4, f.Source!.Row);
        Assert.Equal("Lot 2025/T-101: the reading at 2025-09-30 08:00 comes after one at 2025-10-02 08:00 in the log; the readings were sorted by time. Check the date and time of this row.", f.Message);
        var lot = Assert.Single(review.Lots);
        Assert.Contains("out-of-order-timestamp", lot.Flags);
        Assert.Equal(At("2025-09-30 08:00"), lot.Sugar[0].Time);
        Assert.All(lot.Rates, r => Assert.True(r.ElapsedHours > 0));
        Assert.Equal(24.2, lot.StartingBrix, 9);
    }

    [Fact]
    public void Duplicated_timestamps_are_averaged_and_reported()
    {
        // Given two readings logged at the same minute
        var log = Log("T-101", 2025,
            ("2025-10-01 08:00", 24.0, 20.0),
            ("2025-10-02 08:00", 20.0, 24.0),
            ("2025-10-02 08:00", 19.0, 26.0),
            ("2025-10-03 08:00", 14.0, 27.0));

        // When analysed
        var review = KineticsAnalysis.Run([Lot()], [log], KineticsSettings.Default);

        // Then one reading of 19.5 °Brix and 25 °C stands for both, and the finding points at the second row
        var lot = Assert.Single(review.Lots);
        Assert.Equal(3, lot.Sugar.Count);
        Assert.Equal(19.5, lot.Sugar[1].Brix, 9);
        Assert.Equal(25.0, lot.Sugar[1].TemperatureC!.Value, 9);
        var f = Assert.Single(review.Findings, x => x.Code == "duplicate-timestamp");
        Assert.Equal(4, f.Source!.Row);
        Assert.Contains("duplicate-timestamp", lot.Flags);
    }

    [Fact]
    public void Logs_join_lots_by_season_and_lot_or_by_a_unique_lot_id()
    {
        // Given two seasons each with lot T-101, one lot T-202, and logs with and without a season
        var lots = new[] { Lot("T-101", 2024), Lot("T-101", 2025), Lot("T-202", 2025), Lot("T-303", 2025) };
        (string, double?, double?)[] rows = [("2025-10-01 08:00", 24.0, null), ("2025-10-02 08:00", 20.0, null)];
        var logs = new[] { Log("T-101", 2025, rows), Log("T-202", null, rows), Log("T-101", null, rows), Log("T-999", 2025, rows) };

        // When analysed
        var review = KineticsAnalysis.Run(lots, logs, KineticsSettings.Default);

        // Then 2025/T-101 joins by key, T-202 by its unique id; the seasonless T-101 is ambiguous and T-999 matches nothing
        Assert.Equal([new LotKey(2025, "T-101"), new LotKey(2025, "T-202")], review.Lots.Select(l => l.LotKey));
        Assert.Equal(["T-101", "2025/T-999"], review.LogsWithoutLot.Select(g => g.Name));
        Assert.Equal([new LotKey(2024, "T-101"), new LotKey(2025, "T-303")], review.LotsWithoutLog);
        Assert.Equal(
            "The log for lot T-101 names no season and 2 seasons have a lot T-101 (2024, 2025); give the season in the log so it can be joined.",
            Assert.Single(review.Findings, f => f.Code == "log-matches-several-lots").Message);
        Assert.Single(review.Findings, f => f.Code == "log-without-lot" && f.LotKey == new LotKey(2025, "T-999"));
    }

    [Fact]
    public void A_log_with_a_single_sugar_reading_is_reported_not_analysed()
    {
        // Given one sugar reading and two temperature-only readings
        var log = new FermentationLog("T-101", 2025,
        [
            new LogReading(At("2025-10-01 08:00"), SugarReading.FromBrix(24.0), 18.0, new SourceRef("logs.csv", null, 2)),
            new LogReading(At("2025-10-01 20:00"), null, 22.0, new SourceRef("logs.csv", null, 3)),
        ]);

        // When analysed
        var review = KineticsAnalysis.Run([Lot()], [log], KineticsSettings.Default);

        // Then the lot is absent from the results and the finding says why
        Assert.Empty(review.Lots);
        Assert.Equal(
            "Lot 2025/T-101: the log has 1 sugar reading(s); rates need at least two. The lot's kinetics were not analysed.",
            Assert.Single(review.Findings).Message);
    }

    [Fact]
    public void A_sugar_rise_is_reported()
    {
        // Given a reading 2 °Brix above the one before
        var log = Log("T-101", 2025, ("2025-10-01 08:00", 24.0, null), ("2025-10-02 08:00", 18.0, null), ("2025-10-03 08:00", 20.0, null), ("2025-10-04 08:00", 12.0, null));

        // When analysed
        var review = KineticsAnalysis.Run([Lot()], [log], KineticsSettings.Default);

        // Then the rise is a finding naming both readings
        var f = Assert.Single(review.Findings, x => x.Code == "sugar-rose");
        Assert.StartsWith("Lot 2025/T-101: sugar rose from 18.0 to 20.0 °Brix between 2025-10-02 08:00 and 2025-10-03 08:00", f.Message);
    }

    [Fact]
    public void Unusable_settings_are_refused_with_the_reason()
    {
        // Given thresholds whose danger level is not above the caution level
        var bad = KineticsSettings.Default with { WhiteThresholds = new TemperatureThresholds(25, 20) };

        // When run
        var ex = Assert.Throws<ArgumentException>(() => KineticsAnalysis.Run([], [], bad));

        // Then the message says what is wrong
        Assert.Contains("WhiteThresholds: the danger threshold must be above the caution threshold.", ex.Message);
    }

    [Fact]
    public void The_same_inputs_give_the_same_results()
    {
        // Given one log
        var log = Regular("T-101", 2025, At("2025-10-01 08:00"), 12.0, [24, 23, 20, 16, 11, 7, 3, 0.5, -1, -1.5], [18, 20, 24, 28, 30, 29, 27, 24, 21, 19]);

        // When analysed twice
        var a = Assert.Single(KineticsAnalysis.Run([Lot()], [log], KineticsSettings.Default).Lots);
        var b = Assert.Single(KineticsAnalysis.Run([Lot()], [log], KineticsSettings.Default).Lots);

        // Then every headline number is identical
        Assert.Equal(a.MaxRateBrixPerDay, b.MaxRateBrixPerDay);
        Assert.Equal(a.Gompertz.Fit, b.Gompertz.Fit);
        Assert.Equal(a.HeatRemovedK, b.HeatRemovedK);
    }
}
