using System.Globalization;
using System.Text.RegularExpressions;

namespace YieldBench.Intake;

/// <summary>Years named by sheet and file names ("Lots 2023") and by season cells ("2024/25").</summary>
internal static partial class SeasonNames
{
    /// <summary>A four-digit year (1900–2100) standing alone in a sheet or file name, when there is exactly one.</summary>
    public static int? FromName(string? name)
    {
        if (name is null)
        {
            return null;
        }

        var years = YearInName().Matches(name).Select(m => int.Parse(m.Value, CultureInfo.InvariantCulture)).Where(y => y is >= 1900 and <= 2100).Distinct().ToArray();
        return years.Length == 1 ? years[0] : null;
    }

    /// <summary>The year a season cell's text names ("2024", "2024/25"), or null when it names none.</summary>
    public static int? YearOf(string text) =>
        text.Length == 4 && int.TryParse(text, NumberStyles.None, CultureInfo.InvariantCulture, out int year) ? year
        : YearText().Match(text) is { Success: true } m ? int.Parse(m.Groups["y"].Value, CultureInfo.InvariantCulture) : null;

    [GeneratedRegex(@"(?<![0-9])[0-9]{4}(?![0-9])")]
    private static partial Regex YearInName();

    [GeneratedRegex(@"^\s*(?<y>[0-9]{4})(?:\s*[-/]\s*[0-9]{2,4})?\s*$")]
    private static partial Regex YearText();
}
