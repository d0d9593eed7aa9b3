namespace YieldBench.Reports.Tables;

/// <summary>How a column's values are written (CSV text and spreadsheet number format).</summary>
public enum CellKind
{
    /// <summary>Free text; neutralised against formula injection in CSV and written as text in sheets.</summary>
    Text,

    /// <summary>A whole number.</summary>
    Integer,

    /// <summary>A real number, written in full (round-trip) precision in CSV.</summary>
    Number,

    /// <summary>A share in 0–1, shown as a percentage in sheets and written as the share in CSV.</summary>
    Share,

    /// <summary>A date and time, ISO 8601 in CSV.</summary>
    DateTime,

    /// <summary>true/false.</summary>
    Boolean,
}

/// <summary>One column of a report table.</summary>
/// <param name="Name">snake_case data-file name, unit last (e.g. <c>final_abv</c>).</param>
/// <param name="Heading">Heading shown in the workbook (plain words with unit).</param>
/// <param name="Kind">Value kind.</param>
/// <param name="NumberFormat">Spreadsheet number format (null: by kind).</param>
public sealed record ReportColumn(string Name, string Heading, CellKind Kind, string? NumberFormat = null)
{
    /// <summary>
    /// Decimals a data file writes this column's numbers with: those its number format shows (a share two more, as it
    /// is written as the share and shown as a percentage), or null for a number without a format of its own, written
    /// in full (round-trip) precision.
    /// </summary>
    public int? CsvDecimals => Kind switch
    {
        CellKind.Number when NumberFormat is { } f => Decimals(f),
        CellKind.Share => Decimals(EffectiveNumberFormat) + 2,
        _ => null,
    };

    /// <summary>
    /// The format of a p-value: four decimals, and "&lt; 0.0001" below that (a conditional format: never "0.0000").
    /// A data file writes the value at four decimals.
    /// </summary>
    public const string PValueFormat = "[<0.0001]\"< 0.0001\";0.0000";

    /// <summary>The section of a number format that shows an ordinary number: the last of a conditional format (one starting with a [condition]), else the first.</summary>
    public static string PlainSection(string format)
    {
        ArgumentNullException.ThrowIfNull(format);
        var sections = format.Split(';');
        return format.StartsWith('[') ? sections[^1] : sections[0];
    }

    private static int Decimals(string format)
    {
        string first = PlainSection(format);
        int dot = first.IndexOf('.', StringComparison.Ordinal);
        return dot < 0 ? 0 : first.Skip(dot + 1).TakeWhile(c => c == '0').Count();
    }

    /// <summary>The number format the workbook uses for this column.</summary>
    public string EffectiveNumberFormat => NumberFormat ?? Kind switch
    {
        CellKind.Integer => "0",
        CellKind.Number => "0.000",
        CellKind.Share => "0.0%",
        CellKind.DateTime => "yyyy-mm-dd hh:mm",
        _ => "@",
    };
}

/// <summary>A column and how it reads its value from a row's item: tables are defined by accessors, never by positions.</summary>
/// <typeparam name="T">The item each row shows.</typeparam>
/// <param name="Definition">Name, heading, kind and format.</param>
/// <param name="Value">The cell of an item (string, double (NaN: empty), int, long, bool, DateTime or null).</param>
public sealed record Column<T>(ReportColumn Definition, Func<T, object?> Value)
{
    /// <summary>A column of <typeparamref name="T"/> items.</summary>
    public Column(string name, string heading, CellKind kind, Func<T, object?> value, string? numberFormat = null)
        : this(new ReportColumn(name, heading, kind, numberFormat), value)
    {
    }
}

/// <summary>
/// A table as every renderer sees it: the CSV writer and the workbook writer lay out the same columns and rows, so a
/// data file and its sheet cannot disagree. Cells hold <see cref="string"/>, <see cref="double"/> (NaN: empty),
/// <see cref="int"/>, <see cref="long"/>, <see cref="bool"/>, <see cref="System.DateTime"/>, or null (empty).
/// </summary>
/// <remarks>
/// Cells are kept by column, typed (a number as its eight bytes and a one-byte type; a text as its string), not as
/// boxed objects: at 100,000 lots the per-lot tables held about three million boxed numbers for the whole report.
/// <see cref="Cell"/> reads one cell; <see cref="Rows"/> makes each row when asked, for small tables and tests.
/// </remarks>
public sealed class ReportTable
{
    private readonly CellStore store;
    private readonly int[]? order;
    private readonly bool[]? reorderedHighlights;

    /// <summary>Creates an empty table.</summary>
    public ReportTable(IReadOnlyList<ReportColumn> columns)
    {
        ArgumentNullException.ThrowIfNull(columns);
        if (columns.Count == 0)
        {
            throw new ArgumentException("A table needs at least one column.", nameof(columns));
        }

        var duplicate = columns.GroupBy(c => c.Name, StringComparer.Ordinal).FirstOrDefault(g => g.Count() > 1);
        if (duplicate is not null)
        {
            throw new ArgumentException($"Column '{duplicate.Key}' appears twice.", nameof(columns));
        }

        Columns = columns;
        store = new CellStore(columns.Count);
        Rows = new RowView(this);
    }

    private ReportTable(IReadOnlyList<ReportColumn> columns, CellStore store, int[] order)
    {
        Columns = columns;
        this.store = store;
        this.order = order;
        reorderedHighlights = order.Select(i => store.Highlighted[i]).ToArray();
        Rows = new RowView(this);
    }

    /// <summary>
    /// A table of one row per item, each cell read by its column's accessor; <paramref name="highlight"/> marks rows to
    /// shade (null: none).
    /// </summary>
    public static ReportTable Of<T>(IReadOnlyList<Column<T>> columns, IEnumerable<T> items, Func<T, bool>? highlight = null)
    {
        ArgumentNullException.ThrowIfNull(columns);
        ArgumentNullException.ThrowIfNull(items);
        var table = new ReportTable(columns.Select(c => c.Definition).ToArray());
        if (items.TryGetNonEnumeratedCount(out int count))
        {
            table.store.Reserve(count);
        }

        foreach (var item in items)
        {
            int row = table.store.AddRow(highlight?.Invoke(item) ?? false);
            for (int c = 0; c < columns.Count; c++)
            {
                table.store.Set(row, c, Checked(columns[c].Value(item)));
            }
        }

        return table;
    }

    /// <summary>The columns in their stable order.</summary>
    public IReadOnlyList<ReportColumn> Columns { get; }

    /// <summary>The number of rows.</summary>
    public int RowCount => order?.Length ?? store.Count;

    /// <summary>
    /// The rows, each with one cell per column, made when asked (a new array each time: writers of large tables read
    /// cells with <see cref="Cell"/>).
    /// </summary>
    public IReadOnlyList<object?[]> Rows { get; }

    /// <summary>Whether each row is highlighted in the workbook (flagged lots).</summary>
    public IReadOnlyList<bool> Highlighted => reorderedHighlights ?? store.Highlighted;

    /// <summary>The cell at <paramref name="row"/> and <paramref name="column"/> (0-based), of a type <see cref="Add"/> accepts.</summary>
    public object? Cell(int row, int column) => store.Get(order is null ? row : order[row], column);

    /// <summary>Index of a column by its data-file name.</summary>
    public int IndexOf(string name)
    {
        for (int i = 0; i < Columns.Count; i++)
        {
            if (string.Equals(Columns[i].Name, name, StringComparison.Ordinal))
            {
                return i;
            }
        }

        throw new ArgumentException($"No column '{name}'.", nameof(name));
    }

    /// <summary>Adds a row; it must have one cell per column, of a supported type.</summary>
    public void Add(object?[] cells, bool highlight = false)
    {
        ArgumentNullException.ThrowIfNull(cells);
        if (order is not null)
        {
            throw new InvalidOperationException("A reordered table shares its rows and takes none of its own.");
        }

        if (cells.Length != Columns.Count)
        {
            throw new ArgumentException($"A row has {cells.Length} cells but the table has {Columns.Count} columns.", nameof(cells));
        }

        foreach (var cell in cells)
        {
            Checked(cell);
        }

        int row = store.AddRow(highlight);
        for (int c = 0; c < cells.Length; c++)
        {
            store.Set(row, c, cells[c]);
        }
    }

    /// <summary>
    /// A table of the same columns holding this table's rows (shared, not copied) and highlights in the order
    /// <paramref name="order"/> gives by index; the rows are shared, so neither table may change afterwards.
    /// </summary>
    internal ReportTable Reordered(IReadOnlyList<int> order)
    {
        ArgumentNullException.ThrowIfNull(order);
        return new ReportTable(Columns, store, order.Select(i => this.order is null ? i : this.order[i]).ToArray());
    }

    private static object? Checked(object? cell) => cell is null or string or double or int or long or bool or System.DateTime
        ? cell
        : throw new ArgumentException($"Unsupported cell type {cell.GetType().Name}.", nameof(cell));

    /// <summary>The rows as arrays, made when asked.</summary>
    private sealed class RowView(ReportTable table) : IReadOnlyList<object?[]>
    {
        public int Count => table.RowCount;

        public object?[] this[int index]
        {
            get
            {
                ArgumentOutOfRangeException.ThrowIfNegative(index);
                ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(index, Count);
                var cells = new object?[table.Columns.Count];
                for (int c = 0; c < cells.Length; c++)
                {
                    cells[c] = table.Cell(index, c);
                }

                return cells;
            }
        }

        public IEnumerator<object?[]> GetEnumerator()
        {
            for (int i = 0; i < Count; i++)
            {
                yield return this[i];
            }
        }

        System.Collections.IEnumerator System.Collections.IEnumerable.GetEnumerator() => GetEnumerator();
    }

    /// <summary>Cells by column: a type byte per cell, a number's eight bytes, a text's string (each array made when a column first needs it).</summary>
    private sealed class CellStore(int columns)
    {
        private const long TicksMask = (1L << 62) - 1;
        private readonly CellType[][] types = new CellType[columns][];
        private readonly long[]?[] bits = new long[]?[columns];
        private readonly string?[]?[] texts = new string?[]?[columns];
        private bool[] highlighted = [];
        private int capacity;

        private enum CellType : byte
        {
            Empty,
            Text,
            Number,
            Integer,
            Long,
            Boolean,
            DateTime,
        }

        public int Count { get; private set; }

        public IReadOnlyList<bool> Highlighted => new ArraySegment<bool>(highlighted, 0, Count);

        public void Reserve(int rows)
        {
            if (rows > capacity)
            {
                capacity = rows;
                Array.Resize(ref highlighted, rows);
                for (int c = 0; c < types.Length; c++)
                {
                    Array.Resize(ref types[c], rows);
                    if (bits[c] is not null)
                    {
                        Array.Resize(ref bits[c], rows);
                    }

                    if (texts[c] is not null)
                    {
                        Array.Resize(ref texts[c], rows);
                    }
                }
            }
        }

        public int AddRow(bool highlight)
        {
            if (Count == capacity)
            {
                Reserve(Math.Max(4, capacity * 2));
            }

            highlighted[Count] = highlight;
            return Count++;
        }

        public void Set(int row, int column, object? cell)
        {
            switch (cell)
            {
                case null:
                    types[column][row] = CellType.Empty;
                    return;
                case string s:
                    (texts[column] ??= new string?[capacity])[row] = s;
                    types[column][row] = CellType.Text;
                    return;
                case double d:
                    Number(row, column, CellType.Number, BitConverter.DoubleToInt64Bits(d));
                    return;
                case int i:
                    Number(row, column, CellType.Integer, i);
                    return;
                case long l:
                    Number(row, column, CellType.Long, l);
                    return;
                case bool b:
                    Number(row, column, CellType.Boolean, b ? 1 : 0);
                    return;
                case System.DateTime t:
                    Number(row, column, CellType.DateTime, t.Ticks | ((long)t.Kind << 62));
                    return;
            }
        }

        public object? Get(int row, int column)
        {
            long v = types[column][row] is CellType.Empty or CellType.Text ? 0 : bits[column]![row];
            return types[column][row] switch
            {
                CellType.Text => texts[column]![row],
                CellType.Number => BitConverter.Int64BitsToDouble(v),
                CellType.Integer => (int)v,
                CellType.Long => v,
                CellType.Boolean => v != 0,
                CellType.DateTime => new System.DateTime(v & TicksMask, (DateTimeKind)(v >>> 62)),
                _ => null,
            };
        }

        private void Number(int row, int column, CellType type, long value)
        {
            (bits[column] ??= new long[capacity])[row] = value;
            types[column][row] = type;
        }
    }
}
