using System.Diagnostics;

namespace YieldBench.Bench;

/// <summary>One stage's measurements.</summary>
/// <param name="Name">Stage name (as the library's progress reports it).</param>
/// <param name="Seconds">Wall time, s.</param>
/// <param name="PeakWorkingSetBytes">Highest working set seen during the stage, bytes.</param>
/// <param name="AllocatedBytes">Bytes allocated on the managed heap during the stage.</param>
/// <param name="CpuSeconds">Processor time of the whole process during the stage (all threads), s; less sensitive than wall time to other load on the machine.</param>
internal sealed record StageTiming(string Name, double Seconds, long PeakWorkingSetBytes, long AllocatedBytes, double CpuSeconds);

/// <summary>
/// Splits a run into stages at the moments the library reports a new stage name (its progress callback), so the
/// benchmark times the real entry points without reaching into their insides. Reports arrive synchronously.
/// </summary>
internal sealed class StageClock : IProgress<string>, IDisposable
{
    private readonly MemorySampler _memory = new();
    private readonly Stopwatch _watch = new();
    private readonly List<StageTiming> _stages = [];
    private string? _current;
    private long _allocatedAtStart;
    private TimeSpan _cpuAtStart;

    /// <summary>Told each stage as it ends (the child prints it, so a run stopped for time still reports its finished stages).</summary>
    public Action<StageTiming>? Finished { get; init; }

    public IReadOnlyList<StageTiming> Stages => _stages;

    /// <summary>The stage running now, or null.</summary>
    public string? Current => _current;

    public void Report(string value) => Start(value);

    /// <summary>Ends the running stage (if any) and starts <paramref name="name"/>.</summary>
    public void Start(string name)
    {
        Stop();
        _current = name;
        _allocatedAtStart = GC.GetTotalAllocatedBytes(false);
        _memory.TakeWindowPeak();
        _cpuAtStart = Cpu();
        _watch.Restart();
    }

    /// <summary>Ends the running stage.</summary>
    public void Stop()
    {
        if (_current is null)
        {
            return;
        }

        _watch.Stop();
        long peak = _memory.TakeWindowPeak();
        var timing = new StageTiming(_current, _watch.Elapsed.TotalSeconds, peak, GC.GetTotalAllocatedBytes(false) - _allocatedAtStart, (Cpu() - _cpuAtStart).TotalSeconds);
        _stages.Add(timing);
        Finished?.Invoke(timing);
        _current = null;
    }

    public void Dispose() => _memory.Dispose();

    private static TimeSpan Cpu()
    {
        using var p = Process.GetCurrentProcess();
        return p.TotalProcessorTime;
    }
}
