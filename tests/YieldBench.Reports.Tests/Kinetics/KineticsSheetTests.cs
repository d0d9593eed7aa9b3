using ClosedXML.Excel;
using YieldBench.Reports.Kinetics;

namespace YieldBench.Reports.Tests.Kinetics;

public class KineticsSheetTests
{
    private static IXLWorksheet Filled(XLWorkbook wb)
    {
        var (_, review) = KineticsReportData.Build();
        var sheet = wb.AddWorksheet(KineticsSheet.SheetName);
        KineticsSheet.Fill(sheet, review);
        return sheet;
    }

    private static IXLCell Find(IXLWorksheet sheet, string text) =>
        sheet.CellsUsed().First(c => c.GetString() == text);

    [Fact]
    public void The_sheet_opens_with_the_title_and_the_cautions()
    {
        // Given a new workbook
        using var wb = new XLWorkbook();

        // When the kinetics sheet is filled
        var sheet = Filled(wb);

        // Then the title comes first and the heat and CO2 caution follows
        Assert.Equal("Fermentation kinetics and heat", sheet.Cell(1, 1).GetString());
        Assert.StartsWith("Fermentation releases heat and carbon dioxide.", sheet.Cell(3, 1).GetString());
        Assert.Contains("lab analysis", sheet.Cell(6, 1).GetString());
    }

    [Fact]
    public void The_strain_and_lot_tables_hold_the_review_values_with_flagged_lots_shaded()
    {
        // Given a filled sheet
        using var wb = new XLWorkbook();
        var sheet = Filled(wb);

        // When the tables are read back
        var strainHeader = Find(sheet, "Lots with a log");
        var lotHeader = Find(sheet, "Lot");
        var w03 = sheet.Column(lotHeader.Address.ColumnNumber).CellsUsed().First(c => c.GetString() == "W-03");
        int stuckCol = sheet.Row(lotHeader.Address.RowNumber).CellsUsed().First(c => c.GetString() == "Stuck").Address.ColumnNumber;
        var r01 = sheet.Column(lotHeader.Address.ColumnNumber).CellsUsed().First(c => c.GetString() == "R-01");

        // Then BR-4 and KX-11 show 2 lots each, W-03 is stuck and shaded, and the unflagged R-01 is not shaded
        Assert.Equal("BR-4", sheet.Cell(strainHeader.Address.RowNumber + 1, 1).GetString());
        Assert.Equal(2, sheet.Cell(strainHeader.Address.RowNumber + 1, strainHeader.Address.ColumnNumber).GetValue<int>());
        Assert.Equal(2, sheet.Cell(strainHeader.Address.RowNumber + 2, strainHeader.Address.ColumnNumber).GetValue<int>());
        Assert.Equal("yes", sheet.Cell(w03.Address.RowNumber, stuckCol).GetString());
        Assert.Equal(XLColor.FromHtml("#FBE8C4"), w03.Style.Fill.BackgroundColor);
        Assert.NotEqual(XLColor.FromHtml("#FBE8C4"), r01.Style.Fill.BackgroundColor);
    }

    [Fact]
    public void Findings_include_lots_without_a_log()
    {
        // Given a filled sheet (lot R-05 has no log)
        using var wb = new XLWorkbook();
        var sheet = Filled(wb);

        // When the findings are searched
        var noLog = sheet.CellsUsed().First(c => c.GetString() == "no-log");

        // Then the row names the lot and says what that means
        Assert.Equal("2025/R-05", noLog.CellLeft().GetString());
        Assert.Equal("Lot 2025/R-05 has no fermentation log; its kinetics are not shown.", noLog.CellRight().GetString());
    }

    [Fact]
    public void The_filled_workbook_saves_without_a_graphics_library_and_reads_back_whole()
    {
        // Given a filled sheet and the review it shows
        var (_, review) = KineticsReportData.Build();
        using var wb = new XLWorkbook();
        Filled(wb);

        // When saved to memory and opened again
        using var ms = new MemoryStream();
        wb.SaveAs(ms);
        ms.Position = 0;
        using var again = new XLWorkbook(ms);
        var sheet = again.Worksheet(KineticsSheet.SheetName);

        // Then the per-lot table holds one row per analysed lot, in the review's order, each with its days to dry
        var lotHeader = Find(sheet, "Lot");
        int dryCol = sheet.Row(lotHeader.Address.RowNumber).CellsUsed().First(c => c.GetString() == "Days to dry").Address.ColumnNumber;
        for (int i = 0; i < review.Lots.Count; i++)
        {
            int row = lotHeader.Address.RowNumber + 1 + i;
            Assert.Equal(review.Lots[i].Lot.LotId, sheet.Cell(row, lotHeader.Address.ColumnNumber).GetString());
            if (review.Lots[i].DaysToDry is { } days)
            {
                Assert.Equal(days, sheet.Cell(row, dryCol).GetValue<double>(), 9);
            }
            else
            {
                Assert.True(sheet.Cell(row, dryCol).IsEmpty());
            }
        }

        Assert.Equal(string.Empty, sheet.Cell(lotHeader.Address.RowNumber + 1 + review.Lots.Count, lotHeader.Address.ColumnNumber).GetString());
        Assert.Contains(review.Lots, k => k.DaysToDry is null);
    }

    [Fact]
    public void Given_the_conversion_measures_the_strain_table_shows_each_strains_median_conversion()
    {
        // Given the review and its lots (every invented lot: 24 °Brix, 14 % v/v, so 14 / 24 = 0.58333 % v/v per °Brix)
        var review = KineticsReportData.FullReview();
        using var wb = new XLWorkbook();
        var sheet = wb.AddWorksheet(KineticsSheet.SheetName);

        // When the sheet is filled with the strain review's summaries
        KineticsSheet.Fill(sheet, review.Kinetics!, review.Strains);

        // Then KX-11 shows 3 lots reviewed (one without a log) and the median conversion
        var header = Find(sheet, "Alcohol per °Brix, median (% v/v per °Brix)");
        var reviewed = Find(sheet, "Lots reviewed (all, with or without a log)");
        int kxRow = header.Address.RowNumber + 2;
        Assert.Equal("KX-11", sheet.Cell(kxRow, 1).GetString());
        Assert.Equal(3, sheet.Cell(kxRow, reviewed.Address.ColumnNumber).GetValue<int>());
        Assert.Equal(14.0 / 24.0, sheet.Cell(kxRow, header.Address.ColumnNumber).GetValue<double>(), 9);
    }
}
