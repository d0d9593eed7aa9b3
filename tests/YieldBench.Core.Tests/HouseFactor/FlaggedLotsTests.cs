using YieldBench.Core.Conversion;
using YieldBench.Core.HouseFactor;
using YieldBench.Core.Lots;
using YieldBench.Core.Review.Strains;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.HouseFactor;

public class FlaggedLotsTests
{
    private static readonly Dictionary<string, double> Strains = new() { ["SX-01"] = 0.570, ["SX-02"] = 0.600 };

    /// <summary>Three seeded seasons of two strains, plus a lot recorded with a sugar far too high (factor 0.45) and a lot that stopped at 30 g/L.</summary>
    private static IReadOnlyList<LotConversion> LotsWithTwoBadOnes()
    {
        var lots = SyntheticLots.Seasons(5, Strains, seasons: 3, lotsPerStrainPerSeason: 20, noiseSd: 0.12).ToList();
        lots.Add(SyntheticLots.Lot("BAD-1", 2022, "SX-02", 30.0, 13.5));
        lots.Add(ConversionFactors.For(
            new Lot
            {
                LotId = "SWEET-1",
                Season = 2023,
                Strain = "SX-01",
                StartingSugar = SugarReading.FromBrix(25.0),
                FinalAlcohol = AlcoholContent.FromPercentVolume(12.6),
                ResidualSugarGl = 30.0,
            },
            SugarModel.Default));
        return lots;
    }

    [Fact]
    public void The_version_not_in_use_skips_the_by_lot_backtests_and_changes_nothing_it_reports()
    {
        // Given three seasons with two flagged lots
        var lots = LotsWithTwoBadOnes();
        var flags = StrainReviewer.Run(lots, new StrainReviewSettings(), 3).Flags;

        // When the house factor runs (flagged lots left out; the version with them beside it), and the version with
        // them also runs alone, where its candidates are reported
        var review = HouseFactorAnalysis.Run(lots, flags, new HouseFactorSettings(), [], 7);
        var other = review.OtherVersion!;
        var alone = HouseFactorAnalysis.Run(lots, new HouseFactorSettings(), [], 7);

        // Then the version in use ran its by-lot backtests, the other did not and says so (its by-lot metrics repeat
        // the season backtest) ...
        Assert.All(review.Candidates, c => Assert.NotEqual(BacktestScheme.LeaveOneSeasonOut, c.ByLotScheme));
        Assert.All(other.Candidates, c => Assert.Equal(BacktestScheme.LeaveOneSeasonOut, c.ByLotScheme));
        Assert.All(other.Candidates, c => Assert.Equal(c.BySeason, c.ByLot));
        Assert.Contains(alone.Candidates, c => c.BySeason != c.ByLot);

        // ... and what the other version reports (its recommendations, intervals and planner) is what it gives alone
        Assert.Equal(lots.Count, other.LotsUsed);
        Assert.Equal(alone.Overall, other.Overall);
        Assert.Equal(alone.ByStrain, other.ByStrain);
        Assert.Equal(alone.Planning!.Pooled.SlopePerBrix, other.Planning!.Pooled.SlopePerBrix);
        Assert.Equal(alone.Planning.Pooled.Errors.Select(e => e.Error), other.Planning.Pooled.Errors.Select(e => e.Error));
        Assert.Equal(alone.Candidates.Select(c => c.BySeason), other.Candidates.Select(c => c.BySeason));
    }

    [Fact]
    public void Lots_flagged_as_likely_errors_or_not_dry_are_left_out_by_default_and_named()
    {
        // Given three seasons with a lot whose factor (0.45) is outside the plausible band and a lot left at 30 g/L sugar
        var lots = LotsWithTwoBadOnes();
        var flags = StrainReviewer.Run(lots, new StrainReviewSettings(), 3).Flags;

        // When the house factor runs with the strain review's flags and the default settings
        var review = HouseFactorAnalysis.Run(lots, flags, new HouseFactorSettings(), [], 7);

        // Then both lots are named with their reason, left out of every held-out prediction and of the lots used,
        // and the other version has them
        Assert.Equal(["2022/BAD-1", "2023/SWEET-1"], review.FlaggedLots.Select(f => f.LotKey.ToString()));
        Assert.Equal([FlagCodes.ImplausibleFactor], review.FlaggedLots[0].Codes);
        Assert.Equal([FlagCodes.NotDry], review.FlaggedLots[1].Codes);
        Assert.Contains("30.0 g/L residual sugar", review.FlaggedLots[1].Reason, StringComparison.Ordinal);
        Assert.False(review.FlaggedLotsIncluded);
        Assert.Equal(lots.Count - 2, review.LotsUsed);
        Assert.All(review.Candidates, c => Assert.Equal(lots.Count - 2, c.Primary.Lots));
        var chosen = review.Candidates.Single(c => c.Id == review.Overall!.CandidateId);
        Assert.Equal(lots.Count - 2, chosen.HeldOut.Count);
        Assert.DoesNotContain(chosen.HeldOut, p => p.LotKey.ToString() is "2022/BAD-1" or "2023/SWEET-1");
        Assert.Contains(review.Explanation, s => s.Contains("left out of training, selection and intervals", StringComparison.Ordinal) && s.Contains("2022/BAD-1", StringComparison.Ordinal));
        var other = review.OtherVersion!;
        Assert.True(other.FlaggedLotsIncluded);
        Assert.Equal(lots.Count, other.LotsUsed);
        Assert.Null(other.OtherVersion);
    }

    [Fact]
    public void A_flagged_lot_widens_the_95_percent_band_only_in_the_version_that_includes_it()
    {
        // Given the same lots and flags
        var lots = LotsWithTwoBadOnes();
        var flags = StrainReviewer.Run(lots, new StrainReviewSettings(), 3).Flags;

        // When the setting includes the flagged lots
        var included = HouseFactorAnalysis.Run(lots, flags, new HouseFactorSettings { IncludeFlaggedLots = true }, [], 7);
        var left = included.OtherVersion!;

        // Then the version in use is the one with them, the other leaves them out, and the lot 3 % v/v short of its
        // strain (BAD-1: 13.5 % v/v where 0.60 × 30 °Brix = 18.0 is expected) stretches its strain's 95 % band only where
        // it is included: one error near −4.5 among 61 of SD about 0.12 raises their SD to about 0.6
        Assert.True(included.FlaggedLotsIncluded);
        Assert.False(left.FlaggedLotsIncluded);
        Assert.Equal(lots.Count, included.LotsUsed);
        Assert.Equal(lots.Count - 2, left.LotsUsed);
        var withBad = included.ByStrain.Single(r => r.Strain == "SX-02");
        var withoutBad = left.ByStrain.Single(r => r.Strain == "SX-02");
        Assert.Equal(61, withBad.Lots);
        Assert.Equal(60, withoutBad.Lots);
        Assert.True(withBad.ErrorBand95.Low < -1.0, $"included: {withBad.ErrorBand95.Low}");
        Assert.True(withoutBad.ErrorBand95.Low > -0.5, $"left out: {withoutBad.ErrorBand95.Low}");
    }

    [Fact]
    public void With_no_flagged_lot_the_analysis_runs_once()
    {
        // Given clean lots
        var lots = SyntheticLots.Seasons(9, Strains, seasons: 2, lotsPerStrainPerSeason: 10, noiseSd: 0.1);

        // When the house factor runs with no flags
        var review = HouseFactorAnalysis.Run(lots, [], new HouseFactorSettings(), [], 7);

        // Then nothing is named and there is no other version
        Assert.Empty(review.FlaggedLots);
        Assert.Null(review.OtherVersion);
        Assert.Equal(lots.Count, review.LotsUsed);
    }

    [Fact]
    public void The_sentence_names_the_first_flagged_lots_and_counts_the_rest()
    {
        // Given 1,342 flagged lots, as the benchmark's 100,000 lots gave
        var flagged = Enumerable.Range(0, 1342)
            .Select(i => new FlaggedLot(new LotKey(2020, $"L{i:000000}"), 2020, $"L{i:000000}", "SX-01", [FlagCodes.AboveTheoreticalYield], "flagged as a likely error (above-theoretical-yield)"))
            .ToArray();

        // When the house factor's sentence about them is written
        string sentence = FlaggedLots.Sentence(flagged, included: false);

        // Then it names the first ones, counts the others, and stays short enough for a workbook cell
        Assert.Contains("1342 lot(s) — 1342 flagged as likely errors", sentence, StringComparison.Ordinal);
        Assert.Contains($"2020/L{FlaggedLots.SentenceLots - 1:000000} (SX-01)", sentence, StringComparison.Ordinal);
        Assert.DoesNotContain($"2020/L{FlaggedLots.SentenceLots:000000} (SX-01)", sentence, StringComparison.Ordinal);
        Assert.EndsWith($"; and {1342 - FlaggedLots.SentenceLots} more, each among the review's flags.", sentence, StringComparison.Ordinal);
        Assert.True(sentence.Length < 32_767);
    }
}
