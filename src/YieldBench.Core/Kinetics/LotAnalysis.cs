using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Statistics;
using YieldBench.Core.Units;
using static YieldBench.Core.Kinetics.LogCurves;

namespace YieldBench.Core.Kinetics;

/// <summary>
/// The kinetics of one lot from its log, step by step: readings prepared, time zero, rates, lag, depletion and dryness,
/// temperature exposure, stalls, heat potential, sigmoid fits. Each step reports what it saw as findings and flags.
/// </summary>
internal static class LotAnalysis
{
    /// <summary>What one step passes on: the lot's key, flags and findings so far, settings.</summary>
    private sealed record Context(LotKey Key, HashSet<string> Flags, List<KineticsFinding> Findings, KineticsSettings Settings, WineColour Colour)
    {
        public void Report(string code, string message, SourceRef? source, bool flag = true)
        {
            if (flag)
            {
                Flags.Add(code);
            }

            Findings.Add(new(Key, code, message, source));
        }
    }

    /// <summary>The lot's readings sorted by time, equal times merged.</summary>
    private sealed record Readings(
        List<(DateTime T, double Brix, LogReading Src)> Sugar,
        List<(DateTime T, double C, LogReading Src)> Temperature,
        SourceRef? FirstSource);

    /// <summary>The maximum rate and how it was taken.</summary>
    private sealed record MaxRate(bool Dense, double MedianSpacing, RateMethod Method, double? Rate, DateTime? At);

    /// <summary>Peak temperature and the time above the thresholds.</summary>
    private sealed record Exposure(double? Peak, DateTime? PeakAt, double AboveCaution, double AboveDanger);

    /// <summary>The stall rules' results.</summary>
    private sealed record Stalls(StallEpisode? Stuck, StallEpisode? Restarted, StallEpisode? Sluggish);

    /// <summary>The heat potential along the log.</summary>
    private sealed record HeatResult(HeatPoint? PotentialPeak, double? Removed, int ReadingsAboveDanger);

    /// <summary>Analyses one lot's readings; null (with a finding) when fewer than two sugar readings remain.</summary>
    public static LotKinetics? Analyse(LotConversion conversion, IReadOnlyList<LogReading> raw, KineticsSettings s, List<KineticsFinding> findings)
    {
        var lot = conversion.Lot;
        var cx = new Context(lot.Key, new HashSet<string>(StringComparer.Ordinal), findings, s, lot.Colour);
        var readings = Prepare(raw, cx);
        if (readings.Sugar.Count < 2)
        {
            cx.Report(KineticsCodes.TooFewSugarReadings, $"Lot {cx.Key}: the log has {readings.Sugar.Count} sugar reading(s); rates need at least two. The lot's kinetics were not analysed.", readings.FirstSource, flag: false);
            return null;
        }

        var inoculation = lot.InoculationDate;
        if (inoculation is { } recorded && !InoculationClock.Fits(recorded, readings.Sugar[0].T))
        {
            cx.Report(KineticsCodes.InoculationFarFromLog, InoculationClock.Message(cx.Key.ToString(), recorded, readings.Sugar[0].T), readings.Sugar[0].Src.Source, flag: false);
            inoculation = null;
        }

        var (origin, originKind) = inoculation is { } inoc ? (inoc, TimeOrigin.Inoculation) : (readings.Sugar[0].T, TimeOrigin.FirstReading);
        double H(DateTime t) => (t - origin).TotalHours;
        var th = s.ThresholdsFor(lot.Colour);
        var temps = readings.Temperature.Select(t => new TemperaturePoint(t.T, H(t.T), t.C, t.Src)).ToArray();
        var sugar = readings.Sugar.Select(p => new SugarPoint(p.T, H(p.T), p.Brix, TemperatureAt(temps, p.T, s.TemperaturePairingHours), p.Src)).ToArray();
        var hrs = sugar.Select(p => p.Hours).ToArray();
        var bx = sugar.Select(p => p.Brix).ToArray();

        CheckRises(sugar, cx);
        var rate = FastestRate(sugar, s);
        double start = bx[0];
        var (lagHours, lagEnd) = Lag(sugar, hrs, bx, origin, cx);

        // One-third depletion: of the lot's effective starting sugar (after additions) as its record gives it, and of the
        // first log reading, which is often taken hours after the must was sampled and already lower.
        double lotStart = conversion.EffectiveStartingBrix;
        bool fromLot = double.IsFinite(lotStart) && lotStart > 0;
        double oneThird = (fromLot ? lotStart : start) * 2.0 / 3.0;
        var (oneThirdH, oneThirdAt) = FirstCrossing(hrs, bx, oneThird, origin);
        double oneThirdFirst = start * 2.0 / 3.0;
        var (oneThirdFirstH, oneThirdFirstAt) = FirstCrossing(hrs, bx, oneThirdFirst, origin);

        var (dryH, dryAt) = FirstCrossing(hrs, bx, s.DryBrix, origin);
        double final = bx[^1];
        if (dryAt is null && lot.ResidualSugarGl is { } labRs && labRs <= s.DryResidualSugarGl)
        {
            // The lab's residual sugar says the lot finished: the log was simply not kept to the end (common: readings
            // stop once the cellar sees it is nearly dry). Said as a finding, not a flag, as the stall rules do.
            cx.Report(KineticsCodes.LogEndedBeforeDry, $"Lot {cx.Key}: the log ends at {F(final)} °Brix on {Stamp(sugar[^1].Time)}, above the dry reading of {F(s.DryBrix)} °Brix, but the lab recorded {F(labRs)} g/L residual sugar, within the {F(s.DryResidualSugarGl)} g/L dry limit: the lot finished after its last reading.", sugar[^1].Source, flag: false);
        }
        else if (dryAt is null)
        {
            string rs = lot.ResidualSugarGl is { } r ? $"; the lab recorded {F(r)} g/L residual sugar, above the {F(s.DryResidualSugarGl)} g/L dry limit" : "; no residual sugar was recorded for the lot";
            cx.Report(KineticsCodes.NotDryAtLogEnd, $"Lot {cx.Key}: the log ends at {F(final)} °Brix on {Stamp(sugar[^1].Time)}, above the dry reading of {F(s.DryBrix)} °Brix{rs}.", sugar[^1].Source);
        }

        var exposure = Temperatures(temps, th, cx);

        // Stalls are judged after the lag and after the fastest point: a slow start and the climb to full speed are the
        // lag's business, not a stall.
        double judgeFrom = hrs[0];
        if (lagHours is { } lh)
        {
            judgeFrom = Math.Max(judgeFrom, lh);
        }

        if (rate.At is { } ma)
        {
            judgeFrom = Math.Max(judgeFrom, H(ma));
        }

        var stalls = StallsOf(lot, sugar, hrs, bx, judgeFrom, dryAt, H, cx);
        var heat = Heat(sugar, exposure.Peak, th, cx);

        var consumed = bx.Select(b => start - b).ToArray();
        var gomp = ZwieteringFit.Fit(SigmoidModel.Gompertz, hrs, consumed, s.MinReadingsForFit, s.MinConsumedBrixForFit);
        var logi = ZwieteringFit.Fit(SigmoidModel.Logistic, hrs, consumed, s.MinReadingsForFit, s.MinConsumedBrixForFit);
        if (!gomp.Succeeded && !logi.Succeeded)
        {
            cx.Report(KineticsCodes.NoSigmoidFit, $"Lot {cx.Key}: {gomp.Reason}; rates, lag and depletion times above come from the readings themselves.", null, flag: false);
        }

        return new LotKinetics
        {
            LotKey = cx.Key,
            Lot = lot,
            Thresholds = th,
            Origin = origin,
            OriginKind = originKind,
            Settings = s,
            Sugar = sugar,
            Temperatures = temps,
            Dense = rate.Dense,
            MedianSpacingHours = rate.MedianSpacing,
            MaxRateMethod = rate.Method,
            MaxRateBrixPerDay = rate.Rate,
            MaxRateAt = rate.At,
            StartingBrix = start,
            LotStartingBrix = fromLot ? lotStart : null,
            LagHours = lagHours,
            LagEnd = lagEnd,
            OneThirdBasis = fromLot ? OneThirdBasis.LotRecord : OneThirdBasis.FirstReading,
            OneThirdBrix = oneThird,
            OneThirdAt = oneThirdAt,
            OneThirdHours = oneThirdH,
            OneThirdFirstReadingBrix = oneThirdFirst,
            OneThirdFirstReadingAt = oneThirdFirstAt,
            OneThirdFirstReadingHours = oneThirdFirstH,
            DryAt = dryAt,
            HoursToDry = dryH,
            DurationHours = hrs[^1],
            FinalBrix = final,
            PeakTemperatureC = exposure.Peak,
            PeakTemperatureAt = exposure.PeakAt,
            HoursAboveCaution = exposure.AboveCaution,
            HoursAboveDanger = exposure.AboveDanger,
            Sluggish = stalls.Sluggish,
            Stuck = stalls.Stuck,
            StalledThenFinished = stalls.Restarted,
            ReadingsWithPotentialAboveDanger = heat.ReadingsAboveDanger,
            PotentialPeak = heat.PotentialPeak,
            HeatRemovedK = heat.Removed,
            Gompertz = gomp,
            Logistic = logi,
            Flags = KineticsCodes.Flags.Where(cx.Flags.Contains).ToArray(),
        };
    }

    /// <summary>Sorts the readings by time (reporting any out of order) and merges readings of one time (reporting them).</summary>
    private static Readings Prepare(IReadOnlyList<LogReading> raw, Context cx)
    {
        // Out-of-order: a reading logged before the one above it in the file.
        bool inOrder = true;
        for (int i = 1; i < raw.Count; i++)
        {
            if (raw[i].Timestamp < raw[i - 1].Timestamp)
            {
                inOrder = false;
                cx.Report(KineticsCodes.OutOfOrderTimestamp, $"Lot {cx.Key}: the reading at {Stamp(raw[i].Timestamp)} comes after one at {Stamp(raw[i - 1].Timestamp)} in the log; the readings were sorted by time. Check the date and time of this row.", raw[i].Source);
            }
        }

        // Sorted by time, readings of equal time kept in file order (a stable sort; nothing to do for a log in order).
        var sorted = raw.ToArray();
        if (!inOrder)
        {
            var position = Enumerable.Range(0, sorted.Length).ToArray();
            Array.Sort(position, (a, b) => raw[a].Timestamp != raw[b].Timestamp ? raw[a].Timestamp.CompareTo(raw[b].Timestamp) : a.CompareTo(b));
            for (int i = 0; i < sorted.Length; i++)
            {
                sorted[i] = raw[position[i]];
            }
        }

        // Readings of one time are merged: sugar and temperature each averaged over the readings that hold them.
        var sugarRaw = new List<(DateTime T, double Brix, LogReading Src)>(sorted.Length);
        var tempRaw = new List<(DateTime T, double C, LogReading Src)>(sorted.Length);
        for (int from = 0, to; from < sorted.Length; from = to)
        {
            var time = sorted[from].Timestamp;
            to = from + 1;
            while (to < sorted.Length && sorted[to].Timestamp == time)
            {
                to++;
            }

            if (to - from > 1)
            {
                cx.Report(KineticsCodes.DuplicateTimestamp, $"Lot {cx.Key}: {to - from} readings share the time {Stamp(time)}; their values were averaged. Check whether one of them has a wrong time.", sorted[from + 1].Source);
            }

            double sugarSum = 0, tempSum = 0;
            int sugarCount = 0, tempCount = 0;
            LogReading? sugarSource = null, tempSource = null;
            for (int i = from; i < to; i++)
            {
                var r = sorted[i];
                if (r.Sugar is { } sr)
                {
                    sugarSource = sugarCount == 0 ? r : sugarSource;
                    sugarSum += sr.Brix;
                    sugarCount++;
                }

                if (r.TemperatureC is { } c)
                {
                    tempSource = tempCount == 0 ? r : tempSource;
                    tempSum += c;
                    tempCount++;
                }
            }

            if (sugarCount > 0)
            {
                sugarRaw.Add((time, sugarSum / sugarCount, sugarSource!));
            }

            if (tempCount > 0)
            {
                tempRaw.Add((time, tempSum / tempCount, tempSource!));
            }
        }

        return new Readings(sugarRaw, tempRaw, sorted.Length > 0 ? sorted[0].Source : null);
    }

    /// <summary>Reports a sugar reading more than the setting above the one before it.</summary>
    private static void CheckRises(SugarPoint[] sugar, Context cx)
    {
        for (int i = 1; i < sugar.Length; i++)
        {
            if (sugar[i].Brix - sugar[i - 1].Brix > cx.Settings.SugarRiseBrix)
            {
                cx.Report(KineticsCodes.SugarRose, $"Lot {cx.Key}: sugar rose from {F(sugar[i - 1].Brix)} to {F(sugar[i].Brix)} °Brix between {Stamp(sugar[i - 1].Time)} and {Stamp(sugar[i].Time)}; check the reading, or record the addition or blend that raised it.", sugar[i].Source);
            }
        }
    }

    /// <summary>
    /// The rates between readings, the smoothed rates, and the maximum: from the smoothed rate on dense probe logs, else
    /// (or when no window held three readings) from the rates between readings.
    /// </summary>
    private static MaxRate FastestRate(SugarPoint[] sugar, KineticsSettings s)
    {
        var rates = RatesBetween(sugar);
        var gaps = Descriptive.ToSortedArray(rates.Select(r => r.ElapsedHours));
        double medianSpacing = Descriptive.MedianOfSorted(gaps);
        bool dense = medianSpacing <= s.DenseSpacingHours;
        var smoothed = dense ? SmoothedRates(sugar, s.SmoothingWindowHours) : [];

        double? maxRate = null;
        DateTime? maxAt = null;
        var method = dense ? RateMethod.LocalLinearFit : RateMethod.BetweenReadings;
        if (dense)
        {
            foreach (var sr in smoothed)
            {
                if (sr.BrixPerDay is { } r && (maxRate is null || r > maxRate))
                {
                    maxRate = r;
                    maxAt = sr.Time;
                }
            }
        }

        if (maxRate is null)
        {
            method = RateMethod.BetweenReadings;
            foreach (var r in rates)
            {
                if (maxRate is null || r.BrixPerDay > maxRate)
                {
                    maxRate = r.BrixPerDay;
                    maxAt = r.Midpoint;
                }
            }
        }

        return new MaxRate(dense, medianSpacing, method, maxRate, maxAt);
    }

    /// <summary>Lag: the sugar first falls <see cref="KineticsSettings.LagDropBrix"/> below the start and never comes back above that level.</summary>
    private static (double? Hours, DateTime? End) Lag(SugarPoint[] sugar, double[] hrs, double[] bx, DateTime origin, Context cx)
    {
        double lagLevel = bx[0] - cx.Settings.LagDropBrix;
        int k = bx.Length;
        while (k > 0 && bx[k - 1] <= lagLevel)
        {
            k--;
        }

        if (k >= bx.Length || k == 0)
        {
            return (null, null);
        }

        double tCross = Interpolate(hrs[k - 1], bx[k - 1], hrs[k], bx[k], lagLevel);
        var end = origin + TimeSpan.FromHours(tCross);
        if (tCross < 0)
        {
            cx.Report(KineticsCodes.DropBeforeInoculation, $"Lot {cx.Key}: the sugar had already fallen {F(cx.Settings.LagDropBrix)} °Brix at {Stamp(end)}, before the recorded inoculation at {Stamp(origin)}; the lag is given as 0 h. Check the inoculation date.", sugar[k].Source, flag: false);
        }

        return (Math.Max(0, tCross), end);
    }

    /// <summary>The peak temperature, the hours above the caution and danger thresholds, and their flags.</summary>
    private static Exposure Temperatures(TemperaturePoint[] temps, TemperatureThresholds th, Context cx)
    {
        double? peak = null;
        DateTime? peakAt = null;
        SourceRef? peakSource = null;
        foreach (var t in temps)
        {
            if (peak is null || t.Celsius > peak)
            {
                (peak, peakAt, peakSource) = (t.Celsius, t.Time, t.Source);
            }
        }

        var tH = temps.Select(t => t.Hours).ToArray();
        var tC = temps.Select(t => t.Celsius).ToArray();
        double aboveCaution = KineticsAnalysis.HoursAbove(tH, tC, th.CautionC);
        double aboveDanger = KineticsAnalysis.HoursAbove(tH, tC, th.DangerC);
        if (peak > th.DangerC)
        {
            cx.Report(KineticsCodes.AboveDangerTemp, $"Lot {cx.Key} reached {T(cx, peak!.Value)} at {Stamp(peakAt!.Value)}, above the danger threshold of {T(cx, th.DangerC)}, for about {F(aboveDanger)} h; yeast die near this temperature and the ferment may stop.", peakSource);
        }
        else if (peak > th.CautionC)
        {
            cx.Report(KineticsCodes.AboveCautionTemp, $"Lot {cx.Key} reached {T(cx, peak!.Value)} at {Stamp(peakAt!.Value)}, above the caution threshold of {T(cx, th.CautionC)}, for about {F(aboveCaution)} h.", peakSource);
        }

        return new Exposure(peak, peakAt, aboveCaution, aboveDanger);
    }

    /// <summary>
    /// The stall rules. A stall (<see cref="KineticsSettings.StuckRateBrixPerDay"/> over <see cref="KineticsSettings.StuckHours"/>)
    /// is stuck when the lot did not finish after it; stalled-then-finished when the sugar then fell again at a normal
    /// pace (<see cref="KineticsSettings.RestartRateBrixPerDay"/> over the same window) and the lot finished; otherwise
    /// it was a slow end that only slowed further, which is not flagged. Sluggish is judged on its own.
    /// </summary>
    private static Stalls StallsOf(Lot lot, SugarPoint[] sugar, double[] hrs, double[] bx, double judgeFrom, DateTime? dryAt, Func<DateTime, double> hoursOf, Context cx)
    {
        var s = cx.Settings;
        double sluggishRate = s.SluggishRateFor(lot.Colour);
        var stall = FindStall(sugar, hrs, bx, judgeFrom, s.StuckHours, s.StuckRateBrixPerDay, s.StuckAboveBrix);
        var sluggish = FindStall(sugar, hrs, bx, judgeFrom, s.SluggishHours, sluggishRate, s.SluggishAboveBrix);
        bool rsDry = lot.ResidualSugarGl is { } rsDryValue && rsDryValue <= s.DryResidualSugarGl;
        bool dryAfterStall = stall is not null && dryAt is { } da && da > stall.End;
        StallEpisode? stuck = stall is not null && !dryAfterStall && !rsDry ? stall : null;
        double? restartRate = stall is not null && stuck is null ? FastestWindowAfter(hrs, bx, hoursOf(stall.End), s.StuckHours) : null;
        StallEpisode? restarted = restartRate >= s.RestartRateBrixPerDay ? stall : null;
        string rsNote = lot.ResidualSugarGl is { } rsv
            ? rsv > s.DryResidualSugarGl
                ? $" The lab recorded {F(rsv)} g/L residual sugar, above the {F(s.DryResidualSugarGl)} g/L dry limit."
                : $" The lab recorded {F(rsv)} g/L residual sugar, within the {F(s.DryResidualSugarGl)} g/L dry limit."
            : " No residual sugar was recorded for the lot.";
        string StallText(StallEpisode e) =>
            $"sugar went from {F(e.BrixStart)} to {F(e.BrixEnd)} °Brix between {Stamp(e.Start)} and {Stamp(e.End)} ({F(e.MeanRateBrixPerDay, "0.00")} °Brix/day, under {F(s.StuckRateBrixPerDay, "0.00")} for {F(s.StuckHours, "0")} h while above {F(s.StuckAboveBrix)} °Brix)";
        SourceRef? At(StallEpisode e) => sugar.First(p => p.Time == e.End).Source;
        if (stuck is not null)
        {
            cx.Report(KineticsCodes.Stuck, $"Lot {cx.Key}: {StallText(stuck)}.{rsNote}", At(stuck));
        }
        else if (restarted is not null)
        {
            string how = dryAfterStall
                ? $"the log reached {F(s.DryBrix)} °Brix afterwards ({Stamp(dryAt!.Value)})"
                : "the lot finished after the log ended";
            cx.Report(KineticsCodes.StalledThenFinished, $"Lot {cx.Key}: {StallText(restarted)}, then it picked up again ({F(restartRate!.Value, "0.00")} °Brix/day over {F(s.StuckHours, "0")} h) and {how}, so it is not counted as stuck.{rsNote}", At(restarted));
        }

        if (sluggish is not null)
        {
            cx.Report(KineticsCodes.Sluggish, $"Lot {cx.Key}: sugar went from {F(sluggish.BrixStart)} to {F(sluggish.BrixEnd)} °Brix between {Stamp(sluggish.Start)} and {Stamp(sluggish.End)} ({F(sluggish.MeanRateBrixPerDay, "0.00")} °Brix/day, under {F(sluggishRate, "0.00")} for {F(s.SluggishHours, "0")} h while above {F(s.SluggishAboveBrix)} °Brix, after the fastest point of the ferment).", At(sluggish));
        }

        return new Stalls(stuck, restarted, sluggish);
    }

    /// <summary>
    /// The temperature each reading could reach if its remaining sugar fermented with no heat removed, the must's heat
    /// capacity taken at the reading's °Brix (lowest at the start, so the rise is not understated).
    /// </summary>
    private static HeatResult Heat(SugarPoint[] sugar, double? peak, TemperatureThresholds th, Context cx)
    {
        var heat = HeatPoints(sugar, cx.Settings);
        HeatPoint? potentialPeak = heat.Length == 0 ? null : heat.Aggregate((a, b) => b.PotentialTemperatureC > a.PotentialTemperatureC ? b : a);
        double? removed = potentialPeak is { } pp && peak is not null ? pp.PotentialTemperatureC - peak.Value : null;
        int hotIndex = Array.FindIndex(heat, h => h.PotentialTemperatureC > th.DangerC);
        int hotReadings = heat.Count(h => h.PotentialTemperatureC > th.DangerC);
        if (hotIndex >= 0)
        {
            // Not a lot flag: at ordinary must sugar nearly every lot passes the danger level on paper; the finding is a
            // reminder of the cooling the lot depended on, not a sign that something went wrong.
            var hot = heat[hotIndex];
            string observed = peak is { } pk ? $" The logged peak was {T(cx, pk)}, so about {Rise(cx, removed!.Value)} of the potential was removed by {KineticsFollowUps.WhatRemovedHeat(cx.Colour)}." : string.Empty;
            cx.Report(KineticsCodes.HeatPotentialAboveDanger, $"Lot {cx.Key}: at {F(hot.Brix)} °Brix and {T(cx, hot.TemperatureC)} this lot could have reached {T(cx, hot.PotentialTemperatureC)} without cooling ({Stamp(hot.Time)}; {hotReadings} reading(s) above the {T(cx, th.DangerC)} danger threshold).{observed}", sugar.First(p => p.Time == hot.Time).Source, flag: false);
        }

        return new HeatResult(potentialPeak, removed, hotReadings);
    }

    /// <summary>The rates between consecutive sugar readings, on the real time between them.</summary>
    internal static RateInterval[] RatesBetween(IReadOnlyList<SugarPoint> sugar)
    {
        var rates = new RateInterval[Math.Max(0, sugar.Count - 1)];
        for (int i = 1; i < sugar.Count; i++)
        {
            rates[i - 1] = new RateInterval(sugar[i - 1].Time, sugar[i].Time, sugar[i].Hours - sugar[i - 1].Hours, sugar[i - 1].Brix, sugar[i].Brix);
        }

        return rates;
    }

    /// <summary>The smoothed rate at each sugar reading: a local linear fit over a centred window of <paramref name="windowHours"/>.</summary>
    internal static SmoothedRate[] SmoothedRates(IReadOnlyList<SugarPoint> sugar, double windowHours)
    {
        var local = KineticsAnalysis.LocalLinearRates(sugar.Select(p => p.Hours).ToArray(), sugar.Select(p => p.Brix).ToArray(), windowHours);
        return sugar.Select((p, i) => new SmoothedRate(p.Time, p.Brix, local[i])).ToArray();
    }

    /// <summary>
    /// The temperature each sugar reading with a temperature could reach if its remaining sugar fermented with no heat
    /// removed, the must's heat capacity taken at the reading's °Brix (lowest at the start, so the rise is not understated).
    /// </summary>
    internal static HeatPoint[] HeatPoints(IReadOnlyList<SugarPoint> sugar, KineticsSettings s)
    {
        var heat = new List<HeatPoint>(sugar.Count);
        foreach (var p in sugar)
        {
            if (p.TemperatureC is not { } c)
            {
                continue;
            }

            var reading = SugarReading.FromBrix(p.Brix);
            double gl = reading.GramsPerLitre;
            heat.Add(new HeatPoint(p.Time, p.Brix, c, gl, FermentationHeat.PotentialRiseK(gl, FermentationHeat.MustDensityKgPerL(reading), s.HeatOfFermentationKjPerMol, s.MustHeatCapacityAt(p.Brix))));
        }

        return [.. heat];
    }

    private static string Stamp(DateTime t) => t.ToString("yyyy-MM-dd HH:mm", CultureInfo.InvariantCulture);

    private static string F(double v, string format = "0.0") => v.ToString(format, CultureInfo.InvariantCulture);

    /// <summary>A temperature (°C) as the sentences show it, in the settings' unit.</summary>
    private static string T(Context cx, double celsius) => cx.Settings.SentenceUnit.Show(celsius);

    /// <summary>A temperature difference (K) as the sentences show it: "12.3 K", or in °F degrees.</summary>
    private static string Rise(Context cx, double kelvin) =>
        cx.Settings.SentenceUnit == Units.TemperatureUnit.Fahrenheit ? F(kelvin * 9.0 / 5.0) + " °F" : F(kelvin) + " K";
}
