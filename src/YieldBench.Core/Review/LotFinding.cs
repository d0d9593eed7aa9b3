using YieldBench.Core.Conversion;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Review.Strains;
using YieldBench.Core.Units;
using static System.FormattableString;

namespace YieldBench.Core.Review;

/// <summary>
/// One line per lot to look at: every flag of the lot (strain review and kinetics) merged into what was seen, the most
/// likely explanation first, at most one less likely one after it, and one follow-up action, in plain words.
/// </summary>
public sealed record LotFinding
{
    /// <summary>The lot's key.</summary>
    public required LotKey Key { get; init; }

    /// <summary>The lot's strain.</summary>
    public required string Strain { get; init; }

    /// <summary>The most serious of the lot's flags.</summary>
    public required FlagSeverity Severity { get; init; }

    /// <summary>The flag codes behind the line, the leading explanation's first.</summary>
    public required IReadOnlyList<string> Codes { get; init; }

    /// <summary>Each code in plain words, in the order of <see cref="Codes"/>.</summary>
    public required IReadOnlyList<string> Flags { get; init; }

    /// <summary>What was seen, with the numbers (one or two sentences).</summary>
    public required string Seen { get; init; }

    /// <summary>The most likely explanation.</summary>
    public required string Explanation { get; init; }

    /// <summary>A less likely explanation of the same finding, or null.</summary>
    public string? Otherwise { get; init; }

    /// <summary>What to do first.</summary>
    public required string FollowUp { get; init; }
}

/// <summary>Merges a lot's flags into its <see cref="LotFinding"/> (pure).</summary>
public static class LotFindings
{
    /// <summary>
    /// Explanations in the order they are preferred: what rules the others out first (more alcohol than the sugar can
    /// give), then an unrecorded water addition, which explains a shortfall without any slip in the records, then a
    /// transposed starting sugar, the other likely errors, a strain mix-up, the kinetics and a lot not finished.
    /// </summary>
    private static readonly string[] ExplanationOrder =
    [
        FlagCodes.AboveTheoreticalYield, FlagCodes.PossibleUnrecordedWater, FlagCodes.PossibleTransposedDigits, FlagCodes.ImplausibleFactor,
        FlagCodes.PossibleStrainMixUp, "stuck", "not-dry-at-log-end", "above-danger-temp", "above-caution-temp", "sluggish", FlagCodes.NotDry,
    ];

    /// <summary>Explanations of the same thing (alcohol out of line with the sugar), one of which may be named as less likely.</summary>
    private static readonly string[] Alternatives =
    [
        FlagCodes.PossibleUnrecordedWater, FlagCodes.PossibleTransposedDigits, FlagCodes.ImplausibleFactor, FlagCodes.PossibleStrainMixUp,
    ];

    /// <summary>Codes that describe what was seen rather than explain it, most telling first.</summary>
    private static readonly string[] SymptomOrder =
    [
        FlagCodes.OffStrainLine, FlagCodes.HighFactor, FlagCodes.LowFactor, FlagCodes.FarOutsideTukeyFence, FlagCodes.OutsideTukeyFence,
    ];

    /// <summary>The finding of a lot with follow-up items, or null when it has none.</summary>
    public static LotFinding? Of(LotConversion lot, IReadOnlyList<LotFlag> strainFlags, IReadOnlyList<LotFlag> kineticsItems, LotKinetics? kinetics = null, Units.TemperatureUnit unit = Units.TemperatureUnit.Celsius)
    {
        ArgumentNullException.ThrowIfNull(lot);
        var all = strainFlags.Concat(kineticsItems).ToArray();
        if (all.Length == 0)
        {
            return null;
        }

        var explanations = all.Where(f => Array.IndexOf(ExplanationOrder, f.Code) >= 0).OrderBy(f => Array.IndexOf(ExplanationOrder, f.Code)).ToArray();
        var symptoms = all.Where(f => Array.IndexOf(SymptomOrder, f.Code) >= 0).OrderBy(f => Array.IndexOf(SymptomOrder, f.Code)).ToArray();
        var lead = explanations.FirstOrDefault();
        var second = lead is not null && Array.IndexOf(Alternatives, lead.Code) >= 0
            ? explanations.Skip(1).FirstOrDefault(f => Array.IndexOf(Alternatives, f.Code) >= 0 && !Contradicts(lead, f))
            : null;
        var codes = explanations.Select(f => f.Code).Concat(symptoms.Select(f => f.Code)).Concat(all.Select(f => f.Code)).Distinct(StringComparer.Ordinal).ToArray();
        bool low = symptoms.Any(f => f.Code == FlagCodes.LowFactor || (f.Code == FlagCodes.OffStrainLine && f.Value < f.ReferenceMedian))
            || (symptoms.FirstOrDefault() is { } s && s.Value < s.ReferenceMedian);
        return new LotFinding
        {
            Key = lot.Lot.Key,
            Strain = lot.Lot.Strain,
            Severity = all.Max(f => f.Severity),
            Codes = codes,
            Flags = codes.Select(code => ReviewTexts.FlagName(all.First(f => f.Code == code))).ToArray(),
            Seen = Seen(lot, symptoms, explanations, kinetics, unit),
            Explanation = lead is null ? SymptomExplanation(low, symptoms.FirstOrDefault()?.ReferenceGroup.Contains("(pooled", StringComparison.Ordinal) == true) : Explain(lead, lot),
            Otherwise = second is null ? null : Explain(second, lot),
            FollowUp = lead is null ? SymptomFollowUp(low) : Act(lead, lot),
        };
    }

    /// <summary>
    /// Whether two explanations cannot both hold: more alcohol than the sugar can give rules out every explanation of
    /// too little alcohol; kinetics and an unfinished lot contradict nothing.
    /// </summary>
    private static bool Contradicts(LotFlag a, LotFlag b) =>
        (a.Code == FlagCodes.AboveTheoreticalYield && b.Code == FlagCodes.PossibleUnrecordedWater)
        || (b.Code == FlagCodes.AboveTheoreticalYield && a.Code == FlagCodes.PossibleUnrecordedWater);

    private static string Seen(LotConversion lot, LotFlag[] symptoms, LotFlag[] explanations, LotKinetics? k, Units.TemperatureUnit unit)
    {
        var parts = new List<string>();
        double abv = lot.Lot.FinalAlcohol.PercentVolume;
        if (symptoms.FirstOrDefault(f => f.Code == FlagCodes.OffStrainLine) is { } line)
        {
            parts.Add(Invariant($"made {abv:0.00} % v/v from {lot.EffectiveStartingBrix:0.0} °Brix, {Math.Abs(abv - line.ReferenceMedian):0.00} % v/v {(abv < line.ReferenceMedian ? "less" : "more")} than {(line.AgainstAllLots ? "the line of all finished lots" : "its strain's line")} gives ({line.ReferenceMedian:0.00} % v/v)"));
        }
        else if (symptoms.FirstOrDefault() is { } s)
        {
            parts.Add(Invariant($"made {s.Value:0.000} % v/v per °Brix against {s.ReferenceMedian:0.000} usual for {s.ReferenceGroup}"));
        }

        foreach (var f in explanations)
        {
            switch (f.Code)
            {
                case FlagCodes.AboveTheoreticalYield:
                    parts.Add(Invariant($"needs {f.Value * 100:0.0} % of the Gay-Lussac yield of the {lot.SugarConsumedGl:0} g/L of sugar fermented"));
                    break;
                case FlagCodes.ImplausibleFactor:
                    parts.Add(Invariant($"{f.Value:0.000} % v/v per °Brix is outside the plausible {f.ReferenceGroup.Replace("plausible band ", string.Empty, StringComparison.Ordinal)}"));
                    break;
                case FlagCodes.NotDry:
                    parts.Add(Invariant($"{f.Value:0.0} g/L residual sugar"));
                    break;
                case "stuck" when k?.Stuck is { } stuck:
                    parts.Add(Invariant($"stuck at {stuck.BrixEnd:0.0} °Brix from {stuck.Start:yyyy-MM-dd} ({stuck.MeanRateBrixPerDay:0.00} °Brix/day)"));
                    break;
                case "sluggish" when k?.Sluggish is { } slow:
                    parts.Add(Invariant($"sluggish from {slow.BrixStart:0.0} to {slow.BrixEnd:0.0} °Brix ({slow.MeanRateBrixPerDay:0.00} °Brix/day)"));
                    break;
                case "above-danger-temp" when k?.PeakTemperatureC is { } peak:
                    parts.Add(Invariant($"peaked at {unit.Show(peak)}, above the {unit.Show(k.Thresholds.DangerC, "0")} danger line for about {k.HoursAboveDanger:0} h"));
                    break;
                case "above-caution-temp" when k?.PeakTemperatureC is { } peak:
                    parts.Add(Invariant($"peaked at {unit.Show(peak)}, above the {unit.Show(k.Thresholds.CautionC, "0")} caution line for about {k.HoursAboveCaution:0} h"));
                    break;
                case "not-dry-at-log-end" when k is not null:
                    parts.Add(Invariant($"the log ends at {k.FinalBrix:0.0} °Brix"));
                    break;
                case "stuck" or "sluggish" or "above-danger-temp" or "above-caution-temp" or "not-dry-at-log-end":
                    parts.Add(KineticsWords(f, lot.Lot.Key));
                    break;
            }
        }

        string text = string.Join("; ", parts.Distinct(StringComparer.Ordinal));
        return text.Length == 0 ? string.Empty : char.ToUpperInvariant(text[0]) + text[1..] + ".";
    }

    // A kinetics follow-up's reason without the "Lot 2024/L005: " the kinetics review starts it with.
    private static string KineticsWords(LotFlag f, LotKey key)
    {
        string reason = f.Reason;
        foreach (string prefix in new[] { $"Lot {key}: ", $"Lot {key} " })
        {
            if (reason.StartsWith(prefix, StringComparison.Ordinal))
            {
                reason = reason[prefix.Length..];
                break;
            }
        }

        reason = reason.TrimEnd('.');
        return ReviewTexts.FlagName(f.Code) + ": " + reason;
    }

    private static string Explain(LotFlag f, LotConversion lot) => f.Code switch
    {
        FlagCodes.AboveTheoreticalYield => "Sugar that was not recorded (chaptalization or blending), or a starting sugar or alcohol reading that is wrong: the recorded sugar cannot make this much alcohol.",
        FlagCodes.PossibleUnrecordedWater => Invariant($"An unrecorded water addition (add-back) of {f.Suggestion} would explain the low alcohol."),
        FlagCodes.PossibleTransposedDigits => Invariant($"A starting sugar written with two digits swapped: {f.Recorded} was recorded; {f.Suggestion} would put the lot on {(f.AgainstAllLots ? "the line of all finished lots" : "its strain's line")}."),
        FlagCodes.ImplausibleFactor => "A wrong starting sugar or alcohol reading: no complete fermentation of grape must gives this alcohol per °Brix.",
        FlagCodes.PossibleStrainMixUp => Invariant($"The wrong strain in the records: the lot converts like {f.Suggestion}."),
        FlagCodes.NotDry => "The lot has not finished: its factor uses the sugar actually fermented.",
        "stuck" => "The ferment stopped before it was dry.",
        "not-dry-at-log-end" => "The ferment may not have finished: the log stops above dry.",
        "above-danger-temp" => lot.Lot.Colour is Lots.WineColour.White or Lots.WineColour.Rose
            ? "Too little cooling for this vessel: a white or rosé this warm loses the fresh aroma it is fermented cool to keep."
            : "Too little cooling for this vessel: yeast suffer near this temperature and the ferment may stop.",
        "above-caution-temp" => "Warmer than the caution line for its colour.",
        "sluggish" => "A slow stretch late in the ferment.",
        _ => char.ToUpperInvariant(ReviewTexts.FlagName(f.Code)[0]) + ReviewTexts.FlagName(f.Code)[1..] + ".",
    };

    private static string Act(LotFlag f, LotConversion lot) => f.Code switch
    {
        FlagCodes.AboveTheoreticalYield => "Look for unrecorded sugar or blending in the cellar records; if there was none, re-run the alcohol analysis on a fresh sample.",
        FlagCodes.PossibleUnrecordedWater => "Look for an unrecorded water addition in the cellar records; if there was none, re-check the starting-sugar sample.",
        FlagCodes.PossibleTransposedDigits => "Check the starting sugar in the original harvest or crush record.",
        FlagCodes.ImplausibleFactor => "Re-check the starting sugar and re-run the alcohol analysis on a fresh sample.",
        FlagCodes.PossibleStrainMixUp => "Confirm the strain in the inoculation records.",
        // The kinetics follow-ups and the rest are kept whole: they carry the heat and CO2 cautions and the restart advice.
        _ => Sentence(f.FollowUp),
    };

    // A strain with too few lots is judged against all lots ("all lots (pooled)", "all finished lots (pooled line)"): the
    // sentence then names those, not "the strain's other lots".
    private static string SymptomExplanation(bool low, bool pooled)
    {
        string others = pooled ? "the cellar's lots" : "the strain's other lots";
        string why = pooled ? " (the strain has too few lots to be judged against its own)" : string.Empty;
        return low
            ? $"Less alcohol than {others} from this sugar{why}: most often a starting-sugar sample taken before the skins gave up their sugar, or alcohol lost from a hot open ferment."
            : $"More alcohol than {others} from this sugar{why}: most often a starting-sugar sample that read low, or sugar that was not recorded.";
    }

    private static string SymptomFollowUp(bool low) => low
        ? "Re-check the starting-sugar sampling; if it was sound, look for unrecorded water and re-run the alcohol analysis."
        : "Re-check the starting-sugar sampling; if it was sound, look for unrecorded sugar and re-run the alcohol analysis.";

    private static string Sentence(string text)
    {
        string t = text.Trim().TrimEnd('.');
        return t.Length == 0 ? t : char.ToUpperInvariant(t[0]) + t[1..] + ".";
    }
}
