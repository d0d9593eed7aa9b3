using System.Globalization;
using ScottPlot;
using YieldBench.Core.Review;

namespace YieldBench.Reports.Charts;

/// <summary>
/// The charts of the number to use next harvest: how the recommended predictor did on seasons it had not seen, and
/// the highest picking sugar for a target alcohol. Each lays out numbers the review holds.
/// </summary>
public static class PlanningCharts
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>
    /// Actual against predicted alcohol for every lot, each predicted by the recommended predictor trained without the
    /// lot's season (or the lot, with one season), coloured by strain, with the line of a perfect prediction and the
    /// label tolerance around it.
    /// </summary>
    public static Plot PredictedAgainstActual(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var h = review.HouseFactor;
        var plot = ChartStyle.NewPlot(
            "Predicted against actual alcohol, " + ReviewTexts.Scheme(h.PrimaryScheme),
            "Predicted alcohol (% v/v)",
            "Actual alcohol (% v/v)");
        var chosen = h.Candidates.FirstOrDefault(c => c.Id == h.Overall?.CandidateId);
        if (chosen is null || chosen.HeldOut.Count == 0)
        {
            ChartStyle.Subtitle(plot, "No predictor was recommended: nothing to draw.");
            return plot;
        }

        var points = chosen.HeldOut.Where(p => double.IsFinite(p.PredictedAbv) && double.IsFinite(p.ActualAbv)).ToArray();
        if (points.Length == 0)
        {
            ChartStyle.Subtitle(plot, "No held-out prediction: nothing to draw.");
            return plot;
        }

        ChartStyle.Subtitle(plot, $"{chosen.Name}, the recommended predictor, never shown the lot it predicts; on the dashed line the prediction was exact");
        double lo = Math.Floor(Math.Min(points.Min(p => p.PredictedAbv), points.Min(p => p.ActualAbv)) * 2) / 2;
        double hi = Math.Ceiling(Math.Max(points.Max(p => p.PredictedAbv), points.Max(p => p.ActualAbv)) * 2) / 2;
        var grid = Enumerable.Range(0, 41).Select(i => lo + ((hi - lo) * i / 40.0)).ToArray();
        var regime = h.Regime;
        var upper = grid.Select(x => new Coordinates(x, x + regime.ToleranceFor(x)));
        var lower = grid.Select(x => new Coordinates(x, x - regime.ToleranceFor(x))).Reverse();
        var band = plot.Add.Polygon(upper.Concat(lower).ToArray());
        band.FillColor = ChartPalette.Band.WithAlpha(0.25);
        band.LineWidth = 0;
        band.LegendText = $"label tolerance: {regime.Name}";
        var exact = plot.Add.ScatterLine(new[] { lo, hi }, new[] { lo, hi }, ChartPalette.Reference);
        exact.LineWidth = 2;
        exact.LinePattern = LinePattern.Dashed;
        exact.LegendText = "prediction exact";

        var strains = review.Figures.StrainOrder;
        for (int i = 0; i < strains.Count; i++)
        {
            var mine = points.Where(p => string.Equals(p.Strain, strains[i], StringComparison.Ordinal)).ToArray();
            if (mine.Length == 0)
            {
                continue;
            }

            var m = ChartStyle.AddMarkers(plot, mine.Select(p => p.PredictedAbv).ToArray(), mine.Select(p => p.ActualAbv).ToArray(), ChartPalette.ShapeForIndex(i), 9, ChartPalette.ForIndex(i).WithAlpha(0.85));
            m.LegendText = $"{strains[i]} ({mine.Length})";
        }

        plot.Axes.SetLimits(lo, hi, lo, hi);
        ChartStyle.ShowLegend(plot, Alignment.UpperLeft);
        return plot;
    }

    /// <summary>
    /// For each target alcohol, the highest starting sugar to pick at, per strain: the line keeps the wine at or under
    /// the target with 80 % confidence; the band runs from 95 % confidence (its lower edge) to even odds (its upper).
    /// </summary>
    public static Plot HighestPickingSugar(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var plot = ChartStyle.NewPlot("Highest picking sugar for a target alcohol", "Target alcohol (% v/v)", "Highest starting sugar (°Brix)");
        var curves = review.Figures.Planning;
        if (curves.Count == 0)
        {
            ChartStyle.Subtitle(plot, "No planner line could be learned from these lots: nothing to draw.");
            return plot;
        }

        ChartStyle.Subtitle(plot, "Line: stay at or under the target 4 times in 5 (80 %); band: 19 in 20 (95 %) to even odds. An estimate, not a label statement.");
        var strains = review.Figures.StrainOrder;
        foreach (var c in curves)
        {
            bool pooled = c.Strain == "*";
            int index = IndexOf(strains, c.Strain);
            var color = pooled ? ChartPalette.Reference : ChartPalette.ForIndex(Math.Max(index, 0));
            var at = Enumerable.Range(0, c.Targets.Count).Where(i => double.IsFinite(c.Confident95[i]) && double.IsFinite(c.EvenOdds[i])).ToArray();
            if (!pooled && at.Length >= 2)
            {
                var upper = at.Select(i => new Coordinates(c.Targets[i], c.EvenOdds[i]));
                var lower = at.Select(i => new Coordinates(c.Targets[i], c.Confident95[i])).Reverse();
                var band = plot.Add.Polygon(upper.Concat(lower).ToArray());
                band.FillColor = color.WithAlpha(0.18);
                band.LineWidth = 0;
            }

            var line80 = Enumerable.Range(0, c.Targets.Count).Where(i => double.IsFinite(c.Confident80[i])).ToArray();
            if (line80.Length < 2)
            {
                continue;
            }

            var line = plot.Add.ScatterLine(line80.Select(i => c.Targets[i]).ToArray(), line80.Select(i => c.Confident80[i]).ToArray(), color);
            line.LineWidth = pooled ? 2 : 3.5f;
            line.LinePattern = pooled ? LinePattern.Dashed : ChartPalette.PatternForIndex(Math.Max(index, 0));
            line.LegendText = pooled ? "all lots (80 %)" : $"{c.Strain} (80 %)";
        }

        ChartStyle.ShowLegend(plot, Alignment.UpperLeft);
        return plot;
    }

    private static int IndexOf(IReadOnlyList<string> strains, string strain)
    {
        for (int i = 0; i < strains.Count; i++)
        {
            if (string.Equals(strains[i], strain, StringComparison.Ordinal))
            {
                return i;
            }
        }

        return -1;
    }
}
