using System.Text;
using System.Xml;
using ClosedXML.Excel;

namespace YieldBench.Reports.Workbook;

/// <summary>How text goes into a cell: always as text (never a formula), and only with characters XML can carry.</summary>
public static class SheetLayout
{
    /// <summary>
    /// <paramref name="text"/> without the characters XML 1.0 cannot carry (control characters other than tab and
    /// line breaks, unpaired surrogates, U+FFFE and U+FFFF), so no text can make the package unreadable.
    /// </summary>
    public static string XmlSafe(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        int i = 0;
        while (i < text.Length && ValidAt(text, i) is int width and > 0)
        {
            i += width;
        }

        if (i == text.Length)
        {
            return text;
        }

        var sb = new StringBuilder(text.Length);
        sb.Append(text, 0, i);
        while (i < text.Length)
        {
            int width = ValidAt(text, i);
            if (width > 0)
            {
                sb.Append(text, i, width);
                i += width;
            }
            else
            {
                i++;
            }
        }

        return sb.ToString();
    }

    /// <summary>
    /// Writes a cell as text (never as a formula, whatever its first character), without the characters XML cannot
    /// carry (see <see cref="XmlSafe"/>), as streamed tables write it.
    /// </summary>
    public static void SetText(IXLCell cell, string text)
    {
        ArgumentNullException.ThrowIfNull(cell);
        ArgumentNullException.ThrowIfNull(text);
        cell.SetValue(XmlSafe(text));
        cell.DataType = XLDataType.Text;
    }

    // 1 for a valid character, 2 for a valid surrogate pair, 0 for a character XML cannot carry.
    private static int ValidAt(string text, int i)
    {
        char ch = text[i];
        if (XmlConvert.IsXmlChar(ch))
        {
            return 1;
        }

        return i + 1 < text.Length && XmlConvert.IsXmlSurrogatePair(text[i + 1], ch) ? 2 : 0;
    }
}
