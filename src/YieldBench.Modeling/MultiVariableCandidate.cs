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
/// fermentation temperature where recorded. Numeric inputs are standardised (training mean and SD), categorical inputs
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

    /// <summary>
    /// Most passes of SDCA over the data. ML.NET checks convergence (the duality gap relative to the primal loss, against
    /// <see cref="ConvergenceTolerance"/>; a second pass over the data) every <see cref="ConvergenceCheckPasses"/> passes,
    /// stops when it is reached and keeps the checked pass with the smallest gap. With the small L2 penalty SDCA
    /// converges slowly (each pass shrinks the gap by a factor of about 1 − λn/(λn + ‖x‖²)), and vessel size follows
    /// vessel type closely in a cellar: 100 passes with ML.NET's default tolerance left the demo's held-out predictions
    /// up to 0.16 % v/v from the optimum, and their MAE depended on the seed (0.187 to 0.209).
    /// </summary>
    public const int Iterations = 1000;

    /// <summary>
    /// Duality gap relative to the primal loss at which SDCA stops (ML.NET's default is 0.01). At 1e-5 the demo's and
    /// an invented cellar's held-out predictions lie within 0.001 % v/v of the penalised least-squares optimum,
    /// whatever the seed (tests/YieldBench.Modeling.Tests/MultiVariableAuditTests).
    /// </summary>
    public const float ConvergenceTolerance = 1e-5f;

    /// <summary>
    /// Passes between convergence checks. ML.NET's default with one thread is a check after every pass, which costs as
    /// much as the pass itself. A check every tenth pass costs a tenth as much and runs at most nine passes further.
    /// </summary>
    public const int ConvergenceCheckPasses = 10;

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
    public string Name => "Multi-variable model (sugar, strain, vessel and more)";

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
        // SDCA converges far faster on a centred label: the intercept then starts near its answer.
        double centre = lots.Average(l => l.Lot.FinalAlcohol.PercentVolume);
        var raw = FeaturePlan.Fill(inputs);
        var rows = inputs.Select((x, i) => raw.Fill(x, (float)(lots[i].Lot.FinalAlcohol.PercentVolume - centre))).ToArray();
        var plan = raw.Scaled(rows);

        // The features (standardised numbers, one-hot categories) are formed here rather than by ML.NET transforms:
        // a transform evaluates its rows over background threads that hand rows to each other, which on small folds
        // cost more than the training itself. ML.NET then does what it is here for, the SDCA fit.
        var ml = new MLContext(seed);
        var schema = SchemaDefinition.Create(typeof(FeatureRow));
        schema[nameof(FeatureRow.Features)].ColumnType = new VectorDataViewType(NumberDataViewType.Single, plan.Width);
        var data = ml.Data.LoadFromEnumerable(rows.Select(r => new FeatureRow { Label = r.Label, Features = plan.Vector(r) }).ToArray(), schema);
        var options = new SdcaRegressionTrainer.Options
        {
            LabelColumnName = nameof(FeatureRow.Label),
            FeatureColumnName = nameof(FeatureRow.Features),
            L2Regularization = L2Penalty,
            L1Regularization = 0f,
            MaximumNumberOfIterations = Iterations,
            NumberOfThreads = 1,
            Shuffle = true,
            ConvergenceCheckFrequency = ConvergenceCheckPasses,
            ConvergenceTolerance = ConvergenceTolerance,
        };
        var model = ml.Regression.Trainers.Sdca(options).Fit(ml.Data.Cache(data)).Model;
        return new Predictor(plan, model.Weights.ToArray(), model.Bias, centre);
    }

    /// <summary>The lots themselves, or a seeded sample of <see cref="MaximumTrainingLots"/> of them in their input order.</summary>
    internal static IReadOnlyList<LotConversion> Sample(IReadOnlyList<LotConversion> lots, int seed) =>
        TrainingSample.Of(lots, MaximumTrainingLots, seed);

    /// <summary>The fitted linear model: score = bias + Σ weight × feature, plus the centre of the training labels.</summary>
    private sealed class Predictor(FeaturePlan plan, float[] weights, float bias, double centre) : IAbvPredictor
    {
        public double PredictAbv(PredictionInput input) => centre + Score(plan.Fill(input));

        public IReadOnlyList<double> PredictAbv(IReadOnlyList<PredictionInput> inputs)
        {
            ArgumentNullException.ThrowIfNull(inputs);
            var result = new double[inputs.Count];
            for (int i = 0; i < result.Length; i++)
            {
                result[i] = PredictAbv(inputs[i]);
            }

            return result;
        }

        public SugarLines? AsSugarLines() => null;

        public IReadOnlyList<FeatureImportance> Importance(IReadOnlyList<LotConversion> lots, int seed)
        {
            ArgumentNullException.ThrowIfNull(lots);
            lots = Sample(lots, seed);
            var rows = lots.Select(l => plan.Fill(PredictionInput.From(l), (float)(l.Lot.FinalAlcohol.PercentVolume - centre))).ToArray();
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

        private double Mae(ModelRow[] rows) => rows.Average(r => Math.Abs(r.Label - Score(r)));

        private double Score(ModelRow row)
        {
            var x = plan.Vector(row);
            double score = bias;
            for (int j = 0; j < x.Length; j++)
            {
                score += (double)weights[j] * x[j];
            }

            return score;
        }
    }

    /// <summary>A numeric input: how it is read from a row, and the training mean and standard deviation it is scaled by.</summary>
    private sealed record NumericFeature(Func<ModelRow, float> Get, double Mean, double Sd);

    /// <summary>A categorical input: how it is read from a row, and the training categories in ordinal order (one indicator each).</summary>
    private sealed record CategoryFeature(Func<ModelRow, string> Get, IReadOnlyDictionary<string, int> Index);

    /// <summary>
    /// Which inputs the model uses, the fill-in values for missing numbers (training medians), and once scaled, the
    /// features: each number standardised by its training mean and standard deviation (n − 1), each category one
    /// indicator per training category (a category not seen in training gives all zeros).
    /// </summary>
    private sealed class FeaturePlan
    {
        private readonly Dictionary<string, float> fill = new(StringComparer.Ordinal);
        private readonly List<(string Column, Func<ModelRow, float> Get)> numericColumns = [(nameof(ModelRow.StartingBrix), r => r.StartingBrix)];
        private readonly List<(string Column, Func<ModelRow, string> Get)> categoricalColumns = [(nameof(ModelRow.Strain), r => r.Strain)];
        private NumericFeature[] numeric = [];
        private CategoryFeature[] categories = [];

        public List<Feature> Features { get; } = [new("starting sugar", (t, s) => t.StartingBrix = s.StartingBrix)];

        /// <summary>Number of features.</summary>
        public int Width { get; private set; }

        /// <summary>Chooses the inputs recorded well enough on the training lots and their fill-in values.</summary>
        public static FeaturePlan Fill(IReadOnlyList<PredictionInput> x)
        {
            var p = new FeaturePlan();
            p.Features.Add(new("strain", (t, s) => t.Strain = s.Strain));
            p.AddNumeric(x, nameof(ModelRow.VesselCapacityL), "vessel size", i => i.VesselCapacityL, r => r.VesselCapacityL, (t, s) => t.VesselCapacityL = s.VesselCapacityL);
            p.AddNumeric(x, nameof(ModelRow.YanMgL), "YAN", i => i.YanMgL, r => r.YanMgL, (t, s) => t.YanMgL = s.YanMgL);
            p.AddNumeric(x, nameof(ModelRow.Ph), "pH", i => i.Ph, r => r.Ph, (t, s) => t.Ph = s.Ph);
            p.AddNumeric(x, nameof(ModelRow.FermentationTempC), "fermentation temperature", i => i.FermentationTempC, r => r.FermentationTempC, (t, s) => t.FermentationTempC = s.FermentationTempC);
            p.AddCategory(x, nameof(ModelRow.Vessel), "vessel type", i => i.Vessel, r => r.Vessel, (t, s) => t.Vessel = s.Vessel);
            p.AddCategory(x, nameof(ModelRow.Variety), "variety", i => i.Variety, r => r.Variety, (t, s) => t.Variety = s.Variety);
            return p;
        }

        /// <summary>This plan with the scaling and categories of the training rows.</summary>
        public FeaturePlan Scaled(IReadOnlyList<ModelRow> rows)
        {
            numeric = numericColumns.Select(c =>
            {
                var v = rows.Select(r => (double)c.Get(r)).ToArray();
                double mean = v.Average();
                double sd = v.Length > 1 ? Math.Sqrt(v.Sum(d => (d - mean) * (d - mean)) / (v.Length - 1)) : 0;
                return new NumericFeature(c.Get, mean, sd > 0 ? sd : 1);
            }).ToArray();
            categories = categoricalColumns.Select(c => new CategoryFeature(
                c.Get,
                rows.Select(c.Get).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).Select((name, i) => (name, i)).ToDictionary(t => t.name, t => t.i, StringComparer.Ordinal))).ToArray();
            Width = numeric.Length + categories.Sum(c => c.Index.Count);
            return this;
        }

        /// <summary>The features of a row.</summary>
        public float[] Vector(ModelRow row)
        {
            var x = new float[Width];
            int j = 0;
            foreach (var n in numeric)
            {
                x[j++] = (float)((n.Get(row) - n.Mean) / n.Sd);
            }

            foreach (var c in categories)
            {
                if (c.Index.TryGetValue(c.Get(row), out int k))
                {
                    x[j + k] = 1f;
                }

                j += c.Index.Count;
            }

            return x;
        }

        /// <summary>The row of an input, missing numbers filled in.</summary>
        public ModelRow Fill(PredictionInput x, float label = 0f) => new()
        {
            Label = label,
            StartingBrix = (float)x.StartingBrix,
            VesselCapacityL = FillValue(nameof(ModelRow.VesselCapacityL), x.VesselCapacityL),
            YanMgL = FillValue(nameof(ModelRow.YanMgL), x.YanMgL),
            Ph = FillValue(nameof(ModelRow.Ph), x.Ph),
            FermentationTempC = FillValue(nameof(ModelRow.FermentationTempC), x.FermentationTempC),
            Strain = x.Strain,
            Vessel = string.IsNullOrWhiteSpace(x.Vessel) ? NotRecorded : x.Vessel,
            Variety = string.IsNullOrWhiteSpace(x.Variety) ? NotRecorded : x.Variety,
        };

        private float FillValue(string column, double? value) =>
            value is { } v && double.IsFinite(v) ? (float)v : fill.GetValueOrDefault(column);

        private void AddNumeric(IReadOnlyList<PredictionInput> x, string column, string name, Func<PredictionInput, double?> get, Func<ModelRow, float> read, Action<ModelRow, ModelRow> copy)
        {
            var present = x.Select(get).Where(v => v is { } d && double.IsFinite(d)).Select(v => v!.Value).ToArray();
            if (present.Length < MinimumRecordedShare * x.Count || present.Distinct().Count() < 2)
            {
                return;
            }

            fill[column] = (float)Descriptive.Median(present);
            numericColumns.Add((column, read));
            Features.Add(new(name, copy));
        }

        private void AddCategory(IReadOnlyList<PredictionInput> x, string column, string name, Func<PredictionInput, string?> get, Func<ModelRow, string> read, Action<ModelRow, ModelRow> copy)
        {
            if (x.Select(i => get(i) ?? NotRecorded).Distinct(StringComparer.Ordinal).Count() < 2)
            {
                return;
            }

            categoricalColumns.Add((column, read));
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

/// <summary>One training row as ML.NET sees it: the centred label and the feature vector.</summary>
internal sealed class FeatureRow
{
    public float Label { get; set; }

    public float[] Features { get; set; } = [];
}

/// <summary>One lot's inputs as the model reads them (missing numbers filled in) and its centred label.</summary>
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
