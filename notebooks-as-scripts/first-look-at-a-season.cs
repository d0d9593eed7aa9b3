#:project ../src/YieldBench.Intake/YieldBench.Intake.csproj
// Worked analysis 1: a first look at one season of the demo cellar.
// Question: what did the 2023 cellar record, is every row accounted for, and which lots stand out on a first pass?
// Run from the repository: dotnet run notebooks-as-scripts/first-look-at-a-season.cs
using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Statistics;
using YieldBench.Intake;

const int season = 2023;
var inv = CultureInfo.InvariantCulture;
string F(double v, string f = "0.00") => double.IsFinite(v) ? v.ToString(f, inv) : "n/a";
string root = FindRoot();
string demo = Path.Combine(root, "demo-data", "history");

Console.WriteLine($"# A first look at the {season} season of the invented demo cellar");
Console.WriteLine();
Console.WriteLine("Step 1. Read every file in demo-data/history/ with the same intake the review uses. Intake accounts for every row:");
Console.WriteLine("each one is used as a lot or a log reading, reported as a problem, or skipped as blank or as a summary line.");
var set = IntakeReader.Read([demo], new IntakeOptions());
foreach (var a in set.Accounts)
{
    Console.WriteLine($"  {Path.GetFileName(a.File),-36} {a.Sheet ?? "(csv)",-14} rows {a.RowsRead,5}  lots {a.LotsUsed,3}  readings {a.LogReadingsUsed,5}  reported {a.RowsReported}  blank {a.BlankRowsSkipped}  summary {a.SummaryRowsSkipped}  balances: {a.Balances}");
}

if (set.Accounts.Any(a => !a.Balances))
{
    throw new InvalidOperationException("A sheet's row accounting does not balance; intake lost rows.");
}

Console.WriteLine();
Console.WriteLine("Issues by code (warnings keep the row, errors leave it out):");
foreach (var g in set.Issues.GroupBy(i => (i.Code, i.Severity)).OrderBy(g => g.Key.Code, StringComparer.Ordinal))
{
    Console.WriteLine($"  {g.Key.Code} ({g.Key.Severity}): {g.Count()}");
}

var lots = set.Lots.Where(l => l.Season == season).ToArray();
Console.WriteLine();
Console.WriteLine($"Step 2. The {season} season: {lots.Length} lots.");
Console.WriteLine("  by colour: " + string.Join(", ", lots.GroupBy(l => l.Colour).OrderBy(g => g.Key).Select(g => $"{g.Key} {g.Count()}")));
Console.WriteLine("  by strain: " + string.Join(", ", lots.GroupBy(l => l.Strain).OrderBy(g => g.Key, StringComparer.Ordinal).Select(g => $"{g.Key} {g.Count()}")));
Console.WriteLine("  by vessel: " + string.Join(", ", lots.GroupBy(l => $"{l.Vessel} {l.VesselCapacityL:0} L").OrderBy(g => g.Key, StringComparer.Ordinal).Select(g => $"{g.Key} ×{g.Count()}")));

var brix = Descriptive.ToSortedArray(lots.Select(l => l.StartingSugar.Brix));
var abv = Descriptive.ToSortedArray(lots.Select(l => l.FinalAlcohol.PercentVolume));
Console.WriteLine();
Console.WriteLine("Starting sugar and final alcohol (quartiles by Hyndman–Fan type 7, as R's default quantile):");
Console.WriteLine($"  starting sugar °Brix: min {F(brix[0], "0.0")}, Q1 {F(Descriptive.QuantileOfSorted(brix, 0.25), "0.0")}, median {F(Descriptive.MedianOfSorted(brix), "0.0")}, Q3 {F(Descriptive.QuantileOfSorted(brix, 0.75), "0.0")}, max {F(brix[^1], "0.0")}");
Console.WriteLine($"  final alcohol % v/v:  min {F(abv[0])}, Q1 {F(Descriptive.QuantileOfSorted(abv, 0.25))}, median {F(Descriptive.MedianOfSorted(abv))}, Q3 {F(Descriptive.QuantileOfSorted(abv, 0.75))}, max {F(abv[^1])}");

Console.WriteLine();
Console.WriteLine("Step 3. Conversion per lot. abv_per_brix = final alcohol ÷ effective starting °Brix, where the effective");
Console.WriteLine("sugar applies recorded water and sugar additions by mass balance on dissolved solids (docs/methods.md).");
var conv = lots.Select(l => ConversionFactors.For(l, SugarModel.Default)).ToArray();
var corrected = conv.Where(c => c.AdditionsApplied).ToArray();
Console.WriteLine($"  {corrected.Length} lots had recorded additions; for them the measured and effective sugar differ:");
foreach (var c in corrected.Take(6))
{
    Console.WriteLine($"    {c.Lot.LotId}: measured {F(c.Lot.StartingSugar.Brix, "0.0")} °Brix, water {F(c.Lot.Additions.WaterAddedL ?? 0, "0")} L, sugar {F(c.Lot.Additions.SugarAddedKg ?? 0, "0.0")} kg on {F(c.Lot.Additions.MustVolumeL ?? 0, "0")} L → effective {F(c.EffectiveStartingBrix, "0.0")} °Brix");
}

Console.WriteLine();
Console.WriteLine("  abv_per_brix by strain (median, MAD scaled to the normal SD, n):");
foreach (var g in conv.GroupBy(c => c.Lot.Strain).OrderBy(g => g.Key, StringComparer.Ordinal))
{
    var values = g.Select(c => c.AbvPerBrix).ToArray();
    Console.WriteLine($"    {g.Key}: {F(Descriptive.Median(values), "0.000")}  (MAD {F(Robust.Mad(values), "0.000")}, n {values.Length})");
}

Console.WriteLine();
Console.WriteLine("Step 4. A first screen: lots whose factor sits far from their strain's median (modified z of Iglewicz and");
Console.WriteLine("Hoaglin, |M| > 3.5). The full review adds more detectors and a reason and a follow-up for each flag.");
foreach (var g in conv.GroupBy(c => c.Lot.Strain).OrderBy(g => g.Key, StringComparer.Ordinal))
{
    var values = g.Select(c => c.AbvPerBrix).ToArray();
    double median = Descriptive.Median(values), rawMad = Robust.RawMad(values);
    foreach (var c in g.OrderBy(c => c.Lot.LotId, StringComparer.Ordinal))
    {
        double m = Robust.ModifiedZ(c.AbvPerBrix, median, rawMad);
        if (Math.Abs(m) > 3.5)
        {
            Console.WriteLine($"    {c.Lot.LotId} ({g.Key}): abv_per_brix {F(c.AbvPerBrix, "0.000")} vs strain median {F(median, "0.000")}, M = {F(m, "0.0")}; recorded {F(c.Lot.StartingSugar.Brix, "0.0")} °Brix → {F(c.Lot.FinalAlcohol.PercentVolume)} % v/v; notes: {c.Lot.Notes ?? "none"}");
        }
    }
}

Console.WriteLine();
Console.WriteLine("What to take from this: the low lots are where to look first for a starting-sugar mistake or an addition");
Console.WriteLine("nobody wrote down (demo-data/README.md lists what was planted). Any estimate here is for review only:");
Console.WriteLine("a label's alcohol statement needs a lab analysis and the local rules (docs/cautions.md).");

static string FindRoot()
{
    var dir = new DirectoryInfo(Environment.CurrentDirectory);
    while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "YieldBench.sln")))
    {
        dir = dir.Parent;
    }

    return dir?.FullName ?? throw new InvalidOperationException("Run from inside the repository (YieldBench.sln not found).");
}
