using System.Globalization;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
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
        int leftOut = inputs.Issues.Count(i => i.Severity == IssueSeverity.Error && i.Row is not null);
        int filesLeftOut = inputs.Issues.Count(i => i.Severity == IssueSeverity.Error && i.Row is null);
        string seasons = inputs.Seasons.Count == 0 ? "no season" : string.Join(", ", inputs.Seasons);
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
        var shrunk = h.Candidates.FirstOrDefault(c => c.Id == "strain-shrunk")?.FullFit;
        if (shrunk is { Strains.Count: > 0 })
        {
            lines.Add("Strains by conversion (per-strain factor shrunk toward the pooled one, % v/v per °Brix):");
            int rank = 1;
            foreach (var s in shrunk.Strains.OrderByDescending(s => s.SlopePerBrix).ThenBy(s => s.Strain, StringComparer.Ordinal))
            {
                lines.Add($"  {rank++}. {s.Strain}  {F(s.SlopePerBrix, "0.0000")}  ({s.Lots} lots)");
            }
        }

        if (h.Overall is { } rec)
        {
            string name = h.Candidates.FirstOrDefault(c => c.Id == rec.CandidateId)?.Name ?? rec.CandidateId;
            lines.Add($"House factor: {name}; backtest ({ReviewTables.SchemeName(h.PrimaryScheme)}) mean absolute error {F(rec.Metrics.Mae, "0.00")} % v/v, "
                + $"{F(rec.Metrics.ShareWithinTolerance * 100, "0")} % of lots within the {h.Regime.Name} tolerance.");
            if (double.IsFinite(rec.ErrorBand80.Low))
            {
                lines.Add($"  80 % of lots came out between {F(rec.ErrorBand80.Low, "+0.00;-0.00")} and {F(rec.ErrorBand80.High, "+0.00;-0.00")} % v/v of the prediction"
                    + (double.IsFinite(rec.ErrorBand95.Low) ? $"; 95 % between {F(rec.ErrorBand95.Low, "+0.00;-0.00")} and {F(rec.ErrorBand95.High, "+0.00;-0.00")}." : "."));
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

        var flagged = review.Lots.Select(l => (Lot: l, Flags: ReviewTables.LotFlags(review, l))).Where(x => x.Flags.Count > 0).ToArray();
        if (flagged.Length == 0)
        {
            lines.Add("Flagged lots: none.");
        }
        else
        {
            var byCode = flagged.SelectMany(x => x.Flags).GroupBy(c => c, StringComparer.Ordinal)
                .OrderByDescending(g => g.Count()).ThenBy(g => g.Key, StringComparer.Ordinal)
                .Select(g => $"{g.Key} {g.Count()}");
            lines.Add($"Flagged lots: {flagged.Length} ({string.Join(", ", byCode)}); they are highlighted on the Lots sheet.");
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
