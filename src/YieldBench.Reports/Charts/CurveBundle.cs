using ScottPlot;
using SkiaSharp;

namespace YieldBench.Reports.Charts;

/// <summary>
/// Many polylines of one colour and width (for example the sugar curves of the lots drawn on a strain chart), as one
/// plottable: each curve is one path, and points closer than half a pixel to the last one kept are skipped, which
/// changes nothing visible but keeps dense probe logs cheap. Curves are drawn in the order they were added.
/// </summary>
public sealed class CurveBundle : IPlottable, IHasLegendText
{
    private readonly List<(double[] X, double[] Y)> curves = [];

    /// <summary>An empty bundle.</summary>
    /// <param name="color">Line colour, alpha included.</param>
    /// <param name="lineWidth">Line width, px.</param>
    public CurveBundle(Color color, float lineWidth)
    {
        Color = color;
        LineWidth = lineWidth;
    }

    /// <summary>Legend text (empty: no legend entry).</summary>
    public string LegendText { get; set; } = string.Empty;

    /// <inheritdoc />
    public bool IsVisible { get; set; } = true;

    /// <inheritdoc />
    public IAxes Axes { get; set; } = new Axes();

    /// <summary>Line colour.</summary>
    public Color Color { get; }

    /// <summary>Line width, px.</summary>
    public float LineWidth { get; }

    /// <summary>Curves in the bundle.</summary>
    public int Count => curves.Count;

    /// <inheritdoc />
    public IEnumerable<LegendItem> LegendItems => string.IsNullOrEmpty(LegendText)
        ? LegendItem.None
        : LegendItem.Single(this, LegendText, new LineStyle { Width = LineWidth, Color = Color });

    /// <summary>Adds one curve; points with a non-finite coordinate break the line there.</summary>
    public void Add(IReadOnlyList<double> x, IReadOnlyList<double> y)
    {
        ArgumentNullException.ThrowIfNull(x);
        ArgumentNullException.ThrowIfNull(y);
        if (x.Count != y.Count)
        {
            throw new ArgumentException($"{x.Count} x values but {y.Count} y values.", nameof(y));
        }

        curves.Add(([.. x], [.. y]));
    }

    /// <inheritdoc />
    public AxisLimits GetAxisLimits()
    {
        var bounds = new FiniteBounds();
        foreach (var (x, y) in curves)
        {
            bounds.Add(x, y);
        }

        return bounds.Limits;
    }

    /// <inheritdoc />
    public void Render(RenderPack rp)
    {
        ArgumentNullException.ThrowIfNull(rp);
        using var paint = new SKPaint
        {
            Color = new SKColor(Color.R, Color.G, Color.B, Color.A),
            IsAntialias = true,
            Style = SKPaintStyle.Stroke,
            // Lines of 1 px or less are drawn as hairlines: far cheaper to rasterise for long dense logs, and alike at that width.
            StrokeWidth = LineWidth <= 1 ? 0 : LineWidth,
            StrokeJoin = SKStrokeJoin.Round,
            StrokeCap = SKStrokeCap.Round,
        };
        using var path = new SKPath();
        foreach (var (x, y) in curves)
        {
            path.Reset();
            bool open = false;
            float lastX = 0, lastY = 0;
            for (int i = 0; i < x.Length; i++)
            {
                float px = double.IsFinite(x[i]) ? Axes.GetPixelX(x[i]) : float.NaN;
                float py = double.IsFinite(y[i]) ? Axes.GetPixelY(y[i]) : float.NaN;
                if (!float.IsFinite(px) || !float.IsFinite(py))
                {
                    open = false;
                    continue;
                }

                if (!open)
                {
                    path.MoveTo(px, py);
                    open = true;
                }
                else if (i == x.Length - 1 || Math.Abs(px - lastX) >= 0.5f || Math.Abs(py - lastY) >= 0.5f)
                {
                    path.LineTo(px, py);
                }
                else
                {
                    continue;
                }

                lastX = px;
                lastY = py;
            }

            rp.Canvas.DrawPath(path, paint);
        }
    }
}
