namespace YieldBench.Scenario.Tests;

public class ScenarioRandomTests
{
    [Fact]
    public void The_same_seed_gives_the_same_sequence_and_another_seed_a_different_one()
    {
        // Given two generators with one seed and one with another
        var a = new ScenarioRandom(7);
        var b = new ScenarioRandom(7);
        var c = new ScenarioRandom(8);

        // When each draws ten numbers
        var xa = Enumerable.Range(0, 10).Select(_ => a.NextUInt64()).ToArray();
        var xb = Enumerable.Range(0, 10).Select(_ => b.NextUInt64()).ToArray();
        var xc = Enumerable.Range(0, 10).Select(_ => c.NextUInt64()).ToArray();

        // Then the first two agree and the third does not
        Assert.Equal(xa, xb);
        Assert.NotEqual(xa, xc);
    }

    [Fact]
    public void Normal_deviates_have_the_asked_mean_and_spread()
    {
        // Given a generator
        var rng = new ScenarioRandom(12345);

        // When 200,000 normal deviates with mean 3 and SD 2 are drawn
        var x = Enumerable.Range(0, 200_000).Select(_ => rng.Normal(3, 2)).ToArray();
        double mean = x.Average();
        double sd = Math.Sqrt(x.Select(v => (v - mean) * (v - mean)).Sum() / (x.Length - 1));
        double within1 = x.Count(v => Math.Abs(v - 3) < 2) / (double)x.Length;

        // Then mean, SD and the one-SD share match the normal law (0.6827, from Φ(1) − Φ(−1)); tolerances are ~5 standard errors
        Assert.InRange(mean, 3 - 0.023, 3 + 0.023);
        Assert.InRange(sd, 2 - 0.017, 2 + 0.017);
        Assert.InRange(within1, 0.6827 - 0.0053, 0.6827 + 0.0053);
    }

    [Fact]
    public void Uniform_doubles_stay_in_the_unit_interval_and_fill_it_evenly()
    {
        // Given a generator
        var rng = new ScenarioRandom(99);

        // When 100,000 doubles are put into ten bins
        var bins = new int[10];
        for (int i = 0; i < 100_000; i++)
        {
            double u = rng.NextDouble();
            Assert.InRange(u, 0.0, 0.9999999999999999);
            bins[(int)(u * 10)]++;
        }

        // Then every bin holds 10,000 ± 5 standard errors (SE = √(100000·0.1·0.9) ≈ 95)
        Assert.All(bins, n => Assert.InRange(n, 10_000 - 475, 10_000 + 475));
    }

    [Fact]
    public void Forks_with_different_purposes_draw_different_streams()
    {
        // Given one parent and two forks taken in turn
        var parent = new ScenarioRandom(1);
        var f1 = parent.Fork("season-2023");
        var f2 = parent.Fork("season-2023");

        // Then forks taken at different points differ even with one purpose
        Assert.NotEqual(f1.NextUInt64(), f2.NextUInt64());
    }
}
