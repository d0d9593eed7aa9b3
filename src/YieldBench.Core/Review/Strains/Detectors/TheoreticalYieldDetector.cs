using YieldBench.Core.Conversion;
using YieldBench.Core.Units;
using static System.FormattableString;

namespace YieldBench.Core.Review.Strains.Detectors;

/// <summary><c>above-theoretical-yield</c>: more alcohol than Gay-Lussac allows from the recorded sugar.</summary>
internal sealed class TheoreticalYieldDetector : ILotDetector
{
    public IEnumerable<LotFlag> Flags(LotContext c)
    {
        var conversion = c.Lot.Conversion;
        double efficiency = conversion.GayLussacEfficiency;
        if (!double.IsFinite(efficiency) || !(efficiency > 1.0))
        {
            yield break;
        }

        double most = conversion.SugarConsumedGl * GayLussac.EthanolMassYield / (10 * AlcoholContent.EthanolDensity20C);
        yield return c.AgainstThreshold(
            FlagCodes.AboveTheoreticalYield,
            FlagSeverity.LikelyError,
            ConversionMeasure.GayLussacEfficiency.Name(),
            efficiency,
            "Gay-Lussac theoretical yield",
            1.0,
            Invariant($"the alcohol needs {efficiency * 100:0.0} % of the Gay-Lussac theoretical yield from the recorded sugar ({conversion.SugarConsumedGl:0.0} g/L fermented can give at most {most:0.00} % v/v), which is impossible without unrecorded sugar or a measurement error"),
            FollowUps.LookForSugar + "; " + FollowUps.RerunAlcohol + "; " + FollowUps.RecheckStartingSugar);
    }
}
