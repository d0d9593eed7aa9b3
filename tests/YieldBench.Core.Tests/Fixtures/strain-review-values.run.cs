#:project ../../../src/YieldBench.Intake/YieldBench.Intake.csproj
// Writes each lot's values as the review computes them, to 17 digits, for strain-review-audit.R (a file-based program,
// left out of the test project's build). From the repository root:
//   dotnet run tests/YieldBench.Core.Tests/Fixtures/strain-review-values.run.cs -- . demo-data/history \
//       > tests/YieldBench.Core.Tests/Fixtures/strain-review-audit/demo-values.csv
//   dotnet run tests/YieldBench.Core.Tests/Fixtures/strain-review-values.run.cs -- . \
//       tests/YieldBench.Core.Tests/Fixtures/kinetics-audit/brackenfold-input > tests/YieldBench.Core.Tests/Fixtures/strain-review-audit/brackenfold-values.csv
using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Intake;

var inv = CultureInfo.InvariantCulture;
string root = Path.GetFullPath(args[0]);
var set = IntakeReader.Read(args.Skip(1).Select(a => Path.Combine(root, a)).ToArray(), new IntakeOptions { WorkingDirectory = root });
Console.WriteLine("season,lot_id,strain,vessel,variety,residual_sugar_gl,effective_brix,abv_per_brix,abv_per_brix_fermented,sugar_gl_per_abv,gay_lussac_efficiency,final_abv");
foreach (var c in set.Lots.Select(l => ConversionFactors.For(l, SugarModel.Default)))
{
    Console.WriteLine(string.Join(",", c.Lot.Season.ToString(inv), c.Lot.LotId, c.Lot.Strain, Q(c.Lot.Vessel), Q(c.Lot.Variety),
        c.Lot.ResidualSugarGl is { } rs ? R(rs) : "NA", R(c.EffectiveStartingBrix), R(c.AbvPerBrix), R(c.AbvPerBrixFermented), R(c.SugarGlPerAbv), R(c.GayLussacEfficiency), R(c.Lot.FinalAlcohol.PercentVolume)));
}

string R(double v) => double.IsFinite(v) ? v.ToString("R", inv) : "NA";
static string Q(string? s) => "\"" + (string.IsNullOrWhiteSpace(s) ? "(not recorded)" : s.Trim()) + "\"";
