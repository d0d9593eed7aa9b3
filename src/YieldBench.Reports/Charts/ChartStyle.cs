using ScottPlot;

namespace YieldBench.Reports.Charts;

/// <summary>Shared look of every PNG chart: shipped font, bold title, readable sizes at ≈1600×1000.</summary>
public static class ChartStyle
{
    /// <summary>Default chart width, px.</summary>
    public const int Width = 1600;

    /// <summary>Default chart height, px.</summary>
    public const int Height = 1000;

    /// <summary>Title size, px.</summary>
    public const float TitleSize = 34;

    /// <summary>Axis label size, px.</summary>
    public const float LabelSize = 26;

    /// <summary>Tick label and legend size, px.</summary>
    public const float TickSize = 20;

    /// <summary>
    /// A new plot with the shipped font registered and applied, a bold title, axis labels and readable ticks.
    /// </summary>
    /// <param name="title">Chart title (bold).</param>
    /// <param name="xLabel">Bottom axis label, unit included, e.g. "Effective starting sugar (°Brix)".</param>
    /// <param name="yLabel">Left axis label, unit included.</param>
    public static Plot NewPlot(string title, string xLabel, string yLabel)
    {
        ReportFonts.EnsureRegistered();
        var plot = new Plot();

        // Each label is given the family by name: measured with ScottPlot 5.1.59, Plot.Font.Set() makes later Bold
        // settings ineffective, and a fresh plot's labels already default to Fonts.Default (ours).
        plot.Title(title, TitleSize);
        plot.Axes.Title.Label.FontName = ReportFonts.FamilyName;
        plot.Axes.Title.Label.Bold = true;
        plot.XLabel(xLabel, LabelSize);
        plot.YLabel(yLabel, LabelSize);
        foreach (var axis in new ScottPlot.IAxis[] { plot.Axes.Bottom, plot.Axes.Left, plot.Axes.Right, plot.Axes.Top })
        {
            axis.Label.FontName = ReportFonts.FamilyName;
            axis.Label.Bold = false;
            axis.TickLabelStyle.FontName = ReportFonts.FamilyName;
            axis.TickLabelStyle.FontSize = TickSize;
        }

        plot.Axes.Bottom.Label.FontSize = LabelSize;
        plot.Axes.Left.Label.FontSize = LabelSize;
        plot.Axes.Right.Label.FontSize = LabelSize;
        plot.Legend.FontName = ReportFonts.FamilyName;
        plot.Legend.FontSize = TickSize;
        plot.Grid.MajorLineColor = Color.FromHex("#E5E5E5");
        return plot;
    }

    /// <summary>Subtitle size, px.</summary>
    public const float SubtitleSize = 20;

    /// <summary>
    /// A second, regular-weight line under the title: what the chart shows when that is not obvious, e.g. that a
    /// sample of the lots is drawn. Returns the panel so a test can read its text.
    /// </summary>
    /// <param name="plot">The chart.</param>
    /// <param name="text">The line.</param>
    /// <param name="overFigure">Centre the line over the whole image rather than the plot area: for a plot area narrowed by wide labels.</param>
    public static ScottPlot.Panels.TitlePanel Subtitle(Plot plot, string text, bool overFigure = false)
    {
        ArgumentNullException.ThrowIfNull(plot);
        ArgumentNullException.ThrowIfNull(text);

        // Beside a legend placed right of the plot area the plot area is narrow: a long line is broken in two.
        var panel = new ScottPlot.Panels.TitlePanel { FullFigureCenter = overFigure };
        panel.Label.Text = plot.Axes.GetPanels().Any(p => p is ScottPlot.Panels.LegendPanel) ? TwoLinesIfLong(text) : text;
        panel.Label.FontName = ReportFonts.FamilyName;
        panel.Label.FontSize = SubtitleSize;
        panel.Label.Bold = false;
        panel.Label.ForeColor = Color.FromHex("#333333");
        plot.Axes.AddPanel(panel);
        return panel;
    }

    /// <summary>
    /// Adds a batch of markers (<see cref="MarkerCloud"/>): the way every chart draws one point per lot or per reading,
    /// so that 100,000 lots cost about what a few thousand do.
    /// </summary>
    public static MarkerCloud AddMarkers(
        Plot plot, IReadOnlyList<double> xs, IReadOnlyList<double> ys, MarkerShape shape, float size, Color color, float lineWidth = 1f)
    {
        ArgumentNullException.ThrowIfNull(plot);
        var cloud = new MarkerCloud(xs, ys, shape, size, color, lineWidth);
        plot.Add.Plottable(cloud);
        return cloud;
    }

    /// <summary>The most legend entries drawn inside the plot area; a longer legend (a cellar of many strains) would cover the data.</summary>
    public const int LegendEntriesInside = 10;

    /// <summary>
    /// Shows the legend in the <paramref name="where"/> corner of the plot area (where alcohol-vs-sugar charts have
    /// empty space) while it has at most <see cref="LegendEntriesInside"/> entries and <paramref name="crowded"/> is
    /// false; otherwise beside the plot area, on the right, where it covers nothing.
    /// </summary>
    /// <returns>True when the legend was placed beside the plot area.</returns>
    public static bool ShowLegend(Plot plot, Alignment where = Alignment.UpperLeft, bool crowded = false)
    {
        ArgumentNullException.ThrowIfNull(plot);
        plot.Legend.FontName = ReportFonts.FamilyName;
        plot.Legend.FontSize = TickSize;
        if (crowded || plot.GetPlottables().SelectMany(p => p.LegendItems).Count(i => !string.IsNullOrEmpty(i.LabelText)) > LegendEntriesInside)
        {
            plot.ShowLegend(Edge.Right);

            // The plot area is now narrower than the image: a long subtitle, centred over it, would run off the image's
            // left edge, so it is broken onto two lines.
            foreach (var subtitle in plot.Axes.GetPanels().OfType<ScottPlot.Panels.TitlePanel>())
            {
                subtitle.Label.Text = TwoLinesIfLong(subtitle.Label.Text);
            }

            return true;
        }

        plot.ShowLegend(where);
        return false;
    }

    /// <summary>The longest subtitle kept on one line over a plot area narrowed by a legend beside it, characters (about 900 px of DejaVu Sans at the subtitle size).</summary>
    public const int SubtitleBesideLegend = 95;

    /// <summary>
    /// <paramref name="text"/> on one line when it has at most <see cref="SubtitleBesideLegend"/> characters; otherwise
    /// broken at the clause break (";", else ",", else a space) nearest its middle.
    /// </summary>
    public static string TwoLinesIfLong(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        if (text.Length <= SubtitleBesideLegend || text.Contains('\n', StringComparison.Ordinal))
        {
            return text;
        }

        foreach (string mark in new[] { "; ", ", ", " " })
        {
            int best = -1;
            for (int i = text.IndexOf(mark, StringComparison.Ordinal); i >= 0; i = text.IndexOf(mark, i + 1, StringComparison.Ordinal))
            {
                if (best < 0 || Math.Abs(i - (text.Length / 2)) < Math.Abs(best - (text.Length / 2)))
                {
                    best = i;
                }
            }

            if (best > 0)
            {
                return text[..(best + mark.Length - 1)] + "\n" + text[(best + mark.Length)..];
            }
        }

        return text;
    }

    /// <summary>The most category labels (strains) along the bottom axis that are given one row each.</summary>
    public const int CategoriesOnOneRow = 10;

    /// <summary>
    /// Labels of categories (strains) placed at 0, 1, 2, … along the bottom axis. Up to
    /// <see cref="CategoriesOnOneRow"/> they sit side by side; with more, neighbours alternate between two rows (the
    /// second row's labels start that many lines lower), so that twenty strain codes do not run into each other.
    /// </summary>
    public static ScottPlot.TickGenerators.NumericManual CategoryTicks(IReadOnlyList<string> labels)
    {
        ArgumentNullException.ThrowIfNull(labels);
        var ticks = new ScottPlot.TickGenerators.NumericManual();
        int lines = labels.Count == 0 ? 1 : labels.Max(l => l.Split('\n').Length);
        for (int i = 0; i < labels.Count; i++)
        {
            string drop = labels.Count > CategoriesOnOneRow && i % 2 == 1 ? new string('\n', lines) : string.Empty;
            ticks.AddMajor(i, drop + labels[i]);
        }

        return ticks;
    }

    /// <summary>"9 lots", "1 lot".</summary>
    public static string Lots(int n) => n.ToString(System.Globalization.CultureInfo.InvariantCulture) + (n == 1 ? " lot" : " lots");
}
