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

    /// <summary>Kilolitre (1000 L), as large tanks are sized ("5 kL").</summary>
    Kilolitre,
    UsGallon,
    Kilogram,
    Gram,
    Pound,

    /// <summary>Residual sugar written as a percentage, g per 100 mL (× 10 → g/L).</summary>
    GramsPer100Millilitre,

    /// <summary>Specific gravity written in thousandths, as many cellars note must density ("1090" for SG 1.090).</summary>
    GravityThousandths,

    /// <summary>Must sugar written as potential alcohol, % vol at 16.83 g/L of sugar per % vol (the OIV/EU convention).</summary>
    PotentialAlcohol,

    /// <summary>°KMW (°Babo): only a header or a cell's unit says so, as its values overlap °Brix.</summary>
    Kmw,
}

/// <summary>Unit labels and conversions to the unit each field is held in.</summary>
internal static class ColumnUnits
{
    /// <summary>US liquid gallon in litres (exact: 231 in³, NIST Handbook 44 Appendix C).</summary>
    public const double LitresPerUsGallon = 3.785411784;

    /// <summary>Avoirdupois pound in kilograms (exact, international yard and pound agreement of 1959).</summary>
    public const double KilogramsPerPound = 0.45359237;

    /// <summary>The unit's label in messages and the mapping table; sugar scales take Core's one label.</summary>
    public static string Label(ColumnUnit unit) => unit switch
    {
        ColumnUnit.Brix or ColumnUnit.SpecificGravity or ColumnUnit.Baume or ColumnUnit.Oechsle or ColumnUnit.SugarGramsPerLitre or ColumnUnit.Kmw => SugarScales.Label(Scale(unit)),
        ColumnUnit.PercentVolume => "% v/v",
        ColumnUnit.AlcoholGramsPerLitre => "g/L ethanol",
        ColumnUnit.Celsius => "°C",
        ColumnUnit.Fahrenheit => "°F",
        ColumnUnit.Litre => "L",
        ColumnUnit.Hectolitre => "hL",
        ColumnUnit.Kilolitre => "kL",
        ColumnUnit.UsGallon => "US gal",
        ColumnUnit.Kilogram => "kg",
        ColumnUnit.Gram => "g",
        ColumnUnit.Pound => "lb",
        ColumnUnit.GramsPer100Millilitre => "g/100 mL",
        ColumnUnit.GravityThousandths => "SG × 1000",
        ColumnUnit.PotentialAlcohol => "% vol potential",
        _ => "",
    };

    public static SugarScale Scale(ColumnUnit unit) => unit switch
    {
        ColumnUnit.SpecificGravity or ColumnUnit.GravityThousandths => SugarScale.SpecificGravity,
        ColumnUnit.Baume => SugarScale.Baume,
        ColumnUnit.Oechsle => SugarScale.Oechsle,
        ColumnUnit.Kmw => SugarScale.Kmw,
        ColumnUnit.SugarGramsPerLitre or ColumnUnit.PotentialAlcohol => SugarScale.GramsPerLitre,
        _ => SugarScale.Brix,
    };

    /// <summary>The value in the field's own unit (% v/v, °C, L, kg); other units pass through.</summary>
    public static double ToFieldUnit(double value, ColumnUnit unit) => unit switch
    {
        ColumnUnit.AlcoholGramsPerLitre => value / (10.0 * AlcoholContent.EthanolDensity20C),
        ColumnUnit.Fahrenheit => (value - 32.0) * 5.0 / 9.0,
        ColumnUnit.Hectolitre => value * 100.0,
        ColumnUnit.Kilolitre => value * 1000.0,
        ColumnUnit.UsGallon => value * LitresPerUsGallon,
        ColumnUnit.Gram => value / 1000.0,
        ColumnUnit.Pound => value * KilogramsPerPound,
        ColumnUnit.GramsPer100Millilitre => Math.Round(value * 10.0, 10), // drops the binary error of × 10 (0.09 → 0.9, not 0.8999…)
        _ => value,
    };

    /// <summary>A sugar value in the number its scale reads (SG for SG × 1000, g/L for potential alcohol); other units pass through.</summary>
    public static double OnScale(double value, ColumnUnit unit) => unit switch
    {
        ColumnUnit.GravityThousandths => value / 1000.0,
        ColumnUnit.PotentialAlcohol => value * OivMustTable.SugarGramsPerPercentVolume,
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
