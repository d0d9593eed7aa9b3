using System.Globalization;

namespace YieldBench.Core.Units;

/// <summary>Range checks whose messages name the value, its unit and the allowed range (the one place for their text).</summary>
internal static class Check
{
    /// <summary>The problem with <paramref name="value"/>, or null when it lies in [min, max].</summary>
    public static string? Problem(double value, double min, double max, string name, string unit)
    {
        if (value >= min && value <= max)
        {
            // The common case returns before any text is built (every sugar reading passes through here).
            return null;
        }

        string u = unit.Length == 0 ? string.Empty : " " + unit;
        if (double.IsNaN(value))
        {
            return string.Create(CultureInfo.InvariantCulture, $"{name} is not a number; expected {Format(min)} to {Format(max)}{u}.");
        }

        if (value < min || value > max)
        {
            return string.Create(
                CultureInfo.InvariantCulture,
                $"{name} {Format(value)}{u} is outside the plausible range {Format(min)} to {Format(max)}{u}.");
        }

        return null;
    }

    public static double InRange(double value, double min, double max, string name, string unit)
    {
        if (Problem(value, min, max, name, unit) is { } problem)
        {
            throw new ArgumentOutOfRangeException(name, value, problem);
        }

        return value;
    }

    public static string Format(double v) => v.ToString("0.#####", CultureInfo.InvariantCulture);
}
