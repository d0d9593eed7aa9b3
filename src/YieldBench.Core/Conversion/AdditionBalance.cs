using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Core.Conversion;

/// <summary>
/// Effective starting sugar after recorded pre-fermentation additions, by mass balance on dissolved solids.
/// °Brix is grams of sucrose-equivalent solids per 100 g of must, so:
/// must mass M = V·ρ (ρ = SG 20/20 × 0.99820 kg/L); solids S = M·°Bx/100;
/// water W litres adds 0.99820·W kg of mass and no solids; sucrose K kg adds K kg of mass and K kg of solids;
/// effective °Bx = 100·(S + K)/(M + 0.99820·W + K).
/// Approximations (docs/methods.md): sucrose counts one-for-one as °Brix solids (a refractometer reads invert sugar
/// close to sucrose; the 5.3 % mass gain on inversion is not added); volume contraction on mixing is ignored because
/// the balance is on mass.
/// </summary>
public static class AdditionBalance
{
    /// <summary>Result of the balance: the effective reading and, when it could not be made, why.</summary>
    public sealed record Result(SugarReading Effective, bool Corrected, string? Note);

    /// <summary>Applies the lot's recorded additions to its measured starting sugar.</summary>
    public static Result Apply(SugarReading measured, Additions additions)
    {
        if (!additions.Any)
        {
            return new Result(measured, false, null);
        }

        if (additions.MustVolumeL is not { } volume || volume <= 0)
        {
            return new Result(
                measured,
                false,
                "water or sugar additions are recorded but the must volume is not, so the starting sugar could not be corrected; record must_volume_l");
        }

        double water = additions.WaterAddedL ?? 0;
        double sucrose = additions.SugarAddedKg ?? 0;
        double density = measured.SpecificGravity * OivMustTable.WaterDensity20C;
        double mass = volume * density;
        double solids = mass * measured.Brix / 100.0;
        double brix = 100.0 * (solids + sucrose) / (mass + (OivMustTable.WaterDensity20C * water) + sucrose);
        return new Result(SugarReading.FromBrix(brix), true, null);
    }

    /// <summary>
    /// Water (L) to add to <paramref name="mustVolumeL"/> litres at <paramref name="measured"/> to reach
    /// <paramref name="targetBrix"/>, and the volume afterwards (mixing contraction ignored). Zero when already at or below.
    /// </summary>
    public static (double WaterL, double VolumeAfterL) WaterForTarget(SugarReading measured, double mustVolumeL, double targetBrix)
    {
        Check.InRange(mustVolumeL, 0, 1e9, "Must volume", "L");
        if (targetBrix >= measured.Brix)
        {
            return (0, mustVolumeL);
        }

        Check.InRange(targetBrix, 0.1, SugarReading.MaxBrix, "Target sugar", "°Brix");
        double density = measured.SpecificGravity * OivMustTable.WaterDensity20C;
        double mass = mustVolumeL * density;
        double solids = mass * measured.Brix / 100.0;
        double massAfter = 100.0 * solids / targetBrix;
        double water = (massAfter - mass) / OivMustTable.WaterDensity20C;
        return (water, mustVolumeL + water);
    }
}
