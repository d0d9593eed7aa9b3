namespace YieldBench.Core.Units;

/// <summary>Ethanol content of a wine, held as % v/v at 20 °C.</summary>
public readonly record struct AlcoholContent : IComparable<AlcoholContent>
{
    /// <summary>Density of ethanol at 20 °C in g/mL (Council Directive 76/766/EEC, Annex).</summary>
    public const double EthanolDensity20C = 0.78924;

    /// <summary>Lowest plausible finished-wine alcohol, % v/v.</summary>
    public const double MinPercent = 0.0;

    /// <summary>Highest alcohol yeast fermentation can plausibly reach, % v/v (fortified wines are out of scope).</summary>
    public const double MaxPercent = 25.0;

    private AlcoholContent(double percent) => PercentVolume = percent;

    /// <summary>Alcohol in % v/v at 20 °C.</summary>
    public double PercentVolume { get; }

    /// <summary>Ethanol in g/L: % v/v × 10 mL/L × 0.78924 g/mL.</summary>
    public double GramsPerLitre => PercentVolume * 10.0 * EthanolDensity20C;

    /// <summary>Makes a value from % v/v at 20 °C (0–25).</summary>
    public static AlcoholContent FromPercentVolume(double percent) =>
        new(Check.InRange(percent, MinPercent, MaxPercent, "Alcohol", "% v/v"));

    /// <summary>Makes a value from ethanol g/L at 20 °C (0 to 197.31 g/L, the range of % v/v times 7.8924).</summary>
    public static AlcoholContent FromGramsPerLitre(double gramsPerLitre)
    {
        // Checked in the caller's unit, so the message repeats the value as given.
        Check.InRange(gramsPerLitre, MinPercent * 10.0 * EthanolDensity20C, MaxPercent * 10.0 * EthanolDensity20C, "Ethanol", "g/L");
        return new AlcoholContent(Math.Min(MaxPercent, gramsPerLitre / (10.0 * EthanolDensity20C)));
    }

    /// <summary>
    /// Makes a value from % v/v without throwing: false, with <paramref name="problem"/> set to the factory's message,
    /// when outside 0–25 % v/v.
    /// </summary>
    public static bool TryFromPercentVolume(double percent, out AlcoholContent alcohol, out string? problem)
    {
        problem = Check.Problem(percent, MinPercent, MaxPercent, "Alcohol", "% v/v");
        alcohol = problem is null ? new AlcoholContent(percent) : default;
        return problem is null;
    }

    /// <inheritdoc />
    public int CompareTo(AlcoholContent other) => PercentVolume.CompareTo(other.PercentVolume);

    /// <inheritdoc />
    public override string ToString() => Check.Format(Math.Round(PercentVolume, 2)) + " % v/v";
}
