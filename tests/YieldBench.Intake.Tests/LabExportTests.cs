using YieldBench.Core.Lots;

namespace YieldBench.Intake.Tests;

/// <summary>How lab exports and hand-kept cellar sheets write values the lab could not or did not quantify.</summary>
public class LabExportTests
{
    [Theory]
    [InlineData("<1")]
    [InlineData("< 0.5 g/L")]
    [InlineData("ND")]
    [InlineData("n.d.")]
    [InlineData("<LOD")]
    [InlineData("dry")]
    [InlineData("sec")]
    public void A_residual_sugar_below_the_labs_limit_keeps_the_lot_and_is_said(string rs)
    {
        // Given a lab export whose residual sugar is written as the lab's "below limit" notation
        using var folder = new TestFolder();
        folder.Text("lab-2024.csv", $"Lot,Yeast,Brix,Alcohol,RS g/L\nL1,QX-7,24.0,14.1,{rs}\nL2,QX-7,23.0,13.5,1.2\n");

        // When it is read
        var set = folder.Read("lab-2024.csv");

        // Then both lots are used; the first has no residual sugar (taken as dry by the review) and one warning says why
        Assert.Equal(["L1", "L2"], set.Lots.Select(l => l.LotId));
        Assert.Null(set.Lots[0].ResidualSugarGl);
        Assert.Equal(1.2, set.Lots[1].ResidualSugarGl);
        var issue = Assert.Single(set.Issues, i => i.Code == IssueCodes.BelowLabLimit);
        Assert.Equal(IssueSeverity.Warning, issue.Severity);
        Assert.Equal((2, "RS g/L", rs), (issue.Row, issue.Column, issue.Value));
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
    }

    [Fact]
    public void A_lab_limit_above_the_dryness_limit_leaves_the_lot_out_with_the_reason()
    {
        // Given a residual sugar recorded only as "<10" (an off-dry wine could be below it)
        using var folder = new TestFolder();
        folder.Text("lab-2024.csv", "Lot,Yeast,Brix,Alcohol,RS g/L\nL1,QX-7,24.0,14.1,<10\n");

        // When it is read
        var set = folder.Read("lab-2024.csv");

        // Then the lot is left out, and the message says a limit of 10 g/L cannot tell dry from stopped short
        Assert.Empty(set.Lots);
        var issue = Assert.Single(set.Issues, i => i.Code == IssueCodes.BelowLabLimit);
        Assert.Equal(IssueSeverity.Error, issue.Severity);
        Assert.Contains("below 10 g/L", issue.Message, StringComparison.Ordinal);
    }
}
