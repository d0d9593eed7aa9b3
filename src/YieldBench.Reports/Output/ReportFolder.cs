namespace YieldBench.Reports.Output;

/// <summary>A report folder that cannot be written safely: the message says why and what to do instead.</summary>
public sealed class ReportFolderException(string message) : Exception(message);

/// <summary>
/// The report folder, whole or untouched: the report is written into a staging folder beside it and swapped in at the
/// end, so a failure or a kill leaves the previous report as it was. Paths are compared as the file system sees them
/// (symbolic links resolved; without regard to case where the file system ignores it). A folder is written only when it
/// is new, empty, or holds a manifest of ours; an input is never written over.
/// </summary>
public static class ReportFolder
{
    /// <summary>The manifest listing this tool's files in a report folder.</summary>
    public const string ManifestName = "yieldbench-files.txt";

    private const string StagingTag = ".yieldbench-staging-";
    private const string PreviousTag = ".yieldbench-previous-";
    private const string LockTag = ".yieldbench-lock";

    /// <summary>How paths are compared on this platform's usual file systems.</summary>
    public static StringComparison PathComparison { get; } =
        OperatingSystem.IsWindows() || OperatingSystem.IsMacOS() ? StringComparison.OrdinalIgnoreCase : StringComparison.Ordinal;

    /// <summary>
    /// Why <paramref name="folder"/> cannot take a report of <paramref name="inputs"/> (input files or folders), or null
    /// when it can: it is an input or holds one (also through a symbolic link), it is a file, or it holds files this tool
    /// did not write (no manifest of ours).
    /// </summary>
    public static string? Problem(string folder, IEnumerable<string> inputs)
    {
        ArgumentNullException.ThrowIfNull(folder);
        ArgumentNullException.ThrowIfNull(inputs);
        string target = RealPath(folder);
        string withSep = Path.TrimEndingDirectorySeparator(target) + Path.DirectorySeparatorChar;
        foreach (string input in inputs)
        {
            string real = RealPath(input);
            if (string.Equals(Path.TrimEndingDirectorySeparator(real), Path.TrimEndingDirectorySeparator(target), PathComparison))
            {
                return $"The output folder {folder} is also an input ({input}); choose another --out so no input can be written over.";
            }

            if (real.StartsWith(withSep, PathComparison))
            {
                return $"The output folder {folder} contains the input {input}; choose another --out so no input can be written over.";
            }
        }

        if (File.Exists(target))
        {
            return $"The output {folder} is a file, not a folder; give a folder for the report with --out.";
        }

        if (Directory.Exists(target) && !File.Exists(Path.Combine(target, ManifestName)) && Directory.EnumerateFileSystemEntries(target).Any())
        {
            return $"The folder {folder} holds files this tool did not write (it has no {ManifestName}); give a new or empty folder with --out so nothing of yours is written over.";
        }

        return null;
    }

    /// <summary>
    /// The full path as the file system resolves it: every symbolic link along it followed; for a path that does not
    /// exist yet, its nearest existing parent resolved and the rest appended.
    /// </summary>
    public static string RealPath(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        string full = Path.TrimEndingDirectorySeparator(Path.GetFullPath(path));
        string? parent = Path.GetDirectoryName(full);
        if (parent is null)
        {
            return full;
        }

        string resolved = Path.Combine(RealPath(parent), Path.GetFileName(full));
        FileSystemInfo info = Directory.Exists(resolved) ? new DirectoryInfo(resolved) : new FileInfo(resolved);
        return info.Exists && info.LinkTarget is not null && info.ResolveLinkTarget(returnFinalTarget: true) is { } target
            ? RealPath(target.FullName)
            : resolved;
    }

    /// <summary>The files an earlier run listed in the folder's manifest: plain relative paths inside it only.</summary>
    public static IReadOnlyList<string> ReadManifest(string folder)
    {
        string path = Path.Combine(Path.GetFullPath(folder), ManifestName);
        if (!File.Exists(path))
        {
            return [];
        }

        return File.ReadAllLines(path)
            .Select(l => l.Trim())
            .Where(l => l.Length > 0 && l != ManifestName && !l.Contains("..", StringComparison.Ordinal) && !Path.IsPathRooted(l))
            .ToArray();
    }

    /// <summary>
    /// Starts a report in <paramref name="target"/> (a real path): puts back a previous report a killed swap left under
    /// its hidden name, removes stale staging folders, refuses a folder that is not ours or a planned file that would
    /// write over one of the user's, and makes an empty staging folder beside it.
    /// </summary>
    internal static Staging Begin(string target, IReadOnlyList<string> planned)
    {
        string parent = Path.GetDirectoryName(target) ?? throw new ReportFolderException($"The output {target} has no parent folder.");
        Directory.CreateDirectory(parent);
        string name = Path.GetFileName(target);
        var held = Lock(parent, name, target);
        try
        {
            return Prepare(target, planned, parent, name, held);
        }
        catch
        {
            held.Dispose();
            throw;
        }
    }

    /// <summary>
    /// Takes the report folder's lock, a hidden file beside it held (exclusively) until the report is swapped in or
    /// abandoned, and gone afterwards: a second run writing the same folder at the same time is refused instead of
    /// clearing the first one's staging folder as stale. The system releases it when a run is killed.
    /// </summary>
    private static FileStream Lock(string parent, string name, string target)
    {
        string path = Path.Combine(parent, "." + name + LockTag);
        try
        {
            return new FileStream(path, FileMode.OpenOrCreate, FileAccess.ReadWrite, FileShare.None, 1, FileOptions.DeleteOnClose);
        }
        catch (IOException)
        {
            throw new ReportFolderException($"Another run is writing a report into {target} now; wait for it to finish, or give another --out.");
        }
    }

    private static Staging Prepare(string target, IReadOnlyList<string> planned, string parent, string name, FileStream held)
    {
        Recover(parent, name, target);
        if (Problem(target, []) is { } problem)
        {
            throw new ReportFolderException(problem);
        }

        var previous = ReadManifest(target);
        if (Directory.Exists(target))
        {
            var ours = previous.Append(ManifestName).ToHashSet(StringComparer.Ordinal);
            if (planned.FirstOrDefault(f => !ours.Contains(f) && (File.Exists(Full(target, f)) || Directory.Exists(Full(target, f)))) is { } clash)
            {
                throw new ReportFolderException($"The folder {target} holds {clash}, which this tool did not write; move it away or choose another --out.");
            }
        }

        string staging = Path.Combine(parent, "." + name + StagingTag + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(staging);
        return new Staging(target, staging, previous, held);
    }

    /// <summary>
    /// Swaps the finished staging folder in: the user's own files in the old folder are copied across, the old folder
    /// is renamed aside, the staging folder takes its name, and the old one is deleted. Returns the files of an earlier
    /// run that this run no longer makes.
    /// </summary>
    internal static IReadOnlyList<string> Commit(Staging staging, IReadOnlyList<string> written)
    {
        try
        {
            return Swap(staging, written);
        }
        finally
        {
            staging.Lock.Dispose();
        }
    }

    private static IReadOnlyList<string> Swap(Staging staging, IReadOnlyList<string> written)
    {
        string target = staging.Target;
        var removed = staging.Previous.Except(written, StringComparer.Ordinal).Where(f => File.Exists(Full(target, f))).Order(StringComparer.Ordinal).ToArray();
        if (!Directory.Exists(target))
        {
            Directory.Move(staging.Folder, target);
            return removed;
        }

        var ours = staging.Previous.Append(ManifestName).ToHashSet(StringComparer.Ordinal);
        CopyOthers(target, staging.Folder, string.Empty, ours);
        string parent = Path.GetDirectoryName(target)!;
        string aside = Path.Combine(parent, "." + Path.GetFileName(target) + PreviousTag + Guid.NewGuid().ToString("N"));
        Directory.Move(target, aside);
        Directory.Move(staging.Folder, target);
        Directory.Delete(aside, recursive: true);
        return removed;
    }

    /// <summary>Removes a staging folder after a failure (the report folder is untouched).</summary>
    internal static void Abandon(Staging staging)
    {
        try
        {
            if (Directory.Exists(staging.Folder))
            {
                Directory.Delete(staging.Folder, recursive: true);
            }
        }
        catch (IOException)
        {
            // The next run removes it as stale.
        }
        catch (UnauthorizedAccessException)
        {
        }
        finally
        {
            staging.Lock.Dispose();
        }
    }

    /// <summary>
    /// After a kill: a previous report renamed aside while the report folder is missing is put back; every other
    /// staging or set-aside folder of this report folder is removed.
    /// </summary>
    private static void Recover(string parent, string name, string target)
    {
        string prefix = "." + name;
        var leftovers = Directory.EnumerateDirectories(parent, prefix + ".yieldbench-*")
            .Where(d => Path.GetFileName(d) is { } n && (n.StartsWith(prefix + StagingTag, StringComparison.Ordinal) || n.StartsWith(prefix + PreviousTag, StringComparison.Ordinal)))
            .Order(StringComparer.Ordinal)
            .ToList();
        if (!Directory.Exists(target) && leftovers.FirstOrDefault(d => Path.GetFileName(d).StartsWith(prefix + PreviousTag, StringComparison.Ordinal)) is { } aside)
        {
            Directory.Move(aside, target);
            leftovers.Remove(aside);
        }

        foreach (string stale in leftovers)
        {
            Directory.Delete(stale, recursive: true);
        }
    }

    // Copies what is not ours from the old folder into the new one (symbolic links as links), so the swap keeps it.
    private static void CopyOthers(string from, string to, string relative, HashSet<string> ours)
    {
        foreach (string entry in Directory.EnumerateFileSystemEntries(Path.Combine(from, relative)))
        {
            string rel = relative.Length == 0 ? Path.GetFileName(entry) : relative + "/" + Path.GetFileName(entry);
            string dest = Full(to, rel);
            var info = new FileInfo(entry);
            if (info.LinkTarget is { } link)
            {
                if (!ours.Contains(rel) && !Path.Exists(dest))
                {
                    File.CreateSymbolicLink(dest, link);
                }
            }
            else if (Directory.Exists(entry))
            {
                Directory.CreateDirectory(dest);
                CopyOthers(from, to, rel, ours);
            }
            else if (!ours.Contains(rel) && !File.Exists(dest))
            {
                File.Copy(entry, dest);
            }
        }
    }

    private static string Full(string root, string relative) => Path.Combine(root, relative.Replace('/', Path.DirectorySeparatorChar));

    /// <summary>A report being written: the real target, its staging folder, the files an earlier run listed, and the folder's lock (released by <see cref="Commit"/> or <see cref="Abandon"/>).</summary>
    internal sealed record Staging(string Target, string Folder, IReadOnlyList<string> Previous, FileStream Lock);
}
