#:project ../src/YieldBench.Intake/YieldBench.Intake.csproj
// Worked analysis 5: when to add nutrients.
// Question: a tank of this harvest has had its first readings; when will it reach one-third sugar depletion (the
// usual moment for a nutrient addition), how sure is that, and when is the next reading worth most? One tank of the
// demo's harvest in progress, followed reading by reading.
// Run from the repository: dotnet run notebooks-as-scripts/when-to-add-nutrients.cs
using System.Globalization;
using YieldBench.Core.Forecast;
using YieldBench.Core.Lots;
using YieldBench.Intake;

var inv = CultureInfo.InvariantCulture;
string F(double v, string f = "0.0") => double.IsFinite(v) ? v.ToString(f, inv) : "n/a";
string root = FindRoot();
var settings = ForecastSettings.Default;

Console.WriteLine("# When to add nutrients");
Console.WriteLine();
Console.WriteLine("A second nutrient addition is usually made when about a third of the sugar has gone (common practice): early");
Console.WriteLine("enough for the yeast to use it, late enough not to feed spoilage organisms at the start. Cellars catch the moment by");
Console.WriteLine("reading the tank twice a day and extrapolating by eye. The forecast learns how each strain ferments in this cellar");
Console.WriteLine("from past seasons' logs and updates that with every reading of the tank.");
Console.WriteLine();

var history = IntakeReader.Read([Path.Combine(root, "demo-data", "history")], new IntakeOptions());
var running = IntakeReader.Read([Path.Combine(root, "demo-data", "running")], new IntakeOptions { RunningLots = true });
Console.WriteLine($"History: {history.Lots.Count} finished lots of {string.Join(", ", history.Seasons)}, {history.Logs.Count} with a log. Running: {running.RunningLots.Count} lots of 2026.");

// Learn once from the history (the whole-course fits and the priors), then forecast the tank as its readings come in.
var courses = LotCourses.FromHistory(history.Lots, history.Logs);
var past = courses.Select(c => LoggedEvents.Read(c, settings)).ToArray();
var (form, ratio) = ForecastRunner.ChooseForm(past, settings);
var model = ForecastModel.Train(past, form, settings);
Console.WriteLine($"The modified {form.ToString().ToLowerInvariant()} curve of Zwietering et al. (1990) fits the past logs better (median log ratio of residual sums of squares {F(ratio, "0.00")}).");
Console.WriteLine($"Reading noise learnt from them: {F(model.SugarSd, "0.00")} °Brix; seasons may run {F(model.SeasonSpread * 100, "0")} % faster or slower than the history.");
Console.WriteLine();

var tank = running.RunningLots.Single(l => l.LotId == "26-003");
var log = running.Logs.Single(l => l.LotId == tank.LotId);
Console.WriteLine($"## Lot {tank.LotId}: {tank.Variety}, {F(tank.Additions.MustVolumeL ?? double.NaN, "0")} L in a {F(tank.VesselCapacityL ?? double.NaN, "0")} L {tank.Vessel}, strain {tank.Strain}, {F(tank.StartingSugar.Brix)} °Brix at crush");
Console.WriteLine($"Inoculated {tank.InoculationDate!.Value.ToString("ddd d MMM HH:mm", inv)}; one-third depletion means {F(tank.StartingSugar.Brix * 2 / 3)} °Brix on the hydrometer.");
Console.WriteLine($"{model.LotsOfStrain(tank.Strain)} past lots of {tank.Strain} teach the forecast its usual lag and rate.");
Console.WriteLine();
Console.WriteLine("The forecast of one-third depletion as the readings come in (80 % of outcomes fall inside the interval):");
var readings = log.Readings.OrderBy(r => r.Timestamp).ToArray();
for (int k = 0; k <= readings.Length; k++)
{
    var soFar = new FermentationLog(log.LotId, log.Season, readings.Take(k).ToArray());
    var f = ForecastRunner.Run(Array.Empty<Lot>(), [], [tank], [soFar], settings, model).Lots[0];
    var c = f.Course;
    var third = f.OneThirdHours!.Value;
    string seen = k == 0 ? "before any reading      " : $"after {readings[k - 1].Timestamp.ToString("ddd HH:mm", inv)} ({F(readings[k - 1].Sugar!.Value.Brix)} °Bx)";
    double width = third.High - third.Low;
    Console.WriteLine($"  {seen}: {ForecastSentences.When(c.At(third.Median))}  (80 %: {ForecastSentences.Span(c.At(third.Low), c.At(third.High))}, {F(width, "0")} h wide)");
}

Console.WriteLine();
var now = ForecastRunner.Run(Array.Empty<Lot>(), [], [tank], [log], settings, model).Lots[0];
Console.WriteLine("Today's forecast in words:");
foreach (var line in ForecastSentences.Lot(now))
{
    Console.WriteLine("  " + line.Trim());
}

Console.WriteLine();
Console.WriteLine("How to read it:");
Console.WriteLine("- Early on the interval is as wide as the strain's spread between lots: a white tank at 15 °C ferments slowly, and");
Console.WriteLine("  a day of readings says little about a rate that shows itself over a week. Each reading narrows it.");
Console.WriteLine($"- The next reading worth most is the one named above ({ForecastSentences.When(now.Course.At(now.NextReadingHours))}): the earliest at which one reading");
Console.WriteLine("  would halve the uncertainty of the one-third time. Take it, then plan the addition for the round nearest the");
Console.WriteLine("  forecast — and confirm with the reading on the day: the forecast guides when to measure, it does not replace it.");
Console.WriteLine("- The backtest (yieldbench forecast, docs/performance.md) says how far to trust this: on the demo history whites'");
Console.WriteLine("  one-third times after three readings miss by about 15 h on average, reds' by about 3 h.");
Console.WriteLine();
Console.WriteLine("Cautions: " + string.Join(" ", ForecastSentences.Cautions));

static string FindRoot()
{
    var dir = new DirectoryInfo(Environment.CurrentDirectory);
    while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "YieldBench.sln")))
    {
        dir = dir.Parent;
    }

    return dir?.FullName ?? throw new DirectoryNotFoundException("Run this from inside the repository (YieldBench.sln not found).");
}
