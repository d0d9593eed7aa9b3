using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Units;

/// <summary>The recorded sugar, the one scale label, and the conversion with one range check.</summary>
public class RecordedSugarTests
{
    [Theory]
    [InlineData(SugarScale.Brix, "°Brix")]
    [InlineData(SugarScale.SpecificGravity, "SG")]
    [InlineData(SugarScale.Baume, "°Baumé")]
    [InlineData(SugarScale.Oechsle, "°Oechsle")]
    [InlineData(SugarScale.GramsPerLitre, "g/L")]
    public void Every_scale_has_one_short_label(SugarScale scale, string label)
    {
        // Given a scale; When labelled; Then the label is the one printed everywhere
        Assert.Equal(label, SugarScales.Label(scale));
        Assert.Equal(label, new RecordedSugar(1, scale).Label);
    }

    [Fact]
    public void A_recorded_value_keeps_the_number_as_written_and_gives_its_reading()
    {
        // Given SG 1.10101 as written (24 °Brix in Zoecklein et al., Wine Analysis and Production, Table I-1)
        var recorded = new RecordedSugar(1.10101, SugarScale.SpecificGravity);

        // When printed and converted
        // Then the number is the one written, and its reading is 24 °Brix within the table's 0.01
        Assert.Equal("1.10101 SG", recorded.ToString());
        Assert.Equal(24.0, recorded.Reading.Brix, 0.01);
    }

    [Fact]
    public void A_lot_made_without_a_recorded_value_reads_as_its_starting_sugar_in_Brix()
    {
        // Given a lot made in code with only its °Brix reading
        var lot = new Lot { LotId = "A", Season = 2024, Strain = "S", StartingSugar = SugarReading.FromBrix(23.4), FinalAlcohol = AlcoholContent.FromPercentVolume(13.5) };

        // Then its recorded starting sugar is that reading in °Brix
        Assert.Equal(new RecordedSugar(23.4, SugarScale.Brix), lot.RecordedStartingSugar);
        Assert.Equal(SugarScale.Brix, lot.StartingSugarScale);

        // And a recorded value given sets the scale
        var sg = lot with { RecordedStartingSugar = new RecordedSugar(1.095, SugarScale.SpecificGravity) };
        Assert.Equal(SugarScale.SpecificGravity, sg.StartingSugarScale);
    }

    [Theory]
    [InlineData(1.095, SugarScale.SpecificGravity)]
    [InlineData(95.0, SugarScale.Oechsle)]
    [InlineData(12.5, SugarScale.Baume)]
    [InlineData(237.8, SugarScale.GramsPerLitre)]
    [InlineData(24.1, SugarScale.Brix)]
    public void Converting_with_a_plausible_range_gives_the_factory_reading(double value, SugarScale scale)
    {
        // Given a value inside a starting sugar's 10–40 °Brix
        // When converted with one range check
        bool ok = SugarReading.TryFrom(value, scale, 10, 40, out var reading, out double brix);

        // Then it is the reading the scale's factory makes, to the last bit
        Assert.True(ok);
        Assert.Equal(SugarReading.From(value, scale), reading);
        Assert.Equal(reading.Brix, brix);
    }

    [Theory]
    [InlineData(1.2, SugarScale.SpecificGravity, 44.08)] // the NBS-fitted cubic at SG 1.2 (docs/methods.md; python3 by hand): 44.08 °Brix
    [InlineData(8.0, SugarScale.Brix, 8.0)]
    public void A_value_outside_the_plausible_range_is_refused_with_what_it_would_have_been(double value, SugarScale scale, double expectedBrix)
    {
        // Given a value whose °Brix lies outside 10–40
        // When converted
        bool ok = SugarReading.TryFrom(value, scale, 10, 40, out _, out double brix);

        // Then it is refused, and the °Brix it would have been is given for the message
        Assert.False(ok);
        Assert.Equal(expectedBrix, brix, 0.05);
    }

    [Fact]
    public void Not_a_number_is_refused()
    {
        Assert.False(SugarReading.TryFrom(double.NaN, SugarScale.Brix, -6, 50, out _, out _));
        Assert.False(SugarReading.TryFrom(double.PositiveInfinity, SugarScale.SpecificGravity, -6, 50, out _, out _));
    }
}
