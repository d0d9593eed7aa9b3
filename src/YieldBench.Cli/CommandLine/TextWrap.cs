namespace YieldBench.Cli.CommandLine;

/// <summary>Lines wrapped at word boundaries to fit a terminal of <see cref="Width"/> columns.</summary>
internal static class TextWrap
{
    /// <summary>The terminal width every line of the command fits in.</summary>
    public const int Width = 100;

    /// <summary>
    /// The line wrapped at spaces to <see cref="Width"/> columns; continuation lines are indented two columns deeper
    /// than the line's own indent. A single word longer than the width stays whole; a unit stays with its number.
    /// </summary>
    public static IEnumerable<string> Lines(string line)
    {
        if (line.Length <= Width)
        {
            yield return line;
            yield break;
        }

        int indent = line.Length - line.TrimStart(' ').Length;
        string rest = new(' ', indent + 2);
        var current = new System.Text.StringBuilder(line[..indent]);
        int start = current.Length;
        foreach (string word in Reports.ConsoleSummary.Words(line[indent..]))
        {
            if (current.Length > start && current.Length + 1 + word.Length > Width)
            {
                yield return current.ToString();
                current.Clear().Append(rest);
                start = current.Length;
            }

            current.Append(current.Length > start ? " " : "").Append(word);
        }

        yield return current.ToString();
    }

    /// <summary>Writes <paramref name="text"/> (one or more lines) wrapped.</summary>
    public static void WriteLine(TextWriter writer, string text)
    {
        foreach (string line in text.Split('\n'))
        {
            foreach (string part in Lines(line.TrimEnd('\r')))
            {
                writer.WriteLine(part);
            }
        }
    }
}
