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
}
