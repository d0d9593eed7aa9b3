using System.Globalization;

namespace YieldBench.Intake;

/// <summary>
/// Opens one input file read-only (shared, so a workbook open in a spreadsheet program does not block us), refuses
/// hostile or broken files with a reported issue, and returns its sheets as raw cells.
/// </summary>
internal static class SourceFiles
{
    /// <summary>Bytes of a CSV searched for a zero byte (a text file has none).</summary>
    private const int BinaryProbeBytes = 64 * 1024;

    public static FileStream OpenShared(string fullPath) =>
        new(fullPath, FileMode.Open, FileAccess.Read, FileShare.ReadWrite | FileShare.Delete, 1 << 16);

    public static RawFile Read(string file, string fullPath, IntakeOptions options, IssueSink sink)
    {
        string ext = Path.GetExtension(fullPath).ToLowerInvariant();
        long length = new FileInfo(fullPath).Length;
        if (length == 0)
        {
            sink.Error(file, null, null, null, null, IssueCodes.EmptyFile, IntakeMessages.EmptyFile());
            return Refused;
        }

        if (length > options.MaxFileBytes)
        {
            sink.Error(file, null, null, null, length.ToString(CultureInfo.InvariantCulture), IssueCodes.FileTooLarge, IntakeMessages.FileTooLarge(length, options.MaxFileBytes));
            return Refused;
        }

        byte[] head = new byte[Math.Min(length, BinaryProbeBytes)];
        using (var fs = OpenShared(fullPath))
        {
            fs.ReadExactly(head);
        }

        return ext switch
        {
            ".csv" or ".txt" or ".tsv" => CsvSource.Read(file, fullPath, head, options, sink),
            _ => WorkbookSource.Read(file, fullPath, ext, head, options, sink),
        };
    }

    /// <summary>A file refused (already reported): no sheets.</summary>
    public static RawFile Refused => new([], true);
}
