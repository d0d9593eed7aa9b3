using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Review;

/// <summary>Makes invented lots and their conversion measures for review tests.</summary>
internal static class LotBuilder
{
    public static Lot Lot(string id, int season, string strain, double brix, double abv, string? vessel = "tank", string? variety = "Cabernet Sauvignon", double? residualSugarGl = 1.5) => new()
    {
        LotId = id,
        Season = season,
        Strain = strain,
        StartingSugar = SugarReading.FromBrix(brix),
        FinalAlcohol = AlcoholContent.FromPercentVolume(abv),
        Vessel = vessel,
        Variety = variety,
        ResidualSugarGl = residualSugarGl,
    };

    public static LotConversion Convert(Lot lot) => ConversionFactors.For(lot, SugarModel.Default);

    /// <summary>Standard normal draw (Box–Muller) from a seeded generator.</summary>
    public static double Normal(Random random)
    {
        double u1 = 1.0 - random.NextDouble(), u2 = random.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2);
    }
}
