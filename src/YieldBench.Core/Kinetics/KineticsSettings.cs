using YieldBench.Core.Lots;

namespace YieldBench.Core.Kinetics;

/// <summary>
/// Temperature thresholds for one colour style, °C. Caution: the ferment is slowing and yeast are stressed;
/// danger: yeast die and the ferment may stop. Defaults are common practice (see docs/methods.md).
/// </summary>
/// <param name="CautionC">Caution threshold, °C.</param>
/// <param name="DangerC">Danger threshold, °C (above the caution threshold).</param>
public sealed record TemperatureThresholds(double CautionC, double DangerC);

/// <summary>
/// Settings of the kinetics and heat analysis. Every default and its source is in docs/methods.md.
/// </summary>
public sealed record KineticsSettings
{
    /// <summary>Default settings.</summary>
    public static KineticsSettings Default { get; } = new();

    /// <summary>
    /// The unit temperatures are written in inside the findings' sentences (°C by default; the review's --fahrenheit
    /// sets °F). Every value the analysis computes stays in °C.
    /// </summary>
    public Units.TemperatureUnit SentenceUnit { get; init; } = Units.TemperatureUnit.Celsius;

    /// <summary>°Brix at or below which a lot counts as dry on the hydrometer (default 0 °Brix, as the brief of the tool sets).</summary>
    public double DryBrix { get; init; }

    /// <summary>°Brix below the starting reading that marks the end of the lag when the sugar stays below it (default 1.0).</summary>
    public double LagDropBrix { get; init; } = 1.0;

    /// <summary>Width of the centred window of the local linear fit that gives the smoothed rate, h (default 12).</summary>
    public double SmoothingWindowHours { get; init; } = 12.0;

    /// <summary>A log whose median spacing between sugar readings is at or below this is dense probe data, h (default 2).</summary>
    public double DenseSpacingHours { get; init; } = 2.0;

    /// <summary>Thresholds for reds and lots of unrecorded colour (default 35 / 40 °C).</summary>
    public TemperatureThresholds RedThresholds { get; init; } = new(35.0, 40.0);

    /// <summary>Thresholds for whites and rosés (default 20 / 25 °C).</summary>
    public TemperatureThresholds WhiteThresholds { get; init; } = new(20.0, 25.0);

    /// <summary>Sluggish: mean rate below this over <see cref="SluggishHours"/>, °Brix/day (default 0.5: half the low end of a normal rate).</summary>
    public double SluggishRateBrixPerDay { get; init; } = 0.5;

    /// <summary>Sluggish rate threshold for whites and rosés, which run cooler and slower, °Brix/day (default 0.25).</summary>
    public double WhiteSluggishRateBrixPerDay { get; init; } = 0.25;

    /// <summary>Sluggish only while the sugar stays above this, °Brix (default 5).</summary>
    public double SluggishAboveBrix { get; init; } = 5.0;

    /// <summary>Window over which the sluggish rule is judged, h (default 48).</summary>
    public double SluggishHours { get; init; } = 48.0;

    /// <summary>Stuck: mean rate below this over <see cref="StuckHours"/>, °Brix/day (default 0.25).</summary>
    public double StuckRateBrixPerDay { get; init; } = 0.25;

    /// <summary>Stuck only while the sugar stays above this, °Brix (default 0, the dry reading).</summary>
    public double StuckAboveBrix { get; init; }

    /// <summary>Window over which the stuck rule is judged, h (default 72).</summary>
    public double StuckHours { get; init; } = 72.0;

    /// <summary>
    /// A stall counts as stalled-then-finished only when, after it, the sugar fell at least this fast over a window of
    /// <see cref="StuckHours"/> — the ferment came back to a normal pace — before it finished, °Brix/day (default 1.0,
    /// the low end of a normal white rate). A slow tail that only slows further is not a stall.
    /// </summary>
    public double RestartRateBrixPerDay { get; init; } = 1.0;

    /// <summary>Residual sugar above which the finished wine is not dry, g/L (default 4, the OIV limit for dry).</summary>
    public double DryResidualSugarGl { get; init; } = 4.0;

    /// <summary>Heat released per mole of hexose fermented, kJ/mol (default 100.4, Colombié et al. 2007).</summary>
    public double HeatOfFermentationKjPerMol { get; init; } = FermentationHeat.DefaultHeatOfFermentationKjPerMol;

    /// <summary>
    /// Specific heat capacity of the must, kJ/(kg·K), when fixed by the user; null (the default) takes it from the
    /// must's °Brix by <see cref="FermentationHeat.MustHeatCapacityKjPerKgK"/> (about 3.5–3.7 at 20–26 °Brix).
    /// </summary>
    public double? MustHeatCapacityKjPerKgK { get; init; }

    /// <summary>The must's specific heat at <paramref name="brix"/> °Brix, kJ/(kg·K): the fixed value when one is set, else from its composition.</summary>
    public double MustHeatCapacityAt(double brix) => MustHeatCapacityKjPerKgK ?? FermentationHeat.MustHeatCapacityKjPerKgK(brix);

    /// <summary>A sugar reading takes the temperature interpolated between temperature readings at most this far away, h (default 6).</summary>
    public double TemperaturePairingHours { get; init; } = 6.0;

    /// <summary>Fewest sugar readings for a sigmoid fit (default 6: three parameters and three degrees of freedom).</summary>
    public int MinReadingsForFit { get; init; } = 6;

    /// <summary>Least sugar consumed, °Brix, for a sigmoid fit (default 3).</summary>
    public double MinConsumedBrixForFit { get; init; } = 3.0;

    /// <summary>A reading more than this above the previous one is reported as a rise, °Brix (default 1.0).</summary>
    public double SugarRiseBrix { get; init; } = 1.0;

    /// <summary>The thresholds for a colour: whites and rosés use <see cref="WhiteThresholds"/>, all others <see cref="RedThresholds"/>.</summary>
    public TemperatureThresholds ThresholdsFor(WineColour colour) =>
        colour is WineColour.White or WineColour.Rose ? WhiteThresholds : RedThresholds;

    /// <summary>The sluggish rate threshold for a colour: whites and rosés use <see cref="WhiteSluggishRateBrixPerDay"/>.</summary>
    public double SluggishRateFor(WineColour colour) =>
        colour is WineColour.White or WineColour.Rose ? WhiteSluggishRateBrixPerDay : SluggishRateBrixPerDay;

    /// <summary>Problems with the settings, as sentences; empty when they are usable.</summary>
    public IReadOnlyList<string> Problems()
    {
        var p = new List<string>();
        void Positive(double v, string name)
        {
            if (!(v > 0) || double.IsInfinity(v))
            {
                p.Add($"{name} must be a positive number (it is {v.ToString(System.Globalization.CultureInfo.InvariantCulture)}).");
            }
        }

        Positive(LagDropBrix, nameof(LagDropBrix));
        Positive(SmoothingWindowHours, nameof(SmoothingWindowHours));
        Positive(DenseSpacingHours, nameof(DenseSpacingHours));
        Positive(SluggishRateBrixPerDay, nameof(SluggishRateBrixPerDay));
        Positive(WhiteSluggishRateBrixPerDay, nameof(WhiteSluggishRateBrixPerDay));
        Positive(SluggishHours, nameof(SluggishHours));
        Positive(StuckRateBrixPerDay, nameof(StuckRateBrixPerDay));
        Positive(StuckHours, nameof(StuckHours));
        Positive(HeatOfFermentationKjPerMol, nameof(HeatOfFermentationKjPerMol));
        if (MustHeatCapacityKjPerKgK is { } cp)
        {
            Positive(cp, nameof(MustHeatCapacityKjPerKgK));
        }

        Positive(RestartRateBrixPerDay, nameof(RestartRateBrixPerDay));
        Positive(TemperaturePairingHours, nameof(TemperaturePairingHours));
        Positive(MinConsumedBrixForFit, nameof(MinConsumedBrixForFit));
        Positive(SugarRiseBrix, nameof(SugarRiseBrix));
        if (MinReadingsForFit < 4)
        {
            p.Add("MinReadingsForFit must be at least 4 (three parameters need at least one degree of freedom).");
        }

        foreach (var (name, t) in new[] { (nameof(RedThresholds), RedThresholds), (nameof(WhiteThresholds), WhiteThresholds) })
        {
            if (!(t.DangerC > t.CautionC))
            {
                p.Add($"{name}: the danger threshold must be above the caution threshold.");
            }
        }

        return p;
    }
}
