using System.Globalization;
using System.IO.Compression;
using System.Xml;

namespace YieldBench.Intake;

/// <summary>
/// Reads an OpenDocument spreadsheet (.ods, as LibreOffice and other office suites save it) into raw sheets: a zip
/// whose <c>content.xml</c> holds each sheet as a <c>table:table</c> of rows and cells (OASIS OpenDocument 1.2, part 1,
/// section 9: tables). The zip is checked from its directory before anything is inflated, and the XML is streamed.
/// Rows and cells repeated by <c>number-rows-repeated</c> and <c>number-columns-repeated</c> are written out only
/// where content follows them (a saved sheet repeats its empty tail a million times). Sheets hidden by their table
/// style (<c>table:display="false"</c>) are marked hidden.
/// </summary>
internal static class OdsSource
{
    private const string TableNs = "urn:oasis:names:tc:opendocument:xmlns:table:1.0";
    private const string OfficeNs = "urn:oasis:names:tc:opendocument:xmlns:office:1.0";
    private const string StyleNs = "urn:oasis:names:tc:opendocument:xmlns:style:1.0";
    private const string TextNs = "urn:oasis:names:tc:opendocument:xmlns:text:1.0";
    private const string CalcExtNs = "urn:org:documentfoundation:names:experimental:calc:xmlns:calcext:1.0";

    /// <summary>Columns a row may span (that of the largest spreadsheets); cells beyond are not read.</summary>
    private const int MaxColumns = WorkbookSource.MaxColumns;

    public static RawFile Read(string file, string fullPath, byte[] head, IntakeOptions options, IssueSink sink)
    {
        if (!WorkbookSource.StartsWith(head, WorkbookSource.ZipMagic))
        {
            sink.Error(file, null, null, null, null, IssueCodes.NotAWorkbook, IntakeMessages.NotAZip(".ods"));
            return SourceFiles.Refused;
        }

        if (!WorkbookSource.CheckZip(file, fullPath, ".ods", options, sink, "content.xml"))
        {
            return SourceFiles.Refused;
        }

        try
        {
            using var fs = SourceFiles.OpenShared(fullPath);
            using var zip = new ZipArchive(fs, ZipArchiveMode.Read);
            using var content = zip.GetEntry("content.xml")!.Open();
            using var xr = XmlReader.Create(content, WorkbookSource.SafeXml);
            return new RawFile(ReadSheets(xr, options), false);
        }
        catch (Exception ex) when (ex is XmlException or InvalidDataException or FormatException or OverflowException)
        {
            sink.Error(file, null, null, null, null, IssueCodes.CorruptWorkbook, IntakeMessages.CorruptWorkbook($"its content.xml is damaged: {ex.Message.TrimEnd('.')}"));
            return SourceFiles.Refused;
        }
    }

    private static List<RawSheet> ReadSheets(XmlReader xr, IntakeOptions options)
    {
        var hiddenStyles = new HashSet<string>(StringComparer.Ordinal);
        var sheets = new List<RawSheet>();
        string? styleName = null;
        while (xr.Read())
        {
            if (xr.NodeType != XmlNodeType.Element)
            {
                continue;
            }

            if (xr.LocalName == "style" && xr.NamespaceURI == StyleNs)
            {
                styleName = xr.GetAttribute("name", StyleNs);
            }
            else if (xr.LocalName == "table-properties" && xr.NamespaceURI == StyleNs && styleName is not null
                && xr.GetAttribute("display", TableNs) == "false")
            {
                hiddenStyles.Add(styleName);
            }
            else if (xr.LocalName == "table" && xr.NamespaceURI == TableNs)
            {
                string name = TextSettling.Settle(xr.GetAttribute("name", TableNs) ?? "", multiline: false, out _) is { Length: > 0 } n ? n : $"Sheet{sheets.Count + 1}";
                bool hidden = xr.GetAttribute("style-name", TableNs) is { } style && hiddenStyles.Contains(style);
                (List<object?[]> rows, bool tooMany) = ([], false);
                var spans = new List<CellSpan>();
                var hiddenColumns = new HashSet<int>();
                if (!xr.IsEmptyElement)
                {
                    using var table = xr.ReadSubtree();
                        (rows, tooMany) = ReadTable(table, options.MaxRows, spans, hiddenColumns);
                }

                var sheet = new RawSheet(name, rows, decimalComma: false) { TooManyRows = tooMany, Hidden = hidden };
                sheet.HiddenColumns.UnionWith(hiddenColumns);
                sheet.Merged.AddRange(spans);
                sheets.Add(sheet);
            }
        }

        return sheets;
    }

    /// <summary>
    /// The rows of one <c>table:table</c>, with empty repeats written out only where content follows; the blocks of
    /// merged cells (a cell spanning rows or columns) are added to <paramref name="spans"/>.
    /// </summary>
    private static (List<object?[]> Rows, bool TooMany) ReadTable(XmlReader xr, int maxRows, List<CellSpan> spans, HashSet<int> hiddenColumns)
    {
        var rowSpans = new List<(int Column, int Rows, int Columns)>();
        var rows = new List<object?[]>();
        long pendingBlank = 0;
        long declaredColumns = 0;
        xr.Read();
        while (xr.Read())
        {
            if (xr.NodeType != XmlNodeType.Element || xr.NamespaceURI != TableNs)
            {
                continue;
            }

            if (xr.LocalName == "table-column")
            {
                // Columns hidden in the sheet (table:visibility="collapse"), up to the widest sheet's width.
                long repeatColumns = Repeat(xr.GetAttribute("number-columns-repeated", TableNs));
                if (xr.GetAttribute("visibility", TableNs) is "collapse" or "filter")
                {
                    for (long i = declaredColumns; i < declaredColumns + Math.Min(repeatColumns, MaxColumns - declaredColumns); i++)
                    {
                        hiddenColumns.Add((int)i);
                    }
                }

                declaredColumns += Math.Min(repeatColumns, MaxColumns - declaredColumns);
                continue;
            }

            if (xr.LocalName == "table")
            {
                // A table inside a table (a sub-table) is not a sheet of lots: pass over it.
                xr.Skip();
                continue;
            }

            if (xr.LocalName != "table-row")
            {
                continue;
            }

            long repeat = Repeat(xr.GetAttribute("number-rows-repeated", TableNs));
            object?[] cells = [];
            rowSpans.Clear();
            if (!xr.IsEmptyElement)
            {
                using var row = xr.ReadSubtree();
                cells = ReadRow(row, rowSpans);
            }

            if (cells.Length == 0)
            {
                pendingBlank += repeat;
                continue;
            }

            if (rows.Count + pendingBlank + repeat > maxRows)
            {
                return (rows, true);
            }

            for (long i = 0; i < pendingBlank; i++)
            {
                rows.Add([]);
            }

            pendingBlank = 0;
            foreach (var (column, down, across) in rowSpans)
            {
                spans.Add(new CellSpan(rows.Count, column, rows.Count + down - 1, column + across - 1));
            }

            for (long i = 0; i < repeat; i++)
            {
                rows.Add(i == 0 ? cells : (object?[])cells.Clone());
            }
        }

        return (rows, false);
    }

    /// <summary>The cells of one row, up to its last cell with content; cells spanning others are added to <paramref name="spans"/>.</summary>
    private static object?[] ReadRow(XmlReader xr, List<(int Column, int Rows, int Columns)> spans)
    {
        var cells = new List<object?>();
        long pendingEmpty = 0;
        xr.Read();
        while (xr.Read())
        {
            if (xr.NodeType != XmlNodeType.Element || xr.NamespaceURI != TableNs || xr.LocalName is not ("table-cell" or "covered-table-cell"))
            {
                continue;
            }

            long repeat = Repeat(xr.GetAttribute("number-columns-repeated", TableNs));
            long down = Repeat(xr.GetAttribute("number-rows-spanned", TableNs));
            long across = Repeat(xr.GetAttribute("number-columns-spanned", TableNs));
            long column = cells.Count + pendingEmpty;
            object? value = xr.LocalName == "covered-table-cell" ? null : Cell(xr);
            if (value is not null && (down > 1 || across > 1) && column < MaxColumns)
            {
                spans.Add(((int)column, (int)Math.Min(down, int.MaxValue / 2), (int)Math.Min(across, MaxColumns)));
            }
            if (value is null)
            {
                pendingEmpty += repeat;
                continue;
            }

            for (long i = 0; i < pendingEmpty + repeat && cells.Count < MaxColumns; i++)
            {
                cells.Add(i < pendingEmpty ? null : value);
            }

            pendingEmpty = 0;
        }

        return [.. cells];
    }

    private static long Repeat(string? attribute) =>
        attribute is not null && long.TryParse(attribute, NumberStyles.None, CultureInfo.InvariantCulture, out long n) && n > 0 ? n : 1;

    /// <summary>
    /// One cell's value as the spreadsheet reader gives it for .xlsx: a double, a DateTime, a bool, text, a percentage as
    /// text with its % sign, an <see cref="ErrorCell"/>, a <see cref="FormulaCell"/> for a formula with no stored
    /// result, or null. The reader is left on the cell's element or, for a cell with text, past it.
    /// </summary>
    private static object? Cell(XmlReader xr)
    {
        string? type = xr.GetAttribute("value-type", OfficeNs);
        string? formula = xr.GetAttribute("formula", TableNs);
        bool error = xr.GetAttribute("value-type", CalcExtNs) == "error";
        string? number = xr.GetAttribute("value", OfficeNs);
        string? date = xr.GetAttribute("date-value", OfficeNs);
        string? time = xr.GetAttribute("time-value", OfficeNs);
        string? boolean = xr.GetAttribute("boolean-value", OfficeNs);
        string? stringValue = xr.GetAttribute("string-value", OfficeNs);
        string text = "";
        if (!xr.IsEmptyElement)
        {
            using var inner = xr.ReadSubtree();
            text = Text(inner);
        }

        if (error)
        {
            return new ErrorCell(text.Length > 0 ? text : "#ERROR");
        }

        switch (type)
        {
            case "float" or "currency" when number is not null:
                return double.Parse(number, NumberStyles.Float, CultureInfo.InvariantCulture);
            case "percentage" when number is not null:
                // Shown as 13.8 %: read what the user sees, as text with its %, as for a percent-formatted .xlsx cell.
                return Math.Round(double.Parse(number, NumberStyles.Float, CultureInfo.InvariantCulture) * 100, 10).ToString("R", CultureInfo.InvariantCulture) + "%";
            case "date" when date is not null:
                return DateTime.Parse(date, CultureInfo.InvariantCulture, DateTimeStyles.RoundtripKind);
            case "time" when time is not null:
                return DateTime.FromOADate(XmlConvert.ToTimeSpan(time).TotalDays);
            case "boolean" when boolean is not null:
                return boolean == "true";
            case "string":
                return stringValue ?? text;
            case null when formula is not null:
                return new FormulaCell(formula.StartsWith("of:=", StringComparison.Ordinal) ? formula[4..] : formula.TrimStart('='));
            default:
                return text.Length > 0 ? text : null;
        }
    }

    /// <summary>
    /// The text of a cell's paragraphs, one line each, with spaces, tabs and line breaks as written; a comment attached
    /// to the cell (<c>office:annotation</c>) is not part of it.
    /// </summary>
    private static string Text(XmlReader xr)
    {
        var lines = new List<string>();
        var line = new System.Text.StringBuilder();
        bool inParagraph = false;
        int skipDepth = -1;
        xr.Read();
        while (xr.Read())
        {
            if (skipDepth >= 0)
            {
                skipDepth = xr.NodeType == XmlNodeType.EndElement && xr.Depth == skipDepth ? -1 : skipDepth;
                continue;
            }

            if (xr.NodeType == XmlNodeType.Element && xr.NamespaceURI == OfficeNs && xr.LocalName == "annotation" && !xr.IsEmptyElement)
            {
                skipDepth = xr.Depth;
            }
            else if (xr.NodeType == XmlNodeType.Element && xr.NamespaceURI == TextNs)
            {
                switch (xr.LocalName)
                {
                    case "p" or "h":
                        inParagraph = true;
                        line.Clear();
                        break;
                    case "s":
                        line.Append(' ', (int)Math.Min(Repeat(xr.GetAttribute("c", TextNs)), 1000));
                        break;
                    case "tab":
                        line.Append('\t');
                        break;
                    case "line-break":
                        line.Append('\n');
                        break;
                }
            }
            else if (xr.NodeType is XmlNodeType.Text or XmlNodeType.SignificantWhitespace or XmlNodeType.Whitespace && inParagraph)
            {
                line.Append(xr.Value);
            }
            else if (xr.NodeType == XmlNodeType.EndElement && xr.NamespaceURI == TextNs && xr.LocalName is "p" or "h")
            {
                lines.Add(line.ToString());
                inParagraph = false;
            }
        }

        return string.Join('\n', lines);
    }
}
