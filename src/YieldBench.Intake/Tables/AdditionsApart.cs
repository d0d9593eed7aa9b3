using System.Globalization;

namespace YieldBench.Intake;

/// <summary>
/// A sheet of additions kept apart from the lots — a row per addition: date, lot, what was added, the amount ("water",
/// "120 L"; "sucrose", "25 kg"; "DAP", "30 g/hL") — which a lots table cannot read: one error naming the water and
/// sugar each lot received, to be written in the lots table's own columns, instead of an error for each column of a
/// lot the sheet lacks.
/// </summary>
internal static class AdditionsApart
{
    private static readonly HashSet<string> WhatWords = new(
        ["addition", "additions", "additive", "additives", "product", "item", "what", "material", "addition type", "type of addition", "ajout", "ajouts", "produit", "zusatz", "zugabe", "adicion", "producto", "aggiunta", "prodotto"],
        StringComparer.Ordinal);

    private static readonly HashSet<string> AmountWords = new(
        ["amount", "quantity", "qty", "rate", "dose", "dosage", "amt", "added", "quantite", "dose ajoutee", "menge", "cantidad", "dosis", "quantita"],
        StringComparer.Ordinal);

    private static readonly HashSet<string> WaterWords = new(["water", "h2o", "eau", "wasser", "agua", "acqua", "add back", "addback", "water addback"], StringComparer.Ordinal);

    private static readonly HashSet<string> SugarWords = new(
        ["sugar", "sucrose", "cane sugar", "beet sugar", "chaptal", "chaptalisation", "chaptalization", "sucre", "saccharose", "zucker", "azucar", "sacarosa", "zucchero", "saccarosio"],
        StringComparer.Ordinal);

    /// <summary>Most lots named in the message.</summary>
    private const int LotsShown = 8;

    /// <summary>The columns of what was added and how much, when the table's header names both; null otherwise.</summary>
    public static (int What, int Amount)? Columns(SheetContext ctx)
    {
        var header = ctx.Sheet.Rows[ctx.HeaderRow];
        int what = -1, amount = -1;
        for (int i = 0; i < header.Length; i++)
        {
            if (header[i] is not string h)
            {
                continue;
            }

            string key = HeaderText.FieldKey(h);
            if (what < 0 && WhatWords.Contains(key))
            {
                what = i;
            }
            else if (amount < 0 && AmountWords.Contains(key))
            {
                amount = i;
            }
        }

        return what >= 0 && amount >= 0 ? (what, amount) : null;
    }

    /// <summary>Reports the sheet once, with the water (L) and sugar (kg) it records for each lot.</summary>
    public static void Report(SheetContext ctx, int whatColumn, int amountColumn)
    {
        var lotCol = ctx.LotColumn!;
        var totals = new List<(string Lot, double Water, double Sugar)>();
        var others = new SortedSet<string>(StringComparer.OrdinalIgnoreCase);
        for (int r = ctx.FirstData; r <= ctx.LastRow; r++)
        {
            string lot = CellValues.Text(ctx.Sheet.Cell(r, lotCol.Index));
            string what = CellValues.Text(ctx.Sheet.Cell(r, whatColumn));
            string key = HeaderText.Normalise(what);
            bool water = WaterWords.Contains(key), sugar = SugarWords.Contains(key);
            if (lot.Length == 0 || what.Length == 0)
            {
                continue;
            }

            if (!water && !sugar)
            {
                others.Add(TextSettling.ForDisplay(what));
                continue;
            }

            if (Amount(ctx.Sheet.Cell(r, amountColumn), ctx.Sheet.DecimalComma, water ? FieldKind.Volume : FieldKind.Mass) is not { } amount)
            {
                continue;
            }

            int i = totals.FindIndex(t => t.Lot == lot);
            if (i < 0)
            {
                totals.Add((lot, 0, 0));
                i = totals.Count - 1;
            }

            totals[i] = water ? totals[i] with { Water = totals[i].Water + amount } : totals[i] with { Sugar = totals[i].Sugar + amount };
        }

        var header = ctx.Sheet.Rows[ctx.HeaderRow];
        string Header(int c) => TextSettling.ForDisplay(CellValues.Text(header[c]));
        var lots = totals.Take(LotsShown).Select(t => TextSettling.ForDisplay(t.Lot) + ": "
            + string.Join(" and ", new[] { t.Water > 0 ? $"water {IntakeMessages.Num(Math.Round(t.Water, 1))} L" : null, t.Sugar > 0 ? $"sugar {IntakeMessages.Num(Math.Round(t.Sugar, 2))} kg" : null }.Where(s => s is not null)))
            .ToList();
        if (totals.Count > LotsShown)
        {
            lots.Add($"and {totals.Count - LotsShown} more");
        }

        ctx.Run.Sink.Error(ctx.File, ctx.SheetName, ctx.FirstData, Header(whatColumn), null, IssueCodes.AdditionsApart,
            IntakeMessages.AdditionsApart(lotCol.Header, Header(whatColumn), Header(amountColumn), lots, others.Take(5).ToList()));
    }

    /// <summary>An amount written with a unit of the kind wanted ("120 L", "40 gal", "25 kg", "55 lb"), in L or kg; null otherwise.</summary>
    private static double? Amount(object? cell, bool decimalComma, FieldKind kind)
    {
        if (cell is not string text || CellValues.SplitUnit(text) is not var (number, unit)
            || CellValues.Number(number, decimalComma, out double value, out _) != CellProblem.None)
        {
            return null;
        }

        var column = new BoundColumn(0, Fields.Lot(kind == FieldKind.Volume ? "water_added_l" : "sugar_added_kg"), "", ColumnUnits.DefaultFor(kind), false);
        foreach (var u in kind == FieldKind.Volume ? new[] { ColumnUnit.Litre, ColumnUnit.Hectolitre, ColumnUnit.Kilolitre, ColumnUnit.UsGallon } : [ColumnUnit.Kilogram, ColumnUnit.Pound, ColumnUnit.Gram])
        {
            column.Unit = u;
            if (FieldParsers.CellUnitAgrees(column, unit))
            {
                return ColumnUnits.ToFieldUnit(value, u);
            }
        }

        return null;
    }
}
