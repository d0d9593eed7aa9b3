using YieldBench.Core.Lots;

namespace YieldBench.Core.Conversion;

/// <summary>Computes each lot's conversion measures.</summary>
public static class ConversionFactors
{
    /// <summary>The measures of one lot under a sugar model.</summary>
    public static LotConversion For(Lot lot, SugarModel model)
    {
        ArgumentNullException.ThrowIfNull(lot);
        ArgumentNullException.ThrowIfNull(model);
        var notes = new List<string>();
        var balance = AdditionBalance.Apply(lot.StartingSugar, lot.Additions);
        if (balance.Note is not null)
        {
            notes.Add(balance.Note);
        }

        double brix = balance.Effective.Brix;
        if (model.IsExtrapolated(brix))
        {
            notes.Add($"starting sugar {brix:0.0} °Brix is outside the OIV table's 10–30 °Brix; fermentable sugar uses the sugar share of solids at the table's edge");
        }

        double startGl = model.SugarGramsPerLitre(brix);
        double rs = Math.Max(0, lot.ResidualSugarGl ?? 0);
        double rsBrix = model.BrixEquivalent(rs);
        double fermentedBrix = brix - rsBrix;
        double consumed = startGl - rs;
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
            AbvPerBrixFermented = fermentedBrix > 0 ? abv / fermentedBrix : double.NaN,
            SugarGlPerAbv = abv > 0 ? consumed / abv : double.NaN,
            GayLussacEfficiency = consumed > 0 ? ethanolGl / (GayLussac.EthanolMassYield * consumed) : double.NaN,
            Notes = notes,
        };
    }
}
