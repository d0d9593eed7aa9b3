using System.Buffers;
using System.Globalization;
using System.Text;
using CsvHelper;
using CsvHelper.Configuration;

namespace YieldBench.Intake;

/// <summary>
/// Splits CSV text into records as it streams in, without holding the whole file. Lines without a quote mark, and
/// lines whose quoted fields are well formed (a quote opens a field and closes it before a delimiter or the line end,
/// inner quotes doubled), are split here; any other quoting is handed, one record at a time, to CsvHelper's RFC 4180
/// parser, whose reading of malformed quotes is the reference. Records end where CsvHelper ends them when it reads the
/// whole text: at the first line end outside a quoted field, a quote mark opening a quoted field only at the start of
/// a field (see <see cref="Scan"/>), so each record's text can be handed over alone.
/// </summary>
internal sealed class CsvRecords : IDisposable
{
    // 32 K characters: 64 KB, below the large-object heap's threshold.
    private const int ChunkChars = 1 << 15;

    private readonly TextReader _reader;
    private readonly char _delimiter;
    private readonly CsvConfiguration _config;
    private readonly SearchValues<char> _fieldEnds;
    private readonly List<object?> _fields = [];
    private readonly Queue<(object?[] Fields, string? Bad)> _pending = new();
    private readonly StringBuilder _segment = new();
    private readonly StringBuilder _field = new();

    // The fields of the previous record: a field equal to the one above it is the same string (ids and seasons
    // repeat down a log), which saves building and holding a copy.
    private object?[] _above = [];

    // Per column, the short texts seen so far, so that a repeated value (a strain, a vessel type, a reading such as
    // "20.5") is one string. A column that keeps giving new texts (ids, timestamps) stops being tracked.
    private readonly List<HashSet<string>.AlternateLookup<ReadOnlySpan<char>>?> _seen = [];
    private readonly List<bool> _seenDropped = [];

    private char[] _buffer;
    private int _pos;
    private int _len;
    private bool _eof;

    /// <param name="reader">The text.</param>
    /// <param name="delimiter">The field delimiter.</param>
    /// <param name="chunkChars">Characters read at a time (small only in tests of the buffer's seams).</param>
    public CsvRecords(TextReader reader, char delimiter, int chunkChars = ChunkChars)
    {
        _buffer = new char[Math.Max(2, chunkChars)];
        _reader = reader;
        _delimiter = delimiter;
        _config = Configuration(delimiter);
        _fieldEnds = SearchValues.Create([delimiter, '"', '\r', '\n']);
    }

    /// <summary>The fields of the record last read (all strings).</summary>
    public object?[] Record { get; private set; } = [];

    /// <summary>What is wrong with the quoting of the record last read (an unclosed quote mark), or null.</summary>
    public string? Bad { get; private set; }

    /// <summary>The parser settings every CSV is read with.</summary>
    public static CsvConfiguration Configuration(char delimiter) => new(CultureInfo.InvariantCulture)
    {
        Delimiter = delimiter.ToString(),
        DetectDelimiter = false,
        IgnoreBlankLines = false,
        BadDataFound = null,
        MissingFieldFound = null,
        Mode = CsvMode.RFC4180,
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

    public bool Read()
    {
        if (_pending.TryDequeue(out var queued))
        {
            (Record, Bad) = queued;
            return true;
        }

        if (!NextLine(out int start, out int length, out int terminator))
        {
            return false;
        }

        var line = _buffer.AsSpan(start, length);
        if (!line.Contains('"'))
        {
            Record = Split(line);
            Bad = null;
            return true;
        }

        // A quote mark: the record runs on over line ends while a quoted field is open.
        _segment.Clear();
        var state = Quoting.FieldStart;
        bool wellFormed = true;
        while (true)
        {
            _segment.Append(_buffer, start, length + terminator);
            Scan(_buffer.AsSpan(start, length), ref state, ref wellFormed);
            if (state != Quoting.Quoted)
            {
                break;
            }

            if (!NextLine(out start, out length, out int next))
            {
                // The text ends inside a quoted field.
                wellFormed = false;
                break;
            }

            terminator = next;
        }

        string raw = _segment.ToString();
        if (wellFormed && SplitWellFormed(raw, terminator) is { } fields)
        {
            Record = fields;
            Bad = null;
            return true;
        }

        using (var parser = new CsvParser(new StringReader(raw), _config))
        {
            while (parser.Read())
            {
                _pending.Enqueue(([.. parser.Record ?? []], QuoteProblem(parser.RawRecord)));
            }
        }

        if (_pending.TryDequeue(out queued))
        {
            (Record, Bad) = queued;
            return true;
        }

        return Read();
    }

    public void Dispose() => _reader.Dispose();

    private enum Quoting
    {
        FieldStart,
        Unquoted,
        Quoted,
        AfterQuote,
    }

    /// <summary>
    /// Follows CsvHelper's reading of quote marks through one line: a quote opens a quoted field only at the start
    /// of a field; inside one, a doubled quote is a quote and a single one closes it; anything after the closing
    /// quote up to the delimiter, and any quote inside an unquoted field, is taken as it stands (not well formed).
    /// </summary>
    private void Scan(ReadOnlySpan<char> line, ref Quoting state, ref bool wellFormed)
    {
        for (int i = 0; i < line.Length; i++)
        {
            char c = line[i];
            switch (state)
            {
                case Quoting.FieldStart:
                    state = c == '"' ? Quoting.Quoted : c == _delimiter ? Quoting.FieldStart : Quoting.Unquoted;
                    break;
                case Quoting.Unquoted:
                    if (c == _delimiter)
                    {
                        state = Quoting.FieldStart;
                    }
                    else if (c == '"')
                    {
                        wellFormed = false;
                    }

                    break;
                case Quoting.Quoted:
                    if (c == '"')
                    {
                        if (i + 1 < line.Length && line[i + 1] == '"')
                        {
                            i++;
                        }
                        else
                        {
                            state = Quoting.AfterQuote;
                        }
                    }

                    break;
                default:
                    if (c == _delimiter)
                    {
                        state = Quoting.FieldStart;
                    }
                    else
                    {
                        wellFormed = false;
                    }

                    break;
            }
        }
    }

    private object?[] Split(ReadOnlySpan<char> line)
    {
        int count = line.Count(_delimiter) + 1;
        var fields = new object?[count];
        int f = 0;
        while (true)
        {
            int d = line.IndexOf(_delimiter);
            var field = d < 0 ? line : line[..d];
            fields[f] = field.Length == 0 ? ""
                : f < _above.Length && _above[f] is string above && field.SequenceEqual(above) ? above
                : Text(f, field);
            if (d < 0)
            {
                _above = fields;
                return fields;
            }

            f++;
            line = line[(d + 1)..];
        }
    }

    /// <summary>The text of a field in column <paramref name="column"/>: a string already made for the same text, or a new one.</summary>
    private string Text(int column, ReadOnlySpan<char> field)
    {
        const int MaxLength = 24, MaxDistinct = 4096;
        if (field.Length > MaxLength)
        {
            return new string(field);
        }

        while (_seen.Count <= column)
        {
            _seen.Add(null);
            _seenDropped.Add(false);
        }

        if (_seenDropped[column])
        {
            return new string(field);
        }

        var seen = _seen[column] ??= new HashSet<string>(StringComparer.Ordinal).GetAlternateLookup<ReadOnlySpan<char>>();
        if (seen.TryGetValue(field, out var known))
        {
            return known;
        }

        string text = new(field);
        if (seen.Set.Count >= MaxDistinct)
        {
            _seen[column] = null;
            _seenDropped[column] = true;
            return text;
        }

        seen.Add(text);
        return text;
    }

    /// <summary>The fields of a record whose every quote mark is part of a well-formed quoted field, else null.</summary>
    private object?[]? SplitWellFormed(string raw, int terminator)
    {
        int end = raw.Length - terminator;
        _fields.Clear();
        var sb = _field;
        int i = 0;
        while (true)
        {
            if (i < end && raw[i] == '"')
            {
                sb.Clear();
                i++;
                while (true)
                {
                    int q = raw.IndexOf('"', i, end - i);
                    if (q < 0)
                    {
                        return null;
                    }

                    sb.Append(raw, i, q - i);
                    if (q + 1 < end && raw[q + 1] == '"')
                    {
                        sb.Append('"');
                        i = q + 2;
                        continue;
                    }

                    i = q + 1;
                    break;
                }

                _fields.Add(sb.ToString());
                if (i == end)
                {
                    return [.. _fields];
                }

                if (raw[i] != _delimiter)
                {
                    return null;
                }

                i++;
                continue;
            }

            int next = raw.AsSpan(i, end - i).IndexOfAny(_fieldEnds) is var k and >= 0 ? i + k : end;
            if (next < end && raw[next] != _delimiter)
            {
                return null;
            }

            _fields.Add(raw[i..next]);
            if (next == end)
            {
                return [.. _fields];
            }

            i = next + 1;
        }
    }

    /// <summary>
    /// The next physical line in the buffer: its start, length without the line end, and the length of the line
    /// end ("\r\n", "\n" or "\r"; 0 at the end of the text). False when the text is used up.
    /// </summary>
    private bool NextLine(out int start, out int length, out int terminator)
    {
        int scanned = 0;
        while (true)
        {
            int k = _buffer.AsSpan(_pos + scanned, _len - _pos - scanned).IndexOfAny('\r', '\n');
            if (k >= 0)
            {
                int at = _pos + scanned + k;
                if (_buffer[at] == '\r' && at + 1 == _len && !_eof)
                {
                    // A "\r" at the end of the buffer may be the first half of "\r\n".
                    scanned = at - _pos;
                    Fill();
                    continue;
                }

                start = _pos;
                length = at - _pos;
                terminator = _buffer[at] == '\r' && at + 1 < _len && _buffer[at + 1] == '\n' ? 2 : 1;
                _pos = at + terminator;
                return true;
            }

            if (_eof)
            {
                start = _pos;
                length = _len - _pos;
                terminator = 0;
                _pos = _len;
                return length > 0;
            }

            scanned = _len - _pos;
            Fill();
        }
    }

    /// <summary>Reads more text behind what is left in the buffer (moved to its start, the buffer grown when full).</summary>
    private void Fill()
    {
        int left = _len - _pos;
        if (_pos > 0)
        {
            Array.Copy(_buffer, _pos, _buffer, 0, left);
        }
        else if (left == _buffer.Length)
        {
            Array.Resize(ref _buffer, _buffer.Length * 2);
        }

        _pos = 0;
        _len = left;
        int n = _reader.Read(_buffer, _len, _buffer.Length - _len);
        if (n == 0)
        {
            _eof = true;
        }

        _len += n;
    }
}
