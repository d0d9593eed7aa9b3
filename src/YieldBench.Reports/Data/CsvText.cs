using System.Globalization;
using System.Text;
using YieldBench.Reports.Tables;

namespace YieldBench.Reports.Data;

/// <summary>
/// Writes report tables as CSV: RFC 4180 quoting, CRLF line ends, UTF-8 without byte-order mark, invariant culture,
/// numbers in round-trip precision. Formula-injection rule: a TEXT cell whose first character is <c>=</c>, <c>+</c>,
/// <c>-</c>, <c>@</c>, a tab or a carriage return gets a leading apostrophe (<c>'</c>), so a spreadsheet opening the
/// file shows it as text and never evaluates it; numeric cells are written as numbers and never altered (a negative
/// number is data, not a formula).
/// </summary>
public static class CsvText
{
    private static readonly char[] InjectionLeads = ['=', '+', '-', '@', '\t', '\r'];

    /// <summary>The whole table as CSV text, header first.</summary>
    public static string Write(ReportTable table)
    {
        ArgumentNullException.ThrowIfNull(table);
        var sb = new StringBuilder();
        AppendLine(sb, table.Columns.Select(c => Quote(c.Name)));
        foreach (var row in table.Rows)
        {
            AppendLine(sb, row.Select((cell, i) => Quote(Format(cell, table.Columns[i].Kind))));
        }

        return sb.ToString();
    }

    /// <summary>A cell's CSV text (before quoting), with text neutralised.</summary>
    public static string Format(object? cell, CellKind kind) => cell switch
    {
        null => string.Empty,
        string s => Neutralise(s),
        double d when double.IsNaN(d) || double.IsInfinity(d) => string.Empty,
        double d => d.ToString("R", CultureInfo.InvariantCulture),
        int i => i.ToString(CultureInfo.InvariantCulture),
        long l => l.ToString(CultureInfo.InvariantCulture),
        bool b => b ? "true" : "false",
        DateTime t => t.ToString(t.TimeOfDay == TimeSpan.Zero && kind != CellKind.DateTime ? "yyyy-MM-dd" : "yyyy-MM-ddTHH:mm:ss", CultureInfo.InvariantCulture),
        _ => throw new ArgumentException($"Unsupported cell type {cell.GetType().Name}.", nameof(cell)),
    };

    /// <summary>Prefixes an apostrophe to text a spreadsheet would read as a formula.</summary>
    public static string Neutralise(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        return text.Length > 0 && Array.IndexOf(InjectionLeads, text[0]) >= 0 ? "'" + text : text;
    }

    private static string Quote(string field) =>
        field.AsSpan().IndexOfAny(",\"\r\n") >= 0 ? "\"" + field.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"" : field;

    private static void AppendLine(StringBuilder sb, IEnumerable<string> fields)
    {
        sb.AppendJoin(',', fields);
        sb.Append("\r\n");
    }
}
