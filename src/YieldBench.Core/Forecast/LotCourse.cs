using YieldBench.Core.Lots;

namespace YieldBench.Core.Forecast;

/// <summary>
/// One lot's fermentation as the forecast sees it: sugar and temperature readings in hours from the lot's time origin
/// (the inoculation when recorded, otherwise the first reading), sorted, readings of one time merged.
/// </summary>
public sealed record LotCourse
{
    /// <summary>Season (vintage year).</summary>
    public required int Season { get; init; }

    /// <summary>The cellar's lot id.</summary>
    public required string LotId { get; init; }

    /// <summary>Strain code as recorded.</summary>
    public required string Strain { get; init; }

    /// <summary>Vessel type, or null.</summary>
    public string? Vessel { get; init; }

    /// <summary>Colour style.</summary>
    public WineColour Colour { get; init; }

    /// <summary>Must volume fermenting, L (after additions; the vessel capacity when no volume is recorded), or null.</summary>
    public double? VolumeL { get; init; }

    /// <summary>True when <see cref="VolumeL"/> is the vessel capacity, not a recorded must volume.</summary>
    public bool VolumeIsCapacity { get; init; }

    /// <summary>Yeast assimilable nitrogen, mg N/L, or null.</summary>
    public double? YanMgL { get; init; }

    /// <summary>Starting sugar of the lot record after recorded additions, °Brix: the basis of one-third depletion.</summary>
    public required double StartBrix { get; init; }

    /// <summary>Time zero.</summary>
    public required DateTime Origin { get; init; }

    /// <summary>True when <see cref="Origin"/> is the recorded inoculation.</summary>
    public required bool FromInoculation { get; init; }

    /// <summary>
    /// The recorded inoculation when it was set aside because the log's first reading lies too far from it
    /// (<see cref="Kinetics.InoculationClock"/>); times then count from the first reading. Null otherwise.
    /// </summary>
    public DateTime? InoculationSetAside { get; init; }

    /// <summary>Sugar readings: hours from the origin, ascending.</summary>
    public required double[] SugarHours { get; init; }

    /// <summary>Sugar readings, °Brix (hydrometer scale; below 0 in a dry wine).</summary>
    public required double[] SugarBrix { get; init; }

    /// <summary>Where each sugar reading was read, or null.</summary>
    public required SourceRef?[] SugarSources { get; init; }

    /// <summary>Temperature readings: hours from the origin, ascending.</summary>
    public required double[] TempHours { get; init; }

    /// <summary>Temperature readings, °C.</summary>
    public required double[] TempC { get; init; }

    /// <summary>False for a lot with neither an inoculation time nor any reading: nothing fixes its clock.</summary>
    public bool HasClock => FromInoculation || SugarHours.Length > 0 || TempHours.Length > 0;

    /// <summary>Readings of one time that were merged (averaged).</summary>
    public int MergedReadings { get; init; }

    /// <summary>The time at <paramref name="hours"/> from the origin.</summary>
    public DateTime At(double hours) => Origin + TimeSpan.FromHours(hours);

    /// <summary>Hours from the origin to <paramref name="time"/>.</summary>
    public double HoursOf(DateTime time) => (time - Origin).TotalHours;

    /// <summary>
    /// The course as it stood after its first <paramref name="sugarReadings"/> sugar readings: those readings and the
    /// temperatures logged up to the last of them.
    /// </summary>
    public LotCourse Cut(int sugarReadings)
    {
        int k = Math.Clamp(sugarReadings, 0, SugarHours.Length);
        double until = k == 0 ? double.NegativeInfinity : SugarHours[k - 1];
        int m = 0;
        while (m < TempHours.Length && TempHours[m] <= until)
        {
            m++;
        }

        return this with
        {
            SugarHours = SugarHours[..k],
            SugarBrix = SugarBrix[..k],
            SugarSources = SugarSources[..k],
            TempHours = TempHours[..m],
            TempC = TempC[..m],
        };
    }

    /// <summary>
    /// Prepares a course from a log's readings: sorted by time (readings of one time keep their file order and are
    /// averaged, sugar and temperature each over the readings that hold them).
    /// </summary>
    public static (double[] SugarHours, double[] SugarBrix, SourceRef?[] Sources, double[] TempHours, double[] TempC, int Merged) Prepare(IReadOnlyList<LogReading> readings, DateTime origin)
    {
        ArgumentNullException.ThrowIfNull(readings);
        var order = Enumerable.Range(0, readings.Count).OrderBy(i => readings[i].Timestamp).ThenBy(i => i).ToArray();
        var sh = new List<double>();
        var sb = new List<double>();
        var ss = new List<SourceRef?>();
        var th = new List<double>();
        var tc = new List<double>();
        int merged = 0;
        for (int from = 0, to; from < order.Length; from = to)
        {
            var time = readings[order[from]].Timestamp;
            to = from + 1;
            while (to < order.Length && readings[order[to]].Timestamp == time)
            {
                to++;
            }

            merged += to - from - 1;
            var group = order[from..to].Select(i => readings[i]).ToArray();
            double hours = (time - origin).TotalHours;
            var sugars = group.Where(r => r.Sugar is not null).ToArray();
            if (sugars.Length > 0)
            {
                sh.Add(hours);
                sb.Add(sugars.Average(r => r.Sugar!.Value.Brix));
                ss.Add(sugars[0].Source);
            }

            var temps = group.Where(r => r.TemperatureC is not null).Select(r => r.TemperatureC!.Value).ToArray();
            if (temps.Length > 0)
            {
                th.Add(hours);
                tc.Add(temps.Average());
            }
        }

        return (sh.ToArray(), sb.ToArray(), ss.ToArray(), th.ToArray(), tc.ToArray(), merged);
    }
}
