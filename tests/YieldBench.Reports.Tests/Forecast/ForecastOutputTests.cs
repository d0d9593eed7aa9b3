using YieldBench.Reports.Forecast;

namespace YieldBench.Reports.Tests.Forecast;

public class ForecastOutputTests
{
    [Fact]
    public void The_warm_up_draws_a_chart_and_lays_out_a_workbook_of_an_invented_lot_without_failing()
    {
        // When the forecast's warm-up runs (the command runs it on a spare core while reading its inputs; it works in
        // memory and takes no path, so it cannot write a file)
        var failure = Record.Exception(ForecastOutput.WarmUp);

        // Then the chart and workbook code took its invented lot (an open dry interval, a missing reachable point)
        Assert.Null(failure);
    }
}
