using static System.FormattableString;

namespace YieldBench.Core.Review.Strains.Detectors;

/// <summary>
/// <c>off-strain-line</c>: a finished lot's alcohol far from its strain's Theil–Sen line at its starting sugar; then
/// <c>possible-transposed-digits</c> when a digit swap of the recorded starting sugar would put it on the line
/// (<see cref="TranspositionDetector"/>).
/// </summary>
internal sealed class StrainLineDetector : ILotDetector
{
    public IEnumerable<LotFlag> Flags(LotContext c)
    {
        if (c.Line is not { } line || !(Math.Abs(c.LineZ) > c.Settings.LineResidualLimit))
        {
            yield break;
        }

        var lot = c.Lot;
        double predicted = c.Predicted;
        yield return c.Make(
            FlagCodes.OffStrainLine,
            FlagSeverity.Check,
            "final_abv",
            lot.Abv,
            line.Name,
            predicted,
            line.Scale,
            Invariant($"final alcohol {lot.Abv:0.00} % v/v is {lot.Abv - predicted:+0.00;-0.00} % v/v from the Theil–Sen line of {line.Name} at {lot.Brix:0.0} °Brix ({predicted:0.00} % v/v), {Math.Abs(c.LineZ):0.0} robust residual scales away (scale {line.Scale:0.000} % v/v; limit {c.Settings.LineResidualLimit:0.0})"),
            lot.Abv < predicted
                ? FollowUps.RecheckStartingSugar + "; " + FollowUps.LookForWater + "; " + FollowUps.RerunAlcohol + "; " + FollowUps.Evaporation
                : FollowUps.RecheckStartingSugar + "; " + FollowUps.LookForSugar + "; " + FollowUps.RerunAlcohol);

        if (TranspositionDetector.Swap(c, line) is { } swap)
        {
            yield return swap;
        }
    }
}
