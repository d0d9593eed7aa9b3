using YieldBench.Reports.Output;
using YieldBench.Reports.Tests.Fixtures;

namespace YieldBench.Reports.Tests.Output;

public sealed class ReportWriterTests
{
    [Fact]
    public void A_manifest_line_pointing_outside_the_folder_is_never_followed()
    {
        // Given a folder whose manifest was edited to name a file outside it, and that file
        using var temp = new TempFolder();
        string outFolder = temp["out"];
        Directory.CreateDirectory(outFolder);
        string victim = temp["victim.txt"];
        File.WriteAllText(victim, "keep me");
        File.WriteAllText(Path.Combine(outFolder, ReportWriter.ManifestName), "../victim.txt\n" + victim + "\ndata/lots.csv\n");

        // When the manifest is read
        var listed = ReportWriter.ReadManifest(outFolder);

        // Then only the plain relative path inside the folder is honoured, and the outside file is untouched
        Assert.Equal(["data/lots.csv"], listed);
        Assert.Equal("keep me", File.ReadAllText(victim));
    }

    [Fact]
    public void An_atomic_write_replaces_the_target_and_leaves_no_temporary_file()
    {
        // Given an existing file
        using var temp = new TempFolder();
        string path = temp["sub/file.csv"];
        AtomicFile.WriteAllText(path, "old");

        // When it is written again
        AtomicFile.WriteAllText(path, "new,é\r\n");

        // Then it holds the new UTF-8 text without a byte-order mark, and the folder holds nothing else
        Assert.Equal([(byte)'n', (byte)'e', (byte)'w', (byte)',', 0xC3, 0xA9, (byte)'\r', (byte)'\n'], File.ReadAllBytes(path));
        Assert.Single(Directory.GetFiles(temp["sub"]));
    }

    [Fact]
    public void A_failed_write_leaves_the_old_file_and_no_temporary_file()
    {
        // Given an existing file
        using var temp = new TempFolder();
        string path = temp["file.csv"];
        AtomicFile.WriteAllText(path, "old");

        // When a write fails half-way
        Assert.Throws<InvalidOperationException>(() => AtomicFile.Write(path, s =>
        {
            s.Write([1, 2, 3]);
            throw new InvalidOperationException("disk full");
        }));

        // Then the old content is still there and no temporary file is left
        Assert.Equal("old", File.ReadAllText(path));
        Assert.Single(Directory.GetFiles(temp.Path));
    }
}
