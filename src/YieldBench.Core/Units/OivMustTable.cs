namespace YieldBench.Core.Units;

/// <summary>
/// Fermentable sugar of a must from its °Brix, by the OIV must table (OIV-MA-AS2-02, Table II, as reproduced in the
/// French Arrêté du 14 septembre 2011 relatif aux réfractomètres, Annexe IV). Between the rows held here the table is
/// interpolated with a monotone piecewise-cubic (Fritsch–Carlson) curve. Outside 10–30 °Brix the sugar is the total
/// dissolved solids (°Brix × density) times the sugar share of solids at the nearest table edge — a stated
/// approximation, reported as a warning by callers (see docs/methods.md, "Sugar model").
/// </summary>
public static class OivMustTable
{
    /// <summary>Lowest °Brix the table covers.</summary>
    public const double MinBrix = 10.0;

    /// <summary>Highest °Brix the table covers.</summary>
    public const double MaxBrix = 30.0;

    /// <summary>Grams of sugar per litre taken as one % vol of potential alcohol in the OIV and EU convention.</summary>
    public const double SugarGramsPerPercentVolume = 16.83;

    /// <summary>Density of water at 20 °C relative to water at 4 °C (g/mL): SG 20/20 × this = density at 20 °C.</summary>
    public const double WaterDensity20C = 0.99820;

    // (% sucrose by refractometer, must density kg/L at 20 °C, sugar g/L), rows read in the Arrêté annex.
    private static readonly (double Brix, double Density, double SugarGl)[] Rows =
    [
        (10.0, 1.0391, 82.2),
        (15.0, 1.0598, 136.1),
        (20.0, 1.0818, 191.9),
        (22.0, 1.0908, 214.7),
        (24.0, 1.1001, 237.8),
        (25.0, 1.1047, 249.5),
        (26.0, 1.1095, 261.2),
        (28.0, 1.1190, 284.9),
        (30.0, 1.1287, 308.9),
    ];

    private static readonly double[] Slopes = MonotoneSlopes();

    /// <summary>The table rows this build holds (°Brix, must density kg/L, sugar g/L).</summary>
    public static IReadOnlyList<(double Brix, double Density, double SugarGl)> TableRows => Rows;

    /// <summary>True when <paramref name="brix"/> lies inside the table's 10–30 °Brix span.</summary>
    public static bool Covers(double brix) => brix is >= MinBrix and <= MaxBrix;

    /// <summary>Fermentable sugar (g/L) for a must of the given °Brix; never negative.</summary>
    public static double SugarGramsPerLitre(double brix)
    {
        if (brix <= 0)
        {
            return 0;
        }

        if (brix < MinBrix)
        {
            return TotalSolidsGramsPerLitre(brix) * (Rows[0].SugarGl / TotalSolidsGramsPerLitre(Rows[0].Brix));
        }

        if (brix > MaxBrix)
        {
            var last = Rows[^1];
            return TotalSolidsGramsPerLitre(brix) * (last.SugarGl / TotalSolidsGramsPerLitre(last.Brix));
        }

        int i = Array.FindLastIndex(Rows, r => r.Brix <= brix);
        if (i == Rows.Length - 1)
        {
            return Rows[i].SugarGl;
        }

        var (x0, _, y0) = Rows[i];
        var (x1, _, y1) = Rows[i + 1];
        double h = x1 - x0;
        double t = (brix - x0) / h;
        double t2 = t * t, t3 = t2 * t;
        return ((2 * t3) - (3 * t2) + 1) * y0
            + (t3 - (2 * t2) + t) * h * Slopes[i]
            + ((-2 * t3) + (3 * t2)) * y1
            + (t3 - t2) * h * Slopes[i + 1];
    }

    /// <summary>Potential alcohol (% vol) by the OIV/EU convention: sugar g/L ÷ 16.83.</summary>
    public static double PotentialAlcohol(double brix) => SugarGramsPerLitre(brix) / SugarGramsPerPercentVolume;

    /// <summary>°Brix whose fermentable sugar is <paramref name="sugarGl"/> (bisection on the monotone table).</summary>
    public static double BrixFromSugarGramsPerLitre(double sugarGl)
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

    /// <summary>Total dissolved solids in g/L: °Brix × 10 × density at 20 °C (SG 20/20 × 0.99820).</summary>
    public static double TotalSolidsGramsPerLitre(double brix) =>
        brix * 10.0 * SugarScales.SpecificGravityFromBrix(brix) * WaterDensity20C;

    private static double[] MonotoneSlopes()
    {
        int n = Rows.Length;
        var d = new double[n - 1];
        for (int i = 0; i < n - 1; i++)
        {
            d[i] = (Rows[i + 1].SugarGl - Rows[i].SugarGl) / (Rows[i + 1].Brix - Rows[i].Brix);
        }

        var m = new double[n];
        m[0] = d[0];
        m[n - 1] = d[n - 2];
        for (int i = 1; i < n - 1; i++)
        {
            if (d[i - 1] * d[i] <= 0)
            {
                m[i] = 0;
            }
            else
            {
                // Fritsch–Carlson weighted harmonic mean keeps the curve monotone between rows.
                double h0 = Rows[i].Brix - Rows[i - 1].Brix, h1 = Rows[i + 1].Brix - Rows[i].Brix;
                double w1 = (2 * h1) + h0, w2 = h1 + (2 * h0);
                m[i] = (w1 + w2) / ((w1 / d[i - 1]) + (w2 / d[i]));
            }
        }

        return m;
    }
}
