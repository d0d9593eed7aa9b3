using System.Collections;

namespace YieldBench.Intake;

/// <summary>
/// An append-only list kept in fixed chunks: growing it never copies what it holds, and no chunk is large enough
/// for the large-object heap (a million log readings would otherwise be copied at every doubling).
/// </summary>
internal sealed class ChunkedList<T> : IEnumerable<T>
{
    private const int ChunkSize = 2048;

    private readonly List<T[]> _chunks = [];
    private int _last = ChunkSize;

    public int Count { get; private set; }

    public void Add(T item)
    {
        if (_last == ChunkSize)
        {
            _chunks.Add(new T[ChunkSize]);
            _last = 0;
        }

        _chunks[^1][_last++] = item;
        Count++;
    }

    public IEnumerator<T> GetEnumerator()
    {
        for (int c = 0; c < _chunks.Count; c++)
        {
            var chunk = _chunks[c];
            int n = c == _chunks.Count - 1 ? _last : ChunkSize;
            for (int i = 0; i < n; i++)
            {
                yield return chunk[i];
            }
        }
    }

    IEnumerator IEnumerable.GetEnumerator() => GetEnumerator();
}
