using YieldBench.Reports.Charts;

namespace YieldBench.Reports.Html;

/// <summary>A foreground on a background, and the WCAG 2 contrast ratio the page needs between them.</summary>
/// <param name="Use">Where the pair occurs on the page.</param>
/// <param name="Foreground">Text or mark colour, #RRGGBB.</param>
/// <param name="Background">Colour behind it, #RRGGBB.</param>
/// <param name="Minimum">4.5 for text (WCAG 2 success criterion 1.4.3, level AA), 3 for marks a chart needs to be read (1.4.11).</param>
public sealed record ContrastPair(string Use, string Foreground, string Background, double Minimum);

/// <summary>
/// The page's colours: dark ink on white, and the charts' own palette (<see cref="ChartPalette"/>, Okabe &amp; Ito) for
/// the accent and the marks, so the page and the PNG charts look of one piece. Every pair the page draws is listed in
/// <see cref="Pairs"/>, and a test computes each pair's contrast ratio.
/// </summary>
public static class HtmlPalette
{
    /// <summary>Body text.</summary>
    public const string Ink = "#1B1B1B";

    /// <summary>Secondary text: units, captions, axis labels.</summary>
    public const string Muted = "#505050";

    /// <summary>The page.</summary>
    public const string Paper = "#FFFFFF";

    /// <summary>Every other row of a long table.</summary>
    public const string Zebra = "#F3F6F9";

    /// <summary>Table headers and the chart's interquartile bands: the workbook's header fill.</summary>
    public const string HeaderFill = "#" + ChartPalette.HeaderFillHex;

    /// <summary>A likely error's severity label: the workbook's flagged-row fill.</summary>
    public const string FlaggedFill = "#" + ChartPalette.FlaggedRowFillHex;

    /// <summary>Hairlines and grid lines (decoration; nothing is read from them alone).</summary>
    public const string Hairline = "#C8CED4";

    /// <summary>Links, interval bars and median lines: the charts' first series colour (blue).</summary>
    public static string Accent { get; } = Hex(ChartPalette.Series[0]);

    /// <summary>The rule beside cautions and likely errors: the charts' vermillion.</summary>
    public static string Warm { get; } = Hex(ChartPalette.Series[5]);

    /// <summary>Every foreground and background the page puts together, with the contrast each needs.</summary>
    public static IReadOnlyList<ContrastPair> Pairs { get; } =
    [
        new("body text", Ink, Paper, 4.5),
        new("secondary text", Muted, Paper, 4.5),
        new("links and chart value labels", Accent, Paper, 4.5),
        new("body text on striped rows", Ink, Zebra, 4.5),
        new("secondary text on striped rows", Muted, Zebra, 4.5),
        new("links on striped rows", Accent, Zebra, 4.5),
        new("table header text", Ink, HeaderFill, 4.5),
        new("secondary text in table headers", Muted, HeaderFill, 4.5),
        new("likely-error label", Ink, FlaggedFill, 4.5),
        new("interval bars and median lines", Accent, Paper, 3.0),
        new("median line over its band", Accent, HeaderFill, 3.0),
        new("rule beside cautions and likely errors", Warm, Paper, 3.0),
    ];

    private static string Hex(ScottPlot.Color c) => "#" + c.R.ToString("X2", System.Globalization.CultureInfo.InvariantCulture)
        + c.G.ToString("X2", System.Globalization.CultureInfo.InvariantCulture) + c.B.ToString("X2", System.Globalization.CultureInfo.InvariantCulture);
}
