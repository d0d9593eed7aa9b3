using System.Globalization;
using System.Text;
using CsCheck;
using Xunit.Abstractions;

namespace YieldBench.Cli.Tests;

/// <summary>
/// Random small cellars — one lot, identical factors, one strain, odd text, extreme but valid numbers, short logs —
/// written as CSV files and run through the whole command in-process (intake, review, every renderer): nothing
/// throws, every account balances, the exit code is 0 or 1, and a second run writes byte-identical files. Seeded and
/// bounded in time (YB_GENERATIVE_SECONDS, default 60; YB_GENERATIVE_SEED to replay a failure CsCheck printed).
/// </summary>
public sealed class GenerativeReviewTests(ITestOutputHelper output)
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>One lot as a CSV row's values.</summary>
    public sealed record GenLot(string Id, int Season, string Strain, string? Vessel, double Brix, double Abv, double? Rs, double? Volume, double? Water, double? Sugar, string? Notes);

    /// <summary>One log reading.</summary>
    public sealed record GenReading(string LotId, int Season, int Hour, double? Brix, double? Temp);

    /// <summary>A small cellar: its lots, its log readings, and whether its sugar is written as SG.</summary>
    public sealed record Cellar(GenLot[] Lots, GenReading[] Readings, bool Sg)
    {
        public override string ToString() => $"{Lots.Length} lots, {Readings.Length} readings, SG {Sg}: " + string.Join("; ", Lots.Take(4).Select(l => $"{l.Id}/{l.Season} {l.Strain} {l.Brix}→{l.Abv}"));
    }

    private static readonly string[] StrainPool = ["YB-R12", "yb r12", "QX-7", "Ω-9", "ZZ\u000bR1", "A", "N05\u001b[1m", "L'Été", "=1+1", "99"];

    private static readonly string[] VesselPool = ["Barrel", "barrel", "Stainless tank", "Tank/Vessel 3", "egg", "x,y"];

    private static readonly string[] NotePool = ["", "cool ferment", "line one\vline two", "\"quoted\"", "@SUM(A1)", new string('n', 40_000)];

    /// <summary>Lots of one kind of cellar: 0 ordinary, 1 identical factors, 2 a single lot, 3 extreme values, 4 one strain.</summary>
    private static Gen<GenLot[]> LotsOf(int mode) =>
        Gen.Select(Gen.Int[1, mode == 2 ? 1 : 14], Gen.Int[1, mode == 4 ? 1 : 4], Gen.Int[1, 3], Gen.Int[0, int.MaxValue], (count, strains, seasons, seed) => MakeLots(mode, count, strains, seasons, seed));

    private static GenLot[] MakeLots(int mode, int count, int strains, int seasons, int seed)
    {
        var r = new Random(seed);
        var lots = new GenLot[count];
        for (int i = 0; i < count; i++)
        {
            double brix = mode switch
            {
                1 => 24.0,
                3 => r.Next(3) switch { 0 => 10.0, 1 => 40.0, _ => Math.Round(10 + (30 * r.NextDouble()), 1) },
                _ => Math.Round(19 + (9 * r.NextDouble()), 1),
            };
            double factor = mode == 1 ? 0.5776 : 0.53 + (0.09 * r.NextDouble());
            double abv = Math.Clamp(Math.Round(brix * factor, 2), 3, 20);
            bool additions = r.Next(5) == 0;
            lots[i] = new GenLot(
                $"L{i:00}",
                2020 + r.Next(seasons),
                StrainPool[r.Next(strains)],
                r.Next(4) == 0 ? null : VesselPool[r.Next(VesselPool.Length)],
                brix,
                abv,
                mode == 3 && r.Next(3) == 0 ? 0 : Math.Round(r.NextDouble() * 4, 1),
                additions || r.Next(3) == 0 ? 500 + r.Next(9500) : null,
                additions ? r.Next(200) : null,
                additions && r.Next(2) == 0 ? r.Next(100) : null,
                NotePool[r.Next(NotePool.Length)]);
        }

        return lots;
    }

    private static Gen<Cellar> Cellars { get; } =
        Gen.Int[0, 4].SelectMany(mode => LotsOf(mode)).SelectMany(lots => Gen.Select(Gen.Int[0, int.MaxValue], Gen.Bool, (seed, sg) =>
        {
            // Logs for some lots: one reading, all at one time, or a declining course with temperatures
            var r = new Random(seed);
            var readings = new List<GenReading>();
            foreach (var lot in lots.Where(_ => r.Next(2) == 0))
            {
                int n = r.Next(1, 9);
                bool oneTime = r.Next(6) == 0;
                for (int k = 0; k < n; k++)
                {
                    double brix = Math.Max(-2, lot.Brix - (k * (lot.Brix + 2) / Math.Max(1, n - 1)));
                    readings.Add(new GenReading(lot.Id, lot.Season, oneTime ? 0 : k * (12 + r.Next(24)), r.Next(8) == 0 ? null : Math.Round(brix, 1), r.Next(8) == 0 ? null : Math.Round(-5 + (50 * r.NextDouble()), 1)));
                }
            }

            return new Cellar(lots, [.. readings], sg);
        }));

    private static string Field(string text) =>
        text.IndexOfAny([',', '"', '\n', '\r', '\v']) >= 0 ? "\"" + text.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"" : text;

    private static string N(double? v) => v is { } d ? d.ToString("0.###", Inv) : "";

    /// <summary>Writes the cellar as a lots CSV and a log CSV in a new folder.</summary>
    private static string WriteCellar(Cellar cellar)
    {
        string folder = Path.Combine(Path.GetTempPath(), "yb-gen-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Path.Combine(folder, "in"));
        var lots = new StringBuilder(cellar.Sg
            ? "Lot,Vintage,Yeast,Vessel,Must SG,Alcohol % v/v,RS (g/L),Must volume (L),Water added (L),Sugar added (kg),Notes\n"
            : "Lot,Vintage,Yeast,Vessel,Start Brix,Alcohol % v/v,RS (g/L),Must volume (L),Water added (L),Sugar added (kg),Notes\n");
        foreach (var l in cellar.Lots)
        {
            double sugar = cellar.Sg ? Math.Round(YieldBench.Core.Units.SugarReading.FromBrix(l.Brix).SpecificGravity, 4) : l.Brix;
            lots.Append(string.Join(',', Field(l.Id), l.Season.ToString(Inv), Field(l.Strain), Field(l.Vessel ?? ""), N(sugar), N(l.Abv), N(l.Rs), N(l.Volume), N(l.Water), N(l.Sugar), Field(l.Notes ?? ""))).Append('\n');
        }

        File.WriteAllText(Path.Combine(folder, "in", "lots.csv"), lots.ToString(), new UTF8Encoding(false));
        if (cellar.Readings.Length > 0)
        {
            var log = new StringBuilder("Lot,Vintage,Timestamp,Brix,Temp °C\n");
            var start = new DateTime(2020, 9, 1, 8, 0, 0);
            foreach (var g in cellar.Readings)
            {
                log.Append(CultureInfo.InvariantCulture, $"{Field(g.LotId)},{g.Season},{start.AddYears(g.Season - 2020).AddHours(g.Hour):yyyy-MM-dd HH:mm},{N(g.Brix)},{N(g.Temp)}\n");
            }

            File.WriteAllText(Path.Combine(folder, "in", "logs.csv"), log.ToString(), new UTF8Encoding(false));
        }

        return folder;
    }

    /// <summary>Every file under a folder with its bytes, by relative path.</summary>
    private static SortedDictionary<string, byte[]> Files(string folder) =>
        new(Directory.EnumerateFiles(folder, "*", SearchOption.AllDirectories).ToDictionary(f => Path.GetRelativePath(folder, f), File.ReadAllBytes), StringComparer.Ordinal);

    private static void Review(Cellar cellar)
    {
        string folder = WriteCellar(cellar);
        try
        {
            var check = Cli.Run(folder, "check", "in");
            Assert.True(check.Exit is 0 or 1, $"check exited {check.Exit}: {check.Error}");
            Assert.Contains("Result: ", check.Out, StringComparison.Ordinal);
            Assert.DoesNotContain("does not balance", check.Out, StringComparison.OrdinalIgnoreCase);

            var first = Cli.Run(folder, "review", "in", "--out", "a", "--quiet");
            var second = Cli.Run(folder, "review", "in", "--out", "b", "--quiet");
            foreach (var run in new[] { first, second })
            {
                Assert.True(run.Exit is 0 or 1, $"review exited {run.Exit}: {run.Error}");
                Assert.DoesNotContain("Exception", run.Error, StringComparison.Ordinal);
                Assert.DoesNotContain("   at ", run.Error, StringComparison.Ordinal);
            }

            var a = Files(Path.Combine(folder, "a"));
            var b = Files(Path.Combine(folder, "b"));
            Assert.Contains("report.xlsx", a.Keys);
            Assert.Equal(a.Keys, b.Keys);
            foreach (var (name, bytes) in a)
            {
                Assert.True(bytes.AsSpan().SequenceEqual(b[name]), $"{name} differs between two runs of the same inputs");
            }
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    [Fact]
    public void Random_small_cellars_go_through_intake_review_and_every_renderer_without_a_failure()
    {
        int seconds = int.TryParse(Environment.GetEnvironmentVariable("YB_GENERATIVE_SECONDS"), NumberStyles.None, Inv, out int s) ? s : 60;
        string? seed = Environment.GetEnvironmentVariable("YB_GENERATIVE_SEED");
        int runs = 0;
        Cellars.Sample(
            cellar =>
            {
                runs++;
                Review(cellar);
            },
            writeLine: output.WriteLine,
            seed: seed ?? "0N0XIzNsQ0O2",
            iter: seed is null ? 1_000_000 : 1,
            time: seconds,
            threads: 1);
        output.WriteLine($"{runs} cellars reviewed in at most {seconds} s");
        Assert.True(runs >= 3, $"only {runs} cellars were reviewed in {seconds} s");
    }
}
