using System.Globalization;

namespace YieldBench.Core;

/// <summary>How a p-value is written for people: four decimals, and "&lt; 0.0001" below that (never "0.0000").</summary>
public static class PValues
{
    /// <summary>The smallest p-value written as a number; smaller ones are written "&lt; 0.0001".</summary>
    public const double Smallest = 0.0001;

    /// <summary>The number format of a spreadsheet cell holding a p-value: the same rule as <see cref="Text"/>.</summary>
    public const string CellFormat = "[<0.0001]\"< 0.0001\";0.0000";

    /// <summary>"p = 0.0123", "p &lt; 0.0001", or "p not defined" for NaN.</summary>
    public static string Text(double p) =>
        double.IsNaN(p) ? "p not defined" : p < Smallest ? "p < 0.0001" : "p = " + p.ToString("0.0000", CultureInfo.InvariantCulture);
}
