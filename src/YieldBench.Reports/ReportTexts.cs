using YieldBench.Core.HouseFactor;

namespace YieldBench.Reports;

/// <summary>User-facing texts of the report, kept in one place so tests can assert them.</summary>
public static class ReportTexts
{
    /// <summary>Cautions printed on the console, on the overview and on the methods sheet.</summary>
    public static IReadOnlyList<string> Cautions { get; } =
    [
        .. HouseFactorTexts.PlannerCautions,
        "Fermentation heat: a must can warm far beyond its current temperature as its remaining sugar ferments; the kinetics sheet shows how far without cooling. Follow the cellar's cooling practice and local codes.",
        "Flags mark lots worth a second look, not errors proven: confirm with the cellar records and the lab before changing anything.",
    ];

    /// <summary>The formula-injection rule for data files, as stated in the methods sheet and the guide.</summary>
    public const string InjectionRule =
        "In the CSV files, a text cell starting with =, +, -, @, a tab or a carriage return is written with a leading apostrophe (') so that a spreadsheet shows it as text and never runs it as a formula; numbers are written as numbers.";

    /// <summary>Said when the review runs on the bundled demo data.</summary>
    public const string DemoDataNotice =
        "No inputs given: reviewing the bundled demo data (an invented winery, invented strain codes; not real data).";
}
