using YieldBench.Core.Review;
using YieldBench.Reports.Output;
using YieldBench.Reports.Workbook;

namespace YieldBench.Reports.Parts;

/// <summary>
/// report.xlsx: laid out and its sheets written while the charts are drawn; each picture goes in when the package
/// reaches that part, once the charts part has written it.
/// </summary>
public sealed class WorkbookPart : IReportPart
{
    /// <inheritdoc/>
    public string Name => "workbook";

    /// <inheritdoc/>
    public IReadOnlyList<string> Files(ReviewResult review) => [ReportWriter.WorkbookName];

    /// <inheritdoc/>
    public IReadOnlyList<Action> Jobs(PartContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        return
        [
            () =>
            {
                var charts = ChartsPart.Plan(context.Review, context.Root).Select(c => c.File).ToArray();
                var layout = WorkbookWriter.Layout(context.Review, charts, context.Tables);
                context.Write(ReportWriter.WorkbookName, stream => WorkbookWriter.Finish(
                    layout, charts, includePictures: true, stream, i => context.Read(ChartsPart.Folder + "/" + Path.GetFileName(charts[i].Path))));
            },
        ];
    }
}
