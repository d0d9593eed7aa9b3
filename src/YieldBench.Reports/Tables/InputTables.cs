using YieldBench.Core.Lots;
using YieldBench.Core.Review;

namespace YieldBench.Reports.Tables;

/// <summary>What was read: intake issues, input files and the row accounting.</summary>
public static partial class ReviewTables
{
    private static IReadOnlyList<Column<IntakeIssue>> IssueTable { get; } =
    [
        new("file", "File", CellKind.Text, i => i.File),
        new("sheet", "Sheet", CellKind.Text, i => i.Sheet),
        new("row", "Row", CellKind.Integer, i => i.Row),
        new("column", "Column", CellKind.Text, i => i.Column),
        new("value", "Value", CellKind.Text, i => i.Value),
        new("code", "Code", CellKind.Text, i => i.Code),
        new("severity", "Severity", CellKind.Text, i => i.Severity == IssueSeverity.Error ? "error" : "warning"),
        new("message", "What is wrong and how to fix it", CellKind.Text, i => i.Message),
    ];

    /// <summary>Columns of the issue table: data/intake-issues.csv, the Intake issues sheet and <c>check --issues-csv</c>.</summary>
    public static IReadOnlyList<ReportColumn> IntakeIssueColumns => IssueTable.Select(c => c.Definition).ToArray();

    /// <summary>Every intake issue of the review, in the order intake found them; errors (rows or files left out) highlighted.</summary>
    public static ReportTable IntakeIssues(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        return IntakeIssues(review.Inputs.Issues);
    }

    /// <summary>The issue table of any list of intake issues (the one table both <c>check</c> and <c>review</c> write).</summary>
    public static ReportTable IntakeIssues(IEnumerable<IntakeIssue> issues)
    {
        ArgumentNullException.ThrowIfNull(issues);
        return ReportTable.Of(IssueTable, issues, i => i.Severity == IssueSeverity.Error);
    }

    private static IReadOnlyList<Column<InputFile>> FileTable { get; } =
    [
        new("file", "File", CellKind.Text, f => f.Path),
        new("sha256", "SHA-256", CellKind.Text, f => f.Sha256),
        new("bytes", "Bytes", CellKind.Integer, f => f.Bytes, "#,##0"),
    ];

    /// <summary>Input files with their SHA-256.</summary>
    public static ReportTable InputFiles(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        return ReportTable.Of(FileTable, review.Inputs.Files);
    }

    private static IReadOnlyList<Column<SourceAccount>> AccountTable { get; } =
    [
        new("file", "File", CellKind.Text, a => a.File),
        new("sheet", "Sheet", CellKind.Text, a => a.Sheet),
        new("kind", "Kind", CellKind.Text, a => a.Kind),
        new("rows_read", "Rows read", CellKind.Integer, a => a.RowsRead),
        new("lots_used", "Lots used", CellKind.Integer, a => a.LotsUsed),
        new("log_readings_used", "Log rows used", CellKind.Integer, a => a.LogReadingsUsed),
        new("log_readings", "Log readings", CellKind.Integer, a => a.ReadingsInRows ?? a.LogReadingsUsed),
        new("rows_reported", "Rows reported", CellKind.Integer, a => a.RowsReported),
        new("blank_rows_skipped", "Blank rows", CellKind.Integer, a => a.BlankRowsSkipped),
        new("summary_rows_skipped", "Summary or heading rows", CellKind.Integer, a => a.SummaryRowsSkipped),
    ];

    /// <summary>Row accounting per file and sheet; a sheet whose rows do not balance is highlighted.</summary>
    public static ReportTable RowAccounts(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        return ReportTable.Of(AccountTable, review.Inputs.Accounts, a => !a.Balances);
    }
}
