using ClosedXML.Excel;
using YieldBench.Core.Review.Strains;
using YieldBench.Core.Kinetics;
using YieldBench.Reports.Tables;
using YieldBench.Reports.Workbook;

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
    /// Writes the sheet from row 1; with <paramref name="strains"/> (the strain review), the strain table also shows each strain's median
    /// conversion (alcohol per °Brix, sugar per % alcohol) beside its kinetics.
    /// </summary>
    public static void Fill(IXLWorksheet sheet, KineticsReview review, StrainReview? strains) => Fill(sheet, review, strains, null);

    /// <summary>
    /// As the public overloads; with <paramref name="streamed"/>, a table longer than its threshold (the lots of a
    /// large review) is streamed into the finished package instead of becoming ClosedXML cells. Returns the sheet's
    /// last row.
    /// </summary>
    internal static int Fill(IXLWorksheet sheet, KineticsReview review, StrainReview? strains, StreamedTables? streamed) =>
        Fill(sheet, review, strains, streamed, null);

    /// <summary>As the overload above, with the per-lot table built already (<see cref="KineticsTables.Lots"/> of <paramref name="review"/>) or null to build it.</summary>
    internal static int Fill(IXLWorksheet sheet, KineticsReview review, StrainReview? strains, StreamedTables? streamed, ReportTable? lotsTable)
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
        row = WriteTable(sheet, row, "By strain (median and interquartile range across lots with a log)", KineticsTables.Strains(review, strains), widths, streamed);
        row++;
        row = WriteTable(sheet, row, "By lot (shaded: lots with a flag)", lotsTable ?? KineticsTables.Lots(review), widths, streamed);
        row++;
        row = WriteTable(sheet, row, "Findings", KineticsTables.Findings(review), widths, streamed);
        foreach (var (col, w) in widths)
        {
            // Long message columns wrap at 100 characters rather than stretching the sheet.
            sheet.Column(col).Width = Math.Clamp(w + 2, 8, 100);
        }

        return row - 1;
    }

    // A caption, then the table as every sheet lays one out (no freeze or filter: three tables share the sheet), or
    // "(none)". The columns are sized once for all three tables. Returns the row after the table.
    private static int WriteTable(IXLWorksheet sheet, int row, string caption, ReportTable table, Dictionary<int, int> widths, StreamedTables? streamed)
    {
        var cap = sheet.Cell(row, 1);
        cap.Value = caption;
        cap.Style.Font.Bold = true;
        row++;
        var placed = SheetLayout.WriteTable(sheet, table, row, 1, freezeAndFilter: false, setColumnWidths: false, streamed);
        TrackWidths(table, widths);
        if (table.Rows.Count == 0)
        {
            sheet.Cell(placed.LastRow + 1, 1).Value = "(none)";
            return placed.LastRow + 2;
        }

        return placed.LastRow + 1;
    }

    // Headings up to 24 characters, numbers 10, whole numbers 6, times 16, text its length (read row by row: the
    // per-lot table of a large review is long).
    private static void TrackWidths(ReportTable table, Dictionary<int, int> widths)
    {
        var w = table.Columns.Select(c => Math.Min(c.Heading.Length, 24)).ToArray();
        for (int r = 0; r < table.Rows.Count; r++)
        {
            var cells = table.Rows[r];
            for (int c = 0; c < w.Length; c++)
            {
                w[c] = Math.Max(w[c], cells[c] switch
                {
                    double d when double.IsFinite(d) => 10,
                    int => 6,
                    DateTime => 16,
                    string s => s.Length,
                    _ => 0,
                });
            }
        }

        for (int c = 0; c < w.Length; c++)
        {
            widths[c + 1] = Math.Max(widths.GetValueOrDefault(c + 1), w[c]);
        }
    }
}
