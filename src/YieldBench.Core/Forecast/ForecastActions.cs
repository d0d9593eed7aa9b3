using System.Globalization;
using YieldBench.Core.Units;

namespace YieldBench.Core.Forecast;

/// <summary>When a running lot's next step falls, as the cellar plans a day.</summary>
public enum ActionDay
{
    /// <summary>Something cannot wait: the forecast peak passes the danger threshold, a stuck end is likely, or the log stopped.</summary>
    Now,

    /// <summary>The next step falls on the day the readings stand at (or its forecast time is already past).</summary>
    Today,

    /// <summary>The next step falls on the following day.</summary>
    Tomorrow,

    /// <summary>The next step falls after tomorrow.</summary>
    Later,
}

/// <summary>A running lot's next step: when it falls, what it is, and what needs watching.</summary>
/// <param name="Forecast">The lot's forecast.</param>
/// <param name="Day">The group it is listed in.</param>
/// <param name="Due">When the step falls (local clock), or null when it has no forecast time.</param>
/// <param name="Step">The step in a few words ("nutrient at one-third, 17.8 °Brix").</param>
/// <param name="Then">What follows the step, or empty (", then lab residual sugar").</param>
/// <param name="Range">The 80 % range of <paramref name="Due"/>, short ("18:20–20:13", "28 Sep–30 Sep"), or null; said between the step and <paramref name="Then"/>.</param>
/// <param name="Urgent">What cannot wait, most serious first (empty unless <paramref name="Day"/> is <see cref="ActionDay.Now"/>).</param>
/// <param name="Watch">What to keep an eye on (a peak whose range passes the danger threshold, a stuck risk of 20 % or more...).</param>
/// <param name="NextReading">The next reading most worth taking, or null when the lot is dry by its readings.</param>
public sealed record LotAction(LotForecast Forecast, ActionDay Day, DateTime? Due, string Step, string Then, string? Range, IReadOnlyList<string> Urgent, IReadOnlyList<string> Watch, DateTime? NextReading);

/// <summary>
/// The forecast as a cellar's to-do list: each running lot's next step, grouped by what cannot wait, what falls today,
/// tomorrow and later, soonest first; and the compact console lines made from it (one line a lot). The full paragraph
/// of each lot (<see cref="ForecastSentences.Lot"/>) follows on the console only for a cellar of at most
/// <see cref="DetailUpTo"/> running lots; it is always in forecast.xlsx and forecast.json. Pure.
/// </summary>
public static class ForecastActions
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>
    /// Running lots up to which the console also prints every lot's full paragraph after the to-do list (about two
    /// screens of a 100-column terminal; the demo's ten lots). Above it, the list alone: 300 paragraphs are 2,000 lines.
    /// </summary>
    public const int DetailUpTo = 12;

    /// <summary>Stuck risk from which a lot cannot wait (a restart to plan).</summary>
    public const double StuckActNow = 0.5;

    /// <summary>Stuck risk from which a lot is to be watched closely.</summary>
    public const double StuckWatch = 0.2;

    /// <summary>Each lot's next step, in list order: the urgent ones first (most serious first), then by day and time, then lot id.</summary>
    public static IReadOnlyList<LotAction> Plan(ForecastReport report, TemperatureUnit unit = TemperatureUnit.Celsius)
    {
        ArgumentNullException.ThrowIfNull(report);
        return report.Lots.Select(f => Of(f, report.Now, unit))
            .OrderBy(a => a.Day)
            .ThenBy(a => a.Day == ActionDay.Now ? -Severity(a.Forecast, report.Now) : 0)
            .ThenBy(a => a.Due ?? DateTime.MaxValue)
            .ThenBy(a => a.Forecast.Course.LotId, StringComparer.Ordinal)
            .ToArray();
    }

    /// <summary>One lot's next step, judged at <paramref name="now"/> (where the readings of all running lots stand).</summary>
    public static LotAction Of(LotForecast f, DateTime? now, TemperatureUnit unit = TemperatureUnit.Celsius)
    {
        ArgumentNullException.ThrowIfNull(f);
        var c = f.Course;
        var urgent = new List<string>();
        var watch = new List<string>();
        var last = ForecastSentences.LastReading(c);
        bool stale = ForecastSentences.IsStale(c, now);
        if (!f.DryReached && f.PeakPassedHours is null && f.PeakC is { } peak)
        {
            if (peak.Median > f.DangerC)
            {
                urgent.Add($"cool now: peak {unit.Show(peak.Median)} expected, over the {unit.Show(f.DangerC, "0")} danger threshold");
            }
            else if (peak.High > f.DangerC)
            {
                watch.Add($"peak {unit.Show(peak.Median)}, its 80 % range passes the {unit.Show(f.DangerC, "0")} danger threshold");
            }
            else if (peak.Median > f.CautionC)
            {
                watch.Add($"peak {unit.Show(peak.Median)}, above the {unit.Show(f.CautionC, "0")} caution threshold");
            }
        }

        if (!f.DryReached && f.StuckRisk >= StuckActNow)
        {
            urgent.Add($"stuck risk {ForecastSentences.Percent(f.StuckRisk)}: check nitrogen and temperature, plan a restart");
        }
        else if (!f.DryReached && f.StuckRisk >= StuckWatch)
        {
            watch.Add($"stuck risk {ForecastSentences.Percent(f.StuckRisk)}: watch it closely");
        }

        if (stale)
        {
            urgent.Add($"log stopped {ForecastSentences.When(last!.Value)}: take a reading now");
        }

        DateTime? next = f.DryReached ? null : stale ? now : c.At(f.NextReadingHours);
        var (due, step, then, range) = Step(f, now);
        var day = urgent.Count > 0 ? ActionDay.Now : DayOf(due ?? next, now);
        return new LotAction(f, day, due, step, then, range, urgent, watch, next);
    }

    /// <summary>
    /// The lot's next timed step: the nutrient addition at one-third, else dryness to confirm with a lab analysis, else
    /// the next reading; with its 80 % range, short ("18:20–20:13", "Mon 08:26–Tue 09:46", "28 Sep–30 Sep").
    /// </summary>
    private static (DateTime? Due, string Step, string Then, string? Range) Step(LotForecast f, DateTime? now)
    {
        var c = f.Course;
        bool Before(DateTime t) => now is { } n && t < n;
        if (f.DryReached && f.DryHours is { } reached)
        {
            return (now ?? c.At(reached.Median), "dry by the readings", ": confirm it by lab residual sugar", null);
        }

        if (!f.OneThirdPassed && f.OneThirdHours is { } third && double.IsFinite(third.Median))
        {
            var at = c.At(third.Median);
            string range = double.IsFinite(third.High) ? ShortSpan(c.At(third.Low), c.At(third.High)) : $"{ForecastSentences.ToMinute(c.At(third.Low)).ToString("ddd HH:mm", Inv)} or later";
            return Before(at)
                ? (at, $"one-third ({N(f.OneThirdBrix)} °Brix) due by now", ": read it, then the nutrient", null)
                : (at, $"nutrient at one-third, {N(f.OneThirdBrix)} °Brix", string.Empty, range);
        }

        if (f.DryHours is { } dry && double.IsFinite(dry.Median))
        {
            var at = c.At(dry.Median);
            string range = !double.IsFinite(dry.High) ? $"{c.At(dry.Low).ToString("d MMM", Inv)} or later"
                : dry.High - dry.Low < 48 ? ShortSpan(c.At(dry.Low), c.At(dry.High))
                : $"{c.At(dry.Low).ToString("d MMM", Inv)}–{c.At(dry.High).ToString("d MMM", Inv)}";
            return Before(at)
                ? (at, "dry due by now", ": read it, then lab residual sugar", null)
                : (at, "dry", ", then lab residual sugar", range);
        }

        if (f.OneThirdHours is null)
        {
            return (null, "one-third could not be forecast", ": take readings", null);
        }

        return (null, "dry not expected", $": the sugar looks set to settle near {N(f.SettlesAtBrix)} °Brix", null);
    }

    /// <summary>A time range: "18:20–20:13" within a day, else "Mon 08:26–Tue 09:46".</summary>
    private static string ShortSpan(DateTime low, DateTime high)
    {
        DateTime l = ForecastSentences.ToMinute(low), h = ForecastSentences.ToMinute(high);
        return l.Date == h.Date ? $"{l.ToString("HH:mm", Inv)}–{h.ToString("HH:mm", Inv)}" : $"{l.ToString("ddd HH:mm", Inv)}–{h.ToString("ddd HH:mm", Inv)}";
    }

    private static ActionDay DayOf(DateTime? due, DateTime? now)
    {
        if (due is not { } d || now is not { } n)
        {
            return ActionDay.Later;
        }

        return d.Date <= n.Date ? ActionDay.Today : d.Date == n.Date.AddDays(1) ? ActionDay.Tomorrow : ActionDay.Later;
    }

    /// <summary>Order of the urgent lots: a peak past danger, then a likely stuck end, then a stopped log.</summary>
    private static double Severity(LotForecast f, DateTime? now) =>
        (!f.DryReached && f.PeakPassedHours is null && f.PeakC is { } p && p.Median > f.DangerC ? 4 : 0)
        + (!f.DryReached && f.StuckRisk >= StuckActNow ? 2 : 0)
        + (ForecastSentences.IsStale(f.Course, now) ? 1 : 0);

    /// <summary>
    /// The console's to-do list: a heading, then the groups "Act now", "Today", "Tomorrow", "Later", one line a lot
    /// (lot, strain, when, the step, what to watch, the next reading); <paramref name="detailFile"/> names where each
    /// lot's full forecast is.
    /// </summary>
    public static IReadOnlyList<string> Lines(ForecastReport report, string detailFile, TemperatureUnit unit = TemperatureUnit.Celsius)
    {
        ArgumentNullException.ThrowIfNull(report);
        var plan = Plan(report, unit);
        var lines = new List<string>();
        var seasons = report.Lots.Select(l => l.Course.Season).Distinct().Order().ToArray();
        string stand = report.Now is { } t ? $" (readings stand at {ForecastSentences.When(t)})" : string.Empty;
        int urgent = plan.Count(a => a.Day == ActionDay.Now), watched = plan.Count(a => a.Watch.Count > 0);
        lines.Add($"Forecast for {report.Lots.Count} running lot(s) of {string.Join(", ", seasons)}{stand}: {urgent} to act on now, {watched} to watch; each lot's next step, soonest first (every lot in full: {detailFile}).");
        int lotWidth = Math.Min(12, plan.Select(a => a.Forecast.Course.LotId.Length).DefaultIfEmpty(0).Max());
        int strainWidth = Math.Min(10, plan.Select(a => a.Forecast.Course.Strain.Length).DefaultIfEmpty(0).Max());
        foreach (var group in plan.GroupBy(a => a.Day))
        {
            string title = group.Key switch
            {
                ActionDay.Now => "Act now",
                ActionDay.Today => report.Now is { } n ? $"Today, {n.ToString("ddd d MMM", Inv)}" : "Today",
                ActionDay.Tomorrow => report.Now is { } n ? $"Tomorrow, {n.AddDays(1).ToString("ddd d MMM", Inv)}" : "Tomorrow",
                _ => "Later",
            };
            lines.Add($"{title} ({group.Count()} lot(s)):");
            foreach (var a in group)
            {
                var c = a.Forecast.Course;
                string when = group.Key switch
                {
                    ActionDay.Now => string.Empty,
                    ActionDay.Later => (a.Due is { } d ? d.ToString("ddd d MMM", Inv) : "-").PadRight(12),
                    _ => (a.Due is { } d ? ForecastSentences.ToMinute(d).ToString("HH:mm", Inv) : "-").PadRight(7),
                };
                // The range where the hour matters (today, tomorrow) and for dryness; a one-third days away is a day to plan.
                string range = a.Range is { } r80 && (group.Key is ActionDay.Today or ActionDay.Tomorrow || a.Forecast.OneThirdPassed) ? $" (80 % {r80})" : string.Empty;
                var parts = new List<string>();
                parts.AddRange(a.Urgent);
                parts.Add(group.Key == ActionDay.Now && a.Due is { } due ? $"{a.Step} ({ShortWhen(due, report.Now)}){a.Then}" : a.Step + range + a.Then);
                parts.AddRange(a.Watch.Select(w => "watch " + w));
                // A step already due asks for a reading now; a stopped log's urgent line does too.
                bool readNow = a.Due is { } dueAt && report.Now is { } standing && dueAt < standing;
                if (a.NextReading is { } read && !readNow && !ForecastSentences.IsStale(c, report.Now))
                {
                    parts.Add($"read {ShortWhen(read, report.Now)}");
                }

                lines.Add($"  {c.LotId.PadRight(lotWidth)}  {c.Strain.PadRight(strainWidth)}  {when}{string.Join("; ", parts)}");
            }
        }

        return lines;
    }

    /// <summary>A reading time: "18:00" on the day the readings stand at, else "Sat 06:00" within the week, else the date.</summary>
    private static string ShortWhen(DateTime t, DateTime? now)
    {
        var m = ForecastSentences.ToMinute(t);
        return now is { } n && m.Date == n.Date ? m.ToString("HH:mm", Inv)
            : now is { } w && m > w && m < w.Date.AddDays(6) ? m.ToString("ddd HH:mm", Inv)
            : ForecastSentences.When(m);
    }

    private static string N(double v) => v.ToString("0.0", Inv);
}
