using ScottPlot;
using SkiaSharp;
using YieldBench.Core.Conversion;
using YieldBench.Core.Kinetics;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Output;

namespace YieldBench.Reports.Kinetics;

/// <summary>
/// Kinetics charts (≈1600×1000 PNG): sugar and temperature on two axes for each flagged lot, a small-multiples overview,
/// strain overlays of normalised sugar curves, and rate against remaining sugar. Renders only what the review holds.
/// </summary>
public static class KineticsCharts
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

    /// <summary>Renders every kinetics chart into <paramref name="directory"/> and returns the PNG paths, in a stable order.</summary>
    public static IReadOnlyList<string> Render(KineticsReview review, IReadOnlyList<LotConversion> lots, string directory) =>
        RenderFiles(review, lots, directory).Select(f => f.Path).ToArray();

    /// <summary>As <see cref="Render"/>, with each chart's title for the workbook.</summary>
    public static IReadOnlyList<ChartFile> RenderFiles(KineticsReview review, IReadOnlyList<LotConversion> lots, string directory)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(lots);
        ArgumentNullException.ThrowIfNull(directory);
        var files = new List<ChartFile>();
        if (review.Lots.Count == 0)
        {
            return files;
        }

        // Lots are drawn in the order of the lot records so pages and colours are stable.
        var order = lots.Select((l, i) => (l.Lot.Key, i)).GroupBy(p => p.Key).ToDictionary(g => g.Key, g => g.First().i, StringComparer.Ordinal);
        var ordered = review.Lots.OrderBy(k => order.GetValueOrDefault(k.LotKey, int.MaxValue)).ThenBy(k => k.LotKey, StringComparer.Ordinal).ToArray();
        var strains = ordered.Select(k => k.Lot.Strain).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).ToArray();

        // Past a few pages the overview stops helping a reader and costs most of the charting time; flagged lots come
        // first when the pages cannot hold every lot, and every lot stays in the Kinetics table.
        int capacity = MaxOverviewPages * OverviewPanels;
        var shown = ordered.Length <= capacity
            ? ordered
            : ordered.Where(k => k.Flagged).Concat(ordered.Where(k => !k.Flagged)).Take(capacity).ToArray();
        int pages = (shown.Length + OverviewPanels - 1) / OverviewPanels;
        var jobs = new List<Func<ChartFile>>();
        for (int page = 0; page < pages; page++)
        {
            var chunk = shown.Skip(page * OverviewPanels).Take(OverviewPanels).ToArray();
            string path = Path.Combine(directory, $"kinetics-overview-{page + 1}.png");
            string title = OverviewTitle(page, pages, shown.Length, ordered.Length);
            jobs.Add(() =>
            {
                AtomicFile.WriteAllBytes(path, Overview(chunk, title));
                return new ChartFile(Path.GetFullPath(path), title, ChartStyle.Width, ChartStyle.Height, Sheet);
            });
        }

        jobs.Add(() => ChartImage.Save(StrainOverlay(ordered, strains), Path.Combine(directory, "kinetics-strain-curves.png"), "Normalised sugar curves by strain", Sheet));
        jobs.Add(() => ChartImage.Save(RateAgainstSugar(ordered, strains), Path.Combine(directory, "kinetics-rate-vs-sugar.png"), "Fermentation rate against remaining sugar", Sheet));

        foreach (var k in ordered.Where(k => k.Flagged).Take(MaxLotCharts))
        {
            string name = $"kinetics-lot-{Safe(k.Lot.Season.ToString(System.Globalization.CultureInfo.InvariantCulture))}-{Safe(k.Lot.LotId)}.png";
            jobs.Add(() => ChartImage.Save(LotChart(k), Path.Combine(directory, name), $"Lot {k.LotKey}: sugar and temperature", Sheet));
        }

        files.AddRange(ChartImage.RenderAll(jobs));
        return files;
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
    public static Plot LotChart(LotKinetics k)
    {
        ArgumentNullException.ThrowIfNull(k);
        string origin = k.OriginKind == TimeOrigin.Inoculation ? "inoculation" : "first reading";
        var plot = ChartStyle.NewPlot(
            $"Lot {k.LotKey} ({k.Lot.Strain}): {(k.Flags.Count > 0 ? string.Join(", ", k.Flags) : "no flags")}",
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
            curve.LegendText = $"Gompertz fit (λ {fit.LagHours:0} h, μm {fit.MaxRateBrixPerDay:0.0} °Brix/day)";
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
            var temp = plot.Add.Scatter(k.Temperatures.Select(p => p.Hours / 24.0).ToArray(), k.Temperatures.Select(p => p.Celsius).ToArray());
            temp.Color = tempColor;
            temp.LineWidth = 2;
            temp.MarkerSize = k.Dense ? 0 : 7;
            temp.MarkerShape = MarkerShape.FilledSquare;
            temp.LegendText = "Temperature (°C, right axis)";
            temp.Axes.YAxis = plot.Axes.Right;
            foreach (var (level, label, pattern) in new[] { (k.Thresholds.CautionC, "caution", LinePattern.Dashed), (k.Thresholds.DangerC, "danger", LinePattern.Solid) })
            {
                var line = plot.Add.HorizontalLine(level);
                line.Axes.YAxis = plot.Axes.Right;
                line.Color = tempColor.WithAlpha(0.7);
                line.LinePattern = pattern;
                line.LineWidth = 1.5f;
                line.LegendText = $"{label} {level:0} °C";
            }

            double top = Math.Max(k.Thresholds.DangerC + 2, k.Temperatures.Max(p => p.Celsius) + 2);
            double bottom = Math.Min(0, k.Temperatures.Min(p => p.Celsius) - 2);
            plot.Axes.Right.Label.Text = "Temperature (°C)";
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

    /// <summary>Sugar remaining as a share of the start against days, coloured by strain (one legend entry per strain).</summary>
    public static Plot StrainOverlay(IReadOnlyList<LotKinetics> lots, IReadOnlyList<string> strains)
    {
        ArgumentNullException.ThrowIfNull(lots);
        ArgumentNullException.ThrowIfNull(strains);
        var plot = ChartStyle.NewPlot("Normalised sugar curves by strain", "Days from time zero (inoculation, or first reading)", "Sugar remaining (share of starting °Brix)");
        var labelled = new HashSet<string>(StringComparer.Ordinal);
        foreach (var k in lots)
        {
            if (!(k.StartingBrix > 0))
            {
                continue;
            }

            int idx = Array.IndexOf(strains.ToArray(), k.Lot.Strain);
            var s = plot.Add.Scatter(k.Sugar.Select(p => p.Hours / 24.0).ToArray(), k.Sugar.Select(p => p.Brix / k.StartingBrix).ToArray());
            s.Color = ChartPalette.ForIndex(idx).WithAlpha(0.75);
            s.LineWidth = 2;
            s.MarkerSize = 0;
            if (labelled.Add(k.Lot.Strain))
            {
                s.LegendText = $"{k.Lot.Strain} ({lots.Count(x => x.Lot.Strain == k.Lot.Strain)} lots)";
            }
        }

        var third = plot.Add.HorizontalLine(2.0 / 3.0);
        third.Color = ChartPalette.Reference.WithAlpha(0.5);
        third.LinePattern = LinePattern.Dashed;
        third.LegendText = "One-third of the starting sugar gone";
        ChartStyle.ShowLegend(plot, Alignment.UpperRight);
        return plot;
    }

    /// <summary>Rate (°Brix/day) against remaining sugar (°Brix, decreasing to the right as the ferment runs), coloured by strain.</summary>
    public static Plot RateAgainstSugar(IReadOnlyList<LotKinetics> lots, IReadOnlyList<string> strains)
    {
        ArgumentNullException.ThrowIfNull(lots);
        ArgumentNullException.ThrowIfNull(strains);
        var plot = ChartStyle.NewPlot("Fermentation rate against remaining sugar", "Sugar remaining (°Brix; the ferment runs left to right)", "Rate (°Brix/day)");
        for (int si = 0; si < strains.Count; si++)
        {
            var xs = new List<double>();
            var ys = new List<double>();
            foreach (var k in lots.Where(l => l.Lot.Strain == strains[si]))
            {
                if (k.Dense)
                {
                    // Dense probe logs: the smoothed rate, thinned to one point per hour or so to keep the chart legible.
                    int step = Math.Max(1, (int)Math.Round(1.0 / Math.Max(k.MedianSpacingHours ?? 1.0, 1e-3)));
                    for (int i = 0; i < k.SmoothedRates.Count; i += step)
                    {
                        if (k.SmoothedRates[i].BrixPerDay is { } r)
                        {
                            xs.Add(k.SmoothedRates[i].Brix);
                            ys.Add(r);
                        }
                    }
                }
                else
                {
                    foreach (var r in k.Rates)
                    {
                        xs.Add(0.5 * (r.BrixStart + r.BrixEnd));
                        ys.Add(r.BrixPerDay);
                    }
                }
            }

            if (xs.Count == 0)
            {
                continue;
            }

            var s = plot.Add.Scatter(xs.ToArray(), ys.ToArray());
            s.Color = ChartPalette.ForIndex(si).WithAlpha(0.8);
            s.LineWidth = 0;
            s.MarkerSize = 8;
            s.LegendText = strains[si];
        }

        plot.Axes.AutoScale();
        var lim = plot.Axes.GetLimits();
        plot.Axes.SetLimitsX(lim.Right, lim.Left);
        ChartStyle.ShowLegend(plot, Alignment.UpperLeft);
        return plot;
    }

    /// <summary>Small multiples: one panel per lot with its sugar curve (and temperature on a shared 0–45 °C right axis).</summary>
    public static byte[] Overview(IReadOnlyList<LotKinetics> lots, string title)
    {
        ArgumentNullException.ThrowIfNull(lots);
        ReportFonts.EnsureRegistered();
        int width = ChartStyle.Width, height = ChartStyle.Height;
        const int header = OverviewHeader;
        var (columns, _, pw, ph) = OverviewLayout(lots.Count);
        float small = Math.Clamp(pw / 22f, 11f, 20f);
        using var surface = ChartImage.NewSurface(width, height);
        var canvas = surface.Canvas;
        using (var typeface = ReportFonts.Typeface(bold: true))
        using (var font = new SKFont(typeface, ChartStyle.TitleSize * 0.85f))
        using (var paint = new SKPaint { Color = SKColors.Black, IsAntialias = true })
        {
            canvas.DrawText(title, width / 2f, 48, SKTextAlign.Center, font, paint);
        }

        for (int i = 0; i < lots.Count; i++)
        {
            var k = lots[i];
            var plot = new Plot();
            plot.Title($"{k.LotKey} {k.Lot.Strain}{(k.Flagged ? " *" : string.Empty)}", small * 1.3f);
            plot.Axes.Title.Label.FontName = ReportFonts.FamilyName;
            foreach (var axis in new ScottPlot.IAxis[] { plot.Axes.Bottom, plot.Axes.Left, plot.Axes.Right })
            {
                axis.TickLabelStyle.FontName = ReportFonts.FamilyName;
                axis.TickLabelStyle.FontSize = small;
            }

            var s = plot.Add.Scatter(k.Sugar.Select(p => p.Hours / 24.0).ToArray(), k.Sugar.Select(p => p.Brix).ToArray());
            s.Color = ChartPalette.ForIndex(0);
            s.LineWidth = 2;
            s.MarkerSize = k.Dense ? 0 : 4;
            if (k.Temperatures.Count > 0)
            {
                var t = plot.Add.Scatter(k.Temperatures.Select(p => p.Hours / 24.0).ToArray(), k.Temperatures.Select(p => p.Celsius).ToArray());
                t.Color = ChartPalette.ForIndex(5);
                t.LineWidth = 1.5f;
                t.MarkerSize = 0;
                t.Axes.YAxis = plot.Axes.Right;
                plot.Axes.AutoScale();
                plot.Axes.SetLimitsY(0, 45, plot.Axes.Right);
            }

            plot.Axes.SetLimitsY(-4, 32, plot.Axes.Left);
            // Drawn straight into its cell: encoding and decoding a PNG per panel cost most of an overview page's time.
            float left = (i % columns) * pw, top = header + ((i / columns) * ph);
            canvas.Save();
            canvas.ClipRect(new SKRect(left, top, left + pw, top + ph));
            plot.Render(canvas, new PixelRect(left, left + pw, top + ph, top));
            canvas.Restore();
        }

        using (var typeface = ReportFonts.Typeface(bold: false))
        using (var font = new SKFont(typeface, ChartStyle.TickSize * 0.8f))
        using (var paint = new SKPaint { Color = SKColors.Black, IsAntialias = true })
        {
            canvas.DrawText("Blue: sugar (°Brix, left, −4 to 32); vermillion: temperature (°C, right, 0 to 45); x: days from time zero; * flagged lot", width / 2f, height - 6, SKTextAlign.Center, font, paint);
        }

        return ChartImage.EncodePng(surface);
    }

    private static string Safe(string s) =>
        new(s.Select(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '_' ? c : '_').ToArray());
}
