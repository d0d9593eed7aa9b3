using YieldBench.Core.Conversion;
using YieldBench.Core.Review.Strains.Detectors;
using YieldBench.Core.Statistics;

namespace YieldBench.Core.Review.Strains;

/// <summary>
/// Per-lot robust scores and the odd-lot flags: each detector is a small class of its own (Detectors/), run on every
/// lot with a factor against the references worked out here once; season drift is judged per strain and season.
/// </summary>
internal static class OddLots
{
    /// <summary>The detectors, each run on every lot with a factor, in this order.</summary>
    private static readonly IReadOnlyList<ILotDetector> Detectors =
    [
        new RobustZDetector(),
        new TukeyFenceDetector(),
        new StrainLineDetector(),
        new TheoreticalYieldDetector(),
        new PlausibleFactorDetector(),
        new NotDryDetector(),
        new UnrecordedWaterDetector(),
        new StrainMixUpDetector(),
    ];

    public static IReadOnlyList<LotScore> Score(IReadOnlyList<PreparedLot> lots, StrainReviewSettings settings)
    {
        var references = FactorReferences(lots, settings);
        var scores = new List<LotScore>();
        foreach (var lot in lots)
        {
            if (double.IsNaN(lot.Factor))
            {
                continue;
            }

            var r = references(lot.Strain);
            scores.Add(new LotScore(lot.Key, lot.Strain, lot.FactorName, lot.Factor, r.Name, r.Median, r.Scale, r.Z(lot.Factor), r.ScaleName));
        }

        return scores;
    }

    public static IReadOnlyList<LotFlag> Flag(IReadOnlyList<PreparedLot> lots, IReadOnlyList<LotScore> scores, StrainReviewSettings settings, int seed, SugarModel sugarModel)
    {
        var references = FactorReferences(lots, settings);
        var lines = StrainLines(lots, settings);
        var scoreByKey = scores.ToDictionary(s => s.LotKey);
        var strainRefs = lots.Where(l => !double.IsNaN(l.Factor))
            .GroupBy(l => l.Strain, StringComparer.Ordinal)
            .Where(g => g.Count() >= settings.MinLotsForStrainReference)
            .OrderBy(g => g.Key, StringComparer.Ordinal)
            .Select(g => references(g.Key))
            .ToArray();

        var flags = new List<LotFlag>();
        foreach (var lot in lots)
        {
            if (double.IsNaN(lot.Factor))
            {
                continue;
            }

            var context = new LotContext(lot, scoreByKey[lot.Key], references(lot.Strain), lines(lot.Strain), strainRefs, settings, sugarModel);
            foreach (var detector in Detectors)
            {
                flags.AddRange(detector.Flags(context));
            }
        }

        flags.AddRange(SeasonDrift.Flags(lots, settings, seed));
        return flags
            .OrderBy(f => f.Season)
            .ThenBy(f => f.LotId is null ? 1 : 0)
            .ThenBy(f => f.LotId ?? f.Strain, StringComparer.Ordinal)
            .ThenBy(f => f.Strain, StringComparer.Ordinal)
            .ThenBy(f => IndexOfCode(f.Code))
            .ToArray();
    }

    private static int IndexOfCode(string code)
    {
        for (int i = 0; i < FlagCodes.All.Count; i++)
        {
            if (FlagCodes.All[i] == code)
            {
                return i;
            }
        }

        return int.MaxValue;
    }

    /// <summary>The robust reference of each strain's factors (pooled when the strain has too few lots).</summary>
    private static Func<string, FactorReference> FactorReferences(IReadOnlyList<PreparedLot> lots, StrainReviewSettings settings)
    {
        var usable = lots.Where(l => !double.IsNaN(l.Factor)).ToArray();
        var pooled = FactorReference.Of(StrainReviewer.Pooled, usable, settings);
        var byStrain = usable.GroupBy(l => l.Strain, StringComparer.Ordinal)
            .Where(g => g.Count() >= settings.MinLotsForStrainReference)
            .ToDictionary(g => g.Key, g => FactorReference.Of("strain " + g.Key, g.ToArray(), settings), StringComparer.Ordinal);
        return strain => byStrain.TryGetValue(strain, out var r) ? r : pooled;
    }

    /// <summary>
    /// Scaled MAD; Qn when the MAD is 0; the scaled mean absolute deviation when Qn is 0 too. With one tie group
    /// holding half the values or more, MAD and Qn are both 0 (each has a 50 % breakdown point), hence the last step.
    /// </summary>
    internal static (double Scale, string Name) RobustScale(double[] sorted)
    {
        double mad = Robust.Mad(sorted);
        if (mad > 0)
        {
            return (mad, "MAD");
        }

        double qn = Robust.Qn(sorted);
        if (qn > 0)
        {
            return (qn, "Qn");
        }

        return (Robust.MeanAbsoluteDeviation(sorted), "mean absolute deviation");
    }

    /// <summary>Theil–Sen line of final alcohol on effective starting °Brix per strain, over finished lots; pooled when too few.</summary>
    private static Func<string, StrainLine?> StrainLines(IReadOnlyList<PreparedLot> lots, StrainReviewSettings settings)
    {
        var finished = lots.Where(l => l.IsDry && double.IsFinite(l.Brix) && double.IsFinite(l.Abv)).ToArray();
        StrainLine? Fit(string name, PreparedLot[] group)
        {
            var line = TheilSen.Fit(group.Select(l => l.Brix).ToArray(), group.Select(l => l.Abv).ToArray(), settings.Level);
            if (!line.IsDefined)
            {
                return null;
            }

            // The line is moved to pass through the middle of the strain's lots: intercept median(y − slope·x) (scipy's
            // "joint" intercept) instead of median(y) − slope·median(x). The residual scale (MAD) is measured about the
            // residuals' median, so the residual judged against it must be measured from there too: with discrete
            // readings (SG to 0.001, alcohol to 0.1) the two intercepts can differ by more than the scale itself, which
            // put most of a small strain's lots "off its line".
            var raw = Descriptive.ToSortedArray(group.Select(l => l.Abv - line.Predict(l.Brix)));
            double middle = Descriptive.MedianOfSorted(raw);
            line = line with { Intercept = line.Intercept + middle };
            var residuals = raw.Select(r => r - middle).ToArray();
            // Never below what the readings' precision allows (StrainReviewSettings.MinimumLineScale).
            double scale = Math.Max(RobustScale(residuals).Scale, settings.MinimumLineScale(line.Slope));

            return scale > 0 ? new StrainLine(name, line, scale) : null;
        }

        // Fitted only when a strain needs it (one with too few finished lots): at 100,000 lots it is the largest fit here.
        // The pooled line needs as many finished lots as a strain's own: a robust residual scale from three lots
        // would put ordinary lots "off the line".
        var pooled = new Lazy<StrainLine?>(() => finished.Length >= settings.MinLotsForStrainLine ? Fit("all finished lots (pooled line)", finished) : null);
        var byStrain = finished.GroupBy(l => l.Strain, StringComparer.Ordinal)
            .Where(g => g.Count() >= settings.MinLotsForStrainLine)
            .ToDictionary(g => g.Key, g => Fit("strain " + g.Key, g.ToArray()), StringComparer.Ordinal);
        return strain => byStrain.TryGetValue(strain, out var r) && r is not null ? r : pooled.Value;
    }
}
