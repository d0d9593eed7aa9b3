using static System.FormattableString;

namespace YieldBench.Core.Review.Strains.Detectors;

/// <summary><c>not-dry</c>: residual sugar above the dryness threshold (the factor then uses the sugar fermented).</summary>
internal sealed class NotDryDetector : ILotDetector
{
    public IEnumerable<LotFlag> Flags(LotContext c)
    {
        if (c.Lot.IsDry)
        {
            yield break;
        }

        var conversion = c.Lot.Conversion;
        double dry = c.Settings.DryThresholdGl;
        yield return c.AgainstThreshold(
            FlagCodes.NotDry,
            FlagSeverity.Note,
            "residual_sugar_gl",
            conversion.ResidualSugarGl,
            "dryness threshold",
            dry,
            Invariant($"residual sugar {conversion.ResidualSugarGl:0.0} g/L is above the dryness threshold {dry:0.#} g/L: the lot has not fermented to dryness, so its factor uses the {conversion.FermentedBrix:0.0} °Brix actually fermented"),
            FollowUps.ConfirmFinished);
    }
}
