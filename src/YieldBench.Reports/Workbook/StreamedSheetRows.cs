using System.Buffers;
using System.Globalization;
using System.Text;
using System.Xml;
using System.Xml.Linq;
using YieldBench.Reports.Tables;

namespace YieldBench.Reports.Workbook;

/// <summary>The row markup a streamed sheet writes (see the other part of this class).</summary>
internal static partial class StreamedSheet
{
    /// <summary>
    /// Rows of a streamed table as UTF-8 markup, composed in a reusable buffer. Numbers are written in round-trip
    /// form, dates as their serial numbers, text (and yes/no for booleans) as inline strings with <c>&amp;</c>,
    /// <c>&lt;</c>, <c>&gt;</c> and carriage returns escaped, the characters XML cannot carry removed and whitespace
    /// marked as meaningful where it would otherwise be trimmed; an empty value (or empty text) gives a cell only
    /// when it has a style, as ClosedXML writes it.
    /// </summary>
    internal sealed class RowMarkup
    {
        /// <summary>Buffered bytes at which the caller should write them out.</summary>
        public const int FlushBytes = 1 << 16;

        private static readonly SearchValues<char> Escaped = SearchValues.Create("&<>\r");
        private static readonly SearchValues<char> Breaks = SearchValues.Create("\t\n\r");
        private static readonly SearchValues<char> EscapedInAttributes = SearchValues.Create("&<>\"\t\n\r");
        private static readonly UTF8Encoding Utf8 = new(encoderShouldEmitUTF8Identifier: false, throwOnInvalidBytes: true);

        private readonly byte[] rowOpen;
        private readonly byte[] rowClose;
        private readonly byte[] cellClose;
        private readonly byte[] valueOpen;
        private readonly byte[] valueClose;
        private readonly byte[] textOpen;
        private readonly byte[] textOpenPreserve;
        private readonly byte[] textClose;
        private readonly byte[][] cellStarts;
        private readonly byte[] rowDigits = new byte[16];
        private int rowDigitCount;
        private byte[] buffer = new byte[FlushBytes + 4096];
        private int length;

        /// <param name="prefix">Prefix of the SpreadsheetML namespace where the rows go (empty for the default namespace).</param>
        /// <param name="firstColumn">1-based first column of the table.</param>
        /// <param name="columns">Number of columns.</param>
        public RowMarkup(string prefix, int firstColumn, int columns)
        {
            ArgumentNullException.ThrowIfNull(prefix);
            string p = prefix.Length == 0 ? string.Empty : prefix + ":";
            rowOpen = Utf8.GetBytes("<" + p + "row r=\"");
            rowClose = Utf8.GetBytes("</" + p + "row>");
            cellClose = Utf8.GetBytes("</" + p + "c>");
            valueOpen = Utf8.GetBytes("<" + p + "v>");
            valueClose = Utf8.GetBytes("</" + p + "v>");
            textOpen = Utf8.GetBytes("<" + p + "is><" + p + "t>");
            textOpenPreserve = Utf8.GetBytes("<" + p + "is><" + p + "t xml:space=\"preserve\">");
            textClose = Utf8.GetBytes("</" + p + "t></" + p + "is>");
            cellStarts = Enumerable.Range(firstColumn, columns).Select(c => Utf8.GetBytes("<" + p + "c r=\"" + WorkbookWriter.ColumnLetter(c))).ToArray();
        }

        /// <summary>Bytes composed and not yet written out.</summary>
        public int Length => length;

        /// <summary>A template's row attributes and cell styles as the markup they become.</summary>
        public PreparedTemplate Prepare(Template template)
        {
            ArgumentNullException.ThrowIfNull(template);
            var attributes = new StringBuilder();
            // A row's height is its own (given per row), never the template row's.
            foreach (var (name, value) in template.RowAttributes.Where(a => a.Name is not ("ht" or "customHeight")))
            {
                attributes.Append(' ').Append(name).Append("=\"").Append(Escape(value, EscapedInAttributes)).Append('"');
            }

            // Style 0 is every cell's default, so it is left out (ClosedXML writes it; the meaning is the same).
            bool[] styled = template.Styles.Select(s => s is not null && s != "0").ToArray();
            return new PreparedTemplate(
                Utf8.GetBytes(attributes.ToString()),
                template.Styles.Select((s, c) => Utf8.GetBytes(styled[c] ? "\" s=\"" + s + "\"" : "\"")).ToArray(),
                styled);
        }

        /// <summary>Adds one row.</summary>
        public void Row(int rowNumber, PreparedTemplate template, ReportTable table, int row, double? height = null)
        {
            ArgumentNullException.ThrowIfNull(template);
            ArgumentNullException.ThrowIfNull(table);
            // The row number, which every cell's reference repeats, is formatted once.
            Span<char> digits = stackalloc char[16];
            rowNumber.TryFormat(digits, out rowDigitCount, default, CultureInfo.InvariantCulture);
            for (int i = 0; i < rowDigitCount; i++)
            {
                rowDigits[i] = (byte)digits[i];
            }

            Append(rowOpen);
            Append(rowDigits.AsSpan(0, rowDigitCount));
            Append((byte)'"');
            Append(template.RowAttributes);
            if (height is { } h)
            {
                Append(" ht=\""u8);
                Format(h);
                Append("\" customHeight=\"1\""u8);
            }

            Append((byte)'>');
            for (int c = 0; c < table.Columns.Count; c++)
            {
                Cell(c, template, table.Cell(row, c));
            }

            Append(rowClose);
        }

        /// <summary>Writes the composed bytes to <paramref name="stream"/> and starts again.</summary>
        public void WriteTo(Stream stream)
        {
            ArgumentNullException.ThrowIfNull(stream);
            stream.Write(buffer, 0, length);
            length = 0;
        }

        private static string Escape(string value, SearchValues<char> special)
        {
            if (value.AsSpan().IndexOfAny(special) < 0)
            {
                return value;
            }

            var sb = new StringBuilder(value.Length + 16);
            foreach (char ch in value)
            {
                sb.Append(ch switch
                {
                    '&' => "&amp;",
                    '<' => "&lt;",
                    '>' => "&gt;",
                    '"' => "&quot;",
                    '\t' => "&#x9;",
                    '\n' => "&#xA;",
                    '\r' => "&#xD;",
                    _ => ch.ToString(),
                });
            }

            return sb.ToString();
        }

        private void Cell(int column, PreparedTemplate template, object? value)
        {
            switch (value)
            {
                case null:
                case double d when !double.IsFinite(d):
                    if (template.Styled[column])
                    {
                        Start(column, template);
                        Append("/>"u8);
                    }

                    return;
                case string s:
                    // Empty text is an empty cell, as ClosedXML leaves it (after the characters XML cannot carry go).
                    string safe = SheetLayout.XmlSafe(s);
                    if (safe.Length > 0)
                    {
                        Text(column, template, safe);
                    }
                    else
                    {
                        Cell(column, template, null);
                    }

                    return;
                case bool b:
                    Text(column, template, b ? "yes" : "no");
                    return;
                case double d:
                    Start(column, template);
                    Append((byte)'>');
                    Append(valueOpen);
                    Format(d);
                    Append(valueClose);
                    Append(cellClose);
                    return;
                case int i:
                    Start(column, template);
                    Append((byte)'>');
                    Append(valueOpen);
                    Format(i);
                    Append(valueClose);
                    Append(cellClose);
                    return;
                case long l:
                    Start(column, template);
                    Append((byte)'>');
                    Append(valueOpen);
                    Format(l);
                    Append(valueClose);
                    Append(cellClose);
                    return;
                case DateTime t:
                    // A date is its serial number; the column's date format (in the template's style) shows it.
                    Start(column, template);
                    Append((byte)'>');
                    Append(valueOpen);
                    Format(t.ToOADate());
                    Append(valueClose);
                    Append(cellClose);
                    return;
                default:
                    throw new InvalidOperationException($"Unsupported cell type {value.GetType().Name}.");
            }
        }

        private void Text(int column, PreparedTemplate template, string text)
        {
            // Inline strings are never read as formulas, whatever their first character.
            Start(column, template);
            Append(" t=\"inlineStr\">"u8);

            // Spreadsheet applications trim text whose whitespace is not marked as meaningful.
            bool preserve = char.IsWhiteSpace(text[0]) || char.IsWhiteSpace(text[^1])
                || text.AsSpan().IndexOfAny(Breaks) >= 0 || text.Contains("  ", StringComparison.Ordinal);
            Append(preserve ? textOpenPreserve : textOpen);
            var rest = text.AsSpan();
            while (!rest.IsEmpty)
            {
                int special = rest.IndexOfAny(Escaped);
                Append(special < 0 ? rest : rest[..special]);
                if (special < 0)
                {
                    break;
                }

                Append(rest[special] switch
                {
                    '&' => "&amp;"u8,
                    '<' => "&lt;"u8,
                    '>' => "&gt;"u8,

                    // A bare carriage return would be read back as a line feed.
                    _ => "&#xD;"u8,
                });
                rest = rest[(special + 1)..];
            }

            Append(textClose);
            Append(cellClose);
        }

        private void Start(int column, PreparedTemplate template)
        {
            Append(cellStarts[column]);
            Append(rowDigits.AsSpan(0, rowDigitCount));
            Append(template.AfterReference[column]);
        }

        private void Format<T>(T value)
            where T : ISpanFormattable
        {
            // "R": the shortest text that reads back as the same double; integers as they are. Formatted as characters
            // (numbers are ASCII, so each is one byte): the runtime's character formatting is already compiled for
            // speed by the time a report is written, its UTF-8 formatting would start out unoptimised.
            ReadOnlySpan<char> format = typeof(T) == typeof(double) ? "R" : default;
            Span<char> text = stackalloc char[40];
            if (!value.TryFormat(text, out int written, format, CultureInfo.InvariantCulture))
            {
                throw new InvalidOperationException($"A number took more than {text.Length} characters.");
            }

            if (length + written > buffer.Length)
            {
                Grow(written);
            }

            var into = buffer.AsSpan(length, written);
            for (int i = 0; i < written; i++)
            {
                into[i] = (byte)text[i];
            }

            length += written;
        }

        private void Append(byte b)
        {
            if (length == buffer.Length)
            {
                Grow(1);
            }

            buffer[length++] = b;
        }

        private void Append(ReadOnlySpan<byte> bytes)
        {
            if (length + bytes.Length > buffer.Length)
            {
                Grow(bytes.Length);
            }

            bytes.CopyTo(buffer.AsSpan(length));
            length += bytes.Length;
        }

        private void Append(ReadOnlySpan<char> text)
        {
            int most = Utf8.GetMaxByteCount(text.Length);
            if (length + most > buffer.Length)
            {
                Grow(most);
            }

            length += Utf8.GetBytes(text, buffer.AsSpan(length));
        }

        private void Grow(int atLeast) => Array.Resize(ref buffer, Math.Max(buffer.Length * 2, length + atLeast));
    }

    /// <summary>A template row ready to stamp onto rows: its attributes and each column's style, as UTF-8 markup.</summary>
    /// <param name="RowAttributes">The row attributes after the number, each with its leading space.</param>
    /// <param name="AfterReference">What follows each column's cell reference: its closing quote and <c> s="…"</c> unless the style is the default.</param>
    /// <param name="Styled">Whether each column's style is other than the default (a cell without a value is written only then).</param>
    internal sealed record PreparedTemplate(byte[] RowAttributes, byte[][] AfterReference, bool[] Styled);
}
