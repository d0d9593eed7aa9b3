using YieldBench.Core.Kinetics;
using YieldBench.Core.Statistics;

namespace YieldBench.Core.Forecast;

/// <summary>One forecast of the backtest set beside what happened.</summary>
/// <param name="Season">Held-out season.</param>
/// <param name="LotId">Lot.</param>
/// <param name="Target">"one_third", "dry" or "peak_temp".</param>
/// <param name="Readings">Sugar readings the forecast was cut after.</param>
/// <param name="Truth">What the log shows (hours from the origin, or °C).</param>
/// <param name="Forecast">The forecast.</param>
/// <param name="Line">Straight line through the last two readings.</param>
/// <param name="StrainMedian">The strain's median course, no readings.</param>
/// <param name="Colour">"red" or "white" (whites and rosés), the lot's colour bucket.</param>
public sealed record BacktestCase(int Season, string LotId, string Target, int Readings, double Truth, ForecastValue Forecast, double Line, double StrainMedian, string Colour)
{
    /// <summary>Absolute error of the forecast median.</summary>
    public double Error => Math.Abs(Forecast.Median - Truth);
}

/// <summary>One row of the backtest table: a target at a cut.</summary>
public sealed record BacktestRow(
    string Target,
    int Readings,
    int Lots,
    double Mae,
    double P90,
    double Coverage80,
    double BaselineLineMae,
    double BaselineStrainMae,
    IReadOnlyDictionary<int, double> CoverageBySeason);

/// <summary>The leave-one-season-out backtest.</summary>
/// <param name="Rows">One row per target and cut.</param>
/// <param name="Cases">Every forecast scored.</param>
/// <param name="Seasons">Seasons held out.</param>
public sealed record BacktestResult(IReadOnlyList<BacktestRow> Rows, IReadOnlyList<BacktestCase> Cases, IReadOnlyList<int> Seasons)
{
    /// <summary>The same table for red lots and for white and rosé lots apart (their pace differs: <see cref="ForecastSentences.ByColourHeading"/>).</summary>
    public IReadOnlyList<(string Colour, BacktestRow Row)> ByColour { get; init; } = [];
}

/// <summary>
/// The honest measure: each season is held out in turn; the model learns from the other seasons; every held-out lot
/// with a log is cut after 2, 3, 4 and 6 sugar readings and forecast (the held-out season's lots share their season
/// shift, as lots running together do); each target still ahead at the cut is scored against the log, beside two
/// baselines. Pure and deterministic.
/// </summary>
public static class ForecastBacktest
{
    /// <summary>Targets in table order.</summary>
    public static IReadOnlyList<string> Targets { get; } = ["one_third", "dry", "peak_temp"];

    /// <summary>Runs the backtest; empty when the history has fewer than two seasons with fitted logs.</summary>
    public static BacktestResult Run(IReadOnlyList<PastLot> past, SigmoidModel form, ForecastSettings settings)
    {
        ArgumentNullException.ThrowIfNull(past);
        ArgumentNullException.ThrowIfNull(settings);
        var seasons = past.Where(p => p.FitOf(form) is not null).Select(p => p.Course.Season).Distinct().Order().ToArray();
        var cases = new List<BacktestCase>();
        if (seasons.Length < 2)
        {
            return new BacktestResult([], [], seasons);
        }

        // Each season held out gets its model; each (season, cut) is then forecast on its own, side by side, and the
        // cases are put back in season and cut order.
        // The seasons' models are trained side by side too (each into its own slot).
        var trained = new ForecastModel?[seasons.Length];
        Parallel.For(0, seasons.Length, i =>
        {
            var training = past.Where(p => p.Course.Season != seasons[i]).ToArray();
            if (training.Count(p => p.FitOf(form) is not null) >= 3)
            {
                trained[i] = ForecastModel.Train(training, form, settings);
            }
        });
        var models = new Dictionary<int, ForecastModel>();
        for (int i = 0; i < seasons.Length; i++)
        {
            if (trained[i] is { } m)
            {
                models[seasons[i]] = m;
            }
        }

        var jobs = models.Keys.Order().SelectMany(season => settings.BacktestCuts.Select(cut => (season, cut))).ToArray();
        var results = new List<BacktestCase>[jobs.Length];
        Parallel.For(0, jobs.Length, i =>
        {
            var (season, cut) = jobs[i];
            var model = models[season];
            var lots = past.Where(p => p.Course.Season == season && p.Course.SugarHours.Length > cut).ToArray();
            var found = new List<BacktestCase>();
            if (lots.Length > 0)
            {
                var courses = lots.Select(p => p.Course.Cut(cut)).ToArray();
                var (forecasts, _, _) = SeasonForecaster.Run(model, courses, settings, null, withCurves: false);
                for (int k = 0; k < lots.Length; k++)
                {
                    found.AddRange(Score(lots[k], courses[k], forecasts[k], model, cut, settings));
                }
            }

            results[i] = found;
        });
        foreach (var r in results)
        {
            cases.AddRange(r);
        }

        var byColour = new List<(string, BacktestRow)>();
        foreach (var colour in new[] { "red", "white" })
        {
            byColour.AddRange(Table(cases.Where(c => c.Colour == colour).ToList(), settings).Select(r => (colour, r)));
        }

        return new BacktestResult(Table(cases, settings), cases, seasons) { ByColour = byColour };
    }

    private static List<BacktestRow> Table(List<BacktestCase> cases, ForecastSettings settings)
    {
        var rows = new List<BacktestRow>();
        foreach (var target in Targets)
        {
            foreach (int cut in settings.BacktestCuts)
            {
                var set = cases.Where(x => x.Target == target && x.Readings == cut).ToArray();
                if (set.Length == 0)
                {
                    continue;
                }

                var errors = Descriptive.ToSortedArray(set.Select(x => x.Error));
                var bySeason = set.GroupBy(x => x.Season).OrderBy(g => g.Key).ToDictionary(g => g.Key, g => g.Count(x => x.Forecast.Covers(x.Truth)) / (double)g.Count());
                rows.Add(new BacktestRow(
                    target,
                    cut,
                    set.Length,
                    errors.Average(),
                    Descriptive.QuantileOfSorted(errors, 0.9),
                    set.Count(x => x.Forecast.Covers(x.Truth)) / (double)set.Length,
                    set.Average(x => Math.Abs(x.Line - x.Truth)),
                    set.Average(x => Math.Abs(x.StrainMedian - x.Truth)),
                    bySeason));
            }
        }

        return rows;
    }

    /// <summary>A forecast median used for scoring: an endless one is taken as 1000 h after the cut.</summary>
    private static ForecastValue Finite(ForecastValue v, double cutHours) =>
        new(Math.Min(v.Median, cutHours + 1000), v.Low, v.High);

    private static IEnumerable<BacktestCase> Score(PastLot lot, LotCourse cut, LotForecast f, ForecastModel model, int readings, ForecastSettings settings)
    {
        var c = lot.Course;
        double cutAt = cut.SugarHours[^1];
        var med = model.MediansFor(c.Strain);
        string colour = model.BucketOf(c);
        double firstAt = c.SugarHours[0];
        double Strain(double fromInoculation, double fromFirst) => c.FromInoculation ? fromInoculation : firstAt + fromFirst;
        double level = LoggedEvents.DepletionLevel(c, settings);
        var (t1, b1, t2, b2) = (cut.SugarHours[^2], cut.SugarBrix[^2], cut.SugarHours[^1], cut.SugarBrix[^1]);
        double slope = (b1 - b2) / (t2 - t1);
        double Line(double target, double fallback) => slope > 0 && b2 > target ? t2 + ((b2 - target) / slope) : fallback;

        if (lot.OneThirdHours is { } third && third > cutAt && f.OneThirdHours is { } ft)
        {
            double strain = Strain(med.OneThirdHours, med.OneThirdFromFirst);
            yield return new BacktestCase(c.Season, c.LotId, "one_third", readings, third, Finite(ft, cutAt), Line(level, strain), strain, colour);
        }

        if (lot.DryHours is { } dry && dry > cutAt && f.DryHours is { } fd)
        {
            double strain = Strain(med.DryHours, med.DryFromFirst);
            yield return new BacktestCase(c.Season, c.LotId, "dry", readings, dry, Finite(fd, cutAt), Line(settings.Kinetics.DryBrix, strain), strain, colour);
        }

        double lastTemp = cut.TempHours.Length > 0 ? cut.TempHours[^1] : double.NegativeInfinity;
        if (lot.PeakC is { } peak && lot.PeakHours > lastTemp && f.PeakC is { } fp)
        {
            // The line baseline: the temperature trend of the last two temperature readings, followed to the time the
            // sugar line reaches half the starting sugar (about when a ferment runs hottest), never below the highest so far.
            double soFar = cut.TempC.Length > 0 ? cut.TempC.Max() : double.NaN;
            double line = double.IsNaN(soFar) ? med.PeakC : soFar;
            if (cut.TempC.Length >= 2)
            {
                double th = Line(c.StartBrix / 2, double.NaN);
                double tSlope = (cut.TempC[^1] - cut.TempC[^2]) / (cut.TempHours[^1] - cut.TempHours[^2]);
                if (double.IsFinite(th) && double.IsFinite(tSlope))
                {
                    line = Math.Max(soFar, cut.TempC[^1] + (tSlope * (th - cut.TempHours[^1])));
                }
            }

            yield return new BacktestCase(c.Season, c.LotId, "peak_temp", readings, peak, fp, line, med.PeakC, colour);
        }
    }
}
