using YieldBench.Core.Conversion;

namespace YieldBench.Core.HouseFactor;

/// <summary>Lots' abv_per_brix grouped by strain, the way the per-strain candidates train on them.</summary>
internal static class StrainGroups
{
    /// <summary>
    /// Each strain (ordinal order) with its lots' abv_per_brix in input order: what
    /// <c>GroupBy(strain).OrderBy(key)</c> gives, in one pass with one list per strain (the backtests train these
    /// candidates some twenty times on up to 100,000 lots).
    /// </summary>
    public static (string Strain, double[] Values)[] AbvPerBrix(IReadOnlyList<LotConversion> lots)
    {
        var byStrain = new Dictionary<string, List<double>>(StringComparer.Ordinal);
        foreach (var l in lots)
        {
            if (!byStrain.TryGetValue(l.Lot.Strain, out var values))
            {
                byStrain[l.Lot.Strain] = values = [];
            }

            values.Add(l.AbvPerBrix);
        }

        return byStrain.OrderBy(g => g.Key, StringComparer.Ordinal).Select(g => (g.Key, g.Value.ToArray())).ToArray();
    }
}
