using YieldBench.Core.Lots;
using YieldBench.Core.Review;

namespace YieldBench.Scenario.Tests;

/// <summary>
/// The whole review, run on the demo lots and logs as intake would deliver them, shows every planted case and leaves the
/// controls alone. This pins the demo's promise in demo-data/README.md against the real detectors.
/// </summary>
public class PlantedCaseDetectionTests
{
    private static readonly ScenarioData Demo = ScenarioGenerator.Demo();
    private static readonly ReviewResult Review = ReviewRunner.Run(Demo.ToSeasonSet(), new ReviewSettings(), "test");

    public static TheoryData<string> PlantedKeys()
    {
        var data = new TheoryData<string>();
        foreach (var p in Demo.PlantedCases.Where(p => p.ExpectedCodes.Count > 0 || p.ExpectedKineticsCodes.Count > 0))
        {
            data.Add(p.Key.ToString());
        }

        return data;
    }

    [Theory]
    [MemberData(nameof(PlantedKeys))]
    public void Each_planted_lot_is_flagged_with_an_expected_code(string keyText)
    {
        var key = LotKey.Parse(keyText);
        // Given a planted case and the review's findings on its lot
        var planted = Demo.PlantedCases.Single(p => p.Key == key);
        var flags = Review.Strains.Flags.Where(f => f.LotKey == key).Select(f => f.Code).ToArray();
        var kinetics = Review.Kinetics!.Findings.Where(f => f.LotKey == key).Select(f => f.Code).ToArray();

        // Then at least one expected lot-flag code is raised, and every expected kinetics code
        if (planted.ExpectedCodes.Count > 0)
        {
            Assert.True(planted.ExpectedCodes.Intersect(flags).Any(), $"{planted.Kind} {key}: expected one of [{string.Join(", ", planted.ExpectedCodes)}], got [{string.Join(", ", flags)}]");
        }

        Assert.All(planted.ExpectedKineticsCodes, c => Assert.Contains(c, kinetics));
    }

    [Fact]
    public void Recorded_addition_controls_get_no_lot_flag()
    {
        // Given the lots whose additions were recorded correctly
        var controls = Demo.PlantedCases.Where(p => p.Kind == PlantedKind.RecordedAdditionControl).Select(p => p.Key).ToArray();

        // Then the strain review flags none of them (the addition balance corrected their sugar)
        Assert.NotEmpty(controls);
        Assert.All(controls, k => Assert.DoesNotContain(Review.Strains.Flags, f => f.LotKey == k));
    }

    [Fact]
    public void Few_clean_lots_are_flagged()
    {
        // Given every lot that is not planted
        var planted = Demo.PlantedCases.Select(p => p.Key).ToHashSet();
        var clean = Demo.AllLots.Select(l => l.Recorded.Key).Where(k => !planted.Contains(k)).ToArray();

        // When the lots with any strain-review flag are counted
        int flagged = clean.Count(k => Review.Strains.Flags.Any(f => f.LotKey == k));

        // Then at most 5 % of them carry a flag (the noise is realistic, so a few false alarms are expected)
        Assert.True(flagged <= clean.Length / 20, $"{flagged} of {clean.Length} clean lots flagged");
    }
}
