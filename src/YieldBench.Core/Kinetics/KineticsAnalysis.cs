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
    /// <summary>Flag codes a lot can carry, in the order they are listed (<see cref="KineticsCodes.Flags"/>).</summary>
    public static IReadOnlyList<string> FlagOrder => KineticsCodes.Flags;

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
                    findings.Add(new(log.Key, KineticsCodes.LogMatchesSeveralLots, $"The log for lot {log.LotId} names no season and {same.Length} seasons have a lot {log.LotId} ({string.Join(", ", same.Select(s => s.Lot.Season))}); give the season in the log so it can be joined.", FirstSource(log)) { LogName = log.Name });
                    orphans.Add(log);
                    continue;
                }
            }

            if (match is null)
            {
                findings.Add(new(log.Key, KineticsCodes.LogWithoutLot, $"The log for lot {log.Name} matches no lot in the lot records; check the lot id and season.", FirstSource(log)) { LogName = log.Name });
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
                own.Add(new(lc.Lot.Key, KineticsCodes.SeveralLogsForLot, $"{lotLogs.Count} logs were found for lot {lc.Lot.Key}; their readings were combined.", FirstSource(lotLogs[1])));
            }

            var readings = lotLogs.SelectMany(g => g.Readings).ToArray();
            analysed[i] = LotAnalysis.Analyse(lc, readings, settings, own);
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

    private static SourceRef? FirstSource(FermentationLog log) => log.Readings.FirstOrDefault(r => r.Place is not null)?.Source;
}
