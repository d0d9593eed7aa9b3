using YieldBench.Core.Conversion;

namespace YieldBench.Core.HouseFactor;

/// <summary>
/// A seeded random sample of training lots for candidates whose training cost grows faster than their accuracy
/// with the lot count. A line or a linear model of a few coefficients is estimated to well within the lot-to-lot
/// noise from 10,000–20,000 lots; beyond that, more lots add training time and nothing measurable to a prediction.
/// </summary>
public static class TrainingSample
{
    /// <summary>
    /// The lots themselves when there are at most <paramref name="maximum"/>; otherwise <paramref name="maximum"/> of
    /// them drawn without replacement by a shuffle seeded with <paramref name="seed"/>, kept in their input order.
    /// </summary>
    public static IReadOnlyList<LotConversion> Of(IReadOnlyList<LotConversion> lots, int maximum, int seed)
    {
        ArgumentNullException.ThrowIfNull(lots);
        ArgumentOutOfRangeException.ThrowIfLessThan(maximum, 1);
        if (lots.Count <= maximum)
        {
            return lots;
        }

        var order = Enumerable.Range(0, lots.Count).ToArray();
        new Random(seed).Shuffle(order);
        var chosen = order.AsSpan(0, maximum).ToArray();
        Array.Sort(chosen);
        var sample = new LotConversion[maximum];
        for (int i = 0; i < maximum; i++)
        {
            sample[i] = lots[chosen[i]];
        }

        return sample;
    }
}
