using System.Globalization;
using YieldBench.Reports.Tables;
using YieldBench.Reports.Workbook;

namespace YieldBench.Reports.Tests.Workbook;

public sealed class SheetLayoutWidthTests
{
    [Theory]
    [InlineData("0.000")]
    [InlineData("0.0")]
    [InlineData("0")]
    [InlineData("0.0%")]
    [InlineData("+0.00;-0.00;0.00")]
    public void A_numbers_width_is_the_length_of_its_text_in_the_columns_format_plus_two(string format)
    {
        // Given numbers around every power of ten, at rounding edges, negative, tiny and huge
        var column = new ReportColumn("x", "X", CellKind.Number, format);
        int decimals = format.Contains('.', StringComparison.Ordinal) ? format.Split('.')[1].TakeWhile(c => c == '0').Count() : 0;
        double scale = format.Contains('%', StringComparison.Ordinal) ? 100 : 1;
        var values = new List<double> { 0, -0.0, 1e-9, 0.5, 0.04999, 0.9999, 0.99951, 1e15, 1e16, 123456789012345678.0, -7.25, double.Epsilon };
        for (int k = 0; k <= 16; k++)
        {
            double p = Math.Pow(10, k);
            values.AddRange([p, p - 0.0005, p - 0.05, p - 0.5, p + 0.0004, -p, p * 0.999999]);
        }

        // When their widths are measured
        // Then each is the length of the number rounded to the format's decimals and written out, plus two
        foreach (double v in values)
        {
            string text = Math.Round(Math.Abs(v) * scale, decimals).ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
            Assert.True(text.Length + 2 == SheetLayout.DisplayWidth(v, column), $"{v:R} in '{format}': expected {text.Length + 2} ('{text}'), got {SheetLayout.DisplayWidth(v, column)}");
        }
    }

    [Fact]
    public void Whole_numbers_and_other_values_have_their_usual_widths()
    {
        // Given values of each kind
        var column = new ReportColumn("n", "N", CellKind.Integer);

        // Then whole numbers count their digits and sign (plus one, plus two for long), text its length, times 16
        Assert.Equal(4, SheetLayout.DisplayWidth(123, column));
        Assert.Equal(5, SheetLayout.DisplayWidth(-123, column));
        Assert.Equal(21, SheetLayout.DisplayWidth(long.MaxValue, column));
        Assert.Equal(5, SheetLayout.DisplayWidth("abcde", column));
        Assert.Equal(16, SheetLayout.DisplayWidth(new DateTime(2024, 1, 1), column));
        Assert.Equal(3, SheetLayout.DisplayWidth(true, column));
        Assert.Equal(0, SheetLayout.DisplayWidth(double.NaN, column));
        Assert.Equal(0, SheetLayout.DisplayWidth(null, column));
    }
}
