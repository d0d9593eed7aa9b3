using YieldBench.Core.Review;
using YieldBench.Reports.Kinetics;

namespace YieldBench.Reports.Tables;

/// <summary>
/// The long tables a report shows twice, once as a data file and once on a sheet: built once, on whichever thread asks
/// first, and shared read-only (at 100,000 lots the lots table holds four million cells, and building
/// it was a second of the report's time). The lots sheet's rows are the data file's rows in the sheet's order.
/// </summary>
internal sealed class SharedTables
{
    private readonly Lazy<ReportTable> lots;
    private readonly Lazy<ReportTable> lotsByStrain;
    private readonly Lazy<ReportTable?> kineticsLots;

    public SharedTables(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        Review = review;
        lots = new(() => ReviewTables.Lots(review), LazyThreadSafetyMode.ExecutionAndPublication);
        lotsByStrain = new(() => lots.Value.Reordered(review.Figures.LotsInStrainOrder), LazyThreadSafetyMode.ExecutionAndPublication);
        kineticsLots = new(() => review.Kinetics is { } k ? KineticsTables.Lots(k, review.Settings.TemperatureUnit) : null, LazyThreadSafetyMode.ExecutionAndPublication);
    }

    /// <summary>The review the tables show.</summary>
    public ReviewResult Review { get; }

    /// <summary>One row per lot in input order (data/lots.csv).</summary>
    public ReportTable Lots => lots.Value;

    /// <summary>The same rows in the lots sheet's order (<see cref="ReviewFigures.LotsInStrainOrder"/>).</summary>
    public ReportTable LotsByStrain => lotsByStrain.Value;

    /// <summary>Kinetics per lot (data/kinetics.csv and the kinetics sheet), or null without logs.</summary>
    public ReportTable? KineticsLots => kineticsLots.Value;
}
