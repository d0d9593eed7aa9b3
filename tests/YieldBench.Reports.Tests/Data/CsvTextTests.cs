using YieldBench.Reports.Data;
using YieldBench.Reports.Tables;
using YieldBench.Reports.Tests.Fixtures;

namespace YieldBench.Reports.Tests.Data;

public sealed class CsvTextTests
{
    [Theory]
    [InlineData("=1+1", "'=1+1")]
    [InlineData("+44 1234", "'+44 1234")]
    [InlineData("-2 L water", "'-2 L water")]
    [InlineData("@SUM(A1)", "'@SUM(A1)")]
    [InlineData("\tcmd", "'\tcmd")]
    [InlineData("plain", "plain")]
    [InlineData("a=b", "a=b")]
    [InlineData("", "")]
    public void Text_that_a_spreadsheet_would_run_gets_a_leading_apostrophe(string text, string expected)
    {
        // Given a text cell
        // When it is neutralised
        string result = CsvText.Neutralise(text);

        // Then only a dangerous first character earns the apostrophe (OWASP "CSV Injection" lead characters)
        Assert.Equal(expected, result);
    }

    [Fact]
    public void Negative_numbers_are_written_as_numbers_not_neutralised()
    {
        // Given a table with a negative number and a text cell that starts with a minus sign
        var table = new ReportTable([new("bias_abv", "Bias", CellKind.Number), new("note", "Note", CellKind.Text)]);
        table.Add([-0.125, "-0.125"]);

        // When written as CSV
        string csv = CsvText.Write(table);

        // Then the number stays a number and the text is neutralised
        Assert.Equal("bias_abv,note\r\n-0.125,'-0.125\r\n", csv);
    }

    [Fact]
    public void Fields_with_commas_quotes_or_line_breaks_are_quoted_by_RFC_4180()
    {
        // Given text with a comma, a quote and a line break, a missing value and a NaN
        var table = new ReportTable([new("a", "A", CellKind.Text), new("b", "B", CellKind.Text), new("c", "C", CellKind.Number), new("d", "D", CellKind.Text)]);
        table.Add(["x, y", "say \"dry\"\nthen", double.NaN, null]);

        // When written
        string csv = CsvText.Write(table);

        // Then commas and breaks are quoted, quotes doubled, and missing values are empty fields
        Assert.Equal("a,b,c,d\r\n\"x, y\",\"say \"\"dry\"\"\nthen\",,\r\n", csv);
    }

    [Fact]
    public void Numbers_and_dates_use_the_invariant_culture_in_round_trip_form()
    {
        // Given a number with many digits, a date and a date-time
        var table = new ReportTable([new("n", "N", CellKind.Number), new("d", "D", CellKind.DateTime), new("b", "B", CellKind.Boolean)]);
        table.Add([0.1 + 0.2, new DateTime(2025, 9, 14, 6, 30, 0), true]);

        // When written
        string csv = CsvText.Write(table);

        // Then the double round-trips exactly with a point separator and the date is ISO 8601
        Assert.Equal("n,d,b\r\n0.30000000000000004,2025-09-14T06:30:00,true\r\n", csv);
        Assert.Equal(0.1 + 0.2, double.Parse(csv.Split("\r\n")[1].Split(',')[0], System.Globalization.CultureInfo.InvariantCulture));
    }

    [Fact]
    public void The_lots_file_starts_with_the_documented_columns_in_order()
    {
        // Given a review
        var review = SampleReview.Build();

        // When the lots table is written
        string header = CsvText.Write(ReviewTables.Lots(review)).Split("\r\n")[0];

        // Then its first fourteen columns are the contract of data/lots.csv, the most-read first
        Assert.StartsWith(
            "lot_id,season,strain,flags,starting_brix,final_abv,abv_per_brix,residual_sugar_gl,vessel,variety,robust_z,"
            + "abv_per_brix_fermented,sugar_gl_per_abv,gay_lussac_efficiency,",
            header,
            StringComparison.Ordinal);
    }

    [Fact]
    public void Numbers_are_written_at_their_column_s_stated_precision_and_never_as_negative_zero()
    {
        // Given a table of a °Brix column (2 decimals), a factor column (4), a share column (shown 0.0 %, written to
        // 3 decimals) and a number without a stated precision
        var table = new ReportTable(
        [
            new("brix", "Brix", CellKind.Number, "0.00"),
            new("factor", "Factor", CellKind.Number, "+0.0000;-0.0000;0.0000"),
            new("share", "Share", CellKind.Share),
            new("raw", "Raw", CellKind.Number),
        ]);
        table.Add([16.503677254353796, 0.61165159915492, 0.9547994563673388, 1.0 / 3]);
        table.Add([-0.0004, -0.00004, 1.0, -2.5]);
        table.Add([2.625, 0.03125, 0.0625, double.NaN]);

        // When written
        var lines = CsvText.Write(table).Split("\r\n");

        // Then each column keeps its decimals (an exact half rounds away from zero), a rounded negative zero is 0, and the
        // unstated column keeps full precision
        Assert.Equal("16.50,0.6117,0.955,0.3333333333333333", lines[1]);
        Assert.Equal("0.00,0.0000,1.000,-2.5", lines[2]);
        Assert.Equal("2.63,0.0313,0.063,", lines[3]);
    }

    [Fact]
    public void A_lot_note_written_as_a_formula_is_neutralised_in_the_lots_file()
    {
        // Given a lot whose note is a formula
        var review = SampleReview.Build();

        // When the lots file is written
        string csv = CsvText.Write(ReviewTables.Lots(review));

        // Then the note carries the apostrophe (and is quoted, as it holds quotes and a comma)
        Assert.Contains("\"'=HYPERLINK(\"\"http://example.invalid\"\",\"\"click\"\")\"", csv, StringComparison.Ordinal);
        Assert.Contains(",'-5 L topped,", csv, StringComparison.Ordinal);
        Assert.DoesNotContain(",=HYPERLINK", csv, StringComparison.Ordinal);
    }

    [Fact]
    public void The_intake_issues_file_has_exactly_the_documented_columns()
    {
        // Given a review with intake issues
        var review = SampleReview.Build();

        // When written
        var lines = CsvText.Write(ReviewTables.IntakeIssues(review)).Split("\r\n");

        // Then the header is the contract and values are neutralised
        Assert.Equal("file,sheet,row,column,value,code,severity,message", lines[0]);
        Assert.Equal("lots-2025.csv,,30,final_abv,\"13,2%\",not-a-number,error,\"'13,2%' is not a number; write 13.2.\"", lines[1]);
        Assert.Equal("lots-2024.csv,,9,strain,'@ST-A,strain-looks-like-formula,warning,'+ check the strain cell", lines[2]);
    }
}
