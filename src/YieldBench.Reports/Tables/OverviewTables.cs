using System.Globalization;
using YieldBench.Core.Review;
using YieldBench.Core.Review.Strains;

namespace YieldBench.Reports.Tables;

/// <summary>The overview's decisions and the follow-up list as tables: what the meeting reads first.</summary>
public static partial class ReviewTables
{
    /// <summary>The factor to use next harvest, pooled then per strain, at the typical starting sugar (empty without a recommendation).</summary>
    public static ReportTable Factors(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var f = review.Overview.Factors;
        string at = f is null ? string.Empty : " " + f.ReferenceBrix.ToString("0.0", CultureInfo.InvariantCulture) + " °Brix";
        IReadOnlyList<Column<FactorChoice>> columns =
        [
            new("strain", "Strain", CellKind.Text, c => StrainName(c.Strain)),
            new("factor", "Factor (% v/v per °Brix)", CellKind.Number, c => c.Factor, "0.000"),
            new("predicted_abv", "Alcohol from" + at + " (% v/v)", CellKind.Number, c => c.Estimate.Predicted, "0.00"),
            new("low_80", "80 % of lots: low (% v/v)", CellKind.Number, c => c.Estimate.Low80, "0.00"),
            new("high_80", "80 % of lots: high (% v/v)", CellKind.Number, c => c.Estimate.High80, "0.00"),
            new("low_95", "95 % of lots: low (% v/v)", CellKind.Number, c => c.Estimate.Low95, "0.00"),
            new("high_95", "95 % of lots: high (% v/v)", CellKind.Number, c => c.Estimate.High95, "0.00"),
            new("held_out_error_abv", $"Error on held-out {ReportTexts.HeldOut(review.HouseFactor.PrimaryScheme)} (% v/v)", CellKind.Number, c => c.HeldOutMae, "0.00"),
            new("lots", "Held-out lots scored", CellKind.Integer, c => c.ScoredAlone ? c.Lots : null),
            new("ranges_from", "Ranges from", CellKind.Text, c => c.RangesFrom),
            new("candidate", "How the factor is worked out", CellKind.Text, c => c.Candidate),
        ];
        return ReportTable.Of(columns, f is null ? [] : f.Strains.Prepend(f.Pooled));
    }

    /// <summary>The strains ranked by alcohol from the same starting sugar, with the interval of each factor.</summary>
    public static ReportTable StrainsCompared(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var s = review.Overview.Strains;
        string at = s.ReferenceBrix.ToString("0.0", CultureInfo.InvariantCulture) + " °Brix";
        IReadOnlyList<Column<RankedStrain>> columns =
        [
            new("strain", "Strain", CellKind.Text, r => r.Strain),
            new("factor", s.Adjusted ? "Factor at " + at + " (% v/v per °Brix)" : "Median factor (% v/v per °Brix)", CellKind.Number, r => r.Adjusted?.Factor ?? r.RawMedian, "0.000"),
            new("low", "Factor's 95 % interval: low", CellKind.Number, r => r.Adjusted?.FactorInterval.Low ?? double.NaN, "0.000"),
            new("high", "Factor's 95 % interval: high", CellKind.Number, r => r.Adjusted?.FactorInterval.High ?? double.NaN, "0.000"),
            new("predicted_abv", "Alcohol from " + at + " (% v/v)", CellKind.Number, r => r.Adjusted?.PredictedAbv ?? double.NaN, "0.00"),
            new("lots", "Lots", CellKind.Integer, r => r.Lots),
        ];
        return ReportTable.Of(columns, s.Ranking);
    }

    private static IReadOnlyList<Column<LotFinding>> FindingTable { get; } =
    [
        new("severity", "How sure", CellKind.Text, f => ReviewTexts.Severity(f.Severity)),
        new("lot_id", "Lot", CellKind.Text, f => f.Key.LotId),
        new("season", "Season", CellKind.Integer, f => f.Key.Season),
        new("strain", "Strain", CellKind.Text, f => f.Strain),
        new("seen", "What was seen", CellKind.Text, f => f.Seen),
        new("explanation", "Most likely", CellKind.Text, f => f.Explanation),
        new("otherwise", "Less likely", CellKind.Text, f => f.Otherwise),
        new("follow_up", "What to do", CellKind.Text, f => f.FollowUp),
        new("flags", "Flags", CellKind.Text, f => string.Join("; ", f.Flags)),
    ];

    /// <summary>Columns of data/follow-up.csv and the Follow-up sheet: one row per lot to look at.</summary>
    public static IReadOnlyList<ReportColumn> FindingColumns => FindingTable.Select(c => c.Definition).ToArray();

    /// <summary>One row per lot to look at, most serious first: what was seen, the likely explanation, what to do.</summary>
    public static ReportTable Findings(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        return ReportTable.Of(FindingTable, review.Findings, f => f.Severity == FlagSeverity.LikelyError);
    }

    /// <summary>The lots to look at in short (the overview's first screen): lot, strain, how sure, most likely, what to do.</summary>
    public static ReportTable FindingsInShort(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        string[] keep = ["severity", "lot_id", "strain", "explanation", "follow_up"];
        return ReportTable.Of(FindingTable.Where(c => keep.Contains(c.Definition.Name)).ToArray(), review.Findings, f => f.Severity == FlagSeverity.LikelyError);
    }

    /// <summary>
    /// Strain-level notes of the follow-up list (a strain that converted differently in one season), in the columns of
    /// <see cref="Findings"/>, so the Follow-up sheet's two tables share their columns' widths.
    /// </summary>
    public static ReportTable StrainNotes(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        IReadOnlyList<Column<LotFlag>> columns =
        [
            new("severity", "How sure", CellKind.Text, f => ReviewTexts.Severity(f.Severity)),
            new("lot_id", "Lot", CellKind.Text, _ => "all its lots"),
            new("season", "Season", CellKind.Integer, f => f.Season),
            new("strain", "Strain", CellKind.Text, f => f.Strain),
            new("seen", "What was seen", CellKind.Text, f => f.Reason),
            new("explanation", "Most likely", CellKind.Text, _ => null),
            new("otherwise", "Less likely", CellKind.Text, _ => null),
            new("follow_up", "What to do", CellKind.Text, f => f.FollowUp),
            new("flags", "Flags", CellKind.Text, f => ReviewTexts.FlagName(f.Code)),
        ];
        return ReportTable.Of(columns, review.Strains.Flags.Where(f => f.LotKey is null));
    }

    /// <summary>How each strain fermented, from its lots with a log.</summary>
    public static ReportTable Ferments(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        IReadOnlyList<Column<StrainFerments>> columns =
        [
            new("strain", "Strain", CellKind.Text, s => s.Strain),
            new("lots_with_log", "Lots with a log", CellKind.Integer, s => s.Lots),
            new("days_to_dry", "Days to dry (median)", CellKind.Number, s => s.DaysToDry.Median, "0.0"),
            new("peak_temp_c", "Peak temperature (median, °C)", CellKind.Number, s => s.PeakTemperatureC.Median, "0.0"),
            new("troubled", "Stuck, sluggish or not dry", CellKind.Integer, s => s.Troubled),
            new("troubled_share", "Share troubled", CellKind.Share, s => s.TroubledShare, "0%"),
        ];
        return ReportTable.Of(TemperatureColumns.In(columns, review.Settings.TemperatureUnit), review.Overview.Ferments);
    }
}
