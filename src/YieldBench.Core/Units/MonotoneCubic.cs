namespace YieldBench.Core.Units;

/// <summary>
/// Piecewise-cubic Hermite interpolation that keeps monotone data monotone (Fritsch &amp; Carlson 1980, SIAM J. Numer.
/// Anal. 17:238), with the weighted-harmonic-mean interior slopes and the shape-preserving three-point end slopes
/// used by scipy.interpolate.PchipInterpolator, so that scipy can serve as an outside check of the values.
/// Outside the knots the end cubic is extended.
/// </summary>
internal sealed class MonotoneCubic
{
    private readonly double[] x;
    private readonly double[] y;
    private readonly double[] m;

    public MonotoneCubic(double[] x, double[] y)
    {
        if (x.Length != y.Length || x.Length < 2)
        {
            throw new ArgumentException("Need at least two knots and one value per knot.", nameof(x));
        }

        for (int i = 1; i < x.Length; i++)
        {
            if (!(x[i] > x[i - 1]))
            {
                throw new ArgumentException("Knots must rise strictly.", nameof(x));
            }
        }

        this.x = x;
        this.y = y;
        m = Slopes(x, y);
    }

    public double Evaluate(double at)
    {
        int i = Array.BinarySearch(x, at);
        if (i < 0)
        {
            i = ~i - 1;
        }

        i = Math.Clamp(i, 0, x.Length - 2);
        double h = x[i + 1] - x[i];
        double t = (at - x[i]) / h;
        double t2 = t * t, t3 = t2 * t;
        return (((2 * t3) - (3 * t2) + 1) * y[i])
            + ((t3 - (2 * t2) + t) * h * m[i])
            + (((-2 * t3) + (3 * t2)) * y[i + 1])
            + ((t3 - t2) * h * m[i + 1]);
    }

    private static double[] Slopes(double[] x, double[] y)
    {
        int n = x.Length;
        var h = new double[n - 1];
        var d = new double[n - 1];
        for (int i = 0; i < n - 1; i++)
        {
            h[i] = x[i + 1] - x[i];
            d[i] = (y[i + 1] - y[i]) / h[i];
        }

        var m = new double[n];
        if (n == 2)
        {
            m[0] = m[1] = d[0];
            return m;
        }

        for (int i = 1; i < n - 1; i++)
        {
            if (Math.Sign(d[i - 1]) != Math.Sign(d[i]) || d[i - 1] == 0 || d[i] == 0)
            {
                m[i] = 0;
            }
            else
            {
                double w1 = (2 * h[i]) + h[i - 1], w2 = h[i] + (2 * h[i - 1]);
                m[i] = (w1 + w2) / ((w1 / d[i - 1]) + (w2 / d[i]));
            }
        }

        m[0] = EndSlope(h[0], h[1], d[0], d[1]);
        m[n - 1] = EndSlope(h[n - 2], h[n - 3], d[n - 2], d[n - 3]);
        return m;
    }

    // Non-centred three-point estimate, clipped so the end interval keeps its data's shape.
    private static double EndSlope(double h0, double h1, double d0, double d1)
    {
        double s = (((2 * h0) + h1) * d0 - (h0 * d1)) / (h0 + h1);
        if (Math.Sign(s) != Math.Sign(d0))
        {
            return 0;
        }

        if (Math.Sign(d0) != Math.Sign(d1) && Math.Abs(s) > Math.Abs(3 * d0))
        {
            return 3 * d0;
        }

        return s;
    }
}
