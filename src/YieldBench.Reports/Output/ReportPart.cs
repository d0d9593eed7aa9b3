using System.Collections.Concurrent;
using YieldBench.Core.Review;
using YieldBench.Reports.Tables;

namespace YieldBench.Reports.Output;

/// <summary>
/// One output of a report (the data files, the charts, the workbook, the console summary): it declares the files it
/// writes and gives the jobs that write them. <see cref="ReportPipeline"/> runs every part's jobs, owns the threads,
/// the file list, the staging folder and the swap; adding an output format means adding a part.
/// </summary>
public interface IReportPart
{
    /// <summary>Plain name, as progress reports it.</summary>
    string Name { get; }

    /// <summary>The files the part writes for <paramref name="review"/>, relative to the report folder with '/' separators.</summary>
    IReadOnlyList<string> Files(ReviewResult review);

    /// <summary>
    /// The jobs that write the part's files into <see cref="PartContext.Root"/>; jobs of all parts run side by side, in
    /// any order, each writing only its own files. A job may wait for another part's file (<see cref="PartContext.Read"/>).
    /// </summary>
    IReadOnlyList<Action> Jobs(PartContext context);

    /// <summary>Told what was written once the report is in place (the console summary prints then); does nothing by default.</summary>
    void Written(ReviewResult review, ReportOutput output)
    {
    }
}

/// <summary>
/// What output jobs write with: the staging folder and the files planned, each marked when written so that a job may
/// wait for another's file. A review's parts get a <see cref="PartContext"/>; other reports (the forecast) this.
/// </summary>
public class OutputContext
{
    private readonly ConcurrentDictionary<string, TaskCompletionSource> files = new(StringComparer.Ordinal);

    internal OutputContext(string root, string folder, IEnumerable<string> planned)
    {
        Root = root;
        Folder = folder;
        foreach (string file in planned)
        {
            files[file] = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        }
    }

    /// <summary>The folder the jobs write into (the staging folder: the report folder's contents once it is swapped in).</summary>
    public string Root { get; }

    /// <summary>The report folder the files end up in (full path), for parts that name it.</summary>
    public string Folder { get; }

    /// <summary>Full path in <see cref="Root"/> of a relative file name.</summary>
    public string PathOf(string relative) => Path.Combine(Root, relative.Replace('/', Path.DirectorySeparatorChar));

    /// <summary>Writes a planned file (its folder is made) and marks it written, so parts waiting for it go on.</summary>
    public void Write(string relative, Action<Stream> write)
    {
        ArgumentNullException.ThrowIfNull(write);
        var done = Planned(relative);
        string path = PathOf(relative);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        using (var stream = new FileStream(path, FileMode.CreateNew, FileAccess.ReadWrite, FileShare.None))
        {
            write(stream);
            stream.Flush(flushToDisk: true);
        }

        done.TrySetResult();
    }

    /// <summary>The bytes of a planned file once its part has written it (waits for it; throws when its part failed).</summary>
    public byte[] Read(string relative)
    {
        Planned(relative).Task.GetAwaiter().GetResult();
        return File.ReadAllBytes(PathOf(relative));
    }

    /// <summary>Marks every planned file not yet written as failed, so no job waits for it for ever.</summary>
    internal void Abandon(Exception reason)
    {
        foreach (var file in files.Values)
        {
            file.TrySetException(reason);
        }
    }

    /// <summary>The planned files not written.</summary>
    internal IReadOnlyList<string> Missing() => files.Where(f => !f.Value.Task.IsCompletedSuccessfully).Select(f => f.Key).Order(StringComparer.Ordinal).ToArray();

    private TaskCompletionSource Planned(string relative) =>
        files.TryGetValue(relative, out var done)
            ? done
            : throw new InvalidOperationException($"'{relative}' is not among the files the report's parts declared.");
}

/// <summary>What a part's jobs write with: the staging folder, the review, the tables parts share, and the files written so far.</summary>
public sealed class PartContext : OutputContext
{
    private readonly Lazy<SharedTables> tables;

    internal PartContext(ReviewResult review, string root, string folder, IEnumerable<string> planned)
        : base(root, folder, planned)
    {
        Review = review;
        tables = new(() => new SharedTables(review), LazyThreadSafetyMode.ExecutionAndPublication);
    }

    /// <summary>The review being written.</summary>
    public ReviewResult Review { get; }

    /// <summary>The long per-lot tables a data file and a sheet both show, built once.</summary>
    internal SharedTables Tables => tables.Value;
}
