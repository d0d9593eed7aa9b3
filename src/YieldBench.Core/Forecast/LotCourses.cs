using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Core.Forecast;

/// <summary>Builds <see cref="LotCourse"/>s from lot records and their logs (joined by season and lot id). Pure.</summary>
public static class LotCourses
{
    /// <summary>The courses of finished lots that have a log with at least one sugar reading, in lot order.</summary>
    public static IReadOnlyList<LotCourse> FromHistory(IReadOnlyList<Lot> lots, IReadOnlyList<FermentationLog> logs)
    {
        ArgumentNullException.ThrowIfNull(lots);
        ArgumentNullException.ThrowIfNull(logs);
        var index = Index(logs, lots.Select(l => (l.LotId, l.Season)));
        var result = new List<LotCourse>();
        foreach (var lot in lots)
        {
            if (index.TryGetValue((lot.LotId, lot.Season), out var readings)
                && Make(lot.Season, lot.LotId, lot.Strain, lot.Vessel, lot.VesselCapacityL, lot.Colour, lot.YanMgL, lot.StartingSugar, lot.Additions, lot.InoculationDate, readings) is { SugarHours.Length: > 0 } c)
            {
                result.Add(c);
            }
        }

        return result;
    }

    /// <summary>The course of each running lot (with no readings when it has no log yet), in lot order.</summary>
    public static IReadOnlyList<LotCourse> FromRunning(IReadOnlyList<RunningLot> lots, IReadOnlyList<FermentationLog> logs)
    {
        ArgumentNullException.ThrowIfNull(lots);
        ArgumentNullException.ThrowIfNull(logs);
        var index = Index(logs, lots.Select(l => (l.LotId, l.Season)));
        return lots.Select(l => Make(l.Season, l.LotId, l.Strain, l.Vessel, l.VesselCapacityL, l.Colour, l.YanMgL, l.StartingSugar, l.Additions, l.InoculationDate, index.GetValueOrDefault((l.LotId, l.Season)) ?? [])).ToArray();
    }

    private static Dictionary<(string, int), List<LogReading>> Index(IReadOnlyList<FermentationLog> logs, IEnumerable<(string LotId, int Season)> lots)
    {
        // A log without a season joins the one lot of that id (when exactly one lot has it).
        var seasonsById = lots.GroupBy(l => l.LotId, StringComparer.Ordinal).ToDictionary(g => g.Key, g => g.Select(x => x.Season).Distinct().ToArray(), StringComparer.Ordinal);
        var index = new Dictionary<(string, int), List<LogReading>>();
        foreach (var log in logs)
        {
            int? season = log.Season;
            if (season is null && seasonsById.TryGetValue(log.LotId, out var s) && s.Length == 1)
            {
                season = s[0];
            }

            if (season is not { } key)
            {
                continue;
            }

            if (!index.TryGetValue((log.LotId, key), out var list))
            {
                index[(log.LotId, key)] = list = [];
            }

            list.AddRange(log.Readings);
        }

        return index;
    }

    private static LotCourse Make(int season, string lotId, string strain, string? vessel, double? capacity, WineColour colour, double? yan, SugarReading start, Additions additions, DateTime? inoculated, IReadOnlyList<LogReading> readings)
    {
        var balance = AdditionBalance.Apply(start, additions);
        var firstTime = readings.Count == 0 ? (DateTime?)null : readings.Min(r => r.Timestamp);
        DateTime? setAside = null;
        if (inoculated is { } recorded && firstTime is { } first && !Kinetics.InoculationClock.Fits(recorded, first))
        {
            (setAside, inoculated) = (recorded, null);
        }

        var origin = inoculated ?? firstTime ?? DateTime.MinValue;
        var (sh, sb, ss, th, tc, merged) = LotCourse.Prepare(readings, origin);
        double? volume = balance.VolumeAfterL ?? additions.MustVolumeL;
        return new LotCourse
        {
            Season = season,
            LotId = lotId,
            Strain = strain,
            Vessel = vessel,
            Colour = colour,
            VolumeL = volume ?? capacity,
            VolumeIsCapacity = volume is null && capacity is not null,
            YanMgL = yan,
            StartBrix = balance.Effective.Brix,
            Origin = origin,
            FromInoculation = inoculated is not null,
            InoculationSetAside = setAside,
            SugarHours = sh,
            SugarBrix = sb,
            SugarSources = ss,
            TempHours = th,
            TempC = tc,
            MergedReadings = merged,
        };
    }
}
