using YieldBench.Core.Kinetics;
using YieldBench.Core.Review;
using YieldBench.Core.Review.Strains;

namespace YieldBench.Core.Tests.Review;

public sealed class ReviewTextsTests
{
    [Fact]
    public void Every_flag_and_finding_code_has_plain_words_of_its_own()
    {
        // Given every code the strain review and the kinetics analysis can write, and the code of a lot without a log
        string[] codes = [.. FlagCodes.All, .. KineticsCodes.All, "no-log"];

        // When each is put in plain words
        var words = codes.Select(ReviewTexts.FlagName).ToArray();

        // Then none is left as its code, and no two codes read the same
        Assert.All(codes.Zip(words), p => Assert.NotEqual(p.First, p.Second));
        Assert.Equal(words.Length, words.Distinct(StringComparer.Ordinal).Count());
    }

    [Fact]
    public void A_p_value_is_never_printed_as_zero()
    {
        // Then a p below 0.0001 reads "< 0.0001", others four decimals, and a missing one "n/a"
        Assert.Equal("< 0.0001", ReviewTexts.P(3e-9));
        Assert.Equal("0.0123", ReviewTexts.P(0.01234));
        Assert.Equal("n/a", ReviewTexts.P(double.NaN));
    }
}
