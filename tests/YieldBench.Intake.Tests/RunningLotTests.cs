using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Intake.Tests;

public class RunningLotTests
{
    [Fact]
    public void A_lots_table_without_final_alcohol_is_read_as_running_lots_with_their_logs()
    {
        // Given a table of lots still fermenting (no final alcohol) and its log in °F
        using var folder = new TestFolder();
        var lots = folder.Text("running-2026.csv",
            "Lot,Yeast,Must SG,Vessel,Capacity (L),Must volume (L),YAN (mg N/L),Inoculated,Colour\n" +
            "26-001,yb-r12,1.10101,Stainless tank,5000,4200,180,2026-09-10 10:00,red\n" +
            "26-002,YB-W22,1.09193,Barrel,225,,,,white\n");
        var log = folder.Text("running-log-2026.csv",
            "Lot,Timestamp,Brix,Temp (°F)\n" +
            "26-001,2026-09-10 17:30,23.6,66.2\n" +
            "26-001,2026-09-11 07:30,22.1,71.6\n");

        // When read as running lots
        var set = folder.Read(new IntakeOptions { RunningLots = true }, lots, log);

        // Then both rows are running lots, none a finished lot, and the log joins the first
        Assert.Empty(set.Lots);
        Assert.Equal(2, set.RunningLots.Count);
        var a = set.RunningLots[0];
        Assert.Equal(("26-001", 2026, "yb-r12", "Stainless tank", WineColour.Red), (a.LotId, a.Season, a.Strain, a.Vessel, a.Colour));
        Assert.Equal(24.0, a.StartingSugar.Brix, 0.01); // SG 1.10101 = 24 °Brix (Zoecklein et al., Appendix I, Table I-1)
        Assert.Equal(SugarScale.SpecificGravity, a.StartingSugarScale);
        Assert.Equal((5000.0, 4200.0, 180.0), (a.VesselCapacityL!.Value, a.Additions.MustVolumeL!.Value, a.YanMgL!.Value));
        Assert.Equal(new DateTime(2026, 9, 10, 10, 0, 0), a.InoculationDate);
        Assert.Equal(new SourceRef("running-2026.csv", null, 2), a.Source);
        var readings = Assert.Single(set.Logs).Readings;
        Assert.Equal(19.0, readings[0].TemperatureC!.Value, 1e-9); // 66.2 °F = (66.2 − 32) × 5/9 = 19 °C
        Assert.Contains(set.Accounts, x => x.Kind == "running lots" && x.LotsUsed == 2 && x.Balances);
        Assert.Contains(set.Issues, i => i.Code == "lots-without-log" && i.Message.Contains("26-002", StringComparison.Ordinal));
    }

    [Fact]
    public void Specific_gravity_written_both_ways_in_one_column_is_read_as_the_gravity_each_value_is()
    {
        // Given a must-SG column holding 1092 (thousandths) beside 1.088, and a log's SG column holding 1090 and 1086
        // beside 1.087 and 1.084 (two people typing one sheet)
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2026.csv", "Lot,Yeast,Must SG\nC6,QX-7,1092\nC7,QX-9,1.088\n");
        var log = folder.Text("log-2026.csv", "Lot,Date,SG\nC6,2026-09-10,1090\nC6,2026-09-11,1086\nC7,2026-09-10,1.087\nC7,2026-09-11,1.084\n");

        // When read as lots still fermenting
        var set = folder.Read(new IntakeOptions { RunningLots = true }, lots, log);

        // Then every value is used at the gravity it is: °Brix by the NBS-fitted cubic of docs/methods.md, evaluated in
        // python3: f=lambda S: ((182.4601*S-775.6821)*S+1262.7794)*S-669.5622 → f(1.092)=22.014119, f(1.088)=21.125576,
        // f(1.090)=21.570564, f(1.087)=20.902543
        var lot = set.RunningLots.ToDictionary(l => l.LotId);
        Assert.Equal(22.014119, lot["C6"].StartingSugar.Brix, 1e-6);
        Assert.Equal(21.125576, lot["C7"].StartingSugar.Brix, 1e-6);
        var logs = set.Logs.ToDictionary(l => l.LotId);
        Assert.Equal(21.570564, logs["C6"].Readings[0].Sugar!.Value.Brix, 1e-6);
        Assert.Equal(20.902543, logs["C7"].Readings[0].Sugar!.Value.Brix, 1e-6);
        Assert.All(set.Accounts, a => Assert.Equal(0, a.RowsReported));

        // and each column says once, as a warning, that it held both forms, naming the first value of the other form
        var said = set.Issues.Where(i => i.Code == IssueCodes.UnitDiffersInColumn).OrderBy(i => i.File).ToList();
        Assert.All(said, i => Assert.Equal(IssueSeverity.Warning, i.Severity));
        Assert.Equal([("lots-2026.csv", 2, "1092"), ("log-2026.csv", 2, "1090")], said.OrderByDescending(i => i.File).Select(i => (i.File, i.Row!.Value, i.Value!)));
        Assert.Contains("1 value(s) differ from the column's form (the first, '1092', read as SG 1.092)", said.Single(i => i.File == "lots-2026.csv").Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Notes_typed_in_a_logs_reading_cells_are_no_readings_and_leave_the_rest_of_the_row_used()
    {
        // Given a log with a note in the Brix cell of a row without temperature, "stuck?" in a temperature cell beside
        // a Brix, "dry" in a Brix cell beside a temperature, a blank row and a legitimate -1.5 °Brix near dryness
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2026.csv", "Lot,Yeast,Brix\nN1,QX-7,24.0\n");
        var log = folder.Text("N1.csv",
            "Date,Brix,Temp °C\n2026-09-02,23.0,20\n2026-09-03,pumped over,\n,,\n2026-09-08,1.2,stuck?\n2026-09-10,-1.5,21\n2026-09-12,dry,19\n");

        // When read as lots still fermenting
        var set = folder.Read(new IntakeOptions { RunningLots = true }, lots, log);

        // Then the note-only row is left out with a warning, the others keep their readings, and no error is raised
        var readings = Assert.Single(set.Logs).Readings;
        Assert.Equal([(23.0, 20.0), (1.2, double.NaN), (-1.5, 21.0), (double.NaN, 19.0)],
            readings.Select(r => (r.Sugar?.Brix ?? double.NaN, r.TemperatureC ?? double.NaN)));
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
        var skipped = Assert.Single(set.Issues, i => i.Code == IssueCodes.NoteRowSkipped);
        Assert.Equal((3, "Brix", "pumped over"), (skipped.Row!.Value, skipped.Column, skipped.Value));
        Assert.Equal([("stuck?", "Temp °C"), ("dry", "Brix")], set.Issues.Where(i => i.Code == IssueCodes.NotANumber).Select(i => (i.Value!, i.Column!)));
        var account = Assert.Single(set.Accounts, a => a.File == "N1.csv");
        Assert.Equal((6, 4, 1, 1), (account.RowsRead, account.LogReadingsUsed, account.RowsReported, account.BlankRowsSkipped));
    }

    [Fact]
    public void Columns_of_the_finished_wine_are_named_and_not_read_and_bad_rows_are_reported()
    {
        // Given a running table that still carries a final-alcohol column and a row without starting sugar
        using var folder = new TestFolder();
        var lots = folder.Text("running-2026.csv",
            "Lot,Yeast,Brix,Alcohol % v/v\n" +
            "26-001,YB-R12,24.1,\n" +
            "26-002,YB-R12,,\n" +
            "26-001,YB-R31,25.0,\n");

        // When read as running lots
        var set = folder.Read(new IntakeOptions { RunningLots = true }, lots);

        // Then the alcohol column is named once, the empty sugar and the repeated lot are reported, and the rows balance
        var lot = Assert.Single(set.RunningLots);
        Assert.Equal(24.1, lot.StartingSugar.Brix, 1e-9);
        var final = Assert.Single(set.Issues, i => i.Code == "final-column-not-read");
        Assert.Equal("Alcohol % v/v", final.Column);
        Assert.Contains(set.Issues, i => i.Code == "missing-value" && i.Row == 3);
        Assert.Contains(set.Issues, i => i.Code == "duplicate-lot" && i.Row == 4);
        var account = Assert.Single(set.Accounts);
        Assert.Equal(new SourceAccount("running-2026.csv", null, "running lots", 3, 1, 0, 2, 0, 0), account);
    }

    [Fact]
    public void Without_the_option_a_table_without_final_alcohol_is_still_refused()
    {
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2026.csv", "Lot,Yeast,Brix\n26-001,YB-R12,24.1\n");
        var set = folder.Read(lots);
        Assert.Empty(set.Lots);
        Assert.Empty(set.RunningLots);
        Assert.Contains(set.Issues, i => i.Code == "missing-column" && i.Message.Contains("final_abv", StringComparison.Ordinal));
    }
    [Fact]
    public void A_running_lot_with_one_reading_so_far_is_no_short_log_but_a_finished_lot_with_one_is()
    {
        // Given the same log of one reading, once for a lot still fermenting and once for a finished lot
        using var folder = new TestFolder();
        var running = folder.Text("running-2026.csv", "Lot,Yeast,Brix\n26-001,YB-R12,24.0\n");
        var finished = folder.Text("lots-2025.csv", "Lot,Yeast,Brix,Alc\n25-001,YB-R12,24.0,14.1\n");
        var log1 = folder.Text("log-2026.csv", "Lot,Timestamp,Brix\n26-001,2026-09-10 17:30,23.6\n");
        var log2 = folder.Text("log-2025.csv", "Lot,Timestamp,Brix\n25-001,2025-09-10 17:30,23.6\n");

        // When each is read
        var now = folder.Read(new IntakeOptions { RunningLots = true }, running, log1);
        var past = folder.Read(finished, log2);

        // Then the running lot's single reading is read with no warning (the forecast starts from it); the finished
        // lot's is log-too-short (the kinetics review cannot use it)
        Assert.Single(Assert.Single(now.Logs).Readings);
        Assert.DoesNotContain(now.Issues, i => i.Code == IssueCodes.LogTooShort);
        Assert.Contains(past.Issues, i => i.Code == IssueCodes.LogTooShort);
    }
}
