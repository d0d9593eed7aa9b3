using System.Reflection;
using ScottPlot;
using SkiaSharp;

namespace YieldBench.Reports.Charts;

/// <summary>
/// The font every chart uses, shipped inside this assembly (DejaVu Sans regular and bold, Bitstream Vera licence in
/// Fonts/LICENSE-DejaVu.txt). ScottPlot draws no text at all, and raises no error, on a machine without system
/// fonts; registering the shipped font first makes charts look the same everywhere.
/// </summary>
public static class ReportFonts
{
    /// <summary>Family name charts ask for.</summary>
    public const string FamilyName = "DejaVu Sans";

    private static readonly Lock Gate = new();
    private static readonly Lazy<SKTypeface> SharedRegular = new(() => Typeface(bold: false));
    private static readonly Lazy<SKTypeface> SharedBold = new(() => Typeface(bold: true));
    private static bool registered;

    /// <summary>
    /// Puts the shipped font in front of ScottPlot's font resolvers and makes it the default. Safe to call many times
    /// and from many threads; every chart builder calls it.
    /// </summary>
    public static void EnsureRegistered()
    {
        lock (Gate)
        {
            if (registered)
            {
                return;
            }

            Fonts.FontResolvers.Insert(0, new EmbeddedFontResolver());
            Fonts.Default = FamilyName;
            registered = true;
        }
    }

    /// <summary>
    /// The shipped typeface (regular or bold), read once per process and shared by every chart on every thread (a
    /// typeface does not change once made; ScottPlot's charts draw with these too). Never dispose it.
    /// </summary>
    public static SKTypeface Shared(bool bold) => bold ? SharedBold.Value : SharedRegular.Value;

    /// <summary>The shipped typeface (regular or bold), read from the embedded resource (a new one, for the caller to dispose).</summary>
    public static SKTypeface Typeface(bool bold)
    {
        string name = bold ? "YieldBench.Reports.Fonts.DejaVuSans-Bold.ttf" : "YieldBench.Reports.Fonts.DejaVuSans.ttf";
        using var stream = Assembly.GetExecutingAssembly().GetManifestResourceStream(name)
            ?? throw new InvalidOperationException($"The font resource '{name}' is missing from the Reports assembly; check the EmbeddedResource items.");
        using var copy = new MemoryStream();
        stream.CopyTo(copy);
        using var data = SKData.CreateCopy(copy.ToArray());
        return SKTypeface.FromData(data)
            ?? throw new InvalidOperationException($"The font resource '{name}' could not be read as a typeface.");
    }

    private sealed class EmbeddedFontResolver : IFontResolver
    {
        public SKTypeface? CreateTypeface(string fontName, FontWeight weight, FontSlant slant, FontSpacing spacing) =>
            CreateTypeface(fontName, weight >= FontWeight.SemiBold, slant != FontSlant.Upright);

        public SKTypeface? CreateTypeface(string fontName, bool bold, bool italic)
        {
            // Only our family is answered; any other name falls through to ScottPlot's own resolvers.
            if (!string.Equals(fontName, FamilyName, StringComparison.OrdinalIgnoreCase))
            {
                return null;
            }

            return Shared(bold);
        }
    }
}
