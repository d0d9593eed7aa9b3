using System.Globalization;
using System.Text;
using System.Xml;
using ClosedXML.Excel;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Data;
using YieldBench.Reports.Tables;

namespace YieldBench.Reports.Workbook;

/// <summary>
/// Lays report tables and text onto ClosedXML worksheets. Column widths are computed from the values here, because
/// ClosedXML's AdjustToContents needs the system library libgdiplus.
/// </summary>
public static class SheetLayout
{
    /// <summary>Widest column, in character widths.</summary>
    public const double MaxColumnWidth = 70;

    /// <summary>Narrowest column, in character widths.</summary>
    public const double MinColumnWidth = 6;

    /// <summary>Where a table was placed.</summary>
    /// <param name="HeaderRow">1-based row of the headings.</param>
    /// <param name="FirstColumn">1-based first column.</param>
    /// <param name="LastRow">1-based last data row (the header row when the table is empty).</param>
    /// <param name="LastColumn">1-based last column.</param>
    public sealed record Placement(int HeaderRow, int FirstColumn, int LastRow, int LastColumn);

    /// <summary>
    /// Writes a table with a bold, tinted, wrapped header row and number formats per column; highlights flagged rows;
    /// optionally freezes the header and adds filters. Returns where it went.
    /// </summary>
    public static Placement WriteTable(IXLWorksheet sheet, ReportTable table, int headerRow = 1, int firstColumn = 1, bool freezeAndFilter = true) =>
        WriteTable(sheet, table, headerRow, firstColumn, freezeAndFilter, setColumnWidths: true, streamed: null);

    /// <summary>
    /// As the public overload; without <paramref name="setColumnWidths"/> the caller sizes the columns, and with
    /// <paramref name="streamed"/> a table longer than its threshold is laid out as the heading and two template rows
    /// (plain and highlighted, one value of each column's kind) and registered there, so its rows are streamed into
    /// the finished package instead of becoming ClosedXML cells. Widths, freeze and filter cover the full table either
    /// way, and rows written below it afterwards go where they would have gone.
    /// </summary>
    internal static Placement WriteTable(
        IXLWorksheet sheet, ReportTable table, int headerRow, int firstColumn, bool freezeAndFilter, bool setColumnWidths, StreamedTables? streamed)
    {
        ArgumentNullException.ThrowIfNull(sheet);
        ArgumentNullException.ThrowIfNull(table);
        int cols = table.Columns.Count;
        int lastColumn = firstColumn + cols - 1;
        for (int c = 0; c < cols; c++)
        {
            var cell = sheet.Cell(headerRow, firstColumn + c);
            SetText(cell, table.Columns[c].Heading);
        }

        var header = sheet.Range(headerRow, firstColumn, headerRow, lastColumn);
        header.Style.Font.Bold = true;
        header.Style.Fill.BackgroundColor = XLColor.FromHtml("#" + ChartPalette.HeaderFillHex);
        header.Style.Alignment.WrapText = true;
        header.Style.Alignment.Vertical = XLAlignmentVerticalValues.Top;

        // The rows ClosedXML holds: every data row, or the two template rows of a streamed table.
        int bodyRows;
        if (streamed is not null && streamed.ShouldStream(table))
        {
            for (int c = 0; c < cols; c++)
            {
                SetTemplateValue(sheet.Cell(headerRow + 1, firstColumn + c), table.Columns[c]);
                SetTemplateValue(sheet.Cell(headerRow + 2, firstColumn + c), table.Columns[c]);
            }

            sheet.Range(headerRow + 2, firstColumn, headerRow + 2, lastColumn)
                .Style.Fill.BackgroundColor = XLColor.FromHtml("#" + ChartPalette.FlaggedRowFillHex);
            streamed.Add(new DeferredBody(sheet.Name, headerRow + 1, firstColumn, table));
            bodyRows = 2;
        }
        else
        {
            for (int r = 0; r < table.Rows.Count; r++)
            {
                var row = table.Rows[r];
                for (int c = 0; c < cols; c++)
                {
                    var cell = sheet.Cell(headerRow + 1 + r, firstColumn + c);
                    SetValueOnly(cell, row[c]);
                }

                if (table.Highlighted[r])
                {
                    sheet.Range(headerRow + 1 + r, firstColumn, headerRow + 1 + r, lastColumn)
                        .Style.Fill.BackgroundColor = XLColor.FromHtml("#" + ChartPalette.FlaggedRowFillHex);
                }
            }

            bodyRows = table.Rows.Count;
        }

        int lastRow = headerRow + table.Rows.Count;
        int bodyLastRow = headerRow + bodyRows;
        var (widths, longText) = Measure(table);
        for (int c = 0; c < cols; c++)
        {
            var column = table.Columns[c];

            // One style for the column's data range: a style set cell by cell made large sheets the slowest step.
            if (bodyRows > 0 && column.Kind != CellKind.Text)
            {
                sheet.Range(headerRow + 1, firstColumn + c, bodyLastRow, firstColumn + c).Style.NumberFormat.Format = column.EffectiveNumberFormat;
            }

            if (setColumnWidths)
            {
                sheet.Column(firstColumn + c).Width = Math.Clamp(widths[c] + 2, MinColumnWidth, MaxColumnWidth);
            }

            if (bodyRows > 0 && column.Kind == CellKind.Text && longText[c])
            {
                sheet.Range(headerRow + 1, firstColumn + c, bodyLastRow, firstColumn + c).Style.Alignment.WrapText = true;
            }
        }

        if (freezeAndFilter)
        {
            sheet.SheetView.FreezeRows(headerRow);
            sheet.Range(headerRow, firstColumn, lastRow, lastColumn).SetAutoFilter();
        }

        return new Placement(headerRow, firstColumn, lastRow, lastColumn);
    }

    /// <summary>
    /// The width, in character widths, each column of <paramref name="table"/> needs (its widest value as the sheet
    /// shows it, or its heading's longest word up to 24), and whether it holds text longer than
    /// <see cref="MaxColumnWidth"/>. One pass row by row: a large table's values are read once, in memory order.
    /// </summary>
    private static (double[] Widths, bool[] LongText) Measure(ReportTable table)
    {
        int cols = table.Columns.Count;
        var widths = new double[cols];
        var longText = new bool[cols];
        var shapes = new NumberShape[cols];
        for (int c = 0; c < cols; c++)
        {
            widths[c] = Math.Min(HeadingWidth(table.Columns[c].Heading), 24);
            shapes[c] = new NumberShape(table.Columns[c].EffectiveNumberFormat);
        }

        for (int r = 0; r < table.Rows.Count; r++)
        {
            var row = table.Rows[r];
            for (int c = 0; c < cols; c++)
            {
                object? value = row[c];
                widths[c] = Math.Max(widths[c], DisplayWidth(value, table.Columns[c], shapes[c]));
                if (value is string s && s.Length > MaxColumnWidth)
                {
                    longText[c] = true;
                }
            }
        }

        return (widths, longText);
    }

    /// <summary>
    /// <paramref name="text"/> without the characters XML 1.0 cannot carry (control characters other than tab and
    /// line breaks, unpaired surrogates, U+FFFE and U+FFFF), so no text can make the package unreadable.
    /// </summary>
    public static string XmlSafe(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        int i = 0;
        while (i < text.Length && ValidAt(text, i) is int width and > 0)
        {
            i += width;
        }

        if (i == text.Length)
        {
            return text;
        }

        var sb = new StringBuilder(text.Length);
        sb.Append(text, 0, i);
        while (i < text.Length)
        {
            int width = ValidAt(text, i);
            if (width > 0)
            {
                sb.Append(text, i, width);
                i += width;
            }
            else
            {
                i++;
            }
        }

        return sb.ToString();
    }

    // 1 for a valid character, 2 for a valid surrogate pair, 0 for a character XML cannot carry.
    private static int ValidAt(string text, int i)
    {
        char ch = text[i];
        if (XmlConvert.IsXmlChar(ch))
        {
            return 1;
        }

        return i + 1 < text.Length && XmlConvert.IsXmlSurrogatePair(text[i + 1], ch) ? 2 : 0;
    }

    // A value of the column's kind, so ClosedXML gives the template cell the style a real value would get; empty
    // text leaves no shared string behind when the template row is dropped.
    private static void SetTemplateValue(IXLCell cell, ReportColumn column)
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
                // Text, and booleans, which are written as the text "yes" or "no".
                SetText(cell, string.Empty);
                break;
        }
    }

    /// <summary>
    /// Writes a cell as text (never as a formula, whatever its first character), without the characters XML cannot
    /// carry (see <see cref="XmlSafe"/>), as streamed tables write it.
    /// </summary>
    public static void SetText(IXLCell cell, string text)
    {
        ArgumentNullException.ThrowIfNull(cell);
        ArgumentNullException.ThrowIfNull(text);
        cell.SetValue(XmlSafe(text));
        cell.DataType = XLDataType.Text;
    }

    /// <summary>Writes a heading-like line: bold, a size above body text.</summary>
    public static void SetHeading(IXLCell cell, string text, double size = 14)
    {
        ArgumentNullException.ThrowIfNull(cell);
        SetText(cell, text);
        cell.Style.Font.Bold = true;
        cell.Style.Font.FontSize = size;
    }

    /// <summary>Writes one cell of a table column, with the column's number format on numbers and dates.</summary>
    public static void SetValue(IXLCell cell, object? value, ReportColumn column)
    {
        ArgumentNullException.ThrowIfNull(cell);
        ArgumentNullException.ThrowIfNull(column);
        SetValueOnly(cell, value);
        if (value is int or long or DateTime || value is double d && double.IsFinite(d))
        {
            cell.Style.NumberFormat.Format = column.EffectiveNumberFormat;
        }
    }

    // As SetValue without the per-cell number format, which WriteTable sets once per column.
    private static void SetValueOnly(IXLCell cell, object? value)
    {
        switch (value)
        {
            case null:
                return;
            case string s:
                SetText(cell, s);
                return;
            case double d when !double.IsFinite(d):
                return;
            case double d:
                cell.SetValue(d);
                return;
            case int i:
                cell.SetValue(i);
                return;
            case long l:
                cell.SetValue(l);
                return;
            case bool b:
                SetText(cell, b ? "yes" : "no");
                return;
            case DateTime t:
                cell.SetValue(t);
                return;
            default:
                throw new ArgumentException($"Unsupported cell type {value.GetType().Name}.", nameof(value));
        }
    }

    /// <summary>Approximate width, in character widths, of a value as the sheet shows it.</summary>
    public static double DisplayWidth(object? value, ReportColumn column)
    {
        ArgumentNullException.ThrowIfNull(column);
        return DisplayWidth(value, column, new NumberShape(column.EffectiveNumberFormat));
    }

    private static double DisplayWidth(object? value, ReportColumn column, NumberShape format) => value switch
    {
        null => 0,
        string s => s.Length,
        double d when !double.IsFinite(d) => 0,
        double d => format.Width(d),
        int i => DigitCount(i) + 1,
        long l => DigitCount(l) + 2,
        bool => 3,
        DateTime => 16,
        _ => CsvText.Format(value, column.Kind).Length,
    };

    private static int DigitCount(long value)
    {
        Span<char> digits = stackalloc char[24];
        return value.TryFormat(digits, out int n, default, CultureInfo.InvariantCulture) ? n : value.ToString(CultureInfo.InvariantCulture).Length;
    }

    private static double HeadingWidth(string heading) => heading.Split(' ').Max(w => w.Length) + 4;

    /// <summary>How a number format shows a number: its decimals and whether it is a percentage.</summary>
    private readonly struct NumberShape
    {
        private readonly int decimals;
        private readonly bool percent;
        private readonly string fixedFormat;

        public NumberShape(string format)
        {
            int dot = format.IndexOf('.', StringComparison.Ordinal);
            if (dot >= 0)
            {
                decimals = format.Skip(dot + 1).TakeWhile(ch => ch == '0').Count();
            }

            percent = format.Contains('%', StringComparison.Ordinal);
            fixedFormat = "F" + decimals.ToString(CultureInfo.InvariantCulture);
        }

        public double Width(double d)
        {
            double shown = Math.Round(Math.Abs(d) * (percent ? 100 : 1), decimals);
            if (shown < 1e15)
            {
                // The digits before the point, counted without formatting (this runs for every number of a table).
                int digits = 1;
                for (double power = 10; shown >= power; power *= 10)
                {
                    digits++;
                }

                return digits + (decimals > 0 ? decimals + 1 : 0) + 2;
            }

            Span<char> text = stackalloc char[64];
            int n = shown.TryFormat(text, out int written, fixedFormat, CultureInfo.InvariantCulture)
                ? written
                : shown.ToString(fixedFormat, CultureInfo.InvariantCulture).Length;
            return n + 2;
        }
    }
}
