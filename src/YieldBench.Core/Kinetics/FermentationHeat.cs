using YieldBench.Core.Units;

namespace YieldBench.Core.Kinetics;

/// <summary>
/// The temperature rise the remaining sugar could still cause if it fermented with no heat removed (adiabatic):
/// ΔT = (sugar g/L ÷ 180.16 g/mol) × ΔH kJ/mol ÷ (must density kg/L × cp kJ/(kg·K)).
/// Sources in docs/methods.md ("Heat").
/// </summary>
public static class FermentationHeat
{
    /// <summary>Molar mass of glucose and fructose (C6H12O6), g/mol.</summary>
    public const double HexoseMolarMass = 180.16;

    /// <summary>Heat of fermentation, kJ per mole of hexose: about 24 kcal, Colombié, Malherbe &amp; Sablayrolles 2007.</summary>
    public const double DefaultHeatOfFermentationKjPerMol = 100.4;

    /// <summary>Specific heat of must, kJ/(kg·K): inside the 3.73–4.02 range for juice-like foods (Geankoplis App. A.4-1).</summary>
    public const double DefaultMustHeatCapacityKjPerKgK = 3.9;

    /// <summary>Must density at 20 °C, kg/L, from a sugar reading: SG 20/20 × 0.99820.</summary>
    public static double MustDensityKgPerL(SugarReading sugar) => sugar.SpecificGravity * OivMustTable.WaterDensity20C;

    /// <summary>
    /// Adiabatic temperature rise, K, if <paramref name="sugar"/>'s fermentable sugar (OIV table, g/L; 0 at or below
    /// 0 °Brix) all fermented. Must density is taken from the same reading.
    /// </summary>
    public static double PotentialRiseK(SugarReading sugar, double heatKjPerMol = DefaultHeatOfFermentationKjPerMol, double cpKjPerKgK = DefaultMustHeatCapacityKjPerKgK) =>
        PotentialRiseK(sugar.GramsPerLitre, MustDensityKgPerL(sugar), heatKjPerMol, cpKjPerKgK);

    /// <summary>Adiabatic temperature rise, K, of <paramref name="sugarGl"/> g/L of hexose in a must of the given density.</summary>
    /// <param name="sugarGl">Fermentable sugar remaining, g/L (≥ 0).</param>
    /// <param name="densityKgPerL">Must density, kg/L (about 0.99–1.13).</param>
    /// <param name="heatKjPerMol">Heat of fermentation, kJ/mol.</param>
    /// <param name="cpKjPerKgK">Must specific heat, kJ/(kg·K).</param>
    public static double PotentialRiseK(double sugarGl, double densityKgPerL, double heatKjPerMol = DefaultHeatOfFermentationKjPerMol, double cpKjPerKgK = DefaultMustHeatCapacityKjPerKgK)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(sugarGl);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(densityKgPerL);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(cpKjPerKgK);
        double kjPerL = sugarGl / HexoseMolarMass * heatKjPerMol;
        return kjPerL / (densityKgPerL * cpKjPerKgK);
    }
}
