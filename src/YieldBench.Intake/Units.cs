using YieldBench.Core.Units;

namespace YieldBench.Intake;

/// <summary>A unit a column can be recorded in.</summary>
internal enum ColumnUnit
{
    None,
    Brix,
    SpecificGravity,
    Baume,
    Oechsle,
    SugarGramsPerLitre,
    PercentVolume,
    AlcoholGramsPerLitre,
    Celsius,
    Fahrenheit,
    Litre,
    Hectolitre,
    UsGallon,
    Kilogram,
    Gram,
    Pound,

    /// <summary>Residual sugar written as a percentage, g per 100 mL (× 10 → g/L).</summary>
    GramsPer100Millilitre,
}

/// <summary>Unit labels and conversions to the unit each field is held in.</summary>
internal static class ColumnUnits
{
    /// <summary>US liquid gallon in litres (exact: 231 in³, NIST Handbook 44 Appendix C).</summary>
    public const double LitresPerUsGallon = 3.785411784;

    /// <summary>Avoirdupois pound in kilograms (exact, international yard and pound agreement of 1959).</summary>
    public const double KilogramsPerPound = 0.45359237;

    public static string Label(ColumnUnit unit) => unit switch
    {
        ColumnUnit.Brix => "°Brix",
        ColumnUnit.SpecificGravity => "SG",
        ColumnUnit.Baume => "°Baumé",
        ColumnUnit.Oechsle => "°Oechsle",
        ColumnUnit.SugarGramsPerLitre => "g/L sugar",
        ColumnUnit.PercentVolume => "% v/v",
        ColumnUnit.AlcoholGramsPerLitre => "g/L ethanol",
        ColumnUnit.Celsius => "°C",
        ColumnUnit.Fahrenheit => "°F",
        ColumnUnit.Litre => "L",
        ColumnUnit.Hectolitre => "hL",
        ColumnUnit.UsGallon => "US gal",
        ColumnUnit.Kilogram => "kg",
        ColumnUnit.Gram => "g",
        ColumnUnit.Pound => "lb",
        ColumnUnit.GramsPer100Millilitre => "g/100 mL",
        _ => "",
    };

    public static SugarScale Scale(ColumnUnit unit) => unit switch
    {
        ColumnUnit.SpecificGravity => SugarScale.SpecificGravity,
        ColumnUnit.Baume => SugarScale.Baume,
        ColumnUnit.Oechsle => SugarScale.Oechsle,
        ColumnUnit.SugarGramsPerLitre => SugarScale.GramsPerLitre,
        _ => SugarScale.Brix,
    };

    /// <summary>°Brix of a sugar value on the column's scale, without range checks (the caller checks ranges).</summary>
    public static double ToBrix(double value, ColumnUnit unit) => unit switch
    {
        ColumnUnit.SpecificGravity => SugarScales.BrixFromSpecificGravity(value),
        ColumnUnit.Baume => SugarScales.BrixFromSpecificGravity(SugarScales.SpecificGravityFromBaume(value)),
        ColumnUnit.Oechsle => SugarScales.BrixFromSpecificGravity(SugarScales.SpecificGravityFromOechsle(value)),
        ColumnUnit.SugarGramsPerLitre => OivMustTable.BrixFromSugarGramsPerLitre(value),
        _ => value,
    };

    /// <summary>The value in the field's own unit (% v/v, °C, L, kg); other units pass through.</summary>
    public static double ToFieldUnit(double value, ColumnUnit unit) => unit switch
    {
        ColumnUnit.AlcoholGramsPerLitre => value / (10.0 * AlcoholContent.EthanolDensity20C),
        ColumnUnit.Fahrenheit => (value - 32.0) * 5.0 / 9.0,
        ColumnUnit.Hectolitre => value * 100.0,
        ColumnUnit.UsGallon => value * LitresPerUsGallon,
        ColumnUnit.Gram => value / 1000.0,
        ColumnUnit.Pound => value * KilogramsPerPound,
        ColumnUnit.GramsPer100Millilitre => value * 10.0,
        _ => value,
    };

    /// <summary>The unit assumed when a header states none.</summary>
    public static ColumnUnit DefaultFor(FieldKind kind) => kind switch
    {
        FieldKind.Sugar => ColumnUnit.Brix,
        FieldKind.Alcohol => ColumnUnit.PercentVolume,
        FieldKind.Temperature => ColumnUnit.Celsius,
        FieldKind.Volume => ColumnUnit.Litre,
        FieldKind.Mass => ColumnUnit.Kilogram,
        _ => ColumnUnit.None,
    };
}
