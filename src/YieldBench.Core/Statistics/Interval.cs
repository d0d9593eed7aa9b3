namespace YieldBench.Core.Statistics;

/// <summary>A confidence interval at a stated level (e.g. 0.95), in the unit of the estimate.</summary>
/// <param name="Low">Lower end.</param>
/// <param name="High">Upper end.</param>
/// <param name="Level">Nominal coverage, in (0, 1).</param>
public readonly record struct Interval(double Low, double High, double Level)
{
    /// <summary>An interval that could not be formed (too few values): both ends NaN.</summary>
    public static Interval Undefined(double level) => new(double.NaN, double.NaN, level);

    /// <summary>True when both ends are numbers.</summary>
    public bool IsDefined => !double.IsNaN(Low) && !double.IsNaN(High);

    /// <summary>True when the interval holds the value.</summary>
    public bool Contains(double value) => IsDefined && value >= Low && value <= High;

    /// <summary>Width High − Low.</summary>
    public double Width => High - Low;
}
