using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Review.Strains;

namespace YieldBench.Core.HouseFactor;

/// <summary>
/// A lot the house factor leaves out by default: the strain review flagged it as a likely error, or it did not ferment
/// to dryness (its alcohol is short of a finished ferment, so it would teach a factor that is too low).
/// </summary>
/// <param name="LotKey">The lot's key.</param>
/// <param name="Season">Season.</param>
/// <param name="LotId">Lot id.</param>
/// <param name="Strain">Strain.</param>
/// <param name="Codes">The flag codes that put it here, in flag order (<see cref="FlagCodes"/>).</param>
/// <param name="Reason">Why, in plain words.</param>
public sealed record FlaggedLot(LotKey LotKey, int Season, string LotId, string Strain, IReadOnlyList<string> Codes, string Reason);

/// <summary>Which lots the house factor leaves out by default, from the strain review's flags.</summary>
public static class FlaggedLots
{
    /// <summary>
    /// The lots carrying a flag of severity <see cref="FlagSeverity.LikelyError"/> or the <see cref="FlagCodes.NotDry"/>
    /// flag, in the order of <paramref name="lots"/>; each lot once, with every such code.
    /// </summary>
    public static IReadOnlyList<FlaggedLot> From(IReadOnlyList<LotConversion> lots, IReadOnlyList<LotFlag> flags)
    {
        ArgumentNullException.ThrowIfNull(lots);
        ArgumentNullException.ThrowIfNull(flags);
        var byKey = new Dictionary<LotKey, List<LotFlag>>();
        foreach (var f in flags)
        {
            if (f.LotKey is { } key && (f.Severity == FlagSeverity.LikelyError || f.Code == FlagCodes.NotDry))
            {
                if (!byKey.TryGetValue(key, out var list))
                {
                    byKey[key] = list = [];
                }

                list.Add(f);
            }
        }

        var result = new List<FlaggedLot>(byKey.Count);
        foreach (var l in lots)
        {
            if (!byKey.TryGetValue(l.Lot.Key, out var own))
            {
                continue;
            }

            var codes = own.Select(f => f.Code).Distinct(StringComparer.Ordinal).ToArray();
            var reasons = new List<string>(2);
            var errors = codes.Where(c => c != FlagCodes.NotDry).ToArray();
            if (errors.Length > 0)
            {
                reasons.Add("flagged as a likely error (" + string.Join(", ", errors) + ")");
            }

            if (codes.Contains(FlagCodes.NotDry))
            {
                reasons.Add(string.Create(CultureInfo.InvariantCulture, $"did not ferment to dryness ({l.ResidualSugarGl:0.0} g/L residual sugar)"));
            }

            result.Add(new FlaggedLot(l.Lot.Key, l.Lot.Season, l.Lot.LotId, l.Lot.Strain, codes, string.Join("; ", reasons)));
        }

        return result;
    }

    /// <summary>Most flagged lots <see cref="Sentence"/> names; the others are counted (every one is in the review's flags).</summary>
    public const int SentenceLots = 25;

    /// <summary>
    /// One sentence naming the flagged lots (the first <see cref="SentenceLots"/>, the rest counted: at 100,000 lots
    /// the sentence ran past what a workbook cell holds) and what was done with them.
    /// </summary>
    public static string Sentence(IReadOnlyList<FlaggedLot> flagged, bool included)
    {
        ArgumentNullException.ThrowIfNull(flagged);
        int errors = flagged.Count(f => f.Codes.Any(c => c != FlagCodes.NotDry));
        int notDry = flagged.Count(f => f.Codes.Contains(FlagCodes.NotDry));
        string what = $"{flagged.Count} lot(s) — {errors} flagged as likely errors, {notDry} not fermented to dryness — ";
        string lots = string.Join("; ", flagged.Take(SentenceLots).Select(f => $"{f.LotKey} ({f.Strain}): {f.Reason}"))
            + (flagged.Count > SentenceLots ? string.Create(CultureInfo.InvariantCulture, $"; and {flagged.Count - SentenceLots} more, each among the review's flags") : string.Empty);
        return included
            ? what + $"are included in training, selection and intervals because the setting to include flagged lots is on: {lots}."
            : what + $"are left out of training, selection and intervals (a setting includes them; both versions are reported): {lots}.";
    }
}
