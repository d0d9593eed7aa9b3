using YieldBench.Core.Conversion;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Review.Strains;
using YieldBench.Reports.Tables;

namespace YieldBench.Reports.Kinetics;

/// <summary>The kinetics tables as every renderer lays them out (data file and workbook sheet share them).</summary>
public static class KineticsTables
{
    /// <summary>Columns of the per-lot table (data/kinetics.csv), in their stable order.</summary>
    public static IReadOnlyList<ReportColumn> LotColumns { get; } =
    [
        new("season", "Season", CellKind.Integer),
        new("lot_id", "Lot", CellKind.Text),
        new("strain", "Strain", CellKind.Text),
        new("colour", "Colour", CellKind.Text),
        new("time_origin", "Time zero", CellKind.Text),
        new("time_origin_at", "Time zero at", CellKind.DateTime),
        new("sugar_readings", "Sugar readings", CellKind.Integer),
        new("median_spacing_h", "Median spacing (h)", CellKind.Number, "0.0"),
        new("rate_method", "Maximum rate from", CellKind.Text),
        new("starting_brix", "Starting sugar (°Brix)", CellKind.Number, "0.0"),
        new("final_brix", "Last sugar (°Brix)", CellKind.Number, "0.0"),
        new("max_rate_brix_per_day", "Maximum rate (°Brix/day)", CellKind.Number, "0.00"),
        new("max_rate_at", "Maximum rate at", CellKind.DateTime),
        new("lag_h", "Lag (h)", CellKind.Number, "0.0"),
        new("one_third_brix", "One-third depletion at (°Brix)", CellKind.Number, "0.0"),
        new("one_third_at", "One-third depletion reached", CellKind.DateTime),
        new("one_third_h", "One-third depletion (h)", CellKind.Number, "0.0"),
        new("one_third_basis", "One-third of", CellKind.Text),
        new("one_third_first_reading_brix", "One-third of the first reading at (°Brix)", CellKind.Number, "0.0"),
        new("one_third_first_reading_h", "One-third of the first reading (h)", CellKind.Number, "0.0"),
        new("dry_at", "Dry reached", CellKind.DateTime),
        new("days_to_dry", "Days to dry", CellKind.Number, "0.00"),
        new("duration_h", "Log duration from time zero (h)", CellKind.Number, "0.0"),
        new("peak_temp_c", "Peak temperature (°C)", CellKind.Number, "0.0"),
        new("peak_temp_at", "Peak temperature at", CellKind.DateTime),
        new("caution_temp_c", "Caution threshold (°C)", CellKind.Number, "0.0"),
        new("danger_temp_c", "Danger threshold (°C)", CellKind.Number, "0.0"),
        new("time_above_caution_h", "Time above caution (h)", CellKind.Number, "0.0"),
        new("time_above_danger_h", "Time above danger (h)", CellKind.Number, "0.0"),
        new("sluggish", "Sluggish", CellKind.Boolean),
        new("sluggish_from", "Sluggish from", CellKind.DateTime),
        new("stuck", "Stuck", CellKind.Boolean),
        new("stuck_from", "Stuck from", CellKind.DateTime),
        new("stalled_then_finished", "Stalled, then finished", CellKind.Boolean),
        new("residual_sugar_gl", "Lab residual sugar (g/L)", CellKind.Number, "0.0"),
        new("potential_peak_temp_c", "Reachable without cooling (°C)", CellKind.Number, "0.0"),
        new("potential_peak_at", "Reachable-temperature reading at", CellKind.DateTime),
        new("heat_removed_k", "Heat removed (K)", CellKind.Number, "0.0"),
        new("readings_reachable_above_danger", "Readings that could pass danger without cooling", CellKind.Integer),
        new("gompertz_a_brix", "Gompertz A (°Brix)", CellKind.Number, "0.00"),
        new("gompertz_mu_brix_per_h", "Gompertz μm (°Brix/h)", CellKind.Number, "0.000"),
        new("gompertz_lambda_h", "Gompertz λ (h)", CellKind.Number, "0.0"),
        new("gompertz_rmse_brix", "Gompertz RMSE (°Brix)", CellKind.Number, "0.000"),
        new("gompertz_r2", "Gompertz R²", CellKind.Number, "0.0000"),
        new("gompertz_note", "Gompertz note", CellKind.Text),
        new("logistic_a_brix", "Logistic A (°Brix)", CellKind.Number, "0.00"),
        new("logistic_mu_brix_per_h", "Logistic μm (°Brix/h)", CellKind.Number, "0.000"),
        new("logistic_lambda_h", "Logistic λ (h)", CellKind.Number, "0.0"),
        new("logistic_rmse_brix", "Logistic RMSE (°Brix)", CellKind.Number, "0.000"),
        new("logistic_r2", "Logistic R²", CellKind.Number, "0.0000"),
        new("logistic_note", "Logistic note", CellKind.Text),
        new("flags", "Flags", CellKind.Text),
    ];

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

    /// <summary>Columns of the per-reading table (data/kinetics-readings.csv).</summary>
    public static IReadOnlyList<ReportColumn> ReadingColumns { get; } =
    [
        new("season", "Season", CellKind.Integer),
        new("lot_id", "Lot", CellKind.Text),
        new("time", "Time", CellKind.DateTime),
        new("hours_from_time_zero_h", "Hours from time zero", CellKind.Number, "0.00"),
        new("sugar_brix", "Sugar (°Brix)", CellKind.Number, "0.00"),
        new("temp_c", "Temperature (°C)", CellKind.Number, "0.0"),
        new("rate_since_previous_brix_per_day", "Rate since previous reading (°Brix/day)", CellKind.Number, "0.00"),
        new("smoothed_rate_brix_per_day", "Smoothed rate (°Brix/day)", CellKind.Number, "0.00"),
        new("sugar_remaining_gl", "Fermentable sugar remaining (g/L)", CellKind.Number, "0.0"),
        new("potential_rise_k", "Rise possible without cooling (K)", CellKind.Number, "0.0"),
        new("reachable_temp_c", "Reachable without cooling (°C)", CellKind.Number, "0.0"),
    ];

    /// <summary>Columns of the findings table.</summary>
    public static IReadOnlyList<ReportColumn> FindingColumns { get; } =
    [
        new("lot", "Lot (season/lot)", CellKind.Text),
        new("code", "What was seen", CellKind.Text),
        new("message", "Details", CellKind.Text),
        new("source", "Log row", CellKind.Text),
    ];

    /// <summary>One row per analysed lot; flagged lots are highlighted.</summary>
    public static ReportTable Lots(KineticsReview review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var t = new ReportTable(LotColumns);
        foreach (var k in review.Lots)
        {
            var g = k.Gompertz.Fit;
            var l = k.Logistic.Fit;
            t.Add(
            [
                k.Lot.Season, k.Lot.LotId, k.Lot.Strain, ReviewTables.ColourName(k.Lot.Colour),
                k.OriginKind == TimeOrigin.Inoculation ? "inoculation" : "first reading", k.Origin,
                k.Sugar.Count, k.MedianSpacingHours, k.MaxRateMethod == RateMethod.LocalLinearFit ? "local linear fit" : "between readings",
                k.StartingBrix, k.FinalBrix, k.MaxRateBrixPerDay, k.MaxRateAt, k.LagHours,
                k.OneThirdBrix, k.OneThirdAt, k.OneThirdHours, k.OneThirdBasis == OneThirdBasis.LotRecord ? "lot's starting sugar" : "first reading",
                k.OneThirdFirstReadingBrix, k.OneThirdFirstReadingHours, k.DryAt, k.DaysToDry, k.DurationHours,
                k.PeakTemperatureC, k.PeakTemperatureAt, k.Thresholds.CautionC, k.Thresholds.DangerC, k.HoursAboveCaution, k.HoursAboveDanger,
                k.Sluggish is not null, k.Sluggish?.Start, k.Stuck is not null, k.Stuck?.Start, k.StalledThenFinished is not null,
                k.Lot.ResidualSugarGl, k.PotentialPeak?.PotentialTemperatureC, k.PotentialPeak?.Time, k.HeatRemovedK, k.ReadingsWithPotentialAboveDanger,
                g?.AsymptoteBrix, g?.MaxRateBrixPerHour, g?.LagHours, g?.Rmse, g?.RSquared, k.Gompertz.Reason,
                l?.AsymptoteBrix, l?.MaxRateBrixPerHour, l?.LagHours, l?.Rmse, l?.RSquared, k.Logistic.Reason,
                string.Join(' ', k.Flags),
            ],
            k.Flagged);
        }

        return t;
    }

    /// <summary>
    /// One row per strain. With <paramref name="strains"/> (the review's strain review), each strain's lots reviewed
    /// and median conversion are appended from its group summaries, so a sheet shows each strain's whole performance.
    /// </summary>
    public static ReportTable Strains(KineticsReview review, StrainReview? strains = null)
    {
        ArgumentNullException.ThrowIfNull(review);
        var t = new ReportTable(strains is null ? StrainColumns : [.. StrainColumns, .. StrainConversionColumns]);
        foreach (var s in review.Strains)
        {
            object?[] cells =
            [
                s.Strain, s.Lots,
                s.MaxRateBrixPerDay.Median, s.MaxRateBrixPerDay.Iqr,
                s.LagHours.Median, s.LagHours.Iqr,
                s.DaysToDry.Median, s.DaysToDry.Iqr, s.DaysToDry.N,
                s.PeakTemperatureC.Median, s.PeakTemperatureC.Iqr,
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

    /// <summary>One row per sugar reading of every analysed lot, with its rates and heat potential.</summary>
    public static ReportTable Readings(KineticsReview review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var t = new ReportTable(ReadingColumns);
        foreach (var k in review.Lots)
        {
            var heat = k.Heat.ToDictionary(h => h.Time);
            for (int i = 0; i < k.Sugar.Count; i++)
            {
                var p = k.Sugar[i];
                bool hasHeat = heat.TryGetValue(p.Time, out var h);
                t.Add(
                [
                    k.Lot.Season, k.Lot.LotId, p.Time, p.Hours, p.Brix, p.TemperatureC,
                    i > 0 ? k.Rates[i - 1].BrixPerDay : null, k.SmoothedRates[i].BrixPerDay,
                    hasHeat ? h.SugarGl : null, hasHeat ? h.PotentialRiseK : null, hasHeat ? h.PotentialTemperatureC : null,
                ]);
            }
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
            t.Add([f.Subject, f.Code, f.Message, f.Source?.ToString()]);
        }

        foreach (var key in review.LotsWithoutLog)
        {
            t.Add([key.ToString(), "no-log", $"Lot {key} has no fermentation log; its kinetics are not shown.", null]);
        }

        return t;
    }
}
