namespace YieldBench.Reports.Tests.Conventions;

public sealed class ForbiddenCallTests
{
    // These need the system library libgdiplus, which a fresh machine lacks (measured with ClosedXML 0.95.4).
    private static readonly string[] Forbidden = ["AdjustToContents", "AddPicture(", ".AddPicture", "System.Drawing"];

    [Fact]
    public void No_source_file_calls_what_needs_libgdiplus()
    {
        // Given every C# source file of the repository's src folder
        string src = Path.Combine(RepoRoot(), "src");
        var files = Directory.EnumerateFiles(src, "*.cs", SearchOption.AllDirectories)
            .Where(f => !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}", StringComparison.Ordinal)
                && !f.Contains($"{Path.DirectorySeparatorChar}bin{Path.DirectorySeparatorChar}", StringComparison.Ordinal))
            .ToArray();

        // When they are scanned for the forbidden calls (our own Open XML helper is named AddPicture, so only ClosedXML-style calls on a worksheet count)
        var hits = files.SelectMany(f => File.ReadLines(f).Select((line, i) => (File: f, Line: i + 1, Text: line)))
            .Where(l => Forbidden.Any(word => l.Text.Contains(word, StringComparison.Ordinal)))
            .Where(l => !l.Text.Contains("OpenXmlDrawings.AddPicture", StringComparison.Ordinal) && !l.Text.Contains("public static void AddPicture(WorksheetPart", StringComparison.Ordinal))
            .Where(l => !l.Text.TrimStart().StartsWith("//", StringComparison.Ordinal) && !l.Text.TrimStart().StartsWith("///", StringComparison.Ordinal))
            .Select(l => $"{Path.GetRelativePath(src, l.File)}:{l.Line}: {l.Text.Trim()}")
            .ToArray();

        // Then there are none
        Assert.True(files.Length > 10, "the scan found too few files to be looking in the right place");
        Assert.Empty(hits);
    }

    internal static string RepoRoot()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "YieldBench.sln")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName ?? throw new InvalidOperationException("YieldBench.sln not found above " + AppContext.BaseDirectory);
    }
}
