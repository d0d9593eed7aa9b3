using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Statistics;
using YieldBench.Core.Units;
using static System.FormattableString;

namespace YieldBench.Core.Review.Strains;

/// <summary>Per-lot robust scores and the odd-lot detectors.</summary>
internal static class OddLots
{
    /// <summary>Robust reference of a group: median, normal-consistent scale and the scale's name.</summary>
    private sealed record Reference(string Name, double Median, double Scale, string ScaleName, double Q1, double Q3, int N);

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
            scores.Add(new LotScore(lot.Key, lot.Strain, lot.FactorName, lot.Factor, r.Name, r.Median, r.Scale, Z(lot.Factor, r), r.ScaleName));
        }

        return scores;
    }

    public static IReadOnlyList<LotFlag> Flag(IReadOnlyList<PreparedLot> lots, IReadOnlyList<LotScore> scores, StrainReviewSettings settings, int seed, SugarModel sugarModel)
    {
        var flags = new List<LotFlag>();
        var references = FactorReferences(lots, settings);
        var lines = StrainLines(lots, settings);
        var scoreByKey = scores.ToDictionary(s => s.LotKey);
        var strainRefs = lots.Where(l => !double.IsNaN(l.Factor))
            .GroupBy(l => l.Strain, StringComparer.Ordinal)
            .Where(g => g.Count() >= settings.MinLotsForStrainReference)
            .OrderBy(g => g.Key, StringComparer.Ordinal)
            .Select(g => references(g.Key))
            .ToArray();

        foreach (var lot in lots)
        {
            if (double.IsNaN(lot.Factor))
            {
                continue;
            }

            var own = references(lot.Strain);
            var score = scoreByKey[lot.Key];
            string pooledNote = own.Name == StrainReviewer.Pooled
                ? Invariant($" (strain {lot.Strain} has fewer than {settings.MinLotsForStrainReference} lots, so all lots are the reference)")
                : string.Empty;
            var lotFlags = new List<LotFlag>();

            // Robust z within strain.
            if (!double.IsNaN(score.Z) && Math.Abs(score.Z) > settings.ModifiedZLimit)
            {
                bool high = score.Z > 0;
                lotFlags.Add(Make(lot, high ? FlagCodes.HighFactor : FlagCodes.LowFactor, FlagSeverity.Check, lot.FactorName, lot.Factor, own,
                    Invariant($"factor {lot.Factor:0.0000} % v/v per °Brix is {Math.Abs(score.Z):0.0} robust standard deviations {(high ? "above" : "below")} the median {own.Median:0.0000} of {own.Name}{pooledNote} (modified z {score.Z:+0.0;-0.0} by {own.ScaleName}; limit {settings.ModifiedZLimit:0.0})"),
                    high
                        ? FollowUps.RecheckStartingSugar + "; " + FollowUps.LookForSugar + "; " + FollowUps.RerunAlcohol
                        : FollowUps.RecheckStartingSugar + "; " + FollowUps.LookForWater + "; " + FollowUps.RerunAlcohol + "; " + FollowUps.Evaporation));
            }

            // Tukey fences within strain.
            double iqr = own.Q3 - own.Q1;
            if (own.N >= 4 && iqr > 0)
            {
                bool far = lot.Factor < own.Q1 - (settings.TukeyOuter * iqr) || lot.Factor > own.Q3 + (settings.TukeyOuter * iqr);
                bool outside = lot.Factor < own.Q1 - (settings.TukeyInner * iqr) || lot.Factor > own.Q3 + (settings.TukeyInner * iqr);
                if (outside)
                {
                    string which = far ? "outer" : "inner";
                    double k = far ? settings.TukeyOuter : settings.TukeyInner;
                    lotFlags.Add(Make(lot, far ? FlagCodes.FarOutsideTukeyFence : FlagCodes.OutsideTukeyFence, far ? FlagSeverity.Check : FlagSeverity.Note, lot.FactorName, lot.Factor, own,
                        Invariant($"factor {lot.Factor:0.0000} is beyond the {which} Tukey fence of {own.Name}{pooledNote}: quartiles {own.Q1:0.0000} and {own.Q3:0.0000}, fences at {k:0.#} × IQR {iqr:0.0000} ({own.Q1 - (k * iqr):0.0000} to {own.Q3 + (k * iqr):0.0000})"),
                        FollowUps.RecheckStartingSugar + "; " + FollowUps.RerunAlcohol,
                        scale: iqr));
                }
            }

            // Residual from the strain's Theil–Sen line (finished lots only).
            var line = lines(lot.Strain);
            double lineZ = double.NaN;
            if (lot.IsDry && line is not null)
            {
                double predicted = line.Line.Predict(lot.Brix);
                lineZ = (lot.Abv - predicted) / line.Scale;
                if (Math.Abs(lineZ) > settings.LineResidualLimit)
                {
                    lotFlags.Add(new LotFlag
                    {
                        LotKey = lot.Key,
                        LotId = lot.Conversion.Lot.LotId,
                        Season = lot.Season,
                        Strain = lot.Strain,
                        Code = FlagCodes.OffStrainLine,
                        Severity = FlagSeverity.Check,
                        Measure = "final_abv",
                        Value = lot.Abv,
                        ReferenceGroup = line.Name,
                        ReferenceMedian = predicted,
                        ReferenceScale = line.Scale,
                        Reason = Invariant($"final alcohol {lot.Abv:0.00} % v/v is {lot.Abv - predicted:+0.00;-0.00} % v/v from the Theil–Sen line of {line.Name} at {lot.Brix:0.0} °Brix ({predicted:0.00} % v/v), {Math.Abs(lineZ):0.0} robust residual scales away (scale {line.Scale:0.000} % v/v; limit {settings.LineResidualLimit:0.0})"),
                        FollowUp = lot.Abv < predicted
                            ? FollowUps.RecheckStartingSugar + "; " + FollowUps.LookForWater + "; " + FollowUps.RerunAlcohol + "; " + FollowUps.Evaporation
                            : FollowUps.RecheckStartingSugar + "; " + FollowUps.LookForSugar + "; " + FollowUps.RerunAlcohol,
                    });

                    if (Transposition(lot, line, settings, sugarModel) is { } swap)
                    {
                        lotFlags.Add(swap);
                    }
                }
            }

            // Plausibility: above Gay-Lussac.
            double efficiency = lot.Conversion.GayLussacEfficiency;
            if (double.IsFinite(efficiency) && efficiency > 1.0)
            {
                lotFlags.Add(Threshold(lot, FlagCodes.AboveTheoreticalYield, FlagSeverity.LikelyError, ConversionMeasure.GayLussacEfficiency.Name(), efficiency, "Gay-Lussac theoretical yield", 1.0,
                    Invariant($"the alcohol needs {efficiency * 100:0.0} % of the Gay-Lussac theoretical yield from the recorded sugar ({lot.Conversion.SugarConsumedGl:0.0} g/L fermented can give at most {lot.Conversion.SugarConsumedGl * GayLussac.EthanolMassYield / (10 * AlcoholContent.EthanolDensity20C):0.00} % v/v), which is impossible without unrecorded sugar or a measurement error"),
                    FollowUps.LookForSugar + "; " + FollowUps.RerunAlcohol + "; " + FollowUps.RecheckStartingSugar));
            }

            // Plausibility: factor band.
            if (lot.Factor < settings.PlausibleFactorLow || lot.Factor > settings.PlausibleFactorHigh)
            {
                lotFlags.Add(Threshold(lot, FlagCodes.ImplausibleFactor, FlagSeverity.LikelyError, lot.FactorName, lot.Factor,
                    Invariant($"plausible band {settings.PlausibleFactorLow:0.00}–{settings.PlausibleFactorHigh:0.00}"),
                    lot.Factor < settings.PlausibleFactorLow ? settings.PlausibleFactorLow : settings.PlausibleFactorHigh,
                    Invariant($"factor {lot.Factor:0.0000} % v/v per °Brix is outside the plausible band {settings.PlausibleFactorLow:0.00}–{settings.PlausibleFactorHigh:0.00} for a complete fermentation of grape must"),
                    FollowUps.RecheckStartingSugar + "; " + FollowUps.RerunAlcohol + (lot.Factor < settings.PlausibleFactorLow ? "; " + FollowUps.LookForWater : "; " + FollowUps.LookForSugar)));
            }

            // Not dry.
            if (!lot.IsDry)
            {
                lotFlags.Add(Threshold(lot, FlagCodes.NotDry, FlagSeverity.Note, "residual_sugar_gl", lot.Conversion.ResidualSugarGl, "dryness threshold", settings.DryThresholdGl,
                    Invariant($"residual sugar {lot.Conversion.ResidualSugarGl:0.0} g/L is above the dryness threshold {settings.DryThresholdGl:0.#} g/L: the lot has not fermented to dryness, so its factor uses the {lot.Conversion.FermentedBrix:0.0} °Brix actually fermented"),
                    FollowUps.ConfirmFinished));
            }

            // Possible unrecorded water: low factor in a finished lot with a dilution share in the plausible add-back range.
            bool low = (!double.IsNaN(score.Z) && score.Z < -settings.ModifiedZLimit) || lineZ < -settings.LineResidualLimit;
            if (low && lot.IsDry && !lot.Conversion.AdditionsApplied)
            {
                double expected = own.Median * lot.Brix;
                double share = 1 - (lot.Abv / expected);
                if (share >= settings.WaterShareLow && share <= settings.WaterShareHigh)
                {
                    lotFlags.Add(Make(lot, FlagCodes.PossibleUnrecordedWater, FlagSeverity.Check, lot.FactorName, lot.Factor, own,
                        Invariant($"the lot is dry yet made {lot.Abv:0.00} % v/v where {own.Name}'s median factor predicts {expected:0.00} % v/v from {lot.Brix:0.0} °Brix; an unrecorded water addition of about {share * 100:0} % of the must would explain the shortfall"),
                        FollowUps.LookForWater + "; " + FollowUps.RecheckStartingSugar + "; " + FollowUps.Evaporation));
                }
            }

            // Possible strain mix-up: far from its own strain, close to another's.
            if (!double.IsNaN(score.Z) && Math.Abs(score.Z) > settings.ModifiedZLimit && own.Name != StrainReviewer.Pooled)
            {
                var better = strainRefs
                    .Where(r => r.Name != own.Name)
                    .Select(r => (Ref: r, Z: Z(lot.Factor, r)))
                    .Where(t => !double.IsNaN(t.Z) && Math.Abs(t.Z) <= settings.MixUpFitZ)
                    .OrderBy(t => Math.Abs(t.Z))
                    .ThenBy(t => t.Ref.Name, StringComparer.Ordinal)
                    .FirstOrDefault();
                if (better.Ref is not null)
                {
                    lotFlags.Add(Make(lot, FlagCodes.PossibleStrainMixUp, FlagSeverity.Check, lot.FactorName, lot.Factor, own,
                        Invariant($"factor {lot.Factor:0.0000} is far from {own.Name} (modified z {score.Z:+0.0;-0.0}) but typical of {better.Ref.Name} (median {better.Ref.Median:0.0000}, modified z {better.Z:+0.0;-0.0})"),
                        FollowUps.ConfirmStrain));
                }
            }

            flags.AddRange(lotFlags);
        }

        flags.AddRange(SeasonDrift(lots, settings, seed));
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

    /// <summary>(value − median)/scale: with the scaled MAD this is the Iglewicz–Hoaglin modified z.</summary>
    private static double Z(double value, Reference r) => r.Scale > 0 ? (value - r.Median) / r.Scale : double.NaN;

    /// <summary>The robust reference of each strain's factors (pooled when the strain has too few lots).</summary>
    private static Func<string, Reference> FactorReferences(IReadOnlyList<PreparedLot> lots, StrainReviewSettings settings)
    {
        var usable = lots.Where(l => !double.IsNaN(l.Factor)).ToArray();
        var pooled = Build(StrainReviewer.Pooled, usable.Select(l => l.Factor));
        var byStrain = usable.GroupBy(l => l.Strain, StringComparer.Ordinal)
            .Where(g => g.Count() >= settings.MinLotsForStrainReference)
            .ToDictionary(g => g.Key, g => Build("strain " + g.Key, g.Select(l => l.Factor)), StringComparer.Ordinal);
        return strain => byStrain.TryGetValue(strain, out var r) ? r : pooled;
    }

    private static Reference Build(string name, IEnumerable<double> values)
    {
        var sorted = Descriptive.ToSortedArray(values);
        var (scale, scaleName) = RobustScale(sorted);
        return new Reference(name, Descriptive.MedianOfSorted(sorted), scale, scaleName, Descriptive.QuantileOfSorted(sorted, 0.25), Descriptive.QuantileOfSorted(sorted, 0.75), sorted.Length);
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

    private sealed record StrainLine(string Name, TheilSenLine Line, double Scale);

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

            var residuals = Descriptive.ToSortedArray(group.Select(l => l.Abv - line.Predict(l.Brix)));
            double scale = RobustScale(residuals).Scale;

            return scale > 0 ? new StrainLine(name, line, scale) : null;
        }

        // Fitted only when a strain needs it (one with too few finished lots): at 100,000 lots it is the largest fit here.
        var pooled = new Lazy<StrainLine?>(() => finished.Length >= 2 ? Fit("all finished lots (pooled line)", finished) : null);
        var byStrain = finished.GroupBy(l => l.Strain, StringComparer.Ordinal)
            .Where(g => g.Count() >= settings.MinLotsForStrainLine)
            .ToDictionary(g => g.Key, g => Fit("strain " + g.Key, g.ToArray()), StringComparer.Ordinal);
        return strain => byStrain.TryGetValue(strain, out var r) && r is not null ? r : pooled.Value;
    }

    /// <summary>Flags a starting sugar whose adjacent-digit swap would put the lot on its line.</summary>
    private static LotFlag? Transposition(PreparedLot lot, StrainLine line, StrainReviewSettings settings, SugarModel sugarModel)
    {
        var recorded = lot.Conversion.Lot;
        var scale = recorded.RecordedStartingSugar.Scale;
        int decimals = scale switch
        {
            SugarScale.Brix or SugarScale.Baume => 1,
            SugarScale.SpecificGravity => 3,
            _ => 0,
        };
        double value = recorded.RecordedStartingSugar.Value;
        string text = Math.Round(value, decimals).ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
        string digits = text.Replace(".", string.Empty, StringComparison.Ordinal).TrimStart('-');
        if (text.StartsWith('-'))
        {
            return null;
        }

        (double Brix, double Z, string Text)? best = null;
        for (int i = 0; i + 1 < digits.Length; i++)
        {
            if (digits[i] == digits[i + 1])
            {
                continue;
            }

            var chars = digits.ToCharArray();
            (chars[i], chars[i + 1]) = (chars[i + 1], chars[i]);
            string swapped = new string(chars);
            string candidateText = decimals > 0 ? swapped[..^decimals] + "." + swapped[^decimals..] : swapped;
            double candidate = double.Parse(candidateText, CultureInfo.InvariantCulture);
            if (!SugarReading.TryFrom(candidate, scale, TranspositionMinBrix, TranspositionMaxBrix, out var reading, out _))
            {
                continue;
            }

            double effective = AdditionBalance.Apply(reading, recorded.Additions, sugarModel).Effective.Brix;
            double z = (lot.Abv - line.Line.Predict(effective)) / line.Scale;
            if (Math.Abs(z) <= settings.TranspositionFitZ && (best is null || Math.Abs(z) < Math.Abs(best.Value.Z)))
            {
                best = (effective, z, candidateText.TrimStart('0') is { Length: > 0 } t && !t.StartsWith('.') ? t : candidateText);
            }
        }

        if (best is not { } found)
        {
            return null;
        }

        return new LotFlag
        {
            LotKey = lot.Key,
            LotId = recorded.LotId,
            Season = lot.Season,
            Strain = lot.Strain,
            Code = FlagCodes.PossibleTransposedDigits,
            Severity = FlagSeverity.LikelyError,
            Measure = "starting_brix",
            Value = lot.Brix,
            ReferenceGroup = line.Name,
            ReferenceMedian = found.Brix,
            ReferenceScale = line.Scale,
            Reason = Invariant($"the starting sugar was recorded as {text} {SugarScales.Label(scale)}; with two neighbouring digits swapped ({found.Text} {SugarScales.Label(scale)}) the lot's {lot.Abv:0.00} % v/v would sit on the line of {line.Name} (residual {found.Z:+0.0;-0.0} scales instead of {(lot.Abv - line.Line.Predict(lot.Brix)) / line.Scale:+0.0;-0.0})"),
            FollowUp = FollowUps.RecheckStartingSugar + "; check the original harvest or crush record for a transcription slip",
        };
    }

    /// <summary>A swapped starting sugar is tried only when it lies in this range of °Brix (any must a cellar ferments).</summary>
    private const double TranspositionMinBrix = 5, TranspositionMaxBrix = 45;

    /// <summary>A strain whose season median lies outside the bootstrap interval of its other seasons' median.</summary>
    private static IEnumerable<LotFlag> SeasonDrift(IReadOnlyList<PreparedLot> lots, StrainReviewSettings settings, int seed)
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

    private static LotFlag Make(PreparedLot lot, string code, FlagSeverity severity, string measure, double value, Reference r, string reason, string followUp, double? scale = null) => new()
    {
        LotKey = lot.Key,
        LotId = lot.Conversion.Lot.LotId,
        Season = lot.Season,
        Strain = lot.Strain,
        Code = code,
        Severity = severity,
        Measure = measure,
        Value = value,
        ReferenceGroup = r.Name,
        ReferenceMedian = r.Median,
        ReferenceScale = scale ?? r.Scale,
        Reason = reason,
        FollowUp = followUp,
    };

    private static LotFlag Threshold(PreparedLot lot, string code, FlagSeverity severity, string measure, double value, string reference, double threshold, string reason, string followUp) => new()
    {
        LotKey = lot.Key,
        LotId = lot.Conversion.Lot.LotId,
        Season = lot.Season,
        Strain = lot.Strain,
        Code = code,
        Severity = severity,
        Measure = measure,
        Value = value,
        ReferenceGroup = reference,
        ReferenceMedian = threshold,
        ReferenceScale = double.NaN,
        Reason = reason,
        FollowUp = followUp,
    };
}
