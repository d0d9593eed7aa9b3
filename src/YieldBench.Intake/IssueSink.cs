using YieldBench.Core.Lots;

namespace YieldBench.Intake;

/// <summary>
/// Collects intake issues in the order they are found. Texts from the input (the value, the column header) are shown
/// through <see cref="TextSettling.ForDisplay"/>: control characters written out, long values shortened.
/// </summary>
internal sealed class IssueSink
{
    private readonly List<IntakeIssue> _issues = [];

    public IReadOnlyList<IntakeIssue> Issues => _issues;

    public void Error(string file, string? sheet, int? row, string? column, string? value, string code, string message) =>
        Add(file, sheet, row, column, value, code, message, IssueSeverity.Error);

    public void Warning(string file, string? sheet, int? row, string? column, string? value, string code, string message) =>
        Add(file, sheet, row, column, value, code, message, IssueSeverity.Warning);

    private void Add(string file, string? sheet, int? row, string? column, string? value, string code, string message, IssueSeverity severity) =>
        _issues.Add(new IntakeIssue(
            TextSettling.ForDisplay(file), sheet is null ? null : TextSettling.ForDisplay(sheet), row, column is null ? null : TextSettling.ForDisplay(column),
            value is null ? null : TextSettling.ForDisplay(value), code, TextSettling.ForDisplay(message, int.MaxValue), severity));

    /// <summary>Adds issues collected elsewhere (by a file read ahead), in their order.</summary>
    public void AddRange(IEnumerable<IntakeIssue> issues) => _issues.AddRange(issues);
}
