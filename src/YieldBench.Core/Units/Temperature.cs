namespace YieldBench.Core.Units;

/// <summary>A must or wine temperature, held in °C.</summary>
public readonly record struct Temperature : IComparable<Temperature>
{
    /// <summary>Lowest plausible must temperature, °C (a frozen must is not fermenting).</summary>
    public const double MinCelsius = -10.0;

    /// <summary>Highest plausible must temperature, °C.</summary>
    public const double MaxCelsius = 60.0;

    private Temperature(double celsius) => Celsius = celsius;

    /// <summary>Degrees Celsius.</summary>
    public double Celsius { get; }

    /// <summary>Degrees Fahrenheit: °C × 9/5 + 32.</summary>
    public double Fahrenheit => (Celsius * 9.0 / 5.0) + 32.0;

    /// <summary>Makes a value from °C (−10 to 60).</summary>
    public static Temperature FromCelsius(double celsius) =>
        new(Check.InRange(celsius, MinCelsius, MaxCelsius, "Temperature", "°C"));

    /// <summary>Makes a value from °F (14 to 140): °C = (°F − 32) × 5/9.</summary>
    public static Temperature FromFahrenheit(double fahrenheit)
    {
        Check.InRange(fahrenheit, (MinCelsius * 9.0 / 5.0) + 32.0, (MaxCelsius * 9.0 / 5.0) + 32.0, "Temperature", "°F");
        return new Temperature((fahrenheit - 32.0) * 5.0 / 9.0);
    }

    /// <summary>
    /// Makes a value from °C without throwing: false, with <paramref name="problem"/> set to the factory's message,
    /// when outside −10 to 60 °C.
    /// </summary>
    public static bool TryFromCelsius(double celsius, out Temperature temperature, out string? problem)
    {
        problem = Check.Problem(celsius, MinCelsius, MaxCelsius, "Temperature", "°C");
        temperature = problem is null ? new Temperature(celsius) : default;
        return problem is null;
    }

    /// <inheritdoc />
    public int CompareTo(Temperature other) => Celsius.CompareTo(other.Celsius);

    /// <inheritdoc />
    public override string ToString() => Check.Format(Math.Round(Celsius, 1)) + " °C";
}
