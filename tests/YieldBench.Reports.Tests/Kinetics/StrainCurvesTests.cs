using YieldBench.Core.Conversion;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Kinetics;

namespace YieldBench.Reports.Tests.Kinetics;

public sealed class StrainCurvesTests
{
    /// <summary>
    /// An invented cellar: 130 healthy lots of KX-11 (sigmoid declines to dry at staggered speeds), 12 KX-11 lots that
    /// stick at about 10 °Brix, and 6 healthy lots of BR-4; twice-daily readings, cool ferments. The healthy KX-11 logs
    /// stop at different times after dry (12 to 20 days), the others run 20 days.
    /// </summary>
    private static (IReadOnlyList<LotConversion> Lots, KineticsReview Review) Cellar()
    {
        var lots = new List<LotConversion>();
        var logs = new List<FermentationLog>();
        void Add(string id, string strain, Func<double, double> brix, int readings = 41)
        {
            lots.Add(KineticsReportData.Lot(id, strain, WineColour.Red));
            var b = Enumerable.Range(0, readings).Select(i => Math.Round(brix(i * 12.0), 2)).ToArray();
            logs.Add(KineticsReportData.Log(id, 12, b, b.Select(_ => 22.0).ToArray()));
        }

        for (int i = 0; i < 130; i++)
        {
            double mid = 60 + ((i % 13) * 6);
            Add($"K-{i:000}", "KX-11", t => -1.5 + (25.5 / (1 + Math.Exp((t - mid) / 14.0))), 25 + (i % 17));
        }

        for (int i = 0; i < 12; i++)
        {
            Add($"S-{i:000}", "KX-11", t => Math.Max(10.0 + (0.01 * i), -1.5 + (25.5 / (1 + Math.Exp((t - 60) / 14.0)))));
        }

        for (int i = 0; i < 6; i++)
        {
            Add($"B-{i:000}", "BR-4", t => -1.5 + (25.5 / (1 + Math.Exp((t - 90) / 16.0))));
        }

        return (lots, KineticsAnalysis.Run(lots, logs, KineticsSettings.Default));
    }

    private static IReadOnlyList<StrainCourse> Courses(KineticsReview review, IReadOnlyList<string> strains) =>
        strains.Select(s => SugarCourse.Of(s, review.Lots.Where(k => k.Lot.Strain == s).ToArray())).ToArray();

    [Fact]
    public void Every_flagged_lot_is_drawn_and_at_most_the_cap_of_the_others_per_strain()
    {
        // Given the cellar (the stuck lots are flagged; more than 40 healthy KX-11 lots are not)
        var (_, review) = Cellar();
        var strains = new[] { "KX-11", "BR-4" };
        int flagged = review.Lots.Count(k => k.Flagged);
        int healthyKx = review.Lots.Count(k => !k.Flagged && k.Lot.Strain == "KX-11");
        Assert.True(flagged >= 12, $"{flagged} flagged lots");
        Assert.True(healthyKx > KineticsCharts.MaxOrdinaryCurvesPerStrain, $"{healthyKx} healthy KX-11 lots");

        // When the chart's lines are chosen
        var selection = KineticsCharts.SelectCurves(review.Lots, strains);

        // Then every flagged lot is drawn, KX-11's others are capped at 40 evenly spaced ones, and BR-4's few are all drawn
        Assert.Equal(review.Lots.Where(k => k.Flagged).Select(k => k.LotKey), selection.Flagged.Select(k => k.LotKey));
        var kxOthers = review.Lots.Where(k => !k.Flagged && k.Lot.Strain == "KX-11").ToArray();
        var sampledKx = selection.Sampled.Where(k => k.Lot.Strain == "KX-11").ToArray();
        Assert.Equal(KineticsCharts.MaxOrdinaryCurvesPerStrain, sampledKx.Length);
        Assert.Equal(kxOthers[(int)(0.5 * kxOthers.Length / 40)].LotKey, sampledKx[0].LotKey);
        Assert.Equal(kxOthers[(int)(39.5 * kxOthers.Length / 40)].LotKey, sampledKx[^1].LotKey);
        Assert.Equal(sampledKx.Length, sampledKx.Select(k => k.LotKey).Distinct().Count());
        Assert.Equal(review.Lots.Count(k => !k.Flagged && k.Lot.Strain == "BR-4"), selection.Sampled.Count(k => k.Lot.Strain == "BR-4"));
        Assert.Equal(review.Lots.Count, selection.Total);
    }

    [Fact]
    public void The_chart_draws_exactly_the_chosen_lines_and_its_subtitle_states_the_sample()
    {
        // Given the cellar and its line selection
        var (_, review) = Cellar();
        var strains = new[] { "KX-11", "BR-4" };
        var selection = KineticsCharts.SelectCurves(review.Lots, strains);

        // When the strain-curves chart is built
        var plot = KineticsCharts.StrainOverlay(review.Lots, strains, Courses(review, strains));

        // Then its line bundles hold one curve per chosen lot, and the subtitle says how many of how many are drawn
        int curves = plot.GetPlottables().OfType<CurveBundle>().Sum(b => b.Count);
        Assert.Equal(selection.Drawn, curves);
        Assert.True(selection.Drawn < selection.Total);
        var subtitle = plot.Axes.GetPanels().OfType<ScottPlot.Panels.TitlePanel>().Single(p => p != plot.Axes.Title).Label.Text;
        Assert.StartsWith($"{selection.Drawn} of {selection.Total} lots drawn: all {selection.Flagged.Count} flagged", subtitle, StringComparison.Ordinal);
        Assert.Contains("up to 40 others per strain", subtitle, StringComparison.Ordinal);
        Assert.Contains($"median and quartiles of all {selection.Total}", subtitle, StringComparison.Ordinal);

        // And each strain with a course has its median in the legend with its lot count
        var legend = plot.GetPlottables().OfType<ScottPlot.Plottables.Scatter>().Select(s => s.LegendText).Where(t => t.Length > 0).ToArray();
        Assert.Contains(legend, t => t.StartsWith("KX-11: median, quartiles (142 lots, ", StringComparison.Ordinal));
        Assert.Contains(legend, t => t.StartsWith("BR-4: median, quartiles (6 lots, ", StringComparison.Ordinal));
    }

    [Fact]
    public void With_few_lots_every_lot_is_drawn_and_the_subtitle_says_so()
    {
        // Given the small invented review of the other kinetics tests (four lots with logs)
        var (_, review) = KineticsReportData.Build();
        string[] strains = ["KX-11", "BR-4"];

        // When the lines are chosen and the chart built
        var selection = KineticsCharts.SelectCurves(review.Lots, strains);
        var plot = KineticsCharts.StrainOverlay(review.Lots, strains, Courses(review, strains));

        // Then all four are lines and the subtitle says every lot is drawn
        Assert.Equal((4, 4), (selection.Drawn, selection.Total));
        Assert.Equal(4, plot.GetPlottables().OfType<CurveBundle>().Sum(b => b.Count));
        Assert.StartsWith("Every lot drawn (4)", KineticsCharts.StrainOverlaySubtitle(selection), StringComparison.Ordinal);
    }

    [Fact]
    public void Nice_steps_are_one_two_or_five_times_a_power_of_ten()
    {
        Assert.Equal(5, KineticsCharts.NiceStep(0, 28, 6));
        Assert.Equal(1, KineticsCharts.NiceStep(0, 7.2, 8));
        Assert.Equal(0.2, KineticsCharts.NiceStep(0, 1.1, 6), 12);
        Assert.Equal(20, KineticsCharts.NiceStep(-1, 95, 5));
    }
}
