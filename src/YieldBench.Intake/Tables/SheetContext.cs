using YieldBench.Core.Lots;

namespace YieldBench.Intake;

/// <summary>A column bound to a field, with the unit its values are read in.</summary>
internal sealed class BoundColumn(int index, FieldDef field, string header, ColumnUnit unit, bool unitStated)
{
    private double[]? _parsed;

    public int Index { get; } = index;

    public FieldDef Field { get; set; } = field;

    public string Header { get; } = header;

    public ColumnUnit Unit { get; set; } = unit;

    /// <summary>True when the header, a units row or a mapping gave the unit (the values then do not settle it).</summary>
    public bool UnitStated { get; } = unitStated;

    public DateOrder DateOrder { get; set; }

    /// <summary>True when an explicit mapping (<c>--column</c>, <c>--mapping</c>) bound the column to its field.</summary>
    public bool Mapped { get; init; }

    /// <summary>The first sheet row whose date was a day and month with no year, read in its row's season, and that date.</summary>
    public (int Row, string Text, DateTime Read)? YearFromSeasonAt { get; set; }

    /// <summary>The first sheet row of an SG column whose value was written the other way (1090 among 1.088s), its text and the SG read.</summary>
    public (int Row, string Text, double Sg)? OtherGravityFormAt { get; set; }

    /// <summary>The first sheet row whose value was written with a unit of its own in a column whose header gives none ("5 kL"), its text and the value in the field's unit.</summary>
    public (int Row, string Text, double InField)? CellUnitAt { get; set; }

    /// <summary>How many values of the column were written with a unit of their own and converted.</summary>
    public int CellUnits { get; set; }

    /// <summary>The first sheet row whose value had a comma grouping thousands ("1,250" in a comma-separated file), its text and the number read.</summary>
    public (int Row, string Text, double Value)? ThousandsAt { get; set; }

    /// <summary>How many values of the column had a comma grouping thousands.</summary>
    public int Thousands { get; set; }

    /// <summary>How many values of an SG column were written the other way.</summary>
    public int OtherGravityForms { get; set; }

    /// <summary>How many dates of the column were read in their row's season for want of a year.</summary>
    public int YearsFromSeason { get; set; }

    /// <summary>The first sheet row of a time column holding only the half of the day ("AM", "PM"), and its text.</summary>
    public (int Row, string Text)? HalfDayAt { get; set; }

    /// <summary>How many times of the column named only the half of the day.</summary>
    public int HalfDays { get; set; }

    /// <summary>The first sheet row of a log whose time cell was empty beside a date with no time, and how many such rows.</summary>
    public (int Row, int Count)? NoTimeAt { get; set; }

    /// <summary>The time column's most common time of day (the cellar's usual reading hour), once worked out; null when it holds none.</summary>
    public TimeSpan? UsualTime { get; set; }

    /// <summary>True once <see cref="UsualTime"/> has been worked out.</summary>
    public bool UsualTimeKnown { get; set; }

    /// <summary>The first sheet row whose date text carried a time zone (Z, +02:00), which was not applied.</summary>
    public int? ZoneSeenAt { get; set; }

    /// <summary>Keeps the numbers read while the unit was settled (NaN where a cell held none), by data row.</summary>
    public void KeepParsed(double[] numbers) => _parsed = numbers;

    /// <summary>The number read for data row <paramref name="dataRow"/> while the unit was settled, if any.</summary>
    public bool ParsedAt(int dataRow, out double value)
    {
        value = _parsed is { } p && dataRow >= 0 && dataRow < p.Length ? p[dataRow] : double.NaN;
        return !double.IsNaN(value);
    }
}

/// <summary>
/// One table being read: its sheet, kind, bound columns and data rows; <see cref="HeaderWidth"/> is the number of
/// cells up to the header's last one that is not blank.
/// </summary>
internal sealed record SheetContext(
    IntakeRun Run,
    string File,
    RawSheet Sheet,
    TableKind Kind,
    List<BoundColumn> Columns,
    int FirstData,
    int LastRow,
    int? DefaultSeason,
    int HeaderWidth)
{
    private readonly Dictionary<string, BoundColumn> _byField = IndexByField(Columns);

    public string? SheetName => Sheet.Name;

    /// <summary>The file and sheet as the log readings of this table share them.</summary>
    public SourcePlace Place { get; } = new(File, Sheet.Name);

    /// <summary>Headers of the table that matched no field, for hints in the messages of missing columns.</summary>
    public IReadOnlyList<string> Unmatched { get; init; } = [];

    /// <summary>The sheet row index (0-based) of the header.</summary>
    public int HeaderRow { get; init; }

    /// <summary>
    /// Data rows that are structure, not data, of a log kept in blocks (a heading naming the lot below it, a repeat of
    /// the header): counted with the summary rows. Null when the table has none.
    /// </summary>
    public HashSet<int>? StructureRows { get; set; }

    /// <summary>The variety named by the last heading row read over a group of lots in a table with no variety column ("Syrah").</summary>
    public string? HeadingVariety { get; set; }

    /// <summary>The season named by the last season heading row read ("Vintage 2023"), for the lots below it.</summary>
    public int? HeadingSeason { get; set; }

    /// <summary>The lot id column, or null.</summary>
    public BoundColumn? LotColumn => Column("lot_id");

    /// <summary>
    /// Binds <paramref name="column"/> to <paramref name="field"/> instead of the field it was read for (a lots table's
    /// tank column naming its lots), as a <c>--column</c> mapping would have.
    /// </summary>
    public void Rebind(BoundColumn column, FieldDef field)
    {
        if (_byField.GetValueOrDefault(column.Field.Name) == column)
        {
            _byField.Remove(column.Field.Name);
        }

        column.Field = field;
        _byField[field.Name] = column;
    }

    /// <summary>The column bound to the field (the first one, when a header repeats), or null.</summary>
    public BoundColumn? Column(string field) => _byField.GetValueOrDefault(field);

    /// <summary>The column's cells from the first data row to the last.</summary>
    public IEnumerable<object?> Values(BoundColumn c)
    {
        for (int r = FirstData; r <= LastRow; r++)
        {
            yield return Sheet.Cell(r, c.Index);
        }
    }

    private static Dictionary<string, BoundColumn> IndexByField(List<BoundColumn> columns)
    {
        var index = new Dictionary<string, BoundColumn>(StringComparer.Ordinal);
        foreach (var c in columns)
        {
            index.TryAdd(c.Field.Name, c);
        }

        return index;
    }
}
