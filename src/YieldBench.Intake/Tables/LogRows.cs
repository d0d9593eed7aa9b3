using YieldBench.Core.Lots;
using YieldBench.Core.Units;
using static YieldBench.Intake.FieldParsers;

namespace YieldBench.Intake;

/// <summary>Reads the rows of a fermentation-log table into readings, each named by lot id and season.</summary>
internal static class LogRows
{
    public static void Read(SheetContext ctx, string fileStem)
    {
        var lotCol = ctx.Column("lot_id");
        bool noTime = ctx.Column("timestamp") is null && ctx.Column("date") is null;
        if (noTime)
        {
            ctx.Run.Sink.Error(ctx.File, ctx.SheetName, ctx.FirstData, null, null, IssueCodes.MissingColumn, IntakeMessages.MissingTimeColumn());
        }

        // A sheet without a lot column may hold several lots' readings in blocks, each under a heading naming its lot.
        var blocks = lotCol is null ? LogBlocks.Find(ctx) : null;
        ctx.StructureRows = blocks?.Structure;

        // A "Day" column of day numbers (0, 1, 2…) counts days from inoculation: each reading is kept at that many days
        // after DayZero, and the join places it from its lot's inoculation date (LogJoin). Said once for the column.
        double lastDay = double.NaN;
        bool dayNumbers = !noTime && ctx.Column("timestamp") is null && ctx.Column("date") is { } dateCol && DayNumbers(ctx, dateCol, out lastDay);
        if (dayNumbers)
        {
            var c = ctx.Column("date")!;
            ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData + 1, c.Header, CellValues.Text(ctx.Sheet.Cell(ctx.FirstData, c.Index)), IssueCodes.DaysFromInoculation, IntakeMessages.DaysFromInoculation(c.Header, lastDay));
        }

        // A sheet without a lot column is the log of the lot it is named after (a CSV: its file name).
        string? sheetLot = lotCol is null ? (ctx.SheetName ?? fileStem).Trim() : null;
        if (blocks is not null)
        {
            ReportBlocks(ctx, blocks, sheetLot!);
        }

        var rowState = new RowState(ctx);
        RowAccounting.Read(ctx, new RowAccounting.Plan("log", Readings: true, NotesAreRows: false, Usable: !noTime),
            r => Add(ctx, rowState, r, blocks?.LotAt(r) ?? sheetLot, dayNumbers));
    }

    /// <summary>Says once for the sheet how its blocks were read: the lot each heading names, and the header rows passed over.</summary>
    private static void ReportBlocks(SheetContext ctx, LogBlocks blocks, string sheetLot)
    {
        var named = new List<(int Row, string Lot, bool AboveHeader)>();
        if (blocks.AboveHeader is { } above)
        {
            named.Add((above.Row + 1, above.Lot, true));
        }

        named.AddRange(blocks.Headings.Select(h => (h.Row + 1, h.Lot, false)));
        int firstRow = named.Count > 0 ? named[0].Row : blocks.HeaderRepeats[0] + 1;
        string? firstText = named.Count > 0 ? named[0].Lot : null;
        bool sheetLotUsed = blocks.AboveHeader is null && (blocks.Headings.Count == 0 || blocks.Headings[0].Row > ctx.FirstData);
        ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, firstRow, null, firstText, IssueCodes.LogBlocks,
            IntakeMessages.LogBlocks(named, blocks.HeaderRepeats.Select(r => r + 1).ToList(), sheetLotUsed ? sheetLot : null));
    }

    /// <summary>
    /// The origin of a log counted in days: a reading of day d (and time of day t) is kept at DayZero + d + t until the
    /// join places it at its lot's inoculation date + d + t. No real reading falls in year 1.
    /// </summary>
    public static readonly DateTime DayZero = DateTime.MinValue;

    /// <summary>
    /// The year a reading dated by day and month alone ("12-Sep") is kept in until the join places it in its lot's
    /// year. Year 4 is a leap year (29 February is kept), and no real reading falls in it.
    /// </summary>
    public const int YearUnknown = 4;

    /// <summary>True when a reading's date had no year and is not yet placed.</summary>
    public static bool WithoutYear(DateTime t) => t.Year == YearUnknown;

    /// <summary>True when a reading's time is still counted from <see cref="DayZero"/> (not yet placed).</summary>
    public static bool CountedInDays(DateTime t) => t.Year == DayZero.Year;

    /// <summary>The time of row <paramref name="r"/> of a log counted in days: DayZero + its day + its time of day.</summary>
    private static DateTime? DayCount(SheetContext ctx, RowState st, int r)
    {
        var dayCol = ctx.Column("date")!;
        object? cell = ctx.Sheet.Cell(r, dayCol.Index);
        if (CellValues.Number(cell, ctx.Sheet.DecimalComma, out double day, out _) != CellProblem.None)
        {
            st.Problem(dayCol, cell, IssueCodes.MissingTimestamp, IntakeMessages.MissingTimestamp(), true);
            return null;
        }

        var tod = TimeOfDay(ctx, st, r);
        return st.Bad ? null : DayZero.AddDays(day) + (tod ?? TimeSpan.Zero);
    }

    /// <summary>
    /// True when every filled cell of the date column is a whole number from 0 to 400 (a day count, not a date: a date
    /// cell is read as a date, and an unformatted date serial is above 400), with at least two of them.
    /// </summary>
    private static bool DayNumbers(SheetContext ctx, BoundColumn c, out double last)
    {
        last = double.NaN;
        int count = 0;
        for (int r = ctx.FirstData; r <= ctx.LastRow; r++)
        {
            var cell = ctx.Sheet.Cell(r, c.Index);
            if (CellValues.IsBlank(cell) || ctx.StructureRows?.Contains(r) == true)
            {
                continue;
            }

            if (CellValues.Number(cell, ctx.Sheet.DecimalComma, out double d, out _) != CellProblem.None || d < 0 || d > 400 || d != Math.Floor(d))
            {
                return false;
            }

            last = double.IsNaN(last) ? d : Math.Max(last, d);
            count++;
        }

        return count >= 2;
    }

    /// <summary>Reads row <paramref name="r"/> as a reading and keeps it; false when it was reported instead.</summary>
    private static bool Add(SheetContext ctx, RowState rowState, int r, string? sheetLot, bool dayNumbers)
    {
        var run = ctx.Run;
        var sink = run.Sink;
        var lotCol = ctx.Column("lot_id");
        var sugarCol = ctx.Column("sugar");
        var tempCol = ctx.Column("temp_c");
        var seasonCol = ctx.Column("season");
        var st = rowState.Start(r);
        // A note typed in a reading's cell ("pumped over", "stuck?", "dry"): no reading, and no error of its own.
        var (sugarNote, tempNote) = (NoteIn(ctx, r, sugarCol), NoteIn(ctx, r, tempCol));
        if (NoReadingIn(ctx, r, sugarCol, sugarNote) && NoReadingIn(ctx, r, tempCol, tempNote))
        {
            // A row of words and no reading ("pumped over" alone, "DAP 20 g/hL" where the date goes, or a note in a
            // reading's cell): the cellar's note, said as one; not a reading without a date or without a value.
            if ((sugarNote ?? tempNote) is { } readingNote)
            {
                var noteCol = sugarNote is not null ? sugarCol! : tempCol!;
                sink.Warning(ctx.File, ctx.SheetName, r + 1, noteCol.Header, readingNote, IssueCodes.NoteRowSkipped, IntakeMessages.NoteInReading(noteCol.Field.Name, true));
                return false;
            }

            if (RowNote(ctx, r, dayNumbers) is var (column, text))
            {
                sink.Warning(ctx.File, ctx.SheetName, r + 1, column.Header, text, IssueCodes.NoteRowSkipped, IntakeMessages.LogNoteRow());
                return false;
            }
        }

        string? lotId = sheetLot ?? TextField(st, lotCol);
        if (lotId is null && lotCol is not null && !st.Bad)
        {
            st.Problem(lotCol, null, IssueCodes.MissingValue, IntakeMessages.MissingValue("lot_id"), true);
        }

        int? season = SeasonField(st, seasonCol);
        var when = dayNumbers ? DayCount(ctx, st, r) : When(ctx, st, r);
        SugarReading? sugar = sugarCol is null || sugarNote is not null ? null : SugarField(st, sugarCol);
        double? temp = tempCol is null || tempNote is not null ? null : NumberField(st, tempCol);
        if ((sugarNote ?? tempNote) is { } note && !st.Bad)
        {
            var noteCol = sugarNote is not null ? sugarCol! : tempCol!;
            bool none = sugar is null && temp is null;
            sink.Warning(ctx.File, ctx.SheetName, r + 1, noteCol.Header, note, none ? IssueCodes.NoteRowSkipped : IssueCodes.NotANumber, IntakeMessages.NoteInReading(noteCol.Field.Name, none));
            if (none)
            {
                return false;
            }
        }

        if (!st.Bad && sugar is null && temp is null)
        {
            st.Bad = true;
            sink.Error(ctx.File, ctx.SheetName, r + 1, (sugarCol ?? tempCol)?.Header, null, IssueCodes.NoReading, IntakeMessages.NoReading());
        }

        if (st.Bad || lotId is null || when is null)
        {
            return false;
        }

        run.Readings.Add((lotId, season, new LogReading(when.Value, sugar, temp, ctx.Place, r + 1)));
        return true;
    }

    /// <summary>True when row <paramref name="r"/> has no value in reading column <paramref name="c"/>: none, blank, or a note.</summary>
    private static bool NoReadingIn(SheetContext ctx, int r, BoundColumn? c, string? note) =>
        c is null || note is not null || CellValues.IsBlank(ctx.Sheet.Cell(r, c.Index));

    /// <summary>
    /// The note of a row with no reading: words (two or more, with letters) in its lot, date or timestamp cell, where
    /// the date cell holds no date. Null when the row is dated (a reading left empty is reported as such) or holds no words.
    /// </summary>
    private static (BoundColumn Column, string Text)? RowNote(SheetContext ctx, int r, bool dayNumbers)
    {
        var dateCol = ctx.Column("timestamp") ?? ctx.Column("date");
        if (dateCol is not null && !CellValues.IsBlank(ctx.Sheet.Cell(r, dateCol.Index)) && (dayNumbers || IsDate(ctx, r, dateCol)))
        {
            return null;
        }

        foreach (var c in new[] { dateCol, ctx.Column("lot_id") })
        {
            if (c is not null && ctx.Sheet.Cell(r, c.Index) is string s && s.Trim().Split(' ', StringSplitOptions.RemoveEmptyEntries).Length >= 2 && s.Count(char.IsLetter) >= 2)
            {
                return (c, s.Trim());
            }
        }

        return null;
    }

    /// <summary>True when the date cell of row <paramref name="r"/> reads as a date, with or without its year.</summary>
    private static bool IsDate(SheetContext ctx, int r, BoundColumn c)
    {
        object? cell = ctx.Sheet.Cell(r, c.Index);
        if (cell is string text && CellValues.WithoutZone(text) is { } local)
        {
            cell = local;
        }

        if (CellValues.Date(cell, c.DateOrder, out _, out _, out _) is CellProblem.None or CellProblem.AmbiguousDate)
        {
            return true;
        }

        return cell is string t && CellValues.DayMonth(t.Trim(), c.DateOrder, out _, out _, out _, out _, out _) is CellProblem.None or CellProblem.AmbiguousDate;
    }

    /// <summary>
    /// The text of row <paramref name="r"/>'s cell in a reading column when it is a note, not a value: words (at least
    /// two letters) and no digit ("pumped over", "stuck?", "dry"); a mark for "not measured" ("n/a", "-") is no note.
    /// </summary>
    private static string? NoteIn(SheetContext ctx, int r, BoundColumn? c)
    {
        if (c is null || ctx.Sheet.Cell(r, c.Index) is not string s || s.Any(char.IsDigit) || s.Count(char.IsLetter) < 2)
        {
            return null;
        }

        string t = s.Trim();
        return CellValues.IsNoValueMark(t) ? null : TextSettling.Settle(t, multiline: false, out _);
    }

    /// <summary>
    /// The time of row <paramref name="r"/>: its timestamp, or its date with its time of day; null when it has none
    /// (reported as an error that leaves the row out).
    /// </summary>
    internal static DateTime? When(SheetContext ctx, RowState st, int r)
    {
        var tsCol = ctx.Column("timestamp");
        var dateCol = ctx.Column("date");
        DateTime? when = null;
        if (tsCol is not null)
        {
            when = DateField(st, tsCol, withoutYear: true);
        }
        else if (dateCol is not null)
        {
            when = DateField(st, dateCol, withoutYear: true);
            if (when is not null && TimeOfDay(ctx, st, r) is { } tod)
            {
                when = when.Value.Date + tod;
            }
            else if (st.Bad)
            {
                // A time that is no time (reported): the row has no time to stand at, not midnight.
                when = null;
            }
            else if (when is { TimeOfDay.Ticks: 0 } day && ctx.Column("time") is { } timeCol && UsualTime(ctx, timeCol) is { } usual)
            {
                // A date with its time left empty, in a log that writes the hour of its other readings: the reading
                // stands at the cellar's usual reading hour (the column's most common time), not at midnight; said
                // once for the column.
                when = day + usual;
                timeCol.NoTimeAt = (timeCol.NoTimeAt?.Row ?? r + 1, (timeCol.NoTimeAt?.Count ?? 0) + 1);
            }
        }

        if (when is null && !st.Bad && (tsCol ?? dateCol) is { } c)
        {
            st.Problem(c, ctx.Sheet.Cell(r, c.Index), IssueCodes.MissingTimestamp, IntakeMessages.MissingTimestamp(), true);
        }

        return when;
    }

    /// <summary>The time of day of row <paramref name="r"/>'s Time column; null when there is none or it is blank, or when it is no time (reported, leaving the row out).</summary>
    private static TimeSpan? TimeOfDay(SheetContext ctx, RowState st, int r)
    {
        if (ctx.Column("time") is not { } timeCol)
        {
            return null;
        }

        object? tcell = ctx.Sheet.Cell(r, timeCol.Index);
        var tp = CellValues.TimeOfDay(tcell, out var tod);
        if (tp == CellProblem.None)
        {
            return tod;
        }

        if (tp == CellProblem.NotATime && CellValues.HalfDay(tcell) is { } check)
        {
            // A twice-daily check noted as "AM" or "PM": read at the check's assumed hour, said once for the column.
            timeCol.HalfDayAt ??= (r + 1, CellValues.Text(tcell));
            timeCol.HalfDays++;
            return check;
        }

        if (tp != CellProblem.Blank && !Unreadable(st, timeCol, tcell))
        {
            st.Problem(timeCol, tcell, IssueCodes.NotATime, IntakeMessages.NotATime("time"), true);
        }

        return null;
    }

    /// <summary>Says once for the table's time column that times written only "AM" or "PM" were read at assumed hours, and that empty times were read at the usual hour.</summary>
    internal static void ReportHalfDays(SheetContext ctx)
    {
        if (ctx.Column("time") is { HalfDayAt: { } first } timeCol)
        {
            ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, first.Row, timeCol.Header, first.Text, IssueCodes.HalfDayTime, IntakeMessages.HalfDayTime(timeCol.HalfDays, CellValues.MorningCheck, CellValues.EveningCheck));
        }

        if (ctx.Column("time") is { NoTimeAt: { } empty, UsualTime: { } usual } column)
        {
            ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, empty.Row, column.Header, null, IssueCodes.TimeMissing, IntakeMessages.TimeMissing(empty.Count, empty.Row, usual));
        }
    }

    /// <summary>
    /// The time column's most common time of day among its cells that hold one (the earliest on a tie), worked out
    /// once; null when none does. Times noted only as AM or PM do not count.
    /// </summary>
    private static TimeSpan? UsualTime(SheetContext ctx, BoundColumn timeCol)
    {
        if (!timeCol.UsualTimeKnown)
        {
            var counts = new Dictionary<TimeSpan, int>();
            foreach (var cell in ctx.Values(timeCol))
            {
                if (CellValues.TimeOfDay(cell, out var tod) == CellProblem.None)
                {
                    counts[tod] = counts.GetValueOrDefault(tod) + 1;
                }
            }

            timeCol.UsualTime = counts.Count == 0 ? null : counts.OrderByDescending(kv => kv.Value).ThenBy(kv => kv.Key).First().Key;
            timeCol.UsualTimeKnown = true;
        }

        return timeCol.UsualTime;
    }
}
