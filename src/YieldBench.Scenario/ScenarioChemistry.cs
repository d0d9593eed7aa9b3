namespace YieldBench.Scenario;

/// <summary>
/// The invented world's own chemistry: how its musts turn sugar readings into grams of sugar, and how water and sugar
/// additions change them. It is frozen here, apart from the tool's Core, so that refining the tool's models never
/// changes the demo files; the tool is then checked against a world it did not define. The relations are the published
/// ones, in their simplest form:
/// <list type="bullet">
/// <item>SG 20/20 from °Brix: inverse (Newton's method) of the cubic fitted to the NBS sucrose table,
/// °Bx = ((182.4601·S − 775.6821)·S + 1262.7794)·S − 669.5622.</item>
/// <item>Fermentable sugar from °Brix: the OIV must table rows (OIV-MA-AS2-02 Table II as in the French Arrêté du
/// 14 septembre 2011, Annexe IV) joined by a Fritsch–Carlson monotone cubic on g/L; outside 10–30 °Brix, the total
/// solids times the sugar share of solids at the nearest table edge.</item>
/// <item>Additions: a mass balance on dissolved solids; added sucrose counts one-for-one as °Brix solids when the
/// must's °Brix after the addition is formed. The fermentable sugar the yeast meet is the must's own sugar plus the
/// sucrose's, which inverts to 2 × 180.156 / 342.297 = 1.0526 times its mass of glucose and fructose, spread over the
/// volume after (mass over the density at the solids °Brix after inversion): a chaptalized or watered must holds the
/// non-sugar solids of the must it came from, not those of a natural must of its new °Brix.</item>
/// </list>
/// </summary>
public static class ScenarioChemistry
{
    /// <summary>Density of water at 20 °C, kg/L.</summary>
    public const double WaterDensity20C = 0.99820;

    private static readonly (double Brix, double SugarGl)[] Rows =
    [
        (10.0, 82.2), (15.0, 136.1), (20.0, 191.9), (22.0, 214.7), (24.0, 237.8), (25.0, 249.5), (26.0, 261.2), (28.0, 284.9), (30.0, 308.9),
    ];

    private static readonly double[] Slopes = MonotoneSlopes();

    /// <summary>°Brix from apparent SG 20/20 (the NBS-fitted cubic).</summary>
    public static double BrixFromSpecificGravity(double sg) =>
        (((182.4601 * sg) - 775.6821) * sg + 1262.7794) * sg - 669.5622;

    /// <summary>Apparent SG 20/20 from °Brix (Newton's method on the cubic, from the 0.004-per-°Brix rule of thumb).</summary>
    public static double SpecificGravityFromBrix(double brix)
    {
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

    /// <summary>Fermentable sugar of a must, g/L.</summary>
    public static double SugarGramsPerLitre(double brix)
    {
        if (brix <= 0)
        {
            return 0;
        }

        if (brix < Rows[0].Brix)
        {
            return TotalSolidsGramsPerLitre(brix) * (Rows[0].SugarGl / TotalSolidsGramsPerLitre(Rows[0].Brix));
        }

        if (brix > Rows[^1].Brix)
        {
            return TotalSolidsGramsPerLitre(brix) * (Rows[^1].SugarGl / TotalSolidsGramsPerLitre(Rows[^1].Brix));
        }

        int i = Array.FindLastIndex(Rows, r => r.Brix <= brix);
        if (i == Rows.Length - 1)
        {
            return Rows[i].SugarGl;
        }

        var (x0, y0) = Rows[i];
        var (x1, y1) = Rows[i + 1];
        double h = x1 - x0;
        double t = (brix - x0) / h;
        double t2 = t * t, t3 = t2 * t;
        return ((2 * t3) - (3 * t2) + 1) * y0
            + (t3 - (2 * t2) + t) * h * Slopes[i]
            + ((-2 * t3) + (3 * t2)) * y1
            + (t3 - t2) * h * Slopes[i + 1];
    }

    /// <summary>°Brix of a must after adding <paramref name="waterL"/> L of water and <paramref name="sucroseKg"/> kg of sucrose to <paramref name="volumeL"/> L at <paramref name="brix"/>.</summary>
    public static double BrixAfterAdditions(double brix, double volumeL, double waterL, double sucroseKg)
    {
        if (waterL <= 0 && sucroseKg <= 0)
        {
            return brix;
        }

        double mass = volumeL * SpecificGravityFromBrix(brix) * WaterDensity20C;
        double solids = mass * brix / 100.0;
        return 100.0 * (solids + sucroseKg) / (mass + (WaterDensity20C * waterL) + sucroseKg);
    }

    /// <summary>
    /// Fermentable sugar (g/L) of a must of <paramref name="volumeL"/> L at <paramref name="brix"/> after adding
    /// <paramref name="waterL"/> L of water and <paramref name="sucroseKg"/> kg of sucrose (inverted).
    /// </summary>
    public static double SugarAfterAdditions(double brix, double volumeL, double waterL, double sucroseKg)
    {
        if (waterL <= 0 && sucroseKg <= 0)
        {
            return SugarGramsPerLitre(brix);
        }

        const double hexosePerSucrose = 2 * 180.156 / 342.297;
        double mass = volumeL * SpecificGravityFromBrix(brix) * WaterDensity20C;
        double solids = mass * brix / 100.0;
        double massAfter = mass + (WaterDensity20C * waterL) + sucroseKg;
        double solidsBrix = 100.0 * (solids + (hexosePerSucrose * sucroseKg)) / massAfter;
        double volumeAfter = massAfter / (SpecificGravityFromBrix(solidsBrix) * WaterDensity20C);
        return ((SugarGramsPerLitre(brix) * volumeL) + (1000.0 * hexosePerSucrose * sucroseKg)) / volumeAfter;
    }

    /// <summary>Water (L) that brings <paramref name="volumeL"/> L at <paramref name="brix"/> down to <paramref name="targetBrix"/> (0 when already at or below).</summary>
    public static double WaterForTarget(double brix, double volumeL, double targetBrix)
    {
        if (targetBrix >= brix)
        {
            return 0;
        }

        double mass = volumeL * SpecificGravityFromBrix(brix) * WaterDensity20C;
        double solids = mass * brix / 100.0;
        return ((100.0 * solids / targetBrix) - mass) / WaterDensity20C;
    }

    /// <summary>Sucrose (kg) that brings <paramref name="volumeL"/> L at <paramref name="brix"/> up to <paramref name="targetBrix"/> (the same balance solved for sucrose).</summary>
    public static double SucroseForTarget(double brix, double volumeL, double targetBrix)
    {
        double mass = volumeL * SpecificGravityFromBrix(brix) * WaterDensity20C;
        double solids = mass * brix / 100.0;
        return ((targetBrix * mass) - (100 * solids)) / (100 - targetBrix);
    }

    private static double TotalSolidsGramsPerLitre(double brix) => brix * 10.0 * SpecificGravityFromBrix(brix) * WaterDensity20C;

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
