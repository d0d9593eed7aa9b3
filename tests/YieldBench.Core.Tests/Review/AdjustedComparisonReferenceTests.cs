using YieldBench.Core.Review.Strains;

namespace YieldBench.Core.Tests.Review;

/// <summary>
/// The adjusted strain comparison as a whole (docs/methods.md Part 2 §6: Huber regression on sugar, strain and vessel,
/// each strain at the median sugar and the lots' vessel mix, intervals from the coefficient covariance) against R 4.2.2
/// with MASS 7.3-58.2 on the same 21 invented lots: tests/YieldBench.Core.Tests/Fixtures/adjusted-comparison.R
/// (`Rscript adjusted-comparison.R`; the expected values below are its output).
/// </summary>
public class AdjustedComparisonReferenceTests
{
    private static readonly (string Strain, string Vessel, double Brix, double Abv)[] Lots =
    [
        ("Y-A", "tank", 22.1, 12.86), ("Y-A", "tank", 23.4, 13.70), ("Y-A", "barrel", 24.0, 14.05), ("Y-A", "tank", 21.6, 12.52),
        ("Y-A", "barrel", 25.2, 14.80), ("Y-A", "tank", 23.0, 13.43), ("Y-A", "barrel", 24.6, 14.41),
        ("Y-B", "tank", 23.8, 14.20), ("Y-B", "tank", 22.7, 13.49), ("Y-B", "barrel", 25.5, 15.30), ("Y-B", "tank", 24.1, 14.40),
        ("Y-B", "barrel", 21.9, 13.05), ("Y-B", "tank", 26.0, 15.62), ("Y-B", "barrel", 23.3, 13.40),
        ("Y-C", "tank", 21.4, 12.15), ("Y-C", "tank", 22.8, 12.98), ("Y-C", "barrel", 23.6, 13.50), ("Y-C", "tank", 24.4, 13.96),
        ("Y-C", "barrel", 22.2, 12.64), ("Y-C", "tank", 25.0, 14.35), ("Y-C", "barrel", 23.9, 13.71),
    ];

    [Fact]
    public void Adjusted_factors_differences_and_intervals_match_MASS_rlm_in_R()
    {
        // Given 21 dry lots of three strains in two vessel types (each with at least 5 lots)
        var lots = Lots.Select((l, i) => LotBuilder.Convert(LotBuilder.Lot("L" + i, 2024, l.Strain, l.Brix, l.Abv, vessel: l.Vessel))).ToList();

        // When the strains are compared
        var c = StrainReviewer.Run(lots, new StrainReviewSettings(), seed: 5).Comparison;

        // Then the reference sugar, each strain's adjusted factor with its interval and each adjusted difference are R's
        // (R 4.2.2, MASS 7.3-58.2: rlm(abv ~ I(brix - ref) + strain + vessel), summary(fit) covariance, qt(0.975, n - p))
        Assert.True(c.AdjustedForVessel);
        Assert.Equal(23.6, c.ReferenceBrix, 12);
        (string Strain, double Predicted, double Factor, double Low, double High)[] strains =
        [
            ("Y-A", 13.797484100503, 0.584639156801, 0.583712036231, 0.585566277371),
            ("Y-B", 14.088340224796, 0.596963568847, 0.596030801317, 0.597896336377),
            ("Y-C", 13.496762476559, 0.571896715108, 0.570965604894, 0.572827825323),
        ];
        foreach (var e in strains)
        {
            var a = c.Adjusted.Single(x => x.Strain == e.Strain);
            Assert.Equal(e.Predicted, a.PredictedAbv, 9);
            Assert.Equal(e.Factor, a.Factor, 9);
            Assert.Equal(e.Low, a.FactorInterval.Low, 9);
            Assert.Equal(e.High, a.FactorInterval.High, 9);
        }

        (string First, string Second, double Difference, double Low, double High)[] pairs =
        [
            ("Y-A", "Y-B", -0.290856124294, -0.322082148123, -0.259630100465),
            ("Y-A", "Y-C", 0.300721623944, 0.269883692589, 0.331559555298),
            ("Y-B", "Y-C", 0.591577748238, 0.560199202027, 0.622956294449),
        ];
        foreach (var e in pairs)
        {
            var d = c.AdjustedDifferences.Single(x => x.First == e.First && x.Second == e.Second);
            Assert.Equal(e.Difference, d.AbvDifference, 9);
            Assert.Equal(e.Low, d.Interval.Low, 9);
            Assert.Equal(e.High, d.Interval.High, 9);
        }
    }
}
