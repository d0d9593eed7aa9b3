using ScottPlot;
using YieldBench.Reports.Output;

namespace YieldBench.Reports.Charts;

/// <summary>A PNG chart written to disk.</summary>
/// <param name="Path">Full path of the PNG.</param>
/// <param name="Title">Chart title, used as the picture's description in the workbook.</param>
/// <param name="Width">Width, px.</param>
/// <param name="Height">Height, px.</param>
/// <param name="Sheet">Name of the workbook sheet the picture is placed on, below its table (null: none besides the overview).</param>
/// <param name="OnOverview">True when the overview sheet shows it too (keep it for the few charts that explain the review at a glance).</param>
public sealed record ChartFile(string Path, string Title, int Width, int Height, string? Sheet = null, bool OnOverview = true);

/// <summary>Renders plots to PNG bytes and files.</summary>
public static class ChartImage
{
    /// <summary>The plot as PNG bytes.</summary>
    public static byte[] RenderPng(Plot plot, int width = ChartStyle.Width, int height = ChartStyle.Height)
    {
        ArgumentNullException.ThrowIfNull(plot);
        ReportFonts.EnsureRegistered();
        return plot.GetImageBytes(width, height, ImageFormat.Png);
    }

    /// <summary>Renders the plot and writes it atomically (temporary file, then rename) to <paramref name="path"/>.</summary>
    /// <param name="plot">The plot.</param>
    /// <param name="path">Target path; its folder is created when missing.</param>
    /// <param name="title">Title recorded with the file (workbook picture description).</param>
    /// <param name="sheet">Workbook sheet the picture also goes on, or null.</param>
    /// <param name="width">Width, px.</param>
    /// <param name="height">Height, px.</param>
    /// <param name="onOverview">True when the overview sheet shows it too.</param>
    public static ChartFile Save(
        Plot plot, string path, string title, string? sheet = null, int width = ChartStyle.Width, int height = ChartStyle.Height, bool onOverview = true)
    {
        byte[] png = RenderPng(plot, width, height);
        AtomicFile.WriteAllBytes(path, png);
        return new ChartFile(System.IO.Path.GetFullPath(path), title, width, height, sheet, onOverview);
    }

    /// <summary>
    /// Runs independent chart jobs on all cores and returns their results in the jobs' order, so the files, their
    /// bytes and the workbook's placement do not depend on which thread finished first.
    /// </summary>
    /// <param name="jobs">Each job builds its own plot and writes its own file; jobs share no mutable state.</param>
    public static IReadOnlyList<ChartFile> RenderAll(IReadOnlyList<Func<ChartFile>> jobs)
    {
        ArgumentNullException.ThrowIfNull(jobs);

        // Font registration touches ScottPlot's global resolver list: do it once before any worker starts.
        ReportFonts.EnsureRegistered();
        var results = new ChartFile[jobs.Count];
        Parallel.For(0, jobs.Count, new ParallelOptions { MaxDegreeOfParallelism = Environment.ProcessorCount }, i => results[i] = jobs[i]());
        return results;
    }
}
