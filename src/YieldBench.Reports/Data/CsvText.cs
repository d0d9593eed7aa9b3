using System.Globalization;
using System.Text;
using YieldBench.Reports.Output;
using YieldBench.Reports.Tables;

namespace YieldBench.Reports.Data;

/// <summary>
/// Writes report tables as CSV: RFC 4180 quoting, CRLF line ends, UTF-8 without byte-order mark, invariant culture,
/// numbers at the precision their column states (<see cref="ReportColumn.CsvDecimals"/>: °Brix 2 decimals, factors 4,
/// % v/v 2 …; a column without one in round-trip precision). Formula-injection rule: a TEXT cell whose first character is <c>=</c>, <c>+</c>,
/// <c>-</c>, <c>@</c>, a tab or a carriage return gets a leading apostrophe (<c>'</c>), so a spreadsheet opening the
/// file shows it as text and never evaluates it; numeric cells are written as numbers and never altered (a negative
/// number is data, not a formula).
/// </summary>
public static class CsvText
{
    private static readonly char[] InjectionLeads = ['=', '+', '-', '@', '\t', '\r'];
    private static readonly System.Buffers.SearchValues<char> NeedsQuotes = System.Buffers.SearchValues.Create(",\"\r\n");
    private static readonly UTF8Encoding Utf8NoBom = new(encoderShouldEmitUTF8Identifier: false);

    /// <summary>The whole table as CSV text, header first (the same characters <see cref="Write(ReportTable, TextWriter)"/> writes).</summary>
    public static string Write(ReportTable table)
    {
        ArgumentNullException.ThrowIfNull(table);
        using var writer = new StringWriter(CultureInfo.InvariantCulture);
        Write(table, writer);
        return writer.ToString();
    }

    /// <summary>
    /// Streams the table as CSV to <paramref name="writer"/>, header first, cell by cell: no line or file is built as
    /// a string, so a 100,000-row table costs its bytes and not a copy of itself.
    /// </summary>
    public static void Write(ReportTable table, TextWriter writer)
    {
        ArgumentNullException.ThrowIfNull(table);
        ArgumentNullException.ThrowIfNull(writer);
        var columns = table.Columns;
        var kinds = new CellKind[columns.Count];
        var formats = new string?[columns.Count];
        for (int i = 0; i < columns.Count; i++)
        {
            formats[i] = columns[i].CsvDecimals is { } d ? "F" + d.ToString(CultureInfo.InvariantCulture) : null;
            if (i > 0)
            {
                writer.Write(',');
            }

            WriteField(writer, columns[i].Name);
            kinds[i] = columns[i].Kind;
        }

        writer.Write("\r\n");
        Span<char> buffer = stackalloc char[64];
        for (int r = 0; r < table.RowCount; r++)
        {
            for (int i = 0; i < kinds.Length; i++)
            {
                if (i > 0)
                {
                    writer.Write(',');
                }

                WriteCell(writer, table.Cell(r, i), kinds[i], formats[i], buffer);
            }

            writer.Write("\r\n");
        }
    }

    /// <summary>
    /// Writes the table as a CSV file (UTF-8 without byte-order mark), streamed through a buffer into a temporary
    /// file that then replaces <paramref name="path"/> (<see cref="AtomicFile"/>). The bytes are those of
    /// <see cref="Write(ReportTable)"/> encoded as UTF-8.
    /// </summary>
    public static void WriteFile(ReportTable table, string path)
    {
        ArgumentNullException.ThrowIfNull(table);
        ArgumentNullException.ThrowIfNull(path);
        WriteFile(path, writer => Write(table, writer));
    }

    /// <summary>Streams <paramref name="write"/>'s text into <paramref name="path"/> atomically, as UTF-8 without byte-order mark.</summary>
    public static void WriteFile(string path, Action<TextWriter> write)
    {
        ArgumentNullException.ThrowIfNull(path);
        ArgumentNullException.ThrowIfNull(write);
        AtomicFile.Write(path, stream =>
        {
            using var writer = new StreamWriter(stream, Utf8NoBom, bufferSize: 1 << 16, leaveOpen: true);
            write(writer);
        });
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
        DateTime t => t.ToString(DateFormat(t, kind), CultureInfo.InvariantCulture),
        _ => throw new ArgumentException($"Unsupported cell type {cell.GetType().Name}.", nameof(cell)),
    };

    /// <summary>Prefixes an apostrophe to text a spreadsheet would read as a formula.</summary>
    public static string Neutralise(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        return NeedsApostrophe(text) ? "'" + text : text;
    }

    private static bool NeedsApostrophe(string text) => text.Length > 0 && Array.IndexOf(InjectionLeads, text[0]) >= 0;

    private static string DateFormat(DateTime t, CellKind kind) =>
        t.TimeOfDay == TimeSpan.Zero && kind != CellKind.DateTime ? "yyyy-MM-dd" : "yyyy-MM-ddTHH:mm:ss";

    /// <summary>One cell as <see cref="Format"/> gives it, quoted as <see cref="WriteField"/> does, without building a string.</summary>
    private static void WriteCell(TextWriter writer, object? cell, CellKind kind, string? fixedFormat, Span<char> buffer)
    {
        int n;
        switch (cell)
        {
            case null:
                return;
            case string s:
                WriteText(writer, s);
                return;
            case double d when double.IsNaN(d) || double.IsInfinity(d):
                return;
            case double d:
                // At a fixed precision the value is rounded first, and a negative zero written as 0.
                double v = fixedFormat is null ? d : Math.Round(d, fixedFormat[1] - '0', MidpointRounding.AwayFromZero) + 0.0;
                if (!v.TryFormat(buffer, out n, fixedFormat ?? "R", CultureInfo.InvariantCulture))
                {
                    WriteField(writer, v.ToString(fixedFormat ?? "R", CultureInfo.InvariantCulture));
                    return;
                }

                break;
            case int i:
                i.TryFormat(buffer, out n, default, CultureInfo.InvariantCulture);
                break;
            case long l:
                l.TryFormat(buffer, out n, default, CultureInfo.InvariantCulture);
                break;
            case bool b:
                writer.Write(b ? "true" : "false");
                return;
            case DateTime t:
                t.TryFormat(buffer, out n, DateFormat(t, kind), CultureInfo.InvariantCulture);
                break;
            default:
                throw new ArgumentException($"Unsupported cell type {cell.GetType().Name}.", nameof(cell));
        }

        // Invariant numbers and ISO dates never hold a comma, quote or line break; checked anyway, as for any field.
        var text = buffer[..n];
        if (text.IndexOfAny(NeedsQuotes) >= 0)
        {
            WriteField(writer, text.ToString());
        }
        else
        {
            writer.Write(text);
        }
    }

    /// <summary>A text cell: neutralised (leading apostrophe) and quoted when it holds a comma, quote or line break.</summary>
    private static void WriteText(TextWriter writer, string text)
    {
        bool apostrophe = NeedsApostrophe(text);
        if (text.AsSpan().IndexOfAny(NeedsQuotes) < 0)
        {
            if (apostrophe)
            {
                writer.Write('\'');
            }

            writer.Write(text);
            return;
        }

        writer.Write('"');
        if (apostrophe)
        {
            writer.Write('\'');
        }

        WriteDoublingQuotes(writer, text);
        writer.Write('"');
    }

    /// <summary>A field as RFC 4180 wants it: as it is, or in quotes with inner quotes doubled when it holds a comma, quote or line break.</summary>
    private static void WriteField(TextWriter writer, string field)
    {
        if (field.AsSpan().IndexOfAny(NeedsQuotes) < 0)
        {
            writer.Write(field);
            return;
        }

        writer.Write('"');
        WriteDoublingQuotes(writer, field);
        writer.Write('"');
    }

    private static void WriteDoublingQuotes(TextWriter writer, string text)
    {
        var rest = text.AsSpan();
        int q;
        while ((q = rest.IndexOf('"')) >= 0)
        {
            writer.Write(rest[..(q + 1)]);
            writer.Write('"');
            rest = rest[(q + 1)..];
        }

        writer.Write(rest);
    }
}
