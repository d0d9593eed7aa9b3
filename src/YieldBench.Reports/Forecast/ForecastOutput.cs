using YieldBench.Core.Forecast;
using YieldBench.Core.Lots;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Output;
using YieldBench.Reports.Workbook;

namespace YieldBench.Reports.Forecast;

/// <summary>
/// Writes the forecast's files into a folder through the report pipeline (<see cref="ReportPipeline.WriteFiles"/>):
/// <c>forecast.json</c>, <c>forecast.xlsx</c> and <c>charts/forecast-*.png</c>, written side by side into a staging
/// folder and swapped in whole, with the manifest; a folder holding files this tool did not write is refused.
/// </summary>
public static class ForecastOutput
{
    /// <summary>Folder of the charts inside the output folder.</summary>
    public const string ChartsFolder = "charts";

    /// <summary>The files <see cref="Write"/> makes for <paramref name="report"/>, relative with '/' separators (the manifest not included).</summary>
    public static IReadOnlyList<string> Files(ForecastReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        return [ForecastJson.FileName, ForecastWorkbook.FileName, .. report.Lots.Select(ChartFile)];
    }

    /// <summary>Writes every file; returns what was written.</summary>
    /// <exception cref="ReportFolderException">The folder may not be written into (it holds files of the user's, or an input); nothing was written.</exception>
    public static ReportOutput Write(ForecastReport report, string folder, IReadOnlyList<IntakeIssue> issues, Core.Units.TemperatureUnit unit = Core.Units.TemperatureUnit.Celsius)
    {
        ArgumentNullException.ThrowIfNull(report);
        ArgumentNullException.ThrowIfNull(folder);
        ArgumentNullException.ThrowIfNull(issues);
        return ReportPipeline.WriteFiles(folder, Files(report), context =>
        [
            () => context.Write(ForecastWorkbook.FileName, s => s.Write(ForecastWorkbook.Write(report, issues, unit))),
            () => context.Write(ForecastJson.FileName, s => s.Write(new System.Text.UTF8Encoding(false).GetBytes(ForecastJson.Write(report)))),
            .. report.Lots.Select(f => (Action)(() => context.Write(ChartFile(f), s =>
            {
                using var png = ChartImage.RenderPngData(ForecastCharts.LotChart(f, unit));
                s.Write(png.AsSpan());
            }))),
        ]);
    }

    /// <summary>
    /// Lays out a small workbook and draws a small chart of an invented lot, writing nothing and keeping nothing, so
    /// that the workbook and chart code is loaded and compiled on a spare core while the command reads its inputs and
    /// forecasts (about a quarter of a second of the demo forecast's CPU is this first use; docs/performance.md).
    /// </summary>
    public static void WarmUp()
    {
        var origin = new DateTime(2000, 1, 1, 8, 0, 0);
        double[] hours = [0, 12, 24, 36, 48];
        var course = new LotCourse
        {
            Season = 2000,
            LotId = "warm-up",
            Strain = "warm-up",
            StartBrix = 24,
            Origin = origin,
            FromInoculation = true,
            SugarHours = [12, 24],
            SugarBrix = [23.5, 22.0],
            SugarSources = [null, null],
            TempHours = [12, 24],
            TempC = [20, 22],
        };
        var forecast = new LotForecast
        {
            Course = course,
            OwnStrainPrior = true,
            StrainLots = 3,
            OneThirdBrix = 16,
            OneThirdHours = new ForecastValue(40, 36, 44),
            OneThirdPassed = false,
            DryHours = new ForecastValue(120, 100, double.PositiveInfinity),
            NeverDryChance = 0.1,
            PeakC = new ForecastValue(27, 26, 28),
            ReachableC = 33,
            CoolingKw = 1,
            SettlesAtBrix = -2,
            PeakRateBrixPerDay = 6,
            StuckRisk = 0.1,
            NextReadingHours = 30,
            NextReadingFor = "one-third",
            NowHours = 24,
            SeasonShift = 0,
            Curve = new ForecastCurve(hours, [24, 23.5, 22, 19, 15], [24, 23, 21, 18, 13], [24, 24, 23, 20, 17], [18, 20, 22, 24, 26], [18, 19, 21, 23, 25], [18, 21, 23, 25, 27], [double.NaN, double.NaN, 22, 26, 30]),
            DangerC = 32,
            CautionC = 30,
            CoolingCoefficientPerHour = 0.02,
        };
        ChartImage.RenderPng(ForecastCharts.LotChart(forecast), 160, 100);
        WorkbookWriter.Build([new SheetPlan("Warm-up").Table(ForecastWorkbook.Lots([forecast]), freeze: true).Gap().Texts(["warm-up"])], "warm-up");
    }

    private static string ChartFile(LotForecast f) => ChartsFolder + "/" + ForecastCharts.FileName(f);
}
