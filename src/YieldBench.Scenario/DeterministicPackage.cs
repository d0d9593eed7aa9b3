using System.IO.Compression;
using System.Text;
using System.Text.RegularExpressions;

namespace YieldBench.Scenario;

/// <summary>
/// Rewrites an Open XML package (an .xlsx) so that the same content always gives the same bytes. The packaging layer
/// under ClosedXML names the core-properties part and some relationship ids with fresh GUIDs, and the zip writer
/// stamps every entry with the clock: GUID names and ids are replaced by sequential ones (references updated in every
/// part), document times and entry times by one fixed instant. Entry order and all other content are kept.
/// </summary>
public static partial class DeterministicPackage
{
    /// <summary>The instant written into every package: 2026-01-01 00:00 UTC (zip times hold no zone and start in 1980).</summary>
    public static readonly DateTime FixedInstant = new(2026, 1, 1, 0, 0, 0, DateTimeKind.Utc);

    /// <summary>Returns the package bytes with fixed document times and entry times.</summary>
    public static byte[] Normalise(byte[] package)
    {
        ArgumentNullException.ThrowIfNull(package);
        using var input = new ZipArchive(new MemoryStream(package), ZipArchiveMode.Read);
        var parts = new List<(string Name, byte[] Content)>();
        foreach (var entry in input.Entries)
        {
            using var s = entry.Open();
            using var m = new MemoryStream();
            s.CopyTo(m);
            parts.Add((entry.FullName, m.ToArray()));
        }

        // Map every GUID-like token (32 hex digits in part names, R + 16 hex digits as relationship ids) to a sequence.
        var map = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var (name, content) in parts)
        {
            foreach (Match m in GuidName().Matches(name))
            {
                map.TryAdd(m.Value, $"{map.Count + 1:x32}");
            }

            if (name.EndsWith(".rels", StringComparison.Ordinal))
            {
                foreach (Match m in RandomId().Matches(Encoding.UTF8.GetString(content)))
                {
                    map.TryAdd(m.Groups["id"].Value, $"R{map.Count + 1:x16}");
                }
            }
        }

        using var output = new MemoryStream();
        using (var zip = new ZipArchive(output, ZipArchiveMode.Create, leaveOpen: true))
        {
            foreach (var (originalName, original) in parts)
            {
                string name = Replace(originalName, map);
                byte[] content = original;
                if (IsXml(originalName))
                {
                    string xml = Encoding.UTF8.GetString(content);
                    string changed = Replace(xml, map);
                    string stamp = FixedInstant.ToString("yyyy-MM-ddTHH:mm:ssZ", System.Globalization.CultureInfo.InvariantCulture);
                    changed = CreatedOrModified().Replace(changed, m => m.Groups["open"].Value + stamp + m.Groups["close"].Value);
                    if (!string.Equals(changed, xml, StringComparison.Ordinal))
                    {
                        content = Encoding.UTF8.GetBytes(changed);
                    }
                }

                var copy = zip.CreateEntry(name, CompressionLevel.Optimal);
                copy.LastWriteTime = new DateTimeOffset(FixedInstant);
                using var target = copy.Open();
                target.Write(content);
            }
        }

        return output.ToArray();
    }

    /// <summary>Each entry's name and uncompressed bytes, in package order (for comparing packages whatever the compressor).</summary>
    public static IReadOnlyList<(string Name, byte[] Content)> Entries(byte[] package)
    {
        ArgumentNullException.ThrowIfNull(package);
        using var zip = new ZipArchive(new MemoryStream(package), ZipArchiveMode.Read);
        var list = new List<(string, byte[])>();
        foreach (var entry in zip.Entries)
        {
            using var s = entry.Open();
            using var m = new MemoryStream();
            s.CopyTo(m);
            list.Add((entry.FullName, m.ToArray()));
        }

        return list;
    }

    private static bool IsXml(string name) =>
        name.EndsWith(".xml", StringComparison.Ordinal) || name.EndsWith(".rels", StringComparison.Ordinal) || name.EndsWith(".psmdcp", StringComparison.Ordinal);

    private static string Replace(string text, Dictionary<string, string> map)
    {
        foreach (var (from, to) in map)
        {
            text = text.Replace(from, to, StringComparison.Ordinal);
        }

        return text;
    }

    [GeneratedRegex("[0-9a-f]{32}")]
    private static partial Regex GuidName();

    [GeneratedRegex(@"Id=""(?<id>R[0-9a-f]{16})""")]
    private static partial Regex RandomId();

    [GeneratedRegex(@"(?<open><dcterms:(?:created|modified)[^>]*>)[^<]*(?<close></dcterms:(?:created|modified)>)")]
    private static partial Regex CreatedOrModified();
}
