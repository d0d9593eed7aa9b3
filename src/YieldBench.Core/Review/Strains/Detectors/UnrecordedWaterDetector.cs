using static System.FormattableString;

namespace YieldBench.Core.Review.Strains.Detectors;

/// <summary>
/// <c>possible-unrecorded-water</c>: a low factor in a finished lot without recorded additions, whose shortfall
/// against its strain's median factor is a dilution share in the plausible add-back range. A share s of the diluted
/// volume is s ÷ (1 − s) of the must before the water (10 % of the mix is 11 L per 100 L of must). From
/// <see cref="StrainReviewSettings.WaterLikelyErrorShare"/> on, the recorded sugar is too far from what fermented: a likely error.
/// </summary>
internal sealed class UnrecordedWaterDetector : ILotDetector
{
    public IEnumerable<LotFlag> Flags(LotContext c)
    {
        var lot = c.Lot;
        var s = c.Settings;
        bool low = (!double.IsNaN(c.Score.Z) && c.Score.Z < -s.ModifiedZLimit) || c.LineZ < -s.LineResidualLimit;
        if (!low || !lot.IsDry || lot.Conversion.AdditionsApplied)
        {
            yield break;
        }

        double expected = c.Own.Median * lot.Brix;
        double share = 1 - (lot.Abv / expected);
        if (share < s.WaterShareLow || share > s.WaterShareHigh)
        {
            yield break;
        }

        double perHundred = share / (1 - share) * 100;
        yield return c.Against(
            c.Own,
            FlagCodes.PossibleUnrecordedWater,
            share >= s.WaterLikelyErrorShare ? FlagSeverity.LikelyError : FlagSeverity.Check,
            lot.FactorName,
            lot.Factor,
            Invariant($"the lot is dry yet made {lot.Abv:0.00} % v/v where {c.Own.Name}'s median factor predicts {expected:0.00} % v/v from {lot.Brix:0.0} °Brix; an unrecorded water addition of about {perHundred:0} L per 100 L of must ({share * 100:0} % of the diluted volume) would explain the shortfall"),
            FollowUps.LookForWater + "; " + FollowUps.RecheckStartingSugar + "; " + FollowUps.Evaporation) with
        {
            Suggestion = Invariant($"about {perHundred:0} L of water per 100 L of must"),
        };
    }
}
