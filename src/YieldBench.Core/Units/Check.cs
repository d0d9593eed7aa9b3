using System.Globalization;

namespace YieldBench.Core.Units;

/// <summary>Argument checks whose messages name the value, its unit and the allowed range.</summary>
internal static class Check
{
    public static double InRange(double value, double min, double max, string name, string unit)
    {
        if (double.IsNaN(value) || value < min || value > max)
        {
            throw new ArgumentOutOfRangeException(
                name,
                value,
                string.Create(
                    CultureInfo.InvariantCulture,
                    $"{name} {Format(value)} {unit} is outside the plausible range {Format(min)} to {Format(max)} {unit}."));
        }

        return value;
    }

    public static string Format(double v) => v.ToString("0.#####", CultureInfo.InvariantCulture);
}
