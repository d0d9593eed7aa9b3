using YieldBench.Core.Lots;

namespace YieldBench.Intake;

/// <summary>Collects intake issues in the order they are found.</summary>
internal sealed class IssueSink
{
    private readonly List<IntakeIssue> _issues = [];

    public IReadOnlyList<IntakeIssue> Issues => _issues;

    public void Error(string file, string? sheet, int? row, string? column, string? value, string code, string message) =>
        _issues.Add(new IntakeIssue(file, sheet, row, column, value, code, message, IssueSeverity.Error));

    public void Warning(string file, string? sheet, int? row, string? column, string? value, string code, string message) =>
        _issues.Add(new IntakeIssue(file, sheet, row, column, value, code, message, IssueSeverity.Warning));

    /// <summary>Adds issues collected elsewhere (by a file read ahead), in their order.</summary>
    public void AddRange(IEnumerable<IntakeIssue> issues) => _issues.AddRange(issues);
}
