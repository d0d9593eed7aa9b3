using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Scenario.Tests;

/// <summary>The demo scenario has the shape its brief asks for.</summary>
public class ScenarioPropertyTests
{
    private static readonly ScenarioData Demo = ScenarioGenerator.Demo();

    private static readonly HashSet<LotKey> PlantedKeys = Demo.PlantedCases
        .Where(p => p.Kind != PlantedKind.RecordedAdditionControl).Select(p => p.Key).ToHashSet();

    [Fact]
    public void Three_seasons_of_60_to_90_lots_with_unique_lot_ids()
    {
        // Given the demo scenario
        // Then it has the seasons 2023–2025, each with 60–90 lots and no repeated lot id (across seasons too)
        Assert.Equal([2023, 2024, 2025], Demo.Seasons.Select(s => s.Profile.Year));
        Assert.All(Demo.Seasons, s => Assert.InRange(s.Lots.Count, 60, 90));
        var ids = Demo.AllLots.Select(l => l.Recorded.LotId).ToArray();
        Assert.Equal(ids.Length, ids.Distinct(StringComparer.Ordinal).Count());
    }

    [Fact]
    public void Five_invented_strains_each_with_lots_in_every_season()
    {
        // Given the demo's strains
        var codes = Demo.Strains.Select(s => s.Code).ToArray();

        // Then there are five, all in the project's own YB- code style, each recorded on at least five lots a season
        Assert.Equal(5, codes.Length);
        Assert.All(codes, c => Assert.Matches("^YB-[RWN][0-9]{2}$", c));
        foreach (var season in Demo.Seasons)
        {
            foreach (var code in codes)
            {
                Assert.True(season.Lots.Count(l => l.Recorded.Strain == code) >= 5, $"{code} has fewer than 5 lots in {season.Profile.Year}");
            }
        }
    }

    [Fact]
    public void True_strain_factors_are_distinct_and_lie_between_0_57_and_0_62_at_24_Brix()
    {
        // Given the true factors at 24 °Brix (OIV table: 237.8 g/L of sugar at 24 °Brix, OIV-MA-AS2-02 Table II)
        var factors = Demo.TrueFactorsAt(24.0).Values.Order().ToArray();

        // Then each lies in 0.57–0.62 % v/v per °Brix and neighbours differ by at least 0.004
        Assert.All(factors, f => Assert.InRange(f, 0.57, 0.62));
        for (int i = 1; i < factors.Length; i++)
        {
            Assert.True(factors[i] - factors[i - 1] >= 0.004, $"factors {factors[i - 1]:0.0000} and {factors[i]:0.0000} are too close");
        }

        // And YB-R31's factor is 237.8 / 16.11 / 24 = 0.61505 (hand-worked)
        Assert.Equal(0.61505, Demo.TrueFactorsAt(24.0)["YB-R31"], 4);
    }

    [Fact]
    public void Four_or_more_vessel_types_and_reds_whites_and_rose_every_season()
    {
        // Given the demo lots
        var types = Demo.AllLots.Select(l => l.Recorded.Vessel).Distinct().ToArray();

        // Then at least four vessel types are used and each season has red, white and rosé lots
        Assert.True(types.Length >= 4, string.Join(", ", types));
        foreach (var season in Demo.Seasons)
        {
            Assert.Contains(season.Lots, l => l.Recorded.Colour == WineColour.Red);
            Assert.Contains(season.Lots, l => l.Recorded.Colour == WineColour.White);
            Assert.Contains(season.Lots, l => l.Recorded.Colour == WineColour.Rose);
        }
    }

    [Fact]
    public void The_2024_season_is_recorded_in_specific_gravity_and_the_others_in_Brix()
    {
        // Given the demo seasons
        // Then 2024 lots carry SG readings with three decimals, and the others °Brix with one
        foreach (var lot in Demo.AllLots)
        {
            if (lot.Recorded.Season == 2024)
            {
                Assert.Equal(SugarScale.SpecificGravity, lot.RecordedScale);
                Assert.InRange(lot.RecordedStartingValue, 1.06, 1.13);
                Assert.Equal(Math.Round(lot.RecordedStartingValue, 3), lot.RecordedStartingValue);
            }
            else
            {
                Assert.Equal(SugarScale.Brix, lot.RecordedScale);
                Assert.Equal(Math.Round(lot.RecordedStartingValue, 1), lot.RecordedStartingValue);
            }
        }
    }

    [Fact]
    public void Every_planted_kind_is_present_once_with_its_lot_in_the_files()
    {
        // Given the planted cases
        var kinds = Demo.PlantedCases.Where(p => p.Kind != PlantedKind.RecordedAdditionControl).Select(p => p.Kind).ToArray();

        // Then each of the six kinds is planted once, on a lot that exists in that season
        Assert.Equal(Enum.GetValues<PlantedKind>().Where(k => k != PlantedKind.RecordedAdditionControl).Order(), kinds.Order());
        var keys = Demo.AllLots.Select(l => l.Recorded.Key).ToHashSet();
        Assert.All(Demo.PlantedCases, p => Assert.Contains(p.Key, keys));
        Assert.Equal(Demo.PlantedCases.Count, Demo.PlantedCases.Select(p => p.Key).Distinct().Count());
    }

    [Fact]
    public void Transposed_digit_lot_records_27_4_for_a_true_24_7()
    {
        // Given the transposed-digit case
        var (lot, _) = Case(PlantedKind.TransposedDigits);

        // Then the recorded °Brix is the true one with its last two digits swapped, and the factor reads low
        Assert.Equal(27.4, lot.Recorded.StartingSugar.Brix, 10);
        Assert.Equal(24.7, lot.Truth.StartingBrix, 10);
        Assert.Equal("247".Order(), "274".Order());
        double factor = Conv(lot).AbvPerBrix;
        Assert.True(factor < Catalog.Strain(lot.Truth.Strain).TrueFactorAt(24.7) - 0.04, $"factor {factor:0.000}");
    }

    [Fact]
    public void Unrecorded_water_lot_has_no_recorded_addition_and_reads_a_low_factor()
    {
        // Given the unrecorded-water case
        var (lot, _) = Case(PlantedKind.UnrecordedWater);

        // Then nothing is recorded, yet the truth holds water that took the must from 27.3 to about 24.5 °Brix
        Assert.False(lot.Recorded.Additions.Any);
        Assert.True(lot.Truth.WaterAddedL > 0);
        Assert.InRange(lot.Truth.EffectiveBrix, 24.3, 24.7);
        Assert.Equal(27.3, lot.Recorded.StartingSugar.Brix, 10);

        // And its factor on the recorded sugar sits at least 0.04 below its strain's true factor at that sugar
        Assert.True(Conv(lot).AbvPerBrix < Catalog.Strain(lot.Truth.Strain).TrueFactorAt(27.3) - 0.04);
    }

    [Fact]
    public void Stuck_lot_has_high_residual_sugar_and_a_log_that_levels_off_above_zero()
    {
        // Given the stuck case
        var (lot, _) = Case(PlantedKind.StuckFerment);
        var log = lot.Log!;
        var last = log.Readings[^1];
        var dayBefore = log.Readings.Last(r => r.Timestamp <= last.Timestamp.AddHours(-48));

        // Then residual sugar is above 20 g/L (dry is ≤ 4 g/L, OIV), no dry date is recorded,
        // the last readings sit above 0.5 °Brix and moved less than 0.6 °Brix over the final two days
        Assert.True(lot.Recorded.ResidualSugarGl > 20);
        Assert.Null(lot.Recorded.DryDate);
        Assert.True(last.Sugar!.Value.Brix > 0.5, $"last reading {last.Sugar.Value.Brix}");
        Assert.True(Math.Abs(dayBefore.Sugar!.Value.Brix - last.Sugar.Value.Brix) < 0.6);
        Assert.True(log.Readings[0].Sugar!.Value.Brix - last.Sugar.Value.Brix > 15, "the ferment did most of its work before stalling");
    }

    [Fact]
    public void Under_read_lot_implies_more_than_the_Gay_Lussac_theoretical_yield()
    {
        // Given the under-read case
        var (lot, _) = Case(PlantedKind.UnderReadStartingSugar);

        // Then the recorded sugar is at least 2 °Brix under the truth and the implied yield passes 100 % of Gay-Lussac (0.5114 g/g)
        Assert.True(lot.Truth.StartingBrix - lot.Recorded.StartingSugar.Brix >= 2);
        Assert.True(Conv(lot).GayLussacEfficiency > 1.0, $"efficiency {Conv(lot).GayLussacEfficiency:0.000}");
    }

    [Fact]
    public void Overheated_lot_is_a_red_in_an_open_top_bin_whose_probe_log_passes_40_C()
    {
        // Given the overheated case
        var (lot, planted) = Case(PlantedKind.OverheatedFerment);
        double peak = lot.Log!.Readings.Max(r => r.TemperatureC!.Value);

        // Then it is probe-logged, red, in an open-top bin, and its log peaks above 40 °C (above 38 °C as the brief asks)
        Assert.True(lot.LogIsProbe);
        Assert.Equal(WineColour.Red, lot.Recorded.Colour);
        Assert.Equal("Open-top bin", lot.Recorded.Vessel);
        Assert.True(peak > 40.0, $"peak {peak}");
        Assert.Equal(peak, lot.Recorded.PeakFermentationTempC);
        Assert.Equal(peak, planted.RecordedValue);
    }

    [Fact]
    public void No_other_lot_gets_near_the_danger_temperature_or_stays_sweet()
    {
        // Given every lot that is not a planted case
        var clean = Demo.AllLots.Where(l => !PlantedKeys.Contains(l.Recorded.Key)).ToArray();

        // Then none peaks above 37 °C and none holds more than 4 g/L residual sugar (so flags on them would be false alarms)
        Assert.All(clean, l => Assert.True(l.Recorded.PeakFermentationTempC < 37, $"{l.Recorded.Key} peaks {l.Recorded.PeakFermentationTempC}"));
        Assert.All(clean, l => Assert.True(l.Recorded.ResidualSugarGl <= 4, $"{l.Recorded.Key} RS {l.Recorded.ResidualSugarGl}"));
    }

    [Fact]
    public void Mislabelled_lot_fits_its_true_strain_far_better_than_the_recorded_one()
    {
        // Given the mislabelled case
        var (lot, _) = Case(PlantedKind.MislabelledStrain);
        var conv = Conv(lot);
        double brix = conv.EffectiveStartingBrix;

        // Then the recorded strain differs from the real one, and the lot's factor is nearer the real strain's line
        Assert.NotEqual(lot.Truth.Strain, lot.Recorded.Strain);
        double toRecorded = Math.Abs(conv.AbvPerBrix - Catalog.Strain(lot.Recorded.Strain).TrueFactorAt(brix));
        double toTrue = Math.Abs(conv.AbvPerBrix - Catalog.Strain(lot.Truth.Strain).TrueFactorAt(brix));
        Assert.True(toRecorded > 0.025 && toTrue < 0.015, $"to recorded {toRecorded:0.000}, to true {toTrue:0.000}");
    }

    [Fact]
    public void Recorded_additions_corrected_by_the_mass_balance_land_on_the_true_effective_sugar()
    {
        // Given every lot with a recorded water or sugar addition (the controls among them)
        var added = Demo.AllLots.Where(l => l.Recorded.Additions.Any && !PlantedKeys.Contains(l.Recorded.Key)).ToArray();

        // Then there are water add-backs and chaptalizations, with the must volume recorded,
        // and Core's addition balance recovers the true effective sugar within the sampling and rounding error
        Assert.Contains(added, l => l.Recorded.Additions.WaterAddedL > 0);
        Assert.Contains(added, l => l.Recorded.Additions.SugarAddedKg > 0);
        Assert.All(added, l => Assert.NotNull(l.Recorded.Additions.MustVolumeL));
        Assert.All(added, l => Assert.InRange(Conv(l).EffectiveStartingBrix - l.Truth.EffectiveBrix, -1.4, 1.4));
        Assert.Equal(2, Demo.PlantedCases.Count(p => p.Kind == PlantedKind.RecordedAdditionControl));
    }

    [Fact]
    public void Clean_lots_recover_each_strains_true_sugar_per_percent_within_two_percent()
    {
        // Given clean, dry lots and the conversion measures Core computes from what was recorded
        var clean = Demo.AllLots.Where(l => !PlantedKeys.Contains(l.Recorded.Key)).ToArray();

        // When the median sugar_gl_per_abv of each strain is taken
        foreach (var strain in Demo.Strains)
        {
            var values = clean.Where(l => l.Recorded.Strain == strain.Code).Select(l => Conv(l).SugarGlPerAbv).Order().ToArray();
            double median = values[values.Length / 2];

            // Then it is within 2 % of the strain's true value (vessel losses of 0.2–1.2 % push it slightly up)
            Assert.InRange(median / strain.SugarGlPerAbv, 0.99, 1.02);
        }
    }

    [Fact]
    public void A_good_share_of_lots_have_logs_and_a_few_have_dense_probe_logs()
    {
        // Given the lots
        var all = Demo.AllLots.ToArray();
        var probes = all.Where(l => l.LogIsProbe).ToArray();

        // Then at least half have a log, and one lot per season has a probe log read every 15 minutes
        Assert.True(all.Count(l => l.Log is not null) >= all.Length / 2);
        Assert.Equal(3, probes.Length);
        foreach (var p in probes)
        {
            var gaps = p.Log!.Readings.Zip(p.Log.Readings.Skip(1), (a, b) => (b.Timestamp - a.Timestamp).TotalMinutes).Distinct().ToArray();
            Assert.Equal([15.0], gaps);
            Assert.True(p.Log.Readings.Count > 400);
        }
    }

    [Fact]
    public void Hand_read_logs_take_at_most_two_readings_a_day_in_time_order()
    {
        // Given the hand-read logs
        foreach (var lot in Demo.AllLots.Where(l => l.Log is not null && !l.LogIsProbe))
        {
            var times = lot.Log!.Readings.Select(r => r.Timestamp).ToArray();

            // Then readings are ascending, at most two a calendar day, and all after inoculation
            Assert.True(times.Zip(times.Skip(1), (a, b) => b > a).All(x => x), lot.Recorded.Key.ToString());
            Assert.True(times.GroupBy(t => t.Date).All(g => g.Count() <= 2), lot.Recorded.Key.ToString());
            Assert.True(times[0] > lot.Recorded.InoculationDate, lot.Recorded.Key.ToString());
        }
    }

    [Fact]
    public void Probe_logs_cross_midnight_and_the_end_of_September()
    {
        // Given the probe logs
        foreach (var lot in Demo.AllLots.Where(l => l.LogIsProbe))
        {
            var times = lot.Log!.Readings.Select(r => r.Timestamp).ToArray();

            // Then each holds readings on 30 September and on 1 October, including the 23:45 → 00:00 step
            int year = lot.Recorded.Season;
            Assert.Contains(times, t => t == new DateTime(year, 9, 30, 23, 45, 0));
            Assert.Contains(times, t => t == new DateTime(year, 10, 1, 0, 0, 0));
        }
    }

    [Fact]
    public void A_scale_scenario_without_planted_cases_makes_the_asked_number_of_lots()
    {
        // Given options for ten seasons of 400 lots, a third logged, no planted cases
        var seasons = Enumerable.Range(2016, 10)
            .Select(y => new SeasonProfile(y, 400, 24.5, 22.0, new DateTime(y, 9, 5), 50, SugarScale.Brix, SeasonFileFormat.SemicolonCsv))
            .ToArray();
        var options = new ScenarioOptions { Seed = 5, Seasons = seasons, LogShare = 0.33, ProbeLotsPerSeason = 0, PlantCases = false };

        // When generated
        var s = ScenarioGenerator.Generate(options);

        // Then 4,000 lots exist with ids like "16-001", no planted case, and about a third have logs
        Assert.Equal(4000, s.AllLots.Count());
        Assert.Empty(s.PlantedCases);
        Assert.Equal("16-001", s.Seasons[0].Lots[0].Recorded.LotId);
        Assert.InRange(s.AllLots.Count(l => l.Log is not null), 1200, 1440);
    }

    private static (GeneratedLot Lot, PlantedCase Case) Case(PlantedKind kind)
    {
        var p = Demo.PlantedCases.Single(c => c.Kind == kind);
        return (Demo.AllLots.Single(l => l.Recorded.Key == p.Key), p);
    }

    private static LotConversion Conv(GeneratedLot lot) => ConversionFactors.For(lot.Recorded, SugarModel.Default);
}
