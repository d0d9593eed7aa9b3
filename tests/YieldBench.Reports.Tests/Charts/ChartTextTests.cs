using SkiaSharp;
using YieldBench.Reports.Charts;

namespace YieldBench.Reports.Tests.Charts;

public sealed class ChartTextTests
{
    [Fact]
    public void The_shipped_regular_and_bold_fonts_load_from_the_assembly()
    {
        // Given the fonts embedded in the Reports assembly
        // When they are read as typefaces
        using var regular = ReportFonts.Typeface(bold: false);
        using var bold = ReportFonts.Typeface(bold: true);

        // Then they are DejaVu Sans, one regular and one bold, with real glyphs
        Assert.Equal("DejaVu Sans", regular.FamilyName);
        Assert.Equal("DejaVu Sans", bold.FamilyName);
        Assert.Equal((int)SKFontStyleWeight.Normal, regular.FontWeight);
        Assert.Equal((int)SKFontStyleWeight.Bold, bold.FontWeight);
        Assert.True(regular.GlyphCount > 1000, $"glyph count {regular.GlyphCount}");
        Assert.NotEqual(0, regular.GetGlyph('°'));
    }

    [Fact]
    public void A_chart_title_draws_dark_text_pixels_in_the_title_band()
    {
        // Given two otherwise identical empty charts, one with a title
        var titled = ChartStyle.NewPlot("Conversion factor by strain", "x", "y");
        var untitled = ChartStyle.NewPlot(string.Empty, "x", "y");

        // When both are rendered at the report size
        byte[] withTitle = ChartImage.RenderPng(titled);
        byte[] without = ChartImage.RenderPng(untitled);

        // Then the titled one has dark pixels across the top band and the untitled one has none there
        int dark = PngProbe.DarkPixels(withTitle, 300, 0, 1000, 70);
        int darkWithout = PngProbe.DarkPixels(without, 300, 0, 1000, 70);
        Assert.True(dark > 2000, $"only {dark} dark pixels in the title band");
        Assert.True(darkWithout < 1200, $"{darkWithout} dark pixels in the untitled band (the frame line is 1000)");
        Assert.True(PngProbe.GreyVariance(withTitle, 300, 0, 1000, 70) > 500);
    }

    [Fact]
    public void Chart_titles_are_drawn_in_bold()
    {
        // Given the same title drawn bold (the house style) and regular
        var bold = ChartStyle.NewPlot("Final alcohol vs starting sugar", "x", "y");
        var regular = ChartStyle.NewPlot("Final alcohol vs starting sugar", "x", "y");
        regular.Axes.Title.Label.Bold = false;

        // When both are rendered
        int darkBold = PngProbe.DarkPixels(ChartImage.RenderPng(bold), 200, 0, 1200, 60);
        int darkRegular = PngProbe.DarkPixels(ChartImage.RenderPng(regular), 200, 0, 1200, 60);

        // Then the bold title covers clearly more pixels (DejaVu Sans Bold strokes are about 1.4× as wide)
        Assert.True(darkBold > darkRegular * 1.2, $"bold {darkBold} vs regular {darkRegular}");
    }

    [Fact]
    public void A_rendered_chart_decodes_at_its_stated_size()
    {
        // Given a chart with a series
        var plot = ChartStyle.NewPlot("Sizes", "x", "y");
        plot.Add.Scatter(new double[] { 1, 2, 3 }, new double[] { 3, 1, 2 }, ChartPalette.ForIndex(0));

        // When rendered at 1600×1000 and at 800×500
        var big = PngProbe.Size(ChartImage.RenderPng(plot, 1600, 1000));
        var small = PngProbe.Size(ChartImage.RenderPng(plot, 800, 500));

        // Then each decodes at the size asked for
        Assert.Equal((1600, 1000), big);
        Assert.Equal((800, 500), small);
    }

    [Fact]
    public void The_palette_wraps_around_for_many_series()
    {
        // Given more series than palette colours
        int n = ChartPalette.Series.Count;

        // When colours are asked for past the end
        // Then they wrap around, and the first colour is the Okabe–Ito blue #0072B2
        Assert.Equal(ChartPalette.ForIndex(0), ChartPalette.ForIndex(n));
        Assert.Equal("#0072B2", ChartPalette.ForIndex(0).ToHex().Substring(0, 7).ToUpperInvariant());
    }
}
