using System.Text.RegularExpressions;
using YieldBench.Core.Kinetics;

namespace YieldBench.Core.Tests.Kinetics;

public partial class KineticsCodesTests
{
    private static string RepoRoot()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "YieldBench.sln")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName ?? throw new DirectoryNotFoundException("YieldBench.sln not found above the test folder");
    }

    private static string CodesTable()
    {
        string docs = File.ReadAllText(Path.Combine(RepoRoot(), "docs", "methods.md"));
        int start = docs.IndexOf("### Kinetics codes", StringComparison.Ordinal);
        Assert.True(start >= 0, "docs/methods.md has no 'Kinetics codes' section");
        int end = docs.IndexOf("###", start + 3, StringComparison.Ordinal);
        return docs[start..end];
    }

    [Fact]
    public void Every_kinetics_code_is_explained_in_the_methods_and_nothing_else_is_listed()
    {
        // Given the codes the analysis declares and the rows of the methods' table of kinetics codes
        string table = CodesTable();
        var listed = DocRow().Matches(table).Select(m => m.Groups[1].Value).ToArray();

        // Then the two are the same codes in the same order, and each flag is marked a flag
        Assert.Equal(KineticsCodes.All, listed);
        Assert.All(KineticsCodes.Flags, c => Assert.Contains($"| `{c}` | flag |", table, StringComparison.Ordinal));
        Assert.Equal(KineticsCodes.Flags, KineticsAnalysis.FlagOrder);
    }

    [Fact]
    public void The_kinetics_code_writes_codes_only_through_the_constants()
    {
        // Given the kinetics sources other than the code list itself
        string root = Path.Combine(RepoRoot(), "src", "YieldBench.Core", "Kinetics");
        var literals = Directory.EnumerateFiles(root, "*.cs", SearchOption.AllDirectories)
            .Where(f => Path.GetFileName(f) != "KineticsCodes.cs")
            .SelectMany(f => CodeLiteral().Matches(File.ReadAllText(f)).Select(m => m.Groups[1].Value))
            .Where(c => KineticsCodes.All.Contains(c))
            .Distinct()
            .ToArray();

        // Then none is written as a bare string
        Assert.Empty(literals);
    }

    [GeneratedRegex("\"([a-z]+(?:-[a-z]+)*)\"")]
    private static partial Regex CodeLiteral();

    [GeneratedRegex(@"^\| `([a-z]+(?:-[a-z]+)*)` \|", RegexOptions.Multiline)]
    private static partial Regex DocRow();
}
