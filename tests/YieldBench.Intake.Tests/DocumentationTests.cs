using System.Text.RegularExpressions;

namespace YieldBench.Intake.Tests;

public partial class DocumentationTests
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

    [Fact]
    public void Every_issue_code_intake_can_raise_is_explained_in_the_input_format_docs()
    {
        // Given the codes written in the intake sources
        string root = RepoRoot();
        var codes = Directory.EnumerateFiles(Path.Combine(root, "src", "YieldBench.Intake"), "*.cs")
            .SelectMany(f => CodeLiteral().Matches(File.ReadAllText(f)).Select(m => m.Groups[1].Value))
            .Where(c => !c.StartsWith("yyyy", StringComparison.Ordinal))
            .Distinct()
            .Order(StringComparer.Ordinal)
            .ToList();
        string docs = File.ReadAllText(Path.Combine(root, "docs", "input-format.md"));

        // Then each has a row in the docs' table of issue codes
        Assert.True(codes.Count >= 40, $"only {codes.Count} codes found");
        Assert.All(codes, c => Assert.Contains($"| `{c}` |", docs, StringComparison.Ordinal));
    }

    [Fact]
    public void Every_field_is_documented_with_its_canonical_name()
    {
        string docs = File.ReadAllText(Path.Combine(RepoRoot(), "docs", "input-format.md"));
        Assert.All(Fields.All, f => Assert.Contains($"| `{f.Name}` |", docs, StringComparison.Ordinal));
    }

    [GeneratedRegex("\"([a-z]+(?:-[a-z]+)+)\"")]
    private static partial Regex CodeLiteral();
}
