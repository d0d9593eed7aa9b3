using YieldBench.Core.Statistics;
using YieldBench.Reports.Kinetics;

namespace YieldBench.Reports.Tests.Kinetics;

public sealed class UnionSelectionTests
{
    /// <summary>The ranks of the type-7 quartiles of n values: ⌊(n − 1)·p⌋ and the next, for p = ¼, ½, ¾.</summary>
    private static int[] QuartileRanks(int n) =>
        new[] { 0.25, 0.5, 0.75 }.SelectMany(p =>
        {
            int lo = (int)Math.Floor((n - 1) * p);
            return new[] { lo, Math.Min(lo + 1, n - 1) };
        }).ToArray();

    private static double[] Selected(double[] unordered, double[] ascending, int[] ranks)
    {
        var results = new double[ranks.Length];
        UnionSelection.OrderStatistics(unordered.ToArray(), ascending, ranks, results);
        return results;
    }

    private static double[] Sorted(double[] unordered, double[] ascending, int[] ranks)
    {
        var union = unordered.Concat(ascending).ToArray();
        Array.Sort(union);
        return ranks.Select(r => union[r]).ToArray();
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void Selection_gives_the_values_a_sort_puts_at_every_rank_for_even_and_odd_counts(bool ties)
    {
        // Given samples of every size from 0 to 70 on each side (values from a handful of levels when ties are wanted)
        var random = new Random(20240611);
        for (int na = 0; na <= 70; na++)
        {
            for (int nb = na == 0 ? 1 : 0; nb <= 70; nb += 7)
            {
                double Draw() => ties ? random.Next(5) * 0.25 : Math.Round(random.NextDouble() * 2 - 0.5, 6);
                var a = Enumerable.Range(0, na).Select(_ => Draw()).ToArray();
                var b = Enumerable.Range(0, nb).Select(_ => Draw()).Order().ToArray();
                int n = na + nb;

                // When every rank and the quartile ranks are selected
                var every = Enumerable.Range(0, n).ToArray();

                // Then each is the value a sort of the union puts there
                Assert.Equal(Sorted(a, b, every), Selected(a, b, every));
                Assert.Equal(Sorted(a, b, QuartileRanks(n)), Selected(a, b, QuartileRanks(n)));
            }
        }
    }

    [Fact]
    public void The_type_7_quartiles_from_the_selected_ranks_equal_those_of_the_sorted_union()
    {
        // Given unordered live values and ascending settled ones with ties across the two, for odd and even totals
        var random = new Random(7);
        foreach (int n in new[] { 1, 2, 3, 4, 5, 10, 11, 100, 101, 1000, 1001, 5000 })
        {
            int nb = n / 3;
            var a = Enumerable.Range(0, n - nb).Select(_ => random.Next(40) / 40.0).ToArray();
            var b = Enumerable.Range(0, nb).Select(_ => random.Next(40) / 40.0).Order().ToArray();
            var union = a.Concat(b).ToArray();
            Array.Sort(union);

            // When the quartiles are interpolated from the selected order statistics
            var ranks = QuartileRanks(n);
            var s = Selected(a, b, ranks);
            double Q(int i, double p)
            {
                double h = (n - 1) * p;
                return s[i] + ((h - Math.Floor(h)) * (s[i + 1] - s[i]));
            }

            // Then they are exactly the type-7 quartiles of the sorted union
            Assert.Equal(Descriptive.QuantileOfSorted(union, 0.25), Q(0, 0.25));
            Assert.Equal(Descriptive.QuantileOfSorted(union, 0.5), Q(2, 0.5));
            Assert.Equal(Descriptive.QuantileOfSorted(union, 0.75), Q(4, 0.75));
        }
    }

    [Theory]
    [InlineData("ascending")]
    [InlineData("descending")]
    [InlineData("equal")]
    [InlineData("organ pipe")]
    [InlineData("two levels")]
    public void Orders_that_defeat_a_simple_pivot_still_give_the_sorted_values(string shape)
    {
        // Given 20,000 unordered values in an order that makes naive pivots slow (the depth guard sorts instead)
        const int n = 20_000;
        var a = Enumerable.Range(0, n).Select(i => shape switch
        {
            "ascending" => i,
            "descending" => (double)(n - i),
            "equal" => 0.5,
            "organ pipe" => Math.Min(i, n - i),
            _ => i % 2,
        }).ToArray();
        var b = new[] { -1.0, 0.5, 0.5, 3.0, 1e9 };

        // When the quartile ranks and the extremes are selected
        var ranks = QuartileRanks(n + b.Length).Prepend(0).Append(n + b.Length - 1).Order().ToArray();

        // Then they match the sorted union
        Assert.Equal(Sorted(a, b, ranks), Selected(a, b, ranks));
    }

    [Fact]
    public void Zero_and_negative_zero_select_as_equal_values()
    {
        // Given signed zeros on both sides (equal under comparison)
        var a = new[] { 0.0, -0.0, 1.0, -0.0, -1.0 };
        var b = new[] { -0.0, 0.0 };

        // When every rank is selected, then each is the value of the sorted union up to the sign of zero
        var every = Enumerable.Range(0, 7).ToArray();
        var selected = Selected(a, b, every);
        Assert.Equal(new[] { -1.0, 0, 0, 0, 0, 0, 1.0 }, selected.Select(v => v == 0 ? 0 : v));
    }

    [Fact]
    public void Ranks_may_come_in_any_order_and_repeat()
    {
        // Given a small union (the quartile ranks of two values are 0, 1, 0, 1, 0, 1: not ascending)
        var a = new[] { 3.0, 1.0 };
        var b = new[] { 2.0 };

        // Then each result is the value at its own rank
        Assert.Equal(new[] { 3.0, 1.0, 2.0, 3.0, 1.0 }, Selected(a, b, [2, 0, 1, 2, 0]));
        Assert.Equal(new[] { 1.0, 3.0, 1.0, 3.0, 1.0, 3.0 }, Selected(a, [], QuartileRanks(2)));
    }

    [Fact]
    public void Ranks_outside_the_union_and_too_few_result_places_are_refused()
    {
        var results = new double[2];
        Assert.Throws<ArgumentOutOfRangeException>(() => UnionSelection.OrderStatistics(new[] { 1.0, 2.0 }, new double[] { 3.0 }, new[] { 0, 3 }, results));
        Assert.Throws<ArgumentOutOfRangeException>(() => UnionSelection.OrderStatistics(new[] { 1.0, 2.0 }, new double[] { 3.0 }, new[] { -1 }, results));
        Assert.Throws<ArgumentException>(() => UnionSelection.OrderStatistics(new[] { 1.0, 2.0 }, new double[] { 3.0 }, new[] { 0, 1, 2 }, results));
    }
}
