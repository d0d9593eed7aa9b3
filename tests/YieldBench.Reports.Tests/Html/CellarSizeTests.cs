using System.Text.RegularExpressions;
using YieldBench.Core.Review;
using YieldBench.Reports.Html;
using YieldBench.Reports.Output;
using YieldBench.Reports.Tests.Fixtures;

namespace YieldBench.Reports.Tests.Html;

/// <summary>report.html and the console at the sizes wineries have: a small cellar and one with many strains.</summary>
public sealed partial class CellarSizeTests
{
    private static readonly Lazy<ReviewResult> Small = new(Cellars.Small);
    private static readonly Lazy<ReviewResult> Large = new(() => Cellars.Large(strains: 20, lotsPerSeason: 6, seasons: 2));

    [Fact]
    public void A_small_cellar_s_page_counts_in_the_singular_and_says_no_log_and_no_issue()
    {
        // Given one season of ten lots with no logs and no intake issue
        string page = HtmlReport.Render(Small.Value);

        // Then no count of one is followed by a plural noun, and what is absent is said in words
        Assert.DoesNotMatch(OneWithPlural(), page);
        Assert.Contains("10 lots from 1 file in season 2025 · no fermentation log ·", page, StringComparison.Ordinal);
        Assert.Contains("with no fermentation log; no row left out. Intake reported no issue.", page, StringComparison.Ordinal);
        Assert.DoesNotContain("0 in all", page, StringComparison.Ordinal);
    }

    [Fact]
    public void A_strain_with_too_few_lots_is_named_as_left_out_and_the_one_strain_compared_is_not_called_the_only_one()
    {
        // Given nine lots of SM-A and a single lot of SM-B
        var review = Small.Value;
        Assert.Single(review.Overview.Strains.Ranking);

        // When the page and the console summary are written
        string page = HtmlReport.Render(review);
        string console = string.Join(" ", ConsoleSummary.Lines(review, new ReportOutput("out", [], [])));

        // Then both say SM-B is left out and why, neither says there is one strain only, and the page does not talk
        // about bars that overlap when there is one bar
        const string leftOut = "SM-B (1 lot) is left out of the comparison: a strain needs at least 5 lots to be compared";
        Assert.Contains(leftOut, page, StringComparison.Ordinal);
        Assert.Contains(leftOut, console, StringComparison.Ordinal);
        Assert.DoesNotContain("One strain only", page, StringComparison.Ordinal);
        Assert.DoesNotContain("One strain only", console, StringComparison.Ordinal);
        Assert.Contains("One strain has enough lots to be compared", page, StringComparison.Ordinal);
        Assert.DoesNotContain("Where two bars do not overlap", page, StringComparison.Ordinal);
    }

    [Fact]
    public void With_twenty_strains_the_chart_caption_points_to_the_table_instead_of_listing_every_interval()
    {
        // Given a cellar of twenty strains
        var review = Large.Value;
        Assert.Equal(20, review.Overview.Strains.Ranking.Count);

        // When the page is written
        string page = HtmlReport.Render(review);
        string caption = Regex.Match(page, "<section[^>]*id=\"strains\".*?<figcaption>(.*?)</figcaption>", RegexOptions.Singleline).Groups[1].Value;

        // Then the visible caption is a sentence, not twenty values with their intervals; the table has every strain
        Assert.Contains("each of the 20 strains", caption, StringComparison.Ordinal);
        Assert.Contains("the table below gives each value", caption, StringComparison.Ordinal);
        Assert.DoesNotContain("95 % interval", caption, StringComparison.Ordinal);
        Assert.True(caption.Length < 400, $"caption of {caption.Length} characters");
        foreach (var strain in review.Overview.Strains.Ranking)
        {
            Assert.Contains($"<th scope=\"row\">{strain.Strain}</th>", page, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void With_three_strains_the_chart_caption_still_lists_each_strain_s_value()
    {
        // Given the sample review's three strains
        string page = HtmlReport.Render(SampleReview.Build());
        string caption = Regex.Match(page, "<section[^>]*id=\"strains\".*?<figcaption>(.*?)</figcaption>", RegexOptions.Singleline).Groups[1].Value;

        // Then the caption names each with its value
        foreach (string strain in new[] { "ST-A", "ST-B", "ST-C" })
        {
            Assert.Contains(strain + " 0.", caption, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void A_lot_of_a_strain_too_small_to_be_its_own_reference_is_not_compared_with_the_strain_s_other_lots()
    {
        // Given nine lots of SM-A at 0.59 % v/v per °Brix and the single lot of SM-B at 0.63, well above them
        var lots = Enumerable.Range(0, 10).Select(i => new Core.Lots.Lot
        {
            LotId = $"S{i + 1:00}",
            Season = 2025,
            Strain = i < 9 ? "SM-A" : "SM-B",
            StartingSugar = Core.Units.SugarReading.FromBrix(22.0 + (0.35 * i)),
            FinalAlcohol = Core.Units.AlcoholContent.FromPercentVolume(Math.Round((i < 9 ? 0.59 + (0.002 * ((i % 3) - 1)) : 0.63) * (22.0 + (0.35 * i)), 2)),
            ResidualSugarGl = 1.5,
        }).ToList();
        var review = ReviewRunner.Run(new Core.Lots.SeasonSet { Lots = lots }, new ReviewSettings(), "9.9.9-test");

        // When its finding is read
        var finding = Assert.Single(review.Findings, f => f.Strain == "SM-B");

        // Then it is set against the cellar's lots, as the review judged it, not against a strain that has no other lot
        Assert.StartsWith("More alcohol than the cellar's lots from this sugar (the strain has too few lots to be judged against its own):", finding.Explanation, StringComparison.Ordinal);
        Assert.DoesNotContain("the strain's other lots", HtmlReport.Render(review), StringComparison.Ordinal);
    }

    [Fact]
    public void A_cellar_of_a_thousand_lots_over_five_seasons_reads_its_counts_with_a_thousands_separator_and_its_seasons_as_a_span()
    {
        // Given 1,000 lots: two strains, 100 lots each in each of five seasons (2023–2027)
        var review = Cellars.Large(strains: 2, lotsPerSeason: 100, seasons: 5);

        // When the page is written
        string page = HtmlReport.Render(review);

        // Then the masthead says "1,000 lots" and the span of seasons, not a run of five years; the seed stays a plain number
        Assert.Contains("<p class=\"facts\">1,000 lots from 1 file in 5 seasons, 2023–2027 · no fermentation log ·", page, StringComparison.Ordinal);
        Assert.Contains("1,000 lots used from 1 file", page, StringComparison.Ordinal);
        Assert.Contains("with seed 20261.", page, StringComparison.Ordinal);
    }

    [Fact]
    public void Twenty_strains_in_a_row_that_are_the_same_within_the_noise_are_said_in_one_sentence_not_one_per_pair()
    {
        // Given twenty strains whose neighbours in the ranking differ by less than the noise
        var strains = Large.Value.Overview.Strains;

        // When the ranking is said in plain words (the console and the workbook's Overview)
        var plain = strains.Plain;

        // Then a run of strains the same within the noise is one sentence naming them all, and every strain is still
        // named: far fewer sentences than the nineteen neighbour pairs
        var runs = plain.Where(l => l.Contains("each against the next", StringComparison.Ordinal)).ToArray();
        Assert.NotEmpty(runs);
        Assert.True(plain.Count < 10, string.Join("\n", plain));
        Assert.All(strains.Ranking, r => Assert.Contains(plain, l => l.Contains(r.Strain + " ", StringComparison.Ordinal) || l.Contains(r.Strain + ",", StringComparison.Ordinal) || l.Contains(r.Strain + ".", StringComparison.Ordinal)));
        Assert.Matches(@"^LG-\d\d(, LG-\d\d)+ and LG-\d\d make the same alcohol from the same sugar within the noise, each against the next \(differences of \d\.\d\d % v/v or less\)\.$", runs[0]);
    }

    [Fact]
    public void A_cellar_with_many_lots_to_look_at_prints_the_most_serious_and_counts_the_rest()
    {
        // Given 240 lots of which every fourth was left with 15 g/L of sugar (60 lots to look at, more than the 25 printed)
        var lots = Enumerable.Range(0, 240).Select(i => new Core.Lots.Lot
        {
            LotId = $"M{i + 1:000}",
            Season = 2023 + (i % 3),
            Strain = $"MN-{(i % 4) + 1}",
            StartingSugar = Core.Units.SugarReading.FromBrix(22 + (0.1 * (i % 30))),
            FinalAlcohol = Core.Units.AlcoholContent.FromPercentVolume(Math.Round(0.59 * (22 + (0.1 * (i % 30))), 2)),
            ResidualSugarGl = i % 4 == 3 ? 15 : 1.5,
            Source = new Core.Lots.SourceRef("lots.csv", null, i + 2),
        }).ToList();
        var review = ReviewRunner.Run(new Core.Lots.SeasonSet { Lots = lots, Files = [new Core.Lots.InputFile("lots.csv", new string('e', 64), 9000)] }, new ReviewSettings(), "9.9.9-test");
        var flagged = review.Overview.FlaggedLots;
        Assert.True(flagged.Count > ReviewOverview.PrintedLotsUpTo, $"{flagged.Count} lots to look at");

        // When the page is written
        string page = HtmlReport.Render(review);
        string table = Regex.Match(page, "<table class=\"lots\".*?</table>", RegexOptions.Singleline).Value;
        var rows = Regex.Matches(table, "<tr(?: class=\"unprinted\")?><th scope=\"row\"").Select(m => m.Value.Contains("unprinted", StringComparison.Ordinal)).ToArray();

        // Then the screen table holds every lot, the first 25 (most serious) print and the rest are hidden in print and
        // counted in a sentence that shows only in print and points to the workbook and the data file
        Assert.Equal(flagged.Count, rows.Length);
        Assert.Equal(25, rows.Count(u => !u));
        Assert.All(rows.Take(25), u => Assert.False(u));
        Assert.Contains(".print-only { display: none; }", page, StringComparison.Ordinal);
        Assert.Contains("tr.unprinted { display: none; }", page, StringComparison.Ordinal);
        Assert.Contains($"<p class=\"print-only\">Printed here: the 25 most serious of the {flagged.Count} lots to look at. The other {flagged.Count - 25} (", page, StringComparison.Ordinal);
        Assert.Contains(") are on this page on screen, in the Follow-up sheet of report.xlsx and in data/follow-up.csv.</p>", page, StringComparison.Ordinal);

        // And no section is forced onto a new page (a short section left most of a page empty), while charts and rows
        // are kept whole
        Assert.DoesNotContain("break-before: page", page, StringComparison.Ordinal);
        Assert.Contains("figure, svg, tr, caption, .lead { break-inside: avoid; }", page, StringComparison.Ordinal);

        // And a cellar with few lots to look at prints them all, with no such sentence
        Assert.DoesNotContain("print-only\">", HtmlReport.Render(Small.Value), StringComparison.Ordinal);
    }

    [GeneratedRegex(@"(?<![\d.,])1 (lots|files|rows|fermentation logs|reasons)\b")]
    private static partial Regex OneWithPlural();
}
