using System.Globalization;
using YieldBench.Core.Statistics;
using static System.FormattableString;

namespace YieldBench.Core.Review.Strains.Detectors;

/// <summary><c>season-drift</c>: a strain whose median factor in one season lies outside the bootstrap interval of its median in the others.</summary>
internal static class SeasonDrift
{
    /// <summary>The drift flags of every strain with two or more seasons, strains by code, seasons ascending.</summary>
    public static IEnumerable<LotFlag> Flags(IReadOnlyList<PreparedLot> lots, StrainReviewSettings settings, int seed)
    {
        var result = new List<LotFlag>();
        foreach (var strain in lots.Where(l => !double.IsNaN(l.Factor)).GroupBy(l => l.Strain, StringComparer.Ordinal).OrderBy(g => g.Key, StringComparer.Ordinal))
        {
            var seasons = strain.GroupBy(l => l.Season).OrderBy(g => g.Key).ToArray();
            if (seasons.Length < 2)
            {
                continue;
            }

            foreach (var season in seasons)
            {
                var others = strain.Where(l => l.Season != season.Key).Select(l => l.Factor).ToArray();
                if (season.Count() < settings.MinLotsForInterval || others.Length < settings.MinLotsForInterval)
                {
                    continue;
                }

                double median = Descriptive.Median(season.Select(l => l.Factor));
                var interval = Bootstrap.MedianInterval(others, settings.Resamples, settings.Level,
                    StrainReviewer.DerivedSeed(seed, "drift|" + strain.Key + "|" + season.Key.ToString(CultureInfo.InvariantCulture)));
                double otherMedian = Descriptive.Median(others);
                double strainBrix = Descriptive.Median(strain.Select(l => l.Brix));
                double driftAbv = Math.Abs(median - otherMedian) * strainBrix;
                if (interval.Contains(median) || !(driftAbv >= settings.DriftMinimumAbv))
                {
                    continue;
                }

                result.Add(new LotFlag
                {
                    Season = season.Key,
                    Strain = strain.Key,
                    Code = FlagCodes.SeasonDrift,
                    Severity = FlagSeverity.Note,
                    Measure = "median abv_per_brix",
                    Value = median,
                    ReferenceGroup = Invariant($"strain {strain.Key}, other seasons"),
                    ReferenceMedian = otherMedian,
                    ReferenceScale = Robust.Mad(others),
                    Reason = Invariant($"strain {strain.Key}'s median factor in {season.Key} ({median:0.0000}, {season.Count()} lots) lies outside the {settings.Level * 100:0} % interval {interval.Low:0.0000}–{interval.High:0.0000} of its median in the other seasons ({otherMedian:0.0000}, {others.Length} lots); at its median {strainBrix:0.0} °Brix that is {driftAbv:0.00} % v/v {(median < otherMedian ? "less" : "more")} alcohol"),
                    FollowUp = FollowUps.SeasonCheck,
                });
            }
        }

        return result;
    }
}
