using YieldBench.Reports.Workbook;

namespace YieldBench.Reports.Tests.Workbook;

public sealed class ChunkPipeTests
{
    /// <summary>Records each write it is given; can be told to fail at one.</summary>
    private sealed class RecordingStream(int failAt = -1) : MemoryStream
    {
        public List<int> Writes { get; } = [];

        public int WritingThread { get; private set; }

        public override void Write(byte[] buffer, int offset, int count)
        {
            WritingThread = Environment.CurrentManagedThreadId;
            if (Writes.Count == failAt)
            {
                throw new IOException("disk full (test)");
            }

            Writes.Add(count);
            base.Write(buffer, offset, count);
        }
    }

    private static byte[] Bytes(int n) => Enumerable.Range(0, n).Select(i => unchecked((byte)((i * 7) + (i / 251)))).ToArray();

    [Fact]
    public void Every_byte_arrives_in_order_in_chunks_of_the_fixed_size_on_another_thread()
    {
        // Given a pipe of 1,000-byte chunks and 10,500 bytes written in uneven pieces
        var target = new RecordingStream();
        byte[] data = Bytes(10_500);
        using (var pipe = new ChunkPipe(target, chunkSize: 1000, depth: 2))
        {
            int at = 0;
            foreach (int piece in new[] { 1, 999, 1500, 37, 4000, 2963, 1000 })
            {
                pipe.Write(data, at, piece);
                at += piece;
            }

            // When it is completed
            pipe.Complete();
        }

        // Then the target got the bytes unchanged, as ten full chunks and the rest, from a thread other than the writer's
        Assert.Equal(data, target.ToArray());
        Assert.Equal([1000, 1000, 1000, 1000, 1000, 1000, 1000, 1000, 1000, 1000, 500], target.Writes);
        Assert.NotEqual(Environment.CurrentManagedThreadId, target.WritingThread);
    }

    [Fact]
    public void A_failing_target_fails_the_writer_instead_of_hanging_it()
    {
        // Given a target that fails on its third write and a pipe that holds at most one waiting chunk
        var target = new RecordingStream(failAt: 2);
        using var pipe = new ChunkPipe(target, chunkSize: 100, depth: 1);

        // When far more is written than the pipe can hold
        var ex = Assert.Throws<IOException>(() =>
        {
            for (int i = 0; i < 1000; i++)
            {
                pipe.Write(Bytes(100));
            }

            pipe.Complete();
        });

        // Then the target's own failure reaches the writer, and the target saw only what came before it
        Assert.Equal("disk full (test)", ex.Message);
        Assert.Equal([100, 100], target.Writes);
    }

    [Fact]
    public void Disposing_without_completing_stops_the_other_thread()
    {
        // Given a pipe with a chunk written and one started
        var target = new RecordingStream();
        var pipe = new ChunkPipe(target, chunkSize: 10, depth: 4);
        pipe.Write(Bytes(15));

        // When it is disposed without Complete (the writer failed)
        pipe.Dispose();

        // Then it returns, the started chunk never reaches the target, and the pipe takes no more
        Assert.DoesNotContain(5, target.Writes);
        Assert.Throws<ObjectDisposedException>(() => pipe.Write(Bytes(1)));
    }
}
