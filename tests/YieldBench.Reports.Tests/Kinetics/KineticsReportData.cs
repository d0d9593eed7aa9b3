using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Units;

namespace YieldBench.Reports.Tests.Kinetics;

/// <summary>An invented set of lots and logs for the kinetics renderers (no real winery, strain or data).</summary>
internal static class KineticsReportData
{
    public static readonly DateTime Start = DateTime.ParseExact("2025-09-28 08:00", "yyyy-MM-dd HH:mm", CultureInfo.InvariantCulture);

    public static LotConversion Lot(string id, string strain, WineColour colour, double? rs = null) =>
        ConversionFactors.For(
            new Lot
            {
                LotId = id,
                Season = 2025,
                Strain = strain,
                StartingSugar = SugarReading.FromBrix(24.0),
                FinalAlcohol = AlcoholContent.FromPercentVolume(14.0),
                Colour = colour,
                InoculationDate = Start.AddHours(-6),
                ResidualSugarGl = rs,
            },
            SugarModel.Default);

    public static FermentationLog Log(string id, double stepHours, double[] brix, double[] temps) =>
        new(id, 2025, brix.Select((b, i) => new LogReading(Start.AddHours(i * stepHours), SugarReading.FromBrix(b), temps[i], new SourceRef("logs.csv", null, i + 2))).ToArray());

    /// <summary>The lots and logs of <see cref="Build"/> reviewed whole (conversion, strain review, kinetics, figures).</summary>
    public static ReviewResult FullReview()
    {
        var (lots, logs) = LotsAndLogs();
        return ReviewRunner.Run(new SeasonSet { Lots = lots.Select(l => l.Lot).ToArray(), Logs = logs }, new ReviewSettings(), "test");
    }

    /// <summary>Four lots: a healthy red, a hot red, a stuck white, and a dense probe-logged red; plus a lot with no log.</summary>
    public static (IReadOnlyList<LotConversion> Lots, KineticsReview Review) Build()
    {
        var (lots, logs) = LotsAndLogs();
        return (lots, KineticsAnalysis.Run(lots, logs, KineticsSettings.Default));
    }

    private static (IReadOnlyList<LotConversion> Lots, IReadOnlyList<FermentationLog> Logs) LotsAndLogs()
    {
        var lots = new[]
        {
            Lot("R-01", "KX-11", WineColour.Red),
            Lot("R-02", "KX-11", WineColour.Red),
            Lot("W-03", "BR-4", WineColour.White, rs: 38.0),
            Lot("R-04", "BR-4", WineColour.Red),
            Lot("R-05", "KX-11", WineColour.Red),
        };
        var dense = Enumerable.Range(0, 8 * 24).Select(i => 24.0 - (25.0 / (1.0 + Math.Exp(-(i - 60) / 14.0)))).ToArray();
        var denseT = dense.Select((b, i) => 22.0 + (8.0 * Math.Exp(-Math.Pow((i - 70) / 30.0, 2)))).ToArray();
        var logs = new[]
        {
            Log("R-01", 12, [24.0, 23.6, 21.5, 18.0, 14.0, 10.0, 6.5, 3.5, 1.0, -0.8, -1.5], [18, 21, 25, 28, 30, 31, 30, 28, 25, 22, 20]),
            Log("R-02", 12, [24.0, 23.0, 20.0, 15.5, 10.5, 6.0, 2.5, 0.0, -1.2], [24, 27, 31, 35, 38, 41, 38, 33, 28]),
            Log("W-03", 24, [24.0, 22.5, 19.5, 16.0, 13.0, 11.0, 10.8, 10.7, 10.6, 10.6], [13, 15, 17, 18, 18, 17, 16, 15, 15, 15]),
            Log("R-04", 1, dense, denseT),
        };
        return (lots, logs);
    }
}
