using YieldBench.Core.Lots;

namespace YieldBench.Intake;

/// <summary>
/// Reads one sheet (or CSV file) as a table: finds its header, reads a units row, settles units the header did not
/// state, records the header mapping, and hands the rows to the lots or log reader.
/// </summary>
internal static class SheetReader
{
    /// <summary>What reading a sheet came to.</summary>
    public enum Outcome
    {
        Read,
        NoTable,
        Empty,
    }

    public static Outcome Read(IntakeRun run, string file, string fullPath, RawSheet sheet)
    {
        string? sheetName = sheet.Name;
        var sink = run.Sink;
        if (sheet.TooManyRows || sheet.TooManyCells)
        {
            sink.Error(file, sheetName, null, null, null, sheet.TooManyRows ? IssueCodes.TooManyRows : IssueCodes.TooManyCells,
                sheet.TooManyRows ? IntakeMessages.TooManyRows(run.Options.MaxRows) : IntakeMessages.TooManyCells(WorkbookSource.MaxCells));
            run.Accounts.Add(new SourceAccount(file, sheetName, "refused", 0, 0, 0, 0, 0, 0));
            return Outcome.Read;
        }

        int lastRow = sheet.Rows.FindLastIndex(r => r.Any(c => !CellValues.IsBlank(c)));
        if (lastRow < 0)
        {
            return Outcome.Empty;
        }

        if (!HeaderDetection.Find(run, sheet, lastRow, out int headerRow, out var kind, out var columns, out var unmatched, out var duplicates))
        {
            // Not an ordinary table: perhaps a log with one column per lot — unless it is a log laid across, whose
            // dates along the top would be taken for lots (IntakeReader reports it).
            return LaidAcross(sheet) is null && WideLogRows.TryRead(run, file, fullPath, sheet, lastRow) ? Outcome.Read : Outcome.NoTable;
        }

        foreach (var (_, header) in unmatched)
        {
            sink.Warning(file, sheetName, headerRow + 1, header, null, IssueCodes.ColumnNotUsed, IntakeMessages.ColumnNotUsed());
        }

        foreach (var (column, header, first) in duplicates)
        {
            sink.Warning(file, sheetName, headerRow + 1, header, null, IssueCodes.DuplicateColumn,
                first.Field.Name == "temp_c" && HeaderDetection.IsCapHeader(header) && !HeaderDetection.IsCapHeader(first.Header)
                    ? IntakeMessages.CapTemperatureNotRead(first.Header)
                    : first.Mapped ? IntakeMessages.DuplicateOfMappedColumn(first.Field.Name, first.Header)
                    : sheet.HiddenColumns.Contains(column) && !sheet.HiddenColumns.Contains(first.Index) ? IntakeMessages.HiddenDuplicateColumn(first.Field.Name, first.Header)
                    : IntakeMessages.DuplicateColumn(first.Field.Name, first.Header,
                        potential: first.Unit != ColumnUnit.PotentialAlcohol && HeaderText.UnitFromHeader(header, first.Field.Kind) == ColumnUnit.PotentialAlcohol));
        }

        int firstData = headerRow + 1;
        if (firstData <= lastRow && HeaderDetection.ReadUnitsRow(run, file, sheet, firstData, columns))
        {
            firstData++;
        }

        MergedCells.Warn(sheet, file, sink, firstData);
        string fileStem = Path.GetFileNameWithoutExtension(fullPath);
        int headerWidth = Array.FindLastIndex(sheet.Rows[headerRow], c => !CellValues.IsBlank(c)) + 1;
        var ctx = new SheetContext(run, file, sheet, kind, columns, firstData, lastRow, SeasonNames.FromName(sheetName) ?? SeasonNames.FromName(fileStem) ?? run.Options.Season, headerWidth)
        {
            Unmatched = unmatched.Select(u => u.Header).ToList(),
            HeaderRow = headerRow,
        };
        if (kind == TableKind.Lots)
        {
            LotRows.TankNamesLots(ctx);
        }

        UnitSettling.Settle(ctx);
        foreach (var c in columns)
        {
            string unit = ColumnUnits.Label(c.Unit) is { Length: > 0 } u ? u : c.Field.Unit;
            run.Mappings.Add(new HeaderMapping(file, sheetName, c.Field.Name, c.Header, unit.Length > 0 ? unit : null));
        }

        if (kind == TableKind.Lots)
        {
            LotRows.Read(ctx);
        }
        else
        {
            LogRows.Read(ctx, fileStem);
            LogRows.ReportHalfDays(ctx);
        }

        GravityBothWays(sink, file, sheetName, columns);
        foreach (var c in columns)
        {
            if (c.CellUnitAt is var (unitRow, unitText, inField))
            {
                sink.Warning(file, sheetName, unitRow, c.Header, unitText, IssueCodes.UnitInCellDiffers, IntakeMessages.CellUnitsConverted(c.CellUnits, unitText, unitRow, inField, c.Field.Unit, ColumnUnits.Label(c.Unit) is { Length: > 0 } u ? u : c.Field.Unit));
            }

            if (c.ThousandsAt is var (groupRow, groupText, number))
            {
                sink.Warning(file, sheetName, groupRow, c.Header, groupText, IssueCodes.AmbiguousNumber, IntakeMessages.CommaThousands(c.Thousands, groupText, groupRow, number));
            }
        }

        foreach (var c in columns.Where(c => c.YearFromSeasonAt is not null))
        {
            var (row, text, read) = c.YearFromSeasonAt!.Value;
            sink.Warning(file, sheetName, row, c.Header, text, IssueCodes.DateWithoutYear, IntakeMessages.InoculationInSeason(c.Header, c.YearsFromSeason, text, read));
        }

        foreach (var c in columns.Where(c => c.ZoneSeenAt is not null))
        {
            sink.Warning(file, sheetName, c.ZoneSeenAt, c.Header, null, IssueCodes.TimeZoneNotApplied, IntakeMessages.TimeZoneNotApplied(c.Field.Name));
        }

        return Outcome.Read;
    }

    /// <summary>
    /// A ferment sheet laid across — one of the first three columns labels a row of dates (Date, Day) and rows of
    /// readings (SG, Brix, Temp) — as the row of the dates (0-based), that column, how many dates it holds and the
    /// readings' labels; null for any other sheet. Such a sheet has no header row (its labels run down a column).
    /// </summary>
    internal static (int Row, int Column, int Dates, List<string> Readings)? LaidAcross(RawSheet sheet)
    {
        int lastRow = Math.Min(sheet.Rows.Count, HeaderDetection.SearchRows) - 1;
        for (int c = 0; c < 3; c++)
        {
            int dateRow = -1;
            var readings = new List<string>();
            for (int r = 0; r <= lastRow; r++)
            {
                if (sheet.Cell(r, c) is not string label || label.Trim().Length == 0 || ColumnRules.Find(label, TableKind.Log) is not { } field)
                {
                    continue;
                }

                if (field.Name is "date" or "timestamp" && dateRow < 0)
                {
                    dateRow = r;
                }
                else if (field.Name is "sugar" or "temp_c")
                {
                    readings.Add(label.Trim());
                }
            }

            if (dateRow < 0 || readings.Count == 0)
            {
                continue;
            }

            int dates = 0;
            for (int i = c + 1; i < sheet.Rows[dateRow].Length; i++)
            {
                var cell = sheet.Rows[dateRow][i];
                dates += CellValues.Date(cell, DateOrder.Unknown, out _, out _, out _) is CellProblem.None or CellProblem.AmbiguousDate
                    || (cell is double d && d is >= 0 and <= 400 && d == Math.Floor(d))
                    || (cell is string t && CellValues.DayMonth(t.Trim(), DateOrder.Unknown, out _, out _, out _, out _, out _) != CellProblem.NotADate) ? 1 : 0;
            }

            if (dates >= 2)
            {
                return (dateRow, c, dates, readings);
            }
        }

        return null;
    }

    /// <summary>Says once for each SG column that held gravity written both ways (1090 among 1.088s) how it was read.</summary>
    internal static void GravityBothWays(IssueSink sink, string file, string? sheetName, IEnumerable<BoundColumn> columns)
    {
        foreach (var c in columns.Where(c => c.OtherGravityFormAt is not null))
        {
            var (row, text, sg) = c.OtherGravityFormAt!.Value;
            sink.Warning(file, sheetName, row, c.Header, text, IssueCodes.UnitDiffersInColumn, IntakeMessages.GravityBothWays(c.Header, c.OtherGravityForms, text, sg));
        }
    }
}
