using System.Globalization;

namespace YieldBench.Intake;

/// <summary>
/// Every message intake shows, in one place. Each says what is wrong and what would fix it; tests assert them
/// word for word. Codes are listed with their meaning in docs/input-format.md ("Issue codes").
/// </summary>
public static class IntakeMessages
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Formats a number for a message: up to 4 decimals, invariant culture.</summary>
    public static string Num(double v) => v.ToString("0.####", Inv);

    internal static string FileNotFound() => "The file or folder was not found. Check the path.";

    internal static string UnsupportedFileType(string extension) =>
        $"Files ending in '{extension}' are not read. Save the sheet as .xlsx, .ods or .csv.";

    internal static string FolderEmpty() =>
        "The folder (with its subfolders) holds no .xlsx, .xlsm, .xls, .ods, .csv, .txt or .tsv file; nothing was read from it.";

    internal static string FileSkipped(string extension) =>
        $"The file is not of a type read ({(extension.Length == 0 ? "no extension" : "'" + extension + "'")}); it was skipped. If it holds lots or readings, save it as .xlsx, .ods or .csv.";

    internal static string ReportFolderSkipped() =>
        "The folder is a report this tool wrote (it holds yieldbench-files.txt); its files are results, not inputs, and were not read.";

    internal static string FolderLinkSkipped() => "The folder is a link to another folder; it was not followed. Give the folder it points to, if it holds lots or readings.";

    internal static string FolderTooDeep(int depth) =>
        $"The folder lies more than {depth.ToString(Inv)} folders below the one given; it was not read. Give it by its own path.";

    internal static string CannotOpenFolder(string reason) =>
        $"The folder could not be listed ({reason}). Check the permissions.";

    internal static string TextFileWithoutTable(int rowsSearched) =>
        $"No header row naming lot or log columns was found in the first {rowsSearched.ToString(Inv)} rows of this text file; it was taken for notes and not read. If it holds lots or readings, give it a header row.";

    internal static string LockFileSkipped() =>
        "This is a spreadsheet program's lock file (its name starts with '~$'), not data; it was skipped.";

    internal static string EmptyFile() =>
        "The file is empty (0 bytes), or it is not an ordinary file (a device, a pipe or a socket); nothing was read. Export the sheet again as a file.";

    internal static string FileTooLarge(long bytes, long limit) =>
        $"The file is {bytes.ToString(Inv)} bytes, above the limit of {limit.ToString(Inv)} bytes. Split it (for example one file per season).";

    internal static string CannotOpen(string reason) =>
        $"The file could not be opened ({reason}). Close any program that locks it and check the permissions.";

    internal static string SameContentAgain(string first) =>
        $"The file holds exactly the same bytes as {first}, read already (the same file given twice, met again in a folder given, or a copy), so it was read once. Remove the repeat if it is not wanted.";

    internal static string OldWorkbookNamedNew(string extension) =>
        $"The file is named {extension} but holds an Excel 97–2003 workbook (.xls); it was read as one. Save it again as {extension} (or rename it .xls) so other programs are not misled.";

    internal static string TextNamedWorkbook(string extension) =>
        $"The file is named {extension} but holds text (a CSV or tab-separated table, as some programs export 'for Excel'); it was read as a CSV file. Rename it .csv, or open it in a spreadsheet program and save it as .xlsx.";

    internal static string WebPageNamedWorkbook(string extension) =>
        $"The file is named {extension} but holds a web page (an HTML table, as some programs export 'for Excel'); it was not read. Open it in a spreadsheet program and save it as .xlsx.";

    internal static string NotAZip(string extension) =>
        $"The file is not a readable {extension} workbook (its zip structure is missing or damaged). Open it in a spreadsheet program and save it again as .xlsx.";

    internal static string PasswordProtected() =>
        "The workbook is protected by a password, so it cannot be read. Save a copy without the password and give that.";

    internal static string ZipBomb(long uncompressed, long compressed, double limit) =>
        $"The workbook would expand from {compressed.ToString(Inv)} to {uncompressed.ToString(Inv)} bytes, {Num(Math.Round((double)uncompressed / Math.Max(1, compressed), 1))} times its size, out of proportion for a spreadsheet (limit {Num(limit)} times); it was not opened. Save the data again from the spreadsheet program.";

    internal static string ZipPartsOverlap(long claimed, long length) =>
        $"The workbook's parts claim {claimed.ToString(Inv)} compressed bytes in a file of {length.ToString(Inv)} bytes, so parts share their data, as only a zip bomb's do; it was not opened. Save the data again from the spreadsheet program.";

    internal static string TooBigUncompressed(long uncompressed, long limit) =>
        $"The workbook would expand to {uncompressed.ToString(Inv)} bytes, above the limit of {limit.ToString(Inv)} bytes; it was not opened. Split it into smaller workbooks.";

    internal static string CorruptWorkbook(string reason) =>
        $"The workbook could not be read ({reason}). Open it in a spreadsheet program and save it again as .xlsx.";

    internal static string BinaryCsv(long offset) =>
        $"The file is named .csv but holds binary data (a zero byte at offset {offset.ToString(Inv)}), not text. Export the sheet as CSV again, or give the workbook itself.";

    internal static string Utf16Assumed(bool bigEndian) =>
        $"The file has no byte-order mark, but its bytes are UTF-16 text ({(bigEndian ? "big" : "little")}-endian), and it was read as such. If letters look wrong, save it again as UTF-8 CSV.";

    internal static string EncodingAssumed() =>
        "The file is not valid UTF-8; it was read as Windows-1252. If letters look wrong, save it again as UTF-8 CSV.";

    internal static string NoTableInFile(int rowsSearched) =>
        $"No header row naming lot or log columns was found (searched the first {rowsSearched.ToString(Inv)} rows of every sheet). Add a header row such as the one in 'yieldbench template', or map your headers with --column FIELD=HEADER.";

    internal static string SpellingUnified(string field, string kept, int keptLots, IReadOnlyList<(string Text, int Lots)> others) =>
        $"{field} {string.Join(", ", others.Select(o => $"'{o.Text}' ({o.Lots.ToString(Inv)} lot{(o.Lots == 1 ? "" : "s")})"))} {(others.Count == 1 ? "differs" : "differ")} from '{kept}' ({keptLots.ToString(Inv)} lot{(keptLots == 1 ? "" : "s")}) only in case, spaces or punctuation, so {(others.Count == 1 ? "it was" : "they were")} read as '{kept}'. If they are different, give them {(field == "strain" ? "codes" : "names")} that differ in letters or digits.";

    internal static string UnitsRowRead() =>
        "The row under the header holds only units; they were read as the columns' units, and the row is not a lot.";

    internal static string NoteRowSkipped() =>
        "The row holds only a note, not a lot; it was left out. Move notes to a notes column to keep them with their lot.";

    internal static string LogNoteRow() =>
        "The row holds a note and no reading, so it was left out. A reading needs its date (or time) and a sugar or temperature value; keep notes in a notes column (not read).";

    internal static string NoteInReading(string field, bool rowLeftOut) => rowLeftOut
        ? $"The {field} cell holds a note, not a reading, and the row has no other reading; it was left out. A note belongs in a notes column (not read); a reading needs its number (a dry wine's hydrometer reading, such as -1.5 °Brix or 0.994 SG, is read as it is)."
        : $"The {field} cell holds a note, not a reading; it was left empty and the row's other reading was used. A note belongs in a notes column (not read).";

    internal static string HiddenSheetSkipped() =>
        "The sheet is hidden in the workbook, so it was not read. If it holds lots or readings, unhide it and check again.";

    internal static string SheetSkipped(int rowsSearched) =>
        $"No header row naming lot or log columns was found in the first {rowsSearched.ToString(Inv)} rows; the sheet was not read. If it holds lots or readings, map its headers with --column FIELD=HEADER.";

    internal static string TooManyRows(int limit) =>
        $"The sheet has more than {limit.ToString(Inv)} rows, the limit; it was not read. Split it (for example one sheet per season).";

    internal static string TooManyCells(long limit) =>
        $"The sheet spans more than {limit.ToString("N0", Inv)} cells (rows times columns), the limit; it was not read. Delete empty rows and columns at its end, or split it.";

    internal static string MissingColumn(string field, IReadOnlyList<string> examples) =>
        $"The sheet has no column for {field}, which is required; none of its rows could be used. Add a column headed for example {string.Join(", ", examples.Select(e => "'" + e + "'"))}, or map one with --column {field}=HEADER.";

    internal static string VesselAsLotId(string header) =>
        $" If each lot is known by its tank, the column '{header}' (read as the vessel) names the lots: map it with --column lot_id=\"{header}\".";

    internal static string LotIdFromTank(string header, bool bySeason) =>
        $"The sheet has no lot column; each of its tanks in column '{header}' appears once{(bySeason ? " per season" : "")}, so the tank names the lot (as --column lot_id=\"{header}\" would{(bySeason ? ": T1 of one season and T1 of the next are two lots" : "")}) and is not read as the vessel. If a tank held more than one lot in a season, add a 'Lot' column.";

    internal static string VagueSugarHeader(string header) =>
        $" The column '{header}' names a sugar reading without saying whether it is the must's at the start or the wine's at the end; if it holds the must's, map it with --column starting_sugar=\"{header}\".";

    internal static string PerhapsRunningLots() =>
        " If these lots are still fermenting (the sheet has no column of the finished wine), read them as lots still fermenting: yieldbench check --running FILES, or forecast HISTORY --running FILES.";

    internal static string DaysFromInoculation(string header, double lastDay) =>
        $"The column '{header}' holds day numbers (0 to {Num(lastDay)}), not dates: each reading is placed at its lot's inoculation date plus that many days (day 0 is the inoculation day; a Time column gives the hour). Check that the lots table has each lot's inoculation date; a Date column instead would need no inoculation date.";

    internal static string DaysWithoutInoculation(string lot) =>
        $"The log of {lot} counts days (a Day column of numbers), but the lot has no inoculation date to count them from, so its readings were left out. Add the lot's inoculation date to the lots table, or dates to the log.";

    internal static string NearInoculation(DateTime inoculation) =>
        $"in the year that puts each nearest the lot's inoculation on {inoculation.ToString("yyyy-MM-dd", Inv)}";

    internal const string NearEachInoculation = "in the year that puts each nearest its lot's inoculation date";

    internal const string NearEachLogsDatedReadings = "in the year that puts each nearest its log's readings dated with a year";

    internal const string InEachSeason = "from each lot's season: a ferment starts in that year (the vintage is the year of picking) and runs into the next only where its dates cross the new year";

    internal static string DatesWithoutYearPlacedForLots(IReadOnlyList<string> logs, int count, IReadOnlyList<int> years, string rule, string firstLog, DateTime first) =>
        $"The logs of {logs.Count.ToString(Inv)} lots ({string.Join(", ", logs.Take(10))}{(logs.Count > 10 ? $" and {(logs.Count - 10).ToString(Inv)} more" : "")}) date {count.ToString(Inv)} reading(s) by day and month with no year; they were placed in {string.Join(" and ", years.Select(y => y.ToString(Inv)))}, {rule} (the first, '{CellValues.DayMonthText(first.Month, first.Day)}' of {firstLog}, as {first.ToString("yyyy-MM-dd", Inv)}). If that is wrong, write each date with its year (e.g. {first.ToString("yyyy-MM-dd", Inv)}).";

    internal static string NearDatedReadings(DateTime middle) =>
        $"in the year that puts each nearest the log's readings dated with a year (their middle one {middle.ToString("yyyy-MM-dd", Inv)})";

    internal static string InSeason(int season) =>
        $"from the lot's season {season.ToString(Inv)}: the ferment starts in that year (the vintage is the year of picking) and runs into the next only where its dates cross the new year";

    internal static string FarBeforeInoculation(DateTime inoculation, int days) =>
        $"the nearest year would put it more than {days.ToString(Inv)} days before the lot's inoculation on {inoculation.ToString("yyyy-MM-dd", Inv)}, so which year is meant is not clear";

    internal static string SpanTooLongWithoutYear(int days) =>
        $"the log's dates without a year span more than {days.ToString(Inv)} days, so where the year turns is not clear (and the lot has no inoculation date to place them by)";

    internal static string SeveralSeasonsWithoutYear(string lot, IReadOnlyList<int> seasons) =>
        $"lots named '{lot}' were read in seasons {string.Join(" and ", seasons.Select(y => y.ToString(Inv)))}, so the year cannot be taken from the lot (a season column in the log would say which)";

    internal static string NothingToPlaceYear(string lot) =>
        $"no lot '{lot}' with a season or inoculation date was read, nor a reading of its log dated with a year, to take the year from";

    internal const string NoLeapDayNearest = "the year it would be placed in has no 29 February";

    internal static string NoLeapDay(int year) => $": it has a day and month but no year, and {year.ToString(Inv)}, its season, has no 29 February";

    internal static string InoculationInSeason(string header, int count, string first, DateTime read) =>
        $"The column '{header}' gives {count.ToString(Inv)} date(s) by day and month with no year; each was read in its lot's season (the vintage is the year of picking, and so of inoculation), the first, '{first}', as {read.ToString("yyyy-MM-dd", Inv)}. Write the year where a lot was inoculated in another year (a must picked after the new year).";

    internal static string GravityBothWays(string header, int count, string first, double sg) =>
        $"The column '{header}' holds specific gravity written both ways, as SG (1.088) and in thousandths (1088): {count.ToString(Inv)} value(s) differ from the column's form (the first, '{first}', read as SG {sg.ToString("0.000###", Inv)}). Each was read as the gravity it is; write them one way to make it certain.";

    internal static string DateWithoutYearRefused(string log, string shown, string why) =>
        $"The reading of {log} is dated '{shown}', a day and month with no year, and {why}; it was left out. Write the date with its year (year-month-day, e.g. 2024-09-12).";

    internal static string DatesWithoutYearPlaced(string log, int count, IReadOnlyList<int> years, string basis, DateTime first) =>
        $"The log of {log} dates {count.ToString(Inv)} reading(s) by day and month with no year; they were placed in {string.Join(" and ", years.Select(y => y.ToString(Inv)))}, {basis} (the first, '{CellValues.DayMonthText(first.Month, first.Day)}', as {first.ToString("yyyy-MM-dd", Inv)}). If that is wrong, write each date with its year (e.g. {first.ToString("yyyy-MM-dd", Inv)}).";

    internal static string MissingTimeColumn() =>
        "The log sheet has no timestamp or date column; none of its rows could be used. Add a 'Timestamp' column (or 'Date' and 'Time'), or map one with --column timestamp=HEADER.";

    internal static string SameColumnOnOtherSheets(IReadOnlyList<string> sheets) =>
        $"The same column on {sheets.Count.ToString(Inv)} more sheet(s) of this file was not read either: {string.Join(", ", sheets.Take(8).Select(s => $"\"{s}\""))}{(sheets.Count > 8 ? $" and {(sheets.Count - 8).ToString(Inv)} more" : "")}.";

    internal static string ColumnNotUsed() =>
        "The column matches no field and was not read. If it holds one, map it with --column FIELD=HEADER (fields are listed in docs/input-format.md).";

    internal static string FinalColumnNotRead(string field) =>
        $"The column is read as {field}, a value of the finished wine; lots still fermenting have none yet, so it was not read.";

    internal static string CapTemperatureNotRead(string must, bool oneColumnPerLot = false) =>
        $"This column is the cap's temperature; the must's, '{must}', was read instead, since the heat balance and the temperature figures are of the whole must (a cap runs warmer: check it by hand at each punch-down). "
        + (oneColumnPerLot ? "To read the cap's instead, move the must's column to another sheet." : "Map the one you mean with --column temp_c=HEADER.");

    internal static string DuplicateColumn(string field, string first, bool potential = false) => potential
        ? $"This column of potential alcohol maps to {field}, as does the sugar reading '{first}', which was read instead (a potential alcohol is mostly worked out from the reading). Map the one you mean with --column {field}=HEADER."
        : $"This column maps to {field}, as does the earlier column '{first}'; only the earlier one was read. Rename one of them, or map the one you mean with --column {field}=HEADER.";

    internal static string DuplicateOfMappedColumn(string field, string mapped) =>
        $"This column also maps to {field}, but your mapping names '{mapped}' for it, so that one was read and this one was not.";

    internal static string HiddenDuplicateColumn(string field, string shown) =>
        $"This column is hidden in the workbook, and the column '{shown}' the sheet shows maps to {field} too, so that one was read and this one was not. To read this one, unhide it and map it with --column {field}=HEADER.";

    internal static string UnitAssumed(string unit, string example) =>
        $"The header gives no unit; values were read as {unit}. State the unit in the header, e.g. '{example}'.";

    internal static string OneColumnPerLot(int lots, IEnumerable<string> ids)
    {
        var list = ids.ToList();
        string shown = string.Join(", ", list.Take(8)) + (list.Count > 8 ? $" and {list.Count - 8} more" : "");
        return $"The sheet was read as a fermentation log with one column per lot ({lots} lots: {shown}): each column's header is taken as the lot id, its numbers as that lot's sugar readings (temperatures where the header says temp, °C or °F), and the date and time on the left as the time of each. If a column is no lot, delete it or move it to another sheet; a layout with one row per reading (Lot, Date, Time, Brix, Temp) needs no guessing.";
    }

    internal static string ForEveryLotColumn(int columns) =>
        columns > 1 ? $" The same unit was taken for all {columns} lot columns that state none." : "";

    internal static string UnitFromValues(string unit, double low, double high, string example) => unit == "SG × 1000"
        ? $"The header gives no unit; the values ({Num(low)} to {Num(high)}) look like specific gravity written in thousandths (1090 for SG 1.090, as cellars often note must density; no must holds that much sugar in g/L), so they were read as SG × 1000. To make it certain, write them as SG (1.090) under a header such as '{example.Replace("SG × 1000", "SG", StringComparison.Ordinal)}'."
        : $"The header gives no unit; the values ({Num(low)} to {Num(high)}) look like {unit}, so they were read as {unit}. State the unit in the header, e.g. '{example}'.";

    internal static string GravityInThousandths(double low, double high) =>
        $"The header names specific gravity and the values ({Num(low)} to {Num(high)}) are SG written in thousandths (1090 for SG 1.090), so they were read so. Write them as 1.090 to make it certain.";

    internal static string MaybeBaume() =>
        " Values of 8 to 16 are also what °Baumé gives for a must; if these are °Baumé, head the column 'Starting sugar (°Baumé)', or every lot will read as making more alcohol than its sugar can.";

    internal static string ColumnInFahrenheit(double low, double high) =>
        $"The header says °C but the values ({Num(low)} to {Num(high)}) look like °F; they were converted from °F. Correct the header or the values.";

    internal static string SeasonFromDate(int year) =>
        $"No season for this row (no season value, no year in the sheet or file name, no --season); the inoculation date gives {year}, which was taken. Add a season column or pass --season YEAR if the vintage differs.";

    internal static string NoSeason() =>
        "No season for this row: no season value, no four-digit year in the sheet or file name, and no --season. Add a season column, put the year in the sheet or file name, or pass --season YEAR.";

    internal static string MappingFileNotFound() => "The mapping file was not found. Check the path given to --mapping.";

    internal static string MappingFileRefused(long bytes, long limit) => bytes == 0
        ? "The mapping file is empty, or it is not an ordinary file (a device, a pipe or a socket); it was not read. Give a text file of 'FIELD = HEADER' lines."
        : $"The mapping file is {bytes.ToString(Inv)} bytes, above the limit of {limit.ToString(Inv)} bytes for a list of mappings; it was not read. Check the path given to --mapping.";

    internal static string MappingLineNotUnderstood() =>
        "The line is not of the form FIELD = HEADER. Write one mapping a line, e.g. 'strain = Levure'; '#' starts a comment.";

    internal static string MappingUnknownField(string field, IEnumerable<string> names) =>
        $"'{field}' is not a field name. Use one of: {string.Join(", ", names)} (docs/input-format.md says what each holds).";

    internal static string MappedHeaderNotFound(string field) =>
        $"No sheet has this header, so the mapping to {field} was not used. Check the spelling against the file's header row.";

    internal static string MissingValue(string field) => field == "final_abv"
        ? "final_abv is empty; it is required, so the row was left out. Fill in the lab's final alcohol; a lot still fermenting belongs in a later review, or in 'yieldbench forecast --running' now."
        : $"{field} is empty; it is required, so the row was left out. Fill it in.";

    internal static string UnitInCellDiffers(string field, string cellUnit, string columnUnit) =>
        $"{field} is written with the unit '{cellUnit}', but the column is read in {columnUnit}, so the value was not used. Convert it to {columnUnit}, or write the number alone and state the unit in the header.";

    internal static string SeasonHeading(int year) =>
        $"The row is a season heading: the lots below it, up to the next heading, were read as season {year.ToString(Inv)} where their own season cell is empty. A season column makes this certain.";

    internal static string BelowLabLimit(string field) =>
        $"{field} is recorded as below the lab's limit (not detected, or dry); the review takes a {field} left empty as 0 g/L (dry). Enter the lab's number if it gave one.";

    internal static string LabLimitTooHigh(string field, string limit, string dry) =>
        $"{field} is recorded only as below {limit} g/L, which cannot tell a dry wine from one that stopped short (the review counts a wine as dry up to {dry} g/L), so the row was left out. Enter the lab's number.";

    internal static string NotANumber(string field, string example = "24.3") =>
        $"{field} is not a number. Enter a plain number such as {example} (a decimal comma is read too, in files that use it).";

    internal static string AmbiguousDotNumber(string field, string asThousands, string asDecimal) =>
        $"{field} could be {asThousands} (dot as thousands separator, as this decimal-comma file may use) or {asDecimal} (decimal point). Write it without a thousands separator.";

    internal static string AmbiguousDotNumberUnsettled(string field, string asThousands, string asDecimal) =>
        $"{field} could be {asThousands} (dot as thousands separator, as files from European spreadsheets write it) or {asDecimal} (decimal point); nothing else in this file settles which. Write it without a thousands separator.";

    internal static string AmbiguousNumber(string field, string asThousands, string asDecimal) =>
        $"{field} could be {asThousands} (comma as thousands separator) or {asDecimal} (decimal comma). Write it without a thousands separator.";

    internal static string OutOfRange(string field, string shown, double min, double max, string unit) =>
        $"{field} {shown} is outside the plausible range {Num(min)} to {Num(max)}{(unit.Length > 0 ? " " + unit : "")}. Check the value and its unit.";

    internal static string LooksLikeAFraction(double percent) =>
        $" It looks like a fraction: if it means {Num(percent)} % v/v, write {Num(percent)} (or format the cell as a percentage).";

    internal static string NotPositive(string field, string shown) =>
        $"{field} {shown} is not above zero. Enter the volume or capacity in the header's unit, or leave it empty.";

    internal static string Negative(string field, string shown) =>
        $"{field} {shown} is below zero. Enter 0 or leave it empty when nothing was added.";

    internal static string UnitDiffersInColumn(string field, string valueUnit, string columnUnit) =>
        $"{field} looks like {valueUnit} while the column holds {columnUnit}. Convert it to {columnUnit}, or move such values to a column of their own.";

    internal static string FahrenheitInCelsiusColumn(string field, double celsiusIfFahrenheit) =>
        $"{field} is too hot for °C but would be {Num(Math.Round(celsiusIfFahrenheit, 1))} °C if it were °F. Enter it in °C.";

    internal static string ErrorCell(string field) =>
        $"{field} holds a spreadsheet error (a formula that failed). Fix the formula or type the value.";

    internal static string ReadingDateImplausible(string log, string date, string basis) =>
        $"The reading of {log} is dated {date}, more than a year from {basis}; it was left out (a ferment would seem to last for years). Check the date (a year typed wrong, or a date cell read as its serial number).";

    internal static string LogOutOfSeason(string log, int readings, string span, string basis, int? fromOption, int? fittingSeason)
    {
        string why = fromOption is { } option
            ? $" Its season came from --season {option.ToString(Inv)}, which is given to every file that names no season of its own: leave --season off when the files hold several seasons (a log then takes its season from its lot), or give the log a season column."
            : " Check the log's season (column, sheet or file name) and the dates (a year typed wrong, or date cells read as serial numbers).";
        string fits = fittingSeason is { } f ? $" Lot {log[(log.IndexOf('/') + 1)..]} of season {f.ToString(Inv)} was read, and these dates fit it." : "";
        return $"All {readings.ToString("N0", Inv)} readings of {log} are dated {span}, more than a year from {basis}; the log was left out.{why}{fits}";
    }

    internal static string LogTooShort(string log, int readings) => readings == 1
        ? $"The log of {log} holds one reading, so no rate, lag or time to dryness can be measured; the kinetics review leaves it out. Add the other readings, or leave the log out."
        : $"The log of {log} holds {readings.ToString(Inv)} readings all at one time, so no rate, lag or time to dryness can be measured; the kinetics review leaves it out. Check the dates and times.";

    internal static string ResidualAboveStart(double residualGl, double startGl, string start) =>
        $"The residual sugar, {Num(residualGl)} g/L, is more than the must held at the start ({Num(Math.Round(startGl, 1))} g/L of fermentable sugar at {start}, after recorded additions), which is impossible; the lot was left out. One of the two values is wrong (a unit, a misplaced decimal point, or another lot's value).";

    internal static string AdditionsImplausible(string what, double effectiveBrix, double min, double max) =>
        $"{what} would make {(double.IsNaN(effectiveBrix) ? "a must of more than " + Num(YieldBench.Core.Units.SugarReading.MaxBrix) + " °Brix" : "a must of " + Num(Math.Round(effectiveBrix, 1)) + " °Brix")}, outside any must ({Num(min)} to {Num(max)} °Brix); the lot was left out. One of the values is wrong (a unit, for example pounds or grams for kilograms, or a misplaced decimal point).";

    internal static string AdditionsWithoutVolume() =>
        "Water or sugar additions are recorded without a must volume, so the starting sugar cannot be corrected for them: the lot is reviewed on its measured starting sugar and its factor is off by the additions. Add the must volume (before the additions).";

    internal static string DateOutsideSeason(string field, string date, int season) =>
        $"{field} {date} lies more than a year from season {season.ToString(Inv)}.";

    internal static string HalfDayTime(int count, TimeSpan morning, TimeSpan evening) =>
        $"{count.ToString(Inv)} time(s) of this column name only the half of the day of the check (AM or PM); they were read as {morning.ToString(@"hh\:mm", Inv)} and {evening.ToString(@"hh\:mm", Inv)}, a morning and an afternoon check (an assumption), so the hours between readings, and the rates worked out from them, may be off by a few hours. Write the hour of each check (8:15, 17:40) for exact rates.";

    internal static string TimeZoneNotApplied(string field) =>
        $"{field} values carry a time zone (Z or an offset such as +02:00); they were read as the clock time written, in the file's own clock, and the zone was not applied. Times are compared as written, so keep every log of a lot in one clock.";

    internal static string ExtraFields(int fields, int headerFields) =>
        $"The row has {fields.ToString(Inv)} fields but the header {headerFields.ToString(Inv)}, so its values have shifted and none was used: a value holding the delimiter without quotes splits in two (a number written 4,500 in a comma-separated file). Quote such a value (\"4,500\") or write numbers without a thousands separator.";

    internal static string TextSettled(string field, bool notes) =>
        $"{field} holds control characters (such as a vertical tab, which some database exports write for a line break, or an escape) that spreadsheets, charts and terminals cannot show; {(notes ? "line-break characters were read as line breaks and the others as spaces" : "they were read as spaces")}. Check the text in the file.";

    internal static string TextTooLong(string field, int length, int limit) =>
        $"{field} is {length.ToString("N0", Inv)} characters long, more than the {limit.ToString("N0", Inv)} a spreadsheet cell holds; it was cut to that length. Shorten the text in the file.";

    internal static string MergedCells(string range, int fromRow, int toRow) =>
        $"The cells {range} are merged: a spreadsheet program shows their value once, but the file stores it only in the first cell, so it was read for each of rows {fromRow}–{toRow}. If that is wrong, unmerge the cells and type each row's own value.";

    internal static string FormulaWithoutValue(string field, string formula) =>
        $"{field} holds the formula ={(formula.Length == 0 ? "(shared with a cell above)" : formula)} but no stored result (files written by scripts and some exporters keep only the formula), so its value is unknown. Open the file in a spreadsheet program and save it, which stores the results, or type the value.";

    internal static string NotADate(string field, string? why = null) =>
        $"{field} is not a date{why}. Write dates as year-month-day, e.g. 2024-03-02 (a date cell, or 2024-03-02 14:30 with a time).";

    internal const string WeekdayWithoutDate = ": it names a day of the week but no date, and a weekday does not say which week";

    internal const string DateWithoutYear = ": it has a day and month but no year";

    internal static string LabResultsApart(IReadOnlyList<string> results, bool byLotId) =>
        byLotId
            ? $"The sheet holds the lab's results ({string.Join(", ", results)}) by lot id but no strain or starting sugar, and no lots sheet read lacks a final alcohol column for them to complete, so none of its rows could be used. "
              + "Lab results on a sheet of their own are joined to a lots sheet that has no final alcohol column, by the lot id written exactly alike; or copy these columns into the lots table beside each lot, then check again."
            : $"The sheet holds the lab's results ({string.Join(", ", results)}) but no lot id column, strain or starting sugar, so none of its rows could be used. "
              + "If a column names the lot (a sample or lab number written as the lot id), map it with --column lot_id=HEADER: lab results on a sheet of their own are joined to a lots sheet that has no final alcohol column, by the lot id written exactly alike.";

    internal static string LabResultsJoined(string labSheets) =>
        $"The sheet has no final alcohol column: each lot's final alcohol (and residual sugar, pH or TA where its own row has none) is taken from the lab results on {labSheets}, joined by the lot id written exactly alike (and the season where the lab sheet gives one). Ids written differently are not joined; each is reported.";

    internal static string NoLabResult(string lotId, int season, string labSheets, string? alike) =>
        $"Lot '{lotId}' (season {season.ToString(Inv)}) has no final alcohol: its sheet has no final alcohol column and no lab result on {labSheets} bears its id, so the lot was left out."
        + (alike is null ? " Add its result to the lab sheet under the same id." : $" The lab sheet has '{alike}', perhaps the same lot written differently; YieldBench joins only ids written alike (a guess could give one lot another's alcohol): write the id the same way on both sheets.");

    internal static string LabResultWithoutLot(string lotId, int? season, string? alike) =>
        $"The lab result for '{lotId}' ({(season is { } s ? "season " + s.ToString(Inv) : "no season given")}) matches no lot read, so it was not used."
        + (alike is null ? " Check the id, or add the lot to the lots sheet." : $" A lot '{alike}' was read, perhaps the same lot written differently; YieldBench joins only ids written alike: write the id the same way on both sheets.");

    internal static string DuplicateLabResult(string lotId, string first) =>
        $"A second lab result for '{lotId}' in the same season; the first ({first}) was kept and this row left out. If this is a retest that replaces the first, delete or mark the older row.";

    internal static string TimeMissing(int count, int firstRow, TimeSpan usual) =>
        $"{count} reading(s) of the log have a date but no time (the first at row {firstRow}); each was read at {usual:hh\\:mm}, the time its other readings were most often taken, not at midnight. Rates and hours between readings lean on it: write the hour of each reading.";

    internal static string LogLaidAcross(int row, int dates, List<string> readings) =>
        $"The sheet is a fermentation log laid across: its {dates} dates run along row {row} and each reading has a row of its own ({string.Join(", ", readings.Take(4))}{(readings.Count > 4 ? ", …" : "")}), so none of its readings was read. "
        + "YieldBench reads a log with a row per reading: copy the block and paste it transposed (Paste Special, Transpose) so that the date and each reading head a column, then check again.";

    internal static string NoteInCell(string field, string number, string note) =>
        $"{field} holds a number with a note in brackets: {number} was read as the value and the note '{note}' was not. If the note changes the number (a value to replace), type the number meant; keep notes in a notes column.";

    internal static string LogBlocks(IReadOnlyList<(int Row, string Lot, bool AboveHeader)> headings, IReadOnlyList<int> headerRepeats, string? sheetLot)
    {
        static string Rows(IReadOnlyList<int> rows) =>
            string.Join(", ", rows.Take(6).Select(r => r.ToString(System.Globalization.CultureInfo.InvariantCulture))) + (rows.Count > 6 ? $" and {rows.Count - 6} more" : "");
        string repeats = headerRepeats.Count == 0 ? "" : $"The header typed again (row{(headerRepeats.Count == 1 ? "" : "s")} {Rows(headerRepeats)}) was passed over as structure. ";
        if (headings.Count == 0)
        {
            return $"The header is typed again at row{(headerRepeats.Count == 1 ? "" : "s")} {Rows(headerRepeats)} (a sheet pasted in blocks or printed in pages); those rows were passed over as structure and counted with the summary rows.";
        }

        string named = string.Join(", ", headings.Take(6).Select(h => $"'{h.Lot}' (row {h.Row}{(h.AboveHeader ? ", above the header" : "")})")) + (headings.Count > 6 ? $" and {headings.Count - 6} more" : "");
        return $"The log has no lot column and holds its readings in blocks, each under a row naming its lot: {named}. "
            + "Each reading was read as the lot of the heading above it"
            + (sheetLot is not null ? $" (the readings above the first heading as '{sheetLot}', the sheet's name)" : "")
            + ", and the headings were counted with the summary rows. " + repeats
            + "If a heading names a tank rather than the lot, write the lot's id in it; or add a Lot column.";
    }

    internal static string LotIdInName(string name, string lotId) =>
        $"The log named '{name}' matches no lot by its whole name, but holds the id of lot '{lotId}' as a word: it was read as that lot's log. If it is not, name the log by its lot's id alone.";

    internal static string AdditionsApart(string lotHeader, string whatHeader, string amountHeader, List<string> lots, List<string> others) =>
        $"The sheet keeps additions apart from the lots, a row per addition ({lotHeader}, {whatHeader}, {amountHeader}); YieldBench reads a lot's water and sugar additions from columns of the lots table "
        + "('Water added (L)', 'Sugar added (kg)', with the must volume before them), so none of its rows was read and the lots are reviewed on their measured sugar. "
        + (lots.Count > 0 ? $"Write each lot's total in those columns: {string.Join("; ", lots)}. " : "No water or sugar with a unit (120 L, 25 kg) was found in it. ")
        + (others.Count > 0 ? $"Other additions ({string.Join(", ", others)}) do not enter the review." : "");

    internal static string BoundNotValue(string field, string text, bool above, string limit) =>
        $"{field} is written as a bound ('{text}'): the value lies {(above ? "above" : "below")} {limit}, not at it, so it is no measurement to compute with. "
        + (above ? "Enter the lab's number (a value beyond its range is measured again after dilution)." : "Enter the lab's number.");

    internal static string CellUnitsConverted(int count, string first, int row, double inField, string fieldUnit, string columnUnit) =>
        $"{count} value(s) of the column, whose header gives no unit, are written with a unit of their own (the first, '{first}' at row {row}, = {Num(Math.Round(inField, 2))} {fieldUnit}); "
        + $"each was converted from the unit it states to {fieldUnit}. Values written without a unit were read in {columnUnit}. State the unit in the header, or write every value in one unit.";

    internal static string CommaThousands(int count, string first, int row, double value) =>
        $"{count} value(s) of the column are written with a comma before groups of three digits (the first, '{first}' at row {row}). The file separates its fields with commas and writes its decimals with a point, "
        + $"as spreadsheets set up for the US or UK export, so each such comma was read as a thousands separator ('{first}' = {Num(value)}). If one is a decimal comma, write the value with a point.";

    internal static string VarietyHeading(string text) =>
        $"The row holds only '{text}' over lots, and the table has no variety column: it was read as a heading naming the variety of the lots below it, up to the next such heading, and counted with the summary rows. "
        + "If it names something else (a block, a grower), add a column for it.";

    internal static string GroupHeading(string text, string field) =>
        $"The row holds only '{text}', the {field} of lots below it: it was read as a heading over a group of lots, not as a lot, and counted with the summary rows. Nothing of it is used; each lot's own {field} cell is.";

    internal static string DateOrderFromSpan(bool dayFirst, int dates, int span, int otherSpan, string example) =>
        $"No date of the column has a part above 12 to say which is the day, so its {dates} dates such as '{example}' read both ways. "
        + $"They were read {(dayFirst ? "day first (day/month)" : "month first (month/day)")}: so they fall within {span} day{(span == 1 ? "" : "s")}, as one season's dates do, "
        + $"while {(dayFirst ? "month first" : "day first")} would spread them over {otherSpan} days. If they are {(dayFirst ? "month first" : "day first")}, write them as year-month-day and check again.";

    internal static string AmbiguousDate(string field, string dayFirst, string monthFirst) =>
        $"{field} could be {dayFirst} (day first) or {monthFirst} (month first), and no other date in the column settles the order. Write it as year-month-day.";

    internal static string NotATime(string field) => $"{field} is not a time of day. Write it as 14:30 (24-hour clock).";

    internal static string UnknownColour(string field) =>
        $"{field} is not a colour read here (red, white, rosé). Use one of those words.";

    internal static string NotAYear(string field) =>
        $"{field} is not a year. Enter the four-digit vintage year, e.g. 2024.";

    internal static string DuplicateLot(string lotId, int season, string firstAt) =>
        $"Lot '{lotId}' of season {season.ToString(Inv)} was already read at {firstAt}; this row was left out. Give each lot its own id, or delete the repeated row.";

    internal static string DuplicateLotInOtherVessel(string lotId, string firstVessel, string vessel) =>
        $" The two rows name different vessels ({firstVessel} and {vessel}): if the lot was split across them, give each part its own id (e.g. {lotId}-{vessel}) so both are reviewed, or enter the lot once.";

    internal static string SummaryRow() =>
        "The row looks like a summary (average, total…), not a lot; it was skipped.";

    internal static string NoReading() =>
        "The row has neither a sugar nor a temperature reading, so it was left out. Fill one in, or delete the row.";

    internal static string MissingTimestamp() =>
        "The row has no date or timestamp, so it was left out. Fill in when the reading was taken.";

    internal static string BadCsvRow(string detail) =>
        $"The row could not be split into fields ({detail}). Fix the quote marks in the row.";

    internal static string LogWithoutLot(string lotId, string season) =>
        $"The fermentation log of lot '{lotId}' ({season}) matches no lot read. Check the lot id, or add the lot to the lots sheet.";

    internal static string LogsWithoutAnyLot(IReadOnlyList<string> lotIds) =>
        $"No lot was read (no lots table among the inputs, or none of its rows could be used), so the fermentation logs of {lotIds.Count.ToString(Inv)} lots on this sheet ({string.Join(", ", lotIds.Take(10))}{(lotIds.Count > 10 ? $" and {(lotIds.Count - 10).ToString(Inv)} more" : "")}) match none. Give the lots file with the logs, or fix the lots table's errors listed here.";

    internal static string LeadingZeroTwin(string lotId, string logId) =>
        $" Lot '{lotId}' differs only in leading zeros: a spreadsheet drops them from an id typed as a number. If it is the same lot, write the id the same way in both files (as text, e.g. '{lotId}, to keep the zero).";

    internal static string LotInTank(string lotId, string tank) =>
        $" The lots table names '{tank}' as the tank (vessel) of lot '{lotId}'. If this is that lot's log, write the lot id '{lotId}' in the log in place of the tank; a log is not joined by its tank, which holds other lots in other seasons.";

    internal static string LotsWithoutLog(int count, int season, IReadOnlyList<string> examples) =>
        $"{count.ToString(Inv)} lot(s) of season {season.ToString(Inv)} have no fermentation log: {string.Join(", ", examples)}{(count > examples.Count ? $" and {(count - examples.Count).ToString(Inv)} more" : "")}. Kinetics is shown only for lots with a log.";

    /// <summary>Text appended to an issue about an optional value that was left empty while the row was used.</summary>
    internal const string LeftEmpty = " The value was left empty; the rest of the row was used.";
}
