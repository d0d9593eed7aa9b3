using YieldBench.Core.Kinetics;
using YieldBench.Core.Units;

namespace YieldBench.Core.Forecast;

/// <summary>
/// Fermentation heat on the forecast's sugar course. The hydrometer falls from S0 to F while all the must's fermentable
/// sugar (OIV table at S0, g/L) is used, so each °Brix of fall uses sugar(S0)/(S0 − F) g/L. Heat per litre is that over
/// the molar mass of hexose times the heat of fermentation; the rise is the heat over the must's mass (density at S0)
/// and heat capacity. Constants are the kinetics code's (<see cref="KineticsSettings"/>); sources in docs/methods.md.
/// </summary>
public static class HeatBalance
{
    /// <summary>Fermentable sugar used per °Brix of hydrometer fall, g/L.</summary>
    public static double SugarPerBrix(double startBrix, double finalBrix)
    {
        if (!(startBrix > finalBrix))
        {
            throw new ArgumentOutOfRangeException(nameof(finalBrix), finalBrix, "The settling point must lie below the start.");
        }

        return SugarReading.FromBrix(startBrix).GramsPerLitre / (startBrix - finalBrix);
    }

    /// <summary>Temperature rise per °Brix of fall with no heat removed, K.</summary>
    public static double AdiabaticRisePerBrix(double startBrix, double finalBrix, KineticsSettings settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        double density = FermentationHeat.MustDensityKgPerL(SugarReading.FromBrix(startBrix));
        return FermentationHeat.PotentialRiseK(SugarPerBrix(startBrix, finalBrix), density, settings.HeatOfFermentationKjPerMol, settings.MustHeatCapacityAt(startBrix));
    }

    /// <summary>The rise still possible with no heat removed from a reading of <paramref name="brixNow"/> down to F, K.</summary>
    public static double RemainingRiseK(double startBrix, double finalBrix, double brixNow, KineticsSettings settings) =>
        AdiabaticRisePerBrix(startBrix, finalBrix, settings) * Math.Max(0, brixNow - finalBrix);

    /// <summary>Heat released at a consumption rate (°Brix/h) in <paramref name="volumeL"/> litres of must, kW.</summary>
    public static double HeatPowerKw(double rateBrixPerHour, double startBrix, double finalBrix, double volumeL, KineticsSettings settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        double gramsPerHour = rateBrixPerHour * SugarPerBrix(startBrix, finalBrix) * volumeL;
        double kjPerHour = gramsPerHour / FermentationHeat.HexoseMolarMass * settings.HeatOfFermentationKjPerMol;
        return kjPerHour / 3600.0;
    }
}
