using System.Globalization;

namespace YieldBench.Intake;

/// <summary>A block of merged cells, 0-based and inclusive, as a workbook declares it.</summary>
internal readonly record struct CellSpan(int FromRow, int FromColumn, int ToRow, int ToColumn);

/// <summary>
/// Merged cells read as they are seen. A spreadsheet program shows a block of merged cells as one cell holding the
/// top-left cell's value, but the file stores the value only there: the rows below would read empty (a strain merged
/// over three lots would leave two lots without a strain). A block that spans rows gives every cell in it the shown
/// value, with a warning naming the block unless it lies wholly within the header rows; a block within one row (a title across the sheet, a heading over several
/// columns) is left as stored.
/// </summary>
internal static class MergedCells
{
    /// <summary>Fills the row-spanning merged blocks of every sheet of <paramref name="raw"/>; each is warned of by <see cref="Warn"/> once the sheet's header is known.</summary>
    public static void Settle(RawFile raw)
    {
        foreach (var sheet in raw.Sheets)
        {
            if (sheet.Merged.Count == 0 || sheet.Rows.Count == 0)
            {
                continue;
            }

            // Only cells the sheet holds are filled: a damaged or hostile file may declare a block of any size.
            int width = sheet.Rows.Max(r => r.Length);
            foreach (var span in sheet.Merged.Distinct().OrderBy(s => s.FromRow).ThenBy(s => s.FromColumn))
            {
                int toRow = Math.Min(span.ToRow, sheet.Rows.Count - 1);
                int toColumn = Math.Min(span.ToColumn, width - 1);
                if (span.FromRow < 0 || span.FromColumn < 0 || toRow <= span.FromRow || toColumn < span.FromColumn
                    || sheet.Cell(span.FromRow, span.FromColumn) is not { } value || IsEmptyText(value))
                {
                    continue;
                }

                for (int row = span.FromRow; row <= toRow; row++)
                {
                    var cells = sheet.Rows[row];
                    if (cells.Length <= toColumn)
                    {
                        Array.Resize(ref cells, toColumn + 1);
                        sheet.Rows[row] = cells;
                    }

                    for (int column = span.FromColumn; column <= toColumn; column++)
                    {
                        cells[column] = value;
                    }
                }

                sheet.MergedFilled.Add((span, toRow, value));
            }
        }
    }

    /// <summary>
    /// Warns of each block filled on <paramref name="sheet"/> that reaches row <paramref name="firstDataRow"/> (0-based)
    /// or below, once: a block wholly within the header rows (a header merged down over a second header row or a
    /// units row) gives no data row its value, so it is read without a word. 0 warns of every block (a sheet read as
    /// no table).
    /// </summary>
    public static void Warn(RawSheet sheet, string file, IssueSink sink, int firstDataRow)
    {
        foreach (var (span, toRow, value) in sheet.MergedFilled.Where(m => m.ToRow >= firstDataRow))
        {
            string range = Address(span.FromRow, span.FromColumn) + ":" + Address(span.ToRow, span.ToColumn);
            sink.Warning(file, sheet.Name, span.FromRow + 1, Column(span.FromColumn), CellValues.Text(value), IssueCodes.MergedCells,
                IntakeMessages.MergedCells(range, span.FromRow + 1, toRow + 1));
        }

        sheet.MergedFilled.Clear();
    }

    /// <summary>A column's letters as a spreadsheet shows them: 0 → A, 25 → Z, 26 → AA.</summary>
    public static string Column(int index)
    {
        string letters = "";
        for (int n = index + 1; n > 0; n = (n - 1) / 26)
        {
            letters = (char)('A' + ((n - 1) % 26)) + letters;
        }

        return letters;
    }

    private static string Address(int row, int column) => Column(column) + (row + 1).ToString(CultureInfo.InvariantCulture);

    private static bool IsEmptyText(object value) => value is string s && string.IsNullOrWhiteSpace(s);
}
