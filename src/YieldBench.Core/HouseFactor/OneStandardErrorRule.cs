namespace YieldBench.Core.HouseFactor;

/// <summary>
/// The one-standard-error rule (Breiman, Friedman, Olshen &amp; Stone 1984, <i>Classification and Regression Trees</i>,
/// §3.4.3; Hastie, Tibshirani &amp; Friedman 2009, <i>The Elements of Statistical Learning</i>, 2nd ed., §7.10):
/// among candidates whose held-out error is within one standard error of the best, take the simplest.
/// </summary>
public static class OneStandardErrorRule
{
    /// <summary>A candidate as the rule sees it.</summary>
    /// <param name="Complexity">Lower is simpler.</param>
    /// <param name="Mae">Held-out mean absolute error (NaN: not scored, never chosen).</param>
    /// <param name="StandardError">Standard error of that MAE.</param>
    public readonly record struct Entry(int Complexity, double Mae, double StandardError);

    /// <summary>The rule's choice.</summary>
    /// <param name="Chosen">Index of the chosen entry.</param>
    /// <param name="Best">Index of the entry with the lowest MAE.</param>
    /// <param name="Limit">Best MAE + its standard error: entries at or under it qualify.</param>
    public readonly record struct Choice(int Chosen, int Best, double Limit);

    /// <summary>
    /// Applies the rule; null when no entry has a finite MAE. Ties in MAE go to the simpler, then the earlier entry;
    /// ties in complexity go to the lower MAE, then the earlier entry. A NaN standard error counts as 0.
    /// </summary>
    public static Choice? Choose(IReadOnlyList<Entry> entries)
    {
        ArgumentNullException.ThrowIfNull(entries);
        int best = -1;
        for (int i = 0; i < entries.Count; i++)
        {
            if (!double.IsFinite(entries[i].Mae))
            {
                continue;
            }

            if (best < 0 || entries[i].Mae < entries[best].Mae
                || (entries[i].Mae == entries[best].Mae && entries[i].Complexity < entries[best].Complexity))
            {
                best = i;
            }
        }

        if (best < 0)
        {
            return null;
        }

        double se = double.IsFinite(entries[best].StandardError) ? entries[best].StandardError : 0;
        double limit = entries[best].Mae + se;
        int chosen = best;
        for (int i = 0; i < entries.Count; i++)
        {
            var e = entries[i];
            if (!double.IsFinite(e.Mae) || e.Mae > limit)
            {
                continue;
            }

            var c = entries[chosen];
            if (e.Complexity < c.Complexity || (e.Complexity == c.Complexity && e.Mae < c.Mae))
            {
                chosen = i;
            }
        }

        return new Choice(chosen, best, limit);
    }
}
