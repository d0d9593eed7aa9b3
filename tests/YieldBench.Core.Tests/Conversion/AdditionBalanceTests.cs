using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Conversion;

/// <summary>
/// Water and sugar additions by mass balance. Each test writes the balance out by hand with the published SG of
/// Zoecklein et al. Table I-1 (24 °Bx 1.10101, 22 °Bx 1.09193, 20 °Bx 1.08297), water 0.99820 kg/L at 20 °C,
/// density = SG × 0.99820 and the OIV must table (the effective °Brix is the table's °Brix of the sugar after the
/// additions); tolerances cover the 4e-5 gap between those SGs and the NBS cubic the code uses.
/// The printed hand results are also in tests/YieldBench.Core.Tests/Units/Oracles/units_oracle.py.
/// </summary>
public class AdditionBalanceTests
{
    private const double Water = 0.99820;

    private static double Density(double sg) => sg * Water;

    [Fact]
    public void Water_addition_lowers_the_effective_starting_sugar_to_the_table_Brix_of_its_diluted_sugar()
    {
        // Given 1000 L of must at 24.0 °Bx (237.8 g/L, OIV row) with 100 L of water added
        var additions = new Additions(MustVolumeL: 1000, WaterAddedL: 100, SugarAddedKg: null);

        // By hand: must mass 1000 × 1.10101 × 0.99820 = 1099.028 kg; solids 0.24 × that = 263.767 kg;
        // mass after 1099.028 + 100 × 0.99820 = 1198.848 kg; solids °Bx after 100 × 263.767 / 1198.848 = 22.0017;
        // volume after 1198.848 ÷ (1.091944 × 0.99820) = 1099.88 L; sugar 237.8 × 1000 ÷ 1099.88 = 216.20 g/L —
        // 1.5 g/L above the table's 214.7 at 22.0 °Bx, because water thins the non-sugar solids too — so the effective
        // °Brix, the table's °Brix of 216.20 g/L, is 22.128 (units_oracle.py: 22.0017, 1099.883, 216.2049, 22.12772)
        double mass = 1000 * Density(1.10101);
        double massAfter = mass + (100 * Water);
        double solidsBrix = 100 * mass * 0.24 / massAfter;
        double volumeAfter = massAfter / Density(1.091944);
        double sugar = 237.8 * 1000 / volumeAfter;

        // When the balance is applied
        var result = AdditionBalance.Apply(SugarReading.FromBrix(24.0), additions);

        // Then the solids, volume, sugar and effective °Brix are the hand values, and the correction is reported as made
        Assert.Equal(22.001681917719253, solidsBrix, 1e-9);
        Assert.Equal(solidsBrix, result.SolidsBrix, 1e-4);
        Assert.Equal(1099.88, volumeAfter, 0.01);
        Assert.Equal(volumeAfter, result.VolumeAfterL!.Value, 0.05);
        Assert.Equal(216.20, sugar, 0.01);
        Assert.Equal(sugar, result.EffectiveSugarGl, 0.01);
        Assert.Equal(22.12771791792899, result.Effective.Brix, 1e-3);
        Assert.Equal(result.EffectiveSugarGl, OivMustTable.SugarGramsPerLitre(result.Effective.Brix), 1e-8);
        Assert.True(result.Corrected);
        Assert.Null(result.Note);
    }

    [Fact]
    public void Sugar_addition_counts_the_mass_gained_on_inversion_and_the_musts_own_non_sugar_solids()
    {
        // Given 1000 L at 20.0 °Bx (191.9 g/L, OIV row) with 20 kg of sucrose
        var additions = new Additions(1000, null, 20);

        // By hand: mass 1000 × 1.08297 × 0.99820 = 1081.021 kg; solids 216.204 kg; the sucrose inverts to
        // 20 × 1.052630 = 21.053 kg of glucose + fructose (2 × 180.156 / 342.297), the water taken from the must, so
        // after: 1101.021 kg holding 237.257 kg of solids, 21.5488 °Bx; volume 1101.021 ÷ density at 21.5488 °Bx =
        // 1012.02 L; sugar (191.9 kg + 21.053 kg) ÷ 1012.02 L = 210.42 g/L, whose table °Brix is 21.627
        // (units_oracle.py: 21.54880, 1012.023, 210.4227, 21.62689)
        double mass = 1000 * Density(1.08297);
        double solidsBrix = 100 * ((mass * 0.20) + (20 * 1.052630)) / (mass + 20);

        // When the balance is applied
        var result = AdditionBalance.Apply(SugarReading.FromBrix(20.0), additions);

        // Then the values are the hand balance's: the inversion adds 1.05 kg of solids (+0.10 °Bx of solids), and the
        // added sucrose brings no non-sugar solids, so the must holds more sugar than a natural must of its solids °Brix
        Assert.Equal(21.54879879996809, solidsBrix, 1e-6);
        Assert.Equal(solidsBrix, result.SolidsBrix, 1e-4);
        Assert.Equal(1012.023134175943, result.VolumeAfterL!.Value, 0.02);
        Assert.Equal(210.42265486347114, result.EffectiveSugarGl, 0.01);
        Assert.Equal(21.626887905289262, result.Effective.Brix, 1e-3);
        Assert.True(OivMustTable.SugarGramsPerLitre(result.SolidsBrix) < result.EffectiveSugarGl - 0.8);
    }

    [Fact]
    public void Water_for_a_target_reaches_the_target_when_applied()
    {
        // Given 1000 L at 24.0 °Bx to be brought to an effective 22.0 °Bx (214.7 g/L, the table's sugar there)
        var measured = SugarReading.FromBrix(24.0);

        // When the water is planned and then fed back through Apply
        var (water, volumeAfter) = AdditionBalance.WaterForTarget(measured, 1000, 22.0);
        var applied = AdditionBalance.Apply(measured, new Additions(1000, water, null));

        // Then it is the hand balance solved for the water (units_oracle.py, brentq: 107.716 L, 1107.59 L after — more
        // than the 100.09 L a balance on solids alone gives, since the diluted must holds less non-sugar solids), and
        // applying it lands on 22.0 °Bx and 214.7 g/L with the same volume
        Assert.Equal(107.71609764526542, water, 0.05);
        Assert.Equal(1107.591988821612, volumeAfter, 0.05);
        Assert.Equal(22.0, applied.Effective.Brix, 1e-6);
        Assert.Equal(214.7, applied.EffectiveSugarGl, 1e-5);
        Assert.Equal(volumeAfter, applied.VolumeAfterL!.Value, 1e-9);
    }

    [Fact]
    public void Sugar_for_a_target_reaches_the_target_when_applied()
    {
        // Given 1000 L at 20.0 °Bx to be brought to an effective 22.0 °Bx
        var measured = SugarReading.FromBrix(20.0);

        // When the sugar is planned and fed back through Apply
        var (sugar, _) = AdditionBalance.SugarForTarget(measured, 1000, 22.0);
        var applied = AdditionBalance.Apply(measured, new Additions(1000, null, sugar));

        // Then it is the hand balance solved for the sucrose (units_oracle.py, brentq: 24.687 kg — less than the
        // 27.72 kg a balance on solids alone gives, since sucrose is all sugar and gains 5 % on inversion), and
        // applying it reaches 22.0 °Bx
        Assert.Equal(24.6873617146406, sugar, 0.01);
        Assert.Equal(22.0, applied.Effective.Brix, 1e-6);
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
        // by hand 100 × (10 × 1.09193 × 0.99820 × 0.22 + 900 × 1.05263) ÷ (10.8996 + 900) = 104.27 °Bx (units_oracle.py)
        var result = AdditionBalance.Apply(SugarReading.FromBrix(22.0), new Additions(10, null, 900));

        // Then the correction is refused with the reason
        Assert.False(result.Corrected);
        Assert.Equal(
            "the recorded additions would give 104.3 °Brix, outside -6 to 50 °Brix, so the starting sugar was not corrected; check must_volume_l, water_added_l and sugar_added_kg",
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
