namespace YieldBench.Core.Kinetics;

/// <summary>
/// Whether a lot's recorded inoculation can start the clock of its log. A log whose first reading lies months after
/// the inoculation (most often a year typed wrong in one of the two, or a date a spreadsheet completed with the year it
/// was typed in) would otherwise give a lag and a time to dry of a year; its times then count from the first reading.
/// </summary>
public static class InoculationClock
{
    /// <summary>
    /// Most days from the inoculation to the log's first reading (no alcoholic fermentation waits two months for its
    /// first reading: common practice, a bound chosen well beyond the slowest start).
    /// </summary>
    public const double MaxDaysToFirstReading = 60;

    /// <summary>Most days a log's first reading may come before the inoculation (a juice reading; as intake places a date without a year).</summary>
    public const double MaxDaysBeforeInoculation = 31;

    /// <summary>True when the inoculation can start the clock of a log whose first reading is <paramref name="firstReading"/>.</summary>
    public static bool Fits(DateTime inoculation, DateTime firstReading)
    {
        double days = (firstReading - inoculation).TotalDays;
        return days <= MaxDaysToFirstReading && days >= -MaxDaysBeforeInoculation;
    }

    /// <summary>The sentence said when the inoculation cannot start the clock.</summary>
    public static string Message(string lot, DateTime inoculation, DateTime firstReading)
    {
        double days = (firstReading - inoculation).TotalDays;
        string gap = days > 0
            ? $"{Math.Round(days).ToString("0", System.Globalization.CultureInfo.InvariantCulture)} days after"
            : $"{Math.Round(-days).ToString("0", System.Globalization.CultureInfo.InvariantCulture)} days before";
        return $"Lot {lot}: the log's first reading ({firstReading.ToString("yyyy-MM-dd HH:mm", System.Globalization.CultureInfo.InvariantCulture)}) is {gap} the recorded inoculation ({inoculation.ToString("yyyy-MM-dd HH:mm", System.Globalization.CultureInfo.InvariantCulture)}), too far apart to be this ferment's start, so times count from the first reading. Check the year of the log's dates and of the inoculation date.";
    }
}
