using YieldBench.Core.Lots;

namespace YieldBench.Intake;

/// <summary>
/// The one loop over a table's data rows, shared by lots and logs: every row read is counted once as used, reported,
/// blank or a summary, so each sheet's <see cref="SourceAccount"/> balances. Blank rows, summary rows, note rows
/// (lots tables only), rows of a table that lacks a required column and CSV records with broken quoting are settled
/// here; any other row goes to the table's row reader.
/// </summary>
internal static class RowAccounting
{
    private static readonly HashSet<string> SummaryWords =
    [
        "average", "averages", "avg", "mean", "total", "totals", "sum", "count", "min", "minimum", "max", "maximum",
        "median", "std", "stdev", "std dev", "standard deviation", "overall", "grand total", "subtotal", "sub total", "range",
    ];

    private static readonly HashSet<string> SummaryFollowers = new(["of", "for", "all", "season", "lots", "vintage", "pct"], StringComparer.Ordinal);

    /// <summary>How a table's rows are accounted.</summary>
    /// <param name="Kind">The account's kind ("lots", "running lots", "log").</param>
    /// <param name="Readings">True when used rows are log readings, false when they are lots.</param>
    /// <param name="NotesAreRows">True when a row holding only a note is reported as such (lots tables).</param>
    /// <param name="Usable">False when the table lacks a required column: every row with content is then reported.</param>
    public sealed record Plan(string Kind, bool Readings, bool NotesAreRows, bool Usable);

    /// <summary>Reads every data row; <paramref name="readRow"/> returns true when it used the row, false when it reported it.</summary>
    public static void Read(SheetContext ctx, Plan plan, Func<int, bool> readRow)
    {
        var sink = ctx.Run.Sink;
        int read = 0, used = 0, reported = 0, blank = 0, summary = 0;
        for (int r = ctx.FirstData; r <= ctx.LastRow; r++)
        {
            read++;
            var row = ctx.Sheet.Rows[r];
            if (AllBlank(row))
            {
                blank++;
                continue;
            }

            if (ctx.StructureRows?.Contains(r) == true)
            {
                // A log's block heading or a repeat of its header (LogBlocks): said once for the sheet.
                summary++;
                continue;
            }

            if (IsSummaryRow(ctx, row, out var label))
            {
                summary++;
                sink.Warning(ctx.File, ctx.SheetName, r + 1, ctx.LotColumn?.Header, label, IssueCodes.SummaryRowSkipped, IntakeMessages.SummaryRow());
                continue;
            }

            if (plan.NotesAreRows && SeasonHeading(row) is var (heading, year))
            {
                // "Vintage 2023" over the lots of that season: the season of the rows below it, up to the next heading.
                // Used as a heading, so counted with the summary rows (structure, not data), not as a row left out.
                summary++;
                ctx.HeadingSeason = year;
                sink.Warning(ctx.File, ctx.SheetName, r + 1, null, heading, IssueCodes.SeasonHeading, IntakeMessages.SeasonHeading(year));
                continue;
            }

            if (plan.NotesAreRows && GroupHeading(ctx, r) is var (group, field))
            {
                // "Chardonnay" over the Chardonnay lots, a spacer row before the next variety: structure, not data.
                summary++;
                sink.Warning(ctx.File, ctx.SheetName, r + 1, null, group, IssueCodes.GroupHeading, IntakeMessages.GroupHeading(group, field));
                continue;
            }

            if (plan.NotesAreRows && VarietyHeading(ctx, r) is { } variety)
            {
                // "Syrah" over its lots in a table with no variety column: the variety of the lots below it, up to the
                // next such heading; structure, not data.
                summary++;
                ctx.HeadingVariety = variety;
                sink.Warning(ctx.File, ctx.SheetName, r + 1, null, variety, IssueCodes.GroupHeading, IntakeMessages.VarietyHeading(variety));
                continue;
            }

            if (plan.NotesAreRows && NoteText(row) is { } note)
            {
                reported++;
                sink.Warning(ctx.File, ctx.SheetName, r + 1, null, note, IssueCodes.NoteRowSkipped, IntakeMessages.NoteRowSkipped());
                continue;
            }

            if (!plan.Usable)
            {
                reported++;
                continue;
            }

            if (ctx.Sheet.BadRows.TryGetValue(r, out var detail))
            {
                reported++;
                sink.Error(ctx.File, ctx.SheetName, r + 1, null, null, IssueCodes.BadCsvRow, IntakeMessages.BadCsvRow(detail));
                continue;
            }

            if (ctx.Sheet.IsText && FieldsBeyondHeader(row, ctx.HeaderWidth) is { } extra)
            {
                // An unquoted "4,500" in a comma file is two fields: the row's values have shifted, none can be trusted.
                reported++;
                int fields = Array.FindLastIndex(row, c => !CellValues.IsBlank(c)) + 1;
                sink.Error(ctx.File, ctx.SheetName, r + 1, null, extra, IssueCodes.ExtraFields, IntakeMessages.ExtraFields(fields, ctx.HeaderWidth));
                continue;
            }

            if (readRow(r))
            {
                used++;
            }
            else
            {
                reported++;
            }
        }

        ctx.Run.Accounts.Add(plan.Readings
            ? new SourceAccount(ctx.File, ctx.SheetName, plan.Kind, read, 0, used, reported, blank, summary)
            : new SourceAccount(ctx.File, ctx.SheetName, plan.Kind, read, used, 0, reported, blank, summary));
    }

    /// <summary>The row's fields as text (to show where it split), or null when nothing lies beyond the header's width.</summary>
    private static string? FieldsBeyondHeader(object?[] row, int headerWidth)
    {
        for (int i = headerWidth; i < row.Length; i++)
        {
            if (!CellValues.IsBlank(row[i]))
            {
                return string.Join(" | ", row.Select(CellValues.Text));
            }
        }

        return null;
    }

    private static readonly HashSet<string> SeasonHeadingWords = new(
        ["vintage", "season", "harvest", "year", "crush", "lots", "millesime", "jahrgang", "vendange", "vendimia", "cosecha", "anada", "vendemmia", "annata"],
        StringComparer.Ordinal);

    /// <summary>
    /// A row whose only content is a season heading — a year with a season word, "Vintage 2023", "2024 harvest",
    /// "Vendimia 2023/24" — as its text and year; null for any other row (a year alone could be a lot id).
    /// </summary>
    internal static (string Text, int Year)? SeasonHeading(object?[] row)
    {
        if (NoteText(row, minWords: 2) is not { } text)
        {
            return null;
        }

        var words = HeaderText.Normalise(text).Split(' ', StringSplitOptions.RemoveEmptyEntries);
        int? year = null;
        bool seasonWord = false;
        for (int i = 0; i < words.Length; i++)
        {
            string w = words[i];
            if (w.Length == 4 && w.All(char.IsAsciiDigit) && int.Parse(w, System.Globalization.CultureInfo.InvariantCulture) is >= 1900 and <= 2100 and var y && year is null)
            {
                year = y;
            }
            else if (year is not null && i > 0 && words[i - 1].Length == 4 && w.Length is 2 or 4 && w.All(char.IsAsciiDigit))
            {
                // "2023/24": the second year of a southern-hemisphere or split season; the vintage is the first.
            }
            else if (SeasonHeadingWords.Contains(w))
            {
                seasonWord = true;
            }
            else
            {
                return null;
            }
        }

        return year is { } found && seasonWord ? (text, found) : null;
    }

    /// <summary>Fields whose values a cellar groups its lots by, with a heading row over each group.</summary>
    private static readonly string[] GroupFields = ["variety", "colour", "block", "vessel", "strain"];

    /// <summary>Rows below a possible group heading searched for a lot of its group.</summary>
    private const int GroupSearchRows = 1000;

    /// <summary>
    /// A row whose only content is one text (of any number of words) that is the variety, colour, block, vessel or
    /// strain of a lot below it ("Chardonnay" over the Chardonnay lots), as its text and that field; null otherwise.
    /// </summary>
    private static (string Text, string Field)? GroupHeading(SheetContext ctx, int r)
    {
        if (NoteText(ctx.Sheet.Rows[r], minWords: 1) is not { } text)
        {
            return null;
        }

        string key = HeaderText.Normalise(text);
        foreach (var name in GroupFields)
        {
            if (ctx.Column(name) is not { } c)
            {
                continue;
            }

            for (int below = r + 1; below <= Math.Min(ctx.LastRow, r + GroupSearchRows); below++)
            {
                if (ctx.Sheet.Cell(below, c.Index) is string v && v.Length > 0 && HeaderText.Normalise(v) == key)
                {
                    return (text, name);
                }
            }
        }

        return null;
    }

    /// <summary>Most words of a heading naming a variety ("Cabernet Sauvignon", "Pinot noir", "Grenache Noir Vieilles").</summary>
    private const int MaxVarietyHeadingWords = 3;

    /// <summary>
    /// In a lots table with no variety column, a row whose only content is a name — at most three words, no digit —
    /// standing at the top of the data or after a blank row, with a lot right under it (blank rows aside), as a cellar
    /// book heads each variety's lots ("Syrah", then its lots): the name; null otherwise. A note between lots follows
    /// a lot, not a blank row.
    /// </summary>
    private static string? VarietyHeading(SheetContext ctx, int r)
    {
        if (ctx.Column("variety") is not null || ctx.LotColumn is not { } lotCol || NoteText(ctx.Sheet.Rows[r], minWords: 1) is not { } text
            || text.Any(char.IsDigit) || text.Split(' ', StringSplitOptions.RemoveEmptyEntries).Length > MaxVarietyHeadingWords
            || (r > ctx.FirstData && !AllBlank(ctx.Sheet.Rows[r - 1])))
        {
            return null;
        }

        int next = r + 1;
        while (next <= ctx.LastRow && AllBlank(ctx.Sheet.Rows[next]))
        {
            next++;
        }

        // The row below is a lot: its lot cell and at least one other cell are filled.
        return next <= ctx.LastRow && !CellValues.IsBlank(ctx.Sheet.Cell(next, lotCol.Index))
            && ctx.Sheet.Rows[next].Count(c => !CellValues.IsBlank(c)) >= 2
            ? TextSettling.Settle(text, multiline: false, out _)
            : null;
    }

    /// <summary>A row whose only content is one text of several words (a note between lots), or null.</summary>
    private static string? NoteText(object?[] row, int minWords = 2)
    {
        object? only = null;
        int filled = 0;
        foreach (var c in row)
        {
            if (!CellValues.IsBlank(c) && ++filled == 1)
            {
                only = c;
            }
            else if (filled > 1)
            {
                return null;
            }
        }

        return filled == 1 && only is string s && s.Trim().Split(' ', StringSplitOptions.RemoveEmptyEntries).Length >= minWords ? s.Trim() : null;
    }

    public static bool AllBlank(object?[] row)
    {
        foreach (var c in row)
        {
            if (!CellValues.IsBlank(c))
            {
                return false;
            }
        }

        return true;
    }

    private static object? FirstFilled(object?[] row)
    {
        foreach (var c in row)
        {
            if (!CellValues.IsBlank(c))
            {
                return c;
            }
        }

        return null;
    }

    /// <summary>
    /// True when the words after a summary word name a field or a header of the table ("Total volume", "Average Brix"):
    /// the row sums up that column.
    /// </summary>
    private static bool NamesAColumn(SheetContext ctx, string rest) =>
        ColumnRules.Find(rest, ctx.Kind) is not null || ctx.Columns.Any(c => HeaderText.Normalise(c.Header) == rest);

    /// <summary>True when the table has no strain column or the row's strain is empty (a lot names its strain: "Mean-Lot, QX-7").</summary>
    private static bool NoStrain(SheetContext ctx, object?[] row) =>
        ctx.Column("strain") is not { } c || c.Index >= row.Length || CellValues.IsBlank(row[c.Index]);

    private static bool IsSummaryRow(SheetContext ctx, object?[] row, out string? label)
    {
        label = null;
        var lotCol = ctx.LotColumn;
        object? candidate = lotCol is not null && lotCol.Index < row.Length && !CellValues.IsBlank(row[lotCol.Index])
            ? row[lotCol.Index]
            : FirstFilled(row);
        if (candidate is not string s)
        {
            return false;
        }

        // Every summary word starts with a letter, so text starting with a digit (a lot id) is none.
        var lead = s.AsSpan().TrimStart();
        if (lead.Length > 0 && char.IsAsciiDigit(lead[0]))
        {
            return false;
        }

        string n = HeaderText.Normalise(s);
        if (SummaryWords.Contains(n))
        {
            label = s.Trim();
            return true;
        }

        foreach (var w in SummaryWords)
        {
            // "<word> <follower> ...": the word, a space, then a follower as the next whole word.
            if (n.StartsWith(w + " ", StringComparison.Ordinal)
                && (SummaryFollowers.Contains(n[(w.Length + 1)..].Split(' ')[0]) || (NamesAColumn(ctx, n[(w.Length + 1)..]) && NoStrain(ctx, row))))
            {
                label = s.Trim();
                return true;
            }
        }

        return false;
    }
}
