using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.HouseFactor;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Review;

/// <summary>The numbers the review's charts draw, worked out in Core: rate courses, planning curves, the panel order.</summary>
public sealed class ChartFiguresTests
{
    private static readonly DateTime Start = DateTime.ParseExact("2025-09-28 08:00", "yyyy-MM-dd HH:mm", CultureInfo.InvariantCulture);

    private static LotConversion Lot(string id, string strain) =>
        ConversionFactors.For(
            new Lot
            {
                LotId = id,
                Season = 2025,
                Strain = strain,
                StartingSugar = SugarReading.FromBrix(24.0),
                FinalAlcohol = AlcoholContent.FromPercentVolume(14.0),
                Colour = WineColour.White,
                InoculationDate = Start.AddHours(-6),
            },
            SugarModel.Default);

    private static FermentationLog Log(string id, double stepHours, double[] brix) =>
        new(id, 2025, brix.Select((b, i) => new LogReading(Start.AddHours(i * stepHours), SugarReading.FromBrix(b), 15.0, new SourceRef("logs.csv", null, i + 2))).ToArray());

    [Fact]
    public void A_rate_course_is_the_quartiles_over_lots_of_each_lots_median_rate_in_a_one_brix_band()
    {
        // Given five lots of one strain read every 12 h, falling 0.1·i °Brix per reading from 20.3 °Brix (i = 1…4: two
        // intervals at 0.2·i °Brix/day), and a fifth read ten times as often that falls 0.05 °Brix every 1.2 h
        // (1.0 °Brix/day); every interval's middle sugar lies in [19.5, 20.5), the band centred on 20 °Brix
        var lots = new List<LotConversion>();
        var logs = new List<FermentationLog>();
        for (int i = 1; i <= 4; i++)
        {
            lots.Add(Lot($"L-{i}", "KX-11"));
            logs.Add(Log($"L-{i}", 12, [20.3, 20.3 - (0.1 * i), 20.3 - (0.2 * i)]));
        }

        lots.Add(Lot("L-5", "KX-11"));
        logs.Add(Log("L-5", 1.2, Enumerable.Range(0, 11).Select(j => 20.3 - (0.05 * j)).ToArray()));
        var review = KineticsAnalysis.Run(lots, logs, KineticsSettings.Default);

        // When the strain's rate course is taken
        var course = RateCourses.Of("KX-11", review.Lots);

        // Then there is one band, at 20 °Brix, over all five lots, each counted once whatever its number of readings:
        // lot rates 0.2, 0.4, 0.6, 0.8, 1.0 give type-7 quartiles 0.4, 0.6, 0.8 (by hand; a count-weighted median
        // would be 1.0, the fifth lot having most of the points)
        Assert.Equal(5, course.Lots);
        Assert.Equal([20.0], course.Brix);
        Assert.Equal([5], course.Counted);
        Assert.Equal(0.4, course.Q1[0], 9);
        Assert.Equal(0.6, course.Median[0], 9);
        Assert.Equal(0.8, course.Q3[0], 9);
    }

    [Fact]
    public void A_band_with_fewer_than_five_lots_is_left_out()
    {
        // Given four lots falling through the 20 °Brix band only
        var lots = new List<LotConversion>();
        var logs = new List<FermentationLog>();
        for (int i = 1; i <= 4; i++)
        {
            lots.Add(Lot($"L-{i}", "KX-11"));
            logs.Add(Log($"L-{i}", 12, [20.3, 20.3 - (0.1 * i), 20.3 - (0.2 * i)]));
        }

        var review = KineticsAnalysis.Run(lots, logs, KineticsSettings.Default);

        // When the course is taken
        var course = RateCourses.Of("KX-11", review.Lots);

        // Then it counts the lots but gives no band (five are needed)
        Assert.Equal(4, course.Lots);
        Assert.Empty(course.Brix);
    }

    [Fact]
    public void The_planning_curve_gives_the_planners_answer_at_every_target_and_confidence()
    {
        // Given a line through the origin at 0.6 % v/v per °Brix with 100 spread held-out errors, learned from lots
        // between 20 and 26 °Brix
        var rng = new Random(3);
        var errors = Enumerable.Range(0, 100).Select(i => new SeasonError(Math.Round((rng.NextDouble() - 0.5) * 0.8, 3), 2020 + (i % 4), "SX-01")).ToArray();
        var line = new PlanningLine("SX-01", "test", SugarCurve.Line, 0, 0.6, 100, errors, "test errors");
        var model = new PlanningModel(line, [line], "test") { HistoryLowBrix = 20, HistoryHighBrix = 26, ReferenceBrix = 23 };

        // When its targets and curves are taken
        var targets = PlanningCurves.Targets(model);
        var curves = PlanningCurves.Of(model, ["SX-01"]);

        // Then the targets run from 12.0 (0.6 × 20) to 15.5 (0.6 × 26 = 15.6, up to the next half: 16.0) every 0.1
        Assert.Equal(12.0, targets[0], 12);
        Assert.Equal(16.0, targets[^1], 12);
        Assert.Equal(41, targets.Count);

        // And each point is the planner's highest sugar at that target and confidence; with even odds and no error
        // allowance it would be target ÷ 0.6 (14.4 → 24.0 °Brix): the 95 % answer is lower than the 80 %, lower than even odds
        Assert.Equal(2, curves.Count);
        var c = curves[1];
        Assert.Equal("SX-01", c.Strain);
        for (int i = 0; i < targets.Count; i += 7)
        {
            Assert.Equal(Planner.HighestSugar(line, targets[i], 0.5).HighestBrix, c.EvenOdds[i], 9);
            Assert.Equal(Planner.HighestSugar(line, targets[i], 0.8).HighestBrix, c.Confident80[i], 9);
            Assert.Equal(Planner.HighestSugar(line, targets[i], 0.95).HighestBrix, c.Confident95[i], 9);
            Assert.True(c.Confident95[i] < c.Confident80[i] && c.Confident80[i] < c.EvenOdds[i], $"at {targets[i]}");
        }

        var noErrors = PlanningCurves.Curve(line with { Errors = [] }, [14.4]);
        Assert.Equal(24.0, noErrors.EvenOdds[0], 9);
        Assert.True(double.IsNaN(noErrors.Confident80[0]));
    }

    [Fact]
    public void Without_a_sugar_range_there_is_no_planning_curve()
    {
        // Given a model from a factor typed directly (no lots, so no range of starting sugar)
        var model = PlanningModel.FromFactor(0.6);

        // When curves are asked for
        // Then there are none
        Assert.Empty(PlanningCurves.Targets(model));
        Assert.Empty(PlanningCurves.Of(model, []));
        Assert.Empty(PlanningCurves.Of(null, []));
    }

    [Fact]
    public void The_small_multiples_show_lots_by_strain_then_by_length_of_log()
    {
        // Given ST-A with 8 lots and ST-B with 6 (so ST-A comes first), and logs listed ST-B long, ST-B short, ST-A
        // long, ST-A short (10 and 5 daily readings)
        var lots = new List<Lot>();
        for (int i = 0; i < 14; i++)
        {
            double brix = 22 + (0.3 * i);
            lots.Add(new Lot
            {
                LotId = $"L{i:00}",
                Season = 2024 + (i % 2),
                Strain = i < 8 ? "ST-A" : "ST-B",
                StartingSugar = SugarReading.FromBrix(brix),
                FinalAlcohol = AlcoholContent.FromPercentVolume(Math.Round(0.59 * brix, 2)),
                ResidualSugarGl = 1.5,
                InoculationDate = Start.AddHours(-6),
            });
        }

        FermentationLog Daily(string id, int season, int readings) =>
            new(id, season, Enumerable.Range(0, readings).Select(d => new LogReading(Start.AddHours(d * 24), SugarReading.FromBrix(Math.Max(-1.0, 24.0 - (25.0 * d / (readings - 1)))), 18.0)).ToArray());
        var logs = new[] { Daily("L08", 2024, 10), Daily("L09", 2025, 5), Daily("L00", 2024, 10), Daily("L01", 2025, 5) };

        // When reviewed
        var review = ReviewRunner.Run(new SeasonSet { Lots = lots, Logs = logs }, new ReviewSettings(), "test");

        // Then the panels run ST-A short, ST-A long, ST-B short, ST-B long
        var k = review.Kinetics!.Lots;
        Assert.Equal(["L01", "L00", "L09", "L08"], review.Figures.KineticsPanels.Select(i => k[i].Lot.LotId));
    }
}
