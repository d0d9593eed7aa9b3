using Microsoft.ML;
using Microsoft.ML.Data;
using Microsoft.ML.Trainers;
using YieldBench.Core.Conversion;
using YieldBench.Core.HouseFactor;
using YieldBench.Core.Statistics;

namespace YieldBench.Modeling;

/// <summary>
/// The multi-variable house-factor candidate: an ML.NET linear regression trained by SDCA (stochastic dual coordinate
/// ascent, squared loss, L2 penalty) on starting sugar, strain, vessel type and size, variety, YAN, pH and mean
/// fermentation temperature where recorded. Numeric inputs are standardised (mean/variance), categorical inputs
/// one-hot encoded.
/// <para>
/// Why SDCA and not boosted trees: with a few hundred lots a linear model has far less variance than a tree
/// ensemble, it follows the near-proportional relation of alcohol to sugar and extrapolates it smoothly (trees give
/// steps and stay flat outside the training range), and it trains in milliseconds, which leave-one-lot-out needs.
/// With one thread and a seeded <see cref="MLContext"/> it is deterministic.
/// </para>
/// </summary>
public sealed class MultiVariableCandidate : ICandidateTrainer
{
    /// <summary>The text used for a category the cellar did not record.</summary>
    public const string NotRecorded = "(not recorded)";

    /// <summary>A numeric input is used when recorded on at least this share of training lots and not constant.</summary>
    public const double MinimumRecordedShare = 0.5;

    /// <summary>L2 penalty of SDCA (small: the features are standardised and the data are few).</summary>
    public const float L2Penalty = 1e-3f;

    /// <summary>Most passes of SDCA over the data; it stops earlier at ML.NET's default convergence tolerance.</summary>
    public const int Iterations = 100;

    /// <summary>Shuffles per input in the permutation importance.</summary>
    public const int PermutationRepeats = 5;

    /// <summary>
    /// Most lots the model is trained on (and its importance measured on). Above it a seeded random sample of this
    /// many lots is used: a linear model of some twenty coefficients is estimated to well within the lot-to-lot noise
    /// from 5,000 lots (250 per coefficient), while training time grows with every lot (at 100,000 lots the full data
    /// made this candidate's backtest the slowest step of the review).
    /// </summary>
    public const int MaximumTrainingLots = 5_000;

    /// <inheritdoc />
    public string Id => "multi-variable";

    /// <inheritdoc />
    public string Name => "Multi-variable model (ML.NET SDCA)";

    /// <inheritdoc />
    public string Description => "A linear model of final alcohol on starting sugar, strain, vessel, variety, YAN, pH and fermentation temperature where recorded.";

    /// <inheritdoc />
    public int Complexity => 10;

    /// <inheritdoc />
    public bool IsCostly => true;

    /// <inheritdoc />
    public IAbvPredictor Train(IReadOnlyList<LotConversion> lots, int seed)
    {
        ArgumentNullException.ThrowIfNull(lots);
        if (lots.Count == 0)
        {
            throw new ArgumentException("Training needs at least one lot.", nameof(lots));
        }

        lots = Sample(lots, seed);
        var inputs = lots.Select(PredictionInput.From).ToArray();
        var plan = FeaturePlan.For(inputs);
        var ml = new MLContext(seed);
        // SDCA converges far faster on a centred label: the intercept then starts near its answer.
        double centre = lots.Average(l => l.Lot.FinalAlcohol.PercentVolume);
        var rows = inputs.Select((x, i) => plan.Row(x, (float)(lots[i].Lot.FinalAlcohol.PercentVolume - centre))).ToArray();
        var data = ml.Data.LoadFromEnumerable(rows);

        var numeric = plan.NumericColumns.ToArray();
        IEstimator<ITransformer> pipeline = ml.Transforms.Concatenate("Numeric", numeric)
            .Append(ml.Transforms.NormalizeMeanVariance("Numeric", fixZero: false));
        var featureParts = new List<string> { "Numeric" };
        foreach (string cat in plan.CategoricalColumns)
        {
            pipeline = pipeline.Append(ml.Transforms.Categorical.OneHotEncoding(cat + "Hot", cat));
            featureParts.Add(cat + "Hot");
        }

        var options = new SdcaRegressionTrainer.Options
        {
            LabelColumnName = nameof(ModelRow.Label),
            FeatureColumnName = "Features",
            L2Regularization = L2Penalty,
            L1Regularization = 0f,
            MaximumNumberOfIterations = Iterations,
            NumberOfThreads = 1,
            Shuffle = true,
        };
        // SDCA passes over the data many times (and once more per convergence check); the cache keeps the
        // transformed rows in memory so each pass does not rerun the concatenation, scaling and one-hot encoding
        // (without it those re-runs were nine tenths of the training time).
        pipeline = pipeline
            .Append(ml.Transforms.Concatenate("Features", featureParts.ToArray()))
            .AppendCacheCheckpoint(ml)
            .Append(ml.Regression.Trainers.Sdca(options));
        var model = pipeline.Fit(data);
        return new Predictor(ml, model, plan, centre);
    }

    /// <summary>The lots themselves, or a seeded sample of <see cref="MaximumTrainingLots"/> of them in their input order.</summary>
    internal static IReadOnlyList<LotConversion> Sample(IReadOnlyList<LotConversion> lots, int seed) =>
        TrainingSample.Of(lots, MaximumTrainingLots, seed);

    private sealed class Predictor(MLContext ml, ITransformer model, FeaturePlan plan, double centre) : IAbvPredictor
    {
        public double PredictAbv(PredictionInput input) => PredictAbv([input])[0];

        public IReadOnlyList<double> PredictAbv(IReadOnlyList<PredictionInput> inputs)
        {
            ArgumentNullException.ThrowIfNull(inputs);
            var scores = Scores(inputs.Select(x => plan.Row(x, 0f)));
            var result = new double[scores.Length];
            for (int i = 0; i < scores.Length; i++)
            {
                result[i] = centre + scores[i];
            }

            return result;
        }

        public SugarLines? AsSugarLines() => null;

        public IReadOnlyList<FeatureImportance> Importance(IReadOnlyList<LotConversion> lots, int seed)
        {
            ArgumentNullException.ThrowIfNull(lots);
            lots = Sample(lots, seed);
            var rows = lots.Select(l => plan.Row(PredictionInput.From(l), (float)(l.Lot.FinalAlcohol.PercentVolume - centre))).ToArray();
            double baseMae = Mae(rows);
            var result = new List<FeatureImportance>();
            var rng = new Random(seed);
            foreach (var feature in plan.Features)
            {
                double sum = 0;
                for (int r = 0; r < PermutationRepeats; r++)
                {
                    var order = Enumerable.Range(0, rows.Length).ToArray();
                    rng.Shuffle(order);
                    var shuffled = rows.Select((row, i) => feature.CopyFrom(row, rows[order[i]])).ToArray();
                    sum += Mae(shuffled) - baseMae;
                }

                result.Add(new FeatureImportance(feature.Name, sum / PermutationRepeats));
            }

            return result;
        }

        private double Mae(ModelRow[] rows)
        {
            var scores = Scores(rows);
            return rows.Select((r, i) => Math.Abs(r.Label - (double)scores[i])).Average();
        }

        /// <summary>
        /// The model's scores of the rows, in order, through one prediction engine (made per call: an engine is not
        /// thread-safe). The engine maps row by row; a transformed data view would instead split its cursor over
        /// background threads, whose hand-offs cost more than the arithmetic of a linear model (at 100,000 lots they
        /// were the largest cost of this candidate).
        /// </summary>
        private float[] Scores(IEnumerable<ModelRow> rows)
        {
            using var engine = ml.Model.CreatePredictionEngine<ModelRow, ScoreRow>(model);
            var scores = new List<float>();
            var output = new ScoreRow();
            foreach (var row in rows)
            {
                engine.Predict(row, ref output);
                scores.Add(output.Score);
            }

            return scores.ToArray();
        }
    }

    /// <summary>Which inputs the model uses, and the fill-in values for missing numbers (training medians).</summary>
    private sealed class FeaturePlan
    {
        private readonly Dictionary<string, float> fill = new(StringComparer.Ordinal);

        public List<string> NumericColumns { get; } = [nameof(ModelRow.StartingBrix)];

        public List<string> CategoricalColumns { get; } = [nameof(ModelRow.Strain)];

        public List<Feature> Features { get; } = [new("starting sugar", (t, s) => t.StartingBrix = s.StartingBrix)];

        public static FeaturePlan For(IReadOnlyList<PredictionInput> x)
        {
            var p = new FeaturePlan();
            p.Features.Add(new("strain", (t, s) => t.Strain = s.Strain));
            p.AddNumeric(x, nameof(ModelRow.VesselCapacityL), "vessel size", i => i.VesselCapacityL, (t, s) => t.VesselCapacityL = s.VesselCapacityL);
            p.AddNumeric(x, nameof(ModelRow.YanMgL), "YAN", i => i.YanMgL, (t, s) => t.YanMgL = s.YanMgL);
            p.AddNumeric(x, nameof(ModelRow.Ph), "pH", i => i.Ph, (t, s) => t.Ph = s.Ph);
            p.AddNumeric(x, nameof(ModelRow.FermentationTempC), "fermentation temperature", i => i.FermentationTempC, (t, s) => t.FermentationTempC = s.FermentationTempC);
            p.AddCategory(x, nameof(ModelRow.Vessel), "vessel type", i => i.Vessel, (t, s) => t.Vessel = s.Vessel);
            p.AddCategory(x, nameof(ModelRow.Variety), "variety", i => i.Variety, (t, s) => t.Variety = s.Variety);
            return p;
        }

        public ModelRow Row(PredictionInput x, float label) => new()
        {
            Label = label,
            StartingBrix = (float)x.StartingBrix,
            VesselCapacityL = Fill(nameof(ModelRow.VesselCapacityL), x.VesselCapacityL),
            YanMgL = Fill(nameof(ModelRow.YanMgL), x.YanMgL),
            Ph = Fill(nameof(ModelRow.Ph), x.Ph),
            FermentationTempC = Fill(nameof(ModelRow.FermentationTempC), x.FermentationTempC),
            Strain = x.Strain,
            Vessel = string.IsNullOrWhiteSpace(x.Vessel) ? NotRecorded : x.Vessel,
            Variety = string.IsNullOrWhiteSpace(x.Variety) ? NotRecorded : x.Variety,
        };

        private float Fill(string column, double? value) =>
            value is { } v && double.IsFinite(v) ? (float)v : fill.GetValueOrDefault(column);

        private void AddNumeric(IReadOnlyList<PredictionInput> x, string column, string name, Func<PredictionInput, double?> get, Action<ModelRow, ModelRow> copy)
        {
            var present = x.Select(get).Where(v => v is { } d && double.IsFinite(d)).Select(v => v!.Value).ToArray();
            if (present.Length < MinimumRecordedShare * x.Count || present.Distinct().Count() < 2)
            {
                return;
            }

            fill[column] = (float)Descriptive.Median(present);
            NumericColumns.Add(column);
            Features.Add(new(name, copy));
        }

        private void AddCategory(IReadOnlyList<PredictionInput> x, string column, string name, Func<PredictionInput, string?> get, Action<ModelRow, ModelRow> copy)
        {
            if (x.Select(i => get(i) ?? NotRecorded).Distinct(StringComparer.Ordinal).Count() < 2)
            {
                return;
            }

            CategoricalColumns.Add(column);
            Features.Add(new(name, copy));
        }
    }

    /// <summary>An input the importance shuffles: copying it from another row.</summary>
    private sealed record Feature(string Name, Action<ModelRow, ModelRow> Copy)
    {
        public ModelRow CopyFrom(ModelRow target, ModelRow source)
        {
            var row = target.Clone();
            Copy(row, source);
            return row;
        }
    }
}

/// <summary>The model's output for one row.</summary>
internal sealed class ScoreRow
{
    public float Score { get; set; }
}

/// <summary>One row as ML.NET sees it.</summary>
internal sealed class ModelRow
{
    public float Label { get; set; }

    public float StartingBrix { get; set; }

    public float VesselCapacityL { get; set; }

    public float YanMgL { get; set; }

    public float Ph { get; set; }

    public float FermentationTempC { get; set; }

    public string Strain { get; set; } = string.Empty;

    public string Vessel { get; set; } = string.Empty;

    public string Variety { get; set; } = string.Empty;

    public ModelRow Clone() => (ModelRow)MemberwiseClone();
}
