using System.Text;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Units;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Data;
using YieldBench.Reports.Kinetics;
using YieldBench.Reports.Output;
using YieldBench.Reports.Tables;
using YieldBench.Reports.Tests.Fixtures;
using YieldBench.Reports.Tests.Kinetics;
using YieldBench.Reports.Workbook;

namespace YieldBench.Reports.Tests.Output;

/// <summary>
/// The report pipeline runs the parts' jobs side by side into a staging folder and swaps it in: these tests hold it to
/// the bytes the writers give when each is run on its own, and to a report folder that is whole or untouched.
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
            ["data/follow-up.csv"] = Utf8NoBom.GetBytes(CsvText.Write(ReviewTables.Findings(review))),
            ["data/intake-issues.csv"] = Utf8NoBom.GetBytes(CsvText.Write(ReviewTables.IntakeIssues(review))),
            ["data/house-factor.json"] = Utf8NoBom.GetBytes(HouseFactorJson.Write(review.HouseFactor)),
            ["data/kinetics.csv"] = Utf8NoBom.GetBytes(Csv(w => KineticsCsv.Write(review.Kinetics!, w))),
            ["data/kinetics-findings.csv"] = Utf8NoBom.GetBytes(CsvText.Write(KineticsTables.Findings(review.Kinetics!))),
            [ReportWriter.WorkbookName] = WorkbookWriter.Build(review, alone),
            [ReportWriter.PageName] = Utf8NoBom.GetBytes(YieldBench.Reports.Html.HtmlReport.Render(review)),
        };
        foreach (var chart in alone)
        {
            expected["charts/" + Path.GetFileName(chart.Path)] = File.ReadAllBytes(chart.Path);
        }

        // Then it wrote exactly those files (and the manifest), each with the same bytes, listed in order, after the two steps in order
        Assert.Equal(expected.Keys.Append(ReportWriter.ManifestName).Order(StringComparer.Ordinal), output.Files);
        Assert.Equal(ReportWriter.Files(review), output.Files);
        foreach (var (relative, bytes) in expected)
        {
            Assert.True(bytes.AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(output.Folder, relative))), relative + " differs");
        }

        Assert.Equal([ReportPipeline.WriteStep, ReportPipeline.SwapStep], steps);
        Assert.Equal(
            [ReportWriter.ManifestName, .. output.Files.Where(f => f != ReportWriter.ManifestName)],
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
    public void A_failing_part_leaves_the_previous_report_as_it_was_and_no_staging_folder()
    {
        // Given a report written once, and its files' bytes
        using var temp = new TempFolder();
        string folder = temp["report"];
        var review = ReviewWithLogs();
        ReportWriter.Write(review, folder);
        var before = Snapshot(folder);

        // When it is written again with a part that fails after the others have begun
        var parts = ReportWriter.Parts().Append(new FailingPart("data/extra.csv", waitFor: null)).ToArray();
        var error = Assert.Throws<IOException>(() => ReportPipeline.Write(review, folder, parts));

        // Then the failure is the part's own, the folder holds the earlier report byte for byte, and nothing else was left beside it
        Assert.Equal("disk full", error.Message);
        Assert.Equal(before, Snapshot(folder));
        Assert.Equal(["report"], Directory.GetFileSystemEntries(temp.Path).Select(Path.GetFileName));
    }

    [Fact]
    public async Task A_failing_chart_fails_the_report_and_nothing_waits_for_its_picture()
    {
        // Given the parts with the charts part replaced by one that declares the charts and fails before writing any,
        // while the workbook is laid out beside it and waits for their pictures
        using var temp = new TempFolder();
        string folder = temp["report"];
        var review = ReviewWithLogs();
        var parts = ReportWriter.Parts().Where(p => p is not Parts.ChartsPart).Append(new FailingCharts()).ToArray();

        // When the report is written, it fails (and returns: no job is left waiting for a chart that never came)
        var write = Task.Run(() => ReportPipeline.Write(review, folder, parts));
        var ended = await Task.WhenAny(write, Task.Delay(TimeSpan.FromMinutes(2)));
        Assert.Same(write, ended);
        await Assert.ThrowsAsync<IOException>(() => write);

        // Then no report folder was made and no staging folder is left
        Assert.Empty(Directory.GetFileSystemEntries(temp.Path));
    }

    [Fact]
    public void After_a_kill_the_next_run_puts_the_previous_report_back_and_clears_what_the_killed_run_left()
    {
        // Given what a run killed in the middle of its swap leaves: the earlier report renamed aside, the report folder
        // missing, and a staging folder of another killed run
        using var temp = new TempFolder();
        string folder = temp["report"];
        var review = ReviewWithLogs();
        ReportWriter.Write(review, folder);
        File.WriteAllText(Path.Combine(folder, "my-notes.txt"), "mine");
        Directory.Move(folder, temp[".report.yieldbench-previous-0123"]);
        Directory.CreateDirectory(temp[".report.yieldbench-staging-4567/data"]);
        File.WriteAllText(temp[".report.yieldbench-staging-4567/data/lots.csv"], "half");

        // When the next run writes the report
        var output = ReportWriter.Write(review, folder);

        // Then the report is whole, the user's file of the earlier folder is kept, and nothing of the killed runs is left
        Assert.Equal(ReportWriter.Files(review), output.Files);
        Assert.Equal("mine", File.ReadAllText(Path.Combine(folder, "my-notes.txt")));
        Assert.Equal(["report"], Directory.GetFileSystemEntries(temp.Path).Select(Path.GetFileName));
    }

    [Fact]
    public void A_folder_of_files_this_tool_did_not_write_is_refused_and_left_untouched()
    {
        // Given a folder holding a user's own workbook and lots file, with no manifest of ours
        using var temp = new TempFolder();
        string folder = temp["mine"];
        Directory.CreateDirectory(Path.Combine(folder, "data"));
        File.WriteAllText(Path.Combine(folder, "report.xlsx"), "my workbook");
        File.WriteAllText(Path.Combine(folder, "data", "lots.csv"), "my lots");

        // When a report is written there, it is refused before anything is written
        var error = Assert.Throws<ReportFolderException>(() => ReportWriter.Write(ReviewWithLogs(), folder));

        // Then the message says why, and the user's files are as they were, with nothing beside the folder
        Assert.Contains("holds files this tool did not write", error.Message, StringComparison.Ordinal);
        Assert.Equal("my workbook", File.ReadAllText(Path.Combine(folder, "report.xlsx")));
        Assert.Equal("my lots", File.ReadAllText(Path.Combine(folder, "data", "lots.csv")));
        Assert.Equal(["mine"], Directory.GetFileSystemEntries(temp.Path).Select(Path.GetFileName));
    }

    [Fact]
    public void A_file_of_the_user_s_where_a_report_file_would_go_is_refused()
    {
        // Given a report folder of ours (its manifest) in which the user put a file where a chart of this report goes
        using var temp = new TempFolder();
        string folder = temp["report"];
        var review = ReviewWithLogs();
        ReportWriter.Write(review, folder);
        string manifest = Path.Combine(folder, ReportWriter.ManifestName);
        File.WriteAllLines(manifest, File.ReadAllLines(manifest).Where(l => l != "charts/factor-by-strain.png").ToArray());
        File.WriteAllText(Path.Combine(folder, "charts", "factor-by-strain.png"), "my picture");

        // When the report is written again, it is refused and the user's file is kept
        var error = Assert.Throws<ReportFolderException>(() => ReportWriter.Write(review, folder));
        Assert.Contains("charts/factor-by-strain.png", error.Message, StringComparison.Ordinal);
        Assert.Equal("my picture", File.ReadAllText(Path.Combine(folder, "charts", "factor-by-strain.png")));
    }

    private static Dictionary<string, string> Snapshot(string folder) =>
        Directory.GetFiles(folder, "*", SearchOption.AllDirectories)
            .ToDictionary(f => Path.GetRelativePath(folder, f), f => Convert.ToHexString(System.Security.Cryptography.SHA256.HashData(File.ReadAllBytes(f))), StringComparer.Ordinal);

    /// <summary>A part that declares one file and fails before writing it (optionally after another part's file is written).</summary>
    private sealed class FailingPart(string file, string? waitFor) : IReportPart
    {
        public string Name => "failing";

        public IReadOnlyList<string> Files(ReviewResult review) => [file];

        public IReadOnlyList<Action> Jobs(PartContext context) =>
        [
            () =>
            {
                if (waitFor is not null)
                {
                    context.Read(waitFor);
                }

                throw new IOException("disk full");
            },
        ];
    }

    /// <summary>Declares the charts of the real charts part and fails before drawing any.</summary>
    private sealed class FailingCharts : IReportPart
    {
        public string Name => "charts";

        public IReadOnlyList<string> Files(ReviewResult review) => new Parts.ChartsPart().Files(review);

        public IReadOnlyList<Action> Jobs(PartContext context) => [() => throw new IOException("no room for charts")];
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
