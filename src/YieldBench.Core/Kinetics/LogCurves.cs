using YieldBench.Core.Lots;

namespace YieldBench.Core.Kinetics;

/// <summary>Small operations on a lot's sorted readings: crossings, interpolation, stall windows, temperature pairing.</summary>
internal static class LogCurves
{
    /// <summary>The time at which a straight line from (t0, y0) to (t1, y1) passes <paramref name="level"/> (t0 when flat).</summary>
    internal static double Interpolate(double t0, double y0, double t1, double y1, double level) =>
        y1 == y0 ? t0 : t0 + ((t1 - t0) * (y0 - level) / (y0 - y1));

    /// <summary>The first time the readings reach <paramref name="level"/> or below (interpolated), as hours and a time; nulls when never.</summary>
    internal static (double? Hours, DateTime? At) FirstCrossing(double[] hrs, double[] bx, double level, DateTime origin)
    {
        if (bx[0] <= level)
        {
            return (hrs[0], origin + TimeSpan.FromHours(hrs[0]));
        }

        for (int i = 1; i < bx.Length; i++)
        {
            if (bx[i] <= level)
            {
                double t = Interpolate(hrs[i - 1], bx[i - 1], hrs[i], bx[i], level);
                return (t, origin + TimeSpan.FromHours(t));
            }
        }

        return (null, null);
    }

    /// <summary>°Brix at hour <paramref name="t"/>, interpolated between readings (the end values outside them).</summary>
    internal static double BrixAt(double[] hrs, double[] bx, double t)
    {
        int i = Array.BinarySearch(hrs, t);
        if (i >= 0)
        {
            return bx[i];
        }

        i = ~i;
        if (i == 0)
        {
            return bx[0];
        }

        if (i >= hrs.Length)
        {
            return bx[^1];
        }

        double f = (t - hrs[i - 1]) / (hrs[i] - hrs[i - 1]);
        return bx[i - 1] + (f * (bx[i] - bx[i - 1]));
    }

    /// <summary>
    /// The first window [t − D, t] ending at a reading, lying after <paramref name="from"/>, whose mean rate is under the
    /// threshold while every reading in it (and its interpolated start) stays above the sugar threshold; null when none.
    /// </summary>
    internal static StallEpisode? FindStall(SugarPoint[] sugar, double[] hrs, double[] bx, double from, double windowH, double rateBrixPerDay, double aboveBrix)
    {
        for (int i = 0; i < hrs.Length; i++)
        {
            double t0 = hrs[i] - windowH;
            if (t0 < from - 1e-9)
            {
                continue;
            }

            double b0 = BrixAt(hrs, bx, t0);
            double rate = (b0 - bx[i]) / windowH * 24.0;
            if (rate >= rateBrixPerDay || b0 <= aboveBrix)
            {
                continue;
            }

            bool above = true;
            for (int j = i; j >= 0 && hrs[j] >= t0; j--)
            {
                if (bx[j] <= aboveBrix)
                {
                    above = false;
                    break;
                }
            }

            if (above)
            {
                return new StallEpisode(sugar[i].Time - TimeSpan.FromHours(windowH), sugar[i].Time, b0, bx[i], rate);
            }
        }

        return null;
    }

    /// <summary>The temperature at <paramref name="t"/>: logged then, or interpolated between readings at most <paramref name="maxGapHours"/> away (the nearer one alone when only one is near).</summary>
    internal static double? TemperatureAt(TemperaturePoint[] temps, DateTime t, double maxGapHours)
    {
        if (temps.Length == 0)
        {
            return null;
        }

        // First reading at or after t, by binary search (dense probe logs hold thousands of readings).
        int lo = 0, hi = temps.Length;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (temps[mid].Time < t)
            {
                lo = mid + 1;
            }
            else
            {
                hi = mid;
            }
        }

        int i = lo == temps.Length ? -1 : lo;
        if (i >= 0 && temps[i].Time == t)
        {
            return temps[i].Celsius;
        }

        bool hasBefore = i == -1 || i > 0;
        bool hasAfter = i >= 0;
        var before = i == -1 ? temps[^1] : i > 0 ? temps[i - 1] : default;
        var after = i >= 0 ? temps[i] : default;
        bool nearBefore = hasBefore && (t - before.Time).TotalHours <= maxGapHours;
        bool nearAfter = hasAfter && (after.Time - t).TotalHours <= maxGapHours;
        if (nearBefore && nearAfter)
        {
            double f = (t - before.Time).TotalHours / (after.Time - before.Time).TotalHours;
            return before.Celsius + (f * (after.Celsius - before.Celsius));
        }

        return nearBefore ? before.Celsius : nearAfter ? after.Celsius : null;
    }

    /// <summary>
    /// The fastest mean rate, °Brix/day, over a window of <paramref name="windowH"/> hours ending at a reading and starting
    /// at or after <paramref name="from"/> h; null when no such window fits in the log.
    /// </summary>
    internal static double? FastestWindowAfter(double[] hrs, double[] bx, double from, double windowH)
    {
        double? best = null;
        for (int i = 0; i < hrs.Length; i++)
        {
            double t0 = hrs[i] - windowH;
            if (t0 < from - 1e-9)
            {
                continue;
            }

            double rate = (BrixAt(hrs, bx, t0) - bx[i]) / windowH * 24.0;
            if (best is null || rate > best)
            {
                best = rate;
            }
        }

        return best;
    }
}
