using System.Text;
using YieldBench.Core.HouseFactor;
using YieldBench.Core.Review;
using YieldBench.Core.Units;
using static YieldBench.Reports.Html.HtmlText;

namespace YieldBench.Reports.Html;

/// <summary>
/// report.html: the review on one self-contained page for the meeting room, from the decision down. It lays out the
/// review's overview, per-lot view and figures and computes nothing. Styles, script and charts (inline SVG) are in the
/// file; a content security policy lets it fetch nothing. The lots table sorts and filters with a few lines of script,
/// and the page reads fully without it. Same review, same bytes: no clock, no random id.
/// </summary>
public static class HtmlReport
{
    /// <summary>File name in the output folder.</summary>
    public const string FileName = "report.html";

    /// <summary>The sections, in page order: anchor id and heading.</summary>
    public static IReadOnlyList<(string Id, string Heading)> Sections { get; } =
    [
        ("decisions", "The decisions"),
        ("strains", "The strains compared"),
        ("lots", "The lots to look at"),
        ("ferments", "How the ferments ran"),
        ("inputs", "The inputs"),
        ("methods", "Methods in brief"),
        ("cautions", "Cautions"),
    ];

    /// <summary>The page's text.</summary>
    public static string Render(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var o = review.Overview;
        var page = new StringBuilder(64 * 1024);
        string seasons = o.Inputs.Seasons.Count switch
        {
            0 => string.Empty,
            1 => $" in season {Count(o.Inputs.Seasons[0])}",
            // A run of consecutive seasons longer than three reads as its span ("in 10 seasons, 2016–2025").
            var n when n > 3 && o.Inputs.Seasons[^1] - o.Inputs.Seasons[0] == n - 1 => $" in {Count(n)} seasons, {Count(o.Inputs.Seasons[0])}–{Count(o.Inputs.Seasons[^1])}",
            _ => $" in seasons {string.Join(", ", o.Inputs.Seasons.Select(Count))}",
        };
        page.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
        page.Append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n");
        page.Append($"<meta http-equiv=\"Content-Security-Policy\" content=\"{HtmlAssets.ContentSecurityPolicy}\">\n");
        page.Append($"<meta name=\"generator\" content=\"YieldBench {Escape(review.ToolVersion)}\">\n");
        page.Append($"<title>{Escape(o.Title)}</title>\n");
        page.Append("<style>").Append(HtmlAssets.Css).Append("</style>\n</head>\n<body>\n");

        Header(page, review, seasons);
        page.Append("<main>\n");
        Decisions(page, review);
        Strains(page, review);
        Lots(page, review);
        Ferments(page, review);
        Inputs(page, review);
        Methods(page, review);
        Cautions(page, review);
        page.Append("</main>\n");
        page.Append($"<footer><p>Written by YieldBench {Escape(review.ToolVersion)} with seed {Count(review.Settings.Seed)}. The same inputs and settings give the same page; it holds no date or clock time.</p></footer>\n");
        page.Append("<script>").Append(HtmlAssets.Script).Append("</script>\n</body>\n</html>\n");
        return page.ToString();
    }

    private static void Header(StringBuilder page, ReviewResult review, string seasons)
    {
        var i = review.Overview.Inputs;
        page.Append("<header class=\"masthead\">\n");
        page.Append($"<h1>{Escape(review.Overview.Title)}</h1>\n");
        page.Append($"<p class=\"facts\">{Count(i.LotsUsed, "lot")} from {Count(i.Files, "file")}{seasons} · {(i.Logs == 0 ? "no fermentation log" : Count(i.Logs, "fermentation log"))} · {Escape(review.HouseFactor.Regime.Name)} label rules</p>\n");
        page.Append("<nav aria-label=\"Sections of this page\"><ol>");
        foreach (var (id, heading) in Sections)
        {
            page.Append($"<li><a href=\"#{id}\">{Escape(heading)}</a></li>");
        }

        page.Append("</ol></nav>\n</header>\n");
    }

    private static void Open(StringBuilder page, string id)
    {
        string heading = Sections.First(s => s.Id == id).Heading;
        page.Append($"<section id=\"{id}\" aria-labelledby=\"{id}-h\">\n<h2 id=\"{id}-h\">{Escape(heading)}</h2>\n");
    }

    private static void Close(StringBuilder page) => page.Append("</section>\n");

    private static void Decisions(StringBuilder page, ReviewResult review)
    {
        var o = review.Overview;
        Open(page, "decisions");
        if (o.Factors is not { } f || o.HouseFactor is not { } h)
        {
            page.Append("<p class=\"lead\">No conversion factor is recommended.</p>\n<ul>");
            foreach (string line in o.NoRecommendation)
            {
                page.Append($"<li>{Escape(line)}</li>");
            }

            page.Append("</ul>\n");
            Close(page);
            return;
        }

        string at = Number(f.ReferenceBrix, "0.0");
        page.Append($"<p class=\"lead\">Conversion factor to use next harvest, per strain and for all strains. At a typical starting sugar of {at} °Brix each factor predicts the alcohol shown; on held-out {ReportTexts.HeldOut(review.HouseFactor.PrimaryScheme)}, 80 % and 95 % of wines came out within the ranges beside it.</p>\n");
        page.Append("<div class=\"scroll\"><table class=\"numbers decisions\">\n");
        page.Append($"<caption>Conversion factor to use, with what it predicts at {at} °Brix</caption>\n");
        page.Append("<thead><tr><th scope=\"col\">Strain</th>");
        page.Append("<th scope=\"col\">Factor <span class=\"unit\">% v/v per °Brix</span></th>");
        page.Append($"<th scope=\"col\">Predicted at {at} °Brix <span class=\"unit\">% v/v</span></th>");
        page.Append("<th scope=\"col\">80 % of wines <span class=\"unit\">% v/v</span></th>");
        page.Append("<th scope=\"col\">95 % of wines <span class=\"unit\">% v/v</span></th>");
        page.Append("<th scope=\"col\">Held-out error <span class=\"unit\">mean, % v/v</span></th>");
        page.Append("<th scope=\"col\" class=\"text\">How it is worked out</th></tr></thead>\n<tbody>\n");
        foreach (var c in f.Strains.Prepend(f.Pooled))
        {
            string name = c.Strain == "*" ? "All strains" : c.Strain;
            page.Append($"<tr{(c.Strain == "*" ? " class=\"pooled\"" : string.Empty)}><th scope=\"row\">{Escape(name)}</th>");
            page.Append($"<td class=\"factor\">{Number(c.Factor, "0.0000")}</td>");
            page.Append($"<td>{Number(c.Estimate.Predicted, "0.00")}</td>");
            page.Append($"<td>{Range(c.Estimate.Low80, c.Estimate.High80)}</td>");
            page.Append($"<td>{Range(c.Estimate.Low95, c.Estimate.High95)}</td>");
            page.Append(c.ScoredAlone
                ? $"<td>{Number(c.HeldOutMae, "0.00")} <span class=\"unit\">({Count(c.Lots, "lot")})</span></td>"
                : $"<td class=\"text\"><span class=\"unit\">not scored alone; ranges from {Escape(c.RangesFrom)}</span></td>");
            page.Append($"<td class=\"text\">{Escape(c.Candidate)}{Formula(c)}</td></tr>\n");
        }

        page.Append("</tbody></table></div>\n");
        page.Append($"<p>Chosen by backtest ({Escape(h.Scheme)}), scored against the {Escape(h.Regime)} tolerance: {Percent(h.ShareWithinTolerance)} of held-out lots came within it. A predicted alcohol is an estimate, never a label statement (see <a href=\"#cautions\">Cautions</a>).</p>\n");

        if (o.Planning is { } p)
        {
            page.Append("<h3 id=\"planning\">Highest picking sugar for a target alcohol</h3>\n");
            page.Append("<p>The highest starting sugar (°Brix, after additions) at which a wine stays at or under the target alcohol, with 80 % or 95 % confidence if next season behaves like the backtested ones.</p>\n");
            page.Append("<div class=\"scroll\"><table class=\"numbers planning\">\n<caption>Highest picking °Brix by target alcohol and confidence</caption>\n<thead><tr><th scope=\"col\" rowspan=\"2\">Strain</th>");
            foreach (double t in p.Targets)
            {
                page.Append($"<th scope=\"colgroup\" colspan=\"{Count(p.Confidences.Count)}\">{Number(t, "0.0")} % v/v</th>");
            }

            page.Append("</tr>\n<tr>");
            foreach (double _ in p.Targets)
            {
                foreach (double c in p.Confidences)
                {
                    page.Append($"<th scope=\"col\" class=\"sub\">{Percent(c)}</th>");
                }
            }

            page.Append("</tr></thead>\n<tbody>\n");
            foreach (var row in p.Rows)
            {
                page.Append($"<tr{(row.Strain == "*" ? " class=\"pooled\"" : string.Empty)}><th scope=\"row\">{Escape(row.Strain == "*" ? "All strains" : row.Strain)}</th>");
                foreach (var cells in row.HighestBrix)
                {
                    foreach (double b in cells)
                    {
                        page.Append($"<td>{Number(b, "0.0")}</td>");
                    }
                }

                page.Append("</tr>\n");
            }

            page.Append("</tbody></table></div>\n");
        }

        Close(page);
    }

    private static string Range(double low, double high) =>
        double.IsFinite(low) && double.IsFinite(high) ? $"{Number(low, "0.00")} to {Number(high, "0.00")}" : "n/a";

    private static string Formula(FactorChoice c)
    {
        if (c.Curve != SugarCurve.Line || !double.IsFinite(c.Slope))
        {
            return string.Empty;
        }

        string line = $"{Number(c.Slope, "0.0000")} × °Brix";
        if (c.Intercept != 0 && double.IsFinite(c.Intercept))
        {
            line += $" {(c.Intercept < 0 ? "−" : "+")} {Number(Math.Abs(c.Intercept), "0.00")} % v/v";
        }

        return $": <span class=\"formula\">{line}</span>";
    }

    private static void Strains(StringBuilder page, ReviewResult review)
    {
        var s = review.Overview.Strains;
        Open(page, "strains");
        if (s.Ranking.Count == 0)
        {
            page.Append("<p>No strain had enough lots to compare.</p>\n");
            LeftOutStrains(page, s);
            Close(page);
            return;
        }

        if (review.Overview.StrainHeadline is { } headline)
        {
            page.Append($"<p class=\"lead\">{Escape(headline)}</p>\n");
        }

        var points = s.Ranking.Select(r => r.Adjusted is { } a
            ? $"{r.Strain} {Number(a.Factor, "0.0000")} (95 % interval {Number(a.FactorInterval.Low, "0.0000")} to {Number(a.FactorInterval.High, "0.0000")})"
            : $"{r.Strain} {Number(r.RawMedian, "0.0000")}");
        string description = (s.Ranking.Count == 1
            ? s.LeftOut.Count == 0
                ? "One strain only, so there is nothing to compare; its raw median alcohol per degree of sugar: "
                : "One strain has enough lots to be compared, so there is nothing to compare it with; its raw median alcohol per degree of sugar: "
            : s.Adjusted
            ? $"Alcohol made per degree of sugar by each strain, compared at the same starting sugar of {Number(s.ReferenceBrix, "0.0")} °Brix, highest first: "
            : "Raw median alcohol per degree of sugar by strain (the comparison at the same sugar could not be fitted), highest first: ")
            + string.Join("; ", points) + ".";
        page.Append("<figure>\n");
        page.Append(HtmlCharts.StrainFactors(s, "strain-chart", description));
        // The chart's own description lists every strain; the visible caption does so only while the list reads as a
        // sentence, and otherwise points to the table below, which holds the same values.
        string caption = s.Ranking.Count <= CaptionListsUpTo
            ? description
            : (s.Adjusted
                ? $"Alcohol made per degree of sugar by each of the {Count(s.Ranking.Count)} strains, compared at the same starting sugar of {Number(s.ReferenceBrix, "0.0")} °Brix, highest first"
                : $"Raw median alcohol per degree of sugar of each of the {Count(s.Ranking.Count)} strains, highest first")
              + "; the table below gives each value.";
        page.Append($"\n<figcaption>{Escape(caption)}{(s.Ranking.Count > 1 ? " Where two bars do not overlap, the strains differ by more than the noise." : string.Empty)}</figcaption>\n</figure>\n");
        LeftOutStrains(page, s);

        page.Append("<div class=\"scroll\"><table class=\"numbers\">\n<caption>The strains ranked</caption>\n<thead><tr><th scope=\"col\">Rank</th><th scope=\"col\" class=\"text\">Strain</th><th scope=\"col\">Lots</th>");
        if (s.Adjusted)
        {
            page.Append($"<th scope=\"col\">At {Number(s.ReferenceBrix, "0.0")} °Brix <span class=\"unit\">% v/v per °Brix</span></th><th scope=\"col\">95 % interval</th>");
        }

        page.Append("<th scope=\"col\">Raw median <span class=\"unit\">% v/v per °Brix</span></th></tr></thead>\n<tbody>\n");
        for (int i = 0; i < s.Ranking.Count; i++)
        {
            var r = s.Ranking[i];
            page.Append($"<tr><td>{Count(i + 1)}</td><th scope=\"row\">{Escape(r.Strain)}</th><td>{Quantity(r.Lots)}</td>");
            if (s.Adjusted)
            {
                page.Append(r.Adjusted is { } a
                    ? $"<td>{Number(a.Factor, "0.0000")}</td><td>{Number(a.FactorInterval.Low, "0.0000")} to {Number(a.FactorInterval.High, "0.0000")}</td>"
                    : "<td>n/a</td><td>n/a</td>");
            }

            page.Append($"<td>{Number(r.RawMedian, "0.0000")}</td></tr>\n");
        }

        page.Append("</tbody></table></div>\n");
        Close(page);
    }

    /// <summary>The most strains the chart's visible caption lists by name and value.</summary>
    internal const int CaptionListsUpTo = 6;

    private static void LeftOutStrains(StringBuilder page, Core.Review.StrainsAtAGlance s)
    {
        if (s.LeftOutSentence is { } sentence)
        {
            page.Append($"<p class=\"note\">{Escape(sentence)}</p>\n");
        }
    }

    private static void Lots(StringBuilder page, ReviewResult review)
    {
        var o = review.Overview;
        Open(page, "lots");
        if (o.FlaggedLots.Count == 0)
        {
            page.Append("<p class=\"lead\">No lot needs a second look.</p>\n");
            Close(page);
            return;
        }

        var counts = string.Join(", ", o.Lots.ByWorstSeverity.Where(c => c.Lots > 0).Select(c => $"{Quantity(c.Lots)} {ReviewTexts.Severity(c.Severity)}"));
        page.Append($"<p class=\"lead\">{Count(o.FlaggedLots.Count, "lot")} to look at ({Escape(counts)}), one row each, most serious first. The Follow-up sheet of report.xlsx and data/flags.csv hold every flag.</p>\n");
        page.Append("<div class=\"scroll\"><table class=\"lots\" id=\"lots-table\" data-sortable=\"true\">\n<caption>Lots to look at</caption>\n<thead><tr>");
        page.Append("<th scope=\"col\">Lot</th><th scope=\"col\">Strain</th><th scope=\"col\">Severity</th><th scope=\"col\">What was seen</th><th scope=\"col\">Most likely explanation</th><th scope=\"col\">Follow-up</th></tr></thead>\n<tbody>\n");
        for (int i = 0; i < o.FlaggedLots.Count; i++)
        {
            // The review's one line for the lot: what was seen, the most likely explanation, one follow-up. Past the
            // overview's printed count a row shows on screen only (the print style hides it; a sentence counts them).
            var lot = o.FlaggedLots[i];
            var f = lot.Finding!;
            page.Append($"<tr{(i >= o.PrintedLots ? " class=\"unprinted\"" : string.Empty)}><th scope=\"row\" data-key=\"{Escape(f.Key.ToString())}\">{Escape(f.Key.ToString())}</th>");
            page.Append($"<td>{Escape(f.Strain)}</td>");
            page.Append($"<td data-key=\"{Count((int)f.Severity)}\"><span class=\"severity {SeverityClass(f.Severity)}\">{Escape(ReviewTexts.Severity(f.Severity))}</span></td>");
            page.Append($"<td>{Escape(f.Seen)}<span class=\"aside\">Flags: {Escape(string.Join(", ", f.Flags))}</span></td>");
            page.Append($"<td>{Escape(f.Explanation)}");
            if (f.Otherwise is { } otherwise)
            {
                page.Append($"<span class=\"aside\">Less likely: {Escape(otherwise)}</span>");
            }

            if (!string.IsNullOrWhiteSpace(lot.Lot.Notes))
            {
                page.Append($"<span class=\"aside\">Cellar note: {Escape(lot.Lot.Notes)}</span>");
            }

            page.Append($"</td><td>{Escape(f.FollowUp)}</td></tr>\n");
        }

        page.Append("</tbody></table></div>\n");
        if (o.NotPrintedSentence is { } notPrinted)
        {
            page.Append($"<p class=\"print-only\">{Escape(notPrinted)}</p>\n");
        }

        Close(page);
    }

    private static string SeverityClass(Core.Review.Strains.FlagSeverity s) => s switch
    {
        Core.Review.Strains.FlagSeverity.LikelyError => "likely-error",
        Core.Review.Strains.FlagSeverity.Check => "check",
        _ => "note",
    };

    private static void Ferments(StringBuilder page, ReviewResult review)
    {
        var o = review.Overview;
        Open(page, "ferments");
        if (o.Kinetics is not { } k || o.Ferments.Count == 0)
        {
            page.Append("<p class=\"lead\">No fermentation log was read, so there is nothing to say about how the ferments ran.</p>\n");
            Close(page);
            return;
        }

        page.Append($"<p class=\"lead\">From {Count(k.LotsWithLog, "lot")} with a fermentation log. A ferment counts as troubled when it went sluggish or stuck, or was not dry when its log ended.</p>\n");
        var unit = review.Settings.TemperatureUnit;
        page.Append($"<div class=\"scroll\"><table class=\"numbers\">\n<caption>Ferments by strain: median, with the middle half of lots in brackets</caption>\n<thead><tr><th scope=\"col\">Strain</th><th scope=\"col\">Logged lots</th><th scope=\"col\">Days to dry</th><th scope=\"col\">Peak temperature <span class=\"unit\">{unit.Symbol()}</span></th><th scope=\"col\">Troubled ferments</th></tr></thead>\n<tbody>\n");
        foreach (var f in o.Ferments)
        {
            page.Append($"<tr><th scope=\"row\">{Escape(f.Strain)}</th><td>{Quantity(f.Lots)}</td>");
            page.Append($"<td>{Summary(f.DaysToDry, "0.0")}</td><td>{Summary(InUnit(f.PeakTemperatureC, unit), "0.0")}</td>");
            page.Append($"<td>{Quantity(f.Troubled)} <span class=\"unit\">({Percent(f.TroubledShare)})</span></td></tr>\n");
        }

        page.Append("</tbody></table></div>\n");
        var courses = review.Figures.Courses;
        if (courses.Count > 0)
        {
            string dry = string.Join("; ", o.Ferments.Select(f => $"{f.Strain} {Number(f.DaysToDry.Median, "0.0")}"));
            string description = $"For each strain, the share of the starting sugar left against days from the start: the line is the median lot, the band the middle half of the lots. Median days to dry: {dry}.";
            page.Append("<figure>\n").Append(HtmlCharts.Courses(courses, "course-chart", description));
            page.Append($"\n<figcaption>{Escape(description)}</figcaption>\n</figure>\n");
        }

        Close(page);
    }

    private static string Summary(Core.Kinetics.MetricSummary m, string format) =>
        m.N == 0 ? "n/a" : $"{Number(m.Median, format)} <span class=\"unit\">({Number(m.Q1, format)} to {Number(m.Q3, format)})</span>";

    private static void Inputs(StringBuilder page, ReviewResult review)
    {
        var o = review.Overview;
        var i = o.Inputs;
        Open(page, "inputs");
        page.Append($"<p class=\"lead\">{Count(i.LotsUsed, "lot")} used from {Count(i.Files, "file")}, with {(i.Logs == 0 ? "no fermentation log" : Count(i.Logs, "fermentation log"))}; {(i.RowsLeftOut == 0 ? "no row" : Count(i.RowsLeftOut, "row"))} left out");
        page.Append(i.FileProblems > 0 ? $" and {Count(i.FileProblems)} file or sheet problem{(i.FileProblems == 1 ? string.Empty : "s")}" : string.Empty);
        page.Append(i.Issues == 0
            ? ". Intake reported no issue.</p>\n"
            : $". Every intake issue ({Quantity(i.Issues)} in all) is listed with its fix in data/intake-issues.csv.</p>\n");
        page.Append("<div class=\"scroll\"><table class=\"files\">\n<caption>Files read, with their SHA-256 checksums</caption>\n<thead><tr><th scope=\"col\">File</th><th scope=\"col\" class=\"num\">Bytes</th><th scope=\"col\">SHA-256</th></tr></thead>\n<tbody>\n");
        foreach (var f in review.Inputs.Files)
        {
            page.Append($"<tr><th scope=\"row\">{Escape(f.Path)}</th><td class=\"num\">{f.Bytes.ToString("N0", System.Globalization.CultureInfo.InvariantCulture)}</td><td><code class=\"hash\">{Escape(f.Sha256)}</code></td></tr>\n");
        }

        page.Append("</tbody></table></div>\n");
        if (o.LeftOutReasons.Count > 0)
        {
            page.Append("<div class=\"scroll\"><table>\n<caption>Rows left out, by reason</caption>\n<thead><tr><th scope=\"col\">Reason</th><th scope=\"col\" class=\"num\">Rows</th><th scope=\"col\">For example</th></tr></thead>\n<tbody>\n");
            foreach (var r in o.LeftOutReasons.Take(8))
            {
                page.Append($"<tr><th scope=\"row\"><code>{Escape(r.Code)}</code></th><td class=\"num\">{Quantity(r.Rows)}</td><td>{Escape(r.Example)}</td></tr>\n");
            }

            page.Append("</tbody></table></div>\n");
            if (o.LeftOutReasons.Count > 8)
            {
                page.Append($"<p class=\"note\">{(o.LeftOutReasons.Count == 9 ? "1 more reason is" : Count(o.LeftOutReasons.Count - 8) + " more reasons are")} in data/intake-issues.csv.</p>\n");
            }
        }

        Close(page);
    }

    private static void Methods(StringBuilder page, ReviewResult review)
    {
        Open(page, "methods");
        page.Append("<ul class=\"methods\">\n");
        foreach (string item in HtmlTexts.Methods(review))
        {
            page.Append($"<li>{item}</li>\n");
        }

        page.Append("</ul>\n");
        page.Append("<p>Every formula, constant and setting, with its source, is on the <a href=\"report.xlsx\">“Methods and cautions” sheet of report.xlsx</a> in this folder.</p>\n");
        Close(page);
    }

    private static void Cautions(StringBuilder page, ReviewResult review)
    {
        Open(page, "cautions");
        page.Append("<ul class=\"cautions\">\n");
        foreach (string c in review.Overview.Cautions)
        {
            page.Append($"<li>{Escape(c)}</li>\n");
        }

        page.Append($"<li>{Escape(HtmlTexts.Defer)}</li>\n</ul>\n");
        Close(page);
    }

    // A temperature summary given in °C, shown in the review's unit.
    private static Core.Kinetics.MetricSummary InUnit(Core.Kinetics.MetricSummary m, TemperatureUnit unit) =>
        new(m.N, unit.FromCelsius(m.Median), unit.FromCelsius(m.Q1), unit.FromCelsius(m.Q3));
}
