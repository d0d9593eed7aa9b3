using YieldBench.Core.Statistics;
using static System.FormattableString;

namespace YieldBench.Core.Review.Strains;

/// <summary>The strain comparison: Kruskal–Wallis, pairwise Hodges–Lehmann with Holm, and the adjusted regression.</summary>
internal static class Comparison
{
    private const double Alpha = 0.05;

    public static StrainComparison Build(IReadOnlyList<PreparedLot> all, StrainReviewSettings settings, List<string> notes)
    {
        var usable = all.Where(l => !double.IsNaN(l.Factor)).ToArray();
        var byStrain = usable.GroupBy(l => l.Strain, StringComparer.Ordinal).OrderBy(g => g.Key, StringComparer.Ordinal).ToArray();
        var compared = byStrain.Where(g => g.Count() >= settings.MinLotsForStrainReference).ToArray();
        foreach (var g in byStrain.Where(g => g.Count() < settings.MinLotsForStrainReference))
        {
            notes.Add(Invariant($"Strain {g.Key} has {g.Count()} lot(s), fewer than {settings.MinLotsForStrainReference}: it is left out of the strain comparison and its lots are judged against all lots (pooled)."));
        }

        var strains = compared.Select(g => g.Key).ToArray();
        var factors = compared.Select(g => (IReadOnlyList<double>)g.Select(l => l.Factor).ToArray()).ToArray();
        var medians = factors.Select(f => Descriptive.Median(f)).ToArray();
        var kw = RankTests.KruskalWallis(factors);

        var pairList = new List<(string A, string B, HodgesLehmannResult Hl, MannWhitneyResult Mw)>();
        for (int i = 0; i < strains.Length; i++)
        {
            for (int j = i + 1; j < strains.Length; j++)
            {
                pairList.Add((strains[i], strains[j], RankTests.HodgesLehmann(factors[i], factors[j], settings.Level), RankTests.MannWhitney(factors[i], factors[j])));
            }
        }

        var holm = Multiplicity.Holm(pairList.Select(p => p.Mw.P).ToArray());
        var pairs = pairList.Select((p, i) => new PairwiseShift(p.A, p.B, p.Hl.Shift, p.Hl.Interval, p.Mw.P, holm[i])).ToArray();

        var adjusted = Adjust(compared.SelectMany(g => g).ToArray(), strains, settings, notes);
        var sentences = new List<string>();
        Describe(sentences, strains, medians, kw, pairs, adjusted, compared);
        bool disagree = adjusted.Strains.Count > 1 && strains.Length > 1 && Leader(strains, medians) != Leader(strains, adjusted.Strains.Select(a => a.Factor).ToArray());
        if (disagree)
        {
            string rawLeader = Leader(strains, medians), adjLeader = Leader(strains, adjusted.Strains.Select(a => a.Factor).ToArray());
            double rawBrix = Descriptive.Median(compared.First(g => g.Key == rawLeader).Select(l => l.Brix));
            double adjBrix = Descriptive.Median(compared.First(g => g.Key == adjLeader).Select(l => l.Brix));
            sentences.Add(Invariant(
                $"Caution: ranked by raw median factor, {rawLeader} comes first, but adjusted for starting sugar{(adjusted.WithVessel ? " and vessel" : string.Empty)}, {adjLeader} does. {rawLeader}'s lots started at a median {rawBrix:0.0} °Brix against {adjBrix:0.0} °Brix for {adjLeader}; alcohol per °Brix rises with ripeness, so the raw medians mislead here — use the adjusted comparison."));
        }

        if (adjusted.Strains.Count > 0)
        {
            sentences.Add("The adjusted values compare strains in this cellar; they are not a prediction for a label. A label statement needs a lab analysis of the finished wine and must follow the local rules.");
        }

        return new StrainComparison
        {
            Measure = "alcohol per °Brix (for a lot that is not dry, per °Brix of the sugar that fermented)",
            Strains = strains,
            RawMedians = medians,
            KruskalWallis = kw,
            Pairs = pairs,
            Regression = adjusted.Fit,
            ReferenceBrix = adjusted.ReferenceBrix,
            ReferenceLots = adjusted.ReferenceLots,
            AdjustedForVessel = adjusted.WithVessel,
            Adjusted = adjusted.Strains,
            AdjustedDifferences = adjusted.Differences,
            Sentences = sentences,
            RankingsDisagree = disagree,
            LeftOut = byStrain.Where(g => g.Count() < settings.MinLotsForStrainReference).Select(g => new StrainLots(g.Key, g.Count())).ToArray(),
            MinLots = settings.MinLotsForStrainReference,
        };
    }

    /// <summary>Rounds to two decimals without a negative zero ("-0.00" reads as a sign that is not there).</summary>
    private static double R2(double v) => Math.Round(v, 2) + 0.0;

    private static string Leader(string[] strains, double[] values)
    {
        int best = 0;
        for (int i = 1; i < values.Length; i++)
        {
            if (values[i] > values[best])
            {
                best = i;
            }
        }

        return strains[best];
    }

    private sealed record AdjustedResult(RobustFit? Fit, double ReferenceBrix, int ReferenceLots, bool WithVessel, IReadOnlyList<AdjustedStrain> Strains, IReadOnlyList<AdjustedDifference> Differences);

    private static AdjustedResult Adjust(PreparedLot[] lots, string[] strains, StrainReviewSettings settings, List<string> notes)
    {
        var finished = lots.Where(l => l.IsDry && double.IsFinite(l.Brix) && double.IsFinite(l.Abv)).ToArray();

        // An M-estimator bounds the pull of odd alcohol values but not of odd starting sugars (leverage), so lots
        // whose factor is outside the plausible band or above the Gay-Lussac yield — near-certain data-entry errors —
        // stay out of the regression.
        var used = finished.Where(l => l.Factor >= settings.PlausibleFactorLow && l.Factor <= settings.PlausibleFactorHigh && !(l.Conversion.GayLussacEfficiency > 1.0)).ToArray();
        if (used.Length < finished.Length)
        {
            notes.Add(Invariant($"{finished.Length - used.Length} finished lot(s) with an implausible factor or above the Gay-Lussac yield are left out of the adjusted comparison (see their flags)."));
        }

        double reference = Descriptive.Median(used.Select(l => l.Brix));
        var empty = new AdjustedResult(null, reference, used.Length, false, [], []);
        if (strains.Length < 2)
        {
            notes.Add("The adjusted comparison needs at least two strains with enough lots; it was not made.");
            return empty;
        }

        var vessels = used.Select(l => l.Vessel).Distinct(StringComparer.Ordinal).OrderBy(v => v, StringComparer.Ordinal).ToArray();
        bool vesselUsable = vessels.Length > 1
            && !vessels.Contains(Groupings.NotRecorded)
            && vessels.All(v => used.Count(l => l.Vessel == v) >= settings.MinLotsForInterval);
        if (vessels.Length > 1 && !vesselUsable)
        {
            notes.Add(Invariant($"Vessel type is not in the adjusted comparison: it needs every lot's vessel recorded and at least {settings.MinLotsForInterval} lots of each vessel type."));
        }

        foreach (bool withVessel in vesselUsable ? new[] { true, false } : new[] { false })
        {
            var design = Design(used, strains, withVessel ? vessels : [], reference, out var names);
            if (used.Length <= names.Count + 1 || !RobustRegression.HasFullColumnRank(design))
            {
                if (withVessel)
                {
                    notes.Add("Vessel type is not in the adjusted comparison: it is confounded with strain (each strain used in its own vessels), so the two cannot be told apart.");
                }

                continue;
            }

            var fit = RobustRegression.Huber(design, used.Select(l => l.Abv).ToArray(), names, settings.HuberK, settings.Level);
            int p = names.Count;
            var vesselShare = withVessel ? vessels.Skip(1).Select(v => (double)used.Count(l => l.Vessel == v) / used.Length).ToArray() : [];
            var adjustedStrains = new List<AdjustedStrain>();
            for (int s = 0; s < strains.Length; s++)
            {
                var c = new double[p];
                c[0] = 1;
                if (s > 0)
                {
                    c[1 + s] = 1;
                }

                for (int v = 0; v < vesselShare.Length; v++)
                {
                    c[1 + strains.Length + v] = vesselShare[v];
                }

                var (estimate, _, interval) = fit.Combination(c);
                adjustedStrains.Add(new AdjustedStrain(strains[s], estimate, estimate / reference, new Interval(interval.Low / reference, interval.High / reference, interval.Level)));
            }

            var differences = new List<AdjustedDifference>();
            for (int a = 0; a < strains.Length; a++)
            {
                for (int b = a + 1; b < strains.Length; b++)
                {
                    var c = new double[p];
                    if (a > 0)
                    {
                        c[1 + a] = 1;
                    }

                    c[1 + b] -= 1;
                    var (estimate, _, interval) = fit.Combination(c);
                    differences.Add(new AdjustedDifference(strains[a], strains[b], estimate, interval));
                }
            }

            return new AdjustedResult(fit, reference, used.Length, withVessel, adjustedStrains, differences);
        }

        notes.Add("The adjusted comparison could not be fitted: too few finished lots for the number of strains and vessel types.");
        return empty;
    }

    /// <summary>Columns: intercept, °Brix − reference, one 0/1 column per strain after the first, per vessel after the first.</summary>
    private static double[,] Design(PreparedLot[] used, string[] strains, string[] vessels, double reference, out List<string> names)
    {
        names = ["intercept", "starting_brix_minus_reference"];
        names.AddRange(strains.Skip(1).Select(s => "strain " + s));
        names.AddRange(vessels.Skip(1).Select(v => "vessel " + v));
        var x = new double[used.Length, names.Count];
        for (int i = 0; i < used.Length; i++)
        {
            x[i, 0] = 1;
            x[i, 1] = used[i].Brix - reference;
            int s = Array.IndexOf(strains, used[i].Strain);
            if (s > 0)
            {
                x[i, 1 + s] = 1;
            }

            int v = Array.IndexOf(vessels, used[i].Vessel);
            if (v > 0)
            {
                x[i, strains.Length + v] = 1;
            }
        }

        return x;
    }

    private static void Describe(List<string> sentences, string[] strains, double[] medians, KruskalWallisResult kw, PairwiseShift[] pairs, AdjustedResult adjusted, IGrouping<string, PreparedLot>[] compared)
    {
        if (strains.Length < 2)
        {
            sentences.Add("Fewer than two strains have enough lots to compare.");
            return;
        }

        string level = StrainReviewer.F(100 * (pairs.Length > 0 ? pairs[0].Interval.Level : 0.95), "0");
        if (double.IsNaN(kw.P))
        {
            sentences.Add("Kruskal–Wallis could not be computed: " + kw.Note + ".");
        }
        else
        {
            string verdict = kw.P < Alpha
                ? "the strains' factors differ by more than the lot-to-lot noise would explain"
                : "no difference between the strains' factors stands out from the lot-to-lot noise";
            sentences.Add(Invariant($"Kruskal–Wallis rank test across {strains.Length} strains ({kw.N} lots): H = {kw.H:0.00}, {kw.DegreesOfFreedom} degrees of freedom, p {PText(kw.P)}; {verdict}."));
        }

        // A few pairs are said one by one; past that (21 strains have 210 pairs, some 20 printed pages of sentences the
        // pair tables below already hold) the pairs larger than the noise are named and the rest counted.
        bool onePerPair = pairs.Length <= PairsSaidOneByOne;
        foreach (var p in onePerPair ? pairs : [])
        {
            string verdict = p.HolmP < Alpha && !p.Interval.Contains(0)
                ? "larger than the noise"
                : "within the noise";
            sentences.Add(Invariant($"{p.First} − {p.Second}: raw shift {p.Shift:+0.0000;-0.0000;0.0000} % v/v per °Brix ({level} % interval {p.Interval.Low:0.0000} to {p.Interval.High:0.0000}; Holm-adjusted p {PText(p.HolmP)}) — {verdict}."));
        }

        if (!onePerPair)
        {
            var beyond = pairs.Where(p => p.HolmP < Alpha && !p.Interval.Contains(0)).OrderByDescending(p => Math.Abs(p.Shift)).ToArray();
            sentences.Add(Invariant($"Raw shifts of the {pairs.Length} pairs of strains: {Counted(beyond.Select(p => Invariant($"{p.First} − {p.Second} {p.Shift:+0.0000;-0.0000;0.0000}")).ToArray(), pairs.Length, "within the noise after Holm's adjustment")}; every pair is in the table of pairwise Hodges–Lehmann shifts."));
        }

        if (adjusted.Strains.Count == 0)
        {
            return;
        }

        var parts = adjusted.Strains.Select(a => Invariant($"{a.Strain} {a.Factor:0.0000} ({a.FactorInterval.Low:0.0000}–{a.FactorInterval.High:0.0000})"));
        sentences.Add(Invariant($"Adjusted to {adjusted.ReferenceBrix:0.0} °Brix (the median starting sugar of the {adjusted.ReferenceLots} finished lots kept in the comparison){(adjusted.WithVessel ? " and the cellar's vessel mix" : string.Empty)}, the factors are: {string.Join("; ", parts)}."));
        if (adjusted.Differences.Count <= PairsSaidOneByOne)
        {
            foreach (var d in adjusted.Differences)
            {
                sentences.Add(DifferenceSentence(d));
            }

            return;
        }

        var apart = adjusted.Differences.Where(d => !d.Interval.Contains(0)).OrderByDescending(d => Math.Abs(d.AbvDifference)).ToArray();
        string Words(AdjustedDifference d) => Invariant($"{(d.AbvDifference > 0 ? d.First : d.Second)} makes {Math.Abs(d.AbvDifference):0.00} % v/v more than {(d.AbvDifference > 0 ? d.Second : d.First)}");
        sentences.Add(Invariant($"Alcohol from the same starting sugar, {adjusted.Differences.Count} pairs of strains: {Counted(apart.Select(Words).ToArray(), adjusted.Differences.Count, "the same within the noise")}; every pair, with its interval, is in the table of adjusted differences."));
    }

    /// <summary>Pairs of strains said one sentence each up to this many (five strains); past it, counted with the notable ones named.</summary>
    internal const int PairsSaidOneByOne = 10;

    /// <summary>Pairs named in a counted sentence before the rest are only counted.</summary>
    private const int PairsNamed = 8;

    /// <summary>"3 larger than the noise (A, B, C); the other 187 within the noise", naming at most <see cref="PairsNamed"/>.</summary>
    private static string Counted(string[] notable, int all, string rest)
    {
        if (notable.Length == 0)
        {
            return Invariant($"all {all} {rest}");
        }

        string named = string.Join("; ", notable.Take(PairsNamed)) + (notable.Length > PairsNamed ? Invariant($"; and {notable.Length - PairsNamed} more") : string.Empty);
        return Invariant($"{notable.Length} larger than the noise ({named}); the other {all - notable.Length} {rest}");
    }

    // "= 0.0123" or "< 0.0001": a p-value is never printed as 0.0000.
    private static string PText(double p)
    {
        string text = ReviewTexts.P(p);
        return text.StartsWith('<') ? text : "= " + text;
    }

    /// <summary>An adjusted difference in plain words: which strain makes how much more alcohol from the same sugar, or that they are the same within the noise.</summary>
    internal static string DifferenceSentence(AdjustedDifference d)
    {
        if (d.Interval.Contains(0))
        {
            return Invariant($"{d.First} and {d.Second} make the same alcohol from the same sugar within the noise (difference {R2(d.AbvDifference):+0.00;-0.00;0.00} % v/v, interval {R2(d.Interval.Low):0.00} to {R2(d.Interval.High):0.00}).");
        }

        string more = d.AbvDifference > 0 ? d.First : d.Second, less = d.AbvDifference > 0 ? d.Second : d.First;
        return Invariant($"{more} makes {Math.Abs(d.AbvDifference):0.00} % v/v more alcohol than {less} from the same starting sugar (interval {Math.Min(Math.Abs(d.Interval.Low), Math.Abs(d.Interval.High)):0.00} to {Math.Max(Math.Abs(d.Interval.Low), Math.Abs(d.Interval.High)):0.00}) — larger than the noise.");
    }
}
