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

    /// <summary>
    /// True when the file may be read: it holds bytes and is within the size limit. Checked from the directory entry
    /// alone, before the file is opened: a device (/dev/zero), a pipe or a socket reports no size, and opening a pipe
    /// would wait for a writer, so they are refused here with the empty file.
    /// </summary>
    public static bool SizeAllowed(string file, string fullPath, IntakeOptions options, IssueSink sink, out long length)
    {
        length = EntryLength(fullPath);
        if (length == 0)
        {
            sink.Error(file, null, null, null, null, IssueCodes.EmptyFile, IntakeMessages.EmptyFile());
            return false;
        }

        if (length > options.MaxFileBytes)
        {
            sink.Error(file, null, null, null, length.ToString(CultureInfo.InvariantCulture), IssueCodes.FileTooLarge, IntakeMessages.FileTooLarge(length, options.MaxFileBytes));
            return false;
        }

        return true;
    }

    /// <summary>
    /// The size the directory entry gives for the file a path names, through any links (the size of a link itself is
    /// that of the path it holds). Devices, pipes and sockets give 0.
    /// </summary>
    public static long EntryLength(string fullPath)
    {
        var info = new FileInfo(fullPath);
        return info.LinkTarget is not null && info.ResolveLinkTarget(returnFinalTarget: true) is FileInfo target ? (target.Exists ? target.Length : 0) : info.Length;
    }

    /// <summary>Reads a file whose size <see cref="SizeAllowed"/> accepted into raw sheets.</summary>
    public static RawFile Read(string file, string fullPath, long length, IntakeOptions options, IssueSink sink)
    {
        string ext = Path.GetExtension(fullPath).ToLowerInvariant();
        byte[] head = new byte[Math.Min(length, BinaryProbeBytes)];
        using (var fs = OpenShared(fullPath))
        {
            fs.ReadExactly(head);
        }

        if (ext is ".xlsx" or ".xlsm" or ".xls" && IsText(head))
        {
            // Some programs "export to Excel" as text (a CSV or tab-separated table, or a web page) named .xls.
            if (System.Text.Encoding.Latin1.GetString(head).Contains("<table", StringComparison.OrdinalIgnoreCase))
            {
                sink.Error(file, null, null, null, null, IssueCodes.NotAWorkbook, IntakeMessages.WebPageNamedWorkbook(ext));
                return Refused;
            }

            sink.Warning(file, null, null, null, null, IssueCodes.ContentDiffersFromName, IntakeMessages.TextNamedWorkbook(ext));
            var text = CsvSource.Read(file, fullPath, head, options, sink);
            MergedCells.Settle(text);
            return text;
        }

        var raw = ext switch
        {
            ".csv" or ".txt" or ".tsv" => CsvSource.Read(file, fullPath, head, options, sink),
            ".ods" => OdsSource.Read(file, fullPath, head, options, sink),
            _ => WorkbookSource.Read(file, fullPath, ext, head, options, sink),
        };
        MergedCells.Settle(raw);
        return raw;
    }

    /// <summary>
    /// True when the start of a file is text, not a workbook: no zip or compound-file signature, and either a UTF-16 or
    /// UTF-32 form (which CsvSource reads) or no control byte but tab, line ends and form feed (damaged or random
    /// bytes hold many).
    /// </summary>
    private static bool IsText(byte[] head) =>
        !WorkbookSource.StartsWith(head, WorkbookSource.ZipMagic) && !WorkbookSource.StartsWith(head, WorkbookSource.CompoundFileMagic)
        && (CsvSource.UnicodeForm(head, out _, out _) is not null || !head.Any(b => b < 0x20 && b is not ((byte)'\t' or (byte)'\n' or (byte)'\r' or 0x0C)));

    /// <summary>A file refused (already reported): no sheets.</summary>
    public static RawFile Refused => new([], true);
}
