using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Review.Strains;
using YieldBench.Core.Units;

namespace YieldBench.Reports.Tables;

/// <summary>
/// The review laid out as tables. Column names and order are the data files' contract (docs/report-guide.md); the
/// workbook shows the same tables with plain headings. Every column reads its value from the review's per-lot view or
/// its other records; nothing here computes a statistic, a join or an order.
/// </summary>
public static partial class ReviewTables
{
    /// <summary>The lots table's starting sugar after additions (the native chart's x values).</summary>
    internal static readonly Column<LotReview> StartingBrix = new("starting_brix", "Starting sugar after additions (°Brix)", CellKind.Number, l => l.Conversion.EffectiveStartingBrix, "0.00");

    /// <summary>The lots table's final alcohol (the native chart's y values).</summary>
    internal static readonly Column<LotReview> FinalAbv = new("final_abv", "Final alcohol (% v/v)", CellKind.Number, l => l.Lot.FinalAlcohol.PercentVolume, "0.00");

    /// <summary>
    /// The columns of data/lots.csv and the Lots sheet, each with the accessor that reads it from a lot's review, the
    /// most-read first: the lot, its flags, its sugar, alcohol and factor, then the rest of what was recorded.
    /// </summary>
    internal static IReadOnlyList<Column<LotReview>> LotTable { get; } =
    [
        new("lot_id", "Lot", CellKind.Text, l => l.Lot.LotId),
        new("season", "Season", CellKind.Integer, l => Cells.Season(l.Lot.Season)),
        new("strain", "Strain", CellKind.Text, l => l.Lot.Strain),
        new("flags", "Flags", CellKind.Text, l => l.FlagCodes.Count == 0 ? null : string.Join(';', l.FlagCodes)),
        StartingBrix,
        FinalAbv,
        new("abv_per_brix", "Alcohol per °Brix (% v/v per °Brix)", CellKind.Number, l => l.Conversion.AbvPerBrix, "0.0000"),
        new("residual_sugar_gl", "Residual sugar (g/L)", CellKind.Number, l => Cells.Number(l.Lot.ResidualSugarGl), "0.0"),
        new("vessel", "Vessel", CellKind.Text, l => l.Lot.Vessel),
        new("variety", "Variety", CellKind.Text, l => l.Lot.Variety),
        new("robust_z", "Robust z within strain", CellKind.Number, l => Cells.Number(l.Score?.Z), "0.00"),
        new("abv_per_brix_fermented", "Alcohol per °Brix fermented", CellKind.Number, l => l.Conversion.AbvPerBrixFermented, "0.0000"),
        new("sugar_gl_per_abv", "Sugar per % alcohol (g/L per % v/v)", CellKind.Number, l => l.Conversion.SugarGlPerAbv, "0.00"),
        new("gay_lussac_efficiency", "Share of Gay-Lussac yield", CellKind.Share, l => l.Conversion.GayLussacEfficiency, "0.0%"),
        new("measured_starting_brix", "Starting sugar as measured (°Brix)", CellKind.Number, l => l.Lot.StartingSugar.Brix, "0.00"),
        new("starting_sugar_scale", "Scale recorded", CellKind.Text, l => l.Lot.RecordedStartingSugar.Label),
        new("starting_sugar_as_recorded", "Starting sugar in the recorded scale", CellKind.Number, l => l.Lot.RecordedStartingSugar.Value, "0.000"),
        new("starting_sugar_gl", "Fermentable sugar at start (g/L)", CellKind.Number, l => l.Conversion.StartingSugarGl, "0.0"),
        new("fermented_brix", "°Brix fermented", CellKind.Number, l => l.Conversion.FermentedBrix, "0.00"),
        new("sugar_consumed_gl", "Sugar consumed (g/L)", CellKind.Number, l => l.Conversion.SugarConsumedGl, "0.0"),
        new("additions_applied", "Additions applied", CellKind.Boolean, l => Cells.Boolean(l.Conversion.AdditionsApplied)),
        new("must_volume_l", "Must volume (L)", CellKind.Number, l => Cells.Number(l.Lot.Additions.MustVolumeL), "0"),
        new("water_added_l", "Water added (L)", CellKind.Number, l => Cells.Number(l.Lot.Additions.WaterAddedL), "0"),
        new("sugar_added_kg", "Sugar added (kg)", CellKind.Number, l => Cells.Number(l.Lot.Additions.SugarAddedKg), "0.0"),
        new("vessel_capacity_l", "Vessel capacity (L)", CellKind.Number, l => Cells.Number(l.Lot.VesselCapacityL), "0"),
        new("block", "Block", CellKind.Text, l => l.Lot.Block),
        new("colour", "Colour", CellKind.Text, l => Cells.Colour(l.Lot.Colour)),
        new("final_sugar_brix", "Final sugar reading (°Brix)", CellKind.Number, l => Cells.Number(l.Lot.FinalSugar?.Brix), "0.00"),
        new("yan_mg_l", "YAN (mg N/L)", CellKind.Number, l => Cells.Number(l.Lot.YanMgL), "0"),
        new("ph", "pH", CellKind.Number, l => Cells.Number(l.Lot.Ph), "0.00"),
        new("ta_gl", "TA (g/L)", CellKind.Number, l => Cells.Number(l.Lot.TaGl), "0.00"),
        new("mean_temp_c", "Mean fermentation temperature (°C)", CellKind.Number, l => Cells.Number(l.Lot.MeanFermentationTempC), "0.0"),
        new("peak_temp_c", "Peak fermentation temperature (°C)", CellKind.Number, l => Cells.Number(l.Lot.PeakFermentationTempC), "0.0"),
        new("inoculation_date", "Inoculated", CellKind.DateTime, l => l.Lot.InoculationDate),
        new("dry_date", "Declared dry", CellKind.DateTime, l => l.Lot.DryDate),
        new("notes", "Notes", CellKind.Text, l => l.Lot.Notes),
        new("conversion_notes", "Approximations used", CellKind.Text, l => l.Conversion.Notes.Count == 0 ? null : string.Join("; ", l.Conversion.Notes)),
        new("source_file", "Source file", CellKind.Text, l => l.Lot.Source?.File),
        new("source_sheet", "Source sheet", CellKind.Text, l => l.Lot.Source?.Sheet),
        new("source_row", "Source row", CellKind.Integer, l => l.Lot.Source?.Row),
    ];

    /// <summary>The 1-based position of a column in the lots table (the Lots sheet's column number).</summary>
    internal static int LotColumnNumber(Column<LotReview> column) => LotTable.ToList().IndexOf(column) + 1;

    /// <summary>Columns of data/lots.csv and the lots sheet, in order.</summary>
    public static IReadOnlyList<ReportColumn> LotColumns { get; } = LotTable.Select(c => c.Definition).ToArray();

    /// <summary>
    /// One row per lot used, in <paramref name="order"/> (default: the review's input order, as data/lots.csv has
    /// it); lots to look at are highlighted.
    /// </summary>
    public static ReportTable Lots(ReviewResult review, IEnumerable<LotReview>? order = null)
    {
        ArgumentNullException.ThrowIfNull(review);
        return ReportTable.Of(TemperatureColumns.In(LotTable, review.Settings.TemperatureUnit), order ?? review.LotReviews, l => l.IsFlagged);
    }

    /// <summary>The review's lots in the Lots sheet's order (<see cref="ReviewFigures.LotsInStrainOrder"/>).</summary>
    public static IReadOnlyList<LotReview> InStrainOrder(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        return review.Figures.LotsInStrainOrder.Select(i => review.LotReviews[i]).ToArray();
    }

    /// <summary>Columns of data/groups.csv (the sheets add a note column).</summary>
    public static IReadOnlyList<ReportColumn> GroupColumns => GroupTable.Select(c => c.Definition).ToArray();

    private static IReadOnlyList<Column<GroupSummary>> GroupTable { get; } =
    [
        new("grouping", "Grouping", CellKind.Text, g => g.Grouping),
        new("group", "Group", CellKind.Text, g => g.Group),
        new("measure", "Measure", CellKind.Text, g => g.Measure.Name()),
        new("n", "Lots", CellKind.Integer, g => g.N),
        new("median", "Median", CellKind.Number, g => g.Median, "0.0000"),
        new("mad", "MAD (scaled)", CellKind.Number, g => g.Mad, "0.0000"),
        new("qn", "Qn", CellKind.Number, g => g.Qn, "0.0000"),
        new("sn", "Sn", CellKind.Number, g => g.Sn, "0.0000"),
        new("iqr", "IQR", CellKind.Number, g => g.Iqr, "0.0000"),
        new("mean", "Mean", CellKind.Number, g => g.Mean, "0.0000"),
        new("sd", "SD", CellKind.Number, g => g.Sd, "0.0000"),
        new("trimmed_mean", "20 % trimmed mean", CellKind.Number, g => g.TrimmedMean, "0.0000"),
        new("huber", "Huber location", CellKind.Number, g => g.Huber, "0.0000"),
        new("min", "Min", CellKind.Number, g => g.Min, "0.0000"),
        new("max", "Max", CellKind.Number, g => g.Max, "0.0000"),
        new("ci_low", "Median 95 % interval low", CellKind.Number, g => g.MedianInterval.Low, "0.0000"),
        new("ci_high", "Median 95 % interval high", CellKind.Number, g => g.MedianInterval.High, "0.0000"),
    ];

    /// <summary>Group summaries: every grouping, or only <paramref name="grouping"/>; with a note column for the sheets.</summary>
    public static ReportTable Groups(ReviewResult review, string? grouping = null, bool withNote = false)
    {
        ArgumentNullException.ThrowIfNull(review);
        IReadOnlyList<Column<GroupSummary>> columns = withNote ? [.. GroupTable, new("note", "Note", CellKind.Text, g => g.Note)] : GroupTable;
        return ReportTable.Of(columns, review.Strains.Groups.Where(g => grouping is null || g.Grouping == grouping));
    }

    private static IReadOnlyList<Column<LotFlag>> FlagTable { get; } =
    [
        new("lot_id", "Lot", CellKind.Text, f => f.LotId),
        new("season", "Season", CellKind.Integer, f => f.Season),
        new("code", "Flag", CellKind.Text, f => f.Code),
        new("severity", "Severity", CellKind.Text, f => ReviewTexts.Severity(f.Severity)),
        new("measure", "Measure judged", CellKind.Text, f => f.Measure),
        new("value", "Value", CellKind.Number, f => f.Value, "0.0000"),
        new("reference_group", "Judged against", CellKind.Text, f => f.ReferenceGroup),
        new("reference_median", "Reference median", CellKind.Number, f => f.ReferenceMedian, "0.0000"),
        new("reference_scale", "Reference scale", CellKind.Number, f => f.ReferenceScale, "0.0000"),
        new("reason", "Why", CellKind.Text, f => f.Reason),
        new("follow_up", "Suggested follow-up", CellKind.Text, f => f.FollowUp),
    ];

    /// <summary>Columns of data/flags.csv.</summary>
    public static IReadOnlyList<ReportColumn> FlagColumns => FlagTable.Select(c => c.Definition).ToArray();

    /// <summary>Every strain-review flag in the review's order.</summary>
    public static ReportTable Flags(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        return ReportTable.Of(FlagTable, review.Strains.Flags);
    }

    /// <summary>Cells a per-lot table repeats on most rows, boxed once (a box is never changed, so rows can share it).</summary>
    private static class Cells
    {
        private static readonly object NaN = double.NaN;
        private static readonly object True = true;
        private static readonly object False = false;
        private static readonly object[] Seasons = Enumerable.Range(1900, 301).Select(y => (object)y).ToArray();

        public static object Number(double? value) => value is { } v && !double.IsNaN(v) ? v : NaN;

        public static object Season(int season) => (uint)(season - 1900) < (uint)Seasons.Length ? Seasons[season - 1900] : season;

        public static object Boolean(bool value) => value ? True : False;

        /// <summary>A colour as the lots table writes it: its lower-case name, or empty when unknown.</summary>
        public static string? Colour(WineColour colour) => colour == WineColour.Unknown ? null : ColourName(colour);
    }

    private static readonly System.Collections.Concurrent.ConcurrentDictionary<WineColour, string> ColourNames = new();

    /// <summary>A colour's name in lower case (also <c>unknown</c>), each name made once.</summary>
    internal static string ColourName(WineColour colour) => ColourNames.GetOrAdd(colour, c => c.ToString().ToLowerInvariant());
}
