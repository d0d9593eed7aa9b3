using YieldBench.Core.Lots;
using YieldBench.Core.Review.Strains;
using YieldBench.Reports.Data;
using YieldBench.Reports.Tables;
using YieldBench.Reports.Tests.Fixtures;

namespace YieldBench.Reports.Tests.Tables;

public sealed class ReviewTablesTests
{
    private static readonly Core.Review.ReviewResult Review = SampleReview.Build();

    [Fact]
    public void The_groups_file_has_exactly_the_documented_columns()
    {
        // Given a review
        // When the group summaries are written
        string header = CsvText.Write(ReviewTables.Groups(Review)).Split("\r\n")[0];

        // Then the header is the data-file contract
        Assert.Equal("grouping,group,measure,n,median,mad,qn,iqr,mean,sd,trimmed_mean,huber,min,max,ci_low,ci_high", header);
    }

    [Fact]
    public void The_flags_file_has_exactly_the_documented_columns()
    {
        // Given a review
        // When the flags are written
        string header = CsvText.Write(ReviewTables.Flags(Review)).Split("\r\n")[0];

        // Then the header is the data-file contract
        Assert.Equal("lot_id,season,code,severity,measure,value,reference_group,reference_median,reference_scale,reason,follow_up", header);
    }

    [Fact]
    public void Each_lot_row_carries_its_robust_z_from_the_strain_review()
    {
        // Given a review and its lots table
        var table = ReviewTables.Lots(Review);
        int id = table.IndexOf("lot_id"), season = table.IndexOf("season"), z = table.IndexOf("robust_z");

        // When each row's robust z is looked up in the strain review's scores
        // Then they agree for every lot
        foreach (var row in table.Rows)
        {
            var key = new LotKey((int)row[season]!, (string)row[id]!);
            var score = Review.Strains.Scores.Single(s => s.LotKey == key);
            Assert.Equal(score.Z, (double)row[z]!);
        }
    }

    [Fact]
    public void The_groups_table_holds_one_row_per_group_and_measure_of_the_strain_review()
    {
        // Given a review
        // When the by-strain summaries are laid out
        var table = ReviewTables.Groups(Review, Groupings.Strain);

        // Then there are three strains × four measures, and the numbers are the review's
        Assert.Equal(12, table.Rows.Count);
        var first = Review.Strains.Groups.First(g => g.Grouping == Groupings.Strain);
        Assert.Equal(first.Group, table.Rows[0][1]);
        Assert.Equal(first.Median, (double)table.Rows[0][4]!);
        Assert.Equal(first.MedianInterval.High, (double)table.Rows[0][15]!);
    }

    [Fact]
    public void The_follow_up_list_puts_likely_errors_first()
    {
        // Given a review whose flags have several severities
        var table = ReviewTables.FollowUp(Review);
        var order = new[] { "likely error", "check", "note" };

        // When the severities are read down the list
        var ranks = table.Rows.Select(r => Array.IndexOf(order, (string)r[0]!)).ToArray();

        // Then they never go up again once they have gone down (the sample plants a likely error and a note)
        Assert.Equal(Review.Strains.Flags.Count, table.Rows.Count);
        Assert.Contains(0, ranks);
        Assert.Contains(2, ranks);
        Assert.Contains(table.Rows, r => (string)r[1]! == "L010" && (string)r[4]! == FlagCodes.AboveTheoreticalYield);
        Assert.Contains(table.Rows, r => (string)r[1]! == "L005" && (string)r[4]! == FlagCodes.NotDry);
        Assert.Equal(ranks.Order().ToArray(), ranks);
    }

    [Fact]
    public void Strains_are_ranked_by_adjusted_conversion()
    {
        // Given a review with an adjusted comparison
        var ranked = Review.Figures.Ranking;

        // When the factors are read in rank order
        var factors = ranked.Select(r => r.Adjusted!.Factor).ToArray();

        // Then they fall (ST-B was made to convert best in the sample: 0.600 vs 0.590 and 0.580)
        Assert.Equal(factors.OrderDescending().ToArray(), factors);
        Assert.Equal("ST-B", ranked[0].Strain);
    }

    [Fact]
    public void The_house_factor_sheet_names_the_flagged_lots_and_shows_both_versions()
    {
        // Given the sample review, whose lot L005 did not finish and L010 holds more alcohol than its sugar can give
        // When the house factor's flagged lots and its two versions are laid out
        var flagged = ReviewTables.HouseFactorFlaggedLots(Review);
        var versions = ReviewTables.HouseFactorVersions(Review);

        // Then both lots are named with their flag, and the overall row of each version counts 34 lots (left out, in use)
        // and 36 (included)
        Assert.Equal(["L005", "L010"], flagged.Rows.Select(r => (string)r[flagged.IndexOf("lot_id")]!));
        Assert.Equal(["not-dry", "above-theoretical-yield"], flagged.Rows.Select(r => (string)r[flagged.IndexOf("codes")]!));
        var overall = versions.Rows.Where(r => (string)r[versions.IndexOf("strain")]! == "all lots").ToArray();
        Assert.Equal([("left out", true, 34), ("included", false, 36)], overall.Select(r => ((string)r[0]!, (bool)r[1]!, (int)r[3]!)));
    }
}
