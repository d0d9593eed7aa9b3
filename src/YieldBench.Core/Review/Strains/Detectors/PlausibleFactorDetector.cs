using static System.FormattableString;

namespace YieldBench.Core.Review.Strains.Detectors;

/// <summary><c>implausible-factor</c>: a factor outside the plausible band for a complete fermentation of grape must.</summary>
internal sealed class PlausibleFactorDetector : ILotDetector
{
    public IEnumerable<LotFlag> Flags(LotContext c)
    {
        var s = c.Settings;
        double factor = c.Lot.Factor;
        bool low = factor < s.PlausibleFactorLow;
        if (!low && !(factor > s.PlausibleFactorHigh))
        {
            yield break;
        }

        yield return c.AgainstThreshold(
            FlagCodes.ImplausibleFactor,
            FlagSeverity.LikelyError,
            c.Lot.FactorName,
            factor,
            Invariant($"plausible band {s.PlausibleFactorLow:0.00}–{s.PlausibleFactorHigh:0.00}"),
            low ? s.PlausibleFactorLow : s.PlausibleFactorHigh,
            Invariant($"factor {factor:0.0000} % v/v per °Brix is outside the plausible band {s.PlausibleFactorLow:0.00}–{s.PlausibleFactorHigh:0.00} for a complete fermentation of grape must"),
            FollowUps.RecheckStartingSugar + "; " + FollowUps.RerunAlcohol + (low ? "; " + FollowUps.LookForWater : "; " + FollowUps.LookForSugar));
    }
}
