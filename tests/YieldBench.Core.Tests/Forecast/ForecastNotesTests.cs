using YieldBench.Core.Forecast;

namespace YieldBench.Core.Tests.Forecast;

/// <summary>The forecast's notes as a winemaker reads them: one line per lot while few, one line per kind when many.</summary>
public sealed class ForecastNotesTests
{
    private static ForecastNote NoVolume(int i) =>
        new(2026, $"26-{i:0000}", "no-volume", $"Lot 26-{i:0000} has no must volume or vessel capacity: the cooling power is not given.");

    [Fact]
    public void Three_hundred_lots_without_a_volume_are_said_once_with_the_other_lots_named()
    {
        // Given 300 running lots with no must volume and one lot with no sugar reading
        var notes = Enumerable.Range(1, 300).Select(NoVolume)
            .Append(new ForecastNote(2026, "26-0400", "no-readings", "Lot 26-0400 has no sugar reading yet: its forecast is the strain's usual course from the inoculation."))
            .ToArray();

        // When the notes are worded
        var lines = ForecastSentences.Notes(notes);

        // Then there are two lines, not 301: the first lot's note naming 20 of the other 299 and counting the rest,
        // then the single other note as it was
        Assert.Equal(2, lines.Count);
        Assert.StartsWith("Lot 26-0001 has no must volume or vessel capacity: the cooling power is not given. Likewise for 299 more lots: 26-0002, 26-0003,", lines[0], StringComparison.Ordinal);
        Assert.EndsWith(", 26-0021 and 279 more.", lines[0], StringComparison.Ordinal);
        Assert.Equal(notes[^1].Message, lines[1]);
    }

    [Fact]
    public void Five_notes_of_a_kind_stay_one_line_each()
    {
        // Given five lots with no must volume
        var notes = Enumerable.Range(1, 5).Select(NoVolume).ToArray();

        // Then each keeps its own line
        Assert.Equal(notes.Select(n => n.Message), ForecastSentences.Notes(notes));
    }
}
