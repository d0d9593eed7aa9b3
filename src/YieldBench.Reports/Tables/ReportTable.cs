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
public sealed class ReportTable
{
    private readonly List<object?[]> rows = [];
    private readonly List<bool> highlighted = [];

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
        foreach (var item in items)
        {
            var cells = new object?[columns.Count];
            for (int c = 0; c < cells.Length; c++)
            {
                cells[c] = columns[c].Value(item);
            }

            table.Add(cells, highlight?.Invoke(item) ?? false);
        }

        return table;
    }

    /// <summary>The columns in their stable order.</summary>
    public IReadOnlyList<ReportColumn> Columns { get; }

    /// <summary>The rows, each with one cell per column.</summary>
    public IReadOnlyList<object?[]> Rows => rows;

    /// <summary>Whether each row is highlighted in the workbook (flagged lots).</summary>
    public IReadOnlyList<bool> Highlighted => highlighted;

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
        if (cells.Length != Columns.Count)
        {
            throw new ArgumentException($"A row has {cells.Length} cells but the table has {Columns.Count} columns.", nameof(cells));
        }

        foreach (var cell in cells)
        {
            if (cell is not (null or string or double or int or long or bool or System.DateTime))
            {
                throw new ArgumentException($"Unsupported cell type {cell.GetType().Name}.", nameof(cells));
            }
        }

        rows.Add(cells);
        highlighted.Add(highlight);
    }

    /// <summary>
    /// A table of the same columns holding this table's rows (the same cell arrays, not copies) and highlights in the
    /// order <paramref name="order"/> gives by index; the rows are shared, so neither table may change afterwards.
    /// </summary>
    internal ReportTable Reordered(IReadOnlyList<int> order)
    {
        ArgumentNullException.ThrowIfNull(order);
        var table = new ReportTable(Columns);
        table.rows.Capacity = order.Count;
        table.highlighted.Capacity = order.Count;
        foreach (int i in order)
        {
            table.rows.Add(rows[i]);
            table.highlighted.Add(highlighted[i]);
        }

        return table;
    }
}
