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

    /// <summary>Width of a terminal the text fits in.</summary>
    public const int Width = 100;

    /// <summary>
    /// Writes what was read, file by file (each path once, as the user gave it): its size and SHA-256, then per sheet
    /// the row accounting and the header mapping, then the file's issues; issues of no file (the command's own
    /// mappings) after them; then a one-line result. Lines fit <see cref="Width"/> columns.
    /// </summary>
    public static void WriteText(SeasonSet set, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(set);
        ArgumentNullException.ThrowIfNull(output);
        var files = set.Accounts.Select(a => a.File).Concat(set.Issues.Select(i => i.File)).Distinct(StringComparer.Ordinal).ToList();
        // Grouped once (each group keeps the input order): a folder of thousands of files with hundreds of thousands of
        // issues took minutes when every file scanned every issue.
        var reads = set.Files.GroupBy(f => f.Path, StringComparer.Ordinal).ToDictionary(g => g.Key, g => g.First(), StringComparer.Ordinal);
        var accounts = set.Accounts.ToLookup(a => a.File, StringComparer.Ordinal);
        var mappingsOf = set.Mappings.ToLookup(m => (m.File, m.Sheet));
        var issuesOf = set.Issues.ToLookup(i => i.File, StringComparer.Ordinal);
        foreach (string file in files)
        {
            output.WriteLine(file);
            if (reads.TryGetValue(file, out var read))
            {
                output.WriteLine($"  {read.Bytes.ToString("N0", Inv)} bytes, sha256 {read.Sha256}");
            }

            foreach (var a in accounts[file])
            {
                WriteWrapped(output, "  ", "    ", Accounting(a));
                var mappings = mappingsOf[(file, a.Sheet)].ToList();
                if (mappings.Count > 0)
                {
                    WriteTable(output, ["header", "field", "unit"], mappings.Select(m => new[] { Cut(m.Header, 40), m.Field, m.Unit ?? "" }).ToList());
                }
            }

            foreach (var issue in issuesOf[file])
            {
                WriteWrapped(output, "  ", "      ", Describe(issue, withFile: false));
            }

            output.WriteLine();
        }

        int errors = set.Issues.Count(i => i.Severity == IssueSeverity.Error);
        int warnings = set.Issues.Count - errors;
        int leftOut = set.Accounts.Sum(a => a.RowsReported);
        string seasons = set.Lots.Count == 0 ? "no usable lot rows" : set.Seasons.Count == 0 ? "no season" : string.Join(", ", set.Seasons.Select(N));
        string lots = $"{Counted(set.Lots.Count, "lot")} ({seasons})";
        if (set.Accounts.Any(a => a.Kind == "running lots"))
        {
            // Lots still fermenting (check --running): counted as such, with their seasons.
            var running = set.RunningLots.Select(l => l.Season).Distinct().Order().ToList();
            lots = $"{Counted(set.RunningLots.Count, "running lot")} ({(running.Count == 0 ? "no usable lot rows" : string.Join(", ", running.Select(N)))})";
        }

        WriteWrapped(output, "", "  ", $"Issues: {N(set.Issues.Count)} ({Counted(errors, "error")}, {Counted(warnings, "warning")}).");
        WriteWrapped(output, "", "  ", $"Result: {lots}, {Counted(set.Logs.Count, "fermentation log")} with {Counted(set.Logs.Sum(l => l.Readings.Count), "reading")}; {Counted(leftOut, "row")} left out.");
    }

    /// <summary>A sheet's accounting as one sentence.</summary>
    private static string Accounting(SourceAccount a)
    {
        string sheet = a.Sheet is null ? "" : $"sheet \"{a.Sheet}\", ";
        if (a.Kind is "refused" or "hidden" or "empty" or "not read")
        {
            return $"{sheet}{a.Kind}: no rows read.";
        }

        string used = a.ReadingsInRows is { } held
            ? $"{N(a.LogReadingsUsed)} rows used ({N(held)} readings)"
            : a.LogReadingsUsed > 0 || a.Kind.StartsWith("log", StringComparison.Ordinal) ? $"{N(a.LogReadingsUsed)} readings used" : a.Kind == LabJoin.AccountKind ? $"{N(a.LotsUsed)} results used" : $"{N(a.LotsUsed)} lots used";
        return $"{sheet}{a.Kind}: {N(a.RowsRead)} rows read = {used}, {N(a.RowsReported)} left out, {N(a.BlankRowsSkipped)} blank, " +
            $"{N(a.SummaryRowsSkipped)} summary or heading{(a.Balances ? "" : " — DOES NOT BALANCE")}.";
    }

    /// <summary>One issue as a line: severity, place, code and message (the file left out when it heads the issue's group).</summary>
    public static string Describe(IntakeIssue issue) => Describe(issue, withFile: true);

    private static string Describe(IntakeIssue issue, bool withFile)
    {
        ArgumentNullException.ThrowIfNull(issue);
        var place = new List<string>();
        if (withFile || issue.Sheet is not null)
        {
            string sheet = issue.Sheet is null ? "" : $"[{issue.Sheet}]";
            place.Add(withFile ? (issue.Sheet is null ? issue.File : $"{issue.File} {sheet}") : sheet);
        }

        if (issue.Row is { } r)
        {
            place.Add("row " + N(r));
        }

        if (issue.Column is { } c)
        {
            place.Add($"column \"{Cut(c, 40)}\"");
        }

        if (issue.Value is { Length: > 0 } v)
        {
            place.Add($"value \"{Cut(v, 60)}\"");
        }

        string severity = issue.Severity == IssueSeverity.Error ? "error" : "warning";
        string where = place.Count == 0 ? "" : " " + string.Join(", ", place);
        return $"{severity}{where}: {issue.Code}: {issue.Message}";
    }

    private static string Cut(string text, int max) => text.Length <= max ? text : text[..(max - 1)] + "…";

    /// <summary>Writes text wrapped at word boundaries to <see cref="Width"/> columns, the first line after <paramref name="first"/>, the rest after <paramref name="rest"/>.</summary>
    private static void WriteWrapped(TextWriter output, string first, string rest, string text)
    {
        string indent = first;
        var line = new System.Text.StringBuilder(indent);
        foreach (string word in text.Split(' ', StringSplitOptions.RemoveEmptyEntries))
        {
            if (line.Length > indent.Length && line.Length + 1 + word.Length > Width)
            {
                output.WriteLine(line.ToString());
                indent = rest;
                line.Clear().Append(indent);
            }

            line.Append(line.Length > indent.Length ? " " : "").Append(word);
        }

        output.WriteLine(line.ToString());
    }

    private static string N(int v) => v.ToString(Inv);

    /// <summary>"1 error", "2 errors", "0 errors".</summary>
    private static string Counted(int n, string noun) => $"{N(n)} {noun}{(n == 1 ? "" : "s")}";

    private static void WriteTable(TextWriter output, string[] headers, List<string[]> rows)
    {
        if (rows.Count == 0)
        {
            output.WriteLine("  (none)");
            return;
        }

        var widths = headers.Select((h, i) => Math.Max(h.Length, rows.Max(r => r[i].Length))).ToArray();
        output.WriteLine("    " + string.Join("  ", headers.Select((h, i) => h.PadRight(widths[i]))).TrimEnd());
        foreach (var r in rows)
        {
            output.WriteLine("    " + string.Join("  ", r.Select((c, i) => c.PadRight(widths[i]))).TrimEnd());
        }
    }
}
