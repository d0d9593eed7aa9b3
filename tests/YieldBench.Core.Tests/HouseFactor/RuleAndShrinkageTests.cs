using YieldBench.Core.HouseFactor;

namespace YieldBench.Core.Tests.HouseFactor;

public class RuleAndShrinkageTests
{
    [Fact]
    public void The_one_standard_error_rule_takes_the_simplest_candidate_within_one_standard_error_of_the_best()
    {
        // Given a best MAE of 0.20 ± 0.03 at complexity 4, one at 0.22 (complexity 1) and one at 0.24 (complexity 0)
        OneStandardErrorRule.Entry[] entries = [new(0, 0.24, 0.03), new(1, 0.22, 0.03), new(4, 0.20, 0.03)];

        // When the rule chooses
        var c = OneStandardErrorRule.Choose(entries)!.Value;

        // Then the limit is 0.23, so the complexity-1 candidate is chosen (0.24 is outside) and the best is noted
        Assert.Equal(1, c.Chosen);
        Assert.Equal(2, c.Best);
        Assert.Equal(0.23, c.Limit, 1e-12);
    }

    [Fact]
    public void The_one_standard_error_rule_keeps_the_best_when_simpler_candidates_are_clearly_worse()
    {
        // Given simpler candidates more than one standard error behind
        OneStandardErrorRule.Entry[] entries = [new(0, 0.40, 0.02), new(1, 0.31, 0.02), new(4, 0.25, 0.02), new(9, double.NaN, double.NaN)];

        // When the rule chooses
        var c = OneStandardErrorRule.Choose(entries)!.Value;

        // Then the best is chosen, and the unscored entry is ignored
        Assert.Equal(2, c.Chosen);
        Assert.Equal(2, c.Best);
    }

    [Fact]
    public void Shrinkage_matches_DerSimonian_Laird_in_metafor()
    {
        // Given four strains' abv_per_brix values (oracle: R 4.2.2, metafor 3.8.1:
        // rma(yi = group means, vi = pooled within variance / n, method = "DL"); blup(); script in the test's comment below)
        //   A <- c(0.640,0.600,0.615); B <- 0.570 + 0.01*((1:40) %% 9 - 4)
        //   C <- c(0.575,0.600,0.550,0.585,0.590,0.560,0.581,0.569,0.603,0.557)
        //   D <- c(0.590,0.568,0.612,0.595,0.575,0.601,0.589,0.563,0.587,0.614,0.580,0.576)
        double[] a = [0.640, 0.600, 0.615];
        double[] b = Enumerable.Range(1, 40).Select(i => 0.570 + (0.01 * ((i % 9) - 4))).ToArray();
        double[] c = [0.575, 0.600, 0.550, 0.585, 0.590, 0.560, 0.581, 0.569, 0.603, 0.557];
        double[] d = [0.590, 0.568, 0.612, 0.595, 0.575, 0.601, 0.589, 0.563, 0.587, 0.614, 0.580, 0.576];

        // When the means are shrunk
        var r = EmpiricalBayesShrinkage.Shrink([("A", a), ("B", b), ("C", c), ("D", d)]);

        // Then s²_w, τ², μ and every BLUP agree with metafor
        Assert.Equal(0.000523633879781, r.WithinVariance, 1e-13);
        Assert.Equal(0.000209436365982, r.BetweenVariance, 1e-13);
        Assert.Equal(0.584460801166, r.OverallMean, 1e-11);
        Assert.Equal([0.602936038693, 0.569438943166, 0.578492258186, 0.586975964617], r.Groups.Select(g => Math.Round(g.Shrunk, 12)).ToArray());
    }

    [Fact]
    public void Shrinkage_moves_a_3_lot_strain_more_than_a_40_lot_strain()
    {
        // Given a 3-lot strain and a 40-lot strain whose raw means sit equally far (0.02) on either side of the others
        var lots = SyntheticLots.Counts(
            5,
            [("SX-SMALL", 0.600, 3), ("SX-LARGE", 0.560, 40), ("SX-MID1", 0.580, 20), ("SX-MID2", 0.580, 20)],
            noiseSd: 0.4);

        // When the shrunk-strain candidate trains
        var fit = new ShrunkStrainCandidate().Train(lots, 1).AsSugarLines()!;
        var raw = new PerStrainMedianCandidate().Train(lots, 1).AsSugarLines()!;
        double Mean(string s) => lots.Where(l => l.Lot.Strain == s).Average(l => l.AbvPerBrix);

        // Then the small strain moves further toward the pooled value than the large one
        double moveSmall = Math.Abs(fit.LineFor("SX-SMALL").SlopePerBrix - Mean("SX-SMALL"));
        double moveLarge = Math.Abs(fit.LineFor("SX-LARGE").SlopePerBrix - Mean("SX-LARGE"));
        Assert.True(moveSmall > 3 * moveLarge, $"small moved {moveSmall}, large moved {moveLarge}");
        Assert.NotEqual(raw.LineFor("SX-SMALL").SlopePerBrix, fit.LineFor("SX-SMALL").SlopePerBrix);
    }

    [Fact]
    public void A_single_strain_shrinks_to_its_own_mean()
    {
        // Given one group
        var r = EmpiricalBayesShrinkage.Shrink([("A", [0.58, 0.60])]);

        // Then nothing is estimated between groups and the group keeps its mean
        Assert.Equal(0, r.BetweenVariance);
        Assert.Equal(0.59, r.Groups[0].Shrunk, 1e-12);
    }
}
