using System.Text;
using YieldBench.Core.Lots;

namespace YieldBench.Intake.Tests;

/// <summary>Every result and issue stays in input order.</summary>
public class InputOrderTests
{
    [Fact]
    public void Issues_lots_and_accounts_of_many_inputs_keep_the_input_order()
    {
        // Given inputs of every kind: files with problems, a missing file, an empty folder, an unread type, a folder
        // holding a lock file, and a lot read twice
        using var folder = new TestFolder();
        folder.Text("a-2023.csv", "Lot,Yeast,Brix,ABV,Notes\nA-01,QX-7,24,14,levée\nA-02,QX-7,abc,14,\n", Encoding.Latin1);
        folder.Text("b-2023.csv", "Lot,Yeast,Brix,ABV\nB-01,QX-7,24,14\nA-01,QX-7,24,14\nB-02,\"QX-7,24,14\n");
        folder.Text("notes.docx", "not read");
        Directory.CreateDirectory(folder.PathOf("empty"));
        Directory.CreateDirectory(folder.PathOf("in"));
        File.WriteAllText(folder.PathOf("in/~$c-2023.csv"), "lock");
        File.WriteAllText(folder.PathOf("in/c-2023.csv"), "Lot,Yeast,Brix,ABV\nC-01,QX-7,24,99\nC-02,QX-7,24,14\n");
        File.WriteAllText(folder.PathOf("in/d-2023.csv"), "Lot,Timestamp,Brix\nC-02,2023-09-01 08:00,24\nZ-09,2023-09-01 08:00,24\n");
        folder.Bytes("e.csv", []);

        // When they are read, twice (a folder's files in ordinal name order: "~" sorts after letters)
        string[] inputs = ["a-2023.csv", "missing.csv", "empty", "notes.docx", "b-2023.csv", "in", "e.csv"];
        var set = folder.Read(inputs);
        var again = folder.Read(inputs);

        // Then the issues, lots, accounts and files follow the inputs, the same both times
        Assert.Equal(
            [
                ("a-2023.csv", "encoding-assumed"), ("a-2023.csv", "not-a-number"), ("missing.csv", "file-not-found"), ("empty", "folder-empty"),
                ("notes.docx", "unsupported-file-type"), ("b-2023.csv", "duplicate-lot"), ("b-2023.csv", "bad-csv-row"),
                ("in/c-2023.csv", "out-of-range"), ("in/~$c-2023.csv", "lock-file-skipped"), ("e.csv", "empty-file"), ("in/d-2023.csv", "log-without-lot"), ("in/d-2023.csv", "log-too-short"),
                ("a-2023.csv", "lots-without-log"),
            ],
            set.Issues.Select(i => (i.File.Replace('\\', '/'), i.Code)));
        Assert.Equal(["A-01", "B-01", "C-02"], set.Lots.Select(l => l.LotId));
        Assert.Equal(["a-2023.csv", "notes.docx", "b-2023.csv", "in/c-2023.csv", "in/d-2023.csv", "e.csv"], set.Accounts.Select(a => a.File.Replace('\\', '/')));
        Assert.Equal(["a-2023.csv", "b-2023.csv", "in/c-2023.csv", "in/d-2023.csv"], set.Files.Select(f => f.Path.Replace('\\', '/')));
        Assert.Equal(set.Issues, again.Issues);
        Assert.Equal(set.Accounts, again.Accounts);
    }
}
