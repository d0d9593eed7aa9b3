using ClosedXML.Excel;

namespace YieldBench.Intake;

/// <summary>
/// Writes the blank input workbook in our layout: a "Lots" sheet, a "Fermentation log" sheet, and a "Columns" sheet
/// explaining every column with an example. Column widths are set by hand: ClosedXML's automatic sizing needs a
/// system graphics library that a fresh machine lacks.
/// </summary>
public static class TemplateWriter
{
    /// <summary>Name of the lots sheet.</summary>
    public const string LotsSheet = "Lots";

    /// <summary>Name of the fermentation-log sheet.</summary>
    public const string LogSheet = "Fermentation log";

    /// <summary>Name of the sheet explaining the columns.</summary>
    public const string ColumnsSheet = "Columns";

    /// <summary>The header row of the <see cref="ColumnsSheet"/>, the template's guide to its columns.</summary>
    internal static readonly string[] ColumnsSheetHeaders = ["Sheet", "Column", "Field name", "Unit", "Required", "Meaning", "Example"];

    /// <summary>
    /// True for the template's own guide sheet (named <see cref="ColumnsSheet"/>, its first row these headers): it holds
    /// no lots or readings, so intake passes it over without a sheet-skipped warning (a filled-in template warned of it).
    /// </summary>
    internal static bool IsColumnsGuide(RawSheet sheet) =>
        string.Equals(sheet.Name, ColumnsSheet, StringComparison.OrdinalIgnoreCase) && sheet.Rows.Count > 0
        && ColumnsSheetHeaders.Select((h, i) => (h, i)).All(x => sheet.Cell(0, x.i) is string s && string.Equals(s.Trim(), x.h, StringComparison.OrdinalIgnoreCase));

    /// <summary>Rows given data validation and number formats below each header.</summary>
    public const int PreparedRows = 2000;

    /// <summary>The lots sheet's headers, in order.</summary>
    public static IReadOnlyList<string> LotHeaders => Fields.Lots.Select(f => f.TemplateHeader).ToArray();

    /// <summary>The log sheet's headers, in order (the template uses one timestamp column).</summary>
    public static IReadOnlyList<string> LogHeaders => LogFieldsUsed.Select(f => f.TemplateHeader).ToArray();

    private static IEnumerable<FieldDef> LogFieldsUsed => Fields.Log.Where(f => f.Name is not "date" and not "time");

    /// <summary>
    /// Writes the template to <paramref name="path"/> (replacing any file there; the caller decides whether it may), whole
    /// or not at all: it is saved beside the target under a hidden name and renamed over it only when complete, so a
    /// failure or a kill never leaves a half-written workbook in place of the file that was there.
    /// </summary>
    public static void Write(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        using var wb = new XLWorkbook();
        var lots = wb.Worksheets.Add(LotsSheet);
        WriteHeaders(lots, Fields.Lots.ToList());
        var log = wb.Worksheets.Add(LogSheet);
        WriteHeaders(log, LogFieldsUsed.ToList());
        WriteColumnsSheet(wb.Worksheets.Add(ColumnsSheet));
        string full = Path.GetFullPath(path);
        string partial = Path.Combine(Path.GetDirectoryName(full) ?? ".", "." + Path.GetFileName(full) + ".yieldbench-partial-" + Guid.NewGuid().ToString("N"));
        try
        {
            using (var stream = new FileStream(partial, FileMode.CreateNew, FileAccess.Write))
            {
                wb.SaveAs(stream);
            }

            File.Move(partial, full, overwrite: true);
        }
        finally
        {
            File.Delete(partial);
        }
    }

    private static void WriteHeaders(IXLWorksheet ws, List<FieldDef> fields)
    {
        for (int i = 0; i < fields.Count; i++)
        {
            var f = fields[i];
            int col = i + 1;
            var cell = ws.Cell(1, col);
            cell.Value = f.TemplateHeader;
            cell.Style.Font.Bold = true;
            cell.Style.Fill.BackgroundColor = XLColor.FromHtml(f.Required ? "#D9E7F5" : "#EEEEEE");
            cell.Comment.AddText(Note(f));
            ws.Column(col).Width = Math.Clamp(f.TemplateHeader.Length + 4, 10, 40);
            var data = ws.Range(2, col, PreparedRows + 1, col);

            // Number formats go on the whole column (no cells are made for empty rows); the header keeps text.
            var format = ws.Column(col).Style.NumberFormat;
            switch (f.Kind)
            {
                case FieldKind.Colour:
                    var list = data.SetDataValidation();
                    list.List("\"red,white,rosé\"", true);
                    list.ErrorTitle = "Colour";
                    list.ErrorMessage = "Use red, white or rosé.";
                    break;
                case FieldKind.Season:
                    var year = data.SetDataValidation();
                    year.WholeNumber.Between(1900, 2100);
                    year.ErrorMessage = "Enter a four-digit year (1900–2100).";
                    format.Format = "0";
                    break;
                case FieldKind.Date:
                    format.Format = "yyyy-mm-dd";
                    break;
                case FieldKind.DateTime:
                    format.Format = "yyyy-mm-dd hh:mm";
                    break;
                case FieldKind.Text:
                    format.Format = "@";
                    break;
                default:
                    format.Format = f.Name is "ph" ? "0.00" : f.Name is "final_abv" ? "0.00" : f.Kind is FieldKind.Volume or FieldKind.Mass ? "0" : "0.0";
                    if (f.Min is { } min && f.Max is { } max)
                    {
                        var range = data.SetDataValidation();
                        range.Decimal.Between(min, max);
                        range.ErrorStyle = XLErrorStyle.Warning;
                        range.ErrorMessage = $"Plausible range {IntakeMessages.Num(min)} to {IntakeMessages.Num(max)} {f.Unit}.";
                    }

                    break;
            }
        }

        ws.SheetView.FreezeRows(1);
    }

    private static string Note(FieldDef f)
    {
        string unit = f.Unit.Length > 0 ? $" Unit: {f.Unit}." : "";
        string need = f.Required ? " Required." : " Optional.";
        return $"{f.Meaning}{unit}{need} Example: {f.Example}";
    }

    private static void WriteColumnsSheet(IXLWorksheet ws)
    {
        string[] headers = ColumnsSheetHeaders;
        for (int i = 0; i < headers.Length; i++)
        {
            ws.Cell(1, i + 1).Value = headers[i];
            ws.Cell(1, i + 1).Style.Font.Bold = true;
        }

        int row = 2;
        foreach (var (sheet, f) in Fields.Lots.Select(f => (LotsSheet, f)).Concat(LogFieldsUsed.Select(f => (LogSheet, f))))
        {
            ws.Cell(row, 1).Value = sheet;
            ws.Cell(row, 2).Value = f.TemplateHeader;
            ws.Cell(row, 3).Value = f.Name;
            ws.Cell(row, 4).Value = f.Unit;
            ws.Cell(row, 5).Value = f.Required ? "yes" : "no";
            ws.Cell(row, 6).Value = f.Meaning;
            ws.Cell(row, 7).SetValue(f.Example);
            row++;
        }

        row++;
        ws.Cell(row, 1).Value = "Cautions";
        ws.Cell(row, 1).Style.Font.Bold = true;
        ws.Cell(row + 1, 1).Value = "A predicted or reviewed alcohol is not a label statement: labels need a lab analysis and the local rules.";
        ws.Cell(row + 2, 1).Value = "Fermentation makes heat and carbon dioxide: ventilate cellars and follow local safety codes.";
        int[] widths = [18, 26, 20, 10, 10, 70, 18];
        for (int i = 0; i < widths.Length; i++)
        {
            ws.Column(i + 1).Width = widths[i];
        }

        ws.SheetView.FreezeRows(1);
    }
}
