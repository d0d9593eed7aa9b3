using System.IO.Compression;
using System.IO.Pipelines;
using System.Text;
using System.Text.RegularExpressions;

namespace YieldBench.Reports.Workbook;

/// <summary>
/// Rewrites a zip package (an .xlsx) so that the same review gives the same bytes: every entry's time is set to one
/// fixed value (the packaging library stamps entries with the clock), and the package-level names the packaging
/// library draws at random — the core-properties part's file name and the relationship ids of <c>_rels/.rels</c>,
/// which nothing else refers to — are replaced by fixed ones. Entry order and all other contents are kept, except
/// that worksheets with streamed tables get their rows here (<see cref="StreamedSheet"/>).
/// </summary>
public static partial class DeterministicZip
{
    /// <summary>Fixed name of the core-properties part.</summary>
    public const string CorePropertiesEntry = "package/services/metadata/core-properties/yieldbench.psmdcp";

    /// <summary>Parts of at least this many bytes (before compression) are compressed at the fastest level.</summary>
    public const long LargePartBytes = 1 << 20;

    /// <summary>The time every entry carries: 1980-01-01 00:00, the earliest a zip header can hold.</summary>
    public static DateTimeOffset EntryTime { get; } = new(1980, 1, 1, 0, 0, 0, TimeSpan.Zero);

    /// <summary>The package <paramref name="zip"/> rewritten with fixed entry times.</summary>
    public static byte[] Normalise(byte[] zip) => Normalise(zip, new Dictionary<string, (string, IReadOnlyList<DeferredBody>)>());

    /// <summary>
    /// As <see cref="Normalise(byte[])"/>; each entry named in <paramref name="streamedSheets"/> (zip entry name → sheet
    /// name and its streamed tables) is written with those tables' rows in place of their template rows.
    /// </summary>
    internal static byte[] Normalise(byte[] zip, IReadOnlyDictionary<string, (string Sheet, IReadOnlyList<DeferredBody> Bodies)> streamedSheets)
    {
        ArgumentNullException.ThrowIfNull(zip);
        using var output = new MemoryStream();
        Normalise(new MemoryStream(zip, writable: false), output, streamedSheets);
        return output.ToArray();
    }

    /// <summary>
    /// As <see cref="Normalise(byte[], IReadOnlyDictionary{string, ValueTuple{string, IReadOnlyList{DeferredBody}}})"/>,
    /// reading the package from <paramref name="zip"/> and writing the normalised one straight to
    /// <paramref name="output"/> (seekable, as a file or memory stream is: the bytes are the same either way), so a large
    /// workbook is never held whole in memory a second and third time. Where <paramref name="partBytes"/> gives bytes
    /// for an entry (a part added as a stand-in), they are its content; it is asked as each entry is reached, in order.
    /// </summary>
    internal static void Normalise(
        Stream zip, Stream output, IReadOnlyDictionary<string, (string Sheet, IReadOnlyList<DeferredBody> Bodies)> streamedSheets, Func<string, byte[]?>? partBytes = null)
    {
        ArgumentNullException.ThrowIfNull(zip);
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(streamedSheets);
        if (!output.CanSeek)
        {
            // Without seeking the archive writes data descriptors after each entry: other bytes for the same package.
            throw new ArgumentException("The package must be written to a seekable stream.", nameof(output));
        }

        using var input = new ZipArchive(zip, ZipArchiveMode.Read);
        using (var archive = new ZipArchive(output, ZipArchiveMode.Create, leaveOpen: true))
        {
            int spliced = 0;
            var coreProperties = input.Entries.FirstOrDefault(e => e.FullName.StartsWith("package/services/metadata/core-properties/", StringComparison.Ordinal));
            foreach (var entry in input.Entries)
            {
                string name = entry == coreProperties ? CorePropertiesEntry : entry.FullName;
                // PNGs are deflated already: compressing them again costs time and saves almost nothing. Streamed
                // sheets are hundreds of megabytes of XML in a large review: the fastest level takes a quarter of the
                // time of the default for a file about half as large again. So does any other large part: the native
                // chart's cached points are 8 MB of XML at 100,000 lots, deflated in 0.07 s at the default level and in
                // 0.01 s at the fastest (best of 5 here), stored in 1.5 MB rather than 1.0 MB. The level follows the part's size, so the same review
                // still gives the same bytes.
                bool isStreamed = streamedSheets.TryGetValue(entry.FullName, out var streamed);
                var level = name.EndsWith(".png", StringComparison.OrdinalIgnoreCase) ? CompressionLevel.NoCompression
                    : isStreamed || entry.Length >= LargePartBytes ? CompressionLevel.Fastest
                    : CompressionLevel.Optimal;
                var copy = archive.CreateEntry(name, level);
                copy.LastWriteTime = EntryTime;
                using var from = entry.Open();
                using var to = copy.Open();
                if (!isStreamed && partBytes?.Invoke(entry.FullName) is { } content)
                {
                    to.Write(content);
                }
                else if (isStreamed)
                {
                    WriteStreamedSheet(from, to, streamed.Sheet, streamed.Bodies);
                    spliced++;
                }
                else if (entry.FullName == "_rels/.rels")
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

            if (spliced != streamedSheets.Count)
            {
                var missing = streamedSheets.Keys.Where(k => input.GetEntry(k) is null).Order(StringComparer.Ordinal);
                throw new InvalidOperationException("The package has no part " + string.Join(", ", missing) + " for the streamed tables.");
            }
        }
    }

    /// <summary>Bytes per write to a streamed sheet's compressor.</summary>
    private const int DeflateChunk = 1 << 18;

    /// <summary>
    /// Composes a streamed sheet on this thread while another compresses it (a <see cref="Pipe"/> between them). The
    /// compressor's output depends on the boundaries of the writes it is given, so it always gets writes of
    /// <see cref="DeflateChunk"/> bytes (the last one shorter), whatever the pipe hands over: the bytes are the same
    /// each run.
    /// </summary>
    private static void WriteStreamedSheet(Stream laidOut, Stream entry, string sheet, IReadOnlyList<DeferredBody> bodies)
    {
        var pipe = new Pipe(new PipeOptions(pauseWriterThreshold: 8 * DeflateChunk, resumeWriterThreshold: 4 * DeflateChunk, useSynchronizationContext: false));
        var compress = Task.Run(() =>
        {
            try
            {
                using var composed = pipe.Reader.AsStream();
                byte[] chunk = new byte[DeflateChunk];
                int n;
                while ((n = composed.ReadAtLeast(chunk, chunk.Length, throwOnEndOfStream: false)) > 0)
                {
                    entry.Write(chunk, 0, n);
                }
            }
            catch (Exception e)
            {
                pipe.Reader.Complete(e);
                throw;
            }
        });
        try
        {
            using var writer = pipe.Writer.AsStream();
            StreamedSheet.Write(laidOut, writer, sheet, bodies);
        }
        catch (Exception e)
        {
            pipe.Writer.Complete(e);
            try
            {
                compress.Wait();
            }
            catch (AggregateException)
            {
                // The composing failure is the cause; the compressor's end followed from it.
            }

            throw;
        }

        compress.GetAwaiter().GetResult();
    }

    [GeneratedRegex("Id=\"R[0-9a-f]{16}\"")]
    private static partial Regex RandomRelationshipId();
}
