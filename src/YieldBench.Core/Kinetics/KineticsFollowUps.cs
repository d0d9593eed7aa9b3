using YieldBench.Core.Lots;
using YieldBench.Core.Review.Strains;

namespace YieldBench.Core.Kinetics;

/// <summary>
/// The kinetics flags a winemaker acts on (stuck, sluggish, overheated, not dry when the log ends), as follow-up items in
/// the same shape as the strain review's flags, so one list holds every lot to look at. Data-quality flags of a log
/// (timestamps, rising sugar) and a stall that still finished stay on the kinetics sheet only.
/// </summary>
public static class KineticsFollowUps
{
    /// <summary>Kinetics flag codes that become follow-up items, in report order.</summary>
    public static IReadOnlyList<string> Codes { get; } =
        [KineticsCodes.Stuck, KineticsCodes.Sluggish, KineticsCodes.AboveDangerTemp, KineticsCodes.AboveCautionTemp, KineticsCodes.NotDryAtLogEnd];

    /// <summary>
    /// One item per lot and follow-up code, lots in the review's order and codes in <see cref="Codes"/> order. Severity
    /// is <see cref="FlagSeverity.Check"/> for a stuck ferment, a danger-level temperature or a log ending above dry, and
    /// <see cref="FlagSeverity.Note"/> for a sluggish stretch or a caution-level temperature (a judgement of common
    /// practice: the first three can leave a lot unfinished or spoiled, the last two usually need watching only).
    /// </summary>
    /// <param name="review">The kinetics review.</param>
    public static IReadOnlyList<LotFlag> For(KineticsReview review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var messages = new Dictionary<(LotKey Lot, string Code), string>();
        foreach (var f in review.Findings)
        {
            if (f.LotKey is { } lot)
            {
                messages.TryAdd((lot, f.Code), f.Message);
            }
        }

        var items = new List<LotFlag>();
        foreach (var k in review.Lots)
        {
            foreach (string code in Codes)
            {
                if (!k.Flags.Contains(code))
                {
                    continue;
                }

                string reason = messages.GetValueOrDefault((k.LotKey, code)) ?? $"Lot {k.LotKey}: kinetics flag {code}.";
                items.Add(Item(k, code, reason, review.Settings));
            }
        }

        return items;
    }

    /// <summary>
    /// What to check for cooling next harvest. Cap management is named for reds only: a white or rosé ferments as juice,
    /// with no cap of skins to manage (common practice); for a lot of unknown colour it is named as depending on it.
    /// </summary>
    public static string CoolingFollowUp(WineColour colour) => OnSkins(colour) switch
    {
        true => "Check cooling capacity and cap management for this vessel before next harvest;" + Hazards,
        false => "Check cooling capacity for this vessel before next harvest;" + Hazards,
        null => "Check cooling capacity for this vessel (and cap management, if the must ferments on its skins) before next harvest;" + Hazards,
    };

    /// <summary>What a stuck ferment's follow-up asks to check, the cap only where there is one.</summary>
    public static string StuckChecks(WineColour colour) => OnSkins(colour) switch
    {
        true => "check temperature, nutrients (YAN) and cap.",
        false => "check temperature and nutrients (YAN).",
        null => "check temperature, nutrients (YAN) and, on skins, the cap.",
    };

    /// <summary>What took heat away between the potential and the logged peak, the cap only where there is one.</summary>
    public static string WhatRemovedHeat(WineColour colour) => OnSkins(colour) switch
    {
        true => "the vessel, cap management and cooling",
        false => "the vessel and cooling",
        null => "the vessel, cooling and (on skins) cap management",
    };

    /// <summary>Whether the must ferments on its skins, under a cap: a red does, a white or rosé does not, an unrecorded colour may.</summary>
    private static bool? OnSkins(WineColour colour) => colour switch
    {
        WineColour.Red => true,
        WineColour.White or WineColour.Rose => false,
        _ => null,
    };

    private const string Hazards = " fermentation heat and CO2 in the cellar are hazards — ventilate and follow local safety rules.";

    private static LotFlag Item(LotKinetics k, string code, string reason, KineticsSettings s)
    {
        const string CheckFinish = "Confirm the lot finished (lab residual sugar); if it did not, consider a restart protocol per licensed practice.";
        string cooling = CoolingFollowUp(k.Lot.Colour);
        var (severity, measure, value, reference, threshold, followUp) = code switch
        {
            KineticsCodes.Stuck => (FlagSeverity.Check, "rate_brix_per_day", k.Stuck?.MeanRateBrixPerDay ?? double.NaN, "stuck rule", s.StuckRateBrixPerDay,
                "Taste and measure sugar now; " + StuckChecks(k.Lot.Colour) + " " + CheckFinish),
            KineticsCodes.Sluggish => (FlagSeverity.Note, "rate_brix_per_day", k.Sluggish?.MeanRateBrixPerDay ?? double.NaN, "sluggish rule", s.SluggishRateFor(k.Lot.Colour),
                "Watch the lot until dry; check temperature and nutrients (YAN). " + CheckFinish),
            KineticsCodes.AboveDangerTemp => (FlagSeverity.Check, "peak_temperature_c", k.PeakTemperatureC ?? double.NaN, "danger temperature", k.Thresholds.DangerC,
                cooling + " " + CheckFinish),
            KineticsCodes.AboveCautionTemp => (FlagSeverity.Note, "peak_temperature_c", k.PeakTemperatureC ?? double.NaN, "caution temperature", k.Thresholds.CautionC,
                cooling),
            KineticsCodes.NotDryAtLogEnd => (FlagSeverity.Check, "final_brix", k.FinalBrix, "dry reading", s.DryBrix,
                CheckFinish),
            _ => throw new ArgumentOutOfRangeException(nameof(code), code, "Not a kinetics follow-up code."),
        };
        return new LotFlag
        {
            LotKey = k.LotKey,
            LotId = k.Lot.LotId,
            Season = k.Lot.Season,
            Strain = k.Lot.Strain,
            Code = code,
            Severity = severity,
            Measure = measure,
            Value = value,
            ReferenceGroup = "kinetics: " + reference,
            ReferenceMedian = threshold,
            ReferenceScale = double.NaN,
            Reason = reason,
            FollowUp = followUp,
        };
    }
}
