using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.HouseFactor;

/// <summary>Seeded synthetic seasons with a known true factor per strain: abv = factor × °Brix + N(0, sd²).</summary>
internal static class SyntheticLots
{
    public static IReadOnlyList<LotConversion> Seasons(
        int seed, IReadOnlyDictionary<string, double> trueFactors, int seasons, int lotsPerStrainPerSeason, double noiseSd, int firstSeason = 2021)
    {
        var rng = new Random(seed);
        var lots = new List<LotConversion>();
        for (int s = 0; s < seasons; s++)
        {
            foreach (var (strain, factor) in trueFactors.OrderBy(k => k.Key, StringComparer.Ordinal))
            {
                for (int i = 0; i < lotsPerStrainPerSeason; i++)
                {
                    lots.Add(Make(rng, firstSeason + s, $"L{lots.Count + 1:0000}", strain, factor, noiseSd));
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

    public static double Gaussian(Random rng)
    {
        // Box–Muller; 1 − NextDouble() keeps the logarithm's argument in (0, 1].
        double u1 = 1.0 - rng.NextDouble(), u2 = rng.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }

    private static LotConversion Make(Random rng, int season, string id, string strain, double factor, double sd)
    {
        double brix = 20.0 + (7.0 * rng.NextDouble());
        double abv = (factor * brix) + (sd * Gaussian(rng));
        return Lot(id, season, strain, brix, abv);
    }
}
