using YieldBench.Core.HouseFactor;

namespace YieldBench.Core.Tests.HouseFactor;

public class RegimeAndIntervalTests
{
    [Theory]
    [InlineData(12.6, 13.9, true)] // within 1.5 at or below 14 (27 CFR 4.36)
    [InlineData(13.0, 14.6, false)] // beyond 1.5, and crosses 14
    [InlineData(13.9, 14.1, false)] // within 1.5 but crosses the 14 % boundary ([memory] boundary)
    [InlineData(12.0, 13.5, true)] // exactly 1.5
    [InlineData(14.5, 15.4, true)] // within 1.0 above 14
    [InlineData(14.5, 15.6, false)] // beyond 1.0 above 14
    public void The_US_regime_applies_its_two_tolerances_and_the_14_percent_boundary(double stated, double actual, bool accepted)
    {
        Assert.Equal(accepted, LabelRegime.UnitedStates.Accepts(stated, actual));
    }

    [Theory]
    [InlineData(13.5, 14.0, true)]
    [InlineData(13.5, 14.01, false)]
    [InlineData(13.9, 14.1, true)] // no boundary in the EU regime
    public void The_EU_regime_allows_half_a_percent_either_way(double stated, double actual, bool accepted)
    {
        // Delegated Regulation (EU) 2019/33, Art. 44: ±0.5 % vol
        Assert.Equal(accepted, LabelRegime.EuropeanUnion.Accepts(stated, actual));
    }

    [Fact]
    public void A_user_defined_regime_is_symmetric_and_named_by_its_tolerance()
    {
        var r = LabelRegime.UserDefined(0.3);
        Assert.Equal("User-defined ±0.3 % v/v", r.Name);
        Assert.True(r.Accepts(14.0, 13.7));
        Assert.False(r.Accepts(14.0, 13.6));
        Assert.Throws<ArgumentOutOfRangeException>(() => LabelRegime.UserDefined(0));
    }

    [Fact]
    public void Interval_bounds_are_the_conformal_order_statistics()
    {
        // Given 19 sorted errors 1..19 (Lei et al. 2018: upper bound r(⌈(n+1)p⌉), lower r(⌊(n+1)p⌋))
        var e = Enumerable.Range(1, 19).Select(i => (double)i).ToArray();

        // Then the 95 % upper bound is r(19) = 19, the 90 % upper r(18) = 18, the 10 % lower r(2) = 2,
        // and a 97.5 % bound needs 39 errors, so it is NaN
        Assert.Equal(19, HeldOutErrors.UpperOfSorted(e, 0.95));
        Assert.Equal(18, HeldOutErrors.UpperOfSorted(e, 0.90));
        Assert.Equal(2, HeldOutErrors.LowerOfSorted(e, 0.10));
        Assert.True(double.IsNaN(HeldOutErrors.UpperOfSorted(e, 0.975)));
        Assert.Equal(39, HeldOutErrors.MinimumForTwoSided(0.95));
        Assert.Equal(9, HeldOutErrors.MinimumForTwoSided(0.80));
        Assert.Equal(19, HeldOutErrors.MinimumForOneSided(0.95));
    }

    [Fact]
    public void The_importance_sentence_ranks_inputs_and_groups_the_ones_that_add_little()
    {
        // Given importances where vessel type and pH are under a tenth of starting sugar's
        FeatureImportance[] imp = [new("strain", 0.12), new("vessel type", 0.01), new("starting sugar", 0.9), new("pH", 0.0), new("YAN", 0.2)];

        // When they are put in words
        string s = HouseFactorTexts.ImportanceSentence(imp);

        // Then the sentence says so
        Assert.Equal("Starting sugar explains most; YAN second; strain third; vessel type and pH add little.", s);
    }
}
