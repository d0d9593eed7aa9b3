using YieldBench.Core.Kinetics;

namespace YieldBench.Core.Forecast;

/// <summary>
/// Turns a lot's weighted grid into the forecast: one-third and dry times, the peak, the stuck risk, the next reading,
/// the heat figures and the chart courses. Each node's quantities are Gaussian (S0, F, Ta and P are Gaussian there;
/// times by the delta method) and the forecast is their mixture over nodes, its quantiles found exactly
/// (<see cref="NormalMixture"/>).
/// </summary>
internal static class PosteriorSummary
{
    public static LotForecast Summarise(LotPosterior p, double[] w, double nowHours, double shift, ForecastSettings settings, bool withCurves)
    {
        var c = p.Course;
        var m = p.Model;
        var form = m.Form;
        double level = LoggedEvents.DepletionLevel(c, settings);
        double dry = settings.Kinetics.DryBrix;
        double lo = (1 - settings.IntervalLevel) / 2, hi = 1 - lo;
        var thirds = new NormalMixture(p.Nodes * LotPosterior.Parts);
        var drys = new NormalMixture(p.Nodes * LotPosterior.Parts);
        double observedMax = c.TempC.Length > 0 ? c.TempC.Max() : double.NegativeInfinity;
        var peaks = new NormalMixture(p.Nodes * LotPosterior.TempParts) { Floor = observedMax };
        double rateSum = 0, startSum = 0, finalSum = 0, partSum = 0;
        bool peakModel = c.TempC.Length > 0 || m.MustTemp.Count > 0;
        double neverDry = 0;
        double noise = LotPosterior.SugarVariance(c, m);
        var offset = m.PeakOffsetFor(c);
        double wMax = w.Max();
        for (int k = 0; k < p.Nodes; k++)
        {
            if (w[k] < 1e-5 * wMax)
            {
                continue;
            }

            double kappa = Math.Exp(p.LogKappa[k]), lambda = p.Lag[k];
            for (int part = 0; part < LotPosterior.Parts; part++)
            {
                var g = p.Comp[(k * LotPosterior.Parts) + part];
                double wk = w[k] * p.CompWeight[(k * LotPosterior.Parts) + part];
                if (wk < 1e-5 * wMax || p.CompWeight[(k * LotPosterior.Parts) + part] < 1e-3)
                {
                    continue;
                }

                AddTime(thirds, form, kappa, lambda, g, level, wk, noise);
                double sdF = g.SdB;
                double a = (dry - g.B) / Math.Max(sdF, 1e-9);
                double pDry = SeasonForecaster.Phi(a);
                neverDry += wk * (1 - pDry);
                if (pDry > 1e-6)
                {
                    double ratio = SeasonForecaster.PhiDensity(a) / pDry;
                    double fMean = g.B - (sdF * ratio);
                    double fVar = sdF * sdF * Math.Max(1e-6, 1 - (a * ratio) - (ratio * ratio));
                    var truncated = new Gaussian2(g.A, Math.Min(fMean, dry - 1e-6), g.Vaa, g.Vab * Math.Sqrt(fVar) / Math.Max(sdF, 1e-9), fVar);
                    AddTime(drys, form, kappa, lambda, truncated, dry, wk * pDry, noise);
                }

                drys.Add(double.PositiveInfinity, 0, wk * (1 - pDry));

                rateSum += wk * kappa * (g.A - g.B);
                startSum += wk * g.A;
                finalSum += wk * g.B;
                partSum += wk;
            }

            if (peakModel)
            {
                for (int part = 0; part < LotPosterior.TempParts; part++)
                {
                    var t = p.Temp[(k * LotPosterior.TempParts) + part];
                    double mean = t.B + offset.Mean;
                    double sd = Math.Sqrt(t.Vbb + (offset.Sd * offset.Sd));
                    peaks.Add(mean, sd, w[k] * p.TempWeight[(k * LotPosterior.TempParts) + part]);
                }
            }
        }

        double oneThirdPassedAt = c.SugarBrix.Length > 0 && c.SugarBrix.Min() <= level ? LoggedEvents.FirstCrossing(c.SugarHours, c.SugarBrix, level)!.Value : double.NaN;
        bool passed = !double.IsNaN(oneThirdPassedAt);
        // Components carrying together 0.1 % of the weight move no quantile by more than that share: leave them out.
        thirds.Compact(1e-3);
        drys.Compact(1e-3);
        peaks.Compact(1e-3);
        var third = passed ? new ForecastValue(oneThirdPassedAt, oneThirdPassedAt, oneThirdPassedAt) : Interval(thirds, lo, hi);
        // A lot whose readings already reached the dry reading is dry: the time is when the readings crossed it (as for
        // one-third), not a forecast that may fall before the readings that showed it.
        double dryReachedAt = c.SugarBrix.Length > 0 && c.SugarBrix.Min() <= dry ? LoggedEvents.FirstCrossing(c.SugarHours, c.SugarBrix, dry)!.Value : double.NaN;
        bool dryReached = !double.IsNaN(dryReachedAt);
        var dryValue = dryReached ? new ForecastValue(dryReachedAt, dryReachedAt, dryReachedAt) : Interval(drys, lo, hi);
        var peakValue = peaks.Count > 0 ? Interval(peaks, lo, hi) : (ForecastValue?)null;

        // Posterior means of the peak rate, S0 and F (for the heat figures).
        double rate = rateSum / partSum, s0 = startSum / partSum, f = finalSum / partSum;

        // Sluggish or stuck: never dry, or dry later than the strain's slowest past lot (ForecastModel.SluggishAfterHours).
        double slowest = m.SluggishAfterHours(c.Strain) - (c.FromInoculation ? 0 : m.FirstReadingDelay.Median);
        double late = double.IsNaN(slowest) ? 0 : drys.ShareAbove(slowest, finiteOnly: true);
        double stuckRisk = dryReached ? 0 : Math.Clamp(neverDry + late, 0, 1);

        // Heat: what is left to ferment could still raise the must this much with no heat removed.
        double? reachable = null;
        if (c.TempC.Length > 0 && s0 > f)
        {
            double brixNow = c.SugarBrix.Length > 0 ? c.SugarBrix[^1] : c.StartBrix;
            reachable = c.TempC[^1] + HeatBalance.RemainingRiseK(s0, f, brixNow, settings.Kinetics);
        }

        // The peak is never below the warmest reading so far, nor above what the must could reach with no heat removed
        // at all (a history whose temperatures say little about heat can otherwise put an interval's end past physics).
        double? peakPassedAt = null;
        if (peakValue is { } pv && c.TempC.Length > 0)
        {
            double floor = c.TempC.Max();
            double ceiling = reachable is { } r ? Math.Max(r, floor) : double.PositiveInfinity;
            peakValue = new ForecastValue(Math.Clamp(pv.Median, floor, ceiling), Math.Clamp(pv.Low, floor, ceiling), Math.Clamp(pv.High, floor, ceiling));

            // The peak is behind the lot when the forecast puts nothing warmer to come (its median is the warmest reading)
            // and a later reading is already cooler.
            int warmest = Array.IndexOf(c.TempC, floor);
            if (peakValue.Value.Median <= floor + PeakPassedToleranceC && c.TempC[^1] < floor - PeakPassedToleranceC)
            {
                peakPassedAt = c.TempHours[warmest];
            }
        }

        double? kw = c.VolumeL is { } v && s0 > f ? HeatBalance.HeatPowerKw(rate, s0, f, v, settings.Kinetics) : null;
        var th = settings.Kinetics.ThresholdsFor(c.Colour == Lots.WineColour.Unknown && m.BucketOf(c) == "white" ? Lots.WineColour.White : c.Colour);

        // Next reading: where a reading's spread across the posterior says most about the time still to come.
        bool forThird = !passed && double.IsFinite(third?.Median ?? double.NaN) && third!.Value.Median > nowHours;
        var (nextAt, nextFor) = withCurves ? NextReading(p, w, nowHours, forThird, forThird ? third!.Value.Low : double.NaN, level, dry, settings) : (double.NaN, forThird ? "one-third" : "dryness");
        var curve = withCurves ? Curve(p, w, nowHours, s0, f, dryValue, third, settings) : Empty;
        return new LotForecast
        {
            Course = c,
            OwnStrainPrior = p.Prior.OwnStrain,
            StrainLots = m.LotsOfStrain(c.Strain),
            OneThirdBrix = level,
            OneThirdHours = third,
            OneThirdPassed = passed,
            DryHours = dryValue,
            NeverDryChance = dryReached ? 0 : Math.Clamp(neverDry, 0, 1),
            DryReached = dryReached,
            DryBrix = dry,
            PeakC = peakValue,
            PeakPassedHours = peakPassedAt,
            ReachableC = reachable,
            CoolingKw = kw,
            SettlesAtBrix = f,
            PeakRateBrixPerDay = rate * 24.0,
            StuckRisk = stuckRisk,
            NextReadingHours = nextAt,
            NextReadingFor = nextFor,
            NowHours = nowHours,
            SeasonShift = shift,
            Curve = curve,
            DangerC = th.DangerC,
            CautionC = th.CautionC,
            CoolingCoefficientPerHour = m.CoolingFor(c),
        };
    }

    private static readonly ForecastCurve Empty = new([], [], [], [], [], [], [], []);

    /// <summary>How close to the warmest reading a forecast peak's median counts as that reading, °C (a logged temperature's last digit).</summary>
    private const double PeakPassedToleranceC = 0.05;

    /// <summary>
    /// Adds the time the readings will show the curve reaching <paramref name="level"/> at this node: the delta-method
    /// spread from S0 and F, and a reading's own noise (σ²) turned into time by the rate there.
    /// </summary>
    private static void AddTime(NormalMixture mixture, SigmoidModel form, double kappa, double lambda, Gaussian2 g, double level, double weight, double noiseVar)
    {
        double a = g.A - g.B;
        if (!(a > 0))
        {
            mixture.Add(double.PositiveInfinity, 0, weight);
            return;
        }

        double share = (g.A - level) / a;
        if (share >= 1)
        {
            mixture.Add(double.PositiveInfinity, 0, weight);
            return;
        }

        share = Math.Max(share, 1e-9);
        double t = SigmoidShape.TimeAt(form, kappa, lambda, share);
        double slope = SigmoidShape.Slope(form, kappa, lambda, t);
        double gs = (level - g.B) / (a * a), gf = (g.A - level) / (a * a);
        double variance = slope > 1e-12 ? Math.Max(0, g.VarianceOf(gs, gf) + (noiseVar / (a * a))) / (slope * slope) : 0;
        mixture.Add(t, Math.Min(Math.Sqrt(variance), 500), weight);
    }

    private static ForecastValue? Interval(NormalMixture mixture, double lo, double hi)
    {
        if (mixture.Count == 0)
        {
            return null;
        }

        return new ForecastValue(mixture.Quantile(0.5), mixture.Quantile(lo), mixture.Quantile(hi));
    }

    private static (double At, string For) NextReading(LotPosterior p, double[] w, double now, bool forThird, double thirdLow, double level, double dry, ForecastSettings settings)
    {
        var c = p.Course;
        var form = p.Model.Form;
        double noise = LotPosterior.SugarVariance(c, p.Model);
        var nodes = Enumerable.Range(0, p.Nodes).Where(k => w[k] > 1e-9).ToArray();

        // The node's own time to the target (one-third if ahead, else dryness), from its finishing course.
        var z = new double[nodes.Length];
        for (int i = 0; i < nodes.Length; i++)
        {
            int k = nodes[i];
            var g = p.Comp[k * LotPosterior.Parts];
            double target = forThird ? level : dry;
            double share = Math.Clamp((g.A - target) / Math.Max(1e-9, g.A - g.B), 1e-9, 1 - 1e-9);
            z[i] = SigmoidShape.TimeAt(form, Math.Exp(p.LogKappa[k]), p.Lag[k], share);
        }

        double wSum = nodes.Sum(k => w[k]);
        double zMean = nodes.Select((k, i) => w[k] * z[i]).Sum() / wSum;
        double zVar = nodes.Select((k, i) => w[k] * (z[i] - zMean) * (z[i] - zMean)).Sum() / wSum;
        double end = forThird ? Math.Max(now, Math.Min(now + settings.NextReadingHorizonHours, thirdLow)) : now + settings.NextReadingHorizonHours;
        var gains = new List<(double T, double Gain)>();
        // Candidate times on the whole hours of the clock.
        var clock = c.At(now);
        double first = c.HoursOf(new DateTime(clock.Year, clock.Month, clock.Day, clock.Hour, 0, 0).AddHours(clock.Minute == 0 && clock.Second == 0 ? 0 : 1));
        for (double t = first; t <= end + 1e-9; t += 1.0)
        {
            double ym = 0;
            var y = new double[nodes.Length];
            for (int i = 0; i < nodes.Length; i++)
            {
                int k = nodes[i];
                var g = p.Comp[k * LotPosterior.Parts];
                y[i] = g.A - ((g.A - g.B) * SigmoidShape.Value(form, Math.Exp(p.LogKappa[k]), p.Lag[k], t));
                ym += w[k] * y[i];
            }

            ym /= wSum;
            double cov = 0, vy = 0;
            for (int i = 0; i < nodes.Length; i++)
            {
                double wk = w[nodes[i]] / wSum;
                cov += wk * (z[i] - zMean) * (y[i] - ym);
                vy += wk * (y[i] - ym) * (y[i] - ym);
            }

            // Linear-Gaussian variance reduction of the target time from one reading at t.
            double gain = cov * cov / (vy + noise);
            if (zVar > 0 && gain >= 0.5 * zVar)
            {
                // A reading gains more the later it is taken; the earliest one that halves the variance is the answer.
                return (t, forThird ? "one-third" : "dryness");
            }

            gains.Add((t, gain));
        }

        // No reading in the window halves it: the earliest that gets 90 % of the window's largest gain.
        double top = gains.Count > 0 ? gains.Max(g => g.Gain) : 0;
        double at = gains.FirstOrDefault(g => g.Gain >= 0.9 * top, (now, 0)).T;
        return (at, forThird ? "one-third" : "dryness");
    }

    private static ForecastCurve Curve(LotPosterior p, double[] w, double now, double s0, double f, ForecastValue? dry, ForecastValue? third, ForecastSettings settings)
    {
        var c = p.Course;
        var m = p.Model;
        double start = Math.Min(0, c.SugarHours.Length > 0 ? c.SugarHours[0] : 0);
        double endAt = new[] { dry?.High, dry?.Median, third?.High, now + 72 }.Where(v => v is { } x && double.IsFinite(x)).Max(v => v!.Value);
        endAt = Math.Max(endAt, now + 24) + 24;
        const int points = 61;
        var hours = Enumerable.Range(0, points).Select(i => start + ((endAt - start) * i / (points - 1))).ToArray();

        // The grid point nearest now moves onto it, so the reachable course starts at the last reading.
        int nearest = Enumerable.Range(0, points).MinBy(i => Math.Abs(hours[i] - now));
        hours[nearest] = now;
        var bMed = new double[points];
        var bLo = new double[points];
        var bHi = new double[points];
        var tMed = new double[points];
        var tLo = new double[points];
        var tHi = new double[points];
        var reach = new double[points];
        double delay = m.DelayFor(c);
        double lo = (1 - settings.IntervalLevel) / 2, hi = 1 - lo;
        var nodes = Enumerable.Range(0, p.Nodes).Where(k => w[k] > 1e-7).ToArray();
        // At each time every node and part gives a normal (S0 and F, Ta and P are Gaussian there): the bands are the
        // quantiles of their mixture, as for the forecast's intervals.
        var sugar = new NormalMixture(nodes.Length * LotPosterior.Parts);
        var temp = new NormalMixture(nodes.Length * LotPosterior.TempParts);

        // The components' weights are the same at every time (only their means and sds move), so which of them the
        // compaction drops is worked out once, at the first time, and applied alike at the others.
        (int[], double)? sugarPlan = null, tempPlan = null;
        for (int i = 0; i < points; i++)
        {
            sugar.Clear();
            temp.Clear();
            double t = hours[i];
            foreach (int k in nodes)
            {
                double kappa = Math.Exp(p.LogKappa[k]);
                double h = SigmoidShape.Value(m.Form, kappa, p.Lag[k], t);
                for (int part = 0; part < LotPosterior.Parts; part++)
                {
                    var g = p.Comp[(k * LotPosterior.Parts) + part];
                    sugar.Add(g.A - ((g.A - g.B) * h), Math.Sqrt(Math.Max(0, g.VarianceOf(1 - h, h))), w[k] * p.CompWeight[(k * LotPosterior.Parts) + part]);
                }

                double s = SigmoidShape.Slope(m.Form, kappa, p.Lag[k], t - delay) / kappa;
                for (int part = 0; part < LotPosterior.TempParts; part++)
                {
                    var tp = p.Temp[(k * LotPosterior.TempParts) + part];
                    temp.Add((tp.A * (1 - s)) + (tp.B * s), Math.Sqrt(Math.Max(0, tp.VarianceOf(1 - s, s))), w[k] * p.TempWeight[(k * LotPosterior.TempParts) + part]);
                }
            }

            if (i == 0)
            {
                (sugarPlan, tempPlan) = (sugar.CompactPlan(1e-2), temp.CompactPlan(1e-2));
            }

            if (sugarPlan is { } sugarKeep)
            {
                sugar.Apply(sugarKeep);
            }

            if (tempPlan is { } tempKeep)
            {
                temp.Apply(tempKeep);
            }

            // (A chart band: components holding 1 % of the weight are dropped, so a band end lies between the 9 % and
            // 11 % points; each search starts from the same quantile at the time before, the courses being smooth.)
            double Before(double[] v) => i > 0 ? v[i - 1] : double.NaN;
            (bMed[i], bLo[i], bHi[i]) = (sugar.Quantile(0.5, Before(bMed)), sugar.Quantile(lo, Before(bLo)), sugar.Quantile(hi, Before(bHi)));
            (tMed[i], tLo[i], tHi[i]) = temp.Count > 0
                ? (temp.Quantile(0.5, Before(tMed)), temp.Quantile(lo, Before(tLo)), temp.Quantile(hi, Before(tHi)))
                : (double.NaN, double.NaN, double.NaN);
        }

        // The reachable course: the last temperature plus the heat of what is fermented from now on, none removed.
        double brixNow = c.SugarBrix.Length > 0 ? c.SugarBrix[^1] : c.StartBrix;
        double perBrix = s0 > f ? HeatBalance.AdiabaticRisePerBrix(s0, f, settings.Kinetics) : 0;
        for (int i = 0; i < points; i++)
        {
            reach[i] = c.TempC.Length > 0 && hours[i] >= now ? c.TempC[^1] + (perBrix * Math.Max(0, brixNow - Math.Max(bMed[i], f))) : double.NaN;
        }

        return new ForecastCurve(hours, bMed, bLo, bHi, tMed, tLo, tHi, reach);
    }
}
