using YieldBench.Reports.Charts;
using YieldBench.Reports.Tests.Fixtures;

namespace YieldBench.Reports.Tests.Charts;

public sealed class ReviewChartsTests
{
    private static readonly Core.Review.ReviewResult Review = SampleReview.Build();

    public static TheoryData<string> ChartNames => new() { "alcohol-vs-sugar", "factor-by-strain", "factor-by-season", "backtest-error", "factor-histogram" };

    private static ScottPlot.Plot Make(string name) => name switch
    {
        "alcohol-vs-sugar" => ReviewCharts.AlcoholVsSugar(Review),
        "factor-by-strain" => ReviewCharts.FactorByStrain(Review),
        "factor-by-season" => ReviewCharts.FactorBySeason(Review),
        "backtest-error" => ReviewCharts.BacktestError(Review),
        "factor-histogram" => ReviewCharts.FactorHistogram(Review),
        _ => throw new ArgumentOutOfRangeException(nameof(name)),
    };

    [Theory]
    [MemberData(nameof(ChartNames))]
    public void Each_review_chart_decodes_at_1600_by_1000_with_a_title_and_drawn_content(string name)
    {
        // Given a review chart of the sample review
        byte[] png = ChartImage.RenderPng(Make(name));

        // When decoded and probed
        var size = PngProbe.Size(png);
        int titleInk = PngProbe.DarkPixels(png, 200, 0, 1200, 60);
        double plotVariance = PngProbe.GreyVariance(png, 200, 100, 1300, 750);

        // Then it has the report size, a title in ink, and a plot area far less uniform than an empty chart's grid
        double emptyVariance = PngProbe.GreyVariance(ChartImage.RenderPng(ChartStyle.NewPlot("Empty", "x", "y")), 200, 100, 1300, 750);
        Assert.Equal((1600, 1000), size);
        Assert.True(titleInk > 1500, $"{name}: {titleInk} dark pixels in the title band");
        Assert.True(plotVariance > 100 && plotVariance > 5 * emptyVariance, $"{name}: plot-area variance {plotVariance:0}, empty chart {emptyVariance:0}");
    }

    [Theory]
    [MemberData(nameof(ChartNames))]
    public void The_same_review_draws_the_same_chart_bytes(string name)
    {
        // Given one chart drawn twice, and an empty chart of the same size as a reference
        byte[] first = ChartImage.RenderPng(Make(name));
        byte[] second = ChartImage.RenderPng(Make(name));
        byte[] empty = ChartImage.RenderPng(ChartStyle.NewPlot("Empty", "x", "y"));

        // When their hashes are compared
        string Hash(byte[] b) => Convert.ToHexString(System.Security.Cryptography.SHA256.HashData(b));

        // Then the two drawings are byte-identical (no random jitter, no clock), and the comparison is sensitive:
        // the drawn chart's bytes differ from an empty chart's
        Assert.Equal(Hash(first), Hash(second));
        Assert.NotEqual(Hash(empty), Hash(first));
        Assert.True(first.Length > empty.Length, $"{name}: {first.Length} bytes, empty chart {empty.Length}");
    }

    [Fact]
    public void Strains_are_drawn_most_lots_first_then_by_code()
    {
        // Given the sample review (three strains of twelve lots each)
        // When the chart order is asked for
        // Then ties in lot count fall back to ordinal code order
        Assert.Equal(["ST-A", "ST-B", "ST-C"], ReviewCharts.StrainOrder(Review));
    }
}
