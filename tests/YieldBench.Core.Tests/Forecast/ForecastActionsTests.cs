using YieldBench.Core.Forecast;
using YieldBench.Core.Lots;

namespace YieldBench.Core.Tests.Forecast;

/// <summary>The forecast as a cellar's to-do list: what cannot wait first, then today, tomorrow and later, soonest first.</summary>
public sealed class ForecastActionsTests
{
    private static readonly DateTime Origin = new(2026, 9, 16, 8, 0, 0);

    /// <summary>"Now": Fri 18 Sep 17:00, 57 h after the origin.</summary>
    private static readonly DateTime Now = Origin.AddHours(57);

    private static LotForecast Lot(string id, double? oneThird, double? dry, double peak = 28, double stuck = 0.01, double lastReading = 57, bool oneThirdPassed = false)
    {
        var course = new LotCourse
        {
            Season = 2026,
            LotId = id,
            Strain = "YB-R12",
            Colour = WineColour.Red,
            StartBrix = 24,
            Origin = Origin,
            FromInoculation = true,
            SugarHours = [2, lastReading],
            SugarBrix = [24, 20],
            SugarSources = [null, null],
            TempHours = [],
            TempC = [],
        };
        return new LotForecast
        {
            Course = course,
            OwnStrainPrior = true,
            StrainLots = 20,
            OneThirdBrix = 16,
            OneThirdHours = oneThird is { } t ? new ForecastValue(t, t - 3, t + 4) : null,
            OneThirdPassed = oneThirdPassed,
            DryHours = dry is { } d ? new ForecastValue(d, d - 20, d + 30) : new ForecastValue(double.PositiveInfinity, 150, double.PositiveInfinity),
            NeverDryChance = dry is null ? 0.9 : 0.01,
            PeakC = new ForecastValue(peak, peak - 0.5, peak + 0.5),
            ReachableC = 45,
            CoolingKw = 1,
            SettlesAtBrix = dry is null ? 7.5 : -1.5,
            PeakRateBrixPerDay = 6,
            StuckRisk = stuck,
            NextReadingHours = 62,
            NextReadingFor = "one-third",
            NowHours = 57,
            SeasonShift = 0,
            Curve = new ForecastCurve([], [], [], [], [], [], [], []),
            DangerC = 40,
            CautionC = 35,
        };
    }

    private static ForecastReport Report(params LotForecast[] lots) => new()
    {
        Lots = lots,
        Backtest = new BacktestResult([], [], []),
        Model = null!,
        Form = YieldBench.Core.Kinetics.SigmoidModel.Gompertz,
        FormLogRatio = -0.4,
        PastLogs = 0,
        PastLogsNotFitted = 0,
        Now = Now,
        SeasonShifts = new Dictionary<int, (double, double)>(),
        Notes = [],
        Settings = ForecastSettings.Default,
    };

    [Fact]
    public void Lots_that_cannot_wait_come_first_then_today_tomorrow_and_later_each_soonest_first()
    {
        // Given lots in id order: one-third tomorrow 10:00, dry on Tue 22 Sep, one-third today 19:00, a peak over the
        // 40 °C danger threshold, a likely stuck end, one-third tomorrow 06:00, a log that stopped two days ago
        var report = Report(
            Lot("26-01", oneThird: 74, dry: 150),                 // Sat 19 Sep 10:00
            Lot("26-02", oneThird: 20, dry: 146, oneThirdPassed: true), // dry Tue 22 Sep 10:00
            Lot("26-03", oneThird: 59, dry: 140),                 // Fri 18 Sep 19:00
            Lot("26-04", oneThird: 61, dry: 130, peak: 41.2),     // cool now
            Lot("26-05", oneThird: 20, dry: null, stuck: 0.8, oneThirdPassed: true),
            Lot("26-06", oneThird: 70, dry: 150, stuck: 0.3),     // Sat 19 Sep 06:00, watch
            Lot("26-07", oneThird: 80, dry: 160, lastReading: 9)); // read last Wed 16 Sep 17:00

        // When the to-do list is made
        var plan = ForecastActions.Plan(report);

        // Then the order is: the peak past danger, the stuck end, the stopped log; today 19:00; tomorrow 06:00 and 10:00; later
        Assert.Equal(["26-04", "26-05", "26-07", "26-03", "26-06", "26-01", "26-02"], plan.Select(a => a.Forecast.Course.LotId));
        Assert.Equal(
            [ActionDay.Now, ActionDay.Now, ActionDay.Now, ActionDay.Today, ActionDay.Tomorrow, ActionDay.Tomorrow, ActionDay.Later],
            plan.Select(a => a.Day));
        Assert.Equal("cool now: peak 41.2 °C expected, over the 40 °C danger threshold", Assert.Single(plan[0].Urgent));
        Assert.Equal("stuck risk 80 %: check nitrogen and temperature, plan a restart", Assert.Single(plan[1].Urgent));
        Assert.Equal("log stopped Wed 16 Sep 17:00: take a reading now", Assert.Single(plan[2].Urgent));
        Assert.Equal("stuck risk 30 %: watch it closely", Assert.Single(plan[4].Watch));
        Assert.Equal("nutrient at one-third, 16.0 °Brix", plan[3].Step);
        Assert.Equal("16:00–23:00", plan[3].Range);
        Assert.Equal(new DateTime(2026, 9, 22, 10, 0, 0), plan[6].Due);
        Assert.Equal("dry", plan[6].Step);
    }

    [Fact]
    public void The_console_list_gives_one_line_a_lot_under_its_day()
    {
        // Given one lot due today, one tomorrow and one later
        var report = Report(Lot("26-01", oneThird: 74, dry: 150), Lot("26-03", oneThird: 59, dry: 140), Lot("26-02", oneThird: 20, dry: 146, oneThirdPassed: true));

        // When the console lines are made
        var lines = ForecastActions.Lines(report, "out/forecast.xlsx");

        // Then a heading, and each lot on one line under its day, with the time, the step and the next reading
        Assert.Equal(
        [
            "Forecast for 3 running lot(s) of 2026 (readings stand at Fri 18 Sep 17:00): 0 to act on now, 0 to watch; each lot's next step, soonest first (every lot in full: out/forecast.xlsx).",
            "Today, Fri 18 Sep (1 lot(s)):",
            "  26-03  YB-R12  19:00  nutrient at one-third, 16.0 °Brix (80 % 16:00–23:00); read 22:00",
            "Tomorrow, Sat 19 Sep (1 lot(s)):",
            "  26-01  YB-R12  10:00  nutrient at one-third, 16.0 °Brix (80 % 07:00–14:00); read 22:00",
            "Later (1 lot(s)):",
            "  26-02  YB-R12  Tue 22 Sep  dry (80 % 21 Sep–23 Sep), then lab residual sugar; read 22:00",
        ], lines);
    }
}
