using YieldBench.Core.Forecast;
using YieldBench.Core.Kinetics;
using YieldBench.Core.Units;

namespace YieldBench.Core.Tests.Forecast;

public class HeatBalanceTests
{
    private static readonly KineticsSettings Kinetics = KineticsSettings.Default;

    [Fact]
    public void The_cooling_power_at_a_rate_is_the_heat_of_the_sugar_fermented_per_second()
    {
        // Given 5000 L of a 24 °Brix must that will settle at −2 °Brix, fermenting at 0.25 °Brix/h
        // By hand: the must's sugar is 237.8 g/L (OIV must table, 24.0 °Brix), used over a fall of 24 − (−2) = 26 °Brix,
        // so 237.8 / 26 = 9.14615 g/L per °Brix; 0.25 °Brix/h × 9.14615 g/L × 5000 L = 11 432.7 g/h of hexose;
        // ÷ 180.16 g/mol × 100.4 kJ/mol (Colombié, Malherbe & Sablayrolles 2007) = 6371.19 kJ/h; ÷ 3600 s/h = 1.76978 kW.
        double kw = HeatBalance.HeatPowerKw(0.25, 24.0, -2.0, 5000, Kinetics);

        // Then the forecast's figure is the hand balance
        Assert.Equal(237.8 / 26 * 0.25 * 5000 / 180.16 * 100.4 / 3600, kw, 9);
        Assert.Equal(1.7698, kw, 4);
    }

    [Fact]
    public void The_rise_with_no_cooling_is_the_heat_of_the_sugar_left_over_the_musts_heat_capacity()
    {
        // Given the same must, read at 12 °Brix
        // By hand: sugar still to ferment = 9.14615 g/L per °Brix × (12 − (−2)) = 128.046 g/L; heat = 128.046 / 180.16 ×
        // 100.4 = 71.357 kJ per litre; the litre's mass is the must's density at 24 °Brix, SG 1.10103 by the NBS cubic
        // (1.10101 in Zoecklein et al., Appendix I) × 0.99820 = 1.09905 kg; its heat capacity the kinetics default at the
        // must's 24 °Brix (Choi & Okos composition model: 0.76 × 4.17657 + 0.24 × 1.58567 = 3.55476 kJ/(kg·K)); the
        // rise is heat ÷ (mass × cp).
        double density = SugarReading.FromBrix(24.0).SpecificGravity * 0.99820;
        double cp = Kinetics.MustHeatCapacityAt(24.0);
        Assert.Equal(3.55476, cp, 5);
        double byHand = 237.8 / 26 * 14 / 180.16 * 100.4 / (density * cp);

        // Then the forecast's reachable rise is that, and per °Brix it is a fourteenth of it
        Assert.Equal(byHand, HeatBalance.RemainingRiseK(24.0, -2.0, 12.0, Kinetics), 9);
        Assert.Equal(byHand / 14, HeatBalance.AdiabaticRisePerBrix(24.0, -2.0, Kinetics), 9);
        Assert.Equal(1.09905, density, 5);

        // And below the settling point nothing is left to heat the must
        Assert.Equal(0, HeatBalance.RemainingRiseK(24.0, -2.0, -2.5, Kinetics));
    }

    [Fact]
    public void The_heat_per_brix_agrees_with_the_kinetics_codes_adiabatic_rise_for_the_same_sugar()
    {
        // Given the same sugar and density given to the kinetics code's formula
        double perBrixGl = HeatBalance.SugarPerBrix(24.0, -2.0);
        double density = FermentationHeat.MustDensityKgPerL(SugarReading.FromBrix(24.0));

        // Then the two heat balances are one
        Assert.Equal(FermentationHeat.PotentialRiseK(perBrixGl, density, Kinetics.HeatOfFermentationKjPerMol, Kinetics.MustHeatCapacityAt(24.0)), HeatBalance.AdiabaticRisePerBrix(24.0, -2.0, Kinetics), 12);
    }
}
