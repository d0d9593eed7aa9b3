using System.CommandLine;
using System.Globalization;
using YieldBench.Intake;

namespace YieldBench.Cli.CommandLine;

/// <summary>
/// Checks of the command line made before any work, each giving one line for standard error (the command then exits
/// 2): inputs that do not exist or look like a misspelt option, a season that is no year, a mapping that names no
/// field, an output that cannot be written.
/// </summary>
internal static class UsageChecks
{
    /// <summary>The --season option every command that reads inputs shares: a year 1900–2100, checked while parsing.</summary>
    public static Option<int?> SeasonOption(string description)
    {
        var option = new Option<int?>("--season") { Description = description };
        option.CustomParser = result =>
        {
            string text = result.Tokens.Count > 0 ? result.Tokens[0].Value : "";
            if (int.TryParse(text, NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out int year) && year is >= 1900 and <= 2100)
            {
                return year;
            }

            result.AddError($"--season {text} is not a year between 1900 and 2100; give the vintage, e.g. --season 2024.");
            return null;
        };
        return option;
    }

    /// <summary>
    /// An option holding a decimal number, checked while parsing: written with a point, or with a decimal comma when no
    /// point is present (14,5), as plan reads its numbers. Anything else is one line naming the option and an example
    /// (the parser's own message named a .NET type, and read 14,5 as 145).
    /// </summary>
    public static Option<double?> DecimalOption(string name, string description, string example)
    {
        var option = new Option<double?>(name) { Description = description };
        option.CustomParser = result =>
        {
            string text = result.Tokens.Count > 0 ? result.Tokens[0].Value : "";
            if (TryDecimal(text, out double v))
            {
                return v;
            }

            result.AddError($"{name} {text} is not a number; write it like {name} {example} (a decimal comma is also read).");
            return null;
        };
        return option;
    }

    /// <summary>A decimal number written with a point, or with a decimal comma when no point is present (14,5).</summary>
    public static bool TryDecimal(string text, out double value)
    {
        string t = text.Trim();
        var comma = new NumberFormatInfo { NumberDecimalSeparator = "," };
        return (double.TryParse(t, NumberStyles.Float, CultureInfo.InvariantCulture, out value)
                || (!t.Contains('.', StringComparison.Ordinal) && double.TryParse(t, NumberStyles.Float, comma, out value)))
            && double.IsFinite(value);
    }

    /// <summary>The --seed option: a whole number, checked while parsing (one line naming the option, not a .NET type).</summary>
    public static Option<int?> SeedOption(string description)
    {
        var option = new Option<int?>("--seed") { Description = description };
        option.CustomParser = result =>
        {
            string text = result.Tokens.Count > 0 ? result.Tokens[0].Value : "";
            if (int.TryParse(text.Trim(), NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out int seed))
            {
                return seed;
            }

            result.AddError($"--seed {text} is not a whole number from {int.MinValue.ToString(CultureInfo.InvariantCulture)} to {int.MaxValue.ToString(CultureInfo.InvariantCulture)}; give one like --seed 7.");
            return null;
        };
        return option;
    }

    /// <summary>
    /// The first problem with the inputs, or null: a word starting with '-' that is no file (a misspelt option, which
    /// would otherwise be read as an input), or a path that is neither a file nor a folder.
    /// </summary>
    public static string? Inputs(string command, IEnumerable<string> inputs, string workingDirectory)
    {
        foreach (string input in inputs)
        {
            string full = Path.GetFullPath(input, workingDirectory);
            bool exists = File.Exists(full) || Directory.Exists(full);
            if (!exists && input.StartsWith('-'))
            {
                return $"{command}: '{Shown(input)}' is not an option of {command}; run 'yieldbench {command} --help' for the options.";
            }

            if (!exists)
            {
                return $"{command}: the input '{Shown(input)}' was not found; check the path (a file or a folder of .xlsx, .xls, .ods, .csv files).";
            }
        }

        return null;
    }

    /// <summary>The first --column that is not FIELD=HEADER with a known field, or null (the message lists every field).</summary>
    public static string? Columns(string command, IEnumerable<string> columns) =>
        columns.Select(ColumnMapping.Problem).FirstOrDefault(p => p is not null) is { } problem ? $"{command}: --column {problem}" : null;

    /// <summary>A --mapping file that does not exist, or null.</summary>
    public static string? MappingFile(string command, string? mapping, string workingDirectory) =>
        mapping is not null && !File.Exists(Path.GetFullPath(mapping, workingDirectory))
            ? $"{command}: the mapping file '{Shown(mapping)}' was not found; check the path given to --mapping."
            : null;

    /// <summary>
    /// Why a report folder cannot be written, or null: it is a file or a device (/dev/null), or neither it (when it
    /// exists) nor the nearest folder above it (when it does not) takes a new file — a read-only folder or file system.
    /// Checked by creating and at once deleting an empty file there.
    /// </summary>
    public static string? WritableFolder(string command, string full, string shown)
    {
        if (File.Exists(full))
        {
            return $"{command}: --out '{Shown(shown)}' is a file, not a folder; give a folder for the report.";
        }

        string? folder = full;
        while (folder is not null && !Directory.Exists(folder))
        {
            if (File.Exists(folder))
            {
                return $"{command}: --out '{Shown(shown)}' lies under '{Shown(folder)}', which is a file; give a folder for the report.";
            }

            folder = Path.GetDirectoryName(folder);
        }

        return folder is null || CanCreateIn(folder)
            ? null
            : $"{command}: cannot write in '{Shown(folder)}' (read-only, or no permission); give another --out.";
    }

    /// <summary>
    /// Why a file such as --issues-csv cannot be written, or null: it is a folder or a device, its folder is missing or
    /// read-only, it is one of the inputs, or it exists and is not a file of this tool (its first line differs from
    /// <paramref name="ownHeader"/>).
    /// </summary>
    public static string? WritableFile(string command, string option, string full, string shown, IEnumerable<string> inputFullPaths, string ownHeader)
    {
        if (Directory.Exists(full))
        {
            return $"{command}: {option} '{Shown(shown)}' is a folder; give a file name, e.g. {option} issues.csv.";
        }

        string real = Reports.Output.ReportFolder.RealPath(full);
        foreach (string input in inputFullPaths)
        {
            string inputReal = Reports.Output.ReportFolder.RealPath(input);
            if (string.Equals(real, inputReal, Reports.Output.ReportFolder.PathComparison))
            {
                return $"{command}: {option} '{Shown(shown)}' is one of the inputs; give another file name so no input is written over.";
            }
        }

        if (File.Exists(full))
        {
            if (SourceLength(full) == 0)
            {
                return $"{command}: {option} '{Shown(shown)}' is an empty file or not an ordinary one (a device such as /dev/null); give a new file name.";
            }

            if (!IsOwnFile(full, ownHeader))
            {
                return $"{command}: {option} '{Shown(shown)}' exists and was not written by this tool; give a new file name so nothing of yours is written over.";
            }
        }

        string? folder = Path.GetDirectoryName(full);
        if (folder is null || !Directory.Exists(folder))
        {
            return $"{command}: the folder of {option} '{Shown(shown)}' does not exist; create it first, or give a file in a folder that exists.";
        }

        return CanCreateIn(folder) ? null : $"{command}: cannot write in '{Shown(folder)}' (read-only, or no permission); give another {option}.";
    }

    /// <summary>A path as typed, with control characters written out so a terminal shows them instead of obeying them.</summary>
    public static string Shown(string text) => string.Concat(text.Select(c => char.IsControl(c) ? $"<U+{(int)c:X4}>" : c.ToString()));

    private static long SourceLength(string full)
    {
        var info = new FileInfo(full);
        return info.LinkTarget is not null && info.ResolveLinkTarget(true) is FileInfo target ? (target.Exists ? target.Length : 0) : info.Length;
    }

    private static bool IsOwnFile(string full, string ownHeader)
    {
        if (SourceLength(full) == 0)
        {
            return false;
        }

        try
        {
            using var reader = new StreamReader(full);
            var buffer = new char[ownHeader.Length + 1];
            int n = reader.ReadBlock(buffer, 0, buffer.Length);
            return new string(buffer, 0, n).TrimStart('\uFEFF').StartsWith(ownHeader, StringComparison.Ordinal);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            return false;
        }
    }

    private static bool CanCreateIn(string folder)
    {
        try
        {
            string probe = Path.Combine(folder, ".yieldbench-write-check-" + Guid.NewGuid().ToString("N"));
            using (File.Create(probe, 1, FileOptions.DeleteOnClose))
            {
            }

            return true;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            return false;
        }
    }
}
