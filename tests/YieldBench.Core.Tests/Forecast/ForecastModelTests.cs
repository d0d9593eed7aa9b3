using YieldBench.Core.Forecast;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;

namespace YieldBench.Core.Tests.Forecast;

public class ForecastModelTests
{
    private static readonly ForecastSettings Settings = ForecastSettings.Default;

    [Theory]
    [InlineData(SigmoidModel.Gompertz)]
    [InlineData(SigmoidModel.Logistic)]
    public void The_scaled_sigmoid_is_the_kinetics_codes_Zwietering_curve_divided_by_its_asymptote(SigmoidModel model)
    {
        // Given A = 25 °Brix, μm = 0.2 °Brix/h, λ = 12 h: κ = μm/A
        double a = 25, mu = 0.2, lambda = 12;
        foreach (double t in new[] { -5.0, 0, 12, 40, 90, 300 })
        {
            // Then h(t) = y(t)/A, and the time at a share inverts it
            double y = ZwieteringFit.Evaluate(model, a, mu, lambda, t);
            Assert.Equal(y / a, SigmoidShape.Value(model, mu / a, lambda, t), 12);
            if (y / a is > 1e-9 and < 1 - 1e-9)
            {
                Assert.Equal(t, SigmoidShape.TimeAt(model, mu / a, lambda, y / a), 6);
            }
        }

        // And the steepest slope of h is κ, at the steepest time
        double steep = SigmoidShape.SteepestAt(model, mu / a, lambda);
        Assert.Equal(mu / a, SigmoidShape.Slope(model, mu / a, lambda, steep), 12);
        Assert.True(SigmoidShape.Slope(model, mu / a, lambda, steep + 1) < mu / a && SigmoidShape.Slope(model, mu / a, lambda, steep - 1) < mu / a);
    }

    [Fact]
    public void A_whole_course_fit_recovers_the_start_the_end_the_rate_and_the_lag_of_a_synthetic_log()
    {
        // Given a synthetic log with known S0 24.6, F −1.9, μm 0.19 °Brix/h, λ 15 h and 0.15 °Brix of noise
        var cellar = new SyntheticCellar(11);
        var truth = new SyntheticCellar.Truth(24.6, -1.9, 0.19, 15, 19, 30);
        var log = cellar.Log("T-1", 2030, truth, new DateTime(2030, 9, 1, 10, 0, 0), 1e9);
        var course = LotCourses.FromHistory([cellar.Lot("T-1", 2030, "SX-1", WineColour.Red, truth, new DateTime(2030, 9, 1, 10, 0, 0))], [log])[0];

        // When the modified Gompertz is fitted by variable projection
        var fit = CourseFit.Fit(SigmoidModel.Gompertz, course.SugarHours, course.SugarBrix)!;

        // Then each parameter comes back within what 0.15 °Brix of noise allows, and the residual is the noise
        Assert.Equal(24.6, fit.StartBrix, 0.3);
        Assert.Equal(-1.9, fit.FinalBrix, 0.3);
        Assert.Equal(0.19, fit.MaxRateBrixPerHour, 0.012);
        Assert.Equal(15, fit.LagHours, 2.5);
        Assert.InRange(fit.Rmse, 0.08, 0.22);
    }

    [Theory]
    [InlineData(SigmoidModel.Gompertz)]
    [InlineData(SigmoidModel.Logistic)]
    public void A_log_that_falls_in_a_straight_line_gets_no_curve_whose_must_lies_far_above_its_readings(SigmoidModel model)
    {
        // Given a log read twice a day for 7 days that falls nearly in a straight line from 24.6 to 3.1 °Brix and stops
        // there (a cellar's log of 2025; such a log once gave a fitted must of 101 °Brix, which stopped the forecast)
        double[] hours = Enumerable.Range(0, 14).Select(k => 12.0 * k).ToArray();
        double[] brix = [24.6, 24.1, 22.9, 21.2, 19.6, 17.9, 16.2, 14.6, 12.9, 11.1, 9.4, 7.8, 5.2, 3.1];

        // When it is fitted
        var fit = CourseFit.Fit(model, hours, brix);

        // Then there is no fit, or one whose must lies within 8 °Brix of the highest reading and whose settling point a
        // hydrometer can read
        if (fit is not null)
        {
            Assert.InRange(fit.StartBrix, 20, 24.6 + CourseFit.MostStartAboveReadings);
            Assert.True(fit.FinalBrix >= -6, $"settling point {fit.FinalBrix}");
        }
    }

    [Fact]
    public void The_model_learns_each_strains_rate_and_the_history_prefers_the_form_that_made_it()
    {
        // Given four seasons of a synthetic cellar whose courses are modified Gompertz curves
        var cellar = new SyntheticCellar(3);
        var (lots, logs, truths, _) = cellar.History(2020, 4, 36);
        var past = LotCourses.FromHistory(lots, logs).Select(c => LoggedEvents.Read(c, Settings)).ToArray();

        // When the form is chosen and the model trained
        var (form, ratio) = ForecastRunner.ChooseForm(past, Settings);
        var model = ForecastModel.Train(past, form, Settings);

        // Then the Gompertz wins, and each strain's prior log rate is the mean log rate of its 48 lots, to 0.05
        // (12 % scatter: the mean's sd is 0.02)
        Assert.Equal(SigmoidModel.Gompertz, form);
        Assert.True(ratio < 0);
        foreach (var (strain, _, _, _, _) in SyntheticCellar.Strains)
        {
            var course = past.First(p => p.Course.Strain == strain).Course;
            var prior = model.RatePriorFor(course);
            double truth = lots.Where(l => l.Strain == strain).Average(l => Math.Log(truths[(l.Season, l.LotId)].Rate));
            Assert.True(prior.OwnStrain);
            Assert.True(Math.Abs(prior.LogMu - truth) < 0.05, $"{strain}: prior {prior.LogMu:0.000}, truth {truth:0.000}");
        }

        // And the reading noise is the 0.15 °Brix the logs were made with (rounded to 0.1 °Brix)
        Assert.InRange(model.SugarSd, 0.13, 0.19);
    }

    [Fact]
    public void Each_colour_gets_the_lot_to_lot_rate_scatter_of_its_own_lots()
    {
        // Given four seasons of a synthetic cellar whose whites scatter by 25 % in log rate and reds by 10 %
        var cellar = new SyntheticCellar(5) { RateSd = 0.10, WhiteRateSd = 0.25 };
        var (lots, logs, _, _) = cellar.History(2020, 4, 36);
        var past = LotCourses.FromHistory(lots, logs).Select(c => LoggedEvents.Read(c, Settings)).ToArray();

        // When the model is trained
        var model = ForecastModel.Train(past, SigmoidModel.Gompertz, Settings);

        // Then each colour's scatter of log μm is near its own (48 whites, 96 reds: the sd of an sd estimate is
        // about sd/√(2n), 0.026 and 0.007), the pooled one between them, and a white lot's prior is the wider
        var white = past.First(p => p.Course.Colour == WineColour.White).Course;
        var red = past.First(p => p.Course.Colour == WineColour.Red).Course;
        Assert.InRange(Math.Sqrt(model.WithinFor(white).Vmm), 0.19, 0.31);
        Assert.InRange(Math.Sqrt(model.WithinFor(red).Vmm), 0.08, 0.125);
        Assert.InRange(Math.Sqrt(model.Within.Vmm), Math.Sqrt(model.WithinFor(red).Vmm), Math.Sqrt(model.WithinFor(white).Vmm));
        Assert.True(model.RatePriorFor(white).Vmm > 2 * model.RatePriorFor(red).Vmm);
    }

    [Fact]
    public void The_interval_narrows_as_readings_arrive()
    {
        // Given the history and one new lot of a known strain
        var (model, cellar) = Trained(5);
        var truth = new SyntheticCellar.Truth(24, -1.8, 0.2, 14, 19, 30);
        var inoc = new DateTime(2030, 9, 10, 9, 0, 0);
        var whole = cellar.Log("30-001", 2030, truth, inoc, 1e9);
        var running = cellar.Running("30-001", 2030, "SX-1", WineColour.Red, truth, inoc);

        // When it is forecast after 1, 2, 3 and 4 readings (one-third comes near 60 h, after the fifth reading)
        var widths = new List<double>();
        foreach (int k in new[] { 1, 2, 3, 4 })
        {
            var cut = new FermentationLog("30-001", 2030, whole.Readings.Take(k).ToArray());
            var course = LotCourses.FromRunning([running], [cut]);
            var f = SeasonForecaster.Run(model, course, Settings, null, withCurves: false).Lots[0];
            widths.Add(f.OneThirdHours!.Value.High - f.OneThirdHours.Value.Low);
        }

        // Then each reading narrows the 80 % interval of the one-third time
        for (int i = 1; i < widths.Count; i++)
        {
            Assert.True(widths[i] < widths[i - 1], $"width after {i + 1} readings {widths[i]:0.0} h is not below {widths[i - 1]:0.0} h");
        }

        Assert.True(widths[^1] < 0.6 * widths[0]);
    }

    [Fact]
    public void Intervals_hold_the_truth_about_80_percent_of_the_time_on_lots_drawn_from_a_known_prior()
    {
        // Given five seasons drawn from the model itself (season shifts of sd 0.10, lots scattered around their strain)
        var cellar = new SyntheticCellar(17);
        var (lots, logs, _, _) = cellar.History(2020, 5, 30);
        var past = LotCourses.FromHistory(lots, logs).Select(c => LoggedEvents.Read(c, Settings)).ToArray();

        // When each season is held out and its lots forecast after 2, 3, 4 and 6 readings
        var result = ForecastBacktest.Run(past, SigmoidModel.Gompertz, Settings);

        // Then the 80 % intervals hold the truth in about 80 % of cases (150 lots: a binomial sd of about 3 points)
        foreach (var row in result.Rows.Where(r => r.Target is "one_third" or "dry"))
        {
            Assert.True(row.Coverage80 is >= 0.70 and <= 0.90, $"{row.Target} after {row.Readings}: coverage {row.Coverage80:0.00} ({string.Join(", ", result.Rows.Select(r => $"{r.Target}/{r.Readings} {r.Coverage80:0.00}"))})");
        }

        // And the forecast beats both baselines at every cut
        Assert.All(result.Rows, r => Assert.True(r.Mae < r.BaselineLineMae && r.Mae < r.BaselineStrainMae, $"{r.Target} after {r.Readings}: {r.Mae:0.00} vs {r.BaselineLineMae:0.00} and {r.BaselineStrainMae:0.00}"));
    }

    [Fact]
    public void A_running_lot_of_a_strain_the_history_lacks_gets_the_pooled_prior_a_wider_band_and_a_note()
    {
        // Given the history and two new lots with the same readings, one of a known strain and one of a strain never seen
        var (model, cellar) = Trained(7);
        var truth = new SyntheticCellar.Truth(24, -1.8, 0.18, 16, 19, 30);
        var inoc = new DateTime(2030, 9, 10, 9, 0, 0);
        var whole = cellar.Log("x", 2030, truth, inoc, 1e9);
        var cut = whole.Readings.Take(2).ToArray();
        var known = cellar.Running("30-001", 2030, "SX-1", WineColour.Red, truth, inoc);
        var unknown = known with { LotId = "30-002", Strain = "ZZ-9" };
        var respelt = known with { LotId = "30-003", Strain = "sx 1" };

        // When both are forecast (and the known strain once more under another spelling)
        var report = ForecastRunner.Run(Array.Empty<Lot>(), [], [known, unknown, respelt], [new FermentationLog("30-001", 2030, cut), new FermentationLog("30-002", 2030, cut), new FermentationLog("30-003", 2030, cut)], Settings, model);

        // Then the unknown strain stands on the pooled prior, with a wider interval, and a note says so
        var (a, b) = (report.Lots[0], report.Lots[1]);
        Assert.True(a.OwnStrainPrior);
        Assert.False(b.OwnStrainPrior);
        Assert.Equal(0, b.StrainLots);
        Assert.True(b.OneThirdHours!.Value.High - b.OneThirdHours.Value.Low > a.OneThirdHours!.Value.High - a.OneThirdHours.Value.Low, $"{b.OneThirdHours} vs {a.OneThirdHours}");
        Assert.Contains(report.Notes, n => n.LotId == "30-002" && n.Code == "pooled-prior" && n.Message.Contains("ZZ-9", StringComparison.Ordinal));

        // And a strain written in another case or with other punctuation is the same strain (intake's spelling rule)
        Assert.True(report.Lots[2].OwnStrainPrior);
        Assert.Equal(a.OneThirdHours, report.Lots[2].OneThirdHours);
    }

    [Fact]
    public void A_running_log_with_one_reading_and_a_lot_with_none_are_forecast_from_their_strain()
    {
        // Given a lot with one reading and one with no log at all
        var (model, cellar) = Trained(9);
        var truth = new SyntheticCellar.Truth(24, -1.8, 0.2, 14, 19, 30);
        var inoc = new DateTime(2030, 9, 10, 9, 0, 0);
        var one = cellar.Running("30-001", 2030, "SX-1", WineColour.Red, truth, inoc);
        var none = one with { LotId = "30-002" };
        var log = new FermentationLog("30-001", 2030, cellar.Log("30-001", 2030, truth, inoc, 1e9).Readings.Take(1).ToArray());

        // When forecast
        var report = ForecastRunner.Run(Array.Empty<Lot>(), [], [one, none], [log], Settings, model);

        // Then both have finite one-third and dry times with intervals around them, the one reading counted
        Assert.Equal(1, report.Lots[0].ReadingsUsed);
        Assert.Equal(0, report.Lots[1].ReadingsUsed);
        foreach (var f in report.Lots)
        {
            var third = f.OneThirdHours!.Value;
            Assert.True(third.Low < third.Median && third.Median < third.High && double.IsFinite(third.High));
            Assert.True(third.Median is > 30 and < 120, $"{f.Course.LotId}: {third}");
        }

        Assert.Contains(report.Notes, n => n.LotId == "30-002" && n.Code == "no-readings");
    }

    [Fact]
    public void A_history_too_small_to_measure_how_lots_differ_is_refused_with_how_many_lots_are_needed()
    {
        // Given a small cellar's history: one season of three lots with logs, one of each strain (a Spanish cellar's
        // three logged lots once stopped the forecast with "Index was out of range")
        var cellar = new SyntheticCellar(21);
        var (lots, logs, _, _) = cellar.History(2025, 1, 3);
        var truth = new SyntheticCellar.Truth(24, -1.8, 0.2, 14, 19, 30);
        var running = cellar.Running("26-001", 2026, "SX-1", WineColour.Red, truth, new DateTime(2026, 9, 10, 9, 0, 0));

        // When a forecast is asked for
        var e = Assert.Throws<ArgumentException>(() => ForecastRunner.Run(lots, logs, [running], [], Settings));

        // Then it is refused in words, naming the lots needed, not with an index error or NaN intervals
        Assert.Contains("needs at least", e.Message, StringComparison.Ordinal);
        Assert.Contains("3 could be", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_ferment_levelling_off_well_above_dry_gets_a_high_stuck_risk_and_an_ordinary_one_a_low_one()
    {
        // Given two lots after four days, one that will settle at 7 °Brix and one that finishes
        var (model, cellar) = Trained(13);
        var inoc = new DateTime(2030, 9, 10, 9, 0, 0);
        var stuck = new SyntheticCellar.Truth(26, 7.0, 0.2, 12, 19, 30);
        var fine = new SyntheticCellar.Truth(26, -1.8, 0.2, 12, 19, 30);
        var lots = new[] { cellar.Running("30-001", 2030, "SX-1", WineColour.Red, stuck, inoc), cellar.Running("30-002", 2030, "SX-1", WineColour.Red, fine, inoc) };
        var logs = new[] { cellar.Log("30-001", 2030, stuck, inoc, 100), cellar.Log("30-002", 2030, fine, inoc, 100) };

        // When forecast
        var report = ForecastRunner.Run(Array.Empty<Lot>(), [], lots, logs, Settings, model);

        // Then the first is called likely to stick, near where it settles, and the second not
        Assert.True(report.Lots[0].StuckRisk > 0.5, $"stuck risk {report.Lots[0].StuckRisk:0.00}");
        Assert.InRange(report.Lots[0].SettlesAtBrix, 5, 9);
        Assert.True(report.Lots[1].StuckRisk < 0.1, $"stuck risk {report.Lots[1].StuckRisk:0.00}");
    }

    [Fact]
    public void A_lot_whose_readings_already_went_dry_is_dry_since_they_crossed_the_dry_reading_not_forecast()
    {
        // Given a lot logged until a day after it went dry (the synthetic log stops one day past dryness)
        var (model, cellar) = Trained(17);
        var inoc = new DateTime(2030, 9, 10, 9, 0, 0);
        var truth = new SyntheticCellar.Truth(24, -1.8, 0.2, 14, 19, 30);
        var lot = cellar.Running("30-001", 2030, "SX-1", WineColour.Red, truth, inoc);
        var log = cellar.Log("30-001", 2030, truth, inoc, 900);
        Assert.True(log.Readings[^1].Sugar!.Value.Brix <= 0, "the log ends dry");

        // When forecast
        var f = ForecastRunner.Run(Array.Empty<Lot>(), [], [lot], [log], Settings, model).Lots[0];

        // Then the dry time is where the readings first crossed 0 °Brix (linear between the two readings around it),
        // with no spread, no stuck risk and no heat still to come in the sentences; the next step is the lab analysis
        var hours = log.Readings.Select(r => (r.Timestamp - inoc).TotalHours).ToArray();
        var brix = log.Readings.Select(r => r.Sugar!.Value.Brix).ToArray();
        int k = Array.FindIndex(brix, b => b <= 0);
        double crossing = hours[k - 1] + ((hours[k] - hours[k - 1]) * brix[k - 1] / (brix[k - 1] - brix[k]));
        Assert.True(f.DryReached);
        Assert.Equal(crossing, f.DryHours!.Value.Median, 6);
        Assert.Equal(f.DryHours.Value.Median, f.DryHours.Value.Low);
        Assert.Equal(f.DryHours.Value.Median, f.DryHours.Value.High);
        Assert.Equal(0, f.StuckRisk);
        string text = string.Join("\n", ForecastSentences.Lot(f));
        Assert.Contains($"Dry: the readings passed 0.0 °Brix {ForecastSentences.When(inoc.AddHours(crossing))}", text, StringComparison.Ordinal);
        Assert.Contains("confirm it with a lab residual-sugar analysis", text, StringComparison.Ordinal);
        Assert.DoesNotContain("could reach", text, StringComparison.Ordinal);
        Assert.DoesNotContain("stuck end", text, StringComparison.Ordinal);

        // And a lot cut before it went dry is still forecast, with a spread
        var early = new FermentationLog("30-001", 2030, log.Readings.Take(k).ToArray());
        var g = ForecastRunner.Run(Array.Empty<Lot>(), [], [lot], [early], Settings, model).Lots[0];
        Assert.False(g.DryReached);
        Assert.True(g.DryHours!.Value.High > g.DryHours.Value.Low);
    }

    [Fact]
    public void A_running_lot_whose_inoculation_lies_a_year_from_its_readings_counts_from_its_first_reading_and_says_so()
    {
        // Given a running lot whose log is dated 2030 but whose inoculation was typed as 2029
        var (model, cellar) = Trained(19);
        var inoc = new DateTime(2030, 9, 10, 9, 0, 0);
        var truth = new SyntheticCellar.Truth(24, -1.8, 0.2, 14, 19, 30);
        var typed = cellar.Running("30-001", 2030, "SX-1", WineColour.Red, truth, inoc.AddYears(-1));
        var log = cellar.Log("30-001", 2030, truth, inoc, 30);

        // When forecast
        var report = ForecastRunner.Run(Array.Empty<Lot>(), [], [typed], [log], Settings, model);

        // Then its clock starts at its first reading, a note names the gap and what to check, and it is forecast
        var f = Assert.Single(report.Lots);
        Assert.False(f.Course.FromInoculation);
        Assert.Equal(log.Readings.Min(r => r.Timestamp), f.Course.Origin);
        var note = Assert.Single(report.Notes, n => n.Code == "inoculation-far-from-log");
        Assert.Contains("365 days after the recorded inoculation (2029-09-10 09:00)", note.Message, StringComparison.Ordinal);
        Assert.DoesNotContain(report.Notes, n => n.Code == "no-inoculation-time");
        Assert.True(double.IsFinite(f.OneThirdHours!.Value.Median) && f.OneThirdHours.Value.Median < 200, $"one-third at {f.OneThirdHours.Value.Median:0} h");
    }

    [Fact]
    public void The_charts_temperature_band_carries_the_peaks_own_uncertainty()
    {
        // Given a lot with its first readings (20 h), its peak still far ahead
        var (model, cellar) = Trained(5);
        var truth = new SyntheticCellar.Truth(24, -1.8, 0.2, 14, 19, 30);
        var inoc = new DateTime(2030, 9, 10, 9, 0, 0);
        var lot = cellar.Running("30-001", 2030, "SX-1", WineColour.Red, truth, inoc);
        var log = cellar.Log("30-001", 2030, truth, inoc, 20);
        var f = ForecastRunner.Run(Array.Empty<Lot>(), [], [lot], [log], Settings, model).Lots[0];

        // When the chart's course is laid out
        var curve = f.Curve;
        int top = Array.IndexOf(curve.TempMedian, curve.TempMedian.Max());

        // Then its temperature band at the forecast top is about as wide as the peak's own 80 % interval (the interval
        // adds how far the highest reading falls from the curve's top), not only the spread of the rate and lag
        double band = curve.TempHigh[top] - curve.TempLow[top];
        double interval = f.PeakC!.Value.High - f.PeakC.Value.Low;
        Assert.True(band > 0.6 * interval && band < 1.3 * interval, $"band {band:0.00} °C at the top, peak interval {interval:0.00} °C");

        // And the grid holds the moment of the last reading, where the reachable course starts
        double now = f.Course.SugarHours[^1];
        int at = Array.IndexOf(curve.Hours, now);
        Assert.True(at > 0 && double.IsFinite(curve.ReachableC[at]) && double.IsNaN(curve.ReachableC[at - 1]), $"reachable course starts at {curve.Hours.Zip(curve.ReachableC).FirstOrDefault(x => double.IsFinite(x.Second)).First:0.0} h, last reading {now:0.0} h");
    }

    [Fact]
    public void The_same_inputs_give_the_same_forecast()
    {
        var (model, cellar) = Trained(21);
        var truth = new SyntheticCellar.Truth(24, -1.8, 0.2, 14, 19, 30);
        var inoc = new DateTime(2030, 9, 10, 9, 0, 0);
        var lot = cellar.Running("30-001", 2030, "SX-1", WineColour.Red, truth, inoc);
        var log = cellar.Log("30-001", 2030, truth, inoc, 50);
        var a = ForecastRunner.Run(Array.Empty<Lot>(), [], [lot], [log], Settings, model).Lots[0];
        var b = ForecastRunner.Run(Array.Empty<Lot>(), [], [lot], [log], Settings, model).Lots[0];
        Assert.Equal(a.OneThirdHours, b.OneThirdHours);
        Assert.Equal(a.DryHours, b.DryHours);
        Assert.Equal(a.PeakC, b.PeakC);
        Assert.Equal(a.Curve.BrixMedian, b.Curve.BrixMedian);
    }

    /// <summary>A model trained on three seasons of a synthetic cellar, and the cellar to draw new lots from.</summary>
    [Fact]
    public void A_strain_with_two_past_lots_does_not_make_an_ordinary_lot_look_sluggish()
    {
        // Given three seasons of 30 lots, and two more lots of a strain new to the cellar (SX-9) that ferments like SX-1
        var cellar = new SyntheticCellar(17);
        var (lots, logs, _, _) = cellar.History(2020, 3, 30);
        var like = SyntheticCellar.Strains[0];
        foreach (int i in new[] { 1, 2 })
        {
            var t = new SyntheticCellar.Truth(24, -1.8, like.Rate, like.Lag, 19, like.Peak);
            var inoc = new DateTime(2022, 9, 20 + i, 10, 0, 0);
            lots.Add(cellar.Lot($"22-9{i:00}", 2022, "SX-9", WineColour.Red, t, inoc));
            logs.Add(cellar.Log($"22-9{i:00}", 2022, t, inoc, 1e9));
        }

        var past = LotCourses.FromHistory(lots, logs).Select(c => LoggedEvents.Read(c, Settings)).ToArray();
        var model = ForecastModel.Train(past, SigmoidModel.Gompertz, Settings);

        // When a running SX-9 lot a little slower than its two past lots (7 % lower rate, well within a strain's usual
        // 12 % scatter) is forecast after five readings
        var truth = new SyntheticCellar.Truth(24, -1.8, like.Rate * 0.93, like.Lag, 19, like.Peak);
        var start = new DateTime(2030, 9, 10, 9, 0, 0);
        var running = cellar.Running("30-001", 2030, "SX-9", WineColour.Red, truth, start);
        var cut = new FermentationLog("30-001", 2030, cellar.Log("30-001", 2030, truth, start, 1e9).Readings.Take(5).ToArray());
        var report = ForecastRunner.Run(Array.Empty<Lot>(), [], [running], [cut], Settings, model);

        // Then a late finish is measured against more than the slower of its two past lots (about a typical lot): the
        // strain's median time times the slowest-to-median ratio of the strains with enough lots, so the ordinary lot is
        // not called likely sluggish (with the slower of two lots as the mark, most of its dry times lay beyond it)
        var medians = model.MediansFor("SX-9");
        Assert.Equal(2, medians.DryCount);
        Assert.True(model.SluggishAfterHours("SX-9") > medians.SlowestDryHours * 1.05, $"{model.SluggishAfterHours("SX-9"):0.0} h against {medians.SlowestDryHours:0.0} h");
        Assert.Equal(model.MediansFor("SX-1").SlowestDryHours, model.SluggishAfterHours("SX-1"));
        Assert.True(report.Lots[0].StuckRisk < 0.15, $"stuck risk {report.Lots[0].StuckRisk:0.00} dry {report.Lots[0].DryHours} after {model.SluggishAfterHours("SX-9"):0.0} slowest {medians.SlowestDryHours:0.0} median {medians.DryHours:0.0}");
    }

    private static (ForecastModel Model, SyntheticCellar Cellar) Trained(int seed)
    {
        var cellar = new SyntheticCellar(seed);
        var (lots, logs, _, _) = cellar.History(2020, 3, 30);
        var past = LotCourses.FromHistory(lots, logs).Select(c => LoggedEvents.Read(c, Settings)).ToArray();
        return (ForecastModel.Train(past, SigmoidModel.Gompertz, Settings), cellar);
    }
}
