using System.Globalization;
using YieldBench.Core.Review;
using YieldBench.Core.Review.Strains;

namespace YieldBench.Reports.Tables;

/// <summary>The strain comparison as tables: the ranking, the adjusted differences and the pairwise shifts.</summary>
public static partial class ReviewTables
{
    /// <summary>
    /// Each compared strain's raw median and adjusted conversion at the reference sugar, in the review's ranking
    /// (<see cref="ReviewFigures.Ranking"/>).
    /// </summary>
    public static ReportTable StrainRanking(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var c = review.Strains.Comparison;
        IReadOnlyList<Column<(RankedStrain Strain, int Rank)>> columns =
        [
            new("rank", "Rank", CellKind.Integer, r => r.Rank),
            new("strain", "Strain", CellKind.Text, r => r.Strain.Strain),
            new("lots", "Lots", CellKind.Integer, r => r.Strain.Lots),
            new("raw_median", "Raw median factor (% v/v per °Brix)", CellKind.Number, r => r.Strain.RawMedian, "0.0000"),
            new("adjusted_factor", "Adjusted factor at " + c.ReferenceBrix.ToString("0.0", CultureInfo.InvariantCulture) + " °Brix", CellKind.Number, r => r.Strain.Adjusted?.Factor ?? double.NaN, "0.0000"),
            new("adjusted_low", "95 % interval: low", CellKind.Number, r => r.Strain.Adjusted?.FactorInterval.Low ?? double.NaN, "0.0000"),
            new("adjusted_high", "95 % interval: high", CellKind.Number, r => r.Strain.Adjusted?.FactorInterval.High ?? double.NaN, "0.0000"),
            new("predicted_abv", "Alcohol from " + c.ReferenceBrix.ToString("0.0", CultureInfo.InvariantCulture) + " °Brix (% v/v)", CellKind.Number, r => r.Strain.Adjusted?.PredictedAbv ?? double.NaN, "0.00"),
        ];
        return ReportTable.Of(columns, review.Figures.Ranking.Select((r, i) => (r, i + 1)));
    }

    private static IReadOnlyList<Column<PairwiseShift>> ShiftTable { get; } =
    [
        new("first", "First strain", CellKind.Text, p => p.First),
        new("second", "Second strain", CellKind.Text, p => p.Second),
        new("shift", "Shift, first − second (% v/v per °Brix)", CellKind.Number, p => p.Shift, "+0.0000;-0.0000;0.0000"),
        new("shift_low", "Interval low", CellKind.Number, p => p.Interval.Low, "+0.0000;-0.0000;0.0000"),
        new("shift_high", "Interval high", CellKind.Number, p => p.Interval.High, "+0.0000;-0.0000;0.0000"),
        new("p", "Mann–Whitney p", CellKind.Number, p => p.P, ReportColumn.PValueFormat),
        new("holm_p", "Holm-adjusted p", CellKind.Number, p => p.HolmP, ReportColumn.PValueFormat),
    ];

    /// <summary>Pairwise Hodges–Lehmann shifts with Holm-adjusted p-values; pairs under 0.05 highlighted.</summary>
    public static ReportTable PairwiseShifts(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        return ReportTable.Of(ShiftTable, review.Strains.Comparison.Pairs, p => p.HolmP < 0.05);
    }

    private static IReadOnlyList<Column<AdjustedDifference>> DifferenceTable { get; } =
    [
        new("first", "First strain", CellKind.Text, d => d.First),
        new("second", "Second strain", CellKind.Text, d => d.Second),
        new("abv_difference", "Alcohol difference, first − second (% v/v)", CellKind.Number, d => d.AbvDifference, "+0.00;-0.00;0.00"),
        new("low", "Interval low", CellKind.Number, d => d.Interval.Low, "+0.00;-0.00;0.00"),
        new("high", "Interval high", CellKind.Number, d => d.Interval.High, "+0.00;-0.00;0.00"),
    ];

    /// <summary>Adjusted differences in alcohol at the same starting sugar (and vessel mix); those whose interval excludes 0 highlighted.</summary>
    public static ReportTable AdjustedDifferences(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        return ReportTable.Of(DifferenceTable, review.Strains.Comparison.AdjustedDifferences, d => d.Interval.IsDefined && (d.Interval.Low > 0 || d.Interval.High < 0));
    }
}
