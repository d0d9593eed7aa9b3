using static System.FormattableString;

namespace YieldBench.Core.Review.Strains.Detectors;

/// <summary><c>outside-tukey-fence</c>, <c>far-outside-tukey-fence</c>: the factor beyond Tukey's inner or outer fence of its strain.</summary>
internal sealed class TukeyFenceDetector : ILotDetector
{
    public IEnumerable<LotFlag> Flags(LotContext c)
    {
        var own = c.Own;

        // Never narrower than the readings' precision allows: a normal's interquartile range is 1.349 standard deviations.
        double iqr = Math.Max(own.Q3 - own.Q1, 1.349 * own.MinimumScale);
        if (own.N < 4 || !(iqr > 0))
        {
            yield break;
        }

        var s = c.Settings;
        double factor = c.Lot.Factor;
        bool far = factor < own.Q1 - (s.TukeyOuter * iqr) || factor > own.Q3 + (s.TukeyOuter * iqr);
        bool outside = factor < own.Q1 - (s.TukeyInner * iqr) || factor > own.Q3 + (s.TukeyInner * iqr);
        if (!outside)
        {
            yield break;
        }

        string which = far ? "outer" : "inner";
        double k = far ? s.TukeyOuter : s.TukeyInner;
        yield return c.Against(
            own,
            far ? FlagCodes.FarOutsideTukeyFence : FlagCodes.OutsideTukeyFence,
            far ? FlagSeverity.Check : FlagSeverity.Note,
            c.Lot.FactorName,
            factor,
            Invariant($"factor {factor:0.0000} is beyond the {which} Tukey fence of {own.Name}{c.PooledNote}: quartiles {own.Q1:0.0000} and {own.Q3:0.0000}, fences at {k:0.#} × IQR {iqr:0.0000} ({own.Q1 - (k * iqr):0.0000} to {own.Q3 + (k * iqr):0.0000})"),
            FollowUps.RecheckStartingSugar + "; " + FollowUps.RerunAlcohol,
            scale: iqr);
    }
}
