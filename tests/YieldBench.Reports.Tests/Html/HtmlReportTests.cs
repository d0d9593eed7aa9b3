using System.Security.Cryptography;
using System.Text;
using System.Text.RegularExpressions;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Reports.Html;
using YieldBench.Reports.Tests.Fixtures;

namespace YieldBench.Reports.Tests.Html;

/// <summary>report.html: order, structure, accessibility hooks, self-containment, determinism and escaping.</summary>
public sealed partial class HtmlReportTests
{
    private static readonly Lazy<ReviewResult> Review = new(SampleReview.WithLogs);

    private static string Page => HtmlReport.Render(Review.Value);

    [Fact]
    public void The_sections_come_in_the_meeting_s_order_under_one_title_with_headings_in_order()
    {
        // Given the sample review's page
        string page = Page;

        // When its headings are listed
        var headings = Heading().Matches(page).Select(m => (Level: int.Parse(m.Groups[1].Value, System.Globalization.CultureInfo.InvariantCulture), Id: m.Groups[2].Value)).ToArray();

        // Then there is one h1 first, the h2s are the sections in the issue's order, and no level is skipped
        Assert.Equal(1, headings[0].Level);
        Assert.Single(headings, h => h.Level == 1);
        Assert.Equal(HtmlReport.Sections.Select(s => s.Id + "-h"), headings.Where(h => h.Level == 2).Select(h => h.Id));
        Assert.Equal(
            ["decisions", "strains", "lots", "ferments", "inputs", "methods", "cautions"],
            HtmlReport.Sections.Select(s => s.Id));
        for (int i = 1; i < headings.Length; i++)
        {
            Assert.True(headings[i].Level <= headings[i - 1].Level + 1, $"heading {i} jumps from h{headings[i - 1].Level} to h{headings[i].Level}");
        }

        // And every section has its anchor, linked from the contents
        foreach (var (id, _) in HtmlReport.Sections)
        {
            Assert.Contains($"<section id=\"{id}\"", page, StringComparison.Ordinal);
            Assert.Contains($"<a href=\"#{id}\">", page, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Every_table_has_a_caption_and_header_cells_with_a_scope()
    {
        string page = Page;
        var tables = Regex.Matches(page, "<table[^>]*>(.*?)</table>", RegexOptions.Singleline);
        Assert.True(tables.Count >= 6, $"only {tables.Count} tables");
        foreach (Match t in tables)
        {
            Assert.Contains("<caption>", t.Value, StringComparison.Ordinal);
            Assert.Contains("<thead>", t.Value, StringComparison.Ordinal);
            foreach (Match th in Regex.Matches(t.Value, "<th\\b[^>]*>"))
            {
                Assert.Matches("scope=\"(col|row|colgroup)\"", th.Value);
            }
        }
    }

    [Fact]
    public void Every_chart_is_an_image_with_a_title_and_a_description_that_states_its_point()
    {
        // Given the page of a review with logs: the strain chart and the course chart
        string page = Page;
        var charts = Regex.Matches(page, "<svg [^>]*>", RegexOptions.Singleline);
        Assert.Equal(2, charts.Count);
        foreach (Match svg in charts)
        {
            // Then each is role="img", labelled by its own title and description, which exist and say something
            Assert.Contains("role=\"img\"", svg.Value, StringComparison.Ordinal);
            var ids = Regex.Match(svg.Value, "aria-labelledby=\"([^\"]+)\"").Groups[1].Value.Split(' ');
            Assert.Equal(2, ids.Length);
            Assert.Matches($"<title id=\"{ids[0]}\">[^<]{{10,}}</title>", page);
            Assert.Matches($"<desc id=\"{ids[1]}\">[^<]{{60,}}</desc>", page);
        }

        // And the strain chart's description names every ranked strain with its adjusted factor
        string desc = Regex.Match(page, "<desc id=\"strain-chart-desc\">([^<]*)</desc>").Groups[1].Value;
        foreach (var r in Review.Value.Overview.Strains.Ranking)
        {
            Assert.Contains(r.Strain + " " + HtmlText.Number(r.Adjusted!.Factor, "0.0000"), desc, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void The_decisions_show_the_overview_s_factors_and_planning_answers()
    {
        // Given the overview's factors and planning table
        var o = Review.Value.Overview;
        string page = Page;
        string decisions = Regex.Match(page, "<section id=\"decisions\".*?</section>", RegexOptions.Singleline).Value;

        // Then each factor, its prediction and both ranges are in the decisions section, and every planning answer too
        foreach (var c in o.Factors!.Strains.Prepend(o.Factors.Pooled))
        {
            Assert.Contains($"<td class=\"factor\">{HtmlText.Number(c.Factor, "0.0000")}</td>", decisions, StringComparison.Ordinal);
            Assert.Contains($"<td>{Range(c.Estimate.Low80, c.Estimate.High80)}</td><td>{Range(c.Estimate.Low95, c.Estimate.High95)}</td>", decisions, StringComparison.Ordinal);
        }

        // (A range that could not be formed reads n/a.)
        static string Range(double low, double high) =>
            double.IsFinite(low) && double.IsFinite(high) ? $"{HtmlText.Number(low, "0.00")} to {HtmlText.Number(high, "0.00")}" : "n/a";

        var cells = Regex.Matches(Regex.Match(decisions, "<table class=\"numbers planning\">.*?</table>", RegexOptions.Singleline).Value, "<td>([^<]*)</td>").Select(m => m.Groups[1].Value);
        Assert.Equal(o.Planning!.Rows.SelectMany(r => r.HighestBrix.SelectMany(t => t)).Select(b => HtmlText.Number(b, "0.0")), cells);
    }

    [Fact]
    public void The_lots_table_has_one_row_per_finding_in_the_review_s_order_with_its_words()
    {
        // Given the sample review's one-line findings
        var findings = Review.Value.Findings;
        Assert.NotEmpty(findings);
        string page = Page;

        // When the lots table's rows are read
        var rows = Regex.Matches(Regex.Match(page, "<table class=\"lots\".*?<tbody>(.*?)</tbody>", RegexOptions.Singleline).Groups[1].Value, "<tr>(.*?)</tr>", RegexOptions.Singleline)
            .Select(m => m.Groups[1].Value).ToArray();

        // Then there is a row per finding, in the review's order, holding what was seen, the explanation and the follow-up
        Assert.Equal(findings.Count, rows.Length);
        for (int i = 0; i < rows.Length; i++)
        {
            var f = findings[i];
            Assert.StartsWith($"<th scope=\"row\" data-key=\"{HtmlText.Escape(f.Key.ToString())}\">", rows[i], StringComparison.Ordinal);
            Assert.Contains(HtmlText.Escape(f.Seen), rows[i], StringComparison.Ordinal);
            Assert.Contains(HtmlText.Escape(f.Explanation), rows[i], StringComparison.Ordinal);
            Assert.Contains(HtmlText.Escape(f.FollowUp), rows[i], StringComparison.Ordinal);
            Assert.Contains($"<span class=\"severity", rows[i], StringComparison.Ordinal);
        }
    }

    [Fact]
    public void The_page_fetches_nothing_its_policy_allows_only_its_own_style_and_script()
    {
        // Given the page
        string page = Page;

        // Then it links to no outside resource (the only address is the SVG namespace, which is a name, not a fetch)
        Assert.DoesNotMatch("<link|<img|<iframe|<object|@import|url\\(|src=", page);
        Assert.All(Regex.Matches(page, "https?://[^\"' )<]+").Select(m => m.Value), url => Assert.Equal("http://www.w3.org/2000/svg", url));

        // And its policy names the SHA-256 of the one style block and the one script block actually in the page
        string style = Regex.Match(page, "<style>(.*?)</style>", RegexOptions.Singleline).Groups[1].Value;
        string script = Regex.Match(page, "<script>(.*?)</script>", RegexOptions.Singleline).Groups[1].Value;
        string policy = Regex.Match(page, "http-equiv=\"Content-Security-Policy\" content=\"([^\"]+)\"").Groups[1].Value;
        Assert.Contains($"style-src 'sha256-{Sha(style)}'", policy, StringComparison.Ordinal);
        Assert.Contains($"script-src 'sha256-{Sha(script)}'", policy, StringComparison.Ordinal);
        Assert.StartsWith("default-src 'none';", policy, StringComparison.Ordinal);
        Assert.Equal(1, Regex.Count(page, "<style"));
        Assert.Equal(1, Regex.Count(page, "<script"));
    }

    [Fact]
    public void Every_element_is_closed_in_order()
    {
        // Given the page, its style and script blocks set aside
        string page = Regex.Replace(Page, "<(style|script)>.*?</\\1>", string.Empty, RegexOptions.Singleline);
        string[] voids = ["meta", "br", "input", "img", "link", "hr", "col", "wbr", "!DOCTYPE"];

        // When its tags are walked
        var open = new Stack<string>();
        foreach (Match m in Regex.Matches(page, "<(/?)(!DOCTYPE|[a-zA-Z][a-zA-Z0-9]*)\\b[^>]*?(/?)>"))
        {
            string name = m.Groups[2].Value;
            if (m.Groups[3].Value == "/" || voids.Contains(name, StringComparer.OrdinalIgnoreCase))
            {
                continue;
            }

            if (m.Groups[1].Value == "/")
            {
                // Then each closing tag closes the last element opened
                Assert.True(open.Count > 0 && open.Peek() == name, $"</{name}> closes {(open.Count > 0 ? open.Peek() : "nothing")} at {m.Index}");
                open.Pop();
            }
            else
            {
                open.Push(name);
            }
        }

        // And nothing stays open
        Assert.Empty(open);
    }

    [Fact]
    public void The_same_review_gives_the_same_bytes()
    {
        // Given the sample review built twice, and the page of each
        // Then the pages are byte for byte the same, and hold no clock time
        string a = HtmlReport.Render(SampleReview.WithLogs()), b = HtmlReport.Render(SampleReview.WithLogs());
        Assert.Equal(a, b);
        Assert.DoesNotMatch(@"\b20\d\d-\d\d-\d\dT\d\d:", a);
    }

    [Fact]
    public void Text_from_the_inputs_is_escaped_so_a_strain_name_or_a_note_cannot_add_markup()
    {
        // Given the sample's inputs with a strain named as a script and a flagged lot's note full of quotes and tags
        const string strain = "<script>alert(\"yb\")</script>";
        const string note = "O'Brien said \"topped\" <b>5 L</b> & more";
        var inputs = Review.Value.Inputs;
        var flagged = Review.Value.Overview.FlaggedLots.First(l => l.HasStrainFlag).Key;
        var lots = inputs.Lots.Select(l => l with
        {
            Strain = l.Strain == "ST-A" ? strain : l.Strain,
            Notes = l.Key == flagged ? note : l.Notes,
        }).ToArray();
        var files = inputs.Files.Append(new InputFile("lots \"<2026>\".csv", new string('c', 64), 10)).ToArray();
        var review = ReviewRunner.Run(inputs with { Lots = lots, Files = files }, new ReviewSettings(), "9.9.9-test");

        // When the page is written
        string page = HtmlReport.Render(review);

        // Then the raw texts are nowhere, their escaped forms are there, and the page's only script is its own
        Assert.DoesNotContain(strain, page, StringComparison.Ordinal);
        Assert.DoesNotContain("<b>5 L</b>", page, StringComparison.Ordinal);
        Assert.DoesNotContain("\"<2026>\"", page, StringComparison.Ordinal);
        Assert.Contains("&lt;script&gt;alert(&quot;yb&quot;)&lt;/script&gt;", page, StringComparison.Ordinal);
        Assert.Contains("O&#39;Brien said &quot;topped&quot; &lt;b&gt;5 L&lt;/b&gt; &amp; more", page, StringComparison.Ordinal);
        Assert.Contains("lots &quot;&lt;2026&gt;&quot;.csv", page, StringComparison.Ordinal);
        Assert.Equal(1, Regex.Count(page, "<script", RegexOptions.IgnoreCase));
    }

    [Fact]
    public void The_cautions_hold_the_review_s_own_texts_and_the_deferral_to_local_codes()
    {
        string page = Page;
        string cautions = Regex.Match(page, "<section id=\"cautions\".*?</section>", RegexOptions.Singleline).Value;
        foreach (string c in Review.Value.Overview.Cautions)
        {
            Assert.Contains(HtmlText.Escape(c), cautions, StringComparison.Ordinal);
        }

        Assert.Contains("not a label statement", cautions, StringComparison.Ordinal);
        Assert.Contains("CO2", cautions, StringComparison.Ordinal);
        Assert.Contains("Defer to local codes and licensed practice.", cautions, StringComparison.Ordinal);
    }

    [Fact]
    public void Rows_left_out_are_listed_by_reason_and_a_review_without_logs_says_so()
    {
        // Given the sample review without logs, whose intake left one row out (final_abv "13,2%")
        var review = SampleReview.Build();
        string page = HtmlReport.Render(review);

        // Then the inputs give the reason with its count and example, and the ferments section says no log was read
        string inputs = Regex.Match(page, "<section id=\"inputs\".*?</section>", RegexOptions.Singleline).Value;
        Assert.Contains("<caption>Rows left out, by reason</caption>", inputs, StringComparison.Ordinal);
        Assert.Contains("<th scope=\"row\"><code>not-a-number</code></th><td class=\"num\">1</td><td>&#39;13,2%&#39; is not a number; write 13.2.</td>", inputs, StringComparison.Ordinal);
        Assert.Contains("1 row left out", inputs, StringComparison.Ordinal);
        string ferments = Regex.Match(page, "<section id=\"ferments\".*?</section>", RegexOptions.Singleline).Value;
        Assert.Contains("No fermentation log was read", ferments, StringComparison.Ordinal);
        Assert.Equal(1, Regex.Count(page, "<svg "));
    }

    [Fact]
    public void A_review_too_small_for_a_recommendation_still_makes_a_whole_page()
    {
        // Given three lots of one strain in one season: too few to compare strains or recommend a factor
        var lots = Review.Value.Inputs.Lots.Take(3).ToArray();
        var review = ReviewRunner.Run(new SeasonSet { Lots = lots }, new ReviewSettings(), "9.9.9-test");
        Assert.Null(review.Overview.Factors);

        // When its page is written
        string page = HtmlReport.Render(review);

        // Then every section is there, the decisions say why there is no factor, and the page closes properly
        foreach (var (id, _) in HtmlReport.Sections)
        {
            Assert.Contains($"<section id=\"{id}\"", page, StringComparison.Ordinal);
        }

        Assert.Contains("No conversion factor is recommended.", page, StringComparison.Ordinal);
        foreach (string why in review.Overview.NoRecommendation)
        {
            Assert.Contains(HtmlText.Escape(why), page, StringComparison.Ordinal);
        }

        Assert.EndsWith("</html>\n", page, StringComparison.Ordinal);
    }

    [Fact]
    public void A_review_of_one_season_says_it_held_out_lots_not_seasons()
    {
        // Given the sample's lots of one season only (18 lots, three strains): the backtest can only hold out lots
        var lots = Review.Value.Inputs.Lots.Where(l => l.Season == 2025).ToArray();
        var review = ReviewRunner.Run(new SeasonSet { Lots = lots }, new ReviewSettings(), "9.9.9-test");
        Assert.NotEqual(YieldBench.Core.HouseFactor.BacktestScheme.LeaveOneSeasonOut, review.HouseFactor.PrimaryScheme);
        Assert.NotNull(review.Overview.Factors);

        // When the page and the factor table are made
        string page = HtmlReport.Render(review);
        var headings = YieldBench.Reports.Tables.ReviewTables.Factors(review).Columns.Select(c => c.Heading).ToArray();

        // Then both speak of held-out lots, as the console does; the two-season sample still speaks of seasons
        Assert.Contains("on held-out lots, 80 % and 95 % of wines", page, StringComparison.Ordinal);
        Assert.DoesNotContain("held-out seasons", page, StringComparison.Ordinal);
        Assert.Contains("Error on held-out lots (% v/v)", headings);
        Assert.Contains("on held-out seasons, 80 % and 95 % of wines", Page, StringComparison.Ordinal);
        Assert.Contains("Error on held-out seasons (% v/v)", YieldBench.Reports.Tables.ReviewTables.Factors(Review.Value).Columns.Select(c => c.Heading));
    }

    private static string Sha(string text) => Convert.ToBase64String(SHA256.HashData(Encoding.UTF8.GetBytes(text)));

    [GeneratedRegex("<h([1-6])(?: id=\"([^\"]*)\")?")]
    private static partial Regex Heading();
}
