using YieldBench.Core.Forecast;
using YieldBench.Core.Lots;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Output;

namespace YieldBench.Reports.Forecast;

/// <summary>
/// Writes the forecast's files into a folder: <c>forecast.json</c>, <c>forecast.xlsx</c> and <c>charts/forecast-*.png</c>,
/// each atomically (temporary file, then rename); the workbook is laid out while the charts are drawn. Other files in
/// the folder are left alone.
/// </summary>
public static class ForecastOutput
{
    /// <summary>Folder of the charts inside the output folder.</summary>
    public const string ChartsFolder = "charts";

    /// <summary>The paths, relative to the output folder, of every file <see cref="Write"/> makes for <paramref name="report"/>.</summary>
    public static IReadOnlyList<string> Files(ForecastReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        return [ForecastJson.FileName, ForecastWorkbook.FileName, .. report.Lots.Select(f => Path.Combine(ChartsFolder, ForecastCharts.FileName(f)))];
    }

    /// <summary>Writes every file; returns their full paths in the order of <see cref="Files"/>.</summary>
    public static IReadOnlyList<string> Write(ForecastReport report, string folder, IReadOnlyList<IntakeIssue> issues)
    {
        ArgumentNullException.ThrowIfNull(issues);
        ArgumentNullException.ThrowIfNull(report);
        ArgumentNullException.ThrowIfNull(folder);
        Directory.CreateDirectory(folder);
        var workbook = Task.Run(() => AtomicFile.WriteAllBytes(Path.Combine(folder, ForecastWorkbook.FileName), ForecastWorkbook.Write(report, issues)));
        AtomicFile.WriteAllText(Path.Combine(folder, ForecastJson.FileName), ForecastJson.Write(report));
        var jobs = report.Lots.Select(f => (Func<ChartFile>)(() =>
            ChartImage.Save(ForecastCharts.LotChart(f), Path.Combine(folder, ChartsFolder, ForecastCharts.FileName(f)), $"Lot {f.Course.LotId}: forecast"))).ToArray();
        ChartImage.RenderAll(jobs);
        workbook.GetAwaiter().GetResult();
        return Files(report).Select(f => Path.GetFullPath(Path.Combine(folder, f))).ToArray();
    }
}
