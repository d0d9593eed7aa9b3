using ScottPlot;
using SkiaSharp;
using YieldBench.Reports.Output;

namespace YieldBench.Reports.Charts;

/// <summary>A PNG chart written to disk.</summary>
/// <param name="Path">Full path of the PNG.</param>
/// <param name="Title">Chart title, used as the picture's description in the workbook.</param>
/// <param name="Width">Width, px.</param>
/// <param name="Height">Height, px.</param>
/// <param name="Sheet">Name of the workbook sheet the picture is placed on, below its table (null: none besides the overview).</param>
/// <param name="OnOverview">True when the overview sheet shows it too (keep it for the few charts that explain the review at a glance).</param>
public sealed record ChartFile(string Path, string Title, int Width, int Height, string? Sheet = null, bool OnOverview = true);

/// <summary>A chart to be drawn: the file it becomes, known before it is drawn, and how its PNG is drawn.</summary>
/// <param name="File">The chart file (its path, title and where the workbook shows it).</param>
/// <param name="Draw">Draws the chart and writes its PNG bytes to the stream given.</param>
internal sealed record PlannedChart(ChartFile File, Action<Stream> Draw)
{
    /// <summary>A chart whose plot <paramref name="plot"/> builds, rendered at the report's size.</summary>
    public static PlannedChart Of(Func<Plot> plot, string path, string title, string? sheet = null, bool onOverview = true) =>
        new(
            new ChartFile(System.IO.Path.GetFullPath(path), title, ChartStyle.Width, ChartStyle.Height, sheet, onOverview),
            stream =>
            {
                using var png = ChartImage.RenderPngData(plot(), ChartStyle.Width, ChartStyle.Height);
                stream.Write(png.AsSpan());
            });

    /// <summary>Draws the chart into its file (atomically), one chart after another: for callers outside a report.</summary>
    public static IReadOnlyList<ChartFile> DrawAll(IEnumerable<PlannedChart> charts) =>
        charts.Select(c =>
        {
            AtomicFile.Write(c.File.Path, c.Draw);
            return c.File;
        }).ToArray();
}

/// <summary>Renders plots to PNG bytes and files.</summary>
public static class ChartImage
{
    /// <summary>
    /// PNG settings of every chart: the "up" row filter and zlib level 1. Measured with SkiaSharp 3.119 on a
    /// 1600 × 1000 chart (best of 15), the encoder's default (every filter tried per row, level 6) took 85–110 ms of a
    /// chart's 110–130 ms; the up filter at level 1 takes about 15 ms (level 3: 30 ms) for files 2–10 % larger than
    /// level 3 and 10–20 % larger than the default. PNG is lossless: the pixels, and so the text, are the same
    /// whichever setting is used.
    /// </summary>
    public static SKPngEncoderOptions PngOptions { get; } = new(SKPngEncoderFilterFlags.Up, 1);

    /// <summary>The plot as PNG bytes.</summary>
    public static byte[] RenderPng(Plot plot, int width = ChartStyle.Width, int height = ChartStyle.Height)
    {
        using var png = RenderPngData(plot, width, height);
        return png.ToArray();
    }

    /// <summary>The plot as PNG bytes held by SkiaSharp (native memory: a chart's half megabyte never lands on the managed heap).</summary>
    public static SKData RenderPngData(Plot plot, int width = ChartStyle.Width, int height = ChartStyle.Height)
    {
        ArgumentNullException.ThrowIfNull(plot);
        ReportFonts.EnsureRegistered();
        using var surface = NewSurface(width, height);
        plot.Render(surface.Canvas, width, height);
        return EncodePngData(surface);
    }

    /// <summary>
    /// A white raster surface of the given size for a chart. It starts opaque and everything is drawn over it with
    /// ordinary blending, so the finished picture is opaque and <see cref="EncodePng"/> can store it as RGB.
    /// </summary>
    public static SKSurface NewSurface(int width, int height)
    {
        var surface = SKSurface.Create(new SKImageInfo(width, height, SKColorType.Rgba8888, SKAlphaType.Premul))
            ?? throw new InvalidOperationException($"Could not create a {width} × {height} drawing surface.");
        surface.Canvas.Clear(SKColors.White);
        return surface;
    }

    /// <summary>The surface's pixels as an RGB PNG (<see cref="PngOptions"/>); the surface must come from <see cref="NewSurface"/>.</summary>
    public static byte[] EncodePng(SKSurface surface)
    {
        using var png = EncodePngData(surface);
        return png.ToArray();
    }

    /// <summary>As <see cref="EncodePng"/>, the bytes left in SkiaSharp's native memory (dispose them).</summary>
    public static SKData EncodePngData(SKSurface surface)
    {
        ArgumentNullException.ThrowIfNull(surface);
        using var pixels = surface.PeekPixels()
            ?? throw new InvalidOperationException("The chart surface has no readable pixels.");

        // Every pixel is opaque (see NewSurface), so declaring the pixels opaque drops only the constant alpha byte.
        using var opaque = pixels.WithAlphaType(SKAlphaType.Opaque);
        return opaque.Encode(PngOptions)
            ?? throw new InvalidOperationException("The chart could not be encoded as PNG.");
    }

    /// <summary>Writes PNG bytes held by SkiaSharp to <paramref name="path"/> atomically, straight from native memory.</summary>
    public static void WritePng(string path, SKData png)
    {
        ArgumentNullException.ThrowIfNull(png);
        AtomicFile.Write(path, stream => stream.Write(png.AsSpan()));
    }

    /// <summary>Renders the plot and writes it atomically (temporary file, then rename) to <paramref name="path"/>.</summary>
    /// <param name="plot">The plot.</param>
    /// <param name="path">Target path; its folder is created when missing.</param>
    /// <param name="title">Title recorded with the file (workbook picture description).</param>
    /// <param name="sheet">Workbook sheet the picture also goes on, or null.</param>
    /// <param name="width">Width, px.</param>
    /// <param name="height">Height, px.</param>
    /// <param name="onOverview">True when the overview sheet shows it too.</param>
    public static ChartFile Save(
        Plot plot, string path, string title, string? sheet = null, int width = ChartStyle.Width, int height = ChartStyle.Height, bool onOverview = true)
    {
        using (var png = RenderPngData(plot, width, height))
        {
            WritePng(path, png);
        }

        return new ChartFile(System.IO.Path.GetFullPath(path), title, width, height, sheet, onOverview);
    }
}
