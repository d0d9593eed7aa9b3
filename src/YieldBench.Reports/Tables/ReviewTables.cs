using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.HouseFactor;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Review.Strains;
using YieldBench.Core.Units;

namespace YieldBench.Reports.Tables;

/// <summary>
/// The review laid out as tables. Column names and order are the data files' contract (docs/report-guide.md); the
/// workbook shows the same tables with plain headings.
/// </summary>
public static class ReviewTables
{
    /// <summary>Columns of data/lots.csv and the lots sheet, in order.</summary>
    public static IReadOnlyList<ReportColumn> LotColumns { get; } =
    [
        new("lot_id", "Lot", CellKind.Text),
        new("season", "Season", CellKind.Integer),
        new("strain", "Strain", CellKind.Text),
        new("vessel", "Vessel", CellKind.Text),
        new("variety", "Variety", CellKind.Text),
        new("starting_brix", "Starting sugar after additions (°Brix)", CellKind.Number, "0.00"),
        new("final_abv", "Final alcohol (% v/v)", CellKind.Number, "0.00"),
        new("residual_sugar_gl", "Residual sugar (g/L)", CellKind.Number, "0.0"),
        new("abv_per_brix", "Alcohol per °Brix (% v/v per °Brix)", CellKind.Number, "0.0000"),
        new("abv_per_brix_fermented", "Alcohol per °Brix fermented", CellKind.Number, "0.0000"),
        new("sugar_gl_per_abv", "Sugar per % alcohol (g/L per % v/v)", CellKind.Number, "0.00"),
        new("gay_lussac_efficiency", "Share of Gay-Lussac yield", CellKind.Share),
        new("robust_z", "Robust z within strain", CellKind.Number, "0.00"),
        new("flags", "Flags", CellKind.Text),
        new("measured_starting_brix", "Starting sugar as measured (°Brix)", CellKind.Number, "0.00"),
        new("starting_sugar_scale", "Scale recorded", CellKind.Text),
        new("starting_sugar_as_recorded", "Starting sugar in the recorded scale", CellKind.Number, "0.000"),
        new("starting_sugar_gl", "Fermentable sugar at start (g/L)", CellKind.Number, "0.0"),
        new("fermented_brix", "°Brix fermented", CellKind.Number, "0.00"),
        new("sugar_consumed_gl", "Sugar consumed (g/L)", CellKind.Number, "0.0"),
        new("additions_applied", "Additions applied", CellKind.Boolean),
        new("must_volume_l", "Must volume (L)", CellKind.Number, "0"),
        new("water_added_l", "Water added (L)", CellKind.Number, "0"),
        new("sugar_added_kg", "Sugar added (kg)", CellKind.Number, "0.0"),
        new("vessel_capacity_l", "Vessel capacity (L)", CellKind.Number, "0"),
        new("block", "Block", CellKind.Text),
        new("colour", "Colour", CellKind.Text),
        new("final_sugar_brix", "Final sugar reading (°Brix)", CellKind.Number, "0.00"),
        new("yan_mg_l", "YAN (mg N/L)", CellKind.Number, "0"),
        new("ph", "pH", CellKind.Number, "0.00"),
        new("ta_gl", "TA (g/L)", CellKind.Number, "0.00"),
        new("mean_temp_c", "Mean fermentation temperature (°C)", CellKind.Number, "0.0"),
        new("peak_temp_c", "Peak fermentation temperature (°C)", CellKind.Number, "0.0"),
        new("inoculation_date", "Inoculated", CellKind.DateTime),
        new("dry_date", "Declared dry", CellKind.DateTime),
        new("notes", "Notes", CellKind.Text),
        new("conversion_notes", "Approximations used", CellKind.Text),
        new("source_file", "Source file", CellKind.Text),
        new("source_sheet", "Source sheet", CellKind.Text),
        new("source_row", "Source row", CellKind.Integer),
    ];

    /// <summary>
    /// One row per lot used. <paramref name="order"/> gives the row order (data files keep input order; the lots sheet
    /// groups rows by strain so each strain's chart series is one block of cells).
    /// </summary>
    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    public static ReportTable Lots(ReviewResult review, IEnumerable<LotConversion>? order = null)
    {
        ArgumentNullException.ThrowIfNull(review);
        var table = new ReportTable(LotColumns);
        var scores = review.Strains.Scores.GroupBy(x => x.LotKey).ToDictionary(g => g.Key, g => g.First());
        var index = FlagIndex.Of(review);
        foreach (var c in order ?? review.Lots)
        {
            var lot = c.Lot;

            // Lot.Key formats the key on every call; the index holds each reviewed lot's key, built once.
            var key = index.KeyOf(c);
            var flags = index.Codes(key);
            table.Add(
            [
                lot.LotId,
                SeasonCell(lot.Season),
                lot.Strain,
                lot.Vessel,
                lot.Variety,
                c.EffectiveStartingBrix,
                lot.FinalAlcohol.PercentVolume,
                NumberCell(lot.ResidualSugarGl),
                c.AbvPerBrix,
                c.AbvPerBrixFermented,
                c.SugarGlPerAbv,
                c.GayLussacEfficiency,
                scores.TryGetValue(key, out var score) ? score.Z : NaNCell,
                flags.Count == 0 ? null : string.Join(';', flags),
                lot.StartingSugar.Brix,
                ScaleName(lot.StartingSugarScale),
                lot.StartingSugar.In(lot.StartingSugarScale),
                c.StartingSugarGl,
                c.FermentedBrix,
                c.SugarConsumedGl,
                c.AdditionsApplied ? TrueCell : FalseCell,
                NumberCell(lot.Additions.MustVolumeL),
                NumberCell(lot.Additions.WaterAddedL),
                NumberCell(lot.Additions.SugarAddedKg),
                NumberCell(lot.VesselCapacityL),
                lot.Block,
                ColourCell(lot.Colour),
                NumberCell(lot.FinalSugar?.Brix),
                NumberCell(lot.YanMgL),
                NumberCell(lot.Ph),
                NumberCell(lot.TaGl),
                NumberCell(lot.MeanFermentationTempC),
                NumberCell(lot.PeakFermentationTempC),
                lot.InoculationDate,
                lot.DryDate,
                lot.Notes,
                c.Notes.Count == 0 ? null : string.Join("; ", c.Notes),
                lot.Source?.File,
                lot.Source?.Sheet,
                lot.Source?.Row,
            ],
            highlight: index.WorstSeverity(key) is not null);
        }

        return table;
    }

    // Cells a per-lot table repeats on most rows, boxed once (a box is never changed, so rows can share it): at 100,000
    // lots a box per missing value, flag and season was tens of megabytes held while the report is written.
    private static readonly object NaNCell = double.NaN;
    private static readonly object TrueCell = true;
    private static readonly object FalseCell = false;
    private static readonly object[] SeasonCells = Enumerable.Range(1900, 301).Select(y => (object)y).ToArray();
    private static readonly System.Collections.Concurrent.ConcurrentDictionary<WineColour, string> ColourNames = new();

    private static object NumberCell(double? value) => value is { } v && !double.IsNaN(v) ? v : NaNCell;

    private static object SeasonCell(int season) => (uint)(season - 1900) < (uint)SeasonCells.Length ? SeasonCells[season - 1900] : season;

    /// <summary>A colour as the tables write it (lower-case name; null when unknown), each name made once.</summary>
    internal static string? ColourCell(WineColour colour) => colour == WineColour.Unknown ? null : LowerName(colour);

    /// <summary>The colour's name in lower case (also for <see cref="WineColour.Unknown"/>), each name made once.</summary>
    internal static string LowerName(WineColour colour) => ColourNames.GetOrAdd(colour, c => c.ToString().ToLowerInvariant());

    /// <summary>The lots in the lots sheet's order: by strain (ordinal), then season, then lot id.</summary>
    public static IReadOnlyList<LotConversion> ByStrain(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        return ByStrainIndices(review).Select(i => review.Lots[i]).ToArray();
    }

    /// <summary>The indices into the review's lots of <see cref="ByStrain"/>'s order (a stable sort, so ties keep input order).</summary>
    internal static int[] ByStrainIndices(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var lots = review.Lots;

        // Strains are few: each is ranked once (ordinal order) so most comparisons are of two integers; the index
        // breaks the last ties, which makes the unstable sort give the stable order.
        var strainRank = lots.Select(l => l.Lot.Strain).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal)
            .Select((strain, rank) => (strain, rank)).ToDictionary(x => x.strain, x => x.rank, StringComparer.Ordinal);
        var rank = new int[lots.Count];
        var season = new int[lots.Count];
        var order = new int[lots.Count];
        for (int i = 0; i < lots.Count; i++)
        {
            rank[i] = strainRank[lots[i].Lot.Strain];
            season[i] = lots[i].Lot.Season;
            order[i] = i;
        }

        Array.Sort(order, (a, b) =>
        {
            int c = rank[a].CompareTo(rank[b]);
            if (c == 0)
            {
                c = season[a].CompareTo(season[b]);
            }

            if (c == 0)
            {
                c = string.CompareOrdinal(lots[a].Lot.LotId, lots[b].Lot.LotId);
            }

            return c == 0 ? a.CompareTo(b) : c;
        });
        return order;
    }

    /// <summary>Flag codes of a lot from every section that flags lots, in a fixed order.</summary>
    public static IReadOnlyList<string> LotFlags(ReviewResult review, LotConversion lot)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(lot);
        var index = FlagIndex.Of(review);
        return index.Codes(index.KeyOf(lot));
    }

    /// <summary>
    /// True when the lot is one to look at: a strain-review flag or a kinetics follow-up flag (stuck, sluggish, too hot,
    /// not dry at log end). This drives the Lots-sheet highlight and the overview and console counts.
    /// </summary>
    public static bool IsFlagged(ReviewResult review, LotConversion lot) => LotSeverity(review, lot) is not null;

    /// <summary>
    /// True when the strain review flagged the lot. Conversion charts ring only these, so that they mark conversion
    /// findings; kinetics findings have their own charts.
    /// </summary>
    public static bool HasStrainFlag(ReviewResult review, LotConversion lot)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(lot);
        var index = FlagIndex.Of(review);
        return index.StrainFlags(index.KeyOf(lot)).Count > 0;
    }

    /// <summary>
    /// <see cref="HasStrainFlag"/> for many lots: the review's lookups are found once, and the review's own lots are
    /// answered from the set of those the strain review flagged (built once per review), by reference.
    /// </summary>
    public static Func<LotConversion, bool> StrainFlagTest(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var index = FlagIndex.Of(review);
        return index.HasStrainFlag;
    }

    /// <summary>The most serious follow-up item of a lot (strain review or kinetics), or null when it has none.</summary>
    public static FlagSeverity? LotSeverity(ReviewResult review, LotConversion lot)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(lot);
        var index = FlagIndex.Of(review);
        return index.WorstSeverity(index.KeyOf(lot));
    }

    /// <summary>Every follow-up item: the strain review's flags, then the kinetics follow-ups (<see cref="KineticsFollowUps"/>).</summary>
    public static IReadOnlyList<LotFlag> FollowUpItems(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        return FlagIndex.Of(review).Items;
    }

    /// <summary>
    /// Per-lot lookups built once per review: the tables, charts and overview ask about every lot, and scanning every
    /// flag per lot made those steps quadratic in lots.
    /// </summary>
    private sealed class FlagIndex
    {
        // Held through a Lazy: the table runs its factory outside its lock, and the report's threads (data files,
        // workbook layout, charts) all ask at once, so each built the whole index; now one builds it and the others wait.
        private static readonly System.Runtime.CompilerServices.ConditionalWeakTable<ReviewResult, Lazy<FlagIndex>> Cache = new();
        private readonly Dictionary<LotKey, List<LotFlag>> strainFlags = [];
        private readonly Dictionary<LotKey, LotKinetics> kinetics = [];
        private readonly Dictionary<LotKey, FlagSeverity> worst = [];

        // Each reviewed lot's key, by reference: Lot.Key formats a new string per call, and the reports ask per lot.
        private readonly Dictionary<LotConversion, LotKey> keys = new(ReferenceEqualityComparer.Instance);

        private FlagIndex(ReviewResult review)
        {
            foreach (var lot in review.Lots)
            {
                keys.TryAdd(lot, lot.Lot.Key);
            }

            var kineticsItems = review.Kinetics is { } k ? KineticsFollowUps.For(k) : [];
            Items = review.Strains.Flags.Concat(kineticsItems).ToArray();
            foreach (var f in review.Strains.Flags)
            {
                if (f.LotKey is not { } key)
                {
                    continue;
                }

                if (!strainFlags.TryGetValue(key, out var list))
                {
                    strainFlags[key] = list = [];
                }

                list.Add(f);
            }

            foreach (var f in Items)
            {
                if (f.LotKey is { } key)
                {
                    worst[key] = worst.TryGetValue(key, out var w) && w > f.Severity ? w : f.Severity;
                }
            }

            foreach (var lk in review.Kinetics?.Lots ?? [])
            {
                kinetics.TryAdd(lk.LotKey, lk);
            }
        }

        public IReadOnlyList<LotFlag> Items { get; }

        /// <summary>Whether the strain review flagged the lot (a reviewed lot by reference, any other by its key).</summary>
        public bool HasStrainFlag(LotConversion lot)
        {
            ArgumentNullException.ThrowIfNull(lot);
            return keys.ContainsKey(lot) ? StrainFlaggedLots.Contains(lot) : StrainFlags(lot.Lot.Key).Count > 0;
        }

        // The reviewed lots with a strain-review flag, by reference (a few per cent of the lots: a small set to probe).
        private HashSet<LotConversion> StrainFlaggedLots => LazyInitializer.EnsureInitialized(ref strainFlaggedLots, () =>
            new HashSet<LotConversion>(keys.Where(p => strainFlags.ContainsKey(p.Value)).Select(p => p.Key), ReferenceEqualityComparer.Instance));

        private HashSet<LotConversion>? strainFlaggedLots;

        public static FlagIndex Of(ReviewResult review) =>
            Cache.GetValue(review, r => new Lazy<FlagIndex>(() => new FlagIndex(r), LazyThreadSafetyMode.ExecutionAndPublication)).Value;

        /// <summary>The lot's "season/lot" key (held for the review's lots, formatted for any other).</summary>
        public LotKey KeyOf(LotConversion lot) => keys.TryGetValue(lot, out var key) ? key : lot.Lot.Key;

        public IReadOnlyList<LotFlag> StrainFlags(LotKey lotKey) => strainFlags.TryGetValue(lotKey, out var list) ? list : [];

        public LotKinetics? Kinetics(LotKey lotKey) => kinetics.GetValueOrDefault(lotKey);

        /// <summary>The lot's flag codes, strain review first, then kinetics, each once, in that order.</summary>
        public IReadOnlyList<string> Codes(LotKey lotKey)
        {
            var strain = StrainFlags(lotKey);
            var logged = Kinetics(lotKey)?.Flags ?? [];
            if (strain.Count + logged.Count == 0)
            {
                return [];
            }

            // A handful of codes per lot at most: a linear check for repeats beats building a set.
            var codes = new List<string>(strain.Count + logged.Count);
            foreach (var f in strain)
            {
                AddOnce(codes, f.Code);
            }

            foreach (var code in logged)
            {
                AddOnce(codes, code);
            }

            return codes;
        }

        private static void AddOnce(List<string> codes, string code)
        {
            foreach (var c in codes)
            {
                if (string.Equals(c, code, StringComparison.Ordinal))
                {
                    return;
                }
            }

            codes.Add(code);
        }

        public FlagSeverity? WorstSeverity(LotKey lotKey) => worst.TryGetValue(lotKey, out var w) ? w : null;
    }

    /// <summary>Plain name of a severity, as in data/flags.csv.</summary>
    public static string SeverityName(FlagSeverity severity) => severity switch
    {
        FlagSeverity.Note => "note",
        FlagSeverity.Check => "check",
        FlagSeverity.LikelyError => "likely error",
        _ => severity.ToString(),
    };

    /// <summary>Columns of data/groups.csv (the sheets add a note column).</summary>
    public static IReadOnlyList<ReportColumn> GroupColumns { get; } =
    [
        new("grouping", "Grouping", CellKind.Text),
        new("group", "Group", CellKind.Text),
        new("measure", "Measure", CellKind.Text),
        new("n", "Lots", CellKind.Integer),
        new("median", "Median", CellKind.Number, "0.0000"),
        new("mad", "MAD (scaled)", CellKind.Number, "0.0000"),
        new("qn", "Qn", CellKind.Number, "0.0000"),
        new("iqr", "IQR", CellKind.Number, "0.0000"),
        new("mean", "Mean", CellKind.Number, "0.0000"),
        new("sd", "SD", CellKind.Number, "0.0000"),
        new("trimmed_mean", "20 % trimmed mean", CellKind.Number, "0.0000"),
        new("huber", "Huber location", CellKind.Number, "0.0000"),
        new("min", "Min", CellKind.Number, "0.0000"),
        new("max", "Max", CellKind.Number, "0.0000"),
        new("ci_low", "Median 95 % interval low", CellKind.Number, "0.0000"),
        new("ci_high", "Median 95 % interval high", CellKind.Number, "0.0000"),
    ];

    /// <summary>Group summaries: every grouping, or only <paramref name="grouping"/>; with a note column for the sheets.</summary>
    public static ReportTable Groups(ReviewResult review, string? grouping = null, bool withNote = false)
    {
        ArgumentNullException.ThrowIfNull(review);
        var columns = withNote ? [.. GroupColumns, new ReportColumn("note", "Note", CellKind.Text)] : GroupColumns;
        var table = new ReportTable(columns);
        foreach (var g in review.Strains.Groups.Where(g => grouping is null || g.Grouping == grouping))
        {
            object?[] cells =
            [
                g.Grouping, g.Group, g.Measure.Name(), g.N, g.Median, g.Mad, g.Qn, g.Iqr, g.Mean, g.Sd, g.TrimmedMean, g.Huber, g.Min, g.Max,
                g.MedianInterval.Low, g.MedianInterval.High,
            ];
            table.Add(withNote ? [.. cells, g.Note] : cells);
        }

        return table;
    }

    /// <summary>Columns of data/flags.csv.</summary>
    public static IReadOnlyList<ReportColumn> FlagColumns { get; } =
    [
        new("lot_id", "Lot", CellKind.Text),
        new("season", "Season", CellKind.Integer),
        new("code", "Flag", CellKind.Text),
        new("severity", "Severity", CellKind.Text),
        new("measure", "Measure judged", CellKind.Text),
        new("value", "Value", CellKind.Number, "0.000"),
        new("reference_group", "Judged against", CellKind.Text),
        new("reference_median", "Reference median", CellKind.Number, "0.000"),
        new("reference_scale", "Reference scale", CellKind.Number, "0.000"),
        new("reason", "Why", CellKind.Text),
        new("follow_up", "Suggested follow-up", CellKind.Text),
    ];

    /// <summary>Every strain-review flag in the review's order.</summary>
    public static ReportTable Flags(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var table = new ReportTable(FlagColumns);
        foreach (var f in review.Strains.Flags)
        {
            table.Add([f.LotId, f.Season, f.Code, SeverityName(f.Severity), f.Measure, f.Value, f.ReferenceGroup, f.ReferenceMedian, f.ReferenceScale, f.Reason, f.FollowUp]);
        }

        return table;
    }

    /// <summary>
    /// The follow-up list: strain-review flags and kinetics follow-ups, by severity (likely errors first), then in their
    /// order (strain review first, then kinetics), with the strain.
    /// </summary>
    public static ReportTable FollowUp(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var table = new ReportTable(
        [
            new("severity", "Severity", CellKind.Text),
            new("lot_id", "Lot", CellKind.Text),
            new("season", "Season", CellKind.Integer),
            new("strain", "Strain", CellKind.Text),
            new("code", "Flag", CellKind.Text),
            new("reason", "Why", CellKind.Text),
            new("follow_up", "Suggested follow-up", CellKind.Text),
            new("value", "Value", CellKind.Number, "0.000"),
            new("reference_group", "Judged against", CellKind.Text),
        ]);
        var ordered = FollowUpItems(review)
            .Select((f, i) => (Flag: f, Index: i))
            .OrderByDescending(x => x.Flag.Severity).ThenBy(x => x.Index)
            .Select(x => x.Flag);
        foreach (var f in ordered)
        {
            table.Add([SeverityName(f.Severity), f.LotId ?? "(whole strain)", f.Season, f.Strain, f.Code, f.Reason, f.FollowUp, f.Value, f.ReferenceGroup], highlight: f.Severity == FlagSeverity.LikelyError);
        }

        return table;
    }

    /// <summary>Each compared strain's raw median and adjusted conversion at the reference sugar, ranked by adjusted conversion.</summary>
    public static ReportTable StrainRanking(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var c = review.Strains.Comparison;
        var table = new ReportTable(
        [
            new("rank", "Rank", CellKind.Integer),
            new("strain", "Strain", CellKind.Text),
            new("lots", "Lots", CellKind.Integer),
            new("raw_median", "Raw median " + c.Measure, CellKind.Number, "0.0000"),
            new("adjusted_factor", "Adjusted factor at " + c.ReferenceBrix.ToString("0.0", System.Globalization.CultureInfo.InvariantCulture) + " °Brix", CellKind.Number, "0.0000"),
            new("adjusted_low", "Interval low", CellKind.Number, "0.0000"),
            new("adjusted_high", "Interval high", CellKind.Number, "0.0000"),
            new("predicted_abv", "Predicted alcohol at the reference sugar (% v/v)", CellKind.Number, "0.00"),
        ]);
        var lotsPerStrain = review.Lots.GroupBy(l => l.Lot.Strain, StringComparer.Ordinal).ToDictionary(g => g.Key, g => g.Count(), StringComparer.Ordinal);
        foreach (var (row, rank) in RankedStrains(review).Select((r, i) => (r, i + 1)))
        {
            table.Add([rank, row.Strain, lotsPerStrain.GetValueOrDefault(row.Strain), row.RawMedian, row.Adjusted?.Factor ?? double.NaN, row.Adjusted?.FactorInterval.Low ?? double.NaN, row.Adjusted?.FactorInterval.High ?? double.NaN, row.Adjusted?.PredictedAbv ?? double.NaN]);
        }

        return table;
    }

    /// <summary>Compared strains ranked by adjusted conversion (by raw median when the adjusted comparison could not be fitted).</summary>
    public static IReadOnlyList<(string Strain, double RawMedian, AdjustedStrain? Adjusted)> RankedStrains(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var c = review.Strains.Comparison;
        var rows = c.Strains.Select((s, i) => (Strain: s, RawMedian: c.RawMedians[i], Adjusted: c.Adjusted.FirstOrDefault(a => a.Strain == s))).ToArray();
        return rows.OrderByDescending(r => r.Adjusted?.Factor ?? r.RawMedian).ThenBy(r => r.Strain, StringComparer.Ordinal).ToArray();
    }

    /// <summary>Pairwise Hodges–Lehmann shifts with Holm-adjusted p-values.</summary>
    public static ReportTable PairwiseShifts(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var table = new ReportTable(
        [
            new("first", "First strain", CellKind.Text),
            new("second", "Second strain", CellKind.Text),
            new("shift", "Shift, first − second (% v/v per °Brix)", CellKind.Number, "+0.0000;-0.0000;0.0000"),
            new("shift_low", "Interval low", CellKind.Number, "+0.0000;-0.0000;0.0000"),
            new("shift_high", "Interval high", CellKind.Number, "+0.0000;-0.0000;0.0000"),
            new("p", "Mann–Whitney p", CellKind.Number, "0.0000"),
            new("holm_p", "Holm-adjusted p", CellKind.Number, "0.0000"),
        ]);
        foreach (var p in review.Strains.Comparison.Pairs)
        {
            table.Add([p.First, p.Second, p.Shift, p.Interval.Low, p.Interval.High, p.P, p.HolmP], highlight: p.HolmP < 0.05);
        }

        return table;
    }

    /// <summary>Adjusted differences in alcohol at the same starting sugar (and vessel mix).</summary>
    public static ReportTable AdjustedDifferences(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var table = new ReportTable(
        [
            new("first", "First strain", CellKind.Text),
            new("second", "Second strain", CellKind.Text),
            new("abv_difference", "Alcohol difference, first − second (% v/v)", CellKind.Number, "+0.00;-0.00;0.00"),
            new("low", "Interval low", CellKind.Number, "+0.00;-0.00;0.00"),
            new("high", "Interval high", CellKind.Number, "+0.00;-0.00;0.00"),
        ]);
        foreach (var d in review.Strains.Comparison.AdjustedDifferences)
        {
            table.Add([d.First, d.Second, d.AbvDifference, d.Interval.Low, d.Interval.High], highlight: d.Interval.IsDefined && (d.Interval.Low > 0 || d.Interval.High < 0));
        }

        return table;
    }

    /// <summary>
    /// Rows read but not used: the sum of the intake's row accounting when there is one (a sheet refused whole counts
    /// all its rows), else the count of row-level errors.
    /// </summary>
    public static int RowsLeftOut(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var inputs = review.Inputs;
        return inputs.Accounts.Count > 0
            ? inputs.Accounts.Sum(a => a.RowsReported)
            : inputs.Issues.Count(i => i.Severity == IssueSeverity.Error && i.Row is not null);
    }

    /// <summary>Columns of data/intake-issues.csv.</summary>
    public static IReadOnlyList<ReportColumn> IntakeIssueColumns { get; } =
    [
        new("file", "File", CellKind.Text),
        new("sheet", "Sheet", CellKind.Text),
        new("row", "Row", CellKind.Integer),
        new("column", "Column", CellKind.Text),
        new("value", "Value", CellKind.Text),
        new("code", "Code", CellKind.Text),
        new("message", "What is wrong and how to fix it", CellKind.Text),
    ];

    /// <summary>Every intake issue, in the order intake found them.</summary>
    public static ReportTable IntakeIssues(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var table = new ReportTable(IntakeIssueColumns);
        foreach (var i in review.Inputs.Issues)
        {
            table.Add([i.File, i.Sheet, i.Row, i.Column, i.Value, i.Code, i.Message], highlight: i.Severity == IssueSeverity.Error);
        }

        return table;
    }

    /// <summary>Input files with their SHA-256.</summary>
    public static ReportTable InputFiles(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var table = new ReportTable(
        [
            new("file", "File", CellKind.Text),
            new("sha256", "SHA-256", CellKind.Text),
            new("bytes", "Bytes", CellKind.Integer, "#,##0"),
        ]);
        foreach (var f in review.Inputs.Files)
        {
            table.Add([f.Path, f.Sha256, f.Bytes]);
        }

        return table;
    }

    /// <summary>Row accounting per file and sheet.</summary>
    public static ReportTable RowAccounts(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var table = new ReportTable(
        [
            new("file", "File", CellKind.Text),
            new("sheet", "Sheet", CellKind.Text),
            new("kind", "Kind", CellKind.Text),
            new("rows_read", "Rows read", CellKind.Integer),
            new("lots_used", "Lots used", CellKind.Integer),
            new("log_readings_used", "Log readings used", CellKind.Integer),
            new("rows_reported", "Rows reported", CellKind.Integer),
            new("blank_rows_skipped", "Blank rows", CellKind.Integer),
            new("summary_rows_skipped", "Summary rows", CellKind.Integer),
        ]);
        foreach (var a in review.Inputs.Accounts)
        {
            table.Add([a.File, a.Sheet, a.Kind, a.RowsRead, a.LotsUsed, a.LogReadingsUsed, a.RowsReported, a.BlankRowsSkipped, a.SummaryRowsSkipped], highlight: !a.Balances);
        }

        return table;
    }

    /// <summary>Every house-factor candidate with both backtests.</summary>
    public static ReportTable HouseCandidates(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var h = review.HouseFactor;
        var table = new ReportTable(
        [
            new("candidate", "Candidate", CellKind.Text),
            new("description", "What it does", CellKind.Text),
            new("simplicity_rank", "Simplicity rank", CellKind.Integer),
            new("backtest", "Backtest", CellKind.Text),
            new("lots", "Lots", CellKind.Integer),
            new("mae_abv", "Mean absolute error (% v/v)", CellKind.Number, "0.000"),
            new("mae_se_abv", "Standard error of MAE", CellKind.Number, "0.000"),
            new("bias_abv", "Bias, predicted − actual (% v/v)", CellKind.Number, "+0.000;-0.000;0.000"),
            new("rmse_abv", "RMSE (% v/v)", CellKind.Number, "0.000"),
            new("p90_abs_error_abv", "90th percentile |error| (% v/v)", CellKind.Number, "0.000"),
            new("share_within_tolerance", "Within label tolerance", CellKind.Share),
            new("share_wrong_side", "Wrong side of threshold", CellKind.Share),
            new("recommended", "Recommended", CellKind.Boolean),
        ]);
        string? chosen = h.Overall?.CandidateId;
        foreach (var c in h.Candidates)
        {
            foreach (var (scheme, m) in Backtests(c))
            {
                bool isChosen = c.Id == chosen && m == c.Primary;
                table.Add(
                [
                    c.Name, c.Description, c.Complexity, SchemeName(scheme), m.Lots, m.Mae, m.MaeStandardError, m.Bias, m.Rmse,
                    m.P90AbsoluteError, m.ShareWithinTolerance, m.ShareWrongSideOfThreshold, isChosen,
                ],
                highlight: isChosen);
            }
        }

        return table;
    }

    /// <summary>The recommendation overall and per strain.</summary>
    public static ReportTable Recommendations(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var h = review.HouseFactor;
        var table = new ReportTable(
        [
            new("strain", "Strain", CellKind.Text),
            new("lots", "Lots", CellKind.Integer),
            new("candidate", "Recommended", CellKind.Text),
            new("best_candidate", "Lowest error", CellKind.Text),
            new("mae_abv", "Mean absolute error (% v/v)", CellKind.Number, "0.000"),
            new("mae_limit_abv", "Best MAE + 1 SE (% v/v)", CellKind.Number, "0.000"),
            new("error_80_low_abv", "80 % band low (% v/v)", CellKind.Number, "+0.00;-0.00;0.00"),
            new("error_80_high_abv", "80 % band high (% v/v)", CellKind.Number, "+0.00;-0.00;0.00"),
            new("error_95_low_abv", "95 % band low (% v/v)", CellKind.Number, "+0.00;-0.00;0.00"),
            new("error_95_high_abv", "95 % band high (% v/v)", CellKind.Number, "+0.00;-0.00;0.00"),
            new("share_within_tolerance", "Within label tolerance", CellKind.Share),
            new("explanation", "Why", CellKind.Text),
        ]);
        var names = h.Candidates.ToDictionary(c => c.Id, c => c.Name, StringComparer.Ordinal);
        foreach (var r in (h.Overall is null ? [] : new[] { h.Overall }).Concat(h.ByStrain))
        {
            table.Add(
            [
                r.Strain == "*" ? "all lots" : r.Strain, r.Lots, names.GetValueOrDefault(r.CandidateId, r.CandidateId),
                names.GetValueOrDefault(r.BestCandidateId, r.BestCandidateId), r.Metrics.Mae, r.MaeLimit,
                r.ErrorBand80.Low, r.ErrorBand80.High, r.ErrorBand95.Low, r.ErrorBand95.High, r.Metrics.ShareWithinTolerance, r.Explanation,
            ]);
        }

        return table;
    }

    /// <summary>
    /// The recommendation overall and per strain in both versions of the house factor: with the lots flagged as likely
    /// errors or not dry left out, and with them included (the version in use first).
    /// </summary>
    public static ReportTable HouseFactorVersions(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var table = new ReportTable(
        [
            new("flagged_lots", "Flagged lots", CellKind.Text),
            new("in_use", "In use", CellKind.Boolean),
            new("strain", "Strain", CellKind.Text),
            new("lots", "Lots", CellKind.Integer),
            new("candidate", "Recommended", CellKind.Text),
            new("mae_abv", "Mean absolute error (% v/v)", CellKind.Number, "0.000"),
            new("error_80_low_abv", "80 % band low (% v/v)", CellKind.Number, "+0.00;-0.00;0.00"),
            new("error_80_high_abv", "80 % band high (% v/v)", CellKind.Number, "+0.00;-0.00;0.00"),
            new("error_95_low_abv", "95 % band low (% v/v)", CellKind.Number, "+0.00;-0.00;0.00"),
            new("error_95_high_abv", "95 % band high (% v/v)", CellKind.Number, "+0.00;-0.00;0.00"),
            new("share_within_tolerance", "Within label tolerance", CellKind.Share),
        ]);
        var h = review.HouseFactor;
        var names = h.Candidates.ToDictionary(c => c.Id, c => c.Name, StringComparer.Ordinal);
        foreach (var (version, inUse) in new[] { (h, true), (h.OtherVersion, false) })
        {
            if (version is null)
            {
                continue;
            }

            string which = version.FlaggedLotsIncluded ? "included" : "left out";
            foreach (var r in (version.Overall is null ? [] : new[] { version.Overall }).Concat(version.ByStrain))
            {
                table.Add(
                [
                    which, inUse, r.Strain == "*" ? "all lots" : r.Strain, r.Lots, names.GetValueOrDefault(r.CandidateId, r.CandidateId), r.Metrics.Mae,
                    r.ErrorBand80.Low, r.ErrorBand80.High, r.ErrorBand95.Low, r.ErrorBand95.High, r.Metrics.ShareWithinTolerance,
                ],
                highlight: inUse && r.Strain == "*");
            }
        }

        return table;
    }

    /// <summary>Interval coverage by nested leave-one-season-out: one row per season held out, then all together.</summary>
    public static ReportTable IntervalCoverage(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var table = new ReportTable(
        [
            new("season_held_out", "Season held out", CellKind.Text),
            new("lots", "Lots", CellKind.Integer),
            new("share_in_80", "Inside the planner's 80 % interval", CellKind.Share),
            new("share_in_95", "Inside the planner's 95 % interval", CellKind.Share),
            new("share_in_overall_80", "Inside the overall 80 % band", CellKind.Share),
            new("share_in_overall_95", "Inside the overall 95 % band", CellKind.Share),
        ]);
        if (review.HouseFactor.Coverage is { } c)
        {
            foreach (var r in c.Seasons.Append(c.Total))
            {
                table.Add([r.Season == 0 ? "all seasons" : r.Season.ToString(CultureInfo.InvariantCulture), r.Lots, r.Share80, r.Share95, r.OverallShare80, r.OverallShare95], highlight: r.Season == 0);
            }
        }

        return table;
    }

    /// <summary>The lots flagged as likely errors or not dry, which the house factor leaves out unless a setting includes them.</summary>
    public static ReportTable HouseFactorFlaggedLots(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var table = new ReportTable(
        [
            new("season", "Season", CellKind.Integer),
            new("lot_id", "Lot", CellKind.Text),
            new("strain", "Strain", CellKind.Text),
            new("codes", "Flags", CellKind.Text),
            new("reason", "Why", CellKind.Text),
        ]);
        foreach (var f in review.HouseFactor.FlaggedLots)
        {
            table.Add([f.Season, f.LotId, f.Strain, string.Join(", ", f.Codes), f.Reason]);
        }

        return table;
    }

    /// <summary>The planner table: highest harvest sugar under each target at each confidence.</summary>
    public static ReportTable Planner(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var table = new ReportTable(
        [
            new("strain", "Strain", CellKind.Text),
            new("target_abv", "Keep alcohol under (% v/v)", CellKind.Number, "0.0"),
            new("confidence", "With confidence", CellKind.Share, "0%"),
            new("highest_brix", "Pick at or below (°Brix)", CellKind.Number, "0.0"),
            new("error_allowance_abv", "Allowance for error (% v/v)", CellKind.Number, "0.00"),
            new("note", "Note", CellKind.Text),
        ]);
        foreach (var t in review.HouseFactor.PlannerTable)
        {
            table.Add([t.Strain == "*" ? "all lots" : t.Strain, t.TargetAbv, t.Confidence, t.HighestBrix, t.ErrorAllowance, t.Note]);
        }

        return table;
    }

    /// <summary>Plain name of a backtest scheme.</summary>
    public static string SchemeName(BacktestScheme scheme) => scheme switch
    {
        BacktestScheme.LeaveOneSeasonOut => "leave one season out",
        BacktestScheme.LeaveOneLotOut => "leave one lot out",
        BacktestScheme.TenFoldByLot => "ten folds by lot",
        _ => scheme.ToString(),
    };

    /// <summary>Plain name of a sugar scale.</summary>
    public static string ScaleName(SugarScale scale) => scale switch
    {
        SugarScale.Brix => "°Brix",
        SugarScale.SpecificGravity => "SG",
        SugarScale.Baume => "°Baumé",
        SugarScale.Oechsle => "°Oechsle",
        SugarScale.GramsPerLitre => "g/L",
        _ => scale.ToString(),
    };

    private static IEnumerable<(BacktestScheme Scheme, BacktestMetrics Metrics)> Backtests(CandidateResult c)
    {
        if (c.BySeason is not null)
        {
            yield return (BacktestScheme.LeaveOneSeasonOut, c.BySeason);
        }

        yield return (c.ByLotScheme, c.ByLot);
    }
}
