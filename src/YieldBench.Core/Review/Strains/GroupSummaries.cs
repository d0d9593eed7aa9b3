using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Statistics;

namespace YieldBench.Core.Review.Strains;

/// <summary>Summaries of every measure over every grouping.</summary>
internal static class GroupSummaries
{
    public const string TooFewLots = "too few lots";

    public static IReadOnlyList<GroupSummary> Build(IReadOnlyList<PreparedLot> lots, StrainReviewSettings settings, int seed)
    {
        var jobs = new List<(string Grouping, string Group, ConversionMeasure Measure, PreparedLot[] Lots)>();
        foreach (string grouping in Groupings.All)
        {
            var groups = lots
                .GroupBy(l => Label(grouping, l, settings), StringComparer.Ordinal)
                .OrderBy(g => SortKey(grouping, g.First(), settings), StringComparer.Ordinal)
                .ThenBy(g => g.Key, StringComparer.Ordinal);
            foreach (var group in groups)
            {
                var members = group.ToArray();
                foreach (var measure in ConversionMeasureNames.All)
                {
                    jobs.Add((grouping, group.Key, measure, members));
                }
            }
        }

        // Each summary depends only on its own lots and its own derived bootstrap seed, so they are computed side by
        // side and kept in the order above.
        var result = new GroupSummary[jobs.Count];
        Parallel.For(0, jobs.Count, new ParallelOptions { MaxDegreeOfParallelism = Environment.ProcessorCount }, i =>
            result[i] = Summarise(jobs[i].Grouping, jobs[i].Group, jobs[i].Measure, jobs[i].Lots, settings, seed));
        return result;
    }

    /// <summary>Band label for an effective starting sugar: "&lt;21", "21–23", …, "≥27" from the edges.</summary>
    public static string Band(double brix, IReadOnlyList<double> edges)
    {
        string E(double v) => v.ToString("0.##", CultureInfo.InvariantCulture);
        if (edges.Count == 0)
        {
            return "all";
        }

        if (brix < edges[0])
        {
            return "<" + E(edges[0]);
        }

        for (int i = 1; i < edges.Count; i++)
        {
            if (brix < edges[i])
            {
                return E(edges[i - 1]) + "–" + E(edges[i]);
            }
        }

        return "≥" + E(edges[^1]);
    }

    private static int BandIndex(double brix, IReadOnlyList<double> edges)
    {
        int i = 0;
        while (i < edges.Count && brix >= edges[i])
        {
            i++;
        }

        return i;
    }

    private static string Label(string grouping, PreparedLot l, StrainReviewSettings settings) => grouping switch
    {
        Groupings.Strain => l.Strain,
        Groupings.Vessel => l.Vessel,
        Groupings.SugarBand => Band(l.Brix, settings.SugarBandEdgesBrix),
        Groupings.Variety => l.Variety,
        Groupings.Season => l.Season.ToString(CultureInfo.InvariantCulture),
        Groupings.StrainByVessel => l.Strain + " × " + l.Vessel,
        Groupings.StrainBySeason => l.Strain + " × " + l.Season.ToString(CultureInfo.InvariantCulture),
        _ => throw new ArgumentOutOfRangeException(nameof(grouping), grouping, "Unknown grouping."),
    };

    private static string SortKey(string grouping, PreparedLot l, StrainReviewSettings settings) => grouping switch
    {
        Groupings.SugarBand => BandIndex(l.Brix, settings.SugarBandEdgesBrix).ToString("D3", CultureInfo.InvariantCulture),
        Groupings.Season => l.Season.ToString("D6", CultureInfo.InvariantCulture),
        Groupings.StrainBySeason => l.Strain + "\u0001" + l.Season.ToString("D6", CultureInfo.InvariantCulture),
        _ => Label(grouping, l, settings),
    };

    private static GroupSummary Summarise(string grouping, string group, ConversionMeasure measure, PreparedLot[] lots, StrainReviewSettings settings, int seed)
    {
        var values = lots.Select(l => l.Conversion.Get(measure)).Where(v => double.IsFinite(v)).ToArray();
        int missing = lots.Length - values.Length;
        var sorted = Descriptive.ToSortedArray(values);
        string? note = null;
        Interval interval;
        if (sorted.Length < settings.MinLotsForInterval)
        {
            interval = Interval.Undefined(settings.Level);
            note = GroupSummaries.TooFewLots;
        }
        else
        {
            int streamSeed = StrainReviewer.DerivedSeed(seed, grouping + "|" + group + "|" + measure.Name());
            interval = Bootstrap.MedianInterval(sorted, settings.Resamples, settings.Level, streamSeed);
        }

        if (missing > 0)
        {
            string m = missing.ToString(CultureInfo.InvariantCulture) + " lot(s) without a value";
            note = note is null ? m : note + "; " + m;
        }

        double q1 = Descriptive.QuantileOfSorted(sorted, 0.25), q3 = Descriptive.QuantileOfSorted(sorted, 0.75);
        double iqr = q3 - q1;
        var first = lots.Length > 0 ? lots[0] : null;
        return new GroupSummary
        {
            Grouping = grouping,
            Group = group,
            Measure = measure,
            Strain = grouping is Groupings.Strain or Groupings.StrainByVessel or Groupings.StrainBySeason ? first?.Strain : null,
            Season = grouping is Groupings.Season or Groupings.StrainBySeason ? first?.Season : null,
            N = sorted.Length,
            Missing = missing,
            Median = Descriptive.MedianOfSorted(sorted),
            Mad = Robust.Mad(sorted),
            Qn = Robust.Qn(sorted),
            Sn = Robust.Sn(sorted),
            Iqr = iqr,
            Q1 = q1,
            Q3 = q3,
            LowerWhisker = sorted.Length > 0 ? sorted.First(v => v >= q1 - (1.5 * iqr)) : double.NaN,
            UpperWhisker = sorted.Length > 0 ? sorted.Last(v => v <= q3 + (1.5 * iqr)) : double.NaN,
            Mean = Descriptive.Mean(sorted),
            Sd = Descriptive.StandardDeviation(sorted),
            TrimmedMean = Robust.TrimmedMean(sorted),
            Huber = Robust.HuberLocation(sorted, settings.HuberK),
            Min = sorted.Length > 0 ? sorted[0] : double.NaN,
            Max = sorted.Length > 0 ? sorted[^1] : double.NaN,
            MedianInterval = interval,
            Note = note,
        };
    }
}
