using YieldBench.Core.Lots;

namespace YieldBench.Intake.Tests;

/// <summary>Logs of twice-daily checks that note only the half of the day ("AM", "PM").</summary>
public class HalfDayTimeTests
{
    [Fact]
    public void A_long_log_of_AM_and_PM_checks_is_read_at_the_checks_assumed_hours_and_said_once()
    {
        // Given a log whose Time column says only AM or PM (before, every row was refused as not-a-time)
        using var folder = new TestFolder();
        folder.Text("lots-2025.csv", "Lot,Yeast,Brix,Alc\nA1,ZR-3,24.6,14.4\n");
        folder.Text("log.csv", "Lot,Date,Time,Brix,Temp C\nA1,2025-09-14,AM,24.6,18\nA1,2025-09-14,p.m.,24.0,20\nA1,2025-09-15,am,22.1,22\nA1,2025-09-15,Evening,19.9,24\n");

        // When they are read
        var set = folder.Read("lots-2025.csv", "log.csv");

        // Then every reading is kept, the morning checks at 08:00 and the afternoon ones at 17:00
        var log = Assert.Single(set.Logs);
        Assert.Equal(
            [new DateTime(2025, 9, 14, 8, 0, 0), new DateTime(2025, 9, 14, 17, 0, 0), new DateTime(2025, 9, 15, 8, 0, 0), new DateTime(2025, 9, 15, 17, 0, 0)],
            log.Readings.Select(r => r.Timestamp));

        // and the assumption is said once, at the first such row, with the count and the hours
        var said = Assert.Single(set.Issues, i => i.Code == IssueCodes.HalfDayTime);
        Assert.Equal((IssueCodes.HalfDayTime, IssueSeverity.Warning, 2, "Time", "AM"), (said.Code, said.Severity, said.Row!.Value, said.Column, said.Value));
        Assert.Contains("4 time(s)", said.Message, StringComparison.Ordinal);
        Assert.Contains("08:00 and 17:00", said.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_tank_board_of_AM_and_PM_checks_is_read_too_and_other_words_are_still_no_time()
    {
        // Given a board with a column per tank and a Time column of "matin"/"soir", and one row whose time is a word
        // that names no half of the day
        using var folder = new TestFolder();
        folder.Text("lots-2025.csv", "Lot,Yeast,Brix,Alc\nT1,ZR-3,24.6,14.4\nT2,ZR-3,24.0,14.0\n");
        folder.Text("board.csv", "Date,Time,T1,T2\n2025-09-14,matin,24.6,24.0\n2025-09-14,soir,23.9,23.5\n2025-09-15,noonish,22.0,22.4\n");

        // When they are read
        var set = folder.Read("lots-2025.csv", "board.csv");

        // Then T1's two checks lie at 08:00 and 17:00, the warning names the column once, and the row of "noonish" is
        // refused whole (before, its readings were kept at midnight beside the error that refused it)
        var t1 = Assert.Single(set.Logs, l => l.LotId == "T1");
        Assert.Equal([new DateTime(2025, 9, 14, 8, 0, 0), new DateTime(2025, 9, 14, 17, 0, 0)], t1.Readings.Select(r => r.Timestamp));
        var said = Assert.Single(set.Issues, i => i.Code == IssueCodes.HalfDayTime);
        Assert.Equal((2, "Time"), (said.Row!.Value, said.Column));
        Assert.Contains("2 time(s)", said.Message, StringComparison.Ordinal);
        var refused = Assert.Single(set.Issues, i => i.Code == IssueCodes.NotATime);
        Assert.Equal((4, "noonish"), (refused.Row!.Value, refused.Value));
        Assert.DoesNotContain(set.Logs.SelectMany(l => l.Readings), r => r.Timestamp.Day == 15);
        var board = Assert.Single(set.Accounts, a => a.File == "board.csv");
        Assert.Equal((3, 2, 1, 4), (board.RowsRead, board.LogReadingsUsed, board.RowsReported, board.ReadingsInRows));
    }
}
