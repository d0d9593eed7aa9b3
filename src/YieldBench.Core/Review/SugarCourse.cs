using YieldBench.Core.Kinetics;
using YieldBench.Core.Statistics;

namespace YieldBench.Core.Review;

/// <summary>
/// One strain's typical course of sugar remaining (share of the starting °Brix) against days from time zero: the
/// quartiles (Hyndman–Fan type 7) at each <see cref="SugarCourse.StepHours"/> step over the lots known there.
/// </summary>
/// <param name="Strain">Strain code.</param>
/// <param name="Lots">Lots of the strain with a log and a positive starting sugar.</param>
/// <param name="Flagged">Those of them with a kinetics flag.</param>
/// <param name="Days">Time of each step, days from time zero.</param>
/// <param name="Q1">Lower quartile at each step.</param>
/// <param name="Median">Median at each step.</param>
/// <param name="Q3">Upper quartile at each step.</param>
/// <param name="Counted">Lots known at each step.</param>
public sealed record StrainCourse(
    string Strain, int Lots, int Flagged, IReadOnlyList<double> Days, IReadOnlyList<double> Q1, IReadOnlyList<double> Median, IReadOnlyList<double> Q3, IReadOnlyList<int> Counted);

/// <summary>The strain courses of sugar over time (the strain-curves chart draws them).</summary>
public static class SugarCourse
{
    /// <summary>Time step at which the course (median and interquartile range) is taken, h.</summary>
    public const double StepHours = 6;

    /// <summary>Fewest lots that must be known at a time step for the course to be drawn there.</summary>
    public const int MinLots = 5;

    /// <summary>
    /// The course of <paramref name="lots"/> (one strain's lots). A lot is known at a step from its first reading to
    /// its last, by straight-line interpolation between readings; after its last reading it stays known at that
    /// reading only if it reached dry (a dry wine stays dry), while a log that stopped short of dry says nothing about
    /// later times. The course covers the first unbroken run of steps where at least <see cref="MinLots"/> lots and at
    /// least half of the strain's lots are known, so a few long logs cannot make the tail look like the strain.
    /// </summary>
    public static StrainCourse Of(string strain, IReadOnlyList<LotKinetics> lots)
    {
        ArgumentNullException.ThrowIfNull(strain);
        ArgumentNullException.ThrowIfNull(lots);
        var usable = lots.Where(k => k.StartingBrix > 0 && k.Sugar.Count > 0).ToArray();
        if (usable.Length == 0)
        {
            return new StrainCourse(strain, 0, 0, [], [], [], [], []);
        }

        double first = usable.Min(k => k.Sugar[0].Hours), last = usable.Max(k => k.Sugar[^1].Hours);
        int j0 = (int)Math.Floor(Math.Min(0, first) / StepHours), j1 = (int)Math.Floor(last / StepHours);
        int steps = j1 - j0 + 1;

        // Each lot's share at every step its log spans ("live"); a lot that reached dry joins the settled shares at the
        // step after its last reading and stays there to the end.
        var live = new List<double>[steps];
        var settles = new List<double>[steps];
        for (int j = 0; j < steps; j++)
        {
            live[j] = [];
            settles[j] = [];
        }

        foreach (var k in usable)
        {
            var sugar = k.Sugar;
            int from = (int)Math.Ceiling(sugar[0].Hours / StepHours) - j0;
            int to = (int)Math.Floor(sugar[^1].Hours / StepHours) - j0;
            int p = 0;
            for (int j = from; j <= to; j++)
            {
                double t = (j + j0) * StepHours;
                while (p + 1 < sugar.Count && sugar[p + 1].Hours <= t)
                {
                    p++;
                }

                double brix = p + 1 < sugar.Count && sugar[p].Hours < t
                    ? sugar[p].Brix + ((sugar[p + 1].Brix - sugar[p].Brix) * (t - sugar[p].Hours) / (sugar[p + 1].Hours - sugar[p].Hours))
                    : sugar[p].Brix;
                live[j].Add(brix / k.StartingBrix);
            }

            if (k.HoursToDry is not null && to + 1 < steps)
            {
                settles[Math.Max(to + 1, from)].Add(sugar[^1].Brix / k.StartingBrix);
            }
        }

        int needed = Math.Max(MinLots, (usable.Length + 1) / 2);
        var days = new List<double>();
        var q1 = new List<double>();
        var median = new List<double>();
        var q3 = new List<double>();
        var counted = new List<int>();
        var settled = new List<double>();
        bool started = false;
        for (int j = 0; j < steps; j++)
        {
            settled.AddRange(settles[j]);
            if (live[j].Count + settled.Count < needed)
            {
                if (started)
                {
                    break;
                }

                continue;
            }

            started = true;
            var sorted = Descriptive.ToSortedArray(live[j].Concat(settled));
            days.Add((j + j0) * StepHours / 24.0);
            q1.Add(Descriptive.QuantileOfSorted(sorted, 0.25));
            median.Add(Descriptive.QuantileOfSorted(sorted, 0.5));
            q3.Add(Descriptive.QuantileOfSorted(sorted, 0.75));
            counted.Add(sorted.Length);
        }

        return new StrainCourse(strain, usable.Length, usable.Count(k => k.Flagged), days, q1, median, q3, counted);
    }
}
