using YieldBench.Core.Lots;
using static YieldBench.Intake.FieldParsers;

namespace YieldBench.Intake;

/// <summary>Rows of a lots table read as lots still fermenting (<see cref="IntakeOptions.RunningLots"/>).</summary>
internal static class RunningLotRows
{
    /// <summary>Fields of the finished wine's analysis, which a lot still fermenting cannot have yet.</summary>
    internal static readonly string[] FinalFields = ["final_abv", "residual_sugar_gl", "final_sugar", "dry_date", "mean_temp_c", "peak_temp_c"];

    /// <summary>One warning per final-analysis column of a running-lots table: it is not read.</summary>
    public static void ReportFinalColumns(SheetContext ctx)
    {
        foreach (var name in FinalFields)
        {
            if (ctx.Column(name) is { } c)
            {
                ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, c.Header, null, IssueCodes.FinalColumnNotRead, IntakeMessages.FinalColumnNotRead(name));
            }
        }
    }

    /// <summary>Reads row <paramref name="r"/> as a running lot and keeps it; false when it was reported instead.</summary>
    public static bool Add(SheetContext ctx, RowState row, int r)
    {
        var st = row.Start(r);
        string? lotId = TextField(st, "lot_id");
        string? strain = TextField(st, "strain");
        int? season = SeasonField(st);
        var startScale = ctx.Column("starting_sugar")?.Unit ?? ColumnUnit.Brix;
        var start = SugarField(st, "starting_sugar");
        double? capacity = NumberField(st, "vessel_capacity_l");
        var additions = new Additions(NumberField(st, "must_volume_l"), NumberField(st, "water_added_l"), NumberField(st, "sugar_added_kg"));
        double? yan = NumberField(st, "yan_mgl");
        var inoculated = InoculationField(st, season);
        var colour = ColourField(st);
        if (st.Bad || lotId is null || strain is null || start is null || season is null)
        {
            return false;
        }

        var lot = new RunningLot
        {
            LotId = lotId,
            Season = season.Value,
            Strain = strain,
            StartingSugar = start.Value,
            StartingSugarScale = ColumnUnits.Scale(startScale),
            Vessel = TextField(st, "vessel"),
            VesselCapacityL = capacity,
            Variety = TextField(st, "variety") ?? st.Ctx.HeadingVariety,
            Colour = colour,
            Additions = additions,
            YanMgL = yan,
            InoculationDate = inoculated,
            Notes = TextField(st, "notes"),
            Source = new SourceRef(ctx.File, ctx.SheetName, r + 1),
        };

        var key = new LotKey(lot.Season, lot.LotId);
        if (ctx.Run.LotKeys.TryGetValue(key, out var first))
        {
            ctx.Run.Sink.Error(ctx.File, ctx.SheetName, r + 1, ctx.Column("lot_id")!.Header, lot.LotId, IssueCodes.DuplicateLot, IntakeMessages.DuplicateLot(lot.LotId, lot.Season, first.ToString()));
            return false;
        }

        ctx.Run.LotKeys[key] = lot.Source;
        ctx.Run.RunningLots.Add(lot);
        return true;
    }
}
