using ScottPlot;

namespace YieldBench.Reports.Charts;

/// <summary>
/// The one palette of charts and sheet highlights. Series colours are the eight-colour set published by Okabe &amp; Ito
/// (2008, "Color Universal Design"), chosen because they stay distinguishable under the common colour-vision
/// deficiencies; no red/amber/green meaning is implied by any colour.
/// </summary>
public static class ChartPalette
{
    /// <summary>Series colours in the order series are given them (black is kept for reference lines).</summary>
    public static IReadOnlyList<Color> Series { get; } =
    [
        Color.FromHex("#0072B2"), // blue
        Color.FromHex("#E69F00"), // orange
        Color.FromHex("#009E73"), // bluish green
        Color.FromHex("#CC79A7"), // reddish purple
        Color.FromHex("#56B4E9"), // sky blue
        Color.FromHex("#D55E00"), // vermillion
        Color.FromHex("#F0E442"), // yellow
    ];

    /// <summary>Reference lines (recommended factor, thresholds).</summary>
    public static Color Reference { get; } = Color.FromHex("#000000");

    /// <summary>Tolerance and interval bands (drawn translucent).</summary>
    public static Color Band { get; } = Color.FromHex("#999999");

    /// <summary>Ring drawn around flagged points.</summary>
    public static Color Flagged { get; } = Color.FromHex("#000000");

    /// <summary>Fill of flagged rows in the workbook (a pale tint of the orange series colour), as RGB hex without '#'.</summary>
    public const string FlaggedRowFillHex = "FBE8C4";

    /// <summary>Fill of header rows in the workbook (a pale tint of the blue series colour).</summary>
    public const string HeaderFillHex = "D6E6F2";

    /// <summary>The series colour for the i-th series (wraps around).</summary>
    public static Color ForIndex(int index) => Series[((index % Series.Count) + Series.Count) % Series.Count];

    /// <summary>
    /// Marker shapes of the per-lot points, one per round of the colours: the first seven series are circles, the next
    /// seven triangles, the next seven diamonds, so a cellar of up to 21 strains gives each its own colour and shape
    /// pair (colour alone repeats from the eighth strain on).
    /// </summary>
    public static IReadOnlyList<MarkerShape> Shapes { get; } = [MarkerShape.FilledCircle, MarkerShape.FilledTriangleUp, MarkerShape.FilledDiamond];

    /// <summary>Line patterns of per-series lines, one per round of the colours (solid, dashed, dotted), for the same reason as <see cref="Shapes"/>.</summary>
    public static IReadOnlyList<LinePattern> Patterns { get; } = [LinePattern.Solid, LinePattern.Dashed, LinePattern.Dotted];

    /// <summary>The marker shape of the i-th series: a circle for the first seven, then the next shape each round.</summary>
    public static MarkerShape ShapeForIndex(int index) => Shapes[(Math.Max(0, index) / Series.Count) % Shapes.Count];

    /// <summary>The line pattern of the i-th series: solid for the first seven, then the next pattern each round.</summary>
    public static LinePattern PatternForIndex(int index) => Patterns[(Math.Max(0, index) / Series.Count) % Patterns.Count];
}
