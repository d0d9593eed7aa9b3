using YieldBench.Core.Kinetics;
using YieldBench.Reports.Data;

namespace YieldBench.Reports.Kinetics;

/// <summary>Writes data/kinetics.csv: one row per lot with a log, invariant culture, snake_case columns with the unit last.</summary>
public static class KineticsCsv
{
    /// <summary>Conventional file name inside the output's data folder.</summary>
    public const string FileName = "kinetics.csv";

    /// <summary>Writes the per-lot table as CSV (RFC 4180, CRLF, numbers at each column's precision; see <see cref="CsvText"/>).</summary>
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
