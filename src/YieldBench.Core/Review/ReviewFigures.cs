using YieldBench.Core.Conversion;
using YieldBench.Core.HouseFactor;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Review.Strains;
using YieldBench.Core.Statistics;

namespace YieldBench.Core.Review;

/// <summary>
/// The orders and figures the renderers lay out, worked out once: the strain order every chart and table uses, the
/// box-plot numbers of the factor per strain and per season, the strain ranking and the strain courses of sugar over
/// time. Renderers take these as they are and compute no statistic, join or order of their own.
/// </summary>
public sealed record ReviewFigures
{
    /// <summary>
    /// Strains in the one display order (and colour order) of every chart and table: most lots first, then code
    /// (ordinal); a strain only the logs know comes last, by code.
    /// </summary>
    public required IReadOnlyList<string> StrainOrder { get; init; }

    /// <summary>Indices into <see cref="ReviewResult.Lots"/> grouped by strain in <see cref="StrainOrder"/>, then season, then lot id (the Lots sheet's rows).</summary>
    public required IReadOnlyList<int> LotsInStrainOrder { get; init; }

    /// <summary>Seasons of the lots, ascending.</summary>
    public required IReadOnlyList<int> Seasons { get; init; }

    /// <summary>abv_per_brix of each strain in <see cref="StrainOrder"/> (its box: quartiles, whiskers, median); null for a strain without lots.</summary>
    public required IReadOnlyList<GroupSummary?> FactorByStrain { get; init; }

    /// <summary>abv_per_brix of each strain in each season it has lots (the per-season medians), by strain order then season.</summary>
    public required IReadOnlyList<GroupSummary> FactorByStrainAndSeason { get; init; }

    /// <summary>Median abv_per_brix of every lot with one (NaN when none).</summary>
    public required double PooledFactorMedian { get; init; }

    /// <summary>The compared strains, ranked by adjusted conversion (by raw median when the adjusted comparison could not be fitted).</summary>
    public required IReadOnlyList<RankedStrain> Ranking { get; init; }

    /// <summary>Each strain's course of sugar over time, in <see cref="StrainOrder"/> (empty without logs).</summary>
    public required IReadOnlyList<StrainCourse> Courses { get; init; }

    /// <summary>Each strain's course of fermentation rate against remaining sugar, in <see cref="StrainOrder"/> (empty without logs).</summary>
    public IReadOnlyList<RateCourse> RateCourses { get; init; } = [];

    /// <summary>
    /// Indices into <see cref="KineticsReview.Lots"/> in the order the small-multiples pages show them: by strain
    /// (<see cref="StrainOrder"/>), then by how long the log runs (shortest first), then review order; so a page holds
    /// ferments of like length and its panels can share one time axis (empty without logs).
    /// </summary>
    public IReadOnlyList<int> KineticsPanels { get; init; } = [];

    /// <summary>abv_per_brix of each strain × vessel group with lots, by strain order then vessel (ordinal).</summary>
    public IReadOnlyList<GroupSummary> FactorByStrainAndVessel { get; init; } = [];

    /// <summary>The planning chart's curves: the pooled line, then each strain's (empty without a planning model).</summary>
    public IReadOnlyList<PlanningCurve> Planning { get; init; } = [];

    /// <summary>Builds the figures from the review's parts.</summary>
    internal static ReviewFigures Build(IReadOnlyList<LotConversion> lots, StrainReview strains, KineticsReview? kinetics, PlanningModel? planning = null)
    {
        var counts = new Dictionary<string, int>(StringComparer.Ordinal);
        foreach (var l in lots)
        {
            counts[l.Lot.Strain] = counts.GetValueOrDefault(l.Lot.Strain) + 1;
        }

        var reviewed = counts.OrderByDescending(p => p.Value).ThenBy(p => p.Key, StringComparer.Ordinal).Select(p => p.Key).ToList();
        var logOnly = (kinetics?.Lots ?? []).Select(k => k.Lot.Strain).Where(s => !counts.ContainsKey(s)).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal);
        var order = reviewed.Concat(logOnly).ToArray();
        var rank = order.Select((s, i) => (s, i)).ToDictionary(x => x.s, x => x.i, StringComparer.Ordinal);

        var byStrain = strains.Groups
            .Where(g => g.Grouping == Groupings.Strain && g.Measure == ConversionMeasure.AbvPerBrix && g.Strain is not null)
            .ToDictionary(g => g.Strain!, StringComparer.Ordinal);
        var bySeason = strains.Groups
            .Where(g => g.Grouping == Groupings.StrainBySeason && g.Measure == ConversionMeasure.AbvPerBrix && g.N > 0 && g.Strain is not null && rank.ContainsKey(g.Strain))
            .OrderBy(g => rank[g.Strain!]).ThenBy(g => g.Season)
            .ToArray();
        var byVessel = strains.Groups
            .Where(g => g.Grouping == Groupings.StrainByVessel && g.Measure == ConversionMeasure.AbvPerBrix && g.N > 0 && g.Strain is not null && rank.ContainsKey(g.Strain))
            .OrderBy(g => rank[g.Strain!]).ThenBy(g => g.Group, StringComparer.Ordinal)
            .ToArray();

        var byKinetics = (kinetics?.Lots ?? []).GroupBy(k => k.Lot.Strain, StringComparer.Ordinal).ToDictionary(g => g.Key, g => g.ToArray(), StringComparer.Ordinal);
        return new ReviewFigures
        {
            StrainOrder = order,
            LotsInStrainOrder = InStrainOrder(lots, rank),
            Seasons = lots.Select(l => l.Lot.Season).Distinct().Order().ToArray(),
            FactorByStrain = order.Select(s => byStrain.GetValueOrDefault(s)).ToArray(),
            FactorByStrainAndSeason = bySeason,
            PooledFactorMedian = Descriptive.Median(lots.Select(l => l.AbvPerBrix).Where(double.IsFinite)),
            Ranking = Ranked(strains.Comparison, counts),
            Courses = kinetics is null ? [] : order.Select(s => SugarCourse.Of(s, byKinetics.GetValueOrDefault(s, []))).ToArray(),
            RateCourses = kinetics is null ? [] : order.Select(s => Review.RateCourses.Of(s, byKinetics.GetValueOrDefault(s, []))).ToArray(),
            KineticsPanels = kinetics is null ? [] : Panels(kinetics.Lots, rank),
            FactorByStrainAndVessel = byVessel,
            Planning = PlanningCurves.Of(planning, order),
        };
    }

    // A stable sort: strain (display order), length of the log, then review order.
    private static int[] Panels(IReadOnlyList<LotKinetics> lots, Dictionary<string, int> rank)
    {
        var order = Enumerable.Range(0, lots.Count).ToArray();
        Array.Sort(order, (a, b) =>
        {
            int c = rank.GetValueOrDefault(lots[a].Lot.Strain, int.MaxValue).CompareTo(rank.GetValueOrDefault(lots[b].Lot.Strain, int.MaxValue));
            if (c == 0)
            {
                c = lots[a].DurationHours.CompareTo(lots[b].DurationHours);
            }

            return c == 0 ? a.CompareTo(b) : c;
        });
        return order;
    }

    // A stable sort: strain (display order), season, lot id, then input order.
    private static int[] InStrainOrder(IReadOnlyList<LotConversion> lots, Dictionary<string, int> rank)
    {
        var order = Enumerable.Range(0, lots.Count).ToArray();
        Array.Sort(order, (a, b) =>
        {
            int c = rank[lots[a].Lot.Strain].CompareTo(rank[lots[b].Lot.Strain]);
            if (c == 0)
            {
                c = lots[a].Lot.Key.CompareTo(lots[b].Lot.Key);
            }

            return c == 0 ? a.CompareTo(b) : c;
        });
        return order;
    }

    private static RankedStrain[] Ranked(StrainComparison c, Dictionary<string, int> counts) =>
        c.Strains
            .Select((s, i) => new RankedStrain(s, counts.GetValueOrDefault(s), c.RawMedians[i], c.Adjusted.FirstOrDefault(a => a.Strain == s)))
            .OrderByDescending(r => r.Adjusted?.Factor ?? r.RawMedian).ThenBy(r => r.Strain, StringComparer.Ordinal)
            .ToArray();
}

/// <summary>A compared strain in the ranking.</summary>
/// <param name="Strain">Strain code.</param>
/// <param name="Lots">Lots of the strain reviewed.</param>
/// <param name="RawMedian">Raw median factor (the comparison's measure).</param>
/// <param name="Adjusted">Its conversion adjusted to the reference sugar, or null when the adjusted comparison could not be fitted.</param>
public sealed record RankedStrain(string Strain, int Lots, double RawMedian, AdjustedStrain? Adjusted);
