using System.Data;
using YieldBench.Reports.Charts;
using YieldBench.Reports.Tests.Fixtures;
using YieldBench.Reports.Workbook;

namespace YieldBench.Reports.Tests.Workbook;

/// <summary>The workbook's Overview for a small cellar: one season, a strain of nine lots and one of a single lot.</summary>
public sealed class SmallCellarWorkbookTests
{
    [Fact]
    public void The_overview_of_a_small_cellar_says_what_is_true_of_it()
    {
        // Given the workbook of one season of ten lots: SM-A (9 lots) and SM-B (1 lot), scored by leaving one lot out
        var review = Cellars.Small();
        byte[] bytes = WorkbookWriter.Build(review, [], includePictures: false);

        // When the Overview is read
        var overview = WorkbookTests.ReadSheet(bytes, "Overview");
        var texts = overview.Rows.Cast<DataRow>().Select(r => r[0]).OfType<string>().ToArray();
        var header = overview.Rows.Cast<DataRow>().First(r => r.ItemArray.OfType<string>().Any(s => s.StartsWith("Held-out lots", StringComparison.Ordinal)));
        var factorRows = overview.Rows.Cast<DataRow>().Where(r => r[0] is "SM-A" or "SM-B").Take(2).ToArray();
        int lotsColumn = Enumerable.Range(0, overview.Columns.Count).First(c => header[c] is string s && s.StartsWith("Held-out lots", StringComparison.Ordinal));

        // Then the ranges are said to come from lots held out (not seasons), SM-B is named as left out of the
        // comparison with the reason, the single strain compared is not set against nothing, a count of one lot is
        // singular, and a strain not scored on its own shows no held-out lot count (not 0)
        Assert.Contains(texts, t => t.Contains("by the error on lots held out.", StringComparison.Ordinal));
        Assert.DoesNotContain(texts, t => t.Contains("seasons held out", StringComparison.Ordinal));
        Assert.Contains("SM-B (1 lot) is left out of the comparison: a strain needs at least 5 lots to be compared, and until then its lots are judged against all lots.", texts);
        Assert.Contains("One strain has enough lots to be compared, so there is nothing to compare it with.", texts);
        Assert.DoesNotContain(texts, t => t.Contains("lot(s)", StringComparison.Ordinal));
        Assert.Equal(2, factorRows.Length);
        Assert.All(factorRows, r => Assert.True(r[lotsColumn] is DBNull, $"{r[0]}: held-out lots {r[lotsColumn]}"));
    }

    [Fact]
    public void A_cellar_with_no_logs_is_not_pointed_to_a_kinetics_sheet_it_does_not_have()
    {
        // Given a review that read no fermentation log, and one that did
        var noLogs = Cellars.Small();
        var withLogs = SampleReview.WithLogs();

        // When the workbooks are built and the cautions read
        byte[] bytes = WorkbookWriter.Build(noLogs, [], includePictures: false);
        var texts = WorkbookTests.ReadSheet(bytes, "Overview").Rows.Cast<DataRow>().Select(r => r[0]).OfType<string>().ToArray();
        string heat = Assert.Single(noLogs.Overview.Cautions, c => c.StartsWith("Fermentation heat", StringComparison.Ordinal));

        // Then without logs the heat caution stands but says there was no log;
        // with logs it points to the sheet as before
        Assert.Contains(heat, texts);
        Assert.Contains(heat, WorkbookTests.ReadSheet(bytes, "Methods and cautions").Rows.Cast<DataRow>().Select(r => r[0]).OfType<string>());
        Assert.Contains("This review read no fermentation log", heat, StringComparison.Ordinal);
        Assert.DoesNotContain(noLogs.Overview.Cautions, c => c.Contains("the kinetics sheet shows", StringComparison.Ordinal));
        Assert.Contains(withLogs.Overview.Cautions, c => c.Contains("ferments; the kinetics sheet shows how far without cooling.", StringComparison.Ordinal));
    }
}
