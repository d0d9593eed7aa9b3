namespace YieldBench.Core.Lots;

/// <summary>How serious an intake issue is.</summary>
public enum IssueSeverity
{
    /// <summary>The row was used; something about it is worth knowing (a unit guessed from values, a range extrapolated).</summary>
    Warning,

    /// <summary>The row (or file) was left out.</summary>
    Error,
}

/// <summary>
/// A problem found while reading inputs, with the place it was found and what would fix it.
/// </summary>
/// <param name="File">File path as given by the user.</param>
/// <param name="Sheet">Sheet name (null for CSV or whole-file problems).</param>
/// <param name="Row">Row as the spreadsheet numbers it (1-based), or null for file- or sheet-level problems.</param>
/// <param name="Column">Column header text (or letter) involved, when one is.</param>
/// <param name="Value">The offending cell text, when there is one.</param>
/// <param name="Code">Stable kebab-case code, e.g. <c>not-a-number</c>.</param>
/// <param name="Message">Plain-language message saying what is wrong and what would fix it.</param>
/// <param name="Severity">Whether the row was left out.</param>
public sealed record IntakeIssue(
    string File,
    string? Sheet,
    int? Row,
    string? Column,
    string? Value,
    string Code,
    string Message,
    IssueSeverity Severity);

/// <summary>
/// Row accounting for one sheet (or CSV file): every row read is used, reported, or skipped as blank or summary (an Average or Total row, or a season heading such as "Vintage 2023" over its lots).
/// Identity: <c>RowsRead = LotsUsed + LogReadingsUsed + RowsReported + BlankRowsSkipped + SummaryRowsSkipped</c>.
/// </summary>
public sealed record SourceAccount(
    string File,
    string? Sheet,
    string Kind,
    int RowsRead,
    int LotsUsed,
    int LogReadingsUsed,
    int RowsReported,
    int BlankRowsSkipped,
    int SummaryRowsSkipped)
{
    /// <summary>
    /// Readings the used rows held when one row holds several (a log with one column per lot); null when each used
    /// row of a log is one reading.
    /// </summary>
    public int? ReadingsInRows { get; init; }

    /// <summary>True when the accounting identity holds.</summary>
    public bool Balances => RowsRead == LotsUsed + LogReadingsUsed + RowsReported + BlankRowsSkipped + SummaryRowsSkipped;
}

/// <summary>An input file with its SHA-256, for the report's record of what was reviewed.</summary>
public sealed record InputFile(string Path, string Sha256, long Bytes);

/// <summary>Which header of which sheet went to which field.</summary>
public sealed record HeaderMapping(string File, string? Sheet, string Field, string Header, string? Unit);
