using System.Globalization;

namespace YieldBench.Core.Units;

/// <summary>The unit temperatures are shown in. The review computes in °C; this is only how its outputs show them.</summary>
public enum TemperatureUnit
{
    /// <summary>Degrees Celsius (the default).</summary>
    Celsius,

    /// <summary>Degrees Fahrenheit, for cellars that work in it (the United States).</summary>
    Fahrenheit,
}

/// <summary>Shows °C values in a <see cref="TemperatureUnit"/>: °F = °C × 9/5 + 32; a difference of 1 K is 9/5 °F.</summary>
public static class TemperatureUnits
{
    /// <summary>The unit's symbol, "°C" or "°F".</summary>
    public static string Symbol(this TemperatureUnit unit) => unit == TemperatureUnit.Fahrenheit ? "°F" : "°C";

    /// <summary>The unit's suffix in a data-file column name, "c" or "f" (peak_temp_c, peak_temp_f).</summary>
    public static string Suffix(this TemperatureUnit unit) => unit == TemperatureUnit.Fahrenheit ? "f" : "c";

    /// <summary>A temperature given in °C, in the unit (NaN stays NaN).</summary>
    public static double FromCelsius(this TemperatureUnit unit, double celsius) =>
        unit == TemperatureUnit.Fahrenheit ? (celsius * 9.0 / 5.0) + 32.0 : celsius;

    /// <summary>A temperature given in °C, in the unit; null stays null.</summary>
    public static double? FromCelsius(this TemperatureUnit unit, double? celsius) =>
        celsius is { } c ? unit.FromCelsius(c) : null;

    /// <summary>A temperature difference given in K (or °C), in the unit's degrees.</summary>
    public static double Difference(this TemperatureUnit unit, double kelvin) =>
        unit == TemperatureUnit.Fahrenheit ? kelvin * 9.0 / 5.0 : kelvin;

    /// <summary>A temperature given in °C as text in the unit, e.g. "28.3 °C" or "82.9 °F" (invariant culture).</summary>
    public static string Show(this TemperatureUnit unit, double celsius, string format = "0.0") =>
        unit.FromCelsius(celsius).ToString(format, CultureInfo.InvariantCulture) + " " + unit.Symbol();
}
