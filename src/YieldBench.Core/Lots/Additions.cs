namespace YieldBench.Core.Lots;

/// <summary>
/// Pre-fermentation additions recorded for a lot. Volumes in litres, sugar in kilograms of sucrose.
/// </summary>
/// <param name="MustVolumeL">Must volume before any addition, L.</param>
/// <param name="WaterAddedL">Water added before fermentation (add-back), L.</param>
/// <param name="SugarAddedKg">Sucrose added before fermentation (chaptalization), kg.</param>
public sealed record Additions(double? MustVolumeL, double? WaterAddedL, double? SugarAddedKg)
{
    /// <summary>No additions recorded.</summary>
    public static Additions None { get; } = new(null, null, null);

    /// <summary>True when water or sugar was recorded as added.</summary>
    public bool Any => (WaterAddedL ?? 0) > 0 || (SugarAddedKg ?? 0) > 0;
}
