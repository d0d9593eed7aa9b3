using System.IO.Compression;
using System.Text;
using System.Text.RegularExpressions;

namespace YieldBench.Reports.Workbook;

/// <summary>
/// Rewrites a zip package (an .xlsx) so that the same review gives the same bytes: every entry's time is set to one
/// fixed value (the packaging library stamps entries with the clock), and the package-level names the packaging
/// library draws at random — the core-properties part's file name and the relationship ids of <c>_rels/.rels</c>,
/// which nothing else refers to — are replaced by fixed ones. Entry order and all other contents are kept.
/// </summary>
public static partial class DeterministicZip
{
    /// <summary>Fixed name of the core-properties part.</summary>
    public const string CorePropertiesEntry = "package/services/metadata/core-properties/yieldbench.psmdcp";

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
            var coreProperties = input.Entries.FirstOrDefault(e => e.FullName.StartsWith("package/services/metadata/core-properties/", StringComparison.Ordinal));
            foreach (var entry in input.Entries)
            {
                string name = entry == coreProperties ? CorePropertiesEntry : entry.FullName;
                // PNGs are deflated already: compressing them again costs time and saves almost nothing.
                var level = name.EndsWith(".png", StringComparison.OrdinalIgnoreCase) ? CompressionLevel.NoCompression : CompressionLevel.Optimal;
                var copy = archive.CreateEntry(name, level);
                copy.LastWriteTime = EntryTime;
                using var from = entry.Open();
                using var to = copy.Open();
                if (entry.FullName == "_rels/.rels")
                {
                    using var reader = new StreamReader(from, Encoding.UTF8, detectEncodingFromByteOrderMarks: true);
                    string xml = reader.ReadToEnd();
                    if (coreProperties is not null)
                    {
                        xml = xml.Replace("/" + coreProperties.FullName, "/" + CorePropertiesEntry, StringComparison.Ordinal);
                    }

                    int n = 0;
                    xml = RandomRelationshipId().Replace(xml, _ => $"Id=\"rIdPkg{++n}\"");
                    to.Write(Encoding.UTF8.GetPreamble());
                    to.Write(new UTF8Encoding(encoderShouldEmitUTF8Identifier: false).GetBytes(xml));
                }
                else
                {
                    from.CopyTo(to);
                }
            }
        }

        return output.ToArray();
    }

    [GeneratedRegex("Id=\"R[0-9a-f]{16}\"")]
    private static partial Regex RandomRelationshipId();
}
