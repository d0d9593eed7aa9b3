using YieldBench.Core.Units;

namespace YieldBench.Core.Conversion;

/// <summary>Fermentable sugar of a must from its °Brix, by the chosen <see cref="SugarRule"/>.</summary>
public sealed record SugarModel(SugarRule Rule)
{
    /// <summary>Non-sugar solids allowance of the alternative rule, °Brix.</summary>
    public const double NonSugarBrix = 2.1;

    /// <summary>Sugar per % v/v of the alternative rule: 1.7 % w/v, that is 17 g/L.</summary>
    public const double AlternativeSugarGramsPerPercentVolume = 17.0;

    /// <summary>The default model: the OIV must table.</summary>
    public static SugarModel Default { get; } = new(SugarRule.OivTable);

    /// <summary>The alternative rule: sugar % w/v = (°Brix − 2.1) × density.</summary>
    public static SugarModel BrixMinusNonSugar { get; } = new(SugarRule.BrixMinusNonSugar);

    /// <summary>
    /// Grams of sugar per litre the rule takes as one % v/v of potential alcohol: 16.83 for the OIV table (EU
    /// convention), 17.0 for the alternative rule (its own 1.7 % w/v per % v/v).
    /// </summary>
    public double SugarGramsPerPercentVolume => Rule switch
    {
        SugarRule.OivTable => OivMustTable.SugarGramsPerPercentVolume,
        SugarRule.BrixMinusNonSugar => AlternativeSugarGramsPerPercentVolume,
        _ => throw new ArgumentOutOfRangeException(nameof(Rule), Rule, "Unknown sugar rule."),
    };

    /// <summary>Fermentable sugar, g/L (never negative), for a must of <paramref name="brix"/> °Brix.</summary>
    public double SugarGramsPerLitre(double brix) => Rule switch
    {
        SugarRule.OivTable => OivMustTable.SugarGramsPerLitre(brix),

        // % w/v is g per 100 mL, so g/L = 10 × (°Brix − 2.1) × density (g/mL at 20 °C).
        SugarRule.BrixMinusNonSugar => Math.Max(0, (brix - NonSugarBrix) * 10.0 * SugarScales.DensityFromBrix(brix)),
        _ => throw new ArgumentOutOfRangeException(nameof(Rule), Rule, "Unknown sugar rule."),
    };

    /// <summary>
    /// Potential alcohol, % v/v: sugar g/L ÷ <see cref="SugarGramsPerPercentVolume"/>. An estimate for planning, never a
    /// label statement: a label follows a lab analysis of the wine and the local rules.
    /// </summary>
    public double PotentialAlcohol(double brix) => SugarGramsPerLitre(brix) / SugarGramsPerPercentVolume;

    /// <summary>
    /// The °Brix whose fermentable sugar under this rule is <paramref name="sugarGl"/> (inverse of
    /// <see cref="SugarGramsPerLitre"/>; 0 g/L gives the °Brix where the rule's sugar starts).
    /// </summary>
    public double BrixEquivalent(double sugarGl) =>
        OivMustTable.InverseOfRising(SugarGramsPerLitre, sugarGl, 0, SugarReading.MaxBrix);

    /// <summary>True when the rule is outside its published span for this °Brix and an approximation is used.</summary>
    public bool IsExtrapolated(double brix) => Rule == SugarRule.OivTable && !OivMustTable.Covers(brix);
}
