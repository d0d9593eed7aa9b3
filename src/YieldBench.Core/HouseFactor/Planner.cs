using System.Globalization;
using YieldBench.Core.Conversion;
using YieldBench.Core.Units;

namespace YieldBench.Core.HouseFactor;

/// <summary>Highest harvest sugar that keeps the predicted alcohol under a target at a confidence.</summary>
/// <param name="Strain">Strain the line belongs to (<c>*</c>: pooled).</param>
/// <param name="TargetAbv">Target, % v/v.</param>
/// <param name="Confidence">One-sided confidence that the finished wine stays at or under the target, in (0, 1).</param>
/// <param name="HighestBrix">The answer, °Brix (effective starting sugar), or NaN with a <paramref name="Note"/>.</param>
/// <param name="ErrorAllowance">Upper error bound at the confidence (season-aware, <see cref="SeasonErrorModel.Quantile"/>) subtracted from the target, % v/v (0 at 50 % with no errors).</param>
/// <param name="Note">Why there is no answer, or what it rests on; null when plain.</param>
public sealed record ThresholdAnswer(string Strain, double TargetAbv, double Confidence, double HighestBrix, double ErrorAllowance, string? Note)
{
    /// <summary>
    /// The answer as it is shown to one decimal: <see cref="HighestBrix"/> rounded <em>down</em> to 0.1 °Brix (NaN
    /// stays NaN). It is a highest sugar, so it is never shown above itself: rounded to the nearest, 23.06 °Brix read
    /// 23.1, a must that finishes over the target at the confidence.
    /// </summary>
    public double PickAtOrBelowBrix => RoundDownToTenth(HighestBrix);

    /// <summary>Rounds a °Brix down to 0.1 (a value within 1e-6 of a tenth counts as that tenth, against binary rounding).</summary>
    public static double RoundDownToTenth(double brix) => double.IsFinite(brix) ? Math.Floor(Math.Round(brix * 10, 6)) / 10 : brix;
}

/// <summary>Water add-back that brings a juice to the sugar expected to give a target alcohol.</summary>
/// <param name="TargetBrix">°Brix of the juice after the addition (the measured °Brix when no water is needed).</param>
/// <param name="WaterL">Water to add, L (0 when the juice is already at or below the target).</param>
/// <param name="VolumeAfterL">Juice volume after the addition, L, by the review's mass balance (mass over the density of a sucrose solution of the new °Brix).</param>
/// <param name="After">Predicted alcohol of the diluted must, with intervals.</param>
/// <param name="Note">What the answer rests on or why there is none; null when plain.</param>
public sealed record AddBackAnswer(double TargetBrix, double WaterL, double VolumeAfterL, AlcoholEstimate? After, string? Note);

/// <summary>
/// The potential-alcohol planner. Pure functions of a <see cref="PlanningLine"/>: prediction with intervals, the
/// highest harvest sugar under a target, and water add-back by mass balance. Every answer is an estimate, never a
/// label statement (<see cref="HouseFactorTexts.PlannerCautions"/>).
/// </summary>
public static class Planner
{
    /// <summary>Lowest starting sugar the planner accepts, °Brix: the lower end intake accepts for a starting-sugar cell.</summary>
    public const double LowestMustBrix = 10.0;

    /// <summary>Highest starting sugar the planner accepts, °Brix: the upper end intake accepts for a starting-sugar cell.</summary>
    public const double HighestMustBrix = 40.0;

    /// <summary>Predicted alcohol at a starting sugar, with season-aware 80 % and 95 % intervals from the line's held-out errors.</summary>
    public static AlcoholEstimate Estimate(PlanningLine line, SugarReading startingSugar)
    {
        ArgumentNullException.ThrowIfNull(line);
        return AlcoholEstimate.From(line.Predict(startingSugar.Brix), line.ErrorModel);
    }

    /// <summary>
    /// The highest starting °Brix b with predicted(b) + U(c) ≤ target, where U(c) is the season-aware upper error bound
    /// at one-sided confidence c (<see cref="SeasonErrorModel.Quantile"/>): a must at b or below finishes at or under
    /// the target with probability about c, if the coming season differs from the past ones as they differed among
    /// themselves.
    /// </summary>
    public static ThresholdAnswer HighestSugar(PlanningLine line, double targetAbv, double confidence)
    {
        ArgumentNullException.ThrowIfNull(line);
        if (double.IsNaN(targetAbv) || targetAbv <= 0 || targetAbv > AlcoholContent.MaxPercent)
        {
            throw new ArgumentOutOfRangeException(nameof(targetAbv), targetAbv, "A target alcohol must be above 0 and at most 25 % v/v.");
        }

        if (double.IsNaN(confidence) || confidence <= 0 || confidence >= 1)
        {
            throw new ArgumentOutOfRangeException(nameof(confidence), confidence, "A confidence must be strictly between 0 and 1.");
        }

        string c = Percent(confidence);
        double allowance;
        string? note = null;
        if (line.Errors.Count == 0)
        {
            if (Math.Abs(confidence - 0.5) > 1e-9)
            {
                return new ThresholdAnswer(line.Strain, targetAbv, confidence, double.NaN, double.NaN,
                    $"no held-out errors are known for this predictor, so no answer at {c} confidence can be given; use a house-factor file from a review, or ask at 50 % for the central estimate");
            }

            allowance = 0;
            note = "central estimate only: no held-out errors are known";
        }
        else
        {
            allowance = line.ErrorModel.Quantile(confidence);
            if (double.IsNaN(allowance))
            {
                return new ThresholdAnswer(line.Strain, targetAbv, confidence, double.NaN, double.NaN,
                    $"too few held-out lots ({line.Errors.Count}) for {c} confidence; at least {SeasonErrorModel.MinimumErrors} are needed");
            }
        }

        double brix = line.BrixFor(targetAbv - allowance);
        if (double.IsNaN(brix))
        {
            return new ThresholdAnswer(line.Strain, targetAbv, confidence, double.NaN, allowance,
                "the predictor cannot reach this target within 0–50 °Brix");
        }

        return new ThresholdAnswer(line.Strain, targetAbv, confidence, brix, allowance, note);
    }

    /// <summary>
    /// Water to add to <paramref name="juiceVolumeL"/> litres of juice at <paramref name="measured"/> so that its
    /// predicted alcohol comes to the target (at <paramref name="confidence"/>, when given: to the target less the
    /// upper error bound of <see cref="HighestSugar"/>). The balance is the review's
    /// (<see cref="AdditionBalance.Apply(SugarReading, Lots.Additions, SugarModel)"/>): dissolved solids are kept, water
    /// adds mass, and the juice's fermentable sugar is diluted into the new volume; the °Brix after is the
    /// sugar-equivalent °Brix the review's lots are judged on. For the EU convention this means the sugar after the
    /// addition ÷ 16.83 is the aim — not the table's value at the diluted solids °Brix, which assumes the non-sugar
    /// solids of a riper must.
    /// </summary>
    public static AddBackAnswer WaterAddBack(PlanningLine line, SugarReading measured, double juiceVolumeL, double targetAbv, double? confidence)
    {
        ArgumentNullException.ThrowIfNull(line);
        if (double.IsNaN(juiceVolumeL) || juiceVolumeL <= 0 || juiceVolumeL > 1e9)
        {
            throw new ArgumentOutOfRangeException(nameof(juiceVolumeL), juiceVolumeL, "A juice volume must be above 0 and at most 1e9 L.");
        }

        double aim;
        string? note;
        if (confidence is { } conf)
        {
            var t = HighestSugar(line, targetAbv, conf);
            if (double.IsNaN(t.HighestBrix))
            {
                return new AddBackAnswer(double.NaN, double.NaN, double.NaN, null, t.Note);
            }

            aim = targetAbv - t.ErrorAllowance;
            note = $"aims at a central prediction of {Number(aim)} % v/v, which keeps the wine at or under {Number(targetAbv)} % v/v with {Percent(conf)} confidence";
        }
        else
        {
            aim = targetAbv;
            note = $"aims at a central prediction of {Number(targetAbv)} % v/v";
        }

        double targetBrix = line.BrixFor(aim);
        if (double.IsNaN(targetBrix))
        {
            return new AddBackAnswer(double.NaN, double.NaN, double.NaN, null, "the predictor cannot reach this target within 0–50 °Brix");
        }

        double water = AdditionBalance.WaterForTarget(measured, juiceVolumeL, targetBrix).WaterL;
        if (!(water > 0))
        {
            var now = Estimate(line, measured);
            return new AddBackAnswer(measured.Brix, 0, juiceVolumeL, now,
                $"the juice's predicted alcohol, {Number(now.Predicted)} % v/v, is already at or below the aim of {Number(aim)} % v/v");
        }

        var after = AdditionBalance.Apply(measured, new Lots.Additions(juiceVolumeL, water, null), SugarModel.Default);
        return new AddBackAnswer(after.Effective.Brix, water, after.VolumeAfterL ?? juiceVolumeL + water, AlcoholEstimate.From(line.Predict(after.Effective.Brix), line.ErrorModel), note);
    }

    /// <summary>The threshold table of one line for several targets and confidences (targets outer, confidences inner).</summary>
    public static IReadOnlyList<ThresholdAnswer> Table(PlanningLine line, IReadOnlyList<double> targetsAbv, IReadOnlyList<double> confidences)
    {
        ArgumentNullException.ThrowIfNull(targetsAbv);
        ArgumentNullException.ThrowIfNull(confidences);
        return targetsAbv.SelectMany(t => confidences.Select(c => HighestSugar(line, t, c))).ToArray();
    }

    private static string Percent(double p) => (p * 100).ToString("0.#", CultureInfo.InvariantCulture) + " %";

    private static string Number(double v) => v.ToString("0.0#", CultureInfo.InvariantCulture);
}
