using System.Globalization;
using System.Text;

namespace YieldBench.Reports.Html;

/// <summary>
/// Text and number formatting for the HTML page: every text from the inputs goes through <see cref="Escape"/>; numbers
/// are written in the invariant culture with a real minus sign, and a number that is not defined reads "n/a".
/// </summary>
internal static class HtmlText
{
    /// <summary>
    /// The text with the five characters that carry meaning in HTML (&amp; &lt; &gt; " ') replaced by references, safe in
    /// element content and in double- or single-quoted attribute values. Other characters are kept as UTF-8.
    /// </summary>
    public static string Escape(string? text)
    {
        if (string.IsNullOrEmpty(text))
        {
            return string.Empty;
        }

        var sb = new StringBuilder(text.Length + 16);
        foreach (char c in text)
        {
            switch (c)
            {
                case '&': sb.Append("&amp;"); break;
                case '<': sb.Append("&lt;"); break;
                case '>': sb.Append("&gt;"); break;
                case '"': sb.Append("&quot;"); break;
                case '\'': sb.Append("&#39;"); break;
                default:
                    // Control characters other than tab and line ends have no place in a page; they show as a space.
                    sb.Append(char.IsControl(c) && c is not ('\t' or '\n' or '\r') ? ' ' : c);
                    break;
            }
        }

        return sb.ToString();
    }

    /// <summary>A number with <paramref name="format"/> (invariant), a minus sign (U+2212) for negatives, "n/a" when not finite.</summary>
    public static string Number(double value, string format) =>
        double.IsFinite(value) ? value.ToString(format, CultureInfo.InvariantCulture).Replace('-', '\u2212') : "n/a";

    /// <summary>A signed number (+0.31, −0.32).</summary>
    public static string Signed(double value, string format) =>
        double.IsFinite(value) ? Number(value, "+" + format + ";-" + format + ";" + format) : "n/a";

    /// <summary>A share (0–1) as a whole percentage, e.g. "12 %".</summary>
    public static string Percent(double share) => double.IsFinite(share) ? Number(share * 100, "0") + " %" : "n/a";

    /// <summary>A number for an attribute or a sort key: invariant, shortest round-trip form, empty when not finite.</summary>
    public static string Key(double value) => double.IsFinite(value) ? value.ToString("R", CultureInfo.InvariantCulture) : string.Empty;

    /// <summary>An integer, invariant.</summary>
    public static string Count(int value) => value.ToString(CultureInfo.InvariantCulture);

    /// <summary>A quantity (lots, rows, logs), with a thousands separator: "10,000". Not for years, ranks or seeds.</summary>
    public static string Quantity(int value) => value.ToString("N0", CultureInfo.InvariantCulture);

    /// <summary>A quantity with its noun, singular for one ("1 lot", "10,000 lots"); <paramref name="plural"/> when the plural is not the noun plus "s".</summary>
    public static string Count(int value, string noun, string? plural = null) =>
        Quantity(value) + " " + (value == 1 ? noun : plural ?? noun + "s");

    /// <summary>A coordinate in a chart (two decimals, invariant, plain minus for SVG).</summary>
    public static string Coordinate(double value) => value.ToString("0.##", CultureInfo.InvariantCulture);
}
