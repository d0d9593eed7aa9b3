using System.Globalization;
using YieldBench.Core.Lots;

namespace YieldBench.Intake;

/// <summary>The plain-text rendering of what intake read: mappings, row accounting and issues (the issue table as CSV is written by Reports, ReviewTables.IntakeIssues).</summary>
public static class IntakeReport
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>True when any row was left out or any file or sheet was refused (the check command then exits 1).</summary>
    public static bool AnyRowLeftOut(SeasonSet set)
    {
        ArgumentNullException.ThrowIfNull(set);
        return set.Accounts.Any(a => a.RowsReported > 0) || set.Issues.Any(i => i.Severity == IssueSeverity.Error);
    }

    /// <summary>Writes the header mapping, the accounting table, every issue and a one-line summary.</summary>
    public static void WriteText(SeasonSet set, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(set);
        ArgumentNullException.ThrowIfNull(output);
        output.WriteLine("Files");
        if (set.Files.Count == 0)
        {
            output.WriteLine("  (none read)");
        }

        foreach (var f in set.Files)
        {
            output.WriteLine($"  {f.Path}  {f.Bytes.ToString(Inv)} bytes  sha256 {f.Sha256}");
        }

        output.WriteLine();
        output.WriteLine("Header mapping");
        WriteTable(
            output,
            ["file", "sheet", "header", "field", "unit"],
            set.Mappings.Select(m => new[] { m.File, m.Sheet ?? "", m.Header, m.Field, m.Unit ?? "" }).ToList());

        output.WriteLine();
        output.WriteLine("Rows");
        WriteTable(
            output,
            ["file", "sheet", "kind", "rows read", "lots used", "readings used", "left out", "blank", "summary", "balances"],
            set.Accounts.Select(a => new[]
            {
                a.File, a.Sheet ?? "", a.Kind, N(a.RowsRead), N(a.LotsUsed), N(a.LogReadingsUsed), N(a.RowsReported),
                N(a.BlankRowsSkipped), N(a.SummaryRowsSkipped), a.Balances ? "yes" : "NO",
            }).ToList());

        output.WriteLine();
        int errors = set.Issues.Count(i => i.Severity == IssueSeverity.Error);
        int warnings = set.Issues.Count - errors;
        output.WriteLine($"Issues: {N(set.Issues.Count)} ({N(errors)} errors, {N(warnings)} warnings)");
        foreach (var i in set.Issues)
        {
            output.WriteLine("  " + Describe(i));
        }

        output.WriteLine();
        int leftOut = set.Accounts.Sum(a => a.RowsReported);
        string seasons = set.Lots.Count == 0 ? "no usable lot rows" : set.Seasons.Count == 0 ? "no season" : string.Join(", ", set.Seasons.Select(N));
        output.WriteLine($"Result: {N(set.Lots.Count)} lots ({seasons}), {N(set.Logs.Count)} fermentation logs with {N(set.Logs.Sum(l => l.Readings.Count))} readings; {N(leftOut)} rows left out.");
    }

    /// <summary>One issue as a line: severity, place, code and message.</summary>
    public static string Describe(IntakeIssue issue)
    {
        ArgumentNullException.ThrowIfNull(issue);
        var place = new List<string> { issue.Sheet is null ? issue.File : $"{issue.File} [{issue.Sheet}]" };
        if (issue.Row is { } r)
        {
            place.Add("row " + N(r));
        }

        if (issue.Column is { } c)
        {
            place.Add($"column \"{c}\"");
        }

        if (issue.Value is { Length: > 0 } v)
        {
            place.Add($"value \"{v}\"");
        }

        string severity = issue.Severity == IssueSeverity.Error ? "error  " : "warning";
        return $"{severity} {string.Join(", ", place)}: {issue.Code}: {issue.Message}";
    }

    private static string N(int v) => v.ToString(Inv);

    private static void WriteTable(TextWriter output, string[] headers, List<string[]> rows)
    {
        if (rows.Count == 0)
        {
            output.WriteLine("  (none)");
            return;
        }

        var widths = headers.Select((h, i) => Math.Max(h.Length, rows.Max(r => r[i].Length))).ToArray();
        output.WriteLine("  " + string.Join("  ", headers.Select((h, i) => h.PadRight(widths[i]))).TrimEnd());
        foreach (var r in rows)
        {
            output.WriteLine("  " + string.Join("  ", r.Select((c, i) => c.PadRight(widths[i]))).TrimEnd());
        }
    }
}
