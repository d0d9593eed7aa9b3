namespace YieldBench.Core.Forecast;

/// <summary>Least squares for a few columns by the normal equations and Cholesky, with an optional ridge on chosen columns.</summary>
internal static class SmallLeastSquares
{
    /// <summary>
    /// Coefficients minimising Σ(y − Xβ)² + ridge·Σ_{penalised} β²; the residual variance (divided by n − p) and
    /// (XᵀX + ridge)⁻¹, whose product is the coefficients' covariance.
    /// </summary>
    public static (double[] Beta, double ResidualVariance, double[,] Inverse) Fit(IReadOnlyList<double[]> rows, IReadOnlyList<double> y, double ridge = 0, bool[]? penalised = null)
    {
        int n = rows.Count, p = rows[0].Length;
        var a = new double[p, p];
        var b = new double[p];
        for (int i = 0; i < n; i++)
        {
            var x = rows[i];
            for (int j = 0; j < p; j++)
            {
                b[j] += x[j] * y[i];
                for (int k = 0; k <= j; k++)
                {
                    a[j, k] += x[j] * x[k];
                }
            }
        }

        for (int j = 0; j < p; j++)
        {
            for (int k = 0; k < j; k++)
            {
                a[k, j] = a[j, k];
            }

            // A tiny ridge on every column keeps an empty or collinear column from breaking the factorisation.
            a[j, j] += (penalised is null || penalised[j] ? ridge : 0) + (1e-9 * Math.Max(1.0, a[j, j]));
        }

        var inverse = Invert(a);
        var beta = new double[p];
        for (int j = 0; j < p; j++)
        {
            for (int k = 0; k < p; k++)
            {
                beta[j] += inverse[j, k] * b[k];
            }
        }

        double ss = 0;
        for (int i = 0; i < n; i++)
        {
            double r = y[i];
            for (int j = 0; j < p; j++)
            {
                r -= rows[i][j] * beta[j];
            }

            ss += r * r;
        }

        return (beta, ss / Math.Max(1, n - p), inverse);
    }

    /// <summary>Inverse of a symmetric positive definite matrix by Cholesky.</summary>
    private static double[,] Invert(double[,] a)
    {
        int p = a.GetLength(0);
        var l = new double[p, p];
        for (int j = 0; j < p; j++)
        {
            double d = a[j, j];
            for (int k = 0; k < j; k++)
            {
                d -= l[j, k] * l[j, k];
            }

            l[j, j] = Math.Sqrt(Math.Max(d, 1e-300));
            for (int i = j + 1; i < p; i++)
            {
                double s = a[i, j];
                for (int k = 0; k < j; k++)
                {
                    s -= l[i, k] * l[j, k];
                }

                l[i, j] = s / l[j, j];
            }
        }

        var inv = new double[p, p];
        var e = new double[p];
        var z = new double[p];
        for (int c = 0; c < p; c++)
        {
            Array.Clear(e);
            e[c] = 1;
            for (int i = 0; i < p; i++)
            {
                double s = e[i];
                for (int k = 0; k < i; k++)
                {
                    s -= l[i, k] * z[k];
                }

                z[i] = s / l[i, i];
            }

            for (int i = p - 1; i >= 0; i--)
            {
                double s = z[i];
                for (int k = i + 1; k < p; k++)
                {
                    s -= l[k, i] * inv[k, c];
                }

                inv[i, c] = s / l[i, i];
            }
        }

        return inv;
    }
}
