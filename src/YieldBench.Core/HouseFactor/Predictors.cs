using YieldBench.Core.Conversion;

namespace YieldBench.Core.HouseFactor;

/// <summary>
/// What a house-factor candidate may use to predict a lot's final alcohol: its inputs before fermentation, never its
/// lab results. Optional values are null when the cellar did not record them.
/// </summary>
/// <param name="StartingBrix">Effective starting sugar after recorded additions, °Brix (0–50).</param>
/// <param name="Strain">Yeast strain code.</param>
/// <param name="Vessel">Vessel type.</param>
/// <param name="VesselCapacityL">Vessel capacity, L.</param>
/// <param name="Variety">Grape variety.</param>
/// <param name="YanMgL">Yeast assimilable nitrogen, mg N/L.</param>
/// <param name="Ph">Must pH.</param>
/// <param name="FermentationTempC">Mean fermentation temperature, °C.</param>
public sealed record PredictionInput(
    double StartingBrix,
    string Strain,
    string? Vessel = null,
    double? VesselCapacityL = null,
    string? Variety = null,
    double? YanMgL = null,
    double? Ph = null,
    double? FermentationTempC = null)
{
    /// <summary>
    /// Fermentable sugar after recorded additions by the OIV must table and the review's mass balance, g/L
    /// (<see cref="AdditionBalance.Apply(Units.SugarReading, Lots.Additions, SugarModel)"/>): the EU convention's
    /// numerator. NaN when no addition was recorded (then the table at <see cref="StartingBrix"/> is the same).
    /// </summary>
    public double BalancedSugarGl { get; init; } = double.NaN;

    /// <summary>The inputs of a lot whose conversion measures were computed.</summary>
    public static PredictionInput From(LotConversion lot)
    {
        ArgumentNullException.ThrowIfNull(lot);
        var l = lot.Lot;
        return new PredictionInput(
            lot.EffectiveStartingBrix, l.Strain, l.Vessel, l.VesselCapacityL, l.Variety, l.YanMgL, l.Ph, l.MeanFermentationTempC)
        {
            BalancedSugarGl = lot.AdditionsApplied ? AdditionBalance.Apply(l.StartingSugar, l.Additions, SugarModel.Default).EffectiveSugarGl : double.NaN,
        };
    }
}

/// <summary>A trained predictor of final alcohol (% v/v) from a lot's inputs.</summary>
public interface IAbvPredictor
{
    /// <summary>Predicted final alcohol, % v/v.</summary>
    double PredictAbv(PredictionInput input);

    /// <summary>Predicted final alcohol of several lots, % v/v, in input order (models with a per-call cost batch this).</summary>
    IReadOnlyList<double> PredictAbv(IReadOnlyList<PredictionInput> inputs) => inputs.Select(PredictAbv).ToArray();

    /// <summary>
    /// The predictor as per-strain curves over starting °Brix, when it is one (the planner can use only such a
    /// predictor, as it asks for strain and sugar alone); null for models that use more inputs.
    /// </summary>
    SugarLines? AsSugarLines();

    /// <summary>
    /// Permutation importance of each input on the given lots, when the predictor can report it; otherwise empty.
    /// </summary>
    IReadOnlyList<FeatureImportance> Importance(IReadOnlyList<LotConversion> lots, int seed);
}

/// <summary>
/// A house-factor candidate: trains on a set of lots and returns a predictor. Implementations must be deterministic
/// for a given training set and seed.
/// </summary>
public interface ICandidateTrainer
{
    /// <summary>Stable kebab-case id, e.g. <c>pooled-median</c>.</summary>
    string Id { get; }

    /// <summary>Plain-language name.</summary>
    string Name { get; }

    /// <summary>One sentence on what the candidate does.</summary>
    string Description { get; }

    /// <summary>
    /// Rank of simplicity for the one-standard-error rule: lower is simpler (0 for fixed factors, 1 per pooled
    /// parameter, more for per-strain and multi-variable models). Ties keep the candidate order.
    /// </summary>
    int Complexity { get; }

    /// <summary>True when training is slow enough that leave-one-lot-out is replaced by grouped folds on large data.</summary>
    bool IsCostly { get; }

    /// <summary>Trains on <paramref name="lots"/> (at least one lot, all with finite measures).</summary>
    IAbvPredictor Train(IReadOnlyList<LotConversion> lots, int seed);
}

/// <summary>How a <see cref="SugarLines"/> predictor turns °Brix into alcohol.</summary>
public enum SugarCurve
{
    /// <summary>abv = intercept + slope × °Brix, per strain.</summary>
    Line,

    /// <summary>The OIV/EU convention: fermentable sugar (OIV must table) ÷ 16.83 g/L per % vol; the same for every strain.</summary>
    EuConvention,
}

/// <summary>One strain's line: abv (% v/v) = <paramref name="Intercept"/> + <paramref name="SlopePerBrix"/> × °Brix.</summary>
/// <param name="Strain">Strain code, or <c>*</c> for the pooled line.</param>
/// <param name="Intercept">Intercept, % v/v.</param>
/// <param name="SlopePerBrix">Slope, % v/v per °Brix.</param>
/// <param name="Lots">Lots the line was fitted on.</param>
public sealed record StrainLine(string Strain, double Intercept, double SlopePerBrix, int Lots)
{
    /// <summary>Predicted alcohol, % v/v, at <paramref name="brix"/> °Brix.</summary>
    public double At(double brix) => Intercept + (SlopePerBrix * brix);
}

/// <summary>
/// A predictor that uses only strain and starting sugar: a pooled line and optional per-strain lines (strains not
/// listed use the pooled line), or the EU convention.
/// </summary>
public sealed record SugarLines(SugarCurve Curve, StrainLine Pooled, IReadOnlyList<StrainLine> Strains) : IAbvPredictor
{
    /// <summary>A single pooled line.</summary>
    public static SugarLines Single(double intercept, double slope, int lots) =>
        new(SugarCurve.Line, new StrainLine("*", intercept, slope, lots), []);

    /// <summary>The EU convention.</summary>
    public static SugarLines EuConvention { get; } = new(SugarCurve.EuConvention, new StrainLine("*", double.NaN, double.NaN, 0), []);

    /// <summary>The line used for a strain (its own when fitted, else the pooled one).</summary>
    public StrainLine LineFor(string strain) =>
        Strains.FirstOrDefault(s => string.Equals(s.Strain, strain, StringComparison.Ordinal)) ?? Pooled;

    /// <summary>Predicted alcohol, % v/v, for a strain at a starting sugar in °Brix.</summary>
    public double Predict(string strain, double brix) => Curve switch
    {
        SugarCurve.EuConvention => Units.OivMustTable.PotentialAlcohol(brix),
        _ => LineFor(strain).At(brix),
    };

    /// <inheritdoc />
    public double PredictAbv(PredictionInput input)
    {
        ArgumentNullException.ThrowIfNull(input);

        // The EU convention divides the must's fermentable sugar by 16.83: after a water or sugar addition, the sugar
        // the review's mass balance gives, not the table's value at the diluted or raised °Brix.
        return Curve == SugarCurve.EuConvention && double.IsFinite(input.BalancedSugarGl)
            ? input.BalancedSugarGl / Units.OivMustTable.SugarGramsPerPercentVolume
            : Predict(input.Strain, input.StartingBrix);
    }

    /// <inheritdoc />
    public SugarLines? AsSugarLines() => this;

    /// <inheritdoc />
    public IReadOnlyList<FeatureImportance> Importance(IReadOnlyList<LotConversion> lots, int seed) => [];
}

/// <summary>Permutation importance of one input.</summary>
/// <param name="Feature">Plain name of the input, e.g. "starting sugar".</param>
/// <param name="MaeIncrease">Mean increase in mean absolute error, % v/v, when the input's values are shuffled among lots.</param>
public sealed record FeatureImportance(string Feature, double MaeIncrease);
