using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;

namespace YieldBench.Intake;

/// <summary>
/// A lot read whole, checked against what a must and a wine can be, beyond each value's own range: additions that
/// would make no must, residual sugar above the sugar the must held, dates years away from the season. Impossible
/// combinations leave the lot out with an error naming the values; a date far from the season is left empty with a
/// warning.
/// </summary>
internal static class LotPlausibility
{
    /// <summary>The lot to keep (dates far from its season emptied), or null when it was left out (reported).</summary>
    public static Lot? Check(SheetContext ctx, Lot lot, int row)
    {
        var sink = ctx.Run.Sink;
        int sheetRow = row + 1;
        var additions = lot.Additions;
        var balance = AdditionBalance.Apply(lot.StartingSugar, additions);
        var startField = Fields.Lot("starting_sugar");
        if (additions.Any && additions.MustVolumeL is null)
        {
            var c = ctx.Column("water_added_l") ?? ctx.Column("sugar_added_kg");
            sink.Warning(ctx.File, ctx.SheetName, sheetRow, c?.Header, null, IssueCodes.AdditionsWithoutVolume, IntakeMessages.AdditionsWithoutVolume());
        }
        else if (additions.Any && (!balance.Corrected || balance.SolidsBrix < startField.Min || balance.SolidsBrix > startField.Max))
        {
            // Negative additions are refused cell by cell and water cannot take a must below 0 °Brix, so an uncorrected
            // balance here means a must above the highest °Brix a reading may have. The °Brix judged is the one a
            // refractometer would read after the additions (dissolved solids), as for a starting-sugar cell.
            double effective = balance.Corrected ? balance.SolidsBrix : double.NaN;
            string what = Describe(lot);
            var c = additions.SugarAddedKg is > 0 ? ctx.Column("sugar_added_kg") : ctx.Column("water_added_l");
            sink.Error(ctx.File, ctx.SheetName, sheetRow, c?.Header, null, IssueCodes.AdditionsImplausible,
                balance.Corrected
                    ? IntakeMessages.AdditionsImplausible(what, effective, startField.Min!.Value, startField.Max!.Value)
                    : IntakeMessages.AdditionsImplausible(what, double.NaN, startField.Min!.Value, startField.Max!.Value));
            return null;
        }

        if (lot.ResidualSugarGl is { } rs && rs > balance.EffectiveSugarGl)
        {
            var c = ctx.Column("residual_sugar_gl");
            sink.Error(ctx.File, ctx.SheetName, sheetRow, c?.Header, IntakeMessages.Num(rs), IssueCodes.ResidualAboveStart,
                IntakeMessages.ResidualAboveStart(rs, balance.EffectiveSugarGl, Shown(lot)));
            return null;
        }

        return lot with
        {
            InoculationDate = InSeason(ctx, lot, "inoculation_date", lot.InoculationDate, sheetRow),
            DryDate = InSeason(ctx, lot, "dry_date", lot.DryDate, sheetRow),
        };
    }

    /// <summary>The date, or null with a warning when it lies outside the year before to the year after the season.</summary>
    private static DateTime? InSeason(SheetContext ctx, Lot lot, string field, DateTime? date, int sheetRow)
    {
        if (date is not { } d || (d.Year >= lot.Season - 1 && d.Year <= lot.Season + 1))
        {
            return date;
        }

        string shown = d.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture);
        ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, sheetRow, ctx.Column(field)?.Header, shown, IssueCodes.DateOutsideSeason,
            IntakeMessages.DateOutsideSeason(field, shown, lot.Season) + IntakeMessages.LeftEmpty);
        return null;
    }

    private static string Shown(Lot lot) => lot.RecordedStartingSugar.ToString();

    private static string Describe(Lot lot)
    {
        var a = lot.Additions;
        var parts = new List<string>();
        if (a.SugarAddedKg is > 0)
        {
            parts.Add($"{IntakeMessages.Num(a.SugarAddedKg.Value)} kg of sugar");
        }

        if (a.WaterAddedL is > 0)
        {
            parts.Add($"{IntakeMessages.Num(a.WaterAddedL.Value)} L of water");
        }

        string added = parts.Count == 0 ? "The recorded additions" : string.Join(" and ", parts) + " added";
        return $"{added} to {IntakeMessages.Num(a.MustVolumeL ?? 0)} L of must at {Shown(lot)}";
    }
}
