using System.Globalization;
using System.IO.Compression;
using System.Text;
using System.Text.RegularExpressions;
using System.Text.Unicode;
using System.Xml;
using ExcelDataReader;

namespace YieldBench.Intake;

/// <summary>
/// Opens one input file read-only (shared, so a workbook open in a spreadsheet program does not block us), refuses
/// hostile or broken files with a reported issue, and returns its sheets as raw cells.
/// </summary>
internal static partial class SourceFiles
{
    /// <summary>Bytes of a CSV searched for a zero byte (a text file has none).</summary>
    private const int BinaryProbeBytes = 64 * 1024;

    /// <summary>Non-blank lines at the start of a CSV that settle its delimiter.</summary>
    private const int DelimiterSampleLines = 30;

    private static readonly byte[] ZipMagic = [0x50, 0x4B, 0x03, 0x04];
    private static readonly byte[] CompoundFileMagic = [0xD0, 0xCF, 0x11, 0xE0, 0xA1, 0xB1, 0x1A, 0xE1];

    static SourceFiles() => Encoding.RegisterProvider(CodePagesEncodingProvider.Instance);

    public static FileStream OpenShared(string fullPath) =>
        new(fullPath, FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete, 1 << 16);

    public static RawFile Read(string file, string fullPath, IntakeOptions options, IssueSink sink)
    {
        string ext = Path.GetExtension(fullPath).ToLowerInvariant();
        long length = new FileInfo(fullPath).Length;
        if (length == 0)
        {
            sink.Error(file, null, null, null, null, "empty-file", IntakeMessages.EmptyFile());
            return Refused;
        }

        if (length > options.MaxFileBytes)
        {
            sink.Error(file, null, null, null, length.ToString(CultureInfo.InvariantCulture), "file-too-large", IntakeMessages.FileTooLarge(length, options.MaxFileBytes));
            return Refused;
        }

        byte[] head = new byte[Math.Min(length, BinaryProbeBytes)];
        using (var fs = OpenShared(fullPath))
        {
            fs.ReadExactly(head);
        }

        return ext switch
        {
            ".csv" or ".txt" or ".tsv" => ReadCsv(file, fullPath, head, options, sink),
            _ => ReadWorkbook(file, fullPath, ext, head, options, sink),
        };
    }

    private static RawFile Refused => new([], true);

    private static bool StartsWith(byte[] data, byte[] magic) => data.Length >= magic.Length && data.AsSpan(0, magic.Length).SequenceEqual(magic);

    private static RawFile ReadWorkbook(string file, string fullPath, string ext, byte[] head, IntakeOptions options, IssueSink sink)
    {
        bool isZip = StartsWith(head, ZipMagic);
        bool isCompound = StartsWith(head, CompoundFileMagic);
        if (isCompound && IsEncryptedPackage(fullPath))
        {
            // An encrypted .xlsx is an OLE compound file holding an "EncryptedPackage" stream (MS-OFFCRYPTO 2.3.4).
            sink.Error(file, null, null, null, null, "password-protected", IntakeMessages.PasswordProtected());
            return Refused;
        }

        if (ext is ".xlsx" or ".xlsm" && !isZip)
        {
            sink.Error(file, null, null, null, null, "not-a-workbook", IntakeMessages.NotAZip(ext));
            return Refused;
        }

        if (ext == ".xls" && !isZip && !isCompound)
        {
            sink.Error(file, null, null, null, null, "not-a-workbook", IntakeMessages.CorruptWorkbook("it is not an Excel 97–2003 file"));
            return Refused;
        }

        Dictionary<string, List<(int Row, int Col, string Text)>> errorCells = [];
        if (isZip)
        {
            if (!CheckZip(file, fullPath, ext, options, sink))
            {
                return Refused;
            }

            errorCells = FindErrorCells(fullPath, out string? damage);
            if (damage is not null)
            {
                // The spreadsheet reader stops quietly at damaged XML; a half-read sheet must not pass as whole.
                sink.Error(file, null, null, null, null, "corrupt-workbook", IntakeMessages.CorruptWorkbook(damage));
                return Refused;
            }
        }

        var sheets = new List<RawSheet>();
        try
        {
            using var stream = OpenShared(fullPath);
            using var reader = ExcelReaderFactory.CreateReader(stream);
            do
            {
                var rows = new List<object?[]>();
                bool tooMany = false;
                while (reader.Read())
                {
                    if (rows.Count >= options.MaxRows)
                    {
                        tooMany = true;
                        break;
                    }

                    var cells = new object?[reader.FieldCount];
                    for (int i = 0; i < cells.Length; i++)
                    {
                        cells[i] = reader.GetValue(i);
                        if (cells[i] is double d && IsPercentFormat(reader.GetNumberFormatString(i)))
                        {
                            // A percent-formatted 0.138 is shown as 13.8 %; read what the user sees, as text with its %.
                            cells[i] = Math.Round(d * 100, 10).ToString("R", CultureInfo.InvariantCulture) + "%";
                        }
                    }

                    rows.Add(cells);
                }

                string name = reader.Name ?? $"Sheet{sheets.Count + 1}";
                if (errorCells.TryGetValue(name, out var errors))
                {
                    foreach (var (row, col, text) in errors)
                    {
                        while (rows.Count <= row)
                        {
                            rows.Add([]);
                        }

                        if (rows[row].Length <= col)
                        {
                            var wider = new object?[col + 1];
                            rows[row].CopyTo(wider, 0);
                            rows[row] = wider;
                        }

                        rows[row][col] = new ErrorCell(text);
                    }
                }

                bool hidden = !string.Equals(reader.VisibleState, "visible", StringComparison.OrdinalIgnoreCase) && !string.IsNullOrEmpty(reader.VisibleState);
                sheets.Add(new RawSheet(name, rows, decimalComma: false) { TooManyRows = tooMany, Hidden = hidden });
            }
            while (reader.NextResult());
        }
        catch (ExcelDataReader.Exceptions.InvalidPasswordException)
        {
            sink.Error(file, null, null, null, null, "password-protected", IntakeMessages.PasswordProtected());
            return Refused;
        }
        catch (Exception ex) when (ex is not OutOfMemoryException)
        {
            // The reader meets arbitrary bytes here: any failure inside it means the file is damaged, which is the
            // user's input problem to report, not a fault of ours to crash on.
            sink.Error(file, null, null, null, null, "corrupt-workbook", IntakeMessages.CorruptWorkbook(ex.Message.TrimEnd('.')));
            return Refused;
        }

        return new RawFile(sheets, false);
    }

    private static bool CheckZip(string file, string fullPath, string ext, IntakeOptions options, IssueSink sink)
    {
        try
        {
            using var fs = OpenShared(fullPath);
            using var zip = new ZipArchive(fs, ZipArchiveMode.Read);
            long compressed = 0, uncompressed = 0;
            foreach (var entry in zip.Entries)
            {
                // Sizes come from the central directory; nothing is decompressed here.
                compressed += entry.CompressedLength;
                uncompressed += entry.Length;
            }

            if (uncompressed > options.MaxUncompressedBytes)
            {
                sink.Error(file, null, null, null, null, "zip-bomb", IntakeMessages.TooBigUncompressed(uncompressed, options.MaxUncompressedBytes));
                return false;
            }

            if (compressed > 0 && uncompressed / (double)compressed > options.MaxCompressionRatio)
            {
                sink.Error(file, null, null, null, null, "zip-bomb", IntakeMessages.ZipBomb(uncompressed, compressed, options.MaxCompressionRatio));
                return false;
            }

            if (zip.GetEntry("xl/workbook.xml") is null && zip.GetEntry("xl/workbook.bin") is null)
            {
                sink.Error(file, null, null, null, null, "not-a-workbook", IntakeMessages.NotAZip(ext));
                return false;
            }

            return true;
        }
        catch (InvalidDataException)
        {
            sink.Error(file, null, null, null, null, "not-a-workbook", IntakeMessages.NotAZip(ext));
            return false;
        }
    }

    private static bool IsEncryptedPackage(string fullPath)
    {
        // The compound file's directory holds stream names in UTF-16LE; look for the one encryption adds.
        byte[] needle = Encoding.Unicode.GetBytes("EncryptedPackage");
        using var fs = OpenShared(fullPath);
        var buffer = new byte[Math.Min(fs.Length, 4L * 1024 * 1024)];
        fs.ReadExactly(buffer);
        return buffer.AsSpan().IndexOf(needle) >= 0;
    }

    /// <summary>
    /// Cells of type "e" (formula errors) in each worksheet of an .xlsx, by sheet name. The spreadsheet reader shows
    /// them as empty; this pass lets us report them instead.
    /// </summary>
    private static Dictionary<string, List<(int Row, int Col, string Text)>> FindErrorCells(string fullPath, out string? damage)
    {
        var result = new Dictionary<string, List<(int, int, string)>>(StringComparer.Ordinal);
        damage = null;
        string part = "xl/workbook.xml";
        try
        {
            using var fs = OpenShared(fullPath);
            using var zip = new ZipArchive(fs, ZipArchiveMode.Read);
            var wb = zip.GetEntry("xl/workbook.xml");
            var rels = zip.GetEntry("xl/_rels/workbook.xml.rels");
            if (wb is null || rels is null)
            {
                return result;
            }

            var targets = new Dictionary<string, string>(StringComparer.Ordinal);
            using (var rs = rels.Open())
            using (var xr = XmlReader.Create(rs, SafeXml))
            {
                while (xr.Read())
                {
                    if (xr.NodeType == XmlNodeType.Element && xr.LocalName == "Relationship" && xr.GetAttribute("Id") is { } id && xr.GetAttribute("Target") is { } target)
                    {
                        targets[id] = target.StartsWith('/') ? target.TrimStart('/') : "xl/" + target;
                    }
                }
            }

            var sheets = new List<(string Name, string Path)>();
            using (var ws = wb.Open())
            using (var xr = XmlReader.Create(ws, SafeXml))
            {
                while (xr.Read())
                {
                    if (xr.NodeType == XmlNodeType.Element && xr.LocalName == "sheet" && xr.GetAttribute("name") is { } name)
                    {
                        string? rid = xr.GetAttribute("id", "http://schemas.openxmlformats.org/officeDocument/2006/relationships");
                        if (rid is not null && targets.TryGetValue(rid, out var path))
                        {
                            sheets.Add((name, path));
                        }
                    }
                }
            }

            foreach (var (name, path) in sheets)
            {
                part = $"sheet '{name}'";
                var entry = zip.GetEntry(path);
                if (entry is null)
                {
                    continue;
                }

                using var es = entry.Open();
                using var xr = XmlReader.Create(es, SafeXml);
                while (xr.Read())
                {
                    if (xr.NodeType != XmlNodeType.Element || xr.LocalName != "c" || xr.GetAttribute("t") != "e" || xr.GetAttribute("r") is not { } reference)
                    {
                        continue;
                    }

                    string text = "#ERROR";
                    if (!xr.IsEmptyElement)
                    {
                        using var sub = xr.ReadSubtree();
                        while (sub.Read())
                        {
                            if (sub.NodeType == XmlNodeType.Element && sub.LocalName == "v")
                            {
                                text = sub.ReadElementContentAsString();
                                break;
                            }
                        }
                    }

                    if (TryParseReference(reference, out int row, out int col))
                    {
                        if (!result.TryGetValue(name, out var list))
                        {
                            result[name] = list = [];
                        }

                        list.Add((row, col, text));
                    }
                }
            }
        }
        catch (XmlException ex)
        {
            damage = $"the XML of {part} is damaged: {ex.Message.TrimEnd('.')}";
        }
        catch (InvalidDataException ex)
        {
            damage = $"{part} cannot be decompressed: {ex.Message.TrimEnd('.')}";
        }

        return result;
    }

    private static readonly XmlReaderSettings SafeXml = new() { DtdProcessing = DtdProcessing.Prohibit, XmlResolver = null, IgnoreWhitespace = true };

    /// <summary>"B4" → row 3, column 1 (both 0-based).</summary>
    internal static bool TryParseReference(string reference, out int row, out int col)
    {
        row = col = 0;
        int i = 0, c = 0;
        while (i < reference.Length && char.IsAsciiLetter(reference[i]))
        {
            c = (c * 26) + (char.ToUpperInvariant(reference[i]) - 'A' + 1);
            i++;
        }

        if (i == 0 || i == reference.Length || !int.TryParse(reference.AsSpan(i), NumberStyles.None, CultureInfo.InvariantCulture, out int r) || r < 1)
        {
            return false;
        }

        row = r - 1;
        col = c - 1;
        return true;
    }

    private static RawFile ReadCsv(string file, string fullPath, byte[] head, IntakeOptions options, IssueSink sink)
    {
        bool utf16 = head.Length >= 2 && ((head[0] == 0xFF && head[1] == 0xFE) || (head[0] == 0xFE && head[1] == 0xFF));
        if (!utf16)
        {
            int zero = Array.IndexOf(head, (byte)0);
            if (zero >= 0)
            {
                sink.Error(file, null, null, null, null, "binary-file", IntakeMessages.BinaryCsv(zero));
                return Refused;
            }
        }

        // The file is streamed: read once to settle its encoding, then decoded and split as it is read again.
        Encoding encoding;
        int skip;
        using (var fs = OpenShared(fullPath))
        {
            if (utf16)
            {
                encoding = new UnicodeEncoding(bigEndian: head[0] == 0xFE, byteOrderMark: false);
                skip = 2;
            }
            else if (IsValidUtf8(fs))
            {
                encoding = new UTF8Encoding(encoderShouldEmitUTF8Identifier: false);
                skip = head.Length >= 3 && head[0] == 0xEF && head[1] == 0xBB && head[2] == 0xBF ? 3 : 0;
            }
            else
            {
                encoding = Encoding.GetEncoding(1252);
                skip = 0;
                sink.Warning(file, null, null, null, null, "encoding-assumed", IntakeMessages.EncodingAssumed());
            }
        }

        char delimiter;
        using (var reader = OpenText(fullPath, encoding, skip))
        {
            delimiter = DetectDelimiter(LeadingLines(reader));
        }

        var rows = new List<object?[]>();
        var badRows = new Dictionary<int, string>();
        bool tooMany = false;
        using (var records = new CsvRecords(OpenText(fullPath, encoding, skip), delimiter))
        {
            while (records.Read())
            {
                if (rows.Count >= options.MaxRows)
                {
                    tooMany = true;
                    break;
                }

                if (records.Bad is { } bad)
                {
                    badRows[rows.Count] = bad;
                }

                rows.Add(records.Record);
            }
        }

        bool decimalComma = delimiter != ',' && rows.Take(500).Any(r => r.Any(c => c is string s && DecimalCommaNumber().IsMatch(s)));
        var sheet = new RawSheet(null, rows, decimalComma) { TooManyRows = tooMany };
        foreach (var (k, v) in badRows)
        {
            sheet.BadRows[k] = v;
        }

        return new RawFile([sheet], false);
    }

    /// <summary>The file's text from after its byte-order mark, decoded as it is read.</summary>
    private static StreamReader OpenText(string fullPath, Encoding encoding, int skip)
    {
        var fs = OpenShared(fullPath);
        fs.Seek(skip, SeekOrigin.Begin);
        // Buffers stay below the size that would put them on the large-object heap.
        return new StreamReader(fs, encoding, detectEncodingFromByteOrderMarks: false, bufferSize: 1 << 15, leaveOpen: false);
    }

    /// <summary>
    /// The start of the text, far enough to hold its first <see cref="DelimiterSampleLines"/> non-blank lines whole
    /// (or all of it): what <see cref="DetectDelimiter"/> looks at.
    /// </summary>
    private static string LeadingLines(TextReader reader)
    {
        var sb = new StringBuilder();
        var chunk = new char[4096];
        int lines = 0;
        bool blank = true;
        while (lines < DelimiterSampleLines)
        {
            int n = reader.Read(chunk, 0, chunk.Length);
            if (n == 0)
            {
                break;
            }

            int from = sb.Length;
            sb.Append(chunk, 0, n);
            for (int i = from; i < sb.Length && lines < DelimiterSampleLines; i++)
            {
                char c = sb[i];
                if (c == '\n')
                {
                    lines += blank ? 0 : 1;
                    blank = true;
                }
                else if (!char.IsWhiteSpace(c))
                {
                    blank = false;
                }
            }
        }

        return sb.ToString();
    }

    /// <summary>True when the rest of the stream is valid UTF-8, checked a block at a time.</summary>
    private static bool IsValidUtf8(Stream stream)
    {
        var buffer = new byte[1 << 15];
        int carried = 0;
        while (true)
        {
            int n = stream.Read(buffer, carried, buffer.Length - carried);
            if (n == 0)
            {
                return Utf8.IsValid(buffer.AsSpan(0, carried));
            }

            // Split the block before the last byte that starts a character, so no character is cut in two; valid
            // UTF-8 never has four continuation bytes in a row.
            int total = carried + n, split = total - 1, back = 0;
            while (split >= 0 && back < 4 && (buffer[split] & 0xC0) == 0x80)
            {
                split--;
                back++;
            }

            if (split < 0 || back == 4 || !Utf8.IsValid(buffer.AsSpan(0, split)))
            {
                return false;
            }

            carried = total - split;
            Array.Copy(buffer, split, buffer, 0, carried);
        }
    }

    /// <summary>
    /// The delimiter that splits the first lines most consistently: for each candidate, the most common non-zero
    /// count per line and how many lines have it; the candidate with most such lines wins (ties: more fields).
    /// </summary>
    internal static char DetectDelimiter(string text)
    {
        var lines = text.Split('\n').Select(l => l.TrimEnd('\r')).Where(l => l.Trim().Length > 0).Take(DelimiterSampleLines).ToArray();
        char best = ',';
        int bestLines = 0, bestCount = 0;
        foreach (char d in new[] { ',', ';', '\t', '|' })
        {
            var counts = lines.Select(l => CountOutsideQuotes(l, d)).Where(c => c > 0).ToArray();
            if (counts.Length == 0)
            {
                continue;
            }

            var mode = counts.GroupBy(c => c).OrderByDescending(g => g.Count()).ThenByDescending(g => g.Key).First();
            if (mode.Count() > bestLines || (mode.Count() == bestLines && mode.Key > bestCount))
            {
                best = d;
                bestLines = mode.Count();
                bestCount = mode.Key;
            }
        }

        return best;
    }

    private static int CountOutsideQuotes(string line, char d)
    {
        int n = 0;
        bool quoted = false;
        foreach (char c in line)
        {
            if (c == '"')
            {
                quoted = !quoted;
            }
            else if (c == d && !quoted)
            {
                n++;
            }
        }

        return n;
    }

    [GeneratedRegex(@"^\s*[-+]?[0-9]+,[0-9]+\s*$")]
    private static partial Regex DecimalCommaNumber();

    /// <summary>True when an Excel number format shows the value as a percentage (a % outside quotes and escapes).</summary>
    internal static bool IsPercentFormat(string? format)
    {
        if (string.IsNullOrEmpty(format))
        {
            return false;
        }

        bool quoted = false;
        for (int i = 0; i < format.Length; i++)
        {
            char c = format[i];
            if (c == '"')
            {
                quoted = !quoted;
            }
            else if (!quoted && c == '\\')
            {
                i++;
            }
            else if (!quoted && c == '%')
            {
                return true;
            }
        }

        return false;
    }
}
