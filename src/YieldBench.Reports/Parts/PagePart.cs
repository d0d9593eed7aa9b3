using System.Text;
using YieldBench.Core.Review;
using YieldBench.Reports.Html;
using YieldBench.Reports.Output;

namespace YieldBench.Reports.Parts;

/// <summary>The meeting page, report.html: one self-contained page laid out from the review's overview (<see cref="HtmlReport"/>).</summary>
public sealed class PagePart : IReportPart
{
    /// <inheritdoc/>
    public string Name => "meeting page";

    /// <inheritdoc/>
    public IReadOnlyList<string> Files(ReviewResult review) => [ReportWriter.PageName];

    /// <inheritdoc/>
    public IReadOnlyList<Action> Jobs(PartContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        return [() => context.Write(ReportWriter.PageName, stream => stream.Write(new UTF8Encoding(false).GetBytes(HtmlReport.Render(context.Review))))];
    }
}
