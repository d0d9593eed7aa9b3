using System.Globalization;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Intake;

/// <summary>The row being read and whether a problem has left it out; one per sheet, started afresh for each row.</summary>
internal sealed class RowState(SheetContext ctx)
{
    public bool Bad { get; set; }

    public int Row { get; private set; }

    public int SheetRow => Row + 1;

    public SheetContext Ctx { get; } = ctx;

    public RowState Start(int row)
    {
        Row = row;
        Bad = false;
        return this;
    }

    public void Problem(BoundColumn c, object? cell, string code, string message, bool critical)
    {
        string value = CellValues.Text(cell);
        if (critical)
        {
            Bad = true;
            Ctx.Run.Sink.Error(Ctx.File, Ctx.SheetName, SheetRow, c.Header, value, code, message);
        }
        else
        {
            Ctx.Run.Sink.Warning(Ctx.File, Ctx.SheetName, SheetRow, c.Header, value, code, message + IntakeMessages.LeftEmpty);
        }
    }
}

/// <summary>
/// Reads one field of the row being read: text, season, number, sugar, date, colour. Each value is parsed once,
/// converted once and range-checked once; a bad value is reported where it is found (an error leaving the row out for
/// a value that enters the conversion, else a warning leaving only the value empty).
/// </summary>
internal static partial class FieldParsers
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    internal static string Label(FieldDef f) => f.Name;

    /// <summary>
    /// Reports a cell that holds a formula error, or a formula with no stored result, and returns true; false for any
    /// other cell. The season of a log row is only a warning; other values follow their field.
    /// </summary>
    internal static bool Unreadable(RowState st, BoundColumn c, object? cell)
    {
        bool critical = c.Field.Name == "season" ? st.Ctx.Kind == TableKind.Lots : c.Field.Critical;
        switch (cell)
        {
            case ErrorCell:
                st.Problem(c, cell, IssueCodes.ErrorCell, IntakeMessages.ErrorCell(Label(c.Field)), critical);
                return true;
            case FormulaCell f:
                st.Problem(c, cell, IssueCodes.FormulaWithoutValue, IntakeMessages.FormulaWithoutValue(Label(c.Field), f.Formula), critical);
                return true;
            default:
                return false;
        }
    }

    internal static string? TextField(RowState st, string name) => TextField(st, st.Ctx.Column(name));

    internal static string? TextField(RowState st, BoundColumn? column)
    {
        if (column is not { } c)
        {
            return null;
        }

        object? cell = st.Ctx.Sheet.Cell(st.Row, c.Index);
        if (Unreadable(st, c, cell))
        {
            return null;
        }

        string raw = CellValues.Text(cell);
        string text = TextSettling.Settle(raw, multiline: c.Field.Name == "notes", out var change);
        if (text.Length == 0)
        {
            if (c.Field.Required)
            {
                st.Problem(c, cell, IssueCodes.MissingValue, IntakeMessages.MissingValue(Label(c.Field)), true);
            }

            return null;
        }

        var ctx = st.Ctx;
        if (change.HasFlag(TextChange.Characters))
        {
            ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, st.SheetRow, c.Header, raw, IssueCodes.TextSettled, IntakeMessages.TextSettled(Label(c.Field), c.Field.Name == "notes"));
        }

        if (change.HasFlag(TextChange.Cut))
        {
            ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, st.SheetRow, c.Header, raw, IssueCodes.TextTooLong, IntakeMessages.TextTooLong(Label(c.Field), raw.Length, TextSettling.MaxCellText));
        }

        return text;
    }

    internal static int? SeasonField(RowState st) => SeasonField(st, st.Ctx.Column("season"));

    internal static int? SeasonField(RowState st, BoundColumn? seasonColumn)
    {
        var ctx = st.Ctx;
        if (seasonColumn is { } c)
        {
            object? cell = ctx.Sheet.Cell(st.Row, c.Index);
            if (!CellValues.IsBlank(cell))
            {
                if (cell is double d && d == Math.Floor(d) && d is >= 1900 and <= 2100)
                {
                    return (int)d;
                }

                if (cell is string s && SeasonNames.YearOf(s) is >= 1900 and <= 2100 and var y)
                {
                    return y;
                }

                if (cell is DateTime dt)
                {
                    return dt.Year;
                }

                if (!Unreadable(st, c, cell))
                {
                    st.Problem(c, cell, IssueCodes.NotAYear, IntakeMessages.NotAYear("season"), ctx.Kind == TableKind.Lots);
                }

                return null;
            }
        }

        if (ctx.HeadingSeason is { } heading)
        {
            return heading;
        }

        if (ctx.DefaultSeason is { } def)
        {
            return def;
        }

        if (ctx.Kind == TableKind.Lots && InoculationYear(st) is { } year)
        {
            // The vintage is the year the grapes were picked, which is the year the must was inoculated in either
            // hemisphere (common practice); said in a warning so a different vintage can be given.
            var inoc = ctx.Column("inoculation_date")!;
            ctx.Run.Sink.Warning(ctx.File, ctx.SheetName, st.SheetRow, inoc.Header, CellValues.Text(ctx.Sheet.Cell(st.Row, inoc.Index)), IssueCodes.SeasonFromDate, IntakeMessages.SeasonFromDate(year));
            return year;
        }

        if (ctx.Kind == TableKind.Lots)
        {
            st.Bad = true;
            ctx.Run.Sink.Error(ctx.File, ctx.SheetName, st.SheetRow, seasonColumn?.Header, null, IssueCodes.NoSeason, IntakeMessages.NoSeason());
        }

        return null;
    }

    /// <summary>The year of the row's inoculation date when it reads as a date without doubt (nothing is reported here).</summary>
    private static int? InoculationYear(RowState st)
    {
        if (st.Ctx.Column("inoculation_date") is not { } c)
        {
            return null;
        }

        object? cell = st.Ctx.Sheet.Cell(st.Row, c.Index);
        object? dateCell = cell is string text && CellValues.WithoutZone(text) is { } local ? local : cell;
        return CellValues.Date(dateCell, c.DateOrder, out var value, out _, out _) == CellProblem.None && value.Year is >= 1900 and <= 2100 ? value.Year : null;
    }

    internal static bool NumberCell(RowState st, BoundColumn c, out double value)
    {
        object? cell = st.Ctx.Sheet.Cell(st.Row, c.Index);
        if (cell is string noted && NumberWithNote(noted) is var (number, note) && !c.ParsedAt(st.Row - st.Ctx.FirstData, out _))
        {
            // "24.1 (retest)": a number with a note in brackets that holds no digit. The number is what was measured;
            // the note is named, so nothing is dropped unseen. "24.1 (23.8)" or "24.1 (retest 14/9)" stay no number.
            if (!NumberCellOf(st, c, number, out value))
            {
                return false;
            }

            st.Ctx.Run.Sink.Warning(st.Ctx.File, st.Ctx.SheetName, st.SheetRow, c.Header, noted, IssueCodes.NoteInCell,
                IntakeMessages.NoteInCell(Label(c.Field), number, note));
            return true;
        }

        return NumberCellOf(st, c, cell, out value);
    }

    /// <summary>Longest cell text taken for a number with a note.</summary>
    private const int NoteCellMaxLength = 200;

    /// <summary>
    /// A number (perhaps with a unit) followed by a note in round or square brackets holding a letter and no digit, as
    /// the number's text and the note's (both trimmed); null for any other text. One pass, no backtracking.
    /// </summary>
    internal static (string Number, string Note)? NumberWithNote(string text)
    {
        var t = text.AsSpan().Trim();
        if (t.Length is < 4 or > NoteCellMaxLength || t[^1] is not (')' or ']'))
        {
            return null;
        }

        int open = t.LastIndexOf(t[^1] == ')' ? '(' : '[');
        if (open <= 0)
        {
            return null;
        }

        var number = t[..open].Trim();
        var note = t[(open + 1)..^1].Trim();
        bool noteHasLetter = false;
        foreach (char ch in note)
        {
            if (char.IsAsciiDigit(ch) || ch is '(' or ')' or '[' or ']')
            {
                return null;
            }

            noteHasLetter |= char.IsLetter(ch);
        }

        if (!noteHasLetter || number.IndexOfAny("()[]") >= 0 || !number.ContainsAny("0123456789"))
        {
            return null;
        }

        return (number.ToString(), note.ToString());
    }

    private static bool NumberCellOf(RowState st, BoundColumn c, object? cell, out double value)
    {
        string? alternative = null;
        var problem = c.ParsedAt(st.Row - st.Ctx.FirstData, out value)
            ? CellProblem.None
            : CellValues.Number(cell, st.Ctx.Sheet.DecimalComma, out value, out alternative);
        if (problem == CellProblem.None && st.Ctx.Sheet.DotGroupingUnsettled && cell is string dotted && CellValues.DotThousands(dotted.Trim()))
        {
            // "4.200" in a semicolon file that shows no decimal point elsewhere: 4200 as much as 4.2, never guessed.
            problem = CellProblem.AmbiguousNumber;
            alternative = dotted.Trim().Replace(".", "", StringComparison.Ordinal) + " or " + dotted.Trim();
        }

        if (problem == CellProblem.AmbiguousNumber && CommaThousands(st, c, cell, alternative!, ref value))
        {
            problem = CellProblem.None;
        }

        string label = Label(c.Field);
        if (problem == CellProblem.NotANumber && cell is string text && CellValues.SplitUnit(text) is var (number, unitText))
        {
            // "24.5 Bx", "1.4 g/L": the unit written in the cell is accepted only when it is the column's own unit.
            var inner = CellValues.Number(number, st.Ctx.Sheet.DecimalComma, out value, out alternative);
            if (inner == CellProblem.AmbiguousNumber && CommaThousands(st, c, cell, alternative!, ref value))
            {
                inner = CellProblem.None;
            }

            if (inner == CellProblem.None)
            {
                if (CellUnitAgrees(c, unitText))
                {
                    return true;
                }

                if (!c.UnitStated && c.Field.Kind is FieldKind.Volume or FieldKind.Mass or FieldKind.Temperature && NamedUnit(unitText) is { } own && KindOf(own) == c.Field.Kind)
                {
                    // "5 kL", "50 hL", "2000 gal", "62°F" in a column whose header gives no unit: the cell says its
                    // unit, which is no guess; converted to the column's unit and said once for the column (SheetReader).
                    double inField = ColumnUnits.ToFieldUnit(value, own);
                    value = c.Unit == ColumnUnit.Fahrenheit ? (inField * 9.0 / 5.0) + 32.0 : inField / ColumnUnits.ToFieldUnit(1.0, c.Unit);
                    c.CellUnitAt ??= (st.SheetRow, text.Trim(), inField);
                    c.CellUnits++;
                    return true;
                }

                string columnUnit = ColumnUnits.Label(c.Unit) is { Length: > 0 } u ? u : (c.Field.Unit.Length > 0 ? c.Field.Unit : "its held unit");
                st.Problem(c, cell, IssueCodes.UnitInCellDiffers, IntakeMessages.UnitInCellDiffers(label, unitText, columnUnit), c.Field.Critical);
                return false;
            }

            problem = inner;
        }

        if (problem == CellProblem.NotANumber && c.Field.Name == "residual_sugar_gl" && cell is string limitText
            && BelowLabLimit(limitText, st.Ctx.Sheet.DecimalComma, out double? limit))
        {
            // "<1", "ND", "dry": the lab found less than it measures. Up to the review's dryness limit that says the
            // wine is dry, which is what an empty residual sugar is taken as; a higher limit does not say it.
            double dry = new YieldBench.Core.Review.Strains.StrainReviewSettings().DryThresholdGl;
            if (limit is { } l && l > dry)
            {
                st.Problem(c, cell, IssueCodes.BelowLabLimit, IntakeMessages.LabLimitTooHigh(label, IntakeMessages.Num(l), IntakeMessages.Num(dry)), c.Field.Critical);
            }
            else
            {
                st.Problem(c, cell, IssueCodes.BelowLabLimit, IntakeMessages.BelowLabLimit(label), false);
            }

            return false;
        }

        if (problem == CellProblem.None && cell is string pct && pct.TrimEnd().EndsWith('%'))
        {
            // A percent sign (typed, or from a percent-formatted cell) is % v/v for alcohol and % by mass for °Brix;
            // residual sugar in % is g per 100 mL; for any other field it names no unit the column can hold.
            if (c.Field.Name == "residual_sugar_gl" && c.Unit != ColumnUnit.GramsPer100Millilitre)
            {
                value = Math.Round(value * 10.0, 10);
            }
            else if (c.Field.Kind is not (FieldKind.Alcohol or FieldKind.Sugar) && c.Field.Name != "residual_sugar_gl")
            {
                string columnUnit = ColumnUnits.Label(c.Unit) is { Length: > 0 } u ? u : (c.Field.Unit.Length > 0 ? c.Field.Unit : "its held unit");
                st.Problem(c, cell, IssueCodes.UnitInCellDiffers, IntakeMessages.UnitInCellDiffers(label, "%", columnUnit), c.Field.Critical);
                return false;
            }
        }

        switch (problem)
        {
            case CellProblem.None:
                return true;
            case CellProblem.Blank:
                if (c.Field.Required)
                {
                    st.Problem(c, cell, IssueCodes.MissingValue, IntakeMessages.MissingValue(label), true);
                }

                return false;
            case CellProblem.ErrorCell or CellProblem.FormulaWithoutValue:
                Unreadable(st, c, cell);
                return false;
            case CellProblem.AmbiguousNumber:
                var parts = alternative!.Split(" or ");
                string shown = CellValues.Text(cell);
                if (!shown.Contains(',', StringComparison.Ordinal) && c.Field.Kind == FieldKind.Sugar
                    && double.TryParse(parts[1], System.Globalization.NumberStyles.Float, Inv, out double gravity) && gravity is >= 0.95 and < 1.3)
                {
                    // "1.095" in a sugar column is a specific gravity; 1095 means nothing on any sugar scale.
                    value = gravity;
                    return true;
                }

                st.Problem(c, cell, IssueCodes.AmbiguousNumber, shown.Contains(',', StringComparison.Ordinal)
                    ? IntakeMessages.AmbiguousNumber(label, parts[0], parts[1])
                    : st.Ctx.Sheet.DecimalComma ? IntakeMessages.AmbiguousDotNumber(label, parts[0], parts[1])
                    : IntakeMessages.AmbiguousDotNumberUnsettled(label, parts[0], parts[1]), c.Field.Critical);
                return false;
            default:
                if (cell is string bound && Bound(bound, st.Ctx.Sheet.DecimalComma) is var (above, limitShown))
                {
                    // ">15", "< 3": the lab's value lies beyond its range, which is no measurement to compute with.
                    st.Problem(c, cell, IssueCodes.NotANumber, IntakeMessages.BoundNotValue(label, bound.Trim(), above, limitShown), c.Field.Critical);
                    return false;
                }

                st.Problem(c, cell, IssueCodes.NotANumber, IntakeMessages.NotANumber(label, double.TryParse(c.Field.Example, System.Globalization.NumberStyles.Float, Inv, out _) ? c.Field.Example : "24.3"), c.Field.Critical);
                return false;
        }
    }

    private static readonly HashSet<string> NotDetectedWords =
        ["nd", "n d", "bdl", "lod", "loq", "not detected", "below detection", "below detection limit", "dry", "sec", "seco", "secco", "trocken",
            "trace", "traces", "tr", "spur", "spuren", "traza", "trazas", "traccia", "tracce"];

    /// <summary>
    /// True for a residual sugar the lab gave only as below its limit: "&lt;1", "&lt; 0,5 g/L", "ND", "n.d.", "BDL",
    /// "&lt;LOD", "dry" (also sec, seco, secco, trocken); <paramref name="limit"/> is the number after "&lt;", if any.
    /// </summary>
    internal static bool BelowLabLimit(string text, bool decimalComma, out double? limit)
    {
        limit = null;
        string t = text.Trim();
        if (t.StartsWith('<') || t.StartsWith('\u2264'))
        {
            t = t[1..].Trim();
            if (CellValues.SplitUnit(t) is var (number, unit) && HeaderText.Normalise(unit) is "g l" or "gl" or "gpl")
            {
                t = number;
            }

            if (CellValues.Number(t, decimalComma, out double v, out _) == CellProblem.None && v > 0)
            {
                limit = v;
                return true;
            }
        }

        return NotDetectedWords.Contains(HeaderText.Normalise(t));
    }

    /// <summary>
    /// In a file whose fields are separated by commas and whose decimals are written with a point, "1,250" (a comma
    /// before groups of three digits) groups thousands: the thousands reading is taken, tallied for the column.
    /// </summary>
    private static bool CommaThousands(RowState st, BoundColumn c, object? cell, string alternative, ref double value)
    {
        if (!st.Ctx.Sheet.CommaGroupsThousands || cell is not string s || !s.Contains(',', StringComparison.Ordinal)
            || !double.TryParse(alternative.Split(" or ")[0], NumberStyles.Float, Inv, out double thousands))
        {
            return false;
        }

        value = thousands;
        c.ThousandsAt ??= (st.SheetRow, s.Trim(), thousands);
        c.Thousands++;
        return true;
    }

    /// <summary>The kind of quantity a volume or mass unit measures; None for other units.</summary>
    private static FieldKind? KindOf(ColumnUnit unit) => unit switch
    {
        ColumnUnit.Litre or ColumnUnit.Hectolitre or ColumnUnit.Kilolitre or ColumnUnit.UsGallon => FieldKind.Volume,
        ColumnUnit.Kilogram or ColumnUnit.Pound or ColumnUnit.Gram => FieldKind.Mass,
        ColumnUnit.Celsius or ColumnUnit.Fahrenheit => FieldKind.Temperature,
        _ => null,
    };

    /// <summary>The unit a unit text written in a cell names ("kL", "gal", "lbs", "°Bx"), or null.</summary>
    private static ColumnUnit? NamedUnit(string unitText)
    {
        string u = unitText.ToLowerInvariant().Replace("°", "", StringComparison.Ordinal).Replace("º", "", StringComparison.Ordinal)
            .Replace(" ", "", StringComparison.Ordinal).Replace("é", "e", StringComparison.Ordinal).TrimEnd('.');
        return u == "g" ? ColumnUnit.Gram : NamedScaleOrUnit(u);
    }

    /// <summary>A value written as a bound (">15", "≥ 16.5", "< 3"): whether it is a lower bound, and the limit's text; null otherwise.</summary>
    private static (bool Above, string Limit)? Bound(string text, bool decimalComma)
    {
        string t = text.Trim();
        if (t.Length < 2 || t[0] is not ('>' or '<' or '\u2265' or '\u2264'))
        {
            return null;
        }

        string rest = t[1..].TrimStart('=').Trim();
        string number = CellValues.SplitUnit(rest) is var (n, _) ? n : rest;
        return CellValues.Number(number, decimalComma, out _, out _) == CellProblem.None ? (t[0] is '>' or '\u2265', rest) : null;
    }

    /// <summary>True when a unit written after a number in a cell names the unit the column is read in.</summary>
    internal static bool CellUnitAgrees(BoundColumn c, string unitText)
    {
        string u = unitText.ToLowerInvariant().Replace("°", "", StringComparison.Ordinal).Replace("º", "", StringComparison.Ordinal)
            .Replace(" ", "", StringComparison.Ordinal).Replace("é", "e", StringComparison.Ordinal).TrimEnd('.');
        ColumnUnit? named = NamedScaleOrUnit(u);
        bool gramsPerLitre = u is "g/l" or "gl" or "gpl";
        if (unitText.Trim() is "°" or "º")
        {
            // A bare degree is % vol on alcohol ("13,5°" in the trade's usage in France, Spain and Italy: common
            // practice) and the column's own scale on a temperature ("18°" under °C); on a sugar it could be °Brix,
            // °Baumé or °Oechsle, so it is refused there.
            return (c.Field.Kind == FieldKind.Alcohol && c.Unit == ColumnUnit.PercentVolume) || c.Field.Kind == FieldKind.Temperature;
        }

        return c.Field.Name switch
        {
            "residual_sugar_gl" or "ta_gl" => gramsPerLitre,
            "yan_mgl" => u is "mg/l" or "mgn/l" or "ppm" or "mgl",
            _ when c.Field.Kind == FieldKind.Sugar => gramsPerLitre ? c.Unit == ColumnUnit.SugarGramsPerLitre : named == c.Unit,
            _ when c.Field.Kind == FieldKind.Alcohol => gramsPerLitre ? c.Unit == ColumnUnit.AlcoholGramsPerLitre : named == c.Unit,
            _ when c.Field.Kind == FieldKind.Mass && u == "g" => c.Unit == ColumnUnit.Gram,
            _ => named is not null && named == c.Unit,
        };
    }

    /// <summary>The scale or unit a cell's unit text names once folded ("bx", "gal", "kl"), or null.</summary>
    private static ColumnUnit? NamedScaleOrUnit(string u) => u switch
    {
        "bx" or "brix" => ColumnUnit.Brix,
        "sg" => ColumnUnit.SpecificGravity,
        "oe" or "oechsle" => ColumnUnit.Oechsle,
        "kmw" or "babo" => ColumnUnit.Kmw,
        "be" or "baume" => ColumnUnit.Baume,
        "%" or "%v/v" or "%vol" or "vol" or "vol%" or "%abv" or "abv" or "%alc" or "v/v" => ColumnUnit.PercentVolume,
        "c" => ColumnUnit.Celsius,
        "f" => ColumnUnit.Fahrenheit,
        "l" or "lt" or "ltr" or "litres" or "liters" => ColumnUnit.Litre,
        "hl" => ColumnUnit.Hectolitre,
        "kl" => ColumnUnit.Kilolitre,
        "gal" or "gals" or "gallons" => ColumnUnit.UsGallon,
        "kg" => ColumnUnit.Kilogram,
        "lb" or "lbs" => ColumnUnit.Pound,
        _ => null,
    };

    internal static string Shown(double raw, ColumnUnit unit) =>
        ColumnUnits.Label(unit) is { Length: > 0 } u ? $"{IntakeMessages.Num(raw)} {u}" : IntakeMessages.Num(raw);

    /// <summary>A number in the field's unit, range-checked; null when empty or bad (bad ones reported).</summary>
    internal static double? NumberField(RowState st, string name) => NumberField(st, st.Ctx.Column(name));

    internal static double? NumberField(RowState st, BoundColumn? column)
    {
        if (column is not { } c || !NumberCell(st, c, out double raw))
        {
            return null;
        }

        var f = c.Field;
        string name = f.Name;
        object? cell = st.Ctx.Sheet.Cell(st.Row, c.Index);
        if (f.Kind == FieldKind.Temperature && c.Unit == ColumnUnit.Celsius && raw is > 45 and <= 120)
        {
            st.Problem(c, cell, IssueCodes.FahrenheitInCelsiusColumn, IntakeMessages.FahrenheitInCelsiusColumn(Label(f), (raw - 32) * 5 / 9), f.Critical);
            return null;
        }

        double v = ColumnUnits.ToFieldUnit(raw, c.Unit);
        if (f.Kind is FieldKind.Volume && name is "must_volume_l" or "vessel_capacity_l" && v <= 0)
        {
            st.Problem(c, cell, IssueCodes.OutOfRange, IntakeMessages.NotPositive(Label(f), ConvertedShown(raw, c.Unit, v, f.Unit)), f.Critical);
            return null;
        }

        if (f.Kind is FieldKind.Volume or FieldKind.Mass && v < 0)
        {
            st.Problem(c, cell, IssueCodes.OutOfRange, IntakeMessages.Negative(Label(f), ConvertedShown(raw, c.Unit, v, f.Unit)), f.Critical);
            return null;
        }

        if (f.Min is { } min && f.Max is { } max && (v < min || v > max))
        {
            string message = IntakeMessages.OutOfRange(Label(f), ConvertedShown(raw, c.Unit, v, f.Unit), min, max, f.Unit);
            if (f.Kind == FieldKind.Alcohol && c.Unit == ColumnUnit.PercentVolume && v * 100 >= min && v * 100 <= max)
            {
                // 0.141 is how a spreadsheet holds 14.1 % when the cell lost its percent format.
                message += IntakeMessages.LooksLikeAFraction(raw * 100);
            }

            st.Problem(c, cell, IssueCodes.OutOfRange, message, f.Critical);
            return null;
        }

        return v;
    }

    internal static string ConvertedShown(double raw, ColumnUnit unit, double converted, string fieldUnit)
    {
        string shown = Shown(raw, unit);
        if (ColumnUnits.Label(unit) is { Length: > 0 } u && u != fieldUnit && fieldUnit.Length > 0)
        {
            shown += $" (= {IntakeMessages.Num(Math.Round(converted, 2))} {fieldUnit})";
        }

        return shown;
    }

    internal static SugarReading? SugarField(RowState st, string name) => SugarField(st, st.Ctx.Column(name), out _);

    internal static SugarReading? SugarField(RowState st, BoundColumn? column) => SugarField(st, column, out _);

    /// <summary>A sugar value converted to a reading through Core's sugar scales, and the number as written.</summary>
    internal static SugarReading? SugarField(RowState st, BoundColumn? column, out double recorded)
    {
        recorded = double.NaN;
        if (column is not { } c || !NumberCell(st, c, out double raw))
        {
            return null;
        }

        var f = c.Field;
        object? cell = st.Ctx.Sheet.Cell(st.Row, c.Index);
        var unit = c.Unit;
        if (OtherGravityForm(unit, raw) is { } other)
        {
            // SG written both ways in one column ("1090" beside "1.088"): one scale, so each is read in its own form;
            // said once for the column (SheetReader).
            unit = other;
            c.OtherGravityFormAt ??= (st.SheetRow, CellValues.Text(cell), ColumnUnits.OnScale(raw, other));
            c.OtherGravityForms++;
        }

        if (!UnitSettling.ValueLooksLike(f, raw, unit))
        {
            st.Problem(c, cell, IssueCodes.UnitDiffersInColumn, IntakeMessages.UnitDiffersInColumn(Label(f), ColumnUnits.Label(UnitSettling.LikelyUnit(f, raw)), ColumnUnits.Label(c.Unit)), f.Critical);
            return null;
        }

        double min = f.Min ?? SugarReading.MinBrix, max = f.Max ?? SugarReading.MaxBrix;
        double onScale = ColumnUnits.OnScale(raw, unit);
        if (!SugarReading.TryFrom(onScale, ColumnUnits.Scale(unit), min, max, out var reading, out double brix))
        {
            st.Problem(c, cell, IssueCodes.OutOfRange, IntakeMessages.OutOfRange(Label(f), ConvertedShown(raw, unit, brix, "°Brix"), min, max, "°Brix"), f.Critical);
            return null;
        }

        recorded = onScale;
        return reading;
    }

    /// <summary>
    /// The other way of writing specific gravity when <paramref name="raw"/> is written so in a column read as SG
    /// (1090 in an SG column: thousandths; 1.088 in a column of thousandths: SG); null otherwise. No other scale
    /// reaches either band, so the value cannot be anything else.
    /// </summary>
    private static ColumnUnit? OtherGravityForm(ColumnUnit unit, double raw) => unit switch
    {
        ColumnUnit.SpecificGravity when raw is >= 950 and < 1300 => ColumnUnit.GravityThousandths,
        ColumnUnit.GravityThousandths when raw is >= 0.95 and < 1.3 => ColumnUnit.SpecificGravity,
        _ => null,
    };

    internal static DateTime? DateField(RowState st, string name) => DateField(st, st.Ctx.Column(name));

    /// <param name="withoutYear">
    /// True for a log's date: a day and month with no year ("12-Sep", "12/9") is kept at that day and month in
    /// <see cref="LogRows.YearUnknown"/>, for the join to place in its lot's year (<c>LogJoin</c>).
    /// </param>
    internal static DateTime? DateField(RowState st, BoundColumn? column, bool withoutYear = false)
    {
        if (column is not { } c)
        {
            return null;
        }

        object? cell = st.Ctx.Sheet.Cell(st.Row, c.Index);
        object? dateCell = cell;
        if (cell is string text && CellValues.WithoutZone(text) is { } local)
        {
            // "2024-09-03T08:00:00Z", "…+02:00": read as the clock time written; the column says so once (SheetReader).
            dateCell = local;
            c.ZoneSeenAt ??= st.SheetRow;
        }

        var problem = CellValues.Date(dateCell, c.DateOrder, out var value, out var dayFirst, out var monthFirst);
        string label = Label(c.Field);
        switch (problem)
        {
            case CellProblem.None:
                return value;
            case CellProblem.Blank:
                return null;
            case CellProblem.ErrorCell or CellProblem.FormulaWithoutValue:
                Unreadable(st, c, cell);
                return null;
            case CellProblem.AmbiguousDate:
                st.Problem(c, cell, IssueCodes.AmbiguousDate, IntakeMessages.AmbiguousDate(label, dayFirst!, monthFirst!), c.Field.Critical);
                return null;
            default:
                if (cell is string t)
                {
                    var dm = CellValues.DayMonth(t.Trim(), c.DateOrder, out int month, out int day, out var time, out var df, out var mf);
                    if (withoutYear && dm == CellProblem.None)
                    {
                        return new DateTime(LogRows.YearUnknown, month, day, 0, 0, 0, DateTimeKind.Unspecified) + time;
                    }

                    if (dm == CellProblem.AmbiguousDate)
                    {
                        st.Problem(c, cell, IssueCodes.AmbiguousDate, IntakeMessages.AmbiguousDate(label, df!, mf!), c.Field.Critical);
                        return null;
                    }
                }

                st.Problem(c, cell, IssueCodes.NotADate, IntakeMessages.NotADate(label, cell is string t2 ? WhyNoDate(t2) : null), c.Field.Critical);
                return null;
        }
    }

    /// <summary>
    /// A lot's inoculation date; a day and month with no year ("11-Sep") is read in the row's
    /// <paramref name="season"/> (the vintage is the year of picking, and so of inoculation: common practice), said
    /// once for the column after its rows are read (<see cref="SheetReader"/>).
    /// </summary>
    internal static DateTime? InoculationField(RowState st, int? season)
    {
        var c = st.Ctx.Column("inoculation_date");
        var date = DateField(st, c, withoutYear: season is not null);
        if (date is null || !LogRows.WithoutYear(date.Value))
        {
            return date;
        }

        int year = season!.Value;
        if (date.Value.Month == 2 && date.Value.Day == 29 && !DateTime.IsLeapYear(year))
        {
            object? cell = st.Ctx.Sheet.Cell(st.Row, c!.Index);
            st.Problem(c, cell, IssueCodes.NotADate, IntakeMessages.NotADate(Label(c.Field), IntakeMessages.NoLeapDay(year)), c.Field.Critical);
            return null;
        }

        var read = new DateTime(year, date.Value.Month, date.Value.Day, 0, 0, 0, DateTimeKind.Unspecified) + date.Value.TimeOfDay;
        c!.YearFromSeasonAt ??= (st.SheetRow, CellValues.Text(st.Ctx.Sheet.Cell(st.Row, c.Index)), read);
        c.YearsFromSeason++;
        return read;
    }

    /// <summary>What a text that is no date lacks, when it is a day of the week ("Mon 8am") or a day and month with no year ("9/15 8am").</summary>
    internal static string? WhyNoDate(string text)
    {
        string first = HeaderText.Normalise(text).Split(' ')[0];
        if (first is "mon" or "monday" or "tue" or "tues" or "tuesday" or "wed" or "wednesday" or "thu" or "thur" or "thurs" or "thursday"
            or "fri" or "friday" or "sat" or "saturday" or "sun" or "sunday")
        {
            return IntakeMessages.WeekdayWithoutDate;
        }

        return DayMonthOnly().IsMatch(text.Trim()) || CellValues.DayMonth(text.Trim(), DateOrder.Unknown, out _, out _, out _, out _, out _) != CellProblem.NotADate
            ? IntakeMessages.DateWithoutYear : null;
    }

    [System.Text.RegularExpressions.GeneratedRegex(@"^[0-9]{1,2}[/.-][0-9]{1,2}\.?(?:\s.*)?$")]
    private static partial System.Text.RegularExpressions.Regex DayMonthOnly();

    internal static WineColour ColourField(RowState st)
    {
        if (st.Ctx.Column("colour") is not { } c)
        {
            return WineColour.Unknown;
        }

        object? cell = st.Ctx.Sheet.Cell(st.Row, c.Index);
        if (Unreadable(st, c, cell))
        {
            return WineColour.Unknown;
        }

        string n = HeaderText.Normalise(CellValues.Text(cell));
        switch (n)
        {
            case "":
                return WineColour.Unknown;
            case "red" or "r" or "rouge" or "rot" or "tinto" or "rosso" or "red wine":
                return WineColour.Red;
            case "white" or "w" or "blanc" or "blanco" or "weiss" or "bianco" or "white wine":
                return WineColour.White;
            case "rose" or "rosado" or "rosato" or "blush" or "pink" or "rose wine":
                return WineColour.Rose;
            default:
                st.Problem(c, cell, IssueCodes.UnknownColour, IntakeMessages.UnknownColour(Label(c.Field)), false);
                return WineColour.Unknown;
        }
    }
}
