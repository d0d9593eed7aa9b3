using System.CommandLine;
using System.CommandLine.Parsing;

namespace YieldBench.Cli.CommandLine;

/// <summary>
/// A misspelt command or option answered with the nearest name ("did you mean 'review'?"), said before any work:
/// a word the parser did not take, or a word starting with '-' taken as an input that no file bears.
/// </summary>
internal static class Suggestions
{
    /// <summary>The usage line for the first misspelt word with a near name, or null.</summary>
    public static string? Misspelt(ParseResult parse, string workingDirectory)
    {
        var command = parse.CommandResult.Command;
        bool atRoot = command is RootCommand;
        var words = parse.UnmatchedTokens.Concat(parse.CommandResult.Tokens
            .Where(t => t.Type == TokenType.Argument && t.Value.StartsWith('-') && !Exists(t.Value, workingDirectory))
            .Select(t => t.Value));
        foreach (string word in words)
        {
            bool option = word.StartsWith('-');
            string key = option ? word.Split('=')[0] : word;
            var names = option
                ? command.Options.SelectMany(o => o.Aliases.Prepend(o.Name))
                : atRoot ? command.Subcommands.Select(c => c.Name) : [];
            if (Nearest(key, names) is not { } near)
            {
                continue;
            }

            string who = atRoot ? "yieldbench" : command.Name;
            string what = option ? $"an option of {who}" : "a command";
            string help = atRoot ? "yieldbench --help" : $"yieldbench {command.Name} --help";
            return $"{who}: '{UsageChecks.Shown(key)}' is not {what}; did you mean '{near}'? Run '{help}' for usage.";
        }

        return null;
    }

    /// <summary>The name nearest to <paramref name="word"/> within two edits (and fewer than half its letters), or null.</summary>
    public static string? Nearest(string word, IEnumerable<string> names)
    {
        string? best = null;
        int bestDistance = int.MaxValue;
        foreach (string name in names.Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal))
        {
            int d = Distance(word.ToLowerInvariant(), name.ToLowerInvariant());
            if (d < bestDistance)
            {
                (best, bestDistance) = (name, d);
            }
        }

        return best is not null && bestDistance > 0 && bestDistance <= 2 && bestDistance * 2 < word.TrimStart('-').Length ? best : null;
    }

    /// <summary>The Levenshtein distance: insertions, deletions and substitutions.</summary>
    public static int Distance(string a, string b)
    {
        var previous = new int[b.Length + 1];
        var current = new int[b.Length + 1];
        for (int j = 0; j <= b.Length; j++)
        {
            previous[j] = j;
        }

        for (int i = 1; i <= a.Length; i++)
        {
            current[0] = i;
            for (int j = 1; j <= b.Length; j++)
            {
                int substitution = previous[j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1);
                current[j] = Math.Min(substitution, Math.Min(previous[j] + 1, current[j - 1] + 1));
            }

            (previous, current) = (current, previous);
        }

        return previous[b.Length];
    }

    private static bool Exists(string path, string workingDirectory)
    {
        try
        {
            string full = Path.GetFullPath(path, workingDirectory);
            return File.Exists(full) || Directory.Exists(full);
        }
        catch (ArgumentException)
        {
            return false;
        }
    }
}
