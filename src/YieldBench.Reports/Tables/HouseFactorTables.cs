using YieldBench.Core.HouseFactor;
using YieldBench.Core.Review;

namespace YieldBench.Reports.Tables;

/// <summary>The house-factor section as tables: every candidate, the recommendations and the planner.</summary>
public static partial class ReviewTables
{
    /// <summary>One backtest of one candidate (a row of the candidates table).</summary>
    private sealed record CandidateBacktest(CandidateResult Candidate, BacktestScheme Scheme, BacktestMetrics Metrics, bool Recommended);

    private static IReadOnlyList<Column<CandidateBacktest>> CandidateTable { get; } =
    [
        new("candidate", "Candidate", CellKind.Text, r => r.Candidate.Name),
        new("description", "What it does", CellKind.Text, r => r.Candidate.Description),
        new("simplicity_rank", "Simplicity rank", CellKind.Integer, r => r.Candidate.Complexity),
        new("backtest", "Backtest", CellKind.Text, r => ReviewTexts.Scheme(r.Scheme)),
        new("lots", "Lots", CellKind.Integer, r => r.Metrics.Lots),
        new("mae_abv", "Mean absolute error (% v/v)", CellKind.Number, r => r.Metrics.Mae, "0.000"),
        new("mae_se_abv", "Standard error of MAE", CellKind.Number, r => r.Metrics.MaeStandardError, "0.000"),
        new("bias_abv", "Bias, predicted − actual (% v/v)", CellKind.Number, r => r.Metrics.Bias, "+0.000;-0.000;0.000"),
        new("rmse_abv", "RMSE (% v/v)", CellKind.Number, r => r.Metrics.Rmse, "0.000"),
        new("p90_abs_error_abv", "90th percentile |error| (% v/v)", CellKind.Number, r => r.Metrics.P90AbsoluteError, "0.000"),
        new("share_within_tolerance", "Within label tolerance", CellKind.Share, r => r.Metrics.ShareWithinTolerance),
        new("share_wrong_side", "Wrong side of threshold", CellKind.Share, r => r.Metrics.ShareWrongSideOfThreshold),
        new("recommended", "Recommended", CellKind.Boolean, r => r.Recommended),
    ];

    /// <summary>Every house-factor candidate with both backtests; the recommended one's primary backtest is highlighted.</summary>
    public static ReportTable HouseCandidates(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var h = review.HouseFactor;
        string? chosen = h.Overall?.CandidateId;
        var rows = h.Candidates.SelectMany(c =>
            (c.BySeason is null ? [] : new[] { (BacktestScheme.LeaveOneSeasonOut, c.BySeason) })
                .Append((c.ByLotScheme, c.ByLot))
                .Select(b => new CandidateBacktest(c, b.Item1, b.Item2, c.Id == chosen && b.Item2 == c.Primary)));
        return ReportTable.Of(CandidateTable, rows, r => r.Recommended);
    }

    /// <summary>A recommendation with its candidates' plain names.</summary>
    private sealed record NamedRecommendation(Recommendation Recommendation, string Candidate, string Best);

    private static IReadOnlyList<Column<NamedRecommendation>> RecommendationTable { get; } =
    [
        new("strain", "Strain", CellKind.Text, r => StrainName(r.Recommendation.Strain)),
        new("lots", "Lots", CellKind.Integer, r => r.Recommendation.Lots),
        new("candidate", "Recommended", CellKind.Text, r => r.Candidate),
        new("factor_abv_per_brix", "Factor (% v/v per °Brix)", CellKind.Number, r => r.Recommendation.Factor, "0.0000"),
        new("reference_brix", "At starting sugar (°Brix)", CellKind.Number, r => r.Recommendation.ReferenceBrix, "0.0"),
        new("best_candidate", "Lowest error", CellKind.Text, r => r.Best),
        new("mae_abv", "Mean absolute error (% v/v)", CellKind.Number, r => r.Recommendation.Metrics.Mae, "0.000"),
        new("mae_limit_abv", "Best MAE + 1 SE (% v/v)", CellKind.Number, r => r.Recommendation.MaeLimit, "0.000"),
        new("error_80_low_abv", "80 % band low (% v/v)", CellKind.Number, r => r.Recommendation.ErrorBand80.Low, "+0.00;-0.00;0.00"),
        new("error_80_high_abv", "80 % band high (% v/v)", CellKind.Number, r => r.Recommendation.ErrorBand80.High, "+0.00;-0.00;0.00"),
        new("error_95_low_abv", "95 % band low (% v/v)", CellKind.Number, r => r.Recommendation.ErrorBand95.Low, "+0.00;-0.00;0.00"),
        new("error_95_high_abv", "95 % band high (% v/v)", CellKind.Number, r => r.Recommendation.ErrorBand95.High, "+0.00;-0.00;0.00"),
        new("share_within_tolerance", "Within label tolerance", CellKind.Share, r => r.Recommendation.Metrics.ShareWithinTolerance),
    ];

    /// <summary>The recommendation overall and per strain (why each was chosen is in the house factor's explanation sentences, which the sheet shows above the table).</summary>
    public static ReportTable Recommendations(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var h = review.HouseFactor;
        var names = h.Candidates.ToDictionary(c => c.Id, c => c.Name, StringComparer.Ordinal);
        var rows = (h.Overall is null ? [] : new[] { h.Overall }).Concat(h.ByStrain)
            .Select(r => new NamedRecommendation(r, names.GetValueOrDefault(r.CandidateId, r.CandidateId), names.GetValueOrDefault(r.BestCandidateId, r.BestCandidateId)));
        return ReportTable.Of(RecommendationTable, rows);
    }

    /// <summary>
    /// The recommendation overall and per strain in both versions of the house factor: with the lots flagged as likely
    /// errors or not dry left out, and with them included (the version in use first).
    /// </summary>
    public static ReportTable HouseFactorVersions(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var table = new ReportTable(
        [
            new("flagged_lots", "Flagged lots", CellKind.Text),
            new("in_use", "In use", CellKind.Boolean),
            new("strain", "Strain", CellKind.Text),
            new("lots", "Lots", CellKind.Integer),
            new("candidate", "Recommended", CellKind.Text),
            new("mae_abv", "Mean absolute error (% v/v)", CellKind.Number, "0.000"),
            new("error_80_low_abv", "80 % band low (% v/v)", CellKind.Number, "+0.00;-0.00;0.00"),
            new("error_80_high_abv", "80 % band high (% v/v)", CellKind.Number, "+0.00;-0.00;0.00"),
            new("error_95_low_abv", "95 % band low (% v/v)", CellKind.Number, "+0.00;-0.00;0.00"),
            new("error_95_high_abv", "95 % band high (% v/v)", CellKind.Number, "+0.00;-0.00;0.00"),
            new("share_within_tolerance", "Within label tolerance", CellKind.Share),
        ]);
        var h = review.HouseFactor;
        var names = h.Candidates.ToDictionary(c => c.Id, c => c.Name, StringComparer.Ordinal);
        foreach (var (version, inUse) in new[] { (h, true), (h.OtherVersion, false) })
        {
            if (version is null)
            {
                continue;
            }

            string which = version.FlaggedLotsIncluded ? "included" : "left out";
            foreach (var r in (version.Overall is null ? [] : new[] { version.Overall }).Concat(version.ByStrain))
            {
                table.Add(
                [
                    which, inUse, StrainName(r.Strain), r.Lots, names.GetValueOrDefault(r.CandidateId, r.CandidateId), r.Metrics.Mae,
                    r.ErrorBand80.Low, r.ErrorBand80.High, r.ErrorBand95.Low, r.ErrorBand95.High, r.Metrics.ShareWithinTolerance,
                ],
                highlight: inUse && r.Strain == "*");
            }
        }

        return table;
    }

    /// <summary>The lots flagged as likely errors or not dry, which the house factor leaves out unless a setting includes them.</summary>
    public static ReportTable HouseFactorFlaggedLots(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var table = new ReportTable(
        [
            new("season", "Season", CellKind.Integer),
            new("lot_id", "Lot", CellKind.Text),
            new("strain", "Strain", CellKind.Text),
            new("codes", "Flags", CellKind.Text),
            new("reason", "Why", CellKind.Text),
        ]);
        foreach (var f in review.HouseFactor.FlaggedLots)
        {
            table.Add([f.Season, f.LotId, f.Strain, string.Join(", ", f.Codes), f.Reason]);
        }

        return table;
    }

    private static IReadOnlyList<Column<SeasonCoverageRow>> CoverageTable { get; } =
    [
        new("season_held_out", "Season held out", CellKind.Text, r => r.Season == 0 ? "all seasons" : r.Season.ToString(System.Globalization.CultureInfo.InvariantCulture)),
        new("lots", "Lots", CellKind.Integer, r => r.Lots),
        new("share_in_80", "Inside the planner's 80 % interval", CellKind.Share, r => r.Share80),
        new("share_in_95", "Inside the planner's 95 % interval", CellKind.Share, r => r.Share95),
        new("share_in_overall_80", "Inside the overall 80 % band", CellKind.Share, r => r.OverallShare80),
        new("share_in_overall_95", "Inside the overall 95 % band", CellKind.Share, r => r.OverallShare95),
    ];

    /// <summary>Interval coverage by nested leave-one-season-out: one row per season held out, then all together (highlighted).</summary>
    public static ReportTable IntervalCoverage(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var c = review.HouseFactor.Coverage;
        return ReportTable.Of(CoverageTable, c is null ? [] : c.Seasons.Append(c.Total), r => r.Season == 0);
    }

    private static IReadOnlyList<Column<ThresholdAnswer>> PlannerTable { get; } =
    [
        new("strain", "Strain", CellKind.Text, t => StrainName(t.Strain)),
        new("target_abv", "Keep alcohol under (% v/v)", CellKind.Number, t => t.TargetAbv, "0.0"),
        new("confidence", "With confidence", CellKind.Share, t => t.Confidence, "0%"),
        new("highest_brix", "Pick at or below (°Brix)", CellKind.Number, t => t.PickAtOrBelowBrix, "0.0"),
        new("error_allowance_abv", "Allowance for error (% v/v)", CellKind.Number, t => t.ErrorAllowance, "0.00"),
        new("note", "Note", CellKind.Text, t => t.Note),
    ];

    /// <summary>The planner table: highest harvest sugar under each target at each confidence.</summary>
    public static ReportTable Planner(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        return ReportTable.Of(PlannerTable, review.HouseFactor.PlannerTable);
    }

    /// <summary>
    /// The planner table as the sheet shows it: one row per strain and confidence, one column per target alcohol, each
    /// cell the highest harvest sugar (°Brix) that keeps the predicted alcohol under that target (the long table of
    /// <see cref="Planner"/> is the same answers, one per row, as data/house-factor.json holds them).
    /// </summary>
    public static ReportTable PlannerByTarget(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var answers = review.HouseFactor.PlannerTable;
        var targets = answers.Select(a => a.TargetAbv).Distinct().Order().ToArray();
        var columns = new List<ReportColumn>
        {
            new("strain", "Strain", CellKind.Text),
            new("confidence", "With confidence", CellKind.Share, "0%"),
            new("error_allowance_abv", "Allowance for error (% v/v)", CellKind.Number, "0.00"),
        };
        columns.AddRange(targets.Select(t => new ReportColumn(
            "highest_brix_under_" + t.ToString("0.0", System.Globalization.CultureInfo.InvariantCulture),
            "Under " + t.ToString("0.0", System.Globalization.CultureInfo.InvariantCulture) + " % v/v (°Brix)",
            CellKind.Number,
            "0.0")));
        columns.Add(new("note", "Note", CellKind.Text));
        var table = new ReportTable(columns);
        foreach (var row in answers.GroupBy(a => (a.Strain, a.Confidence)))
        {
            var byTarget = row.ToDictionary(a => a.TargetAbv);
            object?[] cells =
            [
                StrainName(row.Key.Strain), row.Key.Confidence, Allowance(row),
                .. targets.Select(t => (object?)(byTarget.TryGetValue(t, out var a) ? a.PickAtOrBelowBrix : double.NaN)),
                string.Join(" ", row.Select(a => a.Note).Where(n => !string.IsNullOrEmpty(n)).Distinct(StringComparer.Ordinal)),
            ];
            table.Add(cells);
        }

        return table;
    }

    // The row's error allowance when it is the same for every target (it is: the season-aware error quantile does not
    // depend on the target), else empty rather than one target's value under every target.
    private static double Allowance(IEnumerable<ThresholdAnswer> answers)
    {
        var values = answers.Select(a => a.ErrorAllowance).ToArray();
        return values.Max() - values.Min() <= 1e-9 ? values[0] : double.NaN;
    }

    /// <summary>A strain as the house-factor tables name it (<c>*</c> is all lots).</summary>
    private static string StrainName(string strain) => strain == "*" ? "all lots" : strain;
}
