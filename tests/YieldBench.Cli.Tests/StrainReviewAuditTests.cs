using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Review;
using YieldBench.Core.Review.Strains;
using YieldBench.Intake;

namespace YieldBench.Cli.Tests;

/// <summary>
/// The review's robust group summaries and strain comparison, raw and adjusted (docs/methods.md Part 2, sections 2, 3, 5
/// and 6) against a recomputation in R 4.2.2 with robustbase 0.95-0 and MASS 7.3-58.2 from the methods text: tests/YieldBench.Core.Tests/Fixtures/
/// strain-review-audit.R, given each lot's values as the review computes them (strain-review-values.run.cs writes
/// them to 17 digits; the commands are in both files' headers), on the demo and on the invented Brackenfold cellar.
/// The recorded inputs and outputs are in Fixtures/strain-review-audit.
/// </summary>
public class StrainReviewAuditTests
{
    public static TheoryData<string, string> Cellars => new()
    {
        { "demo", "demo-data/history" },
        { "brackenfold", "tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/brackenfold-input" },
    };

    [Theory]
    [MemberData(nameof(Cellars))]
    public void Every_group_summary_and_the_strain_comparison_are_Rs_on_the_same_lots(string name, string input)
    {
        // Given a cellar's lots, the per-lot values R was given, and R's results
        string root = Root();
        string dir = Path.Combine(root, "tests", "YieldBench.Core.Tests", "Fixtures", "strain-review-audit");
        var set = IntakeReader.Read([Path.Combine(root, input)], new IntakeOptions { WorkingDirectory = root });
        var lots = set.Lots.Select(l => ConversionFactors.For(l, SugarModel.Default)).ToArray();
        var given = File.ReadAllLines(Path.Combine(dir, name + "-values.csv")).Skip(1).Select(l => l.Split(',')).ToArray();
        var expected = File.ReadAllLines(Path.Combine(dir, name + "-expected.csv")).Select(l => l.Split(','))
            .ToDictionary(p => (p[0], p[1], p[2], p[3], p[4]), p => p[5] == "NA" ? double.NaN : D(p[5]));

        // When the strain review runs with the review's settings
        var settings = new ReviewSettings();
        var review = StrainReviewer.Run(lots, settings.Strains, settings.Seed, settings.SugarModel);

        // Then R was given exactly the values the review holds (each lot's four measures and effective °Brix)
        Assert.Equal(lots.Length, given.Length);
        for (int i = 0; i < lots.Length; i++)
        {
            Assert.Equal(lots[i].Lot.LotId, given[i][1]);
            Assert.Equal(given[i][6], lots[i].EffectiveStartingBrix.ToString("R", CultureInfo.InvariantCulture));
            Assert.Equal(given[i][7], Text(lots[i].AbvPerBrix));
            Assert.Equal(given[i][10], Text(lots[i].GayLussacEfficiency));
        }

        // And every group of every grouping has R's statistics: n, median, type-7 quartiles and IQR, scaled MAD (1.482602),
        // Qn from its definition (the k-th pairwise distance, written out in the R script) and Sn (robustbase), mean, SD
        // (n − 1), 20 % trimmed mean, min and max to 1e-12 relative (1e-11 for the spreads); Huber's location (k 1.345, scale
        // the scaled MAD, robustbase huberM's iteration and stopping rule) to 1e-12 relative; and robustbase's own Qn() to
        // single precision (2^-24 relative), since in some (18 of the demo's 224 summaries) it returns the order statistic
        // rounded to a float
        var problems = new List<string>();
        void Check(string what, double r, double tool, double relative)
        {
            bool same = double.IsNaN(r) ? double.IsNaN(tool) : Math.Abs(r - tool) <= relative * Math.Max(Math.Abs(r), 1e-300);
            if (!same)
            {
                problems.Add($"{what}: R {r.ToString("R", CultureInfo.InvariantCulture)}, tool {tool.ToString("R", CultureInfo.InvariantCulture)}");
            }
        }

        int groups = 0;
        foreach (var g in review.Groups.Where(g => g.N > 0))
        {
            groups++;
            double R(string stat) => expected[("group", g.Grouping, g.Group, g.Measure.Name(), stat)];
            string at = $"{g.Grouping} {g.Group} {g.Measure.Name()}";
            Check(at + " n", R("n"), g.N, 0);
            foreach (var (stat, value) in new[]
            {
                ("median", g.Median), ("q1", g.Q1), ("q3", g.Q3), ("iqr", g.Iqr), ("mad", g.Mad), ("qn_exact", g.Qn), ("sn", g.Sn), ("mean", g.Mean),
                ("sd", g.Sd), ("trimmed_mean", g.TrimmedMean), ("huber", g.Huber), ("min", g.Min), ("max", g.Max),
            })
            {
                Check($"{at} {stat}", R(stat), value, stat is "iqr" or "mad" or "qn_exact" or "sn" or "sd" ? 1e-11 : 1e-12);
            }

            Check(at + " robustbase Qn", R("qn"), g.Qn, Math.Pow(2, -24));
        }

        Assert.Equal(expected.Keys.Count(k => k.Item1 == "group") / 15, groups);

        // And the comparison's Kruskal–Wallis H and p (R kruskal.test), and for every pair the Hodges–Lehmann shift (the
        // median of all differences) with Moses' interval (the order statistics the methods text names), the Mann–Whitney
        // p (wilcox.test, normal approximation with tie and continuity corrections) and Holm's adjustment (p.adjust)
        var c = review.Comparison;
        Check("Kruskal–Wallis H", expected[("kruskal", "", "", "factor", "H")], c.KruskalWallis.H, 1e-12);
        Check("Kruskal–Wallis p", expected[("kruskal", "", "", "factor", "p")], c.KruskalWallis.P, 1e-9);
        Assert.Equal(expected.Keys.Count(k => k.Item1 == "pair") / 5, c.Pairs.Count);
        foreach (var p in c.Pairs)
        {
            string key = p.First + " vs " + p.Second;
            Check(key + " shift", expected[("pair", "", key, "factor", "shift")], p.Shift, 1e-12);
            Check(key + " low", expected[("pair", "", key, "factor", "low")], p.Interval.Low, 1e-12);
            Check(key + " high", expected[("pair", "", key, "factor", "high")], p.Interval.High, 1e-12);
            Check(key + " p", expected[("pair", "", key, "factor", "p")], p.P, 1e-9);
            Check(key + " Holm", expected[("pair", "", key, "factor", "holm")], p.HolmP, 1e-9);
        }

        // And the adjusted comparison is MASS rlm's (7.3-58.2; Huber k 1.345, as adjusted-comparison.R): the lots used, the
        // reference sugar, whether vessel is in it, each strain's predicted alcohol, factor and interval at the reference
        // sugar and vessel mix, and every pair's difference with its interval, to 1e-9 relative (both stop their iterations
        // by the same rule; MASS's own convergence tolerance is 1e-4)
        Assert.Equal(expected[("adjusted", "", "", "factor", "lots")], c.ReferenceLots);
        Assert.Equal(expected[("adjusted", "", "", "factor", "with_vessel")] == 1, c.AdjustedForVessel);
        Check("reference °Brix", expected[("adjusted", "", "", "factor", "reference_brix")], c.ReferenceBrix, 1e-15);
        Assert.Equal(c.Strains.Count, c.Adjusted.Count);
        foreach (var a in c.Adjusted)
        {
            Check(a.Strain + " predicted", expected[("adjusted", "", a.Strain, "factor", "predicted")], a.PredictedAbv, 1e-9);
            Check(a.Strain + " factor", expected[("adjusted", "", a.Strain, "factor", "factor")], a.Factor, 1e-9);
            Check(a.Strain + " factor low", expected[("adjusted", "", a.Strain, "factor", "low")], a.FactorInterval.Low, 1e-9);
            Check(a.Strain + " factor high", expected[("adjusted", "", a.Strain, "factor", "high")], a.FactorInterval.High, 1e-9);
        }

        Assert.Equal(expected.Keys.Count(k => k.Item1 == "difference") / 3, c.AdjustedDifferences.Count);
        foreach (var a in c.AdjustedDifferences)
        {
            string key = a.First + " - " + a.Second;
            Check(key + " difference", expected[("difference", "", key, "abv", "estimate")], a.AbvDifference, 1e-9);
            Check(key + " low", expected[("difference", "", key, "abv", "low")], a.Interval.Low, 1e-9);
            Check(key + " high", expected[("difference", "", key, "abv", "high")], a.Interval.High, 1e-9);
        }

        Assert.True(problems.Count == 0, string.Join(Environment.NewLine, problems));
    }

    private static string Text(double v) => double.IsFinite(v) ? v.ToString("R", CultureInfo.InvariantCulture) : "NA";

    private static double D(string s) => double.Parse(s, CultureInfo.InvariantCulture);

    private static string Root()
    {
        string? root = AppContext.BaseDirectory;
        while (root is not null && !File.Exists(Path.Combine(root, "YieldBench.sln")))
        {
            root = Path.GetDirectoryName(root);
        }

        return root ?? throw new InvalidOperationException("repository root not found");
    }
}
