using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Statistics;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Review;

/// <summary>The strain course of sugar over time (held in the review result for the strain-curves chart).</summary>
public sealed class SugarCourseTests
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

    private static FermentationLog Log(string id, double stepHours, double[] brix, double[] temps) =>
        new(id, 2025, brix.Select((b, i) => new LogReading(Start.AddHours(i * stepHours), SugarReading.FromBrix(b), temps[i], new SourceRef("logs.csv", null, i + 2))).ToArray());

    /// <summary>
    /// An invented cellar: 130 healthy lots of KX-11 (sigmoid declines to dry at staggered speeds) whose logs stop at
    /// different times after dry (12 to 20 days), and 12 KX-11 lots that stick at about 10 °Brix; twice-daily readings.
    /// </summary>
    private static IReadOnlyList<LotKinetics> Staggered()
    {
        var lots = new List<LotConversion>();
        var logs = new List<FermentationLog>();
        void Add(string id, Func<double, double> brix, int readings = 41)
        {
            lots.Add(Lot(id, "KX-11"));
            var b = Enumerable.Range(0, readings).Select(i => Math.Round(brix(i * 12.0), 2)).ToArray();
            logs.Add(Log(id, 12, b, b.Select(_ => 22.0).ToArray()));
        }

        for (int i = 0; i < 130; i++)
        {
            double mid = 60 + ((i % 13) * 6);
            Add($"K-{i:000}", t => -1.5 + (25.5 / (1 + Math.Exp((t - mid) / 14.0))), 25 + (i % 17));
        }

        for (int i = 0; i < 12; i++)
        {
            Add($"S-{i:000}", t => Math.Max(10.0 + (0.01 * i), -1.5 + (25.5 / (1 + Math.Exp((t - 60) / 14.0)))));
        }

        return KineticsAnalysis.Run(lots, logs, KineticsSettings.Default).Lots;
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
            lots.Add(Lot($"L-{i}", "KX-11"));
            double[] b = [20, 20 - i, 20 - (2 * i), 20 - (3 * i), 20 - (4 * i)];
            logs.Add(Log($"L-{i}", 12, b, [15, 15, 15, 15, 15]));
        }

        var review = KineticsAnalysis.Run(lots, logs, KineticsSettings.Default);

        // When the strain course is taken
        var course = SugarCourse.Of("KX-11", review.Lots);

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
            lots.Add(Lot($"D-{i}", "KX-11"));
            logs.Add(Log($"D-{i}", 12, [20, 8, -1.5], [15, 15, 15]));
            lots.Add(Lot($"U-{i}", "KX-11"));
            logs.Add(Log($"U-{i}", 12, [20, 19, 18, 17, 16, 15, 14, 13, 12], [15, 15, 15, 15, 15, 15, 15, 15, 15]));
        }

        var review = KineticsAnalysis.Run(lots, logs, KineticsSettings.Default);
        Assert.Equal(3, review.Lots.Count(k => k.HoursToDry is not null));

        // When the course is taken
        var course = SugarCourse.Of("KX-11", review.Lots);

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
            lots.Add(Lot($"T-{i}", "KX-11"));
            double[] b = i == 0 ? [20, 19, 18, 17, 16, 15, 14] : [20, 19, 18];
            logs.Add(Log($"T-{i}", 12, b, b.Select(_ => 15.0).ToArray()));
        }

        var review = KineticsAnalysis.Run(lots, logs, KineticsSettings.Default);

        // When the course is taken
        var course = SugarCourse.Of("KX-11", review.Lots);

        // Then it ends at 30 h (ten known); past it only one lot is known, under the five needed
        Assert.Equal(1.25, course.Days[^1], 9);
        Assert.All(course.Counted, c => Assert.Equal(10, c));
    }

    [Fact]
    public void The_course_matches_its_definition_computed_the_slow_way()
    {
        // Given the cellar's KX-11 lots (staggered healthy ferments whose logs stop at different times after dry, and
        // stuck ones that never reach dry)
        var lots = Staggered();
        Assert.True(lots.Count(k => k.HoursToDry is not null && k.DurationHours < lots.Max(x => x.DurationHours)) > 50);

        // When the course is taken, and the definition is applied directly at each of its steps: every lot known at t
        // (interpolated within its log, or at its last reading after it when it reached dry), sorted, type-7 quartiles
        var course = SugarCourse.Of("KX-11", lots);
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

            var sorted = Descriptive.ToSortedArray(known);

            // Then each step agrees with the definition
            Assert.Equal(sorted.Length, course.Counted[s]);
            Assert.Equal(Descriptive.QuantileOfSorted(sorted, 0.25), course.Q1[s], 12);
            Assert.Equal(Descriptive.QuantileOfSorted(sorted, 0.5), course.Median[s], 12);
            Assert.Equal(Descriptive.QuantileOfSorted(sorted, 0.75), course.Q3[s], 12);
        }
    }

    [Fact]
    public void The_review_holds_one_course_per_strain_in_its_strain_order_with_its_flagged_lots_counted()
    {
        // Given a review of six logged lots of one strain and none of another (three reach dry, three stall high)
        var lots = new List<Lot>();
        var logs = new List<FermentationLog>();
        for (int i = 0; i < 3; i++)
        {
            lots.Add(Lot($"D-{i}", "KX-11").Lot);
            logs.Add(Log($"D-{i}", 12, [20, 8, -1.5], [15, 15, 15]));
            lots.Add(Lot($"U-{i}", "KX-11").Lot);
            logs.Add(Log($"U-{i}", 24, [20, 15, 12, 12, 12, 12, 12, 12], [15, 15, 15, 15, 15, 15, 15, 15]));
        }

        lots.Add(Lot("N-1", "BR-4").Lot);
        var review = ReviewRunner.Run(new SeasonSet { Lots = lots, Logs = logs }, new ReviewSettings(), "test");

        // When its courses are read
        var courses = review.Figures.Courses;

        // Then there is one per strain of the strain order (KX-11 first: most lots), each the course of that strain's
        // logged lots, and the flagged count is the lots with a kinetics flag
        Assert.Equal(["KX-11", "BR-4"], review.Figures.StrainOrder);
        Assert.Equal(["KX-11", "BR-4"], courses.Select(c => c.Strain));
        Assert.Equal(SugarCourse.Of("KX-11", review.Kinetics!.Lots).Median, courses[0].Median);
        Assert.Equal(review.Kinetics.Lots.Count(k => k.Flagged), courses[0].Flagged);
        Assert.InRange(courses[0].Flagged, 1, 6);
        Assert.Equal(0, courses[1].Lots);
    }
}
