using YieldBench.Core.Lots;
using YieldBench.Intake;

namespace YieldBench.Fuzz;

/// <summary>
/// The fuzz target: an input's first byte picks the file type (.csv, .xlsx, .xls, .ods, .tsv, .txt), the rest is the
/// file. It is read by intake as a user's file would be, and the check report is written; any exception, and any
/// account that does not balance, is a crash for afl-fuzz (intake must report bad input, never throw).
/// </summary>
public static class Target
{
    /// <summary>The file types an input's first byte chooses between.</summary>
    public static readonly string[] Extensions = [".csv", ".xlsx", ".xls", ".ods", ".tsv", ".txt"];

    private static readonly string Folder = Path.Combine(Path.GetTempPath(), "yieldbench-fuzz-" + Environment.ProcessId.ToString(System.Globalization.CultureInfo.InvariantCulture));

    /// <summary>Reads one input; throws when intake breaks a promise.</summary>
    public static SeasonSet Read(Stream input)
    {
        ArgumentNullException.ThrowIfNull(input);
        using var buffer = new MemoryStream();
        input.CopyTo(buffer);
        byte[] bytes = buffer.ToArray();
        if (bytes.Length == 0)
        {
            return IntakeReader.Read([], new IntakeOptions());
        }

        Directory.CreateDirectory(Folder);
        string name = "input" + Extensions[bytes[0] % Extensions.Length];
        string path = Path.Combine(Folder, name);
        File.WriteAllBytes(path, bytes[1..]);
        var set = IntakeReader.Read([name], new IntakeOptions { WorkingDirectory = Folder, MaxRows = 100_000, Season = 2024 });
        IntakeReport.WriteText(set, TextWriter.Null);
        foreach (var account in set.Accounts)
        {
            if (!account.Balances)
            {
                throw new InvalidOperationException($"{account.File} [{account.Sheet}] does not balance: {account}");
            }
        }

        return set;
    }

    /// <summary>One line on what an input gave.</summary>
    public static string Describe(SeasonSet set) =>
        $"{set.Lots.Count} lots, {set.Logs.Count} logs, issues: {string.Join(' ', set.Issues.Select(i => i.Code).Distinct())}";

    /// <summary>Writes a sample file as a fuzz input: its type's byte, then its bytes.</summary>
    public static void WriteSeed(string file, string outFolder)
    {
        int type = Array.IndexOf(Extensions, Path.GetExtension(file).ToLowerInvariant());
        if (type < 0)
        {
            return;
        }

        Directory.CreateDirectory(outFolder);
        byte[] bytes = File.ReadAllBytes(file);
        File.WriteAllBytes(Path.Combine(outFolder, Path.GetFileName(file) + ".seed"), [(byte)type, .. bytes]);
    }
}
