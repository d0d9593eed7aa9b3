using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Statistics;
using YieldBench.Core.Units;

namespace YieldBench.Core.Kinetics;

/// <summary>
/// Fermentation kinetics and heat from the lots' logs: rates, lag, one-third depletion, dryness, temperature exposure,
/// sluggish and stuck stretches, Zwietering sigmoid fits, adiabatic heat potential, and per-strain summaries.
/// Pure: no I/O, no clock. Definitions and defaults are in docs/methods.md.
/// </summary>
public static class KineticsAnalysis
{
    /// <summary>Flag codes a lot can carry, in the order they are listed.</summary>
    public static IReadOnlyList<string> FlagOrder { get; } =
    [
        "stuck", "sluggish", "stalled-then-finished", "not-dry-at-log-end", "above-danger-temp", "above-caution-temp",
        "out-of-order-timestamp", "duplicate-timestamp", "sugar-rose",
    ];

    /// <summary>
    /// Runs the analysis. Logs join lots by season and lot id; a log with no season joins by lot id when exactly one lot
    /// has that id. Logs without a lot and lots without a log are listed in the result.
    /// </summary>
    public static KineticsReview Run(IReadOnlyList<LotConversion> lots, IReadOnlyList<FermentationLog> logs, KineticsSettings settings)
    {
        ArgumentNullException.ThrowIfNull(lots);
        ArgumentNullException.ThrowIfNull(logs);
        ArgumentNullException.ThrowIfNull(settings);
        var problems = settings.Problems();
        if (problems.Count > 0)
        {
            throw new ArgumentException("Kinetics settings are not usable: " + string.Join(" ", problems), nameof(settings));
        }

        var findings = new List<KineticsFinding>();
        var byKey = new Dictionary<LotKey, LotConversion>();
        foreach (var l in lots)
        {
            byKey.TryAdd(l.Lot.Key, l);
        }

        var byId = lots.GroupBy(l => l.Lot.LotId, StringComparer.Ordinal).ToDictionary(g => g.Key, g => g.ToArray(), StringComparer.Ordinal);
        var logsFor = new Dictionary<LotKey, List<FermentationLog>>();
        var orphans = new List<FermentationLog>();
        foreach (var log in logs)
        {
            LotConversion? match = null;
            if (log.Key is { } logKey)
            {
                byKey.TryGetValue(logKey, out match);
            }
            else if (byId.TryGetValue(log.LotId, out var same))
            {
                if (same.Length == 1)
                {
                    match = same[0];
                }
                else
                {
                    findings.Add(new(log.Key, "log-matches-several-lots", $"The log for lot {log.LotId} names no season and {same.Length} seasons have a lot {log.LotId} ({string.Join(", ", same.Select(s => s.Lot.Season))}); give the season in the log so it can be joined.", FirstSource(log)) { LogName = log.Name });
                    orphans.Add(log);
                    continue;
                }
            }

            if (match is null)
            {
                findings.Add(new(log.Key, "log-without-lot", $"The log for lot {log.Name} matches no lot in the lot records; check the lot id and season.", FirstSource(log)) { LogName = log.Name });
                orphans.Add(log);
                continue;
            }

            if (!logsFor.TryGetValue(match.Lot.Key, out var list))
            {
                logsFor[match.Lot.Key] = list = [];
            }

            list.Add(log);
        }

        // Lots in input order (first of any repeated key); each is analysed on its own, so they run side by side and
        // their results and findings are put back in this order.
        var work = new List<(LotConversion Lot, List<FermentationLog> Logs)>();
        var withoutLog = new List<LotKey>();
        var seen = new HashSet<LotKey>();
        foreach (var lc in lots)
        {
            if (!seen.Add(lc.Lot.Key))
            {
                continue;
            }

            if (!logsFor.TryGetValue(lc.Lot.Key, out var lotLogs))
            {
                withoutLog.Add(lc.Lot.Key);
                continue;
            }

            work.Add((lc, lotLogs));
        }

        var analysed = new LotKinetics?[work.Count];
        var lotFindings = new List<KineticsFinding>[work.Count];
        Parallel.For(0, work.Count, new ParallelOptions { MaxDegreeOfParallelism = Environment.ProcessorCount }, i =>
        {
            var (lc, lotLogs) = work[i];
            var own = new List<KineticsFinding>();
            if (lotLogs.Count > 1)
            {
                own.Add(new(lc.Lot.Key, "several-logs-for-lot", $"{lotLogs.Count} logs were found for lot {lc.Lot.Key}; their readings were combined.", FirstSource(lotLogs[1])));
            }

            var readings = lotLogs.SelectMany(g => g.Readings).ToArray();
            analysed[i] = AnalyseLot(lc.Lot, readings, settings, own);
            lotFindings[i] = own;
        });

        var results = new List<LotKinetics>(work.Count);
        for (int i = 0; i < work.Count; i++)
        {
            findings.AddRange(lotFindings[i]);
            if (analysed[i] is { } lk)
            {
                results.Add(lk);
            }
        }

        return new KineticsReview
        {
            Lots = results,
            Strains = SummariseStrains(results),
            Findings = findings,
            LogsWithoutLot = orphans,
            LotsWithoutLog = withoutLog,
            Settings = settings,
        };
    }

    /// <summary>Per-strain medians and quartiles of the lots' metrics.</summary>
    public static IReadOnlyList<StrainKinetics> SummariseStrains(IReadOnlyList<LotKinetics> lots)
    {
        ArgumentNullException.ThrowIfNull(lots);
        return lots.GroupBy(l => l.Lot.Strain, StringComparer.Ordinal)
            .OrderBy(g => g.Key, StringComparer.Ordinal)
            .Select(g => new StrainKinetics
            {
                Strain = g.Key,
                Lots = g.Count(),
                MaxRateBrixPerDay = Summary(g.Select(l => l.MaxRateBrixPerDay)),
                LagHours = Summary(g.Select(l => l.LagHours)),
                DaysToDry = Summary(g.Select(l => l.DaysToDry)),
                PeakTemperatureC = Summary(g.Select(l => l.PeakTemperatureC)),
                SluggishLots = g.Count(l => l.Sluggish is not null),
                StuckLots = g.Count(l => l.Stuck is not null),
            })
            .ToArray();
    }

    /// <summary>Median and type-7 quartiles of the non-null values.</summary>
    public static MetricSummary Summary(IEnumerable<double?> values)
    {
        var sorted = Descriptive.ToSortedArray(values.Where(v => v is { } x && double.IsFinite(x)).Select(v => v!.Value));
        return new MetricSummary(sorted.Length, Descriptive.MedianOfSorted(sorted), Descriptive.QuantileOfSorted(sorted, 0.25), Descriptive.QuantileOfSorted(sorted, 0.75));
    }

    /// <summary>
    /// The smoothed rate at each point: minus the least-squares slope of °Brix on time over the readings within
    /// ±window/2 h, in °Brix/day; null where the window holds fewer than three readings.
    /// </summary>
    public static IReadOnlyList<double?> LocalLinearRates(IReadOnlyList<double> hours, IReadOnlyList<double> brix, double windowHours)
    {
        ArgumentNullException.ThrowIfNull(hours);
        ArgumentNullException.ThrowIfNull(brix);
        int n = hours.Count;
        var rates = new double?[n];
        int lo = 0, hi = 0;
        double half = windowHours / 2.0;
        for (int i = 0; i < n; i++)
        {
            while (hours[lo] < hours[i] - half)
            {
                lo++;
            }

            while (hi + 1 < n && hours[hi + 1] <= hours[i] + half)
            {
                hi++;
            }

            int m = hi - lo + 1;
            if (m < 3)
            {
                continue;
            }

            // Centre on the reading so the sums stay well conditioned for long logs.
            double sx = 0, sy = 0;
            for (int j = lo; j <= hi; j++)
            {
                sx += hours[j] - hours[i];
                sy += brix[j];
            }

            double mx = sx / m, my = sy / m, sxx = 0, sxy = 0;
            for (int j = lo; j <= hi; j++)
            {
                double dx = hours[j] - hours[i] - mx;
                sxx += dx * dx;
                sxy += dx * (brix[j] - my);
            }

            if (sxx > 0)
            {
                rates[i] = -sxy / sxx * 24.0;
            }
        }

        return rates;
    }

    /// <summary>Hours a piecewise-linear temperature trace spends above <paramref name="thresholdC"/>.</summary>
    public static double HoursAbove(IReadOnlyList<double> hours, IReadOnlyList<double> celsius, double thresholdC)
    {
        ArgumentNullException.ThrowIfNull(hours);
        ArgumentNullException.ThrowIfNull(celsius);
        double total = 0;
        for (int i = 1; i < hours.Count; i++)
        {
            double dt = hours[i] - hours[i - 1];
            double a = celsius[i - 1], b = celsius[i];
            if (a > thresholdC && b > thresholdC)
            {
                total += dt;
            }
            else if (a > thresholdC)
            {
                total += dt * (a - thresholdC) / (a - b);
            }
            else if (b > thresholdC)
            {
                total += dt * (b - thresholdC) / (b - a);
            }
        }

        return total;
    }

    private static SourceRef? FirstSource(FermentationLog log) => log.Readings.FirstOrDefault(r => r.Source is not null)?.Source;

    private static string Stamp(DateTime t) => t.ToString("yyyy-MM-dd HH:mm", CultureInfo.InvariantCulture);

    private static string F(double v, string format = "0.0") => v.ToString(format, CultureInfo.InvariantCulture);

    private static LotKinetics? AnalyseLot(Lot lot, IReadOnlyList<LogReading> raw, KineticsSettings s, List<KineticsFinding> findings)
    {
        var key = lot.Key;
        var flags = new HashSet<string>(StringComparer.Ordinal);

        // Out-of-order: a reading logged before the one above it in the file.
        bool inOrder = true;
        for (int i = 1; i < raw.Count; i++)
        {
            if (raw[i].Timestamp < raw[i - 1].Timestamp)
            {
                inOrder = false;
                flags.Add("out-of-order-timestamp");
                findings.Add(new(key, "out-of-order-timestamp", $"Lot {key}: the reading at {Stamp(raw[i].Timestamp)} comes after one at {Stamp(raw[i - 1].Timestamp)} in the log; the readings were sorted by time. Check the date and time of this row.", raw[i].Source));
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
        var sugarRaw = new List<(DateTime T, double Brix, SourceRef? Src)>(sorted.Length);
        var tempRaw = new List<(DateTime T, double C, SourceRef? Src)>(sorted.Length);
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
                flags.Add("duplicate-timestamp");
                findings.Add(new(key, "duplicate-timestamp", $"Lot {key}: {to - from} readings share the time {Stamp(time)}; their values were averaged. Check whether one of them has a wrong time.", sorted[from + 1].Source));
            }

            double sugarSum = 0, tempSum = 0;
            int sugarCount = 0, tempCount = 0;
            SourceRef? sugarSource = null, tempSource = null;
            for (int i = from; i < to; i++)
            {
                var r = sorted[i];
                if (r.Sugar is { } sr)
                {
                    sugarSource = sugarCount == 0 ? r.Source : sugarSource;
                    sugarSum += sr.Brix;
                    sugarCount++;
                }

                if (r.TemperatureC is { } c)
                {
                    tempSource = tempCount == 0 ? r.Source : tempSource;
                    tempSum += c;
                    tempCount++;
                }
            }

            if (sugarCount > 0)
            {
                sugarRaw.Add((time, sugarSum / sugarCount, sugarSource));
            }

            if (tempCount > 0)
            {
                tempRaw.Add((time, tempSum / tempCount, tempSource));
            }
        }

        if (sugarRaw.Count < 2)
        {
            findings.Add(new(key, "too-few-sugar-readings", $"Lot {key}: the log has {sugarRaw.Count} sugar reading(s); rates need at least two. The lot's kinetics were not analysed.", sorted.Length > 0 ? sorted[0].Source : null));
            return null;
        }

        DateTime origin;
        TimeOrigin originKind;
        if (lot.InoculationDate is { } inoc)
        {
            origin = inoc;
            originKind = TimeOrigin.Inoculation;
        }
        else
        {
            origin = sugarRaw[0].T;
            originKind = TimeOrigin.FirstReading;
        }

        double H(DateTime t) => (t - origin).TotalHours;
        var th = s.ThresholdsFor(lot.Colour);

        var temps = tempRaw.Select(t => new TemperaturePoint(t.T, H(t.T), t.C, t.Src)).ToArray();
        var sugar = sugarRaw.Select(p => new SugarPoint(p.T, H(p.T), p.Brix, TemperatureAt(temps, p.T, s.TemperaturePairingHours), p.Src)).ToArray();
        var hrs = sugar.Select(p => p.Hours).ToArray();
        var bx = sugar.Select(p => p.Brix).ToArray();

        for (int i = 1; i < sugar.Length; i++)
        {
            if (bx[i] - bx[i - 1] > s.SugarRiseBrix)
            {
                flags.Add("sugar-rose");
                findings.Add(new(key, "sugar-rose", $"Lot {key}: sugar rose from {F(bx[i - 1])} to {F(bx[i])} °Brix between {Stamp(sugar[i - 1].Time)} and {Stamp(sugar[i].Time)}; check the reading, or record the addition or blend that raised it.", sugar[i].Source));
            }
        }

        var rates = new RateInterval[sugar.Length - 1];
        for (int i = 1; i < sugar.Length; i++)
        {
            rates[i - 1] = new RateInterval(sugar[i - 1].Time, sugar[i].Time, hrs[i] - hrs[i - 1], bx[i - 1], bx[i]);
        }

        var gaps = Descriptive.ToSortedArray(rates.Select(r => r.ElapsedHours));
        double medianSpacing = Descriptive.MedianOfSorted(gaps);
        bool dense = medianSpacing <= s.DenseSpacingHours;
        var local = LocalLinearRates(hrs, bx, s.SmoothingWindowHours);
        var smoothed = sugar.Select((p, i) => new SmoothedRate(p.Time, p.Brix, local[i])).ToArray();

        double? maxRate = null;
        DateTime? maxAt = null;
        var method = dense ? RateMethod.LocalLinearFit : RateMethod.BetweenReadings;
        if (dense)
        {
            for (int i = 0; i < smoothed.Length; i++)
            {
                if (smoothed[i].BrixPerDay is { } r && (maxRate is null || r > maxRate))
                {
                    maxRate = r;
                    maxAt = smoothed[i].Time;
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

        double start = bx[0];

        // Lag: the sugar first falls LagDropBrix below the start and never comes back above that level.
        double lagLevel = start - s.LagDropBrix;
        int k = bx.Length;
        while (k > 0 && bx[k - 1] <= lagLevel)
        {
            k--;
        }

        double? lagHours = null;
        DateTime? lagEnd = null;
        if (k < bx.Length && k > 0)
        {
            double tCross = Interpolate(hrs[k - 1], bx[k - 1], hrs[k], bx[k], lagLevel);
            lagHours = Math.Max(0, tCross);
            lagEnd = origin + TimeSpan.FromHours(tCross);
            if (tCross < 0)
            {
                findings.Add(new(key, "drop-before-inoculation", $"Lot {key}: the sugar had already fallen {F(s.LagDropBrix)} °Brix at {Stamp(lagEnd.Value)}, before the recorded inoculation at {Stamp(origin)}; the lag is given as 0 h. Check the inoculation date.", sugar[k].Source));
            }
        }

        double oneThird = start * 2.0 / 3.0;
        var (oneThirdH, oneThirdAt) = FirstCrossing(hrs, bx, oneThird, origin);
        var (dryH, dryAt) = FirstCrossing(hrs, bx, s.DryBrix, origin);

        double final = bx[^1];
        if (dryAt is null)
        {
            flags.Add("not-dry-at-log-end");
            string rs = lot.ResidualSugarGl is { } r ? $"; the lab recorded {F(r)} g/L residual sugar" : string.Empty;
            findings.Add(new(key, "not-dry-at-log-end", $"Lot {key}: the log ends at {F(final)} °Brix on {Stamp(sugar[^1].Time)}, above the dry reading of {F(s.DryBrix)} °Brix{rs}.", sugar[^1].Source));
        }

        double? peak = null;
        DateTime? peakAt = null;
        foreach (var t in temps)
        {
            if (peak is null || t.Celsius > peak)
            {
                peak = t.Celsius;
                peakAt = t.Time;
            }
        }

        var tH = temps.Select(t => t.Hours).ToArray();
        var tC = temps.Select(t => t.Celsius).ToArray();
        double aboveCaution = HoursAbove(tH, tC, th.CautionC);
        double aboveDanger = HoursAbove(tH, tC, th.DangerC);
        if (peak > th.DangerC)
        {
            flags.Add("above-danger-temp");
            findings.Add(new(key, "above-danger-temp", $"Lot {key} reached {F(peak!.Value)} °C at {Stamp(peakAt!.Value)}, above the danger threshold of {F(th.DangerC)} °C, for about {F(aboveDanger)} h; yeast die near this temperature and the ferment may stop.", temps.First(t => t.Time == peakAt).Source));
        }
        else if (peak > th.CautionC)
        {
            flags.Add("above-caution-temp");
            findings.Add(new(key, "above-caution-temp", $"Lot {key} reached {F(peak!.Value)} °C at {Stamp(peakAt!.Value)}, above the caution threshold of {F(th.CautionC)} °C, for about {F(aboveCaution)} h.", temps.First(t => t.Time == peakAt).Source));
        }

        // Stalls are judged after the lag and after the fastest point: a slow start and the climb to full speed are the
        // lag's business, not a stall.
        double judgeFrom = hrs[0];
        if (lagHours is { } lh)
        {
            judgeFrom = Math.Max(judgeFrom, lh);
        }

        if (maxAt is { } ma)
        {
            judgeFrom = Math.Max(judgeFrom, H(ma));
        }

        double sluggishRate = s.SluggishRateFor(lot.Colour);
        var stall = FindStall(sugar, hrs, bx, judgeFrom, s.StuckHours, s.StuckRateBrixPerDay, s.StuckAboveBrix);
        var sluggish = FindStall(sugar, hrs, bx, judgeFrom, s.SluggishHours, sluggishRate, s.SluggishAboveBrix);
        bool rsDry = lot.ResidualSugarGl is { } rsDryValue && rsDryValue <= s.DryResidualSugarGl;
        bool dryAfterStall = stall is not null && dryAt is { } da && da > stall.End;
        StallEpisode? stuck = stall is not null && !dryAfterStall && !rsDry ? stall : null;
        StallEpisode? restarted = stall is not null && stuck is null ? stall : null;
        string rsNote = lot.ResidualSugarGl is { } rsv
            ? rsv > s.DryResidualSugarGl
                ? $" The lab recorded {F(rsv)} g/L residual sugar, above the {F(s.DryResidualSugarGl)} g/L dry limit."
                : $" The lab recorded {F(rsv)} g/L residual sugar, within the {F(s.DryResidualSugarGl)} g/L dry limit."
            : " No residual sugar was recorded for the lot.";
        string stallText(StallEpisode e) =>
            $"sugar went from {F(e.BrixStart)} to {F(e.BrixEnd)} °Brix between {Stamp(e.Start)} and {Stamp(e.End)} ({F(e.MeanRateBrixPerDay, "0.00")} °Brix/day, under {F(s.StuckRateBrixPerDay, "0.00")} for {F(s.StuckHours, "0")} h while above {F(s.StuckAboveBrix)} °Brix)";
        if (stuck is not null)
        {
            flags.Add("stuck");
            findings.Add(new(key, "stuck", $"Lot {key}: {stallText(stuck)}.{rsNote}", sugar.First(p => p.Time == stuck.End).Source));
        }
        else if (restarted is not null)
        {
            flags.Add("stalled-then-finished");
            string how = dryAfterStall
                ? $"the log reached {F(s.DryBrix)} °Brix afterwards ({Stamp(dryAt!.Value)})"
                : "the lot finished after the log ended";
            findings.Add(new(key, "stalled-then-finished", $"Lot {key}: {stallText(restarted)}, then {how}, so it is not counted as stuck.{rsNote}", sugar.First(p => p.Time == restarted.End).Source));
        }

        if (sluggish is not null)
        {
            flags.Add("sluggish");
            findings.Add(new(key, "sluggish", $"Lot {key}: sugar went from {F(sluggish.BrixStart)} to {F(sluggish.BrixEnd)} °Brix between {Stamp(sluggish.Start)} and {Stamp(sluggish.End)} ({F(sluggish.MeanRateBrixPerDay, "0.00")} °Brix/day, under {F(sluggishRate, "0.00")} for {F(s.SluggishHours, "0")} h while above {F(s.SluggishAboveBrix)} °Brix, after the fastest point of the ferment).", sugar.First(p => p.Time == sluggish.End).Source));
        }

        var heat = new List<HeatPoint>(sugar.Length);
        foreach (var p in sugar)
        {
            if (p.TemperatureC is not { } c)
            {
                continue;
            }

            var reading = SugarReading.FromBrix(p.Brix);
            double gl = reading.GramsPerLitre;
            heat.Add(new HeatPoint(p.Time, p.Brix, c, gl, FermentationHeat.PotentialRiseK(gl, FermentationHeat.MustDensityKgPerL(reading), s.HeatOfFermentationKjPerMol, s.MustHeatCapacityKjPerKgK)));
        }

        HeatPoint? potentialPeak = heat.Count == 0 ? null : heat.Aggregate((a, b) => b.PotentialTemperatureC > a.PotentialTemperatureC ? b : a);
        double? removed = potentialPeak is { } pp && peak is not null ? pp.PotentialTemperatureC - peak.Value : null;
        int hotIndex = heat.FindIndex(h => h.PotentialTemperatureC > th.DangerC);
        int hotReadings = heat.Count(h => h.PotentialTemperatureC > th.DangerC);
        if (hotIndex >= 0)
        {
            var hot = heat[hotIndex];
            // Not a lot flag: at ordinary must sugar nearly every lot passes the danger level on paper; the finding is a
            // reminder of the cooling the lot depended on, not a sign that something went wrong.
            int count = heat.Count(h => h.PotentialTemperatureC > th.DangerC);
            string observed = peak is { } pk ? $" The logged peak was {F(pk)} °C, so about {F(removed!.Value)} K of the potential was removed by the vessel, cap management and cooling." : string.Empty;
            findings.Add(new(key, "heat-potential-above-danger", $"Lot {key}: at {F(hot.Brix)} °Brix and {F(hot.TemperatureC)} °C this lot could have reached {F(hot.PotentialTemperatureC)} °C without cooling ({Stamp(hot.Time)}; {count} reading(s) above the {F(th.DangerC)} °C danger threshold).{observed}", sugar.First(p => p.Time == hot.Time).Source));
        }

        var consumed = bx.Select(b => start - b).ToArray();
        var gomp = ZwieteringFit.Fit(SigmoidModel.Gompertz, hrs, consumed, s.MinReadingsForFit, s.MinConsumedBrixForFit);
        var logi = ZwieteringFit.Fit(SigmoidModel.Logistic, hrs, consumed, s.MinReadingsForFit, s.MinConsumedBrixForFit);
        if (!gomp.Succeeded && !logi.Succeeded)
        {
            findings.Add(new(key, "no-sigmoid-fit", $"Lot {key}: {gomp.Reason}; rates, lag and depletion times above come from the readings themselves.", null));
        }

        return new LotKinetics
        {
            LotKey = key,
            Lot = lot,
            Thresholds = th,
            Origin = origin,
            OriginKind = originKind,
            Sugar = sugar,
            Temperatures = temps,
            Rates = rates,
            SmoothedRates = smoothed,
            Dense = dense,
            MedianSpacingHours = medianSpacing,
            MaxRateMethod = method,
            MaxRateBrixPerDay = maxRate,
            MaxRateAt = maxAt,
            StartingBrix = start,
            LagHours = lagHours,
            LagEnd = lagEnd,
            OneThirdBrix = oneThird,
            OneThirdAt = oneThirdAt,
            OneThirdHours = oneThirdH,
            DryAt = dryAt,
            HoursToDry = dryH,
            DurationHours = hrs[^1],
            FinalBrix = final,
            PeakTemperatureC = peak,
            PeakTemperatureAt = peakAt,
            HoursAboveCaution = aboveCaution,
            HoursAboveDanger = aboveDanger,
            Sluggish = sluggish,
            Stuck = stuck,
            StalledThenFinished = restarted,
            Heat = heat,
            ReadingsWithPotentialAboveDanger = hotReadings,
            PotentialPeak = potentialPeak,
            HeatRemovedK = removed,
            Gompertz = gomp,
            Logistic = logi,
            Flags = FlagOrder.Where(flags.Contains).ToArray(),
        };
    }

    private static double Interpolate(double t0, double y0, double t1, double y1, double level) =>
        y1 == y0 ? t0 : t0 + ((t1 - t0) * (y0 - level) / (y0 - y1));

    private static (double? Hours, DateTime? At) FirstCrossing(double[] hrs, double[] bx, double level, DateTime origin)
    {
        if (bx[0] <= level)
        {
            return (hrs[0], origin + TimeSpan.FromHours(hrs[0]));
        }

        for (int i = 1; i < bx.Length; i++)
        {
            if (bx[i] <= level)
            {
                double t = Interpolate(hrs[i - 1], bx[i - 1], hrs[i], bx[i], level);
                return (t, origin + TimeSpan.FromHours(t));
            }
        }

        return (null, null);
    }

    private static double BrixAt(double[] hrs, double[] bx, double t)
    {
        int i = Array.BinarySearch(hrs, t);
        if (i >= 0)
        {
            return bx[i];
        }

        i = ~i;
        if (i == 0)
        {
            return bx[0];
        }

        if (i >= hrs.Length)
        {
            return bx[^1];
        }

        double f = (t - hrs[i - 1]) / (hrs[i] - hrs[i - 1]);
        return bx[i - 1] + (f * (bx[i] - bx[i - 1]));
    }

    // The first window [t − D, t] ending at a reading, lying after `from`, whose mean rate is under the threshold while
    // every reading in it (and its interpolated start) stays above the sugar threshold.
    private static StallEpisode? FindStall(SugarPoint[] sugar, double[] hrs, double[] bx, double from, double windowH, double rateBrixPerDay, double aboveBrix)
    {
        for (int i = 0; i < hrs.Length; i++)
        {
            double t0 = hrs[i] - windowH;
            if (t0 < from - 1e-9)
            {
                continue;
            }

            double b0 = BrixAt(hrs, bx, t0);
            double rate = (b0 - bx[i]) / windowH * 24.0;
            if (rate >= rateBrixPerDay || b0 <= aboveBrix)
            {
                continue;
            }

            bool above = true;
            for (int j = i; j >= 0 && hrs[j] >= t0; j--)
            {
                if (bx[j] <= aboveBrix)
                {
                    above = false;
                    break;
                }
            }

            if (above)
            {
                return new StallEpisode(sugar[i].Time - TimeSpan.FromHours(windowH), sugar[i].Time, b0, bx[i], rate);
            }
        }

        return null;
    }

    private static double? TemperatureAt(TemperaturePoint[] temps, DateTime t, double maxGapHours)
    {
        if (temps.Length == 0)
        {
            return null;
        }

        // First reading at or after t, by binary search (dense probe logs hold thousands of readings).
        int lo = 0, hi = temps.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (temps[mid].Time < t)
            {
                lo = mid + 1;
            }
            else
            {
                hi = mid;
            }
        }

        int i = lo == temps.Length ? -1 : lo;
        if (i >= 0 && temps[i].Time == t)
        {
            return temps[i].Celsius;
        }

        bool hasBefore = i == -1 || i > 0;
        bool hasAfter = i >= 0;
        var before = i == -1 ? temps[^1] : i > 0 ? temps[i - 1] : default;
        var after = i >= 0 ? temps[i] : default;
        bool nearBefore = hasBefore && (t - before.Time).TotalHours <= maxGapHours;
        bool nearAfter = hasAfter && (after.Time - t).TotalHours <= maxGapHours;
        if (nearBefore && nearAfter)
        {
            double f = (t - before.Time).TotalHours / (after.Time - before.Time).TotalHours;
            return before.Celsius + (f * (after.Celsius - before.Celsius));
        }

        return nearBefore ? before.Celsius : nearAfter ? after.Celsius : null;
    }
}
