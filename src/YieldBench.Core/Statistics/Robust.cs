namespace YieldBench.Core.Statistics;

/// <summary>
/// Robust location and scale estimators. Every scale is made consistent for the standard deviation of a normal
/// sample. Degenerate-input policy (pinned by tests, and the same as R robustbase 0.95): an empty sample gives NaN;
/// one value gives scale 0 and location equal to that value; all-equal values give scale 0. NaN values throw
/// <see cref="ArgumentException"/> (callers filter missing values first).
/// </summary>
public static class Robust
{
    /// <summary>1/Φ⁻¹(3/4): makes the median absolute deviation consistent for the normal standard deviation.</summary>
    public const double MadConsistency = 1.482602218505602;

    /// <summary>Iglewicz–Hoaglin modified-z factor Φ⁻¹(3/4) ≈ 0.6745 (they round it to 0.6745).</summary>
    public const double ModifiedZFactor = 0.6745;

    /// <summary>Asymptotic consistency constant of Qn for the normal (robustbase 0.95; the 1993 paper's 2.2219 was later corrected).</summary>
    public const double QnConsistency = 2.21914;

    /// <summary>Asymptotic consistency constant of Sn for the normal (Rousseeuw &amp; Croux 1993).</summary>
    public const double SnConsistency = 1.1926;

    /// <summary>Default tuning constant of the Huber M-estimator: 95 % efficiency at the normal.</summary>
    public const double HuberDefaultK = 1.345;

    private static readonly double[] QnSmallSample =
        [0.399356, 0.99365, 0.51321, 0.84401, 0.61220, 0.85877, 0.66993, 0.87344, 0.72014, 0.88906, 0.75743];

    private static readonly double[] SnSmallSample = [0.743, 1.851, 0.954, 1.351, 0.993, 1.198, 1.005, 1.131];

    /// <summary>Raw median absolute deviation from the median, median|xᵢ − med(x)| (no consistency factor).</summary>
    public static double RawMad(IEnumerable<double> values)
    {
        var a = Descriptive.ToSortedArray(values);
        if (a.Length == 0)
        {
            return double.NaN;
        }

        double med = Descriptive.MedianOfSorted(a);
        var dev = new double[a.Length];
        for (int i = 0; i < a.Length; i++)
        {
            dev[i] = Math.Abs(a[i] - med);
        }

        return Descriptive.MedianInPlace(dev);
    }

    /// <summary>
    /// Scaled median absolute deviation, 1.482602 × median|xᵢ − med(x)|, in the unit of the values.
    /// NaN when empty; 0 for one value or when more than half the values are equal.
    /// </summary>
    public static double Mad(IEnumerable<double> values) => MadConsistency * RawMad(values);

    /// <summary>√(π/2): makes the mean absolute deviation consistent for the normal standard deviation.</summary>
    public static readonly double MeanAbsoluteDeviationConsistency = Math.Sqrt(Math.PI / 2);

    /// <summary>
    /// Mean absolute deviation about the median, scaled by √(π/2) to be consistent for the normal standard deviation.
    /// Not robust (its breakdown point is 0), but it is positive whenever the values are not all equal, so it serves
    /// as the last fallback scale when more than half the values are tied and MAD, Qn and Sn are all 0.
    /// NaN when empty; 0 when all values are equal.
    /// </summary>
    public static double MeanAbsoluteDeviation(IEnumerable<double> values)
    {
        var a = Descriptive.ToSortedArray(values);
        if (a.Length == 0)
        {
            return double.NaN;
        }

        double med = Descriptive.MedianOfSorted(a), sum = 0;
        foreach (double v in a)
        {
            sum += Math.Abs(v - med);
        }

        return MeanAbsoluteDeviationConsistency * sum / a.Length;
    }

    /// <summary>
    /// Iglewicz–Hoaglin modified z-score M = 0.6745 (x − median) / raw MAD. The usual outlier rule is |M| &gt; 3.5.
    /// When the raw MAD is 0 the score is undefined: this returns NaN and callers choose a fallback scale.
    /// </summary>
    public static double ModifiedZ(double value, double median, double rawMad) =>
        rawMad > 0 ? ModifiedZFactor * (value - median) / rawMad : double.NaN;

    /// <summary>
    /// Rousseeuw–Croux Qn: 2.21914 · dₙ · the k-th smallest of |xᵢ − xⱼ| (i &lt; j), k = C(⌊n/2⌋+1, 2), with robustbase's
    /// small-sample factors dₙ (tabled for n ≤ 12, fitted formula beyond). Computed in O(n log² n) time by sorted-matrix
    /// selection (Croux &amp; Rousseeuw 1992), never by forming the n(n−1)/2 differences.
    /// NaN when empty; 0 for one value or when all values are equal.
    /// </summary>
    public static double Qn(IEnumerable<double> values)
    {
        var x = Descriptive.ToSortedArray(values);
        int n = x.Length;
        if (n == 0)
        {
            return double.NaN;
        }

        if (n == 1)
        {
            return 0;
        }

        long h = (n / 2) + 1;
        long k = h * (h - 1) / 2;

        double kth = KthPairwiseDifference(x, k);
        double raw = QnConsistency * kth;
        return n <= 12 ? raw * QnSmallSample[n - 2] : raw / QnFiniteCorrection(n);
    }

    /// <summary>
    /// The k-th smallest (1-based) of the differences x[j] − x[i], i &lt; j, of a sorted array: the row-bound narrowing
    /// of Johnson &amp; Mizoguchi (1978) as Croux &amp; Rousseeuw (1992) use it for Qn (see
    /// <see cref="SortedMatrixSelection"/>), written out for this matrix so that the entries are read straight from the
    /// array and both counts of a round come from one two-pointer pass. Row i holds x[j] − x[i] for j = i+1 .. n−1,
    /// non-decreasing along the row because x is sorted; the boundary of the entries below a trial value only moves
    /// right as i grows.
    /// </summary>
    internal static double KthPairwiseDifference(double[] x, long k)
    {
        int n = x.Length;
        var lo = new int[n];
        var hi = new int[n];
        for (int i = 0; i < n; i++)
        {
            lo[i] = i + 1;
            hi[i] = n - 1;
        }

        var below = new int[n];
        var atOrBelow = new int[n];
        var trialValues = new double[n];
        var trialWeights = new long[n];
        while (true)
        {
            long candidates = 0;
            int m = 0;
            for (int i = 0; i < n; i++)
            {
                int a = lo[i], b = hi[i];
                if (a <= b)
                {
                    candidates += b - a + 1;
                    trialValues[m] = x[a + ((b - a) / 2)] - x[i];
                    trialWeights[m] = b - a + 1;
                    m++;
                }
            }

            if (candidates <= Math.Max(n, 64))
            {
                long discarded = 0;
                var values = new List<double>((int)candidates);
                for (int i = 0; i < n; i++)
                {
                    discarded += Math.Max(lo[i], i + 1) - (i + 1);
                    for (int j = lo[i]; j <= hi[i]; j++)
                    {
                        values.Add(x[j] - x[i]);
                    }
                }

                values.Sort();
                return values[(int)(k - discarded - 1)];
            }

            double t = SortedMatrixSelection.WeightedHighMedian(trialValues, trialWeights, m);
            long sumBelow = 0, sumAtOrBelow = 0;
            int p = 0, q = 0;
            for (int i = 0; i < n; i++)
            {
                p = Math.Max(p, i + 1);
                q = Math.Max(q, p);
                while (p < n && x[p] - x[i] < t)
                {
                    p++;
                }

                q = Math.Max(q, p);
                while (q < n && x[q] - x[i] <= t)
                {
                    q++;
                }

                below[i] = p - (i + 1);
                atOrBelow[i] = q - (i + 1);
                sumBelow += below[i];
                sumAtOrBelow += atOrBelow[i];
            }

            if (k <= sumBelow)
            {
                for (int i = 0; i < n; i++)
                {
                    hi[i] = Math.Min(hi[i], i + below[i]);
                }
            }
            else if (k > sumAtOrBelow)
            {
                for (int i = 0; i < n; i++)
                {
                    lo[i] = Math.Max(lo[i], i + 1 + atOrBelow[i]);
                }
            }
            else
            {
                return t;
            }
        }
    }

    /// <summary>
    /// Rousseeuw–Croux Sn: 1.1926 · cₙ · lomedᵢ himedⱼ |xᵢ − xⱼ| (j over all n values, itself included), with
    /// robustbase's small-sample factors cₙ (tabled for n ≤ 9; n/(n − 0.9) for odd n, 1 for even n beyond).
    /// Each inner high median is the k-th smallest of two sorted runs of distances, found by binary search, so the
    /// whole is O(n log n). NaN when empty; 0 for one value or when all values are equal.
    /// </summary>
    public static double Sn(IEnumerable<double> values)
    {
        var x = Descriptive.ToSortedArray(values);
        int n = x.Length;
        if (n == 0)
        {
            return double.NaN;
        }

        if (n == 1)
        {
            return 0;
        }

        // himed of n distances (one of them the zero to itself) is the (⌊n/2⌋+1)-th smallest, i.e. the
        // ⌊n/2⌋-th smallest of the n − 1 distances to the others.
        int m = n / 2;
        var inner = new double[n];
        for (int i = 0; i < n; i++)
        {
            inner[i] = KthDistance(x, i, m);
        }

        Array.Sort(inner);

        // lomed of n values is the ⌈n/2⌉-th smallest... written (n + 1) / 2 in integer arithmetic.
        double raw = SnConsistency * inner[((n + 1) / 2) - 1];
        double factor = n <= 9 ? SnSmallSample[n - 2] : (n % 2 == 1 ? n / (n - 0.9) : 1.0);
        return factor * raw;
    }

    /// <summary>
    /// Mean of the values left after cutting ⌊n·<paramref name="proportion"/>⌋ from each end (as R
    /// <c>mean(x, trim)</c> and scipy <c>trim_mean</c>). Proportion in [0, 0.5); the default 0.2 is the 20 %
    /// trimmed mean. NaN when empty.
    /// </summary>
    public static double TrimmedMean(IEnumerable<double> values, double proportion = 0.2)
    {
        if (double.IsNaN(proportion) || proportion < 0 || proportion >= 0.5)
        {
            throw new ArgumentOutOfRangeException(nameof(proportion), proportion, "The trimmed share must be at least 0 and below 0.5.");
        }

        var a = Descriptive.ToSortedArray(values);
        int n = a.Length;
        if (n == 0)
        {
            return double.NaN;
        }

        int cut = (int)Math.Floor(n * proportion);
        double sum = 0;
        for (int i = cut; i < n - cut; i++)
        {
            sum += a[i];
        }

        return sum / (n - (2 * cut));
    }

    /// <summary>
    /// Huber M-estimate of location with the scale held at the scaled MAD about the median, iterated from the
    /// median by μ ← mean(clip(x, μ − k·s, μ + k·s)) until the step is below 10⁻⁶·s (the scheme of robustbase
    /// <c>huberM</c>). <paramref name="k"/> in units of the scale; 1.345 gives 95 % efficiency at the normal.
    /// NaN when empty; the median when the MAD is 0 (one value, or more than half the values equal).
    /// </summary>
    public static double HuberLocation(IEnumerable<double> values, double k = HuberDefaultK)
    {
        if (double.IsNaN(k) || k <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(k), k, "The Huber tuning constant must be positive.");
        }

        var x = Descriptive.ToSortedArray(values);
        if (x.Length == 0)
        {
            return double.NaN;
        }

        double mu = Descriptive.MedianOfSorted(x);
        double s = Mad(x);
        if (s <= 0)
        {
            return mu;
        }

        const double tolerance = 1e-6;
        for (int iteration = 0; iteration < 10_000; iteration++)
        {
            double lo = mu - (k * s), hi = mu + (k * s), sum = 0;
            foreach (double v in x)
            {
                sum += Math.Clamp(v, lo, hi);
            }

            double next = sum / x.Length;
            if (Math.Abs(mu - next) < tolerance * s)
            {
                break;
            }

            mu = next;
        }

        return mu;
    }

    /// <summary>robustbase's fitted finite-sample correction of Qn for n &gt; 12 (Qn.finite.c); Qn is divided by it.</summary>
    private static double QnFiniteCorrection(int n) =>
        (n % 2 == 1
            ? 1.60188 + ((-2.1284 - (5.172 / n)) / n)
            : 3.67561 + ((1.9654 + ((6.987 - (77.0 / n)) / n)) / n)) / n + 1;

    /// <summary>The m-th smallest (1-based) distance from x[i] to the other points of the sorted array.</summary>
    private static double KthDistance(double[] x, int i, int m)
    {
        // Left run L[a] = x[i] − x[i−1−a] (a < i) and right run R[b] = x[i+1+b] − x[i] (b < n−1−i) are both ascending.
        int nLeft = i, nRight = x.Length - 1 - i;
        int aLow = Math.Max(0, m - nRight), aHigh = Math.Min(m, nLeft);
        while (true)
        {
            // a elements from the left run and m − a from the right.
            int a = aLow + ((aHigh - aLow) / 2);
            int b = m - a;
            double leftLast = a > 0 ? x[i] - x[i - a] : double.NegativeInfinity;
            double rightLast = b > 0 ? x[i + b] - x[i] : double.NegativeInfinity;
            double leftNext = a < nLeft ? x[i] - x[i - a - 1] : double.PositiveInfinity;
            double rightNext = b < nRight ? x[i + b + 1] - x[i] : double.PositiveInfinity;
            if (leftLast > rightNext)
            {
                aHigh = a - 1;
            }
            else if (rightLast > leftNext)
            {
                aLow = a + 1;
            }
            else
            {
                return Math.Max(leftLast, rightLast);
            }
        }
    }
}
