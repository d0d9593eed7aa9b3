#:project ../src/YieldBench.Intake/YieldBench.Intake.csproj
// Worked analysis 4: the ferment that ran hot.
// Question: which ferment got dangerously hot, when, how much hotter could it have got, and what does that mean in
// the cellar? Run from the repository: dotnet run notebooks-as-scripts/the-ferment-that-ran-hot.cs
using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Kinetics;
using YieldBench.Intake;

var inv = CultureInfo.InvariantCulture;
string F(double v, string f = "0.0") => double.IsFinite(v) ? v.ToString(f, inv) : "n/a";
string T(DateTime t) => t.ToString("yyyy-MM-dd HH:mm", inv);
string root = FindRoot();

Console.WriteLine("# The ferment that ran hot");
Console.WriteLine();
Console.WriteLine("Yeast make heat as they ferment. Ferments slow when they run hot and can stop near 38–40 °C (Ough and Amerine");
Console.WriteLine("1966 report sluggish ferments above about 29 °C and stopping near 38 °C); heat also drives off alcohol and aroma.");
Console.WriteLine("The kinetics analysis reads every fermentation log, finds each lot's peak and the hours spent above a caution and");
Console.WriteLine("a danger threshold (reds 35 / 40 °C, whites and rosés 20 / 25 °C by default, common practice), and works out the");
Console.WriteLine("temperature the remaining sugar could still have reached with no cooling at all.");
Console.WriteLine();

var set = IntakeReader.Read([Path.Combine(root, "demo-data", "history")], new IntakeOptions());
var lots = set.Lots.Select(l => ConversionFactors.For(l, SugarModel.Default)).ToArray();
var settings = KineticsSettings.Default;
var review = KineticsAnalysis.Run(lots, set.Logs, settings);
Console.WriteLine($"{review.Lots.Count} lots have a log ({review.Lots.Count(l => l.Dense)} of them dense probe records).");
Console.WriteLine();
Console.WriteLine("The five hottest ferments:");
foreach (var k in review.Lots.Where(l => l.PeakTemperatureC is not null).OrderByDescending(l => l.PeakTemperatureC).Take(5))
{
    Console.WriteLine($"  {k.Lot.LotId} {k.Lot.Variety} in {k.Lot.Vessel} ({k.Lot.Strain}): peak {F(k.PeakTemperatureC!.Value)} °C at {T(k.PeakTemperatureAt!.Value)}; {F(k.HoursAboveCaution)} h above {F(k.Thresholds.CautionC, "0")} °C, {F(k.HoursAboveDanger)} h above {F(k.Thresholds.DangerC, "0")} °C");
}

var hot = review.Lots.Where(l => l.PeakTemperatureC is not null).MaxBy(l => l.PeakTemperatureC!.Value)!;
Console.WriteLine();
Console.WriteLine($"## Lot {hot.Lot.LotId}: {hot.Lot.Variety}, {F(hot.Lot.Additions.MustVolumeL ?? double.NaN, "0")} L in a {F(hot.Lot.VesselCapacityL ?? double.NaN, "0")} L {hot.Lot.Vessel}, strain {hot.Lot.Strain}");
Console.WriteLine($"Cellar notes: {hot.Lot.Notes ?? "none"}");
Console.WriteLine($"Log: {hot.Sugar.Count} sugar readings, {(hot.Dense ? "dense probe record" : "hand readings")}, median spacing {F(hot.MedianSpacingHours ?? double.NaN, "0.00")} h.");
Console.WriteLine($"Started at {F(hot.StartingBrix)} °Brix; lag {F(hot.LagHours ?? double.NaN)} h; fastest {F(hot.MaxRateBrixPerDay ?? double.NaN)} °Brix/day at {(hot.MaxRateAt is { } m ? T(m) : "n/a")}; one-third of the sugar gone at {(hot.OneThirdAt is { } o ? T(o) : "n/a")}; dry at {(hot.DryAt is { } d ? T(d) : "not reached")}.");
Console.WriteLine();
Console.WriteLine("Every six hours around the peak (°Brix, °C, and the temperature the remaining sugar could still reach with no heat removed):");
var window = hot.Heat.Where(h => Math.Abs((h.Time - hot.PeakTemperatureAt!.Value).TotalHours) <= 48).ToArray();
DateTime next = DateTime.MinValue;
foreach (var h in window)
{
    if (h.Time < next)
    {
        continue;
    }

    next = h.Time.AddHours(6);
    string mark = h.TemperatureC > hot.Thresholds.DangerC ? "  ← above danger" : h.TemperatureC > hot.Thresholds.CautionC ? "  ← above caution" : "";
    Console.WriteLine($"  {T(h.Time)}  {F(h.Brix, "0.00"),6} °Brix  {F(h.TemperatureC),5} °C  could reach {F(h.PotentialTemperatureC),5} °C{mark}");
}

Console.WriteLine();
if (hot.PotentialPeak is { } pp)
{
    Console.WriteLine($"At {T(pp.Time)}, with {F(pp.Brix)} °Brix left and the must at {F(pp.TemperatureC)} °C, this lot could have reached {F(pp.PotentialTemperatureC)} °C without cooling.");
    Console.WriteLine($"The potential rise is sugar g/L ÷ 180.16 g/mol × {F(settings.HeatOfFermentationKjPerMol, "0.0")} kJ/mol ÷ (must density × {F(settings.MustHeatCapacityKjPerKgK, "0.0")} kJ/(kg·K)): {F(pp.SugarGl, "0")} g/L gives {F(pp.PotentialRiseK)} K.");
}

if (hot.HeatRemovedK is { } removed)
{
    Console.WriteLine($"Heat removed (potential peak − observed peak): {F(removed)} K — the cooling and the vessel's losses did that much.");
}

Console.WriteLine();
Console.WriteLine("Findings the review reports for this lot:");
foreach (var f in review.Findings.Where(f => f.LotKey == hot.LotKey))
{
    Console.WriteLine($"  [{f.Code}] {f.Message}");
}

var peers = review.Lots.Where(l => l.Lot.Strain == hot.Lot.Strain && l.Lot.Vessel == hot.Lot.Vessel && l.LotKey != hot.LotKey && l.PeakTemperatureC is not null).ToArray();
if (peers.Length > 0)
{
    var peaks = peers.Select(p => p.PeakTemperatureC!.Value).Order().ToArray();
    Console.WriteLine();
    Console.WriteLine($"Its peers ({peers.Length} other {hot.Lot.Strain} lots, vessel type {hot.Lot.Vessel}) peaked at {F(peaks[0])}–{F(peaks[^1])} °C, median {F(peaks[peaks.Length / 2])} °C: this lot ran {F(hot.PeakTemperatureC!.Value - peaks[peaks.Length / 2])} K hotter.");
}

// CO2 released over the ferment: sugar consumed (g/L) × volume × the Gay-Lussac CO2 yield (0.4886 g per g of hexose).
var conv = lots.First(c => c.Lot.Key == hot.Lot.Key);
double volume = hot.Lot.Additions.MustVolumeL ?? double.NaN;
double co2Kg = conv.SugarConsumedGl * volume * GayLussac.CarbonDioxideMassYield / 1000.0;
double co2Litres = co2Kg * 1000.0 / GayLussac.CarbonDioxideMolarMass * 23.64; // ideal gas at 15 °C and 1 atm: 23.64 L/mol
Console.WriteLine();
Console.WriteLine($"This lot also gave off about {F(co2Kg, "0")} kg of CO2 ({F(co2Litres / 1000.0, "0")} m³ of gas at 15 °C), most of it around the peak.");
Console.WriteLine();
Console.WriteLine("In the cellar: a ferment heading past the caution line needs cooling now (the 'could reach' column shows how far it");
Console.WriteLine("can still go). CO2 from fermenting lots collects in low and closed spaces and can kill within minutes: ventilate,");
Console.WriteLine("monitor, and treat tanks and pits as confined spaces under your local rules (docs/cautions.md).");

static string FindRoot()
{
    var dir = new DirectoryInfo(Environment.CurrentDirectory);
    while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "YieldBench.sln")))
    {
        dir = dir.Parent;
    }

    return dir?.FullName ?? throw new InvalidOperationException("Run from inside the repository (YieldBench.sln not found).");
}
