namespace YieldBench.Intake;

/// <summary>A spreadsheet cell that holds a formula error such as #DIV/0! or #N/A.</summary>
internal sealed record ErrorCell(string Text)
{
    public override string ToString() => Text;
}

/// <summary>
/// One sheet (or CSV file) as cells: row i of <see cref="Rows"/> is spreadsheet row i + 1. Cells are null, string,
/// double, DateTime, bool or <see cref="ErrorCell"/>.
/// </summary>
internal sealed class RawSheet(string? name, List<object?[]> rows, bool decimalComma)
{
    public string? Name { get; } = name;

    public List<object?[]> Rows { get; } = rows;

    /// <summary>True when text numbers use a comma as the decimal separator (detected from a CSV's content).</summary>
    public bool DecimalComma { get; } = decimalComma;

    /// <summary>True when the sheet had more rows than the limit and was cut short.</summary>
    public bool TooManyRows { get; init; }

    /// <summary>True when the workbook hides the sheet (hidden or very hidden); such a sheet is not read.</summary>
    public bool Hidden { get; init; }

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
