using YieldBench.Core.Forecast;
using YieldBench.Core.Lots;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Output;

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
    public static ReportOutput Write(ForecastReport report, string folder, IReadOnlyList<IntakeIssue> issues)
    {
        ArgumentNullException.ThrowIfNull(report);
        ArgumentNullException.ThrowIfNull(folder);
        ArgumentNullException.ThrowIfNull(issues);
        return ReportPipeline.WriteFiles(folder, Files(report), context =>
        [
            () => context.Write(ForecastWorkbook.FileName, s => s.Write(ForecastWorkbook.Write(report, issues))),
            () => context.Write(ForecastJson.FileName, s => s.Write(new System.Text.UTF8Encoding(false).GetBytes(ForecastJson.Write(report)))),
            .. report.Lots.Select(f => (Action)(() => context.Write(ChartFile(f), s =>
            {
                using var png = ChartImage.RenderPngData(ForecastCharts.LotChart(f));
                s.Write(png.AsSpan());
            }))),
        ]);
    }

    private static string ChartFile(LotForecast f) => ChartsFolder + "/" + ForecastCharts.FileName(f);
}
