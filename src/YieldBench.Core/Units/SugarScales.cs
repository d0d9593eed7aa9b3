namespace YieldBench.Core.Units;

/// <summary>
/// The raw relations between sugar scales. Each formula's source is in docs/methods.md ("Sugar scales").
/// </summary>
public static class SugarScales
{
    /// <summary>Baumé modulus for liquids heavier than water (SG = 145 / (145 − °Bé)).</summary>
    public const double BaumeModulus = 145.0;

    /// <summary>Density of water at 20 °C, g/mL (998.20 kg/m³).</summary>
    public const double WaterDensity20C = 0.99820;

    /// <summary>Conventional density of air for weighing, g/mL (1.2 kg/m³).</summary>
    public const double AirDensity = 0.0012;

    /// <summary>
    /// Density at 20 °C (g/mL) taken for a liquid of apparent SG 20/20 <paramref name="sg"/>: SG × 0.99820. This
    /// neglects air buoyancy in the apparent SG, which would lower the density by (SG − 1) × 0.0012 g/mL (1.2e-4 g/mL at
    /// 24 °Brix, 0.01 %) — far below the 0.16 % by which a must's density exceeds a sucrose solution's (see
    /// docs/methods.md); the whole project uses this one rule.
    /// </summary>
    public static double DensityFromSpecificGravity(double sg) => sg * WaterDensity20C;

    /// <summary>Apparent SG 20/20 taken for a density at 20 °C in g/mL (inverse of <see cref="DensityFromSpecificGravity"/>).</summary>
    public static double SpecificGravityFromDensity(double density) => density / WaterDensity20C;

    /// <summary>
    /// True SG 20/20 (ratio of densities) of a liquid whose apparent SG 20/20 (ratio of weights in air) is
    /// <paramref name="apparentSg"/>: 1 + (SG − 1)·(1 − ρ_air/ρ_water). For comparing with tables of true SG.
    /// </summary>
    public static double TrueSpecificGravity(double apparentSg) =>
        1.0 + ((apparentSg - 1.0) * (1.0 - (AirDensity / WaterDensity20C)));

    /// <summary>Density at 20 °C (g/mL, equal to kg/L) of a sucrose solution of this °Brix: SG 20/20 × 0.99820.</summary>
    public static double DensityFromBrix(double brix) => DensityFromSpecificGravity(SpecificGravityFromBrix(brix));

    /// <summary>
    /// °Brix from apparent SG 20/20 °C: °Bx = ((182.4601·S − 775.6821)·S + 1262.7794)·S − 669.5622, the cubic fitted
    /// to the NBS sucrose table (RMS 0.0009 °Bx over S 1.00000–1.17874). Below S = 1 it is extrapolated, as hydrometer
    /// scales are, to give the negative °Brix of a finished wine.
    /// </summary>
    public static double BrixFromSpecificGravity(double sg) =>
        (((182.4601 * sg) - 775.6821) * sg + 1262.7794) * sg - 669.5622;

    /// <summary>Apparent SG 20/20 °C from °Brix: the inverse of <see cref="BrixFromSpecificGravity"/> by Newton's method.</summary>
    public static double SpecificGravityFromBrix(double brix)
    {
        // Start from the linear rule of thumb (about 0.004 SG per °Brix) and polish; the cubic is monotone on 0.97–1.25.
        double s = 1.0 + (brix * 0.004);
        for (int i = 0; i < 50; i++)
        {
            double f = BrixFromSpecificGravity(s) - brix;
            double df = ((3 * 182.4601 * s) - (2 * 775.6821)) * s + 1262.7794;
            double step = f / df;
            s -= step;
            if (Math.Abs(step) < 1e-13)
            {
                break;
            }
        }

        return s;
    }

    /// <summary>SG from °Baumé (modulus 145).</summary>
    public static double SpecificGravityFromBaume(double baume) => BaumeModulus / (BaumeModulus - baume);

    /// <summary>°Baumé from SG (modulus 145).</summary>
    public static double BaumeFromSpecificGravity(double sg) => BaumeModulus - (BaumeModulus / sg);

    /// <summary>SG from °Oechsle.</summary>
    public static double SpecificGravityFromOechsle(double oechsle) => 1.0 + (oechsle / 1000.0);

    /// <summary>°Oechsle from SG.</summary>
    public static double OechsleFromSpecificGravity(double sg) => (sg - 1.0) * 1000.0;

    /// <summary>
    /// °Oechsle from °KMW: Oe = KMW·(0.022·KMW + 4.54) (Ambrosi, H., *Wein A bis Z*, Gräfe und Unzer 1994, entry
    /// "Klosterneuburger Mostwaage"; the same relation is printed in hydrometer and refractometer makers' manuals).
    /// The rule of thumb 1 °KMW ≈ 5 °Oe holds near 20 °KMW.
    /// </summary>
    public static double OechsleFromKmw(double kmw) => kmw * ((0.022 * kmw) + 4.54);

    /// <summary>°KMW from °Oechsle: the root of 0.022·k² + 4.54·k − Oe = 0 that is 0 at 0 °Oe.</summary>
    public static double KmwFromOechsle(double oechsle) => (-4.54 + Math.Sqrt((4.54 * 4.54) + (4 * 0.022 * oechsle))) / (2 * 0.022);

    /// <summary>
    /// The short label of a scale, the one every message, data file, sheet and chart prints: °Brix, SG, °Baumé,
    /// °Oechsle, g/L.
    /// </summary>
    public static string Label(SugarScale scale) => scale switch
    {
        SugarScale.Brix => "°Brix",
        SugarScale.SpecificGravity => "SG",
        SugarScale.Baume => "°Baumé",
        SugarScale.Oechsle => "°Oechsle",
        SugarScale.GramsPerLitre => "g/L",
        SugarScale.Kmw => "°KMW",
        _ => throw new ArgumentOutOfRangeException(nameof(scale), scale, "Unknown sugar scale."),
    };
}
