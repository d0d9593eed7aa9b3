using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Units;
using static System.FormattableString;

namespace YieldBench.Core.Review.Strains.Detectors;

/// <summary>
/// <c>possible-transposed-digits</c>: two neighbouring digits of the recorded starting sugar (on the same side of the
/// decimal point), swapped, would put an off-line lot back on its strain line. Tried on the value as recorded, in its own scale, with the lot's additions
/// applied under the review's sugar model.
/// </summary>
internal static class TranspositionDetector
{
    /// <summary>A swapped starting sugar is tried only when it lies in this range of °Brix (any must a cellar ferments).</summary>
    private const double MinBrix = 5, MaxBrix = 45;

    /// <summary>The flag, or null when no swap fits.</summary>
    public static LotFlag? Swap(LotContext c, StrainLine line)
    {
        var lot = c.Lot;
        var recorded = lot.Conversion.Lot;
        var scale = recorded.RecordedStartingSugar.Scale;
        int decimals = scale switch
        {
            SugarScale.Brix or SugarScale.Baume => 1,
            SugarScale.SpecificGravity => 3,
            _ => 0,
        };
        double value = recorded.RecordedStartingSugar.Value;
        string text = Math.Round(value, decimals).ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
        string digits = text.Replace(".", string.Empty, StringComparison.Ordinal).TrimStart('-');
        if (text.StartsWith('-'))
        {
            return null;
        }

        // A swap of the digits either side of the decimal point is not a transposition: a slip of the hand swaps two
        // neighbouring keys, and the point between them is written too (27.3 → 23.7 is a different number, not a slip).
        int lastWholeDigit = digits.Length - decimals - 1;
        (double Brix, double Z, string Text)? best = null;
        for (int i = 0; i + 1 < digits.Length; i++)
        {
            if (digits[i] == digits[i + 1] || (decimals > 0 && i == lastWholeDigit))
            {
                continue;
            }

            var chars = digits.ToCharArray();
            (chars[i], chars[i + 1]) = (chars[i + 1], chars[i]);
            string swapped = new string(chars);
            string candidateText = decimals > 0 ? swapped[..^decimals] + "." + swapped[^decimals..] : swapped;
            double candidate = double.Parse(candidateText, CultureInfo.InvariantCulture);
            if (!SugarReading.TryFrom(candidate, scale, MinBrix, MaxBrix, out var reading, out _))
            {
                continue;
            }

            double effective = AdditionBalance.Apply(reading, recorded.Additions, c.SugarModel).Effective.Brix;
            double z = (lot.Abv - line.Line.Predict(effective)) / line.Scale;
            if (Math.Abs(z) <= c.Settings.TranspositionFitZ && (best is null || Math.Abs(z) < Math.Abs(best.Value.Z)))
            {
                best = (effective, z, candidateText.TrimStart('0') is { Length: > 0 } t && !t.StartsWith('.') ? t : candidateText);
            }
        }

        if (best is not { } found)
        {
            return null;
        }

        string unit = SugarScales.Label(scale);
        return c.Make(
            FlagCodes.PossibleTransposedDigits,
            FlagSeverity.LikelyError,
            "starting_brix",
            lot.Brix,
            line.Name,
            found.Brix,
            line.Scale,
            Invariant($"the starting sugar was recorded as {text} {unit}; with two neighbouring digits swapped ({found.Text} {unit}) the lot's {lot.Abv:0.00} % v/v would sit on the line of {line.Name} (residual {found.Z:+0.0;-0.0} scales instead of {c.LineZ:+0.0;-0.0})"),
            FollowUps.RecheckStartingSugar + "; check the original harvest or crush record for a copying slip") with
        {
            Suggestion = found.Text + " " + unit,
            Recorded = text + " " + unit,
        };
    }
}
