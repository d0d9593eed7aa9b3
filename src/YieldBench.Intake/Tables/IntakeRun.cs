using YieldBench.Core.Lots;

namespace YieldBench.Intake;

/// <summary>State shared by every sheet of one run: options, rules, issues, and what has been read so far.</summary>
internal sealed class IntakeRun(IntakeOptions options, List<MappingRule> rules, IssueSink sink)
{
    public IntakeOptions Options { get; } = options;

    public List<MappingRule> Rules { get; } = rules;

    public IssueSink Sink { get; } = sink;

    public List<Lot> Lots { get; } = [];

    public List<RunningLot> RunningLots { get; } = [];

    /// <summary>Where each lot key (season, lot id) was first read, to report a second row of the same lot.</summary>
    public Dictionary<LotKey, SourceRef> LotKeys { get; } = [];

    /// <summary>Each lot's vessel by key, made at the first repeated lot (so a split tank can be named) and kept from then on.</summary>
    public Dictionary<LotKey, string?>? VesselsByKey { get; set; }

    /// <summary>Log readings in the order read, with the lot id and season they name; joined to lots at the end.</summary>
    public List<(string LotId, int? Season, LogReading Reading)> Readings { get; } = [];

    /// <summary>Readings still used per sheet row of a log with one column per lot, made when the join first leaves one out.</summary>
    public Dictionary<(string File, string? Sheet, int Row), int>? ReadingsLeftInRow { get; set; }

    public List<SourceAccount> Accounts { get; } = [];

    /// <summary>Lots sheets lacking only the final alcohol column, read last against <see cref="LabResults"/>.</summary>
    public List<SheetContext> AwaitingResults { get; } = [];

    /// <summary>Sheets of lab results kept apart from the lots (final alcohol by lot id, no strain or sugar).</summary>
    public List<SheetContext> LabSheets { get; } = [];

    /// <summary>The results read from <see cref="LabSheets"/>, in reading order.</summary>
    public List<LabResult> LabResults { get; } = [];

    /// <summary>Lot ids of rows that found no lab result (named as look-alikes of the results left over).</summary>
    public List<string> LotIdsWithoutResult { get; } = [];


    public List<HeaderMapping> Mappings { get; } = [];
}
