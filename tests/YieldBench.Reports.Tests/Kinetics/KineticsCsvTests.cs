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

        // Then the header lists the stable columns, the most-read first, each lot has one row in lot order, and numbers
        // carry their column's precision (days 1 decimal, rates 2, °Brix 1)
        Assert.Equal(5, lines.Length);
        Assert.StartsWith("season,lot_id,strain,colour,flags,days_to_dry,peak_temp_c,max_rate_brix_per_day,lag_h,one_third_h,", lines[0]);
        Assert.EndsWith(",logistic_rmse_brix,logistic_r2,logistic_note", lines[0]);
        Assert.All(lines[0].Split(','), c => Assert.Matches("^[a-z0-9_]+$", c));
        var header = lines[0].Split(',');
        var r01 = lines[1].Split(',');
        Assert.StartsWith("2025,R-01,KX-11,red,,", lines[1]);
        Assert.Equal("24.0", r01[Array.IndexOf(header, "starting_brix")]);
        Assert.Equal("-1.5", r01[Array.IndexOf(header, "final_brix")]);
        Assert.Equal("31.0", r01[Array.IndexOf(header, "peak_temp_c")]);
        Assert.Equal("inoculation", r01[Array.IndexOf(header, "time_origin")]);
        Assert.StartsWith("2025,R-04,BR-4,red,,", lines[4]);
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
        Assert.Equal("38.0", Col("residual_sugar_gl"));
        Assert.Equal("20.0", Col("caution_temp_c"));
        Assert.Contains("stuck", Col("flags").Split(';'));
        Assert.Equal("2025-10-03T08:00:00", Col("stuck_from"));
    }

    [Fact]
    public void The_findings_summary_counts_each_kind_once_per_lot_and_names_it_plainly()
    {
        // Given four lots with logs and one without, the stuck white W-03 among them
        var (_, review) = KineticsReportData.Build();
        var strains = new Dictionary<YieldBench.Core.Lots.LotKey, string>
        {
            [new(2025, "W-03")] = "W-STRAIN",
        };

        // When summarised by kind
        var table = KineticsTables.FindingKinds(review, strains);
        var rows = table.Rows.ToDictionary(r => (string)r[1]!);

        // Then each kind has one row with the number of distinct lots or logs it concerns, most frequent first, in plain
        // words; the lot without a log has its own row; a lot the map does not know counts as "no lot"
        foreach (var kind in review.Findings.GroupBy(f => f.Code))
        {
            Assert.Equal(kind.Select(f => f.Subject).Distinct().Count(), (int)rows[kind.Key][2]!);
            Assert.Equal(YieldBench.Core.Review.ReviewTexts.FlagName(kind.Key), rows[kind.Key][0]);
        }

        Assert.Equal(review.LotsWithoutLog.Count, (int)rows["no-log"][2]!);
        Assert.Equal("stuck ferment", rows["stuck"][0]);
        Assert.Contains("W-STRAIN 1", (string)rows["stuck"][3]!, StringComparison.Ordinal);
        var counts = table.Rows.Select(r => (int)r[2]!).ToArray();
        Assert.Equal(counts.OrderDescending(), counts);
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
