using ScottPlot;
using SkiaSharp;

namespace YieldBench.Reports.Charts;

/// <summary>
/// Many markers of one shape, size and colour, drawn as one batch: the marker is drawn once into a small sprite and
/// stamped at each point's place. Points are placed on a grid of whole pixels (<see cref="CellPixels"/>: 1 px, or
/// 2 px for markers of 8 px and more, so a marker sits at most a pixel from its exact place, far below its size),
/// and a grid cell already stamped is not stamped again, so the drawing work is bounded by the plot area however many
/// lots there are (100,000 lots or a million rate readings draw in tenths of a second instead of seconds). Where
/// several points share a cell their colour no longer deepens; where markers merely overlap it does, as before.
/// </summary>
public sealed class MarkerCloud : IPlottable, IHasLegendText
{
    private readonly double[] xs;
    private readonly double[] ys;

    /// <summary>
    /// A cloud of markers at (<paramref name="x"/>[i], <paramref name="y"/>[i]); non-finite points are skipped. Arrays
    /// are kept as given, not copied (a million-point cloud would otherwise hold its points twice): do not change them
    /// afterwards.
    /// </summary>
    /// <param name="x">Horizontal coordinates.</param>
    /// <param name="y">Vertical coordinates (same length).</param>
    /// <param name="shape"><see cref="MarkerShape.FilledCircle"/>, <see cref="MarkerShape.OpenCircle"/>, <see cref="MarkerShape.FilledSquare"/>, <see cref="MarkerShape.FilledTriangleUp"/> or <see cref="MarkerShape.FilledDiamond"/>.</param>
    /// <param name="size">Marker diameter (side for squares), px.</param>
    /// <param name="color">Marker colour, alpha included.</param>
    /// <param name="lineWidth">Ring width of open circles, px.</param>
    public MarkerCloud(IReadOnlyList<double> x, IReadOnlyList<double> y, MarkerShape shape, float size, Color color, float lineWidth = 1.5f)
    {
        ArgumentNullException.ThrowIfNull(x);
        ArgumentNullException.ThrowIfNull(y);
        if (x.Count != y.Count)
        {
            throw new ArgumentException($"{x.Count} x values but {y.Count} y values.", nameof(y));
        }

        if (shape is not (MarkerShape.FilledCircle or MarkerShape.OpenCircle or MarkerShape.FilledSquare or MarkerShape.FilledTriangleUp or MarkerShape.FilledDiamond))
        {
            throw new ArgumentException($"Marker shape {shape} is not drawn by a marker cloud.", nameof(shape));
        }

        xs = x as double[] ?? [.. x];
        ys = y as double[] ?? [.. y];
        Shape = shape;
        Size = size;
        Color = color;
        LineWidth = lineWidth;
    }

    /// <summary>Legend text (empty: no legend entry).</summary>
    public string LegendText { get; set; } = string.Empty;

    /// <inheritdoc />
    public bool IsVisible { get; set; } = true;

    /// <inheritdoc />
    public IAxes Axes { get; set; } = new Axes();

    /// <summary>Marker shape.</summary>
    public MarkerShape Shape { get; }

    /// <summary>Marker diameter, px.</summary>
    public float Size { get; }

    /// <summary>Marker colour.</summary>
    public Color Color { get; }

    /// <summary>Ring width of open circles, px.</summary>
    public float LineWidth { get; }

    /// <summary>Points given (finite or not).</summary>
    public int Count => xs.Length;

    /// <summary>Side of the grid cells markers are placed on, px: 2 for markers of 8 px and more, else 1.</summary>
    public int CellPixels => Size >= 8 ? 2 : 1;

    /// <summary>Markers stamped by the last render (distinct grid cells inside the plot area).</summary>
    public int StampedLastRender { get; private set; }

    /// <inheritdoc />
    public IEnumerable<LegendItem> LegendItems => string.IsNullOrEmpty(LegendText)
        ? LegendItem.None
        : LegendItem.Single(this, LegendText, LegendMarker());

    /// <inheritdoc />
    public AxisLimits GetAxisLimits()
    {
        var bounds = new FiniteBounds();
        bounds.Add(xs, ys);
        return bounds.Limits;
    }

    /// <inheritdoc />
    public void Render(RenderPack rp)
    {
        ArgumentNullException.ThrowIfNull(rp);
        StampedLastRender = 0;
        if (xs.Length == 0)
        {
            return;
        }

        // The marker is centred on the sprite's middle pixel corner, so a stamp at a whole-pixel offset puts its centre
        // exactly on the point's rounded pixel coordinate.
        float reach = Shape is MarkerShape.FilledTriangleUp or MarkerShape.FilledDiamond ? Size * 0.6f : Size / 2f;
        int half = (int)Math.Ceiling(reach + LineWidth) + 1;
        int side = 2 * half;
        using var sprite = Sprite(side, half);

        var rect = rp.DataRect;
        int left = (int)Math.Floor(rect.Left) - half, top = (int)Math.Floor(rect.Top) - half;
        int width = (int)Math.Ceiling(rect.Right) + half - left, height = (int)Math.Ceiling(rect.Bottom) + half - top;
        if (width <= 0 || height <= 0)
        {
            return;
        }

        int grid = CellPixels;
        var stamped = new System.Collections.BitArray(width * height);

        // Stamps go out in batches of a fixed size, so the batch arrays stay small (off the large-object heap).
        const int Batch = 4096;
        var transforms = new SKRotationScaleMatrix[Batch];
        var sources = new SKRect[Batch];
        Array.Fill(sources, new SKRect(0, 0, side, side));
        int pending = 0;
        using var paint = new SKPaint();
        for (int i = 0; i < xs.Length; i++)
        {
            if (!double.IsFinite(xs[i]) || !double.IsFinite(ys[i]))
            {
                continue;
            }

            // Compared as floats first: a point far outside the axes can lie beyond the range of an int.
            float px = Axes.GetPixelX(xs[i]), py = Axes.GetPixelY(ys[i]);
            if (!(px >= left - grid && px <= left + width + grid && py >= top - grid && py <= top + height + grid))
            {
                continue;
            }

            int ix = (int)MathF.Round(px / grid) * grid - left, iy = (int)MathF.Round(py / grid) * grid - top;
            if (ix < 0 || iy < 0 || ix >= width || iy >= height)
            {
                continue;
            }

            int cell = (iy * width) + ix;
            if (stamped[cell])
            {
                continue;
            }

            stamped[cell] = true;
            transforms[pending++] = SKRotationScaleMatrix.CreateTranslation(ix + left - half, iy + top - half);
            StampedLastRender++;
            if (pending == Batch)
            {
                rp.Canvas.DrawAtlas(sprite, sources, transforms, paint);
                pending = 0;
            }
        }

        if (pending > 0)
        {
            rp.Canvas.DrawAtlas(sprite, sources[..pending], transforms[..pending], paint);
        }
    }

    private SKImage Sprite(int side, int half)
    {
        using var surface = SKSurface.Create(new SKImageInfo(side, side, SKColorType.Rgba8888, SKAlphaType.Premul))
            ?? throw new InvalidOperationException("Could not create a marker sprite.");
        surface.Canvas.Clear(SKColors.Transparent);
        using var paint = new SKPaint
        {
            Color = new SKColor(Color.R, Color.G, Color.B, Color.A),
            IsAntialias = true,
        };
        float r = Size / 2f;
        switch (Shape)
        {
            case MarkerShape.OpenCircle:
                paint.Style = SKPaintStyle.Stroke;
                paint.StrokeWidth = LineWidth;
                surface.Canvas.DrawCircle(half, half, r, paint);
                break;
            case MarkerShape.FilledSquare:
                paint.Style = SKPaintStyle.Fill;
                surface.Canvas.DrawRect(half - r, half - r, Size, Size, paint);
                break;
            case MarkerShape.FilledTriangleUp:
            case MarkerShape.FilledDiamond:
                // Drawn a little larger than the circle of the same size, so that the three shapes look alike in weight.
                paint.Style = SKPaintStyle.Fill;
                using (var path = new SKPath())
                {
                    float e = r * 1.2f;
                    if (Shape == MarkerShape.FilledTriangleUp)
                    {
                        path.MoveTo(half, half - e);
                        path.LineTo(half + (e * 0.866f), half + (e * 0.5f));
                        path.LineTo(half - (e * 0.866f), half + (e * 0.5f));
                    }
                    else
                    {
                        path.MoveTo(half, half - e);
                        path.LineTo(half + e, half);
                        path.LineTo(half, half + e);
                        path.LineTo(half - e, half);
                    }

                    path.Close();
                    surface.Canvas.DrawPath(path, paint);
                }

                break;
            default:
                paint.Style = SKPaintStyle.Fill;
                surface.Canvas.DrawCircle(half, half, r, paint);
                break;
        }

        return surface.Snapshot();
    }

    private MarkerStyle LegendMarker() => Shape == MarkerShape.OpenCircle
        ? new MarkerStyle(Shape, Size, Color) { LineWidth = LineWidth, LineColor = Color, FillColor = Colors.Transparent }
        : new MarkerStyle(Shape, Size, Color) { LineWidth = 0 };
}
