using YieldBench.Core.Conversion;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Review.Strains;

namespace YieldBench.Core.Review;

/// <summary>
/// Everything the review found about one lot, in one place: its conversion measures, its robust z within its strain,
/// the strain review's flags, its kinetics and kinetics follow-ups, and its worst severity. Built once by
/// <see cref="ReviewRunner"/>; every renderer reads lots through this.
/// </summary>
public sealed record LotReview
{
    /// <summary>The lot's key.</summary>
    public required LotKey Key { get; init; }

    /// <summary>The lot with its conversion measures.</summary>
    public required LotConversion Conversion { get; init; }

    /// <summary>The lot as recorded.</summary>
    public Lot Lot => Conversion.Lot;

    /// <summary>The robust z of the lot's factor within its strain, or null when the lot has no factor.</summary>
    public LotScore? Score { get; init; }

    /// <summary>The robust z (NaN when the lot has none).</summary>
    public double RobustZ => Score?.Z ?? double.NaN;

    /// <summary>The strain review's flags on the lot, in the review's flag order.</summary>
    public required IReadOnlyList<LotFlag> StrainFlags { get; init; }

    /// <summary>The lot's kinetics, or null when it had no log.</summary>
    public LotKinetics? Kinetics { get; init; }

    /// <summary>The kinetics flags a winemaker acts on (<see cref="KineticsFollowUps"/>), as follow-up items.</summary>
    public required IReadOnlyList<LotFlag> KineticsFollowUps { get; init; }

    /// <summary>Every flag code on the lot, each once: the strain review's first, then the kinetics flags.</summary>
    public required IReadOnlyList<string> FlagCodes { get; init; }

    /// <summary>The most serious follow-up item of the lot (strain review or kinetics), or null when it has none.</summary>
    public FlagSeverity? WorstSeverity { get; init; }

    /// <summary>True when the strain review flagged the lot (conversion charts ring only these).</summary>
    public bool HasStrainFlag => StrainFlags.Count > 0;

    /// <summary>True when the lot is one to look at: a strain-review flag or a kinetics follow-up.</summary>
    public bool IsFlagged => WorstSeverity is not null;

    /// <summary>The lot's flags merged into one line (what was seen, the likely explanation, what to do), or null when it has none.</summary>
    public LotFinding? Finding { get; init; }
}

/// <summary>Builds the per-lot view from the review's parts (pure; the same parts give the same view).</summary>
internal static class LotReviews
{
    /// <summary>One entry per lot, in the order of <paramref name="lots"/>; <paramref name="followUps"/> is every follow-up item.</summary>
    public static IReadOnlyList<LotReview> Build(
        IReadOnlyList<LotConversion> lots, StrainReview strains, KineticsReview? kinetics, out IReadOnlyList<LotFlag> followUps, Units.TemperatureUnit unit = Units.TemperatureUnit.Celsius)
    {
        var kineticsItems = kinetics is null ? [] : Kinetics.KineticsFollowUps.For(kinetics);
        followUps = [.. strains.Flags, .. kineticsItems];
        var scores = new Dictionary<LotKey, LotScore>();
        foreach (var s in strains.Scores)
        {
            scores.TryAdd(s.LotKey, s);
        }

        var flags = Grouped(strains.Flags);
        var items = Grouped(kineticsItems);
        var logged = new Dictionary<LotKey, LotKinetics>();
        foreach (var k in kinetics?.Lots ?? [])
        {
            logged.TryAdd(k.LotKey, k);
        }

        var result = new LotReview[lots.Count];
        for (int i = 0; i < lots.Count; i++)
        {
            var key = lots[i].Lot.Key;
            var own = flags.GetValueOrDefault(key) ?? [];
            var ownItems = items.GetValueOrDefault(key) ?? [];
            var k = logged.GetValueOrDefault(key);
            FlagSeverity? worst = null;
            foreach (var f in own.Concat(ownItems))
            {
                worst = worst is { } w && w > f.Severity ? w : f.Severity;
            }

            result[i] = new LotReview
            {
                Key = key,
                Conversion = lots[i],
                Score = scores.GetValueOrDefault(key),
                StrainFlags = own,
                Kinetics = k,
                KineticsFollowUps = ownItems,
                FlagCodes = own.Select(f => f.Code).Concat(k?.Flags ?? []).Distinct(StringComparer.Ordinal).ToArray(),
                WorstSeverity = worst,
                Finding = LotFindings.Of(lots[i], own, ownItems, k, unit),
            };
        }

        return result;
    }

    private static Dictionary<LotKey, List<LotFlag>> Grouped(IEnumerable<LotFlag> flags)
    {
        var byLot = new Dictionary<LotKey, List<LotFlag>>();
        foreach (var f in flags)
        {
            if (f.LotKey is not { } key)
            {
                continue;
            }

            if (!byLot.TryGetValue(key, out var list))
            {
                byLot[key] = list = [];
            }

            list.Add(f);
        }

        return byLot;
    }
}
