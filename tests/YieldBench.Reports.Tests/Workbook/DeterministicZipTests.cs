using System.IO.Compression;
using System.Text;
using YieldBench.Reports.Workbook;

namespace YieldBench.Reports.Tests.Workbook;

public sealed class DeterministicZipTests
{
    /// <summary>A package of the given parts (name → content), as the packaging library would write it.</summary>
    private static byte[] Package(params (string Name, byte[] Content)[] parts)
    {
        using var output = new MemoryStream();
        using (var zip = new ZipArchive(output, ZipArchiveMode.Create, leaveOpen: true))
        {
            foreach (var (name, content) in parts)
            {
                using var s = zip.CreateEntry(name, CompressionLevel.NoCompression).Open();
                s.Write(content);
            }
        }

        return output.ToArray();
    }

    private static long CompressedAt(byte[] content, CompressionLevel level)
    {
        using var output = new MemoryStream();
        using (var zip = new ZipArchive(output, ZipArchiveMode.Create, leaveOpen: true))
        {
            using var s = zip.CreateEntry("x.xml", level).Open();
            s.Write(content);
        }

        using var read = new ZipArchive(new MemoryStream(output.ToArray()));
        return read.Entries[0].CompressedLength;
    }

    // XML-like text that the fastest and the default level compress to clearly different sizes.
    private static byte[] Points(int count) => Encoding.UTF8.GetBytes(string.Concat(
        Enumerable.Range(0, count).Select(i => $"<c:pt idx=\"{i}\"><c:v>{(i * 7919 % 10007) / 41.0:0.###}</c:v></c:pt>")));

    [Fact]
    public void A_large_part_is_compressed_at_the_fastest_level_and_a_small_one_at_the_default_with_the_same_contents()
    {
        // Given a package with a part above the large-part size and one below it
        var large = Points(60_000);
        var small = Points(2_000);
        Assert.True(large.Length >= DeterministicZip.LargePartBytes && small.Length < DeterministicZip.LargePartBytes);
        Assert.NotEqual(CompressedAt(large, CompressionLevel.Fastest), CompressedAt(large, CompressionLevel.Optimal));

        // When it is normalised
        var normalised = DeterministicZip.Normalise(Package(("xl/drawings/charts/chart1.xml", large), ("xl/styles.xml", small)));

        // Then the large part has the fastest level's size, the small one the default's, and both read back unchanged
        using var zip = new ZipArchive(new MemoryStream(normalised));
        var chart = zip.GetEntry("xl/drawings/charts/chart1.xml")!;
        var styles = zip.GetEntry("xl/styles.xml")!;
        Assert.Equal(CompressedAt(large, CompressionLevel.Fastest), chart.CompressedLength);
        Assert.Equal(CompressedAt(small, CompressionLevel.Optimal), styles.CompressedLength);
        byte[] Read(ZipArchiveEntry e)
        {
            using var m = new MemoryStream();
            using (var s = e.Open())
            {
                s.CopyTo(m);
            }

            return m.ToArray();
        }

        Assert.Equal(large, Read(chart));
        Assert.Equal(small, Read(styles));
    }
}
