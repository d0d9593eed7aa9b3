using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Units;

/// <summary>Property tests: every sugar scale converts to °Brix and back without loss over its valid range.</summary>
public class RoundTripTests
{
    private static readonly SugarScale[] HydrometerScales = [SugarScale.Brix, SugarScale.SpecificGravity, SugarScale.Baume, SugarScale.Oechsle];

    [Fact]
    public void Every_hydrometer_scale_round_trips_over_the_whole_valid_range()
    {
        // Given a dense grid of −5.95 to 49.95 °Brix (0.01 °Bx steps; the other scales' accepted ranges are the
        // °Brix range rounded inward, so the last 0.05 °Bx at each end are left out) and every hydrometer scale
        for (int i = 5; i <= 5595; i++)
        {
            double brix = -6.0 + (i * 0.01);
            var reading = SugarReading.FromBrix(brix);
            foreach (var scale in HydrometerScales)
            {
                // When the reading goes out to the scale and back
                var back = SugarReading.From(reading.In(scale), scale);

                // Then the °Brix is the same to 1e-9 (only float rounding separates them)
                Assert.Equal(brix, back.Brix, 1e-9);
            }
        }
    }

    [Fact]
    public void Every_scale_round_trips_through_any_other_for_seeded_random_readings()
    {
        // Given 2000 seeded random readings in 2.2–50 °Brix (g/L carries no information below about 2.14 °Brix)
        var random = new Random(20261201);
        var all = Enum.GetValues<SugarScale>();
        for (int n = 0; n < 2000; n++)
        {
            double brix = 2.2 + (random.NextDouble() * 47.8);
            var from = all[random.Next(all.Length)];
            var via = all[random.Next(all.Length)];

            // When the reading is written on one scale, read back, written on a second and read back again
            var first = SugarReading.From(SugarReading.FromBrix(brix).In(from), from);
            var second = SugarReading.From(first.In(via), via);

            // Then it lands on the starting °Brix within 1e-8 (the g/L inverse is solved to 1e-11 g/L)
            Assert.Equal(brix, second.Brix, 1e-8);
        }
    }

    [Fact]
    public void Grams_per_litre_round_trips_over_the_must_range()
    {
        // Given must sugar from 1 g/L to the largest accepted value, in 0.5 g/L steps
        for (double gl = 1; gl <= SugarReading.MaxGramsPerLitre; gl += 0.5)
        {
            // When it is read as a reading and written back in g/L
            double back = SugarReading.FromGramsPerLitre(gl).GramsPerLitre;

            // Then the sugar is recovered to 1e-7 g/L
            Assert.Equal(gl, back, 1e-7);
        }
    }

    [Fact]
    public void Readings_rise_together_on_every_scale()
    {
        // Given two readings a hundredth of a degree apart over the range
        for (double brix = -6.0; brix < 50.0; brix += 0.25)
        {
            var a = SugarReading.FromBrix(brix);
            var b = SugarReading.FromBrix(brix + 0.01);

            // Then every hydrometer scale rises with °Brix, and sugar g/L never falls
            Assert.True(b.SpecificGravity > a.SpecificGravity);
            Assert.True(b.Baume > a.Baume);
            Assert.True(b.Oechsle > a.Oechsle);
            Assert.True(b.GramsPerLitre >= a.GramsPerLitre);
        }
    }
}
