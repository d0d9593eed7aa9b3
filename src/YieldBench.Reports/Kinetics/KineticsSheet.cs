using ClosedXML.Excel;
using YieldBench.Core.Conversion;
using YieldBench.Core.Kinetics;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Tables;

namespace YieldBench.Reports.Kinetics;

/// <summary>
/// Fills the workbook's kinetics sheet: cautions, the per-strain table, the per-lot table (flagged lots shaded) and the
/// findings. Column widths are set from the text lengths (never ClosedXML's AdjustToContents, which needs libgdiplus).
/// </summary>
public static class KineticsSheet
{
    /// <summary>Suggested sheet name.</summary>
    public const string SheetName = "Kinetics";

    /// <summary>Cautions shown at the top of the sheet (and in the methods document).</summary>
    public static IReadOnlyList<string> Cautions { get; } =
    [
        "Fermentation releases heat and carbon dioxide. CO2 displaces air in cellars, pits and tanks and can kill: ventilate, monitor, and follow your local confined-space and workplace-safety rules.",
        "'Reachable without cooling' is an estimate of the temperature the remaining sugar could still cause with no heat removed (adiabatic); it is a warning sign, not a prediction. Cooling capacity and cap management decide what happens.",
        "Temperature thresholds are common-practice defaults (reds 35/40 °C, whites 20/25 °C); set them to your own practice and your winemaker's judgement.",
        "Sugar readings during fermentation are hydrometer or refractometer readings distorted by alcohol; times to dryness are taken from them. Dryness and any alcohol on a label need a lab analysis under the local rules.",
    ];

    /// <summary>Writes the sheet from row 1. The sheet should be empty.</summary>
    public static void Fill(IXLWorksheet sheet, KineticsReview review) => Fill(sheet, review, null);

    /// <summary>
    /// Writes the sheet from row 1; with <paramref name="lots"/>, the strain table also shows each strain's median
    /// conversion (alcohol per °Brix, sugar per % alcohol) beside its kinetics.
    /// </summary>
    public static void Fill(IXLWorksheet sheet, KineticsReview review, IReadOnlyList<LotConversion>? lots)
    {
        ArgumentNullException.ThrowIfNull(sheet);
        ArgumentNullException.ThrowIfNull(review);
        int row = 1;
        var title = sheet.Cell(row, 1);
        title.Value = "Fermentation kinetics and heat";
        title.Style.Font.Bold = true;
        title.Style.Font.FontSize = 14;
        row += 2;
        foreach (var c in Cautions)
        {
            sheet.Cell(row, 1).Value = c;
            sheet.Cell(row, 1).Style.Font.Italic = true;
            row++;
        }

        var widths = new Dictionary<int, int>();
        row++;
        row = WriteTable(sheet, row, "By strain (median and interquartile range across lots with a log)", KineticsTables.Strains(review, lots), widths);
        row++;
        row = WriteTable(sheet, row, "By lot (shaded: lots with a flag)", KineticsTables.Lots(review), widths);
        row++;
        WriteTable(sheet, row, "Findings", KineticsTables.Findings(review), widths);
        foreach (var (col, w) in widths)
        {
            // Long message columns wrap at 100 characters rather than stretching the sheet.
            sheet.Column(col).Width = Math.Clamp(w + 2, 8, 100);
        }
    }

    private static int WriteTable(IXLWorksheet sheet, int row, string caption, ReportTable table, Dictionary<int, int> widths)
    {
        var cap = sheet.Cell(row, 1);
        cap.Value = caption;
        cap.Style.Font.Bold = true;
        row++;
        for (int c = 0; c < table.Columns.Count; c++)
        {
            var cell = sheet.Cell(row, c + 1);
            cell.Value = table.Columns[c].Heading;
            cell.Style.Font.Bold = true;
            cell.Style.Fill.BackgroundColor = XLColor.FromHtml("#" + ChartPalette.HeaderFillHex);
            cell.Style.Alignment.WrapText = true;
            Track(widths, c + 1, Math.Min(table.Columns[c].Heading.Length, 24));
        }

        row++;
        if (table.Rows.Count == 0)
        {
            sheet.Cell(row, 1).Value = "(none)";
            return row + 1;
        }

        for (int r = 0; r < table.Rows.Count; r++, row++)
        {
            var cells = table.Rows[r];
            for (int c = 0; c < cells.Length; c++)
            {
                var cell = sheet.Cell(row, c + 1);
                var col = table.Columns[c];
                switch (cells[c])
                {
                    case null:
                        break;
                    case double d when !double.IsFinite(d):
                        break;
                    case double d:
                        cell.Value = d;
                        cell.Style.NumberFormat.Format = col.EffectiveNumberFormat;
                        Track(widths, c + 1, 10);
                        break;
                    case int i:
                        cell.Value = i;
                        Track(widths, c + 1, 6);
                        break;
                    case bool b:
                        cell.Value = b ? "yes" : "no";
                        break;
                    case DateTime t:
                        cell.Value = t;
                        cell.Style.NumberFormat.Format = col.EffectiveNumberFormat;
                        Track(widths, c + 1, 16);
                        break;
                    case string s:
                        // Text stays text: a leading '=' must never become a formula.
                        cell.SetValue(s);
                        cell.DataType = XLDataType.Text;
                        Track(widths, c + 1, s.Length);
                        break;
                    default:
                        throw new InvalidOperationException($"Unsupported cell type {cells[c]!.GetType().Name}.");
                }

                if (table.Highlighted[r])
                {
                    cell.Style.Fill.BackgroundColor = XLColor.FromHtml("#" + ChartPalette.FlaggedRowFillHex);
                }
            }
        }

        return row;
    }

    private static void Track(Dictionary<int, int> widths, int col, int w) =>
        widths[col] = Math.Max(widths.GetValueOrDefault(col), w);
}
