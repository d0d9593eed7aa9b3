using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Statistics;
using static System.FormattableString;

namespace YieldBench.Core.Review.Strains;

/// <summary>
/// Runs the strain review: group summaries, the fair comparison of strains, per-lot robust scores and odd-lot flags.
/// Pure: no I/O; the same lots, settings and seed give the same result.
/// </summary>
public static class StrainReviewer
{
    /// <summary>Name of the pooled reference group.</summary>
    public const string Pooled = "all lots (pooled)";

    /// <summary>
    /// Reviews the lots. <paramref name="seed"/> seeds every bootstrap (each group's stream is derived from it and the
    /// group's name, so adding a group does not change the others). Invalid settings throw
    /// <see cref="ArgumentException"/> with the problem in words. <paramref name="sugarModel"/> is the model the lots'
    /// conversion used (default: <see cref="SugarModel.Default"/>); the odd-lot detectors that re-apply a lot's
    /// additions to another starting sugar use it too.
    /// </summary>
    public static StrainReview Run(IReadOnlyList<LotConversion> lots, StrainReviewSettings settings, int seed, SugarModel? sugarModel = null)
    {
        ArgumentNullException.ThrowIfNull(lots);
        ArgumentNullException.ThrowIfNull(settings);
        if (settings.Problem() is { } problem)
        {
            throw new ArgumentException("Strain review settings: " + problem + ".", nameof(settings));
        }

        var notes = new List<string>();
        var prepared = lots.Select(l => new PreparedLot(l, settings)).ToArray();
        int unusable = prepared.Count(p => double.IsNaN(p.Factor));
        if (unusable > 0)
        {
            notes.Add(Invariant($"{unusable} lot(s) have no conversion factor (no starting sugar or no alcohol to divide) and are left out of the comparison and the flags; they still count in the group tables as missing."));
        }

        int notDry = prepared.Count(p => !p.IsDry);
        if (notDry > 0)
        {
            notes.Add(Invariant($"{notDry} lot(s) have residual sugar above {settings.DryThresholdGl:0.#} g/L: their factor is alcohol per °Brix fermented, and they are left out of the Theil–Sen lines and the adjusted comparison because their alcohol is short of a finished ferment."));
        }

        var groups = GroupSummaries.Build(prepared, settings, seed);
        var comparison = Comparison.Build(prepared, settings, notes);
        var scores = OddLots.Score(prepared, settings);
        var flags = OddLots.Flag(prepared, scores, settings, seed, sugarModel ?? SugarModel.Default);
        return new StrainReview
        {
            Settings = settings,
            Seed = seed,
            Groups = groups,
            Comparison = comparison,
            Scores = scores,
            Flags = flags,
            Notes = notes,
        };
    }

    /// <summary>A seed for one named stream, stable across runs and platforms (FNV-1a of the name, mixed with the seed).</summary>
    internal static int DerivedSeed(int seed, string name)
    {
        unchecked
        {
            uint hash = 2166136261;
            foreach (char c in name)
            {
                hash = (hash ^ c) * 16777619;
            }

            return (int)(hash ^ (uint)seed) & int.MaxValue;
        }
    }

    internal static string F(double v, string format) => v.ToString(format, CultureInfo.InvariantCulture);
}

/// <summary>A lot with the values the review needs, normalised once.</summary>
internal sealed class PreparedLot
{
    public PreparedLot(LotConversion conversion, StrainReviewSettings settings)
    {
        Conversion = conversion;
        Strain = conversion.Lot.Strain.Trim();
        // Spellings are settled once, by intake (one spelling per strain and vessel type), so groups take the lot's own
        // text and every output names a vessel as the lots table does.
        Vessel = string.IsNullOrWhiteSpace(conversion.Lot.Vessel) ? Groupings.NotRecorded : conversion.Lot.Vessel.Trim();
        Variety = string.IsNullOrWhiteSpace(conversion.Lot.Variety) ? Groupings.NotRecorded : conversion.Lot.Variety.Trim();
        IsDry = conversion.ResidualSugarGl <= settings.DryThresholdGl;
        Factor = IsDry ? conversion.AbvPerBrix : conversion.AbvPerBrixFermented;
        if (double.IsInfinity(Factor))
        {
            Factor = double.NaN;
        }

        FactorName = (IsDry ? ConversionMeasure.AbvPerBrix : ConversionMeasure.AbvPerBrixFermented).Name();
        Brix = conversion.EffectiveStartingBrix;
        Abv = conversion.Lot.FinalAlcohol.PercentVolume;
    }

    public LotConversion Conversion { get; }

    public string Strain { get; }

    public string Vessel { get; }

    public string Variety { get; }

    public bool IsDry { get; }

    /// <summary>abv_per_brix for dry lots, abv_per_brix_fermented otherwise.</summary>
    public double Factor { get; }

    public string FactorName { get; }

    /// <summary>Effective starting °Brix.</summary>
    public double Brix { get; }

    /// <summary>Final alcohol, % v/v.</summary>
    public double Abv { get; }

    public LotKey Key => Conversion.Lot.Key;

    public int Season => Conversion.Lot.Season;
}
