using YieldBench.Core.Lots;

namespace YieldBench.Intake.Tests;

public class CorpusTests
{
    public static TheoryData<string> CaseNames()
    {
        var data = new TheoryData<string>();
        foreach (var c in Corpus.Cases)
        {
            data.Add(c.Name);
        }

        return data;
    }

    private static (CorpusCase Case, SeasonSet Set) Run(string name, TestFolder folder)
    {
        var c = Corpus.Cases.Single(x => x.Name == name);
        string file = c.Make(folder);
        return (c, folder.Read(c.Options, file));
    }

    [Fact]
    public void The_corpus_holds_at_least_thirty_distinct_broken_inputs()
    {
        Assert.True(Corpus.Cases.Count >= 30, $"{Corpus.Cases.Count} cases");
        Assert.Equal(Corpus.Cases.Count, Corpus.Cases.Select(c => c.Name).Distinct().Count());
    }

    [Theory]
    [MemberData(nameof(CaseNames))]
    public void Each_broken_input_is_reported_with_its_exact_message_and_place(string name)
    {
        // Given a broken input
        using var folder = new TestFolder();

        // When it is read
        var (c, set) = Run(name, folder);

        // Then the expected issue is among those reported, word for word and at the right place
        Assert.Contains(c.Expected, set.Issues);
    }

    [Theory]
    [MemberData(nameof(CaseNames))]
    public void Every_corpus_file_balances_its_row_accounting_and_keeps_its_good_rows(string name)
    {
        // Given a broken input
        using var folder = new TestFolder();

        // When it is read
        var (c, set) = Run(name, folder);

        // Then every sheet's rows are used or reported, and the good rows are still read
        Assert.All(set.Accounts, a => Assert.True(a.Balances, $"{a.File} [{a.Sheet}] does not balance: {a}"));
        Assert.Equal(c.LotsStillRead, set.Lots.Count);
    }
}
