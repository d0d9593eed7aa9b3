using YieldBench.Core.HouseFactor;
using YieldBench.Core.Review.Strains;

namespace YieldBench.Core.Review;

/// <summary>The review's plain words that every renderer prints the same way, kept in one place so tests can assert them.</summary>
public static class ReviewTexts
{
    /// <summary>Cautions printed on the console, on the overview and on the methods sheet.</summary>
    public static IReadOnlyList<string> Cautions { get; } =
    [
        .. HouseFactorTexts.PlannerCautions,
        "Fermentation heat: a must can warm far beyond its current temperature as its remaining sugar ferments; the kinetics sheet shows how far without cooling. Follow the cellar's cooling practice and local codes.",
        "Flags mark lots worth a second look, not errors proven: confirm with the cellar records and the lab before changing anything.",
    ];

    /// <summary>Plain name of a severity, as data/flags.csv writes it.</summary>
    public static string Severity(FlagSeverity severity) => severity switch
    {
        FlagSeverity.Note => "note",
        FlagSeverity.Check => "check",
        FlagSeverity.LikelyError => "likely error",
        _ => severity.ToString(),
    };

    /// <summary>Plain name of a backtest scheme.</summary>
    public static string Scheme(BacktestScheme scheme) => scheme switch
    {
        BacktestScheme.LeaveOneSeasonOut => "leave one season out",
        BacktestScheme.LeaveOneLotOut => "leave one lot out",
        BacktestScheme.TenFoldByLot => "ten folds by lot",
        _ => scheme.ToString(),
    };
}
