using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Scenario;

/// <summary>
/// Makes the invented scenario: seasons of lots with the truth behind them, fermentation logs, and planted cases.
/// Deterministic: the same options give the same lots, digit for digit. No clock is read.
/// </summary>
public static partial class ScenarioGenerator
{
    /// <summary>Hand-read log slots: morning and evening rounds, local time.</summary>
    private static readonly TimeSpan[] Rounds = [new(7, 30, 0), new(17, 30, 0)];

    /// <summary>The demo scenario (three seasons, planted cases).</summary>
    public static ScenarioData Demo() => Generate(ScenarioOptions.Demo);

    /// <summary>Generates a scenario.</summary>
    public static ScenarioData Generate(ScenarioOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        var root = new ScenarioRandom(options.Seed);
        var plans = new List<List<LotPlan>>();
        foreach (var season in options.Seasons)
        {
            plans.Add(PlanSeason(season, root.Fork($"season-{season.Year}"), options));
        }

        var planted = new List<(PlantedKind Kind, LotPlan Plan)>();
        if (options.PlantCases)
        {
            planted.AddRange(Plant(plans));
        }

        var seasons = new List<GeneratedSeason>();
        for (int s = 0; s < options.Seasons.Count; s++)
        {
            seasons.Add(new GeneratedSeason(options.Seasons[s], plans[s].Select(Simulate).ToArray()));
        }

        var byKey = seasons.SelectMany(s => s.Lots).ToDictionary(l => l.Recorded.Key);
        var cases = planted.Select(p => Describe(p.Kind, byKey[new LotKey(p.Plan.Season.Year, p.Plan.LotId)])).ToArray();
        return new ScenarioData
        {
            EstateName = Catalog.EstateName,
            Seed = options.Seed,
            Seasons = seasons,
            Strains = Catalog.Strains,
            Vessels = Catalog.Vessels,
            PlantedCases = cases,
            Running = options.RunningHarvest ? HarvestInProgress(root.Fork("harvest-in-progress")) : null,
        };
    }

    private static List<LotPlan> PlanSeason(SeasonProfile season, ScenarioRandom rng, ScenarioOptions options)
    {
        int n = season.LotCount;
        int width = Math.Max(3, n.ToString(CultureInfo.InvariantCulture).Length);
        var offsets = Enumerable.Range(0, n).Select(_ => rng.Uniform(0, season.HarvestDays)).Order().ToArray();
        var plans = new List<LotPlan>(n);
        for (int i = 0; i < n; i++)
        {
            var colour = rng.Pick<WineColour>([(WineColour.Red, 0.6), (WineColour.White, 0.33), (WineColour.Rose, 0.07)]);
            var variety = colour switch
            {
                WineColour.Red => rng.Pick<VarietyProfile>([(V("Cabernet Sauvignon", WineColour.Red), 0.3), (V("Merlot", WineColour.Red), 0.2), (V("Syrah", WineColour.Red), 0.2), (V("Pinot Noir", WineColour.Red), 0.2), (V("Grenache", WineColour.Red), 0.1)]),
                WineColour.White => rng.Pick<VarietyProfile>([(V("Chardonnay", WineColour.White), 0.45), (V("Sauvignon Blanc", WineColour.White), 0.35), (V("Riesling", WineColour.White), 0.2)]),
                _ => V("Grenache", WineColour.Rose),
            };
            double mean = (colour == WineColour.Red ? season.RedMeanBrix : season.WhiteMeanBrix) + variety.MeanBrixOffset;
            double brix = rng.TruncatedNormal(mean, 1.1, 17.5, 29.5);
            var vessel = colour switch
            {
                WineColour.Red => rng.Pick<VesselProfile>([(Vessels("Open-top bin", 1000), 0.4), (Vessels("Stainless tank", 5000), 0.25), (Vessels("Stainless tank", 10000), 0.2), (Vessels("Concrete egg", 1600), 0.15)]),
                WineColour.White => rng.Pick<VesselProfile>([(Vessels("Stainless tank", 10000), 0.25), (Vessels("Stainless tank", 5000), 0.2), (Vessels("Stainless tank", 2000), 0.15), (Vessels("Barrel", 225), 0.25), (Vessels("Puncheon", 500), 0.1), (Vessels("Concrete egg", 1600), 0.05)]),
                _ => rng.Pick<VesselProfile>([(Vessels("Stainless tank", 5000), 0.6), (Vessels("Stainless tank", 2000), 0.4)]),
            };
            string strain = variety.Name switch
            {
                "Pinot Noir" => rng.Pick<string>([("YB-N05", 0.5), ("YB-R12", 0.4), ("YB-R31", 0.1)]),
                _ when colour == WineColour.Red && brix >= 25.5 => rng.Pick<string>([("YB-R31", 0.55), ("YB-R12", 0.3), ("YB-N05", 0.15)]),
                _ when colour == WineColour.Red => rng.Pick<string>([("YB-R12", 0.5), ("YB-N05", 0.3), ("YB-R31", 0.2)]),
                "Chardonnay" => rng.Pick<string>([("YB-W22", 0.7), ("YB-W07", 0.3)]),
                "Sauvignon Blanc" => rng.Pick<string>([("YB-W22", 0.5), ("YB-W07", 0.5)]),
                "Riesling" => rng.Pick<string>([("YB-W07", 0.8), ("YB-W22", 0.2)]),
                _ => rng.Pick<string>([("YB-W07", 0.7), ("YB-W22", 0.3)]),
            };
            var start = season.FirstInoculation.AddDays(Math.Floor(offsets[i])).AddMinutes(9 * 60 + rng.Next(0, 8 * 60));
            double volume = RoundTo(vessel.CapacityL * rng.Uniform(vessel.FillMin, vessel.FillMax), vessel.CapacityL < 1000 ? 5 : 10);
            var plan = new LotPlan
            {
                Season = season,
                LotId = string.Create(CultureInfo.InvariantCulture, $"{season.Year % 100:00}-{(i + 1).ToString(new string('0', width), CultureInfo.InvariantCulture)}"),
                Seed = rng.NextUInt64(),
                Colour = colour,
                Variety = variety,
                Block = variety.Blocks[rng.Next(0, variety.Blocks.Count)],
                Vessel = vessel,
                Strain = strain,
                RecordedStrain = strain,
                TrueBrix = brix,
                MustVolumeL = volume,
                Inoculated = start,
                LogKind = rng.Chance(options.LogShare) ? LogKind.HandRead : LogKind.None,
            };

            // Cellar practice of the invented estate: add water back to very ripe reds, chaptalize thin whites and Pinot.
            if (colour == WineColour.Red && brix > 26.0 && rng.Chance(0.6))
            {
                double target = rng.Uniform(24.6, 25.2);
                plan.RecordedWaterL = RoundTo(ScenarioChemistry.WaterForTarget(brix, volume, target), 5);
            }
            else if ((colour != WineColour.Red || variety.Name == "Pinot Noir") && brix < 20.8 && rng.Chance(0.7))
            {
                plan.RecordedSugarKg = RoundTo(ScenarioChemistry.SucroseForTarget(brix, volume, rng.Uniform(21.6, 22.2)), 0.5);
            }

            plans.Add(plan);
        }

        // Probe lots: the one inoculated nearest 27 September (so its record crosses the month end), then spread out.
        var anchor = new DateTime(season.Year, 9, 27, 12, 0, 0);
        foreach (var p in plans.OrderBy(p => Math.Abs((p.Inoculated - anchor).TotalHours)).ThenBy(p => p.LotId, StringComparer.Ordinal).Take(options.ProbeLotsPerSeason))
        {
            p.LogKind = LogKind.Probe;
        }

        return plans;
    }

    /// <summary>Places the demo's planted cases on lots chosen by rule, then fixes the numbers that make each one.</summary>
    private static IEnumerable<(PlantedKind, LotPlan)> Plant(List<List<LotPlan>> seasons)
    {
        List<LotPlan> Season(int year) => seasons.FirstOrDefault(s => s.Count > 0 && s[0].Season.Year == year)
            ?? throw new InvalidOperationException($"Planted cases need season {year}; turn PlantCases off for other seasons.");
        var used = new HashSet<LotPlan>();
        LotPlan Choose(int year, Func<LotPlan, bool> rule)
        {
            var s = Season(year);
            var plan = s.Skip(s.Count / 5).FirstOrDefault(p => !used.Contains(p) && p.PlainRecord && rule(p))
                ?? throw new InvalidOperationException($"No lot in {year} fits a planted case; change the seed.");
            used.Add(plan);
            return plan;
        }

        // 2023: transposed digits (24.7 written 27.4).
        var transposed = Choose(2023, p => p.Colour == WineColour.Red && p.Vessel.Type == "Stainless tank" && p.Strain == "YB-R12");
        transposed.TrueBrix = 24.7;
        transposed.ExactRecordedBrix = 27.4;
        transposed.LogKind = LogKind.None;
        yield return (PlantedKind.TransposedDigits, transposed);

        // 2023: water added back to a very ripe red but never written down.
        var water = Choose(2023, p => p.Colour == WineColour.Red && p.Vessel.Type == "Stainless tank" && p.Strain is "YB-R12" or "YB-R31");
        water.TrueBrix = 27.3;
        water.ExactRecordedBrix = 27.3;
        water.UnrecordedWaterL = RoundTo(ScenarioChemistry.WaterForTarget(27.3, water.MustVolumeL, 24.5), 5);
        water.LogKind = LogKind.HandRead;
        yield return (PlantedKind.UnrecordedWater, water);

        // 2023: cooling failed on a warm, fast red in an open-top bin; the probe saw it.
        var hot = Season(2023).First(p => p.LogKind == LogKind.Probe);
        used.Add(hot);
        hot.Colour = WineColour.Red;
        hot.Variety = V("Syrah", WineColour.Red);
        hot.Block = "Old Quarry";
        hot.Vessel = Vessels("Open-top bin", 1000);
        hot.MustVolumeL = 700;
        hot.Strain = hot.RecordedStrain = "YB-R31";
        hot.TrueBrix = 25.8;
        hot.RecordedWaterL = null;
        hot.RecordedSugarKg = null;
        hot.ForcedPeakC = 40.8;
        hot.ForcedResidualGl = 3.6;
        hot.Note = "Chiller plate failed overnight";
        yield return (PlantedKind.OverheatedFerment, hot);

        // Controls: a recorded add-back (2023) and a recorded chaptalization (2024) the tool must correct, not flag.
        var addBack = Season(2023).FirstOrDefault(p => !used.Contains(p) && p.RecordedWaterL is > 0);
        if (addBack is not null)
        {
            used.Add(addBack);
            yield return (PlantedKind.RecordedAdditionControl, addBack);
        }

        var chaptalized = Season(2024).FirstOrDefault(p => !used.Contains(p) && p.RecordedSugarKg is > 0);
        if (chaptalized is not null)
        {
            used.Add(chaptalized);
            yield return (PlantedKind.RecordedAdditionControl, chaptalized);
        }

        // 2024: a fast red strain's lot recorded under the slow red strain's code.
        var mislabel = Choose(2024, p => p.Colour == WineColour.Red && p.Strain == "YB-R31" && p.Vessel.Type != "Open-top bin");
        mislabel.TrueBrix = 24.4;
        mislabel.RecordedStrain = "YB-N05";
        mislabel.LogKind = LogKind.HandRead;
        yield return (PlantedKind.MislabelledStrain, mislabel);

        // 2024: a cold barrel Chardonnay on low nitrogen that stopped with sugar left.
        var stuck = Choose(2024, p => p.Colour == WineColour.White && p.Vessel.Type is "Barrel" or "Puncheon" or "Stainless tank");
        stuck.Variety = V("Chardonnay", WineColour.White);
        stuck.Strain = stuck.RecordedStrain = "YB-W22";
        stuck.TrueBrix = 22.6;
        stuck.RecordedSugarKg = null;
        stuck.RecordedWaterL = null;
        stuck.ForcedYan = 96;
        stuck.StuckAtBrix = 1.4;
        stuck.ForcedResidualGl = 31.4;
        stuck.LogKind = LogKind.HandRead;
        stuck.Note = "Slowed at the end; barrel room warmed";
        yield return (PlantedKind.StuckFerment, stuck);

        // 2025: a red sampled at the crush pad before the skins gave up their sugar.
        var underRead = Choose(2025, p => p.Colour == WineColour.Red && p.Vessel.Type == "Open-top bin" && p.Strain == "YB-R12");
        underRead.TrueBrix = 24.9;
        underRead.ExactRecordedBrix = 22.3;
        underRead.Note = "Brix from the crush-pad sample";
        underRead.LogKind = LogKind.HandRead;
        yield return (PlantedKind.UnderReadStartingSugar, underRead);
    }

    private static PlantedCase Describe(PlantedKind kind, GeneratedLot lot)
    {
        var r = lot.Recorded;
        var t = lot.Truth;
        double recordedBrix = lot.RecordedScale == SugarScale.SpecificGravity ? ScenarioChemistry.BrixFromSpecificGravity(lot.RecordedStartingValue) : lot.RecordedStartingValue;
        double recordedFactor = r.FinalAlcohol.PercentVolume / recordedBrix;
        return kind switch
        {
            // The swap crosses the decimal point (24.7 written 27.4), which possible-transposed-digits does not offer (another
            // number, not a slip of two keys): the review finds the lot low and explains it as likely unrecorded water.
            PlantedKind.TransposedDigits => new(kind, r.Season, r.LotId, ["low-factor", "possible-unrecorded-water"],
                $"starting sugar written {Fmt(recordedBrix)} °Brix for {Fmt(t.StartingBrix)}, the digits either side of the point swapped; abv_per_brix reads {Fmt(recordedFactor, 3)} against the strain's {Fmt(Catalog.Strain(t.Strain).TrueFactorAt(t.StartingBrix), 3)}",
                "starting sugar, °Brix", recordedBrix, t.StartingBrix),
            PlantedKind.UnrecordedWater => new(kind, r.Season, r.LotId, ["possible-unrecorded-water", "low-factor"],
                $"{Fmt(t.WaterAddedL, 0)} L of water added to {Fmt(r.Additions.MustVolumeL ?? 0, 0)} L of must was not recorded; the must really fermented from {Fmt(t.EffectiveBrix)} °Brix, not {Fmt(recordedBrix)}; abv_per_brix reads {Fmt(recordedFactor, 3)}",
                "effective starting sugar, °Brix", recordedBrix, t.EffectiveBrix),
            PlantedKind.OverheatedFerment => new(kind, r.Season, r.LotId, [],
                $"probe log peaks at {Fmt(lot.Log!.Readings.Max(x => x.TemperatureC ?? double.MinValue), 1)} °C, above the red danger threshold of 40 °C (recorded peak {Fmt(r.PeakFermentationTempC ?? 0, 1)} °C)",
                "peak temperature, °C", r.PeakFermentationTempC ?? double.NaN, t.PeakTempC) { ExpectedKineticsCodes = ["above-danger-temp"] },
            PlantedKind.MislabelledStrain => new(kind, r.Season, r.LotId, ["possible-strain-mix-up", "high-factor", "off-strain-line"],
                $"recorded as {r.Strain} but fermented by {t.Strain}; abv_per_brix {Fmt(recordedFactor, 3)} against {r.Strain}'s {Fmt(Catalog.Strain(r.Strain).TrueFactorAt(t.StartingBrix), 3)} and {t.Strain}'s {Fmt(Catalog.Strain(t.Strain).TrueFactorAt(t.StartingBrix), 3)}",
                "true conversion factor, % v/v per °Brix", Catalog.Strain(r.Strain).TrueFactorAt(t.StartingBrix), Catalog.Strain(t.Strain).TrueFactorAt(t.StartingBrix)),
            PlantedKind.StuckFerment => new(kind, r.Season, r.LotId, ["not-dry"],
                $"the ferment levelled off near {Fmt(t.FinalBrix)} °Brix and residual sugar is {Fmt(r.ResidualSugarGl ?? 0)} g/L; the log shows the stall (sluggish then stuck)",
                "residual sugar, g/L", r.ResidualSugarGl ?? double.NaN, t.ResidualSugarGl) { ExpectedKineticsCodes = ["stuck"] },
            PlantedKind.UnderReadStartingSugar => new(kind, r.Season, r.LotId, ["high-factor", "above-theoretical-yield"],
                $"starting sugar sampled before soak-up reads {Fmt(recordedBrix)} °Brix; the must was {Fmt(t.StartingBrix)}; abv_per_brix reads {Fmt(recordedFactor, 3)}",
                "starting sugar, °Brix", recordedBrix, t.StartingBrix),
            PlantedKind.RecordedAdditionControl => new(kind, r.Season, r.LotId, [],
                r.Additions.WaterAddedL is > 0
                    ? $"{Fmt(r.Additions.WaterAddedL ?? 0, 0)} L of water recorded on {Fmt(r.Additions.MustVolumeL ?? 0, 0)} L of must: the effective starting sugar is {Fmt(t.EffectiveBrix)} °Brix, not {Fmt(recordedBrix)}; no flag expected once corrected"
                    : $"{Fmt(r.Additions.SugarAddedKg ?? 0)} kg of sucrose recorded on {Fmt(r.Additions.MustVolumeL ?? 0, 0)} L of must: the effective starting sugar is {Fmt(t.EffectiveBrix)} °Brix, not {Fmt(recordedBrix)}; no flag expected once corrected",
                "effective starting sugar, °Brix", recordedBrix, t.EffectiveBrix),
            _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "Unknown planted kind."),
        };
    }

    private static GeneratedLot Simulate(LotPlan p)
    {
        var rng = new ScenarioRandom(p.Seed);
        var strain = Catalog.Strain(p.Strain);
        bool red = p.Colour == WineColour.Red;
        bool cool = p.Season.WhiteMeanBrix < 21.5;

        // Chemistry of the must.
        double yan = p.ForcedYan ?? Math.Round(rng.TruncatedNormal(215, 55, 80, 420));
        double ph = Math.Round(red ? rng.TruncatedNormal(cool ? 3.52 : 3.6, 0.12, 3.2, 4.0) : rng.TruncatedNormal(cool ? 3.22 : 3.28, 0.09, 2.95, 3.6), 2);
        double ta = Math.Round(red ? rng.TruncatedNormal(cool ? 6.4 : 5.8, 0.6, 4.2, 8.5) : rng.TruncatedNormal(cool ? 7.8 : 7.1, 0.8, 5.0, 10.5), 1);

        // Additions and the effective sugar the yeast really saw.
        double recordedWater = p.RecordedWaterL ?? 0, sugar = p.RecordedSugarKg ?? 0;
        double trueWater = recordedWater + p.UnrecordedWaterL;
        var effective = ScenarioChemistry.BrixAfterAdditions(p.TrueBrix, p.MustVolumeL, trueWater, sugar);

        // Temperatures and kinetics (Zwietering modified Gompertz of °Brix consumed).
        double basePeak = (red ? p.Vessel.RedPeakC : p.Vessel.WhitePeakC) + strain.HeatRiseC;
        double peak = p.ForcedPeakC ?? (basePeak + rng.Normal(0, 1.0));
        double drawnStart = red ? rng.TruncatedNormal(19, 1.2, 15, 23) : rng.TruncatedNormal(13, 0.8, 10, 15.5);
        double startTemp = p.ForcedStartC ?? drawnStart;
        double lag = strain.LagHours * Math.Exp(rng.Normal(0, 0.2)) * (yan < 150 ? 1.3 : 1.0);
        double rate = strain.MaxRateBrixPerHourAt25C * Math.Exp(0.07 * (Math.Min(peak, 34) - 25))
            * Math.Clamp(Math.Pow(yan / 220.0, 0.35), 0.6, 1.25) * Math.Exp(rng.Normal(0, 0.12));
        double finalBrix = p.StuckAtBrix ?? rng.Uniform(-2.1, -1.5);
        double amount = effective - finalBrix;
        double? hoursToZero = p.StuckAtBrix is null ? GompertzTimeTo(amount, rate, lag, effective) : null;

        // Residual sugar and alcohol: sugar consumed ÷ the strain's sugar per % v/v, less vessel and heat losses.
        double rs = p.ForcedResidualGl ?? (0.8 + (2.4 * Math.Pow(rng.NextDouble(), 2)));
        double heatLoss = 0.004 * Math.Max(0, peak - 32);
        double sugarGl = ScenarioChemistry.SugarAfterAdditions(p.TrueBrix, p.MustVolumeL, trueWater, sugar);
        double abv = (sugarGl - rs) / strain.SugarGlPerAbv * (1 - p.Vessel.EthanolLossShare) * (1 - heatLoss);
        double labAbv = Math.Round(abv + rng.Normal(0, 0.07), 2);
        double labRs = Math.Round(Math.Max(0.3, rs + rng.Normal(0, 0.15)), 1);

        // The starting sugar as sampled and written down.
        double sampled = p.ExactRecordedBrix ?? (p.TrueBrix + rng.Normal(0, p.Vessel.SamplingSdBrix));
        double recordedValue;
        SugarReading recordedSugar;
        if (p.Season.Scale == SugarScale.SpecificGravity)
        {
            recordedValue = Math.Round(ScenarioChemistry.SpecificGravityFromBrix(sampled), 3);
            recordedSugar = SugarReading.FromSpecificGravity(recordedValue);
        }
        else
        {
            recordedValue = Math.Round(sampled, 1);
            recordedSugar = SugarReading.FromBrix(recordedValue);
        }

        var truth = new LotTruth
        {
            Strain = p.Strain,
            StartingBrix = p.TrueBrix,
            EffectiveBrix = effective,
            WaterAddedL = trueWater,
            SugarAddedKg = sugar,
            ResidualSugarGl = rs,
            Abv = abv,
            LagHours = lag,
            MaxRateBrixPerHour = rate,
            FinalBrix = finalBrix,
            StartTempC = startTemp,
            PeakTempC = peak,
            HoursToZeroBrix = hoursToZero,
        };

        var (log, logValues) = p.LogKind == LogKind.None ? (null, null) : MakeLog(p, truth, rng.Fork("log"));
        double recordedPeak = log is not null
            ? log.Readings.Max(r => r.TemperatureC ?? double.MinValue)
            : Math.Round(peak + rng.Normal(0, 0.3), 1);
        DateTime? dry = hoursToZero is { } h ? p.Inoculated.AddHours(h).Date.AddDays(rng.Next(1, 3)) : null;

        var lot = new Lot
        {
            LotId = p.LotId,
            Season = p.Season.Year,
            Strain = p.RecordedStrain,
            StartingSugar = recordedSugar,
            RecordedStartingSugar = new RecordedSugar(recordedValue, p.Season.Scale),
            FinalAlcohol = AlcoholContent.FromPercentVolume(labAbv),
            Vessel = p.Vessel.Type,
            VesselCapacityL = p.Vessel.CapacityL,
            Variety = p.Variety.Name,
            Block = p.Block,
            Colour = p.Colour,
            Additions = new Additions(p.MustVolumeL, p.RecordedWaterL, p.RecordedSugarKg),
            ResidualSugarGl = labRs,
            YanMgL = yan,
            Ph = ph,
            TaGl = ta,
            PeakFermentationTempC = recordedPeak,
            InoculationDate = p.Inoculated,
            DryDate = dry,
            Notes = p.Note ?? RoutineNote(p, rng),
        };
        return new GeneratedLot
        {
            Recorded = lot,
            RecordedStartingValue = recordedValue,
            RecordedScale = p.Season.Scale,
            Truth = truth,
            Log = log,
            LogRecordedSugar = logValues,
            LogIsProbe = p.LogKind == LogKind.Probe,
        };
    }

    private static (FermentationLog Log, IReadOnlyList<double> Values) MakeLog(LotPlan p, LotTruth t, ScenarioRandom rng)
    {
        var values = new List<double>();
        double amount = t.EffectiveBrix - t.FinalBrix;
        double end = (t.HoursToZeroBrix ?? (GompertzTimeTo(amount, t.MaxRateBrixPerHour, t.LagHours, t.EffectiveBrix - t.FinalBrix - 0.2) + 120)) + 36;
        var readings = new List<LogReading>();
        bool sg = p.Season.Scale == SugarScale.SpecificGravity;
        if (p.LogKind == LogKind.Probe)
        {
            // A probe records on the quarter hour from the first quarter after inoculation.
            var first = new DateTime(p.Inoculated.Year, p.Inoculated.Month, p.Inoculated.Day, p.Inoculated.Hour, 0, 0).AddMinutes(15 * ((p.Inoculated.Minute / 15) + 1));
            for (var at = first; (at - p.Inoculated).TotalHours <= end; at = at.AddMinutes(15))
            {
                double hours = (at - p.Inoculated).TotalHours;
                double brix = Math.Round(BrixAt(t, hours) + rng.Normal(0, 0.03), 2);
                double temp = Math.Round(TempAt(t, hours) + rng.Normal(0, 0.08), 1);
                readings.Add(new LogReading(at, SugarReading.FromBrix(brix), temp));
                values.Add(brix);
            }
        }
        else
        {
            var day = p.Inoculated.Date;
            for (int d = 0; ; d++)
            {
                bool done = false;
                foreach (var round in Rounds)
                {
                    var at = day.AddDays(d).Add(round).AddMinutes(rng.Next(-12, 13));
                    double hours = (at - p.Inoculated).TotalHours;
                    if (hours < 1)
                    {
                        continue;
                    }

                    if (hours > end)
                    {
                        done = true;
                        break;
                    }

                    // Missed rounds happen; the first reading after inoculation is always taken.
                    if (readings.Count > 0 && rng.Chance(0.03))
                    {
                        continue;
                    }

                    double brix = BrixAt(t, hours) + rng.Normal(0, 0.15);
                    double value = sg ? Math.Round(ScenarioChemistry.SpecificGravityFromBrix(brix), 3) : Math.Round(brix, 1);
                    var reading = sg ? SugarReading.FromSpecificGravity(value) : SugarReading.FromBrix(value);
                    values.Add(value);
                    double temp = Math.Round(TempAt(t, hours) + rng.Normal(0, 0.25), 1);
                    readings.Add(new LogReading(at, reading, temp));
                }

                if (done)
                {
                    break;
                }
            }
        }

        return (new FermentationLog(p.LotId, p.Season.Year, readings), values);
    }

    /// <summary>°Brix on the Zwietering modified Gompertz curve at <paramref name="hours"/> after inoculation.</summary>
    internal static double BrixAt(LotTruth t, double hours)
    {
        double a = t.EffectiveBrix - t.FinalBrix;
        return t.EffectiveBrix - Gompertz(a, t.MaxRateBrixPerHour, t.LagHours, hours);
    }

    /// <summary>Must temperature: rises with the consumption rate (a few hours behind it) from the starting temperature to the peak.</summary>
    internal static double TempAt(LotTruth t, double hours)
    {
        double a = t.EffectiveBrix - t.FinalBrix;
        double lagged = Math.Max(0, hours - 4);
        double share = GompertzRate(a, t.MaxRateBrixPerHour, t.LagHours, lagged) / t.MaxRateBrixPerHour;
        return t.StartTempC + ((t.PeakTempC - t.StartTempC) * share);
    }

    /// <summary>Zwietering et al. (1990) modified Gompertz: y = A·exp{−exp[μm·e/A·(λ − t) + 1]}.</summary>
    internal static double Gompertz(double a, double mu, double lambda, double t) =>
        a * Math.Exp(-Math.Exp((mu * Math.E / a * (lambda - t)) + 1));

    private static double GompertzRate(double a, double mu, double lambda, double t)
    {
        double z = (mu * Math.E / a * (lambda - t)) + 1;
        return a * Math.Exp(-Math.Exp(z)) * Math.Exp(z) * mu * Math.E / a;
    }

    /// <summary>Hours until <paramref name="consumed"/> °Brix of <paramref name="a"/> are gone (closed-form inverse of the Gompertz).</summary>
    private static double GompertzTimeTo(double a, double mu, double lambda, double consumed)
    {
        double share = Math.Clamp(consumed / a, 1e-9, 1 - 1e-9);
        return lambda - ((Math.Log(-Math.Log(share)) - 1) * a / (mu * Math.E));
    }

    private static string? RoutineNote(LotPlan p, ScenarioRandom rng)
    {
        if (p.RecordedWaterL is > 0)
        {
            return "Water add-back after crush";
        }

        if (p.RecordedSugarKg is > 0)
        {
            return "Chaptalized before inoculation";
        }

        string[] red = ["Punch-downs twice daily", "Pump-overs", "Cold soak 3 days", "", "", "Whole berries, some stems"];
        string[] white = ["Settled overnight", "Nutrient at one-third depletion", "", "", "Lees stirred weekly"];
        var options = p.Colour == WineColour.Red ? red : white;
        string note = options[rng.Next(0, options.Length)];
        return note.Length == 0 ? null : note;
    }

    private static VarietyProfile V(string name, WineColour colour) =>
        Catalog.Varieties.First(v => v.Name == name && v.Colour == colour);

    private static VesselProfile Vessels(string type, double capacity) =>
        Catalog.Vessels.First(v => v.Type == type && v.CapacityL == capacity);

    private static double RoundTo(double value, double step) => Math.Round(value / step) * step;

    private static string Fmt(double v, int decimals = 1) => v.ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);

    private enum LogKind
    {
        None,
        HandRead,
        Probe,
    }

    private sealed class LotPlan
    {
        public required SeasonProfile Season { get; init; }

        public required string LotId { get; init; }

        public required ulong Seed { get; init; }

        public required WineColour Colour { get; set; }

        public required VarietyProfile Variety { get; set; }

        public required string Block { get; set; }

        public required VesselProfile Vessel { get; set; }

        public required string Strain { get; set; }

        public required string RecordedStrain { get; set; }

        public required double TrueBrix { get; set; }

        public required double MustVolumeL { get; set; }

        public required DateTime Inoculated { get; init; }

        public required LogKind LogKind { get; set; }

        public double? RecordedWaterL { get; set; }

        public double? RecordedSugarKg { get; set; }

        public double UnrecordedWaterL { get; set; }

        public double? ExactRecordedBrix { get; set; }

        public double? ForcedPeakC { get; set; }

        public double? ForcedStartC { get; set; }

        public double? ForcedResidualGl { get; set; }

        public double? ForcedYan { get; set; }

        public double? StuckAtBrix { get; set; }

        public string? Note { get; set; }

        /// <summary>True while the lot has no recorded addition and no log kind forced, so a planted case can take it.</summary>
        public bool PlainRecord => RecordedWaterL is null && RecordedSugarKg is null && LogKind != LogKind.Probe;
    }
}
