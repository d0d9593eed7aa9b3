using System.Globalization;
using System.Text;
using YieldBench.Core.Units;

namespace YieldBench.Scenario;

/// <summary>
/// Writes a (large) scenario as two plain CSV files for the scale benchmark: all lots in one file (comma-separated,
/// invariant culture, the demo's headers) and the log readings in one long file per season (logs-YEAR.csv) with a full
/// timestamp — per season as a cellar keeps them, which also keeps each file under intake's one-million-row limit.
/// Streams row by row so that 100k lots and a million readings need no more memory than the scenario itself.
/// </summary>
public static class ScaleFiles
{
    /// <summary>Name of the lots file.</summary>
    public const string LotsFileName = "lots.csv";

    /// <summary>Name of a season's logs file.</summary>
    public static string LogsFileName(int season) => string.Create(CultureInfo.InvariantCulture, $"logs-{season}.csv");

    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Options for a benchmark scenario of about <paramref name="lots"/> lots over ten seasons (2016–2025), no planted cases.</summary>
    public static ScenarioOptions Options(int lots, double logShare = 0.33, ulong seed = 7)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(lots, 10);
        int perSeason = lots / 10;
        var seasons = Enumerable.Range(0, 10)
            .Select(i => new SeasonProfile(2016 + i, perSeason + (i < lots % 10 ? 1 : 0), 24.0 + (0.3 * (i % 4)), 21.8 + (0.2 * (i % 3)), new DateTime(2016 + i, 9, 4), 50, SugarScale.Brix, SeasonFileFormat.SemicolonCsv))
            .ToArray();
        return new ScenarioOptions { Seed = seed, Seasons = seasons, LogShare = logShare, ProbeLotsPerSeason = 0, PlantCases = false };
    }

    /// <summary>Writes lots.csv and one logs-YEAR.csv per season with logs into <paramref name="directory"/>; returns the paths and the log readings written.</summary>
    public static (string LotsPath, IReadOnlyList<string> LogsPaths, long Readings) Write(ScenarioData scenario, string directory)
    {
        ArgumentNullException.ThrowIfNull(scenario);
        Directory.CreateDirectory(directory);
        string lotsPath = Path.Combine(directory, LotsFileName);
        var utf8 = new UTF8Encoding(false);
        using (var w = new StreamWriter(lotsPath, false, utf8, 1 << 16))
        {
            w.NewLine = "\n";
            w.WriteLine("Lot,Vintage,Yeast,Vessel,Capacity (L),Variety,Colour,Block,Start Brix (°Bx),Must volume (L),Water added (L),Sugar added (kg),Alcohol % v/v,RS (g/L),YAN (mg N/L),pH,TA (g/L),Peak temp (°C),Inoculated,Dry date,Notes");
            foreach (var g in scenario.AllLots)
            {
                var l = g.Recorded;
                w.Write(l.LotId); w.Write(',');
                w.Write(l.Season.ToString(Inv)); w.Write(',');
                w.Write(l.Strain); w.Write(',');
                w.Write(l.Vessel); w.Write(',');
                w.Write(N(l.VesselCapacityL, "0")); w.Write(',');
                w.Write(l.Variety); w.Write(',');
                w.Write(l.Colour switch { Core.Lots.WineColour.Red => "Red", Core.Lots.WineColour.White => "White", Core.Lots.WineColour.Rose => "Rosé", _ => "" }); w.Write(',');
                w.Write(l.Block); w.Write(',');
                w.Write(N(g.RecordedStartingValue, "0.0")); w.Write(',');
                w.Write(N(l.Additions.MustVolumeL, "0")); w.Write(',');
                w.Write(N(l.Additions.WaterAddedL, "0")); w.Write(',');
                w.Write(N(l.Additions.SugarAddedKg, "0.0")); w.Write(',');
                w.Write(N(l.FinalAlcohol.PercentVolume, "0.00")); w.Write(',');
                w.Write(N(l.ResidualSugarGl, "0.0")); w.Write(',');
                w.Write(N(l.YanMgL, "0")); w.Write(',');
                w.Write(N(l.Ph, "0.00")); w.Write(',');
                w.Write(N(l.TaGl, "0.0")); w.Write(',');
                w.Write(N(l.PeakFermentationTempC, "0.0")); w.Write(',');
                w.Write(l.InoculationDate?.ToString("yyyy-MM-dd HH:mm", Inv)); w.Write(',');
                w.Write(l.DryDate?.ToString("yyyy-MM-dd", Inv)); w.Write(',');
                w.WriteLine(l.Notes is null ? string.Empty : Quote(l.Notes));
            }
        }

        long readings = 0;
        var logsPaths = new List<string>();
        foreach (var season in scenario.Seasons.Where(s => s.Lots.Any(l => l.Log is not null)))
        {
            string logsPath = Path.Combine(directory, LogsFileName(season.Profile.Year));
            logsPaths.Add(logsPath);
            using var w = new StreamWriter(logsPath, false, utf8, 1 << 16);
            w.NewLine = "\n";
            w.WriteLine("Lot,Vintage,Timestamp,Brix,Temp °C");
            foreach (var g in season.Lots)
            {
                if (g.Log is not { } log)
                {
                    continue;
                }

                string prefix = g.Recorded.LotId + "," + g.Recorded.Season.ToString(Inv) + ",";
                foreach (var r in log.Readings)
                {
                    w.Write(prefix);
                    w.Write(r.Timestamp.ToString("yyyy-MM-dd HH:mm", Inv)); w.Write(',');
                    w.Write(N(r.Sugar?.Brix, "0.0")); w.Write(',');
                    w.WriteLine(N(r.TemperatureC, "0.0"));
                    readings++;
                }
            }
        }

        return (lotsPath, logsPaths, readings);
    }

    private static string N(double? v, string format) => v?.ToString(format, Inv) ?? string.Empty;

    private static string Quote(string s) =>
        s.IndexOfAny([',', '"', '\r', '\n']) >= 0 ? "\"" + s.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"" : s;
}
