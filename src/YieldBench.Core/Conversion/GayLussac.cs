namespace YieldBench.Core.Conversion;

/// <summary>
/// Gay-Lussac stoichiometry of alcoholic fermentation: C6H12O6 → 2 C2H5OH + 2 CO2.
/// Molar masses from standard atomic weights (C 12.011, H 1.008, O 15.999).
/// </summary>
public static class GayLussac
{
    /// <summary>Molar mass of glucose/fructose, g/mol.</summary>
    public const double HexoseMolarMass = 180.156;

    /// <summary>Molar mass of ethanol, g/mol.</summary>
    public const double EthanolMolarMass = 46.069;

    /// <summary>Molar mass of carbon dioxide, g/mol.</summary>
    public const double CarbonDioxideMolarMass = 44.009;

    /// <summary>Molar mass of sucrose (C12H22O11), g/mol.</summary>
    public const double SucroseMolarMass = 342.297;

    /// <summary>
    /// Grams of hexose (glucose + fructose) formed per gram of sucrose inverted: C12H22O11 + H2O → 2 C6H12O6,
    /// 2 × 180.156 / 342.297 = 1.0526.
    /// </summary>
    public static double HexosePerSucrose => 2 * HexoseMolarMass / SucroseMolarMass;

    /// <summary>Grams of ethanol per gram of hexose fermented in theory: 2 × 46.069 / 180.156 = 0.5114.</summary>
    public static double EthanolMassYield => 2 * EthanolMolarMass / HexoseMolarMass;

    /// <summary>Grams of CO2 per gram of hexose fermented in theory: 2 × 44.009 / 180.156 = 0.4886.</summary>
    public static double CarbonDioxideMassYield => 2 * CarbonDioxideMolarMass / HexoseMolarMass;

    /// <summary>Sugar (g/L) that yields 1 % v/v of ethanol in theory: 7.8924 / 0.5114 = 15.43 g/L.</summary>
    public static double TheoreticalSugarPerPercentVolume =>
        10.0 * Units.AlcoholContent.EthanolDensity20C / EthanolMassYield;
}
