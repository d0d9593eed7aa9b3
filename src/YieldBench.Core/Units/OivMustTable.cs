namespace YieldBench.Core.Units;

/// <summary>One published row of the OIV must table.</summary>
/// <param name="Brix">Refractometric % sucrose by mass at 20 °C (°Brix).</param>
/// <param name="DensityKgPerL">Must density at 20 °C, kg/L, as printed.</param>
/// <param name="SugarGl">Sugar of the must, g/L, as printed.</param>
/// <param name="PotentialAlcoholPercent">Potential alcohol % vol at 16.83 g/L per % vol, as printed.</param>
public readonly record struct OivMustRow(double Brix, double DensityKgPerL, double SugarGl, double PotentialAlcoholPercent);

/// <summary>
/// Fermentable sugar of a must from its °Brix, by the OIV must table (OIV-MA-AS2-02, Table II, as reproduced in the
/// French Arrêté du 14 septembre 2011 relatif aux réfractomètres, Annexe IV). Only nine of the table's 201 rows could
/// be read for this build; between them the non-sugar solids (total solids − sugar, g/L) are interpolated with the
/// monotone piecewise-cubic Hermite curve of Fritsch and Carlson (the same curve as scipy's PchipInterpolator), and
/// sugar is total solids minus that. Leave-one-row-out, this reproduces the held-out rows within 0.05 g/L, the
/// table's own rounding (docs/methods.md, "Sugar model").
/// Outside 10–30 °Brix the non-sugar solids are held at the nearest edge row's value — a stated approximation that
/// callers report as a warning.
/// </summary>
public static class OivMustTable
{
    /// <summary>Lowest °Brix the table covers.</summary>
    public const double MinBrix = 10.0;

    /// <summary>Highest °Brix the table covers.</summary>
    public const double MaxBrix = 30.0;

    /// <summary>Grams of sugar per litre taken as one % vol of potential alcohol in the OIV and EU convention.</summary>
    public const double SugarGramsPerPercentVolume = 16.83;

    /// <summary>Density of water at 20 °C, kg/L (g/mL); the same constant as <see cref="SugarScales.WaterDensity20C"/>.</summary>
    public const double WaterDensity20C = SugarScales.WaterDensity20C;

    // Rows read in the Arrêté annex (% sucrose, must density kg/L, sugar g/L, % vol at 16.83 g/L).
    private static readonly OivMustRow[] Rows =
    [
        new(10.0, 1.0391, 82.2, 4.88),
        new(15.0, 1.0598, 136.1, 8.08),
        new(20.0, 1.0818, 191.9, 11.40),
        new(22.0, 1.0908, 214.7, 12.75),
        new(24.0, 1.1001, 237.8, 14.13),
        new(25.0, 1.1047, 249.5, 14.82),
        new(26.0, 1.1095, 261.2, 15.52),
        new(28.0, 1.1190, 284.9, 16.92),
        new(30.0, 1.1287, 308.9, 18.35),
    ];

    private static readonly double[] Knots = Rows.Select(r => r.Brix).ToArray();

    // Non-sugar solids at each row: what the refractometer counts as sucrose-equivalent solids but is not sugar.
    // Interpolating this smooth, slowly rising quantity is far more accurate than interpolating sugar itself
    // (held-out row errors 0.05 g/L against 0.18 g/L).
    private static readonly double[] NonSugar = Rows.Select(r => TotalSolidsGramsPerLitre(r.Brix) - r.SugarGl).ToArray();

    private static readonly MonotoneCubic NonSugarCurve = new(Knots, NonSugar);

    /// <summary>The published rows this build holds, in rising °Brix.</summary>
    public static IReadOnlyList<OivMustRow> Table => Rows;

    /// <summary>The table rows this build holds (°Brix, must density kg/L, sugar g/L).</summary>
    public static IReadOnlyList<(double Brix, double Density, double SugarGl)> TableRows { get; } =
        Rows.Select(r => (r.Brix, r.DensityKgPerL, r.SugarGl)).ToArray();

    /// <summary>True when <paramref name="brix"/> lies inside the table's 10–30 °Brix span.</summary>
    public static bool Covers(double brix) => brix is >= MinBrix and <= MaxBrix;

    /// <summary>
    /// Non-sugar solids of a must, g/L: total sucrose-equivalent solids minus the table's sugar. Interpolated inside
    /// 10–30 °Brix; outside, the edge value (21.6 g/L below, 29.2 g/L above).
    /// </summary>
    public static double NonSugarSolidsGramsPerLitre(double brix)
    {
        if (double.IsNaN(brix))
        {
            return double.NaN;
        }

        return NonSugarCurve.Evaluate(Math.Clamp(brix, MinBrix, MaxBrix));
    }

    /// <summary>
    /// Fermentable sugar (g/L) for a must of the given °Brix; never negative. Exact at the published rows.
    /// Below about 2.1 °Brix the non-sugar allowance exceeds the solids and the result is 0.
    /// </summary>
    public static double SugarGramsPerLitre(double brix)
    {
        if (double.IsNaN(brix))
        {
            return double.NaN;
        }

        if (brix <= 0)
        {
            return 0;
        }

        return Math.Max(0, TotalSolidsGramsPerLitre(brix) - NonSugarSolidsGramsPerLitre(brix));
    }

    /// <summary>Potential alcohol (% vol) by the OIV/EU convention: sugar g/L ÷ 16.83.</summary>
    public static double PotentialAlcohol(double brix) => SugarGramsPerLitre(brix) / SugarGramsPerPercentVolume;

    /// <summary>
    /// The °Brix whose fermentable sugar is <paramref name="sugarGl"/> (Illinois root-finding on the rising curve, to
    /// 1e-11 g/L or 1e-10 °Brix).
    /// 0 g/L gives the °Brix where sugar starts (2.147 °Brix).
    /// </summary>
    public static double BrixFromSugarGramsPerLitre(double sugarGl) =>
        InverseOfRising(SugarGramsPerLitre, sugarGl, 0, SugarReading.MaxBrix);

    /// <summary>
    /// Total dissolved solids of a sucrose solution of this °Brix, g/L: °Brix × 10 × its density at 20 °C
    /// (SG 20/20 × 0.99820, <see cref="SugarScales.DensityFromBrix"/>).
    /// </summary>
    public static double TotalSolidsGramsPerLitre(double brix) => brix * 10.0 * SugarScales.DensityFromBrix(brix);

    /// <summary>
    /// For a non-decreasing f, the point in [lo, hi] where f passes <paramref name="y"/>: the largest x with f(x) ≤ y
    /// (so a flat stretch at y resolves to its upper end); hi when f(hi) &lt; y.
    /// </summary>
    internal static double InverseOfRising(Func<double, double> f, double y, double lo, double hi)
    {
        double fHi = f(hi) - y;
        if (fHi < 0)
        {
            return hi;
        }

        double fLo = f(lo) - y;
        if (y <= 0 || fLo >= 0)
        {
            // A flat stretch at y (no sugar below the non-sugar allowance): plain bisection finds its upper end.
            for (int i = 0; i < 200 && hi - lo > 1e-10; i++)
            {
                double mid = 0.5 * (lo + hi);
                if (f(mid) <= y)
                {
                    lo = mid;
                }
                else
                {
                    hi = mid;
                }
            }

            return hi;
        }

        // Illinois (modified regula falsi): keeps the bracket like bisection, converges superlinearly on the smooth curve.
        int side = 0;
        double x = lo;
        for (int i = 0; i < 200 && hi - lo > 1e-10; i++)
        {
            x = ((lo * fHi) - (hi * fLo)) / (fHi - fLo);
            double fx = f(x) - y;
            if (fx == 0)
            {
                return x;
            }

            if (fx < 0)
            {
                lo = x;
                fLo = fx;
                if (side == -1)
                {
                    fHi *= 0.5;
                }

                side = -1;
            }
            else
            {
                hi = x;
                fHi = fx;
                if (side == 1)
                {
                    fLo *= 0.5;
                }

                side = 1;
            }

            if (Math.Abs(fx) < 1e-11)
            {
                return x;
            }
        }

        return x;
    }
}
