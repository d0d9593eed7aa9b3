using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Statistics;

namespace YieldBench.Core.HouseFactor;

/// <summary>How lots were held out.</summary>
public enum BacktestScheme
{
    /// <summary>Each season in turn is predicted by a candidate trained on the other seasons.</summary>
    LeaveOneSeasonOut,

    /// <summary>Each lot in turn is predicted by a candidate trained on all other lots.</summary>
    LeaveOneLotOut,

    /// <summary>Lots dealt into ten seeded folds (used instead of leave-one-lot-out for costly candidates on large data).</summary>
    TenFoldByLot,
}

/// <summary>One held-out prediction.</summary>
/// <param name="LotKey">The lot's key.</param>
/// <param name="Season">Season.</param>
/// <param name="Strain">Strain.</param>
/// <param name="ActualAbv">The lab's final alcohol, % v/v.</param>
/// <param name="PredictedAbv">The prediction of a candidate that never saw this lot, % v/v.</param>
public sealed record HeldOutPrediction(LotKey LotKey, int Season, string Strain, double ActualAbv, double PredictedAbv)
{
    /// <summary>Actual − predicted, % v/v (positive: the wine came out stronger than predicted).</summary>
    public double Error => ActualAbv - PredictedAbv;
}

/// <summary>
/// Backtest metrics of one candidate on held-out lots. Errors are actual − predicted, % v/v.
/// </summary>
/// <param name="Lots">Held-out predictions scored.</param>
/// <param name="Mae">Mean absolute error, % v/v.</param>
/// <param name="MaeStandardError">Standard error of the MAE, season-aware: √(σ²_w/n + σ²_b·Σn_g²/n²) of the absolute errors clustered by strain × season (<see cref="SeasonErrorModel"/>; SD ÷ √n when there is one cluster; NaN for n &lt; 2).</param>
/// <param name="Bias">Mean of (predicted − actual), % v/v: positive means the candidate over-predicts.</param>
/// <param name="Rmse">Root mean squared error, % v/v.</param>
/// <param name="P90AbsoluteError">90th percentile of |error| (Hyndman–Fan type 7), % v/v.</param>
/// <param name="ShareWithinTolerance">Share of lots whose lab alcohol the label regime would accept against the prediction as the stated value.</param>
/// <param name="ShareWrongSideOfThreshold">Share of lots predicted on the other side of the threshold from the lab alcohol (at or below vs above).</param>
public sealed record BacktestMetrics(
    int Lots,
    double Mae,
    double MaeStandardError,
    double Bias,
    double Rmse,
    double P90AbsoluteError,
    double ShareWithinTolerance,
    double ShareWrongSideOfThreshold)
{
    /// <summary>Scores held-out predictions against a regime and a threshold (% v/v).</summary>
    public static BacktestMetrics Score(IReadOnlyList<HeldOutPrediction> predictions, LabelRegime regime, double thresholdAbv)
    {
        ArgumentNullException.ThrowIfNull(predictions);
        ArgumentNullException.ThrowIfNull(regime);
        int n = predictions.Count;
        if (n == 0)
        {
            return new BacktestMetrics(0, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN);
        }

        var abs = predictions.Select(p => Math.Abs(p.Error)).ToArray();
        double mae = abs.Average();
        // Lots of one strain in one season share that season's shift, so the standard error treats them as a cluster
        // (SeasonErrorModel: the variance of a mean under the one-way random-effects model).
        double se = n >= 2
            ? SeasonErrorModel.Of(predictions.Select(p => new SeasonError(Math.Abs(p.Error), p.Season, p.Strain)).ToArray()).StandardErrorOfMean
            : double.NaN;
        double bias = predictions.Average(p => p.PredictedAbv - p.ActualAbv);
        double rmse = Math.Sqrt(predictions.Average(p => p.Error * p.Error));
        double p90 = Descriptive.Quantile(abs, 0.90);
        double within = predictions.Count(p => regime.Accepts(p.PredictedAbv, p.ActualAbv)) / (double)n;
        double wrong = predictions.Count(p => (p.PredictedAbv > thresholdAbv) != (p.ActualAbv > thresholdAbv)) / (double)n;
        return new BacktestMetrics(n, mae, se, bias, rmse, p90, within, wrong);
    }
}

/// <summary>Runs held-out predictions of a candidate.</summary>
public static class Backtest
{
    /// <summary>
    /// Predicts every lot with the candidate trained without it (or without its season, or its fold).
    /// Returned in the order of <paramref name="lots"/>. Lots whose held-out training set is empty are skipped.
    /// </summary>
    public static IReadOnlyList<HeldOutPrediction> Run(
        ICandidateTrainer candidate, IReadOnlyList<LotConversion> lots, BacktestScheme scheme, int seed) =>
        Run(candidate, BacktestFolds.Of(lots, scheme, seed), seed);

    /// <summary>
    /// As <see cref="Run(ICandidateTrainer, IReadOnlyList{LotConversion}, BacktestScheme, int)"/> on folds made once
    /// and shared by every candidate (each fold's training lots and test inputs are then built only once).
    /// </summary>
    public static IReadOnlyList<HeldOutPrediction> Run(ICandidateTrainer candidate, BacktestFolds folds, int seed)
    {
        ArgumentNullException.ThrowIfNull(candidate);
        ArgumentNullException.ThrowIfNull(folds);
        var lots = folds.Lots;
        var predicted = new double[lots.Count];
        Array.Fill(predicted, double.NaN);
        void RunFold(int f)
        {
            var (train, test, inputs) = folds.Fold(f);
            if (train.Count == 0)
            {
                return;
            }

            var model = candidate.Train(train, seed);
            var batch = model.PredictAbv(inputs);
            for (int j = 0; j < test.Length; j++)
            {
                predicted[test[j]] = batch[j];
            }
        }

        if (candidate.IsCostly)
        {
            // A costly candidate's folds are trained side by side: each fold is seeded on its own and writes only its
            // own lots, so the results are those of one fold after another, and a core left idle by the quick
            // candidates is used.
            Parallel.For(0, folds.Count, RunFold);
        }
        else
        {
            for (int f = 0; f < folds.Count; f++)
            {
                RunFold(f);
            }
        }

        var result = new List<HeldOutPrediction>(lots.Count);
        for (int i = 0; i < lots.Count; i++)
        {
            if (double.IsFinite(predicted[i]))
            {
                var l = lots[i].Lot;
                result.Add(new HeldOutPrediction(folds.Keys[i], l.Season, l.Strain, l.FinalAlcohol.PercentVolume, predicted[i]));
            }
        }

        return result;
    }
}

/// <summary>
/// The folds of one backtest scheme over a set of lots, in ascending fold order: for each fold the lots it trains on
/// (in input order), the indices of the lots it predicts and their prediction inputs. Folds of the grouped schemes
/// (by season, ten folds) are built once on first use and kept, so candidates sharing them do not rebuild them;
/// leave-one-lot-out folds are built on demand (keeping n copies of n − 1 lots would cost n² memory). A fold that
/// would train on more than <see cref="MaximumTrainingLots"/> lots trains on a seeded sample of that many
/// (<see cref="TrainingSample"/>); every lot is still held out and predicted once. Thread-safe.
/// </summary>
public sealed class BacktestFolds
{
    private readonly int[] foldOf;
    private readonly int[] foldIds;
    private readonly Lazy<(LotConversion[] Train, int[] Test, PredictionInput[] Inputs)>[]? kept;
    private readonly Lazy<PredictionInput[]> inputs;
    private readonly Lazy<LotKey[]> keys;
    private readonly int maximumTrainingLots;
    private readonly int seed;

    private BacktestFolds(IReadOnlyList<LotConversion> lots, BacktestScheme scheme, int[] foldOf, int maximumTrainingLots, int seed)
    {
        Lots = lots;
        Scheme = scheme;
        this.foldOf = foldOf;
        this.maximumTrainingLots = maximumTrainingLots;
        this.seed = seed;
        foldIds = scheme == BacktestScheme.LeaveOneLotOut ? foldOf : foldOf.Distinct().Order().ToArray();
        inputs = new Lazy<PredictionInput[]>(() => lots.Select(PredictionInput.From).ToArray());
        keys = new Lazy<LotKey[]>(() => lots.Select(l => l.Lot.Key).ToArray());
        if (scheme != BacktestScheme.LeaveOneLotOut)
        {
            kept = foldIds.Select(id => new Lazy<(LotConversion[], int[], PredictionInput[])>(() => Build(id))).ToArray();
        }
    }

    /// <summary>
    /// Most lots a fold trains on; a fold with more trains on a seeded sample of this many, in input order (the same
    /// size and sampling as the coverage check's inner analyses, <see cref="SeasonCoverage.MaximumInnerLots"/>). The
    /// candidates are lines and medians of a few parameters each, estimated to within a few thousandths of % v/v from
    /// 20,000 lots, while their training time grows with every lot (at 100,000 lots the two main analyses' folds were
    /// most of the house factor's time). Histories of up to about 22,000 lots are not sampled at all (the largest fold
    /// trains on all lots but one season or one tenth).
    /// </summary>
    public const int MaximumTrainingLots = SeasonCoverage.MaximumInnerLots;

    /// <summary>The lots, in input order.</summary>
    public IReadOnlyList<LotConversion> Lots { get; }

    /// <summary>The scheme.</summary>
    public BacktestScheme Scheme { get; }

    /// <summary>Number of folds.</summary>
    public int Count => foldIds.Length;

    /// <summary>Each lot's "season/lot" key, in input order.</summary>
    internal IReadOnlyList<LotKey> Keys => keys.Value;

    /// <summary>Deals the lots into the folds of <paramref name="scheme"/> (ten folds by a shuffle seeded with <paramref name="seed"/>).</summary>
    public static BacktestFolds Of(IReadOnlyList<LotConversion> lots, BacktestScheme scheme, int seed) =>
        Of(lots, scheme, seed, MaximumTrainingLots);

    /// <summary>As <see cref="Of(IReadOnlyList{LotConversion}, BacktestScheme, int)"/> with another cap on the lots a fold trains on.</summary>
    internal static BacktestFolds Of(IReadOnlyList<LotConversion> lots, BacktestScheme scheme, int seed, int maximumTrainingLots)
    {
        ArgumentNullException.ThrowIfNull(lots);
        ArgumentOutOfRangeException.ThrowIfLessThan(maximumTrainingLots, 1);
        return new BacktestFolds(lots, scheme, FoldsOf(lots, scheme, seed), maximumTrainingLots, seed);
    }

    /// <summary>The <paramref name="index"/>-th fold (ascending fold id): training lots (sampled above <see cref="MaximumTrainingLots"/>), held-out indices and their inputs.</summary>
    public (IReadOnlyList<LotConversion> Train, int[] Test, IReadOnlyList<PredictionInput> Inputs) Fold(int index)
    {
        var fold = kept is null ? Build(foldIds[index]) : kept[index].Value;
        return (fold.Train, fold.Test, fold.Inputs);
    }

    private (LotConversion[] Train, int[] Test, PredictionInput[] Inputs) Build(int id)
    {
        int held = 0;
        foreach (int f in foldOf)
        {
            if (f == id)
            {
                held++;
            }
        }

        var train = new LotConversion[Lots.Count - held];
        var test = new int[held];
        var testInputs = new PredictionInput[held];
        var all = inputs.Value;
        int t = 0, h = 0;
        for (int i = 0; i < foldOf.Length; i++)
        {
            if (foldOf[i] == id)
            {
                testInputs[h] = all[i];
                test[h++] = i;
            }
            else
            {
                train[t++] = Lots[i];
            }
        }

        return (train.Length > maximumTrainingLots ? [.. TrainingSample.Of(train, maximumTrainingLots, seed)] : train, test, testInputs);
    }

    private static int[] FoldsOf(IReadOnlyList<LotConversion> lots, BacktestScheme scheme, int seed)
    {
        switch (scheme)
        {
            case BacktestScheme.LeaveOneSeasonOut:
                return lots.Select(l => l.Lot.Season).ToArray();
            case BacktestScheme.LeaveOneLotOut:
                return Enumerable.Range(0, lots.Count).ToArray();
            case BacktestScheme.TenFoldByLot:
                // A seeded shuffle dealt round-robin keeps fold sizes within one of each other.
                var order = Enumerable.Range(0, lots.Count).ToArray();
                new Random(seed).Shuffle(order);
                var fold = new int[lots.Count];
                for (int i = 0; i < order.Length; i++)
                {
                    fold[order[i]] = i % 10;
                }

                return fold;
            default:
                throw new ArgumentOutOfRangeException(nameof(scheme), scheme, "Unknown backtest scheme.");
        }
    }
}
