using System.Globalization;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Review.Strains;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Review;

/// <summary>The per-lot view and the figures the review holds for renderers.</summary>
public sealed class LotReviewTests
{
    private static readonly DateTime Start = DateTime.ParseExact("2025-09-28 08:00", "yyyy-MM-dd HH:mm", CultureInfo.InvariantCulture);

    /// <summary>
    /// An invented cellar of three strains (ST-A, ST-B, ST-C) over two seasons: L010 holds more alcohol than its sugar
    /// can give, L005 did not finish, and two lots have logs (L005 stalls at 10.6 °Brix; L020 runs through 41 °C).
    /// </summary>
    internal static readonly Lazy<ReviewResult> Sample = new(() =>
    {
        var lots = new List<Lot>();
        var rng = new Random(7);
        string[] strains = ["ST-C", "ST-A", "ST-B"];
        double[] factor = [0.580, 0.590, 0.600];
        int n = 0;
        foreach (int season in new[] { 2025, 2024 })
        {
            for (int s = 0; s < strains.Length; s++)
            {
                for (int k = 0; k < 6 + s; k++)
                {
                    n++;
                    double brix = 21.5 + (0.5 * k) + (0.3 * s) + (0.2 * (season - 2024));
                    double abv = n == 10 ? Math.Round(0.68 * brix, 2) : Math.Round((factor[s] * brix) + ((rng.NextDouble() - 0.5) * 0.3), 2);
                    lots.Add(new Lot
                    {
                        LotId = $"L{n:000}",
                        Season = season,
                        Strain = strains[s],
                        StartingSugar = SugarReading.FromBrix(brix),
                        FinalAlcohol = AlcoholContent.FromPercentVolume(abv),
                        ResidualSugarGl = n == 5 ? 12.0 : 1.5,
                        InoculationDate = Start.AddHours(-6),
                    });
                }
            }
        }

        FermentationLog Log(string id, int season, double step, double[] brix, double[] temps) =>
            new(id, season, brix.Select((b, i) => new LogReading(Start.AddHours(i * step), SugarReading.FromBrix(b), temps[i])).ToArray());
        var logs = new[]
        {
            Log("L005", 2025, 24, [24.0, 22.5, 19.5, 16.0, 13.0, 11.0, 10.8, 10.7, 10.6, 10.6], [13, 15, 17, 18, 18, 17, 16, 15, 15, 15]),
            Log("L020", 2025, 12, [24.0, 23.0, 20.0, 15.5, 10.5, 6.0, 2.5, 0.0, -1.2], [24, 27, 31, 35, 38, 41, 38, 33, 28]),
        };
        return ReviewRunner.Run(new SeasonSet { Lots = lots, Logs = logs }, new ReviewSettings(), "test");
    });

    [Fact]
    public void Each_lot_s_review_joins_its_score_flags_and_kinetics_by_key()
    {
        // Given the sample review
        var review = Sample.Value;

        // When each lot's review is compared with the review's own lists, worked out independently
        Assert.Equal(review.Lots.Count, review.LotReviews.Count);
        for (int i = 0; i < review.Lots.Count; i++)
        {
            var lot = review.LotReviews[i];
            var key = review.Lots[i].Lot.Key;
            var strainFlags = review.Strains.Flags.Where(f => f.LotKey == key).ToArray();
            var kinetics = review.Kinetics!.Lots.FirstOrDefault(k => k.LotKey == key);
            var items = KineticsFollowUps.For(review.Kinetics).Where(f => f.LotKey == key).ToArray();
            var codes = strainFlags.Select(f => f.Code).Concat(kinetics?.Flags ?? []).Distinct(StringComparer.Ordinal).ToArray();
            FlagSeverity? worst = strainFlags.Concat(items).Select(f => (FlagSeverity?)f.Severity).Max();

            // Then the view holds the same, in the same order
            Assert.Same(review.Lots[i], lot.Conversion);
            Assert.Equal(key, lot.Key);
            Assert.Equal(review.Strains.Scores.SingleOrDefault(s => s.LotKey == key), lot.Score);
            Assert.Equal(strainFlags, lot.StrainFlags);
            Assert.Same(kinetics, lot.Kinetics);
            Assert.Equal(items, lot.KineticsFollowUps);
            Assert.Equal(codes, lot.FlagCodes);
            Assert.Equal(worst, lot.WorstSeverity);
            Assert.Equal(strainFlags.Length > 0, lot.HasStrainFlag);
        }

        // And the sample has lots with several codes, lots with none, and a lot flagged by kinetics alone
        Assert.Contains(review.LotReviews, l => l.FlagCodes.Count >= 2);
        Assert.Contains(review.LotReviews, l => l.FlagCodes.Count == 0);
        var l020 = review.LotReviews.Single(l => l.Key == new LotKey(2025, "L020"));
        Assert.True(l020.IsFlagged);
        Assert.False(l020.HasStrainFlag);
        Assert.Equal(FlagSeverity.Check, l020.WorstSeverity);
    }

    [Fact]
    public void The_follow_up_items_are_the_strain_flags_then_the_kinetics_follow_ups()
    {
        var review = Sample.Value;
        Assert.Equal(review.Strains.Flags.Concat(KineticsFollowUps.For(review.Kinetics!)), review.FollowUps);
        Assert.Contains(review.FollowUps, f => f.Code == "stuck");
    }

    [Fact]
    public void The_strain_order_is_most_lots_first_and_the_lots_sheet_groups_by_it_then_season_then_lot_id()
    {
        // Given the sample (ST-B has 8 lots a season, ST-A 7, ST-C 6; lots were read season 2025 first)
        var review = Sample.Value;

        // When the figures are read
        var order = review.Figures.StrainOrder;
        var sheet = review.Figures.LotsInStrainOrder.Select(i => review.Lots[i].Lot).ToArray();

        // Then the strains come by lot count, and the lots by that strain order, season and lot id
        Assert.Equal(["ST-B", "ST-A", "ST-C"], order);
        var expected = review.Lots.Select(l => l.Lot)
            .OrderBy(l => Array.IndexOf(["ST-B", "ST-A", "ST-C"], l.Strain)).ThenBy(l => l.Season).ThenBy(l => l.LotId, StringComparer.Ordinal).ToArray();
        Assert.Equal(expected, sheet);
        Assert.Equal(review.Lots.Count, review.Figures.LotsInStrainOrder.Distinct().Count());
    }

    [Fact]
    public void The_box_numbers_are_the_strain_summaries_quartiles_and_whiskers_of_abv_per_brix()
    {
        // Given the sample
        var review = Sample.Value;

        // When the per-strain boxes are compared with type-7 quartiles worked out here
        for (int i = 0; i < review.Figures.StrainOrder.Count; i++)
        {
            string strain = review.Figures.StrainOrder[i];
            var values = review.Lots.Where(l => l.Lot.Strain == strain).Select(l => l.AbvPerBrix).Order().ToArray();
            double Q(double p)
            {
                double h = (values.Length - 1) * p;
                int lo = (int)Math.Floor(h);
                return values[lo] + ((h - lo) * (values[Math.Min(lo + 1, values.Length - 1)] - values[lo]));
            }

            var box = review.Figures.FactorByStrain[i]!;
            double iqr = Q(0.75) - Q(0.25);

            // Then they agree, and the whiskers are the farthest lots within 1.5 IQR
            Assert.Equal(strain, box.Strain);
            Assert.Equal(Q(0.25), box.Q1, 12);
            Assert.Equal(Q(0.5), box.Median, 12);
            Assert.Equal(Q(0.75), box.Q3, 12);
            Assert.Equal(values.First(v => v >= Q(0.25) - (1.5 * iqr)), box.LowerWhisker);
            Assert.Equal(values.Last(v => v <= Q(0.75) + (1.5 * iqr)), box.UpperWhisker);
        }

        // And each strain's season medians are those of its lots in that season
        foreach (var g in review.Figures.FactorByStrainAndSeason)
        {
            var values = review.Lots.Where(l => l.Lot.Strain == g.Strain && l.Lot.Season == g.Season).Select(l => l.AbvPerBrix).Order().ToArray();
            double median = values.Length % 2 == 1 ? values[values.Length / 2] : 0.5 * (values[(values.Length / 2) - 1] + values[values.Length / 2]);
            Assert.Equal(median, g.Median, 12);
        }

        Assert.Equal(6, review.Figures.FactorByStrainAndSeason.Count);
    }

    [Fact]
    public void The_overview_counts_agree_with_the_per_lot_view()
    {
        var review = Sample.Value;
        var o = review.Overview;
        Assert.Equal(review.LotReviews.Count(l => l.IsFlagged), o.Lots.Flagged);
        Assert.Equal(o.Lots.Flagged, o.Lots.ByWorstSeverity.Sum(c => c.Lots));
        Assert.Equal(review.LotReviews.Count(l => l.WorstSeverity == FlagSeverity.LikelyError), o.Lots.ByWorstSeverity[0].Lots);
        Assert.Equal(review.Lots.Count, o.Inputs.LotsUsed);
        Assert.Equal(review.Figures.Ranking.Select(r => r.Strain), o.Strains.Ranking.Select(r => r.Strain));
    }
}
