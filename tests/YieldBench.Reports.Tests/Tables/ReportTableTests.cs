using YieldBench.Reports.Tables;

namespace YieldBench.Reports.Tests.Tables;

public sealed class ReportTableTests
{
    private static readonly ReportColumn[] Columns =
    [
        new("a", "A", CellKind.Text),
        new("b", "B", CellKind.Number),
        new("c", "C", CellKind.Integer),
        new("d", "D", CellKind.DateTime),
    ];

    [Fact]
    public void Every_cell_type_reads_back_as_the_value_and_type_it_was_given()
    {
        // Given cells of every supported type, in one column and across columns, with empty ones between
        object?[][] rows =
        [
            ["lot-1", 0.1 + 0.2, 7, new DateTime(2025, 9, 14, 8, 30, 0, DateTimeKind.Unspecified)],
            [null, double.NaN, 12_345_678_901L, new DateTime(2024, 3, 1, 0, 0, 0, DateTimeKind.Utc)],
            [true, -0.0, null, "not a date"],
            ["=SUM(A1)", double.MaxValue, int.MinValue, false],
            [3.5, null, "text among numbers", null],
        ];
        var table = new ReportTable(Columns);
        for (int r = 0; r < rows.Length; r++)
        {
            table.Add(rows[r], highlight: r == 2);
        }

        // When they are read back, cell by cell and row by row
        // Then each is equal to what went in and of the same type (a negative zero keeps its sign; a time its kind)
        Assert.Equal(rows.Length, table.RowCount);
        for (int r = 0; r < rows.Length; r++)
        {
            for (int c = 0; c < Columns.Length; c++)
            {
                Assert.Equal(rows[r][c], table.Cell(r, c));
                Assert.Equal(rows[r][c]?.GetType(), table.Cell(r, c)?.GetType());
                Assert.Equal(rows[r][c], table.Rows[r][c]);
            }
        }

        Assert.True(double.IsNegative((double)table.Cell(2, 1)!));
        Assert.Equal(DateTimeKind.Utc, ((DateTime)table.Cell(1, 3)!).Kind);
        Assert.Equal([false, false, true, false, false], table.Highlighted);
    }

    [Fact]
    public void A_reordered_table_shows_the_same_rows_and_highlights_in_the_given_order()
    {
        // Given a table of 100 rows made from items (more rows than it first makes room for)
        var items = Enumerable.Range(0, 100).ToArray();
        Column<int>[] columns =
        [
            new("n", "N", CellKind.Integer, i => i),
            new("half", "Half", CellKind.Number, i => i / 2.0),
            new("name", "Name", CellKind.Text, i => i % 3 == 0 ? null : $"item {i}"),
        ];
        var table = ReportTable.Of(columns, items.Where(_ => true), i => i % 7 == 0);

        // When it is reordered backwards
        var order = Enumerable.Range(0, 100).Reverse().ToArray();
        var reordered = table.Reordered(order);

        // Then row k of the reordered table is row 99 - k of the first, cells and highlight alike
        Assert.Equal(100, reordered.RowCount);
        for (int k = 0; k < 100; k++)
        {
            int i = 99 - k;
            Assert.Equal(i, reordered.Cell(k, 0));
            Assert.Equal(i / 2.0, reordered.Cell(k, 1));
            Assert.Equal(i % 3 == 0 ? null : $"item {i}", reordered.Cell(k, 2));
            Assert.Equal(i % 7 == 0, reordered.Highlighted[k]);
            Assert.Equal(table.Rows[i], reordered.Rows[k]);
        }
    }

    [Fact]
    public void A_cell_of_an_unsupported_type_is_refused()
    {
        // Given a table
        var table = new ReportTable(Columns);

        // When a row holds a decimal
        // Then it is refused, naming the type, and no row is added
        var e = Assert.Throws<ArgumentException>(() => table.Add(["x", 1.5m, 1, null]));
        Assert.Contains("Decimal", e.Message, StringComparison.Ordinal);
        Assert.Equal(0, table.RowCount);
    }
}
