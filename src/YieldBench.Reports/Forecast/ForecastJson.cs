using System.Globalization;
using System.Text;
using System.Text.Encodings.Web;
using System.Text.Json;
using YieldBench.Core.Forecast;

namespace YieldBench.Reports.Forecast;

/// <summary>
/// Writes <c>forecast.json</c>: <c>{"lots": [...], "backtest": [...]}</c> in the shape the forecast documents, times as
/// local ISO 8601 timestamps as in the logs (no offset), errors in hours, numbers rounded to what the readings
/// support, properties in a fixed order, LF line ends: same inputs, same bytes. A time that is not expected (a lot that
/// may never be dry) is null.
/// </summary>
public static class ForecastJson
{
    /// <summary>File name in the output folder.</summary>
    public const string FileName = "forecast.json";

    /// <summary>The file's text.</summary>
    public static string Write(ForecastReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        using var buffer = new MemoryStream();
        using (var w = new Utf8JsonWriter(buffer, new JsonWriterOptions { Indented = true, NewLine = "\n", Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping }))
        {
            w.WriteStartObject();
            w.WriteStartArray("lots");
            foreach (var f in report.Lots)
            {
                WriteLot(w, f, report);
            }

            w.WriteEndArray();
            w.WriteStartArray("backtest");
            foreach (var r in report.Backtest.Rows)
            {
                w.WriteStartObject();
                w.WriteString("target", r.Target);
                w.WriteNumber("readings", r.Readings);
                w.WriteNumber("lots", r.Lots);
                Number(w, "mae", r.Mae, 2);
                Number(w, "p90", r.P90, 2);
                Number(w, "coverage80", r.Coverage80, 3);
                Number(w, "baseline_line_mae", r.BaselineLineMae, 2);
                Number(w, "baseline_strain_mae", r.BaselineStrainMae, 2);
                w.WriteEndObject();
            }

            w.WriteEndArray();
            w.WriteEndObject();
        }

        return Encoding.UTF8.GetString(buffer.ToArray()) + "\n";
    }

    private static void WriteLot(Utf8JsonWriter w, LotForecast f, ForecastReport report)
    {
        var c = f.Course;
        w.WriteStartObject();
        w.WriteNumber("season", c.Season);
        w.WriteString("lot_id", c.LotId);
        w.WriteString("strain", c.Strain);
        w.WriteNumber("readings_used", f.ReadingsUsed);
        w.WriteStartObject("one_third");
        Number(w, "brix", f.OneThirdBrix, 2);
        Times(w, c, f.OneThirdHours);
        w.WriteEndObject();
        w.WriteStartObject("dry");
        Times(w, c, f.DryHours);
        w.WriteEndObject();
        w.WriteStartObject("peak_temp_c");
        Number(w, "value", f.PeakC?.Median, 1);
        Number(w, "low80", f.PeakC?.Low, 1);
        Number(w, "high80", f.PeakC?.High, 1);
        w.WriteEndObject();
        Number(w, "reachable_without_cooling_c", f.ReachableC, 1);
        Number(w, "cooling_kw", f.CoolingKw, 2);
        Number(w, "stuck_risk", f.StuckRisk, 3);
        Time(w, "next_reading_at", c, f.NextReadingHours);
        w.WriteStartObject("basis");
        w.WriteString("strain_prior", f.OwnStrainPrior ? "strain" : "pooled");
        w.WriteNumber("strain_lots", f.StrainLots);
        w.WriteNumber("readings", f.ReadingsUsed);
        w.WriteString("time_origin", c.FromInoculation ? "inoculation" : "first reading");
        w.WriteString("model", report.Form == Core.Kinetics.SigmoidModel.Gompertz ? "modified Gompertz" : "modified logistic");
        Number(w, "season_shift", f.SeasonShift, 3);
        Number(w, "settles_at_brix", f.SettlesAtBrix, 2);
        Number(w, "peak_rate_brix_per_day", f.PeakRateBrixPerDay, 2);
        Number(w, "vessel_heat_removal_per_h", f.CoolingCoefficientPerHour, 4);
        w.WriteEndObject();
        w.WriteEndObject();
    }

    private static void Times(Utf8JsonWriter w, LotCourse c, ForecastValue? v)
    {
        Time(w, "at", c, v?.Median);
        Time(w, "low80", c, v?.Low);
        Time(w, "high80", c, v?.High);
    }

    /// <summary>A time as "yyyy-MM-ddTHH:mm:ss" on the logs' local clock, to the minute; null when not finite.</summary>
    private static void Time(Utf8JsonWriter w, string name, LotCourse c, double? hours)
    {
        if (hours is { } h && double.IsFinite(h))
        {
            var t = c.At(h);
            var minute = new DateTime(t.Year, t.Month, t.Day, t.Hour, t.Minute, 0).AddMinutes(t.Second >= 30 ? 1 : 0);
            w.WriteString(name, minute.ToString("yyyy-MM-ddTHH:mm:ss", CultureInfo.InvariantCulture));
        }
        else
        {
            w.WriteNull(name);
        }
    }

    private static void Number(Utf8JsonWriter w, string name, double? value, int decimals)
    {
        if (value is { } v && double.IsFinite(v))
        {
            // Adding 0.0 turns a rounded −0 into 0.
            w.WriteNumber(name, Math.Round(v, decimals, MidpointRounding.AwayFromZero) + 0.0);
        }
        else
        {
            w.WriteNull(name);
        }
    }
}
