using ScottPlot;
using SkiaSharp;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Review;
using YieldBench.Core.Units;
using YieldBench.Reports.Charts;

namespace YieldBench.Reports.Kinetics;

/// <summary>
/// Kinetics charts (≈1600×1000 PNG): sugar and temperature on two axes for each flagged lot, a small-multiples overview,
/// each strain's typical course of normalised sugar (median and quartiles, with every flagged lot and a bounded sample
/// of the others drawn), and rate against remaining sugar. Renders only what the review holds.
/// </summary>
public static partial class KineticsCharts
{
    /// <summary>At most this many per-lot charts are drawn (flagged lots in review order); the rest stay in the tables.</summary>
    public const int MaxLotCharts = 24;

    /// <summary>At most this many overview pages are drawn; with more lots, flagged lots fill them first.</summary>
    public const int MaxOverviewPages = 6;

    /// <summary>Lots per overview page (6 × 4 panels).</summary>
    public const int OverviewPanels = 24;

    /// <summary>Header and footer bands of the overview, px.</summary>
    public const int OverviewHeader = 70, OverviewFooter = 34;

    /// <summary>
    /// Grid of an overview page for <paramref name="panels"/> lots: columns ≈ √(1.6·n) (the page's aspect ratio), at most 6,
    /// so a few lots get large panels and a full page gets 6 × 4.
    /// </summary>
    public static (int Columns, int Rows, int PanelWidth, int PanelHeight) OverviewLayout(int panels)
    {
        int n = Math.Clamp(panels, 1, OverviewPanels);
        int cols = Math.Clamp((int)Math.Ceiling(Math.Sqrt(1.6 * n)), 1, 6);
        int rows = (n + cols - 1) / cols;
        return (cols, rows, ChartStyle.Width / cols, (ChartStyle.Height - OverviewHeader - OverviewFooter) / rows);
    }

    /// <summary>Workbook sheet the kinetics pictures belong on.</summary>
    public const string Sheet = KineticsSheet.SheetName;

    /// <summary>Renders every kinetics chart of the review into <paramref name="directory"/> and returns the PNG paths, in a stable order.</summary>
    public static IReadOnlyList<string> Render(ReviewResult review, string directory) =>
        RenderFiles(review, directory).Select(f => f.Path).ToArray();

    /// <summary>As <see cref="Render"/>, with each chart's title for the workbook.</summary>
    public static IReadOnlyList<ChartFile> RenderFiles(ReviewResult review, string directory)
    {
        return PlannedChart.DrawAll(Plan(review, directory).Charts);
    }

    /// <summary>
    /// The charts <see cref="RenderFiles"/> draws, in their order, each with its file known before it is drawn, and
    /// the indices of those to start first (the two whose cost grows with the lot count).
    /// </summary>
    internal static (IReadOnlyList<PlannedChart> Charts, IReadOnlyList<int> StartFirst) Plan(ReviewResult review, string directory)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(directory);
        var charts = new List<PlannedChart>();
        if (review.Kinetics is not { Lots.Count: > 0 } kinetics)
        {
            return (charts, []);
        }

        // Lots keep the order of the lot records (the kinetics review keeps it) for the other charts; the overview pages
        // take the review's panel order (by strain, then length of log) so each page holds ferments of like length on
        // one shared time axis.
        var ordered = kinetics.Lots.ToArray();
        var strains = review.Figures.StrainOrder;
        var courses = review.Figures.Courses;
        var unit = review.Settings.TemperatureUnit;
        var panels = review.Figures.KineticsPanels.Count == ordered.Length
            ? review.Figures.KineticsPanels.Select(i => ordered[i]).ToArray()
            : ordered;

        // Past a few pages the overview stops helping a reader and costs most of the charting time; flagged lots come
        // first when the pages cannot hold every lot (then in panel order), and every lot stays in the Kinetics table.
        int capacity = MaxOverviewPages * OverviewPanels;
        LotKinetics[] shown;
        if (panels.Length <= capacity)
        {
            shown = panels;
        }
        else
        {
            var kept = panels.Where(k => k.Flagged).Concat(panels.Where(k => !k.Flagged)).Take(capacity).ToHashSet(ReferenceEqualityComparer.Instance);
            shown = panels.Where(kept.Contains).ToArray();
        }

        int pages = (shown.Length + OverviewPanels - 1) / OverviewPanels;
        for (int page = 0; page < pages; page++)
        {
            var chunk = shown.Skip(page * OverviewPanels).Take(OverviewPanels).ToArray();
            string path = Path.Combine(directory, $"kinetics-overview-{page + 1}.png");
            string title = OverviewTitle(page, pages, shown.Length, ordered.Length);
            var file = new ChartFile(Path.GetFullPath(path), title, ChartStyle.Width, ChartStyle.Height, Sheet);
            charts.Add(new PlannedChart(file, stream =>
            {
                using var png = OverviewPng(chunk, title, unit);
                stream.Write(png.AsSpan());
            }));
        }

        int strainJob = charts.Count;
        charts.Add(PlannedChart.Of(() => StrainOverlay(ordered, strains, courses), Path.Combine(directory, "kinetics-strain-curves.png"), "Normalised sugar curves by strain", Sheet));
        charts.Add(PlannedChart.Of(() => RateAgainstSugar(review.Figures.RateCourses, strains), Path.Combine(directory, "kinetics-rate-vs-sugar.png"), "Fermentation rate against remaining sugar", Sheet));

        // A chart for each lot to look at for its ferment (a kinetics follow-up: stuck, sluggish, too hot, not dry when
        // its log ends), titled with what was seen in plain words; these stay in the charts folder, not the workbook.
        var followUps = review.LotReviews.Where(l => l.KineticsFollowUps.Count > 0)
            .ToDictionary(l => l.Key, l => string.Join(", ", l.KineticsFollowUps.Select(f => Core.Review.ReviewTexts.FlagName(f.Code))));
        foreach (var k in ordered.Where(k => followUps.ContainsKey(k.LotKey)).Take(MaxLotCharts))
        {
            string name = $"kinetics-lot-{Safe(k.Lot.Season.ToString(System.Globalization.CultureInfo.InvariantCulture))}-{Safe(k.Lot.LotId)}.png";
            string title = $"Lot {k.LotKey} ({k.Lot.Strain}): {followUps[k.LotKey]}";
            charts.Add(PlannedChart.Of(() => LotChart(k, title, unit), Path.Combine(directory, name), $"Lot {k.LotKey}: sugar and temperature", sheet: null, onOverview: false));
        }

        return (charts, [strainJob, strainJob + 1]);
    }

    /// <summary>Title of overview page <paramref name="page"/> (0-based) of <paramref name="pages"/>, saying when not every lot is shown.</summary>
    public static string OverviewTitle(int page, int pages, int shown, int total)
    {
        string title = pages == 1 ? "Sugar against time, every lot with a log" : $"Sugar against time, every lot with a log (page {page + 1} of {pages})";
        return shown >= total
            ? title
            : $"Sugar against time, {shown} of {total} lots with a log, flagged first (page {page + 1} of {pages}); every lot is in the table";
    }

    /// <summary>Sugar (left axis) and temperature (right axis) against days from time zero for one lot.</summary>
    public static Plot LotChart(LotKinetics k, string? title = null, TemperatureUnit unit = TemperatureUnit.Celsius)
    {
        ArgumentNullException.ThrowIfNull(k);
        string origin = k.OriginKind == TimeOrigin.Inoculation ? "inoculation" : "first reading";
        var plot = ChartStyle.NewPlot(
            title ?? $"Lot {k.LotKey} ({k.Lot.Strain}): {(k.Flags.Count > 0 ? string.Join(", ", k.Flags.Select(Core.Review.ReviewTexts.FlagName)) : "no flags")}",
            $"Days from {origin}",
            "Sugar (°Brix)");
        var sugarColor = ChartPalette.ForIndex(0);
        var tempColor = ChartPalette.ForIndex(5);

        var sx = k.Sugar.Select(p => p.Hours / 24.0).ToArray();
        var sy = k.Sugar.Select(p => p.Brix).ToArray();
        var sugar = plot.Add.Scatter(sx, sy);
        sugar.Color = sugarColor;
        sugar.LineWidth = 2;
        sugar.MarkerSize = k.Dense ? 0 : 9;
        sugar.LegendText = "Sugar (°Brix)";

        if (k.Gompertz.Fit is { } fit)
        {
            double t0 = Math.Min(0, sx[0] * 24.0), t1 = sx[^1] * 24.0;
            var fx = Enumerable.Range(0, 200).Select(i => t0 + ((t1 - t0) * i / 199.0)).ToArray();
            var curve = plot.Add.Scatter(fx.Select(h => h / 24.0).ToArray(), fx.Select(h => k.StartingBrix - fit.Predict(h)).ToArray());
            curve.Color = sugarColor.WithAlpha(0.6);
            curve.LineWidth = 2;
            curve.LinePattern = LinePattern.Dashed;
            curve.MarkerSize = 0;
            curve.LegendText = $"Gompertz fit (lag {fit.LagHours:0} h, maximum rate {fit.MaxRateBrixPerDay:0.0} °Brix/day)";
        }

        if (k.Stuck is { } stuck)
        {
            // A horizontal span covers a stretch of the x axis: here the stuck window in days.
            var band = plot.Add.HorizontalSpan((stuck.Start - k.Origin).TotalDays, (stuck.End - k.Origin).TotalDays);
            band.FillStyle.Color = ChartPalette.Band.WithAlpha(0.25);
            band.LegendText = "Stuck stretch";
        }

        var dry = plot.Add.HorizontalLine(0);
        dry.Color = ChartPalette.Reference.WithAlpha(0.4);
        dry.LinePattern = LinePattern.Dotted;
        dry.LineWidth = 1.5f;

        if (k.Temperatures.Count > 0)
        {
            string symbol = unit.Symbol();
            var temp = plot.Add.Scatter(k.Temperatures.Select(p => p.Hours / 24.0).ToArray(), k.Temperatures.Select(p => unit.FromCelsius(p.Celsius)).ToArray());
            temp.Color = tempColor;
            temp.LineWidth = 2;
            temp.MarkerSize = k.Dense ? 0 : 7;
            temp.MarkerShape = MarkerShape.FilledSquare;
            temp.LegendText = $"Temperature ({symbol}, right axis)";
            temp.Axes.YAxis = plot.Axes.Right;
            foreach (var (level, label, pattern) in new[] { (k.Thresholds.CautionC, "caution", LinePattern.Dashed), (k.Thresholds.DangerC, "danger", LinePattern.Solid) })
            {
                var line = plot.Add.HorizontalLine(unit.FromCelsius(level));
                line.Axes.YAxis = plot.Axes.Right;
                line.Color = tempColor.WithAlpha(0.7);
                line.LinePattern = pattern;
                line.LineWidth = 1.5f;
                line.LegendText = $"{label} temperature {unit.Show(level, "0")} (right axis)";
            }

            double top = unit.FromCelsius(Math.Max(k.Thresholds.DangerC + 2, k.Temperatures.Max(p => p.Celsius) + 2));
            double bottom = unit.FromCelsius(Math.Min(0, k.Temperatures.Min(p => p.Celsius) - 2));
            plot.Axes.Right.Label.Text = $"Temperature ({symbol})";
            plot.Axes.Right.Label.FontName = ReportFonts.FamilyName;
            plot.Axes.Right.Label.FontSize = ChartStyle.LabelSize;
            plot.Axes.AutoScale();
            plot.Axes.SetLimitsY(bottom, top, plot.Axes.Right);
        }
        else
        {
            plot.Axes.AutoScale();
        }

        ChartStyle.ShowLegend(plot, Alignment.LowerLeft);
        return plot;
    }

    /// <summary>At most this many lots per strain that are not flagged are drawn as lines on the strain-curves chart.</summary>
    public const int MaxOrdinaryCurvesPerStrain = 40;

    /// <summary>The lots the strain-curves chart draws as lines.</summary>
    /// <param name="Flagged">Every flagged lot, in review order.</param>
    /// <param name="Sampled">The other lots drawn: per strain at most <see cref="MaxOrdinaryCurvesPerStrain"/>, evenly spaced in review order.</param>
    /// <param name="Total">Lots on the chart (with a log and a positive starting sugar); each strain's course uses all of its lots.</param>
    public sealed record CurveSelection(IReadOnlyList<LotKinetics> Flagged, IReadOnlyList<LotKinetics> Sampled, int Total)
    {
        /// <summary>Lots drawn as lines.</summary>
        public int Drawn => Flagged.Count + Sampled.Count;
    }

    /// <summary>
    /// The lots drawn as lines on the strain-curves chart: every flagged lot, and per strain at most
    /// <paramref name="perStrain"/> of the others, evenly spaced through the review order (the i-th of m drawn is
    /// the ⌊(i + ½)·n / m⌋-th of the strain's n others), so the same review always draws the same lots.
    /// </summary>
    public static CurveSelection SelectCurves(IReadOnlyList<LotKinetics> lots, IReadOnlyList<string> strains, int perStrain = MaxOrdinaryCurvesPerStrain)
    {
        ArgumentNullException.ThrowIfNull(lots);
        ArgumentNullException.ThrowIfNull(strains);
        ArgumentOutOfRangeException.ThrowIfNegative(perStrain);
        var usable = lots.Where(k => k.StartingBrix > 0 && k.Sugar.Count > 0).ToArray();
        var flagged = usable.Where(k => k.Flagged).ToArray();
        var sampled = new List<LotKinetics>();
        foreach (string strain in strains)
        {
            var others = usable.Where(k => !k.Flagged && string.Equals(k.Lot.Strain, strain, StringComparison.Ordinal)).ToArray();
            if (others.Length <= perStrain)
            {
                sampled.AddRange(others);
                continue;
            }

            for (int i = 0; i < perStrain; i++)
            {
                sampled.Add(others[(int)((i + 0.5) * others.Length / perStrain)]);
            }
        }

        return new CurveSelection(flagged, sampled, usable.Length);
    }

    /// <summary>Colour of the lines of lots that are not flagged on the strain-curves chart (grey, translucent).</summary>
    public static Color OtherLotColor { get; } = Color.FromHex("#808080").WithAlpha(0.4);

    /// <summary>Opacity of each flagged lot's line when a strain has <paramref name="lines"/> of them: 0.85·√(10/n), between 0.15 and 0.85.</summary>
    public static double FlaggedLineAlpha(int lines) => Math.Clamp(0.85 * Math.Sqrt(10.0 / Math.Max(lines, 1)), 0.15, 0.85);

    /// <summary>The strain-curves chart's subtitle: how many lots are drawn as lines and what the lines and bands are.</summary>
    public static string StrainOverlaySubtitle(CurveSelection selection)
    {
        ArgumentNullException.ThrowIfNull(selection);
        var inv = System.Globalization.CultureInfo.InvariantCulture;
        return selection.Drawn >= selection.Total
            ? string.Format(inv, "Every lot drawn ({0:N0}): flagged in the strain's colour, others grey; thick line and band: each strain's median and quartiles", selection.Total)
            : string.Format(
                inv,
                "{0:N0} of {1:N0} lots drawn: all {2:N0} flagged (strain colour), up to {3} others per strain (grey); median and quartiles of all {1:N0}",
                selection.Drawn,
                selection.Total,
                selection.Flagged.Count,
                MaxOrdinaryCurvesPerStrain);
    }

    /// <summary>
    /// Sugar remaining as a share of the start against days, by strain: each strain's course (<paramref name="courses"/>, in <paramref name="strains"/> order:
    /// median line and interquartile band), every flagged lot as a thin line in its
    /// strain's colour and a bounded sample of the other lots as grey lines (<see cref="SelectCurves"/>); the subtitle
    /// says how many lots are drawn.
    /// </summary>
    public static Plot StrainOverlay(IReadOnlyList<LotKinetics> lots, IReadOnlyList<string> strains, IReadOnlyList<StrainCourse> courses)
    {
        ArgumentNullException.ThrowIfNull(lots);
        ArgumentNullException.ThrowIfNull(strains);
        ArgumentNullException.ThrowIfNull(courses);
        var inv = System.Globalization.CultureInfo.InvariantCulture;
        var plot = ChartStyle.NewPlot("Normalised sugar curves by strain", "Days from time zero (inoculation, or first reading)", "Sugar remaining (share of starting °Brix)");
        var selection = SelectCurves(lots, strains);
        ChartStyle.Subtitle(plot, StrainOverlaySubtitle(selection));

        // The other lots give context in grey; flagged lots carry their strain's colour. Flagged lots can run to
        // thousands at scale, so their lines fade as they grow in number (FlaggedLineAlpha): together they show where
        // the flagged lots went without hiding the course drawn over them.
        var others = new CurveBundle(OtherLotColor, 1f);
        foreach (var k in selection.Sampled)
        {
            others.Add(k.Sugar.Select(p => p.Hours / 24.0).ToArray(), k.Sugar.Select(p => p.Brix / k.StartingBrix).ToArray());
        }

        plot.Add.Plottable(others);
        for (int si = 0; si < strains.Count; si++)
        {
            var mine = selection.Flagged.Where(k => string.Equals(k.Lot.Strain, strains[si], StringComparison.Ordinal)).ToArray();
            // Past a few dozen lines a hairline (1 px) reads the same and costs a sixth of a 1.4 px stroke to draw.
            var bundle = new CurveBundle(ChartPalette.ForIndex(si).WithAlpha(FlaggedLineAlpha(mine.Length)), mine.Length > 50 ? 1f : 1.4f);
            foreach (var k in mine)
            {
                bundle.Add(k.Sugar.Select(p => p.Hours / 24.0).ToArray(), k.Sugar.Select(p => p.Brix / k.StartingBrix).ToArray());
            }

            plot.Add.Plottable(bundle);
        }

        // The bands go over the lots' lines (translucent, so the lines show through and the band stays visible however
        // many lines there are), and the medians on top with a white edge.
        for (int si = 0; si < strains.Count; si++)
        {
            var c = courses[si];
            if (c.Days.Count >= 2)
            {
                var upper = c.Days.Select((d, i) => new Coordinates(d, c.Q3[i]));
                var lower = c.Days.Select((d, i) => new Coordinates(d, c.Q1[i])).Reverse();
                var band = plot.Add.Polygon(upper.Concat(lower).ToArray());
                band.FillColor = ChartPalette.ForIndex(si).WithAlpha(0.28);
                band.LineWidth = 0;
            }
        }

        for (int si = 0; si < strains.Count; si++)
        {
            var c = courses[si];
            if (c.Lots == 0)
            {
                continue;
            }

            string lotsText = string.Format(inv, "{0:N0} lots, {1:N0} flagged", c.Lots, c.Flagged);
            if (c.Days.Count >= 2)
            {
                var days = c.Days.ToArray();
                var halo = plot.Add.ScatterLine(days, c.Median.ToArray(), Colors.White);
                halo.LineWidth = 8;
                var median = plot.Add.ScatterLine(days, c.Median.ToArray(), ChartPalette.ForIndex(si));
                median.LineWidth = 4;
                median.LinePattern = ChartPalette.PatternForIndex(si);
                median.LegendText = $"{strains[si]}: median, quartiles ({lotsText})";
            }
            else
            {
                // Too few lots for a course: the legend still names the strain and its colour.
                var key = new CurveBundle(ChartPalette.ForIndex(si).WithAlpha(0.8), 1.6f) { LegendText = $"{strains[si]} ({lotsText}; too few for a median)" };
                plot.Add.Plottable(key);
            }
        }

        plot.Add.Plottable(new CurveBundle(Colors.Black.WithAlpha(0.8), 1.4f) { LegendText = "thin line in a strain's colour: a flagged lot" });
        plot.Add.Plottable(new CurveBundle(OtherLotColor, 1f) { LegendText = selection.Sampled.Count < selection.Total - selection.Flagged.Count ? "grey line: a lot not flagged (sample)" : "grey line: a lot not flagged" });
        var third = plot.Add.HorizontalLine(2.0 / 3.0);
        third.Color = ChartPalette.Reference.WithAlpha(0.5);
        third.LinePattern = LinePattern.Dashed;
        third.LegendText = "One-third of the starting sugar gone";
        ChartStyle.ShowLegend(plot, Alignment.UpperRight);
        return plot;
    }

    /// <summary>
    /// Rate (°Brix/day) against remaining sugar (°Brix, decreasing to the right as the ferment runs): each strain's
    /// course (<paramref name="courses"/>, in <paramref name="strains"/> order): the median over its lots as a line and
    /// the band from the lower to the upper quartile.
    /// </summary>
    public static Plot RateAgainstSugar(IReadOnlyList<RateCourse> courses, IReadOnlyList<string> strains)
    {
        ArgumentNullException.ThrowIfNull(courses);
        ArgumentNullException.ThrowIfNull(strains);
        var plot = ChartStyle.NewPlot("Fermentation rate against remaining sugar", "Sugar remaining (°Brix; the ferment runs left to right)", "Rate (°Brix/day)");
        ChartStyle.Subtitle(plot, string.Create(
            System.Globalization.CultureInfo.InvariantCulture,
            $"Line: the strain's median rate over its lots in each {RateCourses.BinBrix:0.#} °Brix step; band: from the lower to the upper quartile (steps with at least {RateCourses.MinLots} lots)"));
        bool any = false;
        for (int si = 0; si < courses.Count && si < strains.Count; si++)
        {
            var c = courses[si];
            if (c.Brix.Count == 0)
            {
                continue;
            }

            any = true;
            var color = ChartPalette.ForIndex(si);
            if (c.Brix.Count >= 2)
            {
                var upper = c.Brix.Select((b, i) => new Coordinates(b, c.Q3[i]));
                var lower = c.Brix.Select((b, i) => new Coordinates(b, c.Q1[i])).Reverse();
                var band = plot.Add.Polygon(upper.Concat(lower).ToArray());
                band.FillColor = color.WithAlpha(0.22);
                band.LineWidth = 0;
            }

            var median = plot.Add.Scatter(c.Brix.ToArray(), c.Median.ToArray(), color);
            median.LineWidth = 4;
            median.LinePattern = ChartPalette.PatternForIndex(si);
            median.MarkerSize = c.Brix.Count >= 2 ? 0 : 12;
            median.LegendText = string.Create(System.Globalization.CultureInfo.InvariantCulture, $"{strains[si]} ({c.Lots:N0} lots)");
        }

        if (!any)
        {
            ChartStyle.Subtitle(plot, "Too few lots with rates per strain for a median: nothing to draw.");
            return plot;
        }

        plot.Axes.AutoScale();
        var lim = plot.Axes.GetLimits();
        plot.Axes.SetLimitsX(lim.Right, lim.Left);
        plot.Axes.SetLimitsY(Math.Min(0, lim.Bottom), lim.Top);
        ChartStyle.ShowLegend(plot, Alignment.UpperLeft);
        return plot;
    }
}
