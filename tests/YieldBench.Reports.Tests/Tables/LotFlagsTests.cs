using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Units;
using YieldBench.Reports.Tables;
using YieldBench.Reports.Tests.Fixtures;
using YieldBench.Reports.Tests.Kinetics;

namespace YieldBench.Reports.Tests.Tables;

public sealed class LotFlagsTests
{
    private static ReviewResult ReviewWithLogs() => SampleReview.WithLogs();

    [Fact]
    public void The_strain_flag_test_answers_as_HasStrainFlag_for_the_review_s_lots_and_for_a_copy_of_one()
    {
        // Given the review with logs, some of its lots flagged by the strain review, and a copy of a flagged lot (the
        // same key, another object: answered by its key)
        var review = ReviewWithLogs();
        var test = ReviewTables.StrainFlagTest(review);
        var flagged = review.Lots.First(l => ReviewTables.HasStrainFlag(review, l));
        var copy = flagged with { };

        // Then the test and HasStrainFlag agree on every lot, flagged or not, and on the copy
        Assert.All(review.Lots, l => Assert.Equal(ReviewTables.HasStrainFlag(review, l), test(l)));
        Assert.Contains(review.Lots, l => !test(l));
        Assert.NotSame(flagged, copy);
        Assert.True(test(copy));
        Assert.True(ReviewTables.HasStrainFlag(review, copy));
    }

    [Fact]
    public void A_lot_s_flags_are_its_strain_codes_then_its_kinetics_codes_each_once()
    {
        // Given the review with logs (some lots carry several codes)
        var review = ReviewWithLogs();

        // When each lot's flags are asked for, and worked out independently from the review's own lists
        foreach (var lot in review.Lots)
        {
            var expected = review.Strains.Flags.Where(f => f.LotKey == lot.Lot.Key).Select(f => f.Code)
                .Concat(review.Kinetics!.Lots.FirstOrDefault(k => k.LotKey == lot.Lot.Key)?.Flags ?? [])
                .Distinct(StringComparer.Ordinal).ToArray();

            // Then they agree, in order
            Assert.Equal(expected, ReviewTables.LotFlags(review, lot));
        }

        Assert.Contains(review.Lots, l => ReviewTables.LotFlags(review, l).Count >= 2);
        Assert.Contains(review.Lots, l => ReviewTables.LotFlags(review, l).Count == 0);
    }

    [Fact]
    public void The_lots_table_joins_the_flags_and_highlights_exactly_the_lots_to_look_at()
    {
        // Given the review with logs
        var review = ReviewWithLogs();

        // When the lots table is built
        var table = ReviewTables.Lots(review);
        int flagsColumn = table.IndexOf("flags");

        // Then each row's flags cell is the lot's codes joined by ';' (empty when none) and the highlight is IsFlagged
        for (int i = 0; i < review.Lots.Count; i++)
        {
            var codes = ReviewTables.LotFlags(review, review.Lots[i]);
            Assert.Equal(codes.Count == 0 ? null : string.Join(';', codes), table.Rows[i][flagsColumn]);
            Assert.Equal(ReviewTables.IsFlagged(review, review.Lots[i]), table.Highlighted[i]);
        }

        Assert.Contains(true, table.Highlighted);
        Assert.Contains(false, table.Highlighted);
    }
}
