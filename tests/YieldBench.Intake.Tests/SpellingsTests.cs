namespace YieldBench.Intake.Tests;

public class SpellingsTests
{
    [Theory]
    [InlineData("RC-11", "RC11")]
    [InlineData("rc 11", "RC11")]
    [InlineData(" Stainless  tank ", "STAINLESSTANK")]
    [InlineData("--", "")]
    public void Spellings_compare_by_their_letters_and_digits_in_upper_case(string text, string key)
    {
        Assert.Equal(key, Spellings.Key(text));
    }

    [Fact]
    public void A_typed_strain_is_settled_to_the_spelling_the_review_read()
    {
        // Given the strains a review read
        string[] known = ["YB-R12", "YB-N05", "Barrel"];

        // When a user types them in another case or with other punctuation
        // Then each is the known spelling; an unknown one or punctuation alone is none
        Assert.Equal("YB-R12", Spellings.Settle("yb-r12", known));
        Assert.Equal("YB-R12", Spellings.Settle("YB R12", known));
        Assert.Equal("YB-N05", Spellings.Settle("YB-N05", known));
        Assert.Equal("Barrel", Spellings.Settle("barrel", known));
        Assert.Null(Spellings.Settle("YB-R13", known));
        Assert.Null(Spellings.Settle("-", known));
    }

    [Fact]
    public void An_exact_spelling_wins_over_another_of_the_same_key()
    {
        Assert.Equal("rc-11", Spellings.Settle("rc-11", ["RC-11", "rc-11"]));
    }
}
