using ScottPlot;
using SkiaSharp;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Review;
using YieldBench.Core.Units;
using YieldBench.Reports.Charts;

namespace YieldBench.Reports.Kinetics;

/// <summary>The kinetics small multiples: one panel per lot, many lots to a page, on shared axes.</summary>
public static partial class KineticsCharts
{
    /// <summary>Sugar axis of every overview panel, °Brix (fixed so panels compare at a glance).</summary>
    public const double OverviewBrixMin = -4, OverviewBrixMax = 32;

    /// <summary>Temperature axis of every overview panel, °C.</summary>
    public const double OverviewTempMin = 0, OverviewTempMax = 45;

    /// <summary>
    /// Small multiples: one panel per lot with its sugar curve (left axis, −4 to 32 °Brix) and temperature (right axis,
    /// 0 to 45 °C) against days from time zero. The panels are drawn straight onto the page with SkiaSharp: with 144
    /// panels a full plotting-library layout per panel (automatic ticks, measured labels) cost most of the page.
    /// </summary>
    public static byte[] Overview(IReadOnlyList<LotKinetics> lots, string title, TemperatureUnit unit = TemperatureUnit.Celsius)
    {
        using var png = OverviewPng(lots, title, unit);
        return png.ToArray();
    }

    /// <summary>As <see cref="Overview"/>, the PNG left in SkiaSharp's native memory (dispose it).</summary>
    public static SKData OverviewPng(IReadOnlyList<LotKinetics> lots, string title, TemperatureUnit unit = TemperatureUnit.Celsius)
    {
        ArgumentNullException.ThrowIfNull(lots);
        ReportFonts.EnsureRegistered();
        int width = ChartStyle.Width, height = ChartStyle.Height;
        const int header = OverviewHeader;
        var (columns, _, pw, ph) = OverviewLayout(lots.Count);
        float small = Math.Clamp(pw / 22f, 11f, 20f);
        using var surface = ChartImage.NewSurface(width, height);
        var canvas = surface.Canvas;
        // The process's shared typefaces: reading and parsing the two font files again for every page was a large part of a page's time.
        var regular = ReportFonts.Shared(bold: false);
        var bold = ReportFonts.Shared(bold: true);
        using var ink = new SKPaint { Color = SKColors.Black, IsAntialias = true };
        using (var font = new SKFont(bold, ChartStyle.TitleSize * 0.85f))
        {
            canvas.DrawText(title, width / 2f, 48, SKTextAlign.Center, font, ink);
        }

        using var painter = new PanelPainter(regular, bold, small, unit);
        var days = SharedDays(lots);
        for (int i = 0; i < lots.Count; i++)
        {
            float left = (i % columns) * pw, top = header + ((i / columns) * ph);
            var cell = new SKRect(left, top, left + pw, top + ph);
            canvas.Save();
            canvas.ClipRect(cell);
            painter.Draw(canvas, lots[i], cell, days);
            canvas.Restore();
        }

        using (var font = new SKFont(regular, ChartStyle.TickSize * 0.8f))
        {
            canvas.DrawText($"Blue: sugar (°Brix, left, −4 to 32); vermillion: temperature ({unit.Symbol()}, right, {unit.FromCelsius(OverviewTempMin):0} to {unit.FromCelsius(OverviewTempMax):0}); x: days from time zero, the same on every panel of the page; * flagged lot", width / 2f, height - 6, SKTextAlign.Center, font, ink);
        }

        return ChartImage.EncodePngData(surface);
    }

    /// <summary>
    /// The day range every panel of a page shares: from the earliest to the latest reading of the page's lots, with a
    /// 3 % margin each side (a page of one reading gets a day around it).
    /// </summary>
    public static (double Low, double High) SharedDays(IReadOnlyList<LotKinetics> lots)
    {
        ArgumentNullException.ThrowIfNull(lots);
        double lo = double.PositiveInfinity, hi = double.NegativeInfinity;
        foreach (var k in lots)
        {
            foreach (var p in k.Sugar)
            {
                lo = Math.Min(lo, p.Hours / 24.0);
                hi = Math.Max(hi, p.Hours / 24.0);
            }

            foreach (var p in k.Temperatures)
            {
                lo = Math.Min(lo, p.Hours / 24.0);
                hi = Math.Max(hi, p.Hours / 24.0);
            }
        }

        if (!(hi > lo))
        {
            lo = double.IsFinite(lo) ? lo - 0.5 : 0;
            hi = lo + 1;
        }

        double margin = (hi - lo) * 0.03;
        return (lo - margin, hi + margin);
    }

    /// <summary>
    /// Steps of about <paramref name="target"/> ticks over [<paramref name="lo"/>, <paramref name="hi"/>]: the smallest
    /// of 1, 2 and 5 times a power of ten that gives no more ticks than that.
    /// </summary>
    public static double NiceStep(double lo, double hi, int target)
    {
        double span = hi - lo;
        if (!(span > 0) || target < 1)
        {
            return 1;
        }

        double raw = span / target;
        double magnitude = Math.Pow(10, Math.Floor(Math.Log10(raw)));
        foreach (double m in new[] { 1.0, 2.0, 5.0, 10.0 })
        {
            if (m * magnitude >= raw)
            {
                return m * magnitude;
            }
        }

        return 10 * magnitude;
    }

    /// <summary>Draws one overview panel; holds the fonts and paints a page's panels share.</summary>
    private sealed class PanelPainter : IDisposable
    {
        private const float TickLength = 4;
        private readonly SKFont tickFont;
        private readonly SKFont titleFont;
        private readonly SKPaint text = new() { Color = SKColors.Black, IsAntialias = true };
        private readonly SKPaint frame = new() { Color = SKColors.Black, IsAntialias = false, Style = SKPaintStyle.Stroke, StrokeWidth = 1 };
        private readonly SKPaint grid = new() { Color = new SKColor(0, 0, 0, 26), IsAntialias = false, Style = SKPaintStyle.Stroke, StrokeWidth = 1 };
        private readonly SKPaint sugar;
        private readonly SKPaint sugarMarks;
        private readonly SKPaint temperature;

        private readonly TemperatureUnit unit;

        public PanelPainter(SKTypeface regular, SKTypeface bold, float size, TemperatureUnit unit)
        {
            this.unit = unit;
            tickFont = new SKFont(regular, size);
            titleFont = new SKFont(bold, size * 1.3f);
            var blue = ChartPalette.ForIndex(0);
            var vermillion = ChartPalette.ForIndex(5);
            sugar = new SKPaint { Color = new SKColor(blue.R, blue.G, blue.B, blue.A), IsAntialias = true, Style = SKPaintStyle.Stroke, StrokeWidth = 2, StrokeJoin = SKStrokeJoin.Round };
            sugarMarks = new SKPaint { Color = sugar.Color, IsAntialias = true, Style = SKPaintStyle.Stroke, StrokeWidth = 4, StrokeCap = SKStrokeCap.Round };
            temperature = new SKPaint { Color = new SKColor(vermillion.R, vermillion.G, vermillion.B, vermillion.A), IsAntialias = true, Style = SKPaintStyle.Stroke, StrokeWidth = 1.5f, StrokeJoin = SKStrokeJoin.Round };
        }

        public void Draw(SKCanvas canvas, LotKinetics k, SKRect cell, (double Low, double High) days)
        {
            var inv = System.Globalization.CultureInfo.InvariantCulture;
            bool hasTemp = k.Temperatures.Count > 0;
            float tickH = tickFont.Size;
            float pad = 6;
            var data = new SKRect(
                cell.Left + pad + tickFont.MeasureText("30") + TickLength + 4,
                cell.Top + (titleFont.Size * 1.6f),
                cell.Right - pad - (hasTemp ? tickFont.MeasureText(unit == TemperatureUnit.Fahrenheit ? "100" : "40") + TickLength + 4 : 0),
                cell.Bottom - pad - tickH - TickLength - 4);
            canvas.DrawText($"{k.LotKey} {k.Lot.Strain}{(k.Flagged ? " *" : string.Empty)}", cell.MidX, cell.Top + (titleFont.Size * 1.15f), SKTextAlign.Center, titleFont, text);
            if (data.Width < 10 || data.Height < 10)
            {
                return;
            }

            // x: the page's shared day range, so fast and slow ferments look different at a glance.
            double lo = days.Low, hi = days.High;
            float X(double d) => data.Left + (float)((d - lo) / (hi - lo) * data.Width);
            float YBrix(double b) => data.Bottom - (float)((b - OverviewBrixMin) / (OverviewBrixMax - OverviewBrixMin) * data.Height);
            float YTemp(double c) => data.Bottom - (float)((c - OverviewTempMin) / (OverviewTempMax - OverviewTempMin) * data.Height);

            // Grid and ticks: sugar every 5 °Brix, temperature every 10 °C, days at a 1-2-5 step.
            double step = NiceStep(lo, hi, Math.Max(2, (int)(data.Width / (tickFont.MeasureText("00") * 2.2f))));
            string format = step >= 1 ? "0" : step >= 0.1 ? "0.0" : "0.00";
            for (double d = Math.Ceiling(lo / step) * step; d <= hi; d += step)
            {
                float x = MathF.Round(X(d)) + 0.5f;
                canvas.DrawLine(x, data.Top, x, data.Bottom, grid);
                canvas.DrawLine(x, data.Bottom, x, data.Bottom + TickLength, frame);
                double shown = Math.Abs(d) < step * 1e-9 ? 0 : d;
                canvas.DrawText(shown.ToString(format, inv), x, data.Bottom + TickLength + 2 + tickH, SKTextAlign.Center, tickFont, text);
            }

            for (int b = 0; b <= 30; b += 5)
            {
                float y = MathF.Round(YBrix(b)) + 0.5f;
                canvas.DrawLine(data.Left, y, data.Right, y, grid);
                canvas.DrawLine(data.Left - TickLength, y, data.Left, y, frame);
                canvas.DrawText(b.ToString(inv), data.Left - TickLength - 2, y + (tickH * 0.36f), SKTextAlign.Right, tickFont, text);
            }

            if (hasTemp)
            {
                // Ticks every 10 °C (0 to 40) or every 20 °F (40 to 100), placed on the panel's °C scale.
                var ticks = unit == TemperatureUnit.Fahrenheit
                    ? new[] { 40, 60, 80, 100 }.Select(f => (Label: f, Celsius: (f - 32) * 5.0 / 9.0))
                    : new[] { 0, 10, 20, 30, 40 }.Select(c => (Label: c, Celsius: (double)c));
                foreach (var (c, celsius) in ticks)
                {
                    float y = MathF.Round(YTemp(celsius)) + 0.5f;
                    canvas.DrawLine(data.Right, y, data.Right + TickLength, y, frame);
                    canvas.DrawText(c.ToString(inv), data.Right + TickLength + 2, y + (tickH * 0.36f), SKTextAlign.Left, tickFont, text);
                }
            }

            canvas.Save();
            canvas.ClipRect(data);
            if (hasTemp)
            {
                using var t = new SKPath();
                for (int i = 0; i < k.Temperatures.Count; i++)
                {
                    var p = k.Temperatures[i];
                    if (i == 0)
                    {
                        t.MoveTo(X(p.Hours / 24.0), YTemp(p.Celsius));
                    }
                    else
                    {
                        t.LineTo(X(p.Hours / 24.0), YTemp(p.Celsius));
                    }
                }

                canvas.DrawPath(t, temperature);
            }

            var points = new SKPoint[k.Sugar.Count];
            for (int i = 0; i < points.Length; i++)
            {
                points[i] = new SKPoint(X(k.Sugar[i].Hours / 24.0), YBrix(k.Sugar[i].Brix));
            }

            canvas.DrawPoints(SKPointMode.Polygon, points, sugar);
            if (!k.Dense)
            {
                canvas.DrawPoints(SKPointMode.Points, points, sugarMarks);
            }

            canvas.Restore();
            var box = new SKRect(MathF.Round(data.Left) + 0.5f, MathF.Round(data.Top) + 0.5f, MathF.Round(data.Right) - 0.5f, MathF.Round(data.Bottom) - 0.5f);
            canvas.DrawRect(box, frame);
        }

        public void Dispose()
        {
            tickFont.Dispose();
            titleFont.Dispose();
            text.Dispose();
            frame.Dispose();
            grid.Dispose();
            sugar.Dispose();
            sugarMarks.Dispose();
            temperature.Dispose();
        }
    }

    private static string Safe(string s) =>
        new(s.Select(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '_' ? c : '_').ToArray());
}
