using System.Globalization;
using YieldBench.Core.Units;

namespace YieldBench.Core.Forecast;

/// <summary>
/// The forecast in plain words, for the console, the workbook and the worked scripts: one short paragraph per lot, the
/// backtest in a few lines, and the cautions. Times are local clock times as in the logs ("Thu 17 Sep 14:00"). Pure.
/// </summary>
public static class ForecastSentences
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The cautions every forecast output repeats.</summary>
    public static IReadOnlyList<string> Cautions { get; } =
    [
        "A forecast guides when to measure and act; it is no substitute for the next reading. Take the reading before acting on a forecast time.",
        "Fermentation makes heat: the temperature \"reachable with no cooling\" is where the must would go if no heat were removed from now on. Cool before the forecast peak, not after it.",
        "Fermentation makes carbon dioxide, which collects in tanks, pits and closed or low spaces and can kill: ventilate, and follow local codes for gas monitoring and confined-space entry (docs/cautions.md).",
        "Defer to local codes and licensed practice; a nutrient addition's timing and amount are the winemaker's call.",
    ];

    /// <summary>A clock time as the cellar reads it: "Thu 17 Sep 14:00".</summary>
    public static string When(DateTime t) => ToMinute(t).ToString("ddd d MMM HH:mm", Inv);

    /// <summary>Hours a lot's last reading may lie before the latest reading of all running lots before it is said to be old.</summary>
    public const double StaleAfterHours = 24;

    /// <summary>When the lot's last reading (sugar or temperature) was taken, or null when it has none.</summary>
    public static DateTime? LastReading(LotCourse c)
    {
        ArgumentNullException.ThrowIfNull(c);
        double lastHours = Math.Max(c.SugarHours.Length > 0 ? c.SugarHours[^1] : double.NegativeInfinity, c.TempHours.Length > 0 ? c.TempHours[^1] : double.NegativeInfinity);
        return double.IsFinite(lastHours) ? c.At(lastHours) : null;
    }

    /// <summary>True when the lot's last reading lies more than <see cref="StaleAfterHours"/> before <paramref name="now"/> (its log stopped).</summary>
    public static bool IsStale(LotCourse c, DateTime? now) =>
        now is { } n && LastReading(c) is { } l && (n - l).TotalHours > StaleAfterHours;

    /// <summary>The time rounded to the nearest minute (forecast times carry fractions of a second).</summary>
    public static DateTime ToMinute(DateTime t) => new DateTime(t.Ticks - (t.Ticks % TimeSpan.TicksPerMinute), t.Kind).AddMinutes(t.Ticks % TimeSpan.TicksPerMinute >= TimeSpan.TicksPerMinute / 2 ? 1 : 0);

    /// <summary>A time interval: the second end without its date when it falls on the same day.</summary>
    public static string Span(DateTime low, DateTime high) =>
        ToMinute(low).Date == ToMinute(high).Date ? $"{ToMinute(low).ToString("HH:mm", Inv)}–{ToMinute(high).ToString("HH:mm", Inv)}" : $"{When(low)} – {When(high)}";

    /// <summary>The lot's paragraph: one-third, dryness, heat, risk, next reading, basis; temperatures in <paramref name="unit"/>.</summary>
    /// <remarks>
    /// <paramref name="now"/> is where the readings of all running lots stand; a lot whose own last reading is more than
    /// a day older is said to be so, and what its forecast puts before <paramref name="now"/> is said to be expected to
    /// have happened already (to be checked with a reading), not planned for.
    /// </remarks>
    public static IReadOnlyList<string> Lot(LotForecast f, TemperatureUnit unit = TemperatureUnit.Celsius, DateTime? now = null)
    {
        ArgumentNullException.ThrowIfNull(f);
        var c = f.Course;
        var lines = new List<string>();
        string vessel = c.Vessel is null ? string.Empty : $", {c.Vessel}";
        string head = $"Lot {c.LotId} ({c.Strain}{vessel})";
        DateTime? last = LastReading(c);
        bool stale = IsStale(c, now);
        bool Past(double hours) => stale && c.At(hours) < now!.Value;
        const string ByNow = " — by the forecast it has happened already: take a reading to see where the lot stands";
        if (f.OneThirdHours is not { } third)
        {
            lines.Add($"{head}: one-third at {N(f.OneThirdBrix)} °Brix could not be forecast.");
        }
        else if (f.OneThirdPassed)
        {
            lines.Add($"{head}: one-third ({N(f.OneThirdBrix)} °Brix) was passed {When(c.At(third.Median))} — the usual nutrient moment is behind it.");
        }
        else if (double.IsFinite(third.Median))
        {
            var at = c.At(third.Median);
            string high = double.IsFinite(third.High) ? Span(c.At(third.Low), c.At(third.High)) : $"{When(c.At(third.Low))} or later";
            string check = at.Hour < 12 ? "morning" : "evening";
            lines.Add(Past(third.Median)
                ? $"{head}: one-third at {N(f.OneThirdBrix)} °Brix expected {When(at)} (80 %: {high}){ByNow}."
                : $"{head}: one-third at {N(f.OneThirdBrix)} °Brix expected {When(at)} (80 %: {high}) — plan the nutrient addition for the {at.ToString("ddd", Inv)} {check} check.");
        }
        else
        {
            lines.Add($"{head}: one-third at {N(f.OneThirdBrix)} °Brix is not expected: the ferment looks set to stop before it.");
        }

        var parts = new List<string>();
        if (f.DryReached && f.DryHours is { } reached)
        {
            parts.Add($"dry: the readings passed {N(f.DryBrix)} °Brix {When(c.At(reached.Median))}");
        }
        else if (f.DryHours is { } dry && double.IsFinite(dry.Median))
        {
            // Within two days the hours matter; further out the day is what can be planned.
            bool close = dry.High - dry.Low < 48 && double.IsFinite(dry.High);
            string span = !double.IsFinite(dry.High) ? $"{c.At(dry.Low).ToString("d MMM", Inv)} or later"
                : close ? Span(c.At(dry.Low), c.At(dry.High))
                : $"{c.At(dry.Low).ToString("d MMM", Inv)}–{c.At(dry.High).ToString("d MMM", Inv)}";
            parts.Add($"dry expected {(close ? When(c.At(dry.Median)) : c.At(dry.Median).ToString("ddd d MMM", Inv))} (80 %: {span}){(Past(dry.Median) ? ", already past if the forecast holds" : string.Empty)}");
        }
        else
        {
            parts.Add($"dry not expected: the sugar looks set to settle near {N(f.SettlesAtBrix)} °Brix");
        }

        if (f.DryReached && f.PeakC is { } warmest)
        {
            parts.Add($"its warmest reading {unit.Show(warmest.Median)}");
        }
        else if (f.PeakC is { } top && f.PeakPassedHours is { } peakedAt)
        {
            parts.Add($"its peak, {unit.Show(top.Median)} at the {When(c.At(peakedAt))} reading, looks behind it (the readings since are cooler)");
        }
        else if (f.PeakC is { } peak)
        {
            string warn = peak.Median > f.DangerC ? $", above the {unit.Show(f.DangerC, "0")} danger threshold — cool it now"
                : peak.High > f.DangerC ? $"; the top of the range passes the {unit.Show(f.DangerC, "0")} danger threshold"
                : peak.Median > f.CautionC ? $", above the {unit.Show(f.CautionC, "0")} caution threshold" : string.Empty;
            parts.Add($"peak {unit.Show(peak.Median)} (80 %: {N(unit.FromCelsius(peak.Low))}–{N(unit.FromCelsius(peak.High))}){warn}");
        }

        if (stale)
        {
            // A log that stopped (readings not entered, or the lot forgotten): say so before the forecast is read as news.
            lines.Insert(1, $"  Its last reading was {When(last!.Value)}, {N((now!.Value - last.Value).TotalDays, "0")} day(s) before the latest reading of the running lots ({When(now.Value)}): the forecast runs from that reading.");
        }

        lines.Add("  " + Capital(string.Join("; ", parts)) + ".");
        var heat = new List<string>();
        if (f.ReachableC is { } reach && !f.DryReached)
        {
            heat.Add($"with no cooling from {(stale ? "its last reading" : "now")} it could reach {unit.Show(reach)}");
        }

        if (f.CoolingKw is { } kw && !f.DryReached)
        {
            string power = N(kw, kw < 1 ? "0.00" : kw < 10 ? "0.0" : "0");
            heat.Add(f.PeakPassedHours is null
                ? $"at the forecast peak rate ({N(f.PeakRateBrixPerDay)} °Brix/day) it makes {power} kW of heat, what cooling must remove to hold it steady"
                : $"at its peak rate ({N(f.PeakRateBrixPerDay)} °Brix/day) it made about {power} kW of heat; past its peak it makes less");
        }

        if (heat.Count > 0)
        {
            lines.Add("  " + Capital(string.Join("; ", heat)) + ".");
        }

        string risk = f.StuckRisk >= 0.5 ? " — act now: check nitrogen and temperature, and plan a restart"
            : f.StuckRisk >= 0.2 ? " — watch it closely" : string.Empty;
        string next = f.DryReached
            ? "next: confirm it with a lab residual-sugar analysis before treating it as finished (a hydrometer reads alcohol as well as sugar)"
            : stale ? "next reading: now, before acting on any time above"
            : $"next reading: {When(c.At(f.NextReadingHours))} would narrow the {f.NextReadingFor} forecast most";
        string basis = f.OwnStrainPrior
            ? $"basis: {f.StrainLots} past lot(s) of {c.Strain}, {f.ReadingsUsed} reading(s) so far"
            : $"basis: no own history for {c.Strain} (pooled prior of the other strains), {f.ReadingsUsed} reading(s) so far";
        lines.Add(f.DryReached ? $"  {Capital(next)}; {basis}." : $"  Chance of a sluggish or stuck end: {Percent(f.StuckRisk)}{risk}; {next}; {basis}.");
        return lines;
    }

    /// <summary>What the whole forecast rests on: the history, the form chosen, the season shift and the noise.</summary>
    public static IReadOnlyList<string> Basis(ForecastReport report, TemperatureUnit unit = TemperatureUnit.Celsius)
    {
        ArgumentNullException.ThrowIfNull(report);
        var m = report.Model;
        string form = report.Form == Kinetics.SigmoidModel.Gompertz ? "modified Gompertz" : "modified logistic";
        var lines = new List<string>
        {
            $"History: {report.PastLogs} past lots with a log; {m.LotsUsed} fitted ({report.PastLogsNotFitted} too short, too flat, or not shaped like a fermentation curve, so left out). Sugar course: the {form} curve of Zwietering et al. (1990), chosen because it fits the past logs better (median log ratio of residual sums of squares, Gompertz over logistic, {N(report.FormLogRatio, "0.00")}).",
            $"Reading noise from the past logs: {N(m.SugarSd, "0.00")} °Brix (hand readings), {N(m.DenseSugarSd, "0.00")} °Brix (probe), {N(unit.Difference(m.TempSd), "0.00")} {(unit == TemperatureUnit.Fahrenheit ? "°F" : "°C")}. Season-to-season spread of the time scale: {Percent(m.SeasonSpread)}; {Percent(m.RateOutlierShare)} of past lots ran far from their strain and are allowed for.",
        };
        var spreads = new[] { ("red", "reds"), ("white", "whites and rosés") }
            .Where(x => m.WithinByColour.ContainsKey(x.Item1))
            .Select(x => $"{x.Item2} {Percent(Math.Sqrt(m.WithinByColour[x.Item1].Vmm))} in maximum rate and {Percent(Math.Sqrt(m.WithinByColour[x.Item1].Vll))} of the lag")
            .ToArray();
        if (spreads.Length > 0)
        {
            lines.Add($"Lot-to-lot spread within a strain and season, learnt per colour: {string.Join("; ", spreads)}.");
        }

        foreach (var (season, (mean, sd)) in report.SeasonShifts.OrderBy(kv => kv.Key))
        {
            string pace = Math.Abs(mean) < 0.005 ? "at the history's usual pace" : mean > 0 ? $"about {Percent(Math.Exp(mean) - 1)} faster than the history" : $"about {Percent(1 - Math.Exp(mean))} slower than the history";
            lines.Add($"The lots running in {season} so far ferment {pace} (season shift {N(mean, "0.000")} ± {N(sd, "0.000")} on the log time scale); every lot of the season shares it.");
        }

        if (report.Now is { } now)
        {
            lines.Add($"Readings stand at {When(now)} (the last reading of all running lots).");
        }

        return lines;
    }

    /// <summary>Notes of one kind printed one per lot; past this many, the kind is said once and the other lots named.</summary>
    public const int NotesOnePerLot = 5;

    /// <summary>Lots named after a kind's first note before the rest are counted.</summary>
    public const int NotesLotsNamed = 20;

    /// <summary>
    /// The forecast's notes for reading: each kind (code) in the order it first occurs, one line per note while it has
    /// at most <see cref="NotesOnePerLot"/>; a kind with more (a cellar of 300 running lots with no must volume
    /// recorded) gives its first note and names the other lots (the first <see cref="NotesLotsNamed"/>, then a count)
    /// instead of repeating the sentence 300 times.
    /// </summary>
    public static IReadOnlyList<string> Notes(IReadOnlyList<ForecastNote> notes)
    {
        ArgumentNullException.ThrowIfNull(notes);
        var lines = new List<string>();
        foreach (var kind in notes.GroupBy(n => n.Code, StringComparer.Ordinal))
        {
            var all = kind.ToArray();
            if (all.Length <= NotesOnePerLot)
            {
                lines.AddRange(all.Select(n => n.Message));
                continue;
            }

            var others = all.Skip(1).Select(n => n.LotId ?? "?").ToArray();
            string named = string.Join(", ", others.Take(NotesLotsNamed));
            string more = others.Length > NotesLotsNamed ? string.Create(Inv, $" and {others.Length - NotesLotsNamed} more") : string.Empty;
            lines.Add(all[0].Message + string.Create(Inv, $" Likewise for {others.Length} more lots: {named}{more}."));
        }

        return lines;
    }

    /// <summary>A few lines of the backtest: the model against the two baselines at each cut, per target.</summary>
    public static IReadOnlyList<string> Backtest(BacktestResult backtest, TemperatureUnit unit = TemperatureUnit.Celsius)
    {
        ArgumentNullException.ThrowIfNull(backtest);
        if (backtest.Rows.Count == 0)
        {
            return ["Backtest: the history needs two or more seasons of fitted logs to hold one out; none was run."];
        }

        var lines = new List<string>
        {
            $"Backtest, each of {string.Join(", ", backtest.Seasons)} held out in turn (readings: mean error / 90th percentile / 80 % band held; baselines: last-two-readings line, strain median):",
        };
        foreach (var target in ForecastBacktest.Targets)
        {
            var rows = backtest.Rows.Where(r => r.Target == target).ToArray();
            if (rows.Length == 0)
            {
                continue;
            }

            bool peak = target == "peak_temp";
            string symbol = peak ? unit.Symbol() : "h";
            double E(double v) => peak ? unit.Difference(v) : v;
            string name = target switch { "one_third" => "one-third", "dry" => "dry", _ => "peak temp" };
            var cells = rows.Select(r => $"{r.Readings}: {N(E(r.Mae))}/{N(E(r.P90))} {symbol} {Percent(r.Coverage80)} ({N(E(r.BaselineLineMae))}, {N(E(r.BaselineStrainMae))})");
            lines.Add($"  {name,-10} {string.Join("  ", cells)}");
        }

        return lines;
    }

    /// <summary>
    /// The heading of the backtest by colour, saying how long each colour took to one-third in the lots scored (the
    /// median over lots of the logged time), so the reader sees why errors in hours differ by colour in this cellar.
    /// </summary>
    public static string ByColourHeading(BacktestResult backtest)
    {
        ArgumentNullException.ThrowIfNull(backtest);
        double MedianHours(string colour)
        {
            var hours = backtest.Cases.Where(c => c.Target == "one_third" && c.Colour == colour && double.IsFinite(c.Truth))
                .DistinctBy(c => (c.Season, c.LotId)).Select(c => c.Truth).ToArray();
            return hours.Length == 0 ? double.NaN : Statistics.Descriptive.Median(hours);
        }

        double red = MedianHours("red"), white = MedianHours("white");
        if (!double.IsFinite(red) || !double.IsFinite(white) || red <= 0)
        {
            return "By colour (reds, and whites and rosés)";
        }

        double ratio = white / red;
        string pace = ratio >= 1.5 ? $"{N(ratio)} times as long, so their errors in hours are larger"
            : ratio <= 1 / 1.5 ? $"reds took {N(1 / ratio)} times as long, so their errors in hours are larger"
            : "about as long";
        return $"By colour (whites and rosés took a median {N(white, "0")} h to one-third against {N(red, "0")} h for reds in the lots scored: {pace})";
    }

    private static string Capital(string s) => s.Length == 0 ? s : char.ToUpperInvariant(s[0]) + s[1..];

    private static string N(double v, string format = "0.0") => v.ToString(format, Inv);

    /// <summary>A share as a whole percentage ("7 %"), "&lt; 1 %" below half a percent.</summary>
    public static string Percent(double share) => share < 0.005 ? "< 1 %" : (share * 100).ToString("0", Inv) + " %";
}
