namespace YieldBench.Core.Units;

/// <summary>One published row of the OIV must table.</summary>
/// <param name="Brix">Refractometric % sucrose by mass at 20 °C (°Brix).</param>
/// <param name="DensityKgPerL">Must density at 20 °C, kg/L, as printed.</param>
/// <param name="SugarGl">Sugar of the must, g/L, as printed.</param>
/// <param name="PotentialAlcoholPercent">Potential alcohol % vol at 16.83 g/L per % vol, as printed.</param>
public readonly record struct OivMustRow(double Brix, double DensityKgPerL, double SugarGl, double PotentialAlcoholPercent);

/// <summary>
/// Fermentable sugar of a must from its °Brix, by the OIV must table (OIV-MA-AS2-02, Table II, as reproduced in the
/// French Arrêté du 14 septembre 2011 relatif aux réfractomètres, Annexe IV): its sugar column, 10.0–30.0 °Brix in
/// 0.1 steps, embedded as <c>Units/oiv-must-table.csv</c> with its source. Between rows the sugar is interpolated
/// linearly (the curve bends so little that over 0.1 °Brix the chord is within 0.001 g/L of it, far inside the print's
/// rounding of ±0.05 g/L). Outside 10–30 °Brix the non-sugar solids (total solids − sugar, g/L) are held at the
/// nearest edge row's value — a stated approximation that callers report as a warning.
/// </summary>
public static class OivMustTable
{
    /// <summary>Lowest °Brix the table covers.</summary>
    public const double MinBrix = 10.0;

    /// <summary>Highest °Brix the table covers.</summary>
    public const double MaxBrix = 30.0;

    /// <summary>Step of the table, °Brix.</summary>
    public const double StepBrix = 0.1;

    /// <summary>Grams of sugar per litre taken as one % vol of potential alcohol in the OIV and EU convention.</summary>
    public const double SugarGramsPerPercentVolume = 16.83;

    /// <summary>Density of water at 20 °C, kg/L (g/mL); the same constant as <see cref="SugarScales.WaterDensity20C"/>.</summary>
    public const double WaterDensity20C = SugarScales.WaterDensity20C;

    /// <summary>Name of the embedded table.</summary>
    internal const string ResourceName = "YieldBench.Core.Units.oiv-must-table.csv";

    // Rows printed in full in the Arrêté annex (% sucrose, must density kg/L, sugar g/L, % vol at 16.83 g/L): the
    // check values the embedded column is held to, and the table's must densities.
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

    private static readonly double[] Sugar = ReadSugarColumn();

    // Non-sugar solids of the edge rows, held outside the table.
    private static readonly double NonSugarLow = TotalSolidsGramsPerLitre(MinBrix) - Sugar[0];
    private static readonly double NonSugarHigh = TotalSolidsGramsPerLitre(MaxBrix) - Sugar[^1];

    /// <summary>The rows printed in full (with density and potential alcohol), in rising °Brix.</summary>
    public static IReadOnlyList<OivMustRow> Table => Rows;

    /// <summary>The whole sugar column as embedded: (°Brix, sugar g/L), 10.0–30.0 in 0.1 steps.</summary>
    public static IReadOnlyList<(double Brix, double SugarGl)> SugarColumn { get; } =
        Sugar.Select((g, i) => (Math.Round(MinBrix + (i * StepBrix), 1), g)).ToArray();

    /// <summary>True when <paramref name="brix"/> lies inside the table's 10–30 °Brix span.</summary>
    public static bool Covers(double brix) => brix is >= MinBrix and <= MaxBrix;

    /// <summary>
    /// Non-sugar solids of a must, g/L: total sucrose-equivalent solids minus the table's sugar inside 10–30 °Brix;
    /// outside, the edge row's value (21.6 g/L below, 29.2 g/L above).
    /// </summary>
    public static double NonSugarSolidsGramsPerLitre(double brix)
    {
        if (double.IsNaN(brix))
        {
            return double.NaN;
        }

        return brix < MinBrix ? NonSugarLow : brix > MaxBrix ? NonSugarHigh : TotalSolidsGramsPerLitre(brix) - TableSugar(brix);
    }

    /// <summary>
    /// Fermentable sugar (g/L) for a must of the given °Brix; never negative. Exact at every row of the table.
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

        return Covers(brix) ? TableSugar(brix) : Math.Max(0, TotalSolidsGramsPerLitre(brix) - NonSugarSolidsGramsPerLitre(brix));
    }

    /// <summary>Linear interpolation in the sugar column (10–30 °Brix).</summary>
    private static double TableSugar(double brix)
    {
        double position = (brix - MinBrix) / StepBrix;
        int i = Math.Clamp((int)Math.Floor(position + 1e-9), 0, Sugar.Length - 2);
        double f = position - i;
        return f <= 1e-9 ? Sugar[i] : Sugar[i] + (f * (Sugar[i + 1] - Sugar[i]));
    }

    /// <summary>
    /// Reads the embedded column: lines starting with '#' are the source note, then the header <c>brix,sugar_gl</c>,
    /// then 201 rows from 10.0 to 30.0 °Brix in 0.1 steps. A build whose file breaks that shape fails at once.
    /// </summary>
    private static double[] ReadSugarColumn()
    {
        using var stream = typeof(OivMustTable).Assembly.GetManifestResourceStream(ResourceName)
            ?? throw new InvalidOperationException($"The embedded OIV must table {ResourceName} is missing from the build.");
        using var reader = new StreamReader(stream);
        var values = new List<double>(201);
        bool header = false;
        while (reader.ReadLine() is { } line)
        {
            if (line.Length == 0 || line.StartsWith('#'))
            {
                continue;
            }

            if (!header)
            {
                header = line == "brix,sugar_gl" ? true : throw new InvalidOperationException($"The OIV must table's header is '{line}', not 'brix,sugar_gl'.");
                continue;
            }

            var parts = line.Split(',');
            double brix = double.Parse(parts[0], System.Globalization.CultureInfo.InvariantCulture);
            double expected = MinBrix + (values.Count * StepBrix);
            if (parts.Length != 2 || Math.Abs(brix - expected) > 1e-9)
            {
                throw new InvalidOperationException($"The OIV must table's row '{line}' is not the row for {expected:0.0} °Brix.");
            }

            values.Add(double.Parse(parts[1], System.Globalization.CultureInfo.InvariantCulture));
        }

        return values.Count == 201 ? values.ToArray() : throw new InvalidOperationException($"The OIV must table holds {values.Count} rows, not 201.");
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
