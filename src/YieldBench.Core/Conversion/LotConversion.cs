using YieldBench.Core.Lots;

namespace YieldBench.Core.Conversion;

/// <summary>
/// The conversion measures of one lot (definitions and sources in docs/methods.md, "The four conversion measures").
/// </summary>
public sealed record LotConversion
{
    /// <summary>The lot.</summary>
    public required Lot Lot { get; init; }

    /// <summary>Effective starting °Brix after recorded additions.</summary>
    public required double EffectiveStartingBrix { get; init; }

    /// <summary>True when additions changed the starting sugar.</summary>
    public required bool AdditionsApplied { get; init; }

    /// <summary>Fermentable sugar at the start, g/L: the sugar model at the measured °Brix, corrected for additions by mass balance.</summary>
    public required double StartingSugarGl { get; init; }

    /// <summary>Residual sugar used, g/L (0 when not recorded).</summary>
    public required double ResidualSugarGl { get; init; }

    /// <summary>
    /// °Brix actually fermented: effective start minus the °Brix-equivalent of residual sugar, that equivalent being
    /// the residual sugar's share of the starting sugar (start °Brix × consumed ÷ starting sugar). NaN when nothing
    /// was consumed.
    /// </summary>
    public required double FermentedBrix { get; init; }

    /// <summary>Sugar consumed, g/L: starting sugar minus residual sugar (negative when residual sugar is the larger).</summary>
    public required double SugarConsumedGl { get; init; }

    /// <summary>Final alcohol % v/v ÷ effective starting °Brix.</summary>
    public required double AbvPerBrix { get; init; }

    /// <summary>Final alcohol % v/v ÷ °Brix fermented.</summary>
    public required double AbvPerBrixFermented { get; init; }

    /// <summary>Sugar consumed (g/L) ÷ final alcohol (% v/v); compare 16.83 (OIV/EU convention).</summary>
    public required double SugarGlPerAbv { get; init; }

    /// <summary>Ethanol formed (g/L) ÷ (0.5114 × sugar consumed g/L): share of the Gay-Lussac theoretical yield.</summary>
    public required double GayLussacEfficiency { get; init; }

    /// <summary>Notes on approximations and gaps for this lot (texts in <see cref="ConversionNotes"/>).</summary>
    public IReadOnlyList<string> Notes { get; init; } = [];

    /// <summary>The value of a measure.</summary>
    public double Get(ConversionMeasure measure) => measure switch
    {
        ConversionMeasure.AbvPerBrix => AbvPerBrix,
        ConversionMeasure.AbvPerBrixFermented => AbvPerBrixFermented,
        ConversionMeasure.SugarGlPerAbv => SugarGlPerAbv,
        ConversionMeasure.GayLussacEfficiency => GayLussacEfficiency,
        _ => throw new ArgumentOutOfRangeException(nameof(measure), measure, "Unknown measure."),
    };
}

/// <summary>The four per-lot conversion measures.</summary>
public enum ConversionMeasure
{
    /// <summary><c>abv_per_brix</c>.</summary>
    AbvPerBrix,

    /// <summary><c>abv_per_brix_fermented</c>.</summary>
    AbvPerBrixFermented,

    /// <summary><c>sugar_gl_per_abv</c>.</summary>
    SugarGlPerAbv,

    /// <summary><c>gay_lussac_efficiency</c>.</summary>
    GayLussacEfficiency,
}

/// <summary>Data-file names of the measures.</summary>
public static class ConversionMeasureNames
{
    /// <summary>All measures in their report order.</summary>
    public static IReadOnlyList<ConversionMeasure> All { get; } =
        [ConversionMeasure.AbvPerBrix, ConversionMeasure.AbvPerBrixFermented, ConversionMeasure.SugarGlPerAbv, ConversionMeasure.GayLussacEfficiency];

    /// <summary>snake_case name used in data files.</summary>
    public static string Name(this ConversionMeasure m) => m switch
    {
        ConversionMeasure.AbvPerBrix => "abv_per_brix",
        ConversionMeasure.AbvPerBrixFermented => "abv_per_brix_fermented",
        ConversionMeasure.SugarGlPerAbv => "sugar_gl_per_abv",
        ConversionMeasure.GayLussacEfficiency => "gay_lussac_efficiency",
        _ => throw new ArgumentOutOfRangeException(nameof(m), m, "Unknown measure."),
    };
}
