using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Review.Strains;
using YieldBench.Core.Units;
using YieldBench.Reports.Output;
using YieldBench.Reports.Tables;
using YieldBench.Reports.Tests.Fixtures;
using YieldBench.Reports.Tests.Kinetics;

namespace YieldBench.Reports.Tests.Tables;

public sealed class KineticsFollowUpTests
{
    // Invented logs for two sample lots: L005 (2024, lab residual sugar 12 g/L) stalls at 10.6 °Brix for days; L020
    // (2025, dry) ferments through 41 °C, above the default danger threshold for a lot of unknown colour.
    // The sample review with invented logs for two lots: L005 (2024, lab residual sugar 12 g/L) stalls at 10.6 °Brix
    // for days; L020 (2025, dry) ferments through 41 °C, above the default danger threshold for a lot of unknown colour.
    private static ReviewResult ReviewWithLogs() => SampleReview.WithLogs();

    private static IEnumerable<Dictionary<string, object?>> Rows(ReportTable table) =>
        table.Rows.Select(r => table.Columns.Select((c, i) => (c.Name, r[i])).ToDictionary(p => p.Name, p => p.Item2));

    [Fact]
    public void A_stuck_ferment_is_on_the_follow_up_list_with_what_was_seen_and_a_restart_follow_up()
    {
        // Given a review whose lot L005 stalled above dry and did not finish by the lab's residual sugar
        var review = ReviewWithLogs();
        Assert.Contains("stuck", review.Kinetics!.Lots.Single(k => k.LotKey == new LotKey(2024, "L005")).Flags);

        // When the follow-up table (one row per lot) is built
        var stuck = Rows(ReviewTables.Findings(review)).Single(r => (string?)r["lot_id"] == "L005");

        // Then its row says what was seen with the numbers, the stall as the explanation, and a follow-up naming
        // restart protocols and licensed practice
        Assert.Equal("check", stuck["severity"]);
        Assert.Contains("stuck at 10.6 °Brix", (string)stuck["seen"]!, StringComparison.Ordinal);
        Assert.Equal("The ferment stopped before it was dry.", stuck["explanation"]);
        Assert.Contains("restart protocol per licensed practice", (string)stuck["follow_up"]!, StringComparison.Ordinal);
        Assert.Contains("stuck ferment", (string)stuck["flags"]!, StringComparison.Ordinal);
        Assert.Equal("ST-A", stuck["strain"]);
    }

    [Fact]
    public void An_overheated_ferment_is_on_the_follow_up_list_with_a_cooling_follow_up_and_its_peak()
    {
        // Given a review whose lot L020 peaked at 41 °C
        var review = ReviewWithLogs();

        // When the follow-up table is built
        var hot = Rows(ReviewTables.Findings(review)).Single(r => (string?)r["lot_id"] == "L020");

        // Then what was seen is the logged peak and the follow-up points at cooling, cap management (named as depending
        // on skin contact: the lot's colour is unknown) and the CO2 hazard
        Assert.StartsWith("Peaked at 41.0 °C, above the 40 °C danger line", (string)hot["seen"]!, StringComparison.Ordinal);
        Assert.Equal("check", hot["severity"]);
        Assert.Contains("cooling capacity for this vessel (and cap management, if the must ferments on its skins)", (string)hot["follow_up"]!, StringComparison.Ordinal);
        Assert.Contains("CO2", (string)hot["follow_up"]!, StringComparison.Ordinal);
    }

    [Fact]
    public void Data_quality_flags_of_a_log_stay_off_the_follow_up_list()
    {
        // Given the kinetics follow-up codes
        // When compared with every kinetics flag code
        var left = KineticsAnalysis.FlagOrder.Except(KineticsFollowUps.Codes).ToArray();

        // Then timestamps, rising sugar and a stall that still finished are not follow-ups, and every follow-up code is a real flag
        Assert.Equal(new[] { "stalled-then-finished", "out-of-order-timestamp", "duplicate-timestamp", "sugar-rose" }, left);
        Assert.All(KineticsFollowUps.Codes, c => Assert.Contains(c, KineticsAnalysis.FlagOrder));
    }

    [Fact]
    public void A_lot_flagged_only_by_kinetics_counts_as_a_lot_to_look_at_but_gets_no_ring_on_conversion_charts()
    {
        // Given the review with logs, and lot L020 which the strain review did not flag
        var review = ReviewWithLogs();
        var l020 = review.LotReviews.Single(l => l.Key == new LotKey(2025, "L020"));
        Assert.DoesNotContain(review.Strains.Flags, f => f.LotKey == new LotKey(2025, "L020"));

        // When it is asked about
        // Then it is flagged (Lots-sheet highlight, counts) with a check severity, but not a strain-review finding
        Assert.True(l020.IsFlagged);
        Assert.Equal(FlagSeverity.Check, l020.WorstSeverity);
        Assert.False(l020.HasStrainFlag);
    }

    [Fact]
    public void The_console_count_of_lots_to_look_at_is_the_union_of_strain_and_kinetics_flags()
    {
        // Given the review with logs
        var review = ReviewWithLogs();
        var expected = review.Strains.Flags.Where(f => f.LotKey is not null).Select(f => f.LotKey!.Value)
            .Union(review.Kinetics!.Lots.Where(k => k.Flags.Intersect(KineticsFollowUps.Codes).Any()).Select(k => k.LotKey))
            .Distinct().Count();

        // When the console summary is written
        var line = ConsoleSummary.Lines(review, new ReportOutput("out", [], [])).Single(l => l.StartsWith("Lots to look at:", StringComparison.Ordinal));

        // Then its count, the overview's count (IsFlagged) and the independent union agree
        Assert.StartsWith($"Lots to look at: {expected} (", line, StringComparison.Ordinal);
        Assert.Equal(expected, review.LotReviews.Count(l => l.IsFlagged));
        Assert.Equal(expected, review.Overview.Lots.Flagged);
        Assert.True(expected > review.LotReviews.Count(l => l.HasStrainFlag));
    }
}
