using YieldBench.Core.Units;

namespace YieldBench.Core.HouseFactor;

/// <summary>
/// What the planner needs for one strain (or <c>*</c>, all strains): a curve from starting °Brix to predicted alcohol
/// and the held-out errors (actual − predicted, % v/v, with their season and strain) its season-aware intervals come
/// from (<see cref="SeasonErrorModel"/>).
/// </summary>
/// <param name="Strain">Strain code, or <c>*</c> for the pooled line.</param>
/// <param name="CandidateId">The candidate the line comes from (<c>given</c> when typed on the command line).</param>
/// <param name="Curve">Line or EU convention.</param>
/// <param name="Intercept">Intercept, % v/v (NaN for the EU convention).</param>
/// <param name="SlopePerBrix">Slope, % v/v per °Brix (NaN for the EU convention).</param>
/// <param name="Lots">Lots the line was fitted on.</param>
/// <param name="Errors">Held-out errors with their season and strain; empty when none are known.</param>
/// <param name="ErrorBasis">Which held-out lots the errors are, in words.</param>
public sealed record PlanningLine(
    string Strain,
    string CandidateId,
    SugarCurve Curve,
    double Intercept,
    double SlopePerBrix,
    int Lots,
    IReadOnlyList<SeasonError> Errors,
    string ErrorBasis)
{
    /// <summary>
    /// The random-effects model of <see cref="Errors"/> the intervals come from, fitted once per error list: the
    /// coverage check asks for it for every held-out lot, and refitting it each time made that quadratic in the lots
    /// (docs/performance.md). Kept beside the record, not in it, so a line's equality stays that of its data.
    /// </summary>
    public SeasonErrorModel ErrorModel => FittedModels.GetValue(Errors, SeasonErrorModel.Of);

    private static readonly System.Runtime.CompilerServices.ConditionalWeakTable<IReadOnlyList<SeasonError>, SeasonErrorModel> FittedModels = new();

    /// <summary>
    /// The conversion factor this line stands for, % v/v per °Brix, at <paramref name="brix"/> °Brix: predicted
    /// alcohol ÷ °Brix (the slope itself for a line through the origin).
    /// </summary>
    public double FactorAt(double brix) => Predict(brix) / brix;

    /// <summary>Predicted alcohol, % v/v, at a starting sugar of <paramref name="brix"/> °Brix.</summary>
    public double Predict(double brix) => Curve == SugarCurve.EuConvention
        ? OivMustTable.PotentialAlcohol(brix)
        : Intercept + (SlopePerBrix * brix);

    /// <summary>
    /// The starting °Brix whose predicted alcohol is <paramref name="abv"/>; NaN when the curve cannot reach it
    /// (a flat or falling line, or an answer outside 0–50 °Brix).
    /// </summary>
    public double BrixFor(double abv)
    {
        double brix;
        if (Curve == SugarCurve.EuConvention)
        {
            double sugar = abv * OivMustTable.SugarGramsPerPercentVolume;
            if (sugar <= 0 || sugar > OivMustTable.SugarGramsPerLitre(SugarReading.MaxBrix))
            {
                return double.NaN;
            }

            brix = OivMustTable.BrixFromSugarGramsPerLitre(sugar);
        }
        else
        {
            if (!(SlopePerBrix > 0))
            {
                return double.NaN;
            }

            brix = (abv - Intercept) / SlopePerBrix;
        }

        return brix is > 0 and <= SugarReading.MaxBrix ? brix : double.NaN;
    }
}

/// <summary>The planner's predictor: a pooled line and per-strain lines (strains not listed use the pooled line).</summary>
/// <param name="Pooled">The line for a strain not listed, or when no strain is given.</param>
/// <param name="Strains">Per-strain lines, ordered by strain code.</param>
/// <param name="Basis">In words: which candidate(s) and backtest the model comes from.</param>
public sealed record PlanningModel(PlanningLine Pooled, IReadOnlyList<PlanningLine> Strains, string Basis)
{
    /// <summary>
    /// The starting sugar the factors are quoted at, °Brix: the median effective starting sugar of the lots the model
    /// learned from (NaN for a factor typed directly, which is the same at every sugar).
    /// </summary>
    public double ReferenceBrix { get; init; } = double.NaN;

    /// <summary>Lowest effective starting sugar among the lots the model learned from, °Brix (NaN when unknown).</summary>
    public double HistoryLowBrix { get; init; } = double.NaN;

    /// <summary>Highest effective starting sugar among the lots the model learned from, °Brix (NaN when unknown).</summary>
    public double HistoryHighBrix { get; init; } = double.NaN;

    /// <summary>True when <paramref name="brix"/> lies outside the lots' range, so a prediction there extrapolates.</summary>
    public bool Extrapolates(double brix) =>
        double.IsFinite(HistoryLowBrix) && double.IsFinite(HistoryHighBrix) && (brix < HistoryLowBrix || brix > HistoryHighBrix);

    /// <summary>The % v/v per °Brix a line stands for at <see cref="ReferenceBrix"/> (its slope for a typed factor).</summary>
    public double FactorOf(PlanningLine line)
    {
        ArgumentNullException.ThrowIfNull(line);
        return double.IsFinite(ReferenceBrix) ? line.FactorAt(ReferenceBrix) : line.Intercept == 0 ? line.SlopePerBrix : double.NaN;
    }

    /// <summary>The line for a strain (null or unknown: the pooled line).</summary>
    public PlanningLine For(string? strain) =>
        strain is null ? Pooled : Strains.FirstOrDefault(s => string.Equals(s.Strain, strain, StringComparison.Ordinal)) ?? Pooled;

    /// <summary>True when the strain has a line of its own.</summary>
    public bool Knows(string strain) => Strains.Any(s => string.Equals(s.Strain, strain, StringComparison.Ordinal));

    /// <summary>A model from a factor typed by the user: abv = factor × °Brix, no held-out errors (no intervals).</summary>
    /// <param name="factor">% v/v per °Brix, in (0, 1.5).</param>
    public static PlanningModel FromFactor(double factor)
    {
        if (double.IsNaN(factor) || factor <= 0 || factor >= 1.5)
        {
            throw new ArgumentOutOfRangeException(nameof(factor), factor, "A conversion factor must be between 0 and 1.5 % v/v per °Brix.");
        }

        return new PlanningModel(
            new PlanningLine("*", "given", SugarCurve.Line, 0, factor, 0, [], "no held-out errors: the factor was given directly"),
            [],
            "a factor given on the command line");
    }
}
