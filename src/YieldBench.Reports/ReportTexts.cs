using YieldBench.Core.HouseFactor;

namespace YieldBench.Reports;

/// <summary>User-facing texts of the report, kept in one place so tests can assert them.</summary>
public static class ReportTexts
{
    /// <summary>The formula-injection rule for data files, as stated in the methods sheet and the guide.</summary>
    public const string InjectionRule =
        "In the CSV files, a text cell starting with =, +, -, @, a tab or a carriage return is written with a leading apostrophe (') so that a spreadsheet shows it as text and never runs it as a formula; numbers are written as numbers.";

    /// <summary>Said when the review runs on the bundled demo data.</summary>
    public const string DemoDataNotice =
        "No inputs given: reviewing the bundled demo data (an invented winery, invented strain codes; not real data).";

    /// <summary>
    /// What the house factor's backtest held out, for headings: "seasons" when each season was held out in turn, "lots"
    /// when it held out lots (a history of one season, or lots dealt into folds).
    /// </summary>
    public static string HeldOut(BacktestScheme scheme) => scheme == BacktestScheme.LeaveOneSeasonOut ? "seasons" : "lots";
}
