using System.Diagnostics;

namespace YieldBench.Bench;

/// <summary>
/// Samples the process's working set every few milliseconds on a background thread, so each stage can report the
/// highest resident memory seen while it ran (the OS keeps only one peak for the whole process).
/// </summary>
internal sealed class MemorySampler : IDisposable
{
    private readonly Thread _thread;
    private readonly Process _process = Process.GetCurrentProcess();
    private volatile bool _stop;
    private long _windowPeak;

    public MemorySampler()
    {
        _thread = new Thread(Loop) { IsBackground = true, Name = "memory sampler" };
        _thread.Start();
    }

    /// <summary>Starts a new window and returns the peak of the one that ended, bytes.</summary>
    public long TakeWindowPeak()
    {
        long now = Current();
        long peak = Math.Max(Interlocked.Exchange(ref _windowPeak, now), now);
        return peak;
    }

    public void Dispose()
    {
        _stop = true;
        _thread.Join();
        _process.Dispose();
    }

    private long Current()
    {
        _process.Refresh();
        return _process.WorkingSet64;
    }

    private void Loop()
    {
        while (!_stop)
        {
            long ws = Current();
            long seen;
            do
            {
                seen = Interlocked.Read(ref _windowPeak);
            }
            while (ws > seen && Interlocked.CompareExchange(ref _windowPeak, ws, seen) != seen);

            Thread.Sleep(5);
        }
    }
}
