using static System.FormattableString;

namespace YieldBench.Core.Review.Strains.Detectors;

/// <summary><c>high-factor</c>, <c>low-factor</c>: the lot's factor far from its strain's median, by the modified z.</summary>
internal sealed class RobustZDetector : ILotDetector
{
    public IEnumerable<LotFlag> Flags(LotContext c)
    {
        if (!c.FarFromStrain)
        {
            yield break;
        }

        var lot = c.Lot;
        double z = c.Score.Z;
        bool high = z > 0;
        yield return c.Against(
            c.Own,
            high ? FlagCodes.HighFactor : FlagCodes.LowFactor,
            FlagSeverity.Check,
            lot.FactorName,
            lot.Factor,
            Invariant($"factor {lot.Factor:0.0000} % v/v per °Brix is {Math.Abs(z):0.0} robust standard deviations {(high ? "above" : "below")} the median {c.Own.Median:0.0000} of {c.Own.Name}{c.PooledNote} (modified z {z:+0.0;-0.0} by {c.Own.ScaleName}; limit {c.Settings.ModifiedZLimit:0.0})"),
            high
                ? FollowUps.RecheckStartingSugar + "; " + FollowUps.LookForSugar + "; " + FollowUps.RerunAlcohol
                : FollowUps.RecheckStartingSugar + "; " + FollowUps.LookForWater + "; " + FollowUps.RerunAlcohol + "; " + FollowUps.Evaporation);
    }
}
