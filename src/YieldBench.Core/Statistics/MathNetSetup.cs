namespace YieldBench.Core.Statistics;

/// <summary>
/// MathNet.Numerics splits even small vector and matrix operations across threads (its <c>Control</c> settings).
/// The fits here are small (a sigmoid on a few dozen readings, least squares on a handful of columns) and the review
/// already runs whole lots and candidates side by side, so MathNet's own threads only add hand-over cost: at 100,000
/// lots the kinetics fits spent more time waiting on MathNet's parallel loops than computing. The library therefore
/// sets MathNet's <c>Control.MaxDegreeOfParallelism</c> to 1 on first use of a fit. This is process-wide; a host that
/// wants MathNet's parallelism for its own large problems can set it back after a review.
/// </summary>
internal static class MathNetSetup
{
    private static int done;

    /// <summary>Makes MathNet run single-threaded (once per process).</summary>
    public static void SingleThreaded()
    {
        if (Interlocked.Exchange(ref done, 1) == 0)
        {
            MathNet.Numerics.Control.MaxDegreeOfParallelism = 1;
        }
    }
}
