using System.Globalization;
using YieldBench.Core.Review;
using YieldBench.Core.Review.Strains;
using YieldBench.Core.Units;
using YieldBench.Reports.Kinetics;
using YieldBench.Reports.Tables;

namespace YieldBench.Reports.Workbook;

/// <summary>What each sheet of the workbook shows, in reading order, as plans that lay themselves out.</summary>
internal static class WorkbookSheets
{
    /// <summary>Every sheet of the review's workbook, in workbook order.</summary>
    public static IReadOnlyList<SheetPlan> All(ReviewResult review, SharedTables tables)
    {
        var sheets = new List<SheetPlan>
        {
            Overview(review),
            FollowUp(review),
            Table(WorkbookWriter.Sheets.Lots, tables.LotsByStrain, printColumns: 12),
            StrainComparison(review),
            HouseFactor(review),
            Planner(review),
        };
        if (review.Kinetics is { } k)
        {
            sheets.Add(KineticsSummary(review, k));
            sheets.Add(Table(WorkbookWriter.Sheets.KineticsByLot, tables.KineticsLots!, printColumns: 12));
        }

        foreach (var (grouping, sheet) in WorkbookWriter.Sheets.Groupings)
        {
            sheets.Add(Table(sheet, ReviewTables.Groups(review, grouping, withNote: true)));
        }

        sheets.Add(Table(WorkbookWriter.Sheets.IntakeIssues, ReviewTables.IntakeIssues(review)));
        sheets.Add(Methods(review));
        return sheets;
    }

    /// <summary>The decisions first: the factor to use, the strains compared, the lots to look at, how the strains fermented; then what was read and the cautions.</summary>
    private static SheetPlan Overview(ReviewResult review)
    {
        var o = review.Overview;
        var plan = new SheetPlan(WorkbookWriter.Sheets.Overview)
            .Title(o.Title)
            .Text("Predicted alcohol here is an estimate from past lots, not a label statement; fermentation heat and CO2 are hazards. See the cautions at the end.", italic: true)
            .Gap()
            .Heading("At a glance")
            .Texts(AtAGlance(review))
            .Gap()
            .Heading("The factor to use next harvest");
        if (o.Factors is { } f)
        {
            string tolerance = o.HouseFactor is { } h
                ? string.Create(CultureInfo.InvariantCulture, $" Held out {h.Scheme}, {h.ShareWithinTolerance * 100:0} % of lots came within the {h.Regime} tolerance of the prediction.")
                : string.Empty;
            plan.Text(string.Create(CultureInfo.InvariantCulture, $"Each factor's prediction and ranges are shown at {f.ReferenceBrix:0.0} °Brix, the median starting sugar of the lots compared; a range is where 80 % or 95 % of lots came out, by the error on {ReportTexts.HeldOut(review.HouseFactor.PrimaryScheme)} held out.{tolerance}"))
                .Table(ReviewTables.Factors(review));
        }
        else
        {
            plan.Text("No factor is recommended: " + string.Join(" ", o.NoRecommendation.DefaultIfEmpty("too few lots to choose.")));
        }

        plan.Gap().Heading("Strains compared from the same starting sugar").Texts(o.Strains.Plain);
        if (o.Strains.Ranking.Count == 1)
        {
            plan.Text(o.Strains.LeftOut.Count == 0
                ? "One strain only, so there is nothing to compare it with."
                : "One strain has enough lots to be compared, so there is nothing to compare it with.");
        }

        plan.TableOrNone(ReviewTables.StrainsCompared(review), "Fewer than two strains have enough lots to compare.");
        if (o.Strains.LeftOutSentence is { } leftOut)
        {
            plan.Text(leftOut);
        }

        plan.Gap().Heading("Lots to look at")
            .Text(o.Lots.Flagged == 0
                ? "None: no lot was flagged by the strain review or the kinetics."
                : $"{o.Lots.Flagged} lot{(o.Lots.Flagged == 1 ? string.Empty : "s")}, one line each ({string.Join(", ", o.Lots.ByWorstSeverity.Where(c => c.Lots > 0).Select(c => $"{ReviewTexts.Severity(c.Severity)} {c.Lots}"))}); what was seen and the other possibilities are on the Follow-up sheet.");
        // One line per lot, as a paragraph: the lot, how sure, the likely explanation and what to do.
        foreach (var lot in review.Findings)
        {
            plan.Text($"{lot.Key} {lot.Strain} ({ReviewTexts.Severity(lot.Severity)}): {lot.Explanation} {lot.FollowUp}", bold: lot.Severity == FlagSeverity.LikelyError);
        }

        if (o.Ferments.Count > 0)
        {
            plan.Gap().Heading("How the strains fermented (lots with a log)").Table(ReviewTables.Ferments(review));
        }

        var i = o.Inputs;
        plan.Gap().Heading("What was read").Pairs(
        [
            ("Input files", i.Files, null),
            ("Lots used", i.LotsUsed, null),
            ("Rows left out", i.RowsLeftOut, null),
            ("Intake issues", i.Issues, null),
            ("Seasons", i.Seasons.Count == 0 ? "none" : string.Join(", ", i.Seasons), null),
            ("Fermentation logs", i.Logs, null),
            ("Tool version", review.ToolVersion, null),
        ]);
        return plan.Gap().Heading("Cautions").Texts(o.Cautions);
    }

    /// <summary>Most lots the "At a glance" line names; the rest are counted and listed on the Follow-up sheet.</summary>
    internal const int AtAGlanceLots = 30;

    /// <summary>
    /// The four answers in one line each, so the first screen holds them all: the factor to use, the strains compared,
    /// the lots to look at, how the strains fermented. The sections below give each in full.
    /// </summary>
    internal static IReadOnlyList<string> AtAGlance(ReviewResult review)
    {
        ArgumentNullException.ThrowIfNull(review);
        var inv = CultureInfo.InvariantCulture;
        var o = review.Overview;
        var lines = new List<string>();
        if (o.Factors is { } f)
        {
            var p = f.Pooled;
            string strains = string.Join(", ", f.Strains.Select(s => string.Create(inv, $"{s.Strain} {s.Factor:0.000}")));
            lines.Add(string.Create(inv, $"Factor to use next harvest: {p.Factor:0.000} % v/v per °Brix for all lots ({p.Estimate.Predicted:0.00} % v/v from {f.ReferenceBrix:0.0} °Brix; 80 % of lots {p.Estimate.Low80:0.00}–{p.Estimate.High80:0.00}; error on held-out {ReportTexts.HeldOut(review.HouseFactor.PrimaryScheme)} {p.HeldOutMae:0.00} % v/v). By strain: {strains}."));
        }
        else
        {
            lines.Add("Factor to use next harvest: none is recommended (see below).");
        }

        var ranking = o.Strains.Ranking;
        if (ranking.Count >= 2)
        {
            lines.Add("Strains, most alcohol from the same sugar first: " + string.Join(", ", ranking.Select(r => r.Strain)) + "." + (o.StrainHeadline is { } h ? " " + h : string.Empty));
        }

        // The line names the first lots only (a cell holds at most 32,767 characters: 100,000 lots flagged some
        // thousands, and the workbook failed); the Follow-up sheet and data/follow-up.csv list them all.
        var named = review.Findings.Take(AtAGlanceLots).Select(l => $"{l.Key} ({ReviewTexts.Severity(l.Severity)})");
        string more = review.Findings.Count > AtAGlanceLots
            ? string.Create(inv, $", and {review.Findings.Count - AtAGlanceLots} more on the Follow-up sheet")
            : string.Empty;
        lines.Add(o.Lots.Flagged == 0
            ? "Lots to look at: none."
            : $"Lots to look at: {o.Lots.Flagged} — " + string.Join(", ", named) + more + ".");
        if (o.Ferments.Count > 0)
        {
            var unit = review.Settings.TemperatureUnit;
            lines.Add("Ferments (median days to dry, peak temperature, troubled): " + string.Join("; ", o.Ferments.Select(x =>
                string.Create(inv, $"{x.Strain} {x.DaysToDry.Median:0.0} days, {unit.Show(x.PeakTemperatureC.Median)}, {x.Troubled} of {x.Lots}"))) + ".");
        }

        return lines;
    }

    /// <summary>One row per lot to look at, then the strain-level notes.</summary>
    private static SheetPlan FollowUp(ReviewResult review) =>
        new SheetPlan(WorkbookWriter.Sheets.FollowUp) { WrapUnits = 40 }
            .Table(ReviewTables.Findings(review), freeze: true)
            .Gap()
            .Heading("Strains that converted differently in one season")
            .TableOrNone(ReviewTables.StrainNotes(review), "None.");

    private static SheetPlan StrainComparison(ReviewResult review)
    {
        var c = review.Strains.Comparison;
        var kw = c.KruskalWallis;
        var plan = new SheetPlan(WorkbookWriter.Sheets.StrainComparison)
            .Title("Strain comparison on " + c.Measure)
            .Texts(c.Sentences)
            .Text("A rank test's small p says the strains' factors differ by more than the lot-to-lot noise would explain; a shift is the median difference of two strains' raw factors." + (kw.Note is null ? string.Empty : " " + kw.Note), italic: true);
        if (c.RankingsDisagree)
        {
            plan.Text("Raw medians and the adjusted comparison put a different strain first: the raw ranking is confounded with starting sugar (or vessel).", bold: true);
        }

        return plan.Gap()
            .Heading("Strains ranked by adjusted conversion" + (c.AdjustedForVessel ? " (adjusted for starting sugar and vessel)" : " (adjusted for starting sugar)"))
            .Table(ReviewTables.StrainRanking(review))
            .Heading("Adjusted differences in alcohol at the same starting sugar (shaded: interval excludes 0)")
            .Table(ReviewTables.AdjustedDifferences(review))
            .Heading("Pairwise Hodges–Lehmann shifts of the raw factor (shaded: Holm-adjusted p below 0.05)")
            .Text("A shift is the median difference of two strains' factors; Holm's adjustment keeps the chance of any false alarm over all pairs at 5 %.")
            .Table(ReviewTables.PairwiseShifts(review))
            .Texts(review.Strains.Notes);
    }

    private static SheetPlan HouseFactor(ReviewResult review)
    {
        var h = review.HouseFactor;
        var plan = new SheetPlan(WorkbookWriter.Sheets.HouseFactor) { WrapUnits = 24 }
            .Title("House conversion factor: candidates judged by backtest against " + h.Regime.Name)
            .Texts(h.Explanation)
            .Texts(h.ImportanceSentence is null ? [] : [h.ImportanceSentence])
            .Gap()
            .Heading("Recommendation")
            .Table(ReviewTables.Recommendations(review));
        if (h.Coverage is { } coverage)
        {
            plan.Heading("How often the intervals held on a season they had not seen (" + coverage.Method + ")").Table(ReviewTables.IntervalCoverage(review));
        }

        if (h.FlaggedLots.Count > 0)
        {
            plan.Heading(h.FlaggedLotsIncluded
                    ? "Lots flagged as likely errors or not dry (included: the setting to include them is on)"
                    : "Lots flagged as likely errors or not dry (left out of training, selection and intervals; a setting includes them)")
                .Table(ReviewTables.HouseFactorFlaggedLots(review))
                .Heading("Both versions: flagged lots left out and included")
                .Table(ReviewTables.HouseFactorVersions(review));
        }

        return plan.Heading("Every candidate").Table(ReviewTables.HouseCandidates(review)).Texts(h.Notes);
    }

    private static SheetPlan Planner(ReviewResult review) =>
        new SheetPlan(WorkbookWriter.Sheets.Planner)
            .Title("Planner: the highest harvest sugar that keeps the predicted alcohol under a target")
            .Texts(review.HouseFactor.Cautions)
            .Gap()
            .Text("Each cell is the highest harvest sugar that keeps the predicted alcohol under the column's target with the row's confidence; the allowance is the margin kept for the prediction's error on seasons held out.")
            .Table(ReviewTables.PlannerByTarget(review));

    private static SheetPlan KineticsSummary(ReviewResult review, Core.Kinetics.KineticsReview k) =>
        new SheetPlan(WorkbookWriter.Sheets.Kinetics) { WrapUnits = 50 }
            .Title("Fermentation kinetics and heat")
            .Texts(KineticsSheet.CautionsIn(review.Settings.TemperatureUnit))
            .Gap()
            .Heading("By strain (median and interquartile range across lots with a log)")
            .Table(KineticsTables.Strains(k, review.Strains, review.Settings.TemperatureUnit))
            .Heading("What the logs showed, by kind")
            .TableOrNone(KineticsTables.FindingKinds(k, review.Lots.ToDictionary(l => l.Lot.Key, l => l.Lot.Strain)), "Nothing: no log showed a stall, a temperature above the thresholds or a gap.")
            .Text("The lots to look at are on the Follow-up sheet; every lot's kinetics are on the Kinetics by lot sheet; every finding, with its details and log row, is in data/kinetics-findings.csv; a chart of each lot to look at is in the charts folder (kinetics-lot-….png).", italic: true);

    private static SheetPlan Methods(ReviewResult review) =>
        new SheetPlan(WorkbookWriter.Sheets.Methods) { WrapUnits = 40 }
            .Title("Methods and cautions")
            .Text("YieldBench " + review.ToolVersion)
            .Heading("Cautions")
            .Texts(review.Overview.Cautions)
            .Gap()
            .Heading("Formulas and their sources")
            .Table(MethodsTable.Formulas(review))
            .Heading("Settings")
            .Table(MethodsTable.Settings(review))
            .Heading("Flag codes (as the Lots sheets and the data files write them)")
            .TableOrNone(MethodsTable.FlagGlossary(review), "No lot was flagged.")
            .Heading("Input files")
            .Table(ReviewTables.InputFiles(review))
            .Heading("Rows read per file and sheet")
            .Table(ReviewTables.RowAccounts(review));

    private static SheetPlan Table(string sheet, ReportTable table, int? printColumns = null) =>
        new SheetPlan(sheet) { PrintColumns = printColumns }.Table(table, freeze: true);
}
