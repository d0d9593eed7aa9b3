namespace YieldBench.Reports.Tests.Output;

/// <summary>The console's line wrapping: lines fit the terminal and a unit never starts a line.</summary>
public sealed class ConsoleWrapTests
{
    [Fact]
    public void A_percent_or_degree_sign_stays_with_its_number_when_a_line_wraps()
    {
        // Given a sentence whose "95 %" falls exactly at the 100-column edge (a line seen in a review of 48 lots)
        string text = "MB-2: 0.580 % v/v per °Brix (Per-strain median factor) → 14.05 % v/v; 80 % of lots 13.93–14.24, 95 % 13.84–14.32; ranges from all 48 lots.";

        // When it is wrapped with an indent of 2
        var lines = ConsoleSummary.Wrap(text, 2).ToArray();

        // Then every line fits in 100 columns, no line starts with a unit, and "95 %" is on one line
        Assert.True(lines.Length >= 2);
        Assert.All(lines, l => Assert.True(l.Length <= ConsoleSummary.Width, l));
        Assert.All(lines, l => Assert.False(l.TrimStart().StartsWith('%') || l.TrimStart().StartsWith('°'), l));
        Assert.Contains(lines, l => l.Contains("95 % 13.84", StringComparison.Ordinal));
        Assert.Equal(text, string.Join(" ", lines.Select(l => l.Trim())));
    }

    [Fact]
    public void Words_glue_a_unit_only_to_a_number()
    {
        // A unit after a number is glued; a percent sign after a word (as in "share %") is not
        Assert.Equal(["at", "24.3 °Brix,", "80 %", "of", "lots"], ConsoleSummary.Words("at 24.3 °Brix, 80 % of  lots"));
        Assert.Equal(["share", "%", "held"], ConsoleSummary.Words("share % held"));
    }
}
