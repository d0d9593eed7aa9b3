using YieldBench.Core.Forecast;

namespace YieldBench.Core.Tests.Forecast;

/// <summary>
/// The forecast intervals' quantiles. Reference values from scipy 1.10.1 (Debian python3-scipy):
/// <c>python3 -c "from scipy.stats import norm; print(norm.cdf(z), norm.pdf(z))"</c> for the normal, and for the
/// mixture <c>brentq(lambda x: 0.3*norm.cdf(x,10,2) + 0.7*norm.cdf(x,15,3) - q, -100, 100, xtol=1e-13)</c>.
/// </summary>
public class NormalMixtureTests
{
    [Theory]
    [InlineData(-9.0, 1.1285884059538324e-19, 1.0279773571668917e-18)]
    [InlineData(-6.0, 9.865876450376946e-10, 6.075882849823286e-09)]
    [InlineData(-3.0, 0.0013498980316300933, 0.004431848411938008)]
    [InlineData(-1.5, 0.06680720126885807, 0.12951759566589174)]
    [InlineData(0.0, 0.5, 0.3989422804014327)]
    [InlineData(0.5, 0.6914624612740131, 0.35206532676429947)]
    [InlineData(2.0, 0.9772498680518208, 0.05399096651318805)]
    [InlineData(6.0, 0.9999999990134123, 6.075882849823286e-09)]
    public void The_normal_distribution_function_matches_scipy(double z, double cdf, double pdf)
    {
        // When Hart's approximation is evaluated
        var (phi, density) = NormalMixture.StandardNormal(z);

        // Then it agrees with scipy's norm.cdf to 1e-15 absolute (and to 1e-8 relative in the far lower tail, where the
        // continued fraction's five terms stop), and the density to 1e-15
        Assert.True(Math.Abs(phi - cdf) <= 1e-15, $"Φ({z}) = {phi}, scipy {cdf}");
        if (cdf < 1e-6)
        {
            Assert.True(Math.Abs(phi - cdf) <= 1e-8 * cdf, $"Φ({z}) = {phi}, scipy {cdf} (relative)");
        }

        Assert.Equal(pdf, density, 1e-15 * Math.Max(1, pdf));
    }

    [Theory]
    [InlineData(0.1, 8.867315087009926)]
    [InlineData(0.5, 13.458349164763375)]
    [InlineData(0.9, 18.202828562267293)]
    public void A_two_part_mixture_has_the_quantiles_scipy_finds(double q, double expected)
    {
        // Given 0.3·N(10, 2²) + 0.7·N(15, 3²)
        var m = new NormalMixture(2);
        m.Add(10, 2, 0.3);
        m.Add(15, 3, 0.7);

        // Then its quantile is the root of its distribution function (not a point rule's approximation)
        Assert.Equal(expected, m.Quantile(q), 1e-7);
    }

    [Fact]
    public void A_single_normal_has_its_80_percent_interval_1_2816_sd_either_side()
    {
        // Given N(100, 10²) with weight 5 (weights need not sum to 1)
        var m = new NormalMixture(1);
        m.Add(100, 10, 5);

        // Then the 10 % and 90 % quantiles are 100 ∓ 12.815515655446004 (norm.ppf(0.9) = 1.2815515655446004)
        Assert.Equal(87.184484344553996, m.Quantile(0.1), 1e-7);
        Assert.Equal(112.815515655446004, m.Quantile(0.9), 1e-7);
    }

    [Fact]
    public void Mass_never_reached_pushes_the_quantiles_up_and_the_upper_ones_to_infinity()
    {
        // Given 80 % N(0, 1) and 20 % of the weight on a time never reached
        var m = new NormalMixture(1);
        m.Add(0, 1, 0.8);
        m.Add(double.PositiveInfinity, 0, 0.2);

        // Then the median is where Φ(x) = 0.5 / 0.8 = 0.625 (norm.ppf(0.625) = 0.31863936396437514), the 90 % point is
        // never, and the share above 1.5 counts the never part unless asked for the finite part only
        Assert.Equal(0.31863936396437514, m.Quantile(0.5), 1e-7);
        Assert.True(double.IsPositiveInfinity(m.Quantile(0.9)));
        Assert.Equal(0.2 + (0.8 * 0.06680720126885807), m.ShareAbove(1.5, finiteOnly: false), 1e-12);
        Assert.Equal(0.8 * 0.06680720126885807, m.ShareAbove(1.5, finiteOnly: true), 1e-12);
    }

    [Fact]
    public void A_floor_holds_the_low_quantiles_at_the_highest_temperature_already_logged()
    {
        // Given N(0, 1) floored at 0.5 (a peak is never below what was already logged)
        var m = new NormalMixture(1) { Floor = 0.5 };
        m.Add(0, 1, 1);

        // Then every quantile up to Φ(0.5) = 0.691 sits on the floor, and those above are the normal's own
        Assert.Equal(0.5, m.Quantile(0.1));
        Assert.Equal(0.5, m.Quantile(0.6));
        Assert.Equal(1.2815515655446004, m.Quantile(0.9), 1e-7);
    }

    [Fact]
    public void Point_masses_and_normals_mix()
    {
        // Given a point mass of 0.5 at 3 and 0.5 of N(10, 1)
        var m = new NormalMixture(2);
        m.Add(3, 0, 0.5);
        m.Add(10, 1, 0.5);

        // Then the 25 % point is the point mass (to the search's tolerance) and the 75 % point the normal's median
        Assert.Equal(3, m.Quantile(0.25), 1e-6);
        Assert.Equal(10, m.Quantile(0.75), 1e-6);
    }

    [Fact]
    public void Compacting_moves_no_quantile_by_more_than_the_weight_dropped()
    {
        // Given 40 components of very unequal weight
        var m = new NormalMixture(40);
        var copy = new NormalMixture(40);
        for (int i = 0; i < 40; i++)
        {
            double w = Math.Pow(0.7, i);
            m.Add(i * 0.5, 1 + (0.1 * i), w);
            copy.Add(i * 0.5, 1 + (0.1 * i), w);
        }

        // When the lightest components holding at most 0.1 % of the weight are dropped
        copy.Compact(1e-3);

        // Then fewer are held, and each compacted quantile lies between the full mixture's quantiles 0.1 % either side
        Assert.True(copy.Count < m.Count, $"{copy.Count} of {m.Count} kept");
        foreach (double q in new[] { 0.1, 0.5, 0.9 })
        {
            double x = copy.Quantile(q);
            Assert.InRange(x, m.Quantile(q - 1e-3) - 1e-9, m.Quantile(q + 1e-3) + 1e-9);
        }
    }

    [Fact]
    public void Compacting_drops_the_lightest_components_whose_weights_fit_the_share_and_a_plan_repeats_it()
    {
        // Given twelve components: ten of weight 1 and two light ones (0.004 and 0.007; total 10.011)
        var m = new NormalMixture(12);
        for (int i = 0; i < 12; i++)
        {
            m.Add(i, 1, i == 3 ? 0.004 : i == 8 ? 0.007 : 1);
        }

        // When the plan for a share of 0.1 % (budget 0.010011) is made
        var plan = m.CompactPlan(1e-3);

        // Then only the lightest fits the budget (0.004 + 0.007 would not): eleven stay, in their order, scaled by
        // 10.011 / 10.007
        Assert.NotNull(plan);
        Assert.Equal(new[] { 0, 1, 2, 4, 5, 6, 7, 8, 9, 10, 11 }, plan!.Value.Keep);
        Assert.Equal(10.011 / 10.007, plan.Value.Scale, 1e-15);

        // And a mixture filled alike at another moment (means moved) and compacted by the plan is what Compact makes
        var moved = new NormalMixture(12);
        var again = new NormalMixture(12);
        for (int i = 0; i < 12; i++)
        {
            moved.Add((2 * i) + 0.5, 1.5, i == 3 ? 0.004 : i == 8 ? 0.007 : 1);
            again.Add((2 * i) + 0.5, 1.5, i == 3 ? 0.004 : i == 8 ? 0.007 : 1);
        }

        moved.Apply(plan.Value);
        again.Compact(1e-3);
        Assert.Equal(11, moved.Count);
        foreach (double q in new[] { 0.1, 0.5, 0.9 })
        {
            Assert.Equal(again.Quantile(q), moved.Quantile(q));
        }
    }
}
