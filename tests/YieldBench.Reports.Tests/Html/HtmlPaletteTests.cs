using System.Globalization;
using Xunit.Abstractions;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Html;

namespace YieldBench.Reports.Tests.Html;

/// <summary>
/// The page's colours pass WCAG 2 AA: every foreground and background the page puts together is computed here with the
/// WCAG 2.1 definitions of relative luminance and contrast ratio (W3C Recommendation, 2018, §1.4.3 and "relative
/// luminance" in the glossary).
/// </summary>
public sealed class HtmlPaletteTests(ITestOutputHelper output)
{
    /// <summary>WCAG 2.1 relative luminance of a #RRGGBB colour (sRGB, linearised with the 0.03928 threshold).</summary>
    internal static double Luminance(string hex)
    {
        double Channel(int at)
        {
            double c = int.Parse(hex.AsSpan(at, 2), NumberStyles.HexNumber, CultureInfo.InvariantCulture) / 255.0;
            return c <= 0.03928 ? c / 12.92 : Math.Pow((c + 0.055) / 1.055, 2.4);
        }

        return (0.2126 * Channel(1)) + (0.7152 * Channel(3)) + (0.0722 * Channel(5));
    }

    /// <summary>WCAG 2.1 contrast ratio (L1 + 0.05) / (L2 + 0.05), the lighter colour's luminance on top.</summary>
    internal static double Contrast(string a, string b)
    {
        double la = Luminance(a), lb = Luminance(b);
        return (Math.Max(la, lb) + 0.05) / (Math.Min(la, lb) + 0.05);
    }

    [Theory]
    [InlineData("#000000", "#FFFFFF", 21.0)]
    [InlineData("#767676", "#FFFFFF", 4.54)]
    [InlineData("#777777", "#FFFFFF", 4.48)]
    [InlineData("#0072B2", "#FFFFFF", 5.185)]
    public void The_contrast_computation_gives_published_ratios(string foreground, string background, double expected)
    {
        // Given colour pairs whose ratios are published: black on white is 21:1 by definition; #767676 on white 4.54:1
        // and #777777 4.48:1, the usual examples of just passing and just failing AA (WebAIM contrast checker, from
        // memory); #0072B2 5.185:1 worked by hand from the same formulas (python3, the WCAG formulas typed anew)
        // Then the computation gives them to within half of the last published digit
        Assert.InRange(Contrast(foreground, background), expected - 0.005, expected + 0.005);
    }

    [Fact]
    public void Every_colour_pair_on_the_page_passes_WCAG_AA()
    {
        // Given every foreground and background the page uses together
        // When each pair's contrast ratio is computed
        var failing = new List<string>();
        foreach (var p in HtmlPalette.Pairs)
        {
            double ratio = Contrast(p.Foreground, p.Background);
            output.WriteLine($"{p.Use}: {p.Foreground} on {p.Background} = {ratio:0.00}:1 (needs {p.Minimum:0.0})");
            if (ratio < p.Minimum)
            {
                failing.Add($"{p.Use} {ratio:0.00}");
            }
        }

        // Then each reaches its minimum: 4.5:1 for text, 3:1 for the marks a chart is read by
        Assert.Empty(failing);
    }

    [Fact]
    public void The_page_takes_its_accent_and_rule_colours_from_the_charts_palette()
    {
        // Given the charts' palette (Okabe & Ito)
        // Then the page's accent is its blue and its rule its vermillion, so page and PNG charts agree
        Assert.Equal("#0072B2", HtmlPalette.Accent);
        Assert.Equal("#D55E00", HtmlPalette.Warm);
        Assert.Equal("#" + ChartPalette.HeaderFillHex, HtmlPalette.HeaderFill);
    }

    [Fact]
    public void Of_the_charts_series_colours_only_those_dark_enough_mark_the_page()
    {
        // Given the charts' series colours
        var marks = ChartPalette.Series.Select(c => "#" + c.R.ToString("X2", CultureInfo.InvariantCulture) + c.G.ToString("X2", CultureInfo.InvariantCulture) + c.B.ToString("X2", CultureInfo.InvariantCulture)).ToArray();

        // Then the two the page draws with reach 3:1 on white, and the yellow (which the page never uses) would not
        Assert.True(Contrast(HtmlPalette.Accent, HtmlPalette.Paper) >= 3);
        Assert.True(Contrast(HtmlPalette.Warm, HtmlPalette.Paper) >= 3);
        Assert.Contains("#F0E442", marks);
        Assert.True(Contrast("#F0E442", HtmlPalette.Paper) < 3);
    }
}
