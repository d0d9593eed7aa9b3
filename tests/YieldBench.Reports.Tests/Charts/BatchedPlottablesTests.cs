using ScottPlot;
using SkiaSharp;
using YieldBench.Reports.Charts;

namespace YieldBench.Reports.Tests.Charts;

public sealed class BatchedPlottablesTests
{
    private static Plot Frame()
    {
        var plot = ChartStyle.NewPlot("t", "x", "y");
        plot.Axes.SetLimits(0, 10, 0, 10);
        return plot;
    }

    /// <summary>Centre of the pixels clearly coloured by the blue series colour, in image pixels (rows <paramref name="top"/> to <paramref name="bottom"/>).</summary>
    private static (double X, double Y, int Count) BlueInk(byte[] png, int top = 0, int bottom = int.MaxValue)
    {
        using var bitmap = SKBitmap.Decode(png);
        double sx = 0, sy = 0;
        int n = 0;
        for (int y = Math.Max(0, top); y < Math.Min(bitmap.Height, bottom); y++)
        {
            for (int x = 0; x < bitmap.Width; x++)
            {
                var c = bitmap.GetPixel(x, y);
                if (c.Blue > 120 && c.Red < 80 && c.Green < 160)
                {
                    sx += x;
                    sy += y;
                    n++;
                }
            }
        }

        return n == 0 ? (double.NaN, double.NaN, 0) : (sx / n, sy / n, n);
    }

    [Theory]
    [InlineData(7f, 0.75)]
    [InlineData(12f, 1.5)]
    public void A_marker_cloud_puts_a_marker_where_scottplot_puts_one(float size, double tolerance)
    {
        // Given the same point drawn once by ScottPlot's markers and once by a marker cloud (placed on a 1 px grid
        // below 8 px markers, a 2 px grid from 8 px)
        var reference = Frame();
        reference.Add.Markers(new[] { 3.3 }, new[] { 6.7 }, MarkerShape.FilledCircle, size, ChartPalette.ForIndex(0));
        var batched = Frame();
        var cloud = ChartStyle.AddMarkers(batched, new[] { 3.3 }, new[] { 6.7 }, MarkerShape.FilledCircle, size, ChartPalette.ForIndex(0));

        // When both are rendered
        var a = BlueInk(ChartImage.RenderPng(reference));
        var b = BlueInk(ChartImage.RenderPng(batched));

        // Then the marker sits within the grid's rounding of ScottPlot's and covers about the same area (π·size²/4)
        Assert.Equal(size >= 8 ? 2 : 1, cloud.CellPixels);
        Assert.True(a.Count > size * size / 2 && b.Count > size * size / 2, $"{a.Count} and {b.Count} blue pixels");
        Assert.InRange(Math.Abs(a.X - b.X), 0, tolerance);
        Assert.InRange(Math.Abs(a.Y - b.Y), 0, tolerance);
        Assert.InRange(b.Count, a.Count * 0.7, a.Count * 1.3);
    }

    [Fact]
    public void A_marker_cloud_stamps_each_pixel_once_however_many_points_fall_on_it()
    {
        // Given 100,000 points within a tenth of a pixel of one place, 5 points far apart, and a NaN
        var xs = Enumerable.Range(0, 100_000).Select(i => 5 + (i % 10 * 1e-5)).Concat([1.0, 2.0, 3.0, 4.0, 6.0, double.NaN]).ToArray();
        var ys = Enumerable.Range(0, 100_000).Select(_ => 5.0).Concat([1.0, 2.0, 3.0, 4.0, 6.0, 1.0]).ToArray();
        var plot = Frame();
        var cloud = ChartStyle.AddMarkers(plot, xs, ys, MarkerShape.FilledCircle, 8, ChartPalette.ForIndex(0));

        // When rendered
        ChartImage.RenderPng(plot);

        // Then the 100,000 near-coincident points cost one stamp (two if they straddle a pixel edge) and the others
        // one each; the NaN is skipped
        Assert.Equal(100_006, cloud.Count);
        Assert.InRange(cloud.StampedLastRender, 6, 7);
    }

    [Fact]
    public void Points_far_outside_the_axes_are_skipped_without_overflow()
    {
        // Given fixed axes 0–10 and points at 1e15 and −1e15 (pixels far beyond an int) besides one inside
        var plot = Frame();
        var cloud = ChartStyle.AddMarkers(plot, [1e15, -1e15, 5], [5, 5, 5], MarkerShape.FilledCircle, 6, ChartPalette.ForIndex(0));
        plot.Axes.SetLimits(0, 10, 0, 10);

        // When rendered (the build checks arithmetic overflow)
        ChartImage.RenderPng(plot);

        // Then only the point inside is stamped
        Assert.Equal(1, cloud.StampedLastRender);
    }

    [Fact]
    public void A_marker_cloud_s_limits_cover_its_finite_points_only()
    {
        var cloud = new MarkerCloud([1, 4, double.NaN, 2], [7, -3, 100, double.PositiveInfinity], MarkerShape.OpenCircle, 6, Colors.Black);
        var limits = cloud.GetAxisLimits();
        Assert.Equal((1.0, 4.0, -3.0, 7.0), (limits.Left, limits.Right, limits.Bottom, limits.Top));
        Assert.Throws<ArgumentException>(() => new MarkerCloud([1], [1, 2], MarkerShape.FilledCircle, 6, Colors.Black));
        Assert.Throws<ArgumentException>(() => new MarkerCloud([1], [1], MarkerShape.Cross, 6, Colors.Black));
    }

    [Fact]
    public void A_curve_bundle_draws_each_curve_and_names_itself_in_the_legend_only_when_labelled()
    {
        // Given a bundle of two blue curves and an unlabelled one
        var plot = Frame();
        var bundle = new CurveBundle(ChartPalette.ForIndex(0), 3) { LegendText = "lots" };
        bundle.Add([1, 9], [2, 2]);
        bundle.Add([1, 9], [8, 8]);
        plot.Add.Plottable(bundle);
        var quiet = new CurveBundle(Colors.Gray, 1);
        quiet.Add([1, 2], [1, 2]);
        plot.Add.Plottable(quiet);

        // When rendered
        byte[] png = ChartImage.RenderPng(plot);

        // Then both lines are drawn along their whole length (about 1,100 px each at y = 2 and y = 8), the bundle spans
        // both curves, and only the labelled bundle has a legend entry
        foreach (double y in new[] { 2.0, 8.0 })
        {
            var at = plot.GetPixel(new Coordinates(5, y));
            var ink = BlueInk(png, (int)at.Y - 3, (int)at.Y + 4);
            Assert.True(ink.Count > 2000, $"{ink.Count} blue pixels along y = {y}");
            Assert.InRange(ink.X, at.X - 3, at.X + 3);
        }

        Assert.Equal((1.0, 9.0, 2.0, 8.0), (bundle.GetAxisLimits().Left, bundle.GetAxisLimits().Right, bundle.GetAxisLimits().Bottom, bundle.GetAxisLimits().Top));
        Assert.Equal(2, bundle.Count);
        Assert.Single(bundle.LegendItems);
        Assert.Empty(quiet.LegendItems);
    }
}
