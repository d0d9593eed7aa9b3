using SkiaSharp;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Tests.Fixtures;

namespace YieldBench.Reports.Tests.Charts;

public sealed class PngEncodingTests
{
    private static SKBitmap DecodeRgba(byte[] png)
    {
        using var decoded = SKBitmap.Decode(png) ?? throw new InvalidOperationException("not a decodable image");
        var rgba = new SKBitmap(new SKImageInfo(decoded.Width, decoded.Height, SKColorType.Rgba8888, SKAlphaType.Unpremul));
        Assert.True(decoded.CopyTo(rgba, SKColorType.Rgba8888));
        return rgba;
    }

    [Fact]
    public void The_fast_png_settings_keep_every_pixel_of_the_plot_as_scottplot_draws_it()
    {
        // Given a drawn review chart
        var plot = ReviewCharts.AlcoholVsSugar(SampleReview.Build());

        // When it is written with the chart settings and, as a reference, with ScottPlot's own PNG export
        byte[] ours = ChartImage.RenderPng(plot);
        byte[] reference = plot.GetImageBytes(ChartStyle.Width, ChartStyle.Height, ScottPlot.ImageFormat.Png);

        // Then both decode to the same pixels (the encoding is lossless; only the compression differs)
        using var a = DecodeRgba(ours);
        using var b = DecodeRgba(reference);
        Assert.Equal((b.Width, b.Height), (a.Width, a.Height));
        Assert.Equal(b.Bytes, a.Bytes);
    }

    [Fact]
    public void Charts_are_stored_as_opaque_rgb()
    {
        // Given an empty chart written with the chart settings
        byte[] png = ChartImage.RenderPng(ChartStyle.NewPlot("Empty", "x", "y"));

        // When its header is read (IHDR: width, height, bit depth, colour type at bytes 16–25)
        int width = (png[16] << 24) | (png[17] << 16) | (png[18] << 8) | png[19];
        int height = (png[20] << 24) | (png[21] << 16) | (png[22] << 8) | png[23];

        // Then it is 1600 × 1000, 8-bit RGB (colour type 2: no alpha channel to store)
        Assert.Equal((1600, 1000, 8, 2), (width, height, (int)png[24], (int)png[25]));
    }
}
