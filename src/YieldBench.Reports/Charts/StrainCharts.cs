using System.Globalization;
using ScottPlot;
using YieldBench.Core.Review;
using YieldBench.Core.Units;

namespace YieldBench.Reports.Charts;

/// <summary>
/// The strain charts that answer the meeting's questions: which strain makes more alcohol from the same sugar (the
/// adjusted factors with their intervals), whether that holds in every kind of vessel, and how the strains ferment
/// (days to dry, peak temperature). Each lays out numbers the review holds.
/// </summary>
public static class StrainCharts
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>
    /// Each compared strain's factor adjusted to the same starting sugar (and vessel mix), best at the top, with its
    /// interval, and its raw median beside it; the predicted alcohol at that sugar labels each point.
    /// </summary>
    public static Plot AdjustedFactors(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var c = review.Strains.Comparison;
        var ranked = review.Figures.Ranking;
        var plot = ChartStyle.NewPlot(
            "Strains compared from the same starting sugar",
            string.Create(Inv, $"Alcohol per °Brix at {c.ReferenceBrix:0.0} °Brix (% v/v per °Brix)"),
            string.Empty);
        var adjusted = ranked.Where(r => r.Adjusted is { } a && double.IsFinite(a.Factor)).ToArray();
        if (adjusted.Length == 0)
        {
            ChartStyle.Subtitle(plot, "Fewer than two strains have enough lots to compare: nothing to draw.");
            return plot;
        }

        string level = adjusted[0].Adjusted!.FactorInterval.IsDefined
            ? string.Create(Inv, $"{adjusted[0].Adjusted!.FactorInterval.Level * 100:0} % interval")
            : "interval";
        // Many strains leave each a row too low for a label above its dot and a two-line name: the name and lots go on
        // one line and the value beside the bar's right end.
        bool dense = adjusted.Length > ChartStyle.CategoriesOnOneRow;
        ChartStyle.Subtitle(
            plot,
            $"Dot: the strain's factor adjusted to the same starting sugar{(c.AdjustedForVessel ? " and vessel mix" : string.Empty)}; bar: its {level}; ring: the raw median of its lots (not adjusted)",
            overFigure: dense);
        var colours = review.Figures.StrainOrder.Select((s, i) => (s, i)).ToDictionary(x => x.s, x => ChartPalette.ForIndex(x.i), StringComparer.Ordinal);
        var ticks = new ScottPlot.TickGenerators.NumericManual();
        double lo = double.PositiveInfinity, hi = double.NegativeInfinity;
        var labels = new List<(string Text, double X, double Y)>();
        for (int i = 0; i < adjusted.Length; i++)
        {
            var r = adjusted[i];
            var a = r.Adjusted!;
            double y = adjusted.Length - 1 - i;
            var color = colours.GetValueOrDefault(r.Strain, ChartPalette.Reference);
            ticks.AddMajor(y, dense ? $"{r.Strain} · {ChartStyle.Lots(r.Lots)}" : $"{r.Strain}\n{ChartStyle.Lots(r.Lots)}");
            if (a.FactorInterval.IsDefined)
            {
                var err = plot.Add.ErrorBar(new[] { a.Factor }, new[] { y }, new[] { 0.0 });
                err.XErrorPositive = new[] { a.FactorInterval.High - a.Factor };
                err.XErrorNegative = new[] { a.Factor - a.FactorInterval.Low };
                err.YErrorPositive = new[] { 0.0 };
                err.YErrorNegative = new[] { 0.0 };
                err.LineWidth = 4;
                err.CapSize = 16;
                err.Color = color;
                lo = Math.Min(lo, a.FactorInterval.Low);
                hi = Math.Max(hi, a.FactorInterval.High);
            }

            ChartStyle.AddMarkers(plot, new[] { a.Factor }, new[] { y }, MarkerShape.FilledCircle, 22, color);
            if (double.IsFinite(r.RawMedian))
            {
                ChartStyle.AddMarkers(plot, new[] { r.RawMedian }, new[] { y - 0.22 }, MarkerShape.OpenCircle, 16, color, 2.5f);
                lo = Math.Min(lo, r.RawMedian);
                hi = Math.Max(hi, r.RawMedian);
            }

            lo = Math.Min(lo, a.Factor);
            hi = Math.Max(hi, a.Factor);
            double right = Math.Max(a.Factor, Math.Max(a.FactorInterval.IsDefined ? a.FactorInterval.High : a.Factor, double.IsFinite(r.RawMedian) ? r.RawMedian : a.Factor));
            labels.Add((string.Create(Inv, $"{a.Factor:0.000} → {a.PredictedAbv:0.00} % v/v"), dense ? right : a.Factor, dense ? y : y + 0.32));
        }

        double pad = Math.Max(0.002, (hi - lo) * 0.12);

        // Beside the bars, the labels need about a third of the width again on the right (a label is about 200 px of
        // the plot's 1,400).
        double labelRoom = dense ? Math.Max(0.004, (hi - lo) * 0.3) : 0;
        foreach (var (text, x, y) in labels)
        {
            var label = plot.Add.Text(dense ? "  " + text : text, x, y);
            label.LabelFontName = ReportFonts.FamilyName;
            label.LabelFontSize = ChartStyle.TickSize;
            label.LabelAlignment = dense ? Alignment.MiddleLeft : Alignment.LowerCenter;
        }

        plot.Axes.Left.TickGenerator = ticks;
        plot.Axes.Left.MajorTickStyle.Length = 0;
        plot.Axes.SetLimitsX(lo - pad, hi + pad + labelRoom);
        plot.Axes.SetLimitsY(-0.7, adjusted.Length - 0.3);
        return plot;
    }

    /// <summary>
    /// abv_per_brix of each strain in each kind of vessel: the median of the group's lots with a bar from its lower to
    /// its upper quartile, vessels side by side within each strain, the lot count under each.
    /// </summary>
    public static Plot ByVessel(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var plot = ChartStyle.NewPlot("Conversion factor by strain and vessel", "Strain", "Alcohol per °Brix (% v/v per °Brix)");
        var groups = review.Figures.FactorByStrainAndVessel;
        var strains = review.Figures.StrainOrder;
        var vessels = groups.Select(Vessel).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).ToArray();
        if (groups.Count == 0)
        {
            ChartStyle.Subtitle(plot, "No strain and vessel group has lots with a factor: nothing to draw.");
            return plot;
        }

        // Beside its bar's end a count collides with its neighbours' once the bars are packed (20 strains × 5 vessel
        // types: 100 bars): then the counts go in a band under the bars, one row per vessel type in its colour, where
        // neighbours in a row are a whole strain apart.
        bool banded = strains.Count * vessels.Length > CountsBesideBarsUpTo;
        ChartStyle.Subtitle(plot, banded
            ? "Square: the median of the group's lots; bar: from the lower to the upper quartile; numbers under the bars: lots in the group, a row per vessel"
            : "Square: the median of the group's lots; bar: from the lower to the upper quartile; number: lots in the group");
        var ticks = ChartStyle.CategoryTicks(strains);
        double width = 0.7;
        double low = groups.Select(g => double.IsFinite(g.Q1) ? g.Q1 : g.Median).Where(double.IsFinite).DefaultIfEmpty(0).Min();
        double high = groups.Select(g => double.IsFinite(g.Q3) ? g.Q3 : g.Median).Where(double.IsFinite).DefaultIfEmpty(1).Max();
        double rowHeight = Math.Max(high - low, 1e-6) * 0.045;
        for (int v = 0; v < vessels.Length; v++)
        {
            // Vessels keep their own colours, after the strain colours' first few so they do not read as strains.
            var color = ChartPalette.ForIndex(v + 1);
            var mine = groups.Where(g => Vessel(g) == vessels[v]).ToArray();
            var xs = new List<double>();
            var ys = new List<double>();
            foreach (var g in mine)
            {
                int s = IndexOf(strains, g.Strain!);
                double x = s - (width / 2) + (width * (v + 0.5) / vessels.Length);
                xs.Add(x);
                ys.Add(g.Median);
                if (double.IsFinite(g.Q1) && double.IsFinite(g.Q3))
                {
                    var err = plot.Add.ErrorBar(new[] { x }, new[] { g.Median }, new[] { 0.0 });
                    err.YErrorPositive = new[] { g.Q3 - g.Median };
                    err.YErrorNegative = new[] { g.Median - g.Q1 };
                    err.XErrorPositive = new[] { 0.0 };
                    err.XErrorNegative = new[] { 0.0 };
                    err.LineWidth = 3;
                    err.CapSize = 8;
                    err.Color = color;
                }

                var n = banded
                    ? plot.Add.Text(g.N.ToString(Inv), x, low - (rowHeight * (v + 1)))
                    : plot.Add.Text(g.N.ToString(Inv), x, double.IsFinite(g.Q1) ? g.Q1 : g.Median);
                n.LabelFontName = ReportFonts.FamilyName;
                n.LabelFontSize = ChartStyle.TickSize * 0.8f;
                n.LabelAlignment = banded ? Alignment.MiddleCenter : Alignment.UpperCenter;
                n.LabelFontColor = color;
            }

            var marks = ChartStyle.AddMarkers(plot, xs, ys, MarkerShape.FilledSquare, 16, color);
            marks.LegendText = vessels[v];
        }

        plot.Axes.Bottom.TickGenerator = ticks;
        plot.Axes.Bottom.MajorTickStyle.Length = 0;
        plot.Axes.AutoScale();
        plot.Axes.SetLimitsX(-0.6, strains.Count - 0.4);
        var lim = plot.Axes.GetLimits();
        double span = lim.Top - lim.Bottom;
        plot.Axes.SetLimitsY(banded ? low - (rowHeight * (vessels.Length + 0.8)) : lim.Bottom - (span * 0.08), lim.Top + (span * 0.05));
        ChartStyle.ShowLegend(plot, Alignment.UpperRight, crowded: strains.Count > ChartStyle.CategoriesOnOneRow);
        return plot;
    }

    /// <summary>Strain and vessel bars up to which each count is written under its own bar; past it, in a band of rows.</summary>
    internal const int CountsBesideBarsUpTo = 30;

    /// <summary>
    /// Days to dry by strain: each strain's quartile box with its median, and every lot that reached dry as a dot;
    /// null without logs.
    /// </summary>
    public static Plot? DaysToDry(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        if (review.Kinetics is not { } k || review.Overview.Ferments.Count == 0)
        {
            return null;
        }

        var plot = ChartStyle.NewPlot("Days to dry by strain", string.Empty, "Days from time zero to dry");
        var lots = k.Lots.Where(l => l.HoursToDry is not null).ToLookup(l => l.Lot.Strain, l => l.HoursToDry!.Value / 24.0, StringComparer.Ordinal);
        Boxes(plot, review, f => f.DaysToDry, s => lots[s].ToArray(), d => d);
        ChartStyle.Subtitle(plot, "Box: from the lower to the upper quartile, line: the median; dots: each lot that reached dry");
        return plot;
    }

    /// <summary>
    /// Peak temperature by strain: each strain's quartile box with its median, every lot as a dot, and the caution and
    /// danger temperatures of the strain's lots as short lines against the temperature axis; null without logs.
    /// </summary>
    public static Plot? PeakTemperature(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        if (review.Kinetics is not { } k || review.Overview.Ferments.Count == 0)
        {
            return null;
        }

        var unit = review.Settings.TemperatureUnit;
        var plot = ChartStyle.NewPlot("Peak temperature by strain", string.Empty, $"Peak temperature ({unit.Symbol()})");
        var lots = k.Lots.Where(l => l.PeakTemperatureC is not null).ToLookup(l => l.Lot.Strain, StringComparer.Ordinal);
        var ferments = Boxes(plot, review, f => f.PeakTemperatureC, s => lots[s].Select(l => unit.FromCelsius(l.PeakTemperatureC!.Value)).ToArray(), c => unit.FromCelsius(c));
        bool cautionNamed = false, dangerNamed = false;
        for (int i = 0; i < ferments.Count; i++)
        {
            foreach (var (level, caution) in lots[ferments[i].Strain]
                .SelectMany(l => new[] { (l.Thresholds.CautionC, true), (l.Thresholds.DangerC, false) })
                .Distinct())
            {
                var line = plot.Add.Line(i - 0.45, unit.FromCelsius(level), i + 0.45, unit.FromCelsius(level));
                line.Color = ChartPalette.ForIndex(5).WithAlpha(0.9);
                line.LineWidth = 2.5f;
                line.LinePattern = caution ? LinePattern.Dashed : LinePattern.Solid;
                if (caution && !cautionNamed)
                {
                    line.LegendText = "caution temperature for the lots' colour";
                    cautionNamed = true;
                }
                else if (!caution && !dangerNamed)
                {
                    line.LegendText = "danger temperature for the lots' colour";
                    dangerNamed = true;
                }
            }
        }

        plot.Axes.AutoScale();
        plot.Axes.SetLimitsX(-0.6, ferments.Count - 0.4);
        ChartStyle.ShowLegend(plot, Alignment.LowerRight);
        ChartStyle.Subtitle(plot, "Box: from the lower to the upper quartile, line: the median; dots: each lot");
        return plot;
    }

    // Quartile boxes per strain (those with logs, in the overview's order) and each lot's value beside its box.
    private static IReadOnlyList<StrainFerments> Boxes(
        Plot plot, ReviewResult review, Func<StrainFerments, Core.Kinetics.MetricSummary> metric, Func<string, double[]> values, Func<double, double> shown)
    {
        var ferments = review.Overview.Ferments;
        var labels = new List<string>();
        var colours = review.Figures.StrainOrder.Select((s, i) => (s, i)).ToDictionary(x => x.s, x => ChartPalette.ForIndex(x.i), StringComparer.Ordinal);
        for (int i = 0; i < ferments.Count; i++)
        {
            var f = ferments[i];
            var m = metric(f);
            var color = colours.GetValueOrDefault(f.Strain, ChartPalette.Reference);
            var mine = values(f.Strain);
            labels.Add($"{f.Strain}\n{ChartStyle.Lots(mine.Length)}");
            if (m.N > 0 && double.IsFinite(m.Median))
            {
                var box = new Box { Position = i - 0.12, BoxMin = shown(m.Q1), BoxMax = shown(m.Q3), BoxMiddle = shown(m.Median), WhiskerMin = shown(m.Q1), WhiskerMax = shown(m.Q3), Width = 0.4 };
                plot.Add.Box(box);
                box.FillColor = color.WithAlpha(0.30);
                box.LineColor = color;
                box.LineWidth = 2;
            }

            // Dots spread sideways by rank (deterministic, no random jitter).
            var xs = mine.Select((_, j) => i + 0.2 + (0.1 * ((j % 5) - 2) / 2.0)).ToArray();
            ChartStyle.AddMarkers(plot, xs, mine, MarkerShape.FilledCircle, 8, color.WithAlpha(0.8));
        }

        plot.Axes.Bottom.TickGenerator = ChartStyle.CategoryTicks(labels);
        plot.Axes.Bottom.MajorTickStyle.Length = 0;
        plot.Axes.AutoScale();
        plot.Axes.SetLimitsX(-0.6, ferments.Count - 0.4);
        return ferments;
    }

    internal static string Vessel(Core.Review.Strains.GroupSummary g)
    {
        // The cross-tab's label is "strain × vessel".
        string label = g.Group;
        string prefix = g.Strain + " × ";
        return label.StartsWith(prefix, StringComparison.Ordinal) ? label[prefix.Length..] : label;
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
