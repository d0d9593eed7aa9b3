using YieldBench.Core.Units;

namespace YieldBench.Core.Lots;

/// <summary>
/// A lot still fermenting, as the cellar records it before the end: what a lots table gives before there is a final
/// analysis. Read by intake with <c>IntakeOptions.RunningLots</c>; the in-season forecast uses it. Optional fields are
/// null when the cellar did not record them.
/// </summary>
public sealed record RunningLot
{
    /// <summary>The cellar's lot identifier, unique within a season.</summary>
    public required string LotId { get; init; }

    /// <summary>Season (vintage year).</summary>
    public required int Season { get; init; }

    /// <summary>Yeast strain code as recorded.</summary>
    public required string Strain { get; init; }

    /// <summary>Starting must sugar as measured, before any recorded addition.</summary>
    public required SugarReading StartingSugar { get; init; }

    /// <summary>The scale the starting sugar was recorded in.</summary>
    public SugarScale StartingSugarScale { get; init; } = SugarScale.Brix;

    /// <summary>Vessel type (tank, barrel, bin, concrete…).</summary>
    public string? Vessel { get; init; }

    /// <summary>Vessel capacity, L.</summary>
    public double? VesselCapacityL { get; init; }

    /// <summary>Grape variety.</summary>
    public string? Variety { get; init; }

    /// <summary>Colour style, where recorded.</summary>
    public WineColour Colour { get; init; } = WineColour.Unknown;

    /// <summary>Recorded pre-fermentation additions (the must volume among them).</summary>
    public Additions Additions { get; init; } = Additions.None;

    /// <summary>Yeast assimilable nitrogen of the must, mg N/L.</summary>
    public double? YanMgL { get; init; }

    /// <summary>Inoculation date and time.</summary>
    public DateTime? InoculationDate { get; init; }

    /// <summary>Free-text notes.</summary>
    public string? Notes { get; init; }

    /// <summary>Where the lot's row was read.</summary>
    public SourceRef? Source { get; init; }
}
