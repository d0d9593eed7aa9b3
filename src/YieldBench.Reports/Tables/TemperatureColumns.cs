using YieldBench.Core.Units;

namespace YieldBench.Reports.Tables;

/// <summary>
/// Shows a table's temperature columns in the review's unit: a column whose data-file name ends in <c>_c</c> and whose
/// heading names °C becomes <c>_f</c> and °F, its values converted (a spread such as an IQR as a difference). The review
/// keeps °C; with °C the columns are returned unchanged.
/// </summary>
internal static class TemperatureColumns
{
    /// <summary>True for a temperature column (°C in the heading, <c>_c</c> last in the name).</summary>
    public static bool IsTemperature(ReportColumn column) =>
        column.Name.EndsWith("_c", StringComparison.Ordinal) && column.Heading.Contains("°C", StringComparison.Ordinal);

    /// <summary>The column as it is written in <paramref name="unit"/>.</summary>
    public static ReportColumn In(ReportColumn column, TemperatureUnit unit) =>
        unit == TemperatureUnit.Celsius || !IsTemperature(column)
            ? column
            : column with { Name = column.Name[..^2] + "_" + unit.Suffix(), Heading = column.Heading.Replace("°C", unit.Symbol(), StringComparison.Ordinal) };

    /// <summary>The columns as they are written in <paramref name="unit"/>.</summary>
    public static IReadOnlyList<ReportColumn> In(IReadOnlyList<ReportColumn> columns, TemperatureUnit unit) =>
        unit == TemperatureUnit.Celsius ? columns : columns.Select(c => In(c, unit)).ToArray();

    /// <summary>The columns with each temperature column's values converted to <paramref name="unit"/>.</summary>
    public static IReadOnlyList<Column<T>> In<T>(IReadOnlyList<Column<T>> columns, TemperatureUnit unit) =>
        unit == TemperatureUnit.Celsius
            ? columns
            : columns.Select(c => IsTemperature(c.Definition) ? new Column<T>(In(c.Definition, unit), x => Cell(c.Definition, c.Value(x), unit)) : c).ToArray();

    /// <summary>A cell of <paramref name="column"/> (given in °C) in <paramref name="unit"/>; other cells unchanged.</summary>
    public static object? Cell(ReportColumn column, object? value, TemperatureUnit unit)
    {
        if (unit == TemperatureUnit.Celsius || !IsTemperature(column) || value is not double celsius)
        {
            return value;
        }

        return column.Name.Contains("_iqr", StringComparison.Ordinal) ? unit.Difference(celsius) : unit.FromCelsius(celsius);
    }
}
