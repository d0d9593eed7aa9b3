using YieldBench.Reports.Kinetics;

namespace YieldBench.Reports.Tests.Kinetics;

public class KineticsCsvTests
{
    [Fact]
    public void The_data_file_has_one_row_per_lot_with_snake_case_columns_and_invariant_numbers()
    {
        // Given four lots with logs (and one without)
        var (_, review) = KineticsReportData.Build();

        // When the data file is written
        using var w = new StringWriter();
        KineticsCsv.Write(review, w);
        var lines = w.ToString().Split("\r\n", StringSplitOptions.RemoveEmptyEntries);

        // Then the header lists the stable columns and each lot has one row in lot order
        Assert.Equal(5, lines.Length);
        Assert.StartsWith("season,lot_id,strain,colour,time_origin,time_origin_at,sugar_readings,median_spacing_h,rate_method,starting_brix,final_brix,max_rate_brix_per_day,", lines[0]);
        Assert.EndsWith(",logistic_note,flags", lines[0]);
        Assert.All(lines[0].Split(','), c => Assert.Matches("^[a-z0-9_]+$", c));
        Assert.StartsWith("2025,R-01,KX-11,red,inoculation,2025-09-28T02:00:00,11,12,between readings,24,-1.5,", lines[1]);
        Assert.StartsWith("2025,R-04,BR-4,red,inoculation,", lines[4]);
    }

    [Fact]
    public void Flags_and_stall_columns_carry_what_the_analysis_found()
    {
        // Given the stuck white lot W-03 (RS 38 g/L)
        var (_, review) = KineticsReportData.Build();
        using var w = new StringWriter();

        // When written
        KineticsCsv.Write(review, w);
        var lines = w.ToString().Split("\r\n", StringSplitOptions.RemoveEmptyEntries);
        var header = lines[0].Split(',');
        var row = lines.Single(l => l.StartsWith("2025,W-03,", StringComparison.Ordinal)).Split(',');
        string Col(string name) => row[Array.IndexOf(header, name)];

        // Then its stuck flag, the stretch start and the lab's residual sugar are in the row
        Assert.Equal("true", Col("stuck"));
        Assert.Equal("38", Col("residual_sugar_gl"));
        Assert.Equal("20", Col("caution_temp_c"));
        Assert.Contains("stuck", Col("flags").Split(' '));
        Assert.Equal("2025-10-03T08:00:00", Col("stuck_from"));
    }

    [Fact]
    public void Writing_twice_gives_identical_text()
    {
        // Given one review
        var (_, review) = KineticsReportData.Build();

        // When written twice
        using var a = new StringWriter();
        using var b = new StringWriter();
        KineticsCsv.Write(review, a);
        KineticsCsv.Write(review, b);

        // Then the texts are identical (no timestamps, fixed order)
        Assert.Equal(a.ToString(), b.ToString());
    }

    [Fact]
    public void The_readings_file_has_one_row_per_sugar_reading_with_its_rate_and_heat_potential()
    {
        // Given the review (R-01: 24.0 → 23.6 °Brix in the first 12 h, at 18 °C and 21 °C)
        var (_, review) = KineticsReportData.Build();

        // When the readings file is written
        using var w = new StringWriter();
        KineticsCsv.WriteReadings(review, w);
        var lines = w.ToString().Split("\r\n", StringSplitOptions.RemoveEmptyEntries);
        var header = lines[0].Split(',');

        // Then every sugar reading has a row; the second R-01 row carries (24.0 − 23.6) / 12 h × 24 = 0.8 °Brix/day
        Assert.Equal(1 + review.Lots.Sum(l => l.Sugar.Count), lines.Length);
        Assert.Equal("season,lot_id,time,hours_from_time_zero_h,sugar_brix,temp_c,rate_since_previous_brix_per_day,smoothed_rate_brix_per_day,sugar_remaining_gl,potential_rise_k,reachable_temp_c", lines[0]);
        var first = lines[1].Split(',');
        var second = lines[2].Split(',');
        Assert.Equal("2025-09-28T08:00:00", first[2]);
        Assert.Equal("6", first[3]);
        Assert.Equal(string.Empty, first[Array.IndexOf(header, "rate_since_previous_brix_per_day")]);
        Assert.Equal(0.8, double.Parse(second[Array.IndexOf(header, "rate_since_previous_brix_per_day")], System.Globalization.CultureInfo.InvariantCulture), 9);
        double rise = double.Parse(first[Array.IndexOf(header, "potential_rise_k")], System.Globalization.CultureInfo.InvariantCulture);
        double reach = double.Parse(first[Array.IndexOf(header, "reachable_temp_c")], System.Globalization.CultureInfo.InvariantCulture);
        Assert.Equal(18.0 + rise, reach, 9);
    }
}
