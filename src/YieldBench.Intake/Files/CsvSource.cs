using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;
using System.Text.Unicode;
using CsvHelper;
using CsvHelper.Configuration;

namespace YieldBench.Intake;

/// <summary>
/// Reads a .csv, .txt or .tsv file into one raw sheet: its encoding and delimiter settled from its bytes, its records
/// split by CsvHelper's RFC 4180 parser (streamed, repeated field texts cached), a record with an unclosed quote kept
/// with what is wrong with it.
/// </summary>
internal static partial class CsvSource
{
    /// <summary>Non-blank lines at the start of a CSV that settle its delimiter.</summary>
    private const int DelimiterSampleLines = 30;

    static CsvSource() => Encoding.RegisterProvider(CodePagesEncodingProvider.Instance);

    /// <summary>The parser settings every CSV is read with.</summary>
    public static CsvConfiguration Configuration(char delimiter) => new(CultureInfo.InvariantCulture)
    {
        Delimiter = delimiter.ToString(),
        DetectDelimiter = false,
        IgnoreBlankLines = false,
        BadDataFound = null,
        MissingFieldFound = null,
        Mode = CsvMode.RFC4180,
        CacheFields = true,
    };

    /// <summary>What the raw text of one record says about its quoting: null when its quote marks pair up.</summary>
    public static string? QuoteProblem(string raw)
    {
        if (!raw.Contains('"', StringComparison.Ordinal) || raw.Count(c => c == '"') % 2 == 0)
        {
            return null;
        }

        int swallowed = raw.TrimEnd('\r', '\n').Count(ch => ch == '\n');
        return swallowed == 0
            ? "a quote mark is not closed"
            : $"a quote mark is not closed, so the {swallowed.ToString(CultureInfo.InvariantCulture)} line(s) after it were read into this row";
    }

    public static RawFile Read(string file, string fullPath, byte[] head, IntakeOptions options, IssueSink sink)
    {
        var unicode = UnicodeForm(head, out int skip, out bool guessed);
        if (unicode is null)
        {
            int zero = Array.IndexOf(head, (byte)0);
            if (zero >= 0)
            {
                sink.Error(file, null, null, null, null, IssueCodes.BinaryFile, IntakeMessages.BinaryCsv(zero));
                return SourceFiles.Refused;
            }
        }
        else if (guessed)
        {
            sink.Warning(file, null, null, null, null, IssueCodes.EncodingAssumed, IntakeMessages.Utf16Assumed(unicode is UnicodeEncoding { } u && u.GetPreamble()[0] == 0xFE));
        }

        // The file is streamed: read once to settle its encoding, then decoded and split as it is read again.
        Encoding encoding;
        using (var fs = SourceFiles.OpenShared(fullPath))
        {
            if (unicode is not null)
            {
                encoding = unicode;
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
                sink.Warning(file, null, null, null, null, IssueCodes.EncodingAssumed, IntakeMessages.EncodingAssumed());
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
        using (var parser = new CsvParser(OpenText(fullPath, encoding, skip), Configuration(delimiter)))
        {
            while (parser.Read())
            {
                if (rows.Count >= options.MaxRows)
                {
                    tooMany = true;
                    break;
                }

                if (QuoteProblem(parser.RawRecord) is { } bad)
                {
                    badRows[rows.Count] = bad;
                }

                rows.Add([.. parser.Record ?? []]);
            }
        }

        bool decimalComma = delimiter != ',' && rows.Take(500).Any(r => r.Any(c => c is string s && DecimalCommaNumber().IsMatch(s)));
        bool dotUnsettled = delimiter != ',' && !decimalComma && !rows.Take(500).Any(r => r.Any(c => c is string s && DecimalPointNumber().IsMatch(s)));
        // A comma file (as US and UK spreadsheets export) with decimal points and no decimal comma: "1,250" is 1250.
        bool commaThousands = delimiter == ',' && rows.Take(500).Any(r => r.Any(c => c is string s && DecimalPointNumber().IsMatch(s)))
            && !rows.Take(500).Any(r => r.Any(c => c is string s && DecimalCommaOtherThanThousands().IsMatch(s)));
        var sheet = new RawSheet(null, rows, decimalComma) { TooManyRows = tooMany, IsText = true, DotGroupingUnsettled = dotUnsettled, CommaGroupsThousands = commaThousands };
        foreach (var (k, v) in badRows)
        {
            sheet.BadRows[k] = v;
        }

        return new RawFile([sheet], false);
    }

    /// <summary>
    /// The UTF-32 or UTF-16 encoding the start of the file shows, or null: by its byte-order mark (<paramref name="skip"/>
    /// bytes), or, with no mark, by its bytes — text in UTF-16 written without a mark (as some exports do) has a zero
    /// byte beside nearly every character of the Latin alphabets and never a zero pair (<paramref name="guessed"/>).
    /// </summary>
    internal static Encoding? UnicodeForm(byte[] head, out int skip, out bool guessed)
    {
        (skip, guessed) = (0, false);
        if (head is [0xFF, 0xFE, 0x00, 0x00, ..] or [0x00, 0x00, 0xFE, 0xFF, ..])
        {
            skip = 4;
            return new UTF32Encoding(bigEndian: head[0] == 0x00, byteOrderMark: true);
        }

        if (head is [0xFF, 0xFE, ..] or [0xFE, 0xFF, ..])
        {
            skip = 2;
            return new UnicodeEncoding(bigEndian: head[0] == 0xFE, byteOrderMark: true);
        }

        int pairs = Math.Min(head.Length / 2, 4096);
        if (pairs < 2)
        {
            return null;
        }

        foreach (bool bigEndian in (bool[])[false, true])
        {
            int zeroHigh = 0;
            bool zeroPair = false;
            for (int i = 0; i < pairs && !zeroPair; i++)
            {
                byte high = head[(2 * i) + (bigEndian ? 0 : 1)], low = head[(2 * i) + (bigEndian ? 1 : 0)];
                zeroPair = high == 0 && low == 0;
                zeroHigh += high == 0 ? 1 : 0;
            }

            if (!zeroPair && zeroHigh >= pairs * 0.9)
            {
                guessed = true;
                return new UnicodeEncoding(bigEndian, byteOrderMark: true);
            }
        }

        return null;
    }

    /// <summary>The file's text from after its byte-order mark, decoded as it is read.</summary>
    private static StreamReader OpenText(string fullPath, Encoding encoding, int skip)
    {
        var fs = SourceFiles.OpenShared(fullPath);
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

    /// <summary>A number with a decimal comma and other than three decimals ("24,3", "0,99"): the comma cannot group thousands.</summary>
    [GeneratedRegex(@"^\s*[-+]?[0-9]*,([0-9]{1,2}|[0-9]{4,})\s*$")]
    private static partial Regex DecimalCommaOtherThanThousands();

    /// <summary>A number with a decimal point and other than three decimals ("24.3", "0.99", "1.0950"): the dot is a decimal point.</summary>
    [GeneratedRegex(@"^\s*[-+]?[0-9]*\.([0-9]{1,2}|[0-9]{4,})\s*$")]
    private static partial Regex DecimalPointNumber();

}
