using YieldBench.Core.Units;

namespace YieldBench.Core.Lots;

/// <summary>
/// One finished lot as recorded by the cellar: its starting must sugar (before additions), strain, vessel, additions
/// and the lab's final analysis. Optional fields are null when the cellar did not record them.
/// </summary>
public sealed record Lot
{
    /// <summary>The cellar's lot identifier, unique within a season.</summary>
    public required string LotId { get; init; }

    /// <summary>Season (vintage year).</summary>
    public required int Season { get; init; }

    /// <summary>Yeast strain code as recorded.</summary>
    public required string Strain { get; init; }

    private readonly RecordedSugar? _recordedStartingSugar;

    /// <summary>Starting must sugar as measured, before any recorded addition.</summary>
    public required SugarReading StartingSugar { get; init; }

    /// <summary>
    /// The starting sugar as the cellar recorded it: the number written and its scale (what intake read from the cell).
    /// A lot made without it reads as <see cref="StartingSugar"/> in °Brix.
    /// </summary>
    public RecordedSugar RecordedStartingSugar
    {
        get => _recordedStartingSugar ?? new RecordedSugar(StartingSugar.Brix, SugarScale.Brix);
        init => _recordedStartingSugar = value;
    }

    /// <summary>The scale the starting sugar was recorded in (that of <see cref="RecordedStartingSugar"/>).</summary>
    public SugarScale StartingSugarScale => RecordedStartingSugar.Scale;

    /// <summary>The lab's final alcohol.</summary>
    public required AlcoholContent FinalAlcohol { get; init; }

    /// <summary>Vessel type (tank, barrel, bin, concrete…).</summary>
    public string? Vessel { get; init; }

    /// <summary>Vessel capacity, L.</summary>
    public double? VesselCapacityL { get; init; }

    /// <summary>Grape variety.</summary>
    public string? Variety { get; init; }

    /// <summary>Vineyard block.</summary>
    public string? Block { get; init; }

    /// <summary>Colour style, where recorded.</summary>
    public WineColour Colour { get; init; } = WineColour.Unknown;

    /// <summary>Recorded pre-fermentation additions.</summary>
    public Additions Additions { get; init; } = Additions.None;

    /// <summary>Residual sugar (glucose + fructose) of the finished wine, g/L.</summary>
    public double? ResidualSugarGl { get; init; }

    /// <summary>Final sugar reading (hydrometer °Brix or density) of the finished wine.</summary>
    public SugarReading? FinalSugar { get; init; }

    /// <summary>Yeast assimilable nitrogen of the must, mg N/L.</summary>
    public double? YanMgL { get; init; }

    /// <summary>Must pH.</summary>
    public double? Ph { get; init; }

    /// <summary>Must titratable acidity, g/L.</summary>
    public double? TaGl { get; init; }

    /// <summary>Mean fermentation temperature, °C.</summary>
    public double? MeanFermentationTempC { get; init; }

    /// <summary>Peak fermentation temperature, °C.</summary>
    public double? PeakFermentationTempC { get; init; }

    /// <summary>Inoculation date and time.</summary>
    public DateTime? InoculationDate { get; init; }

    /// <summary>Date the lot was declared dry.</summary>
    public DateTime? DryDate { get; init; }

    /// <summary>Free-text notes.</summary>
    public string? Notes { get; init; }

    /// <summary>Where the lot's row was read.</summary>
    public SourceRef? Source { get; init; }

    /// <summary>The lot's identity across seasons (season, lot id).</summary>
    public LotKey Key => new(Season, LotId);
}
