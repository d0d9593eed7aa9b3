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
    /// <summary>Each row's own height in points, or null for the sheet's default (null: every row the default).</summary>
    public IReadOnlyList<double?>? RowHeights { get; init; }

    /// <summary>1-based last data row.</summary>
    public int LastDataRow => FirstDataRow + Table.RowCount - 1;

    /// <summary>1-based last column.</summary>
    public int LastColumn => FirstColumn + Table.Columns.Count - 1;

    /// <summary>The last row the table holds in the laid-out sheet: its last data row, or the highlighted template row of a one-row table.</summary>
    public int LastRowHeld => Math.Max(LastDataRow, HighlightedTemplateRow);

    /// <summary>Row of the highlighted template.</summary>
    public int HighlightedTemplateRow => FirstDataRow + 1;
}

/// <summary>
/// The tables of one workbook, whose rows ClosedXML never holds (its cell objects made 100,000 lots cost gigabytes):
/// <see cref="SheetPlan"/> registers every table here and the workbook writer streams their rows into the finished
/// package. One path for every table, short or long, so the demo exercises what a large review gets.
/// </summary>
internal sealed class StreamedTables
{
    private readonly List<DeferredBody> bodies = [];

    /// <summary>Every registered table, in the order registered.</summary>
    public IReadOnlyList<DeferredBody> Bodies => bodies;

    /// <summary>
    /// Registers a table; it may not share rows with another streamed table on the same sheet. A table of one row still
    /// has two template rows: nothing may be written in the row after it.
    /// </summary>
    public void Add(DeferredBody body)
    {
        ArgumentNullException.ThrowIfNull(body);
        if (body.Table.RowCount < 1)
        {
            throw new ArgumentException("A streamed table needs at least one data row.", nameof(body));
        }

        var clash = bodies.FirstOrDefault(b => string.Equals(b.SheetName, body.SheetName, StringComparison.Ordinal)
            && b.FirstDataRow <= body.LastRowHeld && body.FirstDataRow <= b.LastRowHeld);
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
