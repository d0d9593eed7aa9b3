using YieldBench.Core.Conversion;
using YieldBench.Core.Review;
using static YieldBench.Reports.Html.HtmlText;

namespace YieldBench.Reports.Html;

/// <summary>The page's own words: methods in brief (as HTML, with the review's settings escaped in) and its closing caution.</summary>
internal static class HtmlTexts
{
    /// <summary>Closes the cautions.</summary>
    public const string Defer = "Everything on this page informs a decision; it does not replace the lab, the cellar's own safety rules or the law. Defer to local codes and licensed practice.";

    /// <summary>The methods in brief, one item each, as HTML.</summary>
    public static IReadOnlyList<string> Methods(ReviewResult review)
    {
        var s = review.Settings;
        string sugar = s.SugarModel.Rule == SugarRule.OivTable ? "the OIV must table" : "°Brix less the non-sugar solids";
        string scheme = Escape(ReviewTexts.Scheme(review.HouseFactor.PrimaryScheme));
        var items = new List<string>
        {
            $"<strong>Conversion.</strong> A lot's factor is its final alcohol (% v/v) divided by its starting sugar (°Brix) after the recorded water and sugar additions, worked out by mass balance; fermentable sugar comes from {sugar}.",
            "<strong>Strains compared.</strong> Final alcohol is regressed on starting sugar with strain (and vessel, when recorded) as factors by a robust Huber regression, and each strain is read off at the same starting sugar with a 95 % interval. The raw factors are also compared by Kruskal–Wallis and Hodges–Lehmann shifts with Holm's adjustment.",
            "<strong>Lots to look at.</strong> A lot is flagged when its factor sits far from its strain's (robust z, Tukey fences, the strain's Theil–Sen line), when it holds more alcohol than Gay-Lussac allows from its sugar, when it is not dry, or when its log shows a stuck, sluggish or overheated ferment. A flag asks for a second look; it proves nothing.",
            $"<strong>Conversion factor to use.</strong> Candidates from trade ballparks and the EU convention to per-strain robust factors and a multi-variable model are backtested ({scheme}); the simplest within one standard error of the best is chosen, and the ranges come from its held-out errors, scored against the {Escape(review.HouseFactor.Regime.Name)} tolerance.",
        };
        if (review.Kinetics is { } k)
        {
            items.Add($"<strong>Ferments.</strong> From the fermentation logs: days from the start until the sugar reads {Number(k.Settings.DryBrix, "0.0")} °Brix or less, the peak temperature, and sluggish or stuck stretches by rate thresholds (on the workbook's methods sheet); the course of sugar is the median and middle half of each strain's logged lots, step by step.");
        }

        items.Add($"<strong>Same inputs, same page.</strong> Every random step is seeded (seed {Count(s.Seed)}); YieldBench {Escape(review.ToolVersion)}.");
        return items;
    }
}
