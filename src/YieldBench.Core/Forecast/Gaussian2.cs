namespace YieldBench.Core.Forecast;

/// <summary>A two-dimensional Gaussian: mean (A, B) and covariance [[Vaa, Vab], [Vab, Vbb]].</summary>
public readonly record struct Gaussian2(double A, double B, double Vaa, double Vab, double Vbb)
{
    /// <summary>Standard deviation of A.</summary>
    public double SdA => Math.Sqrt(Math.Max(Vaa, 0));

    /// <summary>Standard deviation of B.</summary>
    public double SdB => Math.Sqrt(Math.Max(Vbb, 0));

    /// <summary>Variance of the linear combination ga·A + gb·B.</summary>
    public double VarianceOf(double ga, double gb) => (ga * ga * Vaa) + (2 * ga * gb * Vab) + (gb * gb * Vbb);
}

/// <summary>
/// Sufficient sums of observations y ≈ a·x₁ + b·x₂ with independent Gaussian noise: Σx₁², Σx₁x₂, Σx₂², Σx₁y, Σx₂y, Σy²
/// and the count. With a Gaussian prior on (a, b) the posterior and the marginal likelihood are closed forms.
/// </summary>
public struct LinearSums
{
    /// <summary>Σx₁².</summary>
    public double S11;

    /// <summary>Σx₁x₂.</summary>
    public double S12;

    /// <summary>Σx₂².</summary>
    public double S22;

    /// <summary>Σx₁y.</summary>
    public double S1Y;

    /// <summary>Σx₂y.</summary>
    public double S2Y;

    /// <summary>Σy².</summary>
    public double SYY;

    /// <summary>Observations.</summary>
    public int N;

    /// <summary>Adds one observation.</summary>
    public void Add(double x1, double x2, double y)
    {
        S11 += x1 * x1;
        S12 += x1 * x2;
        S22 += x2 * x2;
        S1Y += x1 * y;
        S2Y += x2 * y;
        SYY += y * y;
        N++;
    }

    /// <summary>
    /// Posterior of (a, b) under the prior and noise variance <paramref name="noiseVariance"/>, with the log marginal
    /// likelihood of the observations: log N(y; Xm, σ²I + XVXᵀ), by the matrix determinant lemma and Woodbury's identity.
    /// </summary>
    public readonly (Gaussian2 Posterior, double LogEvidence) Update(Gaussian2 prior, double noiseVariance)
    {
        if (N == 0)
        {
            return (prior, 0.0);
        }

        // Prior precision.
        double detV = (prior.Vaa * prior.Vbb) - (prior.Vab * prior.Vab);
        double paa = prior.Vbb / detV, pab = -prior.Vab / detV, pbb = prior.Vaa / detV;
        double s2 = noiseVariance;
        double qaa = paa + (S11 / s2), qab = pab + (S12 / s2), qbb = pbb + (S22 / s2);
        double detQ = (qaa * qbb) - (qab * qab);

        // Residual against the prior mean: r = y − X·m.
        double ma = prior.A, mb = prior.B;
        double xr1 = S1Y - (S11 * ma) - (S12 * mb);
        double xr2 = S2Y - (S12 * ma) - (S22 * mb);
        double rr = SYY - (2 * ((ma * S1Y) + (mb * S2Y))) + (ma * ma * S11) + (2 * ma * mb * S12) + (mb * mb * S22);

        // Q⁻¹.
        double caa = qbb / detQ, cab = -qab / detQ, cbb = qaa / detQ;
        double b1 = xr1 / s2, b2 = xr2 / s2;
        double da = (caa * b1) + (cab * b2), db = (cab * b1) + (cbb * b2);
        double quad = (Math.Max(rr, 0) / s2) - ((b1 * da) + (b2 * db));
        double logEvidence = -0.5 * ((N * Math.Log(2 * Math.PI * s2)) + Math.Log(detV) + Math.Log(detQ) + quad);
        return (new Gaussian2(ma + da, mb + db, caa, cab, cbb), logEvidence);
    }
}
