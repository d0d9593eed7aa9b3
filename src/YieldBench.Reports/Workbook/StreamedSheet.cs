using System.Buffers;
using System.Globalization;
using System.Text;
using System.Xml;
using System.Xml.Linq;

namespace YieldBench.Reports.Workbook;

/// <summary>
/// Writes a worksheet part whose long tables ClosedXML laid out only as a heading and two template rows: the part is
/// copied node by node through an <see cref="XmlWriter"/>, the template rows give each column's cell style (plain and
/// highlighted) and are replaced by the table's rows, composed as UTF-8 markup (<see cref="RowMarkup"/>) straight into
/// the output, and the sheet's dimension is widened to cover them. Rows ClosedXML wrote before and after a table are
/// kept where they are.
/// </summary>
internal static partial class StreamedSheet
{
    /// <summary>The SpreadsheetML main namespace.</summary>
    public const string MainNamespace = "http://schemas.openxmlformats.org/spreadsheetml/2006/main";

    private static readonly XmlReaderSettings ReaderSettings = new()
    {
        DtdProcessing = DtdProcessing.Prohibit,
        XmlResolver = null,
        CloseInput = false,
    };

    private static readonly XmlWriterSettings WriterSettings = new()
    {
        Encoding = new UTF8Encoding(encoderShouldEmitUTF8Identifier: false),
        CloseOutput = false,

        // Carriage returns in text are written as character references, so text reads back exactly as it was.
        NewLineHandling = NewLineHandling.Entitize,
    };

    /// <summary>
    /// Copies the worksheet XML <paramref name="laidOut"/> to <paramref name="output"/> with the rows of
    /// <paramref name="bodies"/> (all on this sheet) in place of their template rows.
    /// </summary>
    /// <exception cref="InvalidOperationException">ClosedXML wrote a row inside a streamed table's rows, or a template row holds a cell outside its table.</exception>
    public static void Write(Stream laidOut, Stream output, string sheetName, IReadOnlyList<DeferredBody> bodies)
    {
        ArgumentNullException.ThrowIfNull(laidOut);
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(sheetName);
        ArgumentNullException.ThrowIfNull(bodies);
        using var reader = XmlReader.Create(laidOut, ReaderSettings);
        using var writer = XmlWriter.Create(output, WriterSettings);
        var splice = new Splice(writer, output, sheetName, bodies);
        reader.Read();
        while (!reader.EOF)
        {
            if (reader.NodeType == XmlNodeType.XmlDeclaration)
            {
                writer.WriteStartDocument(string.Equals(reader.GetAttribute("standalone"), "yes", StringComparison.Ordinal));
                reader.Read();
            }
            else if (IsMain(reader, "dimension", depth: 1))
            {
                splice.WriteDimension(reader);
                reader.Skip();
            }
            else if (IsMain(reader, "sheetData", depth: 1))
            {
                splice.CopySheetData(reader);
            }
            else
            {
                CopyNode(reader, writer);
                reader.Read();
            }
        }

        splice.CheckAllWritten();
    }

    /// <summary>A cell reference such as <c>AB12</c> as 1-based column and row.</summary>
    public static (int Column, int Row) ParseReference(string reference)
    {
        ArgumentNullException.ThrowIfNull(reference);
        int i = 0, column = 0, row = 0;
        while (i < reference.Length && reference[i] is >= 'A' and <= 'Z')
        {
            column = checked((column * 26) + (reference[i] - 'A' + 1));
            i++;
        }

        int digits = i;
        while (i < reference.Length && reference[i] is >= '0' and <= '9')
        {
            row = checked((row * 10) + (reference[i] - '0'));
            i++;
        }

        if (column == 0 || i == digits || i != reference.Length || row == 0)
        {
            throw new FormatException($"'{reference}' is not a cell reference.");
        }

        return (column, row);
    }

    private static bool IsMain(XmlReader reader, string localName, int depth) =>
        reader.NodeType == XmlNodeType.Element && reader.Depth == depth
        && string.Equals(reader.LocalName, localName, StringComparison.Ordinal)
        && string.Equals(reader.NamespaceURI, MainNamespace, StringComparison.Ordinal);

    /// <summary>Writes the node <paramref name="reader"/> is on (not its subtree) to <paramref name="writer"/>; the reader stays on it.</summary>
    internal static void CopyNode(XmlReader reader, XmlWriter writer)
    {
        switch (reader.NodeType)
        {
            case XmlNodeType.Element:
                writer.WriteStartElement(reader.Prefix, reader.LocalName, reader.NamespaceURI);
                writer.WriteAttributes(reader, defattr: true);
                if (reader.IsEmptyElement)
                {
                    writer.WriteEndElement();
                }

                break;
            case XmlNodeType.EndElement:
                writer.WriteFullEndElement();
                break;
            case XmlNodeType.Text:
                writer.WriteString(reader.Value);
                break;
            case XmlNodeType.Whitespace:
            case XmlNodeType.SignificantWhitespace:
                writer.WriteWhitespace(reader.Value);
                break;
            case XmlNodeType.CDATA:
                writer.WriteCData(reader.Value);
                break;
            case XmlNodeType.Comment:
                writer.WriteComment(reader.Value);
                break;
            case XmlNodeType.ProcessingInstruction:
                writer.WriteProcessingInstruction(reader.Name, reader.Value);
                break;
            default:
                throw new InvalidOperationException($"Unexpected {reader.NodeType} node in a worksheet part.");
        }
    }

    /// <summary>The styles a template row gives each column of its table, and the row's own attributes.</summary>
    /// <param name="Styles">Style index of each column's cell (null: none).</param>
    /// <param name="RowAttributes">The row's attributes other than its number, by qualified name (prefixes are in scope where the rows go).</param>
    internal sealed record Template(string?[] Styles, IReadOnlyList<(string Name, string Value)> RowAttributes)
    {
        public static Template Default(DeferredBody body) => new(new string?[body.Table.Columns.Count], []);

        public static Template Read(XmlReader reader, DeferredBody body, string sheetName)
        {
            var attributes = new List<(string, string)>();
            if (reader.MoveToFirstAttribute())
            {
                do
                {
                    if (reader.Name != "r")
                    {
                        attributes.Add((reader.Name, reader.Value));
                    }
                }
                while (reader.MoveToNextAttribute());

                reader.MoveToElement();
            }

            var row = (XElement)XNode.ReadFrom(reader);
            var styles = new string?[body.Table.Columns.Count];
            foreach (var cell in row.Elements(XName.Get("c", MainNamespace)))
            {
                string reference = (string?)cell.Attribute("r")
                    ?? throw new InvalidOperationException($"Sheet '{sheetName}': a cell of template row {(string?)row.Attribute("r")} has no reference.");
                var (column, _) = ParseReference(reference);
                if (column < body.FirstColumn || column > body.LastColumn)
                {
                    throw new InvalidOperationException(
                        $"Sheet '{sheetName}': cell {reference} lies beside a streamed table (columns {WorkbookWriter.ColumnLetter(body.FirstColumn)}–{WorkbookWriter.ColumnLetter(body.LastColumn)}); nothing may be written there.");
                }

                string? style = (string?)cell.Attribute("s");
                if (style is not null && (style.Length == 0 || !style.All(char.IsAsciiDigit)))
                {
                    throw new InvalidOperationException($"Sheet '{sheetName}': cell {reference} has the style '{style}', which is not a style index.");
                }

                styles[column - body.FirstColumn] = style;
            }

            return new Template(styles, attributes);
        }
    }

    private sealed class Splice(XmlWriter writer, Stream output, string sheetName, IReadOnlyList<DeferredBody> bodies)
    {
        private readonly Queue<DeferredBody> pending = new(bodies.OrderBy(b => b.FirstDataRow));
        private readonly List<DeferredBody> written = [];
        private Template? plain;
        private string prefix = string.Empty;

        public void WriteDimension(XmlReader reader)
        {
            string? existing = reader.GetAttribute("ref");
            int minColumn = int.MaxValue, minRow = int.MaxValue, maxColumn = 0, maxRow = 0;
            void Include(int column, int row)
            {
                minColumn = Math.Min(minColumn, column);
                maxColumn = Math.Max(maxColumn, column);
                minRow = Math.Min(minRow, row);
                maxRow = Math.Max(maxRow, row);
            }

            if (!string.IsNullOrEmpty(existing))
            {
                foreach (var corner in existing.Split(':'))
                {
                    var (column, row) = ParseReference(corner);
                    Include(column, row);
                }
            }

            foreach (var body in bodies)
            {
                Include(body.FirstColumn, body.FirstDataRow);
                Include(body.LastColumn, body.LastDataRow);
            }

            writer.WriteStartElement(reader.Prefix, reader.LocalName, reader.NamespaceURI);
            if (reader.MoveToFirstAttribute())
            {
                do
                {
                    if (reader.Name == "ref")
                    {
                        string from = WorkbookWriter.ColumnLetter(minColumn) + minRow.ToString(CultureInfo.InvariantCulture);
                        string to = WorkbookWriter.ColumnLetter(maxColumn) + maxRow.ToString(CultureInfo.InvariantCulture);
                        writer.WriteAttributeString("ref", from == to ? from : from + ":" + to);
                    }
                    else
                    {
                        writer.WriteAttributeString(reader.Prefix, reader.LocalName, reader.NamespaceURI, reader.Value);
                    }
                }
                while (reader.MoveToNextAttribute());

                reader.MoveToElement();
            }

            writer.WriteEndElement();
        }

        // The reader is on <sheetData>; leaves it after </sheetData>.
        public void CopySheetData(XmlReader reader)
        {
            int depth = reader.Depth;
            writer.WriteStartElement(reader.Prefix, reader.LocalName, reader.NamespaceURI);
            prefix = reader.Prefix;
            if (prefix.Length > 0 && reader.GetAttribute("xmlns") is null)
            {
                // The streamed rows use unprefixed names under a default namespace declared here: the prefix on every
                // element was a fifth of a large sheet's bytes. The rows ClosedXML wrote keep theirs.
                writer.WriteAttributeString("xmlns", MainNamespace);
                prefix = string.Empty;
            }

            writer.WriteAttributes(reader, defattr: true);
            bool empty = reader.IsEmptyElement;
            reader.Read();
            while (!empty && !(reader.NodeType == XmlNodeType.EndElement && reader.Depth == depth))
            {
                if (IsMain(reader, "row", depth + 1))
                {
                    CopyRow(reader);
                }
                else
                {
                    CopyNode(reader, writer);
                    reader.Read();
                }
            }

            while (pending.Count > 0)
            {
                Emit(pending.Dequeue(), plain, null);
                plain = null;
            }

            writer.WriteFullEndElement();
            if (!empty)
            {
                reader.Read();
            }
        }

        public void CheckAllWritten()
        {
            if (pending.Count > 0 || written.Count != bodies.Count)
            {
                throw new InvalidOperationException($"Sheet '{sheetName}' has no sheet data to put its streamed tables in.");
            }
        }

        // The reader is on a <row>; leaves it after the row.
        private void CopyRow(XmlReader reader)
        {
            string number = reader.GetAttribute("r") ?? throw new InvalidOperationException($"Sheet '{sheetName}': a row has no row number.");
            int r = int.Parse(number, NumberStyles.None, CultureInfo.InvariantCulture);

            // Tables whose template rows ClosedXML left out (all cells plain and empty) come before this row.
            while (pending.TryPeek(out var head) && r > head.HighlightedTemplateRow)
            {
                Emit(pending.Dequeue(), plain, null);
                plain = null;
            }

            if (pending.TryPeek(out var next))
            {
                if (r == next.FirstDataRow)
                {
                    plain = Template.Read(reader, next, sheetName);
                    return;
                }

                if (r == next.HighlightedTemplateRow)
                {
                    var highlighted = Template.Read(reader, next, sheetName);
                    Emit(pending.Dequeue(), plain, highlighted);
                    plain = null;
                    return;
                }
            }

            var inside = written.FirstOrDefault(b => r >= b.FirstDataRow && r <= b.LastDataRow);
            if (inside is not null)
            {
                throw new InvalidOperationException(
                    $"Sheet '{sheetName}': row {r} lies inside the streamed table at rows {inside.FirstDataRow}–{inside.LastDataRow}; nothing may be written there.");
            }

            writer.WriteNode(reader, defattr: true);
        }

        private void Emit(DeferredBody body, Template? plainTemplate, Template? highlightedTemplate)
        {
            // The rows, millions of cells in a large review, go to the output as UTF-8 composed here: an XmlWriter's
            // per-node checks and character conversion cost more than all the rest of the workbook. The writer first
            // closes any start tag it still holds open and hands over what it has buffered.
            writer.WriteString(string.Empty);
            writer.Flush();
            var table = body.Table;
            var rows = new RowMarkup(prefix, body.FirstColumn, table.Columns.Count);
            var plainRow = rows.Prepare(plainTemplate ?? Template.Default(body));
            var highlightedRow = rows.Prepare(highlightedTemplate ?? Template.Default(body));
            var highlighted = table.Highlighted;
            for (int i = 0; i < table.RowCount; i++)
            {
                rows.Row(body.FirstDataRow + i, highlighted[i] ? highlightedRow : plainRow, table, i, body.RowHeights?[i]);
                if (rows.Length >= RowMarkup.FlushBytes)
                {
                    rows.WriteTo(output);
                }
            }

            rows.WriteTo(output);
            written.Add(body);
        }
    }
}
