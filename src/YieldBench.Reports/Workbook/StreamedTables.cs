using YieldBench.Reports.Tables;

namespace YieldBench.Reports.Workbook;

/// <summary>
/// A table whose data rows ClosedXML does not hold: ClosedXML writes its heading and two template rows (one plain, one
/// highlighted) at <see cref="FirstDataRow"/> and the row after, and <see cref="StreamedSheet"/> replaces those two rows
/// with every data row when the package is finished.
/// </summary>
/// <param name="SheetName">Sheet the table is on.</param>
/// <param name="FirstDataRow">1-based row of the first data row (the plain template row); the highlighted template is the next row.</param>
/// <param name="FirstColumn">1-based first column.</param>
/// <param name="Table">The table; its rows are written as they are when the package is finished.</param>
internal sealed record DeferredBody(string SheetName, int FirstDataRow, int FirstColumn, ReportTable Table)
{
    /// <summary>1-based last data row.</summary>
    public int LastDataRow => FirstDataRow + Table.Rows.Count - 1;

    /// <summary>1-based last column.</summary>
    public int LastColumn => FirstColumn + Table.Columns.Count - 1;

    /// <summary>Row of the highlighted template.</summary>
    public int HighlightedTemplateRow => FirstDataRow + 1;
}

/// <summary>
/// The tables of one workbook that are too long to lay out cell by cell in ClosedXML (its cell objects made 100,000
/// lots cost gigabytes): <see cref="SheetLayout"/> registers them here and the workbook writer streams their rows into
/// the finished package.
/// </summary>
internal sealed class StreamedTables
{
    /// <summary>Tables with more data rows than this are streamed; shorter ones stay in ClosedXML's cell model.</summary>
    public const int DefaultRowThreshold = 2000;

    private readonly List<DeferredBody> bodies = [];

    /// <summary>Creates an empty register.</summary>
    /// <param name="rowThreshold">Tables with more data rows than this are streamed (at least 2: the template rows need the room).</param>
    public StreamedTables(int rowThreshold = DefaultRowThreshold)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(rowThreshold, 2);
        RowThreshold = rowThreshold;
    }

    /// <summary>Tables with more data rows than this are streamed.</summary>
    public int RowThreshold { get; }

    /// <summary>Every registered table, in the order registered.</summary>
    public IReadOnlyList<DeferredBody> Bodies => bodies;

    /// <summary>Whether <paramref name="table"/> is long enough to stream.</summary>
    public bool ShouldStream(ReportTable table)
    {
        ArgumentNullException.ThrowIfNull(table);
        return table.Rows.Count > RowThreshold;
    }

    /// <summary>Registers a table; it may not share rows with another streamed table on the same sheet.</summary>
    public void Add(DeferredBody body)
    {
        ArgumentNullException.ThrowIfNull(body);
        if (body.Table.Rows.Count < 2)
        {
            throw new ArgumentException("A streamed table needs at least two data rows (the two template rows).", nameof(body));
        }

        var clash = bodies.FirstOrDefault(b => string.Equals(b.SheetName, body.SheetName, StringComparison.Ordinal)
            && b.FirstDataRow <= body.LastDataRow && body.FirstDataRow <= b.LastDataRow);
        if (clash is not null)
        {
            throw new InvalidOperationException(
                $"Sheet '{body.SheetName}': a streamed table at rows {body.FirstDataRow}–{body.LastDataRow} overlaps another at rows {clash.FirstDataRow}–{clash.LastDataRow}.");
        }

        bodies.Add(body);
    }

    /// <summary>The streamed tables of each sheet, ordered by row.</summary>
    public IReadOnlyDictionary<string, IReadOnlyList<DeferredBody>> BySheet() =>
        bodies.GroupBy(b => b.SheetName, StringComparer.Ordinal)
            .ToDictionary(g => g.Key, g => (IReadOnlyList<DeferredBody>)g.OrderBy(b => b.FirstDataRow).ToArray(), StringComparer.Ordinal);
}
