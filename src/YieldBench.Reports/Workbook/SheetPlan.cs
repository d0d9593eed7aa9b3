using System.Globalization;
using ClosedXML.Excel;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Tables;

namespace YieldBench.Reports.Workbook;

/// <summary>
/// A sheet as a list of blocks (titles, paragraphs, label–value pairs, tables) that lays itself out: column widths from
/// the widest text each column shows (measured with the shipped font), paragraphs merged across the sheet's width and
/// wrapped, every wrapped row as tall as its lines, tables' headers frozen and filtered where they start the sheet, and
/// print setup (landscape, one page wide, header rows repeated, a print area of the most-read columns). Every table's
/// rows are streamed into the package (<see cref="StreamedTables"/>): one path, whatever the table's length.
/// </summary>
internal sealed class SheetPlan(string name)
{
    /// <summary>Widest a column is made, in width units (a wrapped text column wraps within it).</summary>
    public const double MaxColumnUnits = 60;

    /// <summary>Narrowest column, in width units.</summary>
    public const double MinColumnUnits = 5;

    /// <summary>Width of a column added beside narrow tables so a paragraph has room, in width units.</summary>
    public const double FillerColumnUnits = 10;

    /// <summary>Width a paragraph wraps within at least, px (about 100 characters).</summary>
    public const double ParagraphPixels = 760;

    /// <summary>Narrowest print area, px of column width: a landscape A4 page between its margins at 100 % (27.7 cm at 96 dpi is 1,047 px; column widths are reckoned at 8 px per unit and shown at up to 8.5).</summary>
    public const double MinPrintPixels = 1000;

    /// <summary>The sheet's default row height, points (20 px: pictures are stacked at a known number of rows apart).</summary>
    public const double DefaultRowHeight = 15;

    private readonly List<Block> blocks = [];

    /// <summary>The sheet's name.</summary>
    public string Name { get; } = name;

    /// <summary>Width a long text column wraps within, in width units.</summary>
    public double WrapUnits { get; init; } = MaxColumnUnits;

    /// <summary>Columns a print area keeps when the sheet's widest table is wider (null: every column).</summary>
    public int? PrintColumns { get; init; }

    /// <summary>A title line: bold, 14 pt.</summary>
    public SheetPlan Title(string text) => Add(new TextBlock(text, 14, Bold: true, Italic: false));

    /// <summary>A heading line: bold, 12 pt.</summary>
    public SheetPlan Heading(string text) => Add(new TextBlock(text, 12, Bold: true, Italic: false));

    /// <summary>A paragraph, wrapped across the sheet's width.</summary>
    public SheetPlan Text(string text, bool italic = false, bool bold = false) => Add(new TextBlock(text, TextMeasure.BodySize, bold, italic));

    /// <summary>Several paragraphs.</summary>
    public SheetPlan Texts(IEnumerable<string> texts)
    {
        foreach (string t in texts)
        {
            Text(t);
        }

        return this;
    }

    /// <summary>Label–value rows (label in the first column, value in the second; a number with its format).</summary>
    public SheetPlan Pairs(IEnumerable<(string Label, object? Value, string? Format)> pairs) => Add(new PairsBlock(pairs.ToArray()));

    /// <summary>
    /// A table: bold wrapped headings, its rows streamed into the package. <paramref name="freeze"/> freezes the rows
    /// down to its heading and adds filters (for a table that starts the sheet), and repeats the heading on every page.
    /// </summary>
    public SheetPlan Table(ReportTable table, bool freeze = false) => Add(new TableBlock(table, freeze));

    /// <summary>A table, or a line saying there is nothing when it has no rows.</summary>
    public SheetPlan TableOrNone(ReportTable table, string none) => table.RowCount == 0 ? Text(none, italic: true) : Table(table);

    /// <summary>An empty row.</summary>
    public SheetPlan Gap() => Add(new GapBlock());

    private SheetPlan Add(Block block)
    {
        blocks.Add(block);
        return this;
    }

    /// <summary>
    /// Writes the sheet into <paramref name="ws"/> from row 1, registers its tables' rows with
    /// <paramref name="streamed"/>, and returns the first row below the content (where pictures may go).
    /// </summary>
    public int Render(IXLWorksheet ws, StreamedTables streamed, TextMeasure measure)
    {
        ArgumentNullException.ThrowIfNull(ws);
        var widths = ColumnWidths(measure);
        if (blocks.OfType<TextBlock>().Any())
        {
            // Paragraphs wrap across at least ParagraphPixels: a sheet whose tables are narrower gets columns of
            // FillerColumnUnits beside them for its paragraphs, rather than paragraphs wrapped every few words.
            var more = new List<double>(widths);
            while (TextMeasure.TextPixels(more.Sum()) < ParagraphPixels)
            {
                more.Add(FillerColumnUnits);
            }

            widths = [.. more];
        }

        for (int c = 0; c < widths.Length; c++)
        {
            ws.Column(c + 1).Width = widths[c];
        }

        ws.RowHeight = DefaultRowHeight;
        int span = ParagraphSpan(widths);
        double paragraphPx = TextMeasure.TextPixels(widths.Take(span).Sum());
        int row = 1;
        int? frozen = null;
        int lastColumn = Math.Max(span, 1);
        foreach (var block in blocks)
        {
            switch (block)
            {
                case TextBlock t:
                    var cell = ws.Cell(row, 1);
                    SheetLayout.SetText(cell, t.Text);
                    cell.Style.Font.FontSize = t.Size;
                    cell.Style.Font.Bold = t.Bold;
                    cell.Style.Font.Italic = t.Italic;
                    cell.Style.Alignment.WrapText = true;
                    cell.Style.Alignment.Vertical = XLAlignmentVerticalValues.Top;
                    if (span > 1)
                    {
                        ws.Range(row, 1, row, span).Merge();
                    }

                    int lines = measure.Lines(t.Text, paragraphPx, t.Size, t.Bold);
                    ws.Row(row).Height = Math.Max(DefaultRowHeight, (lines * TextMeasure.LineHeight(t.Size)) + 3);
                    row++;
                    break;
                case PairsBlock p:
                    foreach (var (label, value, format) in p.Pairs)
                    {
                        SheetLayout.SetText(ws.Cell(row, 1), label);
                        Value(ws.Cell(row, 2), value, format);
                        row++;
                    }

                    break;
                case TableBlock tb:
                    row = RenderTable(ws, tb, row, widths, streamed, measure);
                    lastColumn = Math.Max(lastColumn, tb.Table.Columns.Count);
                    if (tb.Freeze && frozen is null)
                    {
                        frozen = tb.HeaderRow;
                    }

                    break;
                case GapBlock:
                    row++;
                    break;
            }
        }

        if (frozen is { } header)
        {
            ws.SheetView.FreezeRows(header);
            ws.PageSetup.SetRowsToRepeatAtTop(1, header);
        }

        PageSetup(ws, Math.Max(1, row - 1), Math.Min(lastColumn, PrintColumns ?? int.MaxValue));
        return row;
    }

    /// <summary>
    /// Print setup: landscape A4, one page wide and as many tall as needed, centred horizontally, the sheet's name and
    /// the page number in the footer; the print area covers <paramref name="columns"/> columns (pictures below the
    /// content are added by the caller, <see cref="ExtendPrintArea"/>).
    /// </summary>
    private static void PageSetup(IXLWorksheet ws, int lastRow, int columns)
    {
        // A narrow sheet's print area is widened to a page's width with empty columns: fitted to one page wide, a
        // spreadsheet application may otherwise enlarge it beyond 100 % (LibreOffice does).
        columns = Math.Max(columns, ColumnsFor(ws, MinPrintPixels));
        var setup = ws.PageSetup;
        setup.PageOrientation = XLPageOrientation.Landscape;
        setup.PaperSize = XLPaperSize.A4Paper;
        setup.FitToPages(1, 0);
        setup.CenterHorizontally = true;
        setup.Margins.Left = 0.4;
        setup.Margins.Right = 0.4;
        setup.Margins.Top = 0.5;
        setup.Margins.Bottom = 0.6;
        setup.Footer.Center.AddText("&A — page &P of &N");
        setup.PrintAreas.Clear();
        setup.PrintAreas.Add(1, 1, lastRow, Math.Max(1, columns));
    }

    /// <summary>Extends the sheet's print area down to <paramref name="lastRow"/> and across at least <paramref name="columns"/> columns (for pictures placed below the content).</summary>
    public static void ExtendPrintArea(IXLWorksheet ws, int lastRow, int columns)
    {
        var area = ws.PageSetup.PrintAreas.FirstOrDefault();
        int cols = Math.Max(columns, area?.LastColumn().ColumnNumber() ?? 1);
        int rows = Math.Max(lastRow, area?.LastRow().RowNumber() ?? 1);
        ws.PageSetup.PrintAreas.Clear();
        ws.PageSetup.PrintAreas.Add(1, 1, rows, cols);
    }

    /// <summary>The number of columns from the first whose widths add up to <paramref name="pixels"/>.</summary>
    public static int ColumnsFor(IXLWorksheet ws, double pixels)
    {
        double sum = 0;
        int c = 0;
        while (sum < pixels && c < 100)
        {
            c++;
            sum += ws.Column(c).Width * TextMeasure.PixelsPerWidthUnit;
        }

        return c;
    }

    private int RenderTable(IXLWorksheet ws, TableBlock tb, int headerRow, double[] widths, StreamedTables streamed, TextMeasure measure)
    {
        var table = tb.Table;
        tb.HeaderRow = headerRow;
        int cols = table.Columns.Count;
        int headerLines = 1;
        for (int c = 0; c < cols; c++)
        {
            var cell = ws.Cell(headerRow, c + 1);
            SheetLayout.SetText(cell, table.Columns[c].Heading);
            headerLines = Math.Max(headerLines, measure.Lines(table.Columns[c].Heading, TextMeasure.TextPixels(widths[c]) - IndentPixels(measure, table, c), TextMeasure.BodySize, bold: true));
        }

        var header = ws.Range(headerRow, 1, headerRow, cols);
        for (int c = 0; c < cols; c++)
        {
            if (IndentedAfterNumber(table, c))
            {
                Indent(ws.Cell(headerRow, c + 1));
            }
        }

        header.Style.Font.Bold = true;
        header.Style.Fill.BackgroundColor = XLColor.FromHtml("#" + ChartPalette.HeaderFillHex);
        header.Style.Alignment.WrapText = true;
        header.Style.Alignment.Vertical = XLAlignmentVerticalValues.Top;
        ws.Row(headerRow).Height = Math.Max(DefaultRowHeight, (headerLines * TextMeasure.LineHeight(TextMeasure.BodySize)) + 3);

        int first = headerRow + 1;
        if (table.RowCount == 0)
        {
            SheetLayout.SetText(ws.Cell(first, 1), "(none)");
            ws.Cell(first, 1).Style.Font.Italic = true;
            return first + 2;
        }

        // Two template rows (plain, then highlighted) give each column's style; the rows themselves are streamed.
        var wraps = new bool[cols];
        for (int c = 0; c < cols; c++)
        {
            var column = table.Columns[c];
            wraps[c] = column.Kind == CellKind.Text && tb.Wraps[c];
            foreach (int r in new[] { first, first + 1 })
            {
                var cell = ws.Cell(r, c + 1);
                Template(cell, column);
                cell.Style.Alignment.Vertical = XLAlignmentVerticalValues.Top;
                cell.Style.Alignment.WrapText = wraps[c];
                if (IndentedAfterNumber(table, c))
                {
                    Indent(cell);
                }

                if (column.Kind != CellKind.Text)
                {
                    cell.Style.NumberFormat.Format = column.EffectiveNumberFormat;
                }
            }
        }

        ws.Range(first + 1, 1, first + 1, cols).Style.Fill.BackgroundColor = XLColor.FromHtml("#" + ChartPalette.FlaggedRowFillHex);
        var heights = new double?[table.RowCount];
        for (int r = 0; r < table.RowCount; r++)
        {
            int lines = 1;
            for (int c = 0; c < cols; c++)
            {
                if (wraps[c] && table.Cell(r, c) is string s && s.Length > 0)
                {
                    double px = TextMeasure.TextPixels(widths[c]) - IndentPixels(measure, table, c);
                    lines = Math.Max(lines, measure.Width(s) <= px && s.IndexOf('\n', StringComparison.Ordinal) < 0 ? 1 : measure.Lines(s, px));
                }
            }

            heights[r] = lines > 1 ? (lines * TextMeasure.LineHeight(TextMeasure.BodySize)) + 3 : null;
        }

        streamed.Add(new DeferredBody(ws.Name, first, 1, table) { RowHeights = heights });
        int last = first + table.RowCount - 1;
        if (tb.Freeze)
        {
            ws.Range(headerRow, 1, last, cols).SetAutoFilter();
        }

        // Rows after a table start below both template rows, also for a table of one row.
        return Math.Max(last, first + 1) + 2;
    }

    /// <summary>
    /// A text column right of a number column starts one indent in (three spaces, ECMA-376's unit), so a right-aligned
    /// number and the text beside it do not run together ("218all 218 lots…" in a spreadsheet application).
    /// </summary>
    internal static bool IndentedAfterNumber(ReportTable table, int c) =>
        c > 0 && table.Columns[c].Kind == CellKind.Text && table.Columns[c - 1].Kind != CellKind.Text;

    private static double IndentPixels(TextMeasure measure, ReportTable table, int c) =>
        IndentedAfterNumber(table, c) ? measure.Width("   ") : 0;

    private static void Indent(IXLCell cell)
    {
        cell.Style.Alignment.Horizontal = XLAlignmentHorizontalValues.Left;
        cell.Style.Alignment.Indent = 1;
    }

    // A value of the column's kind, so the template cell gets the style a real value would; empty text leaves no
    // shared string behind when the template row is dropped.
    private static void Template(IXLCell cell, ReportColumn column)
    {
        switch (column.Kind)
        {
            case CellKind.Integer:
                cell.SetValue(0);
                break;
            case CellKind.Number:
            case CellKind.Share:
                cell.SetValue(0.0);
                break;
            case CellKind.DateTime:
                cell.SetValue(new DateTime(2000, 1, 1));
                break;
            default:
                SheetLayout.SetText(cell, string.Empty);
                break;
        }
    }

    private static void Value(IXLCell cell, object? value, string? format)
    {
        switch (value)
        {
            case null:
                return;
            case string s:
                SheetLayout.SetText(cell, s);
                return;
            case double d when !double.IsFinite(d):
                SheetLayout.SetText(cell, "n/a");
                return;
            case double d:
                cell.SetValue(d);
                break;
            case int i:
                cell.SetValue(i);
                break;
            default:
                SheetLayout.SetText(cell, Convert.ToString(value, CultureInfo.InvariantCulture) ?? string.Empty);
                return;
        }

        if (format is not null)
        {
            cell.Style.NumberFormat.Format = format;
        }

        cell.Style.Alignment.Horizontal = XLAlignmentHorizontalValues.Left;
    }

    /// <summary>
    /// Column widths (width units) from every block's widest text; paragraphs do not widen columns. The sheet's main
    /// table (its frozen one, else its first) and the label–value pairs set the widths first; another table's text then
    /// wraps within the width its column already has, or about 20 characters where that is less (so a table further
    /// down does not stretch the main table's columns), and its numbers widen a column only where they need to.
    /// </summary>
    private double[] ColumnWidths(TextMeasure measure)
    {
        int cols = Math.Max(2, blocks.OfType<TableBlock>().Select(t => t.Table.Columns.Count).DefaultIfEmpty(0).Max());
        var px = new double[cols];
        double wrapPx = TextMeasure.TextPixels(WrapUnits);
        var main = blocks.OfType<TableBlock>().FirstOrDefault(t => t.Freeze) ?? blocks.OfType<TableBlock>().FirstOrDefault();
        foreach (var block in blocks.Where(b => b is PairsBlock || b == main).Concat(blocks.Where(b => b is TableBlock && b != main)))
        {
            switch (block)
            {
                case PairsBlock p:
                    foreach (var (label, value, format) in p.Pairs)
                    {
                        px[0] = Math.Max(px[0], measure.Width(label));
                        px[1] = Math.Max(px[1], CellWidth(measure, value, format is null ? CellKind.Text : CellKind.Number, format ?? "@"));
                    }

                    break;
                case TableBlock t:
                    var table = t.Table;
                    t.Wraps = new bool[table.Columns.Count];
                    for (int c = 0; c < table.Columns.Count; c++)
                    {
                        var column = table.Columns[c];

                        // A heading wraps: its longest word (at most 24 characters' worth) sets the floor.
                        double heading = column.Heading.Split(' ').Max(w => measure.Width(w, bold: true));
                        double widest = Math.Min(heading, 24 * TextMeasure.PixelsPerWidthUnit);

                        // ...and wide enough that the heading wraps to at most MostHeadingLines lines: a column of short
                        // numbers under a long heading ("95 % of lots: high (% v/v)") otherwise made the header row six
                        // lines tall for the whole table.
                        while (widest < 24 * TextMeasure.PixelsPerWidthUnit && measure.Lines(column.Heading, widest, TextMeasure.BodySize, bold: true) > MostHeadingLines)
                        {
                            widest += 2;
                        }
                        string format = column.EffectiveNumberFormat;
                        for (int r = 0; r < table.RowCount; r++)
                        {
                            widest = Math.Max(widest, CellWidth(measure, table.Cell(r, c), column.Kind, format));
                        }

                        widest += IndentPixels(measure, table, c);

                        // Room the column has already (from the main table) that a text of this table wraps within.
                        double room = t != main ? Math.Max(px[c], ReadableWrapPixels) : wrapPx;
                        if (widest > Math.Min(room, wrapPx) && column.Kind == CellKind.Text)
                        {
                            t.Wraps[c] = true;
                            widest = Math.Min(room, wrapPx);
                        }

                        px[c] = Math.Max(px[c], widest);
                    }

                    break;
            }
        }

        return px.Select(p => Math.Clamp(TextMeasure.WidthUnits(p), MinColumnUnits, MaxColumnUnits)).ToArray();
    }

    /// <summary>Most lines a table heading wraps to; its column is widened until it fits (within 24 characters).</summary>
    internal const int MostHeadingLines = 4;

    /// <summary>Narrowest a column a later table's text wraps within is made, px (about 20 characters).</summary>
    private const double ReadableWrapPixels = 150;

    /// <summary>The columns a paragraph is merged across: from the first until they are wide enough, or all.</summary>
    private static int ParagraphSpan(double[] widths)
    {
        double sum = 0;
        for (int c = 0; c < widths.Length; c++)
        {
            sum += widths[c];
            if (TextMeasure.TextPixels(sum) >= ParagraphPixels)
            {
                return c + 1;
            }
        }

        return widths.Length;
    }

    /// <summary>Width of a value as the sheet shows it, px.</summary>
    internal static double CellWidth(TextMeasure measure, object? value, CellKind kind, string format)
    {
        Span<char> text = stackalloc char[64];
        switch (value)
        {
            case null:
                return 0;
            case string s:
                return measure.Width(s);
            case bool:
                return measure.Width("yes");
            case DateTime:
                return measure.Width("2000-01-01 00:00");
            case double d when !double.IsFinite(d):
                return 0;
            case double d when format.StartsWith('[') && format.Split(';')[0] is { } condition && condition.IndexOf('"', StringComparison.Ordinal) is int q and >= 0:
                // A conditional format's literal section ("< 0.0001") may be shown instead of the number: the wider of the two.
                return Math.Max(measure.Width(condition[(q + 1)..].TrimEnd('"')), CellWidth(measure, d, kind, ReportColumn.PlainSection(format)));
            case double d:
                return d.TryFormat(text, out int n, NetFormat(format), CultureInfo.InvariantCulture) ? measure.Width(text[..n]) : measure.Width(d.ToString(CultureInfo.InvariantCulture));
            case int i:
                return i.TryFormat(text, out int m, NetFormat(format), CultureInfo.InvariantCulture) ? measure.Width(text[..m]) : 0;
            case long l:
                return l.TryFormat(text, out int k, NetFormat(format), CultureInfo.InvariantCulture) ? measure.Width(text[..k]) : 0;
            default:
                return measure.Width(Convert.ToString(value, CultureInfo.InvariantCulture) ?? string.Empty);
        }
    }

    // Spreadsheet number formats used here read the same as .NET custom formats ("0.00", "+0.00;-0.00;0.00", "0.0%",
    // "#,##0"); "@" (text) and dates are not numbers.
    // A conditional format ("[<0.0001]"< 0.0001";0.0000") formats an ordinary number by its plain section.
    private static string NetFormat(string format) => format is "@" or "General" ? "G" : format.StartsWith('[') ? ReportColumn.PlainSection(format) : format;

    private abstract record Block;

    private sealed record TextBlock(string Text, double Size, bool Bold, bool Italic) : Block;

    private sealed record PairsBlock(IReadOnlyList<(string Label, object? Value, string? Format)> Pairs) : Block;

    private sealed record TableBlock(ReportTable Table, bool Freeze) : Block
    {
        public int HeaderRow { get; set; }

        public bool[] Wraps { get; set; } = [];
    }

    private sealed record GapBlock : Block;
}
