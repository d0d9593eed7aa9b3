using YieldBench.Core.HouseFactor;

namespace YieldBench.Core.Tests.HouseFactor;

public class RobustLineCandidateTests
{
    [Fact]
    public void The_Huber_line_through_the_origin_is_not_pulled_by_one_odd_lot()
    {
        // Given 19 lots at a factor of 0.58 (±0.002 % v/v of alternating noise) and one at 0.40 (a stuck or mis-recorded lot)
        var lots = Enumerable.Range(0, 19)
            .Select(i => SyntheticLots.Lot($"L{i}", 2024, "SX-01", 20 + (i * 0.35), (0.58 * (20 + (i * 0.35))) + (i % 2 == 0 ? 0.002 : -0.002)))
            .Append(SyntheticLots.Lot("ODD", 2024, "SX-01", 24, 0.40 * 24))
            .ToArray();

        // When the robust line through the origin is fitted
        var line = new RobustOriginLineCandidate().Train(lots, 1).AsSugarLines()!.Pooled;

        // Then its factor stays at 0.58, where the mean ratio would fall to 0.571
        Assert.Equal(0, line.Intercept);
        Assert.Equal(0.58, line.SlopePerBrix, 0.001);
        Assert.True(lots.Average(l => l.AbvPerBrix) < 0.572);
    }

    [Fact]
    public void The_Theil_Sen_line_recovers_slope_and_intercept_despite_an_odd_lot()
    {
        // Given nine lots exactly on abv = 1.0 + 0.55 × °Brix and one far below it
        var lots = Enumerable.Range(0, 9)
            .Select(i => SyntheticLots.Lot($"L{i}", 2024, "SX-01", 19 + i, 1.0 + (0.55 * (19 + i))))
            .Append(SyntheticLots.Lot("ODD", 2024, "SX-01", 23.5, 9.0))
            .ToArray();

        // When the Theil–Sen candidate is fitted
        var line = new TheilSenLineCandidate().Train(lots, 1).AsSugarLines()!.Pooled;

        // Then the slope is 0.55 (36 of the 45 pairwise slopes are 0.55, so the median is) and the intercept is
        // median(abv) − 0.55 × median(°Brix) = 13.375 − 0.55 × 23.25 = 0.5875 (by hand: the odd lot shifts both medians)
        Assert.Equal(0.55, line.SlopePerBrix, 1e-9);
        Assert.Equal(0.5875, line.Intercept, 1e-9);
    }
}
