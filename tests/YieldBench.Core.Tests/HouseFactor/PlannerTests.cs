using YieldBench.Core.Conversion;
using YieldBench.Core.HouseFactor;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.HouseFactor;

public class PlannerTests
{
    private static PlanningLine LineWithErrors(double slope, double[] errors) =>
        new("SX-01", "test", SugarCurve.Line, 0, slope, 100, errors.Select(e => new SeasonError(e, 2024, "SX-01")).ToArray(), "test errors");

    private static double[] SpreadErrors(int n, int seed)
    {
        var rng = new Random(seed);
        return Enumerable.Range(0, n).Select(_ => 0.2 * SyntheticLots.Gaussian(rng)).ToArray();
    }

    [Fact]
    public void Water_add_back_equals_a_hand_mass_balance()
    {
        // Given 5000 L of must at 26.0 °Brix, a factor of 0.6 % v/v per °Brix and a target of 14.5 % v/v
        var line = LineWithErrors(0.6, SpreadErrors(100, 3));
        var must = SugarReading.FromBrix(26.0);

        // When the planner works out the add-back
        var answer = Planner.WaterAddBack(line, must, 5000, 14.5, null);

        // Then the water passes the hand balance: target °Bx = 14.5 / 0.6 = 24.1667, whose table sugar is
        // 239.0 + (2/3) × (240.1 − 239.0) = 239.733 g/L (OIV rows 24.1 and 24.2); must mass = 5000 L × SG(26 °Bx) ×
        // 0.99820 kg/L; solids = 26 % of it; with W litres of water the mass is mass + 0.99820·W, the solids °Brix
        // 100·solids ÷ that, the volume mass ÷ the density of that °Brix, and the sugar 261.2 g/L × 5000 L ÷ volume
        double targetBrix = 14.5 / 0.6;
        double mass = 5000 * must.SpecificGravity * 0.99820;
        double massAfter = mass + (0.99820 * answer.WaterL);
        double solidsBrix = 100 * mass * 0.26 / massAfter;
        double volumeAfter = massAfter / (SugarReading.FromBrix(solidsBrix).SpecificGravity * 0.99820);
        Assert.Equal(239.0 + (2.0 / 3 * 1.1), 261.2 * 5000 / volumeAfter, 1e-4);
        Assert.Equal(targetBrix, answer.TargetBrix, 1e-6);
        Assert.Equal(volumeAfter, answer.VolumeAfterL, 1e-6);
        Assert.InRange(answer.WaterL, 440, 460); // order of magnitude: 26 → 24.17 °Bx dilutes ~8 % of ~5550 kg
        Assert.Equal(14.5, answer.After!.Predicted, 1e-9);
    }

    [Fact]
    public void The_threshold_answer_fed_back_into_the_predictor_gives_the_target_at_the_stated_confidence()
    {
        // Given a line with 200 held-out errors
        var errors = SpreadErrors(200, 4);
        var line = LineWithErrors(0.59, errors);

        // When the highest sugar for 14.0 % at 95 % confidence is asked
        var t = Planner.HighestSugar(line, 14.0, 0.95);

        // Then the prediction at that sugar plus the 95 % upper error bound is exactly the target,
        // and about 95 % of the held-out errors (drawn from N(0, 0.2²)) keep the wine at or under 14.0 there
        double predicted = line.Predict(t.HighestBrix);
        Assert.Equal(14.0, predicted + line.ErrorModel.Quantile(0.95), 1e-9);
        Assert.InRange(errors.Count(e => predicted + e <= 14.0 + 1e-12) / (double)errors.Length, 0.93, 0.98);
        Assert.True(t.HighestBrix < 14.0 / 0.59);
    }

    [Theory]
    [InlineData(13.84, 23.0)] // 23.0667 °Brix: to the nearest tenth 23.1, whose prediction (13.86 %) is over the target
    [InlineData(13.86, 23.1)] // 23.1 exactly (23.099999… in binary) stays 23.1
    [InlineData(14.5, 24.1)] // 24.1667
    public void The_answer_is_shown_rounded_down_to_a_tenth_so_the_sugar_shown_keeps_the_promise(double target, double shown)
    {
        // Given a line of 0.6 % v/v per °Brix with no held-out errors (a central answer)
        var line = LineWithErrors(0.6, []);

        // When the highest sugar for the target is asked
        var t = Planner.HighestSugar(line, target, 0.5);

        // Then the value shown is the answer rounded down, and its prediction is at or under the target
        Assert.Equal(target / 0.6, t.HighestBrix, 1e-9);
        Assert.Equal(shown, t.PickAtOrBelowBrix);
        Assert.True(line.Predict(t.PickAtOrBelowBrix) <= target + 1e-12);
        Assert.True(double.IsNaN(ThresholdAnswer.RoundDownToTenth(double.NaN)));
    }

    [Fact]
    public void The_EU_convention_threshold_inverts_the_OIV_table()
    {
        // Given the EU convention with no errors (central estimate, 50 %)
        var line = new PlanningLine("*", "eu-convention", SugarCurve.EuConvention, double.NaN, double.NaN, 0, [], "none");

        // When the sugar for 14.13 % is asked at 50 %
        var t = Planner.HighestSugar(line, 14.13, 0.5);

        // Then it is about 24.0 °Brix (OIV table row: 24.0 °Brix → 237.8 g/L → 14.13 % vol at 16.83 g/L)
        Assert.Equal(24.0, t.HighestBrix, 0.01);
        Assert.Equal("central estimate only: no held-out errors are known", t.Note);
    }

    [Fact]
    public void A_given_factor_has_no_intervals_and_the_planner_says_why()
    {
        // Given a factor typed by the user
        var model = PlanningModel.FromFactor(0.6);

        // When a 95 % threshold and an estimate are asked
        var t = Planner.HighestSugar(model.Pooled, 14.0, 0.95);
        var e = Planner.Estimate(model.Pooled, SugarReading.FromBrix(24));

        // Then the estimate is 14.4 with no interval, and the threshold explains what is missing
        Assert.Equal(14.4, e.Predicted, 1e-12);
        Assert.True(double.IsNaN(e.Low80));
        Assert.True(double.IsNaN(t.HighestBrix));
        Assert.Equal("no held-out errors are known for this predictor, so no answer at 95 % confidence can be given; use a house-factor file from a review, or ask at 50 % for the central estimate", t.Note);
    }

    [Fact]
    public void A_must_already_under_the_target_needs_no_water()
    {
        var answer = Planner.WaterAddBack(LineWithErrors(0.6, SpreadErrors(50, 5)), SugarReading.FromBrix(22), 1000, 14.5, null);
        Assert.Equal(0, answer.WaterL);
        Assert.Equal(1000, answer.VolumeAfterL);
        Assert.Equal("the juice's predicted alcohol, 13.2 % v/v, is already at or below the aim of 14.5 % v/v", answer.Note);
    }

    [Fact]
    public void The_EU_convention_add_back_uses_the_reviews_mass_balance()
    {
        // Given the EU convention and 2000 L of juice at 120 °Oechsle (28.08 °Brix), to come to 14.0 % v/v
        var line = new PlanningLine("*", "eu-convention", SugarCurve.EuConvention, double.NaN, double.NaN, 0, [], "none");
        var must = SugarReading.FromOechsle(120);

        // When the planner works out the add-back
        var answer = Planner.WaterAddBack(line, must, 2000, 14.0, null);

        // Then the review's balance of that addition (the juice's OIV sugar diluted into the new volume) gives exactly
        // 14.0 % v/v: 14.0 × 16.83 = 235.62 g/L, and the planner says so
        var balance = AdditionBalance.Apply(must, new Additions(2000, answer.WaterL, null), SugarModel.Default);
        Assert.Equal(14.0 * 16.83, balance.EffectiveSugarGl, 1e-4);
        Assert.Equal(14.0, answer.After!.Predicted, 1e-6);
        Assert.Equal(balance.Effective.Brix, answer.TargetBrix, 1e-9);

        // A balance on solids alone (water to the solids °Brix whose table sugar ÷ 16.83 is 14.0, 23.813 °Bx) assumes the
        // non-sugar solids of a riper must and stops short: by hand its water is (100·S/23.813 − M)/0.99820 L, about
        // 401 L, which gives 14.15 % v/v by the balance
        double mass = 2000 * must.SpecificGravity * 0.99820;
        double solidsWater = ((100 * mass * must.Brix / 100 / line.BrixFor(14.0)) - mass) / 0.99820;
        double bySolids = AdditionBalance.Apply(must, new Additions(2000, solidsWater, null), SugarModel.Default).EffectiveSugarGl / 16.83;
        Assert.Equal(401.46, solidsWater, 0.05);
        Assert.InRange(answer.WaterL, 426.5, 427.0);
        Assert.Equal(14.148, bySolids, 1e-3);
    }

    [Fact]
    public void Too_few_errors_for_the_confidence_asked_give_no_answer_and_the_count_needed()
    {
        // Given nine held-out errors (SeasonErrorModel.MinimumErrors is 10)
        var t = Planner.HighestSugar(LineWithErrors(0.6, SpreadErrors(9, 6)), 14.0, 0.95);
        Assert.True(double.IsNaN(t.HighestBrix));
        Assert.Equal("too few held-out lots (9) for 95 % confidence; at least 10 are needed", t.Note);
    }
}
