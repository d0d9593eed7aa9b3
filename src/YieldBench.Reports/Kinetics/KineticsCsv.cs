using YieldBench.Core.Kinetics;
using YieldBench.Reports.Data;

namespace YieldBench.Reports.Kinetics;

/// <summary>Writes data/kinetics.csv: one row per lot with a log, invariant culture, snake_case columns with the unit last.</summary>
public static class KineticsCsv
{
    /// <summary>Conventional file name inside the output's data folder.</summary>
    public const string FileName = "kinetics.csv";

    /// <summary>Conventional file name of the per-reading data file.</summary>
    public const string ReadingsFileName = "kinetics-readings.csv";

    /// <summary>Writes one row per sugar reading (rates, smoothed rate, sugar g/L and heat potential) as CSV.</summary>
    public static void WriteReadings(KineticsReview review, TextWriter writer)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(writer);
        CsvText.Write(KineticsTables.Readings(review), writer);
    }

    /// <summary>Writes the per-lot table as CSV (RFC 4180, CRLF, round-trip numbers; see <see cref="CsvText"/>).</summary>
    public static void Write(KineticsReview review, TextWriter writer)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(writer);
        CsvText.Write(KineticsTables.Lots(review), writer);
    }

    /// <summary>Writes the per-lot table straight to <paramref name="path"/> (streamed, atomic; the bytes of <see cref="Write"/> as UTF-8).</summary>
    public static void WriteFile(KineticsReview review, string path)
    {
        ArgumentNullException.ThrowIfNull(review);
        CsvText.WriteFile(KineticsTables.Lots(review), path);
    }
}
