using ScottPlot;

namespace YieldBench.Reports.Charts;

/// <summary>The axis limits that hold every point of some series whose x and y are both finite.</summary>
internal struct FiniteBounds
{
    private double left = double.PositiveInfinity, right = double.NegativeInfinity, bottom = double.PositiveInfinity, top = double.NegativeInfinity;

    public FiniteBounds()
    {
    }

    /// <summary>Widens the bounds to the finite points of one series (x and y of equal length).</summary>
    public void Add(double[] x, double[] y)
    {
        for (int i = 0; i < x.Length; i++)
        {
            if (double.IsFinite(x[i]) && double.IsFinite(y[i]))
            {
                left = Math.Min(left, x[i]);
                right = Math.Max(right, x[i]);
                bottom = Math.Min(bottom, y[i]);
                top = Math.Max(top, y[i]);
            }
        }
    }

    /// <summary>The limits, or no limits when no finite point was added.</summary>
    public readonly AxisLimits Limits => left <= right ? new AxisLimits(left, right, bottom, top) : AxisLimits.NoLimits;
}
