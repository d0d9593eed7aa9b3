namespace YieldBench.Intake;

/// <summary>
/// The unit of each column whose header, units row or mapping gave none, settled from its values (always said in a
/// warning); a stated °C column whose values read as °F; the day/month order of text dates. Columns with a stated unit
/// are not looked through, except that one °C check.
/// </summary>
internal static class UnitSettling
{
    public static void Settle(SheetContext ctx)
    {
        foreach (var c in ctx.Columns)
        {
            switch (c.Field.Kind)
            {
                case FieldKind.Sugar or FieldKind.Alcohol or FieldKind.Temperature when c.Unit == ColumnUnit.None:
                    FromValues(ctx, c);
                    break;
                case FieldKind.Temperature when c.Unit == ColumnUnit.Celsius:
                    CheckCelsius(ctx, c);
                    break;
                case FieldKind.Sugar when c.Unit == ColumnUnit.SpecificGravity:
                    CheckGravityThousandths(ctx, c);
                    break;
                case FieldKind.Volume:
                case FieldKind.Mass:
                    if (c.Unit == ColumnUnit.None)
                    {
                        c.Unit = ColumnUnits.DefaultFor(c.Field.Kind);
                        ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, c.Header, null, IssueCodes.UnitAssumed, IntakeMessages.UnitAssumed(ColumnUnits.Label(c.Unit), c.Field.TemplateHeader));
                    }

                    break;
                case FieldKind.Plain when c.Field.Unit.Length > 0 && c.Unit == ColumnUnit.None && !PlainUnitStated(c):
                    ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, c.Header, null, IssueCodes.UnitAssumed, IntakeMessages.UnitAssumed(c.Field.Unit, c.Field.TemplateHeader));
                    break;
                case FieldKind.Date or FieldKind.DateTime:
                    c.DateOrder = CellValues.ColumnDateOrder(ctx.Values(c), out var bySpan);
                    WarnDateOrder(ctx, c, bySpan);
                    break;
            }
        }
    }

    /// <summary>Says once for the column that its day/month order was settled by how its dates gather, when it was.</summary>
    internal static void WarnDateOrder(SheetContext ctx, BoundColumn c, (int Dates, int Span, int OtherSpan, string Example)? bySpan)
    {
        if (bySpan is { } s)
        {
            ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, c.Header, s.Example, IssueCodes.DateOrderFromSpan,
                IntakeMessages.DateOrderFromSpan(c.DateOrder == DateOrder.DayFirst, s.Dates, s.Span, s.OtherSpan, s.Example));
        }
    }

    /// <summary>
    /// The column's numbers, sorted (null when it holds none); the numbers are kept on the column by row, so each cell
    /// is parsed once.
    /// </summary>
    private static double[]? SortedNumbers(SheetContext ctx, BoundColumn c)
    {
        var byRow = new double[ctx.LastRow - ctx.FirstData + 1];
        var found = new List<double>(byRow.Length);
        var withUnits = new List<double>();
        for (int r = ctx.FirstData; r <= ctx.LastRow; r++)
        {
            object? cell = ctx.Sheet.Cell(r, c.Index);
            bool number = CellValues.Number(cell, ctx.Sheet.DecimalComma, out double d, out _) == CellProblem.None;
            byRow[r - ctx.FirstData] = number ? d : double.NaN;
            if (number)
            {
                found.Add(d);
            }
            else if (c.Field.Kind == FieldKind.Sugar && cell is string text && CellValues.SplitUnit(text) is var (written, _)
                && CellValues.Number(written, ctx.Sheet.DecimalComma, out double withUnit, out _) == CellProblem.None)
            {
                // "SG 1.045", "12 Bx": when no plain number settles the scale, these numbers do; the unit written with
                // each is checked against the scale when the row is read (not kept here, so the row reader sees the
                // cell as written).
                withUnits.Add(withUnit);
            }
        }

        if (found.Count == 0)
        {
            found = withUnits;
        }

        c.KeepParsed(byRow);
        if (found.Count == 0)
        {
            return null;
        }

        var sorted = found.ToArray();
        Array.Sort(sorted);
        return sorted;
    }

    private static void FromValues(SheetContext ctx, BoundColumn c)
    {
        if (SortedNumbers(ctx, c) is not { } sorted)
        {
            c.Unit = ColumnUnits.DefaultFor(c.Field.Kind);
            return;
        }

        double low = sorted[0], median = sorted[sorted.Length / 2], high = sorted[^1];
        var sink = ctx.Run.Sink;
        switch (c.Field.Kind)
        {
            case FieldKind.Sugar:
                c.Unit = c.Field.Name == "starting_sugar" ? StartingSugarUnit(median) : ReadingSugarUnit(sorted);
                var fitting = Array.FindAll(sorted, v => ValueLooksLike(c.Field, v, c.Unit));
                var (bandLow, bandHigh) = fitting.Length > 0 ? (fitting[0], fitting[^1]) : (low, high);
                bool maybeBaume = c.Field.Name == "starting_sugar" && c.Unit == ColumnUnit.Brix && median is >= 8 and <= 16;
                sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, c.Header, null, IssueCodes.UnitFromValues,
                    IntakeMessages.UnitFromValues(ColumnUnits.Label(c.Unit), bandLow, bandHigh, SugarHeaderExample(c)) + (maybeBaume ? IntakeMessages.MaybeBaume() : ""));
                break;
            case FieldKind.Alcohol:
                c.Unit = median > 30 ? ColumnUnit.AlcoholGramsPerLitre : ColumnUnit.PercentVolume;
                sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, c.Header, null, IssueCodes.UnitFromValues,
                    IntakeMessages.UnitFromValues(ColumnUnits.Label(c.Unit), low, high, c.Unit == ColumnUnit.AlcoholGramsPerLitre ? "Final alcohol (g/L)" : "Final alcohol (% v/v)"));
                break;
            default:
                c.Unit = TemperatureUnitOf(median);
                sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, c.Header, null, IssueCodes.UnitFromValues,
                    IntakeMessages.UnitFromValues(ColumnUnits.Label(c.Unit), low, high, c.Field.TemplateHeader));
                break;
        }
    }

    /// <summary>A column headed °C whose middle value lies above 45 and up to 120 holds °F: read so, with a warning.</summary>
    private static void CheckCelsius(SheetContext ctx, BoundColumn c)
    {
        if (SortedNumbers(ctx, c) is { } sorted && sorted[sorted.Length / 2] is > 45 and <= 120)
        {
            c.Unit = ColumnUnit.Fahrenheit;
            ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, c.Header, null, IssueCodes.TemperatureInFahrenheit, IntakeMessages.ColumnInFahrenheit(sorted[0], sorted[^1]));
        }
    }

    /// <summary>
    /// A column headed SG (or density, gravity) whose numbers all lie from 950 to 1300 holds SG in thousandths ("1090"
    /// for 1.090, as gravities are often noted): read so, with a warning.
    /// </summary>
    private static void CheckGravityThousandths(SheetContext ctx, BoundColumn c)
    {
        if (SortedNumbers(ctx, c) is { } sorted && sorted[0] >= 950 && sorted[^1] < 1300)
        {
            c.Unit = ColumnUnit.GravityThousandths;
            ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, ctx.FirstData, c.Header, null, IssueCodes.UnitFromValues, IntakeMessages.GravityInThousandths(sorted[0], sorted[^1]));
        }
    }

    internal static bool PlainUnitStated(BoundColumn c) => c.UnitStated || PlainUnitIn(c.Header, c.Field.Unit);

    /// <summary>True when the text (a header, or a header with its units-row unit) names the field's held unit, g/L or mg N/L.</summary>
    internal static bool PlainUnitIn(string text, string fieldUnit)
    {
        string n = " " + HeaderText.Normalise(text) + " ";
        return fieldUnit switch
        {
            "g/L" => n.Contains(" g l ", StringComparison.Ordinal) || n.Contains(" gl ", StringComparison.Ordinal) || n.Contains(" gpl ", StringComparison.Ordinal),
            "mg N/L" => n.Contains(" mg ", StringComparison.Ordinal) || n.Contains(" mgl ", StringComparison.Ordinal) || n.Contains(" ppm ", StringComparison.Ordinal),
            _ => true,
        };
    }

    internal static string SugarHeaderExample(BoundColumn c) => c.Field.Name switch
    {
        "starting_sugar" => "Starting sugar (" + ColumnUnits.Label(c.Unit) + ")",
        "final_sugar" => "Final sugar (" + ColumnUnits.Label(c.Unit) + ")",
        _ => "Sugar (" + ColumnUnits.Label(c.Unit) + ")",
    };

    /// <summary>Temperature scale from a column's median: above 45 no must is in °C, so °F.</summary>
    internal static ColumnUnit TemperatureUnitOf(double median) => median > 45 ? ColumnUnit.Fahrenheit : ColumnUnit.Celsius;

    /// <summary>
    /// Starting-sugar scale from the column median: SG 0.95–1.3, °Oechsle 45–145, SG × 1000 from 950 to 1300 (no must
    /// holds that much sugar in g/L: 40 °Brix is about 470 g/L), g/L above 145, else °Brix.
    /// </summary>
    internal static ColumnUnit StartingSugarUnit(double median) => median switch
    {
        >= 0.95 and < 1.3 => ColumnUnit.SpecificGravity,
        > 45 and <= 145 => ColumnUnit.Oechsle,
        >= 950 and < 1300 => ColumnUnit.GravityThousandths,
        > 145 => ColumnUnit.SugarGramsPerLitre,
        _ => ColumnUnit.Brix,
    };

    /// <summary>Scale of a reading column (logs, final sugar) that runs down to dryness: all values 0.95–1.3 mean SG, all 950–1300 SG × 1000.</summary>
    /// <summary>
    /// The scale of a reading column's sorted values: as <see cref="ReadingSugarUnit(double, double)"/>, except that
    /// values all of which are specific gravity written one way or the other (1108 beside 1.066, two people typing one
    /// sheet) are the gravity written as most of them are; each value of the other form is then read as the gravity it
    /// is (no other scale reaches either band) and said once for the column.
    /// </summary>
    internal static ColumnUnit ReadingSugarUnit(double[] sorted)
    {
        int plain = sorted.Count(v => v is >= 0.95 and < 1.3), thousandths = sorted.Count(v => v is >= 950 and < 1300);
        if (plain > 0 && thousandths > 0 && plain + thousandths == sorted.Length)
        {
            return thousandths >= plain ? ColumnUnit.GravityThousandths : ColumnUnit.SpecificGravity;
        }

        return ReadingSugarUnit(sorted[0], sorted[^1]);
    }

    internal static ColumnUnit ReadingSugarUnit(double low, double high) => (low, high) switch
    {
        ( >= 0.95, < 1.3) => ColumnUnit.SpecificGravity,
        ( >= 950, < 1300) => ColumnUnit.GravityThousandths,
        (_, > 145) => ColumnUnit.SugarGramsPerLitre,
        (_, > 45) => ColumnUnit.Oechsle,
        _ => ColumnUnit.Brix,
    };

    /// <summary>True when a value fits the column's scale; false names a value that looks like another scale.</summary>
    internal static bool ValueLooksLike(FieldDef field, double v, ColumnUnit unit)
    {
        if (field.Name == "starting_sugar")
        {
            var band = StartingSugarUnit(v);
            // °Baumé, potential alcohol and °KMW values lie in °Brix's band (smaller numbers, but no band of their own).
            return unit is ColumnUnit.Baume or ColumnUnit.PotentialAlcohol or ColumnUnit.Kmw ? band == ColumnUnit.Brix : band == unit;
        }

        return unit switch
        {
            ColumnUnit.SpecificGravity => v is >= 0.95 and < 1.3,
            ColumnUnit.GravityThousandths => v is >= 950 and < 1300,
            ColumnUnit.Brix or ColumnUnit.Baume or ColumnUnit.Kmw => v <= 45,
            _ => true,
        };
    }

    internal static ColumnUnit LikelyUnit(FieldDef field, double v) =>
        field.Name == "starting_sugar" ? StartingSugarUnit(v) : ReadingSugarUnit(v, v);
}
