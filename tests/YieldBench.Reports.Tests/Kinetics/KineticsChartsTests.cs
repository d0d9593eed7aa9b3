using YieldBench.Reports.Kinetics;
using YieldBench.Reports.Tests.Charts;

namespace YieldBench.Reports.Tests.Kinetics;

public sealed class KineticsChartsTests : IDisposable
{
    private readonly string dir = Path.Combine(Path.GetTempPath(), "yieldbench-kinetics-charts-" + Guid.NewGuid().ToString("N"));

    public void Dispose()
    {
        if (Directory.Exists(dir))
        {
            Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public void Every_chart_is_written_as_a_decodable_non_blank_png_of_the_report_size()
    {
        // Given the invented review (three flagged lots: hot R-02, stuck W-03, and the dense R-04 if flagged)
        var review = KineticsReportData.FullReview();

        // When the charts are rendered
        var paths = KineticsCharts.Render(review, dir);

        // Then the overview, the strain overlay, the rate chart and one chart per flagged lot exist, each 1600×1000 and drawn on
        var flagged = review.Kinetics!.Lots.Where(l => l.Flagged).Select(l => $"kinetics-lot-2025-{l.Lot.LotId}.png");
        Assert.Equal(
            new[] { "kinetics-overview-1.png", "kinetics-strain-curves.png", "kinetics-rate-vs-sugar.png" }.Concat(flagged),
            paths.Select(Path.GetFileName));
        Assert.Contains("kinetics-lot-2025-W-03.png", paths.Select(Path.GetFileName));
        Assert.Contains("kinetics-lot-2025-R-02.png", paths.Select(Path.GetFileName));
        foreach (var p in paths)
        {
            byte[] png = File.ReadAllBytes(p);
            Assert.Equal((1600, 1000), PngProbe.Size(png));
            Assert.True(PngProbe.GreyVariance(png, 0, 0, 1600, 1000) > 50, $"{Path.GetFileName(p)} looks blank");
        }
    }

    [Fact]
    public void Lot_charts_draw_a_title_and_the_overview_draws_every_panel()
    {
        // Given the review
        var review = KineticsReportData.FullReview();

        // When rendered
        var paths = KineticsCharts.Render(review, dir);

        // Then the lot chart has dark title pixels, and each of the four overview panels (3 × 2 grid: √(1.6·4) → 3 columns) has ink while the unused sixth has none
        byte[] lot = File.ReadAllBytes(paths.Single(p => p.EndsWith("W-03.png", StringComparison.Ordinal)));
        Assert.True(PngProbe.DarkPixels(lot, 300, 0, 1000, 60) > 1500);
        byte[] overview = File.ReadAllBytes(paths[0]);
        var (cols, rows, pw, ph) = KineticsCharts.OverviewLayout(4);
        Assert.Equal((3, 2, 533, 448), (cols, rows, pw, ph));
        for (int i = 0; i < 4; i++)
        {
            Assert.True(PngProbe.GreyVariance(overview, (i % cols) * pw, 70 + ((i / cols) * ph), pw, ph) > 50, $"panel {i} is blank");
        }

        Assert.True(PngProbe.GreyVariance(overview, 2 * pw, 70 + ph, pw, ph) < 1, "the unused sixth panel has ink");
    }

    [Fact]
    public void Rendering_twice_gives_identical_files()
    {
        // Given the review
        var review = KineticsReportData.FullReview();

        // When rendered into two folders
        var a = KineticsCharts.Render(review, Path.Combine(dir, "a"));
        var b = KineticsCharts.Render(review, Path.Combine(dir, "b"));

        // Then the bytes match file for file
        Assert.Equal(a.Count, b.Count);
        for (int i = 0; i < a.Count; i++)
        {
            Assert.Equal(File.ReadAllBytes(a[i]), File.ReadAllBytes(b[i]));
        }
    }
}
