namespace YieldBench.Scenario;

/// <summary>
/// A small seeded generator (xoshiro256** seeded through SplitMix64, Blackman and Vigna 2018) owned by the project, so
/// that the scenario's numbers never change with the .NET runtime's own <see cref="System.Random"/> implementation.
/// </summary>
public sealed class ScenarioRandom
{
    private ulong _s0, _s1, _s2, _s3;
    private double? _spareNormal;

    /// <summary>Makes a generator whose whole sequence is fixed by <paramref name="seed"/>.</summary>
    public ScenarioRandom(ulong seed)
    {
        ulong x = seed;
        _s0 = SplitMix(ref x);
        _s1 = SplitMix(ref x);
        _s2 = SplitMix(ref x);
        _s3 = SplitMix(ref x);
    }

    /// <summary>A child generator for one named part of the scenario, so adding draws in one part leaves others unchanged.</summary>
    public ScenarioRandom Fork(string purpose)
    {
        // FNV-1a over the purpose text: stable across runs and runtimes, unlike string.GetHashCode.
        ulong h = 14695981039346656037UL;
        foreach (char c in purpose)
        {
            h = unchecked((h ^ c) * 1099511628211UL);
        }

        return new ScenarioRandom(unchecked(NextUInt64() ^ h));
    }

    /// <summary>The next 64 random bits.</summary>
    public ulong NextUInt64()
    {
        unchecked
        {
            ulong result = RotateLeft(_s1 * 5, 7) * 9;
            ulong t = _s1 << 17;
            _s2 ^= _s0;
            _s3 ^= _s1;
            _s1 ^= _s2;
            _s0 ^= _s3;
            _s2 ^= t;
            _s3 = RotateLeft(_s3, 45);
            return result;
        }
    }

    /// <summary>Uniform on [0, 1) with 53 random bits.</summary>
    public double NextDouble() => (NextUInt64() >> 11) * (1.0 / 9007199254740992.0);

    /// <summary>Uniform on [<paramref name="min"/>, <paramref name="max"/>).</summary>
    public double Uniform(double min, double max) => min + ((max - min) * NextDouble());

    /// <summary>Uniform integer on [<paramref name="min"/>, <paramref name="maxExclusive"/>).</summary>
    public int Next(int min, int maxExclusive)
    {
        if (maxExclusive <= min)
        {
            throw new ArgumentOutOfRangeException(nameof(maxExclusive), maxExclusive, "The upper bound must exceed the lower bound.");
        }

        return min + (int)(NextDouble() * (maxExclusive - min));
    }

    /// <summary>True with probability <paramref name="p"/>.</summary>
    public bool Chance(double p) => NextDouble() < p;

    /// <summary>Normal deviate (Marsaglia polar method).</summary>
    public double Normal(double mean = 0, double sd = 1)
    {
        if (_spareNormal is { } spare)
        {
            _spareNormal = null;
            return mean + (sd * spare);
        }

        double u, v, s;
        do
        {
            u = (2 * NextDouble()) - 1;
            v = (2 * NextDouble()) - 1;
            s = (u * u) + (v * v);
        }
        while (s >= 1 || s == 0);

        double m = Math.Sqrt(-2 * Math.Log(s) / s);
        _spareNormal = v * m;
        return mean + (sd * u * m);
    }

    /// <summary>Normal deviate truncated to [<paramref name="min"/>, <paramref name="max"/>] by redrawing.</summary>
    public double TruncatedNormal(double mean, double sd, double min, double max)
    {
        for (int i = 0; i < 1000; i++)
        {
            double x = Normal(mean, sd);
            if (x >= min && x <= max)
            {
                return x;
            }
        }

        return Math.Clamp(mean, min, max);
    }

    /// <summary>Picks one item with the given relative weights.</summary>
    public T Pick<T>(IReadOnlyList<(T Item, double Weight)> choices)
    {
        double total = 0;
        foreach (var c in choices)
        {
            total += c.Weight;
        }

        double r = NextDouble() * total;
        foreach (var c in choices)
        {
            r -= c.Weight;
            if (r < 0)
            {
                return c.Item;
            }
        }

        return choices[^1].Item;
    }

    private static ulong SplitMix(ref ulong x)
    {
        unchecked
        {
            ulong z = x += 0x9E3779B97F4A7C15UL;
            z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
            z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
            return z ^ (z >> 31);
        }
    }

    private static ulong RotateLeft(ulong x, int k) => (x << k) | (x >> (64 - k));
}
