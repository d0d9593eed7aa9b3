using YieldBench.Core.Units;

namespace YieldBench.Core.Kinetics;

/// <summary>
/// The temperature rise the remaining sugar could still cause if it fermented with no heat removed (adiabatic):
/// ΔT = (sugar g/L ÷ 180.16 g/mol) × ΔH kJ/mol ÷ (must density kg/L × cp kJ/(kg·K)). The heat of fermentation and the
/// must's heat capacity live here and in <see cref="KineticsSettings"/>, for the kinetics review and the forecast alike.
/// Sources in docs/methods.md ("Heat").
/// </summary>
public static class FermentationHeat
{
    /// <summary>Molar mass of glucose and fructose (C6H12O6), g/mol.</summary>
    public const double HexoseMolarMass = 180.16;

    /// <summary>Heat of fermentation, kJ per mole of hexose: about 24 kcal, Colombié, Malherbe &amp; Sablayrolles 2007.</summary>
    public const double DefaultHeatOfFermentationKjPerMol = 100.4;

    /// <summary>Temperature at which the must's heat capacity is evaluated, °C (the component curves change by under 0.1 % over 10–35 °C).</summary>
    public const double HeatCapacityReferenceC = 20.0;

    /// <summary>
    /// Specific heat of a grape must, kJ/(kg·K), by the composition model of Choi &amp; Okos (1986): the mass-weighted
    /// specific heats of its water and its dissolved solids, the solids taken as carbohydrate (sugars, with the acids
    /// alongside) at the mass fraction its °Brix gives:
    /// cp = (1 − x)·cp_water(T) + x·cp_carbohydrate(T), x = °Brix/100 (clamped to 0–0.6), with
    /// cp_water = 4.1762 − 9.0864·10⁻⁵ T + 5.4731·10⁻⁶ T² and cp_carbohydrate = 1.5488 + 1.9625·10⁻³ T − 5.9399·10⁻⁶ T²
    /// (T in °C). At 20 °C: 3.66 at 20 °Brix, 3.56 at 24, 3.50 at 26, 4.18 for water — lower than the 3.9 used before,
    /// so the rise a must could still make without cooling is larger (sources and checks in docs/methods.md, "Heat").
    /// </summary>
    public static double MustHeatCapacityKjPerKgK(double brix, double temperatureC = HeatCapacityReferenceC)
    {
        double x = Math.Clamp(brix / 100.0, 0, 0.6);
        double t = temperatureC;
        double water = 4.1762 - (9.0864e-5 * t) + (5.4731e-6 * t * t);
        double carbohydrate = 1.5488 + (1.9625e-3 * t) - (5.9399e-6 * t * t);
        return ((1 - x) * water) + (x * carbohydrate);
    }

    /// <summary>Must density at 20 °C, kg/L, from a sugar reading: SG 20/20 × 0.99820.</summary>
    public static double MustDensityKgPerL(SugarReading sugar) => sugar.SpecificGravity * OivMustTable.WaterDensity20C;

    /// <summary>
    /// Adiabatic temperature rise, K, if <paramref name="sugar"/>'s fermentable sugar (OIV table, g/L; 0 at or below
    /// 0 °Brix) all fermented. Must density is taken from the same reading.
    /// </summary>
    public static double PotentialRiseK(SugarReading sugar, double heatKjPerMol = DefaultHeatOfFermentationKjPerMol, double? cpKjPerKgK = null) =>
        PotentialRiseK(sugar.GramsPerLitre, MustDensityKgPerL(sugar), heatKjPerMol, cpKjPerKgK ?? MustHeatCapacityKjPerKgK(sugar.Brix));

    /// <summary>Adiabatic temperature rise, K, of <paramref name="sugarGl"/> g/L of hexose in a must of the given density.</summary>
    /// <param name="sugarGl">Fermentable sugar remaining, g/L (≥ 0).</param>
    /// <param name="densityKgPerL">Must density, kg/L (about 0.99–1.13).</param>
    /// <param name="heatKjPerMol">Heat of fermentation, kJ/mol.</param>
    /// <param name="cpKjPerKgK">Must specific heat, kJ/(kg·K).</param>
    public static double PotentialRiseK(double sugarGl, double densityKgPerL, double heatKjPerMol, double cpKjPerKgK)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(sugarGl);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(densityKgPerL);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(cpKjPerKgK);
        double kjPerL = sugarGl / HexoseMolarMass * heatKjPerMol;
        return kjPerL / (densityKgPerL * cpKjPerKgK);
    }
}
