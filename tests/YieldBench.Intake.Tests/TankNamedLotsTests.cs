using YieldBench.Core.Lots;

namespace YieldBench.Intake.Tests;

/// <summary>Cellars that know a lot by its tank, and lots whose season only their inoculation date gives.</summary>
public class TankNamedLotsTests
{
    [Fact]
    public void A_logs_tank_column_names_the_lot_of_each_reading()
    {
        // Given a log of two tanks in one sheet, the tank in a column headed "Tank" (a log has no vessel field)
        using var folder = new TestFolder();
        folder.Text("log.csv", "Tank,Date,Time,Brix,Temp F\nR1,2026-09-14,08:00,24.6,64\nR1,2026-09-14,20:00,24.1,66\nR2,2026-09-15,18:00,25.8,66\n");

        // When it is read
        var set = folder.Read("log.csv");

        // Then each tank's readings are that lot's log (before, the column was not used and both tanks' readings were
        // one log named after the file)
        Assert.Equal(["R1", "R2"], set.Logs.Select(l => l.LotId).Order());
        Assert.Equal(2, set.Logs.Single(l => l.LotId == "R1").Readings.Count);
        Assert.DoesNotContain(set.Issues, i => i.Code == IssueCodes.ColumnNotUsed);
    }

    [Fact]
    public void A_lots_table_without_a_lot_column_whose_tanks_appear_once_per_season_is_named_by_its_tanks()
    {
        // Given lots known by their tank: no lot column, each tank once per season (T1 in both seasons)
        using var folder = new TestFolder();
        folder.Text("lots.csv", "Vintage,Tank,Yeast,Brix,Alc\n2024,T1,ZR-3,24.6,14.4\n2024,T2,ZR-3,23.9,14.0\n2025,T1,QX-7,24.1,14.2\n");

        // When it is read
        var set = folder.Read("lots.csv");

        // Then every row is a lot named by its tank (before: none was used, with a hint to map the column), T1 of 2024
        // and T1 of 2025 are two lots, and the tank is the lot's name, not its vessel, as the hinted mapping would read it
        Assert.Equal([("T1", 2024), ("T1", 2025), ("T2", 2024)], set.Lots.Select(l => (l.LotId, l.Season)).Order());
        Assert.All(set.Lots, l => Assert.Null(l.Vessel));
        Assert.Contains(set.Mappings, m => m.Header == "Tank" && m.Field == "lot_id");
        Assert.DoesNotContain(set.Mappings, m => m.Field == "vessel");
        var said = Assert.Single(set.Issues, i => i.Code == IssueCodes.LotIdFromTank);
        Assert.Equal((IssueSeverity.Warning, 1, "Tank"), (said.Severity, said.Row!.Value, said.Column));
        Assert.Contains("once per season", said.Message, StringComparison.Ordinal);
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
    }

    [Theory]
    [InlineData("Tank,Yeast,Brix,Alc\nBarrel,ZR-3,24.6,14.4\nBarrel,ZR-3,24.0,14.1\n")] // vessel kinds, not names
    [InlineData("Vintage,Tank,Yeast,Brix,Alc\n2025,R1,ZR-3,24.6,14.4\n2025,r1,ZR-3,24.0,14.1\n")] // one tank, two lots of a season
    public void A_tank_column_that_repeats_within_a_season_names_no_lot_and_says_how_to_map_it(string text)
    {
        // Given a lots table with no lot column whose tank column repeats a value within a season
        using var folder = new TestFolder();
        folder.Text("lots 2025.csv", text);

        // When it is read
        var set = folder.Read("lots 2025.csv");

        // Then no lot is made up from it: the missing lot id is an error that says which column to map, with the option
        Assert.Empty(set.Lots);
        Assert.DoesNotContain(set.Issues, i => i.Code == IssueCodes.LotIdFromTank);
        var missing = Assert.Single(set.Issues, i => i.Code == IssueCodes.MissingColumn);
        Assert.Contains("--column lot_id=\"Tank\"", missing.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_lot_with_no_season_anywhere_takes_the_year_of_its_inoculation_date_with_a_warning()
    {
        // Given lots with no season column, no year in the file name, no --season, but an inoculation date
        using var folder = new TestFolder();
        folder.Text("lots.csv", "Lot,Yeast,Brix,Alc,Inoculated\nA1,ZR-3,24.6,14.4,2025-09-14\nA2,ZR-3,24.0,14.0,\n");

        // When it is read
        var set = folder.Read("lots.csv");

        // Then A1 is of season 2025, said in a warning naming its row and date; A2, with no date, is still no-season
        var a1 = Assert.Single(set.Lots);
        Assert.Equal(("A1", 2025), (a1.LotId, a1.Season));
        var warning = Assert.Single(set.Issues, i => i.Code == IssueCodes.SeasonFromDate);
        Assert.Equal((IssueSeverity.Warning, 2, "Inoculated"), (warning.Severity, warning.Row!.Value, warning.Column));
        Assert.Contains(set.Issues, i => i.Code == IssueCodes.NoSeason && i.Row == 3);
    }
    [Fact]
    public void A_lot_without_its_alcohol_yet_is_told_where_it_belongs_and_a_word_for_alcohol_gets_an_alcohol_example()
    {
        // Given a season's lots, one still without the lab's alcohol and one with "pending" in its place
        using var folder = new TestFolder();
        folder.Text("lots-2025.csv", "Lot,Yeast,Brix,Alc\nA1,QX-7,24.5,14.2\nA2,QX-7,23.9,\nA4,QX-7,24.1,pending\n");

        // When it is read
        var set = folder.Read("lots-2025.csv");

        // Then the empty alcohol says the lot belongs in a later review or the forecast, and "pending" is asked for as a
        // number like the field's own example (13.9 % v/v), not a sugar (24.3) ("n/a" would be an empty cell)
        var missing = Assert.Single(set.Issues, i => i.Code == IssueCodes.MissingValue);
        Assert.Contains("a lot still fermenting belongs in a later review, or in 'yieldbench forecast --running' now", missing.Message, StringComparison.Ordinal);
        var word = Assert.Single(set.Issues, i => i.Code == IssueCodes.NotANumber);
        Assert.Contains("such as 13.9", word.Message, StringComparison.Ordinal);
    }
    [Fact]
    public void A_log_counted_in_day_numbers_is_placed_from_its_lots_inoculation_date()
    {
        // Given a lot inoculated on 10 Sep 2025 at 10:00 and its log kept by day of ferment (Day 0 … 7), and a second
        // lot with the same kind of log but no inoculation date
        using var folder = new TestFolder();
        folder.Text("lots-2025.csv", "Lot,Yeast,Brix,Alc,Inoculated\nA1,QX-7,24.5,14.2,2025-09-10 10:00\nA2,QX-7,24.0,14.0,\n");
        folder.Text("A1.csv", "Day,Brix,Temp\n0,24.5,18\n1,23.0,21\n2,19.5,25\n3,14.0,28\n4,8.5,27\n5,3.0,24\n6,-0.5,21\n7,-1.5,19\n");
        folder.Text("A2.csv", "Day,Time,Brix\n0,08:00,24.0\n1,08:00,22.5\n");

        // When they are read
        var set = folder.Read("lots-2025.csv", "A1.csv", "A2.csv");

        // Then A1's readings lie day by day from the inoculation (day 3 = 13 Sep 10:00), said once for the column; A2's
        // log is left out with an error saying the lot has no inoculation date to count from
        var a1 = Assert.Single(set.Logs);
        Assert.Equal("A1", a1.LotId);
        Assert.Equal(new DateTime(2025, 9, 13, 10, 0, 0), a1.Readings[3].Timestamp);
        Assert.Equal(new DateTime(2025, 9, 17, 10, 0, 0), a1.Readings[^1].Timestamp);
        var said = Assert.Single(set.Issues, i => i.Code == IssueCodes.DaysFromInoculation && i.File == "A1.csv");
        Assert.Equal((IssueSeverity.Warning, 2, "Day"), (said.Severity, said.Row!.Value, said.Column));
        Assert.Contains("day numbers (0 to 7)", said.Message, StringComparison.Ordinal);
        var none = Assert.Single(set.Issues, i => i.Code == IssueCodes.DaysWithoutInoculation);
        Assert.Equal(("A2.csv", "A2"), (none.File, none.Value));
        Assert.DoesNotContain(set.Issues, i => i.Code == IssueCodes.NotADate);

        // and A2's two rows are counted as left out, not as readings used (they were counted used before)
        var a2 = Assert.Single(set.Accounts, a => a.File == "A2.csv");
        Assert.Equal((2, 0, 2), (a2.RowsRead, a2.LogReadingsUsed, a2.RowsReported));
    }
}
