namespace YieldBench.Core.Forecast;

/// <summary>
/// A weighted mixture of normal distributions (a zero sd is a point mass) with, optionally, mass at +∞ (a time never
/// reached) and a floor (the quantity is max(X, floor), e.g. a peak is never below the highest temperature already
/// logged). Its quantiles are those of the mixture itself, found by a safeguarded Newton search on its distribution
/// function; a few points per component would put the interval's ends about √3 instead of 1.28 standard deviations
/// out whenever one component carries most of the weight.
/// </summary>
public sealed class NormalMixture(int capacity)
{
    private double[] _mean = new double[Math.Max(4, capacity)];
    private double[] _sd = new double[Math.Max(4, capacity)];
    private double[] _weight = new double[Math.Max(4, capacity)];
    private double _finite;

    /// <summary>Components held (mass at +∞ not counted).</summary>
    public int Count { get; private set; }

    /// <summary>Total weight, the mass at +∞ included.</summary>
    public double TotalWeight => _finite + NeverWeight;

    /// <summary>Weight at +∞.</summary>
    public double NeverWeight { get; private set; }

    /// <summary>The quantity is max(X, Floor) (−∞: no floor).</summary>
    public double Floor { get; set; } = double.NegativeInfinity;

    /// <summary>Empties the mixture (the floor stays).</summary>
    public void Clear()
    {
        Count = 0;
        _finite = 0;
        NeverWeight = 0;
    }

    /// <summary>Adds N(mean, sd²) with the given weight; a mean of +∞ adds the weight at +∞.</summary>
    public void Add(double mean, double sd, double weight)
    {
        if (!(weight > 0))
        {
            return;
        }

        if (double.IsPositiveInfinity(mean))
        {
            NeverWeight += weight;
            return;
        }

        if (Count == _mean.Length)
        {
            Array.Resize(ref _mean, Count * 2);
            Array.Resize(ref _sd, Count * 2);
            Array.Resize(ref _weight, Count * 2);
        }

        _mean[Count] = mean;
        _sd[Count] = Math.Max(sd, 0);
        _weight[Count] = weight;
        _finite += weight;
        Count++;
    }

    /// <summary>
    /// Φ(z) and φ(z) from one exponential: Hart's (1968) double-precision rational approximation of the normal
    /// distribution function as set out by West (2005, "Better approximations to cumulative normal functions", Wilmott
    /// Magazine), with a continued fraction beyond |z| = 5√2; absolute error below 1e-15 against scipy's norm.cdf (NormalMixtureTests checks it).
    /// </summary>
    internal static (double Cdf, double Density) StandardNormal(double z)
    {
        double x = Math.Abs(z);
        double e = Math.Exp(-0.5 * x * x);
        double tail;
        if (x > 37)
        {
            tail = 0;
        }
        else if (x < 7.07106781186547)
        {
            double num = (((((((0.0352624965998911 * x) + 0.700383064443688) * x) + 6.37396220353165) * x + 33.912866078383) * x + 112.079291497871) * x + 221.213596169931) * x + 220.206867912376;
            double den = ((((((((0.0883883476483184 * x) + 1.75566716318264) * x) + 16.064177579207) * x + 86.7807322029461) * x + 296.564248779674) * x + 637.333633378831) * x + 793.826512519948) * x + 440.413735824752;
            tail = e * num / den;
        }
        else
        {
            double b = x + (1 / (x + (2 / (x + (3 / (x + (4 / (x + 0.65))))))));
            tail = e / b / 2.506628274631;
        }

        return (z > 0 ? 1 - tail : tail, e * 0.398942280401432678);
    }

    /// <summary>Weight of the finite part at or below x (before the floor), and the density there.</summary>
    private (double Cdf, double Pdf) At(double x)
    {
        double cdf = 0, pdf = 0;
        for (int i = 0; i < Count; i++)
        {
            double s = _sd[i];
            if (s <= 0)
            {
                cdf += x >= _mean[i] ? _weight[i] : 0;
                continue;
            }

            double z = (x - _mean[i]) / s;
            if (z < -38)
            {
                continue;
            }

            if (z > 38)
            {
                cdf += _weight[i];
                continue;
            }

            var (phi, density) = StandardNormal(z);
            cdf += _weight[i] * phi;
            pdf += _weight[i] * density / s;
        }

        return (cdf, pdf);
    }

    /// <summary>Share of the total weight above <paramref name="level"/> (the mass at +∞ counted unless finiteOnly).</summary>
    public double ShareAbove(double level, bool finiteOnly)
    {
        if (TotalWeight <= 0)
        {
            return 0;
        }

        double above = level < Floor ? _finite : _finite - At(level).Cdf;
        return (Math.Max(0, above) + (finiteOnly ? 0 : NeverWeight)) / TotalWeight;
    }

    /// <summary>
    /// Drops the lightest components whose weights sum to at most <paramref name="share"/> of the total, and spreads
    /// their weight over the others in proportion: the distribution function moves by at most that share anywhere.
    /// </summary>
    public void Compact(double share)
    {
        if (CompactPlan(share) is { } plan)
        {
            Apply(plan);
        }
    }

    /// <summary>
    /// What <see cref="Compact"/> would do with the weights held now: the components kept, in order, and the factor on
    /// their weights; null when it would change nothing. A mixture later filled with the same weights in the same order
    /// (a chart course's mixture at another time) is compacted alike by <see cref="Apply"/>, with no sort.
    /// </summary>
    public (int[] Keep, double Scale)? CompactPlan(double share)
    {
        if (Count < 8)
        {
            return null;
        }

        // Only a component no heavier than the whole budget can be dropped: those are sorted by weight, the lightest first.
        double budget = share * TotalWeight, dropped = 0;
        int light = 0;
        for (int i = 0; i < Count; i++)
        {
            light += _weight[i] <= budget ? 1 : 0;
        }

        var order = new int[light];
        var weights = new double[light];
        for (int i = 0, m = 0; i < Count; i++)
        {
            if (_weight[i] <= budget)
            {
                (order[m], weights[m]) = (i, _weight[i]);
                m++;
            }
        }

        Array.Sort(weights, order);
        int cut = 0;
        while (cut < light && dropped + weights[cut] <= budget)
        {
            dropped += weights[cut];
            cut++;
        }

        if (cut == 0)
        {
            return null;
        }

        var gone = new bool[Count];
        for (int i = 0; i < cut; i++)
        {
            gone[order[i]] = true;
        }

        var keep = new int[Count - cut];
        for (int i = 0, m = 0; i < Count; i++)
        {
            if (!gone[i])
            {
                keep[m++] = i;
            }
        }

        return (keep, _finite / (_finite - dropped));
    }

    /// <summary>Keeps the components of <paramref name="plan"/> (from <see cref="CompactPlan"/> on the same weights) and scales their weights.</summary>
    public void Apply((int[] Keep, double Scale) plan)
    {
        var (keep, scale) = plan;
        for (int k = 0; k < keep.Length; k++)
        {
            _mean[k] = _mean[keep[k]];
            _sd[k] = _sd[keep[k]];
            _weight[k] = _weight[keep[k]] * scale;
        }

        Count = keep.Length;
    }

    /// <summary>
    /// The q-quantile (0 &lt; q &lt; 1); +∞ when more than 1 − q of the weight is at +∞; NaN when empty. A finite
    /// <paramref name="guess"/> (e.g. the same quantile a moment earlier on a course) starts the search there.
    /// </summary>
    public double Quantile(double q, double guess = double.NaN)
    {
        double total = TotalWeight;
        if (Count == 0 || total <= 0)
        {
            return NeverWeight > 0 ? double.PositiveInfinity : double.NaN;
        }

        double target = q * total;
        if (target >= _finite)
        {
            return double.PositiveInfinity;
        }

        // Bracket: every component's mean ± 40 sd.
        double lo = double.PositiveInfinity, hi = double.NegativeInfinity, mean = 0, second = 0;
        for (int i = 0; i < Count; i++)
        {
            lo = Math.Min(lo, _mean[i] - (40 * _sd[i]));
            hi = Math.Max(hi, _mean[i] + (40 * _sd[i]));
            mean += _weight[i] * _mean[i];
            second += _weight[i] * ((_mean[i] * _mean[i]) + (_sd[i] * _sd[i]));
        }

        if (double.IsFinite(Floor))
        {
            if (At(Floor).Cdf >= target)
            {
                return Floor;
            }

            lo = Math.Max(lo, Floor);
        }

        // Start from the normal with the mixture's mean and sd, then Newton steps kept inside the bracket (a step
        // that leaves it, or a flat density, bisects instead).
        mean /= _finite;
        double sd = Math.Sqrt(Math.Max(second / _finite - (mean * mean), 0));
        // (the start's z is the logistic's with the normal's variance, ln(p / (1 − p))·√3/π: within 0.1 of the normal's
        // quantile for 0.05 ≤ p ≤ 0.95; it is only a start).
        double p = Math.Clamp(target / _finite, 1e-9, 1 - 1e-9);
        double x = Math.Clamp(double.IsFinite(guess) ? guess : mean + (sd * Math.Log(p / (1 - p)) * Math.Sqrt(3) / Math.PI), lo, hi);
        double tolerance = 1e-9 * Math.Max(1.0, hi - lo);
        for (int it = 0; it < 100 && hi - lo > tolerance; it++)
        {
            var (cdf, pdf) = At(x);
            double f = cdf - target;
            if (Math.Abs(f) <= 1e-9 * total)
            {
                return x;
            }

            if (f > 0)
            {
                hi = x;
            }
            else
            {
                lo = x;
            }

            double next = pdf > 0 ? x - (f / pdf) : double.NaN;
            x = next > lo && next < hi ? next : (lo + hi) / 2;
        }

        return x;
    }
}
