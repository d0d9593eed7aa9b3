using System.Globalization;
using ScottPlot;
using YieldBench.Core.Forecast;
using YieldBench.Core.Units;
using YieldBench.Reports.Charts;

namespace YieldBench.Reports.Forecast;

/// <summary>
/// One chart per running lot: sugar readings, the forecast sugar course with its 80 % band, the one-third and dry
/// lines and "now"; on the right axis the temperature readings, the forecast temperature with its band, the temperature
/// reachable with no cooling from now, and the caution and danger thresholds. Lays out what the forecast holds.
/// </summary>
public static class ForecastCharts
{
    /// <summary>File name of a lot's chart inside the output's charts folder.</summary>
    public static string FileName(LotForecast f)
    {
        ArgumentNullException.ThrowIfNull(f);
        return $"forecast-{f.Course.Season.ToString(CultureInfo.InvariantCulture)}-{Safe(f.Course.LotId)}.png";
    }

    /// <summary>The lot's chart, temperatures in <paramref name="unit"/>.</summary>
    public static Plot LotChart(LotForecast f, TemperatureUnit unit = TemperatureUnit.Celsius)
    {
        ArgumentNullException.ThrowIfNull(f);
        var c = f.Course;
        var curve = f.Curve;
        var plot = ChartStyle.NewPlot($"Lot {c.LotId} ({c.Strain}{(c.Vessel is null ? string.Empty : ", " + c.Vessel)}): forecast with 80 % bands", "Date and time (cellar clock)", "Sugar (°Brix)");
        ChartStyle.Subtitle(plot, $"{f.ReadingsUsed} reading(s); one-third at {f.OneThirdBrix.ToString("0.0", CultureInfo.InvariantCulture)} °Brix; a forecast is no substitute for the next reading");
        double X(double hours) => c.At(hours).ToOADate();
        double[] Temps(IReadOnlyList<double> celsius) => celsius.Select(v => unit.FromCelsius(v)).ToArray();
        var sugarColor = ChartPalette.ForIndex(0);
        var tempColor = ChartPalette.ForIndex(5);
        var xs = curve.Hours.Select(X).ToArray();

        if (xs.Length > 1)
        {
            var band = plot.Add.FillY(xs, curve.BrixLow, curve.BrixHigh);
            band.FillStyle.Color = sugarColor.WithAlpha(0.18);
            band.LineStyle.Width = 0;
            band.LegendText = "Sugar, 80 % band";
            var median = plot.Add.Scatter(xs, curve.BrixMedian);
            median.Color = sugarColor;
            median.LineWidth = 2;
            median.MarkerSize = 0;
            median.LinePattern = LinePattern.Dashed;
            median.LegendText = "Sugar, forecast median";
        }

        if (c.SugarHours.Length > 0)
        {
            var readings = plot.Add.ScatterPoints(c.SugarHours.Select(X).ToArray(), c.SugarBrix);
            readings.Color = sugarColor;
            readings.MarkerSize = 11;
            readings.LegendText = "Sugar readings";
        }

        var third = plot.Add.HorizontalLine(f.OneThirdBrix);
        third.Color = ChartPalette.ForIndex(2);
        third.LineWidth = 2;
        third.LinePattern = LinePattern.DenselyDashed;
        third.LegendText = $"One-third, {f.OneThirdBrix.ToString("0.0", CultureInfo.InvariantCulture)} °Brix";
        var dry = plot.Add.HorizontalLine(0);
        dry.Color = ChartPalette.Reference.WithAlpha(0.4);
        dry.LinePattern = LinePattern.Dotted;
        dry.LineWidth = 1.5f;
        var now = plot.Add.VerticalLine(X(f.NowHours));
        now.Color = ChartPalette.Reference.WithAlpha(0.6);
        now.LineWidth = 1.5f;
        now.LegendText = "Now (last reading)";

        bool temps = c.TempC.Length > 0 || curve.TempMedian.Length > 0;
        if (temps)
        {
            if (xs.Length > 1)
            {
                var tBand = plot.Add.FillY(xs, Temps(curve.TempLow), Temps(curve.TempHigh));
                tBand.FillStyle.Color = tempColor.WithAlpha(0.15);
                tBand.LineStyle.Width = 0;
                tBand.Axes.YAxis = plot.Axes.Right;
                tBand.LegendText = "Temperature, 80 % band";
                var tMedian = plot.Add.Scatter(xs, Temps(curve.TempMedian));
                tMedian.Color = tempColor;
                tMedian.LineWidth = 2;
                tMedian.MarkerSize = 0;
                tMedian.LinePattern = LinePattern.Dashed;
                tMedian.Axes.YAxis = plot.Axes.Right;
                tMedian.LegendText = "Temperature, forecast median (right axis)";
                var reachX = xs.Where((_, i) => double.IsFinite(curve.ReachableC[i])).ToArray();
                var reachY = Temps(curve.ReachableC.Where(double.IsFinite).ToArray());
                if (reachX.Length > 1)
                {
                    var reach = plot.Add.Scatter(reachX, reachY);
                    reach.Color = ChartPalette.ForIndex(3);
                    reach.LineWidth = 3;
                    reach.MarkerSize = 0;
                    reach.Axes.YAxis = plot.Axes.Right;
                    reach.LegendText = "Reachable with no cooling from now (right axis)";
                }
            }

            if (c.TempC.Length > 0)
            {
                var tReadings = plot.Add.ScatterPoints(c.TempHours.Select(X).ToArray(), Temps(c.TempC));
                tReadings.Color = tempColor;
                tReadings.MarkerShape = MarkerShape.FilledSquare;
                tReadings.MarkerSize = 9;
                tReadings.Axes.YAxis = plot.Axes.Right;
                tReadings.LegendText = "Temperature readings (right axis)";
            }

            foreach (var (level, label, pattern) in new[] { (f.CautionC, "Caution", LinePattern.Dashed), (f.DangerC, "Danger", LinePattern.Solid) })
            {
                var line = plot.Add.HorizontalLine(unit.FromCelsius(level));
                line.Axes.YAxis = plot.Axes.Right;
                line.Color = tempColor.WithAlpha(0.7);
                line.LinePattern = pattern;
                line.LineWidth = 1.5f;
                line.LegendText = $"{label} {unit.Show(level, "0")}";
            }

            plot.Axes.Right.Label.Text = $"Temperature ({unit.Symbol()})";
            plot.Axes.Right.Label.FontName = ReportFonts.FamilyName;
            plot.Axes.Right.Label.FontSize = ChartStyle.LabelSize;
        }

        var dateAxis = plot.Axes.DateTimeTicksBottom();
        if (dateAxis.TickGenerator is ScottPlot.TickGenerators.DateTimeAutomatic automatic)
        {
            // The cellar's clock: "Thu 17 Sep", with the time under it when a tick is not at midnight.
            automatic.LabelFormatter = d => d.TimeOfDay == TimeSpan.Zero
                ? d.ToString("ddd d MMM", CultureInfo.InvariantCulture)
                : d.ToString("ddd d MMM", CultureInfo.InvariantCulture) + "\n" + d.ToString("HH:mm", CultureInfo.InvariantCulture);
        }

        plot.Axes.Bottom.TickLabelStyle.FontName = ReportFonts.FamilyName;
        plot.Axes.Bottom.TickLabelStyle.FontSize = ChartStyle.TickSize;
        plot.Axes.AutoScale();
        var (sugarLow, sugarHigh, tempLow, tempHigh) = Limits(f);
        plot.Axes.SetLimitsY(sugarLow, sugarHigh, plot.Axes.Left);
        if (temps)
        {
            plot.Axes.SetLimitsY(tempLow, tempHigh, plot.Axes.Right);
        }

        plot.Legend.FontName = ReportFonts.FamilyName;
        plot.Legend.FontSize = ChartStyle.TickSize - 2;
        // Centred in its panel, the legend's frame touched the picture's bottom edge (the panel is measured a little
        // shorter than the legend draws): the legend hangs from the panel's top with room left below it.
        var legendPanel = plot.ShowLegend(Edge.Bottom);
        legendPanel.Alignment = Alignment.UpperCenter;
        legendPanel.Padding = new PixelPadding(20, 20, 40, 8);
        return plot;
    }

    /// <summary>Axis limits: the sugar from below the dry line to above the start; the temperature from below the lowest to above the danger line and the reachable curve.</summary>
    private static (double SugarLow, double SugarHigh, double TempLow, double TempHigh) Limits(LotForecast f)
    {
        var c = f.Course;
        double sugarHigh = Math.Max(c.StartBrix, c.SugarBrix.Length > 0 ? c.SugarBrix.Max() : c.StartBrix) + 1.5;
        double sugarLow = Math.Min(-3, f.Curve.BrixLow.Where(double.IsFinite).DefaultIfEmpty(-3).Min() - 0.5);
        var temps = c.TempC.Concat(f.Curve.TempLow).Concat(f.Curve.TempHigh).Concat(f.Curve.ReachableC).Where(double.IsFinite).ToArray();
        double tempLow = temps.Length > 0 ? Math.Floor(temps.Min()) - 2 : 0;
        double tempHigh = Math.Max(f.DangerC + 3, temps.Length > 0 ? Math.Ceiling(temps.Max()) + 2 : f.DangerC + 3);
        return (sugarLow, sugarHigh, tempLow, tempHigh);
    }

    private static string Safe(string s) => new(s.Select(ch => char.IsLetterOrDigit(ch) || ch is '-' or '_' ? ch : '_').ToArray());
}
