using System.Globalization;
using YieldBench.Core.Review;
using YieldBench.Core.Units;
using YieldBench.Reports.Output;

namespace YieldBench.Reports;

/// <summary>
/// The console summary of a review, as plain lines of at most <see cref="Width"/> characters: the review's overview,
/// decisions first — the factor to use, the strains compared, the lots to look at, how the strains fermented — then
/// what was read, where the files went and the cautions.
/// </summary>
public static class ConsoleSummary
{
    /// <summary>Longest line, in characters (a terminal of 100 columns).</summary>
    public const int Width = 100;

    /// <summary>Lots listed one line each before the rest are left to the Follow-up sheet.</summary>
    public const int LotLines = 12;

    /// <summary>The summary lines.</summary>
    public static IReadOnlyList<string> Lines(ReviewResult review, ReportOutput output)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(output);
        var o = review.Overview;
        var lines = new List<string>();
        void Say(string text, int indent = 0) => lines.AddRange(Wrap(text, indent));

        Say(o.Title);
        if (o.Factors is { } factors)
        {
            Say($"Conversion factor for next harvest, shown at {F(factors.ReferenceBrix, "0.0")} °Brix (the median starting sugar of the lots compared):");
            foreach (var f in factors.Strains.Prepend(factors.Pooled))
            {
                var e = f.Estimate;
                Say($"{(f.Strain == "*" ? "all lots" : f.Strain)}: {F(f.Factor, "0.000")} % v/v per °Brix → {F(e.Predicted, "0.00")} % v/v; "
                    + $"80 % of lots {Range(e.Low80, e.High80)}, 95 % {Range(e.Low95, e.High95)}; "
                    + (f.ScoredAlone ? $"held-out error {F(f.HeldOutMae, "0.00")} % v/v ({f.Lots} lots)" : $"ranges from {f.RangesFrom}")
                    + $"; method: {f.Candidate}.", 2);
            }
        }
        else
        {
            Say("Conversion factor: no recommendation. " + string.Join(" ", o.NoRecommendation));
        }

        if (o.HouseFactor is { } h)
        {
            Say($"Held out {h.Scheme}, {F(h.ShareWithinTolerance * 100, "0")} % of lots came within the {h.Regime} tolerance of the prediction.", 2);
        }

        var strains = o.Strains;
        if (strains.Ranking.Count > 0)
        {
            string values = string.Join(", ", strains.Ranking.Select(s => $"{s.Strain} {F(s.Adjusted?.Factor ?? s.RawMedian, "0.000")}"));
            Say(strains.Ranking.Count == 1
                ? strains.LeftOut.Count == 0
                    ? $"One strain only: {values} % v/v per °Brix; there is no other strain to compare it with."
                    : $"One strain with enough lots to compare: {values} % v/v per °Brix; there is no other strain to compare it with."
                : strains.Adjusted
                ? $"Strains, best first, adjusted to the same starting sugar (% v/v per °Brix): {values}."
                : $"Strains, best first, by raw median (the adjusted comparison could not be fitted): {values}.");
            foreach (string sentence in strains.Plain)
            {
                Say(sentence, 2);
            }
        }

        if (strains.LeftOutSentence is { } leftOut)
        {
            Say(strains.Ranking.Count == 0 ? "No strain had enough lots to compare: " + leftOut : leftOut, 2);
        }

        var lots = o.Lots;
        if (lots.Flagged == 0)
        {
            Say("Lots to look at: none.");
        }
        else
        {
            Say($"Lots to look at: {lots.Flagged} ({string.Join(", ", lots.ByWorstSeverity.Where(x => x.Lots > 0).Select(x => $"{ReviewTexts.Severity(x.Severity)} {x.Lots}"))}), one line each; all on the Follow-up sheet:");
            var findings = o.FlaggedLots.Select(l => l.Finding).OfType<LotFinding>().ToArray();
            foreach (var f in findings.Take(LotLines))
            {
                Say($"{f.Key} {f.Strain} ({ReviewTexts.Severity(f.Severity)}): {f.Seen} {f.Explanation} {f.FollowUp}", 2);
            }

            if (findings.Length > LotLines)
            {
                Say($"… and {findings.Length - LotLines} more on the Follow-up sheet.", 2);
            }
        }

        if (o.Ferments.Count > 0)
        {
            Say("How the strains fermented (lots with a log; median days to dry and peak temperature):");
            foreach (var s in o.Ferments)
            {
                Say($"{s.Strain}: dry in {F(s.DaysToDry.Median, "0.0")} days, peak {review.Settings.TemperatureUnit.Show(s.PeakTemperatureC.Median)}, {s.Troubled} of {s.Lots} troubled (stuck, sluggish or not dry; {F(s.TroubledShare * 100, "0")} %).", 2);
            }
        }

        var inputs = o.Inputs;
        // Seasons come from the lots, so with no usable lot there is no season to name (logs alone give none).
        string seasons = inputs.LotsUsed == 0 ? "no usable lot rows" : inputs.Seasons.Count == 0 ? "no season" : string.Join(", ", inputs.Seasons);
        Say($"Lots used: {inputs.LotsUsed} ({seasons}) from {inputs.Files} file(s); fermentation logs: {inputs.Logs}.");
        Say(inputs.Issues > 0
            ? $"Left out: {inputs.RowsLeftOut} row(s){(inputs.FileProblems > 0 ? $" and {inputs.FileProblems} file or sheet problem(s)" : string.Empty)}; {inputs.Issues} intake issue(s) in total, each with its fix, in {ReportWriter.DataFiles.IntakeIssues}."
            : "Left out: nothing; every row was used or was a blank or summary row.");
        Say($"Files: {output.Files.Count} written to {output.Folder} (open {ReportWriter.WorkbookName}).");
        if (output.Removed.Count > 0)
        {
            Say($"Removed {output.Removed.Count} file(s) of an earlier run that this run no longer makes.");
        }

        Say("Cautions:");
        foreach (string caution in o.Cautions)
        {
            Say("- " + caution, 2);
        }

        return lines;
    }

    /// <summary>Words of <paramref name="text"/> in lines of at most <see cref="Width"/> characters, each indented; later lines two more.</summary>
    internal static IEnumerable<string> Wrap(string text, int indent)
    {
        string pad = new(' ', indent), more = new(' ', indent + 2);
        var line = new System.Text.StringBuilder(pad);
        bool empty = true;
        foreach (string word in Words(text))
        {
            if (!empty && line.Length + 1 + word.Length > Width)
            {
                yield return line.ToString();
                line.Clear().Append(more);
                empty = true;
            }

            if (!empty)
            {
                line.Append(' ');
            }

            line.Append(word);
            empty = false;
        }

        if (!empty)
        {
            yield return line.ToString();
        }
    }

    /// <summary>
    /// The words of a line for wrapping: split at spaces, except that a unit or percent sign stays with the number
    /// before it ("95 %", "24.3 °Brix" never break across lines).
    /// </summary>
    public static IReadOnlyList<string> Words(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        var words = new List<string>();
        foreach (string word in text.Split(' ', StringSplitOptions.RemoveEmptyEntries))
        {
            if (words.Count > 0 && word[0] is '%' or '°' && words[^1].Length > 0 && char.IsDigit(words[^1][^1]))
            {
                words[^1] += " " + word;
            }
            else
            {
                words.Add(word);
            }
        }

        return words;
    }

    private static string Range(double low, double high) => double.IsFinite(low) && double.IsFinite(high) ? $"{F(low, "0.00")}–{F(high, "0.00")}" : "n/a (too few lots)";

    private static string F(double v, string format) => double.IsFinite(v) ? v.ToString(format, CultureInfo.InvariantCulture) : "n/a";
}
