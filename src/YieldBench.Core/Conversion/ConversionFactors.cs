using YieldBench.Core.Lots;

namespace YieldBench.Core.Conversion;

/// <summary>
/// Computes each lot's four conversion measures (definitions and sources in docs/methods.md,
/// "The four conversion measures"). A measure that cannot be computed is NaN and the lot carries a note saying why.
/// </summary>
public static class ConversionFactors
{
    /// <summary>
    /// The measures of one lot under a sugar model:
    /// abv_per_brix = final % v/v ÷ effective starting °Brix;
    /// abv_per_brix_fermented = final % v/v ÷ (effective starting °Brix × sugar consumed ÷ starting sugar);
    /// sugar_gl_per_abv = (starting sugar g/L − residual sugar g/L) ÷ final % v/v;
    /// gay_lussac_efficiency = ethanol g/L ÷ (0.5114 × sugar consumed g/L).
    /// </summary>
    public static LotConversion For(Lot lot, SugarModel model)
    {
        ArgumentNullException.ThrowIfNull(lot);
        ArgumentNullException.ThrowIfNull(model);
        var notes = new List<string>();
        var balance = AdditionBalance.Apply(lot.StartingSugar, lot.Additions, model);
        if (balance.Note is not null)
        {
            notes.Add(balance.Note);
        }

        double brix = balance.Effective.Brix;
        if (model.IsExtrapolated(brix))
        {
            notes.Add(ConversionNotes.OutsideOivTable(brix));
        }

        if (lot.ResidualSugarGl is null)
        {
            notes.Add(ConversionNotes.ResidualSugarMissing);
        }

        double startGl = balance.EffectiveSugarGl;
        double rs = Math.Max(0, lot.ResidualSugarGl ?? 0);
        double consumed = startGl - rs;
        bool fermented = consumed > 0;
        if (!fermented && startGl > 0)
        {
            notes.Add(ConversionNotes.ResidualAboveStart(rs, startGl));
        }

        // The °Brix-equivalent of residual sugar is its share of the starting sugar, in the starting °Brix: the
        // non-sugar solids stay in the same proportion, so a dry wine's two per-°Brix measures coincide.
        double fermentedBrix = fermented ? brix * consumed / startGl : double.NaN;
        double abv = lot.FinalAlcohol.PercentVolume;
        double ethanolGl = lot.FinalAlcohol.GramsPerLitre;
        return new LotConversion
        {
            Lot = lot,
            EffectiveStartingBrix = brix,
            AdditionsApplied = balance.Corrected,
            StartingSugarGl = startGl,
            ResidualSugarGl = rs,
            FermentedBrix = fermentedBrix,
            SugarConsumedGl = consumed,
            AbvPerBrix = brix > 0 ? abv / brix : double.NaN,
            AbvPerBrixFermented = fermented && fermentedBrix > 0 ? abv / fermentedBrix : double.NaN,
            SugarGlPerAbv = fermented && abv > 0 ? consumed / abv : double.NaN,
            GayLussacEfficiency = fermented ? ethanolGl / (GayLussac.EthanolMassYield * consumed) : double.NaN,
            Notes = notes,
        };
    }
}
