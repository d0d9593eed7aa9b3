using System.Globalization;

namespace YieldBench.Core.Lots;

/// <summary>
/// A lot's identity across seasons: its season and the cellar's lot id (unique within a season). Keys compare by
/// season, then lot id (ordinal); written as "season/lot" (e.g. <c>2023/23-016</c>) wherever a report shows one.
/// </summary>
/// <param name="Season">Season (vintage year).</param>
/// <param name="LotId">The cellar's lot identifier.</param>
public readonly record struct LotKey(int Season, string LotId) : IComparable<LotKey>
{
    /// <summary>The lot id, never null (a default key has an empty one).</summary>
    public string LotId { get; init; } = LotId ?? string.Empty;

    /// <inheritdoc/>
    public int CompareTo(LotKey other)
    {
        int c = Season.CompareTo(other.Season);
        return c != 0 ? c : string.CompareOrdinal(LotId, other.LotId);
    }

    /// <summary>"season/lot", as reports write a lot.</summary>
    public override string ToString() => Season.ToString(CultureInfo.InvariantCulture) + "/" + LotId;

    /// <summary>Reads "season/lot" (the text <see cref="ToString"/> writes); the lot id may itself hold '/'.</summary>
    /// <exception cref="FormatException">The text has no season before a '/'.</exception>
    public static LotKey Parse(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        int slash = text.IndexOf('/', StringComparison.Ordinal);
        if (slash <= 0 || !int.TryParse(text.AsSpan(0, slash), NumberStyles.None, CultureInfo.InvariantCulture, out int season))
        {
            throw new FormatException($"'{text}' is not a lot key (season/lot).");
        }

        return new LotKey(season, text[(slash + 1)..]);
    }

    /// <summary>Orders keys by season, then lot id (ordinal).</summary>
    public static bool operator <(LotKey left, LotKey right) => left.CompareTo(right) < 0;

    /// <summary>Orders keys by season, then lot id (ordinal).</summary>
    public static bool operator >(LotKey left, LotKey right) => left.CompareTo(right) > 0;

    /// <summary>Orders keys by season, then lot id (ordinal).</summary>
    public static bool operator <=(LotKey left, LotKey right) => left.CompareTo(right) <= 0;

    /// <summary>Orders keys by season, then lot id (ordinal).</summary>
    public static bool operator >=(LotKey left, LotKey right) => left.CompareTo(right) >= 0;
}
