using System.Globalization;

namespace YieldBench.Core.HouseFactor;

/// <summary>
/// A label-tolerance regime held as data: how far the lab's alcohol may lie from a stated alcohol, and whether the
/// stated and actual values must stay on the same side of a class or tax boundary. Used only to score backtests —
/// a predicted alcohol is never a label statement (labels follow a lab analysis and the local rules).
/// </summary>
/// <param name="Id">Stable id used on the command line and in data files (<c>us</c>, <c>eu</c>, <c>user</c>).</param>
/// <param name="Name">Plain-language name.</param>
/// <param name="ToleranceAtOrBelowBoundary">Allowed |actual − stated|, % v/v, when the stated alcohol is at or below <see cref="BoundaryAbv"/> (or always, with no boundary).</param>
/// <param name="ToleranceAboveBoundary">Allowed |actual − stated|, % v/v, when the stated alcohol is above <see cref="BoundaryAbv"/>.</param>
/// <param name="BoundaryAbv">Class or tax boundary, % v/v, or null for none.</param>
/// <param name="NoCrossingBoundary">True when stated and actual must lie on the same side of the boundary.</param>
/// <param name="Source">Where the rule comes from, with what is confirmed and what is from memory.</param>
public sealed record LabelRegime(
    string Id,
    string Name,
    double ToleranceAtOrBelowBoundary,
    double ToleranceAboveBoundary,
    double? BoundaryAbv,
    bool NoCrossingBoundary,
    string Source)
{
    /// <summary>
    /// United States: ±1.5 percentage points at or below 14 % v/v, ±1.0 above 14 %, and the stated and actual
    /// alcohol may not fall on different sides of the 14 % class/tax boundary.
    /// </summary>
    public static LabelRegime UnitedStates { get; } = new(
        "us",
        "United States (TTB)",
        1.5,
        1.0,
        14.0,
        true,
        "27 CFR 4.36 as summarised in a TTB bulletin [read]: tolerance ±1.5 points at or below 14 % alcohol by volume, ±1.0 above 14 %; "
        + "a stated value may not overlap a prescribed class or tax limit. That the 14 % class/tax boundary is the one applied here is [memory]: confirm the limits "
        + "that apply to your wines with the current regulation.");

    /// <summary>European Union: ±0.5 % vol (the general case; some categories allow ±0.8).</summary>
    public static LabelRegime EuropeanUnion { get; } = new(
        "eu",
        "European Union",
        0.5,
        0.5,
        null,
        false,
        "Commission Delegated Regulation (EU) 2019/33, Art. 44: ±0.5 % vol in general, ±0.8 % vol for some categories [read, summary]; "
        + "OIV international standard for the labelling of wines §2.2: 0.5 % vol [read].");

    /// <summary>The built-in regimes, by id.</summary>
    public static IReadOnlyList<LabelRegime> BuiltIn { get; } = [UnitedStates, EuropeanUnion];

    /// <summary>A user-defined symmetric tolerance of ±<paramref name="tolerance"/> % v/v with no boundary.</summary>
    /// <param name="tolerance">Tolerance, % v/v, in (0, 5].</param>
    public static LabelRegime UserDefined(double tolerance)
    {
        if (double.IsNaN(tolerance) || tolerance <= 0 || tolerance > 5)
        {
            throw new ArgumentOutOfRangeException(nameof(tolerance), tolerance, "A label tolerance must be above 0 and at most 5 % v/v.");
        }

        string t = tolerance.ToString("0.###", CultureInfo.InvariantCulture);
        return new LabelRegime("user", $"User-defined ±{t} % v/v", tolerance, tolerance, null, false, "Set by the user; no published source.");
    }

    /// <summary>Allowed |actual − stated| for a stated alcohol, % v/v.</summary>
    public double ToleranceFor(double statedAbv) =>
        BoundaryAbv is { } b && statedAbv > b ? ToleranceAboveBoundary : ToleranceAtOrBelowBoundary;

    /// <summary>True when a lab result <paramref name="actualAbv"/> would meet a statement of <paramref name="statedAbv"/>.</summary>
    public bool Accepts(double statedAbv, double actualAbv)
    {
        if (Math.Abs(actualAbv - statedAbv) > ToleranceFor(statedAbv) + 1e-12)
        {
            return false;
        }

        if (NoCrossingBoundary && BoundaryAbv is { } b && (statedAbv > b) != (actualAbv > b))
        {
            return false;
        }

        return true;
    }
}
