using System.Globalization;
using System.Text.RegularExpressions;
using Xunit;

namespace YieldBench.Scenario.Tests;

/// <summary>
/// tests/YieldBench.Core.Tests/Fixtures/forecast-information-bound.py computes the best any forecaster could do on the
/// demo history (docs/performance.md quotes it against issue 17's hour targets) from the generator's own constants,
/// copied into the script. These tests fail when the catalog changes and the script (and the figures quoted from it)
/// were not brought along.
/// </summary>
public sealed partial class InformationBoundFixtureTests
{
    private static readonly string Script = File.ReadAllText(Path.Combine(RepoPaths.Root, "tests", "YieldBench.Core.Tests", "Fixtures", "forecast-information-bound.py"));

    [Fact]
    public void The_scripts_strains_are_the_catalogs()
    {
        var inScript = StrainPattern().Matches(Script).ToDictionary(
            m => m.Groups[1].Value,
            m => (Lag: D(m.Groups[2]), Rate: D(m.Groups[3]), Rise: D(m.Groups[4])));

        Assert.Equal(Catalog.Strains.Select(s => s.Code).Order(), inScript.Keys.Order());
        foreach (var s in Catalog.Strains)
        {
            Assert.Equal((s.LagHours, s.MaxRateBrixPerHourAt25C, s.HeatRiseC), inScript[s.Code]);
        }
    }

    [Fact]
    public void The_scripts_vessels_carry_the_catalogs_peaks_and_sampling_scatter()
    {
        var rows = VesselPattern().Matches(Script).Select(m => (Type: m.Groups[1].Value, Capacity: D(m.Groups[2]), Peak: D(m.Groups[3]), Sd: D(m.Groups[4]))).ToList();

        // 6 white rows and 4 red rows (WHITE_VESSELS, RED_VESSELS), each the catalog's vessel of that type and size.
        Assert.Equal(10, rows.Count);
        int index = 0;
        foreach (var row in rows)
        {
            var vessel = Catalog.Vessels.Single(v => v.Type == row.Type && v.CapacityL == row.Capacity);
            double peak = index < 6 ? vessel.WhitePeakC : vessel.RedPeakC;
            Assert.Equal((peak, vessel.SamplingSdBrix), (row.Peak, row.Sd));
            index++;
        }
    }

    private static double D(Group g) => double.Parse(g.Value, CultureInfo.InvariantCulture);

    [GeneratedRegex(@"""(YB-[A-Z]\d\d)"": \(([\d.]+), ([\d.]+), (-?[\d.]+)\)")]
    private static partial Regex StrainPattern();

    [GeneratedRegex(@"\(""([A-Za-z -]+)"", (\d+), ([\d.]+), ([\d.]+), [\d.]+\)")]
    private static partial Regex VesselPattern();
}
