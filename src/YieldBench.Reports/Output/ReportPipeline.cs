using System.Collections.Concurrent;
using YieldBench.Core.Review;

namespace YieldBench.Reports.Output;

/// <summary>What a report run wrote.</summary>
/// <param name="Folder">Output folder (full path, as the file system resolves it).</param>
/// <param name="Files">Files written, relative to <paramref name="Folder"/>, with '/' separators, sorted (the manifest among them).</param>
/// <param name="Removed">Files of an earlier run that this run no longer makes and removed, relative, sorted.</param>
public sealed record ReportOutput(string Folder, IReadOnlyList<string> Files, IReadOnlyList<string> Removed);

/// <summary>
/// Runs the parts of a report: asks each for its files, makes a staging folder beside the report folder, runs every
/// part's jobs on a few threads of its own, writes the manifest and swaps the staging folder in. Any failure leaves the
/// report folder as it was and removes the staging folder. The files and their bytes do not depend on which thread
/// finished first.
/// </summary>
public static class ReportPipeline
{
    /// <summary>Progress step in which the parts' files are written side by side.</summary>
    public const string WriteStep = "data files, charts and workbook";

    /// <summary>Progress step in which the finished report replaces the folder's contents.</summary>
    public const string SwapStep = "moving the new report into place";

    /// <summary>The files <paramref name="parts"/> write for <paramref name="review"/>, and the manifest, sorted.</summary>
    public static IReadOnlyList<string> Files(ReviewResult review, IReadOnlyList<IReportPart> parts)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(parts);
        var files = parts.SelectMany(p => p.Files(review)).Append(ReportFolder.ManifestName).ToArray();
        var twice = files.GroupBy(f => f, StringComparer.Ordinal).FirstOrDefault(g => g.Count() > 1);
        return twice is null
            ? files.Order(StringComparer.Ordinal).ToArray()
            : throw new InvalidOperationException($"Two parts of the report both write {twice.Key}.");
    }

    /// <summary>Writes the report of <paramref name="review"/> into <paramref name="folder"/>, part by part.</summary>
    /// <exception cref="ReportFolderException">The folder is not one a report may be written into; nothing was written.</exception>
    public static ReportOutput Write(ReviewResult review, string folder, IReadOnlyList<IReportPart> parts, IProgress<string>? progress = null)
    {
        ArgumentNullException.ThrowIfNull(review);
        ArgumentNullException.ThrowIfNull(folder);
        ArgumentNullException.ThrowIfNull(parts);
        var files = Files(review, parts);
        string target = ReportFolder.RealPath(folder);
        var staging = ReportFolder.Begin(target, files);
        try
        {
            progress?.Report(WriteStep);
            var context = new PartContext(review, staging.Folder, target, files.Where(f => f != ReportFolder.ManifestName));
            Run(parts.SelectMany(p => p.Jobs(context)).ToArray(), context);
            if (context.Missing() is { Count: > 0 } missing)
            {
                throw new InvalidOperationException("The report's parts did not write " + string.Join(", ", missing) + ".");
            }

            File.WriteAllText(Path.Combine(staging.Folder, ReportFolder.ManifestName), string.Join("\n", files.Where(f => f != ReportFolder.ManifestName).Prepend(ReportFolder.ManifestName)) + "\n");
            progress?.Report(SwapStep);
            var removed = ReportFolder.Commit(staging, files);
            var output = new ReportOutput(target, files, removed);
            foreach (var part in parts)
            {
                part.Written(review, output);
            }

            return output;
        }
        catch
        {
            ReportFolder.Abandon(staging);
            throw;
        }
    }

    /// <summary>
    /// Writes the files of a report that is not a review's (the forecast's) into <paramref name="folder"/> the same way:
    /// staging folder, jobs side by side, manifest, swap; the folder rules of <see cref="ReportFolder"/> apply.
    /// </summary>
    /// <param name="folder">The report folder.</param>
    /// <param name="files">The files the jobs write, relative with '/' separators (the manifest is added).</param>
    /// <param name="jobs">Makes the jobs that write those files into the context's staging folder.</param>
    /// <exception cref="ReportFolderException">The folder is not one a report may be written into; nothing was written.</exception>
    public static ReportOutput WriteFiles(string folder, IReadOnlyList<string> files, Func<OutputContext, IReadOnlyList<Action>> jobs)
    {
        ArgumentNullException.ThrowIfNull(folder);
        ArgumentNullException.ThrowIfNull(files);
        ArgumentNullException.ThrowIfNull(jobs);
        var all = files.Append(ReportFolder.ManifestName).Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal).ToArray();
        string target = ReportFolder.RealPath(folder);
        var staging = ReportFolder.Begin(target, all);
        try
        {
            var context = new OutputContext(staging.Folder, target, all.Where(f => f != ReportFolder.ManifestName));
            Run(jobs(context), context);
            if (context.Missing() is { Count: > 0 } missing)
            {
                throw new InvalidOperationException("The report's jobs did not write " + string.Join(", ", missing) + ".");
            }

            File.WriteAllText(Path.Combine(staging.Folder, ReportFolder.ManifestName), string.Join("\n", all.Where(f => f != ReportFolder.ManifestName).Prepend(ReportFolder.ManifestName)) + "\n");
            var removed = ReportFolder.Commit(staging, all);
            return new ReportOutput(target, all, removed);
        }
        catch
        {
            ReportFolder.Abandon(staging);
            throw;
        }
    }

    /// <summary>
    /// Runs the jobs on one thread more than there are cores (a job may wait for a file, or for the disk), each taking
    /// the next job in order; the first failure stops the rest and is rethrown as it was thrown.
    /// </summary>
    private static void Run(IReadOnlyList<Action> jobs, OutputContext context)
    {
        int workers = Math.Min(jobs.Count, Environment.ProcessorCount + 1);
        int next = -1;
        var errors = new ConcurrentQueue<Exception>();
        void Work()
        {
            int n;
            while (errors.IsEmpty && (n = Interlocked.Increment(ref next)) < jobs.Count)
            {
                try
                {
                    jobs[n]();
                }
                catch (Exception e)
                {
                    errors.Enqueue(e);

                    // A job waiting for a file this one would have written must not wait for ever.
                    context.Abandon(e);
                }
            }
        }

        var threads = Enumerable.Range(0, Math.Max(0, workers - 1)).Select(_ => new Thread(Work) { IsBackground = true, Name = "report part" }).ToArray();
        foreach (var thread in threads)
        {
            thread.Start();
        }

        Work();
        foreach (var thread in threads)
        {
            thread.Join();
        }

        if (errors.TryDequeue(out var first))
        {
            // The first failure is the cause; the others (files abandoned because of it) followed from it.
            System.Runtime.ExceptionServices.ExceptionDispatchInfo.Capture(first).Throw();
        }
    }
}
