using YieldBench.Core.Lots;
using static YieldBench.Intake.FieldParsers;

namespace YieldBench.Intake;

/// <summary>
/// A fermentation log kept with one column per lot (a "brix board": a date, perhaps a time, then a column for each
/// tank): the header names a date or timestamp and at least two columns that name no field but hold numbers below.
/// Each such column's header is read as a lot id, with an optional scale or temperature word after or before it ("C04",
/// "C04 °Bx", "T6 (SG)", "T6 temp °F", "Brix T6", "Temp T6"); a lot's sugar and temperature columns make one reading per row. Tried only on a sheet in
/// which no ordinary header was found, so it never changes how a table of another layout is read.
/// </summary>
internal static class WideLogRows
{
    /// <summary>Share of a lot column's filled cells below the header that must be numbers (at least half: a word such as "racked" in a few cells is reported where it stands).</summary>
    private const double NumericShare = 0.5;

    private static readonly HashSet<string> ScaleWords = ["bx", "brix", "sg", "oe", "oechsle", "kmw", "babo", "be", "baume", "bau", "density", "gravity", "sugar", "densite", "densidad", "densita", "dichte", "mostgewicht"];

    private static readonly HashSet<string> TemperatureWords = ["temp", "temperature", "degc", "degf", "celsius", "fahrenheit"];

    /// <summary>One lot's columns on the sheet.</summary>
    private sealed record LotColumns(string LotId, BoundColumn? Sugar, BoundColumn? Temperature);

    /// <summary>Reads the sheet as a log with one column per lot when it is one; false (nothing reported) when it is not.</summary>
    public static bool TryRead(IntakeRun run, string file, string fullPath, RawSheet sheet, int lastRow)
    {
        if (!Find(sheet, lastRow, out int headerRow, out var timeColumns, out var lots, out var notUsed))
        {
            return false;
        }

        var sink = run.Sink;
        string? sheetName = sheet.Name;
        MergedCells.Warn(sheet, file, sink, headerRow + 1);
        foreach (var (_, header) in notUsed)
        {
            // A lot's cap temperature beside its must temperature (read instead: the heat figures are of the must).
            if (HeaderDetection.IsCapHeader(header) && lots.FirstOrDefault(l => l.LotId == Parse(header).LotId)?.Temperature is { } must && !HeaderDetection.IsCapHeader(must.Header))
            {
                sink.Warning(file, sheetName, headerRow + 1, header, null, IssueCodes.DuplicateColumn, IntakeMessages.CapTemperatureNotRead(must.Header, oneColumnPerLot: true));
                continue;
            }

            sink.Warning(file, sheetName, headerRow + 1, header, null, IssueCodes.ColumnNotUsed, IntakeMessages.ColumnNotUsed());
        }

        var lotBound = lots.SelectMany(l => new[] { l.Sugar, l.Temperature }).OfType<BoundColumn>().ToList();
        var columns = timeColumns.Concat(lotBound).ToList();
        string fileStem = Path.GetFileNameWithoutExtension(fullPath);
        int headerWidth = Array.FindLastIndex(sheet.Rows[headerRow], c => !CellValues.IsBlank(c)) + 1;
        var ctx = new SheetContext(run, file, sheet, TableKind.Log, columns, headerRow + 1, lastRow, SeasonNames.FromName(sheetName) ?? SeasonNames.FromName(fileStem) ?? run.Options.Season, headerWidth);
        foreach (var c in timeColumns)
        {
            c.DateOrder = CellValues.ColumnDateOrder(ctx.Values(c), out var bySpan);
            UnitSettling.WarnDateOrder(ctx, c, bySpan);
        }

        SettleUnits(ctx, lots.Select(l => l.Sugar).OfType<BoundColumn>().Where(c => !c.UnitStated).ToList(), sugar: true);
        SettleUnits(ctx, lots.Select(l => l.Temperature).OfType<BoundColumn>().Where(c => !c.UnitStated).ToList(), sugar: false);
        foreach (var c in columns)
        {
            string unit = ColumnUnits.Label(c.Unit) is { Length: > 0 } u ? u : c.Field.Unit;
            string field = lots.FirstOrDefault(l => l.Sugar == c || l.Temperature == c) is { } lot ? $"{c.Field.Name} of lot {lot.LotId}" : c.Field.Name;
            run.Mappings.Add(new HeaderMapping(file, sheetName, field, c.Header, unit.Length > 0 ? unit : null));
        }

        sink.Warning(file, sheetName, headerRow + 1, null, null, IssueCodes.OneColumnPerLot, IntakeMessages.OneColumnPerLot(lots.Count, lots.Select(l => l.LotId)));

        var rowState = new RowState(ctx);
        int readings = 0;
        RowAccounting.Read(ctx, new RowAccounting.Plan("log, one column per lot", Readings: true, NotesAreRows: false, Usable: true), r =>
        {
            int added = Add(ctx, rowState, r, lots);
            readings += added;
            return added > 0;
        });

        SheetReader.GravityBothWays(sink, file, sheetName, lotBound);
        LogRows.ReportHalfDays(ctx);

        // The account counts rows; say how many readings its used rows held.
        int last = run.Accounts.Count - 1;
        run.Accounts[last] = run.Accounts[last] with { ReadingsInRows = readings };
        return true;
    }

    /// <summary>Reads row <paramref name="r"/>: its time, then each lot's reading; the number of readings kept.</summary>
    private static int Add(SheetContext ctx, RowState st, int r, IReadOnlyList<LotColumns> lots)
    {
        st.Start(r);
        var when = LogRows.When(ctx, st, r);
        if (when is null)
        {
            return 0;
        }

        int? season = SeasonField(st, ctx.Column("season"));
        int kept = 0;
        bool problem = false;
        foreach (var lot in lots)
        {
            st.Start(r);
            var sugar = lot.Sugar is null ? null : SugarField(st, lot.Sugar);
            double? temp = lot.Temperature is null ? null : NumberField(st, lot.Temperature);
            if (st.Bad)
            {
                // Reported where it was found, naming the lot's column; the row's other lots are still read.
                problem = true;
                continue;
            }

            if (sugar is null && temp is null)
            {
                // The lot was not read at this time: an empty cell on a brix board is no problem.
                continue;
            }

            ctx.Run.Readings.Add((lot.LotId, season, new LogReading(when.Value, sugar, temp, ctx.Place, r + 1)));
            kept++;
        }

        if (kept == 0 && !problem)
        {
            ctx.Run.Sink.Error(ctx.File, ctx.SheetName, r + 1, null, null, IssueCodes.NoReading, IntakeMessages.NoReading());
        }

        return kept;
    }

    /// <summary>
    /// The header row of a log with one column per lot: among the first rows, one naming a date or timestamp (and
    /// perhaps a time and a season) whose other cells name no log field, at least two of which head columns of numbers.
    /// </summary>
    private static bool Find(RawSheet sheet, int lastRow, out int headerRow, out List<BoundColumn> timeColumns, out List<LotColumns> lots, out List<(int Col, string Header)> notUsed)
    {
        int searchTo = Math.Min(lastRow, HeaderDetection.SearchRows - 1);
        for (int r = 0; r <= searchTo; r++)
        {
            var row = sheet.Rows[r];
            var time = new List<BoundColumn>();
            var others = new List<(int Col, string Header)>();
            bool otherLogField = false;
            for (int c = 0; c < row.Length; c++)
            {
                if (row[c] is not string s || s.Trim().Length == 0)
                {
                    continue;
                }

                string text = TextSettling.Settle(s, multiline: false, out _);
                if (ColumnRules.Find(text, TableKind.Log) is { } f)
                {
                    if (f.Name is "timestamp" or "date" or "time" or "season")
                    {
                        if (time.All(b => b.Field.Name != f.Name))
                        {
                            time.Add(new BoundColumn(c, f, text, ColumnUnit.None, false));
                        }
                    }
                    else
                    {
                        otherLogField = true;
                    }

                    continue;
                }

                others.Add((c, text));
            }

            if (otherLogField || !time.Any(b => b.Field.Name is "timestamp" or "date") || others.Count < 2)
            {
                continue;
            }

            var numeric = others.Where(o => MostlyNumbers(sheet, r + 1, lastRow, o.Col)).ToList();
            if (numeric.Count < 2)
            {
                continue;
            }

            headerRow = r;
            timeColumns = time;
            notUsed = others.Except(numeric).ToList();
            var found = numeric.Select(o => (Column: o, Parsed: Parse(o.Header)))
                .GroupBy(x => x.Parsed.LotId, StringComparer.Ordinal)
                .Select(g => new LotColumns(
                    g.Key,
                    g.Where(x => !x.Parsed.Temperature).Select(x => Bind(x.Column, "sugar", x.Column.Header, FieldKind.Sugar)).FirstOrDefault(),
                    g.Where(x => x.Parsed.Temperature).OrderBy(x => HeaderDetection.IsCapHeader(x.Column.Header) ? 1 : 0)
                        .Select(x => Bind(x.Column, "temp_c", x.Column.Header, FieldKind.Temperature)).FirstOrDefault()))
                .ToList();
            notUsed.AddRange(numeric.Where(o => !found.Any(l => l.Sugar?.Index == o.Col || l.Temperature?.Index == o.Col)));
            lots = found;
            return true;
        }

        headerRow = -1;
        timeColumns = [];
        lots = [];
        notUsed = [];
        return false;
    }

    private static BoundColumn Bind((int Col, string Header) column, string field, string header, FieldKind kind)
    {
        var unit = HeaderText.UnitFromHeader(header, kind);
        return new BoundColumn(column.Col, Fields.LogField(field), header, unit, unit != ColumnUnit.None);
    }

    /// <summary>A lot column's header split into the lot id and whether it holds temperatures ("T6 temp °F" → T6, yes).</summary>
    internal static (string LotId, bool Temperature) Parse(string header)
    {
        var words = HeaderText.WithoutBrackets(header).Split(' ', StringSplitOptions.RemoveEmptyEntries).ToList();
        string n = " " + HeaderText.Normalise(header) + " ";
        bool temperature = n.Contains(" temp ", StringComparison.Ordinal) || n.Contains(" temperature ", StringComparison.Ordinal)
            || header.Contains("°C", StringComparison.OrdinalIgnoreCase) || header.Contains("°F", StringComparison.OrdinalIgnoreCase);
        while (words.Count > 1 && IsUnitWord(words[^1]))
        {
            words.RemoveAt(words.Count - 1);
        }

        // The word may also come first ("Brix T4", "Temp T4", "°F T4", "Must temp T4"), as a board headed by
        // measurement is typed.
        while (words.Count > 1 && (IsUnitWord(words[0]) || (Qualifiers.Contains(HeaderText.Normalise(words[0])) && words.Count > 2 && TemperatureWords.Contains(HeaderText.Normalise(words[1])))))
        {
            words.RemoveAt(0);
        }

        return (string.Join(' ', words), temperature);
    }

    /// <summary>Words naming where a temperature is taken, before the temperature word ("Must temp T4", "Cap temp T4").</summary>
    private static readonly HashSet<string> Qualifiers = ["must", "cap", "juice", "wine", "tank"];

    /// <summary>A scale or temperature word after a lot id ("°Bx", "SG", "temp", "°F"); a bare "C" or "F" is not one (it could be the lot's name).</summary>
    private static bool IsUnitWord(string word)
    {
        string n = HeaderText.Normalise(word);
        return word.StartsWith('°') || ScaleWords.Contains(n) || TemperatureWords.Contains(n);
    }

    private static bool MostlyNumbers(RawSheet sheet, int from, int lastRow, int col)
    {
        int filled = 0, numbers = 0;
        for (int r = from; r <= lastRow; r++)
        {
            object? cell = sheet.Cell(r, col);
            if (CellValues.IsBlank(cell))
            {
                continue;
            }

            filled++;
            numbers += CellValues.Number(cell, sheet.DecimalComma, out _, out _) == CellProblem.None ? 1 : 0;
        }

        return numbers > 0 && numbers >= NumericShare * filled;
    }

    /// <summary>
    /// The unit of lot columns whose header states none, settled from all their values together (one scale for the
    /// board, said in one warning) rather than column by column.
    /// </summary>
    private static void SettleUnits(SheetContext ctx, List<BoundColumn> columns, bool sugar)
    {
        if (columns.Count == 0)
        {
            return;
        }

        var values = new List<double>();
        foreach (var c in columns)
        {
            foreach (var cell in ctx.Values(c))
            {
                if (CellValues.Number(cell, ctx.Sheet.DecimalComma, out double d, out _) == CellProblem.None)
                {
                    values.Add(d);
                }
            }
        }

        values.Sort();
        if (values.Count == 0)
        {
            columns.ForEach(c => c.Unit = sugar ? ColumnUnit.Brix : ColumnUnit.Celsius);
            return;
        }

        double low = values[0], high = values[^1], median = values[values.Count / 2];
        var unit = sugar ? UnitSettling.ReadingSugarUnit([.. values]) : UnitSettling.TemperatureUnitOf(median);
        columns.ForEach(c => c.Unit = unit);
        string example = $"{columns[0].Header} ({ColumnUnits.Label(unit)})";
        ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, columns[0].Header, null, IssueCodes.UnitFromValues,
            IntakeMessages.UnitFromValues(ColumnUnits.Label(unit), low, high, example) + IntakeMessages.ForEveryLotColumn(columns.Count));
    }
}
