using ClosedXML.Excel;
using YieldBench.Core.Lots;

namespace YieldBench.Intake.Tests;

/// <summary>Fermentation logs kept with one column per lot (a date, perhaps a time, then a column for each tank).</summary>
public class OneColumnPerLotTests
{
    private const string Lots = "Lot,Vintage,Yeast,Brix,ABV %,RS g/L\nC1,2025,ZR-3,24.0,14.1,1.2\nC2,2025,ZR-9,25.5,15.0,1.4\nC3,2025,ZR-3,24.4,14.4,1.1\n";

    [Fact]
    public void A_board_with_a_column_per_lot_gives_each_lot_its_readings_at_the_row_times()
    {
        // Given a board: date and time, then one sugar column per lot, a lot not read at one time (empty cell)
        using var folder = new TestFolder();
        folder.Text("lots.csv", Lots);
        folder.Text("board.csv", "Date,Time,C1,C2,C3\n2025-09-10,09:00 AM,24.0,25.5,24.4\n2025-09-10,09:00 PM,23.5,,23.9\n2025-09-11,09:00 AM,21.0,23.1,20.2\n");

        // When it is read with the lots
        var set = folder.Read("lots.csv", "board.csv");

        // Then each lot has its own log with the readings of its column, at the row's date and time, joined to its lot
        var logs = set.Logs.ToDictionary(l => l.LotId);
        Assert.Equal(["C1", "C2", "C3"], logs.Keys.Order());
        Assert.Equal([24.0, 23.5, 21.0], logs["C1"].Readings.Select(r => r.Sugar!.Value.Brix));
        Assert.Equal([25.5, 23.1], logs["C2"].Readings.Select(r => r.Sugar!.Value.Brix));
        Assert.Equal([new DateTime(2025, 9, 10, 9, 0, 0), new DateTime(2025, 9, 11, 9, 0, 0)], logs["C2"].Readings.Select(r => r.Timestamp));
        Assert.Equal(4, logs["C1"].Readings[2].Source!.Row);

        // and the sheet's account counts rows (all used) and the readings they held, with the layout said in a warning
        var account = Assert.Single(set.Accounts, a => a.File.EndsWith("board.csv", StringComparison.Ordinal));
        Assert.Equal((3, 3, 0), (account.RowsRead, account.LogReadingsUsed, account.RowsReported));
        Assert.Equal(8, account.ReadingsInRows);
        Assert.True(account.Balances);
        Assert.Contains(set.Issues, i => i.Code == IssueCodes.OneColumnPerLot && i.Severity == IssueSeverity.Warning);
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
    }

    [Fact]
    public void Readings_of_one_sheet_share_its_file_and_sheet_and_each_names_its_own_row()
    {
        // Given the lots and a workbook log with two sheets, one per lot
        using var folder = new TestFolder();
        folder.Text("lots.csv", Lots);
        Workbooks.WriteRaw(folder.PathOf("logs.xlsx"),
            ("C1", [["Lot", "Vintage", "Date", "Brix"], ["C1", 2025, "2025-09-10 09:00", 24.0], ["C1", 2025, "2025-09-11 09:00", 21.0]]),
            ("C3", [["Lot", "Vintage", "Date", "Brix"], ["C3", 2025, "2025-09-10 09:00", 24.4], ["C3", 2025, "2025-09-11 09:00", 20.2], ["C3", 2025, "2025-09-12 09:00", 15.1]]));

        // When they are read
        var logs = folder.Read("lots.csv", "logs.xlsx").Logs.ToDictionary(l => l.LotId);

        // Then each reading names the file, its sheet and its row, as messages show them,
        Assert.Equal(["logs.xlsx [C3] row 2", "logs.xlsx [C3] row 3", "logs.xlsx [C3] row 4"], logs["C3"].Readings.Select(r => r.Source!.ToString()!.Replace(folder.Root + Path.DirectorySeparatorChar, string.Empty, StringComparison.Ordinal)));
        Assert.Equal(new SourceRef(logs["C1"].Readings[1].Place!.File, "C1", 3), logs["C1"].Readings[1].Source);

        // and the readings of one sheet share one place rather than each holding its own
        Assert.All(logs["C3"].Readings, r => Assert.Same(logs["C3"].Readings[0].Place, r.Place));
        Assert.NotSame(logs["C1"].Readings[0].Place, logs["C3"].Readings[0].Place);
    }

    [Fact]
    public void Sugar_and_temperature_columns_of_a_lot_make_one_reading_and_a_bad_cell_leaves_out_only_its_lot()
    {
        // Given a workbook board with a title row, Excel dates, per lot a °Bx or SG column and a °F column, a note column,
        // and the word "racked" in one lot's sugar cell
        using var folder = new TestFolder();
        folder.Text("lots.csv", Lots);
        string path = folder.PathOf("board.xlsx");
        using (var wb = new XLWorkbook())
        {
            var ws = wb.Worksheets.Add("Ferments 2025");
            Workbooks.Fill(ws, ["Tank board, 2025 reds"], [], ["Date", "C1 Brix", "C1 °F", "C2 (SG)", "C2 temp °F", "Notes"],
                [new DateTime(2025, 9, 20, 8, 0, 0), 24.0, 62.6, 1.104, 64.4, "punched down"],
                [new DateTime(2025, 9, 21, 8, 0, 0), 21.8, 68.0, "racked", 70.0, null]);
            wb.SaveAs(path);
        }

        // When it is read
        var set = folder.Read("lots.csv", "board.xlsx");

        // Then C1 has two readings with sugar and temperature (62.6 °F = 17.0 °C), C2 one (1.104 SG, 64.4 °F = 18.0 °C);
        // the "racked" cell is an error naming its row, column and value; the notes column is reported as not used
        var logs = set.Logs.ToDictionary(l => l.LotId);
        Assert.Equal([24.0, 21.8], logs["C1"].Readings.Select(r => r.Sugar!.Value.Brix));
        Assert.Equal(17.0, logs["C1"].Readings[0].TemperatureC!.Value, 9);
        var c2 = Assert.Single(logs["C2"].Readings);
        Assert.Equal(1.104, c2.Sugar!.Value.SpecificGravity, 6);
        Assert.Equal(18.0, c2.TemperatureC!.Value, 9);
        var errors = set.Issues.Where(i => i.Severity == IssueSeverity.Error).ToArray();
        var racked = Assert.Single(errors);
        Assert.Equal((5, "C2 (SG)", "racked"), (racked.Row!.Value, racked.Column, racked.Value));
        Assert.Contains(set.Issues, i => i.Code == IssueCodes.ColumnNotUsed && i.Column == "Notes");
        var account = Assert.Single(set.Accounts, a => a.File.EndsWith("board.xlsx", StringComparison.Ordinal));
        Assert.Equal((2, 2, 3), (account.RowsRead, account.LogReadingsUsed, account.ReadingsInRows!.Value));
    }

    [Theory]
    [InlineData("C04", "C04", false)]
    [InlineData("C04 °Bx", "C04", false)]
    [InlineData("Tank 6 (SG)", "Tank 6", false)]
    [InlineData("T6 temp °F", "T6", true)]
    [InlineData("T6 °C", "T6", true)]
    [InlineData("Tank C", "Tank C", false)]
    [InlineData("Brix T4", "T4", false)]
    [InlineData("SG Tank 6", "Tank 6", false)]
    [InlineData("Temp T4", "T4", true)]
    [InlineData("°F T4", "T4", true)]
    [InlineData("Must temp T4", "T4", true)]
    public void A_lot_columns_header_gives_the_lot_id_and_whether_it_holds_temperatures(string header, string lot, bool temperature)
    {
        Assert.Equal((lot, temperature), WideLogRows.Parse(header));
    }

    [Fact]
    public void A_board_of_two_tanks_beside_a_date_and_a_time_is_read_as_a_board_not_as_an_empty_lots_table()
    {
        // Given a small cellar's board: Date, Time and two tank columns (the date and time alone name two fields)
        using var folder = new TestFolder();
        var board = folder.Text("board-2026.csv", "Date,Time,T1,T2\n2026-09-14,08:00,24.0,22.5\n2026-09-15,08:00,21.5,21.0\n");

        // When it is read
        var set = folder.Read(board);

        // Then it is a log with a column per tank: two logs of two readings, both rows used, nothing refused
        Assert.Equal([("T1", 2), ("T2", 2)], set.Logs.Select(l => (l.LotId, l.Readings.Count)).Order());
        var account = Assert.Single(set.Accounts);
        Assert.Equal(("log, one column per lot", 2, 2, 0), (account.Kind, account.RowsRead, account.LogReadingsUsed, account.RowsReported));
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
    }

    [Fact]
    public void A_board_headed_by_measurement_first_gives_each_tank_its_sugar_and_temperature()
    {
        // Given a board typed "Brix T4, Brix T5, Temp T4, Temp T5" (the measurement before the tank), with notes
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2026.csv", "Lot,Yeast,Brix\nT4,ZR-3,25.2\nT5,ZR-9,24.0\n");
        var board = folder.Text("board-2026.csv",
            "Date,Time,Brix T4,Brix T5,Temp T4,Temp T5,Notes\n2026-09-14,18:00,24.9,23.8,19.0,18.2,\n2026-09-15,08:00,23.6,22.9,21.5,20.0,PO both\n");

        // When they are read as lots still fermenting
        var set = folder.Read(new IntakeOptions { RunningLots = true }, lots, board);

        // Then the lots are T4 and T5 (not "Brix T4" and "Temp T4"), each reading holding its sugar and temperature
        var logs = set.Logs.ToDictionary(l => l.LotId);
        Assert.Equal(["T4", "T5"], logs.Keys.Order());
        Assert.Equal([(24.9, 19.0), (23.6, 21.5)], logs["T4"].Readings.Select(r => (r.Sugar!.Value.Brix, r.TemperatureC!.Value)));
        Assert.DoesNotContain(set.Issues, i => i.Code == IssueCodes.LogWithoutLot);
        Assert.Contains(set.Issues, i => i.Code == IssueCodes.OneColumnPerLot && i.Message.Contains("2 lots: T4, T5", StringComparison.Ordinal));
    }

    [Fact]
    public void A_sheet_with_one_numeric_column_beside_the_date_is_not_taken_for_a_board()
    {
        // Given a date column and one column of numbers under a header that names no field (it could be anything)
        using var folder = new TestFolder();
        folder.Text("misc.csv", "Date,Pressings\n2025-09-10,4\n2025-09-11,6\n");

        // When it is read / Then nothing is guessed: no table is found, as before
        var set = folder.Read("misc.csv");
        Assert.Empty(set.Logs);
        Assert.Contains(set.Issues, i => i.Code == IssueCodes.NoTableFound);
    }

    [Fact]
    public void A_tanks_must_temperature_is_read_beside_its_cap_temperature()
    {
        // Given a board with one column per tank: its Brix, its cap and its must temperature
        using var folder = new TestFolder();
        folder.Text("lots.csv", "Lot,Season,Strain,Brix,ABV\nT4,2025,QV-7,24.0,14.1\n");
        folder.Text("log.csv", "Date,Brix T4,Cap temp T4,Must temp T4\n2025-09-10 08:00,22.0,31.5,26.0\n2025-09-11 08:00,17.5,34.0,28.5\n");

        // When it is read
        var set = folder.Read("lots.csv", "log.csv");

        // Then T4's readings carry the must's temperatures, and the cap column is named as not read, with why
        Assert.Equal([26.0, 28.5], set.Logs.Single().Readings.Select(r => r.TemperatureC!.Value));
        var dup = Assert.Single(set.Issues, i => i.Code == IssueCodes.DuplicateColumn);
        Assert.Equal("Cap temp T4", dup.Column);
        Assert.Contains("the must's, 'Must temp T4', was read instead", dup.Message, StringComparison.Ordinal);
        Assert.DoesNotContain(set.Issues, i => i.Code == IssueCodes.ColumnNotUsed);
    }
}
