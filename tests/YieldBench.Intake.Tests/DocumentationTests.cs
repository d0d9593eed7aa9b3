using System.Text.RegularExpressions;

namespace YieldBench.Intake.Tests;

public partial class DocumentationTests
{
    internal static string RepoRoot()
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
        // Given the issue codes intake declares
        string docs = File.ReadAllText(Path.Combine(RepoRoot(), "docs", "input-format.md"));

        // Then each has a row in the docs' table of issue codes
        Assert.True(IssueCodes.All.Count >= 50, $"only {IssueCodes.All.Count} codes found");
        Assert.All(IssueCodes.All, c => Assert.Contains($"| `{c}` |", docs, StringComparison.Ordinal));
    }

    [Fact]
    public void The_docs_list_no_issue_code_intake_does_not_declare()
    {
        // Given the codes in the docs' table of issue codes
        string docs = File.ReadAllText(Path.Combine(RepoRoot(), "docs", "input-format.md"));
        string table = docs[docs.IndexOf("## Issue codes", StringComparison.Ordinal)..];
        var listed = DocRow().Matches(table).Select(m => m.Groups[1].Value).ToList();

        // Then every one is a declared code
        Assert.NotEmpty(listed);
        Assert.All(listed, c => Assert.Contains(c, IssueCodes.All));
    }

    [Fact]
    public void Intake_raises_issues_only_through_the_declared_code_constants()
    {
        // Given the intake sources other than the code list itself
        string root = Path.Combine(RepoRoot(), "src", "YieldBench.Intake");
        var literals = Directory.EnumerateFiles(root, "*.cs", SearchOption.AllDirectories)
            .Where(f => Path.GetFileName(f) != "IssueCodes.cs" && !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}", StringComparison.Ordinal))
            .SelectMany(f => CodeLiteral().Matches(File.ReadAllText(f)).Select(m => m.Groups[1].Value))
            .Where(c => IssueCodes.All.Contains(c))
            .Distinct()
            .ToList();

        // Then none writes a code as a bare string
        Assert.Empty(literals);
    }

    [Fact]
    public void Every_field_is_documented_with_its_canonical_name()
    {
        string docs = File.ReadAllText(Path.Combine(RepoRoot(), "docs", "input-format.md"));
        Assert.All(Fields.All, f => Assert.Contains($"| `{f.Name}` |", docs, StringComparison.Ordinal));
    }

    [GeneratedRegex("\"([a-z]+(?:-[a-z]+)+)\"")]
    private static partial Regex CodeLiteral();

    [GeneratedRegex(@"^\| `([a-z]+(?:-[a-z]+)+)` \|", RegexOptions.Multiline)]
    private static partial Regex DocRow();
}
