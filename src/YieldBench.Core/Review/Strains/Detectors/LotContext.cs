using YieldBench.Core.Conversion;
using YieldBench.Core.Statistics;
using static System.FormattableString;

namespace YieldBench.Core.Review.Strains.Detectors;

/// <summary>An odd-lot detector: what it finds about one lot, judged against the references in its context.</summary>
internal interface ILotDetector
{
    /// <summary>The flags this detector raises on the lot (none, one or more).</summary>
    IEnumerable<LotFlag> Flags(LotContext lot);
}

/// <summary>
/// Robust reference of a group's factors: median, normal-consistent scale and its name, quartiles, size, and the least
/// scale the readings' precision allows (<see cref="StrainReviewSettings.MinimumFactorScale"/>), which the scale is never
/// below.
/// </summary>
internal sealed record FactorReference(string Name, double Median, double Scale, string ScaleName, double Q1, double Q3, int N, double MinimumScale = 0)
{
    /// <summary>The name of the scale when the readings' precision, not the lots' spread, sets it.</summary>
    public const string ReadingPrecision = "reading precision";

    /// <summary>The reference of <paramref name="lots"/>' factors.</summary>
    public static FactorReference Of(string name, IReadOnlyList<PreparedLot> lots, StrainReviewSettings settings)
    {
        var sorted = Descriptive.ToSortedArray(lots.Select(l => l.Factor));
        var (scale, scaleName) = OddLots.RobustScale(sorted);
        double median = Descriptive.MedianOfSorted(sorted);
        double floor = settings.MinimumFactorScale(median, Descriptive.Median(lots.Select(l => l.Abv).Where(double.IsFinite)), Descriptive.Median(lots.Select(l => l.Brix).Where(double.IsFinite)));
        if (!(scale >= floor))
        {
            (scale, scaleName) = (floor, ReadingPrecision);
        }

        return new FactorReference(name, median, scale, scaleName, Descriptive.QuantileOfSorted(sorted, 0.25), Descriptive.QuantileOfSorted(sorted, 0.75), sorted.Length, floor);
    }

    /// <summary>(value − median)/scale: with the scaled MAD this is the Iglewicz–Hoaglin modified z (NaN when the scale is 0).</summary>
    public double Z(double value) => Scale > 0 ? (value - Median) / Scale : double.NaN;
}

/// <summary>A strain's Theil–Sen line of final alcohol on starting sugar, with the robust scale of its residuals.</summary>
internal sealed record StrainLine(string Name, TheilSenLine Line, double Scale);

/// <summary>One lot as the detectors see it: its values, its robust z, its strain's references and the settings.</summary>
internal sealed class LotContext
{
    public LotContext(PreparedLot lot, LotScore score, FactorReference own, StrainLine? line, IReadOnlyList<FactorReference> strainReferences, StrainReviewSettings settings, SugarModel sugarModel)
    {
        Lot = lot;
        Score = score;
        Own = own;
        Line = lot.IsDry ? line : null;
        StrainReferences = strainReferences;
        Settings = settings;
        SugarModel = sugarModel;
        Predicted = Line is { } l ? l.Line.Predict(lot.Brix) : double.NaN;
        LineZ = Line is { } m ? (lot.Abv - Predicted) / m.Scale : double.NaN;
    }

    public PreparedLot Lot { get; }

    public LotScore Score { get; }

    /// <summary>The reference of the lot's own strain (all lots when the strain has too few).</summary>
    public FactorReference Own { get; }

    /// <summary>The strain line a finished lot is judged against, or null (not dry, or no line).</summary>
    public StrainLine? Line { get; }

    /// <summary>The strains with enough lots for a reference of their own, by code.</summary>
    public IReadOnlyList<FactorReference> StrainReferences { get; }

    public StrainReviewSettings Settings { get; }

    public SugarModel SugarModel { get; }

    /// <summary>The alcohol the line predicts at the lot's starting sugar (NaN without a line).</summary>
    public double Predicted { get; }

    /// <summary>The lot's residual from the line in robust scales (NaN without a line).</summary>
    public double LineZ { get; }

    /// <summary>True when the robust z is beyond the limit.</summary>
    public bool FarFromStrain => !double.IsNaN(Score.Z) && Math.Abs(Score.Z) > Settings.ModifiedZLimit;

    /// <summary>Said when the reference is all lots because the strain has too few.</summary>
    public string PooledNote => Own.Name == StrainReviewer.Pooled
        ? Invariant($" (strain {Lot.Strain} has fewer than {Settings.MinLotsForStrainReference} lots, so all lots are the reference)")
        : string.Empty;

    /// <summary>A flag on this lot judged against <paramref name="reference"/> (its median and scale, or <paramref name="scale"/>).</summary>
    public LotFlag Against(FactorReference reference, string code, FlagSeverity severity, string measure, double value, string reason, string followUp, double? scale = null) =>
        Make(code, severity, measure, value, reference.Name, reference.Median, scale ?? reference.Scale, reason, followUp);

    /// <summary>A flag on this lot judged against a threshold (no spread).</summary>
    public LotFlag AgainstThreshold(string code, FlagSeverity severity, string measure, double value, string reference, double threshold, string reason, string followUp) =>
        Make(code, severity, measure, value, reference, threshold, double.NaN, reason, followUp);

    /// <summary>A flag on this lot.</summary>
    public LotFlag Make(string code, FlagSeverity severity, string measure, double value, string reference, double median, double scale, string reason, string followUp) => new()
    {
        LotKey = Lot.Key,
        LotId = Lot.Conversion.Lot.LotId,
        Season = Lot.Season,
        Strain = Lot.Strain,
        Code = code,
        Severity = severity,
        Measure = measure,
        Value = value,
        ReferenceGroup = reference,
        ReferenceMedian = median,
        ReferenceScale = scale,
        Reason = reason,
        FollowUp = followUp,
    };
}
