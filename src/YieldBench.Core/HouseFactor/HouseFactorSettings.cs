namespace YieldBench.Core.HouseFactor;

/// <summary>Settings of the house-factor analysis. Every default is in docs/methods.md with its source.</summary>
public sealed record HouseFactorSettings
{
    /// <summary>Label regime the backtest is scored against (default: United States).</summary>
    public LabelRegime Regime { get; init; } = LabelRegime.UnitedStates;

    /// <summary>
    /// Threshold of the "share on the wrong side" column, % v/v (default 14.0: where the US tolerance changes size and
    /// the tax-class boundary before 2018). Its own measure, apart from the regime's no-crossing line.
    /// </summary>
    public double ThresholdAbv { get; init; } = 14.0;

    /// <summary>Fixed ballpark factors offered as candidates, % v/v per °Brix (common practice: 0.55 and 0.59).</summary>
    public IReadOnlyList<double> FixedFactors { get; init; } = [0.55, 0.59];

    /// <summary>Targets of the planner table, % v/v.</summary>
    public IReadOnlyList<double> PlannerTargets { get; init; } = [13.0, 13.5, 14.0, 14.5, 15.0];

    /// <summary>One-sided confidences of the planner table.</summary>
    public IReadOnlyList<double> PlannerConfidences { get; init; } = [0.80, 0.95];

    /// <summary>Fewest usable lots for a recommendation (default 10: fewer cannot give even an 80 % interval).</summary>
    public int MinimumLots { get; init; } = 10;

    /// <summary>Fewest lots of a strain for a recommendation of its own (default 15).</summary>
    public int MinimumLotsPerStrain { get; init; } = 15;

    /// <summary>Above this many lots leave-one-lot-out gives way to ten seeded folds (default 3000).</summary>
    public int MaximumLotsForLeaveOneLotOut { get; init; } = 3000;

    /// <summary>Above this many lots a costly candidate (robust lines, the multi-variable model) uses ten folds instead of leave-one-lot-out (default 100).</summary>
    public int MaximumLotsForCostlyLeaveOneLotOut { get; init; } = 100;

    /// <summary>
    /// When false (the default), lots the strain review flags as likely errors and lots that did not ferment to dryness
    /// are left out of training, candidate selection and intervals; when true they are included. The review reports
    /// both versions either way.
    /// </summary>
    public bool IncludeFlaggedLots { get; init; }

    /// <summary>
    /// Fewest held-out errors of a strain for intervals of its own (default 15, as for a choice of its own); a strain
    /// with fewer uses all lots' errors.
    /// </summary>
    public int MinimumErrorsForStrainIntervals { get; init; } = 15;
}
