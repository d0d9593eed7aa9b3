using YieldBench.Core.Kinetics;
using YieldBench.Core.Statistics;

namespace YieldBench.Core.Review;

/// <summary>
/// One strain's typical fermentation rate against the sugar still to ferment: at each <see cref="RateCourses.BinBrix"/>
/// band of remaining sugar, the quartiles (Hyndman–Fan type 7) over the strain's lots of each lot's median rate in that
/// band. Each lot counts once per band, so a probe logging every few minutes weighs no more than a hand-read log.
/// </summary>
/// <param name="Strain">Strain code.</param>
/// <param name="Lots">Lots of the strain with at least one rate.</param>
/// <param name="Brix">Centre of each band, °Brix remaining, descending (the order a ferment runs through them).</param>
/// <param name="Q1">Lower quartile of the lots' rates in each band, °Brix/day.</param>
/// <param name="Median">Median of the lots' rates in each band, °Brix/day.</param>
/// <param name="Q3">Upper quartile in each band, °Brix/day.</param>
/// <param name="Counted">Lots with a rate in each band.</param>
public sealed record RateCourse(
    string Strain, int Lots, IReadOnlyList<double> Brix, IReadOnlyList<double> Q1, IReadOnlyList<double> Median, IReadOnlyList<double> Q3, IReadOnlyList<int> Counted);

/// <summary>The strain courses of rate against remaining sugar (the rate chart draws them).</summary>
public static class RateCourses
{
    /// <summary>Width of a band of remaining sugar, °Brix; band b covers [b − ½, b + ½).</summary>
    public const double BinBrix = 1.0;

    /// <summary>Fewest lots with a rate in a band for the course to be given there.</summary>
    public const int MinLots = SugarCourse.MinLots;

    /// <summary>
    /// The course of <paramref name="lots"/> (one strain's lots). A lot's rates are its smoothed rates at each reading
    /// for a dense (probe) log and each interval's rate at the interval's middle sugar for a hand-read log; bands with
    /// fewer than <see cref="MinLots"/> lots are left out.
    /// </summary>
    public static RateCourse Of(string strain, IReadOnlyList<LotKinetics> lots)
    {
        ArgumentNullException.ThrowIfNull(strain);
        ArgumentNullException.ThrowIfNull(lots);
        var perBand = new SortedDictionary<int, List<double>>(Comparer<int>.Create((a, b) => b.CompareTo(a)));
        int withRates = 0;
        var mine = new Dictionary<int, List<double>>();
        foreach (var k in lots)
        {
            mine.Clear();
            foreach (var (brix, rate) in Points(k))
            {
                if (!double.IsFinite(brix) || !double.IsFinite(rate))
                {
                    continue;
                }

                int band = (int)Math.Floor((brix / BinBrix) + 0.5);
                if (!mine.TryGetValue(band, out var list))
                {
                    mine[band] = list = [];
                }

                list.Add(rate);
            }

            if (mine.Count == 0)
            {
                continue;
            }

            withRates++;
            foreach (var (band, rates) in mine)
            {
                if (!perBand.TryGetValue(band, out var lotsRates))
                {
                    perBand[band] = lotsRates = [];
                }

                lotsRates.Add(Descriptive.Median(rates));
            }
        }

        var centres = new List<double>();
        var q1 = new List<double>();
        var median = new List<double>();
        var q3 = new List<double>();
        var counted = new List<int>();
        foreach (var (band, rates) in perBand)
        {
            if (rates.Count < MinLots)
            {
                continue;
            }

            var sorted = Descriptive.ToSortedArray(rates);
            centres.Add(band * BinBrix);
            q1.Add(Descriptive.QuantileOfSorted(sorted, 0.25));
            median.Add(Descriptive.QuantileOfSorted(sorted, 0.5));
            q3.Add(Descriptive.QuantileOfSorted(sorted, 0.75));
            counted.Add(sorted.Length);
        }

        return new RateCourse(strain, withRates, centres, q1, median, q3, counted);
    }

    /// <summary>
    /// The (sugar, rate) points of a lot: a dense log's smoothed rates at its readings, or a hand-read log's interval
    /// rates at the middle sugar of each interval.
    /// </summary>
    public static IEnumerable<(double Brix, double BrixPerDay)> Points(LotKinetics k)
    {
        ArgumentNullException.ThrowIfNull(k);
        if (k.Dense)
        {
            foreach (var r in k.SmoothedRates)
            {
                if (r.BrixPerDay is { } rate)
                {
                    yield return (r.Brix, rate);
                }
            }
        }
        else
        {
            foreach (var r in k.Rates)
            {
                yield return (0.5 * (r.BrixStart + r.BrixEnd), r.BrixPerDay);
            }
        }
    }
}
