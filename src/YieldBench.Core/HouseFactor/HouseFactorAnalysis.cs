using System.Globalization;
using YieldBench.Core.Conversion;

namespace YieldBench.Core.HouseFactor;

/// <summary>
/// Offers every house-factor candidate, backtests each (leave-one-season-out with two or more seasons, and
/// leave-one-lot-out), chooses by the one-standard-error rule overall and per strain, and builds the planner's
/// predictor and table. Pure: no I/O; randomness only from <c>seed</c>.
/// </summary>
public static class HouseFactorAnalysis
{
    /// <summary>The built-in candidates in offer order (simplest first).</summary>
    public static IReadOnlyList<ICandidateTrainer> BuiltInCandidates(HouseFactorSettings settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var list = new List<ICandidateTrainer>();
        list.AddRange(settings.FixedFactors.Select(f => new FixedFactorCandidate(f)));
        list.Add(new EuConventionCandidate());
        list.Add(new PooledMedianCandidate());
        list.Add(new RobustOriginLineCandidate());
        list.Add(new TheilSenLineCandidate());
        list.Add(new PerStrainMedianCandidate());
        list.Add(new ShrunkStrainCandidate());
        return list;
    }

    /// <summary>
    /// Runs the analysis twice, with and without the lots the strain review flagged as likely errors or not fermented
    /// to dryness (<see cref="FlaggedLots.From"/>), side by side. The version <see cref="HouseFactorSettings.IncludeFlaggedLots"/>
    /// asks for (by default: without them) is returned, the other in its <see cref="HouseFactorReview.OtherVersion"/>;
    /// both name the flagged lots. With no flagged lot the analysis runs once.
    /// </summary>
    /// <param name="lots">Lots of any number of seasons.</param>
    /// <param name="flags">The strain review's flags of these lots.</param>
    /// <param name="settings">Settings.</param>
    /// <param name="extraCandidates">Further candidates, offered after the built-in ones.</param>
    /// <param name="seed">Seed for every random step.</param>
    public static HouseFactorReview Run(
        IReadOnlyList<LotConversion> lots, IReadOnlyList<Review.Strains.LotFlag> flags, HouseFactorSettings settings, IReadOnlyList<ICandidateTrainer> extraCandidates, int seed)
    {
        ArgumentNullException.ThrowIfNull(lots);
        ArgumentNullException.ThrowIfNull(settings);
        var flagged = FlaggedLots.From(lots, flags);
        if (flagged.Count == 0)
        {
            return Run(lots, settings, extraCandidates, seed) with { FlaggedLotsIncluded = settings.IncludeFlaggedLots };
        }

        var keys = flagged.Select(f => f.LotKey).ToHashSet();
        var kept = lots.Where(l => !keys.Contains(l.Lot.Key)).ToArray();

        // The two versions share only the immutable lots and are each seeded, so running them side by side gives the
        // same results as one after the other.
        bool includeInUse = settings.IncludeFlaggedLots;
        // The version not in use is reported by its recommendations, intervals and planner only (the candidates' table,
        // with their by-lot backtests, is the version in use), so it skips the by-lot backtests.
        var withoutTask = Task.Run(() => Analyse(kept, settings, extraCandidates, seed, coverage: !includeInUse, byLotReported: !includeInUse));
        var with = Analyse(lots, settings, extraCandidates, seed, coverage: includeInUse, byLotReported: includeInUse);
        var without = withoutTask.GetAwaiter().GetResult();
        without = without with
        {
            FlaggedLotsIncluded = false,
            FlaggedLots = flagged,
            Explanation = [.. without.Explanation, FlaggedLots.Sentence(flagged, included: false)],
        };
        with = with with
        {
            FlaggedLotsIncluded = true,
            FlaggedLots = flagged,
            Explanation = [.. with.Explanation, FlaggedLots.Sentence(flagged, included: true)],
        };
        return settings.IncludeFlaggedLots ? with with { OtherVersion = without } : without with { OtherVersion = with };
    }

    /// <summary>
    /// Runs the analysis on lots with their conversion measures (every lot given is used).
    /// </summary>
    /// <param name="lots">Lots of any number of seasons; lots without a finite abv_per_brix are left out and noted.</param>
    /// <param name="settings">Regime, threshold, planner targets and minimum counts.</param>
    /// <param name="extraCandidates">Further candidates (e.g. the multi-variable model), offered after the built-in ones.</param>
    /// <param name="seed">Seed for every random step.</param>
    public static HouseFactorReview Run(
        IReadOnlyList<LotConversion> lots, HouseFactorSettings settings, IReadOnlyList<ICandidateTrainer> extraCandidates, int seed) =>
        Analyse(lots, settings, extraCandidates, seed, coverage: true, byLotReported: true);

    /// <summary>
    /// The analysis. <paramref name="coverage"/>: also measure the intervals' coverage by nested leave-one-season-out
    /// (<see cref="SeasonCoverage"/>). <paramref name="byLotReported"/>: false for an analysis whose candidates' by-lot
    /// backtests nobody reads (an inner run of that measurement, or the version with or without the flagged lots that
    /// is not in use): with seasons to hold out, each candidate's by-lot metrics then repeat its season backtest
    /// (<see cref="CandidateResult.ByLotScheme"/> says so) instead of training it again fold by fold.
    /// </summary>
    internal static HouseFactorReview Analyse(
        IReadOnlyList<LotConversion> lots, HouseFactorSettings settings, IReadOnlyList<ICandidateTrainer> extraCandidates, int seed, bool coverage, bool byLotReported)
    {
        ArgumentNullException.ThrowIfNull(lots);
        ArgumentNullException.ThrowIfNull(settings);
        ArgumentNullException.ThrowIfNull(extraCandidates);
        var notes = new List<string>();
        var usable = new List<LotConversion>(lots.Count);
        foreach (var l in lots)
        {
            if (double.IsFinite(l.AbvPerBrix) && l.EffectiveStartingBrix > 0)
            {
                usable.Add(l);
            }
            else
            {
                notes.Add($"lot {l.Lot.Key} was left out of the house factor: its starting sugar ({F(l.EffectiveStartingBrix, "0.0")} °Brix) gives no abv_per_brix");
            }
        }

        var seasons = usable.Select(l => l.Lot.Season).Distinct().Order().ToArray();
        var primaryScheme = seasons.Length >= 2 ? BacktestScheme.LeaveOneSeasonOut : BacktestScheme.LeaveOneLotOut;
        var candidates = BuiltInCandidates(settings).Concat(extraCandidates).ToArray();
        var results = new List<CandidateResult>(candidates.Length);
        if (usable.Count >= 2)
        {
            // Candidates share nothing mutable and each is seeded, so evaluating them side by side gives the same
            // results as one after another; the array keeps their order.
            // Costly candidates start first and each thread takes the next candidate when it is free, so the slowest
            // (the multi-variable model) runs beside all the quick ones instead of after them.
            var evaluated = new CandidateResult[candidates.Length];
            // Every scheme deals the lots the same way for every candidate, so each scheme's folds are made once.
            var folds = new[] { BacktestScheme.LeaveOneSeasonOut, BacktestScheme.LeaveOneLotOut, BacktestScheme.TenFoldByLot }
                .ToDictionary(s => s, s => new Lazy<BacktestFolds>(() => BacktestFolds.Of(usable, s, seed)));
            var order = Enumerable.Range(0, candidates.Length).OrderByDescending(i => candidates[i].IsCostly).ThenByDescending(i => candidates[i].Complexity).ToArray();
            Parallel.ForEach(
                System.Collections.Concurrent.Partitioner.Create(order, System.Collections.Concurrent.EnumerablePartitionerOptions.NoBuffering),
                new ParallelOptions { MaxDegreeOfParallelism = Environment.ProcessorCount },
                i => evaluated[i] = Evaluate(candidates[i], usable, s => folds[s].Value, seasons.Length, settings, seed, byLotReported));
            results.AddRange(evaluated);
        }

        var explanation = new List<string>();
        if (seasons.Length < 2 && usable.Count > 0)
        {
            explanation.Add("Only one season is present, so no candidate could be tested on a season it had not seen; leave-one-lot-out was used, which flatters every candidate because season-to-season change is not tested.");
        }

        string? importance = results.Where(r => r.Importance.Count > 0)
            .Select(r => $"{r.Name}: {HouseFactorTexts.ImportanceSentence(r.Importance)}").FirstOrDefault();

        if (usable.Count < settings.MinimumLots)
        {
            explanation.Add($"Too few lots to choose a house factor: {usable.Count} usable, at least {settings.MinimumLots} are needed. Keep a record of starting sugar, strain and the lab's final alcohol for every lot.");
            return new HouseFactorReview
            {
                Regime = settings.Regime,
                ThresholdAbv = settings.ThresholdAbv,
                LotsUsed = usable.Count,
                Seasons = seasons,
                PrimaryScheme = primaryScheme,
                Candidates = results,
                ImportanceSentence = importance,
                Explanation = explanation,
                Notes = notes,
            };
        }

        double referenceBrix = Statistics.Descriptive.Median(usable.Select(l => l.EffectiveStartingBrix));
        var overall = Choose("*", results, r => r.HeldOut, r => true, settings, referenceBrix);
        var byStrain = new List<Recommendation>();
        var strainCounts = usable.GroupBy(l => l.Lot.Strain, StringComparer.Ordinal).OrderBy(g => g.Key, StringComparer.Ordinal)
            .Select(g => (Strain: g.Key, Count: g.Count())).ToArray();
        foreach (var (strain, count) in strainCounts)
        {
            if (count < settings.MinimumLotsPerStrain)
            {
                continue;
            }

            // Per-strain choices feed the planner, which needs a predictor of strain and sugar alone.
            var rec = Choose(strain, results, r => r.HeldOut.Where(p => p.Strain == strain).ToArray(), r => r.FullFit is not null, settings, referenceBrix);
            if (rec is not null)
            {
                byStrain.Add(rec);
            }
        }

        var few = strainCounts.Where(s => s.Count < settings.MinimumLotsPerStrain).Select(s => s.Strain).ToArray();
        if (few.Length > 0)
        {
            explanation.Add($"Strains with fewer than {settings.MinimumLotsPerStrain} lots ({string.Join(", ", few)}) get no choice of their own; the overall choice applies to them.");
        }

        var planning = BuildPlanning(results, overall!, byStrain, strainCounts.Select(s => s.Strain).ToArray(), primaryScheme, settings, explanation);
        if (planning is not null)
        {
            planning = planning with
            {
                ReferenceBrix = referenceBrix,
                HistoryLowBrix = usable.Min(l => l.EffectiveStartingBrix),
                HistoryHighBrix = usable.Max(l => l.EffectiveStartingBrix),
            };
        }
        explanation.InsertRange(0, Explain(overall!, results, primaryScheme, settings));
        foreach (var r in byStrain)
        {
            explanation.Add(r.Explanation);
        }

        var table = new List<ThresholdAnswer>();
        if (planning is not null)
        {
            table.AddRange(Planner.Table(planning.Pooled, settings.PlannerTargets, settings.PlannerConfidences));
            foreach (var line in planning.Strains)
            {
                table.AddRange(Planner.Table(line, settings.PlannerTargets, settings.PlannerConfidences));
            }
        }

        var measured = coverage ? SeasonCoverage.Measure(usable, settings, seed) : null;
        if (measured is not null)
        {
            explanation.Add(SeasonCoverage.Sentence(measured));
        }

        // Every candidate is scored and every choice made: only the recommended candidate's held-out predictions are
        // read from here on (the predicted-against-actual chart). At 100,000 lots the others' held some 100 MB.
        var kept = results.Select(r => r.Id == overall!.CandidateId ? r : r with { HeldOut = [] }).ToArray();
        return new HouseFactorReview
        {
            Regime = settings.Regime,
            ThresholdAbv = settings.ThresholdAbv,
            LotsUsed = usable.Count,
            Seasons = seasons,
            PrimaryScheme = primaryScheme,
            Candidates = kept,
            Overall = overall,
            ByStrain = byStrain,
            Planning = planning,
            PlannerTable = table,
            ImportanceSentence = importance,
            Explanation = explanation,
            Notes = notes,
            Coverage = measured,
        };
    }

    private static CandidateResult Evaluate(
        ICandidateTrainer c, IReadOnlyList<LotConversion> lots, Func<BacktestScheme, BacktestFolds> folds, int seasonCount, HouseFactorSettings settings, int seed, bool byLotReported)
    {
        int limit = c.IsCostly ? settings.MaximumLotsForCostlyLeaveOneLotOut : settings.MaximumLotsForLeaveOneLotOut;
        var lotScheme = lots.Count > limit ? BacktestScheme.TenFoldByLot : BacktestScheme.LeaveOneLotOut;
        IReadOnlyList<HeldOutPrediction>? bySeason = seasonCount >= 2 ? Backtest.Run(c, folds(BacktestScheme.LeaveOneSeasonOut), seed) : null;
        var seasonMetrics = bySeason is null ? null : BacktestMetrics.Score(bySeason, settings.Regime, settings.ThresholdAbv);

        // Where the by-lot backtest is not reported, it is not run: the season backtest stands in for it, and says so.
        bool skipByLot = !byLotReported && bySeason is not null;
        var byLot = skipByLot ? null : Backtest.Run(c, folds(lotScheme), seed);
        var fit = c.Train(lots, seed);
        return new CandidateResult(
            c.Id,
            c.Name,
            c.Description,
            c.Complexity,
            seasonMetrics,
            byLot is null ? seasonMetrics! : BacktestMetrics.Score(byLot, settings.Regime, settings.ThresholdAbv),
            byLot is null ? BacktestScheme.LeaveOneSeasonOut : lotScheme,
            bySeason ?? byLot!,
            fit.AsSugarLines(),
            fit.Importance(lots, seed));
    }

    private static Recommendation? Choose(
        string strain,
        IReadOnlyList<CandidateResult> results,
        Func<CandidateResult, IReadOnlyList<HeldOutPrediction>> heldOut,
        Func<CandidateResult, bool> eligible,
        HouseFactorSettings settings,
        double referenceBrix)
    {
        var pool = results.Where(eligible).ToArray();
        var preds = pool.Select(heldOut).ToArray();
        var metrics = preds.Select(p => BacktestMetrics.Score(p, settings.Regime, settings.ThresholdAbv)).ToArray();
        var choice = OneStandardErrorRule.Choose(pool.Select((r, i) => new OneStandardErrorRule.Entry(r.Complexity, metrics[i].Mae, metrics[i].MaeStandardError)).ToArray());
        if (choice is not { } ch)
        {
            return null;
        }

        var chosen = pool[ch.Chosen];
        var best = pool[ch.Best];
        var model = SeasonErrorModel.Of(SeasonErrors(preds[ch.Chosen]));
        var m = metrics[ch.Chosen];
        var band80 = model.Band(0.80);
        var band95 = model.Band(0.95);
        string who = strain == "*" ? "All lots" : $"Strain {strain}";
        string why = ch.Chosen == ch.Best
            ? $"{who}: {chosen.Name} has the lowest held-out error (MAE {F(m.Mae)} % v/v, standard error {F(ch.Limit - m.Mae)}) and no simpler candidate comes within one standard error of it."
            : $"{who}: {chosen.Name} is the simplest candidate within one standard error of the best ({best.Name}, MAE {F(metrics[ch.Best].Mae)}; limit {F(ch.Limit)}); it costs {F(m.Mae - metrics[ch.Best].Mae)} % v/v of MAE and {F(100 * (metrics[ch.Best].ShareWithinTolerance - m.ShareWithinTolerance), "0.#")} points of lots within tolerance.";
        double factor = chosen.FullFit is { } fit ? fit.Predict(strain, referenceBrix) / referenceBrix : double.NaN;
        if (double.IsFinite(factor))
        {
            why += $" Its factor: {F(factor, "0.0000")} % v/v per °Brix at {F(referenceBrix, "0.0")} °Brix.";
        }

        return new Recommendation(strain, m.Lots, chosen.Id, best.Id, m, ch.Limit, band80, band95, why) { Factor = factor, ReferenceBrix = referenceBrix };
    }

    private static PlanningModel? BuildPlanning(
        IReadOnlyList<CandidateResult> results,
        Recommendation overall,
        IReadOnlyList<Recommendation> byStrain,
        IReadOnlyList<string> strains,
        BacktestScheme scheme,
        HouseFactorSettings settings,
        List<string> explanation)
    {
        var chosen = results.First(r => r.Id == overall.CandidateId);
        var basis = chosen;
        if (chosen.FullFit is null)
        {
            basis = results.Where(r => r.FullFit is not null).OrderBy(r => r.Primary.Mae).ThenBy(r => r.Complexity).FirstOrDefault();
            if (basis is null)
            {
                explanation.Add("No candidate that uses strain and sugar alone could be scored, so the planner has no predictor.");
                return null;
            }

            explanation.Add($"The chosen model needs more inputs than strain and sugar, so the planner uses {basis.Name}, the best candidate that needs only those (MAE {F(basis.Primary.Mae)} % v/v).");
        }

        string schemeText = SchemeText(scheme);
        var pooledErrors = SeasonErrors(basis.HeldOut);
        var pooledFit = basis.FullFit!;
        var pooled = Line("*", basis, pooledFit.Pooled, pooledErrors, $"all {pooledErrors.Length} lots held out by {schemeText}");
        var lines = new List<PlanningLine>();
        foreach (string strain in strains)
        {
            var rec = byStrain.FirstOrDefault(r => r.Strain == strain);
            var source = rec is null ? basis : results.First(r => r.Id == rec.CandidateId);
            var own = SeasonErrors(source.HeldOut.Where(p => p.Strain == strain));
            var all = SeasonErrors(source.HeldOut);
            bool useOwn = own.Length >= settings.MinimumErrorsForStrainIntervals;
            lines.Add(Line(
                strain,
                source,
                source.FullFit!.LineFor(strain),
                useOwn ? own : all,
                useOwn ? $"this strain's {own.Length} lots held out by {schemeText}" : $"all {all.Length} lots held out by {schemeText} (this strain has {own.Length}, too few for intervals of its own)"));
        }

        string ownChoice = byStrain.Count > 0 ? $"; strains with {settings.MinimumLotsPerStrain} or more lots use their own choice by the same rule" : string.Empty;
        return new PlanningModel(pooled, lines, $"{basis.Name} chosen by the one-standard-error rule on {schemeText}, scored against {settings.Regime.Name}{ownChoice}");
    }

    private static PlanningLine Line(string strain, CandidateResult source, StrainLine line, SeasonError[] errors, string basis)
    {
        var curve = source.FullFit!.Curve;
        return new PlanningLine(strain, source.Id, curve, line.Intercept, line.SlopePerBrix, line.Lots, errors, basis);
    }

    private static IEnumerable<string> Explain(Recommendation overall, IReadOnlyList<CandidateResult> results, BacktestScheme scheme, HouseFactorSettings settings)
    {
        var m = overall.Metrics;
        yield return overall.Explanation;
        yield return $"Judged by {SchemeText(scheme)} on {m.Lots} lots: bias {F(m.Bias, "+0.00;-0.00;0.00")} % v/v (positive over-predicts), RMSE {F(m.Rmse)}, 90 % of errors within {F(m.P90AbsoluteError)}; "
            + $"{F(100 * m.ShareWithinTolerance, "0.#")} % of lots would meet {settings.Regime.Name} tolerance against the prediction, {F(100 * m.ShareWrongSideOfThreshold, "0.#")} % were predicted on the wrong side of {F(settings.ThresholdAbv, "0.0")} % v/v.";
        if (double.IsNaN(overall.ErrorBand95.Low))
        {
            yield return $"Too few lots for intervals ({m.Lots}; {SeasonErrorModel.MinimumErrors} are needed).";
        }

        var ranked = results.Where(r => double.IsFinite(r.Primary.Mae)).OrderBy(r => r.Primary.Mae).Take(3).Select(r => $"{r.Name} {F(r.Primary.Mae)}");
        yield return "Lowest held-out MAE (% v/v): " + string.Join("; ", ranked) + ".";
    }

    private static string SchemeText(BacktestScheme s) => s switch
    {
        BacktestScheme.LeaveOneSeasonOut => "leave-one-season-out",
        BacktestScheme.LeaveOneLotOut => "leave-one-lot-out",
        _ => "ten-fold by lot",
    };

    private static SeasonError[] SeasonErrors(IEnumerable<HeldOutPrediction> predictions) =>
        predictions.Select(p => new SeasonError(p.Error, p.Season, p.Strain)).ToArray();

    private static string F(double v, string format = "0.000") => v.ToString(format, CultureInfo.InvariantCulture);
}
