using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Scenario;

/// <summary>
/// The invented estate's strains, vessels and varieties. Every number here is a design choice of the invented scenario
/// (chosen to look like a plausible cellar), not a measured fact about any real yeast or winery.
/// </summary>
public static class Catalog
{
    /// <summary>The invented estate.</summary>
    public const string EstateName = "Tallowmere Estate";

    /// <summary>Starting sugar at which strain factors are compared in the scenario's truth, °Brix.</summary>
    public const double ReferenceBrix = 24.0;

    /// <summary>
    /// Five invented strains. Sugar per % v/v chosen so that the true factor at 24 °Brix runs 0.572–0.615 % v/v per °Brix
    /// (OIV sugar at 24 °Brix is 237.8 g/L): 237.8 ÷ 16.11 ÷ 24 = 0.615 for YB-R31 down to 237.8 ÷ 17.32 ÷ 24 = 0.572 for YB-N05.
    /// </summary>
    public static IReadOnlyList<StrainProfile> Strains { get; } =
    [
        new("YB-R12", "red workhorse: steady, moderate heat", 16.65, 14, 0.14, 0.5, true),
        new("YB-R31", "red for ripe fruit: high sugar tolerance, fast and warm", 16.11, 9, 0.17, 2.0, true),
        new("YB-N05", "slow, characterful red strain with a long lag", 17.32, 30, 0.11, -0.5, true),
        new("YB-W22", "clean white strain", 16.51, 20, 0.12, 0.0, false),
        new("YB-W07", "aromatic white and rosé strain, happy cool", 16.94, 28, 0.10, -0.5, false),
    ];

    /// <summary>Six vessels of five types.</summary>
    public static IReadOnlyList<VesselProfile> Vessels { get; } =
    [
        new("Stainless tank", 10000, 0.70, 0.85, 0.002, 27.5, 15.0, 0.25),
        new("Stainless tank", 5000, 0.72, 0.88, 0.002, 27.5, 15.0, 0.25),
        new("Stainless tank", 2000, 0.75, 0.90, 0.002, 28.0, 15.5, 0.25),
        new("Open-top bin", 1000, 0.60, 0.75, 0.012, 31.5, 20.0, 0.45),
        new("Concrete egg", 1600, 0.80, 0.90, 0.003, 28.5, 17.0, 0.30),
        new("Barrel", 225, 0.85, 0.92, 0.006, 29.0, 19.0, 0.20),
        new("Puncheon", 500, 0.85, 0.92, 0.005, 29.0, 18.0, 0.20),
    ];

    /// <summary>Varieties of the estate.</summary>
    public static IReadOnlyList<VarietyProfile> Varieties { get; } =
    [
        new("Cabernet Sauvignon", WineColour.Red, 0.6, ["North Slope", "Old Quarry"]),
        new("Merlot", WineColour.Red, 0.0, ["Creek Bench"]),
        new("Syrah", WineColour.Red, 0.8, ["Old Quarry", "Terrace 3"]),
        new("Pinot Noir", WineColour.Red, -1.2, ["Creek Bench", "Fern Gully"]),
        new("Grenache", WineColour.Red, 0.9, ["Terrace 3"]),
        new("Chardonnay", WineColour.White, 0.3, ["Fern Gully", "Creek Bench"]),
        new("Sauvignon Blanc", WineColour.White, -0.3, ["North Slope"]),
        new("Riesling", WineColour.White, -0.6, ["Fern Gully"]),
        new("Grenache", WineColour.Rose, -1.5, ["Terrace 3"]),
    ];

    /// <summary>The three demo seasons: a warm 2023, a cool 2024 recorded in specific gravity, a middling 2025 kept as CSV.</summary>
    public static IReadOnlyList<SeasonProfile> DemoSeasons { get; } =
    [
        new(2023, 72, 25.6, 22.8, new DateTime(2023, 9, 6), 40, SugarScale.Brix, SeasonFileFormat.Workbook),
        new(2024, 66, 23.4, 21.0, new DateTime(2024, 9, 14), 38, SugarScale.SpecificGravity, SeasonFileFormat.Workbook),
        new(2025, 84, 24.6, 22.0, new DateTime(2025, 9, 3), 45, SugarScale.Brix, SeasonFileFormat.SemicolonCsv),
    ];

    /// <summary>
    /// A strain the cellar tries for the first time in the harvest in progress: no finished lot of it exists, so a
    /// forecast for it must stand on the other strains (not in <see cref="Strains"/>, which lists the strains of the history).
    /// </summary>
    public static StrainProfile TrialStrain { get; } = new("YB-R44", "red strain on trial this harvest: no history in this cellar", 16.4, 12, 0.15, 1.0, true);

    /// <summary>The strain with the given code (the trial strain included).</summary>
    public static StrainProfile Strain(string code) =>
        Strains.FirstOrDefault(s => s.Code == code) ?? (code == TrialStrain.Code ? TrialStrain : throw new ArgumentException($"No strain {code} in the catalog.", nameof(code)));
}
