using YieldBench.Core.Lots;
using YieldBench.Core.Units;
using static YieldBench.Intake.FieldParsers;

namespace YieldBench.Intake;

/// <summary>Reads the rows of a lots table into <see cref="Lot"/>s (or, with <see cref="IntakeOptions.RunningLots"/>, running lots).</summary>
internal static class LotRows
{
    private static readonly string[] Required = ["lot_id", "strain", "starting_sugar", "final_abv"];

    public static void Read(SheetContext ctx)
    {
        var sink = ctx.Run.Sink;
        bool running = ctx.Run.Options.RunningLots;
        var missing = Required.Where(f => ctx.Column(f) is null && !(running && f == "final_abv")).ToList();
        if (running)
        {
            RunningLotRows.ReportFinalColumns(ctx);
        }

        if (missing.Contains("strain") && missing.Contains("starting_sugar") && ctx.Column("final_abv") is null && ctx.LotColumn is not null
            && AdditionsApart.Columns(ctx) is var (what, amount))
        {
            // Additions kept apart, a row per addition (date, lot, what, amount): one error saying what to write where.
            AdditionsApart.Report(ctx, what, amount);
            ReadRows(ctx, usable: false);
            return;
        }

        bool labApart = !running && missing.Contains("strain") && missing.Contains("starting_sugar") && ctx.Column("final_abv") is not null;
        if (labApart && ctx.LotColumn is not null)
        {
            // The lab's results on a sheet of their own (Sample, Alc, RS, pH): read, and joined at the end to the lots
            // sheets that lack a final alcohol column, by the lot id written exactly alike (LabJoin).
            LabJoin.ReadResults(ctx);
            return;
        }

        if (!running && missing is ["final_abv"])
        {
            // Every column of a lot but the final alcohol: it may be in a lab sheet read later. Read at the end.
            ctx.Run.AwaitingResults.Add(ctx);
            return;
        }

        if (labApart)
        {
            // Results with no lot id: nothing to join by. One error, not one for each column of the lots it lacks.
            sink.Error(ctx.File, ctx.SheetName, ctx.FirstData, null, null, IssueCodes.LabResultsApart, IntakeMessages.LabResultsApart(LabJoin.ResultFields(ctx), byLotId: false));
        }

        ReportMissing(ctx, labApart ? [] : missing);
        ReadRows(ctx, missing.Count == 0);
    }

    /// <summary>
    /// After every input was read: the lots sheets lacking only a final alcohol column, read with the lab results kept
    /// apart (or, with none, reported as missing the column), then the lab results no lot took.
    /// </summary>
    public static void ReadAwaiting(IntakeRun run)
    {
        bool join = run.LabResults.Count > 0;
        foreach (var ctx in run.AwaitingResults)
        {
            if (join)
            {
                run.Sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, null, null, IssueCodes.LabResultsJoined, IntakeMessages.LabResultsJoined(LabJoin.SheetNames(run.LabSheets)));
            }
            else
            {
                ReportMissing(ctx, ["final_abv"]);
            }

            ReadRows(ctx, usable: join);
        }

        if (run.LabSheets.Count > 0)
        {
            LabJoin.ReportUnused(run, joined: run.AwaitingResults.Count > 0);
        }
    }

    private static void ReportMissing(SheetContext ctx, List<string> missing)
    {
        var sink = ctx.Run.Sink;
        foreach (var m in missing)
        {
            var f = Fields.Lot(m);
            string message = IntakeMessages.MissingColumn(m, [f.TemplateHeader, .. f.Synonyms.Take(2)]);
            if (m == "lot_id" && ctx.Column("vessel") is { } vessel)
            {
                // Cellars that name each lot by its tank: the tank column was read as the vessel.
                message += IntakeMessages.VesselAsLotId(vessel.Header);
            }

            if (m == "starting_sugar" && ctx.Unmatched.FirstOrDefault(h => ColumnRules.Find(h, TableKind.Log)?.Name == "sugar") is { } sugarWord)
            {
                // A bare "Densité", "Sugar" or "Gravity": too vague in a lots table (start or end?), but most likely the must's.
                message += IntakeMessages.VagueSugarHeader(sugarWord);
            }

            if (m == "final_abv" && RunningLotRows.FinalFields.All(name => ctx.Column(name) is null))
            {
                // No column of the finished wine at all: most likely lots still fermenting.
                message += IntakeMessages.PerhapsRunningLots();
            }

            sink.Error(ctx.File, ctx.SheetName, ctx.FirstData, null, null, IssueCodes.MissingColumn, message);
        }
    }

    private static void ReadRows(SheetContext ctx, bool usable)
    {
        bool running = ctx.Run.Options.RunningLots;
        var rowState = new RowState(ctx);
        var plan = new RowAccounting.Plan(running ? "running lots" : "lots", Readings: false, NotesAreRows: true, Usable: usable);
        RowAccounting.Read(ctx, plan, r => running ? RunningLotRows.Add(ctx, rowState, r) : Add(ctx, rowState, r));
    }

    /// <summary>
    /// A lots table with no lot column whose tank (vessel) column holds each tank once, or once per season where a season
    /// column says it, is a cellar that knows each lot by its tank: the tank column names the lots, as the hinted
    /// mapping would, with a warning. A column of vessel kinds ("Barrel" on many rows) names no lot and stays the vessel.
    /// </summary>
    internal static void TankNamesLots(SheetContext ctx)
    {
        if (ctx.LotColumn is not null || ctx.Column("vessel") is not { } tank)
        {
            return;
        }

        var season = ctx.Column("season");
        var seen = new HashSet<(string Season, string Tank)>();
        int named = 0;
        for (int r = ctx.FirstData; r <= ctx.LastRow; r++)
        {
            string name = CellValues.Text(ctx.Sheet.Cell(r, tank.Index)).Trim();
            if (name.Length == 0)
            {
                continue;
            }

            string year = season is null ? "" : CellValues.Text(ctx.Sheet.Cell(r, season.Index)).Trim();
            if (!seen.Add((year, name.ToUpperInvariant())))
            {
                return;
            }

            named++;
        }

        if (named == 0)
        {
            return;
        }

        ctx.Rebind(tank, Fields.Lot("lot_id"));
        ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, tank.Header, null, IssueCodes.LotIdFromTank, IntakeMessages.LotIdFromTank(tank.Header, season is not null));
    }

    /// <summary>Reads row <paramref name="r"/> as a lot and keeps it; false when it was reported instead.</summary>
    private static bool Add(SheetContext ctx, RowState rowState, int r)
    {
        var run = ctx.Run;
        if (ReadRow(ctx, rowState, r) is not { } read || LotPlausibility.Check(ctx, read, r) is not { } lot)
        {
            return false;
        }

        if (run.LotKeys.TryGetValue(lot.Key, out var first))
        {
            string message = IntakeMessages.DuplicateLot(lot.LotId, lot.Season, first.ToString());
            run.VesselsByKey ??= run.Lots.ToDictionary(l => l.Key, l => l.Vessel);
            if (lot.Vessel is { } vessel && run.VesselsByKey.GetValueOrDefault(lot.Key) is { } firstVessel && !string.Equals(vessel, firstVessel, StringComparison.Ordinal))
            {
                // A lot split across tanks under one id (22CS03 in T3A and T3B) is read as a repeat; say how to keep both.
                message += IntakeMessages.DuplicateLotInOtherVessel(lot.LotId, firstVessel, vessel);
            }

            run.Sink.Error(ctx.File, ctx.SheetName, r + 1, ctx.LotColumn!.Header, lot.LotId, IssueCodes.DuplicateLot, message);
            return false;
        }

        run.LotKeys[lot.Key] = lot.Source!;
        run.Lots.Add(lot);
        run.VesselsByKey?.Add(lot.Key, lot.Vessel);
        return true;
    }

    private static Lot? ReadRow(SheetContext ctx, RowState row, int r)
    {
        var st = row.Start(r);
        string? lotId = TextField(st, "lot_id");
        string? strain = TextField(st, "strain");
        int? season = SeasonField(st);
        var startScale = ColumnUnits.Scale(ctx.Column("starting_sugar")?.Unit ?? ColumnUnit.Brix);
        SugarReading? start = SugarField(st, ctx.Column("starting_sugar"), out double startRecorded);
        // A lots sheet with no final alcohol column takes it from the lab results kept apart (LabJoin).
        var lab = ctx.Column("final_abv") is null && lotId is not null && season is not null ? LabJoin.Find(st, lotId, season.Value) : null;
        double? abv = lab?.FinalAbv ?? NumberField(st, "final_abv");
        var lot = st.Bad || lotId is null || strain is null || start is null || abv is null || season is null
            ? null
            : new Lot
            {
                LotId = lotId,
                Season = season.Value,
                Strain = strain,
                StartingSugar = start.Value,
                RecordedStartingSugar = new RecordedSugar(startRecorded, startScale),
                FinalAlcohol = AlcoholContent.FromPercentVolume(abv.Value),
                Vessel = TextField(st, "vessel"),
                VesselCapacityL = NumberField(st, "vessel_capacity_l"),
                Variety = TextField(st, "variety") ?? st.Ctx.HeadingVariety,
                Block = TextField(st, "block"),
                Colour = ColourField(st),
                Additions = new Additions(NumberField(st, "must_volume_l"), NumberField(st, "water_added_l"), NumberField(st, "sugar_added_kg")),
                ResidualSugarGl = NumberField(st, "residual_sugar_gl") ?? lab?.ResidualSugarGl,
                FinalSugar = SugarField(st, "final_sugar") ?? lab?.FinalSugar,
                YanMgL = NumberField(st, "yan_mgl"),
                Ph = NumberField(st, "ph") ?? lab?.Ph,
                TaGl = NumberField(st, "ta_gl") ?? lab?.TaGl,
                MeanFermentationTempC = NumberField(st, "mean_temp_c"),
                PeakFermentationTempC = NumberField(st, "peak_temp_c"),
                InoculationDate = InoculationField(st, season),
                DryDate = DateField(st, "dry_date"),
                Notes = TextField(st, "notes"),
                Source = new SourceRef(ctx.File, ctx.SheetName, r + 1),
            };

        if (lot is null)
        {
            // Read the remaining fields anyway so every problem of the row is reported at once.
            foreach (var name in new[] { "vessel_capacity_l", "must_volume_l", "water_added_l", "sugar_added_kg", "residual_sugar_gl", "yan_mgl", "ph", "ta_gl", "mean_temp_c", "peak_temp_c" })
            {
                NumberField(st, name);
            }

            SugarField(st, "final_sugar");
            InoculationField(st, season);
            DateField(st, "dry_date");
            ColourField(st);
            return null;
        }

        return st.Bad ? null : lot;
    }
}
