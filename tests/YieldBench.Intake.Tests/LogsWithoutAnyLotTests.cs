using System.Globalization;

namespace YieldBench.Intake.Tests;

public class LogsWithoutAnyLotTests
{
    [Fact]
    public void A_logs_file_checked_alone_gives_one_warning_per_sheet_naming_its_logs_not_one_per_log()
    {
        // Given a long-format log of twelve lots and no lots table
        using var folder = new TestFolder();
        var lines = new List<string> { "Lot,Date,Brix,Temp C" };
        for (int i = 1; i <= 12; i++)
        {
            lines.Add(string.Create(CultureInfo.InvariantCulture, $"QH-{i:00},2025-09-10 08:00,24.0,18.0"));
            lines.Add(string.Create(CultureInfo.InvariantCulture, $"QH-{i:00},2025-09-11 08:00,20.0,22.0"));
        }

        File.WriteAllLines(folder.PathOf("ferment logs.csv"), lines);

        // When it is read
        var set = folder.Read("ferment logs.csv");

        // Then the twelve logs are kept and one warning says why none matches, naming ten of them and the count
        Assert.Equal(12, set.Logs.Count);
        var issue = Assert.Single(set.Issues, i => i.Code == IssueCodes.LogWithoutLot);
        Assert.Equal("QH-01", issue.Value);
        Assert.Equal(
            "No lot was read (no lots table among the inputs, or none of its rows could be used), so the fermentation logs of 12 lots on this sheet (QH-01, QH-02, QH-03, QH-04, QH-05, QH-06, QH-07, QH-08, QH-09, QH-10 and 2 more) match none. Give the lots file with the logs, or fix the lots table's errors listed here.",
            issue.Message);
    }
}
