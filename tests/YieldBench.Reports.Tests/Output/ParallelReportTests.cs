using System.Text;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Units;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Data;
using YieldBench.Reports.Kinetics;
using YieldBench.Reports.Tables;
using YieldBench.Reports.Tests.Fixtures;
using YieldBench.Reports.Tests.Kinetics;
using YieldBench.Reports.Workbook;

namespace YieldBench.Reports.Tests.Output;

/// <summary>
/// ReportWriter makes the data files, the charts and the workbook's layout side by side; these tests hold it to the
/// bytes the writers give when each is run on its own, one after another.
/// </summary>
public sealed class ParallelReportTests
{
    private static readonly UTF8Encoding Utf8NoBom = new(encoderShouldEmitUTF8Identifier: false);

    private static ReviewResult ReviewWithLogs() => SampleReview.WithLogs();

    [Fact]
    public async Task The_warm_up_beside_a_report_changes_none_of_its_bytes_and_writes_nothing_itself()
    {
        // Given a review written once on its own
        using var temp = new TempFolder();
        var review = ReviewWithLogs();
        ReportWriter.Write(review, temp["alone"]);

        // When the warm-up runs on other threads while the same review is written again
        var warmUps = Enumerable.Range(0, 3).Select(_ => Task.Run(ReportWriter.WarmUp)).ToArray();
        ReportWriter.Write(review, temp["beside"]);
        await Task.WhenAll(warmUps);

        // Then both folders hold the same files with the same bytes (the warm-up shares the font registry and
        // the workbook library with the writer), and nothing else appeared in the temporary folder
        string[] Files(string folder) => Directory.GetFiles(folder, "*", SearchOption.AllDirectories).Select(f => Path.GetRelativePath(folder, f)).Order(StringComparer.Ordinal).ToArray();
        var alone = Files(temp["alone"]);
        Assert.Equal(alone, Files(temp["beside"]));
        Assert.Contains(ReportWriter.WorkbookName, alone);
        foreach (string f in alone)
        {
            Assert.Equal(File.ReadAllBytes(Path.Combine(temp["alone"], f)), File.ReadAllBytes(Path.Combine(temp["beside"], f)));
        }

        Assert.Equal(["alone", "beside"], Directory.GetFileSystemEntries(temp.Path).Select(p => Path.GetFileName(p)!).Order(StringComparer.Ordinal).ToArray());
    }

    [Fact]
    public void The_report_holds_the_bytes_each_writer_gives_on_its_own()
    {
        // Given a review with logs, written by the report writer, and each output made separately, one after another
        using var temp = new TempFolder();
        var review = ReviewWithLogs();
        var steps = new List<string>();
        var output = ReportWriter.Write(review, temp["report"], new SynchronousProgress(steps));

        var alone = new List<ChartFile>(ReviewCharts.WriteAll(review, temp["alone"]));
        alone.AddRange(KineticsCharts.RenderFiles(review, temp["alone"])
            .Select(c => c with { OnOverview = Path.GetFileName(c.Path) == "kinetics-strain-curves.png" }));
        var expected = new Dictionary<string, byte[]>(StringComparer.Ordinal)
        {
            ["data/lots.csv"] = Utf8NoBom.GetBytes(CsvText.Write(ReviewTables.Lots(review))),
            ["data/groups.csv"] = Utf8NoBom.GetBytes(CsvText.Write(ReviewTables.Groups(review))),
            ["data/flags.csv"] = Utf8NoBom.GetBytes(CsvText.Write(ReviewTables.Flags(review))),
            ["data/intake-issues.csv"] = Utf8NoBom.GetBytes(CsvText.Write(ReviewTables.IntakeIssues(review))),
            ["data/house-factor.json"] = Utf8NoBom.GetBytes(HouseFactorJson.Write(review.HouseFactor)),
            ["data/kinetics.csv"] = Utf8NoBom.GetBytes(Csv(w => KineticsCsv.Write(review.Kinetics!, w))),
            [ReportWriter.WorkbookName] = WorkbookWriter.Build(review, alone),
        };
        foreach (var chart in alone)
        {
            expected["charts/" + Path.GetFileName(chart.Path)] = File.ReadAllBytes(chart.Path);
        }

        // Then it wrote exactly those files, each with the same bytes, listed in order, after the two steps in order
        Assert.Equal(expected.Keys.Order(StringComparer.Ordinal), output.Files);
        foreach (var (relative, bytes) in expected)
        {
            Assert.True(bytes.AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(output.Folder, relative))), relative + " differs");
        }

        Assert.Equal([ReportWriter.ParallelStep, ReportWriter.WorkbookStep], steps);
        Assert.Equal(
            [ReportWriter.ManifestName, .. output.Files],
            File.ReadAllText(Path.Combine(output.Folder, ReportWriter.ManifestName)).Split('\n', StringSplitOptions.RemoveEmptyEntries));
    }

    [Fact]
    public void Two_runs_write_the_same_bytes_however_the_threads_are_scheduled()
    {
        // Given the same review written three times into fresh folders
        using var temp = new TempFolder();
        var outputs = Enumerable.Range(0, 3).Select(i => ReportWriter.Write(ReviewWithLogs(), temp["run" + i])).ToArray();

        // Then every run lists the same files with the same bytes
        foreach (var other in outputs.Skip(1))
        {
            Assert.Equal(outputs[0].Files, other.Files);
            foreach (var relative in outputs[0].Files)
            {
                Assert.True(
                    File.ReadAllBytes(Path.Combine(outputs[0].Folder, relative)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(other.Folder, relative))),
                    relative + " differs between runs");
            }
        }
    }

    [Fact]
    public void The_shared_lots_sheet_table_is_the_table_built_in_the_sheet_s_order()
    {
        // Given the review, its lots table built in the sheet's order, and the data file's rows reordered for the sheet
        var review = ReviewWithLogs();
        var built = ReviewTables.Lots(review, ReviewTables.InStrainOrder(review));
        var shared = new SharedTables(review).LotsByStrain;

        // Then they hold the same cells and highlights, row by row
        Assert.Equal(built.Columns, shared.Columns);
        Assert.Equal(built.Highlighted, shared.Highlighted);
        Assert.Equal(built.Rows.Count, shared.Rows.Count);
        for (int r = 0; r < built.Rows.Count; r++)
        {
            Assert.Equal(built.Rows[r], shared.Rows[r]);
        }

        Assert.Contains(true, shared.Highlighted);
    }

    [Fact]
    public void A_failing_data_file_fails_the_report_after_every_other_step_has_stopped()
    {
        // Given an output folder where the data folder cannot be made (a file stands in its place)
        using var temp = new TempFolder();
        string folder = temp["report"];
        Directory.CreateDirectory(folder);
        File.WriteAllText(Path.Combine(folder, "data"), "in the way");

        // When the report is written, it fails with the file system's error, not a wrapped one
        Assert.ThrowsAny<IOException>(() => ReportWriter.Write(ReviewWithLogs(), folder));

        // Then no workbook or manifest was written, and no temporary file is left behind by any step
        Assert.False(File.Exists(Path.Combine(folder, ReportWriter.WorkbookName)));
        Assert.False(File.Exists(Path.Combine(folder, ReportWriter.ManifestName)));
        Assert.Empty(Directory.GetFiles(folder, "*.tmp", SearchOption.AllDirectories));
    }

    [Fact]
    public async Task A_failing_chart_fails_the_report_without_a_workbook_and_nothing_waits_for_its_picture()
    {
        // Given an output folder where the charts folder cannot be made (a file stands in its place), while the
        // workbook is laid out and its sheets written beside the charts, waiting only for their pictures
        using var temp = new TempFolder();
        string folder = temp["report"];
        Directory.CreateDirectory(folder);
        File.WriteAllText(Path.Combine(folder, "charts"), "in the way");

        // When the report is written, it fails (and returns: no step is left waiting for a chart that never came)
        var write = Task.Run(() => ReportWriter.Write(ReviewWithLogs(), folder));
        var ended = await Task.WhenAny(write, Task.Delay(TimeSpan.FromMinutes(2)));
        Assert.Same(write, ended);
        await Assert.ThrowsAnyAsync<Exception>(() => write);

        // Then no workbook or manifest was written, and no temporary file is left behind by any step
        Assert.False(File.Exists(Path.Combine(folder, ReportWriter.WorkbookName)));
        Assert.False(File.Exists(Path.Combine(folder, ReportWriter.ManifestName)));
        Assert.Empty(Directory.GetFiles(folder, "*.tmp", SearchOption.AllDirectories));
    }

    private static string Csv(Action<TextWriter> write)
    {
        using var w = new StringWriter(System.Globalization.CultureInfo.InvariantCulture);
        write(w);
        return w.ToString();
    }

    private sealed class SynchronousProgress(List<string> steps) : IProgress<string>
    {
        public void Report(string value) => steps.Add(value);
    }
}
