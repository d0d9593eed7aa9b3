namespace YieldBench.Reports.Output;

/// <summary>
/// Writes a file so that a reader never sees half of it: the bytes go to a temporary file in the same folder, which is
/// then renamed over the target (a rename within one folder is atomic on the file systems we run on).
/// </summary>
public static class AtomicFile
{
    /// <summary>Writes <paramref name="bytes"/> to <paramref name="path"/>, creating its folder when missing.</summary>
    public static void WriteAllBytes(string path, byte[] bytes)
    {
        ArgumentNullException.ThrowIfNull(bytes);
        Write(path, stream => stream.Write(bytes));
    }

    /// <summary>Writes UTF-8 text (no byte-order mark) to <paramref name="path"/>.</summary>
    public static void WriteAllText(string path, string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        WriteAllBytes(path, new System.Text.UTF8Encoding(encoderShouldEmitUTF8Identifier: false).GetBytes(text));
    }

    /// <summary>Lets <paramref name="write"/> fill a temporary file, then renames it to <paramref name="path"/>.</summary>
    public static void Write(string path, Action<Stream> write)
    {
        ArgumentNullException.ThrowIfNull(write);
        string full = Path.GetFullPath(path);
        string folder = Path.GetDirectoryName(full) ?? throw new ArgumentException($"'{path}' has no folder.", nameof(path));
        Directory.CreateDirectory(folder);
        string temp = Path.Combine(folder, "." + Path.GetFileName(full) + "." + Guid.NewGuid().ToString("N") + ".tmp");
        try
        {
            using (var stream = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None))
            {
                write(stream);
                stream.Flush(flushToDisk: true);
            }

            File.Move(temp, full, overwrite: true);
        }
        finally
        {
            if (File.Exists(temp))
            {
                File.Delete(temp);
            }
        }
    }
}
