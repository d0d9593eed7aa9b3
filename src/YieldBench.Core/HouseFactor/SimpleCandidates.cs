using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Statistics;

namespace YieldBench.Core.HouseFactor;

/// <summary>A fixed trade ballpark: abv = factor × °Brix (common practice: 0.55–0.65 % v/v per °Brix).</summary>
public sealed class FixedFactorCandidate(double factor) : ICandidateTrainer
{
    /// <summary>The factor, % v/v per °Brix.</summary>
    public double Factor { get; } = factor is > 0 and < 1.5 ? factor : throw new ArgumentOutOfRangeException(nameof(factor), factor, "A fixed factor must be between 0 and 1.5 % v/v per °Brix.");

    /// <inheritdoc />
    public string Id => "fixed-" + Factor.ToString("0.00#", CultureInfo.InvariantCulture);

    /// <inheritdoc />
    public string Name => "Fixed " + Factor.ToString("0.00#", CultureInfo.InvariantCulture) + " % v/v per °Brix";

    /// <inheritdoc />
    public string Description => "A trade ballpark (common practice) applied to every lot; nothing is learned from the data.";

    /// <inheritdoc />
    public int Complexity => 0;

    /// <inheritdoc />
    public bool IsCostly => false;

    /// <inheritdoc />
    public IAbvPredictor Train(IReadOnlyList<LotConversion> lots, int seed) => SugarLines.Single(0, Factor, 0);
}

/// <summary>The OIV/EU convention: potential alcohol = fermentable sugar (g/L, OIV must table) ÷ 16.83.</summary>
public sealed class EuConventionCandidate : ICandidateTrainer
{
    /// <inheritdoc />
    public string Id => "eu-convention";

    /// <inheritdoc />
    public string Name => "EU convention (sugar g/L ÷ 16.83)";

    /// <inheritdoc />
    public string Description => "Fermentable sugar from the OIV must table divided by 16.83 g/L per % vol; nothing is learned from the data.";

    /// <inheritdoc />
    public int Complexity => 0;

    /// <inheritdoc />
    public bool IsCostly => false;

    /// <inheritdoc />
    public IAbvPredictor Train(IReadOnlyList<LotConversion> lots, int seed) => SugarLines.EuConvention;
}

/// <summary>abv = median(abv_per_brix) × °Brix over all training lots.</summary>
public sealed class PooledMedianCandidate : ICandidateTrainer
{
    /// <inheritdoc />
    public string Id => "pooled-median";

    /// <inheritdoc />
    public string Name => "Pooled median factor";

    /// <inheritdoc />
    public string Description => "The median abv_per_brix of all lots, applied to every strain.";

    /// <inheritdoc />
    public int Complexity => 1;

    /// <inheritdoc />
    public bool IsCostly => false;

    /// <inheritdoc />
    public IAbvPredictor Train(IReadOnlyList<LotConversion> lots, int seed)
    {
        ArgumentNullException.ThrowIfNull(lots);
        return SugarLines.Single(0, Descriptive.Median(lots.Select(l => l.AbvPerBrix)), lots.Count);
    }
}

/// <summary>abv = median(abv_per_brix of the strain) × °Brix; strains not seen in training use the pooled median.</summary>
public sealed class PerStrainMedianCandidate : ICandidateTrainer
{
    /// <inheritdoc />
    public string Id => "strain-median";

    /// <inheritdoc />
    public string Name => "Per-strain median factor";

    /// <inheritdoc />
    public string Description => "Each strain's own median abv_per_brix; a strain not in the training lots gets the pooled median.";

    /// <inheritdoc />
    public int Complexity => 3;

    /// <inheritdoc />
    public bool IsCostly => false;

    /// <inheritdoc />
    public IAbvPredictor Train(IReadOnlyList<LotConversion> lots, int seed)
    {
        ArgumentNullException.ThrowIfNull(lots);
        var pooled = new StrainLine("*", 0, Descriptive.Median(lots.Select(l => l.AbvPerBrix)), lots.Count);
        var strains = StrainGroups.AbvPerBrix(lots)
            .Select(g => new StrainLine(g.Strain, 0, Descriptive.Median(g.Values), g.Values.Length))
            .ToArray();
        return new SugarLines(SugarCurve.Line, pooled, strains);
    }
}

/// <summary>
/// abv = θ_strain × °Brix with θ the empirical-Bayes (DerSimonian–Laird) shrinkage of each strain's mean
/// abv_per_brix toward the overall mean; strains not seen in training use the overall mean.
/// </summary>
public sealed class ShrunkStrainCandidate : ICandidateTrainer
{
    /// <inheritdoc />
    public string Id => "strain-shrunk";

    /// <inheritdoc />
    public string Name => "Per-strain factor shrunk toward pooled";

    /// <inheritdoc />
    public string Description => "Each strain's mean abv_per_brix pulled toward the pooled mean by empirical Bayes; strains with few lots move more.";

    /// <inheritdoc />
    public int Complexity => 4;

    /// <inheritdoc />
    public bool IsCostly => false;

    /// <inheritdoc />
    public IAbvPredictor Train(IReadOnlyList<LotConversion> lots, int seed)
    {
        ArgumentNullException.ThrowIfNull(lots);
        var groups = StrainGroups.AbvPerBrix(lots).Select(g => (g.Strain, (IReadOnlyList<double>)g.Values)).ToArray();
        var shrunk = EmpiricalBayesShrinkage.Shrink(groups);
        return new SugarLines(
            SugarCurve.Line,
            new StrainLine("*", 0, shrunk.OverallMean, lots.Count),
            shrunk.Groups.Select(g => new StrainLine(g.Group, 0, g.Shrunk, g.Count)).ToArray());
    }
}
