namespace YieldBench.Core.HouseFactor;

/// <summary>User-facing texts of the house-factor analysis and planner, kept in one place (tests assert them).</summary>
public static class HouseFactorTexts
{
    /// <summary>Cautions every planner answer and house-factor section carries.</summary>
    public static IReadOnlyList<string> PlannerCautions { get; } =
    [
        "This is an estimate from past lots, not a label statement: the alcohol on a label must come from a lab analysis of the finished wine and follow the local rules.",
        "Rules on water additions and on labelling alcohol differ by country and region; check what your local rules allow before adding water or stating alcohol.",
        "Fermentation makes heat and carbon dioxide: CO2 collects in closed and low spaces of a cellar and can kill. Ventilate and follow local safety codes.",
    ];

    /// <summary>
    /// One sentence on which inputs matter, from permutation importances: "starting sugar explains most; strain
    /// second; vessel type and pH add little". An input adds little when its importance is under 10 % of the largest.
    /// </summary>
    public static string ImportanceSentence(IReadOnlyList<FeatureImportance> importances)
    {
        ArgumentNullException.ThrowIfNull(importances);
        var ranked = importances.Where(i => double.IsFinite(i.MaeIncrease))
            .OrderByDescending(i => i.MaeIncrease).ThenBy(i => i.Feature, StringComparer.Ordinal).ToArray();
        if (ranked.Length == 0 || ranked[0].MaeIncrease <= 0)
        {
            return "No input changes the model's predictions measurably when shuffled.";
        }

        double top = ranked[0].MaeIncrease;
        var parts = new List<string> { $"{ranked[0].Feature} explains most" };
        string[] ordinals = ["second", "third", "fourth", "fifth", "sixth", "seventh", "eighth"];
        var little = new List<string>();
        for (int i = 1; i < ranked.Length; i++)
        {
            if (ranked[i].MaeIncrease < 0.10 * top)
            {
                little.Add(ranked[i].Feature);
            }
            else
            {
                parts.Add($"{ranked[i].Feature} {ordinals[Math.Min(parts.Count - 1, ordinals.Length - 1)]}");
            }
        }

        if (little.Count > 0)
        {
            string list = little.Count == 1 ? little[0] : string.Join(", ", little.Take(little.Count - 1)) + " and " + little[^1];
            parts.Add(list + (little.Count == 1 ? " adds little" : " add little"));
        }

        string s = string.Join("; ", parts) + ".";
        return char.ToUpperInvariant(s[0]) + s[1..];
    }
}
