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
    public static ScottPlot.Panels.TitlePanel Subtitle(Plot plot, string text)
    {
        ArgumentNullException.ThrowIfNull(plot);
        ArgumentNullException.ThrowIfNull(text);
        var panel = new ScottPlot.Panels.TitlePanel();
        panel.Label.Text = text;
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

    /// <summary>Shows the legend in the upper-left corner (where alcohol-vs-sugar charts have empty space).</summary>
    public static void ShowLegend(Plot plot, Alignment where = Alignment.UpperLeft)
    {
        ArgumentNullException.ThrowIfNull(plot);
        plot.Legend.FontName = ReportFonts.FamilyName;
        plot.Legend.FontSize = TickSize;
        plot.ShowLegend(where);
    }
}
