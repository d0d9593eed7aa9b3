using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Core.Conversion;

/// <summary>
/// Effective starting sugar after recorded pre-fermentation additions, by mass balance.
/// °Brix is grams of sucrose-equivalent solids per 100 g of must, so with must volume V (L) at °Bx B₀:
/// must mass M₀ = V·ρ(B₀) kg (ρ = SG 20/20 × 0.99820 kg/L of a sucrose solution of that °Brix); solids S₀ = M₀·B₀/100;
/// water W litres adds 0.99820·W kg of mass and no solids; sucrose K kg adds K kg of mass and, once the must's
/// invertase has split it (C12H22O11 + H2O → 2 C6H12O6, the water taken from the must), 1.0526·K kg of solids.
/// Mass after M₁ = M₀ + 0.99820·W + K; solids °Brix after B_s = 100·(S₀ + 1.0526·K)/M₁; volume after
/// V₁ = M₁/ρ(B_s); fermentable sugar after = (sugar model at B₀ × V + 1000·1.0526·K)/V₁ g/L.
/// The effective starting °Brix is the °Brix of a grape must holding that much fermentable sugar (the sugar model's
/// inverse): after an addition the non-sugar solids are those of the original must, diluted — not those a natural
/// must of the new °Brix would hold — so °Brix and sugar no longer pair as in the table, and a factor per °Brix is only
/// comparable with unamended lots on this sugar-equivalent °Brix.
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

        /// <summary>Dissolved solids after the additions and the sucrose's inversion, °Brix (a refractometer's reading); NaN when uncorrected.</summary>
        public double SolidsBrix { get; init; } = double.NaN;
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
        double solidsBrix = 100.0 * (solids + (sucrose * GayLussac.HexosePerSucrose)) / massAfter;
        if (!(solidsBrix >= SugarReading.MinBrix && solidsBrix <= SugarReading.MaxBrix))
        {
            return Uncorrected(ConversionNotes.AdditionsOutOfRange(solidsBrix));
        }

        double volumeAfter = massAfter / Density(solidsBrix);
        double sugarAfter = ((measuredSugar * volume) + (1000.0 * sucrose * GayLussac.HexosePerSucrose)) / volumeAfter;
        double brix = model.BrixEquivalent(sugarAfter);
        if (!(brix >= SugarReading.MinBrix && brix <= SugarReading.MaxBrix))
        {
            return Uncorrected(ConversionNotes.AdditionsOutOfRange(brix));
        }

        return new Result(SugarReading.FromBrix(brix), true, null)
        {
            EffectiveSugarGl = sugarAfter,
            VolumeAfterL = volumeAfter,
            SolidsBrix = solidsBrix,
        };
    }

    /// <summary>
    /// Water (L) to add to <paramref name="mustVolumeL"/> litres at <paramref name="measured"/> so that the effective
    /// °Brix of <see cref="Apply(SugarReading, Additions, SugarModel)"/> (default sugar model) is
    /// <paramref name="targetBrix"/> (0.1–50 °Brix), and the volume afterwards by the same balance. Found by bisection
    /// (the effective °Brix falls steadily as water is added) to 1e-7 L. Zero water when the must is already at or
    /// below the target.
    /// </summary>
    public static (double WaterL, double VolumeAfterL) WaterForTarget(SugarReading measured, double mustVolumeL, double targetBrix)
    {
        Check.InRange(mustVolumeL, 0, 1e9, "Must volume", "L");
        Check.InRange(targetBrix, 0.1, SugarReading.MaxBrix, "Target sugar", "°Brix");
        if (targetBrix >= measured.Brix)
        {
            return (0, mustVolumeL);
        }

        var after = Solve(w => Apply(measured, new Additions(mustVolumeL, w, null)), targetBrix, mustVolumeL, falling: true);
        return (after.Amount, after.Result.VolumeAfterL ?? mustVolumeL);
    }

    /// <summary>
    /// Sucrose (kg) to add to <paramref name="mustVolumeL"/> litres at <paramref name="measured"/> so that the
    /// effective °Brix is <paramref name="targetBrix"/> (up to 50 °Brix), and the volume afterwards; by bisection.
    /// Zero when already at or above the target. Whether, when and how much sugar may be added is set by local rules;
    /// this is arithmetic only.
    /// </summary>
    public static (double SugarKg, double VolumeAfterL) SugarForTarget(SugarReading measured, double mustVolumeL, double targetBrix)
    {
        Check.InRange(mustVolumeL, 0, 1e9, "Must volume", "L");
        Check.InRange(targetBrix, SugarReading.MinBrix, SugarReading.MaxBrix, "Target sugar", "°Brix");
        if (targetBrix <= measured.Brix)
        {
            return (0, mustVolumeL);
        }

        // The most sucrose the balance takes: the amount that brings the solids (after inversion) to the 50 °Brix limit.
        double mass = mustVolumeL * Density(measured.Brix);
        double most = ((SugarReading.MaxBrix * mass) - (mass * measured.Brix)) / ((100.0 * GayLussac.HexosePerSucrose) - SugarReading.MaxBrix);
        var after = Solve(k => Apply(measured, new Additions(mustVolumeL, null, k)), targetBrix, most, falling: false);
        return (after.Amount, after.Result.VolumeAfterL ?? mustVolumeL);
    }

    /// <summary>
    /// Bisection on an addition's amount until the effective °Brix is the target (to 1e-7 of the amount's unit). Water
    /// (<paramref name="falling"/>) starts from <paramref name="scale"/> and doubles until it passes the target; sugar
    /// searches up to <paramref name="scale"/>, the most the balance takes (the answer is that amount when even it
    /// falls short).
    /// </summary>
    private static (double Amount, Result Result) Solve(Func<double, Result> apply, double targetBrix, double scale, bool falling)
    {
        bool Beyond(double amount)
        {
            double b = apply(amount).Effective.Brix;
            return falling ? b <= targetBrix : b >= targetBrix;
        }

        double low = 0, high = scale;
        for (int i = 0; falling && i < 80 && !Beyond(high); i++)
        {
            high *= 2;
        }

        while (high - low > 1e-7)
        {
            double mid = (low + high) / 2;
            if (Beyond(mid))
            {
                high = mid;
            }
            else
            {
                low = mid;
            }
        }

        double amount = (low + high) / 2;
        return (amount, apply(amount));
    }

    /// <summary>Density at 20 °C (kg/L) of a sucrose solution of this °Brix, standing in for the must's.</summary>
    private static double Density(double brix) => SugarScales.DensityFromBrix(brix);
}
