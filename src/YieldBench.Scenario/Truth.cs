using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Scenario;

/// <summary>What really happened to a lot, behind what the cellar recorded.</summary>
public sealed record LotTruth
{
    /// <summary>The strain that really fermented the lot (differs from the recorded one for a mislabelled lot).</summary>
    public required string Strain { get; init; }

    /// <summary>True mean starting sugar of the must before any addition, °Brix.</summary>
    public required double StartingBrix { get; init; }

    /// <summary>True starting sugar after every addition, recorded or not, °Brix.</summary>
    public required double EffectiveBrix { get; init; }

    /// <summary>Water really added, L (includes an unrecorded addition).</summary>
    public required double WaterAddedL { get; init; }

    /// <summary>Sucrose really added, kg.</summary>
    public required double SugarAddedKg { get; init; }

    /// <summary>True residual sugar, g/L.</summary>
    public required double ResidualSugarGl { get; init; }

    /// <summary>True alcohol before lab error, % v/v.</summary>
    public required double Abv { get; init; }

    /// <summary>Lag of the sugar curve (Zwietering λ), h after inoculation.</summary>
    public required double LagHours { get; init; }

    /// <summary>Maximum consumption rate (Zwietering μm), °Brix/h.</summary>
    public required double MaxRateBrixPerHour { get; init; }

    /// <summary>°Brix the ferment levels off at (about −1.5 to −2 °Brix for a dry wine read by hydrometer).</summary>
    public required double FinalBrix { get; init; }

    /// <summary>Temperature at inoculation, °C.</summary>
    public required double StartTempC { get; init; }

    /// <summary>Peak temperature the ferment was driven to, °C, before reading noise.</summary>
    public required double PeakTempC { get; init; }

    /// <summary>Hours from inoculation until the curve reads 0 °Brix, or null when it never does (stuck).</summary>
    public required double? HoursToZeroBrix { get; init; }
}

/// <summary>One lot as the scenario made it: the row the cellar wrote, the truth behind it and its log, if kept.</summary>
public sealed record GeneratedLot
{
    /// <summary>The lot as recorded (what the demo files hold), as a Core lot.</summary>
    public required Lot Recorded { get; init; }

    /// <summary>The recorded starting sugar in the season's scale, rounded as the cellar wrote it.</summary>
    public required double RecordedStartingValue { get; init; }

    /// <summary>The scale of <see cref="RecordedStartingValue"/>.</summary>
    public required SugarScale RecordedScale { get; init; }

    /// <summary>What really happened.</summary>
    public required LotTruth Truth { get; init; }

    /// <summary>The lot's fermentation log, or null when none was kept.</summary>
    public FermentationLog? Log { get; init; }

    /// <summary>The log's sugar readings as written in the files (the season's scale, rounded as recorded), in reading order.</summary>
    public IReadOnlyList<double>? LogRecordedSugar { get; init; }

    /// <summary>True when the log is a probe's dense record (every 15 minutes) kept on its own sheet.</summary>
    public bool LogIsProbe { get; init; }
}

/// <summary>The kinds of planted case.</summary>
public enum PlantedKind
{
    /// <summary>Water was added before fermentation but not recorded: the recorded starting sugar is too high.</summary>
    UnrecordedWater,

    /// <summary>The ferment stopped early with high residual sugar.</summary>
    StuckFerment,

    /// <summary>Two digits of the starting sugar were swapped when it was written down.</summary>
    TransposedDigits,

    /// <summary>The starting sugar was sampled before soak-up (skins still releasing sugar): it reads too low.</summary>
    UnderReadStartingSugar,

    /// <summary>Cooling failed and the ferment ran far above the red danger temperature.</summary>
    OverheatedFerment,

    /// <summary>The lot was recorded under the wrong strain.</summary>
    MislabelledStrain,

    /// <summary>A control: a lot with a correctly recorded addition that the tool should correct for, not flag.</summary>
    RecordedAdditionControl,
}

/// <summary>
/// A planted case: which lot, what was done, the numbers that make it detectable, and the flag codes a correct
/// review is expected to raise on it (any one of <see cref="ExpectedCodes"/> counts; an empty list means none).
/// </summary>
/// <param name="Kind">What was planted.</param>
/// <param name="Season">Season of the lot.</param>
/// <param name="LotId">Lot id as recorded.</param>
/// <param name="ExpectedCodes">Lot-flag codes of the statistics review that detect the case; empty for kinetics-only cases and controls.</param>
/// <param name="ExpectedFinding">What a correct review shows, in words (kinetics findings are described here).</param>
/// <param name="Quantity">The quantity the signature is about, with its unit.</param>
/// <param name="RecordedValue">The value in the files.</param>
/// <param name="TrueValue">The value behind it.</param>
public sealed record PlantedCase(
    PlantedKind Kind,
    int Season,
    string LotId,
    IReadOnlyList<string> ExpectedCodes,
    string ExpectedFinding,
    string Quantity,
    double RecordedValue,
    double TrueValue)
{
    /// <summary>The planted lot's key, matching <see cref="Lot.Key"/>.</summary>
    public LotKey Key => new(Season, LotId);

    /// <summary>Finding codes of the kinetics review that detect the case (all are expected); empty when none.</summary>
    public IReadOnlyList<string> ExpectedKineticsCodes { get; init; } = [];
}

/// <summary>One generated season.</summary>
/// <param name="Profile">The season's character.</param>
/// <param name="Lots">Its lots in lot-id order.</param>
public sealed record GeneratedSeason(SeasonProfile Profile, IReadOnlyList<GeneratedLot> Lots);

/// <summary>A whole generated scenario and its truth.</summary>
public sealed record ScenarioData
{
    /// <summary>The invented estate's name.</summary>
    public required string EstateName { get; init; }

    /// <summary>Seed the scenario was generated with.</summary>
    public required ulong Seed { get; init; }

    /// <summary>Seasons in ascending order.</summary>
    public required IReadOnlyList<GeneratedSeason> Seasons { get; init; }

    /// <summary>The strains with their true behaviour.</summary>
    public required IReadOnlyList<StrainProfile> Strains { get; init; }

    /// <summary>The vessels.</summary>
    public required IReadOnlyList<VesselProfile> Vessels { get; init; }

    /// <summary>The planted cases (empty for a scale scenario without them).</summary>
    public required IReadOnlyList<PlantedCase> PlantedCases { get; init; }

    /// <summary>The next season's harvest in progress (lots still fermenting, logs up to "now"), or null.</summary>
    public HarvestInProgress? Running { get; init; }

    /// <summary>Every lot of every season in order.</summary>
    public IEnumerable<GeneratedLot> AllLots => Seasons.SelectMany(s => s.Lots);

    /// <summary>The true conversion factor of each strain at <paramref name="brix"/> °Brix (dry, no vessel loss), % v/v per °Brix.</summary>
    public IReadOnlyDictionary<string, double> TrueFactorsAt(double brix) =>
        Strains.ToDictionary(s => s.Code, s => s.TrueFactorAt(brix), StringComparer.Ordinal);

    /// <summary>The recorded lots and logs as a Core season set, as a perfect intake would produce them.</summary>
    public SeasonSet ToSeasonSet() => new()
    {
        Lots = AllLots.Select(l => l.Recorded).ToArray(),
        Logs = AllLots.Where(l => l.Log is not null).Select(l => l.Log!).ToArray(),
    };
}
