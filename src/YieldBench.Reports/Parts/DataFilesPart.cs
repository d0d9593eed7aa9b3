using System.Text;
using YieldBench.Core.Review;
using YieldBench.Reports.Data;
using YieldBench.Reports.Kinetics;
using YieldBench.Reports.Output;
using YieldBench.Reports.Tables;

namespace YieldBench.Reports.Parts;

/// <summary>The data files: each table streamed to its CSV file, and the house-factor section as JSON.</summary>
public sealed class DataFilesPart : IReportPart
{
    private static readonly UTF8Encoding Utf8NoBom = new(encoderShouldEmitUTF8Identifier: false);

    /// <inheritdoc/>
    public string Name => "data files";

    /// <inheritdoc/>
    public IReadOnlyList<string> Files(ReviewResult review) => Outputs(review).Select(o => o.File).ToArray();

    /// <inheritdoc/>
    public IReadOnlyList<Action> Jobs(PartContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        return Outputs(context.Review).Select(o => (Action)(() => context.Write(o.File, o.Write(context)))).ToArray();
    }

    // Each file with how it is written; tables stream straight to their files (at 100,000 lots a whole file held as one
    // string cost hundreds of MB).
    private static IEnumerable<(string File, Func<PartContext, Action<Stream>> Write)> Outputs(ReviewResult review)
    {
        yield return (ReportWriter.DataFiles.Lots, c => Csv(c.Tables.Lots));
        yield return (ReportWriter.DataFiles.Groups, c => Csv(ReviewTables.Groups(c.Review)));
        yield return (ReportWriter.DataFiles.Flags, c => Csv(ReviewTables.Flags(c.Review)));
        yield return (ReportWriter.DataFiles.FollowUp, c => Csv(ReviewTables.Findings(c.Review)));
        yield return (ReportWriter.DataFiles.IntakeIssues, c => Csv(ReviewTables.IntakeIssues(c.Review)));
        yield return (ReportWriter.DataFiles.HouseFactor, c => stream => HouseFactorJson.Write(c.Review.HouseFactor, stream));
        if (review.Kinetics is not null)
        {
            // The table of KineticsCsv.WriteFile, shared with the kinetics sheet.
            yield return (ReportWriter.DataFiles.Kinetics, c => Csv(c.Tables.KineticsLots!));
            yield return (ReportWriter.DataFiles.KineticsFindings, c => Csv(KineticsTables.Findings(c.Review.Kinetics!)));
        }
    }

    private static Action<Stream> Csv(ReportTable table) => stream =>
    {
        using var writer = new StreamWriter(stream, Utf8NoBom, bufferSize: 1 << 16, leaveOpen: true);
        CsvText.Write(table, writer);
    };
}
