namespace YieldBench.Core.Review.Strains;

/// <summary>Suggested follow-ups in cellar terms; one place, so tests and renderers see the same words.</summary>
public static class FollowUps
{
    /// <summary>For a starting sugar that may be wrong.</summary>
    public const string RecheckStartingSugar =
        "re-check the starting sugar sampling (in reds, soak-up of sugar from the skins can raise °Brix for a day or two after crush; sample a settled, well-mixed juice)";

    /// <summary>For alcohol lower than the sugar suggests.</summary>
    public const string LookForWater = "look for unrecorded water additions (add-back) in the cellar records";

    /// <summary>For alcohol higher than the sugar allows.</summary>
    public const string LookForSugar = "look for unrecorded sugar additions (chaptalization) or blending in the cellar records";

    /// <summary>For any doubtful alcohol.</summary>
    public const string RerunAlcohol = "re-run the alcohol analysis on a fresh sample";

    /// <summary>For low alcohol in warm ferments.</summary>
    public const string Evaporation = "consider evaporation losses of alcohol in hot open fermenters";

    /// <summary>For a lot that behaves like another strain.</summary>
    public const string ConfirmStrain = "confirm the strain assignment in the inoculation records";

    /// <summary>For a lot with residual sugar.</summary>
    public const string ConfirmFinished = "confirm the lot finished (residual sugar by lab analysis); its factor uses the sugar actually fermented";

    /// <summary>For a strain whose season differs.</summary>
    public const string SeasonCheck =
        "compare that season's fruit, nutrition and fermentation temperatures with the other seasons, and check the yeast supply for that season";
}
