using YieldBench.Core.Lots;

namespace YieldBench.Intake.Tests;

public class SameContentTests
{
    private const string Lots = "Lot,Vintage,Yeast,Brix,Alcohol % v/v\nA-01,2023,QX-7,24.0,14.0\nA-02,2023,QX-9,23.1,13.4\n";

    [Fact]
    public void A_file_given_twice_or_met_again_in_a_folder_is_read_once_with_a_warning_not_as_duplicate_lots()
    {
        // Given a lots file in a folder, and a copy of it in a backup folder below
        using var folder = new TestFolder();
        Directory.CreateDirectory(folder.PathOf("cellar/backup"));
        folder.Text("cellar/lots-2023.csv", Lots);
        folder.Text("cellar/backup/lots-2023 copy.csv", Lots);

        // When the file is given by name, then again, then its folder
        var set = folder.Read("cellar/lots-2023.csv", "./cellar/lots-2023.csv", "cellar");

        // Then its two lots are read once; every repeat is a warning naming the file read first, and no row is left out
        Assert.Equal(["A-01", "A-02"], set.Lots.Select(l => l.LotId));
        var repeats = set.Issues.Where(i => i.Code == IssueCodes.SameContentAgain).ToArray();
        Assert.Equal(["./cellar/lots-2023.csv", "cellar/lots-2023.csv", "cellar/backup/lots-2023 copy.csv"], repeats.Select(i => i.File));
        Assert.All(repeats, i => Assert.Equal(IssueSeverity.Warning, i.Severity));
        Assert.All(repeats, i => Assert.StartsWith("The file holds exactly the same bytes as cellar/lots-2023.csv, read already", i.Message, StringComparison.Ordinal));
        Assert.Equal(repeats.Length, set.Issues.Count);
        Assert.Equal(0, set.Accounts.Sum(a => a.RowsReported));
        Assert.Equal(4, set.Files.Count);
    }

    [Fact]
    public void Two_files_that_differ_by_one_byte_are_both_read()
    {
        // Given two lots files differing only in one lot's alcohol
        using var folder = new TestFolder();
        folder.Text("lots-2023.csv", Lots);
        folder.Text("lots-2024.csv", Lots.Replace("2023", "2024", StringComparison.Ordinal).Replace("13.4", "13.5", StringComparison.Ordinal));

        // When both are read
        var set = folder.Read("lots-2023.csv", "lots-2024.csv");

        // Then both seasons' lots are used
        Assert.Equal(4, set.Lots.Count);
        Assert.Empty(set.Issues);
    }
}
