using System.Collections.Concurrent;
using System.Runtime.CompilerServices;

namespace YieldBench.Reports.Workbook;

/// <summary>
/// A write-only stream that hands what is written to <see cref="Stream.Write(byte[], int, int)"/> of a target stream on
/// another thread, in chunks of a fixed size (the last one shorter), so that composing a large sheet and compressing it
/// overlap on two cores. The target sees the same writes, in the same order and with the same boundaries, however the
/// threads are scheduled, so its output (a zip entry's deflated bytes) does not depend on the timing.
/// </summary>
internal sealed class ChunkPipe : Stream
{
    private readonly BlockingCollection<(byte[] Chunk, int Length)> full;
    private readonly ConcurrentBag<byte[]> spare = [];
    private readonly CancellationTokenSource failed = new();
    private readonly Task consumer;
    private readonly int chunkSize;
    private byte[] current;
    private int length;
    private bool completed;

    /// <summary>Starts the thread that writes to <paramref name="target"/>.</summary>
    /// <param name="target">Where the bytes go; written from one other thread only, never from the caller's.</param>
    /// <param name="chunkSize">Bytes per write to the target.</param>
    /// <param name="depth">Chunks that may wait for the target before a write here waits too.</param>
    public ChunkPipe(Stream target, int chunkSize = 1 << 18, int depth = 8)
    {
        ArgumentNullException.ThrowIfNull(target);
        ArgumentOutOfRangeException.ThrowIfLessThan(chunkSize, 1);
        ArgumentOutOfRangeException.ThrowIfLessThan(depth, 1);
        this.chunkSize = chunkSize;
        full = new BlockingCollection<(byte[], int)>(depth);
        current = new byte[chunkSize];
        consumer = Task.Factory.StartNew(
            () =>
            {
                try
                {
                    foreach (var (chunk, n) in full.GetConsumingEnumerable(failed.Token))
                    {
                        target.Write(chunk, 0, n);
                        spare.Add(chunk);
                    }
                }
                catch
                {
                    failed.Cancel();
                    throw;
                }
            },
            CancellationToken.None,
            TaskCreationOptions.LongRunning,
            TaskScheduler.Default);
    }

    /// <inheritdoc/>
    public override bool CanRead => false;

    /// <inheritdoc/>
    public override bool CanSeek => false;

    /// <inheritdoc/>
    public override bool CanWrite => !completed;

    /// <inheritdoc/>
    public override long Length => throw new NotSupportedException();

    /// <inheritdoc/>
    public override long Position
    {
        get => throw new NotSupportedException();
        set => throw new NotSupportedException();
    }

    /// <inheritdoc/>
    public override void Write(byte[] buffer, int offset, int count) => Write(buffer.AsSpan(offset, count));

    /// <inheritdoc/>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public override void Write(ReadOnlySpan<byte> buffer)
    {
        ObjectDisposedException.ThrowIf(completed, this);
        while (!buffer.IsEmpty)
        {
            int n = Math.Min(buffer.Length, chunkSize - length);
            buffer[..n].CopyTo(current.AsSpan(length));
            length += n;
            buffer = buffer[n..];
            if (length == chunkSize)
            {
                Hand(current, length);
                current = spare.TryTake(out var reused) ? reused : new byte[chunkSize];
                length = 0;
            }
        }
    }

    /// <summary>Chunks are handed over as they fill; the last, short one only by <see cref="Complete"/>.</summary>
    public override void Flush()
    {
    }

    /// <summary>Hands over the last chunk and waits until the target has every byte; rethrows the target's failure.</summary>
    public void Complete()
    {
        if (completed)
        {
            return;
        }

        if (length > 0)
        {
            Hand(current, length);
            length = 0;
        }

        completed = true;
        full.CompleteAdding();
        consumer.GetAwaiter().GetResult();
    }

    /// <inheritdoc/>
    public override int Read(byte[] buffer, int offset, int count) => throw new NotSupportedException();

    /// <inheritdoc/>
    public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();

    /// <inheritdoc/>
    public override void SetLength(long value) => throw new NotSupportedException();

    /// <summary>Without <see cref="Complete"/> (the writer failed), stops the other thread and drops what is left.</summary>
    protected override void Dispose(bool disposing)
    {
        if (disposing)
        {
            if (!completed)
            {
                completed = true;
                full.CompleteAdding();
                failed.Cancel();
                try
                {
                    consumer.Wait();
                }
                catch (AggregateException)
                {
                    // The writer's own exception is the one that matters; this one followed from it.
                }
            }

            full.Dispose();
            failed.Dispose();
        }

        base.Dispose(disposing);
    }

    private void Hand(byte[] chunk, int n)
    {
        try
        {
            full.Add((chunk, n), failed.Token);
        }
        catch (OperationCanceledException)
        {
            // The target failed: its exception explains why.
            consumer.GetAwaiter().GetResult();
            throw;
        }
    }
}
