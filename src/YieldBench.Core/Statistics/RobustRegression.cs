using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;

namespace YieldBench.Core.Statistics;

/// <summary>A robust linear fit: coefficients in the order of the design's columns, with robust standard errors.</summary>
public sealed record RobustFit
{
    /// <summary>Column names, as given.</summary>
    public required IReadOnlyList<string> Names { get; init; }

    /// <summary>Coefficients, one per column, in the unit of y per unit of the column.</summary>
    public required IReadOnlyList<double> Coefficients { get; init; }

    /// <summary>Robust standard errors (Huber 1981 sandwich-type correction, as MASS <c>summary.rlm</c> "XtX").</summary>
    public required IReadOnlyList<double> StandardErrors { get; init; }

    /// <summary>Coefficient ± t(n − p, (1 + level)/2) × standard error.</summary>
    public required IReadOnlyList<Interval> Intervals { get; init; }

    /// <summary>Covariance of the coefficients, σ̂²·κ²/m²·(XᵀX)⁻¹, for intervals of linear combinations.</summary>
    public required double[,] Covariance { get; init; }

    /// <summary>Final residual scale: median|r| / 0.6745 of the residuals entering the last weighting.</summary>
    public required double Scale { get; init; }

    /// <summary>Final Huber weights, min(1, k·s/|r|), in row order.</summary>
    public required IReadOnlyList<double> Weights { get; init; }

    /// <summary>Residuals y − Xβ, in row order.</summary>
    public required IReadOnlyList<double> Residuals { get; init; }

    /// <summary>Residual degrees of freedom n − p.</summary>
    public required int DegreesOfFreedom { get; init; }

    /// <summary>Iterations of reweighting made.</summary>
    public required int Iterations { get; init; }

    /// <summary>True when the relative change of the residuals fell below the tolerance.</summary>
    public required bool Converged { get; init; }

    /// <summary>Coverage of <see cref="Intervals"/>.</summary>
    public required double Level { get; init; }

    /// <summary>Estimate, standard error and interval of the linear combination Σ cⱼβⱼ.</summary>
    public (double Estimate, double StandardError, Interval Interval) Combination(IReadOnlyList<double> weights)
    {
        ArgumentNullException.ThrowIfNull(weights);
        int p = Coefficients.Count;
        if (weights.Count != p)
        {
            throw new ArgumentException($"The combination needs {p} weights, one per coefficient.", nameof(weights));
        }

        double estimate = 0, variance = 0;
        for (int i = 0; i < p; i++)
        {
            estimate += weights[i] * Coefficients[i];
            for (int j = 0; j < p; j++)
            {
                variance += weights[i] * Covariance[i, j] * weights[j];
            }
        }

        double se = Math.Sqrt(Math.Max(0, variance));
        double t = StudentT.InvCDF(0, 1, DegreesOfFreedom, (1 + Level) / 2);
        return (estimate, se, new Interval(estimate - (t * se), estimate + (t * se), Level));
    }
}

/// <summary>
/// Robust linear regression by Huber M-estimation with iteratively reweighted least squares, following
/// Venables &amp; Ripley, <i>Modern Applied Statistics with S</i> (4th ed., §6.5) as implemented by MASS <c>rlm</c>:
/// start from least squares; each round set the scale s = median|rᵢ|/0.6745 (MAD of the residuals about zero), the
/// weights wᵢ = min(1, k/|rᵢ/s|), refit weighted least squares (QR, MathNet), and stop when
/// √(Σ(r_old − r_new)²/Σ r_old²) ≤ tolerance. Factor columns are ordinary 0/1 dummy columns the caller builds.
/// Standard errors as MASS <c>summary.rlm</c> (method "XtX"): σ̂ = √(Σ(wᵢrᵢ)²/(n − p))·κ/m with m the share of
/// residuals inside ±k·s and κ = 1 + p·var(ψ′)/(n·m²); SEⱼ = σ̂·√[(XᵀX)⁻¹]ⱼⱼ.
/// </summary>
public static class RobustRegression
{
    /// <summary>
    /// Fits y ≈ Xβ. <paramref name="design"/> rows are observations (include a column of ones for an intercept);
    /// <paramref name="k"/> is Huber's constant in units of the scale (1.345: 95 % efficiency at the normal);
    /// <paramref name="maxIterations"/> and <paramref name="tolerance"/> default to rlm's 20 and 1e-4.
    /// Throws when the design is rank-deficient (a factor level without lots, or collinear columns): callers drop
    /// such columns first. When the residual scale reaches 0 (an exact fit), iteration stops with that fit.
    /// </summary>
    public static RobustFit Huber(
        double[,] design,
        IReadOnlyList<double> y,
        IReadOnlyList<string> names,
        double k = Robust.HuberDefaultK,
        double level = 0.95,
        int maxIterations = 20,
        double tolerance = 1e-4)
    {
        ArgumentNullException.ThrowIfNull(design);
        ArgumentNullException.ThrowIfNull(y);
        ArgumentNullException.ThrowIfNull(names);
        Bootstrap.CheckLevel(level);
        MathNetSetup.SingleThreaded();
        int n = design.GetLength(0), p = design.GetLength(1);
        if (y.Count != n || names.Count != p)
        {
            throw new ArgumentException($"The design is {n}×{p}; y needs {n} values and names {p}.", nameof(y));
        }

        if (n <= p)
        {
            throw new ArgumentException($"{n} observations cannot fit {p} coefficients with residual freedom; need more than {p}.", nameof(design));
        }

        // Plain column-major arrays: the loop below runs up to 21 weighted fits, and MathNet's vector operators
        // allocate a new vector per operation, which dominated the cost at 100,000 lots.
        var xc = new double[n * p];
        for (int j = 0; j < p; j++)
        {
            for (int i = 0; i < n; i++)
            {
                xc[(j * n) + i] = design[i, j];
            }
        }

        var yv = y.ToArray();
        if (NumericalRank(Matrix<double>.Build.Dense(n, p, xc), n, p) < p)
        {
            throw new ArgumentException("The design matrix is rank-deficient (an empty factor level or collinear columns).", nameof(design));
        }

        var weights = new double[n];
        Array.Fill(weights, 1.0);
        var scratch = new double[n];
        var beta = WeightedLeastSquares(xc, n, p, yv, weights);
        var resid = Residuals(xc, n, p, yv, beta);
        double scale = 0;
        bool converged = false;
        int iterations = 0;
        for (int iter = 1; iter <= maxIterations; iter++)
        {
            iterations = iter;
            var previous = resid;
            for (int i = 0; i < n; i++)
            {
                scratch[i] = Math.Abs(resid[i]);
            }

            scale = Descriptive.MedianInPlace(scratch) / Robust.ModifiedZFactor;
            if (scale == 0)
            {
                converged = true;
                break;
            }

            for (int i = 0; i < n; i++)
            {
                double u = Math.Abs(resid[i] / scale);
                weights[i] = u <= k ? 1.0 : k / u;
            }

            beta = WeightedLeastSquares(xc, n, p, yv, weights);
            resid = Residuals(xc, n, p, yv, beta);
            double changeSq = 0, previousSq = 0;
            for (int i = 0; i < n; i++)
            {
                double d = previous[i] - resid[i];
                changeSq += d * d;
                previousSq += previous[i] * previous[i];
            }

            double change = Math.Sqrt(changeSq / Math.Max(1e-20, previousSq));
            if (change <= tolerance)
            {
                converged = true;
                break;
            }
        }

        // summary.rlm ("XtX"): weights and ψ′ from the final residuals at the last scale.
        double sumSq = 0, inside = 0;
        var psiPrime = new double[n];
        var finalWeights = new double[n];
        for (int i = 0; i < n; i++)
        {
            double u = scale > 0 ? Math.Abs(resid[i] / scale) : 0;
            finalWeights[i] = u <= k ? 1.0 : k / u;
            psiPrime[i] = u <= k ? 1.0 : 0.0;
            inside += psiPrime[i];
            double wr = resid[i] * finalWeights[i];
            sumSq += wr * wr;
        }

        int df = n - p;
        double m = inside / n;
        double varPsiPrime = Descriptive.StandardDeviation(psiPrime);
        varPsiPrime *= varPsiPrime;
        double kappa = 1 + (p * varPsiPrime / (n * m * m));
        double sigma = Math.Sqrt(sumSq / df) * kappa / m;
        var xtx = new double[p, p];
        for (int a = 0; a < p; a++)
        {
            for (int b = a; b < p; b++)
            {
                double sum = 0;
                for (int i = 0; i < n; i++)
                {
                    sum += xc[(a * n) + i] * xc[(b * n) + i];
                }

                xtx[a, b] = xtx[b, a] = sum;
            }
        }

        var xtxInverse = Matrix<double>.Build.DenseOfArray(xtx).Inverse();
        var covariance = new double[p, p];
        var se = new double[p];
        var intervals = new Interval[p];
        double t = StudentT.InvCDF(0, 1, df, (1 + level) / 2);
        for (int i = 0; i < p; i++)
        {
            for (int j = 0; j < p; j++)
            {
                covariance[i, j] = sigma * sigma * xtxInverse[i, j];
            }

            se[i] = sigma * Math.Sqrt(xtxInverse[i, i]);
            intervals[i] = new Interval(beta[i] - (t * se[i]), beta[i] + (t * se[i]), level);
        }

        return new RobustFit
        {
            Names = names.ToArray(),
            Coefficients = beta,
            StandardErrors = se,
            Intervals = intervals,
            Covariance = covariance,
            Scale = scale,
            Weights = finalWeights,
            Residuals = resid,
            DegreesOfFreedom = df,
            Iterations = iterations,
            Converged = converged,
            Level = level,
        };
    }

    /// <summary>
    /// True when the design's columns are linearly independent (numerical rank = number of columns), judged as
    /// <see cref="Huber"/> judges it before fitting. Costs one thin QR of the design.
    /// </summary>
    public static bool HasFullColumnRank(double[,] design)
    {
        ArgumentNullException.ThrowIfNull(design);
        int n = design.GetLength(0), p = design.GetLength(1);
        return n >= p && NumericalRank(Matrix<double>.Build.DenseOfArray(design), n, p) == p;
    }

    private static double[] WeightedLeastSquares(double[] xc, int n, int p, double[] y, double[] w)
    {
        if (p == 1)
        {
            // One column: the least-squares coefficient is Σwxy / Σwx², which is what the QR solution reduces to.
            double xwy = 0, xwx = 0;
            for (int i = 0; i < n; i++)
            {
                xwy += w[i] * xc[i] * y[i];
                xwx += w[i] * xc[i] * xc[i];
            }

            return [xwy / xwx];
        }

        var xw = new double[n * p];
        var yw = new double[n];
        for (int i = 0; i < n; i++)
        {
            double sw = Math.Sqrt(w[i]);
            yw[i] = y[i] * sw;
            for (int j = 0; j < p; j++)
            {
                xw[(j * n) + i] = xc[(j * n) + i] * sw;
            }
        }

        // The thin factorisation: the full one forms an n×n Q (650 MB at 9000 lots) for the same least-squares solution.
        return Matrix<double>.Build.Dense(n, p, xw).QR(MathNet.Numerics.LinearAlgebra.Factorization.QRMethod.Thin)
            .Solve(Vector<double>.Build.Dense(yw)).ToArray();
    }

    private static double[] Residuals(double[] xc, int n, int p, double[] y, double[] beta)
    {
        var r = (double[])y.Clone();
        for (int j = 0; j < p; j++)
        {
            double b = beta[j];
            int offset = j * n;
            for (int i = 0; i < n; i++)
            {
                r[i] -= xc[offset + i] * b;
            }
        }

        return r;
    }

    /// <summary>
    /// Rank of X from the singular values of R in its thin QR (X = QR with orthonormal Q, so they are X's), counted
    /// above max(n, p)·ε(σ_max) — the usual SVD rank tolerance (from memory of LAPACK/MathNet practice). Matrix.Rank()
    /// gives the same count but forms an n×n factor (650 MB at 9000 rows).
    /// </summary>
    private static int NumericalRank(Matrix<double> x, int rows, int columns)
    {
        var singular = x.QR(MathNet.Numerics.LinearAlgebra.Factorization.QRMethod.Thin).R.Svd(computeVectors: false).S;
        double largest = singular.AbsoluteMaximum();
        if (largest == 0)
        {
            return 0;
        }

        double tolerance = Math.Max(rows, columns) * MathNet.Numerics.Precision.EpsilonOf(largest);
        return singular.Count(v => Math.Abs(v) > tolerance);
    }

}
