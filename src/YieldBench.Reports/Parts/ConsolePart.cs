using YieldBench.Core.Review;
using YieldBench.Reports.Output;

namespace YieldBench.Reports.Parts;

/// <summary>
/// The console summary: it writes no file; once the report is in place the pipeline tells it what was written and it prints
/// <see cref="ConsoleSummary.Lines"/> to <see cref="Out"/> (null: nothing, as with --quiet).
/// </summary>
public sealed class ConsolePart(TextWriter? output) : IReportPart
{
    /// <summary>Where the summary goes, or null.</summary>
    public TextWriter? Out { get; } = output;

    /// <inheritdoc/>
    public string Name => "console summary";

    /// <inheritdoc/>
    public IReadOnlyList<string> Files(ReviewResult review) => [];

    /// <inheritdoc/>
    public IReadOnlyList<Action> Jobs(PartContext context) => [];

    /// <summary>Prints the summary of the report written.</summary>
    public void Written(ReviewResult review, ReportOutput output)
    {
        if (Out is null)
        {
            return;
        }

        foreach (string line in ConsoleSummary.Lines(review, output))
        {
            Out.WriteLine(line);
        }
    }
}
