namespace YieldBench.Core.Statistics;

/// <summary>Adjustments of p-values for multiple comparisons.</summary>
public static class Multiplicity
{
    /// <summary>
    /// Holm (1979) step-down adjustment, as R <c>p.adjust(p, "holm")</c>: with the m defined p-values sorted
    /// ascending, p̃₍ᵢ₎ = maxⱼ≤ᵢ min(1, (m − j + 1)·p₍ⱼ₎). Returned in the input order. NaN entries stay NaN and do not
    /// count in m. Controls the family-wise error rate under any dependence.
    /// </summary>
    public static double[] Holm(IReadOnlyList<double> pValues)
    {
        ArgumentNullException.ThrowIfNull(pValues);
        var defined = Enumerable.Range(0, pValues.Count).Where(i => !double.IsNaN(pValues[i])).ToArray();
        foreach (int i in defined)
        {
            if (pValues[i] is < 0 or > 1)
            {
                throw new ArgumentOutOfRangeException(nameof(pValues), pValues[i], "A p-value must be between 0 and 1.");
            }
        }

        // A stable sort keeps equal p-values in input order, so the result does not depend on the sort's whims.
        var order = defined.OrderBy(i => pValues[i]).ToArray();
        var adjusted = Enumerable.Repeat(double.NaN, pValues.Count).ToArray();
        int m = order.Length;
        double running = 0;
        for (int j = 0; j < m; j++)
        {
            running = Math.Max(running, Math.Min(1, (m - j) * pValues[order[j]]));
            adjusted[order[j]] = running;
        }

        return adjusted;
    }
}
