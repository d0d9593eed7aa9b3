using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Units;

namespace YieldBench.Reports.Tests.Fixtures;

/// <summary>
/// Invented cellars at the sizes real wineries have, for the layout tests: a small one (one season, one vessel type,
/// no logs, a strain with a single lot) and a large one (many strains over several seasons).
/// </summary>
internal static class Cellars
{
    /// <summary>One season (2025) of ten lots in stainless tanks, no logs: nine of strain SM-A, one of SM-B.</summary>
    public static ReviewResult Small()
    {
        var rng = new Random(11);
        var lots = Enumerable.Range(0, 10).Select(i =>
        {
            double brix = 22.0 + (0.35 * i);
            return new Lot
            {
                LotId = $"S{i + 1:00}",
                Season = 2025,
                Strain = i < 9 ? "SM-A" : "SM-B",
                StartingSugar = SugarReading.FromBrix(brix),
                FinalAlcohol = AlcoholContent.FromPercentVolume(Math.Round((0.592 * brix) + ((rng.NextDouble() - 0.5) * 0.2), 2)),
                Vessel = "Stainless tank",
                ResidualSugarGl = 1.5,
                Source = new SourceRef("lots.csv", null, i + 2),
            };
        }).ToList();
        var inputs = new SeasonSet { Lots = lots, Files = [new InputFile("lots.csv", new string('c', 64), 900)] };
        return ReviewRunner.Run(inputs, new ReviewSettings(), "9.9.9-test");
    }

    /// <summary><paramref name="strains"/> invented strains (LG-01, LG-02, …) with <paramref name="lotsPerSeason"/> lots each in each of <paramref name="seasons"/> seasons from 2023, in two vessel types.</summary>
    public static ReviewResult Large(int strains, int lotsPerSeason, int seasons)
    {
        var rng = new Random(5);
        var lots = new List<Lot>();
        for (int season = 2023; season < 2023 + seasons; season++)
        {
            for (int s = 0; s < strains; s++)
            {
                for (int k = 0; k < lotsPerSeason; k++)
                {
                    double brix = 21.5 + (0.4 * (k % 10)) + (0.05 * s);
                    lots.Add(new Lot
                    {
                        LotId = $"L{lots.Count + 1:0000}",
                        Season = season,
                        Strain = $"LG-{s + 1:00}",
                        StartingSugar = SugarReading.FromBrix(brix),
                        FinalAlcohol = AlcoholContent.FromPercentVolume(Math.Round(((0.575 + (0.002 * s)) * brix) + ((rng.NextDouble() - 0.5) * 0.25), 2)),
                        Vessel = k % 2 == 0 ? "Stainless tank" : "Barrel",
                        ResidualSugarGl = 1.5,
                        Source = new SourceRef("lots.csv", null, lots.Count + 2),
                    });
                }
            }
        }

        var inputs = new SeasonSet { Lots = lots, Files = [new InputFile("lots.csv", new string('d', 64), 90000)] };
        return ReviewRunner.Run(inputs, new ReviewSettings(), "9.9.9-test");
    }
}
