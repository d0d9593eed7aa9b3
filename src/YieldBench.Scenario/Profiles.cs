using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Scenario;

/// <summary>
/// An invented yeast strain of the scenario with its true behaviour. The codes are the project's own; no commercial
/// strain is meant.
/// </summary>
/// <param name="Code">Strain code as the cellar writes it, e.g. <c>YB-R12</c>.</param>
/// <param name="Description">What the invented cellar uses it for.</param>
/// <param name="SugarGlPerAbv">True sugar consumed per 1 % v/v of ethanol, g/L (15.43 is the Gay-Lussac limit; 16.83 the OIV convention).</param>
/// <param name="LagHours">Typical lag from inoculation to a sustained sugar drop, h.</param>
/// <param name="MaxRateBrixPerHourAt25C">Typical maximum sugar consumption rate at a 25 °C peak, °Brix/h.</param>
/// <param name="HeatRiseC">Extra peak temperature this strain tends to give over the vessel's usual peak, °C.</param>
/// <param name="ForReds">True for a strain the cellar uses on reds, false for whites and rosé.</param>
public sealed record StrainProfile(
    string Code,
    string Description,
    double SugarGlPerAbv,
    double LagHours,
    double MaxRateBrixPerHourAt25C,
    double HeatRiseC,
    bool ForReds)
{
    /// <summary>
    /// True conversion factor at a starting sugar of <paramref name="brix"/> for a dry lot in a vessel with no ethanol loss:
    /// OIV fermentable sugar g/L (the scenario's frozen <see cref="ScenarioChemistry"/>) ÷ <see cref="SugarGlPerAbv"/> ÷ °Brix, % v/v per °Brix.
    /// </summary>
    public double TrueFactorAt(double brix) => ScenarioChemistry.SugarGramsPerLitre(brix) / SugarGlPerAbv / brix;
}

/// <summary>A vessel type and size of the invented cellar and how it behaves.</summary>
/// <param name="Type">Vessel type as the cellar writes it.</param>
/// <param name="CapacityL">Capacity, L.</param>
/// <param name="FillMin">Lowest share of capacity filled with must.</param>
/// <param name="FillMax">Highest share of capacity filled with must.</param>
/// <param name="EthanolLossShare">Share of ethanol lost by evaporation and CO2 stripping (open, warm vessels lose more).</param>
/// <param name="RedPeakC">Usual peak temperature of a red ferment in this vessel, °C.</param>
/// <param name="WhitePeakC">Usual peak temperature of a white ferment in this vessel, °C.</param>
/// <param name="SamplingSdBrix">Standard deviation of a starting-sugar sample against the true lot mean, °Brix.</param>
public sealed record VesselProfile(
    string Type,
    double CapacityL,
    double FillMin,
    double FillMax,
    double EthanolLossShare,
    double RedPeakC,
    double WhitePeakC,
    double SamplingSdBrix);

/// <summary>A grape variety of the invented estate with its colour and the usual ripeness of its fruit.</summary>
/// <param name="Name">Variety name.</param>
/// <param name="Colour">Colour style made from it.</param>
/// <param name="MeanBrixOffset">Ripeness relative to the season's mean for the colour, °Brix.</param>
/// <param name="Blocks">Vineyard blocks it grows in.</param>
public sealed record VarietyProfile(string Name, WineColour Colour, double MeanBrixOffset, IReadOnlyList<string> Blocks);

/// <summary>The character of one season of the scenario.</summary>
/// <param name="Year">Vintage.</param>
/// <param name="LotCount">Lots made.</param>
/// <param name="RedMeanBrix">Mean starting sugar of red fruit, °Brix.</param>
/// <param name="WhiteMeanBrix">Mean starting sugar of white fruit, °Brix.</param>
/// <param name="FirstInoculation">Date of the first inoculation.</param>
/// <param name="HarvestDays">Days from the first to the last inoculation.</param>
/// <param name="Scale">Scale the cellar recorded starting sugar in this season.</param>
/// <param name="Format">How the season's lot file is kept.</param>
public sealed record SeasonProfile(
    int Year,
    int LotCount,
    double RedMeanBrix,
    double WhiteMeanBrix,
    DateTime FirstInoculation,
    int HarvestDays,
    SugarScale Scale,
    SeasonFileFormat Format);

/// <summary>How a season's lot file is kept.</summary>
public enum SeasonFileFormat
{
    /// <summary>An .xlsx workbook with a title row, a blank row and an "Average" row.</summary>
    Workbook,

    /// <summary>A semicolon-separated text file with decimal commas.</summary>
    SemicolonCsv,
}
