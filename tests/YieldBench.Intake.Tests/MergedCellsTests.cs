namespace YieldBench.Intake.Tests;

public class MergedCellsTests
{
    private static RawSheet Sheet(params object?[][] rows) => new("Lots", [.. rows], decimalComma: false);

    [Fact]
    public void A_block_declared_far_larger_than_the_sheet_fills_only_the_cells_the_sheet_holds()
    {
        // Given three rows of three cells and a merged block declared over a whole spreadsheet's rows and columns
        var sheet = Sheet(["Lot", "Yeast", "Brix"], ["A-01", "QX-7", 24.0], ["A-02", null, 23.1]);
        sheet.Merged.Add(new CellSpan(1, 1, 1_048_575, 16_383));
        var sink = new IssueSink();

        // When the merged blocks are settled
        MergedCells.Settle(new RawFile([sheet], false));
        MergedCells.Warn(sheet, "lots.xlsx", sink, 0);

        // Then the block's value fills the rows and columns that exist, and nothing more is made
        Assert.Equal(3, sheet.Rows.Count);
        Assert.Equal(new object?[] { "A-02", "QX-7", "QX-7" }, sheet.Rows[2]);
        Assert.Equal(new object?[] { "A-01", "QX-7", "QX-7" }, sheet.Rows[1]);
        var issue = Assert.Single(sink.Issues);
        Assert.Contains("The cells B2:XFD1048576 are merged", issue.Message, StringComparison.Ordinal);
        Assert.Contains("read for each of rows 2–3", issue.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_block_within_one_row_or_with_an_empty_first_cell_is_left_as_stored_without_a_word()
    {
        // Given a title merged across a row, and an empty merged block spanning rows
        var sheet = Sheet(["Tallowmere lots", null, null], ["Lot", "Yeast", "Brix"], ["A-01", null, 24.0], ["A-02", null, 23.1]);
        sheet.Merged.Add(new CellSpan(0, 0, 0, 2));
        sheet.Merged.Add(new CellSpan(2, 1, 3, 1));
        var sink = new IssueSink();

        // When the merged blocks are settled
        MergedCells.Settle(new RawFile([sheet], false));
        MergedCells.Warn(sheet, "lots.xlsx", sink, 0);

        // Then nothing changes and nothing is said
        Assert.Equal(new object?[] { "Tallowmere lots", null, null }, sheet.Rows[0]);
        Assert.Null(sheet.Cell(3, 1));
        Assert.Empty(sink.Issues);
    }

    [Theory]
    [InlineData(0, "A")]
    [InlineData(25, "Z")]
    [InlineData(26, "AA")]
    [InlineData(701, "ZZ")]
    [InlineData(702, "AAA")]
    [InlineData(16_383, "XFD")]
    public void Column_letters_are_those_a_spreadsheet_shows(int index, string letters) =>
        Assert.Equal(letters, MergedCells.Column(index));
}
