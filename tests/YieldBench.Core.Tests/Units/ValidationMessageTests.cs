using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Units;

/// <summary>Values outside their plausible range are refused with a message naming the value, unit and range.</summary>
public class ValidationMessageTests
{
    [Theory]
    [InlineData(SugarScale.Brix, 60.0, "Sugar 60 °Brix is outside the plausible range -6 to 50 °Brix.")]
    [InlineData(SugarScale.Brix, -7.5, "Sugar -7.5 °Brix is outside the plausible range -6 to 50 °Brix.")]
    [InlineData(SugarScale.SpecificGravity, 1.3, "Specific gravity (20/20 °C) 1.3 is outside the plausible range 0.9773 to 1.2318.")]
    [InlineData(SugarScale.SpecificGravity, 0.95, "Specific gravity (20/20 °C) 0.95 is outside the plausible range 0.9773 to 1.2318.")]
    [InlineData(SugarScale.Baume, 30.0, "Sugar 30 °Baumé is outside the plausible range -3.36 to 27.28 °Baumé.")]
    [InlineData(SugarScale.Oechsle, 240.0, "Sugar 240 °Oechsle is outside the plausible range -22.7 to 231.8 °Oechsle.")]
    [InlineData(SugarScale.GramsPerLitre, -1.0, "Sugar -1 g/L is outside the plausible range 0 to 585.5 g/L.")]
    [InlineData(SugarScale.Brix, double.NaN, "Sugar is not a number; expected -6 to 50 °Brix.")]
    public void A_sugar_reading_outside_its_scale_is_refused_with_a_message_naming_value_and_range(SugarScale scale, double value, string expected)
    {
        // Given a value outside the scale's accepted range
        // When it is read without throwing, and with the throwing factory
        bool ok = SugarReading.TryFrom(value, scale, out _, out string? problem);
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => SugarReading.From(value, scale));

        // Then both carry the same exact message
        Assert.False(ok);
        Assert.Equal(expected, problem);
        Assert.StartsWith(expected, ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_sugar_reading_inside_its_scale_is_accepted_without_a_problem()
    {
        // Given 1.095 SG, a ripe must
        // When read without throwing
        bool ok = SugarReading.TryFrom(1.095, SugarScale.SpecificGravity, out var reading, out string? problem);

        // Then it is accepted, about 22.7 °Bx (Margalit's example pairs 22.7 °Bx with density 1.095)
        Assert.True(ok);
        Assert.Null(problem);
        Assert.Equal(22.7, reading.Brix, 0.1);
    }

    [Fact]
    public void A_density_outside_the_range_is_refused_in_grams_per_millilitre()
    {
        // Given 1.3 g/mL, beyond the densest accepted must (50 °Bx: SG 1.2318 × 0.99820 = 1.2296, rounded inward)
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => SugarReading.FromDensity(1.3));

        // Then the message names value and range in g/mL
        Assert.StartsWith("Density at 20 °C 1.3 g/mL is outside the plausible range 0.9756 to 1.2295 g/mL.", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Alcohol_above_twenty_five_percent_is_refused_naming_the_range()
    {
        // Given 31 % v/v, beyond fermentation (fortified wines are out of scope)
        bool ok = AlcoholContent.TryFromPercentVolume(31, out _, out string? problem);
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => AlcoholContent.FromPercentVolume(31));

        // Then the message names it
        Assert.False(ok);
        Assert.Equal("Alcohol 31 % v/v is outside the plausible range 0 to 25 % v/v.", problem);
        Assert.StartsWith(problem!, ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Ethanol_in_grams_per_litre_is_checked_in_grams_per_litre()
    {
        // Given 250 g/L of ethanol
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => AlcoholContent.FromGramsPerLitre(250));

        // Then the message repeats the value in the unit it was given
        Assert.StartsWith("Ethanol 250 g/L is outside the plausible range 0 to 197.31 g/L.", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Temperatures_outside_the_must_range_are_refused_in_their_own_scale()
    {
        // Given 70 °C and 150 °F
        bool ok = Temperature.TryFromCelsius(70, out _, out string? problem);
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => Temperature.FromFahrenheit(150));

        // Then each message names the value in its own unit and the range
        Assert.False(ok);
        Assert.Equal("Temperature 70 °C is outside the plausible range -10 to 60 °C.", problem);
        Assert.StartsWith("Temperature 150 °F is outside the plausible range 14 to 140 °F.", ex.Message, StringComparison.Ordinal);
    }
}
