namespace YieldBench.Intake;

/// <summary>
/// Every issue code intake raises, one constant each. docs/input-format.md ("Issue codes") explains each one; a test
/// checks that every constant is there and that intake writes no code as a bare string.
/// </summary>
public static class IssueCodes
{
    // ---------------------------------------------------------------- files and folders

    /// <summary><c>file-not-found</c>.</summary>
    public const string FileNotFound = "file-not-found";

    /// <summary><c>folder-empty</c>.</summary>
    public const string FolderEmpty = "folder-empty";

    /// <summary><c>lock-file-skipped</c>.</summary>
    public const string LockFileSkipped = "lock-file-skipped";

    /// <summary><c>file-skipped</c>.</summary>
    public const string FileSkipped = "file-skipped";

    /// <summary><c>same-content-again</c>.</summary>
    public const string SameContentAgain = "same-content-again";

    /// <summary><c>unsupported-file-type</c>.</summary>
    public const string UnsupportedFileType = "unsupported-file-type";

    /// <summary><c>cannot-open</c>.</summary>
    public const string CannotOpen = "cannot-open";

    /// <summary><c>empty-file</c>.</summary>
    public const string EmptyFile = "empty-file";

    /// <summary><c>file-too-large</c>.</summary>
    public const string FileTooLarge = "file-too-large";

    /// <summary><c>binary-file</c>.</summary>
    public const string BinaryFile = "binary-file";

    /// <summary><c>encoding-assumed</c>.</summary>
    public const string EncodingAssumed = "encoding-assumed";

    /// <summary><c>not-a-workbook</c>.</summary>
    public const string NotAWorkbook = "not-a-workbook";

    /// <summary><c>content-differs-from-name</c>.</summary>
    public const string ContentDiffersFromName = "content-differs-from-name";

    /// <summary><c>zip-bomb</c>.</summary>
    public const string ZipBomb = "zip-bomb";

    /// <summary><c>password-protected</c>.</summary>
    public const string PasswordProtected = "password-protected";

    /// <summary><c>corrupt-workbook</c>.</summary>
    public const string CorruptWorkbook = "corrupt-workbook";

    // ---------------------------------------------------------------- sheets and tables

    /// <summary><c>no-table-found</c>.</summary>
    public const string NoTableFound = "no-table-found";

    /// <summary><c>sheet-skipped</c>.</summary>
    public const string SheetSkipped = "sheet-skipped";

    /// <summary><c>hidden-sheet-skipped</c>.</summary>
    public const string HiddenSheetSkipped = "hidden-sheet-skipped";

    /// <summary><c>units-row-read</c>.</summary>
    public const string UnitsRowRead = "units-row-read";

    /// <summary><c>note-row-skipped</c>.</summary>
    public const string NoteRowSkipped = "note-row-skipped";

    /// <summary><c>too-many-rows</c>.</summary>
    public const string TooManyRows = "too-many-rows";

    /// <summary><c>too-many-cells</c>.</summary>
    public const string TooManyCells = "too-many-cells";

    /// <summary><c>missing-column</c>.</summary>
    public const string MissingColumn = "missing-column";

    /// <summary><c>lot-id-from-tank</c>.</summary>
    public const string LotIdFromTank = "lot-id-from-tank";

    /// <summary><c>column-not-used</c>.</summary>
    public const string ColumnNotUsed = "column-not-used";

    /// <summary><c>one-column-per-lot</c>.</summary>
    public const string OneColumnPerLot = "one-column-per-lot";

    /// <summary><c>duplicate-column</c>.</summary>
    public const string DuplicateColumn = "duplicate-column";

    /// <summary><c>final-column-not-read</c>.</summary>
    public const string FinalColumnNotRead = "final-column-not-read";

    /// <summary><c>extra-fields</c>.</summary>
    public const string ExtraFields = "extra-fields";

    /// <summary><c>bad-csv-row</c>.</summary>
    public const string BadCsvRow = "bad-csv-row";

    /// <summary><c>summary-row-skipped</c>.</summary>
    public const string SummaryRowSkipped = "summary-row-skipped";

    // ---------------------------------------------------------------- units

    /// <summary><c>unit-assumed</c>.</summary>
    public const string UnitAssumed = "unit-assumed";

    /// <summary><c>unit-from-values</c>.</summary>
    public const string UnitFromValues = "unit-from-values";

    /// <summary><c>temperature-in-fahrenheit</c>.</summary>
    public const string TemperatureInFahrenheit = "temperature-in-fahrenheit";

    /// <summary><c>unit-differs-in-column</c>.</summary>
    public const string UnitDiffersInColumn = "unit-differs-in-column";

    /// <summary><c>season-heading</c>.</summary>
    public const string SeasonHeading = "season-heading";

    /// <summary><c>unit-in-cell-differs</c>.</summary>
    public const string UnitInCellDiffers = "unit-in-cell-differs";

    /// <summary><c>below-lab-limit</c>.</summary>
    public const string BelowLabLimit = "below-lab-limit";

    /// <summary><c>fahrenheit-in-celsius-column</c>.</summary>
    public const string FahrenheitInCelsiusColumn = "fahrenheit-in-celsius-column";

    // ---------------------------------------------------------------- mappings

    /// <summary><c>mapping-file-not-found</c>.</summary>
    public const string MappingFileNotFound = "mapping-file-not-found";

    /// <summary><c>mapping-file-refused</c>.</summary>
    public const string MappingFileRefused = "mapping-file-refused";

    /// <summary><c>mapping-not-understood</c>.</summary>
    public const string MappingNotUnderstood = "mapping-not-understood";

    /// <summary><c>mapping-unknown-field</c>.</summary>
    public const string MappingUnknownField = "mapping-unknown-field";

    /// <summary><c>mapped-header-not-found</c>.</summary>
    public const string MappedHeaderNotFound = "mapped-header-not-found";

    // ---------------------------------------------------------------- values

    /// <summary><c>missing-value</c>.</summary>
    public const string MissingValue = "missing-value";

    /// <summary><c>not-a-number</c>.</summary>
    public const string NotANumber = "not-a-number";

    /// <summary><c>ambiguous-number</c>.</summary>
    public const string AmbiguousNumber = "ambiguous-number";

    /// <summary><c>out-of-range</c>.</summary>
    public const string OutOfRange = "out-of-range";

    /// <summary><c>error-cell</c>.</summary>
    public const string ErrorCell = "error-cell";

    /// <summary><c>text-settled</c>.</summary>
    public const string TextSettled = "text-settled";

    /// <summary><c>text-too-long</c>.</summary>
    public const string TextTooLong = "text-too-long";

    /// <summary><c>formula-without-value</c>.</summary>
    public const string FormulaWithoutValue = "formula-without-value";

    /// <summary><c>merged-cells</c>.</summary>
    public const string MergedCells = "merged-cells";

    /// <summary><c>not-a-date</c>.</summary>
    public const string NotADate = "not-a-date";

    /// <summary><c>half-day-time</c>.</summary>
    public const string HalfDayTime = "half-day-time";

    /// <summary><c>time-zone-not-applied</c>.</summary>
    public const string TimeZoneNotApplied = "time-zone-not-applied";

    /// <summary><c>time-missing</c>.</summary>
    public const string TimeMissing = "time-missing";

    /// <summary><c>lab-results-apart</c>.</summary>
    public const string LabResultsApart = "lab-results-apart";

    /// <summary><c>lab-results-joined</c>.</summary>
    public const string LabResultsJoined = "lab-results-joined";

    /// <summary><c>no-lab-result</c>.</summary>
    public const string NoLabResult = "no-lab-result";

    /// <summary><c>lab-result-without-lot</c>.</summary>
    public const string LabResultWithoutLot = "lab-result-without-lot";

    /// <summary><c>duplicate-lab-result</c>.</summary>
    public const string DuplicateLabResult = "duplicate-lab-result";

    /// <summary><c>log-laid-across</c>.</summary>
    public const string LogLaidAcross = "log-laid-across";

    /// <summary><c>note-in-cell</c>.</summary>
    public const string NoteInCell = "note-in-cell";

    /// <summary><c>additions-apart</c>.</summary>
    public const string AdditionsApart = "additions-apart";

    /// <summary><c>lot-id-in-name</c>.</summary>
    public const string LotIdInName = "lot-id-in-name";

    /// <summary><c>log-blocks</c>.</summary>
    public const string LogBlocks = "log-blocks";

    /// <summary><c>group-heading</c>.</summary>
    public const string GroupHeading = "group-heading";

    /// <summary><c>ambiguous-date</c>.</summary>
    public const string AmbiguousDate = "ambiguous-date";

    /// <summary><c>date-order-from-span</c>.</summary>
    public const string DateOrderFromSpan = "date-order-from-span";

    /// <summary><c>not-a-time</c>.</summary>
    public const string NotATime = "not-a-time";

    /// <summary><c>not-a-year</c>.</summary>
    public const string NotAYear = "not-a-year";

    /// <summary><c>no-season</c>.</summary>
    public const string NoSeason = "no-season";

    /// <summary><c>season-from-date</c>.</summary>
    public const string SeasonFromDate = "season-from-date";

    /// <summary><c>unknown-colour</c>.</summary>
    public const string UnknownColour = "unknown-colour";

    // ---------------------------------------------------------------- lots and logs

    /// <summary><c>duplicate-lot</c>.</summary>
    public const string DuplicateLot = "duplicate-lot";

    /// <summary><c>spelling-unified</c>.</summary>
    public const string SpellingUnified = "spelling-unified";

    /// <summary><c>no-reading</c>.</summary>
    public const string NoReading = "no-reading";

    /// <summary><c>missing-timestamp</c>.</summary>
    public const string MissingTimestamp = "missing-timestamp";

    /// <summary><c>days-from-inoculation</c>.</summary>
    public const string DaysFromInoculation = "days-from-inoculation";

    /// <summary><c>days-without-inoculation</c>.</summary>
    public const string DaysWithoutInoculation = "days-without-inoculation";

    /// <summary><c>date-without-year</c>.</summary>
    public const string DateWithoutYear = "date-without-year";

    /// <summary><c>reading-date-implausible</c>.</summary>
    public const string ReadingDateImplausible = "reading-date-implausible";

    /// <summary><c>log-too-short</c>.</summary>
    public const string LogTooShort = "log-too-short";

    /// <summary><c>residual-above-start</c>.</summary>
    public const string ResidualAboveStart = "residual-above-start";

    /// <summary><c>additions-implausible</c>.</summary>
    public const string AdditionsImplausible = "additions-implausible";

    /// <summary><c>additions-without-volume</c>.</summary>
    public const string AdditionsWithoutVolume = "additions-without-volume";

    /// <summary><c>date-outside-season</c>.</summary>
    public const string DateOutsideSeason = "date-outside-season";

    /// <summary><c>log-without-lot</c>.</summary>
    public const string LogWithoutLot = "log-without-lot";

    /// <summary><c>lots-without-log</c>.</summary>
    public const string LotsWithoutLog = "lots-without-log";

    /// <summary>Every code above.</summary>
    public static IReadOnlyList<string> All { get; } = typeof(IssueCodes).GetFields(System.Reflection.BindingFlags.Public | System.Reflection.BindingFlags.Static)
        .Where(f => f.IsLiteral).Select(f => (string)f.GetRawConstantValue()!).ToArray();
}
