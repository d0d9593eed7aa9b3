using YieldBench.Core.Lots;

namespace YieldBench.Core.Tests.Lots;

public class LotKeyTests
{
    [Fact]
    public void Keys_order_by_season_then_lot_id_ordinally()
    {
        // Given keys of two seasons whose lot ids sort differently by culture and by code point
        LotKey[] keys = [new(2024, "b-1"), new(2023, "Z-9"), new(2024, "B-1"), new(2023, "A-2")];

        // When sorted
        var sorted = keys.Order().Select(k => k.ToString()).ToArray();

        // Then the season comes first and capitals (U+0042) before small letters (U+0062)
        Assert.Equal(["2023/A-2", "2023/Z-9", "2024/B-1", "2024/b-1"], sorted);
    }

    [Fact]
    public void A_key_reads_back_from_its_text_even_with_a_slash_in_the_lot_id()
    {
        // Given a lot id holding a slash
        var key = new LotKey(2025, "T/7");

        // When written and read again
        var again = LotKey.Parse(key.ToString());

        // Then it is the same key, and a text without a season is refused
        Assert.Equal("2025/T/7", key.ToString());
        Assert.Equal(key, again);
        Assert.Throws<FormatException>(() => LotKey.Parse("T-7"));
    }

    [Fact]
    public void Lots_of_the_same_id_in_two_seasons_have_different_keys()
    {
        // Given the same lot id in two seasons
        var a = new LotKey(2023, "L1");
        var b = new LotKey(2024, "L1");

        // Then the keys differ and an equal key is equal
        Assert.NotEqual(a, b);
        Assert.Equal(a, new LotKey(2023, "L1"));
        Assert.True(a < b);
    }
}
