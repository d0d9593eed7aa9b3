using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Review;
using YieldBench.Core.Units;

namespace YieldBench.Reports.Tables;

/// <summary>The methods-and-cautions content: each formula or setting with its value and its source.</summary>
public static class MethodsTable
{
    /// <summary>
    /// The flag codes this review wrote (on the Lots and Kinetics by lot sheets and in the data files), each with its
    /// plain meaning as the Follow-up sheet words it.
    /// </summary>
    public static ReportTable FlagGlossary(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var t = new ReportTable(
        [
            new("code", "Code", CellKind.Text),
            new("meaning", "Meaning", CellKind.Text),
        ]);
        var codes = review.Strains.Flags.Select(f => f.Code)
            .Concat(review.Kinetics?.Lots.SelectMany(k => k.Flags) ?? [])
            .Concat(review.Kinetics?.Findings.Select(f => f.Code) ?? []);
        foreach (string code in codes.Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal))
        {
            t.Add([code, ReviewTexts.FlagName(code)]);
        }

        return t;
    }

    /// <summary>Formulas with their sources.</summary>
    public static ReportTable Formulas(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var t = new ReportTable(
        [
            new("item", "Item", CellKind.Text),
            new("formula", "Formula or rule", CellKind.Text),
            new("source", "Source", CellKind.Text),
        ]);
        string sugarRule = review.Settings.SugarModel.Rule == SugarRule.OivTable
            ? "OIV must table: fermentable sugar (g/L) by °Brix, 10.0–30.0 °Brix, linear interpolation; outside it, the sugar share of solids at the table's edge"
            : $"Sugar % w/v = (°Brix − {SugarModel.NonSugarBrix.ToString("0.0", CultureInfo.InvariantCulture)}) × density";
        t.Add(["Starting sugar after additions", "Water and sugar additions by mass balance of sugar and must mass (docs/methods.md, Conversion)", "Mass balance (common practice)"]);
        t.Add(["Fermentable sugar", sugarRule, review.Settings.SugarModel.Rule == SugarRule.OivTable ? "OIV-MA-AS2-02, Table II; reproduced in the French Arrêté of 14 September 2011, Annexe IV" : "Margalit, Winery Technology and Operations, p. 3 (second-hand quote)"]);
        t.Add(["abv_per_brix", "final alcohol (% v/v) ÷ starting °Brix after additions", "Definition (common practice: ballpark 0.55–0.65)"]);
        t.Add(["abv_per_brix_fermented", "final alcohol ÷ (starting °Brix − °Brix equivalent of residual sugar)", "Definition"]);
        t.Add(["sugar_gl_per_abv", "sugar consumed (g/L) ÷ final alcohol (% v/v); compare " + OivMustTable.SugarGramsPerPercentVolume.ToString("0.00", CultureInfo.InvariantCulture) + " g/L per % vol", "Arrêté of 3 May 1996, art. 2; Reg. (EU) 251/2014 Annex I pt 7"]);
        t.Add(["gay_lussac_efficiency", "ethanol (g/L = % v/v × " + (10 * AlcoholContent.EthanolDensity20C).ToString("0.0000", CultureInfo.InvariantCulture) + ") ÷ (" + GayLussac.EthanolMassYield.ToString("0.0000", CultureInfo.InvariantCulture) + " × sugar consumed g/L)", "Gay-Lussac, C6H12O6 → 2 C2H5OH + 2 CO2; ethanol density 0.78924 g/mL at 20 °C (Council Directive 76/766/EEC)"]);
        var st = review.Settings.Strains;
        t.Add(["Group summaries", "median; MAD × 1.482602; Qn (Rousseeuw–Croux, small-sample factors); IQR and quantiles Hyndman–Fan type 7; mean, SD (n − 1); 20 % trimmed mean; Huber M-location k = " + F(st.HuberK) + "; percentile bootstrap " + (st.Level * 100).ToString("0", CultureInfo.InvariantCulture) + " % interval of the median, " + st.Resamples.ToString(CultureInfo.InvariantCulture) + " resamples, seed " + review.Settings.Seed.ToString(CultureInfo.InvariantCulture) + "; no interval under " + st.MinLotsForInterval.ToString(CultureInfo.InvariantCulture) + " lots", "Rousseeuw & Croux 1993, JASA 88:1273; Hyndman & Fan 1996, Am Stat 50:361; Huber 1964; Efron & Tibshirani 1993"]);
        t.Add(["robust_z", "Mᵢ = 0.6745 (xᵢ − median) / MAD within the lot's strain (Qn when MAD is 0; all lots when the strain has under " + st.MinLotsForStrainReference.ToString(CultureInfo.InvariantCulture) + "); flag |M| > " + F(st.ModifiedZLimit), "Iglewicz & Hoaglin 1993, How to Detect and Handle Outliers"]);
        t.Add(["Tukey fences", "Q1 − k·IQR, Q3 + k·IQR within the strain, k = " + F(st.TukeyInner) + " and " + F(st.TukeyOuter), "Tukey 1977; NIST/SEMATECH e-Handbook of Statistical Methods §7.1.6"]);
        t.Add(["Strain line", "Theil–Sen line of final alcohol on starting sugar per strain (pooled under " + st.MinLotsForStrainLine.ToString(CultureInfo.InvariantCulture) + " lots); residual scaled robustly, flag beyond " + F(st.LineResidualLimit), "Theil 1950; Sen 1968, JASA 63:1379"]);
        t.Add(["Not dry", "residual sugar above " + F(st.DryThresholdGl) + " g/L", "OIV: dry wines at most 4 g/L"]);
        t.Add(["Plausible factor", F(st.PlausibleFactorLow) + "–" + F(st.PlausibleFactorHigh) + " % v/v per °Brix", "docs/methods.md (Gay-Lussac ceiling and trade ballparks)"]);
        t.Add(["Strain comparison", "Kruskal–Wallis across strains; pairwise Mann–Whitney with Hodges–Lehmann shift and Moses interval, Holm-adjusted; adjusted comparison by Huber robust regression of final alcohol on starting sugar with strain (and vessel) as factors, at the pooled median starting sugar", "Kruskal & Wallis 1952; Hodges & Lehmann 1963; Holm 1979; Huber 1973"]);
        t.Add(["House-factor backtest", "Leave-one-season-out with two or more seasons, else leave-one-lot-out; MAE, bias, RMSE, 90th percentile |error|, share within label tolerance, share on the wrong side of " + review.HouseFactor.ThresholdAbv.ToString("0.0", CultureInfo.InvariantCulture) + " % v/v", "Cross-validation (docs/methods.md)"]);
        t.Add(["Recommendation", "Simplest candidate whose MAE is within one standard error of the best; intervals from the held-out errors' quantiles", "One-standard-error rule (Breiman et al. 1984; Hastie, Tibshirani & Friedman, Elements of Statistical Learning §7.10)"]);
        t.Add(["Label regime", review.HouseFactor.Regime.Name, review.HouseFactor.Regime.Source]);
        t.Add(["Label class line a statement may not cross", review.HouseFactor.Regime.NoCrossingLineAbv is { } line ? line.ToString("0.##", CultureInfo.InvariantCulture) + " % v/v" : "none", review.HouseFactor.Regime.NoCrossingLineSource]);
        if (review.Kinetics is { } k)
        {
            var s = k.Settings;
            t.Add(["Fermentation heat", $"rise (K) = remaining sugar (g/L) ÷ density × {s.HeatOfFermentationKjPerMol.ToString("0.0", CultureInfo.InvariantCulture)} kJ/mol ÷ 180.16 g/mol ÷ {(s.MustHeatCapacityKjPerKgK is { } cp ? cp.ToString("0.00", CultureInfo.InvariantCulture) + " kJ/(kg·K) (set)" : "cp of the must at its °Brix (3.66 at 20 °Brix, 3.56 at 24 kJ/(kg·K))")}", "Colombié, Malherbe & Sablayrolles 2007, Food Control 18:953 (≈24 kcal/mol); cp by the composition model of Choi & Okos 1986 (water and carbohydrate at the must's °Brix)"]);
            t.Add(["Sugar curves", "Modified Gompertz and logistic of sugar consumed against time, Levenberg–Marquardt", "Zwietering et al. 1990, Appl Environ Microbiol 56:1875"]);
        }

        t.Add(["Data files", ReportTexts.InjectionRule, "OWASP, CSV Injection (common practice)"]);
        return t;
    }

    /// <summary>The settings the review ran with.</summary>
    public static ReportTable Settings(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var t = new ReportTable(
        [
            new("setting", "Setting", CellKind.Text),
            new("value", "Value", CellKind.Text),
        ]);
        var s = review.Settings;
        t.Add(["Tool version", review.ToolVersion]);
        t.Add(["Seed", s.Seed.ToString(CultureInfo.InvariantCulture)]);
        t.Add(["Sugar rule", s.SugarModel.Rule == SugarRule.OivTable ? "OIV must table" : "°Brix minus non-sugar solids"]);
        t.Add(["Label regime", $"{s.HouseFactor.Regime.Name} ({s.HouseFactor.Regime.Id})"]);
        t.Add(["Threshold for the wrong-side share (% v/v)", F(s.HouseFactor.ThresholdAbv)]);
        t.Add(["Fixed ballpark factors (% v/v per °Brix)", string.Join(", ", s.HouseFactor.FixedFactors.Select(F))]);
        t.Add(["Fewest lots for a recommendation", s.HouseFactor.MinimumLots.ToString(CultureInfo.InvariantCulture)]);
        t.Add(["Fewest lots for a strain's own recommendation", s.HouseFactor.MinimumLotsPerStrain.ToString(CultureInfo.InvariantCulture)]);
        t.Add(["Planner targets (% v/v)", string.Join(", ", s.HouseFactor.PlannerTargets.Select(F))]);
        t.Add(["Planner confidences", string.Join(", ", s.HouseFactor.PlannerConfidences.Select(c => (c * 100).ToString("0", CultureInfo.InvariantCulture) + " %"))]);
        var k = s.Kinetics;
        t.Add(["Dry at or below (°Brix)", F(k.DryBrix)]);
        var unit = s.TemperatureUnit;
        t.Add([$"Red caution / danger temperature ({unit.Symbol()})", F(unit.FromCelsius(k.RedThresholds.CautionC)) + " / " + F(unit.FromCelsius(k.RedThresholds.DangerC))]);
        t.Add([$"White caution / danger temperature ({unit.Symbol()})", F(unit.FromCelsius(k.WhiteThresholds.CautionC)) + " / " + F(unit.FromCelsius(k.WhiteThresholds.DangerC))]);
        t.Add(["Temperatures shown in", unit == TemperatureUnit.Fahrenheit ? "°F (°C × 9/5 + 32; the review computes in °C)" : "°C"]);
        t.Add(["Sluggish: rate below (°Brix/day) with sugar above (°Brix) for (h)", F(k.SluggishRateBrixPerDay) + " / " + F(k.SluggishAboveBrix) + " / " + F(k.SluggishHours)]);
        t.Add(["Stuck: rate below (°Brix/day) with sugar above (°Brix) for (h)", F(k.StuckRateBrixPerDay) + " / " + F(k.StuckAboveBrix) + " / " + F(k.StuckHours)]);
        t.Add(["Heat of fermentation (kJ/mol sugar)", F(k.HeatOfFermentationKjPerMol)]);
        t.Add(["Must heat capacity (kJ/(kg·K))", k.MustHeatCapacityKjPerKgK is { } cpSet ? F(cpSet) : "from the must's °Brix (Choi & Okos 1986)"]);
        t.Add(["Stall restarted: rate at least (°Brix/day) over the stuck window", F(k.RestartRateBrixPerDay)]);
        return t;
    }

    private static string F(double v) => v.ToString("0.###", CultureInfo.InvariantCulture);
}
