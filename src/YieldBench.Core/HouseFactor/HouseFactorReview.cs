namespace YieldBench.Core.HouseFactor;

/// <summary>One candidate with its backtests.</summary>
/// <param name="Id">Stable id.</param>
/// <param name="Name">Plain name.</param>
/// <param name="Description">What it does.</param>
/// <param name="Complexity">Rank of simplicity (lower is simpler).</param>
/// <param name="BySeason">Leave-one-season-out metrics, or null with fewer than two seasons.</param>
/// <param name="ByLot">Leave-one-lot-out metrics (or ten-fold, see <paramref name="ByLotScheme"/>).</param>
/// <param name="ByLotScheme">Leave-one-lot-out, or ten folds on large data; leave-one-season-out where the by-lot backtest was not run and <paramref name="ByLot"/> repeats the season backtest (an analysis whose candidates are not reported: the version with or without the flagged lots that is not in use, the coverage check's inner analyses).</param>
/// <param name="HeldOut">The held-out predictions of the backtest the recommendation uses: kept for the recommended candidate only (empty for the others once the analysis has scored them and made its choices, so a large history does not hold every candidate's predictions of every lot).</param>
/// <param name="FullFit">The candidate trained on all lots, as strain lines, or null for a multi-variable model.</param>
/// <param name="Importance">Permutation importance on all lots (multi-variable model only; else empty).</param>
public sealed record CandidateResult(
    string Id,
    string Name,
    string Description,
    int Complexity,
    BacktestMetrics? BySeason,
    BacktestMetrics ByLot,
    BacktestScheme ByLotScheme,
    IReadOnlyList<HeldOutPrediction> HeldOut,
    SugarLines? FullFit,
    IReadOnlyList<FeatureImportance> Importance)
{
    /// <summary>The metrics of the backtest the recommendation uses.</summary>
    public BacktestMetrics Primary => BySeason ?? ByLot;
}

/// <summary>The one-standard-error choice for all lots or one strain.</summary>
/// <param name="Strain">Strain code, or <c>*</c> for all lots.</param>
/// <param name="Lots">Lots scored.</param>
/// <param name="CandidateId">Chosen candidate.</param>
/// <param name="BestCandidateId">Candidate with the lowest MAE.</param>
/// <param name="Metrics">The chosen candidate's metrics on these lots.</param>
/// <param name="MaeLimit">Best MAE + one standard error, % v/v.</param>
/// <param name="ErrorBand80">The 80 % band of held-out errors (low, high), % v/v: a prediction p has the interval [p + low, p + high]; NaN when too few lots.</param>
/// <param name="ErrorBand95">The 95 % band of held-out errors (low, high), % v/v; NaN when too few lots.</param>
/// <param name="Explanation">Why it was chosen and what it costs, in plain words.</param>
public sealed record Recommendation(
    string Strain,
    int Lots,
    string CandidateId,
    string BestCandidateId,
    BacktestMetrics Metrics,
    double MaeLimit,
    (double Low, double High) ErrorBand80,
    (double Low, double High) ErrorBand95,
    string Explanation)
{
    /// <summary>
    /// The number to use: the chosen candidate's alcohol per °Brix at <see cref="ReferenceBrix"/>, % v/v per °Brix
    /// (its prediction there ÷ the sugar; for all lots, its pooled line). NaN for a model that needs more than strain
    /// and sugar.
    /// </summary>
    public double Factor { get; init; } = double.NaN;

    /// <summary>The starting sugar <see cref="Factor"/> is quoted at: the median effective starting sugar of the lots, °Brix.</summary>
    public double ReferenceBrix { get; init; } = double.NaN;
}

/// <summary>The house-factor section of a review.</summary>
public sealed record HouseFactorReview
{
    /// <summary>Regime the backtest was scored against.</summary>
    public required LabelRegime Regime { get; init; }

    /// <summary>Threshold of the wrong-side share, % v/v.</summary>
    public required double ThresholdAbv { get; init; }

    /// <summary>Lots used.</summary>
    public required int LotsUsed { get; init; }

    /// <summary>Seasons among the lots, ascending.</summary>
    public required IReadOnlyList<int> Seasons { get; init; }

    /// <summary>The backtest the recommendation rests on.</summary>
    public required BacktestScheme PrimaryScheme { get; init; }

    /// <summary>Every candidate with its backtests, in offer order.</summary>
    public required IReadOnlyList<CandidateResult> Candidates { get; init; }

    /// <summary>The choice over all lots, or null when there were too few lots to choose.</summary>
    public Recommendation? Overall { get; init; }

    /// <summary>Choices for strains with enough lots, by strain code.</summary>
    public IReadOnlyList<Recommendation> ByStrain { get; init; } = [];

    /// <summary>The planner's predictor, or null when there was no recommendation.</summary>
    public PlanningModel? Planning { get; init; }

    /// <summary>Highest harvest sugar under each target at each confidence, for the pooled line and each strain.</summary>
    public IReadOnlyList<ThresholdAnswer> PlannerTable { get; init; } = [];

    /// <summary>The multi-variable model's feature importance in one sentence, when one was offered.</summary>
    public string? ImportanceSentence { get; init; }

    /// <summary>Plain-language explanation, one sentence per entry.</summary>
    public IReadOnlyList<string> Explanation { get; init; } = [];

    /// <summary>Lots left out and other notes on the data.</summary>
    public IReadOnlyList<string> Notes { get; init; } = [];

    /// <summary>True when the lots in <see cref="FlaggedLots"/> were used; false when they were left out.</summary>
    public bool FlaggedLotsIncluded { get; init; }

    /// <summary>Lots flagged as likely errors or not fermented to dryness, in lot order (left out unless <see cref="FlaggedLotsIncluded"/>).</summary>
    public IReadOnlyList<FlaggedLot> FlaggedLots { get; init; } = [];

    /// <summary>
    /// The same analysis with the flagged lots treated the other way (included when this version leaves them out, and
    /// the reverse); null when no lot was flagged, so both versions are this one.
    /// </summary>
    public HouseFactorReview? OtherVersion { get; init; }

    /// <summary>
    /// How often the intervals held the lab's alcohol of lots of a season the analysis had not seen (nested
    /// leave-one-season-out); null when fewer than two seasons, or for the other version.
    /// </summary>
    public IntervalCoverage? Coverage { get; init; }

    /// <summary>Cautions shown with every house-factor result.</summary>
    public IReadOnlyList<string> Cautions { get; init; } = HouseFactorTexts.PlannerCautions;
}
