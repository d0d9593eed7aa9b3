using System.Globalization;
using YieldBench.Core.Lots;

namespace YieldBench.Intake;

/// <summary>
/// Joins log readings into one log per lot (by lot id and season), leaves out readings dated implausibly far from
/// their lot's season, and reports logs that match no lot, logs too short to measure, and lots without a log.
/// </summary>
internal static partial class LogJoin
{
    /// <summary>Most days a reading may lie from the middle of its log when no season places it.</summary>
    public const int MaxDaysFromLogMiddle = 366;

    public static List<FermentationLog> Join(IntakeRun run)
    {
        var logs = new List<FermentationLog>();
        var index = new Dictionary<(string, int?), List<LogReading>>();
        // Finished and running lots alike (a run reads one kind or the other).
        var recorded = run.Lots.Select(l => (l.LotId, l.Season, l.Source)).Concat(run.RunningLots.Select(l => (l.LotId, l.Season, l.Source))).ToList();
        var knownIds = recorded.Select(l => l.LotId).ToHashSet(StringComparer.Ordinal);
        string? lastId = null;
        int? lastSeason = null;
        List<LogReading>? lastList = null;
        foreach (var (rawId, season, reading) in run.Readings)
        {
            // A log's readings mostly follow one another: the same lot and season as the reading before is its list.
            if (lastList is not null && season == lastSeason && string.Equals(rawId, lastId, StringComparison.Ordinal))
            {
                lastList.Add(reading);
                continue;
            }

            // A log sheet named "Lot 23-004" (or "Batch #7") is the log of lot 23-004 when no lot bears the full name.
            string lotId = rawId;
            if (!knownIds.Contains(rawId) && LotWordPrefix().Match(rawId) is { Success: true } m && knownIds.Contains(rawId[m.Length..]))
            {
                lotId = rawId[m.Length..];
            }

            if (!index.TryGetValue((lotId, season), out var list))
            {
                index[(lotId, season)] = list = [];
                logs.Add(new FermentationLog(lotId, season, list));
            }

            list.Add(reading);
            (lastId, lastSeason, lastList) = (rawId, season, list);
        }

        logs = PlaceDayCounts(run, logs);
        logs = DropImplausibleDates(run, logs, recorded);
        if (logs.Count == 0)
        {
            return logs;
        }

        var lotKeys = recorded.Select(l => (l.LotId, (int?)l.Season)).ToHashSet();
        var lotIds = knownIds;

        // Lots with a log, by lot id and season (what a lot's key is made of).
        var withLog = new HashSet<(string, int)>();
        ILookup<string, (string LotId, int Season, SourceRef? Source)>? lotsById = null;
        bool Matched(FermentationLog log) => log.Season is null ? lotIds.Contains(log.LotId) : lotKeys.Contains((log.LotId, log.Season));
        foreach (var log in logs)
        {
            bool matched = Matched(log);
            var first = log.Readings[0].Source!;
            if (!matched)
            {
                // "122" and "0122": a spreadsheet drops the leading zero of an id typed as a number. Which one is
                // meant is the cellar's to say; the message names the lot that differs only so.
                string? zeroTwin = recorded.Where(l => log.Season is null || l.Season == log.Season)
                    .Select(l => l.LotId).FirstOrDefault(id => SameButLeadingZeros(id, log.LotId));
                run.Sink.Warning(first.File, first.Sheet, null, null, log.LotId, IssueCodes.LogWithoutLot,
                    IntakeMessages.LogWithoutLot(log.LotId, log.Season is { } s ? "season " + s.ToString(System.Globalization.CultureInfo.InvariantCulture) : "no season")
                    + (zeroTwin is null ? "" : IntakeMessages.LeadingZeroTwin(zeroTwin, log.LotId)));
                continue;
            }

            if (log.Season is { } season)
            {
                // Lot keys are unique, so this is the one lot of that id and season.
                withLog.Add((log.LotId, season));
                continue;
            }

            lotsById ??= recorded.ToLookup(l => l.LotId, StringComparer.Ordinal);
            foreach (var lot in lotsById[log.LotId])
            {
                withLog.Add((lot.LotId, lot.Season));
            }
        }

        // A running lot's log of one reading is a ferment just begun, which the forecast reads; only a finished lot's is short.
        bool oneIsEnough = run.Options.RunningLots;
        foreach (var log in logs.Where(l => Matched(l) && l.Readings.All(r => r.Timestamp == l.Readings[0].Timestamp) && !(oneIsEnough && l.Readings.Count == 1)))
        {
            var first = log.Readings[0].Source!;
            run.Sink.Warning(first.File, first.Sheet, first.Row, null, log.LotId, IssueCodes.LogTooShort, IntakeMessages.LogTooShort(log.Name, log.Readings.Count));
        }

        foreach (var group in recorded.Where(l => !withLog.Contains((l.LotId, l.Season))).GroupBy(l => l.Season).OrderBy(g => g.Key))
        {
            var ids = group.Select(l => l.LotId).ToList();
            var src = group.First().Source!;
            run.Sink.Warning(src.File, src.Sheet, null, null, null, IssueCodes.LotsWithoutLog, IntakeMessages.LotsWithoutLog(ids.Count, group.Key, ids.Take(10).ToList()));
        }

        return logs;
    }

    /// <summary>True for two ids of digits that differ only in leading zeros ("0122" and "122").</summary>
    internal static bool SameButLeadingZeros(string a, string b) =>
        !string.Equals(a, b, StringComparison.Ordinal) && a.Length > 0 && b.Length > 0 && a.All(char.IsAsciiDigit) && b.All(char.IsAsciiDigit)
        && string.Equals(a.TrimStart('0'), b.TrimStart('0'), StringComparison.Ordinal);

    /// <summary>
    /// Readings dated outside the year before to the year after their lot's season (or, for a log whose lot and
    /// season are unknown, more than <see cref="MaxDaysFromLogMiddle"/> days from its middle reading) are left out
    /// with an error, and their sheet's accounting moves them from used to reported.
    /// </summary>
    /// <summary>
    /// A log counted in days (<see cref="LogRows.DayZero"/>) is placed at its lot's inoculation date (day 0 = the
    /// inoculation day); a log whose lot has none is reported and left out (one of no lot is reported as such later).
    /// </summary>
    private static List<FermentationLog> PlaceDayCounts(IntakeRun run, List<FermentationLog> logs)
    {
        if (!logs.Any(l => LogRows.CountedInDays(l.Readings[0].Timestamp)))
        {
            return logs;
        }

        var inoculated = run.Lots.Select(l => (l.LotId, (int?)l.Season, l.InoculationDate))
            .Concat(run.RunningLots.Select(l => (l.LotId, (int?)l.Season, l.InoculationDate)))
            .Where(x => x.InoculationDate is not null)
            .ToList();
        var kept = new List<FermentationLog>(logs.Count);
        foreach (var log in logs)
        {
            if (!LogRows.CountedInDays(log.Readings[0].Timestamp))
            {
                kept.Add(log);
                continue;
            }

            bool lotKnown = run.Lots.Any(l => l.LotId == log.LotId) || run.RunningLots.Any(l => l.LotId == log.LotId);
            var dates = inoculated.Where(x => x.LotId == log.LotId && (log.Season is null || x.Item2 == log.Season)).Select(x => x.InoculationDate!.Value).Distinct().ToList();
            if (!lotKnown)
            {
                // Reported below as a log of no lot.
                kept.Add(log);
                continue;
            }

            if (dates.Count != 1)
            {
                var first = log.Readings[0].Source!;
                run.Sink.Error(first.File, first.Sheet, first.Row, null, log.LotId, IssueCodes.DaysWithoutInoculation, IntakeMessages.DaysWithoutInoculation(log.LotId));
                continue;
            }

            // With times of day in the log, day d is the inoculation's date + d at those times; without, each reading
            // is d days after the inoculation's own clock time.
            bool timed = log.Readings.Any(r => r.Timestamp.TimeOfDay != TimeSpan.Zero);
            var origin = timed ? dates[0].Date : dates[0];
            var placed = log.Readings.Select(r => r with { Timestamp = origin + (r.Timestamp - LogRows.DayZero) }).ToList();
            kept.Add(log with { Readings = placed });
        }

        return kept;
    }

    private static List<FermentationLog> DropImplausibleDates(IntakeRun run, List<FermentationLog> logs, List<(string LotId, int Season, SourceRef? Source)> recorded)
    {
        ILookup<string, int>? seasonsById = null;
        var kept = new List<FermentationLog>(logs.Count);
        foreach (var log in logs)
        {
            // The seasons the log may belong to: its own, or those of the lots of its id; none for a log of no lot.
            int[] seasons = log.Season is { } s ? [s]
                : (seasonsById ??= recorded.ToLookup(l => l.LotId, l => l.Season, StringComparer.Ordinal))[log.LotId].ToArray();
            DateTime middle = seasons.Length > 0 ? default : log.Readings.Select(r => r.Timestamp).Order().ElementAt(log.Readings.Count / 2);
            int first = seasons.Length > 0 ? seasons.Min() - 1 : 0, last = seasons.Length > 0 ? seasons.Max() + 1 : 0;
            bool Plausible(DateTime t) => seasons.Length > 0
                ? t.Year >= first && t.Year <= last
                : Math.Abs((t - middle).TotalDays) <= MaxDaysFromLogMiddle;
            if (log.Readings.All(r => Plausible(r.Timestamp)))
            {
                kept.Add(log);
                continue;
            }

            string basis = seasons.Length > 0
                ? "season " + string.Join(" or ", seasons.Order().Select(y => y.ToString(CultureInfo.InvariantCulture)))
                : "the log's middle reading of " + middle.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);
            var good = new List<LogReading>();
            foreach (var reading in log.Readings)
            {
                if (Plausible(reading.Timestamp))
                {
                    good.Add(reading);
                    continue;
                }

                var src = reading.Source!;
                string shown = reading.Timestamp.ToString("yyyy-MM-dd HH:mm", CultureInfo.InvariantCulture);
                run.Sink.Error(src.File, src.Sheet, src.Row, null, shown, IssueCodes.ReadingDateImplausible, IntakeMessages.ReadingDateImplausible(log.Name, shown, basis));
                MoveToReported(run, src);
            }

            if (good.Count > 0)
            {
                kept.Add(log with { Readings = good });
            }
        }

        return kept;
    }

    /// <summary>Counts a reading that was used as reported in its sheet's accounting.</summary>
    private static void MoveToReported(IntakeRun run, SourceRef source)
    {
        int i = run.Accounts.FindIndex(a => a.File == source.File && a.Sheet == source.Sheet && a.Kind == "log");
        if (i >= 0)
        {
            var a = run.Accounts[i];
            run.Accounts[i] = a with { LogReadingsUsed = a.LogReadingsUsed - 1, RowsReported = a.RowsReported + 1 };
        }
    }

    [System.Text.RegularExpressions.GeneratedRegex(@"^(lot|batch)\s*(#|no\.?|nr\.?|number)?\s*[:#\-]?\s*", System.Text.RegularExpressions.RegexOptions.IgnoreCase | System.Text.RegularExpressions.RegexOptions.CultureInvariant)]
    private static partial System.Text.RegularExpressions.Regex LotWordPrefix();
}
