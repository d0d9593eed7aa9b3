using System.IO.Compression;
using System.Text;
using ClosedXML.Excel;
using YieldBench.Core.Lots;
using YieldBench.Intake;

namespace YieldBench.Intake.Tests;

/// <summary>Lots workbooks kept by hand over years, and the exports cellars make of them (an invented winery, Quernby Ridge).</summary>
public sealed class CellarBookTests
{
    [Theory]
    [InlineData("Lot,Yeast,Season,Harvest Brix,Crush Brix,Alc\n")]
    [InlineData(",,,Must,Must,Lab\nLot,Yeast,Season,Harvest Brix,Crush Brix,Alc\n")]
    public void A_column_the_user_maps_is_read_before_an_earlier_column_a_synonym_matches(string header)
    {
        // Given two starting-sugar columns (a field estimate before picking, and the reading at crush), perhaps under a
        // group label, and the mapping the duplicate-column message advises: --column starting_sugar="Crush Brix"
        using var folder = new TestFolder();
        var lots = folder.Text("cellar-2024.csv", header + "24-CH-01,QR-A4,2024,22.0,24.0,14.1\n");

        // When read
        var set = folder.Read(new IntakeOptions { ColumnMappings = ["starting_sugar=Crush Brix"] }, lots);

        // Then the mapped column is read (24.0, not 22.0), and the other is named as not read because of the mapping
        Assert.Equal(24.0, Assert.Single(set.Lots).StartingSugar.Brix, 1e-9);
        var dup = Assert.Single(set.Issues, i => i.Code == IssueCodes.DuplicateColumn);
        Assert.EndsWith("Harvest Brix", dup.Column, StringComparison.Ordinal);
        Assert.Equal("This column also maps to starting_sugar, but your mapping names 'Crush Brix' for it, so that one was read and this one was not.", dup.Message);
    }

    [Fact]
    public void A_column_of_dates_that_read_both_ways_is_read_in_the_order_that_gathers_them_within_the_season()
    {
        // Given a French export (semicolons, decimal commas) whose inoculation dates all have day and month of 12 or less:
        // day first they are 5 Sep to 5 Oct 2025 (30 days), month first 9 May to 9 Dec (214 days)
        using var folder = new TestFolder();
        var lots = folder.Text("export-2025.csv",
            "Lot;Levure;Millésime;Moût (°Bx);Alcool (% vol);Date levurage\r\n"
            + "25-MU-01;QR-A4;2025;21,2;12,4;05/09/2025\r\n25-MU-02;QR-A4;2025;20,9;12,1;06/09/2025\r\n"
            + "25-PG-01;WX-17;2025;23,4;13,6;10/09/2025\r\n25-GE-01;WX-17;2025;24,0;13,9;12/09/2025\r\n"
            + "25-PN-01;QR-B9;2025;23,8;13,4;05/10/2025\r\n");

        // When read
        var set = folder.Read(lots);

        // Then every date is read day first, said once for the column, and no date is left empty as ambiguous
        Assert.Equal(new DateTime(2025, 10, 5), set.Lots.Single(l => l.LotId == "25-PN-01").InoculationDate);
        Assert.Equal(new DateTime(2025, 9, 6), set.Lots.Single(l => l.LotId == "25-MU-02").InoculationDate);
        Assert.DoesNotContain(set.Issues, i => i.Code == IssueCodes.AmbiguousDate);
        var said = Assert.Single(set.Issues, i => i.Code == IssueCodes.DateOrderFromSpan);
        Assert.Equal("Date levurage", said.Column);
        Assert.Equal(IssueSeverity.Warning, said.Severity);
        Assert.Equal("No date of the column has a part above 12 to say which is the day, so its 5 dates such as '05/09/2025' read both ways. "
            + "They were read day first (day/month): so they fall within 30 days, as one season's dates do, while month first would spread them over 214 days. "
            + "If they are month first, write them as year-month-day and check again.", said.Message);
    }

    [Fact]
    public void A_log_dated_month_first_with_no_day_above_12_is_read_month_first_and_two_dates_alone_stay_ambiguous()
    {
        // Given a lot and its log from a cellar writing month/day (9/5 to 9/9: five days; day first they would be 9 May to 9 Sep)
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2025.csv", "Lot,Yeast,Season,Brix,Alc\nT4,QR-B9,2025,25.1,14.7\nT5,QR-B9,2025,24.0,14.0\n");
        var log = folder.Text("log.csv", "Lot,Date,Time,Brix\nT4,9/5/2025,08:00,25.0\nT4,9/6/2025,08:00,22.1\nT4,9/7/2025,08:00,16.0\nT4,9/8/2025,08:00,8.2\nT4,9/9/2025,08:00,1.0\n");
        var two = folder.Text("log-t5.csv", "Lot,Date,Time,Brix\nT5,9/5/2025,08:00,24.0\nT5,9/6/2025,08:00,21.0\n");

        // When read
        var set = folder.Read(lots, log, two);

        // Then T4's readings run from 5 to 9 September, said once
        var t4 = set.Logs.Single(l => l.LotId == "T4").Readings;
        Assert.Equal([5, 6, 7, 8, 9], t4.Select(r => r.Timestamp.Day));
        Assert.All(t4, r => Assert.Equal(9, r.Timestamp.Month));
        Assert.Contains("They were read month first (month/day): so they fall within 4 days", Assert.Single(set.Issues, i => i.Code == IssueCodes.DateOrderFromSpan && i.File == log).Message, StringComparison.Ordinal);

        // and two dates alone do not settle the order: each is still ambiguous, never guessed
        Assert.Equal(2, set.Issues.Count(i => i.Code == IssueCodes.AmbiguousDate && i.File == two));
    }

    [Fact]
    public void Variety_headings_between_groups_and_a_total_of_a_column_are_structure_not_lots_left_out()
    {
        // Given a cellar book grouped by variety: a heading row over each group (one word, two words), a spacer row,
        // and at the foot a total and an average of a column ("Total volume", "Average Brix")
        using var folder = new TestFolder();
        var lots = folder.Text("cellar-2024.csv",
            "Lot,Variety,Yeast,Season,Volume (L),Brix,Alc\n"
            + "Chardonnay,,,,,,\n24-CH-01,Chardonnay,QR-A4,2024,2400,23.4,13.6\n24-CH-02,Chardonnay,QR-A4,2024,2350,24.1,13.5\n,,,,,,\n"
            + "Pinot noir,,,,,,\n24-PN-01,Pinot Noir,QR-B9,2024,3100,25.2,14.6\n,,,,,,\n"
            + "Total volume,,,,7850,,\nAverage Brix,,,,,24.2,\n"
            + "24-XX-09,,,,,,\nnote: tank 4 cooled overnight,,,,,,\n");

        // When read
        var set = folder.Read(lots);

        // Then the three lots are used; the two headings and the two foot rows are counted with the summary rows;
        // a lone lot id and a note are still reported (left out), as before
        Assert.Equal(["24-CH-01", "24-CH-02", "24-PN-01"], set.Lots.Select(l => l.LotId));
        var account = Assert.Single(set.Accounts);
        Assert.Equal((11, 3, 2, 2, 4), (account.RowsRead, account.LotsUsed, account.RowsReported, account.BlankRowsSkipped, account.SummaryRowsSkipped));
        var headings = set.Issues.Where(i => i.Code == IssueCodes.GroupHeading).ToList();
        Assert.Equal([(2, "Chardonnay"), (6, "Pinot noir")], headings.Select(i => (i.Row!.Value, i.Value!)));
        Assert.Equal("The row holds only 'Pinot noir', the variety of lots below it: it was read as a heading over a group of lots, not as a lot, and counted with the summary rows. Nothing of it is used; each lot's own variety cell is.", headings[1].Message);
        Assert.Equal([9, 10], set.Issues.Where(i => i.Code == IssueCodes.SummaryRowSkipped).Select(i => i.Row!.Value));
        Assert.Equal([11], set.Issues.Where(i => i.Code == IssueCodes.MissingValue).Select(i => i.Row!.Value).Distinct());
        Assert.Equal([12], set.Issues.Where(i => i.Code == IssueCodes.NoteRowSkipped).Select(i => i.Row!.Value));
    }

    [Fact]
    public void A_visible_column_is_read_before_a_hidden_one_for_the_same_field_in_an_xlsx()
    {
        // Given a cellar book whose hidden column D keeps the field estimate before picking (22.0) beside the reading at
        // crush (24.0) the sheet shows
        using var folder = new TestFolder();
        using (var wb = new XLWorkbook())
        {
            var ws = wb.AddWorksheet("Cellar 2024");
            Workbooks.Fill(ws, ["Lot", "Yeast", "Season", "Harvest Brix", "Crush Brix", "Alc"], ["24-CH-01", "QR-A4", 2024, 22.0, 24.0, 14.1]);
            ws.Column(4).Hide();
            wb.SaveAs(folder.PathOf("cellar.xlsx"));
        }

        // When read
        var set = folder.Read("cellar.xlsx");

        // Then the shown reading is the starting sugar, and the hidden column is named as not read, with why
        Assert.Equal(24.0, Assert.Single(set.Lots).StartingSugar.Brix, 1e-9);
        var dup = Assert.Single(set.Issues, i => i.Code == IssueCodes.DuplicateColumn);
        Assert.Equal("Harvest Brix", dup.Column);
        Assert.Equal("This column is hidden in the workbook, and the column 'Crush Brix' the sheet shows maps to starting_sugar too, so that one was read and this one was not. To read this one, unhide it and map it with --column starting_sugar=HEADER.", dup.Message);
    }

    [Fact]
    public void A_visible_column_is_read_before_a_hidden_one_in_an_ods_and_a_hidden_column_alone_is_still_read()
    {
        // Given an .ods (as LibreOffice saves it) whose first starting-sugar column is collapsed, and whose only
        // alcohol column is collapsed too
        using var folder = new TestFolder();
        string Cell(object v) => v is string t ? $"<table:table-cell office:value-type=\"string\"><text:p>{t}</text:p></table:table-cell>"
            : $"<table:table-cell office:value-type=\"float\" office:value=\"{Convert.ToString(v, System.Globalization.CultureInfo.InvariantCulture)}\"/>";
        string Row(params object[] cells) => "<table:table-row>" + string.Concat(cells.Select(Cell)) + "</table:table-row>";
        string content = "<?xml version=\"1.0\" encoding=\"UTF-8\"?><office:document-content xmlns:office=\"urn:oasis:names:tc:opendocument:xmlns:office:1.0\" xmlns:table=\"urn:oasis:names:tc:opendocument:xmlns:table:1.0\" xmlns:text=\"urn:oasis:names:tc:opendocument:xmlns:text:1.0\"><office:body><office:spreadsheet><table:table table:name=\"Cellar 2024\">"
            + "<table:table-column table:number-columns-repeated=\"3\"/><table:table-column table:visibility=\"collapse\"/><table:table-column/><table:table-column table:visibility=\"collapse\"/>"
            + Row("Lot", "Yeast", "Season", "Harvest Brix", "Crush Brix", "Alc") + Row("24-CH-01", "QR-A4", 2024, 22.0, 24.0, 14.1)
            + "</table:table></office:spreadsheet></office:body></office:document-content>";
        using (var zip = new ZipArchive(File.Create(folder.PathOf("cellar.ods")), ZipArchiveMode.Create))
        {
            using (var w = new StreamWriter(zip.CreateEntry("mimetype", CompressionLevel.NoCompression).Open(), new UTF8Encoding(false)))
            {
                w.Write("application/vnd.oasis.opendocument.spreadsheet");
            }

            using (var w = new StreamWriter(zip.CreateEntry("content.xml").Open(), new UTF8Encoding(false)))
            {
                w.Write(content);
            }
        }

        // When read
        var set = folder.Read("cellar.ods");

        // Then the shown starting sugar is read, and the hidden alcohol column, the only one, is read as before
        var lot = Assert.Single(set.Lots);
        Assert.Equal((24.0, 14.1), (lot.StartingSugar.Brix, lot.FinalAlcohol.PercentVolume));
        Assert.Equal("Harvest Brix", Assert.Single(set.Issues, i => i.Code == IssueCodes.DuplicateColumn).Column);
    }

    [Fact]
    public void A_number_with_a_note_in_brackets_is_read_and_the_note_named_but_a_second_number_is_never_chosen()
    {
        // Given a hand-kept book: "24.1 (retest)", "13.5 % vol [lab]" and "24.6 (23.8)" (which of the two?)
        using var folder = new TestFolder();
        var lots = folder.Text("cellar-2024.csv",
            "Lot,Yeast,Season,Brix,Alc\n24-CH-02,QR-A4,2024,24.1 (retest),13.9\n24-CH-03,QR-A4,2024,22.8,13.5 % vol [lab]\n24-PN-03,QR-B9,2024,24.6 (23.8),14.4\n");

        // When read
        var set = folder.Read(lots);

        // Then the first two lots are used with their numbers, each note named in a warning at its cell
        Assert.Equal(24.1, set.Lots.Single(l => l.LotId == "24-CH-02").StartingSugar.Brix, 1e-9);
        Assert.Equal(13.5, set.Lots.Single(l => l.LotId == "24-CH-03").FinalAlcohol.PercentVolume, 1e-9);
        var notes = set.Issues.Where(i => i.Code == IssueCodes.NoteInCell).ToList();
        Assert.Equal([(2, "Brix", "24.1 (retest)"), (3, "Alc", "13.5 % vol [lab]")], notes.Select(i => (i.Row!.Value, i.Column!, i.Value!)));
        Assert.Equal("starting_sugar holds a number with a note in brackets: 24.1 was read as the value and the note 'retest' was not. If the note changes the number (a value to replace), type the number meant; keep notes in a notes column.", notes[0].Message);

        // and a note holding a number is no note: that lot is left out as before, never read as 24.6 or 23.8
        Assert.DoesNotContain(set.Lots, l => l.LotId == "24-PN-03");
        Assert.Contains(set.Issues, i => i.Code == IssueCodes.NotANumber && i.Row == 4 && i.Severity == IssueSeverity.Error);
    }

    [Fact]
    public void A_ferment_sheet_laid_across_is_an_error_saying_how_to_turn_it_not_a_sheet_passed_over_or_dates_read_as_lots()
    {
        // Given a workbook with a lots sheet and a tank's ferment sheet laid across (a title, then Date, Time, SG and
        // cap and juice temperatures each on a row, a column per day), and the same kind of sheet saved as a CSV
        using var folder = new TestFolder();
        using (var wb = new XLWorkbook())
        {
            Workbooks.Fill(wb.AddWorksheet("Lots"), ["Lot", "Yeast", "Season", "Start Brix", "Alc"], ["T4", "QR-B9", 2025, 25.1, 14.7]);
            Workbooks.Fill(wb.AddWorksheet("T4"),
                ["Tank 4 ferment sheet"],
                ["Date", new DateTime(2025, 9, 20), new DateTime(2025, 9, 21), new DateTime(2025, 9, 22)],
                ["Time", "7am", "7am", "8am"],
                ["SG", 1105, 1101, 1088],
                ["Cap temp °F", 64, 70, 80],
                ["Juice temp °F", 62, 66, 74]);
            wb.SaveAs(folder.PathOf("cellar.xlsx"));
        }

        var csv = folder.Text("T7.csv", "Date;20/09/2025;21/09/2025;22/09/2025;23/09/2025\r\nSG;1105;1101;1088;1070\r\nTemp °F;64;70;80;88\r\n");

        // When read
        var set = folder.Read("cellar.xlsx", csv);

        // Then each laid-across sheet is one error at its row of dates naming the readings and the fix (so check
        // exits 1), no sheet-skipped advice to map headers, and no date taken for a lot
        var across = set.Issues.Where(i => i.Code == IssueCodes.LogLaidAcross).ToList();
        Assert.Equal([("cellar.xlsx", "T4", 2), ("T7.csv", null, 1)], across.Select(i => (i.File, i.Sheet, i.Row!.Value)));
        Assert.All(across, i => Assert.Equal((IssueSeverity.Error, "Date"), (i.Severity, i.Column)));
        Assert.Equal("The sheet is a fermentation log laid across: its 3 dates run along row 2 and each reading has a row of its own (SG, Cap temp °F, Juice temp °F), so none of its readings was read. "
            + "YieldBench reads a log with a row per reading: copy the block and paste it transposed (Paste Special, Transpose) so that the date and each reading head a column, then check again.", across[0].Message);
        Assert.DoesNotContain(set.Issues, i => i.Code is IssueCodes.SheetSkipped or IssueCodes.OneColumnPerLot or IssueCodes.NoTableFound);
        Assert.Empty(set.Logs);
        Assert.Equal("T4", Assert.Single(set.Lots).LotId);
    }

    [Fact]
    public void Lab_results_under_ids_written_differently_are_not_joined_by_a_guess()
    {
        // Given a cellar sheet without final alcohol and the lab's sheet of results under its own ids (21CH1 for 21-CH-01)
        using var folder = new TestFolder();
        using (var wb = new XLWorkbook())
        {
            Workbooks.Fill(wb.AddWorksheet("Cellar"), ["Lot", "Yeast", "Vintage", "Crush Brix"], ["21-CH-01", "QR-A4", 2021, 23.4], ["21-PN-03", "QR-B9", 2021, 25.2]);
            Workbooks.Fill(wb.AddWorksheet("Lab results"), ["Sample ID", "Alc % vol", "RS g/L", "pH"], ["21CH1", 13.6, 1.2, 3.3], ["21PN3", 14.6, 2.1, 3.6]);
            wb.SaveAs(folder.PathOf("cellar.xlsx"));
        }

        // When read
        var set = folder.Read("cellar.xlsx");

        // Then no lot is made of a guess (before: three missing-column errors asked the lab sheet for a lot column, a
        // strain and a starting sugar): each lab row is an error naming the lot it looks like, and so is each lot
        var lab = set.Issues.Where(i => i.Sheet == "Lab results" && i.Severity == IssueSeverity.Error).ToList();
        Assert.Equal([(IssueCodes.LabResultWithoutLot, "21CH1"), (IssueCodes.LabResultWithoutLot, "21PN3")], lab.Select(i => (i.Code, i.Value)));
        Assert.Equal("The lab result for '21CH1' (no season given) matches no lot read, so it was not used. "
            + "A lot '21-CH-01' was read, perhaps the same lot written differently; YieldBench joins only ids written alike: write the id the same way on both sheets.", lab[0].Message);
        Assert.Equal(2, set.Issues.Count(i => i.Sheet == "Cellar" && i.Code == IssueCodes.NoLabResult));
        Assert.DoesNotContain(set.Issues, i => i.Code == IssueCodes.MissingColumn);
        Assert.Equal(2, set.Accounts.Single(a => a.Sheet == "Lab results").RowsReported);
        Assert.Empty(set.Lots);
    }

    [Fact]
    public void A_log_reading_with_a_date_and_no_time_stands_at_the_usual_reading_hour_said_once()
    {
        // Given a lot and its log read at 7am most days, once at 5pm, and on two days with the time left empty
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2025.csv", "Lot,Yeast,Season,Brix,Alc\nT5,WX-17,2025,23.2,13.5\n");
        var log = folder.Text("T5.csv", "Date,Time,Brix,Temp\n2025-09-22,7am,23.1,12.8\n2025-09-23,7am,22.6,13.5\n2025-09-24,5pm,19.0,15.6\n"
            + "2025-09-25,,16.1,16.7\n2025-09-26,7am,12.4,17.2\n2025-09-27,,8.0,17.8\n");

        // When read
        var set = folder.Read(lots, log);

        // Then the two readings stand at 07:00 (before: midnight, 7 hours early), said once at the first of them
        var readings = Assert.Single(set.Logs).Readings;
        Assert.Equal(new DateTime(2025, 9, 25, 7, 0, 0), readings[3].Timestamp);
        Assert.Equal(new DateTime(2025, 9, 27, 7, 0, 0), readings[5].Timestamp);
        Assert.Equal(new DateTime(2025, 9, 24, 17, 0, 0), readings[2].Timestamp);
        var said = Assert.Single(set.Issues, i => i.Code == IssueCodes.TimeMissing);
        Assert.Equal((5, "Time", IssueSeverity.Warning), (said.Row!.Value, said.Column!, said.Severity));
        Assert.Equal("2 reading(s) of the log have a date but no time (the first at row 5); each was read at 07:00, the time its other readings were most often taken, not at midnight. Rates and hours between readings lean on it: write the hour of each reading.", said.Message);
    }

    [Fact]
    public void Gravity_written_both_ways_in_a_column_with_no_unit_is_read_as_gravity_on_a_board_and_in_a_long_log()
    {
        // Given a French tank board ("T9 densité": the tank, then the word for density) and a long log headed only
        // "Reading", each with specific gravity mostly in thousandths and once as SG (1.066), as two people type a sheet
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2026.csv", "Lot,Yeast,Season,Brix,Alc\nT9,QR-B9,2026,25.8,14.9\nT12,QR-A4,2026,24.0,14.0\n");
        var board = folder.Text("suivi.csv", "Date;Heure;T9 densité;T9 °C\n2026-10-03;08:00;1108;18\n2026-10-04;08:00;1094;19\n2026-10-05;08:00;1.080;21\n2026-10-06;08:00;1066;22\n");
        var log = folder.Text("log.csv", "Lot,Date,Time,Reading\nT12,2026-10-03,08:00,1100\nT12,2026-10-04,08:00,1.090\nT12,2026-10-05,08:00,1075\n");

        // When read
        var set = folder.Read(lots, board, log);

        // Then T9's board column is its sugar in SG (before: lot 'T9 densité', every value read as g/L and refused as
        // out of range), and each value of the other form is read as the gravity it is, said once per column
        var t9 = set.Logs.Single(l => l.LotId == "T9").Readings;
        Assert.Equal([1.108, 1.094, 1.080, 1.066], t9.Select(r => Math.Round(r.Sugar!.Value.SpecificGravity, 9)));
        Assert.Equal([18.0, 19.0, 21.0, 22.0], t9.Select(r => r.TemperatureC!.Value));
        var t12 = set.Logs.Single(l => l.LotId == "T12").Readings;
        Assert.Equal([1.100, 1.090, 1.075], t12.Select(r => Math.Round(r.Sugar!.Value.SpecificGravity, 9)));
        Assert.Equal(["1.080", "1.090"], set.Issues.Where(i => i.Code == IssueCodes.UnitDiffersInColumn).Select(i => i.Value!));
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
    }

    [Theory]
    [InlineData("Couleur", "rouge", "blanc")]
    [InlineData("Farbe", "rot", "weiss")]
    [InlineData("Colore", "rosso", "bianco")]
    public void A_colour_column_headed_in_french_german_or_italian_is_read(string header, string red, string white)
    {
        // Given a European lots table whose colour column is headed in the cellar's language (its values were read
        // already; the header was a column no field reads)
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2026.csv", $"Lot;Levure;Millésime;Moût (°Bx);Alcool (% vol);{header}\nA1;QR-B9;2026;25,8;14,9;{red}\nA2;QR-A4;2026;22,0;12,9;{white}\n");

        // When read
        var set = folder.Read(lots);

        // Then each lot has its colour, and no column is left unread
        Assert.Equal([WineColour.Red, WineColour.White], set.Lots.Select(l => l.Colour));
        Assert.DoesNotContain(set.Issues, i => i.Code == IssueCodes.ColumnNotUsed);
    }

    [Fact]
    public void A_board_headed_by_tanks_beside_lots_named_by_id_names_the_lot_in_that_tank_without_joining_it()
    {
        // Given lots named by id with their tank as the vessel, and a tank board headed by the tanks
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2026.csv", "Lot,Yeast,Season,Tank,Brix,Alc\n26-SY-01,QR-B9,2026,T9,25.8,14.9\n26-SY-02,QR-B9,2026,T10,26.0,15.0\n");
        var board = folder.Text("board-2026.csv", "Date,Time,T9,T10\n2026-10-03,08:00,25.6,25.9\n2026-10-04,08:00,22.0,23.1\n");

        // When read
        var set = folder.Read(lots, board);

        // Then each tank's log is still a log of no lot (no join by a guess), and its warning names the lot in that tank
        Assert.DoesNotContain(set.Lots, l => set.Logs.Any(g => g.LotId == l.LotId));
        var t9 = Assert.Single(set.Issues, i => i.Code == IssueCodes.LogWithoutLot && i.Value == "T9");
        Assert.Equal("The fermentation log of lot 'T9' (season 2026) matches no lot read. Check the lot id, or add the lot to the lots sheet. "
            + "The lots table names 'T9' as the tank (vessel) of lot '26-SY-01'. If this is that lot's log, write the lot id '26-SY-01' in the log in place of the tank; a log is not joined by its tank, which holds other lots in other seasons.", t9.Message);
    }
}
