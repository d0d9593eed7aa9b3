using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;
using SkiaSharp;

namespace YieldBench.Cli.Tests;

/// <summary>Runs the demo forecast twice (the second quietly, into another folder) for the tests that read its outputs.</summary>
public sealed class DemoForecastFixture : IDisposable
{
    public DemoForecastFixture()
    {
        Root = Path.Combine(Path.GetTempPath(), "yb-forecast-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Root);
        (ExitCode, Out, Error) = Cli.Run(Root, "forecast", "--out", "first");
        (SecondExitCode, QuietOut, _) = Cli.Run(Root, "forecast", "--out", "second", "--quiet");
        Json = JsonDocument.Parse(File.ReadAllText(Path.Combine(First, "forecast.json")));
    }

    public string Root { get; }

    public string First => Path.Combine(Root, "first");

    public string Second => Path.Combine(Root, "second");

    public int ExitCode { get; }

    public int SecondExitCode { get; }

    public string Out { get; }

    public string QuietOut { get; }

    public string Error { get; }

    public JsonDocument Json { get; }

    public JsonElement Lot(string id) => Json.RootElement.GetProperty("lots").EnumerateArray().Single(l => l.GetProperty("lot_id").GetString() == id);

    public void Dispose()
    {
        Json.Dispose();
        try
        {
            Directory.Delete(Root, recursive: true);
        }
        catch (IOException)
        {
        }
    }
}

public sealed partial class ForecastCommandTests(DemoForecastFixture demo) : IClassFixture<DemoForecastFixture>
{
    [GeneratedRegex(@"^\d{4}-\d\d-\d\dT\d\d:\d\d:00$")]
    private static partial Regex LocalTime();

    [Fact]
    public void With_no_inputs_the_forecast_reads_the_demo_history_and_its_harvest_in_progress_and_says_so()
    {
        // Given no inputs (the fixture ran "forecast --out first")
        // Then it said so, succeeded, and printed every running lot, the backtest and the cautions
        Assert.Equal(0, demo.ExitCode);
        Assert.Equal(string.Empty, demo.Error);
        Assert.StartsWith("No inputs given: forecasting the bundled demo's harvest in progress", demo.Out, StringComparison.Ordinal);
        Assert.Contains("Forecast for 10 running lot(s) of 2026 (readings stand at Fri 18 Sep 17:", Cli.Flat(demo.Out), StringComparison.Ordinal);
        for (int i = 1; i <= 10; i++)
        {
            Assert.Contains($"Lot 26-{i:000} (", demo.Out, StringComparison.Ordinal);
        }

        Assert.Contains("Backtest, each of 2023, 2024, 2025 held out in turn", Cli.Flat(demo.Out), StringComparison.Ordinal);
        Assert.Contains("no substitute for the next reading", Cli.Flat(demo.Out), StringComparison.Ordinal);
        Assert.Contains("carbon dioxide", Cli.Flat(demo.Out), StringComparison.Ordinal);
        Assert.All(demo.Out.Split('\n'), l => Assert.True(l.TrimEnd('\r').Length <= 100, l));
        Assert.Equal(0, demo.SecondExitCode);
        Assert.Equal(string.Empty, demo.QuietOut);
    }

    [Fact]
    public void A_cellar_that_works_in_Fahrenheit_reads_the_forecast_in_Fahrenheit_while_the_json_keeps_Celsius()
    {
        // Given the demo forecast run again with --fahrenheit
        var (exit, output, error) = Cli.Run(demo.Root, "forecast", "--out", "fahrenheit", "--fahrenheit");

        // Then it succeeds; the console gives every temperature in °F (lot 26-006's peak is the json's °C × 9/5 + 32),
        // and forecast.json is byte for byte the °C run's (its keys end in _c)
        Assert.Equal((0, string.Empty), (exit, error));
        string flat = Cli.Flat(output);
        Assert.DoesNotContain("°C", flat, StringComparison.Ordinal);
        double peakC = demo.Lot("26-006").GetProperty("peak_temp_c").GetProperty("value").GetDouble();
        // (the json keeps 0.1 °C, the console converts the unrounded value: they agree to 0.1 °F)
        var peakF = Regex.Match(flat, @"Lot 26-006 \(.*?peak (\d+\.\d) °F \(80 %");
        Assert.True(peakF.Success, flat);
        Assert.InRange(double.Parse(peakF.Groups[1].Value, CultureInfo.InvariantCulture), (peakC * 9 / 5) + 32 - 0.1, (peakC * 9 / 5) + 32 + 0.1);
        Assert.Equal(File.ReadAllBytes(Path.Combine(demo.First, "forecast.json")), File.ReadAllBytes(Path.Combine(demo.Root, "fahrenheit", "forecast.json")));
    }

    [Fact]
    public void The_json_has_exactly_the_documented_shape_with_local_times_and_hours()
    {
        var root = demo.Json.RootElement;
        Assert.Equal(["lots", "backtest"], root.EnumerateObject().Select(p => p.Name));
        string[] lotKeys = ["season", "lot_id", "strain", "readings_used", "one_third", "dry", "peak_temp_c", "reachable_without_cooling_c", "cooling_kw", "stuck_risk", "next_reading_at", "basis"];
        Assert.Equal(10, root.GetProperty("lots").GetArrayLength());
        foreach (var lot in root.GetProperty("lots").EnumerateArray())
        {
            Assert.Equal(lotKeys, lot.EnumerateObject().Select(p => p.Name));
            Assert.Equal(["brix", "at", "low80", "high80"], lot.GetProperty("one_third").EnumerateObject().Select(p => p.Name));
            Assert.Equal(["at", "low80", "high80"], lot.GetProperty("dry").EnumerateObject().Select(p => p.Name));
            Assert.Equal(["value", "low80", "high80"], lot.GetProperty("peak_temp_c").EnumerateObject().Select(p => p.Name));
            foreach (var time in new[] { lot.GetProperty("one_third").GetProperty("at"), lot.GetProperty("next_reading_at") })
            {
                Assert.Matches(LocalTime(), time.GetString()!);
            }
        }

        string[] rowKeys = ["target", "readings", "lots", "mae", "p90", "coverage80", "baseline_line_mae", "baseline_strain_mae"];
        var rows = root.GetProperty("backtest").EnumerateArray().ToArray();
        Assert.Equal(12, rows.Length);
        Assert.All(rows, r => Assert.Equal(rowKeys, r.EnumerateObject().Select(p => p.Name)));
        Assert.Equal(["one_third", "dry", "peak_temp"], rows.Select(r => r.GetProperty("target").GetString()).Distinct());
        Assert.Equal([2, 3, 4, 6], rows.Where(r => r.GetProperty("target").GetString() == "dry").Select(r => r.GetProperty("readings").GetInt32()));
    }

    [Fact]
    public void The_planted_lots_of_the_harvest_in_progress_are_found()
    {
        // The lot heading for a stuck end: a high chance, and no dry time expected
        var stuck = demo.Lot("26-005");
        Assert.True(stuck.GetProperty("stuck_risk").GetDouble() >= 0.5);
        Assert.Equal(JsonValueKind.Null, stuck.GetProperty("dry").GetProperty("at").ValueKind);

        // The lot that will overheat without cooling: a forecast peak above the 40 °C red danger threshold, with the
        // cooling power of a 10,000 L tank at its peak rate, and a reachable temperature far above that
        var hot = demo.Lot("26-006");
        Assert.True(hot.GetProperty("peak_temp_c").GetProperty("value").GetDouble() > 40);
        Assert.True(hot.GetProperty("cooling_kw").GetDouble() > 1);
        Assert.True(hot.GetProperty("reachable_without_cooling_c").GetDouble() > 50);
        Assert.Contains("above the 40 °C danger threshold — cool it now", Cli.Flat(demo.Out), StringComparison.Ordinal);

        // The trial strain stands on the pooled prior; the lot without an inoculation time counts from its first reading
        Assert.Equal("pooled", demo.Lot("26-009").GetProperty("basis").GetProperty("strain_prior").GetString());
        Assert.Equal("first reading", demo.Lot("26-008").GetProperty("basis").GetProperty("time_origin").GetString());

        // And an ordinary lot is neither
        var plain = demo.Lot("26-003");
        Assert.True(plain.GetProperty("stuck_risk").GetDouble() < 0.1);
        Assert.True(plain.GetProperty("peak_temp_c").GetProperty("value").GetDouble() < 20);
    }

    [Fact]
    public void The_demo_backtest_beats_both_baselines_at_every_cut()
    {
        foreach (var row in demo.Json.RootElement.GetProperty("backtest").EnumerateArray())
        {
            double mae = row.GetProperty("mae").GetDouble();
            Assert.True(mae < row.GetProperty("baseline_line_mae").GetDouble() && mae < row.GetProperty("baseline_strain_mae").GetDouble(), row.ToString());
        }
    }

    [Fact]
    public void Same_inputs_give_the_same_files_byte_for_byte_and_a_chart_per_running_lot()
    {
        var first = Directory.GetFiles(demo.First, "*", SearchOption.AllDirectories).Select(f => Path.GetRelativePath(demo.First, f)).Order(StringComparer.Ordinal).ToArray();
        var second = Directory.GetFiles(demo.Second, "*", SearchOption.AllDirectories).Select(f => Path.GetRelativePath(demo.Second, f)).Order(StringComparer.Ordinal).ToArray();
        Assert.Equal(first, second);
        Assert.Equal(10, first.Count(f => f.StartsWith("charts", StringComparison.Ordinal) && f.EndsWith(".png", StringComparison.Ordinal)));
        Assert.Contains("forecast.xlsx", first);
        Assert.Contains("yieldbench-files.txt", first);
        foreach (var f in first)
        {
            Assert.True(File.ReadAllBytes(Path.Combine(demo.First, f)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(demo.Second, f))), f + " differs between two runs");
        }

        byte[] png = File.ReadAllBytes(Path.Combine(demo.First, "charts", "forecast-2026-26-006.png"));
        Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47 }, png[..4]);

        // The legend under the plot is framed whole: its frame's bottom line is drawn (a dark row near the bottom)
        // and does not sit on the picture's edge (the last rows are blank).
        using var bitmap = SKBitmap.Decode(png);
        int DarkIn(int y) => Enumerable.Range(0, bitmap.Width).Count(x => Grey(bitmap.GetPixel(x, y)) < 128);
        int frameRow = Enumerable.Range(bitmap.Height - 60, 60).Last(y => DarkIn(y) > bitmap.Width / 2);
        Assert.True(bitmap.Height - 1 - frameRow >= 6, $"the legend frame is {bitmap.Height - 1 - frameRow} px from the bottom edge");
        Assert.All(Enumerable.Range(bitmap.Height - 4, 4), y => Assert.Equal(0, DarkIn(y)));
    }

    private static double Grey(SKColor c) => (0.299 * c.Red) + (0.587 * c.Green) + (0.114 * c.Blue);

    [Fact]
    public void A_peak_forecast_stays_between_the_warmest_reading_and_what_the_must_could_reach_with_no_cooling()
    {
        // Given a small cellar's history of five lots whose temperatures (°F, hand-read) jump about and say little about
        // heat, and three running lots with one to three readings (invented; sugar as SG)
        using var folder = new Scratch();
        var sg = new[]
        {
            "1.088 1.086 1.082 1.074 1.061 1.043 1.025 1.012 1.004 1.000 0.998 0.997 0.996",
            "1.092 1.090 1.086 1.078 1.064 1.045 1.026 1.012 1.004 1.000 0.998 0.997 0.996",
            "1.080 1.079 1.075 1.068 1.055 1.039 1.023 1.010 1.003 0.999 0.998 0.997 0.996",
            "1.095 1.093 1.089 1.080 1.066 1.046 1.027 1.013 1.004 1.000 0.998 0.997 0.996",
            "1.084 1.082 1.079 1.071 1.058 1.041 1.024 1.011 1.003 1.000 0.998 0.997 0.996",
        };
        var tempF = new[]
        {
            "79 63 66 68 73 71 76 77 78 71 70 64 70",
            "75 80 65 77 73 74 65 62 71 70 77 63 67",
            "76 67 77 78 78 77 72 78 73 65 73 72 74",
            "76 78 66 63 71 76 70 74 71 71 75 79 77",
            "69 70 74 63 76 79 65 79 75 69 65 65 80",
        };
        var log = new StringBuilder("Lot,Date,Reading,Temp F\n");
        for (int i = 0; i < 5; i++)
        {
            var day = new DateTime(2025, 9, 20 + i);
            foreach (var (g, t) in sg[i].Split(' ').Zip(tempF[i].Split(' ')))
            {
                log.Append(CultureInfo.InvariantCulture, $"W{i + 1},{day:yyyy-MM-dd},{g},{t}\n");
                day = day.AddDays(1);
            }
        }

        folder.Write("h/lots-2025.csv", "Lot,Yeast,SG,ABV,RS g/L,Inoculated\nW1,WR-1,1.098,13.6,1.0,2025-09-20\nW2,WR-1,1.102,14.0,1.0,2025-09-21\nW3,WR-1,1.090,12.5,1.0,2025-09-22\nW4,WR-1,1.105,14.4,1.0,2025-09-23\nW5,WR-1,1.094,13.0,1.0,2025-09-24\n");
        folder.Write("h/log-2025.csv", log.ToString());
        folder.Write("r/now-2026.csv", "Lot,Yeast,SG,Inoculated\nW26-1,WR-1,1.100,2026-09-14 08:00\nW26-2,WR-1,1.096,2026-09-15 08:00\nW26-3,WR-1,1.092,2026-09-16 08:00\n");
        folder.Write("r/log-2026.csv", "Lot,Date,Time,Reading,Temp F\nW26-1,2026-09-14,08:00,1.100,62\nW26-1,2026-09-15,08:00,1.097,66\nW26-1,2026-09-16,08:00,1.088,72\nW26-2,2026-09-15,08:00,1.096,63\nW26-2,2026-09-16,08:00,1.094,65\nW26-3,2026-09-16,08:00,1.092,61\n");

        // When the running lots are forecast
        var (exit, _, err) = Cli.Run(folder.Root, "forecast", "h", "--running", "r", "--out", "out", "--quiet");

        // Then every peak and its 80 % interval lie between the lot's warmest reading and the temperature it could reach
        // with no heat removed (before, the history's loose heat model gave intervals up to 82.6 °C against 49.8 °C
        // reachable)
        Assert.True(exit == 0, err);
        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder.Root, "out", "forecast.json")));
        var warmest = new Dictionary<string, double> { ["W26-1"] = (72 - 32) / 1.8, ["W26-2"] = (65 - 32) / 1.8, ["W26-3"] = (61 - 32) / 1.8 };
        var lots = json.RootElement.GetProperty("lots").EnumerateArray().ToArray();
        Assert.Equal(3, lots.Length);
        foreach (var lot in lots)
        {
            string id = lot.GetProperty("lot_id").GetString()!;
            double reach = lot.GetProperty("reachable_without_cooling_c").GetDouble();
            var peak = lot.GetProperty("peak_temp_c");
            foreach (string part in new[] { "low80", "value", "high80" })
            {
                Assert.InRange(peak.GetProperty(part).GetDouble(), warmest[id] - 0.05, reach + 0.05);
            }
        }
    }

    [Fact]
    public void A_running_log_in_fahrenheit_gives_the_forecast_of_the_same_log_in_celsius()
    {
        // Given a running lot whose log records temperatures in °F, and the same log in °C
        using var folder = new Scratch();
        string lots = "Lot,Vintage,Yeast,Vessel,Capacity (L),Start Brix,Inoculated,Colour\n26-101,2026,YB-R12,Stainless tank,5000,24.8,2026-09-15 08:00,red\n";
        var readings = new[] { ("2026-09-15 17:30", 24.1, 19.6), ("2026-09-16 07:30", 22.9, 22.4), ("2026-09-16 17:30", 21.0, 25.5) };
        string F(double c) => ((c * 9 / 5) + 32).ToString("0.00", CultureInfo.InvariantCulture);
        string C(double c) => c.ToString("0.00", CultureInfo.InvariantCulture);
        folder.Write("f/lots-2026.csv", lots);
        folder.Write("f/log-2026.csv", "Lot,Timestamp,Brix,Temp (°F)\n" + string.Concat(readings.Select(r => $"26-101,{r.Item1},{r.Item2.ToString(CultureInfo.InvariantCulture)},{F(r.Item3)}\n")));
        folder.Write("c/lots-2026.csv", lots);
        folder.Write("c/log-2026.csv", "Lot,Timestamp,Brix,Temp (°C)\n" + string.Concat(readings.Select(r => $"26-101,{r.Item1},{r.Item2.ToString(CultureInfo.InvariantCulture)},{C(r.Item3)}\n")));
        string history = Path.Combine(AppContext.BaseDirectory, "demo-data", "history");

        // When both are forecast from the demo history
        var (fe, _, ferr) = Cli.Run(folder.Root, "forecast", history, "--running", "f", "--out", "outf", "--quiet");
        var (ce, _, _) = Cli.Run(folder.Root, "forecast", history, "--running", "c", "--out", "outc", "--quiet");

        // Then both succeed with the same lot forecast: the °F readings were read as the °C ones
        Assert.True(fe == 0, ferr);
        Assert.Equal(0, ce);
        using var jf = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder.Root, "outf", "forecast.json")));
        using var jc = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder.Root, "outc", "forecast.json")));
        var lf = jf.RootElement.GetProperty("lots")[0];
        var lc = jc.RootElement.GetProperty("lots")[0];
        Assert.Equal(lc.GetProperty("peak_temp_c").GetProperty("value").GetDouble(), lf.GetProperty("peak_temp_c").GetProperty("value").GetDouble(), 1);
        Assert.Equal(lc.GetProperty("reachable_without_cooling_c").GetDouble(), lf.GetProperty("reachable_without_cooling_c").GetDouble(), 1);
        Assert.Equal(lc.GetProperty("one_third").GetProperty("at").GetString(), lf.GetProperty("one_third").GetProperty("at").GetString());
        Assert.InRange(lf.GetProperty("reachable_without_cooling_c").GetDouble(), 40, 60);
    }

    [Fact]
    public void The_running_files_issues_follow_the_historys_count_under_a_heading_of_their_own()
    {
        // Given a running log whose temperature header gives no unit (a warning), forecast from the demo history (which
        // has intake warnings of its own, counted on one line)
        using var folder = new Scratch();
        folder.Write("r/lots-2026.csv", "Lot,Yeast,Start Brix,Inoculated\n26-301,YB-R12,24.6,2026-09-15 08:00\n");
        folder.Write("r/log-2026.csv", "Lot,Timestamp,Brix,Temp\n26-301,2026-09-15 17:30,24.0,19.8\n26-301,2026-09-16 07:30,22.6,22.9\n");
        string history = Path.Combine(AppContext.BaseDirectory, "demo-data", "history");

        // When forecast
        var (exit, output, _) = Cli.Run(folder.Root, "forecast", history, "--running", "r", "--out", "out");

        // Then the history's line comes first, then a heading for the running files, then their warning with its place
        Assert.Equal(0, exit);
        string flat = Cli.Flat(output);
        int historyLine = flat.IndexOf("History: ", StringComparison.Ordinal);
        int heading = flat.IndexOf("Running lots' files: 1 intake issue(s), each with its place and fix:", StringComparison.Ordinal);
        int warning = flat.IndexOf("forecast: warning r/log-2026.csv, row 1, column \"Temp\"", StringComparison.Ordinal);
        Assert.True(historyLine >= 0 && heading > historyLine && warning > heading, $"history at {historyLine}, heading at {heading}, warning at {warning}:\n{flat}");
    }

    [Fact]
    public void Bad_running_rows_are_reported_with_their_place_and_fix_and_the_rest_forecast()
    {
        // Given a running table with one good lot and one without starting sugar
        using var folder = new Scratch();
        folder.Write("r/lots-2026.csv", "Lot,Yeast,Start Brix,Inoculated\n26-201,YB-W22,22.4,2026-09-17 10:00\n26-202,YB-W22,,\n26-203,YB-W22,21.9,\n");
        string history = Path.Combine(AppContext.BaseDirectory, "demo-data", "history");

        // When forecast
        var (exit, output, error) = Cli.Run(folder.Root, "forecast", history, "--running", "r", "--out", "out");

        // Then the bad row is named with file, row and column and left out (exit 1), and the good lot forecast from its prior
        Assert.Equal(1, exit);
        Assert.Contains("forecast: error r/lots-2026.csv, row 3, column \"Start Brix\"", Cli.Flat(error), StringComparison.Ordinal);
        string flat = Cli.Flat(output);
        Assert.Contains("Lot 26-201 (YB-W22)", flat, StringComparison.Ordinal);
        Assert.Contains("has no sugar reading yet", flat, StringComparison.Ordinal);
        Assert.Contains("Lot 26-203 has neither an inoculation time nor a reading", flat, StringComparison.Ordinal);
        Assert.All(output.Split('\n'), l => Assert.True(l.TrimEnd('\r').Length <= 100, l));
    }

    [Fact]
    public void A_lot_whose_log_stopped_days_before_the_others_is_told_so_and_its_past_times_are_not_planned_for()
    {
        // Given two running lots of one strain: 26-301 last read on 2 Sep, 26-302 read up to 21 Sep
        using var folder = new Scratch();
        folder.Write("r/lots-2026.csv", "Lot,Yeast,Start Brix,Inoculated,Colour\n26-301,YB-R12,24.6,2026-09-01 08:00,red\n26-302,YB-R12,24.2,2026-09-20 08:00,red\n");
        folder.Write("r/log-2026.csv", "Lot,Timestamp,Brix,Temp °C\n26-301,2026-09-01 17:30,24.0,19.8\n26-301,2026-09-02 07:30,22.6,22.9\n26-301,2026-09-02 17:30,20.9,24.9\n"
            + "26-302,2026-09-20 17:30,23.9,19.5\n26-302,2026-09-21 07:30,22.8,22.0\n26-302,2026-09-21 17:30,21.0,24.5\n");
        string history = Path.Combine(AppContext.BaseDirectory, "demo-data", "history");

        // When forecast
        var (exit, output, _) = Cli.Run(folder.Root, "forecast", history, "--running", "r", "--out", "out");

        // Then the old lot's paragraph says how old its log is, that its one-third (3 Sep) is expected to be behind it and
        // asks for a reading now; the current lot is planned for as before
        Assert.Equal(0, exit);
        string flat = Cli.Flat(output);
        int old = flat.IndexOf("Lot 26-301 (YB-R12)", StringComparison.Ordinal), current = flat.IndexOf("Lot 26-302 (YB-R12)", StringComparison.Ordinal);
        Assert.True(old >= 0 && current > old, flat);
        string stale = flat[old..current], fresh = flat[current..];
        Assert.Contains("Thu 3 Sep", stale, StringComparison.Ordinal);
        Assert.Contains("by the forecast it has happened already: take a reading", stale, StringComparison.Ordinal);
        Assert.Contains("Its last reading was Wed 2 Sep 17:30, 19 day(s) before the latest reading of the running lots (Mon 21 Sep 17:30)", stale, StringComparison.Ordinal);
        Assert.Contains("next reading: now", stale, StringComparison.Ordinal);
        Assert.DoesNotContain("plan the nutrient addition", stale, StringComparison.Ordinal);
        Assert.Contains("plan the nutrient addition for the Tue evening check", fresh, StringComparison.Ordinal);
        Assert.DoesNotContain("last reading was", fresh, StringComparison.Ordinal);
    }

    [Fact]
    public void A_lot_past_its_peak_is_told_its_peak_is_behind_it_and_is_not_asked_to_cool_for_it()
    {
        // Given two running reds of one strain: 26-101 near dry, warmest (41.0 °C, over the 40 °C danger line) at the
        // Sun 07:30 reading and cooler since; 26-102 three readings in and warming
        using var folder = new Scratch();
        folder.Write("r/lots-2026.csv", "Lot,Yeast,Start Brix,Inoculated,Colour,Vessel,Volume L\n26-101,YB-R12,24.6,2026-09-10 10:00,red,Stainless tank,4200\n26-102,YB-R12,24.0,2026-09-13 10:00,red,Stainless tank,4200\n");
        folder.Write("r/log-2026.csv", "Lot,Timestamp,Brix,Temp °C\n"
            + "26-101,2026-09-10 17:30,24.3,19.0\n26-101,2026-09-11 07:30,23.0,24.5\n26-101,2026-09-11 17:30,20.9,30.5\n26-101,2026-09-12 07:30,17.2,36.0\n"
            + "26-101,2026-09-12 17:30,13.5,39.5\n26-101,2026-09-13 07:30,9.0,41.0\n26-101,2026-09-13 17:30,5.6,37.5\n26-101,2026-09-14 07:30,3.0,33.0\n26-101,2026-09-14 17:30,1.5,30.5\n"
            + "26-102,2026-09-13 17:30,23.7,19.0\n26-102,2026-09-14 07:30,22.6,21.0\n26-102,2026-09-14 17:30,20.5,23.5\n");
        string history = Path.Combine(AppContext.BaseDirectory, "demo-data", "history");

        // When forecast
        var (exit, output, _) = Cli.Run(folder.Root, "forecast", history, "--running", "r", "--out", "out");

        // Then the lot past its peak is told where its peak was, without a forecast peak interval; nothing asks to cool it
        // now; the warming lot keeps its forecast peak
        Assert.Equal(0, exit);
        string flat = Cli.Flat(output);
        int past = flat.IndexOf("Lot 26-101 (YB-R12", StringComparison.Ordinal), warming = flat.IndexOf("Lot 26-102 (YB-R12", StringComparison.Ordinal);
        Assert.True(past >= 0 && warming > past, flat);
        Assert.Contains("its peak, 41.0 °C at the Sun 13 Sep 07:30 reading, looks behind it (the readings since are cooler)", flat[past..warming], StringComparison.Ordinal);
        Assert.DoesNotContain("cool it now", flat[past..warming], StringComparison.Ordinal);
        Assert.Matches(@"at its peak rate \([\d.]+ °Brix/day\) it made about [\d.]+ kW of heat; past its peak it makes less", flat[past..warming]);
        Assert.Contains("what cooling must remove to hold it steady", flat[warming..], StringComparison.Ordinal);
        Assert.DoesNotContain("cool now", flat[..flat.IndexOf("Each lot in full", StringComparison.Ordinal)], StringComparison.Ordinal);
        Assert.Matches(@"peak \d+\.\d °C \(80 %: [\d.]+–[\d.]+\)", flat[warming..]);
    }

    [Fact]
    public void An_output_folder_outside_the_working_folder_is_named_whole_not_by_a_climb_up_from_it()
    {
        // Given the working folder and an output folder beside it (not below it)
        using var folder = new Scratch();
        using var elsewhere = new Scratch();
        Directory.CreateDirectory(folder.Root);

        // When the demo is forecast into it
        var (exit, output, _) = Cli.Run(folder.Root, "forecast", "--out", elsewhere.Root);

        // Then the console names the files by the folder as given, not as ../yb-fc-…; below the working folder it stays short
        Assert.Equal(0, exit);
        string flat = Cli.Flat(output);
        Assert.Contains($"Wrote {Path.Combine(elsewhere.Root, "forecast.json")}, ", flat, StringComparison.Ordinal);
        Assert.DoesNotContain("..", flat[flat.IndexOf("Wrote ", StringComparison.Ordinal)..], StringComparison.Ordinal);
        var (_, below, _) = Cli.Run(folder.Root, "forecast", "--out", "out");
        Assert.Contains($"Wrote {Path.Combine("out", "forecast.json")}, ", Cli.Flat(below), StringComparison.Ordinal);
    }

    [Fact]
    public void The_demo_console_opens_with_each_lots_next_step_the_lots_that_cannot_wait_first()
    {
        // Given the demo forecast's console (the fixture): 26-006 heads for 41 °C, 26-005 for a stuck end
        string[] lines = demo.Out.Split('\n').Select(l => l.TrimEnd('\r')).ToArray();
        int actNow = Array.IndexOf(lines, "Act now (2 lot(s)):");
        int full = Array.IndexOf(lines, "Each lot in full:");

        // Then the to-do list comes before the lots in full: the overheating lot first, then the stuck one, then by day
        Assert.True(actNow > 0 && full > actNow, demo.Out);
        Assert.StartsWith("  26-006 YB-R31 cool now: peak 41.4 °C expected, over the 40 °C danger threshold", lines[actNow + 1], StringComparison.Ordinal);
        Assert.StartsWith("  26-005 YB-R12 stuck risk 100 %: check nitrogen and temperature, plan a restart", lines[actNow + 3], StringComparison.Ordinal);
        Assert.Equal("Tomorrow, Sat 19 Sep (1 lot(s)):", lines[actNow + 5]);
        Assert.Equal("  26-009  YB-R44  10:38  nutrient at one-third, 16.3 °Brix (80 % 08:27–13:03); read 22:00", lines[actNow + 6]);
        Assert.Equal("Later (7 lot(s)):", lines[actNow + 7]);
        Assert.Equal(10, lines[actNow..full].Count(l => l.StartsWith("  26-0", StringComparison.Ordinal)));
    }

    [Fact]
    public void The_forecast_workbook_gives_each_lot_its_next_step_as_the_console_does()
    {
        // Given the demo forecast's workbook, sheet "Forecast" (read with ExcelDataReader, independent of the writer)
        System.Text.Encoding.RegisterProvider(System.Text.CodePagesEncodingProvider.Instance);
        using var stream = File.OpenRead(Path.Combine(demo.First, "forecast.xlsx"));
        using var reader = ExcelDataReader.ExcelReaderFactory.CreateReader(stream);
        var rows = new List<string[]>();
        while (reader.Read())
        {
            rows.Add(Enumerable.Range(0, reader.FieldCount).Select(i => Convert.ToString(reader.GetValue(i), CultureInfo.InvariantCulture) ?? string.Empty).ToArray());
        }

        // Then each lot's row says when its next step falls and what it is, the overheating and the stuck lot first
        int header = rows.FindIndex(r => r.Contains("Next step falls"));
        Assert.True(header >= 0, "no header");
        int lot = Array.IndexOf(rows[header], "Lot"), day = Array.IndexOf(rows[header], "Next step falls"), step = Array.IndexOf(rows[header], "Next step (what cannot wait first)");
        string[] Of(string id) => rows.Single(r => r[lot] == id);
        Assert.Equal("act now", Of("26-006")[day]);
        Assert.StartsWith("cool now: peak 41.4 °C expected, over the 40 °C danger threshold; nutrient at one-third, 17.8 °Brix", Of("26-006")[step], StringComparison.Ordinal);
        Assert.Equal("act now", Of("26-005")[day]);
        Assert.StartsWith("stuck risk 100 %: check nitrogen and temperature, plan a restart; dry not expected", Of("26-005")[step], StringComparison.Ordinal);
        Assert.Equal("tomorrow", Of("26-009")[day]);
        Assert.Equal("nutrient at one-third, 16.3 °Brix (80 % 08:27–13:03)", Of("26-009")[step]);
        Assert.Equal("later", Of("26-001")[day]);
    }

    [Fact]
    public void A_large_cellar_gets_one_line_a_lot_and_the_full_forecasts_in_the_files()
    {
        // Given 40 running lots (more than the 12 printed in full), inoculated an hour apart, each read three times up to
        // the same evening round
        using var folder = new Scratch();
        var lots = new StringBuilder("Lot,Yeast,Start Brix,Inoculated,Colour,Must volume (L)\n");
        var log = new StringBuilder("Lot,Timestamp,Brix,Temp °C\n");
        var end = new DateTime(2026, 9, 17, 18, 0, 0);
        for (int i = 1; i <= 40; i++)
        {
            string id = $"26-4{i:00}";
            var inoculated = new DateTime(2026, 9, 14, 8, 0, 0).AddHours(i);
            lots.Append(CultureInfo.InvariantCulture, $"{id},YB-R12,24.5,{inoculated:yyyy-MM-dd HH:mm},red,4000\n");
            for (int k = 2; k >= 0; k--)
            {
                var at = end.AddHours(-10 * k);
                double hours = (at - inoculated).TotalHours;
                log.Append(CultureInfo.InvariantCulture, $"{id},{at:yyyy-MM-dd HH:mm},{24.4 - (0.1 * Math.Max(0, hours - 12)):0.0},{18 + (0.12 * hours):0.0}\n");
            }
        }

        folder.Write("r/lots-2026.csv", lots.ToString());
        folder.Write("r/log-2026.csv", log.ToString());
        string history = Path.Combine(AppContext.BaseDirectory, "demo-data", "history");

        // When forecast
        var (exit, output, _) = Cli.Run(folder.Root, "forecast", history, "--running", "r", "--out", "out");

        // Then each lot is one line of the to-do list (no paragraph per lot), the console stays short, the lots in full
        // are pointed to in the files, which hold all 40, and the cautions are kept
        Assert.Equal(0, exit);
        string[] lines = output.Split('\n').Select(l => l.TrimEnd('\r')).ToArray();
        Assert.Equal(40, lines.Count(l => l.StartsWith("  26-4", StringComparison.Ordinal)));
        Assert.DoesNotContain("Lot 26-401 (", output, StringComparison.Ordinal);
        Assert.True(lines.Length < 100, $"{lines.Length} lines:\n{output}");
        Assert.Contains("more than 12 lots, so not printed here): out/forecast.xlsx, sheet \"Forecast\", and out/forecast.json.", Cli.Flat(output), StringComparison.Ordinal);
        Assert.Contains("carbon dioxide", Cli.Flat(output), StringComparison.Ordinal);
        using var json = JsonDocument.Parse(File.ReadAllText(Path.Combine(folder.Root, "out", "forecast.json")));
        Assert.Equal(40, json.RootElement.GetProperty("lots").GetArrayLength());
        Assert.All(lines, l => Assert.True(l.Length <= 100, l));
    }

    [Fact]
    public void A_history_of_lots_without_logs_is_told_to_add_the_logs()
    {
        // Given the demo's 2025 lots table alone as the history (no log file) and the demo's running harvest
        using var folder = new Scratch();
        string demo = Path.Combine(AppContext.BaseDirectory, "demo-data");

        // When forecast
        var (exit, output, error) = Cli.Run(folder.Root, "forecast", Path.Combine(demo, "history", "tallowmere-2025-lots.csv"), "--running", Path.Combine(demo, "running"), "--out", "out", "--quiet");

        // Then it stops with the reason (no past log) and what to add, not a count of fitted curves
        Assert.Equal(1, exit);
        string flat = Cli.Flat(error);
        Assert.Contains("forecast: the forecast cannot be made: The history holds no fermentation log that belongs to one of its finished lots", flat, StringComparison.Ordinal);
        Assert.Contains("Add the past seasons' logs", flat, StringComparison.Ordinal);
        Assert.DoesNotContain("Parameter", flat, StringComparison.Ordinal);
        Assert.DoesNotContain("Lot 26-", Cli.Flat(output), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("the lots still fermenting are missing", "forecast", "demo-data-copy")]
    [InlineData("the history is missing", "forecast", "--running", "demo-data-copy")]
    [InlineData("'--no-such-option' is not an option of forecast", "forecast", "--no-such-option")]
    [InlineData("the input 'x.csv' was not found", "forecast", "demo-data-copy", "--running", "x.csv")]
    [InlineData("--season 20 is not a year", "forecast", "--season", "20")]
    public void A_command_line_that_is_not_understood_exits_2_before_any_work(string expected, params string[] args)
    {
        using var folder = new Scratch();
        folder.Write("demo-data-copy/a.csv", "Lot,Yeast,Brix,Alcohol % v/v\n");
        var (exit, output, error) = Cli.Run(folder.Root, args);
        Assert.Equal(2, exit);
        Assert.Equal(string.Empty, output);
        Assert.Contains(expected, Cli.Flat(error), StringComparison.Ordinal);
        Assert.False(Directory.Exists(Path.Combine(folder.Root, "yieldbench-forecast")));
    }

    [Fact]
    public void A_folder_holding_the_users_own_files_is_not_written_into()
    {
        using var folder = new Scratch();
        folder.Write("mine/notes.txt", "my notes");
        var (exit, _, error) = Cli.Run(folder.Root, "forecast", "--out", "mine", "--quiet");
        Assert.Equal(2, exit);
        Assert.Contains("holds files this tool did not write", Cli.Flat(error), StringComparison.Ordinal);
        Assert.Equal(["notes.txt"], Directory.GetFiles(Path.Combine(folder.Root, "mine")).Select(Path.GetFileName));
    }

    private sealed class Scratch : IDisposable
    {
        public string Root { get; } = Path.Combine(Path.GetTempPath(), "yb-fc-" + Guid.NewGuid().ToString("N"));

        public void Write(string relative, string text)
        {
            string path = Path.Combine(Root, relative);
            Directory.CreateDirectory(Path.GetDirectoryName(path)!);
            File.WriteAllText(path, text);
        }

        public void Dispose()
        {
            try
            {
                Directory.Delete(Root, recursive: true);
            }
            catch (IOException)
            {
            }
        }
    }
}
