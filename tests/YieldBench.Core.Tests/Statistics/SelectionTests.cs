using YieldBench.Core.Statistics;

namespace YieldBench.Core.Tests.Statistics;

/// <summary>
/// The selection shortcuts (median by quickselect, weighted high median by partitioning) must give exactly what the
/// sorting definitions give, ties and even counts included. The reference here is the definition itself, computed by
/// a full sort in the test.
/// </summary>
public sealed class SelectionTests
{
    [Theory]
    [InlineData(1, 1)]
    [InlineData(2, 2)]
    [InlineData(7, 3)]
    [InlineData(10, 4)]
    [InlineData(1001, 5)]
    [InlineData(4000, 6)]
    public void Median_by_selection_equals_the_sorted_median(int n, int seed)
    {
        var random = new Random(seed);

        // Values rounded to 0.1 so that ties are common, as in cellar records.
        var values = Enumerable.Range(0, n).Select(_ => Math.Round(random.NextDouble() * 10, 1)).ToArray();
        var sorted = values.Order().ToArray();
        double expected = n % 2 == 1 ? sorted[n / 2] : 0.5 * (sorted[(n / 2) - 1] + sorted[n / 2]);

        Assert.Equal(expected, Descriptive.MedianInPlace((double[])values.Clone()));
        Assert.Equal(expected, Descriptive.Median(values));
    }

    [Fact]
    public void Median_of_nothing_is_NaN_and_NaN_is_refused()
    {
        Assert.True(double.IsNaN(Descriptive.MedianInPlace([])));
        Assert.Throws<ArgumentException>(() => Descriptive.Median([1.0, double.NaN, 2.0]));
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(4)]
    [InlineData(5)]
    public void Weighted_high_median_equals_the_sorted_definition(int seed)
    {
        var random = new Random(seed);
        foreach (int m in new[] { 1, 2, 3, 8, 65, 500 })
        {
            var values = Enumerable.Range(0, m).Select(_ => (double)random.Next(0, 20)).ToArray();
            var weights = Enumerable.Range(0, m).Select(_ => (long)random.Next(1, 50)).ToArray();

            // Definition: the smallest value whose cumulative weight, in ascending order, exceeds half the total.
            var pairs = values.Zip(weights).OrderBy(p => p.First).ToArray();
            long total = weights.Sum();
            long cumulative = 0;
            double expected = double.NaN;
            foreach (var (v, w) in pairs)
            {
                cumulative += w;
                if (2 * cumulative > total)
                {
                    expected = v;
                    break;
                }
            }

            Assert.Equal(expected, SortedMatrixSelection.WeightedHighMedian(values, weights, m));
        }
    }

    [Theory]
    [InlineData(2, 1)]
    [InlineData(3, 2)]
    [InlineData(40, 3)]
    [InlineData(301, 4)]
    [InlineData(900, 5)]
    [InlineData(1400, 6)]
    public void Theil_Sen_slopes_by_selection_equal_the_sorted_slopes(int n, int seed)
    {
        // Given sugars rounded to 0.1 and alcohols to 0.01, so that tied x values and tied slopes are common
        var random = new Random(seed);
        var x = Enumerable.Range(0, n).Select(_ => Math.Round(20 + (random.NextDouble() * 6), 1)).ToArray();
        var y = x.Select(v => Math.Round((0.6 * v) + (random.NextDouble() - 0.5), 2)).ToArray();

        // When the line (and its interval) is fitted by selecting order statistics
        var line = TheilSen.Fit(x, y);

        // Then slope and interval are the sorted slopes' own values at the ranks scipy's theilslopes takes
        var slopes = new List<double>();
        for (int i = 0; i < n; i++)
        {
            for (int j = i + 1; j < n; j++)
            {
                if (x[i] != x[j])
                {
                    slopes.Add((y[j] - y[i]) / (x[j] - x[i]));
                }
            }
        }

        slopes.Sort();
        int m = slopes.Count;
        double median = m % 2 == 1 ? slopes[m / 2] : 0.5 * (slopes[(m / 2) - 1] + slopes[m / 2]);
        Assert.Equal(m, line.Pairs);
        Assert.Equal(median, line.Slope);
        Assert.Contains(line.SlopeInterval.Low, slopes);
        Assert.Contains(line.SlopeInterval.High, slopes);
        Assert.True(slopes.IndexOf(line.SlopeInterval.Low) <= m / 2 && slopes.LastIndexOf(line.SlopeInterval.High) >= (m - 1) / 2);
    }

    [Fact]
    public void Theil_Sen_treats_x_values_equal_but_for_rounding_noise_as_ties()
    {
        // Given four points, two of whose x values differ only by floating-point noise (as 24.999999999999996 and 25)
        double[] x = [1, 2, 2 + 4e-15, 3];
        double[] y = [1, 2, 5, 3];

        // When the line is fitted
        var line = TheilSen.Fit(x, y);

        // Then that pair is a tie (5 pairs, not 6, and no slope of 10^15): the slopes are 1, 4, 2, 1, -2 → median 1
        Assert.Equal(5, line.Pairs);
        Assert.Equal(1.0, line.Slope, 12);
    }

    [Fact]
    public void Theil_Sen_beyond_the_direct_limit_gives_the_exact_median_slope_of_the_noise_free_points()
    {
        // Given 1,600 points (above the direct limit) at sugars rounded to 0.1, with ±3e-15 of noise added to x
        var random = new Random(11);
        var clean = Enumerable.Range(0, 1600).Select(_ => Math.Round(20 + (random.NextDouble() * 8), 1)).ToArray();
        var x = clean.Select(v => v + ((random.Next(3) - 1) * 3e-15)).ToArray();
        var y = clean.Select(v => Math.Round((0.6 * v) + (random.NextDouble() - 0.5), 2)).ToArray();

        // When the large-n selector fits the noisy points
        var line = TheilSen.Fit(x, y);

        // Then it gives the median of the pairwise slopes of the noise-free points, formed here one by one
        var slopes = new List<double>();
        for (int i = 0; i < clean.Length; i++)
        {
            for (int j = i + 1; j < clean.Length; j++)
            {
                if (clean[i] != clean[j])
                {
                    slopes.Add((y[j] - y[i]) / (clean[j] - clean[i]));
                }
            }
        }

        slopes.Sort();
        int m = slopes.Count;
        double expected = m % 2 == 1 ? slopes[m / 2] : 0.5 * (slopes[(m / 2) - 1] + slopes[m / 2]);
        Assert.Equal(m, line.Pairs);
        Assert.Equal(expected, line.Slope, 9);
    }

    [Theory]
    [InlineData(2, 1)]
    [InlineData(9, 2)]
    [InlineData(70, 3)]
    [InlineData(400, 4)]
    public void The_kth_pairwise_difference_equals_the_sorted_list_of_all_differences(int n, int seed)
    {
        // Given sorted values with many ties (rounded to 0.05)
        var random = new Random(seed);
        var x = Enumerable.Range(0, n).Select(_ => Math.Round(random.NextDouble() * 4 * 20) / 20).Order().ToArray();
        var all = new List<double>();
        for (int i = 0; i < n; i++)
        {
            for (int j = i + 1; j < n; j++)
            {
                all.Add(x[j] - x[i]);
            }
        }

        all.Sort();

        // Then every rank checked (first, last, Qn's and a spread of others) matches the full list
        long h = (n / 2) + 1;
        var ranks = new[] { 1L, all.Count, Math.Min(all.Count, h * (h - 1) / 2), (all.Count + 1) / 2, Math.Max(1, all.Count / 7) };
        foreach (long k in ranks)
        {
            Assert.Equal(all[(int)(k - 1)], Robust.KthPairwiseDifference(x, k));
        }
    }
}
