using YieldBench.Core.Forecast;

namespace YieldBench.Core.Tests.Forecast;

public class ConjugateTests
{
    [Fact]
    public void The_closed_form_evidence_and_posterior_are_those_of_the_joint_gaussian()
    {
        // Given y = a·x1 + b·x2 + noise at three points, a prior on (a, b) and noise variance 0.04
        var prior = new Gaussian2(24, -1.8, 0.09, 0.01, 0.05);
        double[][] x = [[0.9, 0.1], [0.6, 0.4], [0.2, 0.8]];
        double[] y = [21.4, 13.9, 3.1];
        const double s2 = 0.04;
        var sums = default(LinearSums);
        for (int i = 0; i < 3; i++)
        {
            sums.Add(x[i][0], x[i][1], y[i]);
        }

        // When the closed forms are worked out
        var (post, logEvidence) = sums.Update(prior, s2);

        // Then the evidence is the density of y under N(X·m, σ²I + X·V·Xᵀ), computed here directly (3×3)
        var m = new double[3];
        var c = new double[3, 3];
        for (int i = 0; i < 3; i++)
        {
            m[i] = (x[i][0] * prior.A) + (x[i][1] * prior.B);
            for (int j = 0; j < 3; j++)
            {
                c[i, j] = (x[i][0] * x[j][0] * prior.Vaa) + (((x[i][0] * x[j][1]) + (x[i][1] * x[j][0])) * prior.Vab) + (x[i][1] * x[j][1] * prior.Vbb) + (i == j ? s2 : 0);
            }
        }

        var (inv, det) = Invert3(c);
        double q = 0;
        for (int i = 0; i < 3; i++)
        {
            for (int j = 0; j < 3; j++)
            {
                q += (y[i] - m[i]) * inv[i, j] * (y[j] - m[j]);
            }
        }

        double direct = (-0.5 * q) - (1.5 * Math.Log(2 * Math.PI)) - (0.5 * Math.Log(det));
        Assert.Equal(direct, logEvidence, 9);

        // And the posterior mean is m + V·Xᵀ·C⁻¹·(y − X·m), the posterior covariance V − V·Xᵀ·C⁻¹·X·V
        var vx = new double[2, 3];
        for (int j = 0; j < 3; j++)
        {
            vx[0, j] = (prior.Vaa * x[j][0]) + (prior.Vab * x[j][1]);
            vx[1, j] = (prior.Vab * x[j][0]) + (prior.Vbb * x[j][1]);
        }

        double ma = prior.A, mb = prior.B, vaa = prior.Vaa, vbb = prior.Vbb;
        for (int i = 0; i < 3; i++)
        {
            for (int j = 0; j < 3; j++)
            {
                ma += vx[0, i] * inv[i, j] * (y[j] - m[j]);
                mb += vx[1, i] * inv[i, j] * (y[j] - m[j]);
                vaa -= vx[0, i] * inv[i, j] * vx[0, j];
                vbb -= vx[1, i] * inv[i, j] * vx[1, j];
            }
        }

        Assert.Equal(ma, post.A, 9);
        Assert.Equal(mb, post.B, 9);
        Assert.Equal(vaa, post.Vaa, 9);
        Assert.Equal(vbb, post.Vbb, 9);
    }

    private static (double[,] Inverse, double Det) Invert3(double[,] a)
    {
        double det = (a[0, 0] * ((a[1, 1] * a[2, 2]) - (a[1, 2] * a[2, 1])))
            - (a[0, 1] * ((a[1, 0] * a[2, 2]) - (a[1, 2] * a[2, 0])))
            + (a[0, 2] * ((a[1, 0] * a[2, 1]) - (a[1, 1] * a[2, 0])));
        var inv = new double[3, 3];
        for (int i = 0; i < 3; i++)
        {
            for (int j = 0; j < 3; j++)
            {
                int r0 = (j + 1) % 3, r1 = (j + 2) % 3, c0 = (i + 1) % 3, c1 = (i + 2) % 3;
                inv[i, j] = ((a[r0, c0] * a[r1, c1]) - (a[r0, c1] * a[r1, c0])) / det;
            }
        }

        return (inv, det);
    }
}

public class QuadratureTests
{
    [Fact]
    public void The_seven_point_Gauss_Hermite_rule_integrates_polynomials_to_degree_13_exactly()
    {
        // ∫ x^k e^(−x²) dx over the line is Γ((k + 1)/2) for even k (√π, √π/2, 3√π/4, 15√π/8, 105√π/16, 945√π/32, 10395√π/64)
        // and 0 for odd k; a 7-point rule is exact up to degree 2·7 − 1 = 13.
        double[] even = [1, 0.5, 0.75, 1.875, 6.5625, 29.53125, 162.421875];
        var x = SeasonForecaster.HermiteNodes;
        var w = SeasonForecaster.HermiteWeights;
        for (int k = 0; k <= 13; k++)
        {
            double sum = 0;
            for (int i = 0; i < x.Length; i++)
            {
                sum += w[i] * Math.Pow(x[i], k);
            }

            double exact = k % 2 == 1 ? 0 : even[k / 2] * Math.Sqrt(Math.PI);
            Assert.Equal(exact, sum, 9);
        }
    }
}
