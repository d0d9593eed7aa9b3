using YieldBench.Core.Conversion;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Units;

/// <summary>The OIV must table (OIV-MA-AS2-02 Table II, rows read in the Arrêté du 14 septembre 2011, Annexe IV).</summary>
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

        // Then it is the printed sugar to 1e-9 g/L (the interpolant passes through its knots)
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

    // scipy 1.10.1 (Debian python3-scipy 1.10.1-2): /usr/bin/python3 tests/YieldBench.Core.Tests/Units/Oracles/units_oracle.py
    //   ρ(Bx) = SG(Bx)·0.99820, SG from scipy.optimize.brentq on the NBS cubic;
    //   NS = [Bx·10·ρ(Bx) − sugar for each row]; sugar(x) = x·10·ρ(x) − PchipInterpolator(rows_bx, NS)(x).
    [Theory]
    [InlineData(10.5, 87.50768347758992)]
    [InlineData(12.0, 103.53737029826874)]
    [InlineData(12.5, 108.91700802336044)]
    [InlineData(17.5, 163.7640017539478)]
    [InlineData(21.0, 203.2682190464401)]
    [InlineData(23.3, 229.6737101388681)]
    [InlineData(25.5, 255.34445855848847)]
    [InlineData(27.0, 273.00589993029047)]
    [InlineData(29.0, 296.8623214353063)]
    public void Between_rows_the_sugar_is_the_monotone_cubic_scipy_computes(double brix, double scipySugarGl)
    {
        // Given a °Brix between published rows
        // When the sugar model interpolates
        double sugar = OivMustTable.SugarGramsPerLitre(brix);

        // Then it agrees with scipy's PchipInterpolator on the same non-sugar solids to 1e-9 g/L
        Assert.Equal(scipySugarGl, sugar, 1e-9);
    }

    [Fact]
    public void Leaving_out_any_inner_row_the_interpolation_predicts_it_within_table_rounding()
    {
        // Given the nine rows, each inner row held out in turn (the estimate of interpolation error in the methods doc)
        var rows = OivMustTable.Table;
        double worst = 0;
        for (int k = 1; k < rows.Count - 1; k++)
        {
            var kept = rows.Where((_, i) => i != k).ToArray();
            var curve = new MonotoneCubic(
                kept.Select(r => r.Brix).ToArray(),
                kept.Select(r => OivMustTable.TotalSolidsGramsPerLitre(r.Brix) - r.SugarGl).ToArray());

            // When the held-out row is predicted from the others
            double predicted = OivMustTable.TotalSolidsGramsPerLitre(rows[k].Brix) - curve.Evaluate(rows[k].Brix);
            worst = Math.Max(worst, Math.Abs(predicted - rows[k].SugarGl));
        }

        // Then the worst miss is 0.0461 g/L, at 20 °Bx — inside the print's rounding of ±0.05 g/L.
        // scipy 1.10.1, same construction with PchipInterpolator: 0.04609702809707983 (pchip on sugar itself: 0.1785)
        Assert.Equal(0.04609702809707983, worst, 1e-9);
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
