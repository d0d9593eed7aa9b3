using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Statistics;

namespace YieldBench.Core.Forecast;

/// <summary>Training of the temperature part of the forecast model: must temperature, the peak regression, cooling.</summary>
public sealed partial class ForecastModel
{
    private sealed record TemperatureTraining(
        double Sd,
        Dictionary<string, double> Delay,
        Dictionary<string, (double Mean, double Sd)> Must,
        double[] Beta,
        string[] Groups,
        string[] Strains,
        double PeakSd,
        Dictionary<string, double> PeakSdByColour,
        double PeakOutlierShare,
        (double Mean, double Sd) Offset,
        Dictionary<string, (double Mean, double Sd)> OffsetByColour,
        Dictionary<string, double> Cooling,
        double[,] Inverse);

    private static TemperatureTraining TrainTemperature(Fitted[] fitted, Func<LotCourse, string> group, Func<LotCourse, string> bucket, ForecastSettings settings)
    {
        var withTemp = fitted.Where(p => p.Course.TempC.Length >= 4).ToArray();
        var delay = new Dictionary<string, double>(StringComparer.Ordinal);
        double Best(IEnumerable<Fitted> lots)
        {
            double best = 0, bestSs = double.PositiveInfinity;
            for (int d = 0; d <= 12; d++)
            {
                double ss = 0;
                foreach (var p in lots)
                {
                    if (LoggedEvents.FitTemperature(p.Course, p.Fit!, d) is { } tf)
                    {
                        ss += tf.Rmse * tf.Rmse * tf.Points;
                    }
                }

                if (ss < bestSs)
                {
                    (best, bestSs) = (d, ss);
                }
            }

            return best;
        }

        foreach (var g in withTemp.GroupBy(p => group(p.Course)))
        {
            delay[g.Key] = Best(g);
        }

        foreach (var g in withTemp.GroupBy(p => bucket(p.Course)))
        {
            delay["|" + g.Key] = Best(g);
        }

        var fits = withTemp.Select(p => (Lot: p, Fit: LoggedEvents.FitTemperature(p.Course, p.Fit!, delay[group(p.Course)])))
            .Where(x => x.Fit is not null && x.Fit.PeakC > x.Fit.MustC).Select(x => (x.Lot, Fit: x.Fit!)).ToArray();
        if (fits.Length < 3)
        {
            return new TemperatureTraining(0.5, delay, [], [], [], [], 2.0, [], 0.05, (0, 1.0), [], [], new double[0, 0]);
        }

        double sd = Descriptive.Median(fits.Select(x => x.Fit.Rmse * Math.Sqrt(x.Fit.Points / (double)Math.Max(1, x.Fit.Points - 2))));
        var must = fits.GroupBy(x => bucket(x.Lot.Course)).ToDictionary(g => g.Key, g => (g.Average(x => x.Fit.MustC), g.Count() > 1 ? Math.Max(Descriptive.StandardDeviation(g.Select(x => x.Fit.MustC)), 0.5) : 2.0));

        // The peak: a colour intercept, vessel-group and strain effects (shrunk by a ridge), the must temperature and
        // the log maximum rate.
        var groups = fits.GroupBy(x => group(x.Lot.Course)).Where(g => g.Count() >= 2).Select(g => g.Key).Order(StringComparer.Ordinal).ToArray();
        var strains = fits.GroupBy(x => Key(x.Lot.Course.Strain)).Where(g => g.Count() >= 2).Select(g => g.Key).Order(StringComparer.Ordinal).ToArray();
        int p = 2 + groups.Length + strains.Length + 2;
        var penal = new bool[p];
        for (int i = 2; i < p - 2; i++)
        {
            penal[i] = true;
        }

        double[] Row(LotCourse c, double mustC, double logMu) => PeakRow(groups, strains, group(c), Key(c.Strain), bucket(c), mustC, logMu);
        var rows = fits.Select(x => Row(x.Lot.Course, x.Fit.MustC, Math.Log(x.Lot.Fit!.MaxRateBrixPerHour))).ToArray();
        var (beta, _, peakInverse) = SmallLeastSquares.Fit(rows, fits.Select(x => x.Fit.PeakC).ToArray(), ridge: 0.1, penalised: penal);
        var offsets = fits.Where(x => x.Lot.PeakC is not null).Select(x => x.Lot.PeakC!.Value - x.Fit.PeakC).ToArray();
        var offsetByColour = fits.Where(x => x.Lot.PeakC is not null).GroupBy(x => bucket(x.Lot.Course)).Where(g => g.Count() >= 5)
            .ToDictionary(g => g.Key, g => (g.Average(x => x.Lot.PeakC!.Value - x.Fit.PeakC), Descriptive.StandardDeviation(g.Select(x => x.Lot.PeakC!.Value - x.Fit.PeakC))));
        // Residual scale robust to a planted or real runaway ferment: residuals beyond 3.5 MAD-scaled sds are set
        // aside (counted for the prior's wide part) and the others' sd taken, per colour where it has 5 lots.
        double inflate = Math.Sqrt(fits.Length / (double)Math.Max(1, fits.Length - p));
        var residuals = fits.Select((x, i) => x.Fit.PeakC - rows[i].Select((v, j) => v * beta[j]).Sum()).ToArray();
        double TrimmedSd(IEnumerable<double> r)
        {
            var a = r.ToArray();
            double cut = 3.5 * Robust.Mad(a);
            var kept = a.Where(v => Math.Abs(v) <= cut).ToArray();
            return Math.Max(Math.Sqrt(kept.Sum(v => v * v) / Math.Max(1, kept.Length)) * inflate, 0.1);
        }

        double peakSd = TrimmedSd(residuals);
        var byColour = new Dictionary<string, double>(StringComparer.Ordinal);
        foreach (var g in fits.Select((x, i) => (x, i)).GroupBy(z => bucket(z.x.Lot.Course)).Where(g => g.Count() >= 5))
        {
            byColour[g.Key] = TrimmedSd(g.Select(z => residuals[z.i]));
        }

        int peakOutliers = fits.Select((x, i) => Math.Abs(residuals[i]) > 3.5 * byColour.GetValueOrDefault(bucket(x.Lot.Course), peakSd)).Count(b => b);


        // Effective heat removal at the peak, by the quasi-steady balance (P − Ta) = β·μm / k.
        var cooling = new Dictionary<string, double>(StringComparer.Ordinal);
        foreach (var g in fits.GroupBy(x => group(x.Lot.Course)))
        {
            cooling[g.Key] = Descriptive.Median(g.Select(x =>
                HeatBalance.AdiabaticRisePerBrix(x.Lot.Fit!.StartBrix, x.Lot.Fit.FinalBrix, settings.Kinetics) * x.Lot.Fit.MaxRateBrixPerHour / (x.Fit.PeakC - x.Fit.MustC)));
        }

        return new TemperatureTraining(sd, delay, must, beta, groups, strains, peakSd, byColour, (peakOutliers + 1.0) / (fits.Length + 2.0),
            offsets.Length > 1 ? (offsets.Average(), Descriptive.StandardDeviation(offsets)) : (0, 0.5), offsetByColour, cooling, peakInverse);
    }

    private static double[] PeakRow(string[] groups, string[] strains, string group, string strain, string bucket, double mustC, double logMu)
    {
        var x = new double[2 + groups.Length + strains.Length + 2];
        x[bucket == "white" ? 1 : 0] = 1;
        int g = Array.IndexOf(groups, group);
        if (g >= 0)
        {
            x[2 + g] = 1;
        }

        int s = Array.IndexOf(strains, strain);
        if (s >= 0)
        {
            x[2 + groups.Length + s] = 1;
        }

        x[^2] = mustC;
        x[^1] = logMu;
        return x;
    }
}
