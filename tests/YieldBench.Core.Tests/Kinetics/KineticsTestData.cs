using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Kinetics;

/// <summary>Builders for invented lots and logs (no real winery, strain or data).</summary>
internal static class KineticsTestData
{
    public static DateTime At(string stamp) =>
        DateTime.ParseExact(stamp, "yyyy-MM-dd HH:mm", CultureInfo.InvariantCulture);

    public static LotConversion Lot(
        string id = "T-101",
        int season = 2025,
        string strain = "KX-11",
        WineColour colour = WineColour.Red,
        DateTime? inoculation = null,
        double? residualSugarGl = null,
        double startingBrix = 24.0)
    {
        var lot = new Lot
        {
            LotId = id,
            Season = season,
            Strain = strain,
            StartingSugar = SugarReading.FromBrix(startingBrix),
            FinalAlcohol = AlcoholContent.FromPercentVolume(14.0),
            Colour = colour,
            InoculationDate = inoculation,
            ResidualSugarGl = residualSugarGl,
        };
        return ConversionFactors.For(lot, SugarModel.Default);
    }

    /// <summary>A log from (time, °Brix, °C) rows; row numbers start at 2 as under a header row.</summary>
    public static FermentationLog Log(string id, int? season, params (string Time, double? Brix, double? TempC)[] rows) =>
        new(id, season, rows.Select((r, i) => new LogReading(
            At(r.Time),
            r.Brix is { } b ? SugarReading.FromBrix(b) : null,
            r.TempC,
            new SourceRef("logs.csv", null, i + 2))).ToArray());

    /// <summary>Readings every <paramref name="stepHours"/> from <paramref name="start"/> with the given °Brix values.</summary>
    public static FermentationLog Regular(string id, int? season, DateTime start, double stepHours, double[] brix, double[]? tempC = null) =>
        new(id, season, brix.Select((b, i) => new LogReading(
            start + TimeSpan.FromHours(i * stepHours),
            SugarReading.FromBrix(b),
            tempC?[i],
            new SourceRef("logs.csv", null, i + 2))).ToArray());

    public static double Gaussian(Random rng)
    {
        // Box–Muller: two uniforms to one standard normal; seeded by the caller.
        double u1 = 1.0 - rng.NextDouble();
        double u2 = rng.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }
}
