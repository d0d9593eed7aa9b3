using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;

namespace YieldBench.Core.Forecast;

/// <summary>Everything the forecast produced.</summary>
public sealed record ForecastReport
{
    /// <summary>One forecast per running lot, in input order.</summary>
    public required IReadOnlyList<LotForecast> Lots { get; init; }

    /// <summary>The leave-one-season-out backtest on the history.</summary>
    public required BacktestResult Backtest { get; init; }

    /// <summary>The model learnt from the whole history.</summary>
    public required ForecastModel Model { get; init; }

    /// <summary>Sigmoid form used.</summary>
    public required SigmoidModel Form { get; init; }

    /// <summary>Median over past lots of log(SS Gompertz / SS logistic): below 0 the Gompertz fits better.</summary>
    public required double FormLogRatio { get; init; }

    /// <summary>Past lots with a log.</summary>
    public required int PastLogs { get; init; }

    /// <summary>Past logs whose whole course could not be fitted (too short, too little fall), so they teach nothing.</summary>
    public required int PastLogsNotFitted { get; init; }

    /// <summary>The moment the running readings stand at: the last reading of all running lots (null when none has one).</summary>
    public required DateTime? Now { get; init; }

    /// <summary>Season shift of the running lots per season: posterior mean and sd (log time scale; positive runs faster).</summary>
    public required IReadOnlyDictionary<int, (double Mean, double Sd)> SeasonShifts { get; init; }

    /// <summary>Plain sentences about what the forecast rests on and what it could not use.</summary>
    public required IReadOnlyList<ForecastNote> Notes { get; init; }

    /// <summary>Settings used.</summary>
    public required ForecastSettings Settings { get; init; }
}

/// <summary>A sentence about one running lot (or the whole forecast when <paramref name="LotId"/> is null).</summary>
/// <param name="Season">Season, or null.</param>
/// <param name="LotId">Lot, or null.</param>
/// <param name="Code">Stable kebab-case code.</param>
/// <param name="Message">The sentence.</param>
public sealed record ForecastNote(int? Season, string? LotId, string Code, string Message);

/// <summary>Runs the in-season forecast: learn from the history, backtest, forecast the running lots. Pure.</summary>
public static class ForecastRunner
{
    /// <summary>
    /// Forecasts the running lots from the history's finished lots and logs. Throws <see cref="ArgumentException"/>
    /// when the settings are unusable or the history has too few logs that can be fitted (<see cref="ForecastModel.Train"/>).
    /// </summary>
    public static ForecastReport Run(IReadOnlyList<Lot> historyLots, IReadOnlyList<FermentationLog> historyLogs, IReadOnlyList<RunningLot> running, IReadOnlyList<FermentationLog> runningLogs, ForecastSettings settings)
    {
        ArgumentNullException.ThrowIfNull(historyLots);
        ArgumentNullException.ThrowIfNull(historyLogs);
        ArgumentNullException.ThrowIfNull(running);
        ArgumentNullException.ThrowIfNull(runningLogs);
        ArgumentNullException.ThrowIfNull(settings);
        var problems = settings.Problems();
        if (problems.Count > 0)
        {
            throw new ArgumentException("Forecast settings are not usable: " + string.Join(" ", problems), nameof(settings));
        }

        var courses = LotCourses.FromHistory(historyLots, historyLogs);
        var past = new PastLot[courses.Count];
        Parallel.For(0, courses.Count, i => past[i] = LoggedEvents.Read(courses[i], settings));
        var (form, ratio) = ChooseForm(past, settings);

        // The model of the whole history with the running lots' forecast, and the backtest (its own models), side by
        // side: neither reads what the other makes. A failure of the first (too few fitted logs) is the one reported.
        ForecastReport? forecast = null;
        BacktestResult? backtest = null;
        var failed = new System.Runtime.ExceptionServices.ExceptionDispatchInfo?[2];
        Parallel.Invoke(
            () => Guard(0, () => forecast = Forecast(ForecastModel.Train(past, form, settings), running, runningLogs, settings)),
            () => Guard(1, () => backtest = ForecastBacktest.Run(past, form, settings)));
        void Guard(int slot, Action work)
        {
            try
            {
                work();
            }
            catch (Exception e)
            {
                failed[slot] = System.Runtime.ExceptionServices.ExceptionDispatchInfo.Capture(e);
            }
        }

        failed[0]?.Throw();
        failed[1]?.Throw();
        return forecast! with
        {
            Backtest = backtest!,
            FormLogRatio = ratio,
            PastLogs = courses.Count,
            PastLogsNotFitted = past.Count(p => p.FitOf(form) is null),
        };
    }

    /// <summary>
    /// Forecasts the running lots with a model already trained (the history's lots and logs are not read again, and
    /// no backtest is run: its rows are empty).
    /// </summary>
    public static ForecastReport Run(IReadOnlyList<Lot> historyLots, IReadOnlyList<FermentationLog> historyLogs, IReadOnlyList<RunningLot> running, IReadOnlyList<FermentationLog> runningLogs, ForecastSettings settings, ForecastModel trained)
    {
        ArgumentNullException.ThrowIfNull(historyLots);
        ArgumentNullException.ThrowIfNull(historyLogs);
        ArgumentNullException.ThrowIfNull(trained);
        return Forecast(trained, running, runningLogs, settings) with { PastLogs = trained.LotsUsed };
    }

    private static ForecastReport Forecast(ForecastModel model, IReadOnlyList<RunningLot> running, IReadOnlyList<FermentationLog> runningLogs, ForecastSettings settings)
    {
        ArgumentNullException.ThrowIfNull(running);
        ArgumentNullException.ThrowIfNull(runningLogs);
        ArgumentNullException.ThrowIfNull(settings);
        var allCourses = LotCourses.FromRunning(running, runningLogs);
        var unanchored = allCourses.Where(c => !c.HasClock).ToArray();
        var runningCourses = allCourses.Where(c => c.HasClock).ToArray();
        var stamps = runningLogs.SelectMany(l => l.Readings).Select(r => r.Timestamp).ToArray();
        DateTime? now = stamps.Length > 0 ? stamps.Max() : null;
        var forecasts = new LotForecast[runningCourses.Length];
        var shifts = new Dictionary<int, (double, double)>();
        foreach (var season in runningCourses.Select((c, i) => (c, i)).GroupBy(x => x.c.Season).OrderBy(g => g.Key))
        {
            var members = season.ToArray();
            var (lots, shift, sd) = SeasonForecaster.Run(model, members.Select(x => x.c).ToArray(), settings, now, withCurves: true);
            shifts[season.Key] = (shift, sd);
            for (int k = 0; k < members.Length; k++)
            {
                forecasts[members[k].i] = lots[k];
            }
        }

        return new ForecastReport
        {
            Lots = forecasts,
            Backtest = new BacktestResult([], [], []),
            Model = model,
            Form = model.Form,
            FormLogRatio = double.NaN,
            PastLogs = 0,
            PastLogsNotFitted = 0,
            Now = now,
            SeasonShifts = shifts,
            Notes = [.. unanchored.Select(c => new ForecastNote(c.Season, c.LotId, "no-clock", $"Lot {c.LotId} has neither an inoculation time nor a reading, so nothing fixes its clock and it was not forecast; record its inoculation time or take a first reading.")), .. Notes(forecasts, model)],
            Settings = settings,
        };
    }

    /// <summary>
    /// The sigmoid form that fits the history better: the median, over lots fitted by both, of the log ratio of the
    /// residual sums of squares (each lot counts once, however many readings it has). The setting overrides it.
    /// </summary>
    public static (SigmoidModel Form, double LogRatio) ChooseForm(IReadOnlyList<PastLot> past, ForecastSettings settings)
    {
        ArgumentNullException.ThrowIfNull(past);
        ArgumentNullException.ThrowIfNull(settings);
        var ratios = past.Where(p => p.Gompertz is not null && p.Logistic is not null)
            .Select(p => Math.Log(Math.Max(p.Gompertz!.SumOfSquares, 1e-12) / Math.Max(p.Logistic!.SumOfSquares, 1e-12)))
            .ToArray();
        double ratio = ratios.Length > 0 ? Statistics.Descriptive.Median(ratios) : double.NaN;
        var form = settings.Model ?? (ratio > 0 ? SigmoidModel.Logistic : SigmoidModel.Gompertz);
        return (form, ratio);
    }

    private static List<ForecastNote> Notes(IReadOnlyList<LotForecast> lots, ForecastModel model)
    {
        var notes = new List<ForecastNote>();
        foreach (var f in lots)
        {
            var c = f.Course;
            void Note(string code, string message) => notes.Add(new ForecastNote(c.Season, c.LotId, code, message));
            if (!f.OwnStrainPrior)
            {
                Note("pooled-prior", f.StrainLots == 0
                    ? $"Lot {c.LotId}: the history has no lot of strain {c.Strain}, so the pooled prior of the other strains of its colour stands in (a wider band); its own readings take over as they come."
                    : $"Lot {c.LotId}: the history has only {f.StrainLots} lot(s) of strain {c.Strain}, too few for a prior of its own, so the pooled prior stands in (a wider band).");
            }

            if (c.SugarHours.Length == 0)
            {
                Note("no-readings", $"Lot {c.LotId} has no sugar reading yet: its forecast is the strain's usual course from the inoculation.");
            }

            if (c.InoculationSetAside is { } recorded)
            {
                Note("inoculation-far-from-log", Kinetics.InoculationClock.Message(c.LotId, recorded, c.Origin));
            }
            else if (!c.FromInoculation)
            {
                Note("no-inoculation-time", $"Lot {c.LotId} has no inoculation time: times count from its first reading, and the lag is taken as the history's usual time from inoculation to the first reading ({model.FirstReadingDelay.Median.ToString("0", System.Globalization.CultureInfo.InvariantCulture)} h) shorter.");
            }

            if (c.VolumeL is null)
            {
                Note("no-volume", $"Lot {c.LotId} has no must volume or vessel capacity: the cooling power is not given.");
            }
            else if (c.VolumeIsCapacity)
            {
                Note("volume-from-capacity", $"Lot {c.LotId}: no must volume recorded; the cooling power uses the vessel capacity ({c.VolumeL.Value.ToString("0", System.Globalization.CultureInfo.InvariantCulture)} L), an upper bound.");
            }

            if (c.TempC.Length == 0)
            {
                Note("no-temperature", $"Lot {c.LotId} has no temperature reading: the peak comes from the history alone and no reachable temperature is given.");
            }
        }

        return notes;
    }
}
