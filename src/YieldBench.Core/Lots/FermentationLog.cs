using YieldBench.Core.Units;

namespace YieldBench.Core.Lots;

/// <summary>One reading in a fermentation log. Sugar or temperature may be missing, not both.</summary>
/// <remarks>
/// Its provenance is kept as the place (file and sheet) shared by every row of a sheet plus the row number, not as a
/// <see cref="SourceRef"/> of its own: at a million readings an object per reading was tens of megabytes.
/// </remarks>
public sealed record LogReading
{
    /// <summary>A reading from <paramref name="place"/> at spreadsheet row <paramref name="row"/>.</summary>
    public LogReading(DateTime timestamp, SugarReading? sugar, double? temperatureC, SourcePlace? place, int row)
    {
        Timestamp = timestamp;
        Sugar = sugar;
        TemperatureC = temperatureC;
        Place = place;
        Row = place is null ? 0 : row;
    }

    /// <summary>A reading from <paramref name="source"/> (null: not from a file).</summary>
    public LogReading(DateTime timestamp, SugarReading? sugar, double? temperatureC, SourceRef? source = null)
        : this(timestamp, sugar, temperatureC, source is null ? null : new SourcePlace(source.File, source.Sheet), source?.Row ?? 0)
    {
    }

    /// <summary>When the reading was taken.</summary>
    public DateTime Timestamp { get; init; }

    /// <summary>The sugar reading, or null.</summary>
    public SugarReading? Sugar { get; init; }

    /// <summary>The temperature, °C, or null.</summary>
    public double? TemperatureC { get; init; }

    /// <summary>The file and sheet the reading came from, or null when it came from no file.</summary>
    public SourcePlace? Place { get; init; }

    /// <summary>The spreadsheet row (1-based) within <see cref="Place"/>; 0 without a place.</summary>
    public int Row { get; init; }

    /// <summary>Where the reading came from (made when asked), or null when it came from no file.</summary>
    public SourceRef? Source => Place is null ? null : new SourceRef(Place.File, Place.Sheet, Row);
}

/// <summary>
/// A lot's fermentation log as read: readings in the order they appear in the file (kinetics sorts them and
/// reports duplicated or out-of-order timestamps).
/// </summary>
public sealed record FermentationLog(string LotId, int? Season, IReadOnlyList<LogReading> Readings)
{
    /// <summary>The key of the lot the log belongs to (<see cref="Lot.Key"/>), or null when the log names no season.</summary>
    public LotKey? Key => Season is { } s ? new LotKey(s, LotId) : null;

    /// <summary>The log as messages name it: "season/lot", or the lot id alone when no season is known.</summary>
    public string Name => Key?.ToString() ?? LotId;
}
