using System.Globalization;
using System.Text;
using YieldBench.Core.Lots;

namespace YieldBench.Intake.Tests;

/// <summary>
/// The regression corpus (Regression/files, made by Regression/make-corpus.py): broken, hostile and awkward inputs,
/// each read alone. For each, Regression/expected.tsv holds the accounting (lots used, log readings used, rows left
/// out, blank rows, summary rows) and every issue code with its severity and count. No input may throw, hang or
/// leave an account unbalanced. With YB_UPDATE_CORPUS=1 the test rewrites expected.tsv instead of comparing.
/// </summary>
public class RegressionCorpusTests
{
    private static readonly TimeSpan Budget = TimeSpan.FromSeconds(60);

    private static string Folder => Path.Combine(DocumentationTests.RepoRoot(), "tests", "YieldBench.Intake.Tests", "Regression");

    private static string Files => Path.Combine(Folder, "files");

    private static string ExpectedPath => Path.Combine(Folder, "expected.tsv");

    public static TheoryData<string> Entries()
    {
        var data = new TheoryData<string>();
        foreach (var e in EntryNames())
        {
            data.Add(e);
        }

        return data;
    }

    /// <summary>The corpus entries: every file and folder in Regression/files but its .gitattributes.</summary>
    private static IEnumerable<string> EntryNames() =>
        Directory.EnumerateFileSystemEntries(Files).Select(p => Path.GetFileName(p)).Where(n => n != ".gitattributes").Order(StringComparer.Ordinal);

    /// <summary>What reading one entry came to, as one line of expected.tsv.</summary>
    internal static string Summary(string name, SeasonSet set)
    {
        var codes = set.Issues
            .GroupBy(i => (i.Severity == IssueSeverity.Error ? "error" : "warning") + ":" + i.Code)
            .OrderBy(g => g.Key, StringComparer.Ordinal)
            .Select(g => g.Count() == 1 ? g.Key : g.Key + "*" + g.Count().ToString(CultureInfo.InvariantCulture));
        int Sum(Func<SourceAccount, int> f) => set.Accounts.Sum(f);
        return string.Join('\t', name, N(set.Lots.Count), N(Sum(a => a.LogReadingsUsed)), N(Sum(a => a.RowsReported)), N(Sum(a => a.BlankRowsSkipped)),
            N(Sum(a => a.SummaryRowsSkipped)), string.Join(' ', codes));

        static string N(int v) => v.ToString(CultureInfo.InvariantCulture);
    }

    /// <summary>Reads one input on its own thread, failing when it takes longer than the budget (a hang).</summary>
    internal static async Task<SeasonSet> ReadWithin(string root, string input, IntakeOptions? options = null)
    {
        var task = Task.Factory.StartNew(() => IntakeReader.Read([input], (options ?? new IntakeOptions()) with { WorkingDirectory = root }), TaskCreationOptions.LongRunning);
        try
        {
            return await task.WaitAsync(Budget);
        }
        catch (TimeoutException)
        {
            Assert.Fail($"reading {input} took longer than {Budget.TotalSeconds} s");
            throw;
        }
    }

    [Fact]
    public void The_corpus_covers_the_inputs_it_is_meant_to()
    {
        // Given the corpus and its expectations
        var names = EntryNames().ToList();
        var expected = File.ReadAllLines(ExpectedPath).Skip(1).Select(l => l.Split('\t')[0]).ToList();

        // Then every entry has its line and every line its entry, and the corpus is broad
        Assert.True(names.Count >= 90, $"{names.Count} entries");
        Assert.Equal(names, expected);
    }

    [Theory]
    [MemberData(nameof(Entries))]
    public async Task Each_corpus_input_gives_its_expected_issues_and_accounting(string name)
    {
        // Given one corpus input
        // When it is read alone
        var set = await ReadWithin(Files, name);

        // Then every account balances, and the accounting and issue codes are those recorded for it
        Assert.All(set.Accounts, a => Assert.True(a.Balances, $"{a.File} [{a.Sheet}] does not balance: {a}"));
        string actual = Summary(name, set);
        if (Environment.GetEnvironmentVariable("YB_UPDATE_CORPUS") == "1")
        {
            Update(name, actual);
            return;
        }

        string? line = File.ReadAllLines(ExpectedPath).FirstOrDefault(l => l.StartsWith(name + "\t", StringComparison.Ordinal));
        Assert.Equal(line, actual);
    }

    private static readonly Lock UpdateLock = new();

    private static void Update(string name, string line)
    {
        lock (UpdateLock)
        {
            var lines = File.Exists(ExpectedPath) ? File.ReadAllLines(ExpectedPath).Skip(1).ToList() : [];
            lines.RemoveAll(l => l.StartsWith(name + "\t", StringComparison.Ordinal));
            lines.Add(line);
            lines.RemoveAll(l => !EntryNames().Contains(l.Split('\t')[0]));
            lines.Sort(StringComparer.Ordinal);
            File.WriteAllText(ExpectedPath, "entry\tlots\treadings\tleft_out\tblank\tsummary\tissues\n" + string.Join('\n', lines) + "\n", new UTF8Encoding(false));
        }
    }

    [Fact]
    public async Task A_device_a_pipe_and_a_link_to_a_device_are_refused_without_being_opened()
    {
        if (OperatingSystem.IsWindows())
        {
            return;
        }

        // Given a named pipe with no writer and a link to /dev/zero, named as CSV files, and /dev/zero as mapping file
        using var folder = new TestFolder();
        var mkfifo = System.Diagnostics.Process.Start("mkfifo", folder.PathOf("pipe.csv"));
        mkfifo.WaitForExit();
        File.CreateSymbolicLink(folder.PathOf("zero.csv"), "/dev/zero");

        // When they are read (a pipe would block the open, a device would never end)
        var set = await Task.Factory.StartNew(
            () => IntakeReader.Read(["pipe.csv", "zero.csv", "/dev/null"], new IntakeOptions { WorkingDirectory = folder.Root, MappingFile = "/dev/zero" }),
            TaskCreationOptions.LongRunning).WaitAsync(Budget);

        // Then each is refused with a reason, before anything is read
        Assert.Equal(
            [("/dev/zero", "mapping-file-refused"), ("pipe.csv", "empty-file"), ("zero.csv", "empty-file"), ("/dev/null", "unsupported-file-type")],
            set.Issues.Select(i => (i.File, i.Code)));
        Assert.Empty(set.Files);
    }
}
