using YieldBench.Core.HouseFactor;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Statistics;
using YieldBench.Core.Units;

namespace YieldBench.Core.Review;

/// <summary>The conversion factor to use next harvest: pooled and per strain, each at one typical starting sugar.</summary>
/// <param name="ReferenceBrix">The typical starting sugar the factors and ranges are given at, °Brix: the planner's (the median effective starting sugar of the lots the house factor learned from).</param>
/// <param name="Pooled">The factor for all lots (and for a strain without a line of its own).</param>
/// <param name="Strains">Per-strain factors, in the review's strain order.</param>
public sealed record FactorsToUse(double ReferenceBrix, FactorChoice Pooled, IReadOnlyList<FactorChoice> Strains);

/// <summary>One conversion factor to use, with what it predicts at the typical sugar and how far off it was on held-out lots.</summary>
/// <param name="Strain">Strain code, or <c>*</c> for the pooled factor.</param>
/// <param name="Candidate">Plain name of the chosen candidate.</param>
/// <param name="Curve">Line or EU convention.</param>
/// <param name="Intercept">The line's intercept, % v/v (0 for a factor through the origin; NaN for the EU convention).</param>
/// <param name="Slope">The line's slope, % v/v per °Brix, exactly as the planner and data/house-factor.json hold it (NaN for the EU convention).</param>
/// <param name="Factor">% v/v per °Brix at the reference sugar: predicted alcohol ÷ °Brix there (for a line through the origin, its slope), as data/house-factor.json writes it.</param>
/// <param name="Estimate">Predicted alcohol at the reference sugar with its 80 % and 95 % intervals, % v/v.</param>
/// <param name="HeldOutMae">Mean absolute error on held-out lots of this strain (all lots for the pooled factor), % v/v.</param>
/// <param name="Lots">Lots it was scored on (0 for a strain with too few lots for a backtest of its own).</param>
/// <param name="RangesFrom">Which held-out errors the ranges come from, in words (the planning line's error basis, e.g. "all 48 lots held out by leave-one-season-out (this strain has 13, too few for intervals of its own)").</param>
public sealed record FactorChoice(
    string Strain, string Candidate, SugarCurve Curve, double Intercept, double Slope, double Factor, AlcoholEstimate Estimate, double HeldOutMae, int Lots, string RangesFrom)
{
    /// <summary>Whether the factor was scored on held-out lots of its own (false: a strain with too few lots).</summary>
    public bool ScoredAlone => Lots > 0 && double.IsFinite(HeldOutMae);
}

/// <summary>The planning table: the highest picking °Brix that keeps a wine under each target alcohol at each confidence.</summary>
/// <param name="Targets">Target alcohols, % v/v, in the settings' order.</param>
/// <param name="Confidences">Confidences (0–1), in the settings' order.</param>
/// <param name="Rows">The pooled line first, then each strain with a line of its own in the review's strain order.</param>
public sealed record PlanningAtAGlance(IReadOnlyList<double> Targets, IReadOnlyList<double> Confidences, IReadOnlyList<PlanningRow> Rows);

/// <summary>One row of the planning table.</summary>
/// <param name="Strain">Strain code, or <c>*</c> for the pooled line.</param>
/// <param name="HighestBrix">HighestBrix[t][c]: the answer for target t at confidence c as shown, °Brix rounded down to 0.1 (<see cref="HouseFactor.ThresholdAnswer.PickAtOrBelowBrix"/>; NaN when there is none).</param>
public sealed record PlanningRow(string Strain, IReadOnlyList<IReadOnlyList<double>> HighestBrix);

/// <summary>How one strain's ferments ran, from the lots with a log.</summary>
/// <param name="Strain">Strain code.</param>
/// <param name="Lots">Lots of the strain with a log.</param>
/// <param name="DaysToDry">Days from time zero to dry: median and quartiles over the lots that reached dry.</param>
/// <param name="PeakTemperatureC">Peak temperature, °C: median and quartiles.</param>
/// <param name="Troubled">Lots whose ferment went sluggish or stuck, or was not dry when its log ended.</param>
public sealed record StrainFerments(string Strain, int Lots, MetricSummary DaysToDry, MetricSummary PeakTemperatureC, int Troubled)
{
    /// <summary>The kinetics flags that make a ferment count as troubled.</summary>
    public static IReadOnlyList<string> TroubledCodes { get; } = ["stuck", "sluggish", "not-dry-at-log-end"];

    /// <summary>Share of the strain's logged lots that were troubled (0–1; NaN without lots).</summary>
    public double TroubledShare => Lots == 0 ? double.NaN : (double)Troubled / Lots;
}

/// <summary>Rows left out for one reason.</summary>
/// <param name="Code">The intake issue code.</param>
/// <param name="Rows">Rows left out with it.</param>
/// <param name="Example">The message of the first such row, as an example.</param>
public sealed record ReasonCount(string Code, int Rows, string Example);

/// <summary>Builds the overview's detail tables (pure).</summary>
internal static class OverviewDetails
{
    /// <summary>
    /// The factors to use, or null when the house factor made no planner. They are the planner's own: each line's factor
    /// at the planner's reference sugar (<see cref="PlanningModel.FactorOf"/>, as data/house-factor.json writes it), or at
    /// <paramref name="fallbackBrix"/> when the planner names none.
    /// </summary>
    public static FactorsToUse? Factors(HouseFactorReview h, double fallbackBrix, IReadOnlyList<string> strainOrder, Func<string, string> candidateName)
    {
        if (h.Planning is not { } planning || h.Overall is not { } overall)
        {
            return null;
        }

        double referenceBrix = double.IsFinite(planning.ReferenceBrix) ? planning.ReferenceBrix : fallbackBrix;
        if (!double.IsFinite(referenceBrix))
        {
            return null;
        }

        var sugar = SugarReading.FromBrix(referenceBrix);
        FactorChoice Choice(PlanningLine line, Recommendation? r) => new(
            line.Strain,
            candidateName(line.CandidateId),
            line.Curve,
            line.Intercept,
            line.SlopePerBrix,
            double.IsFinite(planning.ReferenceBrix) ? planning.FactorOf(line) : line.FactorAt(referenceBrix),
            Planner.Estimate(line, sugar),
            r?.Metrics.Mae ?? double.NaN,
            r?.Lots ?? 0,
            line.ErrorBasis);

        var byStrain = h.ByStrain.ToDictionary(r => r.Strain, StringComparer.Ordinal);
        var strains = strainOrder.Where(planning.Knows).Select(s => Choice(planning.For(s), byStrain.GetValueOrDefault(s))).ToArray();
        return new FactorsToUse(referenceBrix, Choice(planning.Pooled, overall), strains);
    }

    /// <summary>The planning table, or null when the house factor made no planner table.</summary>
    public static PlanningAtAGlance? Planning(HouseFactorReview h, HouseFactorSettings settings, IReadOnlyList<string> strainOrder)
    {
        if (h.PlannerTable.Count == 0)
        {
            return null;
        }

        var answers = new Dictionary<(string, double, double), double>();
        foreach (var a in h.PlannerTable)
        {
            answers.TryAdd((a.Strain, a.TargetAbv, a.Confidence), a.PickAtOrBelowBrix);
        }

        var known = h.PlannerTable.Select(a => a.Strain).ToHashSet(StringComparer.Ordinal);
        var strains = new[] { "*" }.Concat(strainOrder).Where(known.Contains);
        var rows = strains.Select(s => new PlanningRow(
            s,
            settings.PlannerTargets.Select(t => (IReadOnlyList<double>)settings.PlannerConfidences.Select(c => answers.GetValueOrDefault((s, t, c), double.NaN)).ToArray()).ToArray()))
            .ToArray();
        return new PlanningAtAGlance(settings.PlannerTargets, settings.PlannerConfidences, rows);
    }

    /// <summary>Per strain with logs, in <paramref name="strainOrder"/>.</summary>
    public static IReadOnlyList<StrainFerments> Ferments(KineticsReview? kinetics, IReadOnlyList<string> strainOrder)
    {
        if (kinetics is null)
        {
            return [];
        }

        var summaries = kinetics.Strains.ToDictionary(s => s.Strain, StringComparer.Ordinal);
        var troubled = kinetics.Lots
            .Where(k => k.Flags.Any(f => StrainFerments.TroubledCodes.Contains(f, StringComparer.Ordinal)))
            .GroupBy(k => k.Lot.Strain, StringComparer.Ordinal)
            .ToDictionary(g => g.Key, g => g.Count(), StringComparer.Ordinal);
        return strainOrder.Where(summaries.ContainsKey)
            .Select(s => new StrainFerments(s, summaries[s].Lots, summaries[s].DaysToDry, summaries[s].PeakTemperatureC, troubled.GetValueOrDefault(s)))
            .ToArray();
    }

    /// <summary>Rows left out (row-level errors) by issue code, most rows first, then code.</summary>
    public static IReadOnlyList<ReasonCount> LeftOutReasons(SeasonSet inputs) =>
        inputs.Issues.Where(i => i.Severity == IssueSeverity.Error && i.Row is not null)
            .GroupBy(i => i.Code, StringComparer.Ordinal)
            .Select(g => new ReasonCount(g.Key, g.Count(), g.First().Message))
            .OrderByDescending(r => r.Rows).ThenBy(r => r.Code, StringComparer.Ordinal)
            .ToArray();

    /// <summary>The lots to look at, one each: most serious first, then by lot key.</summary>
    public static IReadOnlyList<LotReview> FlaggedLots(IReadOnlyList<LotReview> lots) =>
        lots.Where(l => l.IsFlagged).OrderByDescending(l => l.WorstSeverity).ThenBy(l => l.Key).ToArray();

    /// <summary>
    /// The plain sentence of the comparison: how much more alcohol the first-ranked strain makes than the last from the
    /// same starting sugar, or that they are the same within the noise; null without an adjusted comparison of two strains.
    /// </summary>
    public static string? StrainHeadline(Strains.StrainComparison c, IReadOnlyList<RankedStrain> ranking)
    {
        if (ranking.Count < 2 || ranking[0].Adjusted is null || ranking[^1].Adjusted is null)
        {
            return null;
        }

        string first = ranking[0].Strain, last = ranking[^1].Strain;
        var d = c.AdjustedDifferences.FirstOrDefault(x => (x.First == first && x.Second == last) || (x.First == last && x.Second == first));
        return d is null ? null : Strains.Comparison.DifferenceSentence(d);
    }

    /// <summary>The reference sugar: the strain comparison's, or the median effective starting sugar when it has none.</summary>
    public static double ReferenceBrix(double comparisonReference, IEnumerable<double> effectiveBrix) =>
        double.IsFinite(comparisonReference) ? comparisonReference : Descriptive.Median(effectiveBrix.Where(double.IsFinite));
}
