using YieldBench.Core.Review;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Kinetics;
using YieldBench.Reports.Output;

namespace YieldBench.Reports.Parts;

/// <summary>The PNG charts under charts/: the review's charts, then the kinetics charts when logs were read.</summary>
public sealed class ChartsPart : IReportPart
{
    /// <summary>The folder the charts go in, relative to the report folder.</summary>
    public const string Folder = "charts";

    /// <inheritdoc/>
    public string Name => "charts";

    /// <inheritdoc/>
    public IReadOnlyList<string> Files(ReviewResult review) =>
        Plan(review, Path.GetTempPath()).Select(c => Folder + "/" + Path.GetFileName(c.File.Path)).ToArray();

    /// <inheritdoc/>
    public IReadOnlyList<Action> Jobs(PartContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        var charts = Plan(context.Review, context.Root);
        var jobs = charts.Select(c => (Action)(() => context.Write(Folder + "/" + Path.GetFileName(c.File.Path), c.Draw))).ToList();

        // The two kinetics charts whose cost grows with the lot count start first, so that neither runs alone at the end.
        var slow = charts.Select((c, i) => (c, i)).Where(x => Path.GetFileName(x.c.File.Path) is "kinetics-strain-curves.png" or "kinetics-rate-vs-sugar.png").Select(x => x.i).ToArray();
        return [.. slow.Select(i => jobs[i]), .. jobs.Where((_, i) => !slow.Contains(i))];
    }

    /// <summary>
    /// Every chart with its file under <paramref name="root"/>/charts, in placement order; the overview sheet shows the
    /// review's charts and, of the kinetics charts, the strain curves (per-lot kinetics charts stay on their sheet).
    /// </summary>
    internal static IReadOnlyList<PlannedChart> Plan(ReviewResult review, string root)
    {
        string folder = Path.Combine(root, Folder);
        var plan = ReviewCharts.Plan(review, folder).ToList();
        if (review.Kinetics is not null)
        {
            plan.AddRange(KineticsCharts.Plan(review, folder).Charts
                .Select(c => c with { File = c.File with { OnOverview = Path.GetFileName(c.File.Path) == "kinetics-strain-curves.png" } }));
        }

        return plan;
    }
}
