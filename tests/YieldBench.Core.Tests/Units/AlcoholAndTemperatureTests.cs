using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Units;

/// <summary>Alcohol % v/v ↔ g/L and temperature °C ↔ °F.</summary>
public class AlcoholAndTemperatureTests
{
    [Fact]
    public void Thirteen_percent_alcohol_is_102_point_60_grams_per_litre()
    {
        // Given ethanol 0.78924 g/mL at 20 °C (Council Directive 76/766/EEC, Annex §4)
        var alcohol = AlcoholContent.FromPercentVolume(13.0);

        // When expressed in g/L
        // Then 13 × 10 mL/L × 0.78924 g/mL = 102.6012 g/L
        Assert.Equal(0.78924, AlcoholContent.EthanolDensity20C);
        Assert.Equal(102.6012, alcohol.GramsPerLitre, 1e-9);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(7.8924)]
    [InlineData(110.4936)]
    [InlineData(197.31)]
    public void Grams_per_litre_and_percent_volume_round_trip(double gl)
    {
        // Given ethanol in g/L
        // When read as alcohol and written back
        double back = AlcoholContent.FromGramsPerLitre(gl).GramsPerLitre;

        // Then it is the same to 1e-9 g/L
        Assert.Equal(gl, back, 1e-9);
    }

    [Theory]
    [InlineData(-40.0, -40.0)]
    [InlineData(0.0, 32.0)]
    [InlineData(20.0, 68.0)]
    [InlineData(37.0, 98.6)]
    [InlineData(60.0, 140.0)]
    public void Celsius_and_Fahrenheit_follow_the_definition(double celsius, double fahrenheit)
    {
        // Given °F = °C × 9/5 + 32 (definition of the scales); −40 is out of the must range so only the formula is checked there
        if (celsius >= Temperature.MinCelsius)
        {
            // When converted each way
            // Then both agree to 1e-9
            Assert.Equal(fahrenheit, Temperature.FromCelsius(celsius).Fahrenheit, 1e-9);
            Assert.Equal(celsius, Temperature.FromFahrenheit(fahrenheit).Celsius, 1e-9);
        }
        else
        {
            Assert.Equal(fahrenheit, (celsius * 9.0 / 5.0) + 32.0, 1e-9);
        }
    }

    [Fact]
    public void The_sluggish_and_stopping_temperatures_of_Ough_and_Amerine_convert_to_about_29_and_38_Celsius()
    {
        // Given 85 °F and 100 °F (Ough & Amerine 1966, Calif. Agric. Exp. Stn Bull. 827)
        // When read in °F
        // Then they are 29.44 °C and 37.78 °C
        Assert.Equal(29.444444, Temperature.FromFahrenheit(85).Celsius, 1e-6);
        Assert.Equal(37.777778, Temperature.FromFahrenheit(100).Celsius, 1e-6);
    }
}
