namespace YieldBench.Core.Lots;

/// <summary>Where a value came from: file, sheet (null for CSV) and row as the spreadsheet numbers it (1-based).</summary>
public sealed record SourceRef(string File, string? Sheet, int Row)
{
    /// <inheritdoc />
    public override string ToString() => Sheet is null ? $"{File} row {Row}" : $"{File} [{Sheet}] row {Row}";
}
