using YieldBench.Core.HouseFactor;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Review.Strains;

namespace YieldBench.Core.Review;

/// <summary>The review's plain words that every renderer prints the same way, kept in one place so tests can assert them.</summary>
public static class ReviewTexts
{
    /// <summary>Cautions printed on the console, on the overview and on the methods sheet.</summary>
    public static IReadOnlyList<string> Cautions { get; } =
    [
        .. HouseFactorTexts.PlannerCautions,
        HeatCaution + "; the kinetics sheet shows how far without cooling. Follow the cellar's cooling practice and local codes.",
        "Flags mark lots worth a second look, not errors proven: confirm with the cellar records and the lab before changing anything.",
    ];

    /// <summary>
    /// <see cref="Cautions"/> for a review that read no fermentation log: the heat caution stands, but there is no
    /// kinetics sheet to point to; it points to the logs that would show it instead.
    /// </summary>
    public static IReadOnlyList<string> CautionsWithoutLogs { get; } =
    [
        .. Cautions.Select(c => c.StartsWith(HeatCaution, StringComparison.Ordinal)
            ? HeatCaution + ". This review read no fermentation log; with the cellar's logs the kinetics sheet would show how far without cooling. Follow the cellar's cooling practice and local codes."
            : c),
    ];

    private const string HeatCaution = "Fermentation heat: a must can warm far beyond its current temperature as its remaining sugar ferments";

    /// <summary>Plain name of a severity, as data/flags.csv writes it.</summary>
    public static string Severity(FlagSeverity severity) => severity switch
    {
        FlagSeverity.Note => "note",
        FlagSeverity.Check => "check",
        FlagSeverity.LikelyError => "likely error",
        _ => severity.ToString(),
    };

    /// <summary>A flag code in plain words (strain review and kinetics codes); an unknown code as it is.</summary>
    public static string FlagName(string code) => code switch
    {
        FlagCodes.HighFactor => "high factor for its strain",
        FlagCodes.LowFactor => "low factor for its strain",
        FlagCodes.OutsideTukeyFence => "factor outside its strain's usual range",
        FlagCodes.FarOutsideTukeyFence => "factor far outside its strain's usual range",
        FlagCodes.OffStrainLine => "alcohol off its strain's line for its sugar",
        FlagCodes.AboveTheoreticalYield => "more alcohol than its sugar can give",
        FlagCodes.ImplausibleFactor => "factor outside the plausible range",
        FlagCodes.NotDry => "not dry",
        FlagCodes.SeasonDrift => "strain drifted this season",
        FlagCodes.PossibleTransposedDigits => "starting sugar may have two digits swapped",
        FlagCodes.PossibleUnrecordedWater => "water may have been added unrecorded",
        FlagCodes.PossibleStrainMixUp => "may have been fermented by another strain",
        KineticsCodes.Stuck => "stuck ferment",
        KineticsCodes.Sluggish => "sluggish ferment",
        KineticsCodes.StalledThenFinished => "stalled, then finished",
        KineticsCodes.NotDryAtLogEnd => "not dry when its log ended",
        KineticsCodes.AboveDangerTemp => "above the danger temperature",
        KineticsCodes.AboveCautionTemp => "above the caution temperature",
        KineticsCodes.OutOfOrderTimestamp => "log readings out of time order",
        KineticsCodes.DuplicateTimestamp => "two log readings at one time",
        KineticsCodes.SugarRose => "sugar rose between readings",
        KineticsCodes.HeatPotentialAboveDanger => "could have passed the danger temperature without cooling",
        KineticsCodes.DropBeforeInoculation => "sugar fell before the recorded inoculation",
        KineticsCodes.InoculationFarFromLog => "log too far from the recorded inoculation",
        KineticsCodes.TooFewSugarReadings => "too few sugar readings to analyse",
        KineticsCodes.NoSigmoidFit => "no fermentation curve could be fitted",
        KineticsCodes.LogEndedBeforeDry => "log ended before dry; the lab found it dry",
        KineticsCodes.SeveralLogsForLot => "several logs for one lot",
        KineticsCodes.LogWithoutLot => "a log that matches no lot",
        KineticsCodes.LogMatchesSeveralLots => "a log that matches several lots",
        "no-log" => "no fermentation log",
        _ => code,
    };

    /// <summary>
    /// A flag in plain words, saying what the lot was really compared with: a lot whose strain had too few lots for a
    /// reference of its own was judged against all lots, and its strain-relative flag says so ("alcohol off the line of
    /// all finished lots for its sugar", not "... off its strain's line ..."). Other flags read as <see cref="FlagName(string)"/>.
    /// </summary>
    public static string FlagName(LotFlag flag)
    {
        ArgumentNullException.ThrowIfNull(flag);
        if (!flag.AgainstAllLots)
        {
            return FlagName(flag.Code);
        }

        return flag.Code switch
        {
            FlagCodes.HighFactor => "high factor against all lots (its strain has too few)",
            FlagCodes.LowFactor => "low factor against all lots (its strain has too few)",
            FlagCodes.OutsideTukeyFence => "factor outside the usual range of all lots (its strain has too few)",
            FlagCodes.FarOutsideTukeyFence => "factor far outside the usual range of all lots (its strain has too few)",
            FlagCodes.OffStrainLine => "alcohol off the line of all finished lots for its sugar (its strain has too few)",
            _ => FlagName(flag.Code),
        };
    }

    /// <summary>A p-value as reports print it: four decimals, or "&lt; 0.0001" below that (never "0.0000").</summary>
    public static string P(double p) =>
        double.IsNaN(p) ? "n/a" : p < 0.0001 ? "< 0.0001" : p.ToString("0.0000", System.Globalization.CultureInfo.InvariantCulture);

    /// <summary>Plain name of a backtest scheme.</summary>
    public static string Scheme(BacktestScheme scheme) => scheme switch
    {
        BacktestScheme.LeaveOneSeasonOut => "leave one season out",
        BacktestScheme.LeaveOneLotOut => "leave one lot out",
        BacktestScheme.TenFoldByLot => "ten folds by lot",
        _ => scheme.ToString(),
    };
}
