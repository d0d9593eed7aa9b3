namespace YieldBench.Core.HouseFactor;

/// <summary>A predicted alcohol with its two-sided prediction intervals (NaN bounds when the errors are too few).</summary>
/// <param name="Predicted">Point prediction, % v/v.</param>
/// <param name="Low80">Lower bound of the 80 % interval, % v/v.</param>
/// <param name="High80">Upper bound of the 80 % interval, % v/v.</param>
/// <param name="Low95">Lower bound of the 95 % interval, % v/v.</param>
/// <param name="High95">Upper bound of the 95 % interval, % v/v.</param>
/// <param name="ErrorCount">Held-out errors the intervals rest on.</param>
public sealed record AlcoholEstimate(double Predicted, double Low80, double High80, double Low95, double High95, int ErrorCount)
{
    /// <summary>The estimate at <paramref name="predicted"/> with the season-aware intervals of the held-out errors' model.</summary>
    public static AlcoholEstimate From(double predicted, SeasonErrorModel errors)
    {
        ArgumentNullException.ThrowIfNull(errors);
        var b80 = errors.Band(0.80);
        var b95 = errors.Band(0.95);
        return new AlcoholEstimate(predicted, predicted + b80.Low, predicted + b80.High, predicted + b95.Low, predicted + b95.High, errors.Count);
    }
}
