namespace YieldBench.Scenario.Tests;

/// <summary>The invented world's frozen chemistry agrees with the published tables it is built from.</summary>
public class ScenarioChemistryTests
{
    [Theory]
    // OIV-MA-AS2-02 Table II rows as reproduced in the French Arrêté du 14 septembre 2011 relatif aux réfractomètres, Annexe IV.
    [InlineData(10.0, 82.2)]
    [InlineData(20.0, 191.9)]
    [InlineData(24.0, 237.8)]
    [InlineData(30.0, 308.9)]
    public void Sugar_at_a_table_row_is_the_OIV_value(double brix, double sugarGl)
    {
        // Given a table row's °Brix
        // When the world's sugar is computed
        // Then it is the table's g/L
        Assert.Equal(sugarGl, ScenarioChemistry.SugarGramsPerLitre(brix), 9);
    }

    [Fact]
    public void Sugar_between_rows_stays_between_the_neighbouring_rows()
    {
        // Given 24.5 °Brix, between the 24 and 25 rows (237.8 and 249.5 g/L)
        double s = ScenarioChemistry.SugarGramsPerLitre(24.5);

        // Then the monotone interpolation lies strictly between them and near their mean (243.65)
        Assert.InRange(s, 243.0, 244.3);
    }

    [Fact]
    public void Specific_gravity_matches_the_published_check_and_the_sucrose_table()
    {
        // Given the cubic's published check S = 1.040 → 9.99325 °Bx and Zoecklein et al. Table I-1 (20 °Bx → 1.08297, 24 → 1.10101)
        // Then the world's conversions agree (table within 0.0001 SG, the fit's stated accuracy)
        // (the coefficients as printed give 9.99341; the check agrees to 0.0002 °Bx, well inside the fit's RMS of 0.0009)
        Assert.InRange(ScenarioChemistry.BrixFromSpecificGravity(1.040), 9.99325 - 0.0002, 9.99325 + 0.0002);
        Assert.Equal(1.08297, ScenarioChemistry.SpecificGravityFromBrix(20.0), 4);
        Assert.Equal(1.10101, ScenarioChemistry.SpecificGravityFromBrix(24.0), 4);
        Assert.Equal(24.0, ScenarioChemistry.BrixFromSpecificGravity(ScenarioChemistry.SpecificGravityFromBrix(24.0)), 10);
    }

    [Fact]
    public void Water_for_a_target_and_the_balance_after_it_agree_with_a_hand_worked_example()
    {
        // Given 1000 L of must at 26 °Brix (SG 1.11035 by the cubic, so 1108.35 kg and 288.17 kg of solids, hand-worked)
        double sg = ScenarioChemistry.SpecificGravityFromBrix(26.0);
        double mass = 1000 * sg * 0.99820;
        double water = ScenarioChemistry.WaterForTarget(26.0, 1000, 24.0);

        // When water is added to bring it to 24 °Brix: mass after = 288.17 / 0.24 = 1200.7 kg, so about 92.5 L
        double expectedWater = ((mass * 0.26 / 0.24) - mass) / 0.99820;

        // Then the water matches the hand balance and the balance after the addition reads 24 °Brix again
        Assert.Equal(expectedWater, water, 9);
        Assert.InRange(water, 90.0, 95.0);
        Assert.Equal(24.0, ScenarioChemistry.BrixAfterAdditions(26.0, 1000, water, 0), 9);
        Assert.Equal(22.0, ScenarioChemistry.BrixAfterAdditions(20.0, 1000, 0, ScenarioChemistry.SucroseForTarget(20.0, 1000, 22.0)), 9);
    }

    [Fact]
    public void Sugar_after_additions_counts_the_inversion_and_the_musts_own_non_sugar_solids()
    {
        // Given 1000 L at 20 °Brix (191.9 g/L, OIV row) with 20 kg of sucrose, the hand balance of the tool's
        // AdditionBalanceTests (units_oracle.py: 210.4227 g/L with the Zoecklein SG 1.08297; the world's cubic SG
        // differs by 4e-5)
        double sugar = ScenarioChemistry.SugarAfterAdditions(20.0, 1000, 0, 20);

        // Then the world's must holds 210.42 g/L: the sucrose's 21.05 kg of glucose and fructose over the volume after,
        // about 2 g/L more than the table gives a natural must of the solids °Brix without inversion (21.45 °Brix, about
        // 208.4 g/L): the added sucrose brings sugar but no non-sugar solids, and gains 5 % on inversion
        Assert.Equal(210.4227, sugar, 0.02);
        Assert.True(sugar > ScenarioChemistry.SugarGramsPerLitre(ScenarioChemistry.BrixAfterAdditions(20.0, 1000, 0, 20)) + 1.5);
        Assert.Equal(ScenarioChemistry.SugarGramsPerLitre(23.0), ScenarioChemistry.SugarAfterAdditions(23.0, 1000, 0, 0));
    }
}
