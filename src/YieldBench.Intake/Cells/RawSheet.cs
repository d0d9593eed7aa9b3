namespace YieldBench.Intake;

/// <summary>A spreadsheet cell that holds a formula error such as #DIV/0! or #N/A.</summary>
internal sealed record ErrorCell(string Text)
{
    public override string ToString() => Text;
}

/// <summary>
/// A spreadsheet cell that holds a formula but no stored result (files written by scripts and some exporters store only
/// the formula; a spreadsheet program computes and stores the result when it saves the file).
/// </summary>
internal sealed record FormulaCell(string Formula)
{
    public override string ToString() => "=" + Formula;
}

/// <summary>
/// One sheet (or CSV file) as cells: row i of <see cref="Rows"/> is spreadsheet row i + 1. Cells are null, string,
/// double, DateTime, bool, <see cref="ErrorCell"/> or <see cref="FormulaCell"/>.
/// </summary>
internal sealed class RawSheet(string? name, List<object?[]> rows, bool decimalComma)
{
    public string? Name { get; } = name;

    public List<object?[]> Rows { get; } = rows;

    /// <summary>True when text numbers use a comma as the decimal separator (detected from a CSV's content).</summary>
    public bool DecimalComma { get; } = decimalComma;

    /// <summary>True when the sheet had more rows than the limit and was cut short.</summary>
    public bool TooManyRows { get; init; }

    /// <summary>True when the sheet spanned more cells than the limit (a damaged file's declared width) and was not kept.</summary>
    public bool TooManyCells { get; init; }

    /// <summary>True when the sheet is a text file's (CSV): its rows are split by a delimiter, so a row may hold more fields than its header.</summary>
    public bool IsText { get; init; }

    /// <summary>
    /// True when nothing in a text file settles whether a dot groups thousands ("4.200" as 4200) or is a decimal
    /// point: the delimiter is not a comma, no decimal comma was seen, and no number with a decimal point and other
    /// than three decimals.
    /// </summary>
    public bool DotGroupingUnsettled { get; init; }

    /// <summary>
    /// True when a text file's fields are separated by commas and its numbers are written with a decimal point ("24.6")
    /// and never with a decimal comma: a comma before groups of three digits ("1,250", quoted) then groups thousands.
    /// </summary>
    public bool CommaGroupsThousands { get; init; }

    /// <summary>True when the workbook hides the sheet (hidden or very hidden); such a sheet is not read.</summary>
    public bool Hidden { get; init; }

    /// <summary>Columns (0-based) the workbook hides: a visible column for the same field is read before them.</summary>
    public HashSet<int> HiddenColumns { get; } = [];

    /// <summary>The blocks of merged cells the workbook declares (read as seen by <see cref="MergedCells"/>).</summary>
    public List<CellSpan> Merged { get; } = [];

    /// <summary>The row-spanning blocks filled as seen, each with the last row it filled and its value, until warned of (<see cref="MergedCells.Warn"/>).</summary>
    public List<(CellSpan Span, int ToRow, object Value)> MergedFilled { get; } = [];

    /// <summary>CSV rows (0-based index) the parser could not split cleanly, with what was wrong.</summary>
    public Dictionary<int, string> BadRows { get; } = [];

    public object? Cell(int row, int col)
    {
        var r = Rows[row];
        return col < r.Length ? r[col] : null;
    }
}

/// <summary>What a source reader produced: sheets, or a refusal already reported.</summary>
internal sealed record RawFile(IReadOnlyList<RawSheet> Sheets, bool Refused);
