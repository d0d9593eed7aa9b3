#:project ../src/YieldBench.Intake/YieldBench.Intake.csproj
// Worked analysis 3: choosing next year's house conversion factor.
// Question: which simple rule should the cellar use next harvest to estimate alcohol from must sugar, and how far
// can its estimates be trusted? Run from the repository: dotnet run notebooks-as-scripts/choosing-next-years-house-factor.cs
using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.HouseFactor;
using YieldBench.Core.Units;
using YieldBench.Intake;

const int seed = 20261;
var inv = CultureInfo.InvariantCulture;
string F(double v, string f = "0.00") => double.IsFinite(v) ? v.ToString(f, inv) : "n/a";
string P(double v) => double.IsFinite(v) ? (100 * v).ToString("0", inv) + " %" : "n/a";
string root = FindRoot();

Console.WriteLine("# Choosing next year's house factor");
Console.WriteLine();
Console.WriteLine("A house factor turns a must's starting sugar into an expected alcohol before fermentation, for planning");
Console.WriteLine("(pick dates, decide on add-backs, book tanks). It is never the label's alcohol: that needs a lab analysis and");
Console.WriteLine("the local rules (docs/cautions.md). The fair test of a rule is how it would have done on a season it never saw,");
Console.WriteLine("so every candidate is fitted on all seasons but one and scored on the one left out, in turn.");
Console.WriteLine();

var set = IntakeReader.Read([Path.Combine(root, "demo-data", "history")], new IntakeOptions());
var lots = set.Lots.Select(l => ConversionFactors.For(l, SugarModel.Default)).ToArray();
var settings = new HouseFactorSettings();
// As the review does: lots the strain review flags as likely errors or not dry do not teach the factor.
var flags = YieldBench.Core.Review.Strains.StrainReviewer.Run(lots, new YieldBench.Core.Review.Strains.StrainReviewSettings(), seed).Flags;
var review = HouseFactorAnalysis.Run(lots, flags, settings, [], seed);
Console.WriteLine($"{review.LotsUsed} lots of seasons {string.Join(", ", review.Seasons)}; backtest: {review.PrimaryScheme}; label regime for scoring: {review.Regime.Name}.");
Console.WriteLine();
Console.WriteLine("candidate                                   | MAE % v/v (± SE) | bias   | 90 % of errors under | within label tolerance | wrong side of 14 %");
Console.WriteLine("--------------------------------------------|------------------|--------|----------------------|------------------------|-------------------");
foreach (var c in review.Candidates.OrderBy(c => c.Primary.Mae))
{
    var m = c.Primary;
    Console.WriteLine($"{Trim(c.Name, 43),-43} | {F(m.Mae, "0.000")} (± {F(m.MaeStandardError, "0.000")}) | {F(m.Bias, "+0.00;-0.00"),6} | {F(m.P90AbsoluteError, "0.00"),20} | {P(m.ShareWithinTolerance),22} | {P(m.ShareWrongSideOfThreshold)}");
}

Console.WriteLine();
if (review.Overall is { } overall)
{
    var chosen = review.Candidates.First(c => c.Id == overall.CandidateId);
    Console.WriteLine($"Recommendation (one-standard-error rule: the simplest candidate whose MAE is within one standard error of the best, {F(overall.MaeLimit, "0.000")} % v/v):");
    Console.WriteLine($"  {chosen.Name}");
    Console.WriteLine($"  {overall.Explanation}");
    Console.WriteLine($"  a lot of a new season: 80 % band {F(overall.ErrorBand80.Low, "+0.00;-0.00")} to {F(overall.ErrorBand80.High, "+0.00;-0.00")} % v/v around the prediction, 95 % band {F(overall.ErrorBand95.Low, "+0.00;-0.00")} to {F(overall.ErrorBand95.High, "+0.00;-0.00")} (season-aware: lots of one season share its shift).");
    if (review.Coverage is { } cov)
    {
        Console.WriteLine($"  tested on each season held out in turn, the planner's 80 % and 95 % intervals held {P(cov.Total.Share80)} and {P(cov.Total.Share95)} of its lots.");
    }
}

foreach (var r in review.ByStrain)
{
    Console.WriteLine($"  for {r.Strain} ({r.Lots} lots): {review.Candidates.First(c => c.Id == r.CandidateId).Name}, MAE {F(r.Metrics.Mae, "0.000")}");
}

Console.WriteLine();
Console.WriteLine("A check the way next year will really go: choose with 2023 and 2024 only, then predict 2025's lots.");
var early = lots.Where(l => l.Lot.Season < 2025).ToArray();
var late = lots.Where(l => l.Lot.Season == 2025).ToArray();
var before = HouseFactorAnalysis.Run(early, flags.Where(f => f.Season < 2025).ToArray(), settings, [], seed);
if (before.Planning is { } planning)
{
    var errors = late.Select(l => l.Lot.FinalAlcohol.PercentVolume - Planner.Estimate(planning.For(l.Lot.Strain), SugarReading.FromBrix(l.EffectiveStartingBrix)).Predicted).ToArray();
    double mae = errors.Average(Math.Abs);
    Console.WriteLine($"  chosen on 2023–24: {before.Candidates.First(c => c.Id == before.Overall!.CandidateId).Name}");
    Console.WriteLine($"  on 2025's {late.Length} lots: MAE {F(mae, "0.000")} % v/v, bias {F(-errors.Average(), "+0.000;-0.000")}, within ±0.5 {P(errors.Count(e => Math.Abs(e) <= 0.5) / (double)errors.Length)}, within ±1.0 {P(errors.Count(e => Math.Abs(e) <= 1.0) / (double)errors.Length)}");
    double promised = before.Candidates.First(c => c.Id == before.Overall!.CandidateId).Primary.Mae;
    Console.WriteLine(mae > promised * 1.15
        ? $"  the backtest had promised MAE {F(promised, "0.000")}; 2025 did worse, as a season unlike the backtested ones (riper fruit, other strains) will."
        : $"  the backtest had promised MAE {F(promised, "0.000")}; 2025 did as well or better, but one season is a small sample: plan with the backtest's bands, not with this.");
    Console.WriteLine("  the worst 2025 misses (often the lots a review flags: a starting sugar read before soak-up, a stuck ferment):");
    foreach (var (l, e) in late.Zip(errors).OrderByDescending(p => Math.Abs(p.Second)).Take(3))
    {
        Console.WriteLine($"    {l.Lot.LotId} {l.Lot.Strain}: {F(l.EffectiveStartingBrix, "0.0")} °Brix, lab {F(l.Lot.FinalAlcohol.PercentVolume)} % v/v, miss {F(e, "+0.00;-0.00")} (notes: {l.Lot.Notes ?? "none"})");
    }

}

Console.WriteLine();
if (review.Planning is { } plan)
{
    Console.WriteLine("Planning with the recommended rule: the highest starting sugar (effective °Brix) that keeps the finished wine at");
    Console.WriteLine("or under a target with the stated one-sided confidence, if next season behaves like the backtested ones:");
    foreach (var a in Planner.Table(plan.Pooled, [13.5, 14.0, 14.5], [0.80, 0.95]))
    {
        Console.WriteLine($"  target {F(a.TargetAbv, "0.0")} % v/v at {P(a.Confidence)}: at most {F(a.HighestBrix, "0.0")} °Brix (allowing {F(a.ErrorAllowance, "0.00")} % v/v of error){(a.Note is null ? "" : "; " + a.Note)}");
    }
}

Console.WriteLine();
foreach (var caution in review.Cautions)
{
    Console.WriteLine("Caution: " + caution);
}

static string Trim(string s, int n) => s.Length <= n ? s : s[..(n - 1)] + "…";

static string FindRoot()
{
    var dir = new DirectoryInfo(Environment.CurrentDirectory);
    while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "YieldBench.sln")))
    {
        dir = dir.Parent;
    }

    return dir?.FullName ?? throw new InvalidOperationException("Run from inside the repository (YieldBench.sln not found).");
}
