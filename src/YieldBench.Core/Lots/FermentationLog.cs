using YieldBench.Core.Units;

namespace YieldBench.Core.Lots;

/// <summary>One reading in a fermentation log. Sugar or temperature may be missing, not both.</summary>
public sealed record LogReading(DateTime Timestamp, SugarReading? Sugar, double? TemperatureC, SourceRef? Source = null);

/// <summary>
/// A lot's fermentation log as read: readings in the order they appear in the file (kinetics sorts them and
/// reports duplicated or out-of-order timestamps).
/// </summary>
public sealed record FermentationLog(string LotId, int? Season, IReadOnlyList<LogReading> Readings)
{
    /// <summary>A key matching <see cref="Lot.Key"/> when the season is known.</summary>
    public string Key => Season is { } s ? $"{s}/{LotId}" : LotId;
}
