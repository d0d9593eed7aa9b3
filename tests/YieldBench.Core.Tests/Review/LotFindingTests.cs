using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Review.Strains;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Review;

/// <summary>One line per lot: a lot's flags merged, explanations ranked, contradictions resolved.</summary>
public sealed class LotFindingTests
{
    private static readonly LotConversion Lot = ConversionFactors.For(
        new Lot
        {
            LotId = "23-016",
            Season = 2023,
            Strain = "XR-31",
            StartingSugar = SugarReading.FromBrix(27.3),
            FinalAlcohol = AlcoholContent.FromPercentVolume(14.96),
            ResidualSugarGl = 1.5,
        },
        SugarModel.Default);

    private static LotFlag Flag(string code, FlagSeverity severity, double value = 0.548, double reference = 0.612, string? suggestion = null, string? recorded = null, string group = "strain XR-31") => new()
    {
        LotKey = Lot.Lot.Key,
        LotId = Lot.Lot.LotId,
        Season = 2023,
        Strain = "XR-31",
        Code = code,
        Severity = severity,
        Measure = "abv_per_brix",
        Value = value,
        ReferenceGroup = group,
        ReferenceMedian = reference,
        ReferenceScale = 0.01,
        Reason = code,
        FollowUp = "re-check the starting sugar sampling; look for unrecorded water additions (add-back) in the cellar records",
        Suggestion = suggestion,
        Recorded = recorded,
    };

    [Fact]
    public void A_lot_judged_against_all_lots_is_not_said_to_be_off_its_strains_line()
    {
        // Given a lot of a strain with too few lots, judged against the pooled line and the pooled factors, with a
        // transposition that would put it on the pooled line
        const string line = "all finished lots (pooled line)";
        var flags = new[]
        {
            Flag(FlagCodes.OffStrainLine, FlagSeverity.Check, value: 14.96, reference: 16.82, group: line),
            Flag(FlagCodes.LowFactor, FlagSeverity.Check, group: "all lots (pooled)"),
            Flag(FlagCodes.PossibleTransposedDigits, FlagSeverity.LikelyError, suggestion: "23.7 °Brix", recorded: "32.7 °Brix", group: line),
        };

        // When merged
        var finding = LotFindings.Of(Lot, flags, [])!;

        // Then its flags and its words name what it was compared with: all lots, never its strain
        Assert.Equal(
        [
            "starting sugar may have two digits swapped",
            "alcohol off the line of all finished lots for its sugar (its strain has too few)",
            "low factor against all lots (its strain has too few)",
        ], finding.Flags);
        Assert.Equal("Made 14.96 % v/v from 27.3 °Brix, 1.86 % v/v less than the line of all finished lots gives (16.82 % v/v).", finding.Seen);
        Assert.Equal("A starting sugar written with two digits swapped: 32.7 °Brix was recorded; 23.7 °Brix would put the lot on the line of all finished lots.", finding.Explanation);
        Assert.DoesNotContain("strain", string.Join(" ", finding.Flags.Skip(1).Select(f => f.Replace("its strain has too few", string.Empty, StringComparison.Ordinal))), StringComparison.Ordinal);

        // And the same flags judged against the strain keep the strain's words
        Assert.Equal("alcohol off its strain's line for its sugar", ReviewTexts.FlagName(Flag(FlagCodes.OffStrainLine, FlagSeverity.Check)));
    }

    [Fact]
    public void Unrecorded_water_leads_and_a_transposition_is_named_only_as_less_likely()
    {
        // Given a low lot with the symptoms, a water explanation (a check) and a transposition (a likely error)
        var flags = new[]
        {
            Flag(FlagCodes.LowFactor, FlagSeverity.Check),
            Flag(FlagCodes.OffStrainLine, FlagSeverity.Check, value: 14.96, reference: 16.82),
            Flag(FlagCodes.PossibleTransposedDigits, FlagSeverity.LikelyError, suggestion: "23.7 °Brix", recorded: "32.7 °Brix"),
            Flag(FlagCodes.PossibleUnrecordedWater, FlagSeverity.Check, suggestion: "about 12 L of water per 100 L of must"),
        };

        // When merged
        var finding = LotFindings.Of(Lot, flags, [])!;

        // Then it is one line: what was seen with the numbers, water first, the transposition after, the worst severity
        Assert.Equal(FlagSeverity.LikelyError, finding.Severity);
        Assert.Equal("Made 14.96 % v/v from 27.3 °Brix, 1.86 % v/v less than its strain's line gives (16.82 % v/v).", finding.Seen);
        Assert.Equal("An unrecorded water addition (add-back) of about 12 L of water per 100 L of must would explain the low alcohol.", finding.Explanation);
        Assert.Equal("A starting sugar written with two digits swapped: 32.7 °Brix was recorded; 23.7 °Brix would put the lot on its strain's line.", finding.Otherwise);
        Assert.StartsWith("Look for an unrecorded water addition", finding.FollowUp, StringComparison.Ordinal);
        Assert.Equal(
            [FlagCodes.PossibleUnrecordedWater, FlagCodes.PossibleTransposedDigits, FlagCodes.OffStrainLine, FlagCodes.LowFactor],
            finding.Codes);
        Assert.Equal(ReviewTexts.FlagName(FlagCodes.PossibleUnrecordedWater), finding.Flags[0]);
    }

    [Fact]
    public void More_alcohol_than_the_sugar_can_give_rules_out_water_and_stands_alone()
    {
        // Given a lot above the theoretical yield that (from a bad reading) also carries a water flag
        var flags = new[]
        {
            Flag(FlagCodes.AboveTheoreticalYield, FlagSeverity.LikelyError, value: 1.039, reference: 1.0),
            Flag(FlagCodes.PossibleUnrecordedWater, FlagSeverity.Check, suggestion: "about 5 L of water per 100 L of must"),
        };

        // When merged
        var finding = LotFindings.Of(Lot, flags, [])!;

        // Then the yield leads and the contradicting water explanation is not offered beside it
        Assert.StartsWith("Sugar that was not recorded", finding.Explanation, StringComparison.Ordinal);
        Assert.Null(finding.Otherwise);
    }

    [Fact]
    public void A_white_past_its_danger_line_is_told_of_lost_aroma_and_a_red_of_suffering_yeast()
    {
        // Given the same danger-temperature flag on a white lot (danger line 25 °C) and on a red one (40 °C)
        var white = ConversionFactors.For(Lot.Lot with { Colour = WineColour.White }, SugarModel.Default);
        var red = ConversionFactors.For(Lot.Lot with { Colour = WineColour.Red }, SugarModel.Default);
        var hot = Flag("above-danger-temp", FlagSeverity.Check, value: 27.0, reference: 25.0);

        // When each lot's line is made
        var w = LotFindings.Of(white, [], [hot])!;
        var r = LotFindings.Of(red, [], [hot])!;

        // Then the white is not told that yeast suffer at 27 °C (before it was), but what a warm white loses; the red is
        Assert.Equal("Too little cooling for this vessel: a white or rosé this warm loses the fresh aroma it is fermented cool to keep.", w.Explanation);
        Assert.Equal("Too little cooling for this vessel: yeast suffer near this temperature and the ferment may stop.", r.Explanation);
    }

    [Fact]
    public void Symptoms_alone_are_explained_by_their_direction_and_a_lot_without_flags_has_no_line()
    {
        // Given a lot only unusually high for its strain
        var high = LotFindings.Of(Lot, [Flag(FlagCodes.OutsideTukeyFence, FlagSeverity.Note, value: 0.647, reference: 0.612)], [])!;

        // Then the explanation speaks of more alcohol, the severity is the flag's, and no flag gives no line
        Assert.Equal("Made 0.647 % v/v per °Brix against 0.612 usual for strain XR-31.", high.Seen);
        Assert.StartsWith("More alcohol than the strain's other lots", high.Explanation, StringComparison.Ordinal);
        Assert.Equal(FlagSeverity.Note, high.Severity);
        Assert.Null(LotFindings.Of(Lot, [], []));
    }
}
