using YieldBench.Core.Forecast;

namespace YieldBench.Core.Tests.Forecast;

public class ByColourHeadingTests
{
    private static BacktestResult Result(double[] redHours, double[] whiteHours)
    {
        // Each lot scored at two cuts (its one-third time is the same truth at both) and a dry case that must not count
        var cases = new List<BacktestCase>();
        void Add(string colour, double[] hours)
        {
            for (int i = 0; i < hours.Length; i++)
            {
                foreach (int cut in new[] { 2, 3 })
                {
                    cases.Add(new BacktestCase(2024, $"{colour}-{i}", "one_third", cut, hours[i], new ForecastValue(hours[i], hours[i] - 5, hours[i] + 5), hours[i], hours[i], colour));
                }

                cases.Add(new BacktestCase(2024, $"{colour}-{i}", "dry", 2, 1000, new ForecastValue(1000, 900, 1100), 1000, 1000, colour));
            }
        }

        Add("red", redHours);
        Add("white", whiteHours);
        return new BacktestResult([], cases, [2024, 2025]);
    }

    [Fact]
    public void The_heading_gives_each_colours_median_time_to_one_third_from_the_lots_scored()
    {
        // Given reds at one-third after 50, 58 and 60 h and whites after 140, 148 and 150 h
        var result = Result([50, 58, 60], [150, 148, 140]);

        // When the backtest by colour is headed
        string heading = ForecastSentences.ByColourHeading(result);

        // Then it says the medians (58 h, 148 h) and their ratio, 148/58 = 2.55
        Assert.Equal("By colour (whites and rosés took a median 148 h to one-third against 58 h for reds in the lots scored: 2.6 times as long, so their errors in hours are larger)", heading);
    }

    [Fact]
    public void A_cellar_whose_whites_ferment_as_fast_as_its_reds_is_not_told_they_are_three_times_slower()
    {
        // Given reds and whites both near 110 h to one-third (an invented cellar that ferments its whites warm)
        var result = Result([100, 110, 120], [105, 112, 115]);

        // When the backtest by colour is headed
        string heading = ForecastSentences.ByColourHeading(result);

        // Then it says so, and no fixed claim about whites
        Assert.Equal("By colour (whites and rosés took a median 112 h to one-third against 110 h for reds in the lots scored: about as long)", heading);
    }

    [Fact]
    public void With_one_colour_scored_the_heading_claims_no_comparison()
    {
        Assert.Equal("By colour (reds, and whites and rosés)", ForecastSentences.ByColourHeading(Result([50, 60], [])));
    }
}
