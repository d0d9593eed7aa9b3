using System.Globalization;
using System.Text;
using YieldBench.Core.Lots;

namespace YieldBench.Intake.Tests;

/// <summary>
/// The quick readings of common cells (plain decimals, ISO dates) give exactly what
/// the general readings give, and row classification (summary, note, blank) and unit settling keep their behaviour.
/// </summary>
public class FastPathTests
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    [Fact]
    public void Plain_decimal_text_reads_as_the_correctly_rounded_double()
    {
        var random = new Random(7);
        for (int n = 0; n < 20000; n++)
        {
            int digits = random.Next(1, 16);
            var sb = new StringBuilder();
            if (random.Next(4) == 0)
            {
                sb.Append('-');
            }

            int point = random.Next(digits + 1);
            for (int i = 0; i < digits; i++)
            {
                if (i == point && i > 0)
                {
                    sb.Append('.');
                }

                sb.Append((char)('0' + random.Next(10)));
            }

            string text = sb.ToString();
            Assert.Equal(CellProblem.None, CellValues.Number(text, false, out double value, out _));
            Assert.True(BitConverter.DoubleToInt64Bits(double.Parse(text, NumberStyles.Float, Inv)) == BitConverter.DoubleToInt64Bits(value), text);
        }
    }

    [Fact]
    public void Any_number_text_reads_as_the_general_parser_reads_it()
    {
        var random = new Random(11);
        string[] pieces = ["0", "1", "7", "9", ".", ",", "-", "+", " ", "%", "e", "#", "\u2212", "\u00A0", "12", "345"];
        for (int n = 0; n < 20000; n++)
        {
            var sb = new StringBuilder();
            int length = random.Next(1, 9);
            for (int i = 0; i < length; i++)
            {
                sb.Append(pieces[random.Next(pieces.Length)]);
            }

            string text = sb.ToString();
            foreach (bool decimalComma in new[] { false, true })
            {
                var fast = CellValues.Number(text, decimalComma, out double v1, out string? a1);
                var general = CellValues.ParseNumberTextGeneral(text, decimalComma, out double v2, out string? a2);
                Assert.True(fast == general && a1 == a2 && BitConverter.DoubleToInt64Bits(v1) == BitConverter.DoubleToInt64Bits(v2), $"'{text}' ({decimalComma}): {fast} {v1} {a1} vs {general} {v2} {a2}");
            }
        }
    }

    [Fact]
    public void Iso_like_date_text_reads_as_the_regular_expressions_read_it()
    {
        var random = new Random(13);
        string[] years = ["2024", "2023", "1899", "1900", "2100", "2101", "202", "20245"];
        string[] separators = ["-", "/", ".", "_"];
        string[] months = ["1", "01", "02", "2", "12", "13", "0", "123"];
        string[] days = ["1", "09", "28", "29", "30", "31", "32", "0", ""];
        string[] times = ["", " 7:05", " 07:05", "T23:59:59", " 24:00", " 12:60", " 1:2", " 12:30:5", " 12:30:45.123", " 12:30:45.", " 12:30.5", "t12:00", "  8:00", " 08:00:60", "T8:00:00.0000000000001"];
        string[] ends = ["", "", "x", " ", "Z", "\n"];
        for (int n = 0; n < 20000; n++)
        {
            string text = years[random.Next(years.Length)] + separators[random.Next(separators.Length)] + months[random.Next(months.Length)]
                + separators[random.Next(separators.Length)] + days[random.Next(days.Length)] + times[random.Next(times.Length)] + ends[random.Next(ends.Length)];
            var order = (DateOrder)random.Next(4);
            var fast = CellValues.Date(text, order, out var d1, out var f1, out var m1);
            var general = CellValues.ParseDateTextGeneral(text.Trim(), order, out var d2, out var f2, out var m2);
            Assert.True(fast == general && d1 == d2 && f1 == f2 && m1 == m2, $"'{text}': {fast} {d1:o} vs {general} {d2:o}");
        }
    }

    [Fact]
    public void Summary_note_and_blank_rows_are_told_apart_from_lots()
    {
        // Given a lots CSV with lots, summary rows of several forms, notes, and blank rows
        using var folder = new TestFolder();
        string name = folder.Text("lots-2023.csv", string.Join("\n",
            "Lot,Yeast,Brix,Alcohol % v/v",
            "23-001,QX-7,24.0,14.0",
            "Average,,24.0,14.0",
            "Total of all lots,,,",
            "avg. for season,,,",
            "Std dev,,,",
            "Grand total:,,,",
            "sub total lots,,,",
            "Count 5,,,",
            "Min for 2023,,,",
            "MEAN,,,",
            "Maximum value,,,",
            "Tank 4 cooled overnight,,,",
            ",,,",
            "   ",
            "",
            "Mean-Lot,QX-7,24.0,14.0",
            "23-002,QX-7,24.0,14.0") + "\n");

        // When it is read
        var set = folder.Read(new IntakeOptions { Season = 2023 }, name);

        // Then only the lots are used, each summary and note row gives one warning, and the blank rows none
        Assert.Equal(["23-001", "Mean-Lot", "23-002"], set.Lots.Select(l => l.LotId));
        Assert.Equal(
            [
                (3, "summary-row-skipped", "Average"), (4, "summary-row-skipped", "Total of all lots"), (5, "summary-row-skipped", "avg. for season"),
                (6, "summary-row-skipped", "Std dev"), (7, "summary-row-skipped", "Grand total:"), (8, "summary-row-skipped", "sub total lots"),
                (9, "note-row-skipped", "Count 5"), (10, "summary-row-skipped", "Min for 2023"), (11, "summary-row-skipped", "MEAN"),
                (12, "note-row-skipped", "Maximum value"), (13, "note-row-skipped", "Tank 4 cooled overnight"),
            ],
            set.Issues.Where(i => i.Code != "lots-without-log").Select(i => (i.Row ?? 0, i.Code, i.Value ?? "")));
        var account = Assert.Single(set.Accounts);
        Assert.Equal((17, 3, 3, 3, 8), (account.RowsRead, account.LotsUsed, account.RowsReported, account.BlankRowsSkipped, account.SummaryRowsSkipped));
    }

    [Fact]
    public void A_sugar_unit_from_the_values_shows_the_range_of_the_values_on_that_scale()
    {
        // Given a starting sugar column without unit whose values are °Brix but for one SG value
        using var folder = new TestFolder();
        string name = folder.Text("lots-2023.csv", "Lot,Yeast,Start sugar,ABV\nA-01,QX-7,22.0,14\nA-02,QX-7,24.5,14\nA-03,QX-7,23.1,14\nA-04,QX-7,1.095,14\n");

        // When it is read
        var set = folder.Read(name);

        // Then the column is read as °Brix, the range shown leaves out the SG value, which is reported on its row
        var unit = Assert.Single(set.Issues, i => i.Code == "unit-from-values");
        Assert.Equal("The header gives no unit; the values (22 to 24.5) look like °Brix, so they were read as °Brix. State the unit in the header, e.g. 'Starting sugar (°Brix)'.", unit.Message);
        Assert.Equal(["A-01", "A-02", "A-03"], set.Lots.Select(l => l.LotId));
        Assert.Contains(set.Issues, i => i.Code == "unit-differs-in-column" && i.Row == 5 && i.Value == "1.095");
    }

    [Fact]
    public void Iso_dates_and_times_in_lots_and_logs_are_read_to_the_second()
    {
        // Given lots and a log with ISO dates in several forms, one of them impossible
        using var folder = new TestFolder();
        folder.Text("lots-2023.csv", "Lot,Yeast,Brix,ABV,Inoculated,Dry date\nA-01,QX-7,24,14,2023-9-4 7:05,2023/09/20\nA-02,QX-7,24,14,2023.09.05T07:05:09.5,2023-02-30\n");
        folder.Text("logs-2023.csv", "Lot,Timestamp,Brix\nA-01,2023-09-04 08:00,24\nA-01,2023-09-05T08:30:15,20\nA-01,2023-09-06 24:00,18\n");

        // When they are read
        var set = folder.Read("lots-2023.csv", "logs-2023.csv");

        // Then each valid form gives its date and time, and each impossible one is reported where it stands
        Assert.Equal(new DateTime(2023, 9, 4, 7, 5, 0), set.Lots[0].InoculationDate);
        Assert.Equal(new DateTime(2023, 9, 20), set.Lots[0].DryDate);
        Assert.Equal(new DateTime(2023, 9, 5, 7, 5, 9), set.Lots[1].InoculationDate);
        Assert.Null(set.Lots[1].DryDate);
        Assert.Contains(set.Issues, i => i.Code == "not-a-date" && i.File == "lots-2023.csv" && i.Row == 3 && i.Column == "Dry date" && i.Value == "2023-02-30");
        var log = Assert.Single(set.Logs);
        Assert.Equal([new DateTime(2023, 9, 4, 8, 0, 0), new DateTime(2023, 9, 5, 8, 30, 15)], log.Readings.Select(r => r.Timestamp));
        Assert.Contains(set.Issues, i => i.Code == "not-a-date" && i.File == "logs-2023.csv" && i.Row == 4 && i.Column == "Timestamp" && i.Value == "2023-09-06 24:00");
    }

    [Theory]
    [InlineData("-0", "0", "-0")]
    [InlineData("0", "-0", "0")]
    public void A_zero_written_with_a_minus_shows_in_a_unit_range_as_it_was_read(string first, string second, string shownLow)
    {
        // Given a log whose sugar column gives no unit and holds both 0 and -0 as its lowest readings
        using var folder = new TestFolder();
        string name = folder.Text("log-2023.csv", $"Lot,Timestamp,Sugar\nA-01,2023-09-01 08:00,24\nA-01,2023-09-02 08:00,{first}\nA-01,2023-09-03 08:00,{second}\nA-01,2023-09-04 08:00,12\n");

        // When it is read
        var set = folder.Read(name);

        // Then the range shown starts at the zero a sort of the values puts first
        var unit = Assert.Single(set.Issues, i => i.Code == "unit-from-values");
        Assert.Equal($"The header gives no unit; the values ({shownLow} to 24) look like °Brix, so they were read as °Brix. State the unit in the header, e.g. 'Sugar (°Brix)'.", unit.Message);
    }
}
