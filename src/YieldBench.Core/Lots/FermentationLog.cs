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
    /// <summary>The key of the lot the log belongs to (<see cref="Lot.Key"/>), or null when the log names no season.</summary>
    public LotKey? Key => Season is { } s ? new LotKey(s, LotId) : null;

    /// <summary>The log as messages name it: "season/lot", or the lot id alone when no season is known.</summary>
    public string Name => Key?.ToString() ?? LotId;
}
