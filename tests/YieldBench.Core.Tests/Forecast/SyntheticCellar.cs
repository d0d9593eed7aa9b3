using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Forecast;

/// <summary>
/// A synthetic cellar drawn from a known model, for the forecast's tests: per strain a mean log maximum rate and lag,
/// lot scatter around them, a season shift per season (a time scale: rate × e^δ, lag × e^−δ), the modified Gompertz
/// sugar course of Zwietering et al. (1990) from S0 to F, twice-daily readings with Gaussian noise, and a temperature
/// that climbs from the must's temperature to its peak in step with the rate, four hours behind it.
/// </summary>
internal sealed class SyntheticCellar(int seed)
{
    private readonly Random rng = new(seed);

    /// <summary>Strain behaviour: mean μm (°Brix/h) and lag (h); whites run slower and cooler.</summary>
    public static readonly (string Strain, double Rate, double Lag, WineColour Colour, double Peak)[] Strains =
    [
        ("SX-1", 0.20, 14, WineColour.Red, 30),
        ("SX-2", 0.15, 24, WineColour.Red, 28),
        ("SX-3", 0.07, 22, WineColour.White, 17),
    ];

    public double RateSd { get; init; } = 0.12;

    /// <summary>Lot scatter of the whites' log rate (null: <see cref="RateSd"/>, as the reds').</summary>
    public double? WhiteRateSd { get; init; }

    public double LagSd { get; init; } = 3.0;

    public double SeasonSd { get; init; } = 0.10;

    public double NoiseBrix { get; init; } = 0.15;

    public double NoiseC { get; init; } = 0.25;

    /// <summary>The truth behind a lot.</summary>
    public sealed record Truth(double S0, double F, double Rate, double Lag, double MustC, double PeakC);

    /// <summary>Seasons of finished lots with logs, and the truth of each (by season and lot id).</summary>
    public (List<Lot> Lots, List<FermentationLog> Logs, Dictionary<(int, string), Truth> Truths, Dictionary<int, double> Shifts) History(int firstSeason, int seasons, int lotsPerSeason)
    {
        var lots = new List<Lot>();
        var logs = new List<FermentationLog>();
        var truths = new Dictionary<(int, string), Truth>();
        var shifts = new Dictionary<int, double>();
        for (int s = 0; s < seasons; s++)
        {
            int season = firstSeason + s;
            double shift = Normal() * SeasonSd;
            shifts[season] = shift;
            for (int i = 0; i < lotsPerSeason; i++)
            {
                var (strain, rate, lag, colour, peak) = Strains[i % Strains.Length];
                string id = $"{season % 100:00}-{i + 1:000}";
                var inoculated = new DateTime(season, 9, 1, 10, 0, 0).AddDays(i % 20);
                var truth = new Truth(
                    24 + Normal(),
                    -1.8 + (0.2 * Normal()),
                    rate * Math.Exp((((colour == WineColour.White ? WhiteRateSd : null) ?? RateSd) * Normal()) + shift),
                    lag * Math.Exp(-shift) + (LagSd * Normal()),
                    (colour == WineColour.White ? 13 : 19) + (0.8 * Normal()),
                    peak + Normal());
                truths[(season, id)] = truth;
                lots.Add(Lot(id, season, strain, colour, truth, inoculated));
                logs.Add(Log(id, season, truth, inoculated, 1e9));
            }
        }

        return (lots, logs, truths, shifts);
    }

    /// <summary>A finished lot record of the truth (starting sugar as sampled, with 0.3 °Brix of sampling error).</summary>
    public Lot Lot(string id, int season, string strain, WineColour colour, Truth t, DateTime inoculated) => new()
    {
        LotId = id,
        Season = season,
        Strain = strain,
        StartingSugar = SugarReading.FromBrix(Math.Round(t.S0 + (0.3 * Normal()), 1)),
        FinalAlcohol = AlcoholContent.FromPercentVolume(13.5),
        Colour = colour,
        Vessel = colour == WineColour.White ? "Tank" : "Bin",
        VesselCapacityL = 5000,
        Additions = new Additions(4000, null, null),
        InoculationDate = inoculated,
    };

    /// <summary>A running lot record of the truth.</summary>
    public RunningLot Running(string id, int season, string strain, WineColour colour, Truth t, DateTime? inoculated) => new()
    {
        LotId = id,
        Season = season,
        Strain = strain,
        StartingSugar = SugarReading.FromBrix(Math.Round(t.S0 + (0.3 * Normal()), 1)),
        Colour = colour,
        Vessel = colour == WineColour.White ? "Tank" : "Bin",
        VesselCapacityL = 5000,
        Additions = new Additions(4000, null, null),
        InoculationDate = inoculated,
    };

    /// <summary>Twice-daily readings (07:30 and 17:30) from the inoculation until dry plus a day, or until <paramref name="untilHours"/>.</summary>
    public FermentationLog Log(string id, int season, Truth t, DateTime inoculated, double untilHours)
    {
        var readings = new List<LogReading>();
        double a = t.S0 - t.F;
        double dryAt = t.F < 0 ? TimeAt(t, t.S0 / a) : 400;
        for (var day = inoculated.Date; ; day = day.AddDays(1))
        {
            foreach (var round in new[] { new TimeSpan(7, 30, 0), new TimeSpan(17, 30, 0) })
            {
                var at = day + round;
                double h = (at - inoculated).TotalHours;
                if (h < 1)
                {
                    continue;
                }

                if (h > Math.Min(dryAt + 24, untilHours) || h > 900)
                {
                    return new FermentationLog(id, season, readings);
                }

                double brix = BrixAt(t, h) + (NoiseBrix * Normal());
                double temp = TempAt(t, h) + (NoiseC * Normal());
                readings.Add(new LogReading(at, SugarReading.FromBrix(Math.Round(brix, 1)), Math.Round(temp, 1)));
            }
        }
    }

    public static double BrixAt(Truth t, double h)
    {
        double a = t.S0 - t.F;
        return t.S0 - (a * Math.Exp(-Math.Exp((t.Rate * Math.E / a * (t.Lag - h)) + 1)));
    }

    public static double TempAt(Truth t, double h)
    {
        double a = t.S0 - t.F, u = (t.Rate * Math.E / a * (t.Lag - Math.Max(0, h - 4))) + 1;
        double share = Math.E * Math.Exp(u) * Math.Exp(-Math.Exp(u));
        return t.MustC + ((t.PeakC - t.MustC) * share);
    }

    /// <summary>Hours at which the curve has consumed <paramref name="share"/> of its fall.</summary>
    public static double TimeAt(Truth t, double share)
    {
        double a = t.S0 - t.F;
        return t.Lag - ((Math.Log(-Math.Log(share)) - 1) * a / (t.Rate * Math.E));
    }

    public double Normal()
    {
        // Box–Muller on the seeded generator.
        double u1 = 1.0 - rng.NextDouble(), u2 = rng.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }
}
