using YieldBench.Core.Units;

namespace YieldBench.Core.Conversion;

/// <summary>Fermentable sugar of a must from its °Brix, by the chosen <see cref="SugarRule"/>.</summary>
public sealed record SugarModel(SugarRule Rule)
{
    /// <summary>Non-sugar solids allowance of the alternative rule, °Brix.</summary>
    public const double NonSugarBrix = 2.1;

    /// <summary>The default model: the OIV must table.</summary>
    public static SugarModel Default { get; } = new(SugarRule.OivTable);

    /// <summary>Fermentable sugar, g/L (never negative).</summary>
    public double SugarGramsPerLitre(double brix) => Rule switch
    {
        SugarRule.OivTable => OivMustTable.SugarGramsPerLitre(brix),
        SugarRule.BrixMinusNonSugar => Math.Max(0, (brix - NonSugarBrix) * 10.0 * SugarScales.SpecificGravityFromBrix(brix) * OivMustTable.WaterDensity20C),
        _ => throw new ArgumentOutOfRangeException(nameof(Rule), Rule, "Unknown sugar rule."),
    };

    /// <summary>°Brix-equivalent of a residual sugar content (inverse of <see cref="SugarGramsPerLitre"/>).</summary>
    public double BrixEquivalent(double sugarGl)
    {
        if (sugarGl <= 0)
        {
            return 0;
        }

        double lo = 0, hi = SugarReading.MaxBrix;
        for (int i = 0; i < 100 && hi - lo > 1e-12; i++)
        {
            double mid = 0.5 * (lo + hi);
            if (SugarGramsPerLitre(mid) < sugarGl)
            {
                lo = mid;
            }
            else
            {
                hi = mid;
            }
        }

        return 0.5 * (lo + hi);
    }

    /// <summary>True when the rule is outside its published span for this °Brix and an approximation is used.</summary>
    public bool IsExtrapolated(double brix) => Rule == SugarRule.OivTable && !OivMustTable.Covers(brix);
}
