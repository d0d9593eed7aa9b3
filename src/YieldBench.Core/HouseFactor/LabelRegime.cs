using System.Globalization;

namespace YieldBench.Core.HouseFactor;

/// <summary>
/// A label-tolerance regime held as data: how far the lab's alcohol may lie from a stated alcohol (a tolerance that may
/// change size at one alcohol), and a line the stated and actual alcohol may not lie on different sides of (a class or
/// tax boundary). Used only to score backtests — a predicted alcohol is never a label statement (labels follow a lab
/// analysis and the local rules, which must be confirmed for each wine).
/// </summary>
/// <param name="Id">Stable id used on the command line and in data files (<c>us</c>, <c>eu</c>, <c>user</c>).</param>
/// <param name="Name">Plain-language name.</param>
/// <param name="ToleranceAtOrBelowSwitch">Allowed |actual − stated|, % v/v, when the stated alcohol is at or below <see cref="ToleranceSwitchAbv"/> (or always, with no switch).</param>
/// <param name="ToleranceAboveSwitch">Allowed |actual − stated|, % v/v, when the stated alcohol is above <see cref="ToleranceSwitchAbv"/>.</param>
/// <param name="ToleranceSwitchAbv">Alcohol at which the tolerance changes size, % v/v, or null for one tolerance.</param>
/// <param name="NoCrossingLineAbv">Alcohol the stated and actual values may not lie on different sides of (at or below vs above), % v/v, or null for none.</param>
/// <param name="Source">Where the tolerance comes from, with what is confirmed and what is from memory.</param>
/// <param name="NoCrossingLineSource">Where the no-crossing line comes from (or that the user set it).</param>
public sealed record LabelRegime(
    string Id,
    string Name,
    double ToleranceAtOrBelowSwitch,
    double ToleranceAboveSwitch,
    double? ToleranceSwitchAbv,
    double? NoCrossingLineAbv,
    string Source,
    string NoCrossingLineSource)
{
    /// <summary>Said with every regime: the rule scored here is a summary, and the rules that apply must be confirmed.</summary>
    public const string ConfirmLocally = "Local rules must be confirmed: this summary only scores backtests, and rules differ by country, by category of wine and over time.";

    /// <summary>
    /// United States: ±1.5 percentage points when the stated alcohol is at or below 14 % v/v, ±1.0 above 14 %; and the
    /// stated and actual alcohol may not fall in different tax classes, whose first boundary is 16 % v/v for still
    /// wine since 2018.
    /// </summary>
    public static LabelRegime UnitedStates { get; } = new(
        "us",
        "United States (TTB)",
        1.5,
        1.0,
        14.0,
        16.0,
        "27 CFR 4.36(b) as summarised in a TTB bulletin [read]: tolerance ±1.5 percentage points for a stated alcohol at or below 14 % by volume, "
        + "±1.0 above 14 %; a stated value may not put the wine in another tax class. " + ConfirmLocally,
        "The first still-wine tax class runs to 16 % alcohol by volume: 26 U.S.C. 5041(b)(1)–(2) as amended in 2017 (effective 2018) [read, secondary: "
        + "a trade press report of January 2018 quoting a TTB notice that the 27 CFR 4.36 tolerances were unchanged while the lowest tax rate now reaches 16 %]; "
        + "the TTB bulletin's own example, a wine labelled 15.5 % may not contain 16.5 %, is the 16 % line [read]. The amending act's section number is [memory]. "
        + "Before 2018 the line was 14 %; set it with the class-line setting when scoring older rules. " + ConfirmLocally);

    /// <summary>European Union: ±0.5 % vol (the general case; some categories allow ±0.8); no crossing line.</summary>
    public static LabelRegime EuropeanUnion { get; } = new(
        "eu",
        "European Union",
        0.5,
        0.5,
        null,
        null,
        "Commission Delegated Regulation (EU) 2019/33, Art. 44: ±0.5 % vol in general, ±0.8 % vol for some categories [read, summary]; "
        + "OIV international standard for the labelling of wines §2.2: 0.5 % vol [read]. " + ConfirmLocally,
        "No crossing line is modelled for the EU regime.");

    /// <summary>The built-in regimes, by id.</summary>
    public static IReadOnlyList<LabelRegime> BuiltIn { get; } = [UnitedStates, EuropeanUnion];

    /// <summary>A user-defined symmetric tolerance of ±<paramref name="tolerance"/> % v/v with no crossing line.</summary>
    /// <param name="tolerance">Tolerance, % v/v, in (0, 5].</param>
    public static LabelRegime UserDefined(double tolerance)
    {
        if (double.IsNaN(tolerance) || tolerance <= 0 || tolerance > 5)
        {
            throw new ArgumentOutOfRangeException(nameof(tolerance), tolerance, "A label tolerance must be above 0 and at most 5 % v/v.");
        }

        string t = tolerance.ToString("0.###", CultureInfo.InvariantCulture);
        return new LabelRegime("user", $"User-defined ±{t} % v/v", tolerance, tolerance, null, null, "Set by the user; no published source. " + ConfirmLocally, "No crossing line unless set.");
    }

    /// <summary>
    /// This regime with the no-crossing line set by the user to <paramref name="lineAbv"/> % v/v (in (0, 25]), or
    /// removed when null; the name says so.
    /// </summary>
    public LabelRegime WithNoCrossingLine(double? lineAbv)
    {
        if (lineAbv is { } v && (double.IsNaN(v) || v <= 0 || v > 25))
        {
            throw new ArgumentOutOfRangeException(nameof(lineAbv), lineAbv, "A class line must be above 0 and at most 25 % v/v.");
        }

        string line = lineAbv is { } l ? l.ToString("0.##", CultureInfo.InvariantCulture) + " %" : "none";
        return this with
        {
            Name = $"{Name}, class line {line}",
            NoCrossingLineAbv = lineAbv,
            NoCrossingLineSource = lineAbv is null ? "Removed by the user." : $"Set by the user to {line}. " + ConfirmLocally,
        };
    }

    /// <summary>Allowed |actual − stated| for a stated alcohol, % v/v.</summary>
    public double ToleranceFor(double statedAbv) =>
        ToleranceSwitchAbv is { } b && statedAbv > b ? ToleranceAboveSwitch : ToleranceAtOrBelowSwitch;

    /// <summary>True when a lab result <paramref name="actualAbv"/> would meet a statement of <paramref name="statedAbv"/>.</summary>
    public bool Accepts(double statedAbv, double actualAbv)
    {
        if (Math.Abs(actualAbv - statedAbv) > ToleranceFor(statedAbv) + 1e-12)
        {
            return false;
        }

        if (NoCrossingLineAbv is { } line && (statedAbv > line) != (actualAbv > line))
        {
            return false;
        }

        return true;
    }
}
