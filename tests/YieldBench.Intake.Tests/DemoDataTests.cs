using YieldBench.Core.Lots;

namespace YieldBench.Intake.Tests;

public class DemoDataTests
{
    private static string DemoFolder()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !Directory.Exists(Path.Combine(dir.FullName, "demo-data")))
        {
            dir = dir.Parent;
        }

        return Path.Combine(dir?.FullName ?? throw new DirectoryNotFoundException("demo-data not found above the test folder"), "demo-data", "history");
    }

    [Fact]
    public void The_demo_data_reads_every_lot_and_log_with_balanced_accounts_and_no_errors()
    {
        // Given the bundled demo data (three seasons of lots, one logs workbook; counts from demo-data/README.md)
        // When it is read
        var set = IntakeReader.Read([DemoFolder()], new IntakeOptions());

        // Then 72 + 66 + 84 lots and 42 + 40 + 53 logs are read, nothing is left out, and every account balances
        Assert.Equal([72, 66, 84], set.Seasons.Select(s => set.Lots.Count(l => l.Season == s)));
        Assert.Equal(42 + 40 + 53, set.Logs.Count);
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
        Assert.All(set.Accounts, a => Assert.True(a.Balances));
        Assert.Equal(0, set.Accounts.Sum(a => a.RowsReported));
        Assert.Equal(2, set.Accounts.Sum(a => a.SummaryRowsSkipped));
        Assert.DoesNotContain(set.Issues, i => i.Code == "log-without-lot");
    }
}
