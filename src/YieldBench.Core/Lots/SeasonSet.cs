namespace YieldBench.Core.Lots;

/// <summary>Everything intake produced: lots of all seasons, fermentation logs, and the intake record.</summary>
public sealed record SeasonSet
{
    /// <summary>Lots used.</summary>
    public required IReadOnlyList<Lot> Lots { get; init; }

    /// <summary>Lots still fermenting (read only with <c>IntakeOptions.RunningLots</c>; empty otherwise).</summary>
    public IReadOnlyList<RunningLot> RunningLots { get; init; } = [];

    /// <summary>Fermentation logs read (joined to lots by key).</summary>
    public IReadOnlyList<FermentationLog> Logs { get; init; } = [];

    /// <summary>Problems found while reading.</summary>
    public IReadOnlyList<IntakeIssue> Issues { get; init; } = [];

    /// <summary>Row accounting per file and sheet.</summary>
    public IReadOnlyList<SourceAccount> Accounts { get; init; } = [];

    /// <summary>Input files with their hashes.</summary>
    public IReadOnlyList<InputFile> Files { get; init; } = [];

    /// <summary>Header-to-field mappings used.</summary>
    public IReadOnlyList<HeaderMapping> Mappings { get; init; } = [];

    /// <summary>Distinct seasons, ascending.</summary>
    public IReadOnlyList<int> Seasons => Lots.Select(l => l.Season).Distinct().Order().ToArray();

    /// <summary>The log of a lot, or null.</summary>
    public FermentationLog? LogFor(Lot lot) =>
        Logs.FirstOrDefault(g => g.Season == lot.Season && g.LotId == lot.LotId)
        ?? Logs.FirstOrDefault(g => g.Season is null && g.LotId == lot.LotId);
}
