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

    /// <summary>°Baumé (modulus 145).</summary>
    public double Baume => SugarScales.BaumeFromSpecificGravity(SpecificGravity);

    /// <summary>°Oechsle.</summary>
    public double Oechsle => SugarScales.OechsleFromSpecificGravity(SpecificGravity);

    /// <summary>Fermentable sugar in g/L by the OIV must table (closed form with a non-sugar allowance outside 10–30 °Brix).</summary>
    public double GramsPerLitre => OivMustTable.SugarGramsPerLitre(Brix);

    /// <summary>Makes a reading from °Brix.</summary>
    public static SugarReading FromBrix(double brix) =>
        new(Check.InRange(brix, MinBrix, MaxBrix, "Sugar", "°Brix"));

    /// <summary>Makes a reading from apparent specific gravity 20/20 °C.</summary>
    public static SugarReading FromSpecificGravity(double specificGravity)
    {
        Check.InRange(specificGravity, SugarScales.SpecificGravityFromBrix(MinBrix), SugarScales.SpecificGravityFromBrix(MaxBrix), "Specific gravity", "(20/20 °C)");
        return new SugarReading(SugarScales.BrixFromSpecificGravity(specificGravity));
    }

    /// <summary>Makes a reading from °Baumé (modulus 145).</summary>
    public static SugarReading FromBaume(double baume)
    {
        Check.InRange(baume, SugarScales.BaumeFromSpecificGravity(SugarScales.SpecificGravityFromBrix(MinBrix)), SugarScales.BaumeFromSpecificGravity(SugarScales.SpecificGravityFromBrix(MaxBrix)), "Sugar", "°Baumé");
        return new SugarReading(SugarScales.BrixFromSpecificGravity(SugarScales.SpecificGravityFromBaume(baume)));
    }

    /// <summary>Makes a reading from °Oechsle.</summary>
    public static SugarReading FromOechsle(double oechsle)
    {
        Check.InRange(oechsle, SugarScales.OechsleFromSpecificGravity(SugarScales.SpecificGravityFromBrix(MinBrix)), SugarScales.OechsleFromSpecificGravity(SugarScales.SpecificGravityFromBrix(MaxBrix)), "Sugar", "°Oechsle");
        return new SugarReading(SugarScales.BrixFromSpecificGravity(SugarScales.SpecificGravityFromOechsle(oechsle)));
    }

    /// <summary>Makes a reading from fermentable sugar in g/L (inverse of the OIV must table).</summary>
    public static SugarReading FromGramsPerLitre(double gramsPerLitre)
    {
        Check.InRange(gramsPerLitre, 0, OivMustTable.SugarGramsPerLitre(MaxBrix), "Sugar", "g/L");
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
        _ => throw new ArgumentOutOfRangeException(nameof(scale), scale, "Unknown sugar scale."),
    };

    /// <summary>The reading expressed on the given scale.</summary>
    public double In(SugarScale scale) => scale switch
    {
        SugarScale.Brix => Brix,
        SugarScale.SpecificGravity => SpecificGravity,
        SugarScale.Baume => Baume,
        SugarScale.Oechsle => Oechsle,
        SugarScale.GramsPerLitre => GramsPerLitre,
        _ => throw new ArgumentOutOfRangeException(nameof(scale), scale, "Unknown sugar scale."),
    };

    /// <inheritdoc />
    public int CompareTo(SugarReading other) => Brix.CompareTo(other.Brix);

    /// <inheritdoc />
    public override string ToString() => Check.Format(Math.Round(Brix, 2)) + " °Brix";
}
