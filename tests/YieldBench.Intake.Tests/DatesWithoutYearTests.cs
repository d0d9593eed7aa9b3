using YieldBench.Core.Lots;

namespace YieldBench.Intake.Tests;

/// <summary>
/// Logs dated by day and month alone ("12-Sep", "13/9"), as a hand-kept tank board is: each reading is placed in its
/// lot's year, said in one warning per log, or refused where the year is not clear. The expected dates were worked
/// out by hand and checked with python3 (datetime), e.g. for the nearest year to an inoculation:
/// <c>min((date(y,9,12) for y in (2025,2026,2027)), key=lambda d: abs(d - date(2026,9,11)))</c> → 2026-09-12.
/// </summary>
public class DatesWithoutYearTests
{
    [Fact]
    public void A_tank_board_with_dates_without_a_year_is_placed_nearest_each_lots_inoculation()
    {
        // Given a workbook named for its season: running lots with inoculation dates, and a sheet per tank whose
        // dates are typed "12-Sep" or "13/9" (text cells), with a time column, a blank row and notes
        using var folder = new TestFolder();
        Workbooks.WriteRaw(folder.PathOf("tank board 2026.xlsx"),
            ("Lots", [["Lot", "Yeast", "Brix", "Inoculated"], ["T1", "QX-7", 24.6, "2026-09-11 16:00"], ["T2", "QX-9", 21.8, "2026-09-12 09:00"]]),
            ("T1", [["Date", "Time", "Brix", "Temp °C"], ["12-Sep", "8:00", 24.1, 18.5], ["12-Sep", "17:30", 23.2, 20.1], [null, null, null, null], ["13/9", "18:00", 18.7, 25.0], ["Sep 14", "8:00", 15.2, 27.1]]),
            ("T2", [["Date", "Time", "Brix", "Temp °C"], ["12 Sept", "17:00", 21.6, 14.0], ["13-Sep", "8:00", 21.2, 14.5]]));

        // When it is read as lots still fermenting
        var set = folder.Read(new IntakeOptions { RunningLots = true }, "tank board 2026.xlsx");

        // Then every reading is dated in 2026, in row order, at its time of day
        var logs = set.Logs.ToDictionary(l => l.LotId);
        Assert.Equal(
            [new DateTime(2026, 9, 12, 8, 0, 0), new DateTime(2026, 9, 12, 17, 30, 0), new DateTime(2026, 9, 13, 18, 0, 0), new DateTime(2026, 9, 14, 8, 0, 0)],
            logs["T1"].Readings.Select(r => r.Timestamp));
        Assert.Equal([new DateTime(2026, 9, 12, 17, 0, 0), new DateTime(2026, 9, 13, 8, 0, 0)], logs["T2"].Readings.Select(r => r.Timestamp));

        // and each log says once, at its first such reading, where its dates were placed and why; nothing is refused
        var said = set.Issues.Where(i => i.Code == IssueCodes.DateWithoutYear).ToList();
        Assert.Equal(2, said.Count);
        Assert.All(said, i => Assert.Equal(IssueSeverity.Warning, i.Severity));
        var t1 = Assert.Single(said, i => i.Sheet == "T1");
        Assert.Equal(2, t1.Row);
        Assert.Equal("12 Sep 08:00", t1.Value);
        Assert.Equal(
            "The log of 2026/T1 dates 4 reading(s) by day and month with no year; they were placed in 2026, in the year that puts each nearest the lot's inoculation on 2026-09-11 (the first, '12 Sep', as 2026-09-12). If that is wrong, write each date with its year (e.g. 2026-09-12).",
            t1.Message);
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
        var account = Assert.Single(set.Accounts, a => a.Sheet == "T1");
        Assert.Equal((5, 4, 0, 1), (account.RowsRead, account.LogReadingsUsed, account.RowsReported, account.BlankRowsSkipped));
    }

    [Fact]
    public void An_inoculation_date_without_a_year_is_read_in_its_lots_season_and_said_once_for_the_column()
    {
        // Given running lots of season 2026 (from the file name) inoculated "11-Sep" and "12/9 15:00", one "29-Feb"
        // (2026 has none), and a log dated without years
        using var folder = new TestFolder();
        var lots = folder.Text("tanks-2026.csv", "Lot,Yeast,Brix,Inoculated\nT1,QX-7,24.6,11-Sep\nT2,QX-9,21.8,13/9 15:00\nT3,QX-9,21.8,29-Feb\n");
        var log = folder.Text("T1.csv", "Date,Brix\n12-Sep,24.0\n14-Sep,20.0\n");

        // When read as lots still fermenting
        var set = folder.Read(new IntakeOptions { RunningLots = true }, lots, log);

        // Then the dates are 2026-09-11 and 2026-09-13 15:00, said in one warning naming the column and the first
        var lot = set.RunningLots.ToDictionary(l => l.LotId);
        Assert.Equal(new DateTime(2026, 9, 11), lot["T1"].InoculationDate);
        Assert.Equal(new DateTime(2026, 9, 13, 15, 0, 0), lot["T2"].InoculationDate);
        var said = Assert.Single(set.Issues, i => i.Code == IssueCodes.DateWithoutYear && i.File == "tanks-2026.csv" && i.Severity == IssueSeverity.Warning);
        Assert.Equal((2, "Inoculated", "11-Sep"), (said.Row!.Value, said.Column, said.Value));
        Assert.StartsWith("The column 'Inoculated' gives 2 date(s) by day and month with no year; each was read in its lot's season", said.Message, StringComparison.Ordinal);

        // and 29 February, which 2026 lacks, leaves that date empty with a warning (the lot is kept)
        var leap = Assert.Single(set.Issues, i => i.Code == IssueCodes.NotADate);
        Assert.Equal((4, "29-Feb"), (leap.Row!.Value, leap.Value));
        Assert.Contains("2026, its season, has no 29 February", leap.Message, StringComparison.Ordinal);
        Assert.Null(lot["T3"].InoculationDate);

        // and the log is placed nearest T1's inoculation
        Assert.Equal([new DateTime(2026, 9, 12), new DateTime(2026, 9, 14)], Assert.Single(set.Logs).Readings.Select(r => r.Timestamp));
    }

    [Fact]
    public void The_logs_of_many_lots_on_one_sheet_are_said_in_one_warning_naming_the_lots()
    {
        // Given one log sheet holding three lots' readings dated without years, each lot with an inoculation date
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2025.csv", "Lot,Yeast,Brix,Inoculated\nC1,QX-7,22.0,2025-09-11\nC2,QX-7,22.5,2025-09-12\nC3,QX-9,23.0,2025-09-13\n");
        var log = folder.Text("log.csv", "Lot,Date,Brix\nC1,11/9,21.9\nC1,13/9,17.0\nC2,12/9,22.3\nC2,14/9,18.0\nC3,13/9,22.8\nC3,15/9,19.0\n");

        // When read as lots still fermenting
        var set = folder.Read(new IntakeOptions { RunningLots = true }, lots, log);

        // Then every reading is in 2025, and one warning at the sheet's first such reading names the three lots
        Assert.All(set.Logs.SelectMany(l => l.Readings), r => Assert.Equal(2025, r.Timestamp.Year));
        var said = Assert.Single(set.Issues, i => i.Code == IssueCodes.DateWithoutYear);
        Assert.Equal((2, "11 Sep"), (said.Row!.Value, said.Value));
        Assert.Equal(
            "The logs of 3 lots (C1, C2, C3) date 6 reading(s) by day and month with no year; they were placed in 2025, in the year that puts each nearest its lot's inoculation date (the first, '11 Sep' of C1, as 2025-09-11). If that is wrong, write each date with its year (e.g. 2025-09-11).",
            said.Message);
    }

    [Fact]
    public void Without_an_inoculation_date_a_ferment_starts_in_its_season_and_runs_into_the_next_year()
    {
        // Given a late ferment of season 2025 (no inoculation date) logged from 28 Dec to 3 Jan without years
        using var folder = new TestFolder();
        var lots = folder.Text("lots.csv", "Lot,Vintage,Yeast,Brix,Alcohol % v/v\nLH-1,2025,QX-7,30.2,11.0\n");
        var log = folder.Text("log.csv", "Lot,Date,Brix\nLH-1,28-Dec,29.8\nLH-1,30-Dec,27.5\nLH-1,1-Jan,24.0\nLH-1,3-Jan,20.1\n");

        // When both are read
        var set = folder.Read(lots, log);

        // Then December is 2025 and January 2026, and the warning names both years and the rule
        Assert.Equal(
            [new DateTime(2025, 12, 28), new DateTime(2025, 12, 30), new DateTime(2026, 1, 1), new DateTime(2026, 1, 3)],
            Assert.Single(set.Logs).Readings.Select(r => r.Timestamp));
        var said = Assert.Single(set.Issues, i => i.Code == IssueCodes.DateWithoutYear);
        Assert.Contains("placed in 2025 and 2026, from the lot's season 2025: the ferment starts in that year", said.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_date_without_a_year_that_cannot_be_placed_is_refused_where_it_stands_and_counted_as_left_out()
    {
        // Given a lot inoculated on 11 Sep whose log holds a reading of "1-Jul" (no year: 72 days before the
        // inoculation in 2026, or ten months after it), and a log of a lot no table names
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2026.csv", "Lot,Yeast,Brix,Inoculated\nT1,QX-7,24.6,2026-09-11\n");
        var log = folder.Text("log.csv", "Lot,Date,Brix\nT1,12-Sep,24.0\nT1,1-Jul,12.0\nT1,14-Sep,20.0\nZZ,12-Sep,22.0\n");

        // When they are read as lots still fermenting
        var set = folder.Read(new IntakeOptions { RunningLots = true }, lots, log);

        // Then the July reading and the reading of no lot are errors at their rows, with their values and a fix
        var refused = set.Issues.Where(i => i.Code == IssueCodes.DateWithoutYear && i.Severity == IssueSeverity.Error).OrderBy(i => i.Row).ToList();
        Assert.Equal([3, 5], refused.Select(i => i.Row));
        Assert.Equal(["1 Jul", "12 Sep"], refused.Select(i => i.Value));
        Assert.Equal(
            "The reading of T1 is dated '1 Jul', a day and month with no year, and the nearest year would put it more than 31 days before the lot's inoculation on 2026-09-11, so which year is meant is not clear; it was left out. Write the date with its year (year-month-day, e.g. 2024-09-12).",
            refused[0].Message);
        Assert.Contains("no lot 'ZZ' with a season or inoculation date was read", refused[1].Message, StringComparison.Ordinal);

        // and the lot keeps its two placed readings, and the log sheet's rows balance with the two left out
        Assert.Equal([new DateTime(2026, 9, 12), new DateTime(2026, 9, 14)], Assert.Single(set.Logs).Readings.Select(r => r.Timestamp));
        var account = Assert.Single(set.Accounts, a => a.File == "log.csv");
        Assert.Equal((4, 2, 2), (account.RowsRead, account.LogReadingsUsed, account.RowsReported));
        Assert.True(account.Balances);
    }

    [Fact]
    public void The_29th_of_february_without_a_year_is_refused_when_its_year_has_none()
    {
        // Given a southern-hemisphere lot of season 2026 (no inoculation date) logged from 27 Feb to 3 Mar without years
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2026.csv", "Lot,Yeast,Brix\nS1,QX-7,23.0\n");
        var log = folder.Text("S1.csv", "Date,Brix\n27-Feb,22.5\n29-Feb,19.0\n3-Mar,12.0\n");

        // When read as lots still fermenting
        var set = folder.Read(new IntakeOptions { RunningLots = true }, lots, log);

        // Then 27 Feb and 3 Mar are 2026 and 29 Feb, which 2026 lacks, is refused at its row for that reason
        Assert.Equal([new DateTime(2026, 2, 27), new DateTime(2026, 3, 3)], Assert.Single(set.Logs).Readings.Select(r => r.Timestamp));
        var refused = Assert.Single(set.Issues, i => i.Code == IssueCodes.DateWithoutYear && i.Severity == IssueSeverity.Error);
        Assert.Equal((3, "29 Feb"), (refused.Row!.Value, refused.Value));
        Assert.Contains("the year it would be placed in has no 29 February", refused.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_day_and_month_that_reads_both_ways_is_ambiguous_unless_the_column_settles_it()
    {
        // Given two logs: one whose only slash date is "12/9" (12 Sep or 9 Dec), one where "13/9" settles day first
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2026.csv", "Lot,Yeast,Brix,Inoculated\nA1,QX-7,24.0,2026-09-11\nA2,QX-7,24.0,2026-09-11\n");
        var a1 = folder.Text("A1.csv", "Date,Brix\n12/9,23.0\n");
        var a2 = folder.Text("A2.csv", "Date,Brix\n12/9,23.0\n13/9,21.0\n");

        // When they are read
        var set = folder.Read(new IntakeOptions { RunningLots = true }, lots, a1, a2);

        // Then the first is refused as ambiguous, naming both readings; the second is 12 and 13 September 2026
        var amb = Assert.Single(set.Issues, i => i.Code == IssueCodes.AmbiguousDate);
        Assert.Equal(("A1.csv", 2, "12/9"), (amb.File, amb.Row, amb.Value));
        Assert.Contains("could be 12 Sep (day first) or 9 Dec (month first)", amb.Message, StringComparison.Ordinal);
        Assert.Equal([new DateTime(2026, 9, 12), new DateTime(2026, 9, 13)], Assert.Single(set.Logs, l => l.LotId == "A2").Readings.Select(r => r.Timestamp));
    }

    [Fact]
    public void On_a_board_with_a_column_per_lot_a_refused_reading_leaves_its_row_only_with_the_rows_last_reading()
    {
        // Given a board of two lots dated without years: lot B1 has an inoculation date, lot B2 is in no lots table
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2026.csv", "Lot,Yeast,Brix,Inoculated\nB1,QX-7,24.0,2026-09-11\n");
        var board = folder.Text("board.csv", "Date,B1,B2\n12-Sep,23.5,22.0\n13-Sep,21.0,\n14-Sep,,19.0\n");

        // When they are read
        var set = folder.Read(new IntakeOptions { RunningLots = true }, lots, board);

        // Then B2's two readings are refused; the row holding only B2's reading moves to left out, the row holding
        // B1's reading too stays used, and the rows and readings balance
        Assert.Equal(2, set.Issues.Count(i => i.Code == IssueCodes.DateWithoutYear && i.Severity == IssueSeverity.Error));
        var account = Assert.Single(set.Accounts, a => a.File == "board.csv");
        Assert.Equal((3, 2, 1, 2), (account.RowsRead, account.LogReadingsUsed, account.RowsReported, account.ReadingsInRows));
        Assert.True(account.Balances);
    }
}
