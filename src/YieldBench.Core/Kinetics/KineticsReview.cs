using YieldBench.Core.Lots;

namespace YieldBench.Core.Kinetics;

/// <summary>The result of the kinetics and heat analysis: one entry per lot with a log, per-strain summaries and findings.</summary>
public sealed record KineticsReview
{
    /// <summary>Lots that had a log, in the order of the lots given.</summary>
    public required IReadOnlyList<LotKinetics> Lots { get; init; }

    /// <summary>Per-strain summaries, ordered by strain code (ordinal).</summary>
    public required IReadOnlyList<StrainKinetics> Strains { get; init; }

    /// <summary>Everything worth reporting, per lot and for the logs as a whole, in a stable order.</summary>
    public required IReadOnlyList<KineticsFinding> Findings { get; init; }

    /// <summary>Logs that matched no lot (or several).</summary>
    public required IReadOnlyList<FermentationLog> LogsWithoutLot { get; init; }

    /// <summary>Keys of lots that had no log.</summary>
    public required IReadOnlyList<LotKey> LotsWithoutLog { get; init; }

    /// <summary>Settings used.</summary>
    public required KineticsSettings Settings { get; init; }
}

/// <summary>Something the analysis saw: a stall, a hot ferment, a timestamp problem, a fit that failed.</summary>
/// <param name="LotKey">The lot, or the key the log names when no lot matched (null when the log names no season).</param>
/// <param name="Code">Stable kebab-case code saying what was seen (e.g. <c>stuck</c>, <c>out-of-order-timestamp</c>).</param>
/// <param name="Message">A plain sentence with the values involved.</param>
/// <param name="Source">The log row involved, when one is.</param>
public sealed record KineticsFinding(LotKey? LotKey, string Code, string Message, SourceRef? Source = null)
{
    /// <summary>The log's name (<see cref="FermentationLog.Name"/>) for a finding about a log that matched no lot; else null.</summary>
    public string? LogName { get; init; }

    /// <summary>What the finding is about as reports write it: the log's name, else "season/lot".</summary>
    public string Subject => LogName ?? LotKey?.ToString() ?? string.Empty;
}

/// <summary>How the maximum rate was taken.</summary>
public enum RateMethod
{
    /// <summary>From the rates between consecutive readings (sparse logs).</summary>
    BetweenReadings,

    /// <summary>From the smoothed rate: a local linear fit over a centred window (dense probe logs).</summary>
    LocalLinearFit,
}

/// <summary>What one-third depletion is measured from.</summary>
public enum OneThirdBasis
{
    /// <summary>The lot's effective starting sugar as its record gives it (after additions).</summary>
    LotRecord,

    /// <summary>The log's first sugar reading (the lot record gave no usable starting sugar).</summary>
    FirstReading,
}

/// <summary>Where the analysis's time zero was taken.</summary>
public enum TimeOrigin
{
    /// <summary>The lot's recorded inoculation.</summary>
    Inoculation,

    /// <summary>The log's first sugar reading (no inoculation recorded).</summary>
    FirstReading,
}

/// <summary>A sugar reading after sorting and merging duplicates.</summary>
/// <param name="Time">Timestamp as logged.</param>
/// <param name="Hours">Hours since the analysis's time origin (negative before it).</param>
/// <param name="Brix">Sugar, °Brix.</param>
/// <param name="TemperatureC">Temperature at the reading (logged with it, or interpolated), °C; null when none is near.</param>
/// <param name="Reading">The log reading it comes from (the first, when readings of one time were merged).</param>
public readonly record struct SugarPoint(DateTime Time, double Hours, double Brix, double? TemperatureC, LogReading? Reading)
{
    /// <summary>The log row (made when asked).</summary>
    public SourceRef? Source => Reading?.Source;
}

/// <summary>A temperature reading after sorting and merging duplicates.</summary>
/// <param name="Time">Timestamp as logged.</param>
/// <param name="Hours">Hours since the analysis's time origin.</param>
/// <param name="Celsius">Temperature, °C.</param>
/// <param name="Reading">The log reading it comes from (the first, when readings of one time were merged).</param>
public readonly record struct TemperaturePoint(DateTime Time, double Hours, double Celsius, LogReading? Reading)
{
    /// <summary>The log row (made when asked).</summary>
    public SourceRef? Source => Reading?.Source;
}

/// <summary>The rate between two consecutive sugar readings, on the real time between them.</summary>
/// <param name="Start">Earlier reading's time.</param>
/// <param name="End">Later reading's time.</param>
/// <param name="ElapsedHours">Real elapsed time, h (&gt; 0).</param>
/// <param name="BrixStart">°Brix at the start.</param>
/// <param name="BrixEnd">°Brix at the end.</param>
public readonly record struct RateInterval(DateTime Start, DateTime End, double ElapsedHours, double BrixStart, double BrixEnd)
{
    /// <summary>Sugar consumption rate, °Brix/h (positive while sugar falls).</summary>
    public double BrixPerHour => (BrixStart - BrixEnd) / ElapsedHours;

    /// <summary>Sugar consumption rate, °Brix/day.</summary>
    public double BrixPerDay => BrixPerHour * 24.0;

    /// <summary>Middle of the interval, where its rate is placed.</summary>
    public DateTime Midpoint => Start + TimeSpan.FromTicks((End - Start).Ticks / 2);
}

/// <summary>The smoothed rate at a reading: minus the slope of a least-squares line through the readings within the window.</summary>
/// <param name="Time">Reading time.</param>
/// <param name="Brix">°Brix at the reading.</param>
/// <param name="BrixPerDay">Smoothed rate, °Brix/day (positive while sugar falls); null when the window held fewer than 3 readings.</param>
public readonly record struct SmoothedRate(DateTime Time, double Brix, double? BrixPerDay);

/// <summary>A stretch of the log where the mean rate stayed below a threshold with the sugar above a threshold.</summary>
/// <param name="Start">Window start.</param>
/// <param name="End">Window end (a reading).</param>
/// <param name="BrixStart">°Brix at the start (interpolated).</param>
/// <param name="BrixEnd">°Brix at the end.</param>
/// <param name="MeanRateBrixPerDay">Mean rate over the window, °Brix/day.</param>
public sealed record StallEpisode(DateTime Start, DateTime End, double BrixStart, double BrixEnd, double MeanRateBrixPerDay);

/// <summary>The heat the remaining sugar could still release, at one sugar reading with a temperature.</summary>
/// <param name="Time">Reading time.</param>
/// <param name="Brix">°Brix.</param>
/// <param name="TemperatureC">Observed temperature, °C.</param>
/// <param name="SugarGl">Fermentable sugar remaining by the OIV table, g/L.</param>
/// <param name="PotentialRiseK">Adiabatic rise if that sugar fermented with no heat removed, K.</param>
public readonly record struct HeatPoint(DateTime Time, double Brix, double TemperatureC, double SugarGl, double PotentialRiseK)
{
    /// <summary>Temperature reachable without cooling, °C.</summary>
    public double PotentialTemperatureC => TemperatureC + PotentialRiseK;
}

/// <summary>Per-lot kinetics and heat. Times in hours are from <see cref="Origin"/>; null means "not reached" or "not measurable".</summary>
public sealed record LotKinetics
{
    /// <summary>The lot's key.</summary>
    public required LotKey LotKey { get; init; }

    /// <summary>The lot.</summary>
    public required Lot Lot { get; init; }

    /// <summary>Thresholds applied (by colour).</summary>
    public required TemperatureThresholds Thresholds { get; init; }

    /// <summary>The settings the lot was analysed with (the smoothing window and heat constants the series below are made with).</summary>
    public required KineticsSettings Settings { get; init; }

    /// <summary>Time zero.</summary>
    public required DateTime Origin { get; init; }

    /// <summary>Where time zero came from.</summary>
    public required TimeOrigin OriginKind { get; init; }

    /// <summary>Sugar readings, sorted, duplicates merged.</summary>
    public required IReadOnlyList<SugarPoint> Sugar { get; init; }

    /// <summary>Temperature readings, sorted, duplicates merged.</summary>
    public required IReadOnlyList<TemperaturePoint> Temperatures { get; init; }

    /// <summary>
    /// Rates between consecutive sugar readings, made from <see cref="Sugar"/> on each call (not held: at 100,000 lots
    /// the held per-reading series were a large part of the review's memory).
    /// </summary>
    public IReadOnlyList<RateInterval> Rates => LotAnalysis.RatesBetween(Sugar);

    /// <summary>
    /// Smoothed rates at each sugar reading (local linear fit over <see cref="KineticsSettings.SmoothingWindowHours"/>),
    /// made from <see cref="Sugar"/> on each call.
    /// </summary>
    public IReadOnlyList<SmoothedRate> SmoothedRates => LotAnalysis.SmoothedRates(Sugar, Settings.SmoothingWindowHours);

    /// <summary>True when the log is dense probe data (median spacing at or below the setting).</summary>
    public required bool Dense { get; init; }

    /// <summary>Median spacing between sugar readings, h; null with fewer than two.</summary>
    public double? MedianSpacingHours { get; init; }

    /// <summary>Which rate the maximum was taken from.</summary>
    public required RateMethod MaxRateMethod { get; init; }

    /// <summary>Maximum rate, °Brix/day.</summary>
    public double? MaxRateBrixPerDay { get; init; }

    /// <summary>When the maximum rate occurred (interval midpoint or reading time).</summary>
    public DateTime? MaxRateAt { get; init; }

    /// <summary>Starting sugar: the first sugar reading, °Brix.</summary>
    public required double StartingBrix { get; init; }

    /// <summary>The lot's effective starting sugar (after additions) as its record gives it, °Brix; null when not usable.</summary>
    public double? LotStartingBrix { get; init; }

    /// <summary>Lag, h: from the origin to the first time the sugar falls <see cref="KineticsSettings.LagDropBrix"/> below the start and stays there.</summary>
    public double? LagHours { get; init; }

    /// <summary>When the lag ended.</summary>
    public DateTime? LagEnd { get; init; }

    /// <summary>What one-third depletion is measured from: the lot's recorded starting sugar, or (without one) the first reading.</summary>
    public required OneThirdBasis OneThirdBasis { get; init; }

    /// <summary>
    /// °Brix at which one-third of the starting sugar is gone (two-thirds of the start), the start being the lot's
    /// effective starting sugar from its record (<see cref="OneThirdBasis"/>).
    /// </summary>
    public required double OneThirdBrix { get; init; }

    /// <summary>When one-third of the starting sugar was gone (interpolated; the first reading's time when it was already lower).</summary>
    public DateTime? OneThirdAt { get; init; }

    /// <summary>Hours from the origin to one-third depletion.</summary>
    public double? OneThirdHours { get; init; }

    /// <summary>°Brix at which one-third of the first reading is gone (the earlier basis, kept for comparison).</summary>
    public required double OneThirdFirstReadingBrix { get; init; }

    /// <summary>When one-third of the first reading was gone (interpolated).</summary>
    public DateTime? OneThirdFirstReadingAt { get; init; }

    /// <summary>Hours from the origin to one-third of the first reading gone.</summary>
    public double? OneThirdFirstReadingHours { get; init; }

    /// <summary>When the sugar first reached the dry reading (interpolated); null when not reached.</summary>
    public DateTime? DryAt { get; init; }

    /// <summary>Hours from the origin to dryness.</summary>
    public double? HoursToDry { get; init; }

    /// <summary>Days from the origin to dryness.</summary>
    public double? DaysToDry => HoursToDry / 24.0;

    /// <summary>Hours from the origin to the last sugar reading.</summary>
    public required double DurationHours { get; init; }

    /// <summary>°Brix at the last reading.</summary>
    public required double FinalBrix { get; init; }

    /// <summary>Highest temperature logged, °C.</summary>
    public double? PeakTemperatureC { get; init; }

    /// <summary>When the peak was logged.</summary>
    public DateTime? PeakTemperatureAt { get; init; }

    /// <summary>Hours above the caution threshold (piecewise-linear between readings).</summary>
    public required double HoursAboveCaution { get; init; }

    /// <summary>Hours above the danger threshold.</summary>
    public required double HoursAboveDanger { get; init; }

    /// <summary>The first sluggish stretch, if any.</summary>
    public StallEpisode? Sluggish { get; init; }

    /// <summary>
    /// The first stretch meeting the stuck rule, when the lot did not finish afterwards: the log never reached the dry
    /// reading after it, and the lab's residual sugar (where recorded) is above the dry limit.
    /// </summary>
    public StallEpisode? Stuck { get; init; }

    /// <summary>
    /// A stretch meeting the stuck rule after which the ferment picked up again at a normal pace
    /// (<see cref="KineticsSettings.RestartRateBrixPerDay"/>) and the lot finished (dry later in the log, or a dry lab
    /// residual sugar). A slow end that only slowed further is neither this nor stuck.
    /// </summary>
    public StallEpisode? StalledThenFinished { get; init; }

    /// <summary>Heat potential at every sugar reading with a temperature, made from <see cref="Sugar"/> on each call.</summary>
    public IReadOnlyList<HeatPoint> Heat => LotAnalysis.HeatPoints(Sugar, Settings);

    /// <summary>Sugar readings at which the temperature reachable without cooling passes the danger threshold.</summary>
    public required int ReadingsWithPotentialAboveDanger { get; init; }

    /// <summary>The reading with the highest temperature reachable without cooling.</summary>
    public HeatPoint? PotentialPeak { get; init; }

    /// <summary>Potential peak minus observed peak, K: what the vessel, cap management and cooling took away.</summary>
    public double? HeatRemovedK { get; init; }

    /// <summary>Modified Gompertz fit (Zwietering et al. 1990) of sugar consumed against time.</summary>
    public required SigmoidFitResult Gompertz { get; init; }

    /// <summary>Modified logistic fit (Zwietering et al. 1990).</summary>
    public required SigmoidFitResult Logistic { get; init; }

    /// <summary>
    /// Flag codes for this lot (e.g. <c>stuck</c>, <c>above-danger-temp</c>), in <see cref="KineticsAnalysis.FlagOrder"/>.
    /// The heat potential is reported as a finding and in <see cref="ReadingsWithPotentialAboveDanger"/>, not as a flag.
    /// </summary>
    public required IReadOnlyList<string> Flags { get; init; }

    /// <summary>True when the lot needs a look (any flag).</summary>
    public bool Flagged => Flags.Count > 0;
}

/// <summary>Median and interquartile spread of one metric across a strain's lots.</summary>
/// <param name="N">Lots with a value.</param>
/// <param name="Median">Median (NaN when N = 0).</param>
/// <param name="Q1">First quartile, Hyndman–Fan type 7.</param>
/// <param name="Q3">Third quartile, type 7.</param>
public sealed record MetricSummary(int N, double Median, double Q1, double Q3)
{
    /// <summary>Interquartile range.</summary>
    public double Iqr => Q3 - Q1;
}

/// <summary>Kinetics of one strain across its lots with logs.</summary>
public sealed record StrainKinetics
{
    /// <summary>Strain code.</summary>
    public required string Strain { get; init; }

    /// <summary>Lots of the strain with a log.</summary>
    public required int Lots { get; init; }

    /// <summary>Maximum rate, °Brix/day.</summary>
    public required MetricSummary MaxRateBrixPerDay { get; init; }

    /// <summary>Lag, h.</summary>
    public required MetricSummary LagHours { get; init; }

    /// <summary>Days to dryness (lots that reached it).</summary>
    public required MetricSummary DaysToDry { get; init; }

    /// <summary>Peak temperature, °C.</summary>
    public required MetricSummary PeakTemperatureC { get; init; }

    /// <summary>Lots with a sluggish stretch.</summary>
    public required int SluggishLots { get; init; }

    /// <summary>Lots with a stuck stretch.</summary>
    public required int StuckLots { get; init; }

    /// <summary>Share of lots sluggish (0–1).</summary>
    public double SluggishShare => Lots == 0 ? double.NaN : (double)SluggishLots / Lots;

    /// <summary>Share of lots stuck (0–1).</summary>
    public double StuckShare => Lots == 0 ? double.NaN : (double)StuckLots / Lots;
}
