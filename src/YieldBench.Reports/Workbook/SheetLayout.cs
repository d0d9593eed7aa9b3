using System.Globalization;
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
    public static Placement WriteTable(IXLWorksheet sheet, ReportTable table, int headerRow = 1, int firstColumn = 1, bool freezeAndFilter = true)
    {
        ArgumentNullException.ThrowIfNull(sheet);
        ArgumentNullException.ThrowIfNull(table);
        int cols = table.Columns.Count;
        for (int c = 0; c < cols; c++)
        {
            var cell = sheet.Cell(headerRow, firstColumn + c);
            SetText(cell, table.Columns[c].Heading);
        }

        var header = sheet.Range(headerRow, firstColumn, headerRow, firstColumn + cols - 1);
        header.Style.Font.Bold = true;
        header.Style.Fill.BackgroundColor = XLColor.FromHtml("#" + ChartPalette.HeaderFillHex);
        header.Style.Alignment.WrapText = true;
        header.Style.Alignment.Vertical = XLAlignmentVerticalValues.Top;

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
                sheet.Range(headerRow + 1 + r, firstColumn, headerRow + 1 + r, firstColumn + cols - 1)
                    .Style.Fill.BackgroundColor = XLColor.FromHtml("#" + ChartPalette.FlaggedRowFillHex);
            }
        }

        int lastRow = headerRow + Math.Max(0, table.Rows.Count);
        for (int c = 0; c < cols; c++)
        {
            var column = table.Columns[c];

            // One style for the column's data range: a style set cell by cell made large sheets the slowest step.
            if (table.Rows.Count > 0 && column.Kind != CellKind.Text)
            {
                sheet.Range(headerRow + 1, firstColumn + c, lastRow, firstColumn + c).Style.NumberFormat.Format = column.EffectiveNumberFormat;
            }

            double width = Math.Min(HeadingWidth(column.Heading), 24);
            foreach (var row in table.Rows)
            {
                width = Math.Max(width, DisplayWidth(row[c], column));
            }

            sheet.Column(firstColumn + c).Width = Math.Clamp(width + 2, MinColumnWidth, MaxColumnWidth);
            if (column.Kind == CellKind.Text && table.Rows.Any(row => row[c] is string s && s.Length > MaxColumnWidth))
            {
                sheet.Range(headerRow + 1, firstColumn + c, lastRow, firstColumn + c).Style.Alignment.WrapText = true;
            }
        }

        if (freezeAndFilter)
        {
            sheet.SheetView.FreezeRows(headerRow);
            sheet.Range(headerRow, firstColumn, lastRow, firstColumn + cols - 1).SetAutoFilter();
        }

        return new Placement(headerRow, firstColumn, lastRow, firstColumn + cols - 1);
    }

    /// <summary>Writes a cell as text (never as a formula, whatever its first character).</summary>
    public static void SetText(IXLCell cell, string text)
    {
        ArgumentNullException.ThrowIfNull(cell);
        cell.SetValue(text);
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
        return value switch
        {
            null => 0,
            string s => s.Length,
            double d when !double.IsFinite(d) => 0,
            double d => FormattedNumberWidth(d, column.EffectiveNumberFormat),
            int i => i.ToString(CultureInfo.InvariantCulture).Length + 1,
            long l => l.ToString(CultureInfo.InvariantCulture).Length + 2,
            bool => 3,
            DateTime => 16,
            _ => CsvText.Format(value, column.Kind).Length,
        };
    }

    private static double HeadingWidth(string heading) => heading.Split(' ').Max(w => w.Length) + 4;

    private static double FormattedNumberWidth(double d, string format)
    {
        int decimals = 0;
        int dot = format.IndexOf('.', StringComparison.Ordinal);
        if (dot >= 0)
        {
            decimals = format.Skip(dot + 1).TakeWhile(ch => ch == '0').Count();
        }

        string s = Math.Round(Math.Abs(d) * (format.Contains('%', StringComparison.Ordinal) ? 100 : 1), decimals)
            .ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
        return s.Length + 2;
    }
}
