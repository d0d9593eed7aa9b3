namespace YieldBench.Intake;

/// <summary>
/// Settings for <see cref="IntakeReader.Read"/>. Every member is optional; the defaults are documented in
/// docs/input-format.md ("Limits").
/// </summary>
public sealed record IntakeOptions
{
    /// <summary>Default largest input file accepted, bytes (200 MiB).</summary>
    public const long DefaultMaxFileBytes = 200L * 1024 * 1024;

    /// <summary>Default largest number of rows read from one sheet or CSV file.</summary>
    public const int DefaultMaxRows = 1_000_000;

    /// <summary>Default largest ratio of uncompressed to compressed size of a workbook's zip entries.</summary>
    public const double DefaultMaxCompressionRatio = 200.0;

    /// <summary>Default largest total uncompressed size of a workbook's zip entries, bytes (2 GiB).</summary>
    public const long DefaultMaxUncompressedBytes = 2L * 1024 * 1024 * 1024;

    /// <summary>Explicit column mappings, each "FIELD=HEADER" (e.g. "strain=Levure"), as given by <c>--column</c>.</summary>
    public IReadOnlyList<string> ColumnMappings { get; init; } = [];

    /// <summary>A column-mapping file (one "FIELD = HEADER" a line, '#' comments), or null.</summary>
    public string? MappingFile { get; init; }

    /// <summary>Season (vintage year) used when neither a column, the sheet name nor the file name gives one.</summary>
    public int? Season { get; init; }

    /// <summary>Largest input file accepted, bytes.</summary>
    public long MaxFileBytes { get; init; } = DefaultMaxFileBytes;

    /// <summary>Largest number of rows read from one sheet or CSV file; a larger sheet is refused whole.</summary>
    public int MaxRows { get; init; } = DefaultMaxRows;

    /// <summary>Largest ratio of uncompressed to compressed size of a workbook, from its zip central directory.</summary>
    public double MaxCompressionRatio { get; init; } = DefaultMaxCompressionRatio;

    /// <summary>Largest total uncompressed size of a workbook, bytes.</summary>
    public long MaxUncompressedBytes { get; init; } = DefaultMaxUncompressedBytes;

    /// <summary>
    /// When true, lots tables hold lots still fermenting: they need no final alcohol, their rows become
    /// <see cref="YieldBench.Core.Lots.RunningLot"/>s (in <see cref="YieldBench.Core.Lots.SeasonSet.RunningLots"/>), and
    /// columns of the final analysis are reported as not used. Logs are read as always.
    /// </summary>
    public bool RunningLots { get; init; }

    /// <summary>Directory relative paths are resolved against (null: the process's current directory).</summary>
    public string? WorkingDirectory { get; init; }
}
