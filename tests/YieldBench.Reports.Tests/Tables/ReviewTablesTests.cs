using YieldBench.Core.Review;
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
        Assert.Equal("grouping,group,measure,n,median,mad,qn,sn,iqr,mean,sd,trimmed_mean,huber,min,max,ci_low,ci_high", header);
    }

    [Fact]
    public void The_groups_file_writes_each_groups_Sn_as_methods_md_promises()
    {
        // Given a review and its groups file
        string[] lines = CsvText.Write(ReviewTables.Groups(Review)).Split("\r\n", StringSplitOptions.RemoveEmptyEntries);
        int sn = Array.IndexOf(lines[0].Split(','), "sn");

        // Then every row's sn is its group's Sn (Rousseeuw & Croux; Robust.Sn is checked against R robustbase in
        // RobustTests), at the file's 4 decimals, and differs from Qn somewhere (it is not a copy of the column before)
        var groups = Review.Strains.Groups.ToArray();
        Assert.Equal(groups.Length, lines.Length - 1);
        for (int i = 0; i < groups.Length; i++)
        {
            string cell = lines[i + 1].Split(',')[sn];
            if (double.IsNaN(groups[i].Sn))
            {
                Assert.Equal(string.Empty, cell);
            }
            else
            {
                Assert.Equal(groups[i].Sn, double.Parse(cell, System.Globalization.CultureInfo.InvariantCulture), 4);
            }
        }

        Assert.Contains(groups, g => Math.Abs(g.Sn - g.Qn) > 1e-3);
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
        Assert.Equal(first.MedianInterval.High, (double)table.Rows[0][16]!);
    }

    [Fact]
    public void The_follow_up_list_has_one_row_per_lot_to_look_at_likely_errors_first()
    {
        // Given a review whose flags have several severities
        var table = ReviewTables.Findings(Review);
        var order = new[] { "likely error", "check", "note" };

        // When the severities are read down the list
        var ranks = table.Rows.Select(r => Array.IndexOf(order, (string)r[0]!)).ToArray();

        // Then there is one row per lot to look at, the severities never go up again once they have gone down (the
        // sample plants a likely error, L010), and each lot appears once
        Assert.Equal(Review.LotReviews.Count(l => l.IsFlagged), table.Rows.Count);
        Assert.Equal(table.Rows.Count, table.Rows.Select(r => ((int)r[2]!, (string)r[1]!)).Distinct().Count());
        Assert.Equal(0, ranks[0]);
        Assert.Contains(1, ranks);
        Assert.Contains(table.Rows, r => (string)r[1]! == "L010" && ((string)r[8]!).Contains(ReviewTexts.FlagName(FlagCodes.AboveTheoreticalYield), StringComparison.Ordinal));
        Assert.Contains(table.Rows, r => (string)r[1]! == "L005" && ((string)r[8]!).Contains(ReviewTexts.FlagName(FlagCodes.NotDry), StringComparison.Ordinal));
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

    [Fact]
    public void The_planner_sheet_shows_each_answer_once_under_its_target()
    {
        // Given the sample review's planner answers (strain × target × confidence)
        var answers = Review.HouseFactor.PlannerTable;
        var targets = answers.Select(a => a.TargetAbv).Distinct().Order().ToArray();

        // When laid out one row per strain and confidence, one column per target
        var table = ReviewTables.PlannerByTarget(Review);

        // Then every answer's highest sugar is in its row under its target's column, and nothing else is there
        Assert.True(targets.Length >= 2);
        Assert.Equal(answers.Count, table.Rows.Count * targets.Length);
        foreach (var a in answers)
        {
            var row = table.Rows.Single(r => (string)r[0]! == (a.Strain == "*" ? "all lots" : a.Strain) && (double)r[1]! == a.Confidence);
            Assert.Equal(a.PickAtOrBelowBrix, (double)row[3 + Array.IndexOf(targets, a.TargetAbv)]!);
            Assert.Equal(a.ErrorAllowance, (double)row[2]!, 9);
        }
    }

    [Fact]
    public void Every_flag_code_the_review_wrote_has_plain_words_in_the_glossary()
    {
        // Given the sample review with fermentation logs (strain flags, kinetics flags and log findings)
        var review = SampleReview.WithLogs();

        // When the methods sheet's glossary is laid out
        var glossary = MethodsTable.FlagGlossary(review);
        var codes = glossary.Rows.Select(r => (string)r[0]!).ToArray();

        // Then it holds every code the lots table writes, each once, each with words other than the code itself
        var written = ReviewTables.Lots(review).Rows.Select(r => (string?)r[ReviewTables.Lots(review).IndexOf("flags")])
            .Where(f => f is not null).SelectMany(f => f!.Split(';')).Distinct().ToArray();
        Assert.NotEmpty(written);
        Assert.Subset(codes.ToHashSet(), written.ToHashSet());
        Assert.Equal(codes.Distinct().Count(), codes.Length);
        Assert.All(glossary.Rows, r => Assert.NotEqual(r[0], r[1]));
    }
}
