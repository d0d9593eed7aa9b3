namespace YieldBench.Scenario.Tests;

public class HarvestInProgressTests
{
    private static readonly HarvestInProgress Running = ScenarioGenerator.Demo().Running!;

    [Fact]
    public void The_harvest_in_progress_holds_ten_lots_of_the_next_season_at_two_to_eight_readings_cut_at_now()
    {
        Assert.Equal(2026, Running.Season);
        Assert.Equal(10, Running.Lots.Count);
        Assert.All(Running.Lots, l =>
        {
            Assert.InRange(l.Log.Readings.Count, 2, 8);
            Assert.All(l.Log.Readings, r => Assert.True(r.Timestamp <= Running.Now));
            Assert.True(l.WholeLog.Readings.Count > l.Log.Readings.Count, $"{l.Recorded.LotId}: the whole log goes on after now");
        });
        Assert.Contains(Running.Lots, l => l.Log.Readings.Count == 2);
        Assert.Contains(Running.Lots, l => l.Log.Readings.Count >= 7);
    }

    [Fact]
    public void The_planted_lots_do_what_the_readme_says_in_the_logs_still_to_come()
    {
        // The stuck-bound lot never reaches the dry reading: its whole log levels off near 8 °Brix
        var stuck = Running.Lots.Single(l => l.Recorded.LotId == "26-005");
        Assert.All(stuck.WholeLog.Readings, r => Assert.True(r.Sugar!.Value.Brix > 6.5));
        Assert.Equal(8.0, stuck.Truth.FinalBrix);

        // The lot left without cooling is still climbing at now and goes on past the 40 °C red danger threshold
        var hot = Running.Lots.Single(l => l.Recorded.LotId == "26-006");
        double soFar = hot.Log.Readings.Max(r => r.TemperatureC!.Value);
        double later = hot.WholeLog.Readings.Where(r => r.Timestamp > Running.Now).Max(r => r.TemperatureC!.Value);
        Assert.True(later > soFar && later > 40.5, $"so far {soFar} °C, later {later} °C");
        Assert.Equal(41.5, hot.Truth.PeakTempC);

        // The trial strain has no finished lot in the history, and one lot has no inoculation time
        var history = ScenarioGenerator.Demo().AllLots.Select(l => l.Recorded.Strain).ToHashSet();
        Assert.DoesNotContain(Catalog.TrialStrain.Code, history);
        Assert.Equal(Catalog.TrialStrain.Code, Running.Lots.Single(l => l.Recorded.LotId == "26-009").Recorded.Strain);
        Assert.Null(Running.Lots.Single(l => l.Recorded.LotId == "26-008").Recorded.InoculationDate);
    }
}
