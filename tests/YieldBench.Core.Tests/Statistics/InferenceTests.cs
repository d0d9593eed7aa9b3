using YieldBench.Core.Statistics;
using YieldBench.Core.Tests.Fixtures;

namespace YieldBench.Core.Tests.Statistics;

// Oracles: scipy 1.10.1 and statsmodels 0.13.5 (`apt-get install -y python3-scipy python3-statsmodels`), R 4.2.2 with
// MASS 7.3-58.2; commands in Fixtures/reference-values.py and Fixtures/reference-values.R.
public class InferenceTests
{
    private static readonly double[] G1 = [2.9, 3.0, 2.5, 2.6, 3.2];
    private static readonly double[] G2 = [3.8, 2.7, 4.0, 2.4];
    private static readonly double[] G3 = [2.8, 3.4, 3.7, 2.2, 2.0, 3.0];
    private static readonly double[] A = [0.58, 0.61, 0.55, 0.63, 0.60, 0.57];
    private static readonly double[] B = [0.52, 0.56, 0.54, 0.59, 0.50, 0.53, 0.51];

    [Fact]
    public void Kruskal_Wallis_with_ties_matches_R_and_scipy()
    {
        // Given three groups with a tie (3.0 twice)
        // When tested
        var r = RankTests.KruskalWallis([G1, G2, G3]);

        // Then H and p match R kruskal.test and scipy.stats.kruskal: 0.615682766846, 0.735031897007
        Assert.Equal(0.615682766846, r.H, 10);
        Assert.Equal(0.735031897007, r.P, 10);
        Assert.Equal(2, r.DegreesOfFreedom);
        Assert.Null(r.Note);
    }

    [Fact]
    public void Kruskal_Wallis_is_undefined_for_one_group_or_all_equal_values()
    {
        // Given one non-empty group, then all-equal values
        var one = RankTests.KruskalWallis([G1, []]);
        var same = RankTests.KruskalWallis([[0.6, 0.6], [0.6, 0.6, 0.6]]);

        // Then NaN with the reason
        Assert.True(double.IsNaN(one.P));
        Assert.Equal("fewer than two groups hold values", one.Note);
        Assert.True(double.IsNaN(same.H));
        Assert.Equal("all values are equal, so ranks cannot separate the groups", same.Note);
    }

    [Fact]
    public void Mann_Whitney_small_untied_samples_use_the_exact_distribution()
    {
        // Given 6 and 7 values without ties
        var r = RankTests.MannWhitney(A, B);

        // Then U and the exact two-sided p match scipy mannwhitneyu(method="exact") and R wilcox.test(exact = TRUE):
        // U = 38, p = 0.013986013986
        Assert.True(r.Exact);
        Assert.Equal(38, r.U);
        Assert.Equal(0.013986013986013986, r.P, 12);
    }

    [Fact]
    public void Mann_Whitney_with_ties_uses_the_corrected_normal_approximation()
    {
        // Given 10 and 9 values with many ties
        double[] ta = [0.58, 0.60, 0.60, 0.62, 0.57, 0.61, 0.59, 0.60, 0.63, 0.58];
        double[] tb = [0.56, 0.58, 0.57, 0.60, 0.55, 0.57, 0.58, 0.56, 0.59];

        // When tested
        var r = RankTests.MannWhitney(ta, tb);

        // Then scipy mannwhitneyu(method="asymptotic", use_continuity=True): U = 76, p = 0.011761912660010358
        Assert.False(r.Exact);
        Assert.Equal(76, r.U);
        Assert.Equal(0.011761912660010358, r.P, 12);
    }

    [Fact]
    public void Hodges_Lehmann_shift_and_exact_interval_match_R_wilcox_test()
    {
        // Given the same untied samples
        var r = RankTests.HodgesLehmann(A, B, 0.95);

        // Then R wilcox.test(a, b, conf.int = TRUE, exact = TRUE): estimate 0.055, interval 0.010 to 0.100
        Assert.True(r.Exact);
        Assert.Equal(0.055, r.Shift, 12);
        Assert.Equal(0.010, r.Interval.Low, 12);
        Assert.Equal(0.100, r.Interval.High, 12);
    }

    [Fact]
    public void Hodges_Lehmann_by_selection_equals_the_median_of_all_differences()
    {
        // Given two seeded samples of 400 and 300 values (120,000 differences)
        var random = new Random(5);
        var a = Enumerable.Range(0, 400).Select(_ => Math.Round(0.6 + (random.NextDouble() * 0.05), 3)).ToArray();
        var b = Enumerable.Range(0, 300).Select(_ => Math.Round(0.59 + (random.NextDouble() * 0.05), 3)).ToArray();

        // When the shift is selected and, independently, all differences are sorted
        var diffs = a.SelectMany(x => b.Select(y => x - y)).OrderBy(d => d).ToArray();
        var r = RankTests.HodgesLehmann(a, b);

        // Then the shift is the median of the differences and the interval ends are order statistics of them
        Assert.Equal(0.5 * (diffs[59_999] + diffs[60_000]), r.Shift, 15);
        Assert.Contains(r.Interval.Low, diffs);
        Assert.Contains(r.Interval.High, diffs);
        Assert.True(r.Interval.Low < r.Shift && r.Shift < r.Interval.High);
    }

    [Fact]
    public void Holm_adjustment_matches_R_p_adjust()
    {
        // Given p-values with one missing
        double[] p = [0.01, 0.04, 0.03, 0.005, double.NaN];

        // When adjusted
        var adjusted = Multiplicity.Holm(p);

        // Then R p.adjust(p, "holm") = 0.03 0.06 0.06 0.02 NA
        Assert.Equal(0.03, adjusted[0], 12);
        Assert.Equal(0.06, adjusted[1], 12);
        Assert.Equal(0.06, adjusted[2], 12);
        Assert.Equal(0.02, adjusted[3], 12);
        Assert.True(double.IsNaN(adjusted[4]));
    }

    [Theory]
    [InlineData(0.95, 3.7142857142857144, 4.375)]
    [InlineData(0.80, 3.8333333333333335, 4.166666666666667)]
    [InlineData(0.50, 3.9375, 4.125)]
    public void Theil_Sen_reproduces_Sen_1968_example_as_scipy(double level, double low, double high)
    {
        // Given Sen's (1968) example, as in scipy's test_theilslopes
        double[] x = [1, 2, 3, 4, 10, 12, 18];
        double[] y = [9, 15, 19, 20, 45, 55, 78];

        // When fitted
        var line = TheilSen.Fit(x, y, level);

        // Then slope 4, intercept 4 and the interval match scipy 1.10.1 theilslopes(y, x, level)
        Assert.Equal(4.0, line.Slope, 12);
        Assert.Equal(4.0, line.Intercept, 12);
        Assert.Equal(low, line.SlopeInterval.Low, 12);
        Assert.Equal(high, line.SlopeInterval.High, 12);
    }

    [Fact]
    public void Theil_Sen_with_tied_x_matches_scipy_on_stackloss()
    {
        // Given stackloss air flow (many ties) and stack loss
        var air = Enumerable.Range(0, 21).Select(i => ReferenceData.StackLoss[i, 0]).ToArray();
        var loss = Enumerable.Range(0, 21).Select(i => ReferenceData.StackLoss[i, 3]).ToArray();

        // When fitted
        var line = TheilSen.Fit(air, loss);

        // Then scipy theilslopes(loss, air, 0.95): slope 1, intercept −43, interval 0.75 to 1.1666…
        Assert.Equal(1.0, line.Slope, 12);
        Assert.Equal(-43.0, line.Intercept, 12);
        Assert.Equal(0.75, line.SlopeInterval.Low, 12);
        Assert.Equal(1.1666666666666667, line.SlopeInterval.High, 12);
    }

    [Fact]
    public void Theil_Sen_selection_path_matches_scipy_on_2000_tied_points()
    {
        // Given 2,000 points rounded to 0.1 in x and 0.01 in y (heavy ties), above the direct limit
        Assert.True(GeneratedSamples.TheilSen2000X.Length > TheilSen.DirectLimit);

        // When fitted by the selection path
        var line = TheilSen.Fit(GeneratedSamples.TheilSen2000X, GeneratedSamples.TheilSen2000Y);

        // Then scipy theilslopes(ys, xs, 0.95): slope 0.6, intercept 0.1, interval 0.5941176470588236 to 0.6055555555555555
        Assert.Equal(0.6, line.Slope, 12);
        Assert.Equal(0.1, line.Intercept, 10);
        Assert.Equal(0.5941176470588236, line.SlopeInterval.Low, 12);
        Assert.Equal(0.6055555555555555, line.SlopeInterval.High, 12);
    }

    [Fact]
    public void Theil_Sen_selection_finds_every_order_statistic_that_sorting_finds()
    {
        // Given 1,200 seeded continuous points (all slopes distinct in practice)
        var random = new Random(9);
        var x = Enumerable.Range(0, 1200).Select(_ => 18 + (random.NextDouble() * 10)).ToArray();
        var y = x.Select(v => (0.6 * v) + (random.NextDouble() - 0.5)).ToArray();
        var all = new List<double>();
        for (int i = 0; i < x.Length; i++)
        {
            for (int j = i + 1; j < x.Length; j++)
            {
                all.Add((y[j] - y[i]) / (x[j] - x[i]));
            }
        }

        all.Sort();
        var selector = new TheilSen.SlopeSelector(x, y, seed: 4);

        // When ranks across the range are selected
        // Then each equals the sorted slope at that rank
        foreach (long k in new long[] { 1, 2, 1000, all.Count / 3, all.Count / 2, (all.Count / 2) + 1, all.Count - 7, all.Count })
        {
            Assert.Equal(all[(int)(k - 1)], selector.Select(k));
        }

        // And a run of two ranks (the two middle slopes) comes out in one selection
        long mid = all.Count / 2;
        Assert.Equal([all[(int)mid - 1], all[(int)mid]], selector.SelectRange(mid, mid + 1));
    }

    [Theory]
    [InlineData(0.0, 0.0)]
    [InlineData(2.0, 1.0)]
    public void Theil_Sen_selection_handles_points_that_all_lie_on_one_line(double slope, double intercept)
    {
        // Given 2,000 points exactly on y = intercept + slope·x with tied x (every pairwise slope equal)
        var x = Enumerable.Range(0, 2000).Select(i => 18 + ((i % 97) * 0.1)).ToArray();
        var y = x.Select(v => intercept + (slope * v)).ToArray();

        // When fitted by the selection path
        var line = TheilSen.Fit(x, y);

        // Then the slope and both interval ends are that slope
        Assert.Equal(slope, line.Slope, 9);
        Assert.Equal(slope, line.SlopeInterval.Low, 9);
        Assert.Equal(slope, line.SlopeInterval.High, 9);
        Assert.Equal(intercept, line.Intercept, 9);
    }

    [Fact]
    public void Theil_Sen_is_undefined_when_every_x_is_equal()
    {
        // Given three lots at the same starting sugar
        var line = TheilSen.Fit([24.0, 24.0, 24.0], [14.1, 14.3, 14.0]);

        // Then no line, with the reason
        Assert.False(line.IsDefined);
        Assert.Equal("all x values are equal", line.Note);
        Assert.Equal("fewer than two points", TheilSen.Fit([24.0], [14.1]).Note);
    }

    [Fact]
    public void Huber_regression_on_stackloss_matches_MASS_rlm()
    {
        // Given stackloss with an intercept column
        int n = 21;
        var design = new double[n, 4];
        var y = new double[n];
        for (int i = 0; i < n; i++)
        {
            design[i, 0] = 1;
            design[i, 1] = ReferenceData.StackLoss[i, 0];
            design[i, 2] = ReferenceData.StackLoss[i, 1];
            design[i, 3] = ReferenceData.StackLoss[i, 2];
            y[i] = ReferenceData.StackLoss[i, 3];
        }

        // When fitted by Huber IRLS with rlm's defaults
        var fit = RobustRegression.Huber(design, y, ["(Intercept)", "Air.Flow", "Water.Temp", "Acid.Conc."]);

        // Then MASS 7.3-58.2 rlm(stack.loss ~ ., stackloss): coefficients, summary() standard errors and scale
        double[] coef = [-41.026531052233, 0.829373868888, 0.926108184089, -0.127849160312];
        double[] se = [9.807347196401, 0.111180346016, 0.303408095307, 0.128852585127];
        for (int j = 0; j < 4; j++)
        {
            Assert.Equal(coef[j], fit.Coefficients[j], 8);
            Assert.Equal(se[j], fit.StandardErrors[j], 8);
        }

        Assert.Equal(2.44071379481, fit.Scale, 8);
        Assert.True(fit.Converged);
    }

    [Fact]
    public void Huber_regression_with_factor_columns_matches_MASS_rlm_on_warpbreaks()
    {
        // Given warpbreaks (R datasets) with 0/1 columns for wool B and tensions M and H (baselines wool A, tension L)
        int[] breaks =
        [
            26, 30, 54, 25, 70, 52, 51, 26, 67, 18, 21, 29, 17, 12, 18, 35, 30, 36, 36, 21, 24, 18, 10, 43, 28, 15, 26,
            27, 14, 29, 19, 29, 31, 41, 20, 44, 42, 26, 19, 16, 39, 28, 21, 39, 29, 20, 21, 24, 17, 13, 15, 15, 16, 28,
        ];
        var design = new double[54, 4];
        for (int i = 0; i < 54; i++)
        {
            int tension = (i % 27) / 9;
            design[i, 0] = 1;
            design[i, 1] = i >= 27 ? 1 : 0;
            design[i, 2] = tension == 1 ? 1 : 0;
            design[i, 3] = tension == 2 ? 1 : 0;
        }

        // When fitted
        var fit = RobustRegression.Huber(design, breaks.Select(b => (double)b).ToArray(), ["(Intercept)", "woolB", "tensionM", "tensionH"]);

        // Then MASS 7.3-58.2 rlm(breaks ~ wool + tension, warpbreaks) and its summary() standard errors
        double[] coef = [36.7141494014, -4.3015268261, -8.2508848449, -13.1453479013];
        double[] se = [3.15973231731, 3.15973231731, 3.86986595059, 3.86986595059];
        for (int j = 0; j < 4; j++)
        {
            Assert.Equal(coef[j], fit.Coefficients[j], 7);
            Assert.Equal(se[j], fit.StandardErrors[j], 7);
        }

        Assert.Equal(11.1193476649, fit.Scale, 7);

        // And a linear combination reproduces a coefficient and its standard error
        var (estimate, error, interval) = fit.Combination([0, 0, 0, 1]);
        Assert.Equal(fit.Coefficients[3], estimate, 12);
        Assert.Equal(fit.StandardErrors[3], error, 12);
        Assert.Equal(fit.Intervals[3], interval);
    }

    [Fact]
    public void Huber_regression_refuses_a_rank_deficient_design_with_a_message()
    {
        // Given two identical columns
        var design = new double[6, 2];
        for (int i = 0; i < 6; i++)
        {
            design[i, 0] = 1;
            design[i, 1] = 1;
        }

        // Then the fit is refused, naming the cause
        var e = Assert.Throws<ArgumentException>(() => RobustRegression.Huber(design, [1, 2, 3, 4, 5, 6], ["a", "b"]));
        Assert.StartsWith("The design matrix is rank-deficient (an empty factor level or collinear columns).", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Bootstrap_median_interval_is_reproducible_and_agrees_with_the_exact_bootstrap_distribution()
    {
        // Given 25 seeded values
        var random = new Random(21);
        var x = Enumerable.Range(0, 25).Select(_ => 0.55 + (random.NextDouble() * 0.1)).OrderBy(v => v).ToArray();

        // When the percentile interval is drawn twice with one seed and once with many resamples
        var first = Bootstrap.MedianInterval(x, 4000, 0.95, seed: 17);
        var again = Bootstrap.MedianInterval(x, 4000, 0.95, seed: 17);

        // Then it is identical for the same seed, and its ends sit within one order statistic of the exact
        // bootstrap quantiles: for odd n the resampled median is x(k) with P(med ≤ x(k)) = P(Bin(n, k/n) ≥ (n+1)/2)
        // (Efron & Tibshirani 1993, the exact bootstrap distribution of the median)
        Assert.Equal(first, again);
        int LowestRankReaching(double p)
        {
            for (int k = 1; k <= 25; k++)
            {
                double cdf = 1 - MathNet.Numerics.Distributions.Binomial.CDF(k / 25.0, 25, 12);
                if (cdf >= p)
                {
                    return k;
                }
            }

            return 25;
        }

        int lowRank = LowestRankReaching(0.025), highRank = LowestRankReaching(0.975);
        Assert.InRange(first.Low, x[lowRank - 2], x[lowRank]);
        Assert.InRange(first.High, x[highRank - 2], x[highRank]);
    }

    [Theory]
    [InlineData(5001)]
    [InlineData(4000)]
    [InlineData(24)]
    [InlineData(41)]
    public void Bootstrap_intervals_follow_the_exact_law_of_the_resampled_median(int n)
    {
        // Given n seeded values, below and above the direct-resampling limit, odd and even
        var random = new Random(n);
        var x = Enumerable.Range(0, n).Select(_ => random.NextDouble()).OrderBy(v => v).ToArray();

        // When the interval is drawn (by resampling up to the limit, from the median's law above it)
        var interval = Bootstrap.MedianInterval(x, 4000, 0.95, seed: 3);

        // Then its ends sit within a few order statistics of the exact bootstrap quantiles. The lower middle of a
        // resample is at most x(k) with probability P(Bin(n, k/n) ≥ ⌈n/2⌉), the upper middle with P(Bin ≥ ⌊n/2⌋ + 1)
        // (Efron & Tibshirani 1993); a median lies between them, so its quantile lies between theirs.
        int Rank(double p, int need)
        {
            for (int k = 1; k <= n; k++)
            {
                if (1 - MathNet.Numerics.Distributions.Binomial.CDF(k / (double)n, n, need - 1) >= p)
                {
                    return k;
                }
            }

            return n;
        }

        int lowerNeed = (n + 1) / 2, upperNeed = (n / 2) + 1;
        int slack = n <= Bootstrap.DirectLimit ? 2 : 4; // the 2.5 % quantile of 4,000 resamples can step over an atom
        Assert.InRange(interval.Low, x[Rank(0.025, upperNeed) - 1 - slack], x[Rank(0.025, lowerNeed) - 1 + slack]);
        Assert.InRange(interval.High, x[Rank(0.975, upperNeed) - 1 - slack], x[Rank(0.975, lowerNeed) - 1 + slack]);
        Assert.Equal(interval, Bootstrap.MedianInterval(x, 4000, 0.95, seed: 3));
    }

    [Fact]
    public void Bootstrap_needs_two_values_and_gives_a_point_for_equal_values()
    {
        // Given one value, and equal values
        // Then undefined, and zero width
        Assert.False(Bootstrap.MedianInterval([0.6], 2000, 0.95, 1).IsDefined);
        var same = Bootstrap.MedianInterval([0.6, 0.6, 0.6], 2000, 0.95, 1);
        Assert.Equal(0.6, same.Low);
        Assert.Equal(0.6, same.High);
    }

    [Fact]
    public void P_values_far_in_the_tail_come_from_the_survival_function()
    {
        // Given three groups of 40 values that do not overlap, each value twice (so the normal approximation applies)
        double[] a = [.. Enumerable.Range(0, 40).Select(i => (double)(i / 2))];
        double[] b = [.. a.Select(v => v + 100)];
        double[] c = [.. a.Select(v => v + 200)];

        // When tested
        var kw = RankTests.KruskalWallis([a, b, c]);
        var mw = RankTests.MannWhitney(a, b);

        // Then the p-values are scipy 1.10.1's, far below what 1 − CDF can hold (it would give 0):
        // stats.kruskal(a, b, c) → H 105.80716865796053, p 1.0574631763174369e-23;
        // stats.mannwhitneyu(a, b, method='asymptotic') → p 1.4149821894307883e-14
        Assert.Equal(105.80716865796053, kw.H, 1e-9);
        Assert.Equal(1.0574631763174369e-23, kw.P, 1.0574631763174369e-23 * 1e-9);
        Assert.Equal(1.4149821894307883e-14, mw.P, 1.4149821894307883e-14 * 1e-6);
        Assert.False(mw.Exact);
    }

    [Theory]
    [InlineData(0.0123456, "0.0123")]
    [InlineData(0.0001, "0.0001")]
    [InlineData(0.0000999, "< 0.0001")]
    [InlineData(1.0574631763174369e-23, "< 0.0001")]
    [InlineData(double.NaN, "n/a")]
    public void P_values_below_0_0001_are_written_as_less_than_0_0001(double p, string text)
    {
        Assert.Equal(text, YieldBench.Core.Review.ReviewTexts.P(p));
    }
}
