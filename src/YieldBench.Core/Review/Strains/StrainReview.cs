using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Statistics;

namespace YieldBench.Core.Review.Strains;

/// <summary>
/// Everything the strain review found, ready for renderers to lay out: group summaries, the strain comparison,
/// per-lot robust scores and the odd-lot flags. Lists are in a fixed, documented order.
/// </summary>
public sealed record StrainReview
{
    /// <summary>Settings the review ran with.</summary>
    public required StrainReviewSettings Settings { get; init; }

    /// <summary>The seed every random step used.</summary>
    public required int Seed { get; init; }

    /// <summary>Summaries by grouping (in <see cref="Groupings.All"/> order), then group label (ordinal), then measure.</summary>
    public required IReadOnlyList<GroupSummary> Groups { get; init; }

    /// <summary>The comparison of strains.</summary>
    public required StrainComparison Comparison { get; init; }

    /// <summary>Robust z of each lot's factor within its strain, in input order.</summary>
    public required IReadOnlyList<LotScore> Scores { get; init; }

    /// <summary>Flags ordered by season, lot id (ordinal), then code order; group-level flags (no lot) last in each season.</summary>
    public required IReadOnlyList<LotFlag> Flags { get; init; }

    /// <summary>Plain-language notes on what was left out and why (nothing is dropped silently).</summary>
    public required IReadOnlyList<string> Notes { get; init; }

    /// <summary>The summary of <paramref name="measure"/> over one group of one grouping, or null when there is no such group.</summary>
    public GroupSummary? Summary(string grouping, string group, ConversionMeasure measure) =>
        Groups.FirstOrDefault(g => g.Grouping == grouping && g.Measure == measure && string.Equals(g.Group, group, StringComparison.Ordinal));
}

/// <summary>The groupings summarised, with their report names.</summary>
public static class Groupings
{
    /// <summary>By yeast strain.</summary>
    public const string Strain = "strain";

    /// <summary>By vessel type.</summary>
    public const string Vessel = "vessel";

    /// <summary>By starting-sugar band (effective °Brix after additions).</summary>
    public const string SugarBand = "starting sugar band";

    /// <summary>By grape variety.</summary>
    public const string Variety = "variety";

    /// <summary>By season.</summary>
    public const string Season = "season";

    /// <summary>Cross-tab strain × vessel type.</summary>
    public const string StrainByVessel = "strain × vessel";

    /// <summary>Cross-tab strain × season.</summary>
    public const string StrainBySeason = "strain × season";

    /// <summary>Label of a missing vessel or variety.</summary>
    public const string NotRecorded = "(not recorded)";

    /// <summary>All groupings in report order.</summary>
    public static IReadOnlyList<string> All { get; } = [Strain, Vessel, SugarBand, Variety, Season, StrainByVessel, StrainBySeason];
}

/// <summary>
/// Summary of one measure over one group of lots. Values in the measure's unit (% v/v per °Brix, g/L per % v/v, or
/// a 0–1 share for Gay-Lussac efficiency). Scales (MAD, Qn, SD) are normal-consistent; IQR is type 7.
/// </summary>
public sealed record GroupSummary
{
    /// <summary>Grouping name (<see cref="Groupings"/>).</summary>
    public required string Grouping { get; init; }

    /// <summary>Group label, e.g. a strain code, "barrel", "23–25", "Y-17 × barrel".</summary>
    public required string Group { get; init; }

    /// <summary>The measure.</summary>
    public required ConversionMeasure Measure { get; init; }

    /// <summary>The strain the group is of (by strain, strain × vessel, strain × season), else null.</summary>
    public string? Strain { get; init; }

    /// <summary>The season the group is of (by season, strain × season), else null.</summary>
    public int? Season { get; init; }

    /// <summary>Lots with a value of this measure.</summary>
    public required int N { get; init; }

    /// <summary>Lots in the group without a value of this measure (e.g. no alcohol), left out of the statistics.</summary>
    public required int Missing { get; init; }

    /// <summary>Median.</summary>
    public required double Median { get; init; }

    /// <summary>Scaled MAD (1.482602 × raw MAD).</summary>
    public required double Mad { get; init; }

    /// <summary>Rousseeuw–Croux Qn.</summary>
    public required double Qn { get; init; }

    /// <summary>Rousseeuw–Croux Sn.</summary>
    public double Sn { get; init; } = double.NaN;

    /// <summary>Interquartile range (type 7): <see cref="Q3"/> − <see cref="Q1"/>.</summary>
    public required double Iqr { get; init; }

    /// <summary>Lower quartile (type 7).</summary>
    public double Q1 { get; init; } = double.NaN;

    /// <summary>Upper quartile (type 7).</summary>
    public double Q3 { get; init; } = double.NaN;

    /// <summary>Smallest value at or above <see cref="Q1"/> − 1.5 IQR (a box plot's lower whisker, Tukey's inner fence).</summary>
    public double LowerWhisker { get; init; } = double.NaN;

    /// <summary>Largest value at or below <see cref="Q3"/> + 1.5 IQR (a box plot's upper whisker).</summary>
    public double UpperWhisker { get; init; } = double.NaN;

    /// <summary>Arithmetic mean.</summary>
    public required double Mean { get; init; }

    /// <summary>Sample standard deviation (n − 1).</summary>
    public required double Sd { get; init; }

    /// <summary>20 % trimmed mean.</summary>
    public required double TrimmedMean { get; init; }

    /// <summary>Huber M-location (k from the settings).</summary>
    public required double Huber { get; init; }

    /// <summary>Smallest value.</summary>
    public required double Min { get; init; }

    /// <summary>Largest value.</summary>
    public required double Max { get; init; }

    /// <summary>Percentile bootstrap interval of the median (NaN ends when the group is too small).</summary>
    public required Interval MedianInterval { get; init; }

    /// <summary>Why something is missing (e.g. "too few lots"), or null.</summary>
    public string? Note { get; init; }
}

/// <summary>The strain comparison: rank test, pairwise shifts, and the comparison adjusted for starting sugar.</summary>
public sealed record StrainComparison
{
    /// <summary>Data-file name of the factor compared: abv_per_brix for dry lots, abv_per_brix_fermented otherwise.</summary>
    public required string Measure { get; init; }

    /// <summary>Strains compared (at least the minimum lots), ordinal order.</summary>
    public required IReadOnlyList<string> Strains { get; init; }

    /// <summary>Raw median factor of each compared strain, same order as <see cref="Strains"/>.</summary>
    public required IReadOnlyList<double> RawMedians { get; init; }

    /// <summary>Kruskal–Wallis across the compared strains.</summary>
    public required KruskalWallisResult KruskalWallis { get; init; }

    /// <summary>Every pair (first strain before second in ordinal order): Hodges–Lehmann shift first − second.</summary>
    public required IReadOnlyList<PairwiseShift> Pairs { get; init; }

    /// <summary>The robust regression behind the adjusted comparison, or null when it could not be fitted.</summary>
    public RobustFit? Regression { get; init; }

    /// <summary>
    /// Reference starting sugar of the adjusted comparison: the median effective °Brix of the lots kept in it (finished
    /// lots with a plausible factor, <see cref="ReferenceLots"/> of them).
    /// </summary>
    public required double ReferenceBrix { get; init; }

    /// <summary>The finished lots kept in the adjusted comparison, whose median starting sugar is <see cref="ReferenceBrix"/>.</summary>
    public int ReferenceLots { get; init; }

    /// <summary>True when vessel type entered the regression as a factor.</summary>
    public required bool AdjustedForVessel { get; init; }

    /// <summary>Each strain's adjusted conversion at the reference sugar, same order as <see cref="Strains"/> (empty when not fitted).</summary>
    public required IReadOnlyList<AdjustedStrain> Adjusted { get; init; }

    /// <summary>Adjusted differences for every pair, first − second, in % v/v at the reference sugar.</summary>
    public required IReadOnlyList<AdjustedDifference> AdjustedDifferences { get; init; }

    /// <summary>Plain-language findings, in reading order.</summary>
    public required IReadOnlyList<string> Sentences { get; init; }

    /// <summary>True when ranking by raw medians and by adjusted conversion put a different strain first.</summary>
    public required bool RankingsDisagree { get; init; }

    /// <summary>Strains with lots but fewer than <see cref="MinLots"/> of them, left out of the comparison (their lots are judged against all lots), ordinal order.</summary>
    public IReadOnlyList<StrainLots> LeftOut { get; init; } = [];

    /// <summary>The fewest lots a strain needs to be compared (<see cref="StrainReviewSettings.MinLotsForStrainReference"/>).</summary>
    public int MinLots { get; init; }
}

/// <summary>A strain and how many lots it has.</summary>
/// <param name="Strain">Strain code.</param>
/// <param name="Lots">Lots.</param>
public sealed record StrainLots(string Strain, int Lots);

/// <summary>Hodges–Lehmann shift of the factor between two strains.</summary>
/// <param name="First">First strain.</param>
/// <param name="Second">Second strain.</param>
/// <param name="Shift">Median of factor differences first − second, % v/v per °Brix.</param>
/// <param name="Interval">Moses' distribution-free interval of the shift.</param>
/// <param name="P">Mann–Whitney two-sided p.</param>
/// <param name="HolmP">Holm-adjusted p over all pairs.</param>
public sealed record PairwiseShift(string First, string Second, double Shift, Interval Interval, double P, double HolmP);

/// <summary>A strain's conversion adjusted for starting sugar (and vessel mix) at the reference sugar.</summary>
/// <param name="Strain">Strain code.</param>
/// <param name="PredictedAbv">Predicted final alcohol at the reference sugar, % v/v.</param>
/// <param name="Factor">PredictedAbv ÷ reference °Brix, % v/v per °Brix.</param>
/// <param name="FactorInterval">Interval of the factor from the regression's covariance.</param>
public sealed record AdjustedStrain(string Strain, double PredictedAbv, double Factor, Interval FactorInterval);

/// <summary>Adjusted difference between two strains at the same starting sugar and vessel mix.</summary>
/// <param name="First">First strain.</param>
/// <param name="Second">Second strain.</param>
/// <param name="AbvDifference">Difference in predicted alcohol, % v/v.</param>
/// <param name="Interval">Interval of the difference, % v/v.</param>
public sealed record AdjustedDifference(string First, string Second, double AbvDifference, Interval Interval);

/// <summary>A lot's robust z within its reference group.</summary>
/// <param name="LotKey">The lot's key.</param>
/// <param name="Strain">The lot's strain.</param>
/// <param name="Measure">Data-file name of the factor scored.</param>
/// <param name="Value">The lot's factor.</param>
/// <param name="ReferenceGroup">The strain, or "all lots (pooled)" when the strain has too few lots.</param>
/// <param name="ReferenceMedian">Median of the reference group.</param>
/// <param name="ReferenceScale">Scale used: scaled MAD, or Qn when the MAD is 0.</param>
/// <param name="Z">(value − median) / scale: the Iglewicz–Hoaglin modified z (NaN when both scales are 0).</param>
/// <param name="ScaleName">"MAD" or "Qn".</param>
public sealed record LotScore(LotKey LotKey, string Strain, string Measure, double Value, string ReferenceGroup, double ReferenceMedian, double ReferenceScale, double Z, string ScaleName);

/// <summary>How much a flag matters.</summary>
public enum FlagSeverity
{
    /// <summary>Worth knowing; no action needed unless it fits other evidence.</summary>
    Note,

    /// <summary>Worth checking the records or the lab.</summary>
    Check,

    /// <summary>Very likely a data-entry or measurement error.</summary>
    LikelyError,
}

/// <summary>One finding about one lot (or, for season drift, one strain in one season).</summary>
public sealed record LotFlag
{
    /// <summary>The lot's key, or null for a group-level flag.</summary>
    public LotKey? LotKey { get; init; }

    /// <summary>The lot id, or null for a group-level flag.</summary>
    public string? LotId { get; init; }

    /// <summary>Season.</summary>
    public required int Season { get; init; }

    /// <summary>The lot's strain (or the drifting strain).</summary>
    public required string Strain { get; init; }

    /// <summary>Flag code (<see cref="FlagCodes"/>).</summary>
    public required string Code { get; init; }

    /// <summary>Severity.</summary>
    public required FlagSeverity Severity { get; init; }

    /// <summary>Data-file name of the value judged (a measure, or starting_brix, residual_sugar_gl).</summary>
    public required string Measure { get; init; }

    /// <summary>The value judged.</summary>
    public required double Value { get; init; }

    /// <summary>What it was judged against, e.g. "strain Y-17", "all lots (pooled)".</summary>
    public required string ReferenceGroup { get; init; }

    /// <summary>
    /// True when the lot was judged against all lots (the pooled reference or the pooled line) because its strain had
    /// too few lots for a reference of its own.
    /// </summary>
    public bool AgainstAllLots => ReferenceGroup.Contains("(pooled", StringComparison.Ordinal);

    /// <summary>Median (or line value, or threshold) of the reference.</summary>
    public required double ReferenceMedian { get; init; }

    /// <summary>Scale of the reference (NaN where a threshold, not a spread, was used).</summary>
    public required double ReferenceScale { get; init; }

    /// <summary>Plain-language reason with the numbers.</summary>
    public required string Reason { get; init; }

    /// <summary>Suggested follow-up in cellar terms.</summary>
    public required string FollowUp { get; init; }

    /// <summary>
    /// What an explaining flag proposes, in a few words: the starting sugar a transposition would give ("24.7 °Brix"),
    /// the strain a lot behaves like ("strain YB-R31"), the water an addition would take ("about 11 L per 100 L of
    /// must"); null for other flags.
    /// </summary>
    public string? Suggestion { get; init; }

    /// <summary>For a transposition, the starting sugar as recorded ("27.4 °Brix"); null otherwise.</summary>
    public string? Recorded { get; init; }
}

/// <summary>The flag codes, in their report order.</summary>
public static class FlagCodes
{
    /// <summary>Factor far above the strain's (robust z).</summary>
    public const string HighFactor = "high-factor";

    /// <summary>Factor far below the strain's (robust z).</summary>
    public const string LowFactor = "low-factor";

    /// <summary>Beyond Tukey's inner fence within the strain.</summary>
    public const string OutsideTukeyFence = "outside-tukey-fence";

    /// <summary>Beyond Tukey's outer fence within the strain.</summary>
    public const string FarOutsideTukeyFence = "far-outside-tukey-fence";

    /// <summary>Alcohol far from the strain's Theil–Sen line at the lot's starting sugar.</summary>
    public const string OffStrainLine = "off-strain-line";

    /// <summary>More alcohol than Gay-Lussac allows from the recorded sugar.</summary>
    public const string AboveTheoreticalYield = "above-theoretical-yield";

    /// <summary>Factor outside the plausible band.</summary>
    public const string ImplausibleFactor = "implausible-factor";

    /// <summary>Residual sugar above the dryness threshold.</summary>
    public const string NotDry = "not-dry";

    /// <summary>A strain's season median outside the other seasons' interval.</summary>
    public const string SeasonDrift = "season-drift";

    /// <summary>A digit swap of the starting sugar would put the lot on the strain line.</summary>
    public const string PossibleTransposedDigits = "possible-transposed-digits";

    /// <summary>Low factor in a finished lot, consistent with unrecorded water.</summary>
    public const string PossibleUnrecordedWater = "possible-unrecorded-water";

    /// <summary>The lot fits another strain far better than its own.</summary>
    public const string PossibleStrainMixUp = "possible-strain-mix-up";

    /// <summary>All codes in report order.</summary>
    public static IReadOnlyList<string> All { get; } =
    [
        HighFactor, LowFactor, OutsideTukeyFence, FarOutsideTukeyFence, OffStrainLine, AboveTheoreticalYield,
        ImplausibleFactor, NotDry, SeasonDrift, PossibleTransposedDigits, PossibleUnrecordedWater, PossibleStrainMixUp,
    ];
}
