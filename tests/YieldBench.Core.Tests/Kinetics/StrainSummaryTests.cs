using YieldBench.Core.Kinetics;
using static YieldBench.Core.Tests.Kinetics.KineticsTestData;

namespace YieldBench.Core.Tests.Kinetics;

public class StrainSummaryTests
{
    [Fact]
    public void Strain_medians_and_quartiles_follow_the_type_7_definition()
    {
        // Given three lots of strain KX-11 whose fastest daily drops are 3, 4 and 6 °Brix/day, and one of BR-4
        var start = At("2025-10-01 08:00");
        var lots = new[] { Lot("T-1"), Lot("T-2"), Lot("T-3"), Lot("T-4", strain: "BR-4") };
        var logs = new[]
        {
            Regular("T-1", 2025, start, 24, [24, 21, 18, 15, 12, 9]),
            Regular("T-2", 2025, start, 24, [24, 20, 16, 12, 8, 4]),
            Regular("T-3", 2025, start, 24, [24, 18, 12, 9.5, 9.4, 9.3, 9.3]),
            Regular("T-4", 2025, start, 24, [22, 20, 18]),
        };

        // When analysed
        var review = KineticsAnalysis.Run(lots, logs, KineticsSettings.Default);

        // Then for KX-11 (hand-worked, R quantile type 7 of 3, 4, 6): median 4, Q1 3.5, Q3 5; one lot of three is stuck
        var kx = Assert.Single(review.Strains, s => s.Strain == "KX-11");
        Assert.Equal(3, kx.Lots);
        Assert.Equal(3, kx.MaxRateBrixPerDay.N);
        Assert.Equal(4.0, kx.MaxRateBrixPerDay.Median, 9);
        Assert.Equal(3.5, kx.MaxRateBrixPerDay.Q1, 9);
        Assert.Equal(5.0, kx.MaxRateBrixPerDay.Q3, 9);
        Assert.Equal(1.5, kx.MaxRateBrixPerDay.Iqr, 9);
        Assert.Equal(1, kx.StuckLots);
        Assert.Equal(1.0 / 3.0, kx.StuckShare, 9);
        Assert.Equal(0, kx.DaysToDry.N);
        Assert.True(double.IsNaN(kx.DaysToDry.Median));
        Assert.Equal(["BR-4", "KX-11"], review.Strains.Select(s => s.Strain));
    }
}
