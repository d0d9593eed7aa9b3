namespace YieldBench.Core.Lots;

/// <summary>Where a value came from: file, sheet (null for CSV) and row as the spreadsheet numbers it (1-based).</summary>
public sealed record SourceRef(string File, string? Sheet, int Row)
{
    /// <inheritdoc />
    public override string ToString() => Sheet is null ? $"{File} row {Row}" : $"{File} [{Sheet}] row {Row}";
}

/// <summary>A file and sheet (null for CSV) that values come from: one per sheet read, shared by its rows.</summary>
public sealed record SourcePlace(string File, string? Sheet);
