namespace YieldBench.Intake.Tests;

public class SmokeTests
{
    [Fact]
    public void A_semicolon_csv_with_decimal_commas_title_and_average_rows_reads_its_lots()
    {
        using var folder = new TestFolder();
        var name = folder.Text("harvest-2023.csv",
            "Cellar lot record 2023;;;;\n" +
            "Lot;Yeast;Start Brix (°Bx);Alcohol % v/v;RS (g/L)\n" +
            "A-01;QX-7;24,3;14,1;1,2\n" +
            "\n" +
            "A-02;QX-9;22,8;13,2;0,8\n" +
            "Average;;23,55;13,65;1,0\n");
        var set = folder.Read(name);
        Assert.Equal(2, set.Lots.Count);
        Assert.Equal(24.3, set.Lots[0].StartingSugar.Brix, 10);
        Assert.Equal(2023, set.Lots[0].Season);
        var acc = Assert.Single(set.Accounts);
        Assert.Equal((4, 2, 0, 1, 1), (acc.RowsRead, acc.LotsUsed, acc.RowsReported, acc.BlankRowsSkipped, acc.SummaryRowsSkipped));
        Assert.True(acc.Balances);
        Assert.Equal(["summary-row-skipped"], set.Issues.Select(i => i.Code));
    }
}
