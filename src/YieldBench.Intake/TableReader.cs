using System.Globalization;
using System.Text.RegularExpressions;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Intake;

/// <summary>A column bound to a field, with the unit its values are read in.</summary>
internal sealed class BoundColumn(int index, FieldDef field, string header, ColumnUnit unit, bool unitStated)
{
    public int Index { get; } = index;

    public FieldDef Field { get; set; } = field;

    public string Header { get; } = header;

    public ColumnUnit Unit { get; set; } = unit;

    public bool UnitStated { get; } = unitStated;

    public DateOrder DateOrder { get; set; }
}

/// <summary>State shared by every sheet of one run: options, rules, issues, and lots already read.</summary>
internal sealed class IntakeRun(IntakeOptions options, List<MappingRule> rules, IssueSink sink)
{
    public IntakeOptions Options { get; } = options;

    public List<MappingRule> Rules { get; } = rules;

    public IssueSink Sink { get; } = sink;

    public List<Lot> Lots { get; } = [];

    public List<RunningLot> RunningLots { get; } = [];

    public Dictionary<LotKey, SourceRef> LotKeys { get; } = [];

    public ChunkedList<(string LotId, int? Season, LogReading Reading)> Readings { get; } = new();

    public List<SourceAccount> Accounts { get; } = [];

    public List<HeaderMapping> Mappings { get; } = [];

    /// <summary>A column's numbers while its unit is settled; reused from column to column (tables are read on one thread).</summary>
    public List<double> ColumnValues { get; } = [];

    /// <summary>Room to select a column's middle value in without reordering <see cref="ColumnValues"/>.</summary>
    public double[] SelectionSpace { get; set; } = [];
}

/// <summary>Finds the table in a sheet, maps its headers, and turns its rows into lots or log readings.</summary>
internal static partial class TableReader
{
    /// <summary>Rows searched from the top of a sheet for the header row.</summary>
    public const int HeaderSearchRows = 50;

    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    private static readonly HashSet<string> SummaryWords =
    [
        "average", "averages", "avg", "mean", "total", "totals", "sum", "count", "min", "minimum", "max", "maximum",
        "median", "std", "stdev", "std dev", "standard deviation", "overall", "grand total", "subtotal", "sub total", "range",
    ];

    private static readonly HashSet<string> SummaryFollowers = new(["of", "for", "all", "season", "lots", "vintage", "pct"], StringComparer.Ordinal);

    private static readonly HashSet<string>.AlternateLookup<ReadOnlySpan<char>> SummaryFollowerLookup = SummaryFollowers.GetAlternateLookup<ReadOnlySpan<char>>();

    /// <summary>What reading a sheet came to.</summary>
    public enum Outcome
    {
        Read,
        NoTable,
        Empty,
    }

    public static Outcome ReadSheet(IntakeRun run, string file, string fullPath, RawSheet sheet)
    {
        string? sheetName = sheet.Name;
        var sink = run.Sink;
        int lastRow = sheet.Rows.FindLastIndex(r => r.Any(c => !CellValues.IsBlank(c)));
        if (lastRow < 0)
        {
            return Outcome.Empty;
        }

        if (sheet.TooManyRows)
        {
            sink.Error(file, sheetName, null, null, null, "too-many-rows", IntakeMessages.TooManyRows(run.Options.MaxRows));
            run.Accounts.Add(new SourceAccount(file, sheetName, "refused", 0, 0, 0, 0, 0, 0));
            return Outcome.Read;
        }

        if (!FindHeader(run, sheet, lastRow, out int headerRow, out var kind, out var columns, out var unmatched, out var duplicates))
        {
            return Outcome.NoTable;
        }

        foreach (var (col, header) in unmatched)
        {
            sink.Warning(file, sheetName, headerRow + 1, header, null, "column-not-used", IntakeMessages.ColumnNotUsed());
        }

        foreach (var (col, header, first) in duplicates)
        {
            sink.Warning(file, sheetName, headerRow + 1, header, null, "duplicate-column", IntakeMessages.DuplicateColumn(first.Field.Name, first.Header));
        }

        int firstData = headerRow + 1;
        if (firstData <= lastRow && IsUnitsRow(sheet.Rows[firstData]))
        {
            // A units row under the header ("°Bx", "%", "g/L"): its units count as the headers' own, and it is no lot.
            var unitsRow = sheet.Rows[firstData];
            for (int i = 0; i < columns.Count; i++)
            {
                var c = columns[i];
                string unitText = c.Index < unitsRow.Length ? CellValues.Text(unitsRow[c.Index]) : "";
                if (c.UnitStated || unitText.Length == 0)
                {
                    continue;
                }

                var unit = HeaderText.UnitFromHeader($"{c.Header} ({unitText})", c.Field.Kind);
                if (unit != ColumnUnit.None)
                {
                    columns[i] = new BoundColumn(c.Index, c.Field, c.Header, unit, true) { DateOrder = c.DateOrder };
                }
            }

            sink.Warning(file, sheetName, firstData + 1, null, null, "units-row-read", IntakeMessages.UnitsRowRead());
            firstData++;
        }

        var ctx = new SheetContext(run, file, sheet, kind, columns, firstData, lastRow, SeasonFromName(sheetName) ?? SeasonFromName(Path.GetFileNameWithoutExtension(fullPath)) ?? run.Options.Season);
        SettleUnits(ctx);
        foreach (var c in columns)
        {
            string unit = ColumnUnits.Label(c.Unit) is { Length: > 0 } u ? u : c.Field.Unit;
            run.Mappings.Add(new HeaderMapping(file, sheetName, c.Field.Name, c.Header, unit.Length > 0 ? unit : null));
        }

        return kind == TableKind.Lots ? ReadLots(ctx) : ReadLog(ctx, Path.GetFileNameWithoutExtension(fullPath));
    }

    private sealed record SheetContext(
        IntakeRun Run,
        string File,
        RawSheet Sheet,
        TableKind Kind,
        List<BoundColumn> Columns,
        int FirstData,
        int LastRow,
        int? DefaultSeason)
    {
        private readonly Dictionary<string, BoundColumn> _byField = IndexByField(Columns);

        public string? SheetName => Sheet.Name;

        /// <summary>The lot id column, or null.</summary>
        public BoundColumn? LotColumn { get; } = Columns.FirstOrDefault(c => c.Field.Name == "lot_id");

        /// <summary>The column bound to the field (the first one, when a header repeats), or null.</summary>
        public BoundColumn? Column(string field) => _byField.GetValueOrDefault(field);

        private static Dictionary<string, BoundColumn> IndexByField(List<BoundColumn> columns)
        {
            var index = new Dictionary<string, BoundColumn>(StringComparer.Ordinal);
            foreach (var c in columns)
            {
                index.TryAdd(c.Field.Name, c);
            }

            return index;
        }

        public IEnumerable<object?> Values(BoundColumn c)
        {
            for (int r = FirstData; r <= LastRow; r++)
            {
                yield return Sheet.Cell(r, c.Index);
            }
        }
    }

    private static bool FindHeader(
        IntakeRun run,
        RawSheet sheet,
        int lastRow,
        out int headerRow,
        out TableKind kind,
        out List<BoundColumn> columns,
        out List<(int Col, string Header)> unmatched,
        out List<(int Col, string Header, BoundColumn First)> duplicates)
    {
        headerRow = -1;
        kind = TableKind.Lots;
        columns = [];
        unmatched = [];
        duplicates = [];
        int bestScore = 1;
        int searchTo = Math.Min(lastRow, HeaderSearchRows - 1);
        for (int r = 0; r <= searchTo; r++)
        {
            var row = sheet.Rows[r];
            var lotFields = new HashSet<string>();
            var logFields = new HashSet<string>();
            int texts = 0, matched = 0;
            foreach (var cell in row)
            {
                if (cell is not string s || s.Trim().Length == 0)
                {
                    continue;
                }

                texts++;
                bool any = false;
                if (Match(run, s, TableKind.Lots, out _) is { } lf)
                {
                    lotFields.Add(lf.Name);
                    any = true;
                }

                if (Match(run, s, TableKind.Log, out _) is { } gf)
                {
                    logFields.Add(gf.Name);
                    any = true;
                }

                matched += any ? 1 : 0;
            }

            // A header row names at least two fields, and most of its cells are field names (a row of notes
            // that happens to mention two field words is not a header).
            int score = Math.Max(lotFields.Count, logFields.Count);
            if (score > bestScore && (matched * 2 >= texts || score >= 4))
            {
                bestScore = score;
                headerRow = r;
                kind = Classify(lotFields, logFields);
            }
        }

        if (headerRow < 0)
        {
            return false;
        }

        var header = sheet.Rows[headerRow];
        for (int c = 0; c < header.Length; c++)
        {
            if (header[c] is not { } cell || CellValues.IsBlank(cell))
            {
                continue;
            }

            string text = CellValues.Text(cell);
            var field = Match(run, text, kind, out var rule);
            if (field is null)
            {
                unmatched.Add((c, text));
                continue;
            }

            if (rule is not null)
            {
                rule.Used = true;
            }

            var unit = rule is { Unit: not ColumnUnit.None } ? rule.Unit : HeaderText.UnitFromHeader(text, field.Kind);
            if (unit == ColumnUnit.None && field.Name == "residual_sugar_gl" && HeaderText.IsPercentHeader(text))
            {
                // "RS %" is the lab's g per 100 mL (common practice); read as g/L it would be ten times too dry.
                unit = ColumnUnit.GramsPer100Millilitre;
            }

            var bound = new BoundColumn(c, field, text, unit, unit != ColumnUnit.None);
            if (columns.FirstOrDefault(b => b.Field.Name == field.Name) is { } first)
            {
                duplicates.Add((c, text, first));
                continue;
            }

            columns.Add(bound);
        }

        // A log with only a "time" column holding full timestamps reads it as the timestamp.
        if (kind == TableKind.Log && !columns.Any(b => b.Field.Name is "timestamp" or "date") && columns.FirstOrDefault(b => b.Field.Name == "time") is { } timeOnly)
        {
            timeOnly.Field = Fields.LogField("timestamp");
        }

        return true;
    }

    private static TableKind Classify(HashSet<string> lotFields, HashSet<string> logFields)
    {
        bool lotSpecific = lotFields.Overlaps(["strain", "final_abv", "starting_sugar", "residual_sugar_gl", "vessel", "variety", "yan_mgl"]);
        bool logShape = logFields.Overlaps(["timestamp", "date", "time"]) && logFields.Overlaps(["sugar", "temp_c"]);
        if (logShape && !lotFields.Overlaps(["strain", "final_abv"]))
        {
            return TableKind.Log;
        }

        return lotSpecific || !logShape ? TableKind.Lots : TableKind.Log;
    }

    private static FieldDef? Match(IntakeRun run, string header, TableKind kind, out MappingRule? rule)
    {
        foreach (var r in run.Rules)
        {
            if (r.For(kind) is { } f && r.Matches(header))
            {
                rule = r;
                return f;
            }
        }

        rule = null;
        var index = kind == TableKind.Lots ? ColumnRules.LotIndex : ColumnRules.LogIndex;
        if (index.TryGetValue(HeaderText.FieldKey(header), out var field) || index.TryGetValue(HeaderText.Normalise(header), out field))
        {
            return field;
        }

        return null;
    }

    /// <summary>A four-digit year (1900–2100) standing alone in a sheet or file name, when there is exactly one.</summary>
    internal static int? SeasonFromName(string? name)
    {
        if (name is null)
        {
            return null;
        }

        var years = YearInName().Matches(name).Select(m => int.Parse(m.Value, Inv)).Where(y => y is >= 1900 and <= 2100).Distinct().ToArray();
        return years.Length == 1 ? years[0] : null;
    }

    [GeneratedRegex(@"(?<![0-9])[0-9]{4}(?![0-9])")]
    private static partial Regex YearInName();

    [GeneratedRegex(@"^\s*(?<y>[0-9]{4})(?:\s*[-/]\s*[0-9]{2,4})?\s*$")]
    private static partial Regex YearText();

    /// <summary>The year a season cell's text names ("2024", "2024/25"), or null when it names none.</summary>
    internal static int? YearOf(string text)
    {
        if (text.Length == 4 && char.IsAsciiDigit(text[0]) && char.IsAsciiDigit(text[1]) && char.IsAsciiDigit(text[2]) && char.IsAsciiDigit(text[3]))
        {
            return ((text[0] - '0') * 1000) + ((text[1] - '0') * 100) + ((text[2] - '0') * 10) + (text[3] - '0');
        }

        return YearText().Match(text) is { Success: true } m ? int.Parse(m.Groups["y"].Value, Inv) : null;
    }

    // ---------------------------------------------------------------- units settled from the values

    private static void SettleUnits(SheetContext ctx)
    {
        foreach (var c in ctx.Columns)
        {
            switch (c.Field.Kind)
            {
                case FieldKind.Sugar:
                case FieldKind.Alcohol:
                case FieldKind.Temperature:
                    SettleFromValues(ctx, c);
                    break;
                case FieldKind.Volume:
                case FieldKind.Mass:
                    if (c.Unit == ColumnUnit.None)
                    {
                        c.Unit = ColumnUnits.DefaultFor(c.Field.Kind);
                        ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, c.Header, null, "unit-assumed", IntakeMessages.UnitAssumed(ColumnUnits.Label(c.Unit), c.Field.TemplateHeader));
                    }

                    break;
                case FieldKind.Plain when c.Field.Unit.Length > 0 && c.Unit == ColumnUnit.None && !PlainUnitStated(c):
                    ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, c.Header, null, "unit-assumed", IntakeMessages.UnitAssumed(c.Field.Unit, c.Field.TemplateHeader));
                    break;
                case FieldKind.Date or FieldKind.DateTime:
                    c.DateOrder = CellValues.ColumnDateOrder(ctx.Values(c));
                    break;
            }
        }
    }

    private static bool PlainUnitStated(BoundColumn c)
    {
        string n = " " + HeaderText.Normalise(c.Header) + " ";
        return c.Field.Unit switch
        {
            "g/L" => n.Contains(" g l ", StringComparison.Ordinal) || n.Contains(" gl ", StringComparison.Ordinal) || n.Contains(" gpl ", StringComparison.Ordinal),
            "mg N/L" => n.Contains(" mg ", StringComparison.Ordinal) || n.Contains(" mgl ", StringComparison.Ordinal) || n.Contains(" ppm ", StringComparison.Ordinal),
            _ => true,
        };
    }

    private static void SettleFromValues(SheetContext ctx, BoundColumn c)
    {
        var values = ctx.Run.ColumnValues;
        values.Clear();
        values.EnsureCapacity(ctx.LastRow - ctx.FirstData + 1);
        bool negativeZero = false;
        for (int r = ctx.FirstData; r <= ctx.LastRow; r++)
        {
            if (CellValues.Number(ctx.Sheet.Cell(r, c.Index), ctx.Sheet.DecimalComma, out double d, out _) == CellProblem.None)
            {
                values.Add(d);
                negativeZero |= d == 0 && double.IsNegative(d);
            }
        }

        if (values.Count == 0)
        {
            c.Unit = c.Unit == ColumnUnit.None ? ColumnUnits.DefaultFor(c.Field.Kind) : c.Unit;
            return;
        }

        var spread = new Spread(values, negativeZero, ctx.Run);
        double median = spread.Median, low = spread.Low, high = spread.High;
        var sink = ctx.Run.Sink;
        switch (c.Field.Kind)
        {
            case FieldKind.Sugar when c.Unit == ColumnUnit.None:
                c.Unit = c.Field.Name == "starting_sugar" ? StartingSugarUnit(median) : ReadingSugarUnit(low, high);
                var (bandLow, bandHigh) = spread.Band(v => ValueLooksLike(c.Field, v, c.Unit)) ?? (low, high);
                sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, c.Header, null, "unit-from-values",
                    IntakeMessages.UnitFromValues(ColumnUnits.Label(c.Unit), bandLow, bandHigh, SugarHeaderExample(c)));
                break;
            case FieldKind.Alcohol when c.Unit == ColumnUnit.None:
                c.Unit = median > 30 ? ColumnUnit.AlcoholGramsPerLitre : ColumnUnit.PercentVolume;
                sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, c.Header, null, "unit-from-values",
                    IntakeMessages.UnitFromValues(ColumnUnits.Label(c.Unit), low, high, c.Unit == ColumnUnit.AlcoholGramsPerLitre ? "Final alcohol (g/L)" : "Final alcohol (% v/v)"));
                break;
            case FieldKind.Temperature when c.Unit == ColumnUnit.None:
                c.Unit = median > 45 ? ColumnUnit.Fahrenheit : ColumnUnit.Celsius;
                sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, c.Header, null, "unit-from-values",
                    IntakeMessages.UnitFromValues(ColumnUnits.Label(c.Unit), low, high, c.Field.TemplateHeader));
                break;
            case FieldKind.Temperature when c.Unit == ColumnUnit.Celsius && median is > 45 and <= 120:
                c.Unit = ColumnUnit.Fahrenheit;
                sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, c.Header, null, "temperature-in-fahrenheit", IntakeMessages.ColumnInFahrenheit(low, high));
                break;
        }
    }

    /// <summary>
    /// The lowest, middle (the element at index n / 2 in sorted order) and highest of a column's values, as a sort
    /// would give them, found by selection. Values that compare equal are the same number, except -0 and 0, which
    /// print apart: when a column holds both and a zero is the lowest or highest value shown, the values are sorted
    /// and the ends taken from the sorted order, as they always were.
    /// </summary>
    private sealed class Spread
    {
        private readonly List<double> _values;
        private readonly bool _negativeZero;
        private bool _sorted;

        public Spread(List<double> values, bool negativeZero, IntakeRun run)
        {
            _values = values;
            _negativeZero = negativeZero;
            double low = values[0], high = values[0];
            foreach (double v in values)
            {
                low = v < low ? v : low;
                high = v > high ? v : high;
            }

            if (negativeZero && (low == 0 || high == 0))
            {
                Sort();
                (low, high) = (values[0], values[^1]);
            }

            // Selection reorders what it works on. Where a sort may still be needed (to place -0 and 0), the order it
            // starts from decides where they land, so the values keep their order and a copy is used.
            var all = System.Runtime.InteropServices.CollectionsMarshal.AsSpan(values);
            if (negativeZero)
            {
                if (run.SelectionSpace.Length < all.Length)
                {
                    run.SelectionSpace = new double[all.Length];
                }

                all.CopyTo(run.SelectionSpace);
                all = run.SelectionSpace.AsSpan(0, values.Count);
            }

            Median = YieldBench.Core.Statistics.Descriptive.SelectInPlace(all, values.Count / 2);

            (Low, High) = (low, high);
        }

        public double Low { get; }

        public double Median { get; }

        public double High { get; }

        /// <summary>The lowest and highest of the values that pass the test (first and last in sorted order), or null.</summary>
        public (double Low, double High)? Band(Func<double, bool> fits)
        {
            if (!_sorted)
            {
                bool any = false;
                double low = 0, high = 0;
                foreach (double v in _values)
                {
                    if (fits(v))
                    {
                        low = !any || v < low ? v : low;
                        high = !any || v > high ? v : high;
                        any = true;
                    }
                }

                if (!any)
                {
                    return null;
                }

                if (!_negativeZero || (low != 0 && high != 0))
                {
                    return (low, high);
                }

                Sort();
            }

            var inBand = _values.Where(fits).ToList();
            return inBand.Count > 0 ? (inBand[0], inBand[^1]) : null;
        }

        private void Sort()
        {
            _values.Sort();
            _sorted = true;
        }
    }

    private static string SugarHeaderExample(BoundColumn c) => c.Field.Name switch
    {
        "starting_sugar" => "Starting sugar (" + ColumnUnits.Label(c.Unit) + ")",
        "final_sugar" => "Final sugar (" + ColumnUnits.Label(c.Unit) + ")",
        _ => "Sugar (" + ColumnUnits.Label(c.Unit) + ")",
    };

    /// <summary>Starting-sugar scale from the column median: SG 0.95–1.3, °Oechsle 45–145, g/L above 145, else °Brix.</summary>
    internal static ColumnUnit StartingSugarUnit(double median) => median switch
    {
        >= 0.95 and < 1.3 => ColumnUnit.SpecificGravity,
        > 45 and <= 145 => ColumnUnit.Oechsle,
        > 145 => ColumnUnit.SugarGramsPerLitre,
        _ => ColumnUnit.Brix,
    };

    /// <summary>Scale of a reading column (logs, final sugar) that runs down to dryness: all values 0.95–1.3 mean SG.</summary>
    internal static ColumnUnit ReadingSugarUnit(double low, double high) => (low, high) switch
    {
        ( >= 0.95, < 1.3) => ColumnUnit.SpecificGravity,
        (_, > 145) => ColumnUnit.SugarGramsPerLitre,
        (_, > 45) => ColumnUnit.Oechsle,
        _ => ColumnUnit.Brix,
    };

    /// <summary>True when a value fits the column's scale; false names a value that looks like another scale.</summary>
    private static bool ValueLooksLike(FieldDef field, double v, ColumnUnit unit)
    {
        if (field.Name == "starting_sugar")
        {
            var band = StartingSugarUnit(v);
            return unit is ColumnUnit.Baume ? band == ColumnUnit.Brix : band == unit;
        }

        return unit switch
        {
            ColumnUnit.SpecificGravity => v is >= 0.95 and < 1.3,
            ColumnUnit.Brix or ColumnUnit.Baume => v <= 45,
            _ => true,
        };
    }

    private static ColumnUnit LikelyUnit(FieldDef field, double v) =>
        field.Name == "starting_sugar" ? StartingSugarUnit(v) : ReadingSugarUnit(v, v);

    // ---------------------------------------------------------------- rows

    /// <summary>The row being read and whether a problem has left it out; one per sheet, started afresh for each row.</summary>
    private sealed class RowState(SheetContext ctx)
    {
        public bool Bad { get; set; }

        public int Row { get; private set; }

        public int SheetRow => Row + 1;

        public SheetContext Ctx { get; } = ctx;

        public RowState Start(int row)
        {
            Row = row;
            Bad = false;
            return this;
        }

        public void Problem(BoundColumn c, object? cell, string code, string message, bool critical)
        {
            string value = CellValues.Text(cell);
            if (critical)
            {
                Bad = true;
                Ctx.Run.Sink.Error(Ctx.File, Ctx.SheetName, SheetRow, c.Header, value, code, message);
            }
            else
            {
                Ctx.Run.Sink.Warning(Ctx.File, Ctx.SheetName, SheetRow, c.Header, value, code, message + IntakeMessages.LeftEmpty);
            }
        }
    }

    /// <summary>True when every non-blank cell of the row is text naming only a unit (and at least two are).</summary>
    private static bool IsUnitsRow(object?[] row)
    {
        int units = 0;
        foreach (var cell in row)
        {
            if (CellValues.IsBlank(cell))
            {
                continue;
            }

            if (cell is not string s || !HeaderText.IsUnitOnly(s))
            {
                return false;
            }

            units++;
        }

        return units >= 2;
    }

    /// <summary>A row whose only content is one text of several words (a note between lots), or null.</summary>
    private static string? NoteText(object?[] row)
    {
        object? only = null;
        int filled = 0;
        foreach (var c in row)
        {
            if (!CellValues.IsBlank(c) && ++filled == 1)
            {
                only = c;
            }
            else if (filled > 1)
            {
                return null;
            }
        }

        return filled == 1 && only is string s && s.Trim().Contains(' ', StringComparison.Ordinal) ? s.Trim() : null;
    }

    private static bool AllBlank(object?[] row)
    {
        foreach (var c in row)
        {
            if (!CellValues.IsBlank(c))
            {
                return false;
            }
        }

        return true;
    }

    private static object? FirstFilled(object?[] row)
    {
        foreach (var c in row)
        {
            if (!CellValues.IsBlank(c))
            {
                return c;
            }
        }

        return null;
    }

    private static bool IsSummaryRow(SheetContext ctx, object?[] row, out string? label)
    {
        label = null;
        var lotCol = ctx.LotColumn;
        object? candidate = lotCol is not null && lotCol.Index < row.Length && !CellValues.IsBlank(row[lotCol.Index])
            ? row[lotCol.Index]
            : FirstFilled(row);
        if (candidate is not string s)
        {
            return false;
        }

        // Every summary word starts with a letter, so text starting with a digit (a lot id) is none.
        var lead = s.AsSpan().TrimStart();
        if (lead.Length > 0 && char.IsAsciiDigit(lead[0]))
        {
            return false;
        }

        string n = HeaderText.Normalise(s);
        if (SummaryWords.Contains(n))
        {
            label = s.Trim();
            return true;
        }

        foreach (var w in SummaryWords)
        {
            // "<word> <follower> ...": the word, a space, then a follower as the next whole word.
            if (n.Length > w.Length && n[w.Length] == ' ' && n.StartsWith(w, StringComparison.Ordinal))
            {
                var rest = n.AsSpan(w.Length + 1);
                int space = rest.IndexOf(' ');
                if (SummaryFollowerLookup.Contains(space < 0 ? rest : rest[..space]))
                {
                    label = s.Trim();
                    return true;
                }
            }
        }

        return false;
    }

    private static Outcome ReadLots(SheetContext ctx)
    {
        var run = ctx.Run;
        var sink = run.Sink;
        bool running = run.Options.RunningLots;
        string[] required = running ? ["lot_id", "strain", "starting_sugar"] : ["lot_id", "strain", "starting_sugar", "final_abv"];
        var missing = required.Where(f => ctx.Column(f) is null).ToList();
        if (running)
        {
            ReportFinalColumns(ctx);
        }

        foreach (var m in missing)
        {
            var f = Fields.Lot(m);
            sink.Error(ctx.File, ctx.SheetName, ctx.FirstData, null, null, "missing-column", IntakeMessages.MissingColumn(m, [f.TemplateHeader, .. f.Synonyms.Take(2)]));
        }

        int read = 0, used = 0, reported = 0, blank = 0, summary = 0;
        var rowState = new RowState(ctx);
        for (int r = ctx.FirstData; r <= ctx.LastRow; r++)
        {
            read++;
            var row = ctx.Sheet.Rows[r];
            if (AllBlank(row))
            {
                blank++;
                continue;
            }

            if (IsSummaryRow(ctx, row, out var label))
            {
                summary++;
                sink.Warning(ctx.File, ctx.SheetName, r + 1, ctx.Column("lot_id")?.Header, label, "summary-row-skipped", IntakeMessages.SummaryRow());
                continue;
            }

            if (NoteText(row) is { } note)
            {
                reported++;
                sink.Warning(ctx.File, ctx.SheetName, r + 1, null, note, "note-row-skipped", IntakeMessages.NoteRowSkipped());
                continue;
            }

            if (missing.Count > 0)
            {
                reported++;
                continue;
            }

            if (ctx.Sheet.BadRows.TryGetValue(r, out var detail))
            {
                reported++;
                sink.Error(ctx.File, ctx.SheetName, r + 1, null, null, "bad-csv-row", IntakeMessages.BadCsvRow(detail));
                continue;
            }

            if (running)
            {
                bool added = AddRunningLot(ctx, rowState, r);
                used += added ? 1 : 0;
                reported += added ? 0 : 1;
                continue;
            }

            var lot = ReadLotRow(ctx, rowState, r);
            if (lot is null)
            {
                reported++;
                continue;
            }

            if (run.LotKeys.TryGetValue(lot.Key, out var first))
            {
                reported++;
                sink.Error(ctx.File, ctx.SheetName, r + 1, ctx.Column("lot_id")!.Header, lot.LotId, "duplicate-lot", IntakeMessages.DuplicateLot(lot.LotId, lot.Season, first.ToString()));
                continue;
            }

            run.LotKeys[lot.Key] = lot.Source!;
            run.Lots.Add(lot);
            used++;
        }

        run.Accounts.Add(new SourceAccount(ctx.File, ctx.SheetName, running ? "running lots" : "lots", read, used, 0, reported, blank, summary));
        return Outcome.Read;
    }

    private static Lot? ReadLotRow(SheetContext ctx, RowState row, int r)
    {
        var st = row.Start(r);
        string? lotId = TextField(st, "lot_id");
        string? strain = TextField(st, "strain");
        int? season = SeasonField(st);
        var startScale = ColumnUnits.Scale(ctx.Column("starting_sugar")?.Unit ?? ColumnUnit.Brix);
        SugarReading? start = SugarField(st, ctx.Column("starting_sugar"), out double startRecorded);
        double? abv = NumberField(st, "final_abv");
        var lot = st.Bad || lotId is null || strain is null || start is null || abv is null || season is null
            ? null
            : new Lot
            {
                LotId = lotId,
                Season = season.Value,
                Strain = strain,
                StartingSugar = start.Value,
                RecordedStartingSugar = new RecordedSugar(startRecorded, startScale),
                FinalAlcohol = AlcoholContent.FromPercentVolume(abv.Value),
                Vessel = TextField(st, "vessel"),
                VesselCapacityL = NumberField(st, "vessel_capacity_l"),
                Variety = TextField(st, "variety"),
                Block = TextField(st, "block"),
                Colour = ColourField(st),
                Additions = new Additions(NumberField(st, "must_volume_l"), NumberField(st, "water_added_l"), NumberField(st, "sugar_added_kg")),
                ResidualSugarGl = NumberField(st, "residual_sugar_gl"),
                FinalSugar = SugarField(st, "final_sugar"),
                YanMgL = NumberField(st, "yan_mgl"),
                Ph = NumberField(st, "ph"),
                TaGl = NumberField(st, "ta_gl"),
                MeanFermentationTempC = NumberField(st, "mean_temp_c"),
                PeakFermentationTempC = NumberField(st, "peak_temp_c"),
                InoculationDate = DateField(st, "inoculation_date"),
                DryDate = DateField(st, "dry_date"),
                Notes = TextField(st, "notes"),
                Source = new SourceRef(ctx.File, ctx.SheetName, r + 1),
            };

        if (lot is null)
        {
            // Read the remaining fields anyway so every problem of the row is reported at once.
            foreach (var name in new[] { "vessel_capacity_l", "must_volume_l", "water_added_l", "sugar_added_kg", "residual_sugar_gl", "yan_mgl", "ph", "ta_gl", "mean_temp_c", "peak_temp_c" })
            {
                NumberField(st, name);
            }

            SugarField(st, "final_sugar");
            DateField(st, "inoculation_date");
            DateField(st, "dry_date");
            ColourField(st);
            return null;
        }

        return st.Bad ? null : lot;
    }

    private static string Label(FieldDef f) => f.Name;

    private static string? TextField(RowState st, string name) => TextField(st, st.Ctx.Column(name));

    private static string? TextField(RowState st, BoundColumn? column)
    {
        if (column is not { } c)
        {
            return null;
        }

        object? cell = st.Ctx.Sheet.Cell(st.Row, c.Index);
        if (cell is ErrorCell)
        {
            st.Problem(c, cell, "error-cell", IntakeMessages.ErrorCell(Label(c.Field)), c.Field.Critical);
            return null;
        }

        string text = CellValues.Text(cell);
        if (text.Length == 0)
        {
            if (c.Field.Required)
            {
                st.Problem(c, cell, "missing-value", IntakeMessages.MissingValue(Label(c.Field)), true);
            }

            return null;
        }

        return text;
    }

    private static int? SeasonField(RowState st) => SeasonField(st, st.Ctx.Column("season"));

    private static int? SeasonField(RowState st, BoundColumn? seasonColumn)
    {
        var ctx = st.Ctx;
        if (seasonColumn is { } c)
        {
            object? cell = ctx.Sheet.Cell(st.Row, c.Index);
            if (!CellValues.IsBlank(cell))
            {
                if (cell is double d && d == Math.Floor(d) && d is >= 1900 and <= 2100)
                {
                    return (int)d;
                }

                if (cell is string s && YearOf(s) is >= 1900 and <= 2100 and var y)
                {
                    return y;
                }

                if (cell is DateTime dt)
                {
                    return dt.Year;
                }

                st.Problem(c, cell, cell is ErrorCell ? "error-cell" : "not-a-year", cell is ErrorCell ? IntakeMessages.ErrorCell("season") : IntakeMessages.NotAYear("season"), ctx.Kind == TableKind.Lots);
                return null;
            }
        }

        if (ctx.DefaultSeason is { } def)
        {
            return def;
        }

        if (ctx.Kind == TableKind.Lots)
        {
            st.Bad = true;
            ctx.Run.Sink.Error(ctx.File, ctx.SheetName, st.SheetRow, seasonColumn?.Header, null, "no-season", IntakeMessages.NoSeason());
        }

        return null;
    }

    private static bool NumberCell(RowState st, BoundColumn c, out double value)
    {
        object? cell = st.Ctx.Sheet.Cell(st.Row, c.Index);
        var problem = CellValues.Number(cell, st.Ctx.Sheet.DecimalComma, out value, out var alternative);
        string label = Label(c.Field);
        if (problem == CellProblem.NotANumber && cell is string text && CellValues.SplitUnit(text) is var (number, unitText))
        {
            // "24.5 Bx", "1.4 g/L": the unit written in the cell is accepted only when it is the column's own unit.
            var inner = CellValues.Number(number, st.Ctx.Sheet.DecimalComma, out value, out alternative);
            if (inner == CellProblem.None)
            {
                if (CellUnitAgrees(c, unitText))
                {
                    return true;
                }

                string columnUnit = ColumnUnits.Label(c.Unit) is { Length: > 0 } u ? u : (c.Field.Unit.Length > 0 ? c.Field.Unit : "its held unit");
                st.Problem(c, cell, "unit-in-cell-differs", IntakeMessages.UnitInCellDiffers(label, unitText, columnUnit), c.Field.Critical);
                return false;
            }

            problem = inner;
        }

        if (problem == CellProblem.None && cell is string pct && pct.TrimEnd().EndsWith('%'))
        {
            // A percent sign (typed, or from a percent-formatted cell) is % v/v for alcohol and % by mass for °Brix;
            // residual sugar in % is g per 100 mL; for any other field it names no unit the column can hold.
            if (c.Field.Name == "residual_sugar_gl" && c.Unit != ColumnUnit.GramsPer100Millilitre)
            {
                value = Math.Round(value * 10.0, 10);
            }
            else if (c.Field.Kind is not (FieldKind.Alcohol or FieldKind.Sugar) && c.Field.Name != "residual_sugar_gl")
            {
                string columnUnit = ColumnUnits.Label(c.Unit) is { Length: > 0 } u ? u : (c.Field.Unit.Length > 0 ? c.Field.Unit : "its held unit");
                st.Problem(c, cell, "unit-in-cell-differs", IntakeMessages.UnitInCellDiffers(label, "%", columnUnit), c.Field.Critical);
                return false;
            }
        }

        switch (problem)
        {
            case CellProblem.None:
                return true;
            case CellProblem.Blank:
                if (c.Field.Required)
                {
                    st.Problem(c, cell, "missing-value", IntakeMessages.MissingValue(label), true);
                }

                return false;
            case CellProblem.ErrorCell:
                st.Problem(c, cell, "error-cell", IntakeMessages.ErrorCell(label), c.Field.Critical);
                return false;
            case CellProblem.AmbiguousNumber:
                var parts = alternative!.Split(" or ");
                string shown = CellValues.Text(cell);
                if (!shown.Contains(',', StringComparison.Ordinal) && c.Field.Kind == FieldKind.Sugar
                    && double.TryParse(parts[1], System.Globalization.NumberStyles.Float, Inv, out double gravity) && gravity is >= 0.95 and < 1.3)
                {
                    // "1.095" in a sugar column is a specific gravity; 1095 means nothing on any sugar scale.
                    value = gravity;
                    return true;
                }

                st.Problem(c, cell, "ambiguous-number", shown.Contains(',', StringComparison.Ordinal)
                    ? IntakeMessages.AmbiguousNumber(label, parts[0], parts[1])
                    : IntakeMessages.AmbiguousDotNumber(label, parts[0], parts[1]), c.Field.Critical);
                return false;
            default:
                st.Problem(c, cell, "not-a-number", IntakeMessages.NotANumber(label), c.Field.Critical);
                return false;
        }
    }

    /// <summary>True when a unit written after a number in a cell names the unit the column is read in.</summary>
    private static bool CellUnitAgrees(BoundColumn c, string unitText)
    {
        string u = unitText.ToLowerInvariant().Replace("°", "", StringComparison.Ordinal).Replace("º", "", StringComparison.Ordinal)
            .Replace(" ", "", StringComparison.Ordinal).Replace("é", "e", StringComparison.Ordinal).TrimEnd('.');
        ColumnUnit? named = u switch
        {
            "bx" or "brix" => ColumnUnit.Brix,
            "sg" => ColumnUnit.SpecificGravity,
            "oe" or "oechsle" => ColumnUnit.Oechsle,
            "be" or "baume" => ColumnUnit.Baume,
            "%" or "%v/v" or "%vol" or "vol" or "vol%" or "%abv" or "abv" or "%alc" or "v/v" => ColumnUnit.PercentVolume,
            "c" => ColumnUnit.Celsius,
            "f" => ColumnUnit.Fahrenheit,
            "l" or "lt" or "ltr" or "litres" or "liters" => ColumnUnit.Litre,
            "hl" => ColumnUnit.Hectolitre,
            "gal" or "gals" or "gallons" => ColumnUnit.UsGallon,
            "kg" => ColumnUnit.Kilogram,
            "lb" or "lbs" => ColumnUnit.Pound,
            _ => null,
        };
        bool gramsPerLitre = u is "g/l" or "gl" or "gpl";
        return c.Field.Name switch
        {
            "residual_sugar_gl" or "ta_gl" => gramsPerLitre,
            "yan_mgl" => u is "mg/l" or "mgn/l" or "ppm" or "mgl",
            _ when c.Field.Kind == FieldKind.Sugar => gramsPerLitre ? c.Unit == ColumnUnit.SugarGramsPerLitre : named == c.Unit,
            _ when c.Field.Kind == FieldKind.Alcohol => gramsPerLitre ? c.Unit == ColumnUnit.AlcoholGramsPerLitre : named == c.Unit,
            _ when c.Field.Kind == FieldKind.Mass && u == "g" => c.Unit == ColumnUnit.Gram,
            _ => named is not null && named == c.Unit,
        };
    }

    private static string Shown(double raw, ColumnUnit unit) =>
        ColumnUnits.Label(unit) is { Length: > 0 } u ? $"{IntakeMessages.Num(raw)} {u}" : IntakeMessages.Num(raw);

    /// <summary>A number in the field's unit, range-checked; null when empty or bad (bad ones reported).</summary>
    private static double? NumberField(RowState st, string name) => NumberField(st, st.Ctx.Column(name));

    private static double? NumberField(RowState st, BoundColumn? column)
    {
        if (column is not { } c || !NumberCell(st, c, out double raw))
        {
            return null;
        }

        var f = c.Field;
        string name = f.Name;
        object? cell = st.Ctx.Sheet.Cell(st.Row, c.Index);
        if (f.Kind == FieldKind.Temperature && c.Unit == ColumnUnit.Celsius && raw is > 45 and <= 120)
        {
            st.Problem(c, cell, "fahrenheit-in-celsius-column", IntakeMessages.FahrenheitInCelsiusColumn(Label(f), (raw - 32) * 5 / 9), f.Critical);
            return null;
        }

        double v = ColumnUnits.ToFieldUnit(raw, c.Unit);
        if (f.Kind is FieldKind.Volume && name is "must_volume_l" or "vessel_capacity_l" && v <= 0)
        {
            st.Problem(c, cell, "out-of-range", IntakeMessages.NotPositive(Label(f), ConvertedShown(raw, c.Unit, v, f.Unit)), f.Critical);
            return null;
        }

        if (f.Kind is FieldKind.Volume or FieldKind.Mass && v < 0)
        {
            st.Problem(c, cell, "out-of-range", IntakeMessages.Negative(Label(f), ConvertedShown(raw, c.Unit, v, f.Unit)), f.Critical);
            return null;
        }

        if (f.Min is { } min && f.Max is { } max && (v < min || v > max))
        {
            string message = IntakeMessages.OutOfRange(Label(f), ConvertedShown(raw, c.Unit, v, f.Unit), min, max, f.Unit);
            if (f.Kind == FieldKind.Alcohol && c.Unit == ColumnUnit.PercentVolume && v * 100 >= min && v * 100 <= max)
            {
                // 0.141 is how a spreadsheet holds 14.1 % when the cell lost its percent format.
                message += IntakeMessages.LooksLikeAFraction(raw * 100);
            }

            st.Problem(c, cell, "out-of-range", message, f.Critical);
            return null;
        }

        return v;
    }

    private static string ConvertedShown(double raw, ColumnUnit unit, double converted, string fieldUnit)
    {
        string shown = Shown(raw, unit);
        if (ColumnUnits.Label(unit) is { Length: > 0 } u && u != fieldUnit && fieldUnit.Length > 0)
        {
            shown += $" (= {IntakeMessages.Num(Math.Round(converted, 2))} {fieldUnit})";
        }

        return shown;
    }

    private static SugarReading? SugarField(RowState st, string name) => SugarField(st, st.Ctx.Column(name), out _);

    private static SugarReading? SugarField(RowState st, BoundColumn? column) => SugarField(st, column, out _);

    /// <summary>A sugar value converted to a reading through Core's sugar scales, and the number as written.</summary>
    private static SugarReading? SugarField(RowState st, BoundColumn? column, out double recorded)
    {
        recorded = double.NaN;
        if (column is not { } c || !NumberCell(st, c, out double raw))
        {
            return null;
        }

        var f = c.Field;
        object? cell = st.Ctx.Sheet.Cell(st.Row, c.Index);
        if (!ValueLooksLike(f, raw, c.Unit))
        {
            st.Problem(c, cell, "unit-differs-in-column", IntakeMessages.UnitDiffersInColumn(Label(f), ColumnUnits.Label(LikelyUnit(f, raw)), ColumnUnits.Label(c.Unit)), f.Critical);
            return null;
        }

        double min = f.Min ?? SugarReading.MinBrix, max = f.Max ?? SugarReading.MaxBrix;
        if (!SugarReading.TryFrom(raw, ColumnUnits.Scale(c.Unit), min, max, out var reading, out double brix))
        {
            st.Problem(c, cell, "out-of-range", IntakeMessages.OutOfRange(Label(f), ConvertedShown(raw, c.Unit, brix, "°Brix"), min, max, "°Brix"), f.Critical);
            return null;
        }

        recorded = raw;
        return reading;
    }

    private static DateTime? DateField(RowState st, string name) => DateField(st, st.Ctx.Column(name));

    private static DateTime? DateField(RowState st, BoundColumn? column)
    {
        if (column is not { } c)
        {
            return null;
        }

        object? cell = st.Ctx.Sheet.Cell(st.Row, c.Index);
        var problem = CellValues.Date(cell, c.DateOrder, out var value, out var dayFirst, out var monthFirst);
        string label = Label(c.Field);
        switch (problem)
        {
            case CellProblem.None:
                return value;
            case CellProblem.Blank:
                return null;
            case CellProblem.ErrorCell:
                st.Problem(c, cell, "error-cell", IntakeMessages.ErrorCell(label), c.Field.Critical);
                return null;
            case CellProblem.AmbiguousDate:
                st.Problem(c, cell, "ambiguous-date", IntakeMessages.AmbiguousDate(label, dayFirst!, monthFirst!), c.Field.Critical);
                return null;
            default:
                st.Problem(c, cell, "not-a-date", IntakeMessages.NotADate(label), c.Field.Critical);
                return null;
        }
    }

    private static WineColour ColourField(RowState st)
    {
        if (st.Ctx.Column("colour") is not { } c)
        {
            return WineColour.Unknown;
        }

        object? cell = st.Ctx.Sheet.Cell(st.Row, c.Index);
        string n = HeaderText.Normalise(CellValues.Text(cell));
        switch (n)
        {
            case "":
                return WineColour.Unknown;
            case "red" or "r" or "rouge" or "rot" or "tinto" or "rosso" or "red wine":
                return WineColour.Red;
            case "white" or "w" or "blanc" or "blanco" or "weiss" or "bianco" or "white wine":
                return WineColour.White;
            case "rose" or "rosado" or "rosato" or "blush" or "pink" or "rose wine":
                return WineColour.Rose;
            default:
                st.Problem(c, cell, "unknown-colour", IntakeMessages.UnknownColour(Label(c.Field)), false);
                return WineColour.Unknown;
        }
    }

    private static Outcome ReadLog(SheetContext ctx, string fileStem)
    {
        var run = ctx.Run;
        var sink = run.Sink;
        var lotCol = ctx.Column("lot_id");
        var tsCol = ctx.Column("timestamp");
        var dateCol = ctx.Column("date");
        var timeCol = ctx.Column("time");
        var sugarCol = ctx.Column("sugar");
        var tempCol = ctx.Column("temp_c");
        var seasonCol = ctx.Column("season");
        bool noTime = tsCol is null && dateCol is null;
        if (noTime)
        {
            sink.Error(ctx.File, ctx.SheetName, ctx.FirstData, null, null, "missing-column", IntakeMessages.MissingTimeColumn());
        }

        // A sheet without a lot column is the log of the lot it is named after (a CSV: its file name).
        string? sheetLot = lotCol is null ? (ctx.SheetName ?? fileStem).Trim() : null;
        int read = 0, used = 0, reported = 0, blank = 0, summary = 0;
        var rowState = new RowState(ctx);
        for (int r = ctx.FirstData; r <= ctx.LastRow; r++)
        {
            read++;
            var row = ctx.Sheet.Rows[r];
            if (AllBlank(row))
            {
                blank++;
                continue;
            }

            if (IsSummaryRow(ctx, row, out var label))
            {
                summary++;
                sink.Warning(ctx.File, ctx.SheetName, r + 1, lotCol?.Header, label, "summary-row-skipped", IntakeMessages.SummaryRow());
                continue;
            }

            if (noTime)
            {
                reported++;
                continue;
            }

            if (ctx.Sheet.BadRows.TryGetValue(r, out var detail))
            {
                reported++;
                sink.Error(ctx.File, ctx.SheetName, r + 1, null, null, "bad-csv-row", IntakeMessages.BadCsvRow(detail));
                continue;
            }

            var st = rowState.Start(r);
            string? lotId = sheetLot ?? TextField(st, lotCol);
            if (lotId is null && lotCol is not null && !st.Bad)
            {
                st.Problem(lotCol, null, "missing-value", IntakeMessages.MissingValue("lot_id"), true);
            }

            int? season = SeasonField(st, seasonCol);
            DateTime? when = null;
            if (tsCol is not null)
            {
                when = DateField(st, tsCol);
            }
            else if (dateCol is not null)
            {
                when = DateField(st, dateCol);
                if (when is not null && timeCol is not null)
                {
                    object? tcell = ctx.Sheet.Cell(r, timeCol.Index);
                    var tp = CellValues.TimeOfDay(tcell, out var tod);
                    if (tp == CellProblem.None)
                    {
                        when = when.Value.Date + tod;
                    }
                    else if (tp != CellProblem.Blank)
                    {
                        st.Problem(timeCol, tcell, tp == CellProblem.ErrorCell ? "error-cell" : "not-a-time", tp == CellProblem.ErrorCell ? IntakeMessages.ErrorCell("time") : IntakeMessages.NotATime("time"), true);
                    }
                }
            }

            if (when is null && !st.Bad)
            {
                var c = tsCol ?? dateCol!;
                st.Problem(c, ctx.Sheet.Cell(r, c.Index), "missing-timestamp", IntakeMessages.MissingTimestamp(), true);
            }

            SugarReading? sugar = sugarCol is null ? null : SugarField(st, sugarCol);
            double? temp = tempCol is null ? null : NumberField(st, tempCol);
            if (!st.Bad && sugar is null && temp is null)
            {
                st.Bad = true;
                sink.Error(ctx.File, ctx.SheetName, r + 1, (sugarCol ?? tempCol)?.Header, null, "no-reading", IntakeMessages.NoReading());
            }

            if (st.Bad || lotId is null || when is null)
            {
                reported++;
                continue;
            }

            run.Readings.Add((lotId, season, new LogReading(when.Value, sugar, temp, new SourceRef(ctx.File, ctx.SheetName, r + 1))));
            used++;
        }

        run.Accounts.Add(new SourceAccount(ctx.File, ctx.SheetName, "log", read, 0, used, reported, blank, summary));
        return Outcome.Read;
    }
}
