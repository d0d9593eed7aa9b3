using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Units;
using YieldBench.Reports.Output;

namespace YieldBench.Reports.Tests.Output;

/// <summary>A cellar with one strain: the console and the page say there is nothing to compare.</summary>
public sealed class OneStrainTests
{
    [Fact]
    public void A_cellar_of_one_strain_is_told_there_is_no_other_strain_to_compare_it_with()
    {
        // Given two seasons of 12 lots, all of one invented strain
        var rng = new Random(3);
        var lots = Enumerable.Range(0, 24).Select(i => new Lot
        {
            LotId = $"L{i:00}",
            Season = 2024 + (i / 12),
            Strain = "ST-A",
            StartingSugar = SugarReading.FromBrix(22.0 + (0.25 * (i % 12))),
            FinalAlcohol = AlcoholContent.FromPercentVolume(Math.Round((0.59 * (22.0 + (0.25 * (i % 12)))) + ((rng.NextDouble() - 0.5) * 0.2), 2)),
            ResidualSugarGl = 1.5,
        }).ToList();
        var review = ReviewRunner.Run(new SeasonSet { Lots = lots }, new ReviewSettings(), "9.9.9-test");

        // When the console summary and the page are written
        var console = string.Join(" ", ConsoleSummary.Lines(review, new ReportOutput("out", [], [])));
        string page = YieldBench.Reports.Html.HtmlReport.Render(review);

        // Then each says there is one strain and nothing to compare, not that a comparison "could not be fitted"
        Assert.Contains("One strain only: ST-A ", console, StringComparison.Ordinal);
        Assert.Contains("there is no other strain to compare it with", console, StringComparison.Ordinal);
        Assert.DoesNotContain("could not be fitted", console, StringComparison.Ordinal);
        Assert.Contains("One strain only, so there is nothing to compare", page, StringComparison.Ordinal);
    }
}
