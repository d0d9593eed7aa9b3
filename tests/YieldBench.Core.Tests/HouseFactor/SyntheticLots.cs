using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.HouseFactor;

/// <summary>Seeded synthetic seasons with a known true factor per strain: abv = factor × °Brix + N(0, sd²).</summary>
internal static class SyntheticLots
{
    /// <summary>
    /// Seasons of lots; with <paramref name="shiftSd"/> &gt; 0 every strain in every season also gets its own alcohol
    /// shift drawn from N(0, shiftSd²) (a season × strain random effect, % v/v), shared by its lots.
    /// </summary>
    public static IReadOnlyList<LotConversion> Seasons(
        int seed, IReadOnlyDictionary<string, double> trueFactors, int seasons, int lotsPerStrainPerSeason, double noiseSd, int firstSeason = 2021, double shiftSd = 0)
    {
        var rng = new Random(seed);
        var lots = new List<LotConversion>();
        for (int s = 0; s < seasons; s++)
        {
            foreach (var (strain, factor) in trueFactors.OrderBy(k => k.Key, StringComparer.Ordinal))
            {
                double shift = shiftSd > 0 ? shiftSd * Gaussian(rng) : 0;
                for (int i = 0; i < lotsPerStrainPerSeason; i++)
                {
                    lots.Add(Make(rng, firstSeason + s, $"L{lots.Count + 1:0000}", strain, factor, noiseSd, shift));
                }
            }
        }

        return lots;
    }

    public static IReadOnlyList<LotConversion> Counts(int seed, IReadOnlyList<(string Strain, double Factor, int Lots)> strains, double noiseSd, int season = 2024)
    {
        var rng = new Random(seed);
        var lots = new List<LotConversion>();
        foreach (var (strain, factor, n) in strains)
        {
            for (int i = 0; i < n; i++)
            {
                lots.Add(Make(rng, season, $"L{lots.Count + 1:0000}", strain, factor, noiseSd));
            }
        }

        return lots;
    }

    public static LotConversion Lot(string id, int season, string strain, double brix, double abv) =>
        ConversionFactors.For(
            new Lot
            {
                LotId = id,
                Season = season,
                Strain = strain,
                StartingSugar = SugarReading.FromBrix(brix),
                FinalAlcohol = AlcoholContent.FromPercentVolume(abv),
            },
            SugarModel.Default);

    /// <summary>How many of the lots fall inside the planner's 80 % and 95 % intervals for their strain.</summary>
    public static (int Lots, int In80, int In95) Covered(YieldBench.Core.HouseFactor.PlanningModel planning, IEnumerable<LotConversion> lots)
    {
        int n = 0, in80 = 0, in95 = 0;
        foreach (var l in lots)
        {
            var e = YieldBench.Core.HouseFactor.Planner.Estimate(planning.For(l.Lot.Strain), SugarReading.FromBrix(l.EffectiveStartingBrix));
            double actual = l.Lot.FinalAlcohol.PercentVolume;
            n++;
            in80 += actual >= e.Low80 && actual <= e.High80 ? 1 : 0;
            in95 += actual >= e.Low95 && actual <= e.High95 ? 1 : 0;
        }

        return (n, in80, in95);
    }

    public static double Gaussian(Random rng)
    {
        // Box–Muller; 1 − NextDouble() keeps the logarithm's argument in (0, 1].
        double u1 = 1.0 - rng.NextDouble(), u2 = rng.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }

    private static LotConversion Make(Random rng, int season, string id, string strain, double factor, double sd, double shift = 0)
    {
        double brix = 20.0 + (7.0 * rng.NextDouble());
        double abv = (factor * brix) + shift + (sd * Gaussian(rng));
        return Lot(id, season, strain, brix, abv);
    }
}
