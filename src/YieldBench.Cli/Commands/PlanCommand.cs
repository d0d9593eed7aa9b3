using System.CommandLine;
using System.Globalization;
using YieldBench.Cli.CommandLine;
using YieldBench.Core.Conversion;
using YieldBench.Core.HouseFactor;
using YieldBench.Core.Lots;
using YieldBench.Core.Review;
using YieldBench.Core.Units;
using YieldBench.Intake;
using YieldBench.Reports;

namespace YieldBench.Cli.Commands;

/// <summary>
/// <c>yieldbench plan</c>: potential alcohol before harvest from a review's house factor (or a factor given directly).
/// Three questions: predicted alcohol for a must; the highest harvest sugar under target alcohols; water add-back.
/// </summary>
internal static class PlanCommand
{

    private static readonly Dictionary<string, (SugarScale Scale, string Unit)> Scales = new(StringComparer.OrdinalIgnoreCase)
    {
        ["brix"] = (SugarScale.Brix, "°Brix"),
        ["sg"] = (SugarScale.SpecificGravity, "SG"),
        ["baume"] = (SugarScale.Baume, "°Baumé"),
        ["oechsle"] = (SugarScale.Oechsle, "°Oechsle"),
        ["kmw"] = (SugarScale.Kmw, "°KMW"),
        ["gl"] = (SugarScale.GramsPerLitre, "g/L sugar"),
    };

    public static Command Create(CliContext context)
    {
        var factorFile = new Option<string?>("--factor-file") { Description = "A house-factor.json written by 'yieldbench review' (its data folder)." };
        var factor = new Option<string?>("--factor") { Description = "A conversion factor to use instead, % v/v per °Brix (no intervals: none are known)." };
        var lotFiles = new Option<string[]>("--lots") { Description = "Or lot files or folders of past seasons: the house factor is chosen from them first (as 'yieldbench review' does, without the multi-variable model).", AllowMultipleArgumentsPerToken = true };
        var strain = new Option<string?>("--strain") { Description = "Yeast strain code (default: the pooled line for all strains)." };
        var sugar = new Option<string?>("--sugar") { Description = "Starting must sugar, on the scale given by --scale." };
        var scale = new Option<string>("--scale") { Description = "Scale of --sugar: brix, sg, baume, oechsle, kmw or gl.", DefaultValueFactory = _ => "brix" };
        var target = new Option<string[]>("--target") { Description = "Target alcohol(s), % v/v; several may follow one --target.", AllowMultipleArgumentsPerToken = true };
        var confidence = new Option<string[]>("--confidence") { Description = "Confidence(s) that the wine stays at or under the target, 0.5–0.99 (default 0.8 and 0.95).", AllowMultipleArgumentsPerToken = true };
        var volume = new Option<string?>("--volume") { Description = "Juice volume, L (the liquid the sugar reading is of): with --sugar and one --target, the water add-back is worked out. For must on skins give --pomace-share too." };
        var pomace = new Option<string?>("--pomace-share") { Description = "Share of --volume that is skins and seeds, 0–0.5 (default 0: --volume is juice); the balance counts only the juice." };
        var command = new Command("plan", "Plan potential alcohol: predicted alcohol for a must, the highest harvest sugar under a target, or the water add-back to reach it.");
        foreach (var o in new Option[] { factorFile, factor, lotFiles, strain, sugar, scale, target, confidence, volume, pomace })
        {
            command.Options.Add(o);
        }

        command.SetAction(parse =>
        {
            var request = new Request(
                parse.GetValue(factorFile),
                parse.GetValue(factor),
                parse.GetValue(lotFiles) ?? [],
                parse.GetValue(strain),
                parse.GetValue(sugar),
                parse.GetValue(scale) ?? "brix",
                parse.GetValue(target) ?? [],
                parse.GetValue(confidence) ?? [],
                parse.GetValue(volume),
                parse.GetValue(pomace));
            return Run(request, context);
        });
        return command;
    }

    /// <summary>The message for a --factor-file that is no file: a folder holding a review's house factor names it.</summary>
    private static string MissingFactorFile(string given, string path)
    {
        string name = HouseFactorJson.FileName;
        if (Directory.Exists(path))
        {
            string? inside = new[] { name, Path.Combine("data", name) }.FirstOrDefault(p => File.Exists(Path.Combine(path, p)));
            return inside is null
                ? $"--factor-file {given} is a folder, not a {name}; give the {name} in a review's data folder."
                : $"--factor-file {given} is a folder, not a file; give --factor-file {Path.Combine(given, inside)}.";
        }

        return $"--factor-file {given}: no such file. Give the {name} written by 'yieldbench review' in its output's data folder.";
    }

    private sealed record Request(string? FactorFile, string? Factor, string[] LotFiles, string? Strain, string? Sugar, string Scale, string[] Targets, string[] Confidences, string? Volume, string? PomaceShare = null);

    private static int Run(Request r, CliContext context)
    {
        using var err = new WrappingWriter(context.Error); // lines fit a 100-column terminal (README, Console)
        int sources = (r.FactorFile is null ? 0 : 1) + (r.Factor is null ? 0 : 1) + (r.LotFiles.Length == 0 ? 0 : 1);
        if (sources != 1)
        {
            err.WriteLine("plan: give one of --factor-file (a house-factor.json from 'yieldbench review'), --factor (a conversion factor, % v/v per °Brix) or --lots (lot files of past seasons), not several and not none.");
            return ExitCodes.Usage;
        }

        PlanningModel model;
        string? regime = null;
        if (r.LotFiles.Length > 0)
        {
            var fromLots = FromLots(r.LotFiles, context);
            if (fromLots is null)
            {
                return ExitCodes.InputProblems;
            }

            model = fromLots;
        }
        else if (r.FactorFile is not null)
        {
            string path = Path.IsPathRooted(r.FactorFile) ? r.FactorFile : Path.Combine(context.WorkingDirectory, r.FactorFile);
            if (!File.Exists(path))
            {
                // A missing input is a command line that cannot be carried out (README, Exit codes), named as given.
                err.WriteLine("plan: " + MissingFactorFile(r.FactorFile, path));
                return ExitCodes.Usage;
            }

            var file = HouseFactorJson.Read(File.ReadAllText(path, System.Text.Encoding.UTF8), r.FactorFile);
            if (file.Model is null)
            {
                err.WriteLine("plan: " + file.Error);
                return ExitCodes.InputProblems;
            }

            model = file.Model;
            regime = file.RegimeName;
        }
        else
        {
            if (!TryNumber(r.Factor!, "--factor", err, out double f))
            {
                return ExitCodes.Usage;
            }

            if (f is <= 0 or >= 1.5)
            {
                err.WriteLine($"plan: --factor {r.Factor} is outside 0–1.5 % v/v per °Brix; typical house factors are 0.55–0.65.");
                return ExitCodes.Usage;
            }

            model = PlanningModel.FromFactor(f);
        }

        if (!Scales.TryGetValue(r.Scale, out var scale))
        {
            err.WriteLine($"plan: --scale {r.Scale} is not known; use brix, sg, baume, oechsle, kmw or gl.");
            return ExitCodes.Usage;
        }

        SugarReading? must = null;
        if (r.Sugar is not null)
        {
            if (!TryNumber(r.Sugar, "--sugar", err, out double s))
            {
                return ExitCodes.Usage;
            }

            // Checked as intake checks a starting-sugar cell: a must's starting sugar lies within 10–40 °Brix.
            SugarReading? reading = null;
            try
            {
                reading = SugarReading.From(s, scale.Scale);
            }
            catch (ArgumentOutOfRangeException)
            {
            }

            if (reading is not { } read || read.Brix < Planner.LowestMustBrix || read.Brix > Planner.HighestMustBrix)
            {
                string range = scale.Scale == SugarScale.Brix
                    ? $"{F(Planner.LowestMustBrix, "0")}–{F(Planner.HighestMustBrix, "0")} °Brix"
                    : $"{ScaleValue(Planner.LowestMustBrix, scale.Scale)}–{ScaleValue(Planner.HighestMustBrix, scale.Scale)} {scale.Unit} ({F(Planner.LowestMustBrix, "0")}–{F(Planner.HighestMustBrix, "0")} °Brix)";
                string was = reading is { } x && scale.Scale != SugarScale.Brix ? $" (= {F(x.Brix, "0.0#")} °Brix)" : string.Empty;
                // The value bands intake reads an unlabelled starting sugar by (docs/input-format.md, Units).
                string? likely = (scale.Scale, s) switch
                {
                    (not SugarScale.SpecificGravity, >= 0.95 and < 1.3) => "a specific gravity: add --scale sg",
                    (not SugarScale.Oechsle, > 45 and <= 145) => "°Oechsle: add --scale oechsle",
                    (not SugarScale.GramsPerLitre, > 145 and <= 400) => "sugar in g/L: add --scale gl",
                    _ => null,
                };
                string hint = likely is null ? "check the reading and that --scale names its scale" : $"{r.Sugar} looks like {likely}";
                err.WriteLine($"plan: --sugar {r.Sugar} {scale.Unit}{was} is outside {range}, the range of a must's starting sugar; {hint}.");
                return ExitCodes.Usage;
            }

            must = read;
        }

        var targets = new List<double>();
        foreach (string t in r.Targets)
        {
            if (!TryNumber(t, "--target", err, out double v))
            {
                return ExitCodes.Usage;
            }

            if (v is <= 0 or > 25)
            {
                err.WriteLine($"plan: --target {t} is outside 0–25 % v/v.");
                return ExitCodes.Usage;
            }

            targets.Add(v);
        }

        var confidences = new List<double>();
        foreach (string c in r.Confidences)
        {
            if (!TryNumber(c, "--confidence", err, out double v))
            {
                return ExitCodes.Usage;
            }

            if (v is < 0.5 or > 0.99)
            {
                err.WriteLine($"plan: --confidence {c} is outside 0.5–0.99 (write 0.95 for 95 %).");
                return ExitCodes.Usage;
            }

            confidences.Add(v);
        }

        double pomaceShare = 0;
        if (r.PomaceShare is not null)
        {
            if (!TryNumber(r.PomaceShare, "--pomace-share", err, out pomaceShare))
            {
                return ExitCodes.Usage;
            }

            if (pomaceShare is < 0 or > 0.5)
            {
                err.WriteLine($"plan: --pomace-share {r.PomaceShare} is outside 0–0.5 (write 0.15 for 15 % of the volume as skins and seeds).");
                return ExitCodes.Usage;
            }

            if (r.Volume is null)
            {
                err.WriteLine("plan: --pomace-share goes with --volume (the share of that volume that is skins and seeds).");
                return ExitCodes.Usage;
            }
        }

        double? volumeL = null;
        if (r.Volume is not null)
        {
            if (!TryNumber(r.Volume, "--volume", err, out double v))
            {
                return ExitCodes.Usage;
            }

            if (v is <= 0 or > 1e9)
            {
                err.WriteLine($"plan: --volume {r.Volume} must be above 0 L.");
                return ExitCodes.Usage;
            }

            if (must is null || targets.Count != 1)
            {
                err.WriteLine("plan: the water add-back needs --volume, --sugar and exactly one --target.");
                return ExitCodes.Usage;
            }

            if (confidences.Count > 1)
            {
                err.WriteLine("plan: the water add-back takes at most one --confidence.");
                return ExitCodes.Usage;
            }

            volumeL = v;
        }

        // A strain is matched with intake's spelling rules ("yb-r12" is YB-R12); one the model does not know is an error.
        string? strain = null;
        if (r.Strain is not null && model.Strains.Count > 0)
        {
            strain = Spellings.Settle(r.Strain, model.Strains.Select(l => l.Strain));
            if (strain is null)
            {
                err.WriteLine($"plan: --strain {r.Strain} is not a strain of this house factor; known strains: {string.Join(", ", model.Strains.Select(l => l.Strain))}. Leave --strain out for the line of all strains.");
                return ExitCodes.Usage;
            }
        }

        using var o = new WrappingWriter(context.Out);
        var line = model.For(strain);
        o.WriteLine($"Planner basis: {model.Basis}" + (regime is null || model.Basis.Contains(regime, StringComparison.Ordinal) ? "." : $" (label tolerance scored: {regime})."));
        if (r.Strain is not null && model.Strains.Count == 0)
        {
            o.WriteLine($"Strain {r.Strain}: the factor applies to every strain.");
        }

        string who = line.Strain == "*" ? "all strains" : $"strain {line.Strain}";
        string from = line.CandidateId == "given" ? string.Empty : $" (candidate {line.CandidateId})";
        o.WriteLine($"Predictor for {who}{from}: {Describe(line)}; intervals from {line.ErrorBasis}.");
        o.WriteLine(FactorText(model, line) + ".");
        if (must is { } checkedMust && model.Extrapolates(checkedMust.Brix))
        {
            o.WriteLine($"Warning: {F(checkedMust.Brix, "0.0#")} °Brix is outside the {F(model.HistoryLowBrix, "0.0")}–{F(model.HistoryHighBrix, "0.0")} °Brix of the lots the house factor learned from, so the prediction extrapolates; trust it less.");
        }

        o.WriteLine();

        // With no held-out errors only the central (50 %) answer exists, so that is the default then.
        var defaultConfidences = confidences.Count > 0 ? confidences : line.Errors.Count > 0 ? [0.80, 0.95] : [0.50];
        if (volumeL is { } vol)
        {
            double juice = vol * (1 - pomaceShare);
            var answer = Planner.WaterAddBack(line, must!.Value, juice, targets[0], confidences.Count == 1 ? confidences[0] : null);
            o.WriteLine(pomaceShare > 0
                ? $"Juice: {F(juice, "0")} L (the {F(vol, "0")} L given less {F(100 * pomaceShare, "0.#")} % skins and seeds; only the juice enters the balance) at {SugarText(must.Value, r.Sugar!, scale)}; target {F(targets[0], "0.0#")} % v/v."
                : $"Juice: {F(juice, "0")} L (the volume given is taken as juice; for must on skins give --pomace-share) at {SugarText(must.Value, r.Sugar!, scale)}; target {F(targets[0], "0.0#")} % v/v.");
            if (double.IsNaN(answer.WaterL))
            {
                o.WriteLine($"No add-back could be worked out: {answer.Note}.");
            }
            else if (answer.WaterL == 0)
            {
                o.WriteLine($"No water needed: {answer.Note}.");
                o.WriteLine("As it is: " + EstimateText(answer.After!) + ".");
            }
            else
            {
                o.WriteLine($"Add {F(answer.WaterL, "0")} L of water: the juice comes to {F(answer.TargetBrix, "0.0")} °Brix and {F(answer.VolumeAfterL, "0")} L by the review's mass balance ({answer.Note}).");
                o.WriteLine("After the addition: " + EstimateText(answer.After!) + ".");
            }
        }
        else
        {
            if (must is { } m)
            {
                var e = Planner.Estimate(line, m);
                o.WriteLine($"Starting sugar {SugarText(m, r.Sugar!, scale)}: {EstimateText(e)}.");
            }

            if (targets.Count > 0 || must is null)
            {
                var ts = targets.Count > 0 ? targets : [13.0, 13.5, 14.0, 14.5, 15.0];
                o.WriteLine("Highest harvest sugar (effective starting °Brix) that keeps the wine at or under the target:");
                o.WriteLine("  target % v/v | " + string.Join(" | ", defaultConfidences.Select(c => $"{F(100 * c, "0.#")} % confidence")));
                foreach (double t in ts)
                {
                    var cells = defaultConfidences.Select(c => Planner.HighestSugar(line, t, c)).ToArray();
                    o.WriteLine($"  {F(t, "0.0#"),12} | " + string.Join(" | ", cells.Select(a => double.IsNaN(a.HighestBrix) ? "no answer" : F(a.PickAtOrBelowBrix, "0.0") + " °Brix")));
                }

                foreach (string? note in defaultConfidences.Select(c => Planner.HighestSugar(line, ts[0], c).Note).Where(n => n is not null).Distinct())
                {
                    o.WriteLine("  Note: " + note + ".");
                }
            }
        }

        o.WriteLine();
        o.WriteLine("Cautions:");
        foreach (string c in HouseFactorTexts.PlannerCautions)
        {
            o.WriteLine("- " + c);
        }

        return ExitCodes.Success;
    }

    private static PlanningModel? FromLots(string[] paths, CliContext context)
    {
        var set = IntakeReader.Read(paths, new IntakeOptions { WorkingDirectory = context.WorkingDirectory });
        int leftOut = set.Issues.Count(i => i.Severity == IssueSeverity.Error);
        if (set.Issues.Count > 0)
        {
            TextWrap.WriteLine(context.Error, $"plan: {set.Issues.Count} intake issue(s), {leftOut} of them leaving a row or file out; run 'yieldbench check' or 'yieldbench review' on the same files to see each with its fix.");
        }

        var settings = new ReviewSettings();
        var lots = set.Lots.Select(l => ConversionFactors.For(l, settings.SugarModel)).ToArray();
        // As in the review: the lots the strain review flags as likely errors or not dry do not teach the factor.
        var flags = YieldBench.Core.Review.Strains.StrainReviewer.Run(lots, settings.Strains, settings.Seed).Flags;
        var review = HouseFactorAnalysis.Run(lots, flags, settings.HouseFactor, [], settings.Seed);
        if (review.Planning is null)
        {
            TextWrap.WriteLine(context.Error, "plan: no house factor could be chosen from these lots. " + string.Join(" ", review.Explanation));
            return null;
        }

        return review.Planning with { Basis = review.Planning.Basis + $", from {lots.Length} lots read now" };
    }

    /// <summary>The number a winemaker wants: the line's % v/v per °Brix, and the pooled one beside a strain's.</summary>
    private static string FactorText(PlanningModel model, PlanningLine line)
    {
        string at = double.IsFinite(model.ReferenceBrix) ? $" at {F(model.ReferenceBrix, "0.0")} °Brix (the lots' median starting sugar)" : string.Empty;
        string text = $"Factor: {F(model.FactorOf(line), "0.0000")} % v/v per °Brix{at}";
        return line.Strain == "*" ? text : text + $"; all strains pooled: {F(model.FactorOf(model.Pooled), "0.0000")}";
    }

    private static string ScaleValue(double brix, SugarScale scale) =>
        F(SugarReading.FromBrix(brix).In(scale), scale switch { SugarScale.SpecificGravity => "0.000", SugarScale.Brix or SugarScale.Baume => "0.0", _ => "0" });

    private static string Describe(PlanningLine l) => l.Curve == SugarCurve.EuConvention
        ? "potential alcohol = fermentable sugar (OIV must table) ÷ 16.83 g/L per % vol"
        : l.Intercept == 0
            ? $"alcohol = {F(l.SlopePerBrix, "0.0000")} × °Brix"
            : $"alcohol = {F(l.Intercept, "0.000;−0.000")} + {F(l.SlopePerBrix, "0.0000")} × °Brix";

    private static string EstimateText(AlcoholEstimate e)
    {
        string text = $"predicted alcohol {F(e.Predicted, "0.00")} % v/v";
        if (e.ErrorCount == 0)
        {
            return text + "; no interval: no held-out errors are known (a house-factor file from a review gives them)";
        }

        text += double.IsNaN(e.Low80) ? "; no 80 % interval (too few held-out lots)" : $"; 80 % interval {F(e.Low80, "0.00")}–{F(e.High80, "0.00")}";
        text += double.IsNaN(e.Low95) ? "; no 95 % interval (too few held-out lots)" : $"; 95 % interval {F(e.Low95, "0.00")}–{F(e.High95, "0.00")}";
        return text;
    }

    private static string SugarText(SugarReading m, string typed, (SugarScale Scale, string Unit) scale) =>
        scale.Scale == SugarScale.Brix ? $"{F(m.Brix, "0.0#")} °Brix" : $"{typed} {scale.Unit} = {F(m.Brix, "0.0#")} °Brix";

    private static bool TryNumber(string text, string option, TextWriter err, out double value)
    {
        if (UsageChecks.TryDecimal(text, out value))
        {
            return true;
        }

        err.WriteLine($"plan: {option} {text} is not a number; write it like 24.5 (a decimal comma, 24,5, is also read).");
        value = double.NaN;
        return false;
    }

    private static string F(double v, string format) => v.ToString(format, CultureInfo.InvariantCulture);
}
