using System.Globalization;
using System.Text;

namespace YieldBench.Intake;

/// <summary>What settling a text changed.</summary>
[Flags]
internal enum TextChange
{
    None = 0,

    /// <summary>Control characters (a vertical tab, an escape…) or characters XML cannot hold were replaced.</summary>
    Characters = 1,

    /// <summary>The text was longer than a spreadsheet cell holds and was cut.</summary>
    Cut = 2,
}

/// <summary>
/// Text from input files settled so that every output can hold it and a terminal cannot be steered by it: workbook
/// and chart XML hold only tab, line feed, carriage return and the characters from U+0020 up (XML 1.0, section 2.2,
/// "Characters"), except the surrogates and U+FFFE/U+FFFF; a spreadsheet cell holds at most 32,767 characters (the
/// limit of Excel and LibreOffice Calc, from memory of their published specifications). Control characters (C0, DEL
/// and C1, which include the escape that starts terminal sequences) are replaced, so no input text reaches a console
/// or file raw.
/// </summary>
internal static class TextSettling
{
    /// <summary>Most characters a spreadsheet cell holds.</summary>
    public const int MaxCellText = 32_767;

    /// <summary>Most characters of an input value shown in an issue.</summary>
    public const int MaxShownValue = 500;

    /// <summary>
    /// The text settled: in a one-line field (lot id, strain, vessel…) every control character becomes a space; in a
    /// note, a vertical tab or form feed (how some database exports write a line break) and a carriage return become a
    /// line break, a tab stays, and any other control character becomes a space. Lone surrogates and U+FFFE/U+FFFF
    /// become U+FFFD. Then the text is trimmed and cut to <see cref="MaxCellText"/> characters.
    /// </summary>
    public static string Settle(string text, bool multiline, out TextChange change)
    {
        change = TextChange.None;
        if (NeedsWork(text))
        {
            var sb = new StringBuilder(text.Length);
            for (int i = 0; i < text.Length; i++)
            {
                char c = text[i];
                if (char.IsHighSurrogate(c) && i + 1 < text.Length && char.IsLowSurrogate(text[i + 1]))
                {
                    sb.Append(c).Append(text[++i]);
                }
                else if (char.IsSurrogate(c) || c is '\uFFFE' or '\uFFFF')
                {
                    sb.Append('\uFFFD');
                    change |= TextChange.Characters;
                }
                else if (multiline && c is '\n' or '\t')
                {
                    sb.Append(c);
                }
                else if (multiline && c == '\r')
                {
                    // "\r\n" and a lone "\r" are one line break.
                    sb.Append('\n');
                    i += i + 1 < text.Length && text[i + 1] == '\n' ? 1 : 0;
                }
                else if (multiline && c is '\v' or '\f')
                {
                    sb.Append('\n');
                    change |= TextChange.Characters;
                }
                else if (char.IsControl(c))
                {
                    sb.Append(' ');
                    change |= TextChange.Characters;
                }
                else
                {
                    sb.Append(c);
                }
            }

            text = sb.ToString().Trim();
        }

        if (text.Length > MaxCellText)
        {
            int cut = char.IsHighSurrogate(text[MaxCellText - 1]) ? MaxCellText - 1 : MaxCellText;
            text = text[..cut];
            change |= TextChange.Cut;
        }

        return text;
    }

    /// <summary>
    /// A text shown in an issue or on a console: control characters written as <c>&lt;U+001B&gt;</c>, invalid characters
    /// as U+FFFD, and text beyond <paramref name="max"/> characters replaced by a count.
    /// </summary>
    public static string ForDisplay(string text, int max = MaxShownValue)
    {
        if (!NeedsWork(text) && text.Length <= max)
        {
            return text;
        }

        var sb = new StringBuilder((int)Math.Min(text.Length, (long)max + 40));
        for (int i = 0; i < text.Length && sb.Length < max; i++)
        {
            char c = text[i];
            if (char.IsHighSurrogate(c) && i + 1 < text.Length && char.IsLowSurrogate(text[i + 1]))
            {
                sb.Append(c).Append(text[++i]);
            }
            else if (char.IsSurrogate(c) || c is '\uFFFE' or '\uFFFF')
            {
                sb.Append('\uFFFD');
            }
            else if (char.IsControl(c))
            {
                sb.Append("<U+").Append(((int)c).ToString("X4", CultureInfo.InvariantCulture)).Append('>');
            }
            else
            {
                sb.Append(c);
            }
        }

        if (sb.Length >= max && text.Length > max)
        {
            sb.Append(CultureInfo.InvariantCulture, $"… ({text.Length:N0} characters in all)");
        }

        return sb.ToString();
    }

    /// <summary>True when the text holds a character that settling or display changes.</summary>
    private static bool NeedsWork(string text)
    {
        foreach (char c in text)
        {
            if (c < ' ' || (c >= '\u007F' && c <= '\u009F') || char.IsSurrogate(c) || c is '\uFFFE' or '\uFFFF')
            {
                return true;
            }
        }

        return false;
    }
}
