using System.IO.Compression;

namespace YieldBench.Reports.Workbook;

/// <summary>
/// Rewrites a zip package (an .xlsx) with every entry's time set to one fixed value, keeping entry order and
/// contents, so that the same review gives the same bytes (the packaging library stamps entries with the clock).
/// </summary>
public static class DeterministicZip
{
    /// <summary>The time every entry carries: 1980-01-01 00:00, the earliest a zip header can hold.</summary>
    public static DateTimeOffset EntryTime { get; } = new(1980, 1, 1, 0, 0, 0, TimeSpan.Zero);

    /// <summary>The package <paramref name="zip"/> rewritten with fixed entry times.</summary>
    public static byte[] Normalise(byte[] zip)
    {
        ArgumentNullException.ThrowIfNull(zip);
        using var input = new ZipArchive(new MemoryStream(zip, writable: false), ZipArchiveMode.Read);
        using var output = new MemoryStream();
        using (var archive = new ZipArchive(output, ZipArchiveMode.Create, leaveOpen: true))
        {
            foreach (var entry in input.Entries)
            {
                var copy = archive.CreateEntry(entry.FullName, CompressionLevel.Optimal);
                copy.LastWriteTime = EntryTime;
                using var from = entry.Open();
                using var to = copy.Open();
                from.CopyTo(to);
            }
        }

        return output.ToArray();
    }
}
