using System.Globalization;
using YieldBench.Core.Review;
using YieldBench.Reports.Output;

namespace YieldBench.Reports;

/// <summary>The short console summary of a review, as plain lines (the command prints them): the review's overview, worded for a terminal.</summary>
public static class ConsoleSummary
{
    /// <summary>The summary lines: lots used and left out, strains ranked, recommendation, flagged lots, where the files went, cautions.</summary>
    public static IReadOnlyList<string> Lines(ReviewResult review, ReportOutput output)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(output);
        var o = review.Overview;
        var lines = new List<string>();
        var inputs = o.Inputs;
        // Seasons come from the lots, so with no usable lot there is no season to name (logs alone give none).
        string seasons = inputs.LotsUsed == 0 ? "no usable lot rows" : inputs.Seasons.Count == 0 ? "no season" : string.Join(", ", inputs.Seasons);
        lines.Add($"Lots used: {inputs.LotsUsed} ({seasons}) from {inputs.Files} file(s); fermentation logs: {inputs.Logs}.");
        if (inputs.Issues > 0)
        {
            lines.Add($"Left out: {inputs.RowsLeftOut} row(s){(inputs.FileProblems > 0 ? $" and {inputs.FileProblems} file or sheet problem(s)" : string.Empty)}; {inputs.Issues} intake issue(s) in total, each with its fix, in {ReportWriter.DataFiles.IntakeIssues}.");
        }
        else
        {
            lines.Add("Left out: nothing; every row was used or was a blank or summary row.");
        }

        var strains = o.Strains;
        if (strains.Ranking.Count > 0)
        {
            lines.Add(strains.Adjusted
                ? $"Strains ranked by conversion adjusted to {F(strains.ReferenceBrix, "0.0")} °Brix (% v/v per °Brix, 95 % interval):"
                : $"Strains ranked by raw median {strains.Measure} (the adjusted comparison could not be fitted):");
            int rank = 1;
            foreach (var s in strains.Ranking)
            {
                lines.Add(s.Adjusted is not { } adj
                    ? $"  {rank++}. {s.Strain}  {F(s.RawMedian, "0.0000")}"
                    : $"  {rank++}. {s.Strain}  {F(adj.Factor, "0.0000")}  ({F(adj.FactorInterval.Low, "0.0000")} to {F(adj.FactorInterval.High, "0.0000")}); raw median {F(s.RawMedian, "0.0000")}");
            }

            foreach (var sentence in strains.Sentences.Take(2))
            {
                lines.Add("  " + sentence);
            }
        }

        if (o.HouseFactor is { } h)
        {
            lines.Add($"House factor: {h.Candidate}; backtest ({h.Scheme}) mean absolute error {F(h.Mae, "0.00")} % v/v, "
                + $"{F(h.ShareWithinTolerance * 100, "0")} % of lots within the {h.Regime} tolerance.");
            if (double.IsFinite(h.Band80.Low))
            {
                lines.Add($"  A lot of a new season should come out between {F(h.Band80.Low, "+0.00;-0.00")} and {F(h.Band80.High, "+0.00;-0.00")} % v/v of the prediction with 80 % confidence"
                    + (double.IsFinite(h.Band95.Low) ? $", between {F(h.Band95.Low, "+0.00;-0.00")} and {F(h.Band95.High, "+0.00;-0.00")} with 95 %." : "."));
            }

            foreach (var s in h.ByStrain)
            {
                lines.Add($"  {s.Strain}: {s.Candidate}, mean absolute error {F(s.Mae, "0.00")} % v/v ({s.Lots} lots).");
            }
        }
        else
        {
            lines.Add("House factor: no recommendation. " + string.Join(" ", o.NoRecommendation));
        }

        var lots = o.Lots;
        if (lots.Flagged == 0)
        {
            lines.Add("Lots to look at: none flagged.");
        }
        else
        {
            lines.Add($"Lots to look at: {lots.Flagged} flagged (strain review and kinetics) — by worst flag: {string.Join(", ", lots.ByWorstSeverity.Select(x => $"{ReviewTexts.Severity(x.Severity)} {x.Lots}"))}; reasons and follow-ups on the Follow-up sheet and in {ReportWriter.DataFiles.Flags}{(o.Kinetics is null ? string.Empty : " and " + ReportWriter.DataFiles.Kinetics)}.");
            foreach (var f in lots.LikelyErrors.Take(5))
            {
                lines.Add($"  {f.Season}/{f.LotId ?? f.Strain} {f.Code}: {f.Reason}");
            }
        }

        if (o.Kinetics is { } k)
        {
            var kflags = k.Flags.Select(c => $"{c.Code} {c.Lots}").ToArray();
            lines.Add($"Kinetics: {k.LotsWithLog} lots with a log; {k.Flagged} flagged{(kflags.Length > 0 ? " (" + string.Join(", ", kflags) + ")" : string.Empty)}.");
        }

        lines.Add($"Files: {output.Files.Count} written to {output.Folder} (open {ReportWriter.WorkbookName}).");
        if (output.Removed.Count > 0)
        {
            lines.Add($"Removed {output.Removed.Count} file(s) of an earlier run that this run no longer makes.");
        }

        lines.Add("Cautions:");
        lines.AddRange(o.Cautions.Select(c => "  - " + c));
        return lines;
    }

    private static string F(double v, string format) => double.IsFinite(v) ? v.ToString(format, CultureInfo.InvariantCulture) : "n/a";
}
