namespace YieldBench.Core.Forecast;

/// <summary>Weighted points of a mixture, kept in two arrays so that sorting is a primitive sort of the values.</summary>
internal sealed class WeightedPoints(int capacity)
{
    private double[] _values = new double[Math.Max(4, capacity)];
    private double[] _weights = new double[Math.Max(4, capacity)];

    private double _never;
    private bool _neverPlaced;

    public int Count { get; private set; }

    public double TotalWeight { get; private set; }

    public void Clear()
    {
        Count = 0;
        TotalWeight = 0;
        _never = 0;
        _neverPlaced = false;
    }

    public void Add(double value, double weight)
    {
        if (double.IsPositiveInfinity(value))
        {
            // Every "never" is one point, added at the end of the sort: it only needs its weight.
            _never += weight;
            TotalWeight += weight;
            return;
        }

        if (Count == _values.Length)
        {
            Array.Resize(ref _values, Count * 2);
            Array.Resize(ref _weights, Count * 2);
        }

        _values[Count] = value;
        _weights[Count] = weight;
        Count++;
        TotalWeight += weight;
    }

    /// <summary>Total weight of points above <paramref name="level"/> (finite ones only when asked).</summary>
    public double WeightAbove(double level, bool finiteOnly)
    {
        double s = finiteOnly || _neverPlaced ? 0 : _never;
        for (int i = 0; i < Count; i++)
        {
            if (_values[i] > level && (!finiteOnly || double.IsFinite(_values[i])))
            {
                s += _weights[i];
            }
        }

        return s;
    }

    /// <summary>Sorts the points by value (ties keep no particular order; equal values give equal quantiles).</summary>
    public void Sort()
    {
        Array.Sort(_values, _weights, 0, Count);
        if (_never > 0 && !_neverPlaced)
        {
            // The "never" weight goes last, as one point at +∞ (Add counted it in the total already).
            TotalWeight -= _never;
            AddFinite(double.PositiveInfinity, _never);
            _neverPlaced = true;
        }
    }

    private void AddFinite(double value, double weight)
    {
        if (Count == _values.Length)
        {
            Array.Resize(ref _values, Count * 2);
            Array.Resize(ref _weights, Count * 2);
        }

        _values[Count] = value;
        _weights[Count] = weight;
        Count++;
        TotalWeight += weight;
    }

    /// <summary>
    /// Weighted quantile of the sorted points: the value where the cumulative weight, counted to each point's middle,
    /// reaches q of the total, interpolated linearly between neighbouring points.
    /// </summary>
    public double QuantileOfSorted(double q)
    {
        if (Count == 0)
        {
            return double.NaN;
        }

        double target = q * TotalWeight, cum = 0, prevMid = double.NaN, prevV = double.NaN;
        for (int i = 0; i < Count; i++)
        {
            double mid = cum + (_weights[i] / 2);
            if (mid >= target)
            {
                if (double.IsNaN(prevMid) || double.IsInfinity(_values[i]) || double.IsInfinity(prevV))
                {
                    return _values[i];
                }

                double f = (target - prevMid) / (mid - prevMid);
                return prevV + (f * (_values[i] - prevV));
            }

            cum += _weights[i];
            (prevMid, prevV) = (mid, _values[i]);
        }

        return _values[Count - 1];
    }
}
