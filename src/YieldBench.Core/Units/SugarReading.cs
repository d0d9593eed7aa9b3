namespace YieldBench.Core.Units;

/// <summary>
/// A must-sugar reading, held internally as °Brix and convertible to every <see cref="SugarScale"/>.
/// Specific gravity is the apparent SG 20/20 °C (what a hydrometer calibrated at 20 °C reads), related to °Brix by the
/// closed form fitted to the NBS sucrose table (see docs/methods.md, "Sugar scales").
/// </summary>
public readonly record struct SugarReading : IComparable<SugarReading>
{
    /// <summary>Lowest °Brix accepted: a finished dry wine reads about −2 to −3 °Brix on a hydrometer.</summary>
    public const double MinBrix = -6.0;

    /// <summary>Highest °Brix accepted: late-harvest and dried-grape musts reach about 40–45 °Brix.</summary>
    public const double MaxBrix = 50.0;

    private SugarReading(double brix) => Brix = brix;

    /// <summary>°Brix (% sucrose by mass).</summary>
    public double Brix { get; }

    /// <summary>Apparent specific gravity 20/20 °C.</summary>
    public double SpecificGravity => SugarScales.SpecificGravityFromBrix(Brix);

    /// <summary>Density at 20 °C, g/mL, of a sucrose solution with this reading: SG × 0.99820.</summary>
    public double Density => SugarScales.DensityFromSpecificGravity(SpecificGravity);

    /// <summary>°Baumé (modulus 145).</summary>
    public double Baume => SugarScales.BaumeFromSpecificGravity(SpecificGravity);

    /// <summary>°Oechsle.</summary>
    public double Oechsle => SugarScales.OechsleFromSpecificGravity(SpecificGravity);

    /// <summary>Fermentable sugar in g/L by the OIV must table (edge non-sugar allowance outside 10–30 °Brix).</summary>
    public double GramsPerLitre => OivMustTable.SugarGramsPerLitre(Brix);

    /// <summary>Makes a reading from °Brix (−6 to 50).</summary>
    public static SugarReading FromBrix(double brix) =>
        new(Check.InRange(brix, MinBrix, MaxBrix, "Sugar", "°Brix"));

    /// <summary>
    /// Lowest specific gravity 20/20 °C accepted: SG at <see cref="MinBrix"/>, rounded inward to 4 decimals (0.9773).
    /// </summary>
    public static double MinSpecificGravity { get; } = Math.Ceiling(SugarScales.SpecificGravityFromBrix(MinBrix) * 1e4) / 1e4;

    /// <summary>Highest specific gravity 20/20 °C accepted: SG at <see cref="MaxBrix"/>, rounded inward (1.2318).</summary>
    public static double MaxSpecificGravity { get; } = Math.Floor(SugarScales.SpecificGravityFromBrix(MaxBrix) * 1e4) / 1e4;

    /// <summary>Lowest °Baumé accepted (the Baumé of <see cref="MinSpecificGravity"/>, rounded inward to 2 decimals).</summary>
    public static double MinBaume { get; } = Math.Ceiling(SugarScales.BaumeFromSpecificGravity(MinSpecificGravity) * 100) / 100;

    /// <summary>Highest °Baumé accepted (the Baumé of <see cref="MaxSpecificGravity"/>, rounded inward).</summary>
    public static double MaxBaume { get; } = Math.Floor(SugarScales.BaumeFromSpecificGravity(MaxSpecificGravity) * 100) / 100;

    /// <summary>Lowest °Oechsle accepted (−22.7).</summary>
    public static double MinOechsle { get; } = Math.Ceiling(SugarScales.OechsleFromSpecificGravity(MinSpecificGravity) * 10) / 10;

    /// <summary>Highest °Oechsle accepted (231.8).</summary>
    public static double MaxOechsle { get; } = Math.Floor(SugarScales.OechsleFromSpecificGravity(MaxSpecificGravity) * 10) / 10;

    /// <summary>Lowest °KMW accepted (the KMW of <see cref="MinOechsle"/>, rounded inward to 2 decimals).</summary>
    public static double MinKmw { get; } = Math.Ceiling(SugarScales.KmwFromOechsle(MinOechsle) * 100) / 100;

    /// <summary>Highest °KMW accepted (the KMW of <see cref="MaxOechsle"/>, rounded inward).</summary>
    public static double MaxKmw { get; } = Math.Floor(SugarScales.KmwFromOechsle(MaxOechsle) * 100) / 100;

    /// <summary>Highest must sugar accepted, g/L: the sugar model at <see cref="MaxBrix"/>, rounded down to 0.1 g/L.</summary>
    public static double MaxGramsPerLitre { get; } = Math.Floor(OivMustTable.SugarGramsPerLitre(MaxBrix) * 10) / 10;

    /// <summary>Makes a reading from apparent specific gravity 20/20 °C (0.9773–1.2318).</summary>
    public static SugarReading FromSpecificGravity(double specificGravity)
    {
        Check.InRange(specificGravity, MinSpecificGravity, MaxSpecificGravity, "Specific gravity (20/20 °C)", string.Empty);
        return new SugarReading(SugarScales.BrixFromSpecificGravity(specificGravity));
    }

    /// <summary>
    /// Makes a reading from a density at 20 °C in g/mL (as an oscillating-cell density meter reports it), through
    /// SG = density ÷ 0.99820 (<see cref="SugarScales.SpecificGravityFromDensity"/>).
    /// </summary>
    public static SugarReading FromDensity(double gramsPerMillilitre)
    {
        double min = Math.Ceiling(SugarScales.DensityFromSpecificGravity(MinSpecificGravity) * 1e4) / 1e4;
        double max = Math.Floor(SugarScales.DensityFromSpecificGravity(MaxSpecificGravity) * 1e4) / 1e4;
        Check.InRange(gramsPerMillilitre, min, max, "Density at 20 °C", "g/mL");
        return new SugarReading(SugarScales.BrixFromSpecificGravity(SugarScales.SpecificGravityFromDensity(gramsPerMillilitre)));
    }

    /// <summary>Makes a reading from °Baumé (modulus 145).</summary>
    public static SugarReading FromBaume(double baume)
    {
        Check.InRange(baume, MinBaume, MaxBaume, "Sugar", "°Baumé");
        return new SugarReading(SugarScales.BrixFromSpecificGravity(SugarScales.SpecificGravityFromBaume(baume)));
    }

    /// <summary>Makes a reading from °Oechsle.</summary>
    public static SugarReading FromOechsle(double oechsle)
    {
        Check.InRange(oechsle, MinOechsle, MaxOechsle, "Sugar", "°Oechsle");
        return new SugarReading(SugarScales.BrixFromSpecificGravity(SugarScales.SpecificGravityFromOechsle(oechsle)));
    }

    /// <summary>Makes a reading from °KMW (°Babo), through °Oechsle.</summary>
    public static SugarReading FromKmw(double kmw)
    {
        Check.InRange(kmw, MinKmw, MaxKmw, "Sugar", "°KMW");
        return new SugarReading(SugarScales.BrixFromSpecificGravity(SugarScales.SpecificGravityFromOechsle(SugarScales.OechsleFromKmw(kmw))));
    }

    /// <summary>
    /// Makes a reading from a must's fermentable sugar in g/L (inverse of the OIV must table): the °Brix whose
    /// sugar is the value. Sugar is 0 up to 2.147 °Brix (non-sugar solids), so 0 g/L reads as 2.147 °Brix.
    /// </summary>
    public static SugarReading FromGramsPerLitre(double gramsPerLitre)
    {
        Check.InRange(gramsPerLitre, 0, MaxGramsPerLitre, "Sugar", "g/L");
        return new SugarReading(OivMustTable.BrixFromSugarGramsPerLitre(gramsPerLitre));
    }

    /// <summary>Makes a reading from a value on the given scale.</summary>
    public static SugarReading From(double value, SugarScale scale) => scale switch
    {
        SugarScale.Brix => FromBrix(value),
        SugarScale.SpecificGravity => FromSpecificGravity(value),
        SugarScale.Baume => FromBaume(value),
        SugarScale.Oechsle => FromOechsle(value),
        SugarScale.GramsPerLitre => FromGramsPerLitre(value),
        SugarScale.Kmw => FromKmw(value),
        _ => throw new ArgumentOutOfRangeException(nameof(scale), scale, "Unknown sugar scale."),
    };

    /// <summary>
    /// °Brix of a value on the given scale by the same relations as the factories, without any range check: for
    /// saying what an out-of-range value would have been. NaN or infinite where a relation has no value.
    /// </summary>
    public static double BrixOf(double value, SugarScale scale) => scale switch
    {
        SugarScale.Brix => value,
        SugarScale.SpecificGravity => SugarScales.BrixFromSpecificGravity(value),
        SugarScale.Baume => SugarScales.BrixFromSpecificGravity(SugarScales.SpecificGravityFromBaume(value)),
        SugarScale.Oechsle => SugarScales.BrixFromSpecificGravity(SugarScales.SpecificGravityFromOechsle(value)),
        SugarScale.GramsPerLitre => OivMustTable.BrixFromSugarGramsPerLitre(value),
        SugarScale.Kmw => SugarScales.BrixFromSpecificGravity(SugarScales.SpecificGravityFromOechsle(SugarScales.OechsleFromKmw(value))),
        _ => throw new ArgumentOutOfRangeException(nameof(scale), scale, "Unknown sugar scale."),
    };

    /// <summary>
    /// Makes a reading from a value on the given scale when its °Brix lies in [<paramref name="minBrix"/>,
    /// <paramref name="maxBrix"/>] (a narrower plausible range than the accepted −6 to 50, such as a starting sugar's
    /// 10 to 40): the value is converted once and checked once. <paramref name="brix"/> is the converted value either
    /// way, so a message can say what the value would have been.
    /// </summary>
    public static bool TryFrom(double value, SugarScale scale, double minBrix, double maxBrix, out SugarReading reading, out double brix)
    {
        brix = BrixOf(value, scale);
        bool inRange = brix >= Math.Max(minBrix, MinBrix) && brix <= Math.Min(maxBrix, MaxBrix);
        reading = inRange ? new SugarReading(brix) : default;
        return inRange;
    }

    /// <summary>
    /// Makes a reading from a value on the given scale without throwing: false, with <paramref name="problem"/> set to
    /// the same text the factory would throw, when the value is outside the scale's accepted range.
    /// </summary>
    public static bool TryFrom(double value, SugarScale scale, out SugarReading reading, out string? problem)
    {
        problem = scale switch
        {
            SugarScale.Brix => Check.Problem(value, MinBrix, MaxBrix, "Sugar", "°Brix"),
            SugarScale.SpecificGravity => Check.Problem(value, MinSpecificGravity, MaxSpecificGravity, "Specific gravity (20/20 °C)", string.Empty),
            SugarScale.Baume => Check.Problem(value, MinBaume, MaxBaume, "Sugar", "°Baumé"),
            SugarScale.Oechsle => Check.Problem(value, MinOechsle, MaxOechsle, "Sugar", "°Oechsle"),
            SugarScale.GramsPerLitre => Check.Problem(value, 0, MaxGramsPerLitre, "Sugar", "g/L"),
            SugarScale.Kmw => Check.Problem(value, MinKmw, MaxKmw, "Sugar", "°KMW"),
            _ => throw new ArgumentOutOfRangeException(nameof(scale), scale, "Unknown sugar scale."),
        };
        reading = problem is null ? From(value, scale) : default;
        return problem is null;
    }

    /// <summary>The reading expressed on the given scale.</summary>
    public double In(SugarScale scale) => scale switch
    {
        SugarScale.Brix => Brix,
        SugarScale.SpecificGravity => SpecificGravity,
        SugarScale.Baume => Baume,
        SugarScale.Oechsle => Oechsle,
        SugarScale.GramsPerLitre => GramsPerLitre,
        SugarScale.Kmw => SugarScales.KmwFromOechsle(Oechsle),
        _ => throw new ArgumentOutOfRangeException(nameof(scale), scale, "Unknown sugar scale."),
    };

    /// <inheritdoc />
    public int CompareTo(SugarReading other) => Brix.CompareTo(other.Brix);

    /// <inheritdoc />
    public override string ToString() => Check.Format(Math.Round(Brix, 2)) + " °Brix";
}
