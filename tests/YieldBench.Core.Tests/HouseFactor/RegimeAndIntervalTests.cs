using YieldBench.Core.HouseFactor;

namespace YieldBench.Core.Tests.HouseFactor;

public class RegimeAndIntervalTests
{
    [Theory]
    [InlineData(12.6, 13.9, true)] // within 1.5 at or below 14 (27 CFR 4.36(b))
    [InlineData(13.0, 14.6, false)] // beyond 1.5
    [InlineData(13.9, 14.1, true)] // within 1.5; crossing 14 % no longer changes the tax class (26 U.S.C. 5041(b) since 2018)
    [InlineData(12.0, 13.5, true)] // exactly 1.5
    [InlineData(14.5, 15.4, true)] // within 1.0 above 14
    [InlineData(14.5, 15.6, false)] // beyond 1.0 above 14
    [InlineData(15.5, 16.5, false)] // the TTB bulletin's own example: labelled 15.5 % may not contain 16.5 % (crosses 16)
    [InlineData(15.8, 16.2, false)] // within 1.0 but crosses the 16 % tax-class line
    [InlineData(16.2, 16.9, true)] // both above 16
    public void The_US_regime_switches_tolerance_at_14_percent_and_may_not_cross_the_16_percent_class_line(double stated, double actual, bool accepted)
    {
        Assert.Equal(accepted, LabelRegime.UnitedStates.Accepts(stated, actual));
    }

    [Fact]
    public void The_class_line_is_a_setting_of_the_regime_with_its_source()
    {
        // Given the US regime as built in, and with the line set back to 14 % (the rule before 2018) or removed
        var us = LabelRegime.UnitedStates;
        var before2018 = us.WithNoCrossingLine(14.0);
        var none = us.WithNoCrossingLine(null);

        // Then the default line is 16 % with its sources, each version says local rules must be confirmed, and the line
        // decides whether 13.9 stated / 14.1 actual passes; the tolerance still switches at 14
        Assert.Equal(16.0, us.NoCrossingLineAbv);
        Assert.Contains("26 U.S.C. 5041(b)", us.NoCrossingLineSource, StringComparison.Ordinal);
        Assert.Contains("27 CFR 4.36(b)", us.Source, StringComparison.Ordinal);
        Assert.All(new[] { us, before2018, LabelRegime.EuropeanUnion }, r => Assert.Contains(LabelRegime.ConfirmLocally, r.Source, StringComparison.Ordinal));
        Assert.True(us.Accepts(13.9, 14.1));
        Assert.False(before2018.Accepts(13.9, 14.1));
        Assert.Equal("United States (TTB), class line 14 %", before2018.Name);
        Assert.True(none.Accepts(15.8, 16.2));
        Assert.False(none.Accepts(14.5, 15.6));
        Assert.Throws<ArgumentOutOfRangeException>(() => us.WithNoCrossingLine(0));
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
    public void The_season_error_model_matches_a_one_way_ANOVA_in_R()
    {
        // Given 15 errors in three clusters of 5, 4 and 6 lots (one strain, three seasons)
        double[] y = [0.12, -0.05, 0.30, 0.08, 0.21, -0.22, -0.10, -0.31, -0.05, 0.05, 0.14, -0.02, 0.20, 0.09, 0.11];
        int[] season = [.. Enumerable.Repeat(2021, 5), .. Enumerable.Repeat(2022, 4), .. Enumerable.Repeat(2023, 6)];

        // When the model is fitted
        var m = SeasonErrorModel.Of(y.Select((e, i) => new SeasonError(e, season[i], "SX-01")).ToArray());

        // Then the mean squares are R's anova(lm(y ~ g)) and the variance components, variance of the mean, season
        // variance, predictive variance, Satterthwaite degrees of freedom and t quantiles follow the formulas in the
        // class's documentation (R 4.2.2, Debian r-base-core; script: msw, msb from anova(); n0 = (n − Σn²/n)/(G − 1);
        // s2b = (msb − msw)/n0; varmean = msw/n + s2b·Σn²/n²; tau2 = s2b·((S − 1)/S)²; V = msw(1 + 1/n) + tau2(1 + 1/S);
        // b = ((S − 1)/S)²(1 + 1/S)/n0, a = 1 + 1/n − b, nu = V²/((a·msw)²/(n − G) + (b·msb)²/(G − 1));
        // mean(y) + qt(p, nu)·√V): msw 0.0116858333333333, s2b 0.0216214527027027, varmean 0.00817839714714715,
        // tau2 0.00960953453453453, V 0.0252776016016016, nu 5.74348321005259, q10 −0.193499570364222,
        // q90 0.266832903697555, q97.5 0.429950335930742
        Assert.Equal(15, m.Count);
        Assert.Equal(3, m.Clusters);
        Assert.Equal(0.0366666666666667, m.Mean, 1e-12);
        Assert.Equal(0.0116858333333333, m.WithinVariance, 1e-12);
        Assert.Equal(0.0216214527027027, m.BetweenVariance, 1e-12);
        Assert.Equal(0.00817839714714715, m.VarianceOfMean, 1e-12);
        Assert.Equal(0.00960953453453453, m.SeasonVariance, 1e-12);
        Assert.Equal(0.0252776016016016, m.PredictiveVariance, 1e-12);
        Assert.Equal(5.74348321005259, m.DegreesOfFreedom, 1e-9);
        Assert.Equal(-0.193499570364222, m.Quantile(0.10), 1e-7);
        Assert.Equal(0.266832903697555, m.Quantile(0.90), 1e-7);
        Assert.Equal(0.429950335930742, m.Quantile(0.975), 1e-7);
    }

    [Fact]
    public void On_balanced_clusters_the_variance_components_equal_REML_in_nlme()
    {
        // Given three clusters of four errors
        double[] y = [0.1, 0.3, 0.2, 0.25, -0.2, -0.05, -0.15, -0.1, 0.05, 0.0, 0.12, 0.08];

        // When the model is fitted
        var m = SeasonErrorModel.Of(y.Select((e, i) => new SeasonError(e, 2020 + (i / 4), "SX-01")).ToArray());

        // Then (balanced, positive) the ANOVA estimates are the REML ones: R 4.2.2 + nlme 3.1.162,
        // VarCorr(lme(y ~ 1, random = ~1|g, method = "REML")) → between 0.027425693583919, within 0.00467222225318778
        // (the optimiser's tolerance allows 1e-7)
        Assert.Equal(0.027425693583919, m.BetweenVariance, 1e-7);
        Assert.Equal(0.00467222225318778, m.WithinVariance, 1e-7);
    }

    [Fact]
    public void One_season_gives_the_ordinary_prediction_interval_and_too_few_errors_give_none()
    {
        // Given 12 errors of one season
        double[] y = [0.1, -0.2, 0.05, 0.3, -0.1, 0.0, 0.15, -0.25, 0.2, -0.05, 0.1, -0.15];
        var m = SeasonErrorModel.Of(y.Select(e => new SeasonError(e, 2024, "SX-01")).ToArray());

        // Then the between variance is 0, the within variance is the sample variance, ν = n − 1, and the 90 % bound
        // is mean + qt(0.9, 11)·s·√(1 + 1/n) (R 4.2.2: mean 0.0125, sd 0.16804355496, qt(0.9, 11) = 1.36343031802)
        Assert.Equal(0, m.BetweenVariance);
        Assert.Equal(11, m.DegreesOfFreedom);
        double sd = Math.Sqrt(y.Sum(v => (v - y.Average()) * (v - y.Average())) / 11);
        Assert.Equal(0.16804355496, sd, 1e-10);
        Assert.Equal(0.0125 + (1.36343031802 * sd * Math.Sqrt(1 + (1.0 / 12))), m.Quantile(0.9), 1e-8);

        // And nine errors are too few for an interval
        var few = SeasonErrorModel.Of(y.Take(9).Select(e => new SeasonError(e, 2024, "SX-01")).ToArray());
        Assert.False(few.HasIntervals);
        Assert.True(double.IsNaN(few.Band(0.8).Low));
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
