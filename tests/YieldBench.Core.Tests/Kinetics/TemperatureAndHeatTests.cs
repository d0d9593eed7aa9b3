using YieldBench.Core.Kinetics;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;
using static YieldBench.Core.Tests.Kinetics.KineticsTestData;

namespace YieldBench.Core.Tests.Kinetics;

public class TemperatureAndHeatTests
{
    [Fact]
    public void Hours_above_a_threshold_follow_straight_lines_between_readings()
    {
        // Given 30 → 40 → 30 °C at 0, 10 and 20 h
        double[] h = [0, 10, 20];
        double[] c = [30, 40, 30];

        // When the time above 35 °C is measured
        double above = KineticsAnalysis.HoursAbove(h, c, 35.0);

        // Then (hand-worked) the line crosses 35 °C at 5 h and again at 15 h: 10 h above; nothing is strictly above 40 °C
        Assert.Equal(10.0, above, 9);
        Assert.Equal(0.0, KineticsAnalysis.HoursAbove(h, c, 40.0), 9);
    }

    [Fact]
    public void A_log_kept_in_Fahrenheit_is_converted_before_thresholds_are_applied()
    {
        // Given a probe that logged °F, converted with Temperature.FromFahrenheit: 86 °F = 30 °C, 105.8 °F = 41 °C
        double C(double f) => Temperature.FromFahrenheit(f).Celsius;
        var log = Log("T-101", 2025,
            ("2025-10-01 00:00", 24.0, C(86.0)),
            ("2025-10-01 12:00", 20.0, C(105.8)),
            ("2025-10-02 00:00", 14.0, C(86.0)),
            ("2025-10-03 00:00", 4.0, C(77.0)));

        // When a red lot is analysed (thresholds 35 / 40 °C)
        var review = KineticsAnalysis.Run([Lot()], [log], KineticsSettings.Default);

        // Then the peak is 41.0 °C and (hand-worked) 40 °C is exceeded from 10.909 h to 13.091 h: 12 h × 1/11 on each side = 2.182 h;
        // 35 °C is exceeded for 12 h × 6/11 on each side = 13.091 h
        var lot = Assert.Single(review.Lots);
        Assert.Equal(41.0, lot.PeakTemperatureC!.Value, 9);
        Assert.Equal(At("2025-10-01 12:00"), lot.PeakTemperatureAt);
        Assert.Equal(24.0 / 11.0, lot.HoursAboveDanger, 9);
        Assert.Equal(144.0 / 11.0, lot.HoursAboveCaution, 9);
        Assert.Contains("above-danger-temp", lot.Flags);
        Assert.Equal(37.0, C(98.6), 9);
    }

    [Fact]
    public void A_cellar_that_works_in_Fahrenheit_reads_the_findings_sentences_in_Fahrenheit()
    {
        // Given the same °F probe log (peak 41 °C = 105.8 °F; red danger threshold 40 °C = 104 °F)
        double C(double f) => Temperature.FromFahrenheit(f).Celsius;
        var log = Log("T-101", 2025, ("2025-10-01 00:00", 24.0, C(86.0)), ("2025-10-01 12:00", 20.0, C(105.8)), ("2025-10-02 00:00", 14.0, C(86.0)), ("2025-10-03 00:00", 4.0, C(77.0)));

        // When it is analysed with the sentences in °F
        var review = KineticsAnalysis.Run([Lot()], [log], KineticsSettings.Default with { SentenceUnit = YieldBench.Core.Units.TemperatureUnit.Fahrenheit });

        // Then the finding says the peak and the threshold in °F, and no °C is left in any finding; the values stay °C
        var danger = Assert.Single(review.Findings, f => f.Code == "above-danger-temp");
        Assert.StartsWith("Lot 2025/T-101 reached 105.8 °F at 2025-10-01 12:00, above the danger threshold of 104.0 °F", danger.Message, StringComparison.Ordinal);
        Assert.DoesNotContain(review.Findings, f => f.Message.Contains("°C", StringComparison.Ordinal));
        Assert.Equal(41.0, Assert.Single(review.Lots).PeakTemperatureC!.Value, 9);
    }

    [Fact]
    public void Whites_use_the_lower_thresholds()
    {
        // Given the same log peaking at 24 °C for a white and for a red lot
        var rows = new[] { ("2025-10-01 00:00", (double?)22.0, (double?)14.0), ("2025-10-02 00:00", 18.0, 24.0), ("2025-10-03 00:00", 12.0, 18.0) };

        // When each is analysed
        var white = Assert.Single(KineticsAnalysis.Run([Lot(colour: WineColour.White)], [Log("T-101", 2025, rows)], KineticsSettings.Default).Lots);
        var red = Assert.Single(KineticsAnalysis.Run([Lot(colour: WineColour.Red)], [Log("T-101", 2025, rows)], KineticsSettings.Default).Lots);

        // Then the white passes its 20 °C caution threshold (not its 25 °C danger one) and the red passes neither
        Assert.Equal(new TemperatureThresholds(20.0, 25.0), white.Thresholds);
        Assert.Contains("above-caution-temp", white.Flags);
        Assert.DoesNotContain("above-danger-temp", white.Flags);
        Assert.DoesNotContain("above-caution-temp", red.Flags);
    }

    [Fact]
    public void A_white_lots_follow_ups_and_heat_sentence_name_no_cap_and_a_reds_do()
    {
        // Given the same hot log (peak 41 °C: above both colours' danger lines) for a white and a red lot
        var rows = new[] { ("2025-10-01 00:00", (double?)22.0, (double?)24.0), ("2025-10-02 00:00", 16.0, 36.0), ("2025-10-03 00:00", 8.0, 41.0), ("2025-10-04 00:00", 2.0, 33.0) };

        // When each is analysed and its follow-ups made
        var whiteReview = KineticsAnalysis.Run([Lot(colour: WineColour.White)], [Log("T-101", 2025, rows)], KineticsSettings.Default);
        var redReview = KineticsAnalysis.Run([Lot(colour: WineColour.Red)], [Log("T-101", 2025, rows)], KineticsSettings.Default);
        var white = Assert.Single(KineticsFollowUps.For(whiteReview), f => f.Code == KineticsCodes.AboveDangerTemp);
        var red = Assert.Single(KineticsFollowUps.For(redReview), f => f.Code == KineticsCodes.AboveDangerTemp);

        // Then a white, fermented as juice, is told to check cooling only (before, also its "cap management", which a
        // white has none of), and a red cooling and its cap; the heat sentence likewise
        Assert.StartsWith("Check cooling capacity for this vessel before next harvest; fermentation heat and CO2", white.FollowUp, StringComparison.Ordinal);
        Assert.StartsWith("Check cooling capacity and cap management for this vessel before next harvest;", red.FollowUp, StringComparison.Ordinal);
        Assert.DoesNotContain(whiteReview.Findings, f => f.Message.Contains("cap", StringComparison.OrdinalIgnoreCase));
        Assert.Contains(redReview.Findings, f => f.Code == KineticsCodes.HeatPotentialAboveDanger && f.Message.EndsWith("removed by the vessel, cap management and cooling.", StringComparison.Ordinal));
        Assert.Equal("check temperature and nutrients (YAN).", KineticsFollowUps.StuckChecks(WineColour.Rose));
        Assert.Equal("check temperature, nutrients (YAN) and cap.", KineticsFollowUps.StuckChecks(WineColour.Red));
    }

    [Fact]
    public void The_heat_constants_match_their_sources()
    {
        // Given the published values
        // Colombié, Malherbe & Sablayrolles 2007 (Food Control 18:953): about 24 kcal per mole of sugar; 24 × 4.184 = 100.42 kJ
        // Molar mass of C6H12O6: 6 × 12.011 + 12 × 1.008 + 6 × 15.999 = 180.156 g/mol
        // When compared with the defaults
        // Then they agree
        Assert.Equal(24.0 * 4.184, FermentationHeat.DefaultHeatOfFermentationKjPerMol, 1);
        Assert.Equal((6 * 12.011) + (12 * 1.008) + (6 * 15.999), FermentationHeat.HexoseMolarMass, 2);
        Assert.Equal(FermentationHeat.DefaultHeatOfFermentationKjPerMol, KineticsSettings.Default.HeatOfFermentationKjPerMol);
    }

    [Fact]
    public void The_musts_heat_capacity_follows_the_Choi_Okos_composition_model()
    {
        // Given Choi & Okos (1986) as printed in food-engineering texts: cp_water = 4.1762 − 9.0864e-5·T + 5.4731e-6·T²,
        // cp_carbohydrate = 1.5488 + 1.9625e-3·T − 5.9399e-6·T² (kJ/(kg·K), T °C); at 20 °C, by hand, 4.17657 and 1.58567
        // When a must's heat capacity is taken at 20 °C as (1 − °Brix/100)·water + °Brix/100·carbohydrate
        // Then it is, by hand: 20 °Brix 0.80 × 4.17657 + 0.20 × 1.58567 = 3.65839; 24 °Brix 3.55476; 26 °Brix 3.50294;
        // pure water 4.17657
        Assert.Equal(3.65839, FermentationHeat.MustHeatCapacityKjPerKgK(20), 5);
        Assert.Equal(3.55476, FermentationHeat.MustHeatCapacityKjPerKgK(24), 5);
        Assert.Equal(3.50294, FermentationHeat.MustHeatCapacityKjPerKgK(26), 5);
        Assert.Equal(4.17657, FermentationHeat.MustHeatCapacityKjPerKgK(0), 5);

        // And it is within 0.04 of the other composition rule printed beside it (Heldman 1975: 4.180 × water + 1.42 ×
        // carbohydrate gives 3.518 at 24 °Brix), and below the measured heat capacities of apples in Geankoplis App. A.4-1
        // (3.73–4.02 at 75–85 % water; the model gives 3.53 and 3.79 at 25 and 15 % solids): it errs low, so the
        // temperature a must could reach errs high — the safe side for a warning
        Assert.Equal(3.518, (4.180 * 0.76) + (1.42 * 0.24), 3);
        Assert.InRange(FermentationHeat.MustHeatCapacityKjPerKgK(24) - 3.518, 0, 0.04);
        Assert.True(FermentationHeat.MustHeatCapacityKjPerKgK(25) < 3.73);
        Assert.True(FermentationHeat.MustHeatCapacityKjPerKgK(15) < 4.02);

        // And the settings take it from the must unless a value is set
        Assert.Equal(3.55476, KineticsSettings.Default.MustHeatCapacityAt(24), 5);
        Assert.Equal(3.9, (KineticsSettings.Default with { MustHeatCapacityKjPerKgK = 3.9 }).MustHeatCapacityAt(24));
    }

    [Fact]
    public void The_adiabatic_rise_matches_a_hand_worked_value()
    {
        // Given 200 g/L of sugar in a must of 1.08 kg/L with cp 3.9 kJ/(kg·K)
        // When the rise is computed
        double rise = FermentationHeat.PotentialRiseK(200.0, 1.08, 100.4, 3.9);

        // Then (hand-worked) 200 / 180.16 = 1.110124 mol/L × 100.4 = 111.4564 kJ/L ÷ (1.08 × 3.9 = 4.212) = 26.4616 K
        Assert.Equal(26.4616, rise, 3);
    }

    [Fact]
    public void One_degree_Brix_of_sucrose_per_kilogram_gives_the_referenced_rise()
    {
        // Given 10 g per kg (1 °Brix) of sugar at density 1 and cp 4.0 kJ/(kg·K)
        // When the rise is computed
        double rise = FermentationHeat.PotentialRiseK(10.0, 1.0, 100.4, 4.0);

        // Then it is ≈ 1.39 K/°Brix, ≈ 5.6 kJ/kg per °Brix: 10 g / 180.16 g/mol × 100.4 kJ/mol (24 kcal/mol, Colombié,
        // Malherbe & Sablayrolles 2007, Food Control 18:953) ÷ 4.0 kJ/(kg·K) — arithmetic done here, not a published value
        Assert.Equal(1.39, rise, 2);
        Assert.Equal(5.57, 10.0 / 180.16 * 100.4, 2);
    }

    [Fact]
    public void A_reading_whose_potential_passes_the_danger_threshold_is_flagged_in_plain_words()
    {
        // Given a red lot at 20 °Brix and 29 °C; the OIV must table gives 191.9 g/L at 20 °Brix and Zoecklein et al.
        // Table I-1 gives SG 1.08297, so density 1.08297 × 0.99820 = 1.081021 kg/L
        var log = Log("T-101", 2025,
            ("2025-10-01 00:00", 20.0, 29.0),
            ("2025-10-01 12:00", 18.0, 31.0),
            ("2025-10-02 00:00", 12.0, 33.0),
            ("2025-10-03 00:00", 2.0, 30.0));

        // When analysed
        var review = KineticsAnalysis.Run([Lot(startingBrix: 20.0)], [log], KineticsSettings.Default);

        // Then (hand-worked, cp of a 20 °Brix must 3.65839 kJ/(kg·K), Choi & Okos as in the test above)
        // ΔT = 191.9 / 180.16 × 100.4 / (1.081021 × 3.65839) = 27.04 K, so 56.0 °C was reachable
        var lot = Assert.Single(review.Lots);
        double expected = 191.9 / 180.16 * 100.4 / (1.08297 * 0.99820 * 3.65839);
        Assert.Equal(expected, lot.Heat[0].PotentialRiseK, 2);
        Assert.Equal(29.0 + expected, lot.PotentialPeak!.Value.PotentialTemperatureC, 2);
        Assert.Equal(29.0 + expected - 33.0, lot.HeatRemovedK!.Value, 2);
        Assert.Equal(3, lot.ReadingsWithPotentialAboveDanger);
        var f = Assert.Single(review.Findings, x => x.Code == KineticsCodes.HeatPotentialAboveDanger);
        Assert.StartsWith("Lot 2025/T-101: at 20.0 °Brix and 29.0 °C this lot could have reached 56.0 °C without cooling (2025-10-01 00:00;", f.Message);
        Assert.Contains("The logged peak was 33.0 °C, so about 23.0 K of the potential was removed", f.Message);
    }

    [Fact]
    public void A_cool_low_sugar_reading_is_not_flagged_for_heat()
    {
        // Given a white lot at 4 °Brix and 12 °C: about 3 K of potential, far from 25 °C
        var log = Log("T-101", 2025, ("2025-10-01 00:00", 4.0, 12.0), ("2025-10-02 00:00", 2.0, 12.0));

        // When analysed
        var lot = Assert.Single(KineticsAnalysis.Run([Lot(colour: WineColour.White, startingBrix: 4.0)], [log], KineticsSettings.Default).Lots);

        // Then no heat flag is raised and the potential stays under 20 °C
        Assert.Equal(0, lot.ReadingsWithPotentialAboveDanger);
        Assert.InRange(lot.PotentialPeak!.Value.PotentialTemperatureC, 12.0, 20.0);
    }

    [Fact]
    public void A_sugar_reading_without_its_own_temperature_takes_one_interpolated_from_near_readings()
    {
        // Given temperature logged at 00:00 (20 °C) and 04:00 (24 °C), sugar at 02:00 and again far from any temperature
        var log = new FermentationLog("T-101", 2025,
        [
            new LogReading(At("2025-10-01 00:00"), SugarReading.FromBrix(24.0), 20.0),
            new LogReading(At("2025-10-01 02:00"), SugarReading.FromBrix(23.8), null),
            new LogReading(At("2025-10-01 04:00"), null, 24.0),
            new LogReading(At("2025-10-02 04:00"), SugarReading.FromBrix(18.0), null),
        ]);

        // When analysed (pairing window 6 h)
        var lot = Assert.Single(KineticsAnalysis.Run([Lot()], [log], KineticsSettings.Default).Lots);

        // Then the 02:00 reading takes 22 °C and the next-day reading, 24 h from any temperature, takes none
        Assert.Equal(22.0, lot.Sugar[1].TemperatureC!.Value, 9);
        Assert.Null(lot.Sugar[2].TemperatureC);
        Assert.Equal(2, lot.Heat.Count);
    }
}
