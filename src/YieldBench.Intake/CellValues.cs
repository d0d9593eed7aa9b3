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
        "MMMM d yyyy", "d MMM yyyy HH:mm", "d-MMM-yyyy HH:mm", "MMM d, yyyy HH:mm",
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
            case string s:
                return ParseNumberText(s, decimalComma, out value, out alternative);
            default:
                return CellProblem.NotANumber;
        }
    }

    /// <summary>
    /// A number followed by a unit in one text cell ("24.5 Bx", "1.4 g/L", "13.8 % vol"): the number and the unit text,
    /// or null when the text is not of that form.
    /// </summary>
    public static (string Number, string Unit)? SplitUnit(string text)
    {
        var m = NumberThenUnit().Match(text.Trim());
        return m.Success ? (m.Groups[1].Value, m.Groups[2].Value.Trim()) : null;
    }

    [GeneratedRegex(@"^([-+\u2212]?[0-9][0-9.,\u00A0 ]*?)\s*([°º%]?\s*[A-Za-zé][A-Za-zé/ .%]*|°\s*[A-Za-z]+|%\s*[A-Za-z/ ]+)$", RegexOptions.CultureInvariant)]
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

    /// <summary>Any number text: grouping, decimal commas, signs, spaces, percent; the reference for the fast path.</summary>
    internal static CellProblem ParseNumberTextGeneral(string s, bool decimalComma, out double value, out string? alternative)
    {
        value = double.NaN;
        alternative = null;
        string t = s.Trim().Replace('\u2212', '-').Replace("\u00A0", "", StringComparison.Ordinal).Replace("\u202F", "", StringComparison.Ordinal);
        if (t.Length == 0)
        {
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
    /// Text such as "24.3", "-1.8" or "1000": an optional minus, digits, and an optional point with digits, at most 15
    /// digits in all. Such a number is an integer below 2^53 divided by an exact power of ten, so one division gives
    /// the correctly rounded double, the value <see cref="double.TryParse(string?, NumberStyles, IFormatProvider?, out double)"/>
    /// gives. False for any other text, which takes the general path.
    /// </summary>
    private static bool PlainDecimal(string s, out double value)
    {
        value = 0;
        int i = 0;
        bool negative = s.Length > 0 && s[0] == '-';
        if (negative)
        {
            i++;
        }

        long mantissa = 0;
        int digits = 0, decimals = 0;
        bool point = false;
        for (; i < s.Length; i++)
        {
            char c = s[i];
            if (char.IsAsciiDigit(c))
            {
                if (++digits > 15)
                {
                    return false;
                }

                mantissa = (mantissa * 10) + (c - '0');
                decimals += point ? 1 : 0;
            }
            else if (c == '.' && !point && digits > 0)
            {
                point = true;
            }
            else
            {
                return false;
            }
        }

        if (digits == 0 || (point && decimals == 0))
        {
            return false;
        }

        double magnitude = decimals == 0 ? mantissa : mantissa / PowersOfTen[decimals];
        value = negative ? -magnitude : magnitude;
        return true;
    }

    private static readonly double[] PowersOfTen = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15];

    /// <summary>Day/month order settled by the column's text dates (a first part above 12 means day first).</summary>
    public static DateOrder ColumnDateOrder(IEnumerable<object?> cells)
    {
        bool dayFirst = false, monthFirst = false;
        foreach (var c in cells)
        {
            if (c is string s && !StartsWithThreeDigits(s.Trim()) && SlashDate().Match(s.Trim()) is { Success: true } m)
            {
                if (m.Groups["sep"].Value == ".")
                {
                    continue;
                }

                int a = int.Parse(m.Groups["a"].Value, Inv), b = int.Parse(m.Groups["b"].Value, Inv);
                dayFirst |= a > 12 && b <= 12;
                monthFirst |= b > 12 && a <= 12;
            }
        }

        return (dayFirst, monthFirst) switch
        {
            (true, true) => DateOrder.Mixed,
            (true, false) => DateOrder.DayFirst,
            (false, true) => DateOrder.MonthFirst,
            _ => DateOrder.Unknown,
        };
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

        if (PlainIsoDate(s, out value, out bool valid))
        {
            return valid ? CellProblem.None : CellProblem.NotADate;
        }

        return ParseDateTextGeneral(s, order, out value, out dayFirst, out monthFirst);
    }

    /// <summary>Any date text (trimmed, not empty), by the regular expressions; the reference for the fast path.</summary>
    internal static CellProblem ParseDateTextGeneral(string s, DateOrder order, out DateTime value, out string? dayFirst, out string? monthFirst)
    {
        value = default;
        dayFirst = monthFirst = null;
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

        return DateTime.TryParseExact(s, MonthNameFormats, Inv, DateTimeStyles.AllowWhiteSpaces, out value) ? CellProblem.None : CellProblem.NotADate;
    }

    /// <summary>A day and month cannot follow "d/" or "dd/" when the text starts with three digits.</summary>
    private static bool StartsWithThreeDigits(string s) =>
        s.Length >= 3 && char.IsAsciiDigit(s[0]) && char.IsAsciiDigit(s[1]) && char.IsAsciiDigit(s[2]);

    /// <summary>
    /// The common ISO text ("2024-03-02", "2024-03-02 14:30", "2024/3/2T14:30:05.5") in ASCII digits, read without
    /// the regular expression: true when the text has that form (then <paramref name="valid"/> tells whether it is a
    /// real date and time, as <see cref="IsoDate"/> and <see cref="MakeDate"/> would), false for any other text.
    /// </summary>
    private static bool PlainIsoDate(string s, out DateTime value, out bool valid)
    {
        value = default;
        valid = false;
        int i = 0;
        if (!Digits(s, ref i, 4, 4, out int year) || !Separator(s, ref i) || !Digits(s, ref i, 1, 2, out int month)
            || !Separator(s, ref i) || !Digits(s, ref i, 1, 2, out int day))
        {
            return false;
        }

        int h = 0, min = 0, sec = 0;
        bool time = i < s.Length;
        if (time)
        {
            if (s[i] is not (' ' or 'T'))
            {
                return false;
            }

            i++;
            if (!Digits(s, ref i, 1, 2, out h) || i >= s.Length || s[i] != ':')
            {
                return false;
            }

            i++;
            if (!Digits(s, ref i, 2, 2, out min))
            {
                return false;
            }

            if (i < s.Length)
            {
                if (s[i] != ':')
                {
                    return false;
                }

                i++;
                if (!Digits(s, ref i, 2, 2, out sec))
                {
                    return false;
                }

                if (i < s.Length)
                {
                    // Fractions of a second are accepted and dropped.
                    if (s[i] != '.')
                    {
                        return false;
                    }

                    i++;
                    if (!Digits(s, ref i, 1, int.MaxValue, out _))
                    {
                        return false;
                    }

                    if (i < s.Length)
                    {
                        return false;
                    }
                }
            }
        }

        if (month is < 1 or > 12 || day < 1 || year is < 1900 or > 2100 || day > DateTime.DaysInMonth(year, month))
        {
            return true;
        }

        value = new DateTime(year, month, day, 0, 0, 0, DateTimeKind.Unspecified);
        if (time)
        {
            if (h > 23 || min > 59 || sec > 59)
            {
                return true;
            }

            value = value.Add(new TimeSpan(h, min, sec));
        }

        valid = true;
        return true;

        static bool Separator(string s, ref int i)
        {
            if (i < s.Length && s[i] is '-' or '/' or '.')
            {
                i++;
                return true;
            }

            return false;
        }

        static bool Digits(string s, ref int i, int least, int most, out int number)
        {
            number = 0;
            int n = 0;
            while (n < most && i < s.Length && char.IsAsciiDigit(s[i]))
            {
                // Only the date and time parts are used as numbers (at most four digits); long fractions are skipped.
                number = n < 9 ? (number * 10) + (s[i] - '0') : number;
                i++;
                n++;
            }

            return n >= least;
        }
    }

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

    /// <summary>A time of day from a time cell, a day fraction, or text "14:30", "14:30:05", "2:30 PM".</summary>
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
            case string s:
                var m = TimeText().Match(s.Trim());
                if (!m.Success)
                {
                    return string.IsNullOrWhiteSpace(s) ? CellProblem.Blank : CellProblem.NotATime;
                }

                int h = int.Parse(m.Groups["h"].Value, Inv), min = int.Parse(m.Groups["min"].Value, Inv);
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

    [GeneratedRegex(@"^[0-9]{1,3}(,[0-9]{3})+$")]
    private static partial Regex ThousandsWithComma();

    [GeneratedRegex(@"^[0-9]{1,3}(\.[0-9]{3})+$")]
    private static partial Regex ThousandsWithDot();

    [GeneratedRegex(@"^(?<y>[0-9]{4})[-/.](?<m>[0-9]{1,2})[-/.](?<d>[0-9]{1,2})(?:[ T](?<h>[0-9]{1,2}):(?<min>[0-9]{2})(?::(?<s>[0-9]{2})(?:\.[0-9]+)?)?)?$")]
    private static partial Regex IsoDate();

    [GeneratedRegex(@"^(?<a>[0-9]{1,2})(?<sep>[/.-])(?<b>[0-9]{1,2})\k<sep>(?<y>[0-9]{4}|[0-9]{2})(?:[ T](?<h>[0-9]{1,2}):(?<min>[0-9]{2})(?::(?<s>[0-9]{2}))?)?$")]
    private static partial Regex SlashDate();

    [GeneratedRegex(@"^(?<h>[0-9]{1,2})[:.](?<min>[0-9]{2})(?::(?<s>[0-9]{2}))?\s*(?<ampm>[AaPp]\.?[Mm]\.?)?$")]
    private static partial Regex TimeText();
}
