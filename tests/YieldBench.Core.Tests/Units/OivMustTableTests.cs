using YieldBench.Core.Conversion;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Units;

/// <summary>The OIV must table (OIV-MA-AS2-02 Table II, as reproduced in the Arrêté du 14 septembre 2011, Annexe IV).</summary>
public class OivMustTableTests
{
    // % sucrose, sugar g/L, % vol at 16.83 g/L — as printed in the Arrêté du 14 septembre 2011, Annexe IV.
    public static TheoryData<double, double, double> PublishedRows => new()
    {
        { 10.0, 82.2, 4.88 }, { 15.0, 136.1, 8.08 }, { 20.0, 191.9, 11.40 }, { 22.0, 214.7, 12.75 }, { 24.0, 237.8, 14.13 },
        { 25.0, 249.5, 14.82 }, { 26.0, 261.2, 15.52 }, { 28.0, 284.9, 16.92 }, { 30.0, 308.9, 18.35 },
    };

    [Theory]
    [MemberData(nameof(PublishedRows))]
    public void Sugar_at_a_published_row_is_the_printed_value(double brix, double sugarGl, double potentialAlcohol)
    {
        // Given a row of the OIV table
        _ = potentialAlcohol;

        // When the sugar model is asked for that °Brix
        double sugar = SugarReading.FromBrix(brix).GramsPerLitre;

        // Then it is the printed sugar to 1e-9 g/L
        Assert.Equal(sugarGl, sugar, 1e-9);
    }

    [Theory]
    [MemberData(nameof(PublishedRows))]
    public void Potential_alcohol_at_a_published_row_matches_the_printed_column(double brix, double sugarGl, double potentialAlcohol)
    {
        // Given a row of the OIV table and the EU convention 16.83 g/L per % vol (Arrêté du 3 mai 1996, art. 2)
        _ = sugarGl;

        // When potential alcohol is computed
        double computed = OivMustTable.PotentialAlcohol(brix);

        // Then it is within 0.01 % vol of the printed column (the print derives it from unrounded sugar; 136.1/16.83 = 8.087
        // is printed 8.08)
        Assert.Equal(potentialAlcohol, computed, 0.01);
    }

    [Fact]
    public void The_embedded_table_holds_201_rows_of_0_1_Brix_and_the_nine_published_rows()
    {
        // Given the embedded sugar column (copied from the Arrêté du 14 septembre 2011, Annexe IV)
        var column = OivMustTable.SugarColumn;

        // Then it runs 10.0–30.0 °Brix in 0.1 steps, and its rows at the nine published °Brix are the printed sugars
        Assert.Equal(201, column.Count);
        Assert.Equal(10.0, column[0].Brix);
        Assert.Equal(30.0, column[^1].Brix);
        foreach (var row in OivMustTable.Table)
        {
            Assert.Equal(row.SugarGl, column.Single(c => c.Brix == row.Brix).SugarGl);
        }
    }

    [Fact]
    public void Every_step_of_the_table_follows_its_neighbours_trend()
    {
        // Given the embedded column (copied by hand: a mistyped row would break the trend)
        var sugar = OivMustTable.SugarColumn.Select(c => c.SugarGl).ToArray();

        // When the steps and the changes between steps are taken
        var steps = sugar.Zip(sugar.Skip(1), (a, b) => b - a).ToArray();
        var bends = steps.Zip(steps.Skip(1), (a, b) => b - a).ToArray();

        // Then every 0.1 °Brix step rises by 1.0–1.2 g/L, and consecutive steps differ by at most the print's rounding
        // (one digit of 0.1 g/L): the table is smooth to its last printed digit
        Assert.All(steps, d => Assert.InRange(d, 0.99, 1.21));
        Assert.All(bends, d => Assert.InRange(d, -0.101, 0.101));
    }

    [Theory]
    [InlineData(12.0, 103.5)]
    [InlineData(25.4, 254.1)]
    [InlineData(16.3, 150.5)]
    public void Sugar_at_any_row_is_the_tabled_value(double brix, double tabledGl)
    {
        // Given a row of the full table that is not among the nine printed in full (values as copied)
        // When the sugar model is asked for that °Brix
        // Then it is the tabled value exactly
        Assert.Equal(tabledGl, OivMustTable.SugarGramsPerLitre(brix), 1e-9);
    }

    [Fact]
    public void Between_rows_the_sugar_is_interpolated_linearly()
    {
        // Given 25.45 °Brix, halfway between the rows 25.4 (254.1 g/L) and 25.5 (255.3 g/L)
        // When the sugar model is asked
        // Then it is their mean, 254.7 g/L
        Assert.Equal(254.7, OivMustTable.SugarGramsPerLitre(25.45), 1e-9);
    }

    [Fact]
    public void The_nine_row_interpolation_it_replaces_was_at_most_0_076_grams_per_litre_off()
    {
        // Given the earlier model's non-sugar solids curve through the nine published rows (Fritsch–Carlson monotone
        // cubic; scipy 1.10.1 PchipInterpolator gives the same) — recorded here as its values at the three rows where it
        // was furthest from the full table (units_oracle.py, "nine-row model at")
        (double Brix, double NineRow)[] worst = [(25.4, 254.17598), (16.3, 150.42617), (25.1, 250.66996)];

        // When each is compared with the full table
        // Then the largest change is 0.076 g/L at 25.4 °Brix (0.005 % vol of potential alcohol), the figure in docs/methods.md
        foreach (var (brix, nineRow) in worst)
        {
            Assert.InRange(Math.Abs(nineRow - OivMustTable.SugarGramsPerLitre(brix)), 0.069, 0.0761);
        }

        Assert.Equal(0.076, Math.Round(worst[0].NineRow - OivMustTable.SugarGramsPerLitre(25.4), 3), 1e-12);
    }

    [Fact]
    public void Below_the_table_the_non_sugar_solids_of_the_ten_Brix_row_are_kept()
    {
        // Given a 5 °Brix juice, outside the table
        double brix = 5.0;

        // When the sugar is computed
        double sugar = OivMustTable.SugarGramsPerLitre(brix);

        // Then it is total solids minus the 10 °Bx row's 21.6155 g/L of non-sugar solids (scipy 1.10.1: 29.27645)
        Assert.Equal(29.276453321298206, sugar, 1e-9);
        Assert.True(SugarModel.Default.IsExtrapolated(brix));
    }

    [Fact]
    public void Above_the_table_the_non_sugar_solids_of_the_thirty_Brix_row_are_kept()
    {
        // Given a 40 °Brix late-harvest must
        // When the sugar is computed
        double sugar = OivMustTable.SugarGramsPerLitre(40.0);

        // Then it is total solids minus the 30 °Bx row's 29.2300 g/L (scipy 1.10.1: 441.41642)
        Assert.Equal(441.41641777413093, sugar, 1e-9);
    }

    [Fact]
    public void The_edge_allowance_leaves_no_sugar_at_about_two_Brix_like_the_alternative_rule()
    {
        // Given the non-sugar allowance of the 10 °Bx row, 21.6 g/L
        // When the °Brix where sugar starts is found
        double start = OivMustTable.BrixFromSugarGramsPerLitre(0);

        // Then it is 2.1475 °Bx (scipy 1.10.1 brentq: 2.1474588), close to the 2.1 °Bx allowance of the
        // (Brix − 2.1) × density rule (Margalit)
        Assert.Equal(2.1474588142878552, start, 1e-8);
        Assert.Equal(0, OivMustTable.SugarGramsPerLitre(1.5));
    }

    [Fact]
    public void Must_density_of_the_table_exceeds_sucrose_density_by_about_a_thousandth()
    {
        // Given the table's must densities and the NBS-cubic sucrose density at the same °Brix
        // When compared row by row
        var excess = OivMustTable.Table
            .Select(r => r.DensityKgPerL - SugarScales.DensityFromBrix(r.Brix))
            .ToArray();

        // Then must is denser by 0.5–1.7 g/L (at most 0.14 %): the documented error of using sucrose density in mass balances
        Assert.All(excess, e => Assert.InRange(e, 0.0004, 0.0018));
    }
}
