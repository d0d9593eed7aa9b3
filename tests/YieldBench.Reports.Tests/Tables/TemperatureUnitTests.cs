using System.Globalization;
using YieldBench.Core.Review;
using YieldBench.Core.Units;
using YieldBench.Reports.Kinetics;
using YieldBench.Reports.Tables;
using YieldBench.Reports.Tests.Fixtures;

namespace YieldBench.Reports.Tests.Tables;

/// <summary>The °F option: every temperature a table, text or chart shows is converted; the review keeps °C.</summary>
public sealed class TemperatureUnitTests
{
    private static readonly Lazy<ReviewResult> Celsius = new(() => SampleReview.WithLogs());
    private static readonly Lazy<ReviewResult> Fahrenheit = new(() => SampleReview.WithLogs(new ReviewSettings { TemperatureUnit = TemperatureUnit.Fahrenheit }));

    [Theory]
    [InlineData(0.0, 32.0)]
    [InlineData(100.0, 212.0)]
    [InlineData(-40.0, -40.0)]
    [InlineData(35.0, 95.0)]
    public void A_temperature_converts_by_the_definition_and_a_difference_by_nine_fifths(double celsius, double fahrenheit)
    {
        // Given °C values with their °F by the definition t/°F = 1.8·t/°C + 32 (NIST SP 811, appendix B.9)
        // When converted for display
        // Then the temperature and the symbol follow it, a difference is 1.8 times, and °C is left alone
        Assert.Equal(fahrenheit, TemperatureUnit.Fahrenheit.FromCelsius(celsius), 9);
        Assert.Equal(celsius, TemperatureUnit.Celsius.FromCelsius(celsius), 9);
        Assert.Equal(18.0, TemperatureUnit.Fahrenheit.Difference(10.0), 9);
        Assert.Equal(fahrenheit.ToString("0.0", CultureInfo.InvariantCulture) + " °F", TemperatureUnit.Fahrenheit.Show(celsius));
    }

    [Fact]
    public void The_kinetics_tables_name_and_convert_their_temperature_columns()
    {
        // Given the same review with logs shown in °C and in °F
        var c = KineticsTables.Lots(Celsius.Value.Kinetics!);
        var f = KineticsTables.Lots(Fahrenheit.Value.Kinetics!, TemperatureUnit.Fahrenheit);
        var cs = KineticsTables.Strains(Celsius.Value.Kinetics!);
        var fs = KineticsTables.Strains(Fahrenheit.Value.Kinetics!, null, TemperatureUnit.Fahrenheit);

        // When their columns and cells are compared
        int peakC = c.Columns.Select(x => x.Name).ToList().IndexOf("peak_temp_c");
        int peakF = f.Columns.Select(x => x.Name).ToList().IndexOf("peak_temp_f");
        int medC = cs.Columns.Select(x => x.Name).ToList().IndexOf("peak_temp_median_c");
        int medF = fs.Columns.Select(x => x.Name).ToList().IndexOf("peak_temp_median_f");
        int iqrC = cs.Columns.Select(x => x.Name).ToList().IndexOf("peak_temp_iqr_c");
        int iqrF = fs.Columns.Select(x => x.Name).ToList().IndexOf("peak_temp_iqr_f");

        // Then in °F no column ends in _c with °C in its heading, every peak is 1.8·°C + 32 (the lot with 41 °C: 105.8),
        // the strain median likewise, and its interquartile range 1.8 times (a difference); other columns are unchanged
        Assert.True(peakC >= 0 && peakF == peakC && medF == medC && iqrF == iqrC);
        Assert.DoesNotContain(f.Columns, x => x.Heading.Contains("°C", StringComparison.Ordinal));
        Assert.Contains(f.Columns, x => x.Heading == "Peak temperature (°F)");
        for (int r = 0; r < c.Rows.Count; r++)
        {
            if (c.Rows[r][peakC] is double pc)
            {
                Assert.Equal((pc * 1.8) + 32, (double)f.Rows[r][peakF]!, 9);
            }
        }

        Assert.Contains(f.Rows, r => r[peakF] is double p && Math.Abs(p - 105.8) < 1e-9);
        for (int r = 0; r < cs.Rows.Count; r++)
        {
            Assert.Equal(((double)cs.Rows[r][medC]! * 1.8) + 32, (double)fs.Rows[r][medF]!, 9);
            Assert.Equal((double)cs.Rows[r][iqrC]! * 1.8, (double)fs.Rows[r][iqrF]!, 9);
        }

        Assert.Equal(c.Columns.Count(x => x.Name == "days_to_dry"), f.Columns.Count(x => x.Name == "days_to_dry"));
    }

    [Fact]
    public void The_follow_up_text_console_and_lots_file_speak_in_the_chosen_unit()
    {
        // Given the review with logs in °F (lot L020 peaks at 41 °C, above its danger line)
        var review = Fahrenheit.Value;

        // When its follow-up lines, console lines and lots table are read
        var seen = string.Join(" ", review.Findings.Select(x => x.Seen));
        var console = string.Join("\n", ConsoleSummary.Lines(review, new YieldBench.Reports.Output.ReportOutput("out", [], [])));
        var lots = ReviewTables.Lots(review);

        // Then temperatures read in °F and none in °C: 41 °C is 105.8 °F
        Assert.Contains("peaked at 105.8 °F", seen, StringComparison.OrdinalIgnoreCase);
        Assert.DoesNotContain("°C", seen, StringComparison.Ordinal);
        Assert.Contains("°F", console, StringComparison.Ordinal);
        Assert.DoesNotContain(" °C", console.Split("Cautions:")[0], StringComparison.Ordinal);
        Assert.Contains(lots.Columns, x => x.Name == "peak_temp_f");
        Assert.Contains(KineticsSheet.CautionsIn(TemperatureUnit.Fahrenheit), c => c.Contains("95/104 °F", StringComparison.Ordinal));
        Assert.Equal(KineticsSheet.Cautions, KineticsSheet.CautionsIn(TemperatureUnit.Celsius));
        Assert.DoesNotContain(lots.Columns, x => x.Name.EndsWith("temp_c", StringComparison.Ordinal));
    }
}
