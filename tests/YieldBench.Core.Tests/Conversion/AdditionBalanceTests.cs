using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Conversion;

/// <summary>
/// Water and sugar additions by mass balance. Each test writes the balance out by hand with the published SG of
/// Zoecklein et al. Table I-1 (24 °Bx 1.10101, 22 °Bx 1.09193, 20 °Bx 1.08297), water 0.99820 kg/L at 20 °C and
/// density = SG × 0.99820; tolerances cover the 4e-5 gap between those SGs and the NBS cubic the code uses.
/// The printed hand results are also in tests/YieldBench.Core.Tests/Units/Oracles/units_oracle.py.
/// </summary>
public class AdditionBalanceTests
{
    private const double Water = 0.99820;

    private static double Density(double sg) => sg * Water;

    [Fact]
    public void Water_addition_lowers_the_effective_starting_sugar()
    {
        // Given 1000 L of must at 24.0 °Bx with 100 L of water added
        var additions = new Additions(MustVolumeL: 1000, WaterAddedL: 100, SugarAddedKg: null);

        // By hand: must mass 1000 × 1.10101 × 0.99820 = 1099.028 kg; solids 0.24 × that = 263.767 kg;
        // mass after 1099.028 + 100 × 0.99820 = 1198.848 kg; °Bx after 100 × 263.767 / 1198.848 = 22.0017
        double mass = 1000 * Density(1.10101);
        double solids = mass * 0.24;
        double massAfter = mass + (100 * Water);
        double handBrix = 100 * solids / massAfter;

        // When the balance is applied
        var result = AdditionBalance.Apply(SugarReading.FromBrix(24.0), additions);

        // Then the effective sugar is 22.0017 °Bx, and the correction is reported as made
        Assert.Equal(22.001681917719253, handBrix, 1e-9);
        Assert.Equal(handBrix, result.Effective.Brix, 1e-4);
        Assert.True(result.Corrected);
        Assert.Null(result.Note);
    }

    [Fact]
    public void Water_addition_dilutes_the_sugar_in_proportion_to_the_volume_after()
    {
        // Given the same 1000 L at 24.0 °Bx (237.8 g/L, OIV row) and 100 L of water
        // By hand: volume after = 1198.848 kg ÷ density of 22.0017 °Bx (1.091944 × 0.99820 = 1.089978 kg/L)
        //          = 1099.88 L; sugar = 237.8 g/L × 1000 L ÷ 1099.88 L = 216.20 g/L
        double volumeAfter = 1198.848182 / Density(1.091944);
        double handSugar = 237.8 * 1000 / volumeAfter;

        // When the balance is applied under the OIV model
        var result = AdditionBalance.Apply(SugarReading.FromBrix(24.0), new Additions(1000, 100, null), SugarModel.Default);

        // Then sugar and volume match the hand values — and the sugar is 1.5 g/L above the table's 214.7 g/L at 22 °Bx,
        // because dilution thins the non-sugar solids too
        Assert.Equal(1099.88, volumeAfter, 0.01);
        Assert.Equal(216.20, handSugar, 0.01);
        Assert.Equal(handSugar, result.EffectiveSugarGl, 0.01);
        Assert.Equal(volumeAfter, result.VolumeAfterL!.Value, 0.05);
    }

    [Fact]
    public void Sugar_addition_raises_the_effective_starting_sugar_counting_inversion()
    {
        // Given 1000 L at 20.0 °Bx (191.9 g/L, OIV row) with 20 kg of sucrose
        var additions = new Additions(1000, null, 20);

        // By hand: mass 1000 × 1.08297 × 0.99820 = 1081.021 kg; solids 216.204 kg; after: 1101.021 kg and
        // 236.204 kg, so 21.4532 °Bx; volume 1101.021 ÷ (1.089472 × 0.99820) = 1012.42 L;
        // sugar (191.9 kg + 20 kg × 1.052630 hexose per sucrose) ÷ 1012.42 L = 210.34 g/L
        double mass = 1000 * Density(1.08297);
        double handBrix = 100 * ((mass * 0.20) + 20) / (mass + 20);
        double handSugar = ((191.9 * 1000) + (20000 * 1.052630)) / ((mass + 20) / Density(1.089472));

        // When the balance is applied
        var result = AdditionBalance.Apply(SugarReading.FromBrix(20.0), additions);

        // Then the effective values match the hand balance
        Assert.Equal(21.453197080533606, handBrix, 1e-9);
        Assert.Equal(handBrix, result.Effective.Brix, 1e-5);
        Assert.Equal(210.34, handSugar, 0.005);
        Assert.Equal(handSugar, result.EffectiveSugarGl, 0.01);
        Assert.Equal(1012.42, result.VolumeAfterL!.Value, 0.01);
    }

    [Fact]
    public void Water_for_a_target_matches_the_hand_balance_and_reaches_the_target_when_applied()
    {
        // Given 1000 L at 24.0 °Bx to be brought to 22.0 °Bx
        var measured = SugarReading.FromBrix(24.0);

        // By hand: solids 263.767 kg must be 22 % of the mass after: 1198.941 kg; water (1198.941 − 1099.028) ÷ 0.99820
        // = 100.092 L; volume after, taken as additive, 1000 + 100.092 = 1100.092 L (by mass ÷ density it is 1099.98 L)
        double mass = 1000 * Density(1.10101);
        double massAfter = mass * 0.24 / 0.22;
        double handWater = (massAfter - mass) / Water;

        // When the water is planned and then fed back through Apply
        var (water, volumeAfter) = AdditionBalance.WaterForTarget(measured, 1000, 22.0);
        var applied = AdditionBalance.Apply(measured, new Additions(1000, water, null));

        // Then the plan matches the hand value, and applying it lands on 22.0 °Bx with the same volume
        Assert.Equal(100.0918, handWater, 1e-4);
        Assert.Equal(handWater, water, 0.005);
        Assert.Equal(1000 + water, volumeAfter, 1e-9);
        Assert.Equal(22.0, applied.Effective.Brix, 1e-9);
        Assert.Equal(1099.98, applied.VolumeAfterL!.Value, 0.03);
        Assert.InRange(volumeAfter / applied.VolumeAfterL!.Value, 1.0, 1.0002); // the two volume rules agree to 0.02 %
    }

    [Fact]
    public void Sugar_for_a_target_matches_the_hand_balance_and_reaches_the_target_when_applied()
    {
        // Given 1000 L at 20.0 °Bx to be brought to 22.0 °Bx
        var measured = SugarReading.FromBrix(20.0);

        // By hand: 100·(S + K) = 22·(M + K) ⇒ K = (22 × 1081.021 − 100 × 216.204) ÷ 78 = 27.718 kg
        double mass = 1000 * Density(1.08297);
        double handSugar = ((22 * mass) - (100 * mass * 0.20)) / 78;

        // When the sugar is planned and fed back through Apply
        var (sugar, _) = AdditionBalance.SugarForTarget(measured, 1000, 22.0);
        var applied = AdditionBalance.Apply(measured, new Additions(1000, null, sugar));

        // Then the plan matches the hand value and applying it reaches 22.0 °Bx
        Assert.Equal(27.718478, handSugar, 1e-6);
        Assert.Equal(handSugar, sugar, 1e-4);
        Assert.Equal(22.0, applied.Effective.Brix, 1e-9);
    }

    [Fact]
    public void A_must_already_at_the_target_needs_nothing()
    {
        var measured = SugarReading.FromBrix(21.0);
        Assert.Equal((0.0, 500.0), AdditionBalance.WaterForTarget(measured, 500, 23.0));
        Assert.Equal((0.0, 500.0), AdditionBalance.SugarForTarget(measured, 500, 20.0));
    }

    [Fact]
    public void Additions_without_a_must_volume_are_reported_and_not_guessed()
    {
        // Given water recorded but no must volume
        var result = AdditionBalance.Apply(SugarReading.FromBrix(25.0), new Additions(null, 80, null));

        // Then the measured sugar is kept and the note says what to record
        Assert.False(result.Corrected);
        Assert.Equal(25.0, result.Effective.Brix);
        Assert.Equal(249.5, result.EffectiveSugarGl, 1e-9);
        Assert.Equal(
            "water or sugar additions are recorded but the must volume is not, so the starting sugar could not be corrected; record must_volume_l",
            result.Note);
    }

    [Fact]
    public void A_negative_addition_is_reported_and_not_applied()
    {
        // Given a water addition typed as −40 L
        var result = AdditionBalance.Apply(SugarReading.FromBrix(25.0), new Additions(1000, -40, null));

        // Then it is refused with a note naming column and value
        Assert.False(result.Corrected);
        Assert.Equal(
            "water_added_l -40 is negative, so the starting sugar was not corrected; record the amount added as a positive number",
            result.Note);
    }

    [Fact]
    public void Additions_that_would_leave_the_plausible_range_are_reported()
    {
        // Given 10 L of must with 900 kg of sugar recorded (a units mix-up);
        // by hand 100 × (10 × 1.09193 × 0.99820 × 0.22 + 900) ÷ (10.8996 + 900) = 99.07 °Bx
        var result = AdditionBalance.Apply(SugarReading.FromBrix(22.0), new Additions(10, null, 900));

        // Then the correction is refused with the reason
        Assert.False(result.Corrected);
        Assert.Equal(
            "the recorded additions would give 99.1 °Brix, outside -6 to 50 °Brix, so the starting sugar was not corrected; check must_volume_l, water_added_l and sugar_added_kg",
            result.Note);
    }

    [Fact]
    public void No_additions_leave_the_reading_and_the_model_sugar_unchanged()
    {
        var result = AdditionBalance.Apply(SugarReading.FromBrix(26.0), Additions.None);
        Assert.False(result.Corrected);
        Assert.Null(result.Note);
        Assert.Equal(261.2, result.EffectiveSugarGl, 1e-9);
    }
}
