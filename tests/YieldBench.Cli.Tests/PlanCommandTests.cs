using System.Globalization;
using YieldBench.Cli;
using YieldBench.Core.Conversion;
using YieldBench.Core.HouseFactor;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;
using YieldBench.Reports;

namespace YieldBench.Cli.Tests;

public sealed class PlanCommandTests : IDisposable
{
    private readonly string dir = Path.Combine(Path.GetTempPath(), "yieldbench-plan-" + Guid.NewGuid().ToString("N"));

    public PlanCommandTests() => Directory.CreateDirectory(dir);

    public void Dispose() => Directory.Delete(dir, recursive: true);

    /// <summary>Three seeded seasons: SX-01 at 0.57, SX-02 at 0.61 % v/v per °Brix, noise SD 0.15.</summary>
    private static IReadOnlyList<LotConversion> Lots()
    {
        var rng = new Random(8);
        var lots = new List<LotConversion>();
        for (int s = 0; s < 3; s++)
        {
            foreach (var (strain, f) in new[] { ("SX-01", 0.57), ("SX-02", 0.61) })
            {
                for (int i = 0; i < 25; i++)
                {
                    double brix = 20 + (7 * rng.NextDouble());
                    double u1 = 1 - rng.NextDouble(), u2 = rng.NextDouble();
                    double abv = (f * brix) + (0.15 * Math.Sqrt(-2 * Math.Log(u1)) * Math.Cos(2 * Math.PI * u2));
                    var lot = new Lot
                    {
                        LotId = $"L{lots.Count:000}", Season = 2022 + s, Strain = strain,
                        StartingSugar = SugarReading.FromBrix(brix), FinalAlcohol = AlcoholContent.FromPercentVolume(abv),
                    };
                    lots.Add(ConversionFactors.For(lot, SugarModel.Default));
                }
            }
        }

        return lots;
    }

    private (HouseFactorReview Review, string Path) FactorFile()
    {
        var review = HouseFactorAnalysis.Run(Lots(), new HouseFactorSettings(), [], 3);
        string path = Path.Combine(dir, HouseFactorJson.FileName);
        HouseFactorJson.WriteFile(review, path);
        return (review, path);
    }

    private (int Code, string Out, string Err) Plan(params string[] args)
    {
        var o = new StringWriter(CultureInfo.InvariantCulture);
        var e = new StringWriter(CultureInfo.InvariantCulture);
        int code = YieldBenchApp.Run(["plan", .. args], new CliContext(o, e, false, dir));

        // Every line fits a 100-column terminal, as README's Console promises (plan's lines ran to 250 columns)
        Assert.All((o.ToString() + e.ToString()).Split('\n'), l => Assert.True(l.TrimEnd('\r').Length <= 100, l));
        return (code, o.ToString(), e.ToString());
    }

    [Fact]
    public void The_house_factor_file_round_trips_the_planning_model_and_is_byte_stable()
    {
        // Given a review's house-factor section
        var review = HouseFactorAnalysis.Run(Lots(), new HouseFactorSettings(), [], 3);

        // When it is written twice and read back
        string a = HouseFactorJson.Write(review), b = HouseFactorJson.Write(review);
        var read = HouseFactorJson.Read(a, "test");

        // Then the text is identical, holds no clock, and the model predicts as the original does
        Assert.Equal(a, b);
        Assert.DoesNotContain("\r", a, StringComparison.Ordinal);
        Assert.Contains("\"kind\": \"house-factor\"", a, StringComparison.Ordinal);
        Assert.Null(read.Error);
        var original = review.Planning!.For("SX-02");
        var back = read.Model!.For("SX-02");
        Assert.Equal(original.Predict(24.3), back.Predict(24.3), 1e-12);
        Assert.Equal(original.Errors, back.Errors);
        Assert.Equal(original.ErrorModel, back.ErrorModel);
        Assert.Equal("United States (TTB)", read.RegimeName);
    }

    [Fact]
    public void Question_a_predicts_alcohol_for_a_strain_and_a_sugar_on_any_scale_with_intervals_and_cautions()
    {
        // Given a house-factor file
        var (review, path) = FactorFile();
        var line = review.Planning!.For("SX-02");
        var must = SugarReading.FromSpecificGravity(1.102);
        var expected = Planner.Estimate(line, must);

        // When the planner is asked about SX-02 at SG 1.102
        var (code, output, err) = Plan("--factor-file", path, "--strain", "SX-02", "--sugar", "1.102", "--scale", "sg");

        // Then it prints the prediction with both intervals, as the planner computes them, and every caution
        Assert.Equal(0, code);
        Assert.Equal(string.Empty, err);
        string f2(double v) => v.ToString("0.00", CultureInfo.InvariantCulture);
        Assert.Contains(
            $"Starting sugar 1.102 SG = {must.Brix.ToString("0.0#", CultureInfo.InvariantCulture)} °Brix: predicted alcohol {f2(expected.Predicted)} % v/v; 80 % interval {f2(expected.Low80)}–{f2(expected.High80)}; 95 % interval {f2(expected.Low95)}–{f2(expected.High95)}.",
            Cli.Flat(output),
            StringComparison.Ordinal);
        Assert.InRange(expected.Predicted, 0.61 * must.Brix - 0.1, 0.61 * must.Brix + 0.1);
        Assert.All(HouseFactorTexts.PlannerCautions, c => Assert.Contains("- " + c, Cli.Flat(output), StringComparison.Ordinal));
    }

    [Fact]
    public void Question_b_gives_the_highest_harvest_sugar_for_several_targets()
    {
        // Given a house-factor file
        var (review, path) = FactorFile();
        var line = review.Planning!.For("SX-01");

        // When the planner is asked for 14.0 and 14.5 % at 95 % confidence
        var (code, output, _) = Plan("--factor-file", path, "--strain", "SX-01", "--target", "14.0", "14.5", "--confidence", "0.95");

        // Then each row is the planner's threshold answer
        Assert.Equal(0, code);
        foreach (double t in new[] { 14.0, 14.5 })
        {
            double b = Planner.HighestSugar(line, t, 0.95).PickAtOrBelowBrix;
            Assert.Contains($"{t.ToString("0.0", CultureInfo.InvariantCulture),14} | {b.ToString("0.0", CultureInfo.InvariantCulture)} °Brix", output, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void The_highest_harvest_sugar_is_shown_rounded_down_so_it_never_exceeds_the_limit()
    {
        // Given a factor of 0.6 typed directly (a central answer, 50 %)
        // When the highest sugar for 13.84 % and for 13.86 % is asked
        var (code, output, _) = Plan("--factor", "0.6", "--target", "13.84", "13.86", "--confidence", "0.5");

        // Then 13.84 / 0.6 = 23.0667 °Brix is shown as 23.0 (to the nearest it read 23.1, which predicts 13.86 %,
        // over the target), 13.86 / 0.6 = 23.1 exactly stays 23.1, and each target is shown as typed
        Assert.Equal(0, code);
        Assert.Contains("         13.84 | 23.0 °Brix", output, StringComparison.Ordinal);
        Assert.Contains("         13.86 | 23.1 °Brix", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Question_c_gives_the_water_add_back_and_the_volume_afterwards()
    {
        // Given a factor of 0.6 typed directly
        // When 5000 L at 26 °Brix is to come to 14.5 % v/v
        var (code, output, _) = Plan("--factor", "0.6", "--volume", "5000", "--sugar", "26", "--target", "14.5");

        // Then the add-back is the planner's, which follows the review's balance (PlannerTests hold it to a hand balance:
        // the juice's sugar, 261.2 g/L × 5000 L, diluted into the volume after, is the table's 239.73 g/L at 24.17 °Brix)
        var answer = Planner.WaterAddBack(PlanningModel.FromFactor(0.6).Pooled, SugarReading.FromBrix(26), 5000, 14.5, null);
        Assert.Equal(0, code);
        Assert.Contains("Juice: 5000 L (the volume given is taken as juice; for must on skins give --pomace-share) at 26.0 °Brix", Cli.Flat(output), StringComparison.Ordinal);
        Assert.Contains($"Add {answer.WaterL.ToString("0", CultureInfo.InvariantCulture)} L of water: the juice comes to 24.2 °Brix and {answer.VolumeAfterL.ToString("0", CultureInfo.InvariantCulture)} L by the review's mass balance", Cli.Flat(output), StringComparison.Ordinal);
        Assert.InRange(answer.WaterL, 440, 460);
        Assert.Contains("Factor: 0.6000 % v/v per °Brix.", Cli.Flat(output), StringComparison.Ordinal);
        Assert.Contains("Rules on water additions and on labelling alcohol differ by country", Cli.Flat(output), StringComparison.Ordinal);
    }

    [Fact]
    public void A_decimal_comma_is_read_and_a_bad_number_names_the_option_and_the_fix()
    {
        var ok = Plan("--factor", "0,6", "--sugar", "24,0");
        Assert.Equal(0, ok.Code);
        Assert.Contains("predicted alcohol 14.40 % v/v", Cli.Flat(ok.Out), StringComparison.Ordinal);

        var bad = Plan("--factor", "0.6", "--sugar", "twenty");
        Assert.Equal(2, bad.Code);
        Assert.Equal("plan: --sugar twenty is not a number; write it like 24.5 (a decimal comma, 24,5, is also read).", Cli.Flat(bad.Err).Trim());
    }

    [Fact]
    public void A_missing_factor_file_is_a_command_line_that_cannot_be_carried_out_named_as_given()
    {
        // README, Exit codes: a missing input is exit 2, and paths are shown as the user gave them
        var (code, _, err) = Plan("--factor-file", "nowhere.json", "--sugar", "24");
        Assert.Equal(2, code);
        Assert.Equal("plan: --factor-file nowhere.json: no such file. Give the house-factor.json written by 'yieldbench review' in its output's data folder.", Cli.Flat(err).Trim());
    }

    [Fact]
    public void A_factor_file_given_as_a_review_folder_names_the_house_factor_inside_it()
    {
        // Given a review folder holding data/house-factor.json, and an empty folder
        string review = Path.Combine(dir, "review 2025");
        Directory.CreateDirectory(Path.Combine(review, "data"));
        HouseFactorJson.WriteFile(HouseFactorAnalysis.Run(Lots(), new HouseFactorSettings(), [], 3), Path.Combine(review, "data", HouseFactorJson.FileName));
        Directory.CreateDirectory(Path.Combine(dir, "empty"));

        // When each is given as the factor file
        var a = Plan("--factor-file", "review 2025", "--sugar", "24");
        var b = Plan("--factor-file", "empty", "--sugar", "24");

        // Then both are exit 2 in one line; the first says which file to give
        Assert.Equal(2, a.Code);
        Assert.Equal($"plan: --factor-file review 2025 is a folder, not a file; give --factor-file {Path.Combine("review 2025", "data", "house-factor.json")}.", Cli.Flat(a.Err).Trim());
        Assert.Equal(2, b.Code);
        Assert.Equal("plan: --factor-file empty is a folder, not a house-factor.json; give the house-factor.json in a review's data folder.", Cli.Flat(b.Err).Trim());
    }

    [Fact]
    public void A_hand_edited_factor_file_with_a_number_in_quotes_names_the_property_not_a_type()
    {
        // Given a house-factor file whose pooled slope was typed in quotes
        var (_, path) = FactorFile();
        string text = File.ReadAllText(path);
        int at = text.IndexOf("\"slope_abv_per_brix\": ", StringComparison.Ordinal) + "\"slope_abv_per_brix\": ".Length;
        int end = text.IndexOf(',', at);
        File.WriteAllText(path, text[..at] + "\"" + text[at..end] + "\"" + text[end..]);

        // When the planner reads it
        var (code, _, err) = Plan("--factor-file", HouseFactorJson.FileName, "--sugar", "24");

        // Then it names the property and the line, and no reader type name
        Assert.Equal(1, code);
        Assert.Contains("house-factor.json: not a readable house-factor file at line ", Cli.Flat(err), StringComparison.Ordinal);
        Assert.Contains("(the value of planning.pooled.slope_abv_per_brix is not of the kind this file holds there). Write it again with 'yieldbench review'.", Cli.Flat(err), StringComparison.Ordinal);
        Assert.DoesNotContain("YieldBench", err.Replace("'yieldbench review'", string.Empty, StringComparison.Ordinal), StringComparison.Ordinal);
    }

    [Fact]
    public void Giving_both_a_file_and_a_factor_is_a_usage_error()
    {
        var (code, _, err) = Plan("--factor-file", "x.json", "--factor", "0.6");
        Assert.Equal(2, code);
        Assert.StartsWith("plan: give one of --factor-file", Cli.Flat(err), StringComparison.Ordinal);
    }

    [Fact]
    public void A_file_from_a_review_with_too_few_lots_says_there_is_nothing_to_plan_with()
    {
        // Given a review of five lots
        var review = HouseFactorAnalysis.Run(Lots().Take(5).ToArray(), new HouseFactorSettings(), [], 3);
        string path = Path.Combine(dir, "small.json");
        HouseFactorJson.WriteFile(review, path);

        // When the planner reads it
        var (code, _, err) = Plan("--factor-file", path, "--sugar", "24");

        // Then it is an input problem naming the reason
        Assert.Equal(1, code);
        Assert.Contains("the review chose no house factor, so there is nothing to plan with. Too few lots to choose a house factor: 5 usable", Cli.Flat(err), StringComparison.Ordinal);
    }

    [Fact]
    public void A_file_that_is_not_a_house_factor_file_is_refused_with_a_fix()
    {
        // Given a JSON file of another kind and a file that is not JSON
        string other = Path.Combine(dir, "other.json");
        File.WriteAllText(other, "{\"format_version\": 1, \"kind\": \"lots\"}");
        string broken = Path.Combine(dir, "broken.json");
        File.WriteAllText(broken, "{ not json");

        // When the planner reads them
        var a = Plan("--factor-file", other, "--sugar", "24");
        var b = Plan("--factor-file", broken, "--sugar", "24");

        // Then both are input problems that say what to do
        Assert.Equal(1, a.Code);
        Assert.Contains("other.json: not a house-factor file (its \"kind\" is not \"house-factor\"). Give the house-factor.json written by 'yieldbench review'.", Cli.Flat(a.Err), StringComparison.Ordinal);
        Assert.Equal(1, b.Code);
        Assert.Contains("broken.json: not a readable house-factor file at line 1", Cli.Flat(b.Err), StringComparison.Ordinal);
        Assert.Contains("Write it again with 'yieldbench review'.", Cli.Flat(b.Err), StringComparison.Ordinal);
    }

    [Fact]
    public void An_unknown_scale_is_a_usage_error_listing_the_scales()
    {
        var (code, _, err) = Plan("--factor", "0.6", "--sugar", "24", "--scale", "plato");
        Assert.Equal(2, code);
        Assert.Contains("plan: --scale plato is not known; use brix, sg, baume, oechsle, kmw or gl.", Cli.Flat(err), StringComparison.Ordinal);
    }

    [Fact]
    public void A_strain_is_matched_by_intakes_spelling_rules_and_an_unknown_one_is_an_error_listing_the_known()
    {
        // Given a house-factor file of strains SX-01 and SX-02
        var (review, path) = FactorFile();

        // When the planner is asked with "sx 02" and with SX-77
        var ok = Plan("--factor-file", path, "--strain", "sx 02", "--sugar", "24");
        var bad = Plan("--factor-file", path, "--strain", "SX-77", "--sugar", "24");

        // Then the first uses SX-02's line and shows its factor beside the pooled one; the second exits 2 naming the known strains
        Assert.Equal(0, ok.Code);
        Assert.Contains("Predictor for strain SX-02 (candidate ", Cli.Flat(ok.Out), StringComparison.Ordinal);
        var model = review.Planning!;
        string f4(double v) => v.ToString("0.0000", CultureInfo.InvariantCulture);
        Assert.Contains($"Factor: {f4(model.FactorOf(model.For("SX-02")))} % v/v per °Brix at {model.ReferenceBrix.ToString("0.0", CultureInfo.InvariantCulture)} °Brix (the lots' median starting sugar); all strains pooled: {f4(model.FactorOf(model.Pooled))}.", Cli.Flat(ok.Out), StringComparison.Ordinal);
        Assert.InRange(model.FactorOf(model.For("SX-02")), 0.60, 0.62); // the true factor is 0.61
        Assert.Equal(2, bad.Code);
        Assert.Contains("plan: --strain SX-77 is not a strain of this house factor; known strains: SX-01, SX-02.", Cli.Flat(bad.Err), StringComparison.Ordinal);
    }

    [Fact]
    public void An_impossible_sugar_is_a_usage_error_in_its_own_scale_and_one_outside_the_history_is_a_warning()
    {
        // Given a house-factor file learned from lots of 20–27 °Brix
        var (review, path) = FactorFile();

        // When the planner is asked at 5 °Brix, at SG 1.200 (44 °Brix), and at 29.0 °Brix
        var low = Plan("--factor-file", path, "--sugar", "5");
        var sg = Plan("--factor-file", path, "--sugar", "1.200", "--scale", "sg");
        var high = Plan("--factor-file", path, "--sugar", "29");

        // Then the first two exit 2 saying the range in the scale given (10 °Brix = SG 1.040, 40 °Brix = SG 1.179:
        // Zoecklein et al. Table I-1 gives 1.04002 at 10 %), and the third answers with a warning
        Assert.Equal(2, low.Code);
        Assert.Contains("plan: --sugar 5 °Brix is outside 10–40 °Brix, the range of a must's starting sugar", Cli.Flat(low.Err), StringComparison.Ordinal);
        Assert.Equal(2, sg.Code);
        Assert.Contains("is outside 1.040–1.179 SG (10–40 °Brix)", Cli.Flat(sg.Err), StringComparison.Ordinal);
        Assert.Equal(0, high.Code);
        Assert.Contains($"Warning: 29.0 °Brix is outside the {review.Planning!.HistoryLowBrix.ToString("0.0", CultureInfo.InvariantCulture)}–{review.Planning.HistoryHighBrix.ToString("0.0", CultureInfo.InvariantCulture)} °Brix of the lots the house factor learned from, so the prediction extrapolates", Cli.Flat(high.Out), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("1.104", "1.104 looks like a specific gravity: add --scale sg.")]
    [InlineData("92", "92 looks like °Oechsle: add --scale oechsle.")]
    [InlineData("245", "245 looks like sugar in g/L: add --scale gl.")]
    [InlineData("5", "check the reading and that --scale names its scale.")]
    public void A_sugar_given_in_another_scale_than_brix_is_refused_with_the_scale_it_looks_like(string sugar, string hint)
    {
        // Given a house-factor file / When --sugar is given a value of another scale without --scale (the bands intake
        // reads an unlabelled starting sugar by: SG 0.95–1.3, °Oechsle 45–145, g/L above 145)
        var (_, path) = FactorFile();
        var run = Plan("--factor-file", path, "--sugar", sugar);

        // Then it exits 2 naming the likely scale and the option that says it (a value that looks like none keeps the
        // general advice)
        Assert.Equal(2, run.Code);
        Assert.Contains(hint, Cli.Flat(run.Err), StringComparison.Ordinal);
    }

    [Fact]
    public void A_juice_already_under_the_target_needs_no_water_and_a_pomace_share_leaves_the_skins_out_of_the_balance()
    {
        // Given a factor of 0.6
        // When 1000 L at 22 °Brix is to come to 14.5 %, and 5000 L of must on skins (20 % skins and seeds) at 26 °Brix to 14.5 %
        var none = Plan("--factor", "0.6", "--volume", "1000", "--sugar", "22", "--target", "14.5");
        var skins = Plan("--factor", "0.6", "--volume", "5000", "--pomace-share", "0.2", "--sugar", "26", "--target", "14.5");
        var juiceOnly = Plan("--factor", "0.6", "--volume", "4000", "--sugar", "26", "--target", "14.5");

        // Then the first says no water is needed, and the second balances only its 4000 L of juice
        Assert.Contains("No water needed: the juice's predicted alcohol, 13.2 % v/v, is already at or below the aim of 14.5 % v/v.", Cli.Flat(none.Out), StringComparison.Ordinal);
        Assert.Contains("Juice: 4000 L (the 5000 L given less 20 % skins and seeds; only the juice enters the balance)", Cli.Flat(skins.Out), StringComparison.Ordinal);
        string Add(string text) => text.Split('\n').First(l => l.StartsWith("Add ", StringComparison.Ordinal));
        Assert.Equal(Add(juiceOnly.Out), Add(skins.Out));
    }

    [Fact]
    public void Lot_files_given_directly_are_analysed_first_and_the_answer_names_its_basis()
    {
        // Given the repository's demo lot files
        string? root = AppContext.BaseDirectory;
        while (root is not null && !File.Exists(Path.Combine(root, "YieldBench.sln")))
        {
            root = Path.GetDirectoryName(root);
        }

        Assert.NotNull(root);
        string demo = Path.Combine(root!, "demo-data", "history");

        // When the planner is given them with a strain and a sugar
        var (code, output, _) = Plan("--lots", demo, "--sugar", "24");

        // Then it chooses a house factor from them and answers with intervals
        Assert.Equal(0, code);
        Assert.Matches(@"chosen by the one-standard-error rule on leave-one-season-out, .* from \d+ lots read now\.", Cli.Flat(output));
        Assert.Matches(@"Starting sugar 24\.0 °Brix: predicted alcohol \d+\.\d\d % v/v; 80 % interval ", Cli.Flat(output));
    }

    [Fact]
    public void Giving_a_factor_and_lot_files_together_is_a_usage_error()
    {
        var (code, _, err) = Plan("--lots", "x.csv", "--factor", "0.6");
        Assert.Equal(2, code);
        Assert.StartsWith("plan: give one of --factor-file", Cli.Flat(err), StringComparison.Ordinal);
    }
}
