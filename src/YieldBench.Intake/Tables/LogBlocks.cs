namespace YieldBench.Intake;

/// <summary>
/// A log sheet without a lot column that holds several lots' readings one block under another, each block under a
/// heading row naming its lot ("25-QR-02", "Tank 4"), often with the header typed again under the heading: the
/// headings name the lot of the readings below them, and the headings and repeated headers are structure, not rows
/// left out.
/// </summary>
internal sealed class LogBlocks
{
    /// <summary>Most words of a heading text; longer texts are notes.</summary>
    private const int MaxHeadingWords = 4;

    /// <summary>Most characters of a heading text.</summary>
    private const int MaxHeadingLength = 60;

    private readonly List<(int Row, string Lot)> _headings = [];

    private LogBlocks()
    {
    }

    /// <summary>The heading rows (sheet row index, 0-based) and the lot each names, in sheet order.</summary>
    public IReadOnlyList<(int Row, string Lot)> Headings => _headings;

    /// <summary>The lot of the readings above the first heading when a heading stands right above the header, and its row.</summary>
    public (int Row, string Lot)? AboveHeader { get; private set; }

    /// <summary>Rows repeating the header (0-based).</summary>
    public List<int> HeaderRepeats { get; } = [];

    /// <summary>Every row that is structure: headings and repeated headers.</summary>
    public HashSet<int> Structure { get; } = [];

    /// <summary>
    /// The blocks of a log table without a lot column, or null when the sheet has neither a heading nor a repeat of its
    /// header among its data rows. A row is a heading when its only content is a short text (no date, no number) and
    /// either the header is typed again right below it (blank rows aside), or it follows a blank row (or the header)
    /// and holds a digit, as lot and tank names do ("T4", "25-QR-02"), with a reading right under it.
    /// </summary>
    public static LogBlocks? Find(SheetContext ctx)
    {
        var sheet = ctx.Sheet;
        var header = sheet.Rows[ctx.HeaderRow];
        var blocks = new LogBlocks();
        for (int r = ctx.FirstData; r <= ctx.LastRow; r++)
        {
            var row = sheet.Rows[r];
            if (RepeatsHeader(header, row))
            {
                blocks.HeaderRepeats.Add(r);
                blocks.Structure.Add(r);
                continue;
            }

            if (HeadingText(row, ctx.Sheet.DecimalComma) is not { } text)
            {
                continue;
            }

            int next = r + 1;
            while (next <= ctx.LastRow && RowAccounting.AllBlank(sheet.Rows[next]))
            {
                next++;
            }

            bool overHeader = next <= ctx.LastRow && RepeatsHeader(header, sheet.Rows[next]);
            bool afterBlank = r == ctx.FirstData || RowAccounting.AllBlank(sheet.Rows[r - 1]);
            bool named = afterBlank && next == r + 1 && next <= ctx.LastRow && text.Any(char.IsAsciiDigit);
            if (overHeader || named)
            {
                blocks._headings.Add((r, text));
                blocks.Structure.Add(r);
            }
        }

        if (blocks.Structure.Count == 0)
        {
            return null;
        }

        if (blocks._headings.Count > 0)
        {
            // The first block's heading usually stands above the header itself (the heading, then the header, then the
            // readings): the nearest row above the header, blank rows aside, when it holds only such a text.
            int above = ctx.HeaderRow - 1;
            while (above >= 0 && RowAccounting.AllBlank(sheet.Rows[above]))
            {
                above--;
            }

            if (above >= 0 && (blocks._headings[0].Row > ctx.FirstData) && HeadingText(sheet.Rows[above], ctx.Sheet.DecimalComma) is { } first)
            {
                blocks.AboveHeader = (above, first);
            }
        }

        return blocks;
    }

    /// <summary>The lot named for row <paramref name="r"/>: the heading above it, else the heading above the header, else null.</summary>
    public string? LotAt(int r)
    {
        string? lot = AboveHeader?.Lot;
        foreach (var (row, name) in _headings)
        {
            if (row > r)
            {
                break;
            }

            lot = name;
        }

        return lot;
    }

    /// <summary>True when every filled cell of <paramref name="row"/> holds the header's text of its column (at least two cells).</summary>
    private static bool RepeatsHeader(object?[] header, object?[] row)
    {
        int filled = 0;
        for (int i = 0; i < row.Length; i++)
        {
            if (CellValues.IsBlank(row[i]))
            {
                continue;
            }

            if (i >= header.Length || header[i] is not string h || row[i] is not string v
                || !string.Equals(HeaderText.Normalise(h), HeaderText.Normalise(v), StringComparison.Ordinal))
            {
                return false;
            }

            filled++;
        }

        return filled >= 2;
    }

    /// <summary>The row's only content when it is a short text that is no date, number or "not measured" mark; else null.</summary>
    private static string? HeadingText(object?[] row, bool decimalComma)
    {
        string? only = null;
        foreach (var c in row)
        {
            if (CellValues.IsBlank(c))
            {
                continue;
            }

            if (only is not null || c is not string s)
            {
                return null;
            }

            only = s;
        }

        if (only is null)
        {
            return null;
        }

        string t = TextSettling.Settle(only, multiline: false, out _).Trim().TrimEnd(':').Trim();
        // Words hold a letter or a digit: a dash between them ("Tank T2 – Pinot Noir") is no word.
        if (t.Length is 0 or > MaxHeadingLength || t.Split(' ', StringSplitOptions.RemoveEmptyEntries).Count(w => w.Any(char.IsLetterOrDigit)) > MaxHeadingWords
            || CellValues.IsNoValueMark(t)
            || CellValues.Number(t, decimalComma, out _, out _) != CellProblem.NotANumber
            || CellValues.Date(t, DateOrder.Unknown, out _, out _, out _) is CellProblem.None or CellProblem.AmbiguousDate
            || CellValues.DayMonth(t, DateOrder.Unknown, out _, out _, out _, out _, out _) != CellProblem.NotADate)
        {
            return null;
        }

        return t;
    }
}
