namespace YieldBench.Core.Kinetics;

/// <summary>
/// The codes of the kinetics analysis: the flags a lot can carry and the findings it reports. Every code is explained in
/// docs/methods.md (a test holds the two together), and the analysis writes codes only through these constants.
/// </summary>
public static class KineticsCodes
{
    /// <summary>Flag: a stall (see <see cref="KineticsSettings.StuckRateBrixPerDay"/>) after which the lot did not finish.</summary>
    public const string Stuck = "stuck";

    /// <summary>Flag: a slow stretch while much sugar was left (see <see cref="KineticsSettings.SluggishRateFor"/>).</summary>
    public const string Sluggish = "sluggish";

    /// <summary>Flag: a stall, then a restart to a normal pace, then the lot finished.</summary>
    public const string StalledThenFinished = "stalled-then-finished";

    /// <summary>Flag: the log ends above the dry reading.</summary>
    public const string NotDryAtLogEnd = "not-dry-at-log-end";

    /// <summary>Finding (not a flag): the log ends above the dry reading, but the lab's residual sugar shows the lot finished.</summary>
    public const string LogEndedBeforeDry = "log-ended-before-dry";

    /// <summary>Flag: the peak temperature passed the danger threshold.</summary>
    public const string AboveDangerTemp = "above-danger-temp";

    /// <summary>Flag: the peak temperature passed the caution threshold (and not the danger one).</summary>
    public const string AboveCautionTemp = "above-caution-temp";

    /// <summary>Flag and finding: a reading is logged before the one above it.</summary>
    public const string OutOfOrderTimestamp = "out-of-order-timestamp";

    /// <summary>Flag and finding: several readings share one time.</summary>
    public const string DuplicateTimestamp = "duplicate-timestamp";

    /// <summary>Flag and finding: the sugar rose between readings by more than the setting.</summary>
    public const string SugarRose = "sugar-rose";

    /// <summary>Finding: a log with no season matches lots of several seasons.</summary>
    public const string LogMatchesSeveralLots = "log-matches-several-lots";

    /// <summary>Finding: a log matches no lot.</summary>
    public const string LogWithoutLot = "log-without-lot";

    /// <summary>Finding: several logs were found for one lot and combined.</summary>
    public const string SeveralLogsForLot = "several-logs-for-lot";

    /// <summary>Finding: fewer than two sugar readings, so the lot was not analysed.</summary>
    public const string TooFewSugarReadings = "too-few-sugar-readings";

    /// <summary>Finding: the sugar had already fallen before the recorded inoculation.</summary>
    public const string DropBeforeInoculation = "drop-before-inoculation";

    /// <summary>Finding: the log's first reading is too far from the recorded inoculation to start its clock (<see cref="InoculationClock"/>).</summary>
    public const string InoculationFarFromLog = "inoculation-far-from-log";

    /// <summary>Finding: the temperature reachable without cooling passes the danger threshold (not a flag).</summary>
    public const string HeatPotentialAboveDanger = "heat-potential-above-danger";

    /// <summary>Finding: neither sigmoid could be fitted.</summary>
    public const string NoSigmoidFit = "no-sigmoid-fit";

    /// <summary>The flags a lot can carry, in the order they are listed.</summary>
    public static IReadOnlyList<string> Flags { get; } =
    [
        Stuck, Sluggish, StalledThenFinished, NotDryAtLogEnd, AboveDangerTemp, AboveCautionTemp,
        OutOfOrderTimestamp, DuplicateTimestamp, SugarRose,
    ];

    /// <summary>Every code: the flags, then the findings that are not flags.</summary>
    public static IReadOnlyList<string> All { get; } =
    [
        .. Flags, LogMatchesSeveralLots, LogWithoutLot, SeveralLogsForLot, TooFewSugarReadings, DropBeforeInoculation, InoculationFarFromLog,
        HeatPotentialAboveDanger, NoSigmoidFit, LogEndedBeforeDry,
    ];
}
