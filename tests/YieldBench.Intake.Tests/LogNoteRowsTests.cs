using YieldBench.Core.Lots;
using YieldBench.Intake;

namespace YieldBench.Intake.Tests;

/// <summary>Cellar notes typed on rows of their own in a log ("pumped over", "DAP 20 g/hL", "pressed").</summary>
public sealed class LogNoteRowsTests
{
    [Fact]
    public void Rows_of_words_with_no_reading_are_notes_said_as_such_not_readings_without_a_date()
    {
        // Given a log kept by hand: six readings, and three rows of notes, one alone in the lot column, one where the
        // date goes, one in the temperature cell of a dated row without a time
        using var folder = new TestFolder();
        folder.Text("lots.csv", "Lot,Strain,Brix,Alcohol,Season\n25-01,QR-A4,24.5,14.3,2025\n");
        folder.Text("log.csv", "Lot,Date,Time,Brix,Temp\n"
            + "25-01,2025-09-10,08:00,24.5,18.0\n25-01,2025-09-10,18:00,23.8,19.5\npumped over,,,,\n25-01,2025-09-11,08:00,21.9,22.0\n"
            + "25-01,DAP 20 g/hL,,,\n25-01,2025-09-11,18:00,19.0,24.5\n25-01,2025-09-12,08:00,15.5,26.0\n25-01,2025-09-12,,,pressed\n25-01,2025-09-12,18:00,12.0,26.5\n");

        // When read
        var set = folder.Read("lots.csv", "log.csv");

        // Then the six readings are read and each note row is one note-row-skipped warning at its row and column, with no
        // error (before: missing-timestamp at row 4 and not-a-date at row 6) and no time-missing for the skipped row 9
        Assert.Equal(6, Assert.Single(set.Logs).Readings.Count);
        var notes = set.Issues.Where(i => i.Code == IssueCodes.NoteRowSkipped).Select(i => (i.Row!.Value, i.Column, i.Value)).ToArray();
        Assert.Equal([(4, "Lot", "pumped over"), (6, "Date", "DAP 20 g/hL"), (9, "Temp", "pressed")], notes);
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
        Assert.DoesNotContain(set.Issues, i => i.Code == IssueCodes.TimeMissing);
        Assert.Equal(3, set.Accounts.Single(a => a.File == "log.csv").RowsReported);
    }

    [Fact]
    public void A_dated_row_with_no_reading_and_a_row_with_a_reading_but_no_date_stay_errors()
    {
        // Given a dated row with its readings left empty, and a reading with a note where its date goes
        using var folder = new TestFolder();
        folder.Text("lots.csv", "Lot,Strain,Brix,Alcohol,Season\n25-01,QR-A4,24.5,14.3,2025\n");
        folder.Text("log.csv", "Lot,Date,Time,Brix,Temp\n25-01,2025-09-10,08:00,24.5,18.0\n25-01,2025-09-10,18:00,,\n25-01,after racking,,21.0,20.0\n25-01,2025-09-11,08:00,21.9,22.0\n");

        // When read
        var set = folder.Read("lots.csv", "log.csv");

        // Then both are errors at their rows: a reading without a value, and a value without a date
        var errors = set.Issues.Where(i => i.Severity == IssueSeverity.Error).Select(i => (i.Row!.Value, i.Code)).ToArray();
        Assert.Equal([(3, IssueCodes.NoReading), (4, IssueCodes.NotADate)], errors);
        Assert.DoesNotContain(set.Issues, i => i.Code == IssueCodes.NoteRowSkipped);
    }
}
