using YieldBench.Core.Forecast;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;
using YieldBench.Reports.Tables;
using YieldBench.Reports.Workbook;

namespace YieldBench.Reports.Forecast;

/// <summary>
/// The forecast workbook: sheet "Forecast" with one row per running lot (times as the cellar clock reads them, 80 %
/// intervals beside each), sheet "Backtest" with the leave-one-season-out table, and sheet "Notes and cautions".
/// The sheets lay themselves out as the review's do (widths and heights measured with the shipped font, frozen and
/// filtered headers, print setup). Same forecast, same bytes.
/// </summary>
public static class ForecastWorkbook
{
    /// <summary>File name in the output folder.</summary>
    public const string FileName = "forecast.xlsx";

    /// <summary>The one-row-per-lot table.</summary>
    public static ReportTable Lots(ForecastReport report, TemperatureUnit unit = TemperatureUnit.Celsius)
    {
        ArgumentNullException.ThrowIfNull(report);
        return Lots(report.Lots, unit, report.Now);
    }

    /// <summary>The one-row-per-lot table of <paramref name="lots"/>.</summary>
    internal static ReportTable Lots(IReadOnlyList<LotForecast> lots, TemperatureUnit unit = TemperatureUnit.Celsius, DateTime? now = null)
    {
        static object? At(LotForecast f, double? hours) => hours is { } h && double.IsFinite(h) ? f.Course.At(h) : null;
        static double Num(double? v) => v is { } x && double.IsFinite(x) ? x : double.NaN;
        double Temp(double? celsius) => unit.FromCelsius(Num(celsius));
        string u = unit.Symbol(), x = unit.Suffix();
        Column<LotForecast>[] columns =
        [
            new("season", "Season", CellKind.Integer, f => f.Course.Season),
            new("lot_id", "Lot", CellKind.Text, f => f.Course.LotId),
            new("strain", "Strain", CellKind.Text, f => f.Course.Strain),
            new("vessel", "Vessel", CellKind.Text, f => f.Course.Vessel),
            new("next_step_day", "Next step falls", CellKind.Text, f => DayWords(ForecastActions.Of(f, now, unit).Day)),
            new("next_step", "Next step (what cannot wait first)", CellKind.Text, f => StepWords(ForecastActions.Of(f, now, unit))),
            new("next_step_at", "Next step due", CellKind.DateTime, f => ForecastActions.Of(f, now, unit).Due),
            new("readings_used", "Readings used", CellKind.Integer, f => f.ReadingsUsed),
            new("one_third_brix", "One-third level (°Brix)", CellKind.Number, f => f.OneThirdBrix, "0.0"),
            new("one_third_at", "One-third expected", CellKind.DateTime, f => At(f, f.OneThirdHours?.Median)),
            new("one_third_low80", "One-third, 80 % from", CellKind.DateTime, f => At(f, f.OneThirdHours?.Low)),
            new("one_third_high80", "One-third, 80 % to", CellKind.DateTime, f => At(f, f.OneThirdHours?.High)),
            new("one_third_passed", "One-third already passed", CellKind.Boolean, f => f.OneThirdPassed),
            new("dry_at", "Dry expected", CellKind.DateTime, f => At(f, f.DryHours?.Median)),
            new("dry_low80", "Dry, 80 % from", CellKind.DateTime, f => At(f, f.DryHours?.Low)),
            new("dry_high80", "Dry, 80 % to", CellKind.DateTime, f => At(f, f.DryHours?.High)),
            new("dry_reached", "Dry already reached", CellKind.Boolean, f => f.DryReached),
            new($"peak_temp_{x}", $"Peak temperature ({u})", CellKind.Number, f => Temp(f.PeakC?.Median), "0.0"),
            new($"peak_temp_low80_{x}", $"Peak, 80 % from ({u})", CellKind.Number, f => Temp(f.PeakC?.Low), "0.0"),
            new($"peak_temp_high80_{x}", $"Peak, 80 % to ({u})", CellKind.Number, f => Temp(f.PeakC?.High), "0.0"),
            new($"reachable_without_cooling_{x}", $"Reachable with no cooling from now ({u})", CellKind.Number, f => Temp(f.ReachableC), "0.0"),
            new("cooling_kw", "Heat at the peak rate: cooling to hold it (kW)", CellKind.Number, f => Num(f.CoolingKw), "0.00"),
            new("vessel_heat_removal_per_h", "Vessel type's usual heat removal at the peak (per h)", CellKind.Number, f => Num(f.CoolingCoefficientPerHour), "0.000"),
            new("stuck_risk", "Chance of a sluggish or stuck end", CellKind.Share, f => f.StuckRisk),
            new("next_reading_at", "Next reading most worth taking", CellKind.DateTime, f => At(f, f.NextReadingHours)),
            new("basis", "Basis", CellKind.Text, f => f.OwnStrainPrior ? $"{f.StrainLots} past lots of the strain" : "pooled prior (strain not in the history)"),
            new("summary", "In words", CellKind.Text, f => string.Join(" ", ForecastSentences.Lot(f, unit, now).Select(s => s.Trim()))),
        ];
        return ReportTable.Of(columns, lots, f => f.StuckRisk >= 0.2 || (f.PeakC is { } p && p.High > f.DangerC));
    }

    /// <summary>The to-do list's day in words, as the console's groups are headed.</summary>
    private static string DayWords(ActionDay day) => day switch
    {
        ActionDay.Now => "act now",
        ActionDay.Today => "today",
        ActionDay.Tomorrow => "tomorrow",
        _ => "later",
    };

    /// <summary>The lot's line of the to-do list without its time: what cannot wait, the step with its range, what to watch.</summary>
    private static string StepWords(LotAction a) =>
        string.Join("; ", a.Urgent
            .Append(a.Step + (a.Range is { } r ? $" (80 % {r})" : string.Empty) + a.Then)
            .Concat(a.Watch.Select(w => "watch " + w)));

    /// <summary>The backtest table, with the per-season coverage.</summary>
    public static ReportTable Backtest(ForecastReport report, TemperatureUnit unit = TemperatureUnit.Celsius)
    {
        ArgumentNullException.ThrowIfNull(report);
        var seasons = report.Backtest.Seasons;
        double E(BacktestRow r, double v) => r.Target == "peak_temp" ? unit.Difference(v) : v;
        string hOr = $"h or {unit.Symbol()}";
        var columns = new List<Column<BacktestRow>>
        {
            new("target", "Target", CellKind.Text, r => r.Target),
            new("readings", "Readings before the cut", CellKind.Integer, r => r.Readings),
            new("lots", "Lots scored", CellKind.Integer, r => r.Lots),
            new("mae", $"Mean absolute error ({hOr})", CellKind.Number, r => E(r, r.Mae), "0.00"),
            new("p90", $"90th-percentile error ({hOr})", CellKind.Number, r => E(r, r.P90), "0.00"),
            new("coverage80", "80 % interval held the truth", CellKind.Share, r => r.Coverage80),
            new("baseline_line_mae", "Line through the last two readings: mean error", CellKind.Number, r => E(r, r.BaselineLineMae), "0.00"),
            new("baseline_strain_mae", "Strain median, no readings: mean error", CellKind.Number, r => E(r, r.BaselineStrainMae), "0.00"),
        };
        foreach (int season in seasons)
        {
            columns.Add(new($"coverage80_{season}", $"80 % held, {season} held out", CellKind.Share, r => r.CoverageBySeason.TryGetValue(season, out var v) ? v : double.NaN));
        }

        return ReportTable.Of(columns, report.Backtest.Rows);
    }

    /// <summary>The backtest by colour bucket.</summary>
    public static ReportTable ByColour(ForecastReport report, TemperatureUnit unit = TemperatureUnit.Celsius)
    {
        ArgumentNullException.ThrowIfNull(report);
        double E(BacktestRow r, double v) => r.Target == "peak_temp" ? unit.Difference(v) : v;
        string hOr = $"h or {unit.Symbol()}";
        Column<(string Colour, BacktestRow Row)>[] columns =
        [
            new("colour", "Colour", CellKind.Text, x => x.Colour == "white" ? "white and rosé" : x.Colour),
            new("target", "Target", CellKind.Text, x => x.Row.Target),
            new("readings", "Readings before the cut", CellKind.Integer, x => x.Row.Readings),
            new("lots", "Lots scored", CellKind.Integer, x => x.Row.Lots),
            new("mae", $"Mean absolute error ({hOr})", CellKind.Number, x => E(x.Row, x.Row.Mae), "0.00"),
            new("p90", $"90th-percentile error ({hOr})", CellKind.Number, x => E(x.Row, x.Row.P90), "0.00"),
            new("coverage80", "80 % interval held the truth", CellKind.Share, x => x.Row.Coverage80),
            new("baseline_line_mae", "Line through the last two readings: mean error", CellKind.Number, x => E(x.Row, x.Row.BaselineLineMae), "0.00"),
            new("baseline_strain_mae", "Strain median, no readings: mean error", CellKind.Number, x => E(x.Row, x.Row.BaselineStrainMae), "0.00"),
        ];
        return ReportTable.Of(columns, report.Backtest.ByColour);
    }

    /// <summary>The workbook's bytes, laid out as the review's workbook is (<see cref="SheetPlan"/>).</summary>
    public static byte[] Write(ForecastReport report, IReadOnlyList<IntakeIssue> issues, TemperatureUnit unit = TemperatureUnit.Celsius)
    {
        ArgumentNullException.ThrowIfNull(report);
        ArgumentNullException.ThrowIfNull(issues);
        SheetPlan[] sheets =
        [
            new SheetPlan("Forecast") { WrapUnits = 40 }
                .Table(Lots(report, unit), freeze: true)
                .Gap()
                .Texts(ForecastSentences.Cautions),
            new SheetPlan("Backtest")
                .Table(Backtest(report, unit), freeze: true)
                .Gap()
                .Heading(ForecastSentences.ByColourHeading(report.Backtest))
                .Table(ByColour(report, unit))
                .Gap()
                .Texts(ForecastSentences.Backtest(report.Backtest, unit).Select(l => l.Trim())),
            new SheetPlan("Notes and cautions")
                .Heading("Cautions")
                .Texts(ForecastSentences.Cautions)
                .Gap()
                .Heading("What the forecast rests on")
                .Texts(ForecastSentences.Basis(report, unit).Concat(ForecastSentences.Notes(report.Notes))),
            new SheetPlan("Intake issues").Table(ReviewTables.IntakeIssues(issues), freeze: true),
        ];
        return WorkbookWriter.Build(sheets, "YieldBench in-season forecast");
    }
}
