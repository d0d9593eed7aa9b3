using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Conversion;

/// <summary>
/// The four conversion measures of a lot, worked by hand from OIV table rows (Arrêté du 14 septembre 2011, Annexe IV),
/// ethanol 0.78924 g/mL (Directive 76/766/EEC) and the Gay-Lussac yield 2 × 46.069 / 180.156 = 0.511435.
/// Lots, strains and numbers are invented.
/// </summary>
public class ConversionFactorsTests
{
    private static Lot MakeLot(double brix, double abv, double? residualGl, Additions? additions = null) => new()
    {
        LotId = "T-01",
        Season = 2031,
        Strain = "ST-A1",
        StartingSugar = SugarReading.FromBrix(brix),
        FinalAlcohol = AlcoholContent.FromPercentVolume(abv),
        ResidualSugarGl = residualGl,
        Additions = additions ?? Additions.None,
    };

    [Fact]
    public void A_dry_lot_gets_all_four_measures_as_worked_by_hand()
    {
        // Given a lot from 24.0 °Bx (237.8 g/L) to 14.0 % v/v with 2.0 g/L residual sugar
        var lot = MakeLot(24.0, 14.0, 2.0);

        // By hand: abv_per_brix 14 / 24 = 0.583333; consumed 237.8 − 2.0 = 235.8 g/L;
        // °Bx fermented 24 × 235.8 / 237.8 = 23.79815; abv_per_brix_fermented 14 / 23.79815 = 0.588281;
        // sugar_gl_per_abv 235.8 / 14 = 16.842857; ethanol 14 × 7.8924 = 110.4936 g/L;
        // gay_lussac_efficiency 110.4936 / (0.511435 × 235.8) = 0.916227
        // When the measures are computed
        var c = ConversionFactors.For(lot, SugarModel.Default);

        // Then each matches
        Assert.Equal(0.583333333, c.AbvPerBrix, 1e-8);
        Assert.Equal(235.8, c.SugarConsumedGl, 1e-9);
        Assert.Equal(23.79814970563499, c.FermentedBrix, 1e-9);
        Assert.Equal(0.5882810291207237, c.AbvPerBrixFermented, 1e-9);
        Assert.Equal(16.842857142857145, c.SugarGlPerAbv, 1e-9);
        Assert.Equal(0.9162273940566082, c.GayLussacEfficiency, 1e-9);
        Assert.Empty(c.Notes);
    }

    [Fact]
    public void An_unfinished_lot_is_credited_only_with_the_sugar_it_fermented()
    {
        // Given a lot from 25.0 °Bx (249.5 g/L) that stopped at 12.2 % v/v with 40 g/L residual sugar
        var lot = MakeLot(25.0, 12.2, 40.0);

        // By hand: abv_per_brix 12.2 / 25 = 0.488; consumed 209.5 g/L; °Bx fermented 25 × 209.5 / 249.5 = 20.99198;
        // abv_per_brix_fermented 0.581174; sugar_gl_per_abv 209.5 / 12.2 = 17.172131;
        // gay_lussac_efficiency 12.2 × 7.8924 / (0.511435 × 209.5) = 0.898659
        var c = ConversionFactors.For(lot, SugarModel.Default);

        // Then the plain factor looks poor while the fermented factor is ordinary
        Assert.Equal(0.488, c.AbvPerBrix, 1e-12);
        Assert.Equal(20.991983967935873, c.FermentedBrix, 1e-9);
        Assert.Equal(0.5811742243436754, c.AbvPerBrixFermented, 1e-9);
        Assert.Equal(17.172131147540984, c.SugarGlPerAbv, 1e-9);
        Assert.Equal(0.8986588196816531, c.GayLussacEfficiency, 1e-9);
    }

    [Fact]
    public void A_dry_lot_with_no_residual_sugar_has_equal_plain_and_fermented_factors()
    {
        var c = ConversionFactors.For(MakeLot(22.0, 12.9, 0.0), SugarModel.Default);
        Assert.Equal(c.AbvPerBrix, c.AbvPerBrixFermented, 1e-12);
        Assert.Equal(214.7 / 12.9, c.SugarGlPerAbv, 1e-9);
    }

    [Fact]
    public void Watered_lots_are_measured_from_the_effective_starting_sugar()
    {
        // Given 1000 L at 24.0 °Bx with 100 L water (216.20 g/L, the table °Brix of which is 22.1277, by the hand
        // balance in AdditionBalanceTests)
        var lot = MakeLot(24.0, 12.8, 1.5, new Additions(1000, 100, null));

        // When the measures are computed
        var c = ConversionFactors.For(lot, SugarModel.Default);

        // Then they rest on the corrected values: 12.8 / 22.1277 = 0.57846; (216.20 − 1.5) / 12.8 = 16.773
        Assert.True(c.AdditionsApplied);
        Assert.Equal(22.12771791792899, c.EffectiveStartingBrix, 1e-3);
        Assert.Equal(0.57846, c.AbvPerBrix, 1e-4);
        Assert.Equal(16.773, c.SugarGlPerAbv, 1e-3);
    }

    [Fact]
    public void Missing_residual_sugar_is_taken_as_dry_and_said_so()
    {
        var c = ConversionFactors.For(MakeLot(23.0, 13.4, null), SugarModel.Default);
        Assert.Equal(0, c.ResidualSugarGl);
        Assert.Equal(
            ["residual sugar is not recorded, so it is taken as 0 g/L (dry); record residual_sugar_gl for a fair comparison"],
            c.Notes);
    }

    [Fact]
    public void Residual_sugar_above_the_starting_sugar_leaves_the_fermented_measures_empty_with_a_reason()
    {
        // Given 12 °Bx must (103.5 g/L, the OIV table's row) and a residual sugar typed as 150 g/L
        var c = ConversionFactors.For(MakeLot(12.0, 1.0, 150.0), SugarModel.Default);

        // Then the fermented measures are NaN and the note names both values
        Assert.True(double.IsNaN(c.AbvPerBrixFermented));
        Assert.True(double.IsNaN(c.SugarGlPerAbv));
        Assert.True(double.IsNaN(c.GayLussacEfficiency));
        Assert.Equal(1.0 / 12.0, c.AbvPerBrix, 1e-12);
        Assert.Equal(103.5, c.StartingSugarGl, 1e-9);
        Assert.Contains(
            string.Create(
                CultureInfo.InvariantCulture,
                $"residual sugar 150.0 g/L is not below the starting sugar {c.StartingSugarGl:0.0} g/L, so the fermented measures cannot be computed; check both values"),
            c.Notes);
    }

    [Fact]
    public void A_must_outside_the_OIV_table_is_measured_with_a_warning()
    {
        var c = ConversionFactors.For(MakeLot(32.0, 15.5, 60.0), SugarModel.Default);
        Assert.Equal(
            ["starting sugar 32.0 °Brix is outside the OIV table's 10–30 °Brix; fermentable sugar uses the non-sugar solids of the table's nearest edge"],
            c.Notes);
        Assert.False(double.IsNaN(c.GayLussacEfficiency));
    }

    [Fact]
    public void Measures_are_named_in_snake_case_for_data_files()
    {
        Assert.Equal(
            ["abv_per_brix", "abv_per_brix_fermented", "sugar_gl_per_abv", "gay_lussac_efficiency"],
            ConversionMeasureNames.All.Select(m => m.Name()));
    }
}
