using System.Globalization;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Review.Strains;
using YieldBench.Reports.Tables;

namespace YieldBench.Reports;

/// <summary>The short console summary of a review, as plain lines (the command prints them).</summary>
public static class ConsoleSummary
{
    /// <summary>The summary lines: lots used and left out, strains ranked, recommendation, flagged lots, where the files went, cautions.</summary>
    public static IReadOnlyList<string> Lines(ReviewResult review, ReportOutput output)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(output);
        var lines = new List<string>();
        var inputs = review.Inputs;
        int leftOut = ReviewTables.RowsLeftOut(review);
        int filesLeftOut = inputs.Issues.Count(i => i.Severity == IssueSeverity.Error && i.Row is null);
        // Seasons come from the lots, so with no usable lot there is no season to name (logs alone give none).
        string seasons = review.Lots.Count == 0 ? "no usable lot rows" : inputs.Seasons.Count == 0 ? "no season" : string.Join(", ", inputs.Seasons);
        lines.Add($"Lots used: {review.Lots.Count} ({seasons}) from {inputs.Files.Count} file(s); fermentation logs: {inputs.Logs.Count}.");
        if (inputs.Issues.Count > 0)
        {
            lines.Add($"Left out: {leftOut} row(s){(filesLeftOut > 0 ? $" and {filesLeftOut} file or sheet problem(s)" : string.Empty)}; {inputs.Issues.Count} intake issue(s) in total, each with its fix, in {ReportWriter.DataFiles.IntakeIssues}.");
        }
        else
        {
            lines.Add("Left out: nothing; every row was used or was a blank or summary row.");
        }

        var h = review.HouseFactor;
        var comparison = review.Strains.Comparison;
        var ranked = ReviewTables.RankedStrains(review);
        if (ranked.Count > 0)
        {
            bool adjusted = comparison.Adjusted.Count > 0;
            lines.Add(adjusted
                ? $"Strains ranked by conversion adjusted to {F(comparison.ReferenceBrix, "0.0")} °Brix (% v/v per °Brix, 95 % interval):"
                : $"Strains ranked by raw median {comparison.Measure} (the adjusted comparison could not be fitted):");
            int rank = 1;
            foreach (var (strain, raw, adj) in ranked)
            {
                lines.Add(adj is null
                    ? $"  {rank++}. {strain}  {F(raw, "0.0000")}"
                    : $"  {rank++}. {strain}  {F(adj.Factor, "0.0000")}  ({F(adj.FactorInterval.Low, "0.0000")} to {F(adj.FactorInterval.High, "0.0000")}); raw median {F(raw, "0.0000")}");
            }

            foreach (var sentence in comparison.Sentences.Take(2))
            {
                lines.Add("  " + sentence);
            }
        }

        if (h.Overall is { } rec)
        {
            string name = h.Candidates.FirstOrDefault(c => c.Id == rec.CandidateId)?.Name ?? rec.CandidateId;
            lines.Add($"House factor: {name}; backtest ({ReviewTables.SchemeName(h.PrimaryScheme)}) mean absolute error {F(rec.Metrics.Mae, "0.00")} % v/v, "
                + $"{F(rec.Metrics.ShareWithinTolerance * 100, "0")} % of lots within the {h.Regime.Name} tolerance.");
            if (double.IsFinite(rec.ErrorBand80.Low))
            {
                lines.Add($"  A lot of a new season should come out between {F(rec.ErrorBand80.Low, "+0.00;-0.00")} and {F(rec.ErrorBand80.High, "+0.00;-0.00")} % v/v of the prediction with 80 % confidence"
                    + (double.IsFinite(rec.ErrorBand95.Low) ? $", between {F(rec.ErrorBand95.Low, "+0.00;-0.00")} and {F(rec.ErrorBand95.High, "+0.00;-0.00")} with 95 %" : string.Empty)
                    + (h.Coverage is { } c ? $" (on seasons held out, the planner's intervals held {F(c.Total.Share80 * 100, "0.0")} % and {F(c.Total.Share95 * 100, "0.0")} % of lots)." : "."));
            }

            foreach (var s in h.ByStrain)
            {
                string sname = h.Candidates.FirstOrDefault(c => c.Id == s.CandidateId)?.Name ?? s.CandidateId;
                lines.Add($"  {s.Strain}: {sname}, mean absolute error {F(s.Metrics.Mae, "0.00")} % v/v ({s.Lots} lots).");
            }
        }
        else
        {
            lines.Add("House factor: no recommendation. " + string.Join(" ", h.Explanation));
        }

        var flags = review.Strains.Flags;
        var bySeverity = new[] { FlagSeverity.LikelyError, FlagSeverity.Check, FlagSeverity.Note }
            .Select(sev => (Severity: sev, Lots: review.Lots.Count(l => ReviewTables.LotSeverity(review, l) == sev)))
            .ToArray();
        int flaggedLots = bySeverity.Sum(x => x.Lots);
        if (flaggedLots == 0)
        {
            lines.Add("Lots to look at: none flagged.");
        }
        else
        {
            lines.Add($"Lots to look at: {flaggedLots} flagged (strain review and kinetics) — by worst flag: {string.Join(", ", bySeverity.Select(x => $"{ReviewTables.SeverityName(x.Severity)} {x.Lots}"))}; reasons and follow-ups on the Follow-up sheet and in {ReportWriter.DataFiles.Flags}{(review.Kinetics is null ? string.Empty : " and " + ReportWriter.DataFiles.Kinetics)}.");
            foreach (var f in flags.Where(f => f.Severity == FlagSeverity.LikelyError).Take(5))
            {
                lines.Add($"  {f.Season}/{f.LotId ?? f.Strain} {f.Code}: {f.Reason}");
            }
        }

        if (review.Kinetics is { } k)
        {
            var kflags = k.Lots.SelectMany(x => x.Flags).GroupBy(c => c, StringComparer.Ordinal)
                .OrderByDescending(g => g.Count()).ThenBy(g => g.Key, StringComparer.Ordinal).Select(g => $"{g.Key} {g.Count()}").ToArray();
            lines.Add($"Kinetics: {k.Lots.Count} lots with a log; {k.Lots.Count(x => x.Flagged)} flagged{(kflags.Length > 0 ? " (" + string.Join(", ", kflags) + ")" : string.Empty)}.");
        }

        lines.Add($"Files: {output.Files.Count} written to {output.Folder} (open {ReportWriter.WorkbookName}).");
        if (output.Removed.Count > 0)
        {
            lines.Add($"Removed {output.Removed.Count} file(s) of an earlier run that this run no longer makes.");
        }

        lines.Add("Cautions:");
        lines.AddRange(ReportTexts.Cautions.Select(c => "  - " + c));
        return lines;
    }

    private static string F(double v, string format) => double.IsFinite(v) ? v.ToString(format, CultureInfo.InvariantCulture) : "n/a";
}
