using System.Text;
using YieldBench.Reports.Output;
using YieldBench.Reports.Tests.Fixtures;

namespace YieldBench.Reports.Tests.Output;

/// <summary>
/// Two runs writing the same report folder at once: the second is refused with what to do, and the first finishes whole
/// (before the folder had a lock, the second removed the first one's staging folder as a stale leftover).
/// </summary>
public sealed class ReportFolderLockTests
{
    private static IReadOnlyList<Action> OneFile(OutputContext context, string text, Action? whileWriting = null) =>
    [
        () => context.Write("note.txt", s =>
        {
            whileWriting?.Invoke();
            s.Write(Encoding.UTF8.GetBytes(text));
        }),
    ];

    [Fact]
    public void A_second_run_into_the_same_folder_while_the_first_writes_is_refused_and_the_first_finishes_whole()
    {
        // Given a report folder with an earlier report in it
        using var temp = new TempFolder();
        string folder = temp["report"];
        ReportPipeline.WriteFiles(folder, ["note.txt"], c => OneFile(c, "first"));

        // When a second run starts on the same folder while a run is writing its files
        ReportFolderException? refused = null;
        ReportPipeline.WriteFiles(folder, ["note.txt"], c => OneFile(c, "second", () =>
            refused = Assert.Throws<ReportFolderException>(() => ReportPipeline.WriteFiles(folder, ["note.txt"], c2 => OneFile(c2, "third")))));

        // Then the second run is refused with the folder, the lock and what to do; the running one's report is whole
        Assert.NotNull(refused);
        Assert.Contains("Another run is writing a report into", refused.Message, StringComparison.Ordinal);
        Assert.Contains("wait for it to finish, or give another --out", refused.Message, StringComparison.Ordinal);
        Assert.Equal("second", File.ReadAllText(Path.Combine(folder, "note.txt")));

        // and nothing is left beside the folder: no lock, no staging folder
        Assert.Equal(["report"], Directory.GetFileSystemEntries(temp.Path).Select(p => Path.GetFileName(p)!).ToArray());
    }

    [Fact]
    public void The_lock_is_released_when_a_run_fails_so_the_next_run_writes()
    {
        // Given a run whose job fails part way
        using var temp = new TempFolder();
        string folder = temp["report"];
        Assert.Throws<InvalidOperationException>(() => ReportPipeline.WriteFiles(folder, ["note.txt"], c => OneFile(c, "x", () => throw new InvalidOperationException("disk gone"))));

        // When the next run writes the same folder
        ReportPipeline.WriteFiles(folder, ["note.txt"], c => OneFile(c, "after"));

        // Then it writes, and nothing but the folder is left
        Assert.Equal("after", File.ReadAllText(Path.Combine(folder, "note.txt")));
        Assert.Equal(["report"], Directory.GetFileSystemEntries(temp.Path).Select(p => Path.GetFileName(p)!).ToArray());
    }
}
