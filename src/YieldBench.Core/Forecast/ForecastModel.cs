using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Statistics;

namespace YieldBench.Core.Forecast;

/// <summary>
/// What the history teaches the forecast: the sigmoid form, reading noise, the priors on each lot's start, end, rate and
/// lag (by strain, with the vessel's usual temperature and the must's nitrogen as covariates where the logs show them),
/// the season-to-season spread, the temperature model per vessel type and the strain medians the baselines use.
/// Built by <see cref="Train"/> from past lots; pure.
/// </summary>
public sealed partial class ForecastModel
{
    private ForecastModel()
    {
    }

    /// <summary>Sigmoid form used.</summary>
    public SigmoidModel Form { get; private init; }

    /// <summary>Sugar reading noise of hand-read logs, °Brix (median whole-course residual).</summary>
    public double SugarSd { get; private init; }

    /// <summary>Sugar reading noise of dense probe logs, °Brix.</summary>
    public double DenseSugarSd { get; private init; }

    /// <summary>Temperature noise, °C (median residual of the temperature fits).</summary>
    public double TempSd { get; private init; }

    /// <summary>Mean and sd of S0 − the lot record's starting sugar, °Brix.</summary>
    public (double Mean, double Sd) StartOffset { get; private init; }

    /// <summary>Prior share of lot records whose starting sugar is wrong (Laplace's rule on the lots whose fitted start lies far off the record).</summary>
    public double WrongStartShare { get; private init; }

    /// <summary>Spread of S0 around a wrong record, °Brix (our definition).</summary>
    public const double WrongStartSd = 3.0;

    /// <summary>Mean and sd of S0 − the record for the lot's vessel type (all lots when the type has fewer than 8).</summary>
    public (double Mean, double Sd) StartOffsetFor(LotCourse course)
    {
        ArgumentNullException.ThrowIfNull(course);
        return _startByVessel.TryGetValue(Key(course.Vessel), out var v) ? v : StartOffset;
    }

    /// <summary>Mean and sd of F, the hydrometer's settling point, of lots that finished dry, °Brix.</summary>
    public (double Mean, double Sd) Final { get; private init; }

    /// <summary>Prior share of lots that stop short of dry (Laplace's rule of succession on the past lots).</summary>
    public double StuckShare { get; private init; }

    /// <summary>Mean and sd of F of lots that stop short of dry, °Brix.</summary>
    public (double Mean, double Sd) StuckFinal { get; private init; }

    /// <summary>Past lots learnt from, with their fits.</summary>
    public int LotsUsed { get; private init; }

    /// <summary>Past lots per strain key.</summary>
    public IReadOnlyDictionary<string, int> StrainLots { get; private init; } = new Dictionary<string, int>();

    /// <summary>Season-to-season spread of the log time scale (sd of the season shift δ).</summary>
    public double SeasonSpread { get; private init; }

    /// <summary>Season shifts seen in the history (mean log-rate residual per season).</summary>
    public IReadOnlyDictionary<int, double> SeasonShifts { get; private init; } = new Dictionary<int, double>();

    /// <summary>Change of log maximum rate per °C of the vessel type's usual peak temperature (0 when the logs do not show it).</summary>
    public double RateTemperatureSlope { get; private init; }

    /// <summary>Change of log maximum rate per unit log YAN (0 when YAN is not recorded for most lots).</summary>
    public double RateNitrogenSlope { get; private init; }

    /// <summary>
    /// Prior share of lots far outside their strain's rate and lag (Laplace's rule on the lots the robust fit set
    /// aside); the prior gives them a part <see cref="WideFactor"/> times wider.
    /// </summary>
    public double RateOutlierShare { get; private init; }

    /// <summary>How much wider (in sd) the wide part of a contaminated prior is (our definition).</summary>
    public const double WideFactor = 4.0;

    /// <summary>
    /// Within-season, within-strain covariance of (log μm, λ/λ̂), λ̂ the lot's predicted lag (at least
    /// <see cref="MinLagScale"/>): the lag's scatter is taken in proportion to the lag.
    /// </summary>
    public (double Vmm, double Vml, double Vll) Within { get; private init; }

    /// <summary>
    /// <see cref="Within"/> learnt from each colour's lots apart (whites and rosés scatter otherwise than reds), for a
    /// colour with at least <see cref="MinColourLots"/> kept lots.
    /// </summary>
    public IReadOnlyDictionary<string, (double Vmm, double Vml, double Vll)> WithinByColour { get; private init; } = new Dictionary<string, (double, double, double)>();

    /// <summary>Fewest kept lots of a colour for a scatter of its own (our definition).</summary>
    public const int MinColourLots = 10;

    /// <summary>The within-season scatter of the lot's colour (all lots' when the colour has too few).</summary>
    public (double Vmm, double Vml, double Vll) WithinFor(LotCourse course) =>
        WithinByColour.TryGetValue(BucketOf(course), out var w) ? w : Within;

    /// <summary>Least lag, h, that the lag's relative scatter is scaled by (our definition: about a third of a reading interval).</summary>
    public const double MinLagScale = 4.0;

    /// <summary>The scale of a lot's lag scatter: its predicted lag, at least <see cref="MinLagScale"/> hours.</summary>
    private static double LagScale(double predictedLag) => Math.Max(predictedLag, MinLagScale);

    /// <summary>Median and sd of hours from inoculation to the first reading.</summary>
    public (double Median, double Sd) FirstReadingDelay { get; private init; }

    /// <summary>Temperature lag behind the rate, h, per vessel group (vessel key and colour) with a colour fallback.</summary>
    public IReadOnlyDictionary<string, double> TempDelay { get; private init; } = new Dictionary<string, double>();

    /// <summary>The usual peak temperature per vessel group, °C (median logged peak).</summary>
    public IReadOnlyDictionary<string, double> VesselPeak { get; private init; } = new Dictionary<string, double>();

    /// <summary>Mean and sd of the must temperature Ta per colour bucket.</summary>
    public IReadOnlyDictionary<string, (double Mean, double Sd)> MustTemp { get; private init; } = new Dictionary<string, (double, double)>();

    /// <summary>Residual sd of the peak regression, °C, over all lots.</summary>
    public double PeakSd { get; private init; }

    /// <summary>Residual sd of the peak regression per colour bucket, °C (whites rise less, and scatter less).</summary>
    public IReadOnlyDictionary<string, double> PeakSdByColour { get; private init; } = new Dictionary<string, double>();

    /// <summary>Prior share of lots whose peak runs far from the regression (a wide part of the peak prior).</summary>
    public double PeakOutlierShare { get; private init; }

    /// <summary>Residual sd of the peak for the lot's colour.</summary>
    public double PeakSdFor(LotCourse course) => PeakSdByColour.TryGetValue(BucketOf(course), out var v) ? v : PeakSd;

    /// <summary>Mean and sd of the logged peak minus the fitted P (readings miss or overshoot the curve's top).</summary>
    public (double Mean, double Sd) PeakOffset { get; private init; }

    /// <summary>The peak offset per colour bucket (a white's broad top is read many times, a red's sharp one may fall between readings).</summary>
    public IReadOnlyDictionary<string, (double Mean, double Sd)> PeakOffsetByColour { get; private init; } = new Dictionary<string, (double, double)>();

    /// <summary>The peak offset for the lot's colour.</summary>
    public (double Mean, double Sd) PeakOffsetFor(LotCourse course) => PeakOffsetByColour.TryGetValue(BucketOf(course), out var v) ? v : PeakOffset;

    /// <summary>Slope of the peak on the must temperature.</summary>
    public double PeakMustSlope { get; private init; }

    /// <summary>Slope of the peak on log μm, °C per log unit.</summary>
    public double PeakRateSlope { get; private init; }

    /// <summary>Effective heat removal per vessel group, 1/h: β·μm/(P − Ta), the quasi-steady heat balance at the peak (median).</summary>
    public IReadOnlyDictionary<string, double> CoolingCoefficient { get; private init; } = new Dictionary<string, double>();

    private Dictionary<string, (double Mean, double Sd)> _startByVessel = [];
    private string[] _strainColumns = [];
    private double[] _betaMu = [], _betaLag = [];
    private double[,] _inverse = new double[0, 0];
    private double _xtCentre, _xnCentre;
    private bool _useYan;
    private double _yanLogSd;
    private Dictionary<string, (double Mu, double Lag)> _colourIntercept = [];
    private (double Vmm, double Vml, double Vll) _between;
    private Dictionary<string, string> _strainColour = [];
    private double[] _peakBeta = [];
    private double[,] _peakInverse = new double[0, 0];
    private string[] _peakGroups = [], _peakStrains = [];
    private Dictionary<string, StrainMedians> _medians = [];
    private StrainMedians _pooledMedians = new(double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, 0);
    private double _slowestOverMedian = double.NaN;

    /// <summary>Strain medians of the training lots (hours from the inoculation, and from the first reading).</summary>
    /// <param name="OneThirdHours">Median hours to one-third depletion.</param>
    /// <param name="DryHours">Median hours to the dry reading.</param>
    /// <param name="PeakC">Median logged peak, °C.</param>
    /// <param name="OneThirdFromFirst">Median hours from the first reading to one-third depletion.</param>
    /// <param name="DryFromFirst">Median hours from the first reading to dryness.</param>
    /// <param name="SlowestDryHours">The slowest time to dryness among the strain's lots, h.</param>
    /// <param name="DryCount">The strain's lots with a time to dryness.</param>
    public sealed record StrainMedians(double OneThirdHours, double DryHours, double PeakC, double OneThirdFromFirst, double DryFromFirst, double SlowestDryHours, int DryCount);

    /// <summary>Lots with a time to dryness a strain needs before its own slowest lot marks a late finish.</summary>
    public const int SlowestNeedsLots = 10;

    /// <summary>
    /// Hours from the inoculation after which reaching dry counts as a sluggish end: the strain's slowest past lot when
    /// it has at least <see cref="SlowestNeedsLots"/> with a time to dryness (about its 95th percentile or beyond).
    /// With fewer, its slowest lot is no such mark (of two lots, the slower is a typical lot), so its median time is
    /// taken times the ratio of slowest to median that strains with enough lots show (or the whole history, when none
    /// has), and never less than its own slowest. A strain the history does not know takes the history's slowest lot.
    /// </summary>
    public double SluggishAfterHours(string strain)
    {
        var own = MediansFor(strain);
        if (ReferenceEquals(own, _pooledMedians) || own.DryCount >= SlowestNeedsLots || double.IsNaN(own.DryHours) || double.IsNaN(_slowestOverMedian))
        {
            return own.SlowestDryHours;
        }

        return Math.Max(own.SlowestDryHours, own.DryHours * _slowestOverMedian);
    }

    /// <summary>The key a strain code or vessel type is matched by: letters and digits, upper case (intake's rule).</summary>
    public static string Key(string? text) =>
        text is null ? string.Empty : new string(text.Where(char.IsLetterOrDigit).Select(char.ToUpperInvariant).ToArray());

    /// <summary>"white" for whites and rosés, "red" otherwise (the kinetics thresholds treat unrecorded colour as red).</summary>
    public static string ColourBucket(WineColour colour) => colour is WineColour.White or WineColour.Rose ? "white" : "red";

    /// <summary>The vessel group of a lot: vessel key and colour bucket.</summary>
    public string GroupOf(LotCourse c) => Key(c.Vessel) + "|" + BucketOf(c);

    /// <summary>The colour bucket of a lot; an unrecorded colour takes the strain's usual colour in the history.</summary>
    public string BucketOf(LotCourse c) =>
        c.Colour != WineColour.Unknown ? ColourBucket(c.Colour) : _strainColour.GetValueOrDefault(Key(c.Strain), "red");

    /// <summary>Past lots of the strain (0 for a strain the history does not know).</summary>
    public int LotsOfStrain(string strain) => StrainLots.GetValueOrDefault(Key(strain));

    /// <summary>The strain's medians, or the pooled medians for a strain the history does not know.</summary>
    public StrainMedians MediansFor(string strain) => _medians.GetValueOrDefault(Key(strain), _pooledMedians);

    /// <summary>
    /// Learns from past lots (those with a whole-course fit). Throws <see cref="ArgumentException"/> when fewer than
    /// three lots can be fitted (the forecast then has nothing to stand on), or fewer than two more than the quantities
    /// the rate and lag regression learns (the lot-to-lot scatter could not be measured).
    /// </summary>
    public static ForecastModel Train(IReadOnlyList<PastLot> past, SigmoidModel form, ForecastSettings settings)
    {
        ArgumentNullException.ThrowIfNull(past);
        ArgumentNullException.ThrowIfNull(settings);
        var fitted = past.Where(p => p.FitOf(form) is not null).Select(p => new Fitted(p, p.FitOf(form)!)).ToArray();
        if (fitted.Length < 3)
        {
            throw new ArgumentException(
                past.Count == 0
                    ? "The history holds no fermentation log that belongs to one of its finished lots, and the forecast learns how each strain ferments from past logs. Add the past seasons' logs (sugar readings by lot id and time, as review reads them) to the history."
                    : $"The forecast needs at least 3 past lots whose logs can be fitted with a fermentation curve; {fitted.Length} of the {past.Count} past lot(s) with a log could be (too few readings, or sugar that does not fall). The Kinetics sheet of a review of the history says why each log was not fitted.",
                nameof(past));
        }

        double dry = settings.Kinetics.DryBrix;
        var strainColour = fitted.GroupBy(p => Key(p.Course.Strain))
            .ToDictionary(g => g.Key, g => g.Count(p => p.Course.Colour is WineColour.White or WineColour.Rose) > g.Count(p => p.Course.Colour is WineColour.Red) ? "white" : "red");
        string Bucket(LotCourse c) => c.Colour != WineColour.Unknown ? ColourBucket(c.Colour) : strainColour.GetValueOrDefault(Key(c.Strain), "red");
        string Group(LotCourse c) => Key(c.Vessel) + "|" + Bucket(c);

        // Reading noise: the median residual of the whole-course fits, hand-read and dense logs apart.
        bool Dense(LotCourse c) => c.SugarHours.Length >= 3 && Descriptive.Median(c.SugarHours.Zip(c.SugarHours.Skip(1), (a, b) => b - a)) <= settings.Kinetics.DenseSpacingHours;
        var sparseRmse = fitted.Where(p => !Dense(p.Course)).Select(p => p.Fit!.Rmse * Math.Sqrt(p.Fit.Points / (double)Math.Max(1, p.Fit.Points - 4))).ToArray();
        var denseRmse = fitted.Where(p => Dense(p.Course)).Select(p => p.Fit!.Rmse * Math.Sqrt(p.Fit.Points / (double)Math.Max(1, p.Fit.Points - 4))).ToArray();
        double sugarSd = sparseRmse.Length > 0 ? Descriptive.Median(sparseRmse) : Descriptive.Median(denseRmse);
        double denseSd = denseRmse.Length > 0 ? Descriptive.Median(denseRmse) : sugarSd;

        // Start: S0 against the lot record's starting sugar (after additions), per vessel type where it has enough
        // lots (a sample from a bin of skins reads worse than one from a tank), with a small share of records that are
        // simply wrong (an under-read sample, an unrecorded addition): those lots' starts lie far outside the rest.
        var offsets = fitted.Select(p => p.Fit!.StartBrix - p.Course.StartBrix).ToArray();
        double offMed = Descriptive.Median(offsets);
        double offSd = Math.Max(Robust.Mad(offsets), 0.1);
        var startByVessel = new Dictionary<string, (double, double)>(StringComparer.Ordinal);
        foreach (var g in fitted.GroupBy(p => Key(p.Course.Vessel)).Where(g => g.Count() >= 8))
        {
            var o = g.Select(p => p.Fit.StartBrix - p.Course.StartBrix).ToArray();
            startByVessel[g.Key] = (Descriptive.Median(o), Math.Max(Robust.Mad(o), 0.1));
        }

        int wrongRecords = fitted.Count(p => Math.Abs(p.Fit.StartBrix - p.Course.StartBrix - offMed) > Math.Max(1.5, 5 * offSd));
        double wrongShare = (wrongRecords + 1.0) / (fitted.Length + 2.0);
        var finals = fitted.Where(p => p.Fit!.FinalBrix < dry).Select(p => p.Fit!.FinalBrix).ToArray();
        var stuck = fitted.Where(p => p.Fit!.FinalBrix >= dry).Select(p => p.Fit!.FinalBrix).ToArray();
        double finalMean = finals.Length > 0 ? finals.Average() : dry - 1.8;
        double finalSd = finals.Length > 1 ? Math.Max(Descriptive.StandardDeviation(finals), 0.1) : 0.5;
        double stuckShare = (stuck.Length + 1.0) / (fitted.Length + 2.0);
        var stuckFinal = stuck.Length >= 2
            ? (stuck.Average(), Math.Max(Descriptive.StandardDeviation(stuck), 1.5))
            : (dry + 3.0, 2.5);

        // The vessel type's usual peak temperature, a covariate of the rate.
        var vesselPeak = new Dictionary<string, double>(StringComparer.Ordinal);
        foreach (var g in fitted.Where(p => p.PeakC is not null).GroupBy(p => Group(p.Course)))
        {
            vesselPeak[g.Key] = Descriptive.Median(g.Select(p => p.PeakC!.Value));
        }

        foreach (var g in fitted.Where(p => p.PeakC is not null).GroupBy(p => Bucket(p.Course)))
        {
            vesselPeak["|" + g.Key] = Descriptive.Median(g.Select(p => p.PeakC!.Value));
        }

        double UsualPeak(LotCourse c) =>
            vesselPeak.TryGetValue(Group(c), out var v) ? v : vesselPeak.TryGetValue("|" + Bucket(c), out var w) ? w : 25.0;

        // Rate and lag: strain intercepts (strains with too few lots pooled per colour) and the covariates.
        var strainCounts = fitted.GroupBy(p => Key(p.Course.Strain)).ToDictionary(g => g.Key, g => g.Count());
        var columns = strainCounts.Where(kv => kv.Value >= settings.MinStrainLots).Select(kv => kv.Key).Order(StringComparer.Ordinal).ToList();
        foreach (var bucket in new[] { "red", "white" })
        {
            if (fitted.Any(p => !columns.Contains(Key(p.Course.Strain)) && Bucket(p.Course) == bucket))
            {
                columns.Add("~" + bucket);
            }
        }

        double xtCentre = fitted.Average(p => UsualPeak(p.Course));
        int withYan = fitted.Count(p => p.Course.YanMgL is > 0);
        bool useYan = withYan >= 0.8 * fitted.Length && withYan >= 10;
        double xnCentre = useYan ? fitted.Where(p => p.Course.YanMgL is > 0).Average(p => Math.Log(p.Course.YanMgL!.Value)) : 0;
        double yanLogSd = useYan ? Descriptive.StandardDeviation(fitted.Where(p => p.Course.YanMgL is > 0).Select(p => Math.Log(p.Course.YanMgL!.Value))) : 0;
        int p0 = columns.Count;
        double[] Row(LotCourse c)
        {
            var x = new double[p0 + 2];
            string k = Key(c.Strain);
            int col = columns.IndexOf(k);
            x[col >= 0 ? col : columns.IndexOf("~" + Bucket(c))] = 1;
            x[p0] = UsualPeak(c) - xtCentre;
            x[p0 + 1] = useYan && c.YanMgL is > 0 ? Math.Log(c.YanMgL.Value) - xnCentre : 0;
            return x;
        }

        var rows = fitted.Select(p => Row(p.Course)).ToArray();
        var logMu = fitted.Select(p => Math.Log(p.Fit!.MaxRateBrixPerHour)).ToArray();
        var lag = fitted.Select(p => p.Fit!.LagHours).ToArray();
        // Rate and lag residuals, fitted robustly: lots far outside the rest in Mahalanobis distance (a strain
        // mix-up, a ferment that went wrong) are set aside, the fit and covariance made again on the others, twice; the
        // covariance of what is kept is rescaled for the trimming (χ² with 2 degrees of freedom at 0.99: 9.21, and
        // P(χ²₄ ≤ 9.21)/0.99 = 0.9535), and the share set aside becomes the prior's wide part.
        var keep = Enumerable.Repeat(true, fitted.Length).ToArray();
        double[] betaMu = [], betaLag = [], eMu = [], eLag = [];
        double[,] inverse = new double[0, 0];
        var seasons = fitted.Select((p, i) => (p.Course.Season, i)).GroupBy(x => x.Season).OrderBy(g => g.Key).ToArray();
        int covariates = Enumerable.Range(p0, 2).Count(j => rows.Any(x => x[j] != 0));
        int learnt = p0 + covariates + seasons.Length;
        if (fitted.Length - learnt < 2)
        {
            // The lot-to-lot scatter of rate and lag (a 2 × 2 covariance) needs two degrees of freedom left over;
            // with fewer it is zero or singular, and every interval would be 0 wide or undefined.
            throw new ArgumentException($"The forecast needs at least {learnt + 2} past lots whose logs can be fitted here; {fitted.Length} could be. It learns {learnt} things from them ({p0} strain or colour group(s), {covariates} of peak temperature and YAN, {seasons.Length} season(s)) and needs two lots more than that to measure how much lots differ. Add the logs of more past lots.", nameof(past));
        }

        var shifts = new Dictionary<int, double>();
        (double, double, double) within = (0, 0, 0);
        var byColour = new Dictionary<string, (double, double, double)>(StringComparer.Ordinal);
        double Predict(double[] beta, double[] x) => x.Select((v, i) => v * beta[i]).Sum();
        for (int pass = 0; pass < 3; pass++)
        {
            var idx = Enumerable.Range(0, fitted.Length).Where(i => keep[i]).ToArray();
            (betaMu, _, inverse) = SmallLeastSquares.Fit(idx.Select(i => rows[i]).ToArray(), idx.Select(i => logMu[i]).ToArray());
            (betaLag, _, _) = SmallLeastSquares.Fit(idx.Select(i => rows[i]).ToArray(), idx.Select(i => lag[i]).ToArray());
            var bm = betaMu;
            var bl = betaLag;
            eMu = fitted.Select((p, i) => logMu[i] - Predict(bm, rows[i])).ToArray();
            eLag = fitted.Select((p, i) => lag[i] - Predict(bl, rows[i])).ToArray();

            // Seasons: the mean log-rate residual of each season (kept lots) is its shift.
            var em = eMu;
            var el = eLag;
            shifts = seasons.ToDictionary(g => g.Key, g => g.Where(x => keep[x.i]).Select(x => em[x.i]).DefaultIfEmpty(0).Average());
            var lagShifts = seasons.ToDictionary(g => g.Key, g => g.Where(x => keep[x.i]).Select(x => el[x.i]).DefaultIfEmpty(0).Average());
            // The lag's scatter grows with the lag (a strain that starts in 9 h does not vary by the 6 h a 30-hour strain
            // does): lag residuals are taken relative to the lot's predicted lag (at least MinLagScale hours).
            double sMm = 0, sMl = 0, sLl = 0;
            var centred = new (double A, double B)[fitted.Length];
            for (int i = 0; i < fitted.Length; i++)
            {
                double scale = LagScale(Predict(bl, rows[i]));
                centred[i] = (eMu[i] - shifts[fitted[i].Course.Season], (eLag[i] - lagShifts[fitted[i].Course.Season]) / scale);
                if (keep[i])
                {
                    sMm += centred[i].A * centred[i].A;
                    sMl += centred[i].A * centred[i].B;
                    sLl += centred[i].B * centred[i].B;
                }
            }

            // Degrees of freedom: the kept lots less what the regression learns, its rank (a covariate that does not
            // vary, YAN when it is not used, or a vessel peak the strain columns already fix, learns nothing), and one
            // shift per season.
            int rank = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.DenseOfRowArrays(idx.Select(i => rows[i])).Rank();
            int dof = Math.Max(1, idx.Length - rank - seasons.Length);
            double trim = pass == 0 ? 1.0 : 0.9535;
            within = (sMm / dof / trim, sMl / dof / trim, sLl / dof / trim);

            // Per colour: the same sums over the colour's kept lots, with the colour's share of the degrees of freedom.
            byColour.Clear();
            foreach (var bucket in new[] { "red", "white" })
            {
                double bMm = 0, bMl = 0, bLl = 0;
                int nb = 0;
                for (int i = 0; i < fitted.Length; i++)
                {
                    if (keep[i] && Bucket(fitted[i].Course) == bucket)
                    {
                        (bMm, bMl, bLl, nb) = (bMm + (centred[i].A * centred[i].A), bMl + (centred[i].A * centred[i].B), bLl + (centred[i].B * centred[i].B), nb + 1);
                    }
                }

                if (nb >= MinColourLots)
                {
                    double bDof = Math.Max(1.0, nb * (double)dof / idx.Length);
                    byColour[bucket] = (bMm / bDof / trim, bMl / bDof / trim, bLl / bDof / trim);
                }
            }

            for (int i = 0; i < fitted.Length; i++)
            {
                var w2 = byColour.TryGetValue(Bucket(fitted[i].Course), out var own) ? own : within;
                var g2 = new Gaussian2(0, 0, w2.Item1, w2.Item2, w2.Item3);
                double det = (g2.Vaa * g2.Vbb) - (g2.Vab * g2.Vab);
                double d2 = ((g2.Vbb * centred[i].A * centred[i].A) - (2 * g2.Vab * centred[i].A * centred[i].B) + (g2.Vaa * centred[i].B * centred[i].B)) / det;
                keep[i] = !(det > 0) || d2 <= 9.21; // a covariance that is not positive sets no lot aside
            }
        }

        int rateOutliers = keep.Count(k => !k);
        double spread = settings.MinSeasonSpread;
        if (seasons.Length >= 2)
        {
            double mean = shifts.Values.Average();
            double between = shifts.Values.Sum(v => (v - mean) * (v - mean)) / (seasons.Length - 1);
            double noise = seasons.Average(g => within.Item1 / g.Count(x => keep[x.i]));
            spread = Math.Max(spread, Math.Sqrt(Math.Max(0, between - noise)));
        }

        // Strains the history does not know: the mean intercept of the colour's strains, widened by the spread of
        // strain intercepts around their colour's mean.
        var colourIntercept = new Dictionary<string, (double, double)>(StringComparer.Ordinal);
        var devs = new List<(double Mu, double Lag)>();
        foreach (var bucket in new[] { "red", "white" })
        {
            var cols = columns.Select((c, i) => (c, i)).Where(x => !x.c.StartsWith('~') && strainColour.GetValueOrDefault(x.c) == bucket).ToArray();
            if (cols.Length == 0)
            {
                continue;
            }

            double mm = cols.Average(x => betaMu[x.i]), ml = cols.Average(x => betaLag[x.i]);
            colourIntercept[bucket] = (mm, ml);
            devs.AddRange(cols.Select(x => (betaMu[x.i] - mm, betaLag[x.i] - ml)));
        }

        int kDof = Math.Max(1, devs.Count - colourIntercept.Count);
        double typicalLag = LagScale(colourIntercept.Count > 0 ? colourIntercept.Values.Average(v => v.Item2) : betaLag.Take(p0).Average());
        var betweenStrains = (
            Math.Max(devs.Sum(d => d.Mu * d.Mu) / kDof, within.Item1),
            devs.Sum(d => d.Mu * d.Lag) / kDof,
            Math.Max(devs.Sum(d => d.Lag * d.Lag) / kDof, within.Item3 * typicalLag * typicalLag));

        // First reading after inoculation.
        var delays = fitted.Where(p => p.Course.FromInoculation).Select(p => p.Course.SugarHours[0]).ToArray();
        var firstDelay = delays.Length > 0 ? (Descriptive.Median(delays), delays.Length > 1 ? Descriptive.StandardDeviation(delays) : 6.0) : (6.0, 6.0);

        var temp = TrainTemperature(fitted, Group, Bucket, settings);
        // What the strain's past lots did, as logged: every past lot with a log, its course fitted or not (a log the
        // sigmoid does not fit, a stall that then finished, is still a past lot and may be the strain's slowest).
        var medians = new Dictionary<string, StrainMedians>(StringComparer.Ordinal);
        foreach (var g in past.GroupBy(p => Key(p.Course.Strain)))
        {
            medians[g.Key] = Medians(g.ToArray());
        }

        var pooledMedians = Medians(past);

        return new ForecastModel
        {
            Form = form,
            SugarSd = sugarSd,
            DenseSugarSd = denseSd,
            TempSd = temp.Sd,
            StartOffset = (offMed, offSd),
            WrongStartShare = wrongShare,
            _startByVessel = startByVessel,
            Final = (finalMean, finalSd),
            StuckShare = stuckShare,
            StuckFinal = stuckFinal,
            LotsUsed = fitted.Length,
            StrainLots = strainCounts,
            SeasonSpread = spread,
            SeasonShifts = shifts,
            RateTemperatureSlope = betaMu[p0],
            RateNitrogenSlope = useYan ? betaMu[p0 + 1] : 0,
            Within = within,
            WithinByColour = byColour.ToDictionary(kv => kv.Key, kv => (kv.Value.Item1, kv.Value.Item2, kv.Value.Item3), StringComparer.Ordinal),
            RateOutlierShare = (rateOutliers + 1.0) / (fitted.Length + 2.0),
            FirstReadingDelay = firstDelay,
            TempDelay = temp.Delay,
            VesselPeak = vesselPeak,
            MustTemp = temp.Must,
            PeakSd = temp.PeakSd,
            PeakSdByColour = temp.PeakSdByColour,
            PeakOutlierShare = temp.PeakOutlierShare,
            PeakOffset = temp.Offset,
            PeakOffsetByColour = temp.OffsetByColour,
            PeakMustSlope = temp.Beta.Length > 0 ? temp.Beta[^2] : 0,
            PeakRateSlope = temp.Beta.Length > 0 ? temp.Beta[^1] : 0,
            CoolingCoefficient = temp.Cooling,
            _strainColumns = columns.ToArray(),
            _betaMu = betaMu,
            _betaLag = betaLag,
            _inverse = inverse,
            _xtCentre = xtCentre,
            _xnCentre = xnCentre,
            _useYan = useYan,
            _yanLogSd = yanLogSd,
            _colourIntercept = colourIntercept,
            _between = betweenStrains,
            _strainColour = strainColour,
            _peakBeta = temp.Beta,
            _peakInverse = temp.Inverse,
            _peakGroups = temp.Groups,
            _peakStrains = temp.Strains,
            _medians = medians,
            _pooledMedians = pooledMedians,
            _slowestOverMedian = SlowestOverMedian(medians.Values, pooledMedians),
        };
    }

    /// <summary>A past lot with its fit of the form in use.</summary>
    private sealed record Fitted(PastLot Lot, CurveFit Fit)
    {
        public LotCourse Course => Lot.Course;

        public double? PeakC => Lot.PeakC;

        public double? OneThirdHours => Lot.OneThirdHours;

        public double? DryHours => Lot.DryHours;
    }

    /// <summary>
    /// The strain's medians as logged. Hours from inoculation count the lots with an inoculation time (a lot without
    /// one counts from its first reading, which is not the same clock), or every lot when none has one; hours from the
    /// first reading and the peak count every lot.
    /// </summary>
    private static StrainMedians Medians(IReadOnlyList<PastLot> lots)
    {
        double Med(IEnumerable<double?> v)
        {
            var a = v.Where(x => x is not null).Select(x => x!.Value).ToArray();
            return a.Length == 0 ? double.NaN : Descriptive.Median(a);
        }

        var clocked = lots.Where(p => p.Course.FromInoculation).ToArray();
        if (clocked.Length == 0)
        {
            clocked = lots.ToArray();
        }

        var dryTimes = clocked.Where(p => p.DryHours is not null).Select(p => p.DryHours!.Value).ToArray();
        return new StrainMedians(
            Med(clocked.Select(p => p.OneThirdHours)),
            Med(clocked.Select(p => p.DryHours)),
            Med(lots.Select(p => p.PeakC)),
            Med(lots.Select(p => p.OneThirdHours - p.Course.SugarHours[0])),
            Med(lots.Select(p => p.DryHours - p.Course.SugarHours[0])),
            dryTimes.Length == 0 ? double.NaN : dryTimes.Max(),
            dryTimes.Length);
    }

    /// <summary>
    /// How far the slowest lot lies beyond the median, as a ratio of hours to dryness: the median over strains with at
    /// least <see cref="SlowestNeedsLots"/> such lots, else the whole history's.
    /// </summary>
    private static double SlowestOverMedian(IEnumerable<StrainMedians> strains, StrainMedians pooled)
    {
        var ratios = strains.Where(m => m.DryCount >= SlowestNeedsLots && m.DryHours > 0).Select(m => m.SlowestDryHours / m.DryHours).ToArray();
        return ratios.Length > 0 ? Descriptive.Median(ratios) : pooled.DryHours > 0 ? pooled.SlowestDryHours / pooled.DryHours : double.NaN;
    }

    /// <summary>The lot's prior on (log μm, λ) before the season shift, and whether it is the strain's own.</summary>
    public RatePrior RatePriorFor(LotCourse course)
    {
        ArgumentNullException.ThrowIfNull(course);
        int p0 = _strainColumns.Length;
        string key = Key(course.Strain);
        string bucket = BucketOf(course);
        int col = Array.IndexOf(_strainColumns, key);
        double xt = (VesselPeak.TryGetValue(GroupOf(course), out var v) ? v : VesselPeak.TryGetValue("|" + bucket, out var w) ? w : _xtCentre) - _xtCentre;
        bool yanKnown = _useYan && course.YanMgL is > 0;
        double xn = yanKnown ? Math.Log(course.YanMgL!.Value) - _xnCentre : 0;
        double mu = (_betaMu[p0] * xt) + (_betaMu[p0 + 1] * xn);
        double lag = (_betaLag[p0] * xt) + (_betaLag[p0 + 1] * xn);
        bool own = col >= 0;
        double fShare = 0;
        if (own)
        {
            mu += _betaMu[col];
            lag += _betaLag[col];

            // The prediction's own uncertainty, xᵀ(XᵀX)⁻¹x times the lots' scatter (finite for a lot like the
            // history's even where covariates and strains go together, as when each strain had one vessel type).
            var x = new double[p0 + 2];
            x[col] = 1;
            x[p0] = xt;
            x[p0 + 1] = xn;
            for (int i = 0; i < x.Length; i++)
            {
                for (int j = 0; j < x.Length; j++)
                {
                    fShare += x[i] * _inverse[i, j] * x[j];
                }
            }

            fShare = Math.Clamp(fShare, 0, 1);
        }
        else
        {
            int pooled = Array.IndexOf(_strainColumns, "~" + bucket);
            var (cm, cl) = _colourIntercept.TryGetValue(bucket, out var ci) ? ci
                : pooled >= 0 ? (_betaMu[pooled], _betaLag[pooled])
                : (_betaMu.Take(p0).Average(), _betaLag.Take(p0).Average());
            mu += cm;
            lag += cl;
        }

        // The lots' scatter, its lag part in proportion to the lot's prior lag.
        double scale = LagScale(lag);
        var within = WithinFor(course);
        double vmm = within.Vmm * (1 + fShare), vml = within.Vml * scale * (1 + fShare), vll = within.Vll * scale * scale * (1 + fShare);
        if (!own)
        {
            vmm += _between.Vmm;
            vml += _between.Vml;
            vll += _between.Vll;
        }

        if (_useYan && !yanKnown)
        {
            // YAN not recorded: its effect is unknown, so the spread it causes in the history is added.
            vmm += RateNitrogenSlope * RateNitrogenSlope * _yanLogSd * _yanLogSd;
        }

        return new RatePrior(mu, lag, vmm, vml, vll, own);
    }

    /// <summary>Prior mean of the peak P, °C, for a must temperature and a log maximum rate (without the lot's own scatter).</summary>
    public double PeakMean(LotCourse course, double mustC, double logMu)
    {
        ArgumentNullException.ThrowIfNull(course);
        if (_peakBeta.Length == 0)
        {
            return mustC + 10.0;
        }

        var x = PeakRow(_peakGroups, _peakStrains, GroupOf(course), Key(course.Strain), BucketOf(course), mustC, logMu);
        double s = 0;
        for (int i = 0; i < x.Length; i++)
        {
            s += x[i] * _peakBeta[i];
        }

        return s;
    }

    /// <summary>
    /// The peak regression's own uncertainty for a lot, as a share of its residual variance: xᵀ(XᵀX + R)⁻¹x at the
    /// given must temperature and log maximum rate (0 without a regression; at most 1).
    /// </summary>
    public double PeakPredictionShare(LotCourse course, double mustC, double logMu)
    {
        ArgumentNullException.ThrowIfNull(course);
        if (_peakBeta.Length == 0)
        {
            return 0;
        }

        var x = PeakRow(_peakGroups, _peakStrains, GroupOf(course), Key(course.Strain), BucketOf(course), mustC, logMu);
        double f = 0;
        for (int i = 0; i < x.Length; i++)
        {
            for (int j = 0; j < x.Length; j++)
            {
                f += x[i] * _peakInverse[i, j] * x[j];
            }
        }

        return Math.Clamp(f, 0, 1);
    }

    /// <summary>The peak regression for a lot as P = base + PeakMustSlope·Ta + PeakRateSlope·log μm: its base.</summary>
    public double PeakBase(LotCourse course) => PeakMean(course, 0, 0);

    /// <summary>Temperature lag behind the rate for the lot's vessel group (colour fallback; 4 h when the history has none).</summary>
    public double DelayFor(LotCourse course) =>
        TempDelay.TryGetValue(GroupOf(course), out var d) ? d : TempDelay.TryGetValue("|" + BucketOf(course), out var e) ? e : 4.0;

    /// <summary>Mean and sd of Ta for the lot's colour.</summary>
    public (double Mean, double Sd) MustTempFor(LotCourse course) =>
        MustTemp.TryGetValue(BucketOf(course), out var m) ? m : (18.0, 3.0);

    /// <summary>Effective heat removal of the lot's vessel group, 1/h (colour median as fallback), or null.</summary>
    public double? CoolingFor(LotCourse course)
    {
        if (CoolingCoefficient.TryGetValue(GroupOf(course), out var k))
        {
            return k;
        }

        var same = CoolingCoefficient.Where(kv => kv.Key.EndsWith("|" + BucketOf(course), StringComparison.Ordinal)).Select(kv => kv.Value).ToArray();
        return same.Length > 0 ? Descriptive.Median(same) : null;
    }
}

/// <summary>A lot's prior on (log μm, λ) before the season shift.</summary>
/// <param name="LogMu">Mean log maximum rate (°Brix/h).</param>
/// <param name="Lag">Mean lag, h from the inoculation.</param>
/// <param name="Vmm">Variance of log μm.</param>
/// <param name="Vml">Covariance.</param>
/// <param name="Vll">Variance of λ.</param>
/// <param name="OwnStrain">True when the strain has a prior of its own; false when pooled.</param>
public sealed record RatePrior(double LogMu, double Lag, double Vmm, double Vml, double Vll, bool OwnStrain);
