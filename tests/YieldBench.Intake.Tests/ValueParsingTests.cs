namespace YieldBench.Intake.Tests;

public class ValueParsingTests
{
    [Theory]
    [InlineData("24.3", false, 24.3)]
    [InlineData("24,3", false, 24.3)]
    [InlineData(" 24,3 ", true, 24.3)]
    [InlineData("1.234,5", false, 1234.5)]
    [InlineData("1,234.5", false, 1234.5)]
    [InlineData("13.5%", false, 13.5)]
    [InlineData("\u22121.8", false, -1.8)]
    [InlineData("4 200", false, 4200)]
    [InlineData("4,200", true, 4.2)]
    public void Numbers_stored_as_text_are_read_in_either_decimal_convention(string text, bool decimalComma, double expected)
    {
        Assert.Equal(CellProblem.None, CellValues.Number(text, decimalComma, out double v, out _));
        Assert.Equal(expected, v, 10);
    }

    [Fact]
    public void A_comma_before_three_digits_in_a_point_decimal_file_is_ambiguous()
    {
        Assert.Equal(CellProblem.AmbiguousNumber, CellValues.Number("4,200", false, out _, out var alternative));
        Assert.Equal("4200 or 4.200", alternative);
    }

    [Theory]
    [InlineData("2024-03-02", "2024-03-02 00:00")]
    [InlineData("2024-03-02 14:30", "2024-03-02 14:30")]
    [InlineData("2024-03-02T14:30:00", "2024-03-02 14:30")]
    [InlineData("02.03.2024", "2024-03-02 00:00")]
    [InlineData("2 Mar 2024", "2024-03-02 00:00")]
    [InlineData("25/03/2024", "2024-03-25 00:00")]
    [InlineData("03/25/2024", "2024-03-25 00:00")]
    public void Dates_in_text_are_read_when_their_order_is_certain(string text, string expected)
    {
        Assert.Equal(CellProblem.None, CellValues.Date(text, DateOrder.Unknown, out var v, out _, out _));
        Assert.Equal(expected, v.ToString("yyyy-MM-dd HH:mm", System.Globalization.CultureInfo.InvariantCulture));
    }

    [Fact]
    public void An_ambiguous_day_month_date_is_settled_by_another_date_in_the_same_column()
    {
        // Given a column holding 25/03/2024 (day first) and 04/03/2024
        var order = CellValues.ColumnDateOrder(["25/03/2024", "04/03/2024"]);

        // When the ambiguous one is read with the column's order / Then it is 4 March
        Assert.Equal(DateOrder.DayFirst, order);
        Assert.Equal(CellProblem.None, CellValues.Date("04/03/2024", order, out var v, out _, out _));
        Assert.Equal(new DateTime(2024, 3, 4), v);
    }

    [Fact]
    public void An_excel_serial_number_in_a_date_column_is_a_date()
    {
        // 45353 is 2024-03-02 in the 1900 date system (Excel DATE(2024,3,2), common practice).
        Assert.Equal(CellProblem.None, CellValues.Date(45353.5, DateOrder.Unknown, out var v, out _, out _));
        Assert.Equal(new DateTime(2024, 3, 2, 12, 0, 0), v);
    }

    [Theory]
    [InlineData("08:30", 8, 30)]
    [InlineData("8.30", 8, 30)]
    [InlineData("2:15 PM", 14, 15)]
    [InlineData("12:05 am", 0, 5)]
    [InlineData("8am", 8, 0)]
    [InlineData("5 pm", 17, 0)]
    [InlineData("8 a.m.", 8, 0)]
    [InlineData("12pm", 12, 0)]
    [InlineData("17h30", 17, 30)]
    [InlineData("8h", 8, 0)]
    public void Times_of_day_are_read_from_text(string text, int h, int m)
    {
        Assert.Equal(CellProblem.None, CellValues.TimeOfDay(text, out var t));
        Assert.Equal(new TimeSpan(h, m, 0), t);
    }

    [Theory]
    [InlineData("8")]
    [InlineData("13pm")]
    [InlineData("25h")]
    [InlineData("8h75")]
    [InlineData("am")]
    [InlineData("morning")]
    public void A_bare_hour_or_an_impossible_time_is_no_time_of_day(string text)
    {
        Assert.Equal(CellProblem.NotATime, CellValues.TimeOfDay(text, out _));
    }

    [Theory]
    [InlineData("Lot;Yeast;Brix\nA;B;24,1\n", ';')]
    [InlineData("Lot,Yeast,Brix\nA,B,24.1\n", ',')]
    [InlineData("Title of the sheet\nLot\tYeast\tBrix\nA\tB\t24.1\n", '\t')]
    [InlineData("Lot,Notes;x,Brix\n\"A,1\",ok,24\n", ',')]
    public void The_csv_delimiter_is_the_one_that_splits_the_lines_consistently(string text, char expected)
    {
        Assert.Equal(expected, CsvSource.DetectDelimiter(text));
    }

    [Theory]
    [InlineData("Lots 2023", 2023)]
    [InlineData("harvest-2021-final", 2021)]
    [InlineData("2019 vs 2020", null)]
    [InlineData("Tank 12345", null)]
    [InlineData("Lots", null)]
    public void A_season_is_taken_from_a_name_only_when_it_holds_exactly_one_year(string name, int? expected)
    {
        Assert.Equal(expected, SeasonNames.FromName(name));
    }

    [Theory]
    [InlineData("\uFF12\uFF10\uFF12\uFF14-03-02")]
    [InlineData("\uFF10\uFF12.03.2024")]
    [InlineData("14:\uFF13\uFF10")]
    public void Dates_with_non_ascii_digits_are_a_reported_problem_not_a_crash(string text)
    {
        // Full-width digits (as an East Asian input method types them) match .NET's \d but not int.Parse: they must be
        // refused as an unreadable date, never throw.
        Assert.NotEqual(CellProblem.None, CellValues.Date(text, DateOrder.Unknown, out _, out _, out _));
    }

    [Fact]
    public void A_log_row_with_a_full_width_date_is_reported_and_the_rest_is_read()
    {
        using var folder = new TestFolder();
        var lots = folder.Text("lots 2024.csv", "Lot;Yeast;Start Brix (°Bx);Alcohol % v/v\nA-01;QX-7;24,3;14,1\n");
        var logs = folder.Text("logs 2024.csv", "Lot;Date;Brix\nA-01;2024-03-01 08:00;24,3\nA-01;\uFF12\uFF10\uFF12\uFF14-03-02 08:00;20,1\nA-01;2024-03-03 08:00;15,0\n");

        var set = folder.Read(lots, logs);

        Assert.Equal(2, set.Logs.Single().Readings.Count);
        Assert.Contains(set.Issues, i => i.File.EndsWith("logs 2024.csv", StringComparison.Ordinal) && i.Row == 3);
    }
}
