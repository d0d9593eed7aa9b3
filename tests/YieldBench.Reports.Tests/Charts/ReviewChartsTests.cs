using YieldBench.Reports.Charts;
using YieldBench.Reports.Tests.Fixtures;

namespace YieldBench.Reports.Tests.Charts;

public sealed class ReviewChartsTests
{
    private static readonly Core.Review.ReviewResult Review = SampleReview.Build();
    private static readonly Lazy<Core.Review.ReviewResult> WithLogs = new(SampleReview.WithLogs);

    private static readonly string[] Full =
    [
        "alcohol-vs-sugar", "factor-by-strain", "factor-by-season", "backtest-error", "strain-factors",
        "backtest-predicted-vs-actual", "planning", "peak-temperature",
    ];

    // Charts that draw few marks on the small sample (six groups; two lots with logs, one of them dry).
    private static readonly string[] Sparse = ["strain-by-vessel", "days-to-dry"];

    public static TheoryData<string> ChartNames => new(Full);

    public static TheoryData<string> SparseChartNames => new(Sparse);

    public static TheoryData<string> AllChartNames => new(Full.Concat(Sparse));

    private static ScottPlot.Plot Make(string name) => name switch
    {
        "alcohol-vs-sugar" => ReviewCharts.AlcoholVsSugar(Review),
        "factor-by-strain" => ReviewCharts.FactorByStrain(Review),
        "factor-by-season" => ReviewCharts.FactorBySeason(Review),
        "backtest-error" => ReviewCharts.BacktestError(Review),
        "strain-factors" => StrainCharts.AdjustedFactors(Review),
        "strain-by-vessel" => StrainCharts.ByVessel(Review),
        "backtest-predicted-vs-actual" => PlanningCharts.PredictedAgainstActual(Review),
        "planning" => PlanningCharts.HighestPickingSugar(Review),
        "days-to-dry" => StrainCharts.DaysToDry(WithLogs.Value)!,
        "peak-temperature" => StrainCharts.PeakTemperature(WithLogs.Value)!,
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
    [MemberData(nameof(SparseChartNames))]
    public void A_chart_of_few_marks_still_decodes_with_a_title_and_marks_beyond_the_empty_grid(string name)
    {
        // Given a chart that has few marks on the sample review
        byte[] png = ChartImage.RenderPng(Make(name));

        // When decoded and probed
        int titleInk = PngProbe.DarkPixels(png, 200, 0, 1200, 60);
        double plotVariance = PngProbe.GreyVariance(png, 200, 100, 1300, 750);
        double emptyVariance = PngProbe.GreyVariance(ChartImage.RenderPng(ChartStyle.NewPlot("Empty", "x", "y")), 200, 100, 1300, 750);

        // Then it has the report size, a title, and clearly more than an empty chart's grid (half as much again)
        Assert.Equal((1600, 1000), PngProbe.Size(png));
        Assert.True(titleInk > 1500, $"{name}: {titleInk} dark pixels in the title band");
        Assert.True(plotVariance > 1.5 * emptyVariance, $"{name}: plot-area variance {plotVariance:0}, empty chart {emptyVariance:0}");
    }

    [Theory]
    [MemberData(nameof(AllChartNames))]
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
