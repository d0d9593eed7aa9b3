namespace YieldBench.Core.Lots;

/// <summary>Colour style of a lot, where recorded; it sets temperature-threshold defaults (whites run cooler).</summary>
public enum WineColour
{
    /// <summary>Not recorded.</summary>
    Unknown,

    /// <summary>Red (fermented on skins).</summary>
    Red,

    /// <summary>White.</summary>
    White,

    /// <summary>Rosé.</summary>
    Rose,
}
