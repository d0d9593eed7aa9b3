using ScottPlot;
using YieldBench.Core.Conversion;
using YieldBench.Core.HouseFactor;
using YieldBench.Core.Review;

namespace YieldBench.Reports.Charts;

/// <summary>
/// The review's PNG charts. Each builder lays out numbers the review holds; box hinges and per-season medians use
/// Core's type-7 quantile so the boxes match the sheets' quartiles.
/// </summary>
public static class ReviewCharts
{
    /// <summary>File names under charts/, in the order they are drawn and placed.</summary>
    public static class Files
    {
        /// <summary>Alcohol vs starting sugar.</summary>
        public const string AlcoholVsSugar = "alcohol-vs-sugar.png";

        /// <summary>Conversion factor by strain.</summary>
        public const string FactorByStrain = "factor-by-strain.png";

        /// <summary>Conversion factor by season, per strain.</summary>
        public const string FactorBySeason = "factor-by-season.png";

        /// <summary>Backtest error per candidate.</summary>
        public const string BacktestError = "backtest-error.png";

        /// <summary>Strain factors adjusted to the same starting sugar, with intervals.</summary>
        public const string StrainFactors = "strain-factors.png";

        /// <summary>Conversion factor by strain and vessel.</summary>
        public const string StrainByVessel = "strain-by-vessel.png";

        /// <summary>Days to dry by strain.</summary>
        public const string DaysToDry = "days-to-dry.png";

        /// <summary>Peak temperature by strain.</summary>
        public const string PeakTemperature = "peak-temperature.png";

        /// <summary>Predicted against actual alcohol in the backtest.</summary>
        public const string PredictedVsActual = "backtest-predicted-vs-actual.png";

        /// <summary>Highest picking sugar for a target alcohol.</summary>
        public const string Planning = "planning.png";
    }

    /// <summary>Draws every review chart into <paramref name="folder"/> (one after another) and returns them in placement order.</summary>
    public static IReadOnlyList<ChartFile> WriteAll(ReviewResult review, string folder) => PlannedChart.DrawAll(Plan(review, folder));

    /// <summary>The charts <see cref="WriteAll"/> draws, in placement order, each with its file known before it is drawn.</summary>
    internal static IReadOnlyList<PlannedChart> Plan(ReviewResult review, string folder)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(folder);
        if (review.Lots.Count == 0)
        {
            return [];
        }

        // The overview shows the charts that answer the meeting's questions; the others go on the sheet they explain.
        const string comparison = Workbook.WorkbookWriter.Sheets.StrainComparison, house = Workbook.WorkbookWriter.Sheets.HouseFactor, planner = Workbook.WorkbookWriter.Sheets.Planner;
        var charts = new List<PlannedChart>
        {
            PlannedChart.Of(() => AlcoholVsSugar(review), Path.Combine(folder, Files.AlcoholVsSugar), "Final alcohol vs starting sugar", "Lots", onOverview: true),
        };
        if (review.Figures.Ranking.Any(r => r.Adjusted is not null))
        {
            charts.Add(PlannedChart.Of(() => StrainCharts.AdjustedFactors(review), Path.Combine(folder, Files.StrainFactors), "Strains compared from the same starting sugar", sheet: null, onOverview: true));
        }

        if (review.Kinetics is not null && review.Overview.Ferments.Count > 0)
        {
            charts.Add(PlannedChart.Of(() => StrainCharts.DaysToDry(review)!, Path.Combine(folder, Files.DaysToDry), "Days to dry by strain", sheet: null, onOverview: true));
            charts.Add(PlannedChart.Of(() => StrainCharts.PeakTemperature(review)!, Path.Combine(folder, Files.PeakTemperature), "Peak temperature by strain", sheet: null, onOverview: true));
        }

        charts.Add(PlannedChart.Of(() => FactorByStrain(review), Path.Combine(folder, Files.FactorByStrain), "Conversion factor by strain", comparison, onOverview: false));
        if (review.Figures.Seasons.Count > 1)
        {
            // With one season there is no season to set against another: the chart would repeat factor-by-strain.
            charts.Add(PlannedChart.Of(() => FactorBySeason(review), Path.Combine(folder, Files.FactorBySeason), "Conversion factor by season, per strain", comparison, onOverview: false));
        }
        // With one kind of vessel the chart would repeat factor-by-strain: it is drawn for two kinds or more.
        if (review.Figures.FactorByStrainAndVessel.Select(StrainCharts.Vessel).Distinct(StringComparer.Ordinal).Skip(1).Any())
        {
            charts.Add(PlannedChart.Of(() => StrainCharts.ByVessel(review), Path.Combine(folder, Files.StrainByVessel), "Conversion factor by strain and vessel", comparison, onOverview: false));
        }

        if (review.HouseFactor.Candidates.Count > 0)
        {
            charts.Add(PlannedChart.Of(() => BacktestError(review), Path.Combine(folder, Files.BacktestError), "Backtest error per candidate", house, onOverview: false));
        }

        if (review.HouseFactor.Overall is not null)
        {
            charts.Add(PlannedChart.Of(() => PlanningCharts.PredictedAgainstActual(review), Path.Combine(folder, Files.PredictedVsActual), "Predicted against actual alcohol, seasons held out", house, onOverview: false));
        }

        if (review.Figures.Planning.Count > 0)
        {
            charts.Add(PlannedChart.Of(() => PlanningCharts.HighestPickingSugar(review), Path.Combine(folder, Files.Planning), "Highest picking sugar for a target alcohol", planner, onOverview: false));
        }

        return charts;
    }

    /// <summary>Strains in the review's display order (<see cref="ReviewFigures.StrainOrder"/>): most lots first, then code.</summary>
    public static IReadOnlyList<string> StrainOrder(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        return review.Figures.StrainOrder;
    }

    /// <summary>
    /// Final alcohol against starting sugar: points by strain, each strain's fitted line, and the recommended
    /// predictor with the label regime's tolerance band.
    /// </summary>
    public static Plot AlcoholVsSugar(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var plot = ChartStyle.NewPlot("Final alcohol vs starting sugar", "Starting sugar after additions (°Brix)", "Final alcohol (% v/v)");
        var strains = review.Figures.StrainOrder;
        double xMin = review.Lots.Min(l => l.EffectiveStartingBrix), xMax = review.Lots.Max(l => l.EffectiveStartingBrix);
        double[] grid = Enumerable.Range(0, 41).Select(i => xMin + ((xMax - xMin) * i / 40.0)).ToArray();

        var planning = review.HouseFactor.Planning;
        if (planning is not null)
        {
            var line = planning.Pooled;
            var regime = review.HouseFactor.Regime;
            double[] predicted = grid.Select(line.Predict).ToArray();
            var upper = grid.Select((x, i) => new Coordinates(x, predicted[i] + regime.ToleranceFor(predicted[i])));
            var lower = grid.Select((x, i) => new Coordinates(x, predicted[i] - regime.ToleranceFor(predicted[i]))).Reverse();
            var band = plot.Add.Polygon(upper.Concat(lower).ToArray());
            band.FillColor = ChartPalette.Band.WithAlpha(0.25);
            band.LineWidth = 0;
            band.LegendText = $"label tolerance: {regime.Name}";
            var rec = plot.Add.ScatterLine(grid, predicted, ChartPalette.Reference);
            rec.LineWidth = 3;
            rec.LinePattern = LinePattern.Dashed;
            rec.LegendText = "planner line (all lots): " + CandidateName(review, line.CandidateId);
        }

        var fitted = StrainLinesForChart(review);
        var byStrain = ByStrain(review);
        for (int i = 0; i < strains.Count; i++)
        {
            var members = byStrain[strains[i]].ToArray();
            if (members.Length == 0)
            {
                continue;
            }

            var color = ChartPalette.ForIndex(i);
            var points = ChartStyle.AddMarkers(
                plot,
                members.Select(m => m.Conversion.EffectiveStartingBrix).ToArray(),
                members.Select(m => m.Lot.FinalAlcohol.PercentVolume).ToArray(),
                ChartPalette.ShapeForIndex(i),
                9,
                color);
            points.LegendText = $"{strains[i]} ({members.Length})";
            if (fitted?.Strains.FirstOrDefault(s => s.Strain == strains[i]) is { } sl)
            {
                double lo = members.Min(m => m.Conversion.EffectiveStartingBrix), hi = members.Max(m => m.Conversion.EffectiveStartingBrix);
                var fit = plot.Add.ScatterLine(new[] { lo, hi }, new[] { sl.At(lo), sl.At(hi) }, color);
                fit.LineWidth = 2;
                fit.LinePattern = ChartPalette.PatternForIndex(i);
            }
        }

        MarkFlagged(plot, review.LotReviews, l => l.Conversion.EffectiveStartingBrix, l => l.Lot.FinalAlcohol.PercentVolume);
        ChartStyle.ShowLegend(plot, Alignment.UpperLeft);
        return plot;
    }

    /// <summary>abv_per_brix by strain: a box (quartiles, whiskers to the farthest lots within 1.5 IQR) and every lot.</summary>
    public static Plot FactorByStrain(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var plot = ChartStyle.NewPlot("Conversion factor by strain", "Strain", "Alcohol per °Brix (% v/v per °Brix)");
        var strains = review.Figures.StrainOrder;
        var points = new List<(LotReview Lot, double X)>();
        var byStrain = ByStrain(review);
        var labels = new List<string>();
        for (int i = 0; i < strains.Count; i++)
        {
            var members = byStrain[strains[i]].Where(l => double.IsFinite(l.Conversion.AbvPerBrix)).ToArray();
            labels.Add($"{strains[i]}\n{ChartStyle.Lots(members.Length)}");
            if (members.Length == 0 || review.Figures.FactorByStrain[i] is not { } g)
            {
                continue;
            }

            var color = ChartPalette.ForIndex(i);
            var box = new Box
            {
                Position = i,
                BoxMin = g.Q1,
                BoxMax = g.Q3,
                BoxMiddle = g.Median,
                WhiskerMin = g.LowerWhisker,
                WhiskerMax = g.UpperWhisker,
                Width = 0.5,
            };
            plot.Add.Box(box);

            // Set after adding: adding a box gives it the plot's next palette colour.
            box.FillColor = color.WithAlpha(0.30);
            box.LineColor = color;
            box.LineWidth = 2;

            // Points spread sideways by rank (deterministic, no random jitter) so equal values stay visible.
            var xs = members.Select((m, k) => i + 0.3 + (0.15 * ((k % 7) - 3) / 3.0)).ToArray();
            points.AddRange(members.Select((m, k) => (m, xs[k])));
            ChartStyle.AddMarkers(plot, xs, members.Select(m => m.Conversion.AbvPerBrix).ToArray(), MarkerShape.FilledCircle, 7, color);
        }

        var at = new Dictionary<LotReview, double>(ReferenceEqualityComparer.Instance);
        foreach (var (lot, x) in points)
        {
            at[lot] = x;
        }

        MarkFlagged(plot, points.Select(p => p.Lot).ToArray(), l => at[l], l => l.Conversion.AbvPerBrix);
        plot.Axes.Bottom.TickGenerator = ChartStyle.CategoryTicks(labels);
        plot.Axes.Bottom.MajorTickStyle.Length = 0;
        plot.Axes.SetLimitsX(-0.7, strains.Count - 0.2);
        return plot;
    }

    /// <summary>Median abv_per_brix per season for each strain, with every lot behind it.</summary>
    public static Plot FactorBySeason(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var plot = ChartStyle.NewPlot("Conversion factor by season, per strain", "Season", "Alcohol per °Brix (% v/v per °Brix)");
        var strains = review.Figures.StrainOrder;
        var seasons = review.Figures.Seasons;
        var byStrain = ByStrain(review);
        for (int i = 0; i < strains.Count; i++)
        {
            var color = ChartPalette.ForIndex(i);
            double offset = (i - ((strains.Count - 1) / 2.0)) * SeasonStep(strains.Count);
            var members = byStrain[strains[i]].Where(l => double.IsFinite(l.Conversion.AbvPerBrix)).ToArray();
            ChartStyle.AddMarkers(
                plot, members.Select(m => m.Lot.Season + offset).ToArray(), members.Select(m => m.Conversion.AbvPerBrix).ToArray(), MarkerShape.OpenCircle, 6, color.WithAlpha(0.6));
            var medians = review.Figures.FactorByStrainAndSeason.Where(g => g.Strain == strains[i]).ToArray();
            var line = plot.Add.Scatter(medians.Select(m => m.Season!.Value + offset).ToArray(), medians.Select(m => m.Median).ToArray(), color);
            line.LineWidth = 3;
            line.MarkerSize = 14;
            line.MarkerShape = MarkerShape.FilledSquare;
            line.LegendText = strains[i] + " median";
        }

        var ticks = new ScottPlot.TickGenerators.NumericManual();
        foreach (int s in seasons)
        {
            ticks.AddMajor(s, s.ToString(System.Globalization.CultureInfo.InvariantCulture));
        }

        plot.Axes.Bottom.TickGenerator = ticks;
        plot.Axes.SetLimitsX(seasons[0] - 0.6, seasons[^1] + 0.6);
        ChartStyle.ShowLegend(plot, Alignment.UpperRight);
        return plot;
    }

    /// <summary>
    /// The sideways step between strains within a season on the by-season chart: 0.08 of a season, narrowed when there
    /// are so many strains that they would otherwise spread into the neighbouring seasons (all strains stay within
    /// ±0.35 of their season).
    /// </summary>
    internal static double SeasonStep(int strains) => strains <= 1 ? 0.08 : Math.Min(0.08, 0.7 / (strains - 1));

    /// <summary>Each candidate's mean absolute error on the primary backtest, ±1 standard error, with the one-SE limit.</summary>
    public static Plot BacktestError(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var h = review.HouseFactor;
        var plot = ChartStyle.NewPlot(
            "Backtest error per candidate (" + ReviewTexts.Scheme(h.PrimaryScheme) + ")", "Mean absolute error, ±1 standard error (% v/v)", string.Empty);
        var candidates = h.Candidates.ToArray();
        var ticks = new ScottPlot.TickGenerators.NumericManual();
        string? chosen = h.Overall?.CandidateId;
        for (int i = 0; i < candidates.Length; i++)
        {
            var c = candidates[i];
            var m = c.Primary;
            double y = candidates.Length - 1 - i;
            ticks.AddMajor(y, c.Name);
            if (!double.IsFinite(m.Mae))
            {
                continue;
            }

            var color = c.Id == chosen ? ChartPalette.ForIndex(5) : ChartPalette.ForIndex(0);
            var bar = plot.Add.Bars(new[] { new Bar { Position = y, Value = m.Mae, FillColor = color.WithAlpha(0.8), LineWidth = 0, Orientation = Orientation.Horizontal, Size = 0.6 } });
            bar.Horizontal = true;
            if (double.IsFinite(m.MaeStandardError))
            {
                var err = plot.Add.ErrorBar(new[] { m.Mae }, new[] { y }, new[] { 0.0 });
                err.XErrorPositive = new[] { m.MaeStandardError };
                err.XErrorNegative = new[] { m.MaeStandardError };
                err.YErrorPositive = new[] { 0.0 };
                err.YErrorNegative = new[] { 0.0 };
                err.LineWidth = 3;
                err.CapSize = 10;
                err.Color = ChartPalette.Reference;
            }
        }

        if (h.Overall is { } rec && double.IsFinite(rec.MaeLimit))
        {
            var limit = plot.Add.VerticalLine(rec.MaeLimit, 2, ChartPalette.Reference, LinePattern.Dashed);
            limit.LegendText = "best + 1 standard error (recommended candidate in vermillion)";
            ChartStyle.ShowLegend(plot, Alignment.LowerRight);
        }

        plot.Axes.Left.TickGenerator = ticks;
        plot.Axes.Left.MajorTickStyle.Length = 0;
        plot.Axes.SetLimitsX(0, Math.Max(0.1, candidates.Select(c => c.Primary.Mae + (double.IsFinite(c.Primary.MaeStandardError) ? c.Primary.MaeStandardError : 0)).Where(double.IsFinite).DefaultIfEmpty(1).Max() * 1.15));
        return plot;
    }

    /// <summary>The review's lots by strain, each strain's lots in review order.</summary>
    private static ILookup<string, LotReview> ByStrain(ReviewResult review) => review.LotReviews.ToLookup(l => l.Lot.Strain, StringComparer.Ordinal);

    private static SugarLines? StrainLinesForChart(ReviewResult review)
    {
        var h = review.HouseFactor;
        var recommended = h.Candidates.FirstOrDefault(c => c.Id == h.Overall?.CandidateId)?.FullFit;
        if (recommended is { Strains.Count: > 0 })
        {
            return recommended;
        }

        return h.Candidates.FirstOrDefault(c => c.Id == "strain-shrunk")?.FullFit;
    }

    private static string CandidateName(ReviewResult review, string id) =>
        review.HouseFactor.Candidates.FirstOrDefault(c => c.Id == id)?.Name ?? id;

    private static void MarkFlagged(Plot plot, IReadOnlyList<LotReview> lots, Func<LotReview, double> x, Func<LotReview, double> y)
    {
        var flagged = lots.Where(l => l.HasStrainFlag && double.IsFinite(x(l)) && double.IsFinite(y(l))).ToArray();
        if (flagged.Length == 0)
        {
            return;
        }

        var rings = ChartStyle.AddMarkers(plot, flagged.Select(x).ToArray(), flagged.Select(y).ToArray(), MarkerShape.OpenCircle, 20, ChartPalette.Flagged, 2.5f);
        rings.LegendText = $"flagged by the strain review ({flagged.Length})";
    }
}
