using YieldBench.Core.Lots;
using YieldBench.Intake;

namespace YieldBench.Intake.Tests;

/// <summary>Lots workbooks kept by hand over years, and the exports cellars make of them (an invented winery, Quernby Ridge).</summary>
public sealed class CellarBookTests
{
    [Theory]
    [InlineData("Lot,Yeast,Season,Harvest Brix,Crush Brix,Alc\n")]
    [InlineData(",,,Must,Must,Lab\nLot,Yeast,Season,Harvest Brix,Crush Brix,Alc\n")]
    public void A_column_the_user_maps_is_read_before_an_earlier_column_a_synonym_matches(string header)
    {
        // Given two starting-sugar columns (a field estimate before picking, and the reading at crush), perhaps under a
        // group label, and the mapping the duplicate-column message advises: --column starting_sugar="Crush Brix"
        using var folder = new TestFolder();
        var lots = folder.Text("cellar-2024.csv", header + "24-CH-01,QR-A4,2024,22.0,24.0,14.1\n");

        // When read
        var set = folder.Read(new IntakeOptions { ColumnMappings = ["starting_sugar=Crush Brix"] }, lots);

        // Then the mapped column is read (24.0, not 22.0), and the other is named as not read because of the mapping
        Assert.Equal(24.0, Assert.Single(set.Lots).StartingSugar.Brix, 1e-9);
        var dup = Assert.Single(set.Issues, i => i.Code == IssueCodes.DuplicateColumn);
        Assert.EndsWith("Harvest Brix", dup.Column, StringComparison.Ordinal);
        Assert.Equal("This column also maps to starting_sugar, but your mapping names 'Crush Brix' for it, so that one was read and this one was not.", dup.Message);
    }
}
