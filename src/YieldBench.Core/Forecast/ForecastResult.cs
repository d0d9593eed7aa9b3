namespace YieldBench.Core.Forecast;

/// <summary>A forecast quantity: the median and the central interval (hours from the lot's origin, or °C).</summary>
/// <param name="Median">Median.</param>
/// <param name="Low">Lower end of the interval.</param>
/// <param name="High">Upper end, or +∞ when more than the upper tail's share may never reach it.</param>
public readonly record struct ForecastValue(double Median, double Low, double High)
{
    /// <summary>True when the interval holds <paramref name="truth"/>.</summary>
    public bool Covers(double truth) => truth >= Low && truth <= High;
}

/// <summary>The forecast of one running lot.</summary>
public sealed record LotForecast
{
    /// <summary>The course the forecast was made from.</summary>
    public required LotCourse Course { get; init; }

    /// <summary>Sugar readings used.</summary>
    public int ReadingsUsed => Course.SugarHours.Length;

    /// <summary>True when the strain has a prior of its own; false when the pooled prior of all strains stood in.</summary>
    public required bool OwnStrainPrior { get; init; }

    /// <summary>Past lots of the strain the prior rests on.</summary>
    public required int StrainLots { get; init; }

    /// <summary>The one-third depletion level, °Brix.</summary>
    public required double OneThirdBrix { get; init; }

    /// <summary>Hours to one-third depletion, or null when the interval cannot be formed.</summary>
    public required ForecastValue? OneThirdHours { get; init; }

    /// <summary>True when the readings already passed the one-third level.</summary>
    public required bool OneThirdPassed { get; init; }

    /// <summary>Hours to the dry reading; the median or high end is +∞ when the lot may never get there.</summary>
    public required ForecastValue? DryHours { get; init; }

    /// <summary>
    /// True when the readings already reached the dry reading: <see cref="DryHours"/> is then when they crossed it, the
    /// chance of a stuck end is 0, and what is left to say is to confirm it with a lab analysis.
    /// </summary>
    public bool DryReached { get; init; }

    /// <summary>The dry reading, °Brix (the kinetics setting the forecast used).</summary>
    public double DryBrix { get; init; }

    /// <summary>Chance the lot never reaches the dry reading.</summary>
    public required double NeverDryChance { get; init; }

    /// <summary>Highest logged temperature to come, °C (at least the highest so far), or null without temperatures or a temperature model.</summary>
    public required ForecastValue? PeakC { get; init; }

    /// <summary>
    /// Hours (from the origin) of the warmest reading when the peak is behind the lot: the forecast puts nothing warmer to
    /// come and a later reading is already cooler. Null while the peak is ahead (or at the last reading), or without temperatures.
    /// </summary>
    public double? PeakPassedHours { get; init; }

    /// <summary>Temperature reachable with no heat removed from the last reading on, °C, or null without a temperature.</summary>
    public required double? ReachableC { get; init; }

    /// <summary>Heat released at the forecast peak rate, kW (what cooling must remove to hold the temperature there), or null without a volume.</summary>
    public required double? CoolingKw { get; init; }

    /// <summary>Where the hydrometer is expected to settle, °Brix (posterior mean of F).</summary>
    public required double SettlesAtBrix { get; init; }

    /// <summary>Forecast peak consumption rate, °Brix/day (posterior mean).</summary>
    public required double PeakRateBrixPerDay { get; init; }

    /// <summary>Chance of a sluggish or stuck end: never dry, or dry later than the strain's slowest past lot.</summary>
    public required double StuckRisk { get; init; }

    /// <summary>Hours (from the origin) at which the next reading would most narrow the forecast.</summary>
    public required double NextReadingHours { get; init; }

    /// <summary>What the next reading would narrow: "one-third" or "dryness".</summary>
    public required string NextReadingFor { get; init; }

    /// <summary>Hours of "now": the last reading of all the running lots (no clock is read).</summary>
    public required double NowHours { get; init; }

    /// <summary>Posterior mean season shift δ of the lots running together (log time scale; positive runs faster).</summary>
    public required double SeasonShift { get; init; }

    /// <summary>Forecast course for the chart: hours, sugar median and interval, temperature median and interval, reachable temperature.</summary>
    public required ForecastCurve Curve { get; init; }

    /// <summary>Danger threshold of the lot's colour, °C.</summary>
    public required double DangerC { get; init; }

    /// <summary>Caution threshold of the lot's colour, °C.</summary>
    public required double CautionC { get; init; }

    /// <summary>Effective heat removal of the vessel group in the history, 1/h, or null.</summary>
    public double? CoolingCoefficientPerHour { get; init; }
}

/// <summary>Forecast sugar and temperature courses on a time grid (hours from the origin), for charts.</summary>
public sealed record ForecastCurve(
    double[] Hours,
    double[] BrixMedian,
    double[] BrixLow,
    double[] BrixHigh,
    double[] TempMedian,
    double[] TempLow,
    double[] TempHigh,
    double[] ReachableC);
