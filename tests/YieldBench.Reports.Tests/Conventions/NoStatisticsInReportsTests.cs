using System.Text.RegularExpressions;

namespace YieldBench.Reports.Tests.Conventions;

/// <summary>
/// Renderers only lay out what the review holds: no source file of Reports computes a statistic. The scan looks for
/// Core's statistics namespace and estimators, a plotting library's statistics, and the LINQ and framework calls that
/// would compute a location or spread on the side.
/// </summary>
public sealed partial class NoStatisticsInReportsTests
{
    [GeneratedRegex(@"Core\.Statistics|ScottPlot\.Statistics|MathNet|\bDescriptive\.|\bRobust\.|\bTheilSen\b|\bBootstrap\.|\bRankTests\.|\bQuantile|\bMedian\(|\.Average\(|StandardDeviation\(|\bVariance\(")]
    private static partial Regex StatisticsCall();

    /// <summary>The lines of <paramref name="lines"/> (path, number, text) that call a statistic, comments left out.</summary>
    internal static IReadOnlyList<string> Offending(IEnumerable<(string File, int Line, string Text)> lines) =>
        lines.Where(l => !l.Text.TrimStart().StartsWith("//", StringComparison.Ordinal) && StatisticsCall().IsMatch(l.Text))
            .Select(l => $"{l.File}:{l.Line}: {l.Text.Trim()}")
            .ToArray();

    [Fact]
    public void No_source_file_of_Reports_computes_a_statistic()
    {
        // Given every C# source file of src/YieldBench.Reports
        string reports = Path.Combine(ForbiddenCallTests.RepoRoot(), "src", "YieldBench.Reports");
        var files = Directory.EnumerateFiles(reports, "*.cs", SearchOption.AllDirectories)
            .Where(f => !f.Contains($"{Path.DirectorySeparatorChar}obj{Path.DirectorySeparatorChar}", StringComparison.Ordinal)
                && !f.Contains($"{Path.DirectorySeparatorChar}bin{Path.DirectorySeparatorChar}", StringComparison.Ordinal))
            .ToArray();

        // When their lines are scanned for statistics calls
        var hits = Offending(files.SelectMany(f => File.ReadLines(f).Select((text, i) => (Path.GetRelativePath(reports, f), i + 1, text))));

        // Then there are none (the review holds every median, quartile and count a renderer shows)
        Assert.True(files.Length > 20, "the scan found too few files to be looking in the right place");
        Assert.Empty(hits);
    }

    [Theory]
    [InlineData("using YieldBench.Core.Statistics;")]
    [InlineData("        double m = Descriptive.Median(values);")]
    [InlineData("        var hist = ScottPlot.Statistics.Histogram.WithBinSize(0.005, lo, hi);")]
    [InlineData("        double mean = xs.Average(x => x.Abv);")]
    [InlineData("        var q = Quantile(sorted, 0.25);")]
    public void The_scan_catches_a_statistics_call(string line)
    {
        // Given a line that computes a statistic, and the same line as a comment
        // Then the scan reports the first and passes over the second
        Assert.Single(Offending([("Planted.cs", 1, line)]));
        Assert.Empty(Offending([("Planted.cs", 1, "        // " + line.Trim())]));
    }
}
