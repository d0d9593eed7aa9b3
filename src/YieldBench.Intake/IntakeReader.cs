using System.Security.Cryptography;
using YieldBench.Core.Lots;

namespace YieldBench.Intake;

/// <summary>
/// Reads seasons of lots and fermentation logs from .xlsx, .xlsm, .xls, .ods, .csv, .txt and .tsv files and folders of
/// them. Never throws for bad
/// input: every problem becomes an <see cref="IntakeIssue"/> naming file, sheet, row, column and value, and every row
/// read is accounted for (<see cref="SourceAccount"/>).
/// </summary>
public static class IntakeReader
{
    /// <summary>File name endings that are read, from a folder or given by name.</summary>
    public static IReadOnlyList<string> Extensions { get; } = [".xlsx", ".xlsm", ".xls", ".ods", ".csv", ".txt", ".tsv"];

    /// <summary>
    /// The file that marks a folder as a report this tool wrote (the report writer's manifest); such a folder met below
    /// an input folder is skipped, so a report kept beside the inputs is never read back as input.
    /// </summary>
    public const string ReportManifestName = "yieldbench-files.txt";

    /// <summary>Folders below a folder given that are looked into (deeper ones are reported, not read).</summary>
    public const int MaxFolderDepth = 8;

    /// <summary>
    /// Reads every input. <paramref name="paths"/> are files or folders (a folder means the files of the types read in
    /// it and its subfolders, in ordinal order of their paths; every other file is reported as skipped). Results are in
    /// input order and do not depend on the clock.
    /// </summary>
    /// <param name="paths">Input files and folders, absolute or relative to <see cref="IntakeOptions.WorkingDirectory"/>.</param>
    /// <param name="options">Mappings, season fallback and limits.</param>
    /// <returns>Lots, logs, issues, accounting, file hashes and header mappings.</returns>
    public static SeasonSet Read(IReadOnlyList<string> paths, IntakeOptions options)
    {
        ArgumentNullException.ThrowIfNull(paths);
        ArgumentNullException.ThrowIfNull(options);
        var sink = new IssueSink();
        string root = options.WorkingDirectory ?? Environment.CurrentDirectory;
        string? mappingFull = options.MappingFile is null ? null : Path.GetFullPath(options.MappingFile, root);
        var rules = ColumnRules.Parse(options, options.MappingFile, mappingFull, sink);
        var run = new IntakeRun(options, rules, sink);
        var files = new List<InputFile>();

        // The inputs in order, each a file to read or an issue found while listing them (a missing file, an empty folder).
        foreach (var step in Expand(paths, root))
        {
            if (step.Issue is { } issue)
            {
                sink.AddRange([issue]);
                continue;
            }

            var (display, full) = (step.Display!, step.Full!);
            ReadFile(run, step, Readable(full) ? Load(display, full, options) : null, files);
        }

        LotRows.ReadAwaiting(run);
        ColumnRules.ReportUnused(rules, sink);
        Spellings.Unify(run.Lots, sink);
        var logs = LogJoin.Join(run);
        return new SeasonSet
        {
            Lots = run.Lots,
            RunningLots = run.RunningLots,
            Logs = logs,
            Issues = FoldUnusedColumns(sink.Issues),
            Accounts = run.Accounts,
            Files = files,
            Mappings = run.Mappings,
        };
    }

    /// <summary>
    /// A column no field reads, repeated on many sheets of one file (a "Notes" column on every tank's sheet), is said
    /// once, at its first sheet, naming the other sheets, instead of once per sheet.
    /// </summary>
    internal static IntakeIssue[] FoldUnusedColumns(IReadOnlyList<IntakeIssue> issues)
    {
        var repeats = issues.Where(i => i.Code == IssueCodes.ColumnNotUsed && i.Column is not null)
            .GroupBy(i => (i.File, i.Column))
            .Where(g => g.Select(i => i.Sheet).Distinct(StringComparer.Ordinal).Count() > 1)
            .ToDictionary(g => g.First(), g => g.Skip(1).ToArray(), new ReferenceComparer());
        if (repeats.Count == 0)
        {
            return [.. issues];
        }

        var dropped = repeats.Values.SelectMany(v => v).ToHashSet(new ReferenceComparer());
        var result = new List<IntakeIssue>(issues.Count);
        foreach (var issue in issues)
        {
            if (dropped.Contains(issue))
            {
                continue;
            }

            result.Add(repeats.TryGetValue(issue, out var others) ? issue with { Message = issue.Message + " " + IntakeMessages.SameColumnOnOtherSheets(others.Select(o => o.Sheet ?? "").ToArray()) } : issue);
        }

        return [.. result];
    }

    /// <summary>Issues by identity (two issues may be equal in every field and still be two).</summary>
    private sealed class ReferenceComparer : IEqualityComparer<IntakeIssue>
    {
        public bool Equals(IntakeIssue? x, IntakeIssue? y) => ReferenceEquals(x, y);

        public int GetHashCode(IntakeIssue obj) => System.Runtime.CompilerServices.RuntimeHelpers.GetHashCode(obj);
    }

    /// <summary>
    /// One input in order: a file to read (display name, full path, and whether it was met in a folder rather than
    /// named), or an issue found listing the inputs.
    /// </summary>
    private sealed record Step(string? Display, string? Full, IntakeIssue? Issue, bool InFolder = false);

    private static Step Found(string file, string code, string message, IssueSeverity severity) =>
        new(null, null, new IntakeIssue(file, null, null, null, null, code, message, severity));

    private static IEnumerable<Step> Expand(IReadOnlyList<string> paths, string root)
    {
        foreach (var given in paths)
        {
            string full = Path.GetFullPath(given, root);

            // Shown relative to where the user stands when it lies there, as typed otherwise.
            string relative = Path.GetRelativePath(root, full);
            string p = Path.IsPathRooted(given) && !relative.StartsWith("..", StringComparison.Ordinal) && !Path.IsPathRooted(relative) ? relative : given;
            if (Directory.Exists(full))
            {
                var steps = new List<Step>();
                int read = 0;
                Walk(full, TextSettling.ForDisplay(p, int.MaxValue), 0, steps, ref read);
                if (read == 0)
                {
                    steps.Insert(0, Found(p, IssueCodes.FolderEmpty, IntakeMessages.FolderEmpty(), IssueSeverity.Warning));
                }

                foreach (var step in steps)
                {
                    yield return step;
                }
            }
            else if (File.Exists(full))
            {
                yield return new Step(TextSettling.ForDisplay(p, int.MaxValue), full, null);
            }
            else
            {
                yield return Found(p, IssueCodes.FileNotFound, IntakeMessages.FileNotFound(), IssueSeverity.Error);
            }
        }
    }

    /// <summary>
    /// The files of a folder and its subfolders in ordinal order of their names (a folder's files, then its
    /// subfolders), each a file to read or a file skipped with the reason. Links to folders are not followed.
    /// </summary>
    private static void Walk(string folder, string display, int depth, List<Step> steps, ref int read)
    {
        string[] files, folders;
        try
        {
            files = Directory.GetFiles(folder);
            folders = Directory.GetDirectories(folder);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            steps.Add(Found(display, IssueCodes.CannotOpen, IntakeMessages.CannotOpenFolder(ex.Message.TrimEnd('.')), IssueSeverity.Error));
            return;
        }

        Array.Sort(files, StringComparer.Ordinal);
        Array.Sort(folders, StringComparer.Ordinal);
        foreach (var f in files)
        {
            string name = Path.GetFileName(f);
            string shown = Path.Combine(display, TextSettling.ForDisplay(name, int.MaxValue));
            if (name.StartsWith("~$", StringComparison.Ordinal) || (name.StartsWith(".~lock.", StringComparison.Ordinal) && name.EndsWith('#')))
            {
                steps.Add(Found(shown, IssueCodes.LockFileSkipped, IntakeMessages.LockFileSkipped(), IssueSeverity.Warning));
            }
            else if (!Extensions.Contains(Path.GetExtension(name).ToLowerInvariant()))
            {
                steps.Add(Found(shown, IssueCodes.FileSkipped, IntakeMessages.FileSkipped(Path.GetExtension(name)), IssueSeverity.Warning));
            }
            else
            {
                steps.Add(new Step(shown, f, null, InFolder: true));
                read++;
            }
        }

        foreach (var d in folders)
        {
            string shown = Path.Combine(display, TextSettling.ForDisplay(Path.GetFileName(d), int.MaxValue));
            if (new DirectoryInfo(d).LinkTarget is not null)
            {
                steps.Add(Found(shown, IssueCodes.FileSkipped, IntakeMessages.FolderLinkSkipped(), IssueSeverity.Warning));
            }
            else if (File.Exists(Path.Combine(d, ReportManifestName)) || Path.GetFileName(d).StartsWith(".yieldbench-", StringComparison.Ordinal))
            {
                // A report this tool wrote (or its staging folder): its data files are results, not inputs.
                steps.Add(Found(shown, IssueCodes.FileSkipped, IntakeMessages.ReportFolderSkipped(), IssueSeverity.Warning));
            }
            else if (depth + 1 > MaxFolderDepth)
            {
                steps.Add(Found(shown, IssueCodes.FileSkipped, IntakeMessages.FolderTooDeep(MaxFolderDepth), IssueSeverity.Warning));
            }
            else
            {
                Walk(d, shown, depth + 1, steps, ref read);
            }
        }
    }

    /// <summary>True for a file of a type that is read (by its name's ending).</summary>
    private static bool Readable(string full) => Extensions.Contains(Path.GetExtension(full).ToLowerInvariant());

    /// <summary>A file hashed and parsed into raw sheets, with the issues found doing so, not yet read as tables.</summary>
    private sealed record LoadedFile(InputFile? Hash, RawFile? Raw, IReadOnlyList<IntakeIssue> Issues, string? CannotOpen);

    /// <summary>Hashes and parses one file into raw sheets, with the issues found doing so.</summary>
    private static LoadedFile Load(string file, string full, IntakeOptions options)
    {
        var sink = new IssueSink();
        InputFile? hash = null;
        try
        {
            if (!SourceFiles.SizeAllowed(file, full, options, sink, out long length))
            {
                return new LoadedFile(null, SourceFiles.Refused, sink.Issues, null);
            }

            hash = Hash(file, full);
            var raw = SourceFiles.Read(file, full, length, options, sink);
            return new LoadedFile(hash, raw, sink.Issues, null);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            return new LoadedFile(hash, null, sink.Issues, ex.Message.TrimEnd('.'));
        }
    }

    private static void ReadFile(IntakeRun run, Step step, LoadedFile? loaded, List<InputFile> files)
    {
        var (file, full) = (step.Display!, step.Full!);
        var sink = run.Sink;
        string ext = Path.GetExtension(full).ToLowerInvariant();
        if (loaded is null)
        {
            sink.Error(file, null, null, null, null, IssueCodes.UnsupportedFileType, IntakeMessages.UnsupportedFileType(ext.Length == 0 ? "(no extension)" : ext));
            run.Accounts.Add(new SourceAccount(file, null, "refused", 0, 0, 0, 0, 0, 0));
            return;
        }

        if (loaded.Hash is { } hash)
        {
            // The same bytes again (a file given twice, met again in a folder given, or a copy) would only repeat its
            // lots as duplicates: it is read once, and the repeat is said.
            var same = files.FirstOrDefault(f => f.Sha256 == hash.Sha256 && f.Bytes == hash.Bytes);
            files.Add(hash);
            if (same is not null)
            {
                sink.Warning(file, null, null, null, null, IssueCodes.SameContentAgain, IntakeMessages.SameContentAgain(same.Path));
                run.Accounts.Add(new SourceAccount(file, null, "not read", 0, 0, 0, 0, 0, 0));
                return;
            }
        }

        sink.AddRange(loaded.Issues);
        if (loaded.Raw is not { } raw)
        {
            sink.Error(file, null, null, null, null, IssueCodes.CannotOpen, IntakeMessages.CannotOpen(loaded.CannotOpen ?? ""));
            run.Accounts.Add(new SourceAccount(file, null, "refused", 0, 0, 0, 0, 0, 0));
            return;
        }

        if (raw.Refused)
        {
            run.Accounts.Add(new SourceAccount(file, null, "refused", 0, 0, 0, 0, 0, 0));
            return;
        }

        var notTables = new List<RawSheet>();
        var acrossSheets = new List<RawSheet>();
        bool anyTable = false;
        foreach (var sheet in raw.Sheets)
        {
            if (sheet.Hidden)
            {
                // Hidden sheets usually hold old workings or lookups; reading them unasked would mix them into the lots.
                MergedCells.Warn(sheet, file, sink, 0);
                sink.Warning(file, sheet.Name, null, null, null, IssueCodes.HiddenSheetSkipped, IntakeMessages.HiddenSheetSkipped());
                run.Accounts.Add(new SourceAccount(file, sheet.Name, "hidden", 0, 0, 0, 0, 0, 0));
                continue;
            }

            var outcome = SheetReader.Read(run, file, full, sheet);

            // A sheet read as no table (or refused) warns of every merged block it holds.
            MergedCells.Warn(sheet, file, sink, 0);
            switch (outcome)
            {
                case SheetReader.Outcome.Read:
                    anyTable = true;
                    break;
                case SheetReader.Outcome.NoTable when SheetReader.LaidAcross(sheet) is not null:
                    acrossSheets.Add(sheet);
                    break;
                case SheetReader.Outcome.NoTable:
                    notTables.Add(sheet);
                    break;
                default:
                    run.Accounts.Add(new SourceAccount(file, sheet.Name, "empty", 0, 0, 0, 0, 0, 0));
                    break;
            }
        }

        if (!anyTable && acrossSheets.Count == 0)
        {
            if (step.InFolder && Path.GetExtension(full).Equals(".txt", StringComparison.OrdinalIgnoreCase))
            {
                // A .txt met in a folder is as likely a note as a table: without a header it is skipped, not an error.
                sink.Warning(file, null, null, null, null, IssueCodes.NoTableFound, IntakeMessages.TextFileWithoutTable(HeaderDetection.SearchRows));
            }
            else
            {
                sink.Error(file, null, null, null, null, IssueCodes.NoTableFound, IntakeMessages.NoTableInFile(HeaderDetection.SearchRows));
            }
        }
        else
        {
            foreach (var sheet in notTables.Where(s => !TemplateWriter.IsColumnsGuide(s)))
            {
                sink.Warning(file, sheet.Name, null, null, null, IssueCodes.SheetSkipped, IntakeMessages.SheetSkipped(HeaderDetection.SearchRows));
            }
        }

        foreach (var sheet in notTables)
        {
            run.Accounts.Add(new SourceAccount(file, sheet.Name, "not read", 0, 0, 0, 0, 0, 0));
        }

        foreach (var sheet in acrossSheets)
        {
            // A ferment sheet laid across (dates along a row, a row per measure): its readings are not read, which is
            // an error whose fix says how to turn it, not a sheet passed over with a warning.
            var (row, column, dates, readings) = SheetReader.LaidAcross(sheet)!.Value;
            sink.Error(file, sheet.Name, row + 1, CellValues.Text(sheet.Cell(row, column)), null, IssueCodes.LogLaidAcross, IntakeMessages.LogLaidAcross(row + 1, dates, readings));
            run.Accounts.Add(new SourceAccount(file, sheet.Name, "not read", 0, 0, 0, 0, 0, 0));
        }
    }

    private static InputFile Hash(string display, string full)
    {
        using var stream = SourceFiles.OpenShared(full);
        byte[] hash = SHA256.HashData(stream);
        return new InputFile(display, Convert.ToHexStringLower(hash), stream.Length);
    }
}
