using YieldBench.Core.Units;

namespace YieldBench.Reports.Kinetics;

/// <summary>
/// The workbook's kinetics sheets: "Kinetics" (the cautions, the per-strain table and the findings) and "Kinetics by
/// lot" (<see cref="Workbook.WorkbookSheets"/> lays both out).
/// </summary>
public static class KineticsSheet
{
    /// <summary>Suggested sheet name.</summary>
    public const string SheetName = "Kinetics";

    /// <summary>Cautions shown at the top of the sheet (and in the methods document).</summary>
    public static IReadOnlyList<string> Cautions { get; } =
    [
        "Fermentation releases heat and carbon dioxide. CO2 displaces air in cellars, pits and tanks and can kill: ventilate, monitor, and follow your local confined-space and workplace-safety rules.",
        "'Reachable without cooling' is an estimate of the temperature the remaining sugar could still cause with no heat removed (adiabatic); it is a warning sign, not a prediction. Cooling capacity (and, for a must on its skins, cap management) decides what happens.",
        "Temperature thresholds are common-practice defaults (reds 35/40 °C, whites 20/25 °C); set them to your own practice and your winemaker's judgement.",
        "Sugar readings during fermentation are hydrometer or refractometer readings distorted by alcohol; times to dryness are taken from them. Dryness and any alcohol on a label need a lab analysis under the local rules.",
    ];

    /// <summary>The cautions with the default thresholds also given in °F when the review shows °F.</summary>
    public static IReadOnlyList<string> CautionsIn(TemperatureUnit unit) =>
        unit == TemperatureUnit.Fahrenheit
            ? Cautions.Select(c => c.Replace("(reds 35/40 °C, whites 20/25 °C)", "(reds 35/40 °C = 95/104 °F, whites 20/25 °C = 68/77 °F)", StringComparison.Ordinal)).ToArray()
            : Cautions;
}
