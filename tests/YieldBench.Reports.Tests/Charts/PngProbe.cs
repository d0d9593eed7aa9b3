using SkiaSharp;

namespace YieldBench.Reports.Tests.Charts;

/// <summary>Decodes a PNG and measures how much its pixels vary, to tell a drawn chart from a blank one.</summary>
internal static class PngProbe
{
    public static (int Width, int Height) Size(byte[] png)
    {
        using var bitmap = SKBitmap.Decode(png) ?? throw new InvalidOperationException("not a decodable image");
        return (bitmap.Width, bitmap.Height);
    }

    /// <summary>Variance of grey levels (0–255) over a rectangle of the image.</summary>
    public static double GreyVariance(byte[] png, int left, int top, int width, int height)
    {
        using var bitmap = SKBitmap.Decode(png) ?? throw new InvalidOperationException("not a decodable image");
        double sum = 0, sumSq = 0;
        long n = 0;
        for (int y = top; y < Math.Min(bitmap.Height, top + height); y++)
        {
            for (int x = left; x < Math.Min(bitmap.Width, left + width); x++)
            {
                var c = bitmap.GetPixel(x, y);
                double g = (0.299 * c.Red) + (0.587 * c.Green) + (0.114 * c.Blue);
                sum += g;
                sumSq += g * g;
                n++;
            }
        }

        double mean = sum / n;
        return (sumSq / n) - (mean * mean);
    }

    /// <summary>Count of pixels darker than <paramref name="threshold"/> in a rectangle.</summary>
    public static int DarkPixels(byte[] png, int left, int top, int width, int height, int threshold = 128)
    {
        using var bitmap = SKBitmap.Decode(png) ?? throw new InvalidOperationException("not a decodable image");
        int count = 0;
        for (int y = top; y < Math.Min(bitmap.Height, top + height); y++)
        {
            for (int x = left; x < Math.Min(bitmap.Width, left + width); x++)
            {
                var c = bitmap.GetPixel(x, y);
                if ((0.299 * c.Red) + (0.587 * c.Green) + (0.114 * c.Blue) < threshold)
                {
                    count++;
                }
            }
        }

        return count;
    }
}
