namespace YieldBench.Core.Units;

/// <summary>
/// A sugar value exactly as the cellar recorded it: the number written down and the scale it was written on (1.095 SG,
/// 24.1 °Brix). Reports show it as written instead of converting the °Brix reading back; the reading itself is
/// <see cref="Reading"/>.
/// </summary>
/// <param name="Value">The number as written.</param>
/// <param name="Scale">The scale it was written on.</param>
public readonly record struct RecordedSugar(double Value, SugarScale Scale)
{
    /// <summary>The reading this value is on its scale (throws when the value is outside the scale's accepted range).</summary>
    public SugarReading Reading => SugarReading.From(Value, Scale);

    /// <summary>The scale's label (<see cref="SugarScales.Label"/>).</summary>
    public string Label => SugarScales.Label(Scale);

    /// <inheritdoc />
    public override string ToString() => Check.Format(Value) + " " + Label;
}
