using YieldBench.Core.Conversion;

namespace YieldBench.Core.HouseFactor;

/// <summary>How often one held-out season's lots fell inside the intervals made without that season.</summary>
/// <param name="Season">The season held out.</param>
/// <param name="Lots">Its lots that got an interval.</param>
/// <param name="Inside80">Of those, inside the planner's 80 % interval.</param>
/// <param name="Inside95">Of those, inside the planner's 95 % interval.</param>
/// <param name="InsideOverall80">Inside the overall recommendation's 80 % band around its own prediction (NaN share when it had none).</param>
/// <param name="InsideOverall95">Inside the overall recommendation's 95 % band.</param>
/// <param name="OverallLots">Lots that got an overall band.</param>
public sealed record SeasonCoverageRow(int Season, int Lots, int Inside80, int Inside95, int OverallLots, int InsideOverall80, int InsideOverall95)
{
    /// <summary>Share inside the planner's 80 % interval.</summary>
    public double Share80 => Lots > 0 ? Inside80 / (double)Lots : double.NaN;

    /// <summary>Share inside the planner's 95 % interval.</summary>
    public double Share95 => Lots > 0 ? Inside95 / (double)Lots : double.NaN;

    /// <summary>Share inside the overall 80 % band.</summary>
    public double OverallShare80 => OverallLots > 0 ? InsideOverall80 / (double)OverallLots : double.NaN;

    /// <summary>Share inside the overall 95 % band.</summary>
    public double OverallShare95 => OverallLots > 0 ? InsideOverall95 / (double)OverallLots : double.NaN;
}

/// <summary>Interval coverage measured by nested leave-one-season-out, per held-out season and over all of them.</summary>
/// <param name="Seasons">One row per season held out, ascending.</param>
/// <param name="Total">All seasons together (its <see cref="SeasonCoverageRow.Season"/> is 0).</param>
/// <param name="Method">How it was measured, in words.</param>
public sealed record IntervalCoverage(IReadOnlyList<SeasonCoverageRow> Seasons, SeasonCoverageRow Total, string Method);

/// <summary>
/// Measures the intervals' coverage the honest way: each season in turn is held out, the whole house-factor analysis
/// (its own leave-one-season-out backtest, the one-standard-error choices, the season-aware intervals) runs on the
/// other seasons, and the held-out season's lots are checked against the intervals that analysis gives them — the
/// planner's line for their strain, and the overall recommendation's band. Built-in candidates only (the planner
/// uses no other); seeded like the analysis. Needs two or more seasons.
/// </summary>
public static class SeasonCoverage
{
    /// <summary>
    /// Most lots an inner analysis is run on; more are sampled down to this many (<see cref="TrainingSample"/>, seeded).
    /// The coverage is a share of held-out lots inside intervals; an analysis of 20,000 lots gives intervals within a few
    /// thousandths of % v/v of one of 90,000 (their width is the lot-to-lot and season-to-season spread, not the
    /// line's own uncertainty), while the ten inner analyses at 100,000 lots cost most of the house factor's time.
    /// Every held-out lot is still scored. Histories of up to about 22,000 lots are not sampled at all.
    /// </summary>
    public const int MaximumInnerLots = 20_000;

    /// <summary>The coverage, or null with fewer than two seasons.</summary>
    public static IntervalCoverage? Measure(IReadOnlyList<LotConversion> lots, HouseFactorSettings settings, int seed)
    {
        ArgumentNullException.ThrowIfNull(lots);
        ArgumentNullException.ThrowIfNull(settings);
        var seasons = lots.Select(l => l.Lot.Season).Distinct().Order().ToArray();
        if (seasons.Length < 2)
        {
            return null;
        }

        // Each season's inner analysis is seeded and writes only its own row, so they run side by side.
        var rows = new SeasonCoverageRow[seasons.Length];
        Parallel.For(0, seasons.Length, i =>
        {
            int held = seasons[i];
            var train = TrainingSample.Of(lots.Where(l => l.Lot.Season != held).ToArray(), MaximumInnerLots, seed);
            var inner = HouseFactorAnalysis.Analyse(train, settings, [], seed, coverage: false, byLotReported: false);
            rows[i] = Score(held, lots.Where(l => l.Lot.Season == held), inner);
        });

        var total = new SeasonCoverageRow(
            0,
            rows.Sum(r => r.Lots),
            rows.Sum(r => r.Inside80),
            rows.Sum(r => r.Inside95),
            rows.Sum(r => r.OverallLots),
            rows.Sum(r => r.InsideOverall80),
            rows.Sum(r => r.InsideOverall95));
        string method = seasons.Length == 2
            ? "nested leave-one-season-out over 2 seasons: each inner analysis saw one season, so its intervals could not measure season-to-season spread"
            : $"nested leave-one-season-out over {seasons.Length} seasons: each season predicted by the analysis of the other {seasons.Length - 1}";
        return new IntervalCoverage(rows, total, method);
    }

    /// <summary>The coverage in one sentence, with each season's figures.</summary>
    public static string Sentence(IntervalCoverage coverage)
    {
        ArgumentNullException.ThrowIfNull(coverage);
        static string P(double v) => double.IsFinite(v) ? (100 * v).ToString("0.0", System.Globalization.CultureInfo.InvariantCulture) + " %" : "n/a";
        var t = coverage.Total;
        string seasons = string.Join("; ", coverage.Seasons.Select(r => $"{r.Season}: {P(r.Share80)} and {P(r.Share95)} of {r.Lots}"));
        return $"Tested on seasons they had not seen ({coverage.Method}), the planner's 80 % and 95 % intervals held the lab's alcohol of {P(t.Share80)} and {P(t.Share95)} of {t.Lots} lots ({seasons}).";
    }

    private static SeasonCoverageRow Score(int season, IEnumerable<LotConversion> test, HouseFactorReview inner)
    {
        int lots = 0, in80 = 0, in95 = 0, overallLots = 0, overall80 = 0, overall95 = 0;
        var planning = inner.Planning;
        var overall = inner.Overall;
        var overallFit = overall is null ? null : inner.Candidates.First(c => c.Id == overall.CandidateId).FullFit;

        // A line's interval is its prediction plus its error bands (Planner.Estimate); the bands (four Student-t
        // quantiles) depend on the line alone, so they are taken once per line, not once per lot.
        var bands = new Dictionary<PlanningLine, ((double Low, double High) B80, (double Low, double High) B95)>(ReferenceEqualityComparer.Instance);
        foreach (var l in test)
        {
            double actual = l.Lot.FinalAlcohol.PercentVolume;
            double brix = l.EffectiveStartingBrix;
            if (planning is not null)
            {
                var line = planning.For(l.Lot.Strain);
                if (!bands.TryGetValue(line, out var b))
                {
                    var model = line.ErrorModel;
                    bands[line] = b = (model.Band(0.80), model.Band(0.95));
                }

                double predicted = line.Predict(Units.SugarReading.FromBrix(brix).Brix);
                double low80 = predicted + b.B80.Low, high80 = predicted + b.B80.High, low95 = predicted + b.B95.Low, high95 = predicted + b.B95.High;
                if (double.IsFinite(low80) && double.IsFinite(low95))
                {
                    lots++;
                    in80 += actual >= low80 && actual <= high80 ? 1 : 0;
                    in95 += actual >= low95 && actual <= high95 ? 1 : 0;
                }
            }

            if (overallFit is not null && double.IsFinite(overall!.ErrorBand80.Low) && double.IsFinite(overall.ErrorBand95.Low))
            {
                double error = actual - overallFit.Predict(l.Lot.Strain, brix);
                overallLots++;
                overall80 += error >= overall.ErrorBand80.Low && error <= overall.ErrorBand80.High ? 1 : 0;
                overall95 += error >= overall.ErrorBand95.Low && error <= overall.ErrorBand95.High ? 1 : 0;
            }
        }

        return new SeasonCoverageRow(season, lots, in80, in95, overallLots, overall80, overall95);
    }
}
