using YieldBench.Reports.Charts;

namespace YieldBench.Reports.Tests.Charts;

public sealed class RenderAllTests
{
    private static Func<ChartFile> Job(int i, Action? before = null) => () =>
    {
        before?.Invoke();
        Thread.Sleep((7 - (i % 7)) * 2);
        return new ChartFile($"/charts/{i}.png", $"chart {i}", 1600, 1000);
    };

    [Fact]
    public void Results_come_back_in_the_jobs_order_whatever_the_start_order()
    {
        // Given twenty jobs of uneven length, two of them to start first
        var jobs = Enumerable.Range(0, 20).Select(i => Job(i)).ToArray();

        // When they are run
        var results = ChartImage.RenderAll(jobs, [12, 5]);

        // Then every job ran once and the results are in the jobs' order
        Assert.Equal(Enumerable.Range(0, 20).Select(i => $"chart {i}"), results.Select(r => r.Title));
    }

    [Fact]
    public void A_failing_job_is_reported_and_later_jobs_are_not_started()
    {
        // Given forty jobs of which the first throws
        int started = 0;
        var jobs = Enumerable.Range(0, 40).Select(i => Job(i, () =>
        {
            Interlocked.Increment(ref started);
            if (i == 0)
            {
                throw new IOException("disk full");
            }
        })).ToArray();

        // When they are run
        var error = Assert.Throws<AggregateException>(() => ChartImage.RenderAll(jobs));

        // Then the failure is carried, and the workers stopped taking jobs (each finishes at most the one it holds)
        Assert.Contains(error.InnerExceptions, e => e is IOException { Message: "disk full" });
        Assert.True(started < 40, $"{started} jobs started");
    }

    [Fact]
    public void Jobs_to_start_first_must_be_distinct_indices()
    {
        var jobs = Enumerable.Range(0, 3).Select(i => Job(i)).ToArray();
        Assert.Throws<ArgumentException>(() => ChartImage.RenderAll(jobs, [3]));
        Assert.Throws<ArgumentException>(() => ChartImage.RenderAll(jobs, [1, 1]));
        Assert.Empty(ChartImage.RenderAll([]));
    }
}
