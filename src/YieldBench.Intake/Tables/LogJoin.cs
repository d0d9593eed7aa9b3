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
        var namedByWord = new HashSet<string>(StringComparer.Ordinal);
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
            else if (!knownIds.Contains(rawId) && LotIdAsWord(rawId, knownIds) is { } word)
            {
                // A log named "Tank T1 - 25-QR-01" (a block heading, a sheet name): the one lot id it holds as a word
                // names the lot; said once for the name.
                lotId = word;
                if (namedByWord.Add(rawId) && reading.Source is { } at)
                {
                    run.Sink.Warning(at.File, at.Sheet, at.Row, null, rawId, IssueCodes.LotIdInName, IntakeMessages.LotIdInName(rawId, word));
                }
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
        logs = PlaceDatesWithoutYear(run, logs);
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

        // With no lot read at all (a logs file checked alone, or a lots table none of whose rows could be used), no log
        // can match: one warning per sheet says why and names the logs, instead of one per log saying the same thing.
        if (recorded.Count == 0 && logs.Count > 1)
        {
            foreach (var sheet in logs.GroupBy(l => (l.Readings[0].Source!.File, l.Readings[0].Source!.Sheet)))
            {
                var first = sheet.First().Readings[0].Source!;
                var names = sheet.Select(l => l.LotId).ToArray();
                run.Sink.Warning(first.File, first.Sheet, null, null, names[0], IssueCodes.LogWithoutLot,
                    names.Length == 1
                        ? IntakeMessages.LogWithoutLot(names[0], sheet.First().Season is { } s1 ? "season " + s1.ToString(System.Globalization.CultureInfo.InvariantCulture) : "no season")
                        : IntakeMessages.LogsWithoutAnyLot(names));
            }

            return logs;
        }

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
                // A board headed by tanks (T9) beside a lots table that names lots by id and records the tank as the
                // vessel: the message names the lot that was in that tank; the log is not joined by it (a tank holds
                // many lots over the years, and perhaps two in one season).
                string? inTank = zeroTwin is not null ? null
                    : run.Lots.Select(l => (l.LotId, l.Season, l.Vessel)).Concat(run.RunningLots.Select(l => (l.LotId, l.Season, l.Vessel)))
                        .Where(l => (log.Season is null || l.Season == log.Season) && l.Vessel is { } v && string.Equals(v.Trim(), log.LotId.Trim(), StringComparison.OrdinalIgnoreCase))
                        .Select(l => l.LotId).FirstOrDefault();
                run.Sink.Warning(first.File, first.Sheet, null, null, log.LotId, IssueCodes.LogWithoutLot,
                    IntakeMessages.LogWithoutLot(log.LotId, log.Season is { } s ? "season " + s.ToString(System.Globalization.CultureInfo.InvariantCulture) : "no season")
                    + (zeroTwin is null ? "" : IntakeMessages.LeadingZeroTwin(zeroTwin, log.LotId))
                    + (inTank is null ? "" : IntakeMessages.LotInTank(inTank, log.LotId)));
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
                foreach (var reading in log.Readings)
                {
                    // Left out: counted with the rows reported, not the readings used.
                    MoveToReported(run, reading.Source!);
                }

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

    /// <summary>Most days before its lot's inoculation a reading dated without a year is placed (a juice reading before inoculation); further back it is refused.</summary>
    public const int MaxDaysBeforeInoculation = 31;

    /// <summary>Most days a log's dates without a year may span when only the season places them (half a year: beyond it the order is no longer clear).</summary>
    public const int MaxSpanWithoutYear = 183;

    /// <summary>
    /// Places readings dated by day and month alone ("12-Sep", kept in <see cref="LogRows.YearUnknown"/>) in their
    /// lot's year: nearest the lot's inoculation date when it has one (refused when that falls more than
    /// <see cref="MaxDaysBeforeInoculation"/> days before it); else nearest the log's own dated readings; else in the
    /// lot's season, the ferment starting in the season's year and running on into the next when its dates cross the
    /// new year (the vintage is the year of picking: common practice). One warning per log says where they were
    /// placed; a reading that cannot be placed is an error and left out.
    /// </summary>
    private static List<FermentationLog> PlaceDatesWithoutYear(IntakeRun run, List<FermentationLog> logs)
    {
        if (!logs.Any(l => l.Readings.Any(r => LogRows.WithoutYear(r.Timestamp))))
        {
            return logs;
        }

        var lots = run.Lots.Select(l => (l.LotId, l.Season, l.InoculationDate))
            .Concat(run.RunningLots.Select(l => (l.LotId, l.Season, l.InoculationDate))).ToList();
        var kept = new List<FermentationLog>(logs.Count);
        var said = new List<(SourceRef First, string Log, int Count, List<int> Years, string Rule, string Basis, DateTime FirstPlaced, string FirstShown)>();
        foreach (var log in logs)
        {
            var undated = log.Readings.Where(r => LogRows.WithoutYear(r.Timestamp)).ToList();
            if (undated.Count == 0)
            {
                kept.Add(log);
                continue;
            }

            var matches = lots.Where(l => l.LotId == log.LotId && (log.Season is null || l.Season == log.Season)).ToList();
            var inoculations = matches.Select(l => l.InoculationDate).OfType<DateTime>().Distinct().ToList();
            var dated = log.Readings.Select(r => r.Timestamp).Where(t => !LogRows.WithoutYear(t) && !LogRows.CountedInDays(t)).Order().ToList();
            int[] seasons = log.Season is { } ls ? [ls] : matches.Select(l => l.Season).Distinct().Order().ToArray();
            var placed = new Dictionary<LogReading, DateTime>(ReferenceEqualityComparer.Instance);
            var noLeapDay = new HashSet<LogReading>(ReferenceEqualityComparer.Instance);
            string basis, rule = "", refusal = "";
            if (inoculations.Count == 1)
            {
                var inoc = inoculations[0];
                (basis, rule) = (IntakeMessages.NearInoculation(inoc), IntakeMessages.NearEachInoculation);
                foreach (var r in undated)
                {
                    if (Nearest(r.Timestamp, inoc) is not { } t)
                    {
                        noLeapDay.Add(r);
                    }
                    else if (t >= inoc.Date.AddDays(-MaxDaysBeforeInoculation))
                    {
                        placed[r] = t;
                    }
                }

                refusal = IntakeMessages.FarBeforeInoculation(inoc, MaxDaysBeforeInoculation);
            }
            else if (dated.Count > 0)
            {
                var middle = dated[dated.Count / 2];
                (basis, rule) = (IntakeMessages.NearDatedReadings(middle), IntakeMessages.NearEachLogsDatedReadings);
                foreach (var r in undated)
                {
                    if (Nearest(r.Timestamp, middle) is { } t)
                    {
                        placed[r] = t;
                    }
                    else
                    {
                        noLeapDay.Add(r);
                    }
                }
            }
            else if (seasons.Length == 1)
            {
                (basis, rule) = (IntakeMessages.InSeason(seasons[0]), IntakeMessages.InEachSeason);
                refusal = IntakeMessages.SpanTooLongWithoutYear(MaxSpanWithoutYear);
                foreach (var (r, t) in InSeason(undated, seasons[0]))
                {
                    if (t is { } when)
                    {
                        placed[r] = when;
                    }
                    else
                    {
                        noLeapDay.Add(r);
                    }
                }
            }
            else
            {
                basis = "";
                refusal = seasons.Length > 1
                    ? IntakeMessages.SeveralSeasonsWithoutYear(log.LotId, seasons)
                    : IntakeMessages.NothingToPlaceYear(log.LotId);
            }

            var readings = new List<LogReading>(log.Readings.Count);
            foreach (var r in log.Readings)
            {
                if (!LogRows.WithoutYear(r.Timestamp))
                {
                    readings.Add(r);
                }
                else if (placed.TryGetValue(r, out var t))
                {
                    readings.Add(r with { Timestamp = t });
                }
                else
                {
                    var src = r.Source!;
                    string shown = DayMonthShown(r.Timestamp);
                    string why = noLeapDay.Contains(r) ? IntakeMessages.NoLeapDayNearest : refusal;
                    run.Sink.Error(src.File, src.Sheet, src.Row, null, shown, IssueCodes.DateWithoutYear, IntakeMessages.DateWithoutYearRefused(log.Name, shown, why));
                    MoveToReported(run, src);
                }
            }

            if (placed.Count > 0)
            {
                var first = undated.First(placed.ContainsKey);
                said.Add((first.Source!, log.Name, placed.Count, placed.Values.Select(t => t.Year).Distinct().Order().ToList(), rule, basis, placed[first], DayMonthShown(first.Timestamp)));
            }

            if (readings.Count > 0)
            {
                kept.Add(log with { Readings = readings });
            }
        }

        // Said once per sheet and rule (a board of a hundred tanks gives one warning, not a hundred), at its first reading.
        foreach (var group in said.GroupBy(x => (x.First.File, x.First.Sheet, x.Rule)))
        {
            var first = group.First();
            var years = group.SelectMany(x => x.Years).Distinct().Order().ToList();
            string message = group.Count() == 1
                ? IntakeMessages.DatesWithoutYearPlaced(first.Log, first.Count, years, first.Basis, first.FirstPlaced)
                : IntakeMessages.DatesWithoutYearPlacedForLots(group.Select(x => x.Log).ToList(), group.Sum(x => x.Count), years, first.Rule, first.Log, first.FirstPlaced);
            run.Sink.Warning(first.First.File, first.First.Sheet, first.First.Row, null, first.FirstShown, IssueCodes.DateWithoutYear, message);
        }

        return kept;
    }

    /// <summary>"12 Sep 08:00": a reading's day and month (and time, when it has one) as the sheet gave them.</summary>
    private static string DayMonthShown(DateTime t) =>
        CellValues.DayMonthText(t.Month, t.Day) + (t.TimeOfDay == TimeSpan.Zero ? "" : t.ToString(" HH:mm", CultureInfo.InvariantCulture));

    /// <summary>The day and month of <paramref name="undated"/> in the year that puts it nearest <paramref name="anchor"/> (within half a year); null for 29 February in a year without one.</summary>
    private static DateTime? Nearest(DateTime undated, DateTime anchor)
    {
        DateTime? best = null;
        for (int y = anchor.Year - 1; y <= anchor.Year + 1; y++)
        {
            if (InYear(undated, y) is { } t && (best is null || Math.Abs((t - anchor).Ticks) < Math.Abs((best.Value - anchor).Ticks)))
            {
                best = t;
            }
        }

        // 29 February nearest in a year without one: not placed by a guess at the next nearest.
        return best is { } b && undated.Month == 2 && undated.Day == 29 && !DateTime.IsLeapYear(b.Year) ? null : best;
    }

    private static DateTime? InYear(DateTime undated, int year) =>
        undated.Month == 2 && undated.Day == 29 && !DateTime.IsLeapYear(year) ? null
            : new DateTime(year, undated.Month, undated.Day, 0, 0, 0, DateTimeKind.Unspecified) + undated.TimeOfDay;

    /// <summary>
    /// Readings dated without a year, placed from the season alone: the dates are laid on the calendar's circle, the
    /// longest gap between them is taken for the time with no ferment, and the ferment starts after it in the season's
    /// year (running into the next when it crosses the new year); 29 February in a year without one comes with no
    /// date. None is placed when they span more than
    /// <see cref="MaxSpanWithoutYear"/> days.
    /// </summary>
    private static IEnumerable<(LogReading Reading, DateTime? When)> InSeason(List<LogReading> undated, int season)
    {
        var sorted = undated.OrderBy(r => r.Timestamp).ToList();
        double Day(LogReading r) => (r.Timestamp - new DateTime(LogRows.YearUnknown, 1, 1)).TotalDays;
        const double YearDays = 366;
        int gapAfter = sorted.Count - 1;
        double largest = Day(sorted[0]) + YearDays - Day(sorted[^1]);
        for (int i = 0; i + 1 < sorted.Count; i++)
        {
            double gap = Day(sorted[i + 1]) - Day(sorted[i]);
            if (gap > largest)
            {
                (largest, gapAfter) = (gap, i);
            }
        }

        if (YearDays - largest > MaxSpanWithoutYear)
        {
            yield break;
        }

        for (int i = 0; i < sorted.Count; i++)
        {
            // Readings after the gap start the ferment in the season's year; those up to it follow in the next year.
            int year = i > gapAfter || gapAfter == sorted.Count - 1 ? season : season + 1;
            // Null for 29 February in a year without one.
            yield return (sorted[i], InYear(sorted[i].Timestamp, year));
        }
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
            var good = log.Readings.Where(r => Plausible(r.Timestamp)).ToList();
            if (good.Count == 0 && log.Readings.Count > 1)
            {
                // Every reading is out: one error for the log (a season given wrongly, e.g. by --season to a file of
                // several seasons' logs), not one per reading.
                ReportLogOutOfSeason(run, log, seasons, basis, recorded);
                continue;
            }

            foreach (var reading in log.Readings)
            {
                if (Plausible(reading.Timestamp))
                {
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

    private static void ReportLogOutOfSeason(IntakeRun run, FermentationLog log, int[] seasons, string basis, List<(string LotId, int Season, SourceRef? Source)> recorded)
    {
        var times = log.Readings.Select(r => r.Timestamp).Order().ToList();
        string span = times[0].ToString("yyyy-MM-dd", CultureInfo.InvariantCulture) + " to " + times[^1].ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);
        int? fitting = recorded.Where(l => l.LotId == log.LotId && !seasons.Contains(l.Season) && Math.Abs(l.Season - times[0].Year) <= 1)
            .Select(l => (int?)l.Season).FirstOrDefault();
        bool fromOption = run.Options.Season is { } option && seasons is [var only] && only == option && log.Season == option;
        var first = log.Readings.MinBy(r => r.Timestamp)!.Source!;
        run.Sink.Error(first.File, first.Sheet, first.Row, null, span, IssueCodes.ReadingDateImplausible,
            IntakeMessages.LogOutOfSeason(log.Name, log.Readings.Count, span, basis, fromOption ? run.Options.Season : null, fitting));
        foreach (var reading in log.Readings)
        {
            MoveToReported(run, reading.Source!);
        }
    }

    /// <summary>
    /// Counts a reading that was used as reported in its sheet's accounting. On a sheet with one column per lot a row
    /// holds several readings: the reading leaves the row's count, and the row moves to reported with its last one.
    /// </summary>
    private static void MoveToReported(IntakeRun run, SourceRef source)
    {
        int i = run.Accounts.FindIndex(a => a.File == source.File && a.Sheet == source.Sheet && a.Kind.StartsWith("log", StringComparison.Ordinal));
        if (i < 0)
        {
            return;
        }

        var a = run.Accounts[i];
        if (a.ReadingsInRows is { } inRows)
        {
            run.ReadingsLeftInRow ??= run.Readings.Where(x => x.Reading.Place is not null)
                .GroupBy(x => (x.Reading.Place!.File, x.Reading.Place.Sheet, x.Reading.Row)).ToDictionary(g => g.Key, g => g.Count());
            var key = (source.File, source.Sheet, source.Row);
            int left = run.ReadingsLeftInRow[key] = run.ReadingsLeftInRow.GetValueOrDefault(key, 1) - 1;
            run.Accounts[i] = left > 0
                ? a with { ReadingsInRows = inRows - 1 }
                : a with { ReadingsInRows = inRows - 1, LogReadingsUsed = a.LogReadingsUsed - 1, RowsReported = a.RowsReported + 1 };
            return;
        }

        run.Accounts[i] = a with { LogReadingsUsed = a.LogReadingsUsed - 1, RowsReported = a.RowsReported + 1 };
    }

    [System.Text.RegularExpressions.GeneratedRegex(@"^(lot|batch)\s*(#|no\.?|nr\.?|number)?\s*[:#\-]?\s*", System.Text.RegularExpressions.RegexOptions.IgnoreCase | System.Text.RegularExpressions.RegexOptions.CultureInvariant)]
    private static partial System.Text.RegularExpressions.Regex LotWordPrefix();

    /// <summary>
    /// The one lot id that <paramref name="name"/> holds as a word ("25-QR-01" in "Tank T1 - 25-QR-01"), when exactly
    /// one does; null otherwise. Only ids of at least three characters holding a digit count, so that "4" in "Tank 4" or
    /// a word such as "Syrah" never names a lot.
    /// </summary>
    internal static string? LotIdAsWord(string name, HashSet<string> knownIds)
    {
        string? found = null;
        foreach (var raw in name.Split([' ', '\t'], StringSplitOptions.RemoveEmptyEntries))
        {
            string word = raw.Trim(':', ',', ';', '(', ')', '[', ']', '.');
            if (word.Length >= 3 && word.Any(char.IsAsciiDigit) && knownIds.Contains(word))
            {
                if (found is not null && found != word)
                {
                    return null;
                }

                found = word;
            }
        }

        return found;
    }
}
