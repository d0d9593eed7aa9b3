using System.Globalization;

namespace YieldBench.Core.Conversion;

/// <summary>
/// The texts of the notes the conversion step attaches to a lot (one place, so tests and renderers see the same words).
/// </summary>
public static class ConversionNotes
{
    /// <summary>Additions are recorded but the must volume they apply to is not.</summary>
    public const string AdditionsWithoutVolume =
        "water or sugar additions are recorded but the must volume is not, so the starting sugar could not be corrected; record must_volume_l";

    /// <summary>Residual sugar was not recorded.</summary>
    public const string ResidualSugarMissing =
        "residual sugar is not recorded, so it is taken as 0 g/L (dry); record residual_sugar_gl for a fair comparison";

    /// <summary>A recorded addition is negative.</summary>
    public static string NegativeAddition(string column, double value) => string.Create(
        CultureInfo.InvariantCulture,
        $"{column} {value:0.###} is negative, so the starting sugar was not corrected; record the amount added as a positive number");

    /// <summary>The additions give a must outside the accepted °Brix range.</summary>
    public static string AdditionsOutOfRange(double brix) => string.Create(
        CultureInfo.InvariantCulture,
        $"the recorded additions would give {brix:0.0} °Brix, outside -6 to 50 °Brix, so the starting sugar was not corrected; check must_volume_l, water_added_l and sugar_added_kg");

    /// <summary>The starting sugar lies outside the OIV table.</summary>
    public static string OutsideOivTable(double brix) => string.Create(
        CultureInfo.InvariantCulture,
        $"starting sugar {brix:0.0} °Brix is outside the OIV table's 10–30 °Brix; fermentable sugar uses the non-sugar solids of the table's nearest edge");

    /// <summary>Residual sugar is at least the starting sugar, so nothing was fermented by the model.</summary>
    public static string ResidualAboveStart(double residualGl, double startGl) => string.Create(
        CultureInfo.InvariantCulture,
        $"residual sugar {residualGl:0.0} g/L is not below the starting sugar {startGl:0.0} g/L, so the fermented measures cannot be computed; check both values");
}
