using YieldBench.Core.Lots;

namespace YieldBench.Intake.Tests;

/// <summary>
/// Cellar files of an invented US estate (Quillon Ridge Cellars, strains QX-14, QX-22) in shapes a new user brought:
/// several tanks' logs stacked in one sheet, gallons, pounds and kilolitres, lab values written as bounds.
/// </summary>
public class CellarFilesRoundFiveTests
{
    private const string Lots = "Lot,Vintage,Yeast,Brix at crush,Inoculated,Alc %\n"
        + "25-QR-01,2025,QX-14,24.6,2025-10-04,14.1\n25-QR-02,2025,QX-14,25.8,2025-10-05,14.3\n25-QR-03,2025,QX-22,22.1,2025-10-06,12.9\n";

    [Fact]
    public void Tank_logs_stacked_in_one_sheet_under_lot_headings_are_read_as_each_lots_log()
    {
        // Given lots and one log sheet with no lot column holding three tanks' readings one block under another, each
        // block under a row naming its lot (the first above the header), the header typed again under the others
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2025.csv", Lots);
        var log = folder.Text("stacked-log.csv",
            "Ferment log 2025\n25-QR-01\nDate,Time,Brix,Temp °F\n5-Oct,08:00,24.6,62\n6-Oct,08:00,22.0,70\n7-Oct,08:00,17.5,78\n\n"
            + "25-QR-02\nDate,Time,Brix,Temp °F\n6-Oct,08:00,25.8,60\n7-Oct,08:00,24.0,66\n\n"
            + "25-QR-03\nDate,Time,Brix,Temp °F\n7-Oct,08:00,22.1,55\n8-Oct,08:00,21.5,56\n");

        // When both are read
        var set = folder.Read(lots, log);

        // Then each block is its lot's log, dated in the lot's year (before, every reading was refused and the headings
        // and repeated headers were not-a-date errors)
        var logs = set.Logs.ToDictionary(l => l.LotId);
        Assert.Equal(["25-QR-01", "25-QR-02", "25-QR-03"], logs.Keys.Order());
        Assert.Equal([24.6, 22.0, 17.5], logs["25-QR-01"].Readings.Select(r => Math.Round(r.Sugar!.Value.Brix, 6)));
        Assert.Equal([new DateTime(2025, 10, 6, 8, 0, 0), new DateTime(2025, 10, 7, 8, 0, 0)], logs["25-QR-02"].Readings.Select(r => r.Timestamp));
        Assert.Equal(13.333333, Math.Round(logs["25-QR-03"].Readings[1].TemperatureC!.Value, 6)); // (56 − 32) × 5/9
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);

        // and the layout is said once, naming each heading's lot and row and the repeated headers
        var said = Assert.Single(set.Issues, i => i.Code == IssueCodes.LogBlocks);
        Assert.Equal((IssueSeverity.Warning, 2, "25-QR-01"), (said.Severity, said.Row, said.Value));
        Assert.Equal(
            "The log has no lot column and holds its readings in blocks, each under a row naming its lot: '25-QR-01' (row 2, above the header), '25-QR-02' (row 8), '25-QR-03' (row 13). "
            + "Each reading was read as the lot of the heading above it, and the headings were counted with the summary rows. The header typed again (rows 9, 14) was passed over as structure. "
            + "If a heading names a tank rather than the lot, write the lot's id in it; or add a Lot column.",
            said.Message);

        // and every row balances: 7 readings, 2 blank rows, 2 headings and 2 repeated headers
        var account = Assert.Single(set.Accounts, a => a.File == log);
        Assert.Equal((13, 7, 0, 2, 4), (account.RowsRead, account.LogReadingsUsed, account.RowsReported, account.BlankRowsSkipped, account.SummaryRowsSkipped));
    }

    [Fact]
    public void Stacked_blocks_without_a_repeated_header_take_their_lot_from_a_heading_after_a_blank_row_and_a_note_stays_no_heading()
    {
        // Given a log whose blocks are headed only by a tank-board name after a blank row; the first readings sit under
        // the header with no heading (they are the sheet's own lot), and a note without a digit lies between readings
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2025.csv", Lots);
        var log = folder.Text("25-QR-01.csv",
            "Date,Time,SG,Temp\n2025-10-05,08:00,1.102,17\n2025-10-06,08:00,1.090,21\n\n25-QR-02\n2025-10-06,08:00,1.108,16\n2025-10-07,08:00,1.100,19\n\nracked\n2025-10-08,08:00,1.085,23\n");

        // When read
        var set = folder.Read(lots, log);

        // Then the readings above the heading are the sheet's lot, those below it 25-QR-02's; the lone word "racked"
        // (no digit) is no heading: its row is reported as before and the reading under it stays 25-QR-02's
        var logs = set.Logs.ToDictionary(l => l.LotId);
        Assert.Equal(2, logs["25-QR-01"].Readings.Count);
        Assert.Equal(3, logs["25-QR-02"].Readings.Count);
        var said = Assert.Single(set.Issues, i => i.Code == IssueCodes.LogBlocks);
        Assert.Contains("'25-QR-02' (row 5)", said.Message, StringComparison.Ordinal);
        Assert.Contains("(the readings above the first heading as '25-QR-01', the sheet's name)", said.Message, StringComparison.Ordinal);
        Assert.Single(set.Issues, i => i.Row == 9 && i.Value == "racked");
    }

    [Fact]
    public void A_header_typed_again_in_a_one_lot_log_is_structure_not_a_row_left_out()
    {
        // Given a one-lot log (named by its file) whose header is typed again half way down, as a sheet pasted in two goes
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2025.csv", Lots);
        var log = folder.Text("25-QR-03.csv", "Date,Time,Brix,Temp\n2025-10-07,08:00,22.1,13\n2025-10-08,08:00,21.0,14\nDate,Time,Brix,Temp\n2025-10-09,08:00,19.0,15\n");

        // When read
        var set = folder.Read(lots, log);

        // Then its three readings are used and the repeated header is counted as structure, said once (before: a
        // not-a-date error and check's exit code 1)
        Assert.Equal(3, Assert.Single(set.Logs).Readings.Count);
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
        var said = Assert.Single(set.Issues, i => i.Code == IssueCodes.LogBlocks);
        Assert.Equal(4, said.Row);
        Assert.StartsWith("The header is typed again at row 4 ", said.Message, StringComparison.Ordinal);
        var account = Assert.Single(set.Accounts, a => a.File == log);
        Assert.Equal((4, 3, 0, 1), (account.RowsRead, account.LogReadingsUsed, account.RowsReported, account.SummaryRowsSkipped));
    }
}
