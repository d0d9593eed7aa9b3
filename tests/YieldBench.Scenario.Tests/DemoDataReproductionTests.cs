using System.IO.Compression;
using System.Text;

namespace YieldBench.Scenario.Tests;

/// <summary>The committed demo-data/ (its history/ and running/ subfolders and README) is exactly what the generator writes.</summary>
public class DemoDataReproductionTests
{
    private static readonly IReadOnlyList<(string Name, byte[] Bytes)> Rendered = DemoDataWriter.Render(ScenarioGenerator.Demo());

    [Fact]
    public void Generator_reproduces_every_committed_demo_file_byte_for_byte()
    {
        // Given the files the generator renders for the demo scenario
        // When each is compared with the committed file of the same name
        var mismatched = Rendered
            .Where(f => !File.Exists(PathOf(f.Name)) || !File.ReadAllBytes(PathOf(f.Name)).AsSpan().SequenceEqual(f.Bytes))
            .Select(f => f.Name)
            .ToArray();

        // Then every byte matches (if this fails after a deliberate change, run: dotnet run --project src/YieldBench.Scenario -- demo-data)
        Assert.Empty(mismatched);
    }

    [Fact]
    public void Demo_folder_holds_only_the_generated_files_and_the_git_attributes()
    {
        // Given the committed demo folder and its subfolders
        var present = Directory.GetFiles(RepoPaths.DemoData, "*", SearchOption.AllDirectories)
            .Select(f => Path.GetRelativePath(RepoPaths.DemoData, f))
            .Order(StringComparer.Ordinal)
            .ToArray();

        // When compared with the generator's file list
        var expected = Rendered.Select(f => f.Name).Append(".gitattributes").Order(StringComparer.Ordinal).ToArray();

        // Then no stale or stray file sits beside them
        Assert.Equal(expected, present);
    }

    private static string PathOf(string name) => Path.Combine(RepoPaths.DemoData, name);

    [Fact]
    public void Finished_seasons_and_the_harvest_in_progress_sit_in_separate_subfolders()
    {
        // Given the generator's file list
        var names = Rendered.Select(f => f.Name).ToArray();

        // Then the README sits at the top, the season files and logs in history/, the lots still fermenting in running/ only
        Assert.Contains("README.md", names);
        Assert.Equal(4, names.Count(n => n.StartsWith(DemoDataWriter.HistoryFolderName + Path.DirectorySeparatorChar, StringComparison.Ordinal)));
        Assert.Equal([Path.Combine(DemoDataWriter.RunningFolderName, DemoDataWriter.RunningFileName)], names.Where(n => n.StartsWith(DemoDataWriter.RunningFolderName + Path.DirectorySeparatorChar, StringComparison.Ordinal)));
        Assert.Equal(1 + 4 + 1, names.Length);
    }

    [Fact]
    public void Two_renderings_of_the_demo_give_identical_bytes()
    {
        // Given two independent renderings
        var again = DemoDataWriter.Render(ScenarioGenerator.Demo());

        // Then they agree file by file
        Assert.Equal(Rendered.Select(f => f.Name), again.Select(f => f.Name));
        for (int i = 0; i < Rendered.Count; i++)
        {
            Assert.True(Rendered[i].Bytes.AsSpan().SequenceEqual(again[i].Bytes), Rendered[i].Name + " differs between renderings");
        }
    }

    [Fact]
    public void Workbooks_carry_the_fixed_instant_and_no_random_part_names()
    {
        // Given a rendered workbook
        var workbook = Rendered.First(f => f.Name.EndsWith(".xlsx", StringComparison.Ordinal)).Bytes;

        // When its parts are listed
        var entries = DeterministicPackage.Entries(workbook);
        using var zip = new ZipArchive(new MemoryStream(workbook));

        // Then the core properties hold 2026-01-01, part names hold no GUID, and every entry time is the fixed instant
        var core = entries.Single(e => e.Name.EndsWith(".psmdcp", StringComparison.Ordinal));
        string xml = Encoding.UTF8.GetString(core.Content);
        Assert.Contains("2026-01-01T00:00:00", xml, StringComparison.Ordinal);
        Assert.EndsWith("00000000000000000000000000000001.psmdcp", core.Name, StringComparison.Ordinal);
        Assert.All(zip.Entries, e => Assert.Equal(new DateTime(2026, 1, 1), e.LastWriteTime.DateTime));
    }
}
