using YieldBench.Core.Lots;

namespace YieldBench.Scenario;

/// <summary>One lot of the harvest in progress: the row the cellar keeps, the truth, the log so far and the whole log to come.</summary>
/// <param name="Recorded">The running lot as the cellar records it (no final analysis).</param>
/// <param name="Truth">What really drives it.</param>
/// <param name="Log">Its readings up to <see cref="HarvestInProgress.Now"/>.</param>
/// <param name="LogRecordedSugar">The log's sugar readings as written (°Brix to one decimal), in reading order.</param>
/// <param name="WholeLog">Every reading the lot will get, now and later (what a forecast is judged against).</param>
/// <param name="Story">What is planted in the lot, or null for an ordinary one.</param>
public sealed record RunningGeneratedLot(RunningLot Recorded, LotTruth Truth, FermentationLog Log, IReadOnlyList<double> LogRecordedSugar, FermentationLog WholeLog, string? Story);

/// <summary>The next season of the invented estate, caught mid-harvest: lots still fermenting and their logs so far.</summary>
/// <param name="Season">The season.</param>
/// <param name="Now">The moment the logs stop: the evening round of the last day.</param>
/// <param name="Lots">The running lots in lot-id order.</param>
public sealed record HarvestInProgress(int Season, DateTime Now, IReadOnlyList<RunningGeneratedLot> Lots);

/// <summary>The harvest in progress of the demo scenario.</summary>
public static partial class ScenarioGenerator
{
    /// <summary>The season of the harvest in progress.</summary>
    public const int RunningSeason = 2026;

    /// <summary>The moment the running logs stop: after the evening round of 18 September 2026.</summary>
    public static readonly DateTime RunningNow = new(2026, 9, 18, 18, 0, 0);

    // Ten lots at 2 to 8 readings: each row is (lot, strain, colour, variety, vessel type, capacity, true °Brix, inoculated).
    private static readonly (string Lot, string Strain, WineColour Colour, string Variety, string Vessel, double Capacity, double Brix, DateTime Inoculated)[] RunningPlan =
    [
        ("26-001", "YB-R12", WineColour.Red, "Cabernet Sauvignon", "Stainless tank", 5000, 25.1, new(2026, 9, 15, 6, 10, 0)),
        ("26-002", "YB-R31", WineColour.Red, "Syrah", "Open-top bin", 1000, 26.4, new(2026, 9, 15, 16, 0, 0)),
        ("26-003", "YB-W22", WineColour.White, "Chardonnay", "Stainless tank", 10000, 22.6, new(2026, 9, 16, 6, 30, 0)),
        ("26-004", "YB-N05", WineColour.Red, "Pinot Noir", "Concrete egg", 1600, 23.8, new(2026, 9, 16, 15, 0, 0)),
        ("26-005", "YB-R12", WineColour.Red, "Grenache", "Open-top bin", 1000, 27.6, new(2026, 9, 15, 6, 40, 0)),
        ("26-006", "YB-R31", WineColour.Red, "Cabernet Sauvignon", "Stainless tank", 10000, 26.8, new(2026, 9, 17, 6, 0, 0)),
        ("26-007", "YB-W07", WineColour.White, "Riesling", "Barrel", 225, 21.8, new(2026, 9, 17, 6, 15, 0)),
        ("26-008", "YB-W22", WineColour.White, "Sauvignon Blanc", "Puncheon", 500, 22.0, new(2026, 9, 17, 14, 30, 0)),
        ("26-009", "YB-R44", WineColour.Red, "Merlot", "Concrete egg", 1600, 24.6, new(2026, 9, 17, 15, 0, 0)),
        ("26-010", "YB-W07", WineColour.Rose, "Grenache", "Stainless tank", 2000, 21.4, new(2026, 9, 18, 6, 0, 0)),
    ];

    private static HarvestInProgress HarvestInProgress(ScenarioRandom rng)
    {
        var season = new SeasonProfile(RunningSeason, RunningPlan.Length, 24.8, 22.2, new DateTime(2026, 9, 15), 4, Core.Units.SugarScale.Brix, SeasonFileFormat.Workbook);
        var lots = new List<RunningGeneratedLot>();
        foreach (var (id, strain, colour, variety, vessel, capacity, brix, inoculated) in RunningPlan)
        {
            var vesselProfile = Vessels(vessel, capacity);
            var plan = new LotPlan
            {
                Season = season,
                LotId = id,
                Seed = rng.NextUInt64(),
                Colour = colour,
                Variety = V(variety, colour),
                Block = V(variety, colour).Blocks[0],
                Vessel = vesselProfile,
                Strain = strain,
                RecordedStrain = strain,
                TrueBrix = brix,
                MustVolumeL = RoundTo(capacity * ((vesselProfile.FillMin + vesselProfile.FillMax) / 2), capacity < 1000 ? 5 : 10),
                Inoculated = inoculated,
                LogKind = LogKind.HandRead,
            };
            string? story = null;
            switch (id)
            {
                case "26-005":
                    // Very ripe Grenache on little nitrogen: heading for a stuck end well short of dry.
                    plan.ForcedYan = 88;
                    plan.StuckAtBrix = 8.0;
                    plan.Note = "Low YAN at crush; no nutrient added yet";
                    story = "heading for a stuck end: low nitrogen (88 mg N/L) on very ripe fruit; the ferment will level off near 8 °Brix";
                    break;
                case "26-006":
                    // A big tank of ripe fruit on the warm strain, its jacket not switched on: it will overheat without cooling.
                    plan.ForcedStartC = 22.5;
                    plan.ForcedPeakC = 41.5;
                    plan.Note = "Jacket not yet connected";
                    story = "will overheat without cooling: warm must on the fast, warm strain in a 10,000 L tank; left alone it would peak near 41.5 °C, above the 40 °C red danger threshold";
                    break;
                case "26-008":
                    story = "no inoculation time recorded: times count from its first reading";
                    break;
                case "26-009":
                    story = $"a strain on trial ({Catalog.TrialStrain.Code}) with no past lot in this cellar: the pooled prior stands in";
                    break;
            }

            var made = Simulate(plan);
            var whole = made.Log!;
            var cut = whole.Readings.Where(r => r.Timestamp <= RunningNow).ToArray();
            var values = made.LogRecordedSugar!.Take(cut.Length).ToArray();
            var r = made.Recorded;
            var running = new RunningLot
            {
                LotId = r.LotId,
                Season = r.Season,
                Strain = r.Strain,
                StartingSugar = r.StartingSugar,
                Vessel = r.Vessel,
                VesselCapacityL = r.VesselCapacityL,
                Variety = r.Variety,
                Colour = r.Colour,
                Additions = r.Additions,
                YanMgL = r.YanMgL,
                InoculationDate = id == "26-008" ? null : r.InoculationDate,
                Notes = r.Notes,
            };
            lots.Add(new RunningGeneratedLot(running, made.Truth, new FermentationLog(id, RunningSeason, cut), values, whole, story));
        }

        return new HarvestInProgress(RunningSeason, RunningNow, lots);
    }
}
