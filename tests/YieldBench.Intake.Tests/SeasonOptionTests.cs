using YieldBench.Core.Lots;
using YieldBench.Intake;

namespace YieldBench.Intake.Tests;

/// <summary>--season given to a folder whose logs name no season: a log whose dates lie in another season.</summary>
public sealed class SeasonOptionTests
{
    [Fact]
    public void A_log_given_the_wrong_season_by_the_option_is_one_error_naming_the_option_and_the_lot_its_dates_fit()
    {
        // Given lots of season 2023 (a season column) and a log file with no season, read with --season 2025 (as a user
        // might give it, thinking it picks the season to review)
        using var folder = new TestFolder();
        folder.Text("lots.csv", "Season,Lot,Strain,Brix,Alcohol\n2023,23-01,QR-A4,24.0,14.1\n2023,23-02,QR-A4,23.5,13.8\n");
        folder.Text("ferment-log.csv", "Lot,Time,Brix,Temp\n"
            + "23-01,2023-09-10 08:00,24.0,18.0\n23-01,2023-09-10 18:00,23.1,19.5\n23-01,2023-09-11 08:00,20.8,22.0\n23-01,2023-09-11 18:00,18.0,24.0\n");

        // When read
        var set = folder.Read(new IntakeOptions { Season = 2025 }, "lots.csv", "ferment-log.csv");

        // Then the log is one error at its first reading's row, not four, saying where its season came from and which lot
        // its dates fit
        var error = Assert.Single(set.Issues, i => i.Code == IssueCodes.ReadingDateImplausible);
        Assert.Equal((IssueSeverity.Error, 2, "2023-09-10 to 2023-09-11"), (error.Severity, error.Row!.Value, error.Value));
        Assert.Equal(
            "All 4 readings of 2025/23-01 are dated 2023-09-10 to 2023-09-11, more than a year from season 2025; the log was left out. "
            + "Its season came from --season 2025, which is given to every file that names no season of its own: leave --season off when the files "
            + "hold several seasons (a log then takes its season from its lot), or give the log a season column. Lot 23-01 of season 2023 was read, and these dates fit it.",
            error.Message);
        Assert.Empty(set.Logs);

        // and every row of the log is counted as reported
        var log = set.Accounts.Single(a => a.File == "ferment-log.csv");
        Assert.Equal(4, log.RowsReported);

        // and without the option the log joins its lot
        var plain = folder.Read("lots.csv", "ferment-log.csv");
        Assert.Equal("23-01", Assert.Single(plain.Logs).LotId);
        Assert.DoesNotContain(plain.Issues, i => i.Code == IssueCodes.ReadingDateImplausible);
    }
}
