using YieldBench.Core.Conversion;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Conversion;

/// <summary>Gay-Lussac stoichiometry: C6H12O6 → 2 C2H5OH + 2 CO2.</summary>
public class GayLussacTests
{
    [Fact]
    public void Ethanol_yield_from_molar_masses_is_0_5114_gram_per_gram_of_hexose()
    {
        // Given molar masses from standard atomic weights (C 12.011, H 1.008, O 15.999)
        double hexose = (6 * 12.011) + (12 * 1.008) + (6 * 15.999);
        double ethanol = (2 * 12.011) + (6 * 1.008) + 15.999;
        double co2 = 12.011 + (2 * 15.999);

        // When the constants are compared with the sums, and the mass yields are formed
        // Then they match, and the yields are the published 0.5114 ethanol and 0.489 CO2 (C6H12O6 → 2 C2H5OH + 2 CO2 with molar masses 180.16, 46.07, 44.01: 2 × 46.07 / 180.16 and 2 × 44.01 / 180.16)
        Assert.Equal(GayLussac.HexoseMolarMass, hexose, 1e-9);
        Assert.Equal(GayLussac.EthanolMolarMass, ethanol, 1e-9);
        Assert.Equal(GayLussac.CarbonDioxideMolarMass, co2, 1e-9);
        Assert.Equal(0.5114, GayLussac.EthanolMassYield, 5e-5);
        Assert.Equal(0.489, GayLussac.CarbonDioxideMassYield, 5e-4);
        Assert.Equal(1.0, GayLussac.EthanolMassYield + GayLussac.CarbonDioxideMassYield, 1e-3);
    }

    [Fact]
    public void In_theory_fifteen_point_four_three_grams_of_sugar_make_one_percent_alcohol()
    {
        // Given 1 % v/v = 7.8924 g/L of ethanol and 0.5114 g ethanol per g sugar
        // When the sugar needed is computed
        double sugar = GayLussac.TheoreticalSugarPerPercentVolume;

        // Then it is 7.8924 / 0.511435 = 15.4319 g/L (ethanol density 0.78924 g/mL, Council Directive 76/766/EEC Annex; arithmetic done here)
        Assert.Equal(15.431887108467732, sugar, 1e-9);
        Assert.Equal(15.43, sugar, 0.005);
    }

    [Fact]
    public void The_EU_convention_of_16_83_grams_is_91_point_7_percent_of_theoretical()
    {
        // Given 16.83 g/L per % vol (Arrêté du 3 mai 1996, art. 2) and the older 17.5 g/L
        // When each is compared with the theoretical 15.43 g/L
        double eu = GayLussac.TheoreticalSugarPerPercentVolume / OivMustTable.SugarGramsPerPercentVolume;
        double older = GayLussac.TheoreticalSugarPerPercentVolume / 17.5;

        // Then they are 91.7 % and 88.2 % (16.83 g/L, Arrêté du 3 mai 1996 art. 2, and 17.5 g/L against 15.43 g/L; arithmetic done here)
        Assert.Equal(0.917, eu, 5e-4);
        Assert.Equal(0.882, older, 5e-4);
    }

    [Fact]
    public void Inverted_sucrose_gives_five_point_three_percent_more_hexose_by_mass()
    {
        // Given C12H22O11 + H2O → C6H12O6 + C6H12O6, sucrose 342.297 g/mol
        double sucrose = (12 * 12.011) + (22 * 1.008) + (11 * 15.999);

        // When the hexose gain is computed
        // Then 2 × 180.156 / 342.297 = 1.05263
        Assert.Equal(GayLussac.SucroseMolarMass, sucrose, 1e-9);
        Assert.Equal(1.052629733827641, GayLussac.HexosePerSucrose, 1e-12);
    }
}
