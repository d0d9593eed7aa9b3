using System.Security.Cryptography;
using YieldBench.Core.Lots;

namespace YieldBench.Intake;

/// <summary>
/// Reads seasons of lots and fermentation logs from .xlsx, .xls and .csv files and folders. Never throws for bad
/// input: every problem becomes an <see cref="IntakeIssue"/> naming file, sheet, row, column and value, and every row
/// read is accounted for (<see cref="SourceAccount"/>).
/// </summary>
public static partial class IntakeReader
{
    /// <summary>File name endings read from a folder and accepted as inputs.</summary>
    public static IReadOnlyList<string> Extensions { get; } = [".xlsx", ".xlsm", ".xls", ".csv"];

    /// <summary>
    /// Reads every input. <paramref name="paths"/> are files or folders (a folder means its .xlsx, .xlsm, .xls and .csv
    /// files, not its subfolders, in ordinal name order). Results are in input order and do not depend on the clock.
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
            ReadFile(run, display, full, Readable(full) ? Load(display, full, options) : null, files);
        }

        ColumnRules.ReportUnused(rules, sink);
        Spellings.Unify(run.Lots, sink);
        var logs = JoinLogs(run);
        return new SeasonSet
        {
            Lots = run.Lots,
            RunningLots = run.RunningLots,
            Logs = logs,
            Issues = sink.Issues.ToArray(),
            Accounts = run.Accounts,
            Files = files,
            Mappings = run.Mappings,
        };
    }

    /// <summary>One input in order: a file to read (display name and full path), or an issue found listing the inputs.</summary>
    private sealed record Step(string? Display, string? Full, IntakeIssue? Issue);

    private static Step Found(string file, string code, string message, IssueSeverity severity) =>
        new(null, null, new IntakeIssue(file, null, null, null, null, code, message, severity));

    private static IEnumerable<Step> Expand(IReadOnlyList<string> paths, string root)
    {
        foreach (var p in paths)
        {
            string full = Path.GetFullPath(p, root);
            if (Directory.Exists(full))
            {
                var inFolder = Directory.EnumerateFiles(full)
                    .Where(f => Extensions.Contains(Path.GetExtension(f).ToLowerInvariant()))
                    .Order(StringComparer.Ordinal)
                    .ToList();
                if (inFolder.Count == 0)
                {
                    yield return Found(p, IssueCodes.FolderEmpty, IntakeMessages.FolderEmpty(), IssueSeverity.Warning);
                }

                foreach (var f in inFolder)
                {
                    string display = Path.Combine(p, Path.GetFileName(f));
                    if (Path.GetFileName(f).StartsWith("~$", StringComparison.Ordinal))
                    {
                        yield return Found(display, IssueCodes.LockFileSkipped, IntakeMessages.LockFileSkipped(), IssueSeverity.Warning);
                        continue;
                    }

                    yield return new Step(display, f, null);
                }
            }
            else if (File.Exists(full))
            {
                yield return new Step(p, full, null);
            }
            else
            {
                yield return Found(p, IssueCodes.FileNotFound, IntakeMessages.FileNotFound(), IssueSeverity.Error);
            }
        }
    }

    /// <summary>True for a file of a type that is read (by its name's ending).</summary>
    private static bool Readable(string full)
    {
        string ext = Path.GetExtension(full).ToLowerInvariant();
        return Extensions.Contains(ext) || ext is ".txt" or ".tsv";
    }

    /// <summary>A file hashed and parsed into raw sheets, with the issues found doing so, not yet read as tables.</summary>
    private sealed record LoadedFile(InputFile? Hash, RawFile? Raw, IReadOnlyList<IntakeIssue> Issues, string? CannotOpen);

    /// <summary>Hashes and parses one file into raw sheets, with the issues found doing so.</summary>
    private static LoadedFile Load(string file, string full, IntakeOptions options)
    {
        var sink = new IssueSink();
        InputFile? hash = null;
        try
        {
            hash = Hash(file, full);
            var raw = SourceFiles.Read(file, full, options, sink);
            return new LoadedFile(hash, raw, sink.Issues, null);
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            return new LoadedFile(hash, null, sink.Issues, ex.Message.TrimEnd('.'));
        }
    }

    private static void ReadFile(IntakeRun run, string file, string full, LoadedFile? loaded, List<InputFile> files)
    {
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
            files.Add(hash);
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
        bool anyTable = false;
        foreach (var sheet in raw.Sheets)
        {
            if (sheet.Hidden)
            {
                // Hidden sheets usually hold old workings or lookups; reading them unasked would mix them into the lots.
                sink.Warning(file, sheet.Name, null, null, null, IssueCodes.HiddenSheetSkipped, IntakeMessages.HiddenSheetSkipped());
                run.Accounts.Add(new SourceAccount(file, sheet.Name, "hidden", 0, 0, 0, 0, 0, 0));
                continue;
            }

            switch (SheetReader.Read(run, file, full, sheet))
            {
                case SheetReader.Outcome.Read:
                    anyTable = true;
                    break;
                case SheetReader.Outcome.NoTable:
                    notTables.Add(sheet);
                    break;
                default:
                    run.Accounts.Add(new SourceAccount(file, sheet.Name, "empty", 0, 0, 0, 0, 0, 0));
                    break;
            }
        }

        if (!anyTable)
        {
            sink.Error(file, null, null, null, null, IssueCodes.NoTableFound, IntakeMessages.NoTableInFile(HeaderDetection.SearchRows));
        }
        else
        {
            foreach (var sheet in notTables)
            {
                sink.Warning(file, sheet.Name, null, null, null, IssueCodes.SheetSkipped, IntakeMessages.SheetSkipped(HeaderDetection.SearchRows));
            }
        }

        foreach (var sheet in notTables)
        {
            run.Accounts.Add(new SourceAccount(file, sheet.Name, "not read", 0, 0, 0, 0, 0, 0));
        }
    }

    private static InputFile Hash(string display, string full)
    {
        using var stream = SourceFiles.OpenShared(full);
        byte[] hash = SHA256.HashData(stream);
        return new InputFile(display, Convert.ToHexStringLower(hash), stream.Length);
    }

    private static List<FermentationLog> JoinLogs(IntakeRun run)
    {
        var logs = new List<FermentationLog>();
        var index = new Dictionary<(string, int?), List<LogReading>>();
        // Finished and running lots alike (a run reads one kind or the other).
        var recorded = run.Lots.Select(l => (l.LotId, l.Season, l.Source)).Concat(run.RunningLots.Select(l => (l.LotId, l.Season, l.Source))).ToList();
        var knownIds = recorded.Select(l => l.LotId).ToHashSet(StringComparer.Ordinal);
        string? lastId = null;
        int? lastSeason = null;
        List<LogReading>? lastList = null;
        foreach (var (rawId, season, reading) in run.Readings)
        {
            // A log's readings mostly follow one another: the same lot and season as the reading before is its list.
            if (lastList is not null && season == lastSeason && string.Equals(rawId, lastId, StringComparison.Ordinal))
            {
                lastList.Add(reading);
                continue;
            }

            // A log sheet named "Lot 23-004" (or "Batch #7") is the log of lot 23-004 when no lot bears the full name.
            string lotId = rawId;
            if (!knownIds.Contains(rawId) && LotWordPrefix().Match(rawId) is { Success: true } m && knownIds.Contains(rawId[m.Length..]))
            {
                lotId = rawId[m.Length..];
            }

            if (!index.TryGetValue((lotId, season), out var list))
            {
                index[(lotId, season)] = list = [];
                logs.Add(new FermentationLog(lotId, season, list));
            }

            list.Add(reading);
            (lastId, lastSeason, lastList) = (rawId, season, list);
        }

        if (logs.Count == 0)
        {
            return logs;
        }

        var lotKeys = recorded.Select(l => (l.LotId, (int?)l.Season)).ToHashSet();
        var lotIds = knownIds;

        // Lots with a log, by lot id and season (what a lot's key is made of).
        var withLog = new HashSet<(string, int)>();
        ILookup<string, (string LotId, int Season, SourceRef? Source)>? lotsById = null;
        foreach (var log in logs)
        {
            bool matched = log.Season is null ? lotIds.Contains(log.LotId) : lotKeys.Contains((log.LotId, log.Season));
            var first = log.Readings[0].Source!;
            if (!matched)
            {
                run.Sink.Warning(first.File, first.Sheet, null, null, log.LotId, IssueCodes.LogWithoutLot,
                    IntakeMessages.LogWithoutLot(log.LotId, log.Season is { } s ? "season " + s.ToString(System.Globalization.CultureInfo.InvariantCulture) : "no season"));
                continue;
            }

            if (log.Season is { } season)
            {
                // Lot keys are unique, so this is the one lot of that id and season.
                withLog.Add((log.LotId, season));
                continue;
            }

            lotsById ??= recorded.ToLookup(l => l.LotId, StringComparer.Ordinal);
            foreach (var lot in lotsById[log.LotId])
            {
                withLog.Add((lot.LotId, lot.Season));
            }
        }

        foreach (var group in recorded.Where(l => !withLog.Contains((l.LotId, l.Season))).GroupBy(l => l.Season).OrderBy(g => g.Key))
        {
            var ids = group.Select(l => l.LotId).ToList();
            var src = group.First().Source!;
            run.Sink.Warning(src.File, src.Sheet, null, null, null, IssueCodes.LotsWithoutLog, IntakeMessages.LotsWithoutLog(ids.Count, group.Key, ids.Take(10).ToList()));
        }

        return logs;
    }

    [System.Text.RegularExpressions.GeneratedRegex(@"^(lot|batch)\s*(#|no\.?|nr\.?|number)?\s*[:#\-]?\s*", System.Text.RegularExpressions.RegexOptions.IgnoreCase | System.Text.RegularExpressions.RegexOptions.CultureInvariant)]
    private static partial System.Text.RegularExpressions.Regex LotWordPrefix();
}
