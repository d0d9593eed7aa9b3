using YieldBench.Core.HouseFactor;

namespace YieldBench.Core.Review;

/// <summary>
/// The planning chart's numbers for one planner line: for each target alcohol, the highest picking sugar that keeps
/// the wine at or under the target with even odds, with 80 % and with 95 % confidence (<see cref="Planner.HighestSugar"/>:
/// the line's prediction less the season-aware error allowance). NaN where the line cannot give an answer.
/// </summary>
/// <param name="Strain">Strain code, or <c>*</c> for the pooled line.</param>
/// <param name="Targets">Target alcohol, % v/v, ascending.</param>
/// <param name="EvenOdds">Highest °Brix at 50 % confidence for each target.</param>
/// <param name="Confident80">Highest °Brix at 80 % confidence.</param>
/// <param name="Confident95">Highest °Brix at 95 % confidence.</param>
public sealed record PlanningCurve(
    string Strain, IReadOnlyList<double> Targets, IReadOnlyList<double> EvenOdds, IReadOnlyList<double> Confident80, IReadOnlyList<double> Confident95);

/// <summary>The planning curves of a review's planner lines.</summary>
public static class PlanningCurves
{
    /// <summary>Step between targets, % v/v.</summary>
    public const double Step = 0.1;

    /// <summary>
    /// The targets the chart covers: the pooled line's predictions over the lots' starting sugars, widened to whole
    /// half-percent steps, every <see cref="Step"/>; empty when the range is unknown.
    /// </summary>
    public static IReadOnlyList<double> Targets(PlanningModel model)
    {
        ArgumentNullException.ThrowIfNull(model);
        double lo = model.Pooled.Predict(model.HistoryLowBrix), hi = model.Pooled.Predict(model.HistoryHighBrix);
        if (!double.IsFinite(lo) || !double.IsFinite(hi) || !(hi > lo))
        {
            return [];
        }

        lo = Math.Floor(lo * 2) / 2;
        hi = Math.Ceiling(hi * 2) / 2;
        int n = (int)Math.Round((hi - lo) / Step);
        return Enumerable.Range(0, n + 1).Select(i => Math.Round(lo + (i * Step), 10)).ToArray();
    }

    /// <summary>
    /// The curve of every planner line: pooled first, then the strains in <paramref name="strainOrder"/>; empty without
    /// a planning model.
    /// </summary>
    public static IReadOnlyList<PlanningCurve> Of(PlanningModel? model, IReadOnlyList<string> strainOrder)
    {
        ArgumentNullException.ThrowIfNull(strainOrder);
        if (model is null)
        {
            return [];
        }

        var targets = Targets(model);
        if (targets.Count == 0)
        {
            return [];
        }

        var lines = new List<PlanningLine> { model.Pooled };
        lines.AddRange(strainOrder.Where(model.Knows).Select(model.For));
        return lines.Select(line => Curve(line, targets)).ToArray();
    }

    /// <summary>One line's curve over <paramref name="targets"/>.</summary>
    public static PlanningCurve Curve(PlanningLine line, IReadOnlyList<double> targets)
    {
        ArgumentNullException.ThrowIfNull(line);
        ArgumentNullException.ThrowIfNull(targets);

        // The error allowance does not depend on the target: it is found once per confidence (one fit of the error
        // model) and each target's answer is the line's sugar for the target less it, as the planner computes it.
        double[] At(double confidence)
        {
            var first = Planner.HighestSugar(line, targets[0], confidence);
            double allowance = first.ErrorAllowance;
            return targets.Select(t => double.IsFinite(allowance) ? line.BrixFor(t - allowance) : double.NaN).ToArray();
        }

        return new PlanningCurve(line.Strain, targets, At(0.5), At(0.8), At(0.95));
    }
}
