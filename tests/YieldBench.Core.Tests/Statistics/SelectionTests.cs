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
}
