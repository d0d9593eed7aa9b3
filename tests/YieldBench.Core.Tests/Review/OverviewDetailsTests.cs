using YieldBench.Core.HouseFactor;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Review.Strains;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Review;

/// <summary>The overview's detail tables: factors to use, planning table, ferments per strain, reasons left out, lots to look at.</summary>
public sealed class OverviewDetailsTests
{
    private static ReviewResult Sample => LotReviewTests.Sample.Value;

    [Fact]
    public void The_factors_to_use_are_the_planner_s_lines_at_the_comparison_s_reference_sugar()
    {
        // Given the sample review, whose house factor recommends a planner
        var review = Sample;
        var planning = review.HouseFactor.Planning;
        Assert.NotNull(planning);

        // When the overview's factors are read
        var factors = review.Overview.Factors;

        // Then they are given at the planner's reference sugar, the pooled one is the planner's pooled line, and each
        // strain with a line of its own is there, in the review's strain order
        Assert.NotNull(factors);
        Assert.True(double.IsFinite(planning.ReferenceBrix));
        Assert.Equal(planning.ReferenceBrix, factors.ReferenceBrix);
        Assert.Equal("*", factors.Pooled.Strain);
        Assert.Equal(planning.Pooled.SlopePerBrix, factors.Pooled.Slope);
        Assert.Equal(review.HouseFactor.Overall!.Metrics.Mae, factors.Pooled.HeldOutMae);
        Assert.Equal(review.Figures.StrainOrder.Where(planning.Knows), factors.Strains.Select(s => s.Strain));
        foreach (var choice in factors.Strains.Append(factors.Pooled))
        {
            // Each factor is the planner's at its reference sugar, the number data/house-factor.json writes
            var line = planning.For(choice.Strain == "*" ? null : choice.Strain);
            Assert.Equal(planning.FactorOf(line), choice.Factor);
            Assert.Equal(line.Predict(factors.ReferenceBrix) / factors.ReferenceBrix, choice.Factor, 12);

            // The estimate is the planner's at the reference sugar, its 80 % range inside its 95 % range
            var estimate = Planner.Estimate(line, SugarReading.FromBrix(factors.ReferenceBrix));
            Assert.Equal(estimate, choice.Estimate);
            Assert.InRange(choice.Estimate.Predicted, choice.Estimate.Low80, choice.Estimate.High80);
            Assert.True(choice.Estimate.Low95 <= choice.Estimate.Low80 && choice.Estimate.High80 <= choice.Estimate.High95);

            // Its ranges say which held-out errors they come from, and it counts as scored alone exactly when the house
            // factor scored it (the pooled line, or a strain with a recommendation of its own)
            Assert.Equal(line.ErrorBasis, choice.RangesFrom);
            bool own = choice.Strain == "*" || review.HouseFactor.ByStrain.Any(r => r.Strain == choice.Strain);
            Assert.Equal(own, choice.ScoredAlone);
        }
    }

    [Fact]
    public void A_strain_too_small_for_a_backtest_of_its_own_is_not_scored_alone_and_says_where_its_ranges_come_from()
    {
        // Given a choice for a strain with no recommendation of its own (13 lots; 15 are needed), as the overview builds it
        var estimate = new AlcoholEstimate(14.05, 13.93, 14.24, 13.84, 14.32, 48);
        var choice = new FactorChoice("MB-2", "Per-strain median factor", SugarCurve.Line, 0, 0.58, 0.58, estimate, double.NaN, 0,
            "all 48 lots held out by leave-one-season-out (this strain has 13, too few for intervals of its own)");

        // Then it is not scored alone, and the console says where its ranges come from instead of an error of "n/a (0 lots)"
        Assert.False(choice.ScoredAlone);
        Assert.True(new FactorChoice("*", "x", SugarCurve.Line, 0, 0.6, 0.6, estimate, 0.1, 48, "all 48 lots").ScoredAlone);
    }

    [Fact]
    public void A_factor_through_the_origin_is_its_slope_and_predicts_slope_times_the_reference_sugar()
    {
        // Given a strain whose line passes through the origin (the per-strain median factor), if the sample has one
        var factors = Sample.Overview.Factors!;
        var origin = factors.Strains.Append(factors.Pooled).Where(c => c.Curve == SugarCurve.Line && c.Intercept == 0).ToArray();
        Assert.NotEmpty(origin);

        // Then its factor is the slope, and the prediction at the reference sugar is slope × °Brix (to rounding)
        foreach (var c in origin)
        {
            Assert.Equal(c.Slope, c.Factor, 12);
            Assert.Equal(c.Slope * factors.ReferenceBrix, c.Estimate.Predicted, 12);
        }
    }

    [Fact]
    public void The_planning_table_holds_every_planner_answer_once_pooled_first()
    {
        // Given the sample review's planner table
        var review = Sample;
        var table = review.HouseFactor.PlannerTable;
        var planning = review.Overview.Planning;
        Assert.NotNull(planning);

        // Then the rows start with the pooled line, hold each strain of the planner table, and every cell is the
        // planner's answer for its strain, target and confidence
        Assert.Equal("*", planning.Rows[0].Strain);
        Assert.Equal(table.Select(a => a.Strain).Distinct().Order(StringComparer.Ordinal), planning.Rows.Select(r => r.Strain).Order(StringComparer.Ordinal));
        int cells = 0;
        foreach (var row in planning.Rows)
        {
            for (int t = 0; t < planning.Targets.Count; t++)
            {
                for (int c = 0; c < planning.Confidences.Count; c++)
                {
                    var answer = table.Single(a => a.Strain == row.Strain && a.TargetAbv == planning.Targets[t] && a.Confidence == planning.Confidences[c]);
                    Assert.Equal(answer.PickAtOrBelowBrix, row.HighestBrix[t][c]);
                    cells++;
                }
            }
        }

        Assert.Equal(table.Count, cells);
    }

    [Fact]
    public void Ferments_per_strain_count_the_stuck_sluggish_and_unfinished_logs_as_troubled()
    {
        // Given the sample: L005 (ST-A, 2025) stalls at 10.6 °Brix, L020 runs hot but finishes
        var review = Sample;
        var ferments = review.Overview.Ferments;

        // Then each strain with a log has a row, in strain order, and only L005's strain counts a troubled ferment
        Assert.Equal(review.Figures.StrainOrder.Where(s => review.Kinetics!.Lots.Any(k => k.Lot.Strain == s)), ferments.Select(f => f.Strain));
        var stalled = review.Kinetics!.Lots.Single(k => k.Lot.LotId == "L005");
        Assert.Contains(stalled.Flags, f => StrainFerments.TroubledCodes.Contains(f));
        foreach (var f in ferments)
        {
            Assert.Equal(f.Strain == stalled.Lot.Strain ? 1 : 0, f.Troubled);
            Assert.Equal((double)f.Troubled / f.Lots, f.TroubledShare);
        }
    }

    [Fact]
    public void Lots_to_look_at_come_once_each_most_serious_first()
    {
        // Given the sample review
        var review = Sample;
        var flagged = review.Overview.FlaggedLots;

        // Then every flagged lot is there once, and severities never rise down the list; within a severity, lot keys ascend
        Assert.Equal(review.LotReviews.Count(l => l.IsFlagged), flagged.Count);
        Assert.Equal(flagged.Count, flagged.Select(l => l.Key).Distinct().Count());
        Assert.Contains(flagged, l => l.Lot.LotId == "L010");
        for (int i = 1; i < flagged.Count; i++)
        {
            Assert.True(flagged[i - 1].WorstSeverity > flagged[i].WorstSeverity
                || (flagged[i - 1].WorstSeverity == flagged[i].WorstSeverity && flagged[i - 1].Key.CompareTo(flagged[i].Key) < 0));
        }

        Assert.Equal(FlagSeverity.LikelyError, flagged[0].WorstSeverity);
    }

    [Fact]
    public void Rows_left_out_are_counted_by_reason_most_rows_first()
    {
        // Given a set with three row errors of two codes, a file-level error and a warning
        var lot = Sample.Inputs.Lots[0];
        var set = new SeasonSet
        {
            Lots = [lot],
            Issues =
            [
                new("a.csv", null, 4, "final_abv", "x", "not-a-number", "first", IssueSeverity.Error),
                new("a.csv", null, 5, "strain", "", "missing-value", "second", IssueSeverity.Error),
                new("a.csv", null, 6, "final_abv", "y", "not-a-number", "third", IssueSeverity.Error),
                new("b.csv", null, null, null, null, "unreadable-file", "whole file", IssueSeverity.Error),
                new("a.csv", null, 7, "notes", "=1", "formula-like-text", "warned", IssueSeverity.Warning),
            ],
        };

        // When the reasons are counted
        var reasons = ReviewRunner.Run(set, new ReviewSettings(), "test").Overview.LeftOutReasons;

        // Then only row errors count, grouped by code, most rows first, each with its first message as example
        Assert.Equal([new ReasonCount("not-a-number", 2, "first"), new ReasonCount("missing-value", 1, "second")], reasons);
    }
}
