using YieldBench.Core.Conversion;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Review.Strains;
using YieldBench.Core.Units;
using YieldBench.Reports.Tables;

namespace YieldBench.Reports.Kinetics;

/// <summary>The kinetics tables as every renderer lays them out (data file and workbook sheet share them).</summary>
public static class KineticsTables
{
    /// <summary>
    /// The per-lot table (data/kinetics.csv and the Kinetics by lot sheet), the most-read columns first: the lot and its
    /// flags, days to dry and peak temperature, then rates and stalls, then heat, then the sigmoid fits.
    /// </summary>
    private static IReadOnlyList<Column<LotKinetics>> LotTable { get; } =
    [
        new("season", "Season", CellKind.Integer, k => k.Lot.Season),
        new("lot_id", "Lot", CellKind.Text, k => k.Lot.LotId),
        new("strain", "Strain", CellKind.Text, k => k.Lot.Strain),
        new("colour", "Colour", CellKind.Text, k => ReviewTables.ColourName(k.Lot.Colour)),
        new("flags", "Flags", CellKind.Text, k => string.Join(';', k.Flags)),
        new("days_to_dry", "Days to dry", CellKind.Number, k => k.DaysToDry, "0.0"),
        new("peak_temp_c", "Peak temperature (°C)", CellKind.Number, k => k.PeakTemperatureC, "0.0"),
        new("max_rate_brix_per_day", "Maximum rate (°Brix/day)", CellKind.Number, k => k.MaxRateBrixPerDay, "0.00"),
        new("lag_h", "Lag (h)", CellKind.Number, k => k.LagHours, "0.0"),
        new("one_third_h", "One-third of the sugar gone (h)", CellKind.Number, k => k.OneThirdHours, "0.0"),
        new("time_above_caution_h", "Time above caution (h)", CellKind.Number, k => k.HoursAboveCaution, "0.0"),
        new("time_above_danger_h", "Time above danger (h)", CellKind.Number, k => k.HoursAboveDanger, "0.0"),
        new("sluggish", "Sluggish", CellKind.Boolean, k => k.Sluggish is not null),
        new("stuck", "Stuck", CellKind.Boolean, k => k.Stuck is not null),
        new("stalled_then_finished", "Stalled, then finished", CellKind.Boolean, k => k.StalledThenFinished is not null),
        new("starting_brix", "Starting sugar (°Brix)", CellKind.Number, k => k.StartingBrix, "0.0"),
        new("final_brix", "Last sugar (°Brix)", CellKind.Number, k => k.FinalBrix, "0.0"),
        new("residual_sugar_gl", "Lab residual sugar (g/L)", CellKind.Number, k => k.Lot.ResidualSugarGl, "0.0"),
        new("time_origin", "Time zero", CellKind.Text, k => k.OriginKind == TimeOrigin.Inoculation ? "inoculation" : "first reading"),
        new("time_origin_at", "Time zero at", CellKind.DateTime, k => k.Origin),
        new("sugar_readings", "Sugar readings", CellKind.Integer, k => k.Sugar.Count),
        new("median_spacing_h", "Median spacing (h)", CellKind.Number, k => k.MedianSpacingHours, "0.0"),
        new("rate_method", "Maximum rate from", CellKind.Text, k => k.MaxRateMethod == RateMethod.LocalLinearFit ? "local linear fit" : "between readings"),
        new("max_rate_at", "Maximum rate at", CellKind.DateTime, k => k.MaxRateAt),
        new("one_third_brix", "One-third depletion at (°Brix)", CellKind.Number, k => k.OneThirdBrix, "0.0"),
        new("one_third_at", "One-third depletion reached", CellKind.DateTime, k => k.OneThirdAt),
        new("one_third_basis", "One-third of", CellKind.Text, k => k.OneThirdBasis == OneThirdBasis.LotRecord ? "lot's starting sugar" : "first reading"),
        new("one_third_first_reading_brix", "One-third of the first reading at (°Brix)", CellKind.Number, k => k.OneThirdFirstReadingBrix, "0.0"),
        new("one_third_first_reading_h", "One-third of the first reading (h)", CellKind.Number, k => k.OneThirdFirstReadingHours, "0.0"),
        new("dry_at", "Dry reached", CellKind.DateTime, k => k.DryAt),
        new("duration_h", "Log duration from time zero (h)", CellKind.Number, k => k.DurationHours, "0.0"),
        new("peak_temp_at", "Peak temperature at", CellKind.DateTime, k => k.PeakTemperatureAt),
        new("caution_temp_c", "Caution threshold (°C)", CellKind.Number, k => k.Thresholds.CautionC, "0.0"),
        new("danger_temp_c", "Danger threshold (°C)", CellKind.Number, k => k.Thresholds.DangerC, "0.0"),
        new("sluggish_from", "Sluggish from", CellKind.DateTime, k => k.Sluggish?.Start),
        new("stuck_from", "Stuck from", CellKind.DateTime, k => k.Stuck?.Start),
        new("potential_peak_temp_c", "Reachable without cooling (°C)", CellKind.Number, k => k.PotentialPeak?.PotentialTemperatureC, "0.0"),
        new("potential_peak_at", "Reachable-temperature reading at", CellKind.DateTime, k => k.PotentialPeak?.Time),
        new("heat_removed_k", "Heat removed (K)", CellKind.Number, k => k.HeatRemovedK, "0.0"),
        new("readings_reachable_above_danger", "Readings that could pass danger without cooling", CellKind.Integer, k => k.ReadingsWithPotentialAboveDanger),
        new("gompertz_a_brix", "Gompertz sugar used in all (°Brix)", CellKind.Number, k => k.Gompertz.Fit?.AsymptoteBrix, "0.00"),
        new("gompertz_mu_brix_per_h", "Gompertz maximum rate (°Brix/h)", CellKind.Number, k => k.Gompertz.Fit?.MaxRateBrixPerHour, "0.000"),
        new("gompertz_lambda_h", "Gompertz lag (h)", CellKind.Number, k => k.Gompertz.Fit?.LagHours, "0.0"),
        new("gompertz_rmse_brix", "Gompertz RMSE (°Brix)", CellKind.Number, k => k.Gompertz.Fit?.Rmse, "0.000"),
        new("gompertz_r2", "Gompertz R²", CellKind.Number, k => k.Gompertz.Fit?.RSquared, "0.0000"),
        new("gompertz_note", "Gompertz note", CellKind.Text, k => k.Gompertz.Reason),
        new("logistic_a_brix", "Logistic sugar used in all (°Brix)", CellKind.Number, k => k.Logistic.Fit?.AsymptoteBrix, "0.00"),
        new("logistic_mu_brix_per_h", "Logistic maximum rate (°Brix/h)", CellKind.Number, k => k.Logistic.Fit?.MaxRateBrixPerHour, "0.000"),
        new("logistic_lambda_h", "Logistic lag (h)", CellKind.Number, k => k.Logistic.Fit?.LagHours, "0.0"),
        new("logistic_rmse_brix", "Logistic RMSE (°Brix)", CellKind.Number, k => k.Logistic.Fit?.Rmse, "0.000"),
        new("logistic_r2", "Logistic R²", CellKind.Number, k => k.Logistic.Fit?.RSquared, "0.0000"),
        new("logistic_note", "Logistic note", CellKind.Text, k => k.Logistic.Reason),
    ];

    /// <summary>Columns of the per-lot table (data/kinetics.csv), in their stable order.</summary>
    public static IReadOnlyList<ReportColumn> LotColumns { get; } = LotTable.Select(c => c.Definition).ToArray();

    /// <summary>Columns of the per-strain table.</summary>
    public static IReadOnlyList<ReportColumn> StrainColumns { get; } =
    [
        new("strain", "Strain", CellKind.Text),
        new("lots_with_log", "Lots with a log", CellKind.Integer),
        new("max_rate_median_brix_per_day", "Maximum rate, median (°Brix/day)", CellKind.Number, "0.00"),
        new("max_rate_iqr_brix_per_day", "Maximum rate, IQR (°Brix/day)", CellKind.Number, "0.00"),
        new("lag_median_h", "Lag, median (h)", CellKind.Number, "0.0"),
        new("lag_iqr_h", "Lag, IQR (h)", CellKind.Number, "0.0"),
        new("days_to_dry_median", "Days to dry, median", CellKind.Number, "0.00"),
        new("days_to_dry_iqr", "Days to dry, IQR", CellKind.Number, "0.00"),
        new("lots_dry", "Lots that reached dry", CellKind.Integer),
        new("peak_temp_median_c", "Peak temperature, median (°C)", CellKind.Number, "0.0"),
        new("peak_temp_iqr_c", "Peak temperature, IQR (°C)", CellKind.Number, "0.0"),
        new("sluggish_share", "Sluggish share", CellKind.Share),
        new("stuck_share", "Stuck share", CellKind.Share),
    ];

    /// <summary>Conversion columns appended to the strain table when the lots' conversion measures are given.</summary>
    public static IReadOnlyList<ReportColumn> StrainConversionColumns { get; } =
    [
        new("lots_reviewed", "Lots reviewed (all, with or without a log)", CellKind.Integer),
        new("abv_per_brix_median", "Alcohol per °Brix, median (% v/v per °Brix)", CellKind.Number, "0.0000"),
        new("sugar_gl_per_abv_median", "Sugar per % alcohol, median (g/L per % v/v)", CellKind.Number, "0.00"),
    ];

    /// <summary>Columns of the findings table (data/kinetics-findings.csv).</summary>
    public static IReadOnlyList<ReportColumn> FindingColumns { get; } =
    [
        new("lot", "Lot (season/lot) or log", CellKind.Text),
        new("code", "Code", CellKind.Text),
        new("what", "What was seen", CellKind.Text),
        new("message", "Details", CellKind.Text),
        new("source", "Log row", CellKind.Text),
    ];

    /// <summary>Columns of the findings summary: one row per kind of finding.</summary>
    public static IReadOnlyList<ReportColumn> FindingKindColumns { get; } =
    [
        new("what", "What was seen", CellKind.Text),
        new("code", "Code (as in data/kinetics-findings.csv)", CellKind.Text),
        new("lots", "Lots or logs", CellKind.Integer),
        new("by_strain", "By strain", CellKind.Text),
    ];

    /// <summary>
    /// One row per kind of finding (and of lot without a log), most frequent first: how many lots or logs it concerns
    /// and how they fall by strain. The findings themselves are in data/kinetics-findings.csv.
    /// </summary>
    public static ReportTable FindingKinds(KineticsReview review, IReadOnlyDictionary<LotKey, string> strainOf)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(strainOf);
        var t = new ReportTable(FindingKindColumns);
        var all = review.Findings.Select(f => (Code: f.Code, Subject: f.Subject, LotKey: f.LotKey))
            .Concat(review.LotsWithoutLog.Select(k => (Code: "no-log", Subject: k.ToString(), LotKey: (LotKey?)k)));
        foreach (var kind in all.GroupBy(f => f.Code, StringComparer.Ordinal)
                     .Select(g => (Code: g.Key, Subjects: g.DistinctBy(f => f.Subject, StringComparer.Ordinal).ToArray()))
                     .OrderByDescending(g => g.Subjects.Length).ThenBy(g => g.Code, StringComparer.Ordinal))
        {
            var byStrain = kind.Subjects
                .GroupBy(f => f.LotKey is { } key && strainOf.TryGetValue(key, out var strain) ? strain : "no lot", StringComparer.Ordinal)
                .OrderByDescending(g => g.Count()).ThenBy(g => g.Key, StringComparer.Ordinal)
                .Select(g => $"{g.Key} {g.Count()}");
            t.Add([ReviewTexts.FlagName(kind.Code), kind.Code, kind.Subjects.Length, string.Join(", ", byStrain)]);
        }

        return t;
    }

    /// <summary>One row per analysed lot, temperatures in <paramref name="unit"/>; flagged lots are highlighted.</summary>
    public static ReportTable Lots(KineticsReview review, TemperatureUnit unit = TemperatureUnit.Celsius)
    {
        ArgumentNullException.ThrowIfNull(review);
        return ReportTable.Of(TemperatureColumns.In(LotTable, unit), review.Lots, k => k.Flagged);
    }

    /// <summary>
    /// One row per strain. With <paramref name="strains"/> (the review's strain review), each strain's lots reviewed
    /// and median conversion are appended from its group summaries, so a sheet shows each strain's whole performance.
    /// </summary>
    public static ReportTable Strains(KineticsReview review, StrainReview? strains = null, TemperatureUnit unit = TemperatureUnit.Celsius)
    {
        ArgumentNullException.ThrowIfNull(review);
        var t = new ReportTable(TemperatureColumns.In(strains is null ? StrainColumns : [.. StrainColumns, .. StrainConversionColumns], unit));
        foreach (var s in review.Strains)
        {
            object?[] cells =
            [
                s.Strain, s.Lots,
                s.MaxRateBrixPerDay.Median, s.MaxRateBrixPerDay.Iqr,
                s.LagHours.Median, s.LagHours.Iqr,
                s.DaysToDry.Median, s.DaysToDry.Iqr, s.DaysToDry.N,
                unit.FromCelsius(s.PeakTemperatureC.Median), unit.Difference(s.PeakTemperatureC.Iqr),
                s.SluggishShare, s.StuckShare,
            ];
            if (strains is not null)
            {
                var factor = strains.Summary(Groupings.Strain, s.Strain, ConversionMeasure.AbvPerBrix);
                var sugar = strains.Summary(Groupings.Strain, s.Strain, ConversionMeasure.SugarGlPerAbv);
                cells =
                [
                    .. cells,
                    factor is null ? 0 : factor.N + factor.Missing,
                    factor?.Median ?? double.NaN,
                    sugar?.Median ?? double.NaN,
                ];
            }

            t.Add(cells);
        }

        return t;
    }

    /// <summary>Every finding, plus a line for each log without a lot and each lot without a log.</summary>
    public static ReportTable Findings(KineticsReview review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var t = new ReportTable(FindingColumns);
        foreach (var f in review.Findings)
        {
            t.Add([f.Subject, f.Code, ReviewTexts.FlagName(f.Code), f.Message, f.Source?.ToString()]);
        }

        foreach (var key in review.LotsWithoutLog)
        {
            t.Add([key.ToString(), "no-log", ReviewTexts.FlagName("no-log"), $"Lot {key} has no fermentation log; its kinetics are not shown.", null]);
        }

        return t;
    }
}
