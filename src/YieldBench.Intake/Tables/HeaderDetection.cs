namespace YieldBench.Intake;

/// <summary>
/// Finds the header row of a sheet (the row naming most fields among the first <see cref="SearchRows"/>), decides
/// whether the table holds lots or log readings, binds each header to a field with the unit it states, and reads a
/// units row under the header.
/// </summary>
internal static class HeaderDetection
{
    /// <summary>Rows searched from the top of a sheet for the header row.</summary>
    public const int SearchRows = 50;

    /// <summary>Fields that say when a row was taken, not what was read.</summary>
    private static bool WhenField(string name) => name is "timestamp" or "date" or "time" or "season";

    public static bool Find(
        IntakeRun run,
        RawSheet sheet,
        int lastRow,
        out int headerRow,
        out TableKind kind,
        out List<BoundColumn> columns,
        out List<(int Col, string Header)> unmatched,
        out List<(int Col, string Header, BoundColumn First)> duplicates)
    {
        headerRow = -1;
        kind = TableKind.Lots;
        columns = [];
        unmatched = [];
        duplicates = [];
        int bestScore = 1;
        int searchTo = Math.Min(lastRow, SearchRows - 1);
        for (int r = 0; r <= searchTo; r++)
        {
            var lotFields = new HashSet<string>();
            var logFields = new HashSet<string>();
            int texts = 0, matched = 0;
            int width = Math.Max(sheet.Rows[r].Length, r > 0 ? sheet.Rows[r - 1].Length : 0);
            for (int c = 0; c < width; c++)
            {
                if (HeaderAt(sheet, r, c) is not var (s, fromAbove) || (!fromAbove && sheet.Cell(r, c) is not string))
                {
                    continue;
                }

                string? group = fromAbove ? null : GroupLabel(sheet, r, c);
                var lf = (group is null ? null : Match(run, group + " " + s, TableKind.Lots, out _)) ?? Match(run, s, TableKind.Lots, out _);
                var gf = (group is null ? null : Match(run, group + " " + s, TableKind.Log, out _)) ?? Match(run, s, TableKind.Log, out _);
                if (fromAbove && lf is null && gf is null)
                {
                    // Text above an empty header cell counts only when it names a field (a title above is no header).
                    continue;
                }

                texts++;
                lotFields.UnionWith(lf is null ? [] : [lf.Name]);
                logFields.UnionWith(gf is null ? [] : [gf.Name]);
                matched += lf is not null || gf is not null ? 1 : 0;
            }

            // A header row names at least two fields, and most of its cells are field names (a row of notes
            // that happens to mention two field words is not a header).
            // A row naming only when (date, time, season) and nothing read then is no ordinary header: it is a board
            // with a column per tank ("Date, Time, T1, T2"), left to WideLogRows.
            int score = lotFields.Concat(logFields).All(WhenField) ? 0 : Math.Max(lotFields.Count, logFields.Count);
            if (score > bestScore && (matched * 2 >= texts || score >= 4))
            {
                bestScore = score;
                headerRow = r;
                kind = Classify(lotFields, logFields);
            }
        }

        if (headerRow < 0)
        {
            return false;
        }

        int headerWidth = Math.Max(sheet.Rows[headerRow].Length, headerRow > 0 ? sheet.Rows[headerRow - 1].Length : 0);
        for (int c = 0; c < headerWidth; c++)
        {
            if (HeaderAt(sheet, headerRow, c) is not var (cellText, fromAbove))
            {
                continue;
            }

            string text = TextSettling.Settle(cellText, multiline: false, out _);
            var field = Match(run, text, kind, out var rule);

            // Two header rows: a group label above ("Must" over Brix and pH, "Wine" over Alc, RS and Brix) says which
            // reading a header is. The label and the header together win when they name a field ("Wine Brix" is the
            // final sugar; "Must Brix" the starting sugar); otherwise the header alone is read, as before.
            // A header the user mapped by its own text (--column, --mapping) keeps that field: the group label does
            // not turn it into another one.
            if (!fromAbove && GroupLabel(sheet, headerRow, c) is { } group
                && Match(run, group + " " + text, kind, out var groupRule) is { } grouped
                && (rule is null || groupRule is not null))
            {
                (field, rule, text) = (grouped, groupRule, group + " " + text);
            }

            if (field is null)
            {
                if (!fromAbove)
                {
                    unmatched.Add((c, text));
                }

                continue;
            }

            if (rule is not null)
            {
                rule.Used = true;
            }

            var unit = rule is { Unit: not ColumnUnit.None } ? rule.Unit : HeaderText.UnitFromHeader(text, field.Kind);
            if (unit == ColumnUnit.None && field.Name == "residual_sugar_gl" && HeaderText.IsPercentHeader(text))
            {
                // "RS %" is the lab's g per 100 mL (common practice); read as g/L it would be ten times too dry.
                unit = ColumnUnit.GramsPer100Millilitre;
            }

            var bound = new BoundColumn(c, field, text, unit, unit != ColumnUnit.None) { Mapped = rule is not null };
            if (columns.FirstOrDefault(b => b.Field.Name == field.Name) is { } first)
            {
                if ((bound.Mapped && !first.Mapped)
                    || (bound.Mapped == first.Mapped && sheet.HiddenColumns.Contains(first.Index) && !sheet.HiddenColumns.Contains(c)))
                {
                    // Or: the earlier column is hidden in the workbook (an old estimate kept out of sight) and this
                    // one is what the sheet shows.
                    // The user named this column for the field (as the duplicate-column message advises): it is read,
                    // and the earlier column that only a synonym matched is the repeat.
                    columns[columns.IndexOf(first)] = bound;
                    duplicates.Add((first.Index, first.Header, bound));
                    continue;
                }

                if (first.Unit == ColumnUnit.PotentialAlcohol && unit != ColumnUnit.PotentialAlcohol && !first.Mapped)
                {
                    // A potential alcohol beside a sugar reading is mostly worked out from it by the sheet's own rule:
                    // the reading is read, the potential alcohol named as the repeat.
                    columns[columns.IndexOf(first)] = bound;
                    duplicates.Add((first.Index, first.Header, bound));
                    continue;
                }

                if (field.Name == "temp_c" && IsCapHeader(first.Header) && !IsCapHeader(text) && !first.Mapped)
                {
                    // Cap and must temperature side by side: the must's is read, whichever comes first (the heat
                    // balance and the temperature figures are of the whole must; a cap runs warmer).
                    columns[columns.IndexOf(first)] = bound;
                    duplicates.Add((first.Index, first.Header, bound));
                    continue;
                }

                duplicates.Add((c, text, first));
                continue;
            }

            columns.Add(bound);
        }

        // A log with only a "time" column holding full timestamps reads it as the timestamp.
        if (kind == TableKind.Log && !columns.Any(b => b.Field.Name is "timestamp" or "date") && columns.FirstOrDefault(b => b.Field.Name == "time") is { } timeOnly)
        {
            timeOnly.Field = Fields.LogField("timestamp");
        }

        return true;
    }

    private static TableKind Classify(HashSet<string> lotFields, HashSet<string> logFields)
    {
        bool lotSpecific = lotFields.Overlaps(["strain", "final_abv", "starting_sugar", "residual_sugar_gl", "vessel", "variety", "yan_mgl"]);
        bool logShape = logFields.Overlaps(["timestamp", "date", "time"]) && logFields.Overlaps(["sugar", "temp_c"]);
        if (logShape && !lotFields.Overlaps(["strain", "final_abv"]))
        {
            return TableKind.Log;
        }

        return lotSpecific || !logShape ? TableKind.Lots : TableKind.Log;
    }

    private static FieldDef? Match(IntakeRun run, string header, TableKind kind, out MappingRule? rule)
    {
        foreach (var r in run.Rules)
        {
            if (r.For(kind) is { } f && r.Matches(header))
            {
                rule = r;
                return f;
            }
        }

        rule = null;
        return ColumnRules.Find(header, kind);
    }

    /// <summary>
    /// The header text of column <paramref name="column"/> in row <paramref name="row"/>: the cell's own text, or, when
    /// the cell is empty, the text right above it (two header rows typed without merging: "Lot" and "Yeast" in the
    /// upper row beside the group labels, the grouped headers in the lower one); null when both are empty.
    /// </summary>
    private static (string Text, bool FromAbove)? HeaderAt(RawSheet sheet, int row, int column)
    {
        object? cell = sheet.Cell(row, column);
        if (!CellValues.IsBlank(cell))
        {
            return cell is string s ? (s, false) : (CellValues.Text(cell), false);
        }

        return row > 0 && sheet.Cell(row - 1, column) is string above && above.Trim().Length > 0 ? (above, true) : null;
    }

    /// <summary>
    /// The text right above a header cell when it labels a group of columns: a merged block over the cell (its first
    /// cell's text) or the cell itself; null when there is none.
    /// </summary>
    private static string? GroupLabel(RawSheet sheet, int headerRow, int column)
    {
        if (headerRow == 0)
        {
            return null;
        }

        int r = headerRow - 1;
        foreach (var span in sheet.Merged)
        {
            if (span.FromRow <= r && r <= span.ToRow && span.FromColumn <= column && column <= span.ToColumn)
            {
                return sheet.Cell(span.FromRow, span.FromColumn) is string merged && merged.Trim().Length > 0 ? merged.Trim() : null;
            }
        }

        return sheet.Cell(r, column) is string s && s.Trim().Length > 0 ? s.Trim() : null;
    }

    /// <summary>True when every non-blank cell of the row is text naming only a unit (and at least two are).</summary>
    public static bool IsUnitsRow(RawSheet sheet, int r)
    {
        int units = 0;
        var row = sheet.Rows[r];
        for (int c = 0; c < row.Length; c++)
        {
            var cell = row[c];
            if (CellValues.IsBlank(cell) || MergedFromAbove(sheet, r, c))
            {
                // A header merged down over the units row ("Lot" over its empty units cell) is no value of the row.
                continue;
            }

            if (cell is not string s || !HeaderText.IsUnitOnly(s))
            {
                return false;
            }

            units++;
        }

        return units >= 2;
    }

    /// <summary>True when cell (<paramref name="r"/>, <paramref name="c"/>) holds the value of a merged block that starts in a row above.</summary>
    private static bool MergedFromAbove(RawSheet sheet, int r, int c) =>
        sheet.MergedFilled.Any(m => m.Span.FromRow < r && m.ToRow >= r && c >= m.Span.FromColumn && c <= m.Span.ToColumn);

    /// <summary>
    /// When the row right under the header holds only units ("°Bx", "%", "g/L"), takes each as its column's unit where
    /// the header states none, reports the row once, and returns true (the row is then not a row read).
    /// </summary>
    public static bool ReadUnitsRow(IntakeRun run, string file, RawSheet sheet, int row, List<BoundColumn> columns)
    {
        if (!IsUnitsRow(sheet, row))
        {
            return false;
        }

        var unitsRow = sheet.Rows[row];
        for (int i = 0; i < columns.Count; i++)
        {
            var c = columns[i];
            string unitText = c.Index < unitsRow.Length && !MergedFromAbove(sheet, row, c.Index) ? CellValues.Text(unitsRow[c.Index]) : "";
            if (c.UnitStated || unitText.Length == 0)
            {
                continue;
            }

            string withUnit = $"{c.Header} ({unitText})";
            var unit = HeaderText.UnitFromHeader(withUnit, c.Field.Kind);
            if (c.Field.Name == "residual_sugar_gl" && HeaderText.IsPercentHeader(withUnit))
            {
                // "%" under RS is the lab's g per 100 mL, as in the header "RS %".
                unit = ColumnUnit.GramsPer100Millilitre;
            }

            if (unit != ColumnUnit.None || (c.Field.Kind == FieldKind.Plain && c.Field.Unit.Length > 0 && UnitSettling.PlainUnitIn(withUnit, c.Field.Unit)))
            {
                // A plain field whose units-row unit is its own (g/L under RS, mg/L under YAN) keeps its unit, now stated.
                columns[i] = new BoundColumn(c.Index, c.Field, c.Header, unit, true) { DateOrder = c.DateOrder, Mapped = c.Mapped };
            }
        }

        run.Sink.Warning(file, sheet.Name, row + 1, null, null, IssueCodes.UnitsRowRead, IntakeMessages.UnitsRowRead());
        return true;
    }

    /// <summary>True for a cap temperature's header ("Cap temp", "Cap °C"): the word cap on its own.</summary>
    internal static bool IsCapHeader(string header) =>
        System.Text.RegularExpressions.Regex.IsMatch(header, @"(?<![A-Za-z])cap(?![A-Za-z])", System.Text.RegularExpressions.RegexOptions.IgnoreCase | System.Text.RegularExpressions.RegexOptions.CultureInvariant);
}
