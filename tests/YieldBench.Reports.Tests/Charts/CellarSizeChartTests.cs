using ScottPlot;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Tests.Fixtures;

namespace YieldBench.Reports.Tests.Charts;

/// <summary>The charts at the sizes wineries have: twenty strains, and a small cellar of one season.</summary>
public sealed class CellarSizeChartTests
{
    private static readonly Lazy<Core.Review.ReviewResult> Twenty = new(() => Cellars.Large(strains: 20, lotsPerSeason: 6, seasons: 2));
    private static readonly Lazy<Core.Review.ReviewResult> Small = new(Cellars.Small);

    [Fact]
    public void Twenty_strains_on_the_alcohol_chart_each_get_their_own_colour_and_marker_pair_and_the_legend_goes_beside_the_plot()
    {
        // Given a cellar of twenty strains
        var plot = ReviewCharts.AlcoholVsSugar(Twenty.Value);

        // When the strains' point clouds are listed
        var clouds = plot.GetPlottables().OfType<MarkerCloud>().Where(c => c.LegendText.StartsWith("LG-", StringComparison.Ordinal)).ToArray();

        // Then there are twenty, no two alike in colour and shape, and the legend is not drawn over the data
        Assert.Equal(20, clouds.Length);
        Assert.Equal(20, clouds.Select(c => (c.Color.ToHex(), c.Shape)).Distinct().Count());
        Assert.False(plot.Legend.IsVisible);
        Assert.Contains(plot.Axes.GetPanels(), p => p is ScottPlot.Panels.LegendPanel);
    }

    [Fact]
    public void Three_strains_keep_circles_and_the_legend_inside_the_plot()
    {
        // Given the sample review's three strains
        var plot = ReviewCharts.AlcoholVsSugar(SampleReview.Build());

        // Then its points are circles and the legend sits in the plot's corner as before
        Assert.All(plot.GetPlottables().OfType<MarkerCloud>().Where(c => c.LegendText.StartsWith("ST-", StringComparison.Ordinal)), c => Assert.Equal(MarkerShape.FilledCircle, c.Shape));
        Assert.True(plot.Legend.IsVisible);
        Assert.DoesNotContain(plot.Axes.GetPanels(), p => p is ScottPlot.Panels.LegendPanel);
    }

    [Fact]
    public void A_chart_of_many_bars_but_one_legend_entry_keeps_its_legend_inside()
    {
        // Given the backtest chart: nine bars and error bars, one named line
        var plot = ReviewCharts.BacktestError(SampleReview.Build());

        // Then only named entries count, and its one entry stays in the plot's corner
        Assert.True(plot.Legend.IsVisible);
        Assert.DoesNotContain(plot.Axes.GetPanels(), p => p is ScottPlot.Panels.LegendPanel);
    }

    [Fact]
    public void Two_vessel_types_get_the_by_vessel_chart()
    {
        // Given the twenty-strain cellar in tanks and barrels
        var planned = ReviewCharts.Plan(Twenty.Value, "charts").Select(c => Path.GetFileName(c.File.Path));

        // Then the strain-by-vessel chart is drawn
        Assert.Contains(ReviewCharts.Files.StrainByVessel, planned);
    }

    [Fact]
    public void Twenty_strains_on_the_season_chart_stay_within_their_own_season()
    {
        // Given a cellar of twenty strains over two seasons
        var plot = ReviewCharts.FactorBySeason(Twenty.Value);

        // When the strains' season medians are read back
        var xs = plot.GetPlottables().OfType<ScottPlot.Plottables.Scatter>().SelectMany(s => s.Data.GetScatterPoints()).Select(p => p.X).ToArray();

        // Then every one lies within 0.4 of its season, so no strain is drawn over the neighbouring season or off the axis
        Assert.Equal(40, xs.Length);
        Assert.All(xs, x => Assert.True(Math.Abs(x - Math.Round(x)) <= 0.4, $"median drawn at {x}"));
    }

    [Fact]
    public void Twenty_strain_labels_alternate_between_two_rows_and_three_stay_on_one()
    {
        // Given the factor-by-strain chart of twenty strains and of three
        var many = BottomTicks(ReviewCharts.FactorByStrain(Twenty.Value));
        var few = BottomTicks(ReviewCharts.FactorByStrain(SampleReview.Build()));

        // Then with twenty every second label starts two lines lower (below its neighbours' two lines); with three none does
        Assert.Equal(20, many.Length);
        Assert.All(many.Where((t, i) => i % 2 == 1), t => Assert.StartsWith("\n\nLG-", t.Label, StringComparison.Ordinal));
        Assert.All(many.Where((t, i) => i % 2 == 0), t => Assert.StartsWith("LG-", t.Label, StringComparison.Ordinal));
        Assert.All(few, t => Assert.StartsWith("ST-", t.Label, StringComparison.Ordinal));
    }

    [Fact]
    public void A_strain_of_one_lot_is_labelled_1_lot_and_a_cellar_of_one_season_and_one_vessel_type_gets_no_by_season_or_by_vessel_chart()
    {
        // Given a small cellar: one season, stainless tanks only, a strain of nine lots and one of a single lot
        var review = Small.Value;

        // When its charts are planned and the factor-by-strain chart is drawn
        var planned = ReviewCharts.Plan(review, "charts").Select(c => Path.GetFileName(c.File.Path)).ToArray();
        var ticks = BottomTicks(ReviewCharts.FactorByStrain(review));

        // Then the single lot reads "1 lot", and there is no by-season chart of one season nor by-vessel chart of one vessel type
        Assert.Equal(["SM-A\n9 lots", "SM-B\n1 lot"], ticks.Select(t => t.Label));
        Assert.DoesNotContain(ReviewCharts.Files.FactorBySeason, planned);
        Assert.DoesNotContain(ReviewCharts.Files.StrainByVessel, planned);
        Assert.Contains(ReviewCharts.Files.FactorByStrain, planned);
    }

    [Fact]
    public void Twenty_strains_in_five_vessel_types_get_lot_counts_that_do_not_overlap()
    {
        // Given twenty strains, each in five vessel types (100 bars)
        var lots = new List<Core.Lots.Lot>();
        string[] vessels = ["Barrel", "Concrete egg", "Open-top bin", "Puncheon", "Stainless tank"];
        for (int i = 0; i < 600; i++)
        {
            double brix = 21.5 + (0.3 * (i % 13));
            lots.Add(new Core.Lots.Lot
            {
                LotId = $"V{i + 1:000}",
                Season = 2023 + (i % 3),
                Strain = $"LG-{(i % 20) + 1:00}",
                Vessel = vessels[i / 20 % 5],
                StartingSugar = Core.Units.SugarReading.FromBrix(brix),
                FinalAlcohol = Core.Units.AlcoholContent.FromPercentVolume(Math.Round((0.58 + (0.0005 * (i % 7))) * brix, 2)),
                ResidualSugarGl = 1.5,
                Source = new Core.Lots.SourceRef("lots.csv", null, i + 2),
            });
        }

        var review = Core.Review.ReviewRunner.Run(new Core.Lots.SeasonSet { Lots = lots, Files = [new Core.Lots.InputFile("lots.csv", new string('f', 64), 9000)] }, new Core.Review.ReviewSettings(), "9.9.9-test");

        // When the strain-by-vessel chart is drawn
        var plot = StrainCharts.ByVessel(review);
        ChartImage.RenderPng(plot);
        var labels = plot.GetPlottables().OfType<ScottPlot.Plottables.Text>().ToArray();

        // Then there is a count for each of the 100 groups and no two counts' boxes (the digits at the label's font
        // size, about 0.62 em wide each and 1.2 em tall) overlap on the picture
        Assert.Equal(100, labels.Length);
        var boxes = labels.Select(l =>
        {
            var at = plot.GetPixel(l.Location);
            double w = l.LabelText.Length * l.LabelFontSize * 0.62, h = l.LabelFontSize * 1.2;
            return (Left: at.X - (w / 2), Right: at.X + (w / 2), Top: at.Y - (h / 2), Bottom: at.Y + (h / 2), l.LabelText);
        }).ToArray();
        for (int a = 0; a < boxes.Length; a++)
        {
            for (int b = a + 1; b < boxes.Length; b++)
            {
                bool overlap = boxes[a].Left < boxes[b].Right && boxes[b].Left < boxes[a].Right && boxes[a].Top < boxes[b].Bottom && boxes[b].Top < boxes[a].Bottom;
                Assert.False(overlap, $"{boxes[a]} overlaps {boxes[b]}");
            }
        }
    }

    [Fact]
    public void Twenty_strains_compared_put_each_value_beside_its_bar_on_the_strain_s_own_row()
    {
        // Given the adjusted comparison of twenty strains
        var plot = StrainCharts.AdjustedFactors(Twenty.Value);
        ChartImage.RenderPng(plot);
        var rows = plot.Axes.Left.TickGenerator.Ticks;
        var labels = plot.GetPlottables().OfType<ScottPlot.Plottables.Text>().ToArray();

        // Then each row's name is on one line, and each value label sits on a row (not between two) to the right
        Assert.Equal(20, rows.Length);
        Assert.All(rows, t => Assert.DoesNotContain('\n', t.Label));
        Assert.Equal(20, labels.Length);
        Assert.All(labels, l => Assert.Equal(Alignment.MiddleLeft, l.LabelAlignment));
        Assert.Equal(rows.Select(t => t.Position).Order(), labels.Select(l => l.Location.Y).Order());
    }

    [Fact]
    public void A_long_subtitle_over_a_plot_narrowed_by_a_legend_beside_it_is_broken_onto_two_lines()
    {
        // Given a subtitle of 120 characters with clause breaks
        const string text = "811 of 1,026 lots drawn: all 18 flagged (strain colour), up to 40 others per strain (grey); median and quartiles of all 1,026";

        // When it is put over the twenty-strain chart (legend beside) and over the three-strain chart (legend inside)
        var beside = ChartStyle.Subtitle(ReviewCharts.AlcoholVsSugar(Twenty.Value), text).Label.Text;
        var inside = ChartStyle.Subtitle(ReviewCharts.AlcoholVsSugar(SampleReview.Build()), text).Label.Text;

        // Then beside a legend it is broken at the semicolon into two lines that each fit, and inside it stays whole
        Assert.Equal("811 of 1,026 lots drawn: all 18 flagged (strain colour), up to 40 others per strain (grey);\nmedian and quartiles of all 1,026", beside);
        Assert.All(beside.Split('\n'), line => Assert.True(line.Length <= ChartStyle.SubtitleBesideLegend, line));
        Assert.Equal(text, inside);
    }

    // A tick generator lists its ticks once the chart has been laid out.
    private static Tick[] BottomTicks(Plot plot)
    {
        ChartImage.RenderPng(plot);
        return plot.Axes.Bottom.TickGenerator.Ticks;
    }
}
