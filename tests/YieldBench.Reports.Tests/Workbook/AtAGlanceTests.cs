using YieldBench.Reports.Tests.Fixtures;
using YieldBench.Reports.Workbook;

namespace YieldBench.Reports.Tests.Workbook;

/// <summary>The Overview's "At a glance" line of lots to look at, at the size of a large history.</summary>
public sealed class AtAGlanceTests
{
    [Fact]
    public void Many_lots_to_look_at_are_named_up_to_the_limit_and_the_rest_counted()
    {
        // Given a review with far more findings than one cell can name (as 100,000 lots give: some thousands)
        var review = SampleReview.Build();
        var one = Assert.IsType<Core.Review.LotFinding>(review.Findings.FirstOrDefault(), exactMatch: false);
        var many = Enumerable.Repeat(one, 5000).ToArray();
        var big = review with { Findings = many };

        // When the "At a glance" lines are written
        string line = Assert.Single(WorkbookSheets.AtAGlance(big), l => l.StartsWith("Lots to look at: ", StringComparison.Ordinal));

        // Then the line names the first lots, counts the others, and fits a cell (at most 32,767 characters)
        int named = line.Split($"{one.Key} (").Length - 1;
        Assert.Equal(WorkbookSheets.AtAGlanceLots, named);
        Assert.Contains($", and {5000 - WorkbookSheets.AtAGlanceLots} more on the Follow-up sheet.", line, StringComparison.Ordinal);
        Assert.True(line.Length < 32_767, $"{line.Length} characters");
    }
}
