using System.Globalization;
using System.Text.RegularExpressions;

namespace YieldBench.Intake;

/// <summary>How a cell could not be read as the value wanted.</summary>
internal enum CellProblem
{
    None,
    Blank,
    NotANumber,
    AmbiguousNumber,
    ErrorCell,
    FormulaWithoutValue,
    NotADate,
    AmbiguousDate,
    NotATime,
}

/// <summary>Day/month order of text dates in one column, settled by the column's own unambiguous dates.</summary>
internal enum DateOrder
{
    Unknown,
    DayFirst,
    MonthFirst,
    Mixed,
}

/// <summary>Reads cells as numbers, dates, times and text. Culture is always explicit.</summary>
internal static partial class CellValues
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    private static readonly NumberFormatInfo DecimalCommaFormat = new() { NumberDecimalSeparator = ",", NumberGroupSeparator = "." };

    // Excel serial day numbers accepted as dates: 1954-10-03 (20000) to 2119-01-10 (80000).
    private const double MinSerialDate = 20000, MaxSerialDate = 80000;

    private static readonly string[] MonthNameFormats =
    [
        "d MMM yyyy", "d MMMM yyyy", "d-MMM-yyyy", "d-MMM-yy", "dd-MMM-yy", "MMM d yyyy", "MMM d, yyyy", "MMMM d, yyyy",
        "MMMM d yyyy", "d MMM yyyy H:mm", "d-MMM-yyyy H:mm", "MMM d, yyyy H:mm", "MMMM d, yyyy H:mm", "MMM d yyyy H:mm",
    ];

    public static bool IsBlank(object? v) => v is null || (v is string s && string.IsNullOrWhiteSpace(s));

    /// <summary>The cell as the user would see it, for messages and text fields.</summary>
    public static string Text(object? v) => v switch
    {
        null => "",
        string s => s.Trim(),
        double d => d.ToString("G15", Inv),
        DateTime dt => dt.TimeOfDay == TimeSpan.Zero ? dt.ToString("yyyy-MM-dd", Inv) : dt.ToString("yyyy-MM-dd HH:mm:ss", Inv),
        bool b => b ? "TRUE" : "FALSE",
        ErrorCell e => e.Text,
        FormulaCell f => "=" + f.Formula,
        IFormattable f => f.ToString(null, Inv),
        _ => v.ToString() ?? "",
    };

    /// <summary>A number from a numeric cell, or from text in invariant or decimal-comma form.</summary>
    public static CellProblem Number(object? v, bool decimalComma, out double value, out string? alternative)
    {
        value = double.NaN;
        alternative = null;
        switch (v)
        {
            case null:
                return CellProblem.Blank;
            case double d:
                value = d;
                return double.IsFinite(d) ? CellProblem.None : CellProblem.NotANumber;
            case ErrorCell:
                return CellProblem.ErrorCell;
            case FormulaCell:
                return CellProblem.FormulaWithoutValue;
            case string s:
                return ParseNumberText(s, decimalComma, out value, out alternative);
            default:
                return CellProblem.NotANumber;
        }
    }

    /// <summary>
    /// A number followed by a unit in one text cell ("24.5 Bx", "1.4 g/L", "13.8 % vol"), or a sugar scale written
    /// before the number as hydrometer readings are often noted ("SG 1.045", "Bx 12", "°Oe: 85"): the number and the
    /// unit text, or null when the text is not of that form.
    /// </summary>
    public static (string Number, string Unit)? SplitUnit(string text)
    {
        string t = text.Trim();
        var m = NumberThenUnit().Match(t);
        if (m.Success)
        {
            return (m.Groups[1].Value, m.Groups[2].Value.Trim());
        }

        m = ScaleThenNumber().Match(t);
        if (m.Success)
        {
            return (m.Groups[2].Value, m.Groups[1].Value.Trim());
        }

        // "13,5°": a bare degree sign, as alcohol is written in degrees in France, Spain and Italy.
        m = NumberThenDegree().Match(t);
        return m.Success ? (m.Groups[1].Value, "°") : null;
    }

    [GeneratedRegex(@"^([-+\u2212]?[0-9][0-9.,]*)\s*[°º]$", RegexOptions.CultureInvariant)]
    private static partial Regex NumberThenDegree();

    [GeneratedRegex(@"^([°º]?\s*(?:sg|bx|brix|be|baum[eé]|oe|oechsle))\s*[:=]?\s*([-+\u2212]?[0-9][0-9.,]*)$", RegexOptions.CultureInvariant | RegexOptions.IgnoreCase)]
    private static partial Regex ScaleThenNumber();

    [GeneratedRegex(@"^([-+\u2212]?[0-9][0-9.,\u00A0\u2009\u2007\u202F ]*?)\s*([°º%]?\s*[A-Za-zé][A-Za-zé/ .%]*|°\s*[A-Za-z]+|%\s*[A-Za-z/ ]+)$", RegexOptions.CultureInvariant)]
    private static partial Regex NumberThenUnit();

    private static CellProblem ParseNumberText(string s, bool decimalComma, out double value, out string? alternative)
    {
        if (!(decimalComma && s.Contains('.', StringComparison.Ordinal)) && PlainDecimal(s, out value))
        {
            alternative = null;
            return CellProblem.None;
        }

        return ParseNumberTextGeneral(s, decimalComma, out value, out alternative);
    }

    private static readonly HashSet<string> NoValueMarks = new(["-", "--", "\u2013", "\u2014", "n/a", "na", "n.a.", "?"], StringComparer.OrdinalIgnoreCase);

    /// <summary>True for a mark of "not measured" ("-", "n/a", "NA"), read as an empty cell where a number is expected.</summary>
    public static bool IsNoValueMark(string text) => NoValueMarks.Contains(text.Trim());

    /// <summary>Any number text: grouping, decimal commas, signs, spaces, percent; the reference for the fast path.</summary>
    internal static CellProblem ParseNumberTextGeneral(string s, bool decimalComma, out double value, out string? alternative)
    {
        value = double.NaN;
        alternative = null;
        string t = s.Trim().Replace('\u2212', '-').Replace("\u00A0", "", StringComparison.Ordinal).Replace("\u202F", "", StringComparison.Ordinal)
            .Replace("\u2009", "", StringComparison.Ordinal).Replace("\u2007", "", StringComparison.Ordinal);
        if (t.Length == 0 || NoValueMarks.Contains(t))
        {
            // "-", "n/a", "NA": the sheet's way of writing that nothing was measured, which is an empty cell.
            return CellProblem.Blank;
        }

        if (t.EndsWith('%'))
        {
            t = t[..^1].TrimEnd();
        }

        if (t.StartsWith('#'))
        {
            return CellProblem.ErrorCell;
        }

        t = t.Replace(" ", "", StringComparison.Ordinal);
        int comma = t.LastIndexOf(','), dot = t.LastIndexOf('.');
        if (comma >= 0 && dot >= 0)
        {
            // Both present: the later one is the decimal separator, the other groups thousands.
            t = comma > dot ? t.Replace(".", "", StringComparison.Ordinal).Replace(',', '.') : t.Replace(",", "", StringComparison.Ordinal);
        }
        else if (comma >= 0)
        {
            if (!decimalComma && ThousandsWithComma().IsMatch(t))
            {
                string asThousands = t.Replace(",", "", StringComparison.Ordinal);
                string asDecimal = t.Replace(',', '.');
                if (double.TryParse(asThousands, NumberStyles.Float, Inv, out _) && double.TryParse(asDecimal, NumberStyles.Float, Inv, out _))
                {
                    alternative = asThousands + " or " + asDecimal;
                    return CellProblem.AmbiguousNumber;
                }
            }

            return double.TryParse(t, NumberStyles.Float, DecimalCommaFormat, out value) && double.IsFinite(value)
                ? CellProblem.None
                : CellProblem.NotANumber;
        }

        if (decimalComma && dot >= 0 && ThousandsWithDot().IsMatch(t))
        {
            // In a decimal-comma file "1.200" is as likely 1200 (dot grouping thousands) as 1.2: never guessed.
            string asThousands = t.Replace(".", "", StringComparison.Ordinal);
            alternative = asThousands + " or " + t;
            return CellProblem.AmbiguousNumber;
        }

        return double.TryParse(t, NumberStyles.Float, Inv, out value) && double.IsFinite(value) ? CellProblem.None : CellProblem.NotANumber;
    }

    /// <summary>
    /// The common plain number ("24.3", "-1.8", "1000"): the framework's parser under its strictest style (a sign and a
    /// decimal point, nothing else) gives what the general path would; false sends any other text there. Without it
    /// every cell took the general path's trims and replacements (docs/performance.md: +35 % CPU for check at 100k lots).
    /// </summary>
    private static bool PlainDecimal(string s, out double value) =>
        double.TryParse(s, NumberStyles.AllowLeadingSign | NumberStyles.AllowDecimalPoint, Inv, out value) && double.IsFinite(value);

    /// <summary>Day/month order settled by the column's text dates (a first part above 12 means day first).</summary>
    public static DateOrder ColumnDateOrder(IEnumerable<object?> cells) => ColumnDateOrder(cells, out _);

    /// <summary>Fewest distinct dates that can settle a column's day/month order by how closely they gather.</summary>
    public const int SpanRuleMinDates = 3;

    /// <summary>Longest span, in days, of one season's dates in the order the gathering rule settles on.</summary>
    public const int SpanRuleMaxDays = 120;

    /// <summary>How many times wider the other order must spread the same dates for the gathering rule to settle.</summary>
    public const int SpanRuleRatio = 4;

    /// <summary>
    /// Day/month order settled by the column's text dates: a first part above 12 anywhere means day first, a second
    /// part above 12 month first. When no date settles it that way, by how the dates gather (<paramref name="bySpan"/>
    /// then says so): a season's inoculations, or a ferment's readings, fall within weeks, and swapping day and month
    /// scatters the same dates over months (5/9, 12/9, 5/10 are 5 Sep to 5 Oct, or 9 May to 10 Dec). The order is
    /// taken when at least <see cref="SpanRuleMinDates"/> distinct dates read in it span at most
    /// <see cref="SpanRuleMaxDays"/> days within each year written and the other order spreads them at least
    /// <see cref="SpanRuleRatio"/> times as wide; otherwise the column stays unsettled and each date that reads both
    /// ways is ambiguous.
    /// </summary>
    public static DateOrder ColumnDateOrder(IEnumerable<object?> cells, out (int Dates, int Span, int OtherSpan, string Example)? bySpan)
    {
        bySpan = null;
        string? example = null;
        bool dayFirst = false, monthFirst = false;
        var ambiguous = new HashSet<(string Year, int A, int B)>();
        var same = new HashSet<(string Year, int A, int B)>();
        foreach (var c in cells)
        {
            if (c is string raw && WithoutTwelveHourMark(raw.Trim()) is var s && !StartsWithThreeDigits(s) && (SlashDate().Match(s) is { Success: true } m || (m = NumericDayMonth().Match(s)).Success))
            {
                if (m.Groups["sep"].Value == ".")
                {
                    continue;
                }

                int a = int.Parse(m.Groups["a"].Value, Inv), b = int.Parse(m.Groups["b"].Value, Inv);
                dayFirst |= a > 12 && b <= 12;
                monthFirst |= b > 12 && a <= 12;
                if (a is >= 1 and <= 12 && b is >= 1 and <= 12)
                {
                    // 9/9 reads the same both ways: it counts in the span, not among the dates that read both ways.
                    (a == b ? same : ambiguous).Add((m.Groups["y"].Value, a, b));
                    example ??= a == b ? null : raw.Trim();
                }
            }
        }

        var order = (dayFirst, monthFirst) switch
        {
            (true, true) => DateOrder.Mixed,
            (true, false) => DateOrder.DayFirst,
            (false, true) => DateOrder.MonthFirst,
            _ => DateOrder.Unknown,
        };
        if (order != DateOrder.Unknown || ambiguous.Count < SpanRuleMinDates)
        {
            return order;
        }

        int asDayFirst = GatheredSpan(ambiguous.Concat(same).Select(d => (d.Year, Month: d.B, Day: d.A)));
        int asMonthFirst = GatheredSpan(ambiguous.Concat(same).Select(d => (d.Year, Month: d.A, Day: d.B)));
        if (asDayFirst <= SpanRuleMaxDays && asMonthFirst >= SpanRuleRatio * Math.Max(asDayFirst, 1))
        {
            bySpan = (ambiguous.Count, asDayFirst, asMonthFirst, example!);
            return DateOrder.DayFirst;
        }

        if (asMonthFirst <= SpanRuleMaxDays && asDayFirst >= SpanRuleRatio * Math.Max(asMonthFirst, 1))
        {
            bySpan = (ambiguous.Count, asMonthFirst, asDayFirst, example!);
            return DateOrder.MonthFirst;
        }

        return order;
    }

    /// <summary>
    /// The widest span, in days, of the dates of any one year written (dates without a year form one group, spanned
    /// on the calendar's circle, so a ferment across the new year is weeks, not a year); far beyond any season when a
    /// day and month is no date in this reading.
    /// </summary>
    private static int GatheredSpan(IEnumerable<(string Year, int Month, int Day)> dates)
    {
        int widest = 0;
        foreach (var year in dates.GroupBy(d => d.Year))
        {
            var days = new List<int>();
            foreach (var (_, month, day) in year)
            {
                if (!ValidDayMonth(month, day))
                {
                    return int.MaxValue / 8;
                }

                days.Add(new DateTime(2000, month, day, 0, 0, 0, DateTimeKind.Unspecified).DayOfYear);
            }

            days.Sort();
            int span = days[^1] - days[0];
            if (year.Key.Length == 0)
            {
                int largestGap = 366 - span;
                for (int i = 1; i < days.Count; i++)
                {
                    largestGap = Math.Max(largestGap, days[i] - days[i - 1]);
                }

                span = 366 - largestGap;
            }

            widest = Math.Max(widest, span);
        }

        return widest;
    }

    /// <summary>
    /// A date (and time, when given) from a date cell, an Excel serial number, or text: ISO year-month-day,
    /// d.m.y (dots: day first), d/m/y or m/d/y (settled by the column), or an English month name.
    /// </summary>
    public static CellProblem Date(object? v, DateOrder order, out DateTime value, out string? dayFirst, out string? monthFirst)
    {
        value = default;
        dayFirst = monthFirst = null;
        switch (v)
        {
            case null:
                return CellProblem.Blank;
            case DateTime dt:
                value = dt;
                return CellProblem.None;
            case double d when d is >= MinSerialDate and <= MaxSerialDate:
                value = DateTime.FromOADate(d);
                return CellProblem.None;
            case ErrorCell:
                return CellProblem.ErrorCell;
            case FormulaCell:
                return CellProblem.FormulaWithoutValue;
            case string s:
                return ParseDateText(s.Trim(), order, out value, out dayFirst, out monthFirst);
            default:
                return CellProblem.NotADate;
        }
    }

    private static CellProblem ParseDateText(string s, DateOrder order, out DateTime value, out string? dayFirst, out string? monthFirst)
    {
        value = default;
        dayFirst = monthFirst = null;
        if (s.Length == 0)
        {
            return CellProblem.Blank;
        }

        if (PlainIsoDate(s, out value))
        {
            return CellProblem.None;
        }

        return ParseDateTextGeneral(s, order, out value, out dayFirst, out monthFirst);
    }

    /// <summary>Any date text (trimmed, not empty), by the regular expressions; the reference for the fast path.</summary>
    internal static CellProblem ParseDateTextGeneral(string s, DateOrder order, out DateTime value, out string? dayFirst, out string? monthFirst)
    {
        value = default;
        dayFirst = monthFirst = null;
        if (s.Length > 4 && s[^1] is 'M' or 'm' or '.' && TwelveHourClock().Match(s) is { Success: true } twelve)
        {
            // "10/5/2025 8:00 AM", "Oct 6, 2025 5:30 p.m.": a date and a 12-hour clock time, as US spreadsheets export
            // date-times; 12 AM is midnight, 12 PM noon.
            var inner = ParseDateTextGeneral(twelve.Groups["rest"].Value, order, out value, out dayFirst, out monthFirst);
            if (inner != CellProblem.None)
            {
                return inner;
            }

            int hour = value.Hour;
            if (hour is 0 or > 12)
            {
                return CellProblem.NotADate;
            }

            bool pm = twelve.Groups["half"].Value is "p" or "P";
            value = value.AddHours(pm ? (hour == 12 ? 0 : 12) : (hour == 12 ? -12 : 0));
            return CellProblem.None;
        }
        if (SerialText().IsMatch(s) && double.TryParse(s.Replace(',', '.'), NumberStyles.Float, CultureInfo.InvariantCulture, out double serial)
            && serial is >= MinSerialDate and <= MaxSerialDate)
        {
            // A date column saved to CSV by a spreadsheet that held its dates as plain numbers ("45920"): the serial
            // day number, as in a workbook cell.
            value = DateTime.FromOADate(serial);
            return CellProblem.None;
        }

        if (IsoDate().Match(s) is { Success: true } iso)
        {
            return MakeDate(iso.Groups["y"].Value, iso.Groups["m"].Value, iso.Groups["d"].Value, iso, out value) ? CellProblem.None : CellProblem.NotADate;
        }

        if (SlashDate().Match(s) is { Success: true } m)
        {
            string a = m.Groups["a"].Value, b = m.Groups["b"].Value, y = m.Groups["y"].Value;
            if (m.Groups["sep"].Value == ".")
            {
                return MakeDate(y, b, a, m, out value) ? CellProblem.None : CellProblem.NotADate;
            }

            bool asDayFirst = MakeDate(y, b, a, m, out var d1);
            bool asMonthFirst = MakeDate(y, a, b, m, out var d2);
            if (asDayFirst && asMonthFirst && d1 != d2)
            {
                if (order == DateOrder.DayFirst)
                {
                    value = d1;
                    return CellProblem.None;
                }

                if (order == DateOrder.MonthFirst)
                {
                    value = d2;
                    return CellProblem.None;
                }

                dayFirst = d1.ToString("yyyy-MM-dd", Inv);
                monthFirst = d2.ToString("yyyy-MM-dd", Inv);
                return CellProblem.AmbiguousDate;
            }

            if (asDayFirst || asMonthFirst)
            {
                value = asDayFirst ? d1 : d2;
                return CellProblem.None;
            }

            return CellProblem.NotADate;
        }

        if (DateTime.TryParseExact(s, MonthNameFormats, Inv, DateTimeStyles.AllowWhiteSpaces, out value))
        {
            return CellProblem.None;
        }

        // "3 octobre 2025", "5. März 2025", "5 de octubre de 2025", "1er oct. 2025": a day, a month named in French,
        // German, Spanish or Italian (or English), a year.
        if (NamedDate().Match(s) is { Success: true } named && MonthNumber(named.Groups["mon"].Value) is > 0 and var month)
        {
            return MakeDate(named.Groups["y"].Value, month.ToString(Inv), named.Groups["d"].Value, named, out value) ? CellProblem.None : CellProblem.NotADate;
        }

        return CellProblem.NotADate;
    }

    /// <summary>
    /// A day and month written without a year, as on a hand-kept tank board: "12-Sep", "12 Sept", "Sep 12", "12/9" or
    /// "9/12" (order settled by the column, as for dates with a year), "12.9." (dots: day first), each perhaps followed
    /// by a time ("12-Sep 08:00"). <see cref="CellProblem.AmbiguousDate"/> when "12/9" could be either and the column
    /// does not settle it (<paramref name="dayFirst"/> and <paramref name="monthFirst"/> then name both, "12 Sep" and
    /// "9 Dec"); <see cref="CellProblem.NotADate"/> for any other text. The year is the caller's to settle.
    /// </summary>
    public static CellProblem DayMonth(string s, DateOrder order, out int month, out int day, out TimeSpan time, out string? dayFirst, out string? monthFirst)
    {
        month = day = 0;
        time = TimeSpan.Zero;
        dayFirst = monthFirst = null;
        Match m;
        if ((m = NamedDayMonth().Match(s)).Success || (m = MonthNameDay().Match(s)).Success)
        {
            month = MonthNumber(m.Groups["mon"].Value);
            day = int.Parse(m.Groups["d"].Value, Inv);
        }
        else if ((m = NumericDayMonth().Match(s)).Success && !StartsWithThreeDigits(s))
        {
            int a = int.Parse(m.Groups["a"].Value, Inv), b = int.Parse(m.Groups["b"].Value, Inv);
            bool asDayFirst = ValidDayMonth(b, a), asMonthFirst = ValidDayMonth(a, b);
            if (m.Groups["sep"].Value == "." || order == DateOrder.DayFirst || (asDayFirst && !asMonthFirst))
            {
                (month, day) = (b, a);
            }
            else if (order == DateOrder.MonthFirst || (asMonthFirst && !asDayFirst))
            {
                (month, day) = (a, b);
            }
            else if (asDayFirst && asMonthFirst && a != b)
            {
                dayFirst = DayMonthText(b, a);
                monthFirst = DayMonthText(a, b);
                return CellProblem.AmbiguousDate;
            }
            else
            {
                (month, day) = (b, a);
            }
        }
        else
        {
            return CellProblem.NotADate;
        }

        if (!ValidDayMonth(month, day))
        {
            return CellProblem.NotADate;
        }

        if (m.Groups["h"].Success)
        {
            int h = int.Parse(m.Groups["h"].Value, Inv), min = int.Parse(m.Groups["min"].Value, Inv);
            if (h > 23 || min > 59)
            {
                return CellProblem.NotADate;
            }

            time = new TimeSpan(h, min, 0);
        }

        return CellProblem.None;
    }

    /// <summary>"12 Sep": a day and month as messages show them (English month abbreviations, as the readers accept).</summary>
    public static string DayMonthText(int month, int day) =>
        day.ToString(Inv) + " " + CultureInfo.InvariantCulture.DateTimeFormat.GetAbbreviatedMonthName(month);

    /// <summary>True when <paramref name="day"/> exists in <paramref name="month"/> of some year (29 February included).</summary>
    private static bool ValidDayMonth(int month, int day) => month is >= 1 and <= 12 && day >= 1 && day <= DateTime.DaysInMonth(2024, month);

    /// <summary>
    /// The month a name or abbreviation gives (1–12), in English, French, German, Spanish or Italian, accents folded
    /// and case ignored ("Sept", "octobre", "März", "Okt", "dic", "settembre"); 0 for any other word.
    /// </summary>
    private static int MonthNumber(string name) => MonthNames.GetValueOrDefault(HeaderText.Normalise(name.TrimEnd('.')));

    private static readonly Dictionary<string, int> MonthNames = BuildMonthNames();

    private static Dictionary<string, int> BuildMonthNames()
    {
        string[][] names =
        [
            ["jan", "january", "janvier", "janv", "januar", "janner", "jaenner", "enero", "ene", "gennaio", "gen"],
            ["feb", "february", "fevrier", "fevr", "fev", "februar", "febrero", "febbraio"],
            ["mar", "march", "mars", "marz", "maerz", "mrz", "marzo"],
            ["apr", "april", "avril", "avr", "abril", "abr", "aprile"],
            ["may", "mai", "mayo", "maggio", "mag"],
            ["jun", "june", "juin", "juni", "junio", "giugno", "giu"],
            ["jul", "july", "juillet", "juil", "juli", "julio", "luglio", "lug"],
            ["aug", "august", "aout", "agosto", "ago"],
            ["sep", "sept", "september", "septembre", "septiembre", "setiembre", "settembre", "set"],
            ["oct", "october", "octobre", "oktober", "okt", "octubre", "ottobre", "ott"],
            ["nov", "november", "novembre", "noviembre"],
            ["dec", "december", "decembre", "dezember", "dez", "diciembre", "dic", "dicembre"],
        ];
        var map = new Dictionary<string, int>(StringComparer.Ordinal);
        for (int m = 0; m < names.Length; m++)
        {
            foreach (var n in names[m])
            {
                map.Add(n, m + 1);
            }
        }

        return map;
    }

    [GeneratedRegex(@"^(?<d>[0-9]{1,2})(?:st|nd|rd|th|er|º|°)?\.?\s*(?:de\s+|-)?(?<mon>\p{L}{3,10})\.?\s*(?:de\s+|del\s+|-)?(?<y>[0-9]{4})(?:,?\s+(?<h>[0-9]{1,2})[:.h](?<min>[0-9]{2}))?$", RegexOptions.IgnoreCase | RegexOptions.CultureInvariant)]
    private static partial Regex NamedDate();

    /// <summary>The text without a 12-hour clock's AM or PM ("10/5/2025 8:00 AM" → "10/5/2025 8:00"); other text as it is.</summary>
    private static string WithoutTwelveHourMark(string s) =>
        s.Length > 4 && s[^1] is 'M' or 'm' or '.' && TwelveHourClock().Match(s) is { Success: true } m ? m.Groups["rest"].Value : s;

    [GeneratedRegex(@"^(?<rest>.*[0-9][\sT][0-9]{1,2}[:.][0-9]{2}(?::[0-9]{2})?)\s*(?<half>[AaPp])\.?\s?[Mm]\.?$", RegexOptions.CultureInvariant)]
    private static partial Regex TwelveHourClock();

    [GeneratedRegex(@"^(?<d>[0-9]{1,2})(?:st|nd|rd|th|er)?\.?[\s-]*(?:de\s+)?(?<mon>\p{L}{3,10})\.?(?:,?\s+(?<h>[0-9]{1,2})[:.](?<min>[0-9]{2}))?$")]
    private static partial Regex NamedDayMonth();

    [GeneratedRegex(@"^(?<mon>\p{L}{3,10})\.?[\s-]*(?<d>[0-9]{1,2})(?:st|nd|rd|th)?(?:,?\s+(?<h>[0-9]{1,2})[:.](?<min>[0-9]{2}))?$")]
    private static partial Regex MonthNameDay();

    [GeneratedRegex(@"^(?<a>[0-9]{1,2})(?<sep>[/.-])(?<b>[0-9]{1,2})\.?(?:[ T](?<h>[0-9]{1,2}):(?<min>[0-9]{2}))?$")]
    private static partial Regex NumericDayMonth();

    /// <summary>A day and month cannot follow "d/" or "dd/" when the text starts with three digits.</summary>
    private static bool StartsWithThreeDigits(string s) =>
        s.Length >= 3 && char.IsAsciiDigit(s[0]) && char.IsAsciiDigit(s[1]) && char.IsAsciiDigit(s[2]);

    /// <summary>
    /// The common ISO text ("2024-03-02", "2024-03-02 14:30", "2024-03-02 14:30:05") read by the framework's exact
    /// parser, within the years the general path accepts; false sends any other text to the general path, which gives
    /// the same date for these forms. Without it every date cell took the regular expression (docs/performance.md).
    /// </summary>
    private static bool PlainIsoDate(string s, out DateTime value) =>
        DateTime.TryParseExact(s, PlainIsoFormats, Inv, DateTimeStyles.None, out value) && value.Year is >= 1900 and <= 2100;

    private static readonly string[] PlainIsoFormats = ["yyyy-MM-dd", "yyyy-MM-dd HH:mm", "yyyy-MM-dd HH:mm:ss"];

    private static bool MakeDate(string y, string m, string d, Match match, out DateTime value)
    {
        value = default;
        int year = int.Parse(y, Inv);
        if (y.Length == 2)
        {
            // Two-digit years are taken as 20yy: cellar records of this tool's era (documented).
            year += 2000;
        }

        int month = int.Parse(m, Inv), day = int.Parse(d, Inv);
        if (month is < 1 or > 12 || day < 1 || year is < 1900 or > 2100 || day > DateTime.DaysInMonth(year, month))
        {
            return false;
        }

        value = new DateTime(year, month, day, 0, 0, 0, DateTimeKind.Unspecified);
        if (match.Groups["h"].Success)
        {
            int h = int.Parse(match.Groups["h"].Value, Inv), min = int.Parse(match.Groups["min"].Value, Inv);
            int sec = match.Groups["s"].Success ? int.Parse(match.Groups["s"].Value, Inv) : 0;
            if (h > 23 || min > 59 || sec > 59)
            {
                return false;
            }

            value = value.Add(new TimeSpan(h, min, sec));
        }

        return true;
    }

    /// <summary>The hour a morning check is taken to stand for when a log gives only "AM" (common practice, assumed).</summary>
    public static readonly TimeSpan MorningCheck = new(8, 0, 0);

    /// <summary>The hour an afternoon or evening check is taken to stand for when a log gives only "PM" (common practice, assumed).</summary>
    public static readonly TimeSpan EveningCheck = new(17, 0, 0);

    /// <summary>
    /// A time cell that names only the half of the day of a twice-daily check ("AM", "p.m.", "morning", "soir",
    /// "abends"): the morning or the evening check's assumed hour; null for anything else.
    /// </summary>
    public static TimeSpan? HalfDay(object? v)
    {
        if (v is not string s)
        {
            return null;
        }

        string t = s.Trim().Replace(".", "", StringComparison.Ordinal).Replace(" ", "", StringComparison.Ordinal).ToLowerInvariant();
        return t switch
        {
            "am" or "morning" or "morn" or "matin" or "morgen" or "morgens" or "vormittag" or "manana" or "mañana" or "mattina" or "mattino" => MorningCheck,
            "pm" or "afternoon" or "evening" or "eve" or "soir" or "apres-midi" or "après-midi" or "abend" or "abends" or "nachmittag" or "tarde" or "pomeriggio" or "sera" => EveningCheck,
            _ => null,
        };
    }

    /// <summary>A time of day from a time cell, a day fraction, or text "14:30", "14:30:05", "2:30 PM", "8am", "17h30".</summary>
    public static CellProblem TimeOfDay(object? v, out TimeSpan value)
    {
        value = default;
        switch (v)
        {
            case null:
                return CellProblem.Blank;
            case DateTime dt:
                value = dt.TimeOfDay;
                return CellProblem.None;
            case double d when d is >= 0 and < 1:
                value = TimeSpan.FromSeconds(Math.Round(d * 86400.0));
                return CellProblem.None;
            case ErrorCell:
                return CellProblem.ErrorCell;
            case FormulaCell:
                return CellProblem.FormulaWithoutValue;
            case string s:
                var m = TimeText().Match(s.Trim());
                if (!m.Success)
                {
                    return string.IsNullOrWhiteSpace(s) ? CellProblem.Blank : CellProblem.NotATime;
                }

                int h = int.Parse(m.Groups["h"].Value, Inv), min = m.Groups["min"].Success ? int.Parse(m.Groups["min"].Value, Inv) : 0;
                int sec = m.Groups["s"].Success ? int.Parse(m.Groups["s"].Value, Inv) : 0;
                if (m.Groups["ampm"].Success)
                {
                    if (h is < 1 or > 12)
                    {
                        return CellProblem.NotATime;
                    }

                    bool pm = m.Groups["ampm"].Value.StartsWith('p') || m.Groups["ampm"].Value.StartsWith('P');
                    h = (h % 12) + (pm ? 12 : 0);
                }

                if (h > 23 || min > 59 || sec > 59)
                {
                    return CellProblem.NotATime;
                }

                value = new TimeSpan(h, min, sec);
                return CellProblem.None;
            default:
                return CellProblem.NotATime;
        }
    }

    [GeneratedRegex(@"^[0-9]{5}(?:[.,][0-9]+)?$")]
    private static partial Regex SerialText();

    [GeneratedRegex(@"^[0-9]{1,3}(,[0-9]{3})+$")]
    private static partial Regex ThousandsWithComma();

    [GeneratedRegex(@"^[0-9]{1,3}(\.[0-9]{3})+$")]
    private static partial Regex ThousandsWithDot();

    /// <summary>
    /// A date-and-time text without its time zone ("2024-09-03T08:00:00Z" → "2024-09-03T08:00:00", "… 08:00+02:00" →
    /// "… 08:00"), or null when it names none. Only a zone after a time of day is taken off.
    /// </summary>
    public static string? WithoutZone(string text)
    {
        // A zone is a 'Z', 'UTC' or a signed offset at the end: text whose last six characters hold none of them
        // (every plain timestamp) is not matched against the expression.
        string t = text.Trim();
        var tail = t.AsSpan(Math.Max(0, t.Length - 6));
        if (!tail.EndsWith("Z") && !tail.EndsWith("UTC") && tail.IndexOfAny('+', '-') < 0)
        {
            return null;
        }

        var m = ZoneAfterTime().Match(t);
        return m.Success ? m.Groups["local"].Value : null;
    }

    [GeneratedRegex(@"^(?<local>.*[0-9]:[0-9]{2}(?::[0-9]{2}(?:\.[0-9]+)?)?)\s*(?:Z|UTC|[+-][0-9]{2}(?::?[0-9]{2})?)$", RegexOptions.CultureInvariant)]
    private static partial Regex ZoneAfterTime();

    /// <summary>True for "4.200", "12.500.000": digits grouped by dots in threes, as thousands or as decimals.</summary>
    public static bool DotThousands(string text) => ThousandsWithDot().IsMatch(text);

    [GeneratedRegex(@"^(?<y>[0-9]{4})[-/.](?<m>[0-9]{1,2})[-/.](?<d>[0-9]{1,2})(?:[ T](?<h>[0-9]{1,2}):(?<min>[0-9]{2})(?::(?<s>[0-9]{2})(?:\.[0-9]+)?)?)?$")]
    private static partial Regex IsoDate();

    [GeneratedRegex(@"^(?<a>[0-9]{1,2})(?<sep>[/.-])(?<b>[0-9]{1,2})\k<sep>(?<y>[0-9]{4}|[0-9]{2})(?:[ T](?<h>[0-9]{1,2}):(?<min>[0-9]{2})(?::(?<s>[0-9]{2}))?)?$")]
    private static partial Regex SlashDate();

    /// <summary>
    /// "14:30", "14:30:05", "8.30", "2:30 PM"; and as cellar boards write them "8am", "5 pm", "8 a.m." (an hour with
    /// a.m. or p.m.), "17h30", "8h" (an hour marked h, as in French and Spanish cellars). A bare hour ("8") is not one.
    /// </summary>
    [GeneratedRegex(@"^(?<h>[0-9]{1,2})(?:[:.](?<min>[0-9]{2})(?::(?<s>[0-9]{2}))?|\s?[Hh](?<min>[0-9]{2})?|(?=\s*[AaPp]\.?\s?[Mm]))\s*(?<ampm>[AaPp]\.?\s?[Mm]\.?)?$")]
    private static partial Regex TimeText();
}
