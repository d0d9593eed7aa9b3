using System.Collections.Concurrent;
using System.Net.WebSockets;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;

namespace YieldBench.Browser.Tests;

/// <summary>
/// A minimal client of the Chrome DevTools protocol over one page's web socket: send a command and await its result;
/// every event is kept in order so a test can wait for one or read them all.
/// </summary>
public sealed class DevTools : IAsyncDisposable
{
    private static readonly TimeSpan Patience = TimeSpan.FromSeconds(120);
    private readonly ClientWebSocket socket;
    private readonly ConcurrentDictionary<int, TaskCompletionSource<JsonElement>> pending = new();
    private readonly List<(string Method, JsonElement Params)> events = [];
    private readonly CancellationTokenSource stop = new();
    private readonly Task receiving;
    private int nextId;

    private DevTools(ClientWebSocket socket)
    {
        this.socket = socket;
        receiving = Task.Run(Receive);
    }

    /// <summary>Connects to a page's DevTools web socket.</summary>
    public static async Task<DevTools> Connect(Uri url)
    {
        var socket = new ClientWebSocket();
        socket.Options.KeepAliveInterval = TimeSpan.Zero;
        await socket.ConnectAsync(url, CancellationToken.None).WaitAsync(TimeSpan.FromSeconds(30));
        return new DevTools(socket);
    }

    /// <summary>Events received so far.</summary>
    public int EventCount
    {
        get
        {
            lock (events)
            {
                return events.Count;
            }
        }
    }

    /// <summary>The events received since <paramref name="from"/>.</summary>
    public IReadOnlyList<(string Method, JsonElement Params)> EventsSince(int from)
    {
        lock (events)
        {
            return events.Skip(from).ToArray();
        }
    }

    /// <summary>Sends a command and returns its result; a protocol error is thrown.</summary>
    public async Task<JsonElement> Send(string method, JsonObject? parameters = null)
    {
        int id = Interlocked.Increment(ref nextId);
        var done = new TaskCompletionSource<JsonElement>(TaskCreationOptions.RunContinuationsAsynchronously);
        pending[id] = done;
        var message = new JsonObject { ["id"] = id, ["method"] = method, ["params"] = parameters ?? new JsonObject() };
        byte[] bytes = Encoding.UTF8.GetBytes(message.ToJsonString());
        await socket.SendAsync(bytes, WebSocketMessageType.Text, endOfMessage: true, CancellationToken.None);
        try
        {
            return await done.Task.WaitAsync(Patience);
        }
        catch (TimeoutException)
        {
            throw new TimeoutException($"The browser did not answer {method} within {Patience.TotalSeconds} s.");
        }
    }

    /// <summary>Waits for an event of <paramref name="method"/> received at or after position <paramref name="from"/>.</summary>
    public async Task<JsonElement> WaitFor(string method, int from)
    {
        var deadline = DateTime.UtcNow + Patience;
        while (DateTime.UtcNow < deadline)
        {
            foreach (var (m, p) in EventsSince(from))
            {
                if (m == method)
                {
                    return p;
                }
            }

            if (receiving.IsCompleted)
            {
                throw new InvalidOperationException($"The browser closed the connection before {method}.");
            }

            await Task.Delay(25);
        }

        throw new TimeoutException($"No {method} within {Patience.TotalSeconds} s.");
    }

    /// <summary>Evaluates a script expression in the page and returns its value (JSON).</summary>
    public async Task<JsonElement> Evaluate(string expression)
    {
        var result = await Send("Runtime.evaluate", new JsonObject { ["expression"] = expression, ["returnByValue"] = true, ["awaitPromise"] = true });
        if (result.TryGetProperty("exceptionDetails", out var error))
        {
            throw new InvalidOperationException($"The page threw on '{expression}': {error}");
        }

        return result.GetProperty("result").TryGetProperty("value", out var value) ? value : default;
    }

    private async Task Receive()
    {
        var buffer = new byte[1 << 16];
        using var message = new MemoryStream();
        try
        {
            while (socket.State == WebSocketState.Open && !stop.IsCancellationRequested)
            {
                var r = await socket.ReceiveAsync(buffer, stop.Token);
                if (r.MessageType == WebSocketMessageType.Close)
                {
                    break;
                }

                message.Write(buffer, 0, r.Count);
                if (!r.EndOfMessage)
                {
                    continue;
                }

                using (var doc = JsonDocument.Parse(message.ToArray()))
                {
                    var root = doc.RootElement;
                    if (root.TryGetProperty("id", out var idElement) && pending.TryRemove(idElement.GetInt32(), out var done))
                    {
                        if (root.TryGetProperty("error", out var error))
                        {
                            done.TrySetException(new InvalidOperationException("DevTools error: " + error));
                        }
                        else
                        {
                            done.TrySetResult(root.GetProperty("result").Clone());
                        }
                    }
                    else if (root.TryGetProperty("method", out var method))
                    {
                        var p = root.TryGetProperty("params", out var ps) ? ps.Clone() : default;
                        lock (events)
                        {
                            events.Add((method.GetString()!, p));
                        }
                    }
                }

                message.SetLength(0);
            }
        }
        catch (OperationCanceledException)
        {
        }
        catch (WebSocketException)
        {
        }
        finally
        {
            foreach (var p in pending.Values)
            {
                p.TrySetException(new InvalidOperationException("The browser connection closed."));
            }
        }
    }

    public async ValueTask DisposeAsync()
    {
        stop.Cancel();
        try
        {
            if (socket.State == WebSocketState.Open)
            {
                await socket.CloseOutputAsync(WebSocketCloseStatus.NormalClosure, null, CancellationToken.None).WaitAsync(TimeSpan.FromSeconds(5));
            }
        }
        catch (Exception e) when (e is WebSocketException or TimeoutException or OperationCanceledException)
        {
        }

        try
        {
            await receiving.WaitAsync(TimeSpan.FromSeconds(5));
        }
        catch (TimeoutException)
        {
        }

        socket.Dispose();
        stop.Dispose();
    }
}
