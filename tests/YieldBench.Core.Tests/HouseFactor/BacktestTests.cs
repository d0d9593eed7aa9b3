using YieldBench.Core.Lots;
using YieldBench.Core.HouseFactor;

namespace YieldBench.Core.Tests.HouseFactor;

public class BacktestTests
{
    private static readonly Dictionary<string, double> DifferentStrains = new()
    {
        ["SX-01"] = 0.560, ["SX-02"] = 0.585, ["SX-03"] = 0.610, ["SX-04"] = 0.635,
    };

    private static readonly Dictionary<string, double> SameStrains = new()
    {
        ["SX-01"] = 0.575, ["SX-02"] = 0.575, ["SX-03"] = 0.575, ["SX-04"] = 0.575,
    };

    [Fact]
    public void Metrics_match_a_hand_computed_example_checked_in_R()
    {
        // Given six held-out predictions (oracle: R 4.2.2, mean(abs(e)), sd(abs(e))/sqrt(6), mean(pred - actual),
        // sqrt(mean(e^2)), quantile(abs(e), .9, type = 7) → 0.416666666667, 0.104615698843, -0.116666666667,
        // 0.477842372894, 0.7)
        double[] actual = [13.2, 14.1, 12.8, 15.0, 13.9, 14.4];
        double[] predicted = [13.0, 14.5, 12.9, 14.2, 14.3, 13.8];
        var preds = actual.Select((a, i) => new HeldOutPrediction(new LotKey(2024, $"L{i}"), 2024, "SX-01", a, predicted[i])).ToArray();

        // When they are scored against the US regime and the 14 % threshold
        var m = BacktestMetrics.Score(preds, LabelRegime.UnitedStates, 14.0);

        // Then every metric is the hand value; every lot is within its tolerance and none crosses the 16 % class line, so
        // 6 of 6 meet the US rule; lots 5 and 6 cross 14 %, so 2 of 6 are on the wrong side of the threshold, and with the
        // class line set to 14 % (the rule before 2018) only 4 of 6 would meet it
        Assert.Equal(6, m.Lots);
        Assert.Equal(0.416666666667, m.Mae, 1e-9);
        Assert.Equal(0.104615698843, m.MaeStandardError, 1e-9);
        Assert.Equal(-0.116666666667, m.Bias, 1e-9);
        Assert.Equal(0.477842372894, m.Rmse, 1e-9);
        Assert.Equal(0.7, m.P90AbsoluteError, 1e-9);
        Assert.Equal(6.0 / 6, m.ShareWithinTolerance, 1e-12);
        Assert.Equal(2.0 / 6, m.ShareWrongSideOfThreshold, 1e-12);
        Assert.Equal(4.0 / 6, BacktestMetrics.Score(preds, LabelRegime.UnitedStates.WithNoCrossingLine(14.0), 14.0).ShareWithinTolerance, 1e-12);
    }

    [Fact]
    public void Leave_one_season_out_never_trains_on_the_season_it_predicts()
    {
        // Given two seasons whose strain factors differ sharply, one strain each season
        var lots = new[]
        {
            SyntheticLots.Lot("A1", 2023, "SX-01", 20, 10.0), SyntheticLots.Lot("A2", 2023, "SX-01", 25, 12.5),
            SyntheticLots.Lot("B1", 2024, "SX-01", 20, 12.0), SyntheticLots.Lot("B2", 2024, "SX-01", 25, 15.0),
        };

        // When the pooled median is backtested leave-one-season-out
        var preds = Backtest.Run(new PooledMedianCandidate(), lots, BacktestScheme.LeaveOneSeasonOut, 1);

        // Then 2023 lots are predicted with the 2024 factor 0.6 and 2024 lots with the 2023 factor 0.5
        Assert.Equal([12.0, 15.0, 10.0, 12.5], preds.Select(p => Math.Round(p.PredictedAbv, 9)).ToArray());
    }

    [Theory]
    [InlineData(BacktestScheme.TenFoldByLot, 10)]
    [InlineData(BacktestScheme.LeaveOneSeasonOut, 3)]
    [InlineData(BacktestScheme.LeaveOneLotOut, 60)]
    public void Every_lot_is_held_out_exactly_once_and_trained_on_in_every_other_fold(BacktestScheme scheme, int expectedFolds)
    {
        // Given three seeded seasons of 20 lots
        var lots = SyntheticLots.Seasons(5, SameStrains, seasons: 3, lotsPerStrainPerSeason: 5, noiseSd: 0.15);

        // When the folds of the scheme are dealt
        var folds = BacktestFolds.Of(lots, scheme, 3);

        // Then each lot is predicted by one fold only, never trained on there, and trained on (in input order) everywhere else
        Assert.Equal(expectedFolds, folds.Count);
        var heldBy = new int[lots.Count];
        for (int f = 0; f < folds.Count; f++)
        {
            var (train, test, inputs) = folds.Fold(f);
            Assert.Equal(test.Length, inputs.Count);
            Assert.Equal(lots.Count, train.Count + test.Length);
            var expectedTrain = lots.Where((_, i) => !test.Contains(i)).ToArray();
            Assert.Equal(expectedTrain, train);
            foreach (int i in test)
            {
                heldBy[i]++;
                Assert.Equal(lots[i].EffectiveStartingBrix, inputs[Array.IndexOf(test, i)].StartingBrix);
            }

            if (scheme == BacktestScheme.LeaveOneSeasonOut)
            {
                Assert.Single(test.Select(i => lots[i].Lot.Season).Distinct());
            }
        }

        Assert.All(heldBy, n => Assert.Equal(1, n));
    }

    [Theory]
    [InlineData(BacktestScheme.TenFoldByLot)]
    [InlineData(BacktestScheme.LeaveOneSeasonOut)]
    public void A_fold_with_more_training_lots_than_the_cap_trains_on_a_seeded_sample_and_still_predicts_every_lot(BacktestScheme scheme)
    {
        // Given three seeded seasons of 60 lots, and folds capped at 25 training lots
        var lots = SyntheticLots.Seasons(5, SameStrains, seasons: 3, lotsPerStrainPerSeason: 5, noiseSd: 0.15);
        var capped = BacktestFolds.Of(lots, scheme, 3, maximumTrainingLots: 25);
        var again = BacktestFolds.Of(lots, scheme, 3, maximumTrainingLots: 25);
        var full = BacktestFolds.Of(lots, scheme, 3);

        for (int f = 0; f < capped.Count; f++)
        {
            var (train, test, _) = capped.Fold(f);
            var (fullTrain, fullTest, _) = full.Fold(f);

            // Then each fold trains on 25 distinct lots of its own full training set, in input order, never on a lot it predicts
            Assert.Equal(25, train.Count);
            Assert.Equal(25, train.Distinct().Count());
            Assert.All(train, l => Assert.Contains(l, fullTrain));
            var positions = train.Select(l => lots.ToList().IndexOf(l)).ToArray();
            Assert.Equal(positions.Order().ToArray(), positions);
            Assert.DoesNotContain(positions, test.Contains);

            // And the held-out lots are those of the uncapped fold, and the sample is the same every time
            Assert.Equal(fullTest, test);
            Assert.Equal(train, again.Fold(f).Train);
        }

        // And below the default cap (20,000) nothing is sampled: a fold trains on all lots outside it
        Assert.Equal(lots.Count - full.Fold(0).Test.Length, full.Fold(0).Train.Count);
    }

    [Fact]
    public void Shared_folds_give_the_same_predictions_as_folds_dealt_for_one_candidate()
    {
        // Given seeded seasons and the ten-fold scheme dealt once
        var lots = SyntheticLots.Seasons(9, DifferentStrains, seasons: 2, lotsPerStrainPerSeason: 10, noiseSd: 0.15);
        var folds = BacktestFolds.Of(lots, BacktestScheme.TenFoldByLot, 4);

        // When two candidates use the shared folds, and each is also backtested on its own
        var shared = new ICandidateTrainer[] { new PerStrainMedianCandidate(), new PooledMedianCandidate() }.Select(c => Backtest.Run(c, folds, 4)).ToArray();
        var alone = new ICandidateTrainer[] { new PerStrainMedianCandidate(), new PooledMedianCandidate() }.Select(c => Backtest.Run(c, lots, BacktestScheme.TenFoldByLot, 4)).ToArray();

        // Then the predictions agree lot by lot, and the two candidates really differ
        for (int c = 0; c < 2; c++)
        {
            Assert.Equal(alone[c].Select(p => (p.LotKey, p.PredictedAbv)), shared[c].Select(p => (p.LotKey, p.PredictedAbv)));
        }

        Assert.NotEqual(shared[0].Select(p => p.PredictedAbv), shared[1].Select(p => p.PredictedAbv));
    }

    [Fact]
    public void The_backtest_ranks_the_true_per_strain_model_first_on_seeded_seasons()
    {
        // Given four seeded seasons where each strain has its own true factor (0.560 to 0.635) and noise SD 0.15 % v/v
        var lots = SyntheticLots.Seasons(11, DifferentStrains, seasons: 4, lotsPerStrainPerSeason: 20, noiseSd: 0.15);

        // When the analysis runs
        var review = HouseFactorAnalysis.Run(lots, new HouseFactorSettings(), [], 7);

        // Then leave-one-season-out is used, a per-strain candidate has the lowest MAE, every pooled or fixed one is clearly worse,
        // and the recommendation is per strain
        Assert.Equal(BacktestScheme.LeaveOneSeasonOut, review.PrimaryScheme);
        var ranked = review.Candidates.OrderBy(c => c.Primary.Mae).ToArray();
        Assert.Contains(ranked[0].Id, new[] { "strain-median", "strain-shrunk" });
        Assert.Contains(ranked[1].Id, new[] { "strain-median", "strain-shrunk" });
        Assert.True(ranked[2].Primary.Mae > ranked[0].Primary.Mae + (3 * ranked[0].Primary.MaeStandardError));
        Assert.Contains(review.Overall!.CandidateId, new[] { "strain-median", "strain-shrunk" });
        Assert.InRange(ranked[0].Primary.Mae, 0.10, 0.14); // E|N(0, 0.15²)| = 0.15·√(2/π) = 0.1197
    }

    [Fact]
    public void The_recommended_intervals_cover_a_new_season_at_about_their_nominal_rate()
    {
        // Given four backtested seasons and a fifth, unseen season of 4000 lots from the same process
        var lots = SyntheticLots.Seasons(21, DifferentStrains, seasons: 4, lotsPerStrainPerSeason: 20, noiseSd: 0.15);
        var review = HouseFactorAnalysis.Run(lots, new HouseFactorSettings(), [], 7);
        var fresh = SyntheticLots.Seasons(99, DifferentStrains, seasons: 1, lotsPerStrainPerSeason: 1000, noiseSd: 0.15, firstSeason: 2030);

        // When each new lot is predicted by the planner line of its strain
        var (n, in80, in95) = SyntheticLots.Covered(review.Planning!, fresh);

        // Then about 80 % and 95 % of the new lots fall inside (80 held-out errors per strain: a few points of slack)
        Assert.InRange(in80 / (double)n, 0.74, 0.88);
        Assert.InRange(in95 / (double)n, 0.91, 0.99);
    }

    [Fact]
    public void The_one_standard_error_rule_picks_the_pooled_factor_when_strain_differences_are_noise()
    {
        // Given seeded seasons where every strain has the same true factor 0.575
        var lots = SyntheticLots.Seasons(31, SameStrains, seasons: 3, lotsPerStrainPerSeason: 15, noiseSd: 0.15);

        // When the analysis runs
        var review = HouseFactorAnalysis.Run(lots, new HouseFactorSettings(), [], 7);

        // Then the simpler pooled median is chosen even if a per-strain candidate scores a hair better
        Assert.Equal("pooled-median", review.Overall!.CandidateId);
        Assert.DoesNotContain(review.ByStrain, r => r.CandidateId is "strain-median");
    }

    [Fact]
    public void The_analysis_gives_the_same_numbers_for_the_same_inputs_and_seed()
    {
        // Given one set of lots
        var lots = SyntheticLots.Seasons(41, DifferentStrains, seasons: 2, lotsPerStrainPerSeason: 10, noiseSd: 0.2);

        // When the analysis runs twice
        var a = HouseFactorAnalysis.Run(lots, new HouseFactorSettings(), [], 5);
        var b = HouseFactorAnalysis.Run(lots, new HouseFactorSettings(), [], 5);

        // Then metrics, choice and planner table agree exactly
        Assert.Equal(a.Candidates.Select(c => c.Primary.Mae), b.Candidates.Select(c => c.Primary.Mae));
        Assert.Equal(a.Overall!.CandidateId, b.Overall!.CandidateId);
        Assert.Equal(a.PlannerTable.Select(t => t.HighestBrix), b.PlannerTable.Select(t => t.HighestBrix));
    }

    [Fact]
    public void Too_few_lots_give_no_recommendation_and_say_so()
    {
        // Given six lots
        var lots = SyntheticLots.Seasons(51, SameStrains, seasons: 1, lotsPerStrainPerSeason: 1, noiseSd: 0.2).Concat(
            SyntheticLots.Seasons(52, new Dictionary<string, double> { ["SX-09"] = 0.58 }, 1, 2, 0.2)).ToArray();

        // When the analysis runs
        var review = HouseFactorAnalysis.Run(lots, new HouseFactorSettings(), [], 5);

        // Then nothing is chosen, the planner has no model, and the reason is plain
        Assert.Null(review.Overall);
        Assert.Null(review.Planning);
        Assert.Contains("Too few lots to choose a house factor: 6 usable, at least 10 are needed. Keep a record of starting sugar, strain and the lab's final alcohol for every lot.", review.Explanation);
    }

    [Fact]
    public void One_season_falls_back_to_leave_one_lot_out_and_says_it_flatters()
    {
        // Given a single season of 40 lots
        var lots = SyntheticLots.Seasons(61, SameStrains, seasons: 1, lotsPerStrainPerSeason: 10, noiseSd: 0.2);

        // When the analysis runs
        var review = HouseFactorAnalysis.Run(lots, new HouseFactorSettings(), [], 5);

        // Then leave-one-lot-out is the primary backtest, no season metrics exist, and the explanation warns
        Assert.Equal(BacktestScheme.LeaveOneLotOut, review.PrimaryScheme);
        Assert.All(review.Candidates, c => Assert.Null(c.BySeason));
        Assert.Contains(review.Explanation, s => s.StartsWith("Only one season is present", StringComparison.Ordinal));
    }
}

public class PlannerFallbackTests
{
    /// <summary>A stand-in for a multi-variable model: knows the true rule, including the nitrogen effect.</summary>
    private sealed class KnowsNitrogen : ICandidateTrainer, IAbvPredictor
    {
        public string Id => "knows-nitrogen";

        public string Name => "Knows nitrogen";

        public string Description => "Test stand-in.";

        public int Complexity => 10;

        public bool IsCostly => false;

        public IAbvPredictor Train(IReadOnlyList<YieldBench.Core.Conversion.LotConversion> lots, int seed) => this;

        public double PredictAbv(PredictionInput input) => (0.58 * input.StartingBrix) + (0.01 * (input.YanMgL!.Value - 200));

        public SugarLines? AsSugarLines() => null;

        public IReadOnlyList<FeatureImportance> Importance(IReadOnlyList<YieldBench.Core.Conversion.LotConversion> lots, int seed) =>
            [new("starting sugar", 1.0), new("YAN", 0.5)];
    }

    [Fact]
    public void When_the_chosen_model_needs_more_than_strain_and_sugar_the_planner_uses_the_best_that_does_and_says_so()
    {
        // Given lots whose alcohol depends strongly on YAN, which only the stand-in model knows
        var rng = new Random(3);
        var lots = Enumerable.Range(0, 60).Select(i =>
        {
            double brix = 20 + (7 * rng.NextDouble()), yan = 100 + (200 * rng.NextDouble());
            var lot = new YieldBench.Core.Lots.Lot
            {
                LotId = $"L{i}",
                Season = 2022 + (i % 3),
                Strain = "SX-01",
                StartingSugar = YieldBench.Core.Units.SugarReading.FromBrix(brix),
                FinalAlcohol = YieldBench.Core.Units.AlcoholContent.FromPercentVolume((0.58 * brix) + (0.01 * (yan - 200)) + (0.05 * SyntheticLots.Gaussian(rng))),
                YanMgL = yan,
            };
            return YieldBench.Core.Conversion.ConversionFactors.For(lot, YieldBench.Core.Conversion.SugarModel.Default);
        }).ToArray();

        // When the analysis runs with the stand-in offered
        var review = HouseFactorAnalysis.Run(lots, new HouseFactorSettings(), [new KnowsNitrogen()], 1);

        // Then the stand-in is chosen, the planner uses a strain-and-sugar candidate, and the explanation says why
        Assert.Equal("knows-nitrogen", review.Overall!.CandidateId);
        Assert.NotEqual("knows-nitrogen", review.Planning!.Pooled.CandidateId);
        Assert.Contains(review.Explanation, s => s.StartsWith("The chosen model needs more inputs than strain and sugar, so the planner uses ", StringComparison.Ordinal));
        Assert.Equal("Knows nitrogen: Starting sugar explains most; YAN second.", review.ImportanceSentence);
    }
}
