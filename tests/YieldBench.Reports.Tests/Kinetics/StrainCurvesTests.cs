using YieldBench.Core.Conversion;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
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
        var plot = KineticsCharts.StrainOverlay(review.Lots, strains);

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
        var (lots, review) = KineticsReportData.Build();
        var strains = KineticsCharts.StrainOrder(review.Lots, lots);

        // When the lines are chosen and the chart built
        var selection = KineticsCharts.SelectCurves(review.Lots, strains);
        var plot = KineticsCharts.StrainOverlay(review.Lots, strains);

        // Then all four are lines and the subtitle says every lot is drawn
        Assert.Equal((4, 4), (selection.Drawn, selection.Total));
        Assert.Equal(4, plot.GetPlottables().OfType<CurveBundle>().Sum(b => b.Count));
        Assert.StartsWith("Every lot drawn (4)", KineticsCharts.StrainOverlaySubtitle(selection), StringComparison.Ordinal);
    }

    [Fact]
    public void The_course_is_the_type_7_quartiles_of_the_interpolated_curves_at_each_step()
    {
        // Given five lots of one strain falling in straight lines from 20 °Brix at 1 to 5 °Brix per 12 h, read every 12 h
        // for two days (none reaches dry, so no lot counts after its last reading)
        var lots = new List<LotConversion>();
        var logs = new List<FermentationLog>();
        for (int i = 1; i <= 5; i++)
        {
            lots.Add(KineticsReportData.Lot($"L-{i}", "KX-11", WineColour.White));
            double[] b = [20, 20 - i, 20 - (2 * i), 20 - (3 * i), 20 - (4 * i)];
            logs.Add(KineticsReportData.Log($"L-{i}", 12, b, [15, 15, 15, 15, 15]));
        }

        var review = KineticsAnalysis.Run(lots, logs, KineticsSettings.Default);

        // When the strain course is taken
        var course = KineticsCharts.Course("KX-11", review.Lots);

        // Then at 12 h from inoculation (time zero, 6 h before the first reading; half-way to the second reading) the
        // shares are 1 − i/40, i = 1…5: median 1 − 3/40 and quartiles 1 − 4/40 and 1 − 2/40 (type 7 on five values
        // falls on the 2nd and 4th); at 48 h (half-way between 20 − 3i and 20 − 4i) the median is 1 − 10.5/20
        Assert.All(review.Lots, k => Assert.Equal(20.0, k.StartingBrix, 9));
        int at12 = course.Days.ToList().FindIndex(d => Math.Abs(d - 0.5) < 1e-9);
        int at48 = course.Days.ToList().FindIndex(d => Math.Abs(d - 2.0) < 1e-9);
        Assert.True(at12 >= 0 && at48 >= 0, string.Join(", ", course.Days));
        Assert.Equal(1 - (3.0 / 40), course.Median[at12], 9);
        Assert.Equal(1 - (4.0 / 40), course.Q1[at12], 9);
        Assert.Equal(1 - (2.0 / 40), course.Q3[at12], 9);
        Assert.Equal(5, course.Counted[at12]);
        Assert.Equal(1 - (10.5 / 20), course.Median[at48], 9);

        // And the course runs from the first reading (6 h) to the last (54 h): no lot is known outside it
        Assert.Equal(0.25, course.Days[0], 9);
        Assert.Equal(2.25, course.Days[^1], 9);
    }

    [Fact]
    public void A_lot_that_reached_dry_counts_after_its_last_reading_and_one_that_stopped_short_does_not()
    {
        // Given six lots: three reach dry within a day and stop logging; three others log for four days without reaching dry
        var lots = new List<LotConversion>();
        var logs = new List<FermentationLog>();
        for (int i = 0; i < 3; i++)
        {
            lots.Add(KineticsReportData.Lot($"D-{i}", "KX-11", WineColour.White));
            logs.Add(KineticsReportData.Log($"D-{i}", 12, [20, 8, -1.5], [15, 15, 15]));
            lots.Add(KineticsReportData.Lot($"U-{i}", "KX-11", WineColour.White));
            logs.Add(KineticsReportData.Log($"U-{i}", 12, [20, 19, 18, 17, 16, 15, 14, 13, 12], [15, 15, 15, 15, 15, 15, 15, 15, 15]));
        }

        var review = KineticsAnalysis.Run(lots, logs, KineticsSettings.Default);
        Assert.Equal(3, review.Lots.Count(k => k.HoursToDry is not null));

        // When the course is taken
        var course = KineticsCharts.Course("KX-11", review.Lots);

        // Then at four days all six are known: the dry three at their last reading (−1.5/20) and the others half-way
        // between their readings at 90 h (13 °Brix) and 102 h (12 °Brix)
        int at96 = course.Days.ToList().FindIndex(d => Math.Abs(d - 4.0) < 1e-9);
        Assert.True(at96 >= 0, string.Join(", ", course.Days));
        Assert.Equal(6, course.Counted[at96]);
        Assert.Equal(0.5 * ((-1.5 / 20) + (12.5 / 20)), course.Median[at96], 9);
    }

    [Fact]
    public void The_course_stops_where_fewer_than_half_of_the_strain_s_lots_are_known()
    {
        // Given ten lots that stop logging before dry: nine after 30 h from time zero, one after 78 h
        var lots = new List<LotConversion>();
        var logs = new List<FermentationLog>();
        for (int i = 0; i < 10; i++)
        {
            lots.Add(KineticsReportData.Lot($"T-{i}", "KX-11", WineColour.White));
            double[] b = i == 0 ? [20, 19, 18, 17, 16, 15, 14] : [20, 19, 18];
            logs.Add(KineticsReportData.Log($"T-{i}", 12, b, b.Select(_ => 15.0).ToArray()));
        }

        var review = KineticsAnalysis.Run(lots, logs, KineticsSettings.Default);

        // When the course is taken
        var course = KineticsCharts.Course("KX-11", review.Lots);

        // Then it ends at 30 h (ten known); past it only one lot is known, under the five needed
        Assert.Equal(1.25, course.Days[^1], 9);
        Assert.All(course.Counted, c => Assert.Equal(10, c));
    }

    [Fact]
    public void Strains_take_the_colour_order_of_the_review_charts()
    {
        // Given lots where KX-11 has more lots than BR-4, which comes first by code
        var (lots, review) = KineticsReportData.Build();

        // When the kinetics charts' strain order is asked for
        var order = KineticsCharts.StrainOrder(review.Lots, lots);

        // Then it is most lots first (KX-11 has three of five lots), then code, as on every other chart
        Assert.Equal(["KX-11", "BR-4"], order);
    }

    [Fact]
    public void Nice_steps_are_one_two_or_five_times_a_power_of_ten()
    {
        Assert.Equal(5, KineticsCharts.NiceStep(0, 28, 6));
        Assert.Equal(1, KineticsCharts.NiceStep(0, 7.2, 8));
        Assert.Equal(0.2, KineticsCharts.NiceStep(0, 1.1, 6), 12);
        Assert.Equal(20, KineticsCharts.NiceStep(-1, 95, 5));
    }
    [Fact]
    public void The_course_matches_its_definition_computed_the_slow_way()
    {
        // Given the cellar's KX-11 lots (staggered healthy ferments whose logs stop at different times after dry, and
        // stuck ones that never reach dry)
        var (_, review) = Cellar();
        var lots = review.Lots.Where(k => k.Lot.Strain == "KX-11").ToArray();
        Assert.True(lots.Count(k => k.HoursToDry is not null && k.DurationHours < lots.Max(x => x.DurationHours)) > 50);

        // When the course is taken, and the definition is applied directly at each of its steps: every lot known at t
        // (interpolated within its log, or at its last reading after it when it reached dry), sorted, type-7 quartiles
        var course = KineticsCharts.Course("KX-11", lots);
        Assert.True(course.Days.Count > 20, $"{course.Days.Count} steps");
        for (int s = 0; s < course.Days.Count; s++)
        {
            double t = course.Days[s] * 24.0;
            var known = new List<double>();
            foreach (var k in lots)
            {
                var pts = k.Sugar;
                if (t < pts[0].Hours || (t > pts[^1].Hours && k.HoursToDry is null))
                {
                    continue;
                }

                int i = 0;
                while (i + 1 < pts.Count && pts[i + 1].Hours <= t)
                {
                    i++;
                }

                double brix = i + 1 < pts.Count && pts[i].Hours < t
                    ? pts[i].Brix + ((pts[i + 1].Brix - pts[i].Brix) * (t - pts[i].Hours) / (pts[i + 1].Hours - pts[i].Hours))
                    : pts[i].Brix;
                known.Add(brix / k.StartingBrix);
            }

            var sorted = Core.Statistics.Descriptive.ToSortedArray(known);

            // Then each step agrees with the definition
            Assert.Equal(sorted.Length, course.Counted[s]);
            Assert.Equal(Core.Statistics.Descriptive.QuantileOfSorted(sorted, 0.25), course.Q1[s], 12);
            Assert.Equal(Core.Statistics.Descriptive.QuantileOfSorted(sorted, 0.5), course.Median[s], 12);
            Assert.Equal(Core.Statistics.Descriptive.QuantileOfSorted(sorted, 0.75), course.Q3[s], 12);
        }
    }
}
