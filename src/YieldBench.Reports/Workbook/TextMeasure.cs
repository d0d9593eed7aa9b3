using SkiaSharp;
using YieldBench.Reports.Charts;

namespace YieldBench.Reports.Workbook;

/// <summary>
/// Measures cell text with the shipped fonts (DejaVu Sans, which the workbook names as its font), so column widths and
/// row heights fit the text: in LibreOffice, which has DejaVu Sans, exactly; in Excel, which substitutes a narrower
/// font, with room to spare. A text's width is the sum of its characters' advances (each measured once with
/// SkiaSharp and kept); italic is the regular font slanted, with the same advances.
/// </summary>
internal sealed class TextMeasure
{
    /// <summary>The workbook's font.</summary>
    public const string FontName = ReportFonts.FamilyName;

    /// <summary>The workbook's body size, points.</summary>
    public const double BodySize = 10;

    /// <summary>Pixels per point at the 96 dpi spreadsheet applications lay sheets out at.</summary>
    public const double PixelsPerPoint = 96.0 / 72.0;

    /// <summary>
    /// Pixels per character of column width: the advance of a digit of the body font (DejaVu Sans digits are 0.636 em,
    /// 8.48 px at 10 pt), rounded down as spreadsheet applications round it, so widths err on the wide side.
    /// </summary>
    public const double PixelsPerWidthUnit = 8;

    /// <summary>Room a cell keeps free on its left and right together, px.</summary>
    public const double CellPadding = 10;

    /// <summary>Height of one line of text at <paramref name="size"/> points, in points (DejaVu Sans: 1.164 em, rounded up with leading).</summary>
    public static double LineHeight(double size) => Math.Ceiling(size * 1.28 * 4) / 4;

    private readonly double[][] ascii = [new double[128], new double[128]];
    private readonly Dictionary<char, double>[] other = [new(), new()];
    private readonly SKFont[] fonts;

    public TextMeasure()
    {
        // Measured at 100 px and scaled: advances are linear in size.
        fonts = [new SKFont(ReportFonts.Shared(bold: false), 100), new SKFont(ReportFonts.Shared(bold: true), 100)];
        for (int b = 0; b < 2; b++)
        {
            for (int c = 0; c < 128; c++)
            {
                ascii[b][c] = fonts[b].MeasureText(((char)c).ToString());
            }
        }
    }

    /// <summary>Width of <paramref name="text"/> on one line at <paramref name="size"/> points, px.</summary>
    public double Width(string text, double size = BodySize, bool bold = false) => Width(text.AsSpan(), size, bold);

    /// <summary>Width of <paramref name="text"/> on one line, px.</summary>
    public double Width(ReadOnlySpan<char> text, double size = BodySize, bool bold = false)
    {
        int b = bold ? 1 : 0;
        double sum = 0;
        foreach (char c in text)
        {
            sum += c < 128 ? ascii[b][c] : Other(b, c);
        }

        return sum * size * PixelsPerPoint / 100;
    }

    /// <summary>The column width (in width units) that shows <paramref name="px"/> pixels of text with the cell's padding.</summary>
    public static double WidthUnits(double px) => Math.Ceiling((px + CellPadding) / PixelsPerWidthUnit * 4) / 4;

    /// <summary>Pixels of text a column of <paramref name="units"/> width units shows beside its padding.</summary>
    public static double TextPixels(double units) => (units * PixelsPerWidthUnit) - CellPadding;

    /// <summary>
    /// The lines <paramref name="text"/> takes when wrapped at word boundaries to <paramref name="widthPx"/> (a word
    /// longer than the width is broken, as spreadsheet applications break it); line breaks in the text start new lines.
    /// </summary>
    public int Lines(string text, double widthPx, double size = BodySize, bool bold = false)
    {
        if (string.IsNullOrEmpty(text))
        {
            return 1;
        }

        int lines = 0;
        foreach (string paragraph in text.Replace("\r\n", "\n", StringComparison.Ordinal).Split('\n'))
        {
            lines += ParagraphLines(paragraph, widthPx, size, bold);
        }

        return lines;
    }

    private int ParagraphLines(string text, double widthPx, double size, bool bold)
    {
        double space = Width(" ", size, bold);
        int lines = 1;
        double used = 0;
        foreach (string word in text.Split(' '))
        {
            double w = Width(word, size, bold);
            if (used > 0 && used + space + w > widthPx)
            {
                lines++;
                used = 0;
            }

            if (used > 0)
            {
                used += space;
            }

            // A word wider than the line fills whole lines and starts the next with what is left of it.
            while (w > widthPx && widthPx > 0)
            {
                lines++;
                w -= widthPx;
            }

            used += w;
        }

        return lines;
    }

    private double Other(int bold, char c)
    {
        lock (other[bold])
        {
            if (!other[bold].TryGetValue(c, out double w))
            {
                w = fonts[bold].MeasureText(c.ToString());
                other[bold][c] = w;
            }

            return w;
        }
    }
}
