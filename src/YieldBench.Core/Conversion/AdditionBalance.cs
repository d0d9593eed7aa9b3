using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Core.Conversion;

/// <summary>
/// Effective starting sugar after recorded pre-fermentation additions, by mass balance.
/// °Brix is grams of sucrose-equivalent solids per 100 g of must, so with must volume V (L) at °Bx B₀:
/// must mass M₀ = V·ρ(B₀) kg (ρ = SG 20/20 × 0.99820 kg/L of a sucrose solution of that °Brix); solids = M₀·B₀/100;
/// water W litres adds 0.99820·W kg of mass and no solids; sucrose K kg adds K kg of mass and K kg of solids;
/// effective °Bx B₁ = 100·(solids + K)/(M₀ + 0.99820·W + K).
/// Volume afterwards V₁ = M₁/ρ(B₁): the mixture is given the density of a sucrose solution of its °Brix, which
/// stands in for the small contraction on mixing and the volume the dissolved sugar takes up.
/// Fermentable sugar afterwards = (sugar model at B₀ × V + 1000·K·1.0526)/V₁ g/L: added sucrose inverts to
/// 1.0526 times its mass of glucose + fructose (C12H22O11 + H2O → 2 C6H12O6) before yeast ferment it.
/// Approximations are listed in docs/methods.md ("Additions: water and sugar before fermentation").
/// </summary>
public static class AdditionBalance
{
    /// <summary>Result of the balance: the effective reading and, when it could not be made, why.</summary>
    /// <param name="Effective">Effective starting sugar; the measured one when no correction was made.</param>
    /// <param name="Corrected">True when additions changed the starting sugar.</param>
    /// <param name="Note">Why no correction was made although additions were recorded; null otherwise.</param>
    public sealed record Result(SugarReading Effective, bool Corrected, string? Note)
    {
        /// <summary>Fermentable sugar of the must after additions, g/L (the sugar model's value when uncorrected).</summary>
        public double EffectiveSugarGl { get; init; } = double.NaN;

        /// <summary>Must volume after additions, L; null when the must volume was not recorded.</summary>
        public double? VolumeAfterL { get; init; }
    }

    /// <summary>Applies the lot's recorded additions to its measured starting sugar, with the default sugar model.</summary>
    public static Result Apply(SugarReading measured, Additions additions) => Apply(measured, additions, SugarModel.Default);

    /// <summary>Applies the lot's recorded additions to its measured starting sugar under <paramref name="model"/>.</summary>
    public static Result Apply(SugarReading measured, Additions additions, SugarModel model)
    {
        ArgumentNullException.ThrowIfNull(additions);
        ArgumentNullException.ThrowIfNull(model);
        double measuredSugar = model.SugarGramsPerLitre(measured.Brix);
        Result Uncorrected(string? note) =>
            new(measured, false, note) { EffectiveSugarGl = measuredSugar, VolumeAfterL = additions.MustVolumeL };

        if (additions.WaterAddedL is < 0)
        {
            return Uncorrected(ConversionNotes.NegativeAddition("water_added_l", additions.WaterAddedL.Value));
        }

        if (additions.SugarAddedKg is < 0)
        {
            return Uncorrected(ConversionNotes.NegativeAddition("sugar_added_kg", additions.SugarAddedKg.Value));
        }

        if (!additions.Any)
        {
            return Uncorrected(null);
        }

        if (additions.MustVolumeL is not { } volume || !(volume > 0))
        {
            return Uncorrected(ConversionNotes.AdditionsWithoutVolume);
        }

        double water = additions.WaterAddedL ?? 0;
        double sucrose = additions.SugarAddedKg ?? 0;
        double mass = volume * Density(measured.Brix);
        double solids = mass * measured.Brix / 100.0;
        double massAfter = mass + (OivMustTable.WaterDensity20C * water) + sucrose;
        double brix = 100.0 * (solids + sucrose) / massAfter;
        if (!(brix >= SugarReading.MinBrix && brix <= SugarReading.MaxBrix))
        {
            return Uncorrected(ConversionNotes.AdditionsOutOfRange(brix));
        }

        double volumeAfter = massAfter / Density(brix);
        double sugarGrams = (measuredSugar * volume) + (1000.0 * sucrose * GayLussac.HexosePerSucrose);
        return new Result(SugarReading.FromBrix(brix), true, null)
        {
            EffectiveSugarGl = sugarGrams / volumeAfter,
            VolumeAfterL = volumeAfter,
        };
    }

    /// <summary>
    /// Water (L) to add to <paramref name="mustVolumeL"/> litres at <paramref name="measured"/> to reach
    /// <paramref name="targetBrix"/> (0.1–50 °Brix), and the volume afterwards, V + W: volumes of must and water are
    /// taken as additive (the mass-over-density volume of <see cref="Apply(SugarReading, Additions, SugarModel)"/>
    /// differs by about 0.01 %). Zero water when the must is already at or below the target.
    /// </summary>
    public static (double WaterL, double VolumeAfterL) WaterForTarget(SugarReading measured, double mustVolumeL, double targetBrix)
    {
        Check.InRange(mustVolumeL, 0, 1e9, "Must volume", "L");
        Check.InRange(targetBrix, 0.1, SugarReading.MaxBrix, "Target sugar", "°Brix");
        if (targetBrix >= measured.Brix)
        {
            return (0, mustVolumeL);
        }

        double mass = mustVolumeL * Density(measured.Brix);
        double solids = mass * measured.Brix / 100.0;
        double massAfter = 100.0 * solids / targetBrix;
        double water = (massAfter - mass) / OivMustTable.WaterDensity20C;
        return (water, mustVolumeL + water);
    }

    /// <summary>
    /// Sucrose (kg) to add to <paramref name="mustVolumeL"/> litres at <paramref name="measured"/> to reach
    /// <paramref name="targetBrix"/> (up to 50 °Brix), and the volume afterwards. Zero when already at or above the
    /// target. Whether, when and how much sugar may be added is set by local rules; this is arithmetic only.
    /// </summary>
    public static (double SugarKg, double VolumeAfterL) SugarForTarget(SugarReading measured, double mustVolumeL, double targetBrix)
    {
        Check.InRange(mustVolumeL, 0, 1e9, "Must volume", "L");
        Check.InRange(targetBrix, SugarReading.MinBrix, SugarReading.MaxBrix, "Target sugar", "°Brix");
        if (targetBrix <= measured.Brix)
        {
            return (0, mustVolumeL);
        }

        // 100·(S + K) = B·(M + K)  ⇒  K = (B·M − 100·S) / (100 − B).
        double mass = mustVolumeL * Density(measured.Brix);
        double solids = mass * measured.Brix / 100.0;
        double sugar = ((targetBrix * mass) - (100.0 * solids)) / (100.0 - targetBrix);
        return (sugar, (mass + sugar) / Density(targetBrix));
    }

    /// <summary>Density at 20 °C (kg/L) of a sucrose solution of this °Brix, standing in for the must's.</summary>
    private static double Density(double brix) => SugarScales.DensityFromBrix(brix);
}
