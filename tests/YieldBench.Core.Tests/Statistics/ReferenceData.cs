namespace YieldBench.Core.Tests.Statistics;

/// <summary>Published data sets used as oracles.</summary>
internal static class ReferenceData
{
    /// <summary>
    /// <c>chem</c> from R package MASS (Analytical Methods Committee 1989): 24 determinations of copper in wholemeal
    /// flour, µg/g, with the gross outlier 28.95.
    /// </summary>
    public static readonly double[] Chem =
    [
        2.90, 3.10, 3.40, 3.40, 3.70, 3.70, 2.80, 2.50, 2.40, 2.40, 2.70, 2.20,
        5.28, 3.37, 3.03, 3.03, 28.95, 3.77, 3.40, 2.20, 3.50, 3.60, 3.70, 3.70,
    ];

    /// <summary>stackloss (Brownlee 1965), R datasets: Air.Flow, Water.Temp, Acid.Conc., stack.loss.</summary>
    public static readonly double[,] StackLoss =
    {
        { 80, 27, 89, 42 }, { 80, 27, 88, 37 }, { 75, 25, 90, 37 }, { 62, 24, 87, 28 }, { 62, 22, 87, 18 },
        { 62, 23, 87, 18 }, { 62, 24, 93, 19 }, { 62, 24, 93, 20 }, { 58, 23, 87, 15 }, { 58, 18, 80, 14 },
        { 58, 18, 89, 14 }, { 58, 17, 88, 13 }, { 58, 18, 82, 11 }, { 58, 19, 93, 12 }, { 50, 18, 89, 8 },
        { 50, 18, 86, 7 }, { 50, 19, 72, 8 }, { 50, 19, 79, 8 }, { 50, 20, 80, 9 }, { 56, 20, 82, 15 },
        { 70, 20, 91, 15 },
    };
}
