using System.Globalization;

namespace YieldBench.Scenario.Tests;

public class ScaleFilesTests
{
    [Fact]
    public void Scale_files_hold_one_row_per_lot_and_per_reading_with_invariant_numbers()
    {
        // Given a 1,000-lot benchmark scenario written to a temporary folder
        var scenario = ScenarioGenerator.Generate(ScaleFiles.Options(1000));
        string dir = Path.Combine(Path.GetTempPath(), "yieldbench-scale-test-" + Environment.ProcessId.ToString(CultureInfo.InvariantCulture));
        try
        {
            // When the files are written
            var (lotsPath, logsPaths, readings) = ScaleFiles.Write(scenario, dir);
            var lotLines = File.ReadAllLines(lotsPath);
            long logLines = logsPaths.Sum(p => File.ReadLines(p).LongCount() - 1);

            // Then the lots file has a header and 1,000 rows of 21 fields, and the log files hold every reading once
            Assert.Equal(1001, lotLines.Length);
            Assert.All(lotLines.Skip(1), l => Assert.Equal(21, SplitCsv(l).Count));
            Assert.Equal(scenario.AllLots.Sum(l => l.Log?.Readings.Count ?? 0), readings);
            Assert.Equal(readings, logLines);
            Assert.Equal(scenario.Seasons.Count(s => s.Lots.Any(l => l.Log is not null)), logsPaths.Count);

            // And the first lot's alcohol reads back with a decimal point
            var first = SplitCsv(lotLines[1]);
            Assert.Equal(scenario.Seasons[0].Lots[0].Recorded.FinalAlcohol.PercentVolume, double.Parse(first[12], CultureInfo.InvariantCulture), 10);
        }
        finally
        {
            if (Directory.Exists(dir))
            {
                Directory.Delete(dir, recursive: true);
            }
        }
    }

    [Fact]
    public void Benchmark_options_spread_the_lots_over_ten_seasons()
    {
        // Given options for 1,005 lots
        var options = ScaleFiles.Options(1005);

        // Then ten seasons 2016–2025 share them, the first five taking the remainder, with no planted cases
        Assert.Equal(Enumerable.Range(2016, 10), options.Seasons.Select(s => s.Year));
        Assert.Equal(1005, options.Seasons.Sum(s => s.LotCount));
        Assert.Equal(101, options.Seasons[0].LotCount);
        Assert.Equal(100, options.Seasons[9].LotCount);
        Assert.False(options.PlantCases);
    }

    private static List<string> SplitCsv(string line)
    {
        var fields = new List<string>();
        var current = new System.Text.StringBuilder();
        bool quoted = false;
        for (int i = 0; i < line.Length; i++)
        {
            char c = line[i];
            if (quoted)
            {
                if (c == '"' && i + 1 < line.Length && line[i + 1] == '"')
                {
                    current.Append('"');
                    i++;
                }
                else if (c == '"')
                {
                    quoted = false;
                }
                else
                {
                    current.Append(c);
                }
            }
            else if (c == '"')
            {
                quoted = true;
            }
            else if (c == ',')
            {
                fields.Add(current.ToString());
                current.Clear();
            }
            else
            {
                current.Append(c);
            }
        }

        fields.Add(current.ToString());
        return fields;
    }
}
