using YieldBench.Core.Lots;
using YieldBench.Core.Conversion;
using YieldBench.Core.Review.Strains;

namespace YieldBench.Core.Tests.Review;

/// <summary>
/// An invented cellar with planted cases. Alcohol follows a straight line in starting sugar,
/// ABV = −2.33 + 0.687·°Brix (the slope and intercept of the OIV table's potential alcohol between 20 and 26 °Brix
/// at 16.83 g/L: 11.40 % at 20 °Bx, 15.52 % at 26 °Bx, OIV-MA-AS2-02 Table II as reproduced in the French Arrêté du
/// 14 septembre 2011 relatif aux réfractomètres, Annexe IV), plus a strain effect and noise N(0, 0.12).
/// Strain codes, lots and numbers are invented.
/// </summary>
internal sealed class SyntheticCellar
{
    public const double Intercept = -2.33;
    public const double Slope = 0.687;
    public const double Noise = 0.12;
    public const double PlantedShift = 1.0;

    /// <summary>True strain effects, % v/v at the same starting sugar. Y-17 is better by 0.15 and used on riper fruit.</summary>
    public static readonly Dictionary<string, double> Effects = new(StringComparer.Ordinal)
    {
        ["Y-05"] = 0.0,
        ["Y-17"] = 0.15,
        ["Y-22"] = 0.0,
        ["Y-31"] = 0.0,
        ["Y-44"] = -1.4,
    };

    public List<LotConversion> Lots { get; } = [];

    /// <summary>Planted lot key → the code that must be raised for it.</summary>
    public Dictionary<LotKey, string> Planted { get; } = [];

    /// <summary>Lots shifted by ±<see cref="PlantedShift"/>: key → true when shifted up.</summary>
    public Dictionary<LotKey, bool> Shifted { get; } = [];

    /// <summary>Keys of lots that carry no planted fault.</summary>
    public HashSet<LotKey> Clean { get; } = [];

    /// <summary>The strain and season planted with a drift of −0.3 % v/v on every lot.</summary>
    public (string Strain, int Season) Drift { get; } = ("Y-22", 2025);

    public static SyntheticCellar Make(int seed, int lotsPerStrainSeason = 20)
    {
        var cellar = new SyntheticCellar();
        var random = new Random(seed);
        string[] vessels = ["tank", "barrel", "bin"];
        int counter = 0;
        foreach (int season in new[] { 2022, 2023, 2024, 2025 })
        {
            foreach (var (strain, effect) in Effects)
            {
                for (int i = 0; i < lotsPerStrainSeason; i++)
                {
                    counter++;
                    string id = "L" + counter.ToString("D4", System.Globalization.CultureInfo.InvariantCulture);
                    double ripeness = strain == "Y-17" ? 25.8 : 23.0;
                    double brix = Math.Round(ripeness + (0.9 * LotBuilder.Normal(random)), 1);
                    double abv = Intercept + (Slope * brix) + effect + (Noise * LotBuilder.Normal(random));
                    bool drift = (strain, season) == cellar.Drift;
                    if (drift)
                    {
                        abv -= 0.3;
                    }

                    var key = new LotKey(season, id);
                    bool plant = !drift && random.NextDouble() < 0.1;
                    if (plant)
                    {
                        bool up = random.NextDouble() < 0.5;
                        abv += up ? PlantedShift : -PlantedShift;
                        cellar.Planted[key] = FlagCodes.OffStrainLine;
                        cellar.Shifted[key] = up;
                    }
                    else if (!drift)
                    {
                        cellar.Clean.Add(key);
                    }

                    var lot = LotBuilder.Lot(id, season, strain, brix, Math.Round(abv, 2), vessels[random.Next(3)]);
                    cellar.Lots.Add(LotBuilder.Convert(lot));
                }
            }
        }

        // Special plants, each a lot of a well-populated strain in 2024.
        void Add(string id, string strain, double recordedBrix, double abv, string code, double residualSugar = 1.5)
        {
            var lot = LotBuilder.Lot(id, 2024, strain, recordedBrix, Math.Round(abv, 2), "tank", residualSugarGl: residualSugar);
            cellar.Lots.Add(LotBuilder.Convert(lot));
            cellar.Planted[new LotKey(2024, id)] = code;
        }

        double Abv(double brix, string strain) => Intercept + (Slope * brix) + Effects[strain];
        Add("P-SWAP-1", "Y-05", 42.2, Abv(24.2, "Y-05"), FlagCodes.PossibleTransposedDigits);
        Add("P-SWAP-2", "Y-05", 32.1, Abv(23.1, "Y-05"), FlagCodes.PossibleTransposedDigits);

        // A swap across the decimal point (24.2 written as 22.4) is another number, not a transposition: it is planted
        // for the alcohol it gives (off its strain's line) and must not be offered as swapped digits.
        Add("P-CROSS", "Y-05", 22.4, Abv(24.2, "Y-05"), FlagCodes.OffStrainLine);
        var sugar = SugarModel.Default.SugarGramsPerLitre(23.0);
        double theoretical = sugar * GayLussac.EthanolMassYield / (10 * YieldBench.Core.Units.AlcoholContent.EthanolDensity20C);
        Add("P-OVER", "Y-22", 23.0, 1.05 * theoretical, FlagCodes.AboveTheoreticalYield);
        Add("P-STUCK", "Y-31", 24.0, Abv(24.0 - 1.2, "Y-31"), FlagCodes.NotDry, residualSugar: 12.0);

        // 8 % unrecorded water: the must the yeast saw was 24.0 diluted to about 22.1 °Brix.
        Add("P-WATER", "Y-31", 24.0, Abv(22.08, "Y-31"), FlagCodes.PossibleUnrecordedWater);

        // Recorded as Y-05 but converted like Y-44.
        Add("P-MIXUP", "Y-05", 23.0, Abv(23.0, "Y-44"), FlagCodes.PossibleStrainMixUp);
        return cellar;
    }
}
