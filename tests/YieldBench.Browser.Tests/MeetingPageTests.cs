using System.Globalization;
using System.Text.Json;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using SkiaSharp;
using Xunit.Abstractions;

namespace YieldBench.Browser.Tests;

/// <summary>
/// report.html of the demo review in a real browser: it renders at a projector's 1280×720 with no console error and
/// fetches nothing, prints within the page budget on A4 and Letter, shows each strain's factor as data/house-factor.json
/// has it, reads fully with scripts off, and its lots table sorts and filters with them on.
/// </summary>
[Trait("Category", "Browser")]
public sealed partial class MeetingPageTests(MeetingPage page, ITestOutputHelper output) : IClassFixture<MeetingPage>
{
    /// <summary>The most pages the demo page may print to, on either paper size (issue 19).</summary>
    private const int MostPages = 8;

    [BrowserFact]
    public async Task At_1280_by_720_the_page_renders_with_no_console_error_fetches_nothing_and_shows_the_decision_first()
    {
        // Given the demo review's page, loaded at a projector's size
        page.RequireBrowser();
        Assert.True(page.ExitCode == 0, "the demo review did not succeed:\n" + page.Console);
        int mark = await page.Load(1280, 720);

        // When it is photographed
        var shot = await page.Page.Send("Page.captureScreenshot", new JsonObject { ["format"] = "png" });
        byte[] png = Convert.FromBase64String(shot.GetProperty("data").GetString()!);
        await File.WriteAllBytesAsync(Path.Combine(MeetingPage.Artifacts, "report-1280x720.png"), png);

        // Then nothing went wrong in the console, the only thing loaded is the page itself
        Assert.True(page.Errors(mark).Count == 0, "console errors:\n" + string.Join("\n", page.Errors(mark)));
        Assert.Equal([page.PageUrl.AbsoluteUri], page.Requests(mark).Distinct());

        // And the screenshot is 1280×720 and not blank: a real share of ink and more than a few colours
        using var bitmap = SKBitmap.Decode(png);
        Assert.Equal((1280, 720), (bitmap.Width, bitmap.Height));
        int inked = 0;
        var colours = new HashSet<uint>();
        for (int y = 0; y < bitmap.Height; y += 2)
        {
            for (int x = 0; x < bitmap.Width; x += 2)
            {
                var c = bitmap.GetPixel(x, y);
                colours.Add((uint)((c.Red >> 3) << 10 | (c.Green >> 3) << 5 | (c.Blue >> 3)));
                if (c.Red + c.Green + c.Blue < 600)
                {
                    inked++;
                }
            }
        }

        double share = inked / (bitmap.Width / 2.0 * (bitmap.Height / 2.0));
        output.WriteLine($"screenshot: {png.Length} bytes, {share:P1} of pixels inked, {colours.Count} colours");
        Assert.InRange(share, 0.03, 0.6);
        Assert.True(colours.Count >= 8, $"only {colours.Count} colours in the screenshot");

        // And the first screen holds the decision: its heading and the pooled factor's row are above the fold
        var fold = await page.Page.Evaluate(
            "(() => { const h = document.getElementById('decisions-h').getBoundingClientRect(); const r = document.querySelector('#decisions table tbody tr').getBoundingClientRect(); return [h.top, r.bottom]; })()");
        Assert.True(fold[0].GetDouble() < 300, $"the decisions heading starts at {fold[0]} px");
        Assert.True(fold[1].GetDouble() < 720, $"the pooled factor's row ends at {fold[1]} px, below the first screen");
    }

    [BrowserFact]
    public async Task Each_section_s_anchor_brings_its_heading_into_view()
    {
        // Given the page at 1280×720
        page.RequireBrowser();
        int mark = await page.Load(1280, 720);
        var ids = (await page.Page.Evaluate("[...document.querySelectorAll('main > section')].map(s => s.id)")).EnumerateArray().Select(e => e.GetString()!).ToArray();
        Assert.Equal(["decisions", "strains", "lots", "ferments", "inputs", "methods", "cautions"], ids);
        double lastScroll = -1;
        foreach (string id in ids)
        {
            // When the contents link of the section is followed
            var where = await page.Page.Evaluate(
                $"(() => {{ document.querySelector('nav a[href=\"#{id}\"]').click(); return [document.getElementById('{id}-h').getBoundingClientRect().top, window.scrollY]; }})()");
            var shot = await page.Page.Send("Page.captureScreenshot", new JsonObject { ["format"] = "png" });
            await File.WriteAllBytesAsync(Path.Combine(MeetingPage.Artifacts, $"section-{id}.png"), Convert.FromBase64String(shot.GetProperty("data").GetString()!));

            // Then its heading is on the screen, and the page never scrolls back up from one section to the next
            Assert.InRange(where[0].GetDouble(), 0, 700);
            Assert.True(where[1].GetDouble() >= lastScroll, $"#{id} scrolled back up, above the section before");
            lastScroll = where[1].GetDouble();
        }

        Assert.Empty(page.Errors(mark));
    }

    [BrowserFact]
    public async Task The_page_prints_to_at_most_eight_pages_on_A4_and_on_Letter()
    {
        // Given the demo review's page
        page.RequireBrowser();
        await page.Load();
        var counts = new List<string>();
        foreach (var (paper, width, height) in new[] { ("A4", 8.27, 11.69), ("Letter", 8.5, 11.0) })
        {
            // When it is printed to PDF on the paper, with the page's own margins
            int mark = page.Page.EventCount;
            var pdf = await page.Page.Send("Page.printToPDF", new JsonObject
            {
                ["paperWidth"] = width,
                ["paperHeight"] = height,
                ["printBackground"] = true,
                ["displayHeaderFooter"] = false,
                ["preferCSSPageSize"] = false,
            });
            byte[] bytes = Convert.FromBase64String(pdf.GetProperty("data").GetString()!);
            await File.WriteAllBytesAsync(Path.Combine(MeetingPage.Artifacts, $"report-{paper}.pdf"), bytes);

            // Then it has between one and eight pages, and printing logged no error
            int pages = PdfPage().Matches(System.Text.Encoding.Latin1.GetString(bytes)).Count;
            counts.Add($"{paper}: {pages} pages, {bytes.Length} bytes");
            Assert.InRange(pages, 1, MostPages);
            Assert.Empty(page.Errors(mark));
        }

        string measured = string.Join("; ", counts) + $"; report.html {new FileInfo(page.PagePath).Length} bytes";
        output.WriteLine(measured);
        await File.WriteAllTextAsync(Path.Combine(MeetingPage.Artifacts, "measured.txt"), measured + "\n");
    }

    [BrowserFact]
    public async Task Each_strain_s_factor_on_the_page_is_house_factor_json_s_to_the_shown_precision()
    {
        // Given the review's house-factor file, read on its own (not through the writer's types)
        page.RequireBrowser();
        using var json = JsonDocument.Parse(await File.ReadAllTextAsync(Path.Combine(page.Output, "data", "house-factor.json")));
        var planning = json.RootElement.GetProperty("planning");
        var lines = planning.GetProperty("strains").EnumerateArray().Prepend(planning.GetProperty("pooled")).ToArray();
        Assert.True(lines.Length >= 3, "the demo's house factor has a pooled line and per-strain lines");

        // When the decisions table's rows are read as the browser shows them
        await page.Load();
        var rows = (await page.Page.Evaluate("[...document.querySelectorAll('#decisions table.decisions tbody tr')].map(r => r.innerText)"))
            .EnumerateArray().Select(r => r.GetString()!).ToArray();

        // Then each line of the file has its row, and the row shows the line's factor as the file has it, at the
        // page's four decimals (the EU convention has no factor of its own in the file, and the row says so)
        Assert.Equal(lines.Length, rows.Length);
        foreach (var line in lines)
        {
            string strain = line.GetProperty("strain").GetString()!;
            string label = strain == "*" ? "All strains" : strain;
            string row = Assert.Single(rows, r => r.StartsWith(label + "\t", StringComparison.Ordinal));
            var numbers = line.EnumerateObject()
                .Where(p => (p.Name == "slope_abv_per_brix" || p.Name.StartsWith("factor", StringComparison.Ordinal)) && p.Value.ValueKind == JsonValueKind.Number)
                .Select(p => p.Value.GetDouble().ToString("0.0000", CultureInfo.InvariantCulture))
                .ToArray();
            if (line.GetProperty("curve").GetString() == "eu-convention")
            {
                Assert.Contains("EU convention", row, StringComparison.Ordinal);
            }
            else
            {
                Assert.NotEmpty(numbers);
            }

            foreach (string n in numbers)
            {
                Assert.True(row.Contains(n, StringComparison.Ordinal), $"row of {label} does not show {n}: {row}");
            }

            output.WriteLine($"{label}: {string.Join(", ", numbers.DefaultIfEmpty("EU convention"))} found in: {row.Replace('\t', '|')}");
        }
    }

    [BrowserFact]
    public async Task With_scripts_off_the_lots_table_holds_every_lot_to_look_at_in_the_page_s_order()
    {
        // Given the page loaded with scripts disabled
        page.RequireBrowser();
        int mark = await page.Load(scripts: false);
        try
        {
            // When the lots table is read
            var lots = await page.Page.Evaluate("[...document.querySelectorAll('#lots-table tbody tr')].map(r => [r.cells.length, r.innerText.trim().length, r.cells[0].innerText])");
            bool filter = (await page.Page.Evaluate("document.getElementById('lots-filter') !== null")).GetBoolean();

            // Then it holds every row the file holds, each complete, and no script control
            string html = await File.ReadAllTextAsync(page.PagePath);
            string body = Regex.Match(html, "<table class=\"lots\".*?<tbody>(.*?)</tbody>", RegexOptions.Singleline).Groups[1].Value;
            int rows = Regex.Count(body, "<tr>");
            Assert.True(rows > 0, "the demo has lots to look at");
            Assert.Equal(rows, lots.GetArrayLength());
            Assert.All(lots.EnumerateArray(), r => Assert.True(r[0].GetInt32() == 6 && r[1].GetInt32() > 20, r.ToString()));

            // And every lot data/flags.csv flags (read on its own: season and lot id columns) has its row
            var shown = lots.EnumerateArray().Select(r => r[2].GetString()!.Trim()).ToHashSet(StringComparer.Ordinal);
            var flagsCsv = await File.ReadAllLinesAsync(Path.Combine(page.Output, "data", "flags.csv"));
            var header = flagsCsv[0].Split(',');
            int lotColumn = Array.IndexOf(header, "lot_id"), seasonColumn = Array.IndexOf(header, "season");
            var flagged = flagsCsv.Skip(1).Select(l => l.Split(',')).Where(f => f.Length > Math.Max(lotColumn, seasonColumn) && f[lotColumn].Length > 0)
                .Select(f => f[seasonColumn] + "/" + f[lotColumn]).ToHashSet(StringComparer.Ordinal);
            Assert.NotEmpty(flagged);
            Assert.Subset(shown, flagged);
            Assert.False(filter);
            Assert.Empty(page.Errors(mark));
        }
        finally
        {
            await page.Page.Send("Emulation.setScriptExecutionDisabled", new JsonObject { ["value"] = false });
        }
    }

    [BrowserFact]
    public async Task With_scripts_on_the_lots_table_filters_by_text_and_sorts_by_a_column()
    {
        // Given the page with its script
        page.RequireBrowser();
        int mark = await page.Load();
        var all = (await page.Page.Evaluate("[...document.querySelectorAll('#lots-table tbody tr')].map(r => r.textContent.toLowerCase())")).EnumerateArray().Select(e => e.GetString()!).ToArray();
        var strains = (await page.Page.Evaluate("[...document.querySelectorAll('#lots-table tbody tr')].map(r => r.cells[1].innerText)")).EnumerateArray().Select(e => e.GetString()!).ToArray();
        string strain = strains.GroupBy(s => s).OrderByDescending(g => g.Count()).First().Key;

        // When the filter is given a strain code, then text that is in no row
        string Filter(string text) =>
            $"(() => {{ const i = document.getElementById('lots-filter'); i.value = '{text}'; i.dispatchEvent(new Event('input')); return [[...document.querySelectorAll('#lots-table tbody tr')].filter(r => !r.hidden).map(r => r.cells[1].innerText), document.querySelector('.filter output').textContent]; }})()";
        var byStrain = await page.Page.Evaluate(Filter(strain));
        var byNothing = await page.Page.Evaluate(Filter("no such lot anywhere"));

        // Then the rows shown are exactly those whose text holds the code (every lot of the strain among them), the count
        // says so, and a text in no row hides every row
        var shown = byStrain[0].EnumerateArray().Select(e => e.GetString()!).ToArray();
        Assert.Equal(all.Count(t => t.Contains(strain.ToLowerInvariant(), StringComparison.Ordinal)), shown.Length);
        Assert.Equal(strains.Count(s => s == strain), shown.Count(s => s == strain));
        Assert.True(shown.Length < all.Length, "a strain's code should not match every lot");
        Assert.Equal($"{shown.Length} of {all.Length} lots shown", byStrain[1].GetString());
        Assert.Equal(0, byNothing[0].GetArrayLength());
        Assert.Equal($"0 of {all.Length} lots shown", byNothing[1].GetString());

        // When the filter is cleared and the Lot column is sorted twice
        string Sort(int times) =>
            $"(() => {{ const i = document.getElementById('lots-filter'); i.value = ''; i.dispatchEvent(new Event('input')); const b = document.querySelector('#lots-table thead th button'); for (let k = 0; k < {times}; k++) b.click(); return [document.querySelector('#lots-table thead th').getAttribute('aria-sort'), [...document.querySelectorAll('#lots-table tbody tr')].map(r => r.cells[0].getAttribute('data-key'))]; }})()";
        var up = await page.Page.Evaluate(Sort(1));
        var down = await page.Page.Evaluate(Sort(1));

        // Then the rows come in ascending, then descending order of lot, and the header says so
        var upKeys = up[1].EnumerateArray().Select(e => e.GetString()!).ToArray();
        var downKeys = down[1].EnumerateArray().Select(e => e.GetString()!).ToArray();
        Assert.Equal("ascending", up[0].GetString());
        Assert.Equal("descending", down[0].GetString());
        Assert.Equal(all.Length, upKeys.Length);
        Assert.Equal(upKeys.Order(StringComparer.Ordinal), upKeys);
        Assert.Equal(upKeys.Reverse(), downKeys);
        Assert.Empty(page.Errors(mark));
    }

    [GeneratedRegex(@"/Type\s*/Page(?![s\w])")]
    private static partial Regex PdfPage();
}
