using System.Text;
using YieldBench.Core.Review;
using static YieldBench.Reports.Html.HtmlText;

namespace YieldBench.Reports.Html;

/// <summary>
/// The page's charts as inline SVG, drawn from numbers the review holds (no statistic is computed here): each is an
/// image with a title and a description that states its point, so a screen reader and a text-only reader get the point too.
/// </summary>
internal static class HtmlCharts
{
    private const string Font = "font-family=\"system-ui, 'DejaVu Sans', 'Segoe UI', Arial, sans-serif\"";

    /// <summary>
    /// The strains' conversion adjusted to one starting sugar, each a dot with its 95 % interval, in the ranking's order
    /// (highest first); raw medians without bars when the adjusted comparison could not be fitted.
    /// </summary>
    public static string StrainFactors(StrainsAtAGlance strains, string id, string description)
    {
        var rows = strains.Ranking;
        const double width = 880, left = 110, right = 250, top = 16, rowHeight = 44, axisHeight = 58;
        double height = top + (rows.Count * rowHeight) + axisHeight;
        var values = new List<double>();
        foreach (var r in rows)
        {
            if (r.Adjusted is { } a)
            {
                values.Add(a.Factor);
                values.Add(a.FactorInterval.Low);
                values.Add(a.FactorInterval.High);
            }
            else
            {
                values.Add(r.RawMedian);
            }
        }

        var (lo, hi, step) = Axis(values.Where(double.IsFinite).DefaultIfEmpty(0.55).Min(), values.Where(double.IsFinite).DefaultIfEmpty(0.65).Max());
        double plotRight = width - right;
        double X(double v) => left + ((v - lo) / (hi - lo) * (plotRight - left));

        var svg = Open(id, width, height, strains.Adjusted ? "Conversion by strain at the same starting sugar" : "Conversion by strain (raw medians)", description);
        double axisY = top + (rows.Count * rowHeight) + 6;
        for (int k = 0; k <= (int)Math.Round((hi - lo) / step); k++)
        {
            double t = lo + (k * step);
            svg.Append($"<line x1=\"{Coordinate(X(t))}\" y1=\"{Coordinate(top)}\" x2=\"{Coordinate(X(t))}\" y2=\"{Coordinate(axisY)}\" stroke=\"{HtmlPalette.Hairline}\" stroke-width=\"1\"/>");
            svg.Append($"<text x=\"{Coordinate(X(t))}\" y=\"{Coordinate(axisY + 20)}\" text-anchor=\"middle\" font-size=\"15\" fill=\"{HtmlPalette.Muted}\">{Number(t, "0.000")}</text>");
        }

        svg.Append($"<line x1=\"{Coordinate(left)}\" y1=\"{Coordinate(axisY)}\" x2=\"{Coordinate(plotRight)}\" y2=\"{Coordinate(axisY)}\" stroke=\"{HtmlPalette.Muted}\" stroke-width=\"1\"/>");
        string axisLabel = strains.Adjusted
            ? $"% v/v per °Brix, adjusted to {Number(strains.ReferenceBrix, "0.0")} °Brix (dot) with its 95 % interval (bar)"
            : "% v/v per °Brix, raw median";
        svg.Append($"<text x=\"{Coordinate((left + plotRight) / 2)}\" y=\"{Coordinate(axisY + 44)}\" text-anchor=\"middle\" font-size=\"15\" fill=\"{HtmlPalette.Muted}\">{Escape(axisLabel)}</text>");

        for (int i = 0; i < rows.Count; i++)
        {
            var r = rows[i];
            double y = top + (i * rowHeight) + (rowHeight / 2);
            svg.Append($"<text x=\"{Coordinate(left - 12)}\" y=\"{Coordinate(y + 5)}\" text-anchor=\"end\" font-size=\"16\" font-weight=\"bold\" fill=\"{HtmlPalette.Ink}\">{Escape(r.Strain)}</text>");
            double value = r.Adjusted?.Factor ?? r.RawMedian;
            string label = Number(value, "0.0000");
            if (r.Adjusted is { } a && double.IsFinite(a.FactorInterval.Low) && double.IsFinite(a.FactorInterval.High))
            {
                double x1 = X(a.FactorInterval.Low), x2 = X(a.FactorInterval.High);
                svg.Append($"<line x1=\"{Coordinate(x1)}\" y1=\"{Coordinate(y)}\" x2=\"{Coordinate(x2)}\" y2=\"{Coordinate(y)}\" stroke=\"{HtmlPalette.Accent}\" stroke-width=\"4\" stroke-linecap=\"butt\"/>");
                foreach (double x in new[] { x1, x2 })
                {
                    svg.Append($"<line x1=\"{Coordinate(x)}\" y1=\"{Coordinate(y - 9)}\" x2=\"{Coordinate(x)}\" y2=\"{Coordinate(y + 9)}\" stroke=\"{HtmlPalette.Accent}\" stroke-width=\"3\"/>");
                }

                label += $"  ({Number(a.FactorInterval.Low, "0.0000")} to {Number(a.FactorInterval.High, "0.0000")})";
            }

            if (double.IsFinite(value))
            {
                svg.Append($"<circle cx=\"{Coordinate(X(value))}\" cy=\"{Coordinate(y)}\" r=\"7\" fill=\"{HtmlPalette.Ink}\"/>");
            }

            svg.Append($"<text x=\"{Coordinate(plotRight + 14)}\" y=\"{Coordinate(y + 5)}\" font-size=\"15\" fill=\"{HtmlPalette.Ink}\" xml:space=\"preserve\">{Escape(label)}</text>");
        }

        return svg.Append("</svg>").ToString();
    }

    /// <summary>
    /// Each strain's course of sugar left (share of its starting °Brix) against days, one small panel per strain on one
    /// shared time axis: the median as a line and the middle half of the lots as a band.
    /// </summary>
    public static string Courses(IReadOnlyList<StrainCourse> courses, string id, string description)
    {
        const int columns = 3;
        const double panelWidth = 300, panelHeight = 190, gapX = 24, gapY = 34, left = 52, top = 30, bottom = 44;
        int panelRows = (courses.Count + columns - 1) / columns;
        double width = left + (columns * panelWidth) + ((columns - 1) * gapX) + 8;
        double height = (panelRows * (top + panelHeight + bottom)) + ((panelRows - 1) * gapY) + 24;
        double lastDay = courses.SelectMany(c => c.Days).DefaultIfEmpty(1).Max();
        var (_, xHi, xStep) = Axis(0, Math.Max(lastDay, 1), zeroBased: true);
        double yLo = Math.Min(0, courses.SelectMany(c => c.Q1).Where(double.IsFinite).DefaultIfEmpty(0).Min());
        yLo = Math.Floor(yLo * 10) / 10;
        const double yHi = 1.0;

        var svg = Open(id, width, height, "Typical course of sugar by strain", description);
        for (int i = 0; i < courses.Count; i++)
        {
            var c = courses[i];
            double ox = left + (i % columns * (panelWidth + gapX));
            double oy = (i / columns * (top + panelHeight + bottom + gapY)) + top;
            double X(double d) => ox + (d / xHi * panelWidth);
            double Y(double s) => oy + ((yHi - s) / (yHi - yLo) * panelHeight);

            svg.Append($"<text x=\"{Coordinate(ox)}\" y=\"{Coordinate(oy - 10)}\" font-size=\"16\" font-weight=\"bold\" fill=\"{HtmlPalette.Ink}\">{Escape(c.Strain)}<tspan font-weight=\"normal\" fill=\"{HtmlPalette.Muted}\"> · {Count(c.Lots)} logged lots</tspan></text>");
            foreach (double s in new[] { 0.0, 0.5, 1.0 })
            {
                svg.Append($"<line x1=\"{Coordinate(ox)}\" y1=\"{Coordinate(Y(s))}\" x2=\"{Coordinate(ox + panelWidth)}\" y2=\"{Coordinate(Y(s))}\" stroke=\"{HtmlPalette.Hairline}\" stroke-width=\"1\"/>");
                if (i % columns == 0)
                {
                    svg.Append($"<text x=\"{Coordinate(ox - 6)}\" y=\"{Coordinate(Y(s) + 5)}\" text-anchor=\"end\" font-size=\"14\" fill=\"{HtmlPalette.Muted}\">{Number(s * 100, "0")} %</text>");
                }
            }

            for (int k = 0; k <= (int)Math.Round(xHi / xStep); k++)
            {
                double d = k * xStep;
                svg.Append($"<line x1=\"{Coordinate(X(d))}\" y1=\"{Coordinate(oy + panelHeight)}\" x2=\"{Coordinate(X(d))}\" y2=\"{Coordinate(oy + panelHeight + 5)}\" stroke=\"{HtmlPalette.Muted}\" stroke-width=\"1\"/>");
                svg.Append($"<text x=\"{Coordinate(X(d))}\" y=\"{Coordinate(oy + panelHeight + 20)}\" text-anchor=\"middle\" font-size=\"14\" fill=\"{HtmlPalette.Muted}\">{Number(d, "0")}</text>");
            }

            svg.Append($"<text x=\"{Coordinate(ox + (panelWidth / 2))}\" y=\"{Coordinate(oy + panelHeight + 38)}\" text-anchor=\"middle\" font-size=\"14\" fill=\"{HtmlPalette.Muted}\">days from the start</text>");
            svg.Append($"<rect x=\"{Coordinate(ox)}\" y=\"{Coordinate(oy)}\" width=\"{Coordinate(panelWidth)}\" height=\"{Coordinate(panelHeight)}\" fill=\"none\" stroke=\"{HtmlPalette.Muted}\" stroke-width=\"1\"/>");
            if (c.Days.Count < 2)
            {
                svg.Append($"<text x=\"{Coordinate(ox + (panelWidth / 2))}\" y=\"{Coordinate(oy + (panelHeight / 2))}\" text-anchor=\"middle\" font-size=\"15\" fill=\"{HtmlPalette.Muted}\">too few logs for a course</text>");
                continue;
            }

            var band = new StringBuilder();
            for (int j = 0; j < c.Days.Count; j++)
            {
                band.Append(j == 0 ? "M" : " L").Append(Coordinate(X(c.Days[j]))).Append(' ').Append(Coordinate(Y(c.Q3[j])));
            }

            for (int j = c.Days.Count - 1; j >= 0; j--)
            {
                band.Append(" L").Append(Coordinate(X(c.Days[j]))).Append(' ').Append(Coordinate(Y(c.Q1[j])));
            }

            svg.Append($"<path d=\"{band} Z\" fill=\"{HtmlPalette.HeaderFill}\" stroke=\"none\"/>");
            var line = new StringBuilder();
            for (int j = 0; j < c.Days.Count; j++)
            {
                line.Append(j == 0 ? "M" : " L").Append(Coordinate(X(c.Days[j]))).Append(' ').Append(Coordinate(Y(c.Median[j])));
            }

            svg.Append($"<path d=\"{line}\" fill=\"none\" stroke=\"{HtmlPalette.Accent}\" stroke-width=\"3\" stroke-linejoin=\"round\"/>");
        }

        return svg.Append("</svg>").ToString();
    }

    private static StringBuilder Open(string id, double width, double height, string title, string description)
    {
        var svg = new StringBuilder(4096);
        svg.Append($"<svg class=\"chart\" viewBox=\"0 0 {Coordinate(width)} {Coordinate(height)}\" role=\"img\" aria-labelledby=\"{id}-title {id}-desc\" {Font} xmlns=\"http://www.w3.org/2000/svg\">");
        svg.Append($"<title id=\"{id}-title\">{Escape(title)}</title><desc id=\"{id}-desc\">{Escape(description)}</desc>");
        return svg;
    }

    /// <summary>Round axis limits around [<paramref name="min"/>, <paramref name="max"/>] and a tick step of 1, 2 or 5 × 10ⁿ giving 3 to 7 ticks.</summary>
    internal static (double Low, double High, double Step) Axis(double min, double max, bool zeroBased = false)
    {
        if (!(max > min))
        {
            double pad = Math.Abs(min) > 0 ? Math.Abs(min) * 0.05 : 1;
            (min, max) = (min - pad, max + pad);
        }

        double span = max - min;
        double raw = span / 5;
        double magnitude = Math.Pow(10, Math.Floor(Math.Log10(raw)));
        double step = new[] { 1.0, 2.0, 5.0, 10.0 }.Select(m => m * magnitude).First(s => span / s <= 6);
        double low = zeroBased ? 0 : Math.Floor(min / step) * step;
        double high = Math.Ceiling(max / step) * step;
        return (Math.Round(low, 10), Math.Round(high, 10), step);
    }
}
