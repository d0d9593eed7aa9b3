using YieldBench.Core.Statistics;

namespace YieldBench.Core.Review.Strains;

/// <summary>
/// Settings of the strain review. Every default is documented with its source in docs/methods.md.
/// </summary>
public sealed record StrainReviewSettings
{
    /// <summary>Upper edges of the starting-sugar bands, °Brix, ascending: bands are &lt;21, 21–23, 23–25, 25–27, ≥27.</summary>
    public IReadOnlyList<double> SugarBandEdgesBrix { get; init; } = [21, 23, 25, 27];

    /// <summary>Bootstrap resamples for each interval of a median (at least 2,000 for reports).</summary>
    public int Resamples { get; init; } = 2000;

    /// <summary>Coverage of every interval, in (0, 1).</summary>
    public double Level { get; init; } = 0.95;

    /// <summary>Groups with fewer lots get no interval and the note "too few lots".</summary>
    public int MinLotsForInterval { get; init; } = 5;

    /// <summary>A strain with fewer lots is judged against the pooled lots (robust z, Tukey fences, comparisons).</summary>
    public int MinLotsForStrainReference { get; init; } = 5;

    /// <summary>A strain with fewer finished lots is judged against the pooled Theil–Sen line.</summary>
    public int MinLotsForStrainLine { get; init; } = 8;

    /// <summary>Iglewicz–Hoaglin limit on |modified z| (3.5, their recommendation).</summary>
    public double ModifiedZLimit { get; init; } = 3.5;

    /// <summary>Tukey's inner fence in IQRs beyond the quartiles (1.5).</summary>
    public double TukeyInner { get; init; } = 1.5;

    /// <summary>Tukey's outer fence in IQRs beyond the quartiles (3).</summary>
    public double TukeyOuter { get; init; } = 3.0;

    /// <summary>Limit on the robustly scaled residual from the strain's Theil–Sen line (same scale as modified z).</summary>
    public double LineResidualLimit { get; init; } = 3.5;

    /// <summary>Residual sugar above which a lot is not dry, g/L (OIV: dry at most 4 g/L).</summary>
    public double DryThresholdGl { get; init; } = 4.0;

    /// <summary>Lowest plausible conversion factor, % v/v per °Brix (see the methods document for the derivation).</summary>
    public double PlausibleFactorLow { get; init; } = 0.50;

    /// <summary>Highest plausible conversion factor, % v/v per °Brix (the Gay-Lussac ceiling is about 0.62–0.65).</summary>
    public double PlausibleFactorHigh { get; init; } = 0.68;

    /// <summary>Huber tuning constant for location and for the adjusted regression (1.345: 95 % normal efficiency).</summary>
    public double HuberK { get; init; } = Robust.HuberDefaultK;

    /// <summary>A lot "fits another strain far better" when its |z| there is at most this while its own |z| exceeds the limit.</summary>
    public double MixUpFitZ { get; init; } = 1.0;

    /// <summary>A digit swap "puts the lot on the line" when its scaled residual would be at most this.</summary>
    public double TranspositionFitZ { get; init; } = 1.5;

    /// <summary>Share of water in the must (0–1) that an unrecorded add-back could plausibly explain, low end.</summary>
    public double WaterShareLow { get; init; } = 0.02;

    /// <summary>Share of water in the must (0–1) that an unrecorded add-back could plausibly explain, high end.</summary>
    public double WaterShareHigh { get; init; } = 0.25;

    /// <summary>
    /// From this share of unrecorded water (of the diluted volume) on, the flag is a likely error rather than a check:
    /// 5 % is about 5 L per 100 L of must, 1.2 °Brix at 25 °Brix, so the recorded starting sugar is not the sugar that
    /// fermented and the lot cannot teach a conversion factor (a judgement of common practice).
    /// </summary>
    public double WaterLikelyErrorShare { get; init; } = 0.05;

    /// <summary>
    /// Smallest season drift worth a flag, in % v/v at the strain's median starting sugar: a season median outside the
    /// other seasons' interval but closer than this is within lab repeatability for alcohol and is not flagged.
    /// </summary>
    public double DriftMinimumAbv { get; init; } = 0.15;

    /// <summary>
    /// The spread of a lab's final-alcohol result, % v/v (standard deviation), below which no group's spread is taken to
    /// be: alcohol is reported to 0.1 % v/v and a lab's repeated results differ by about that much (common practice; the
    /// figure is ours, from memory of lab practice, not from a cited standard).
    /// </summary>
    public double AlcoholReadingSd { get; init; } = 0.05;

    /// <summary>
    /// The spread of a starting-sugar reading, °Brix (standard deviation): refractometers and hydrometers are read to
    /// 0.1 °Brix (or 0.001 SG, about 0.25 °Brix) and a must sample is rarely better than that (common practice).
    /// </summary>
    public double SugarReadingSd { get; init; } = 0.1;

    /// <summary>
    /// The least robust scale of a group's conversion factors (% v/v per °Brix) that readings of this precision allow, at
    /// the group's median factor, alcohol and starting sugar: f·√((σA/A)² + (σB/B)²) (first-order propagation of the two
    /// readings' errors into their ratio). A group whose lots agree more closely than this (five lots read to the same
    /// tenths) would otherwise flag a lot for a difference no lab could tell apart.
    /// </summary>
    public double MinimumFactorScale(double medianFactor, double medianAbv, double medianBrix) =>
        medianAbv > 0 && medianBrix > 0
            ? Math.Abs(medianFactor) * Math.Sqrt(Math.Pow(AlcoholReadingSd / medianAbv, 2) + Math.Pow(SugarReadingSd / medianBrix, 2))
            : 0;

    /// <summary>The least robust scale of residuals from a strain's alcohol-on-sugar line of <paramref name="slope"/>, % v/v: √(σA² + (slope·σB)²).</summary>
    public double MinimumLineScale(double slope) => Math.Sqrt((AlcoholReadingSd * AlcoholReadingSd) + Math.Pow(slope * SugarReadingSd, 2));

    /// <summary>Checks the settings; returns the first problem in plain words, or null.</summary>
    public string? Problem()
    {
        for (int i = 0; i < SugarBandEdgesBrix.Count; i++)
        {
            if (double.IsNaN(SugarBandEdgesBrix[i]) || (i > 0 && SugarBandEdgesBrix[i] <= SugarBandEdgesBrix[i - 1]))
            {
                return "starting-sugar band edges must be numbers in ascending order, e.g. 21, 23, 25, 27";
            }
        }

        if (Resamples < Bootstrap.MinResamples)
        {
            return $"bootstrap resamples must be at least {Bootstrap.MinResamples} (2,000 or more recommended)";
        }

        if (Level is <= 0 or >= 1)
        {
            return "the interval level must be between 0 and 1, e.g. 0.95";
        }

        if (PlausibleFactorLow >= PlausibleFactorHigh)
        {
            return "the plausible factor band must have its low end below its high end";
        }

        return null;
    }
}
