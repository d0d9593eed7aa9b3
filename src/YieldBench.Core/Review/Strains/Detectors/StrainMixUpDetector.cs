using static System.FormattableString;

namespace YieldBench.Core.Review.Strains.Detectors;

/// <summary><c>possible-strain-mix-up</c>: a lot far from its own strain (modified z) but typical of another strain.</summary>
internal sealed class StrainMixUpDetector : ILotDetector
{
    public IEnumerable<LotFlag> Flags(LotContext c)
    {
        if (!c.FarFromStrain || c.Own.Name == StrainReviewer.Pooled)
        {
            yield break;
        }

        double factor = c.Lot.Factor;
        var better = c.StrainReferences
            .Where(r => r.Name != c.Own.Name)
            .Select(r => (Ref: r, Z: r.Z(factor)))
            .Where(t => !double.IsNaN(t.Z) && Math.Abs(t.Z) <= c.Settings.MixUpFitZ)
            .OrderBy(t => Math.Abs(t.Z))
            .ThenBy(t => t.Ref.Name, StringComparer.Ordinal)
            .FirstOrDefault();
        if (better.Ref is null)
        {
            yield break;
        }

        yield return c.Against(
            c.Own,
            FlagCodes.PossibleStrainMixUp,
            FlagSeverity.Check,
            c.Lot.FactorName,
            factor,
            Invariant($"factor {factor:0.0000} is far from {c.Own.Name} (modified z {c.Score.Z:+0.0;-0.0}) but typical of {better.Ref.Name} (median {better.Ref.Median:0.0000}, modified z {better.Z:+0.0;-0.0})"),
            FollowUps.ConfirmStrain) with
        {
            Suggestion = better.Ref.Name,
        };
    }
}
