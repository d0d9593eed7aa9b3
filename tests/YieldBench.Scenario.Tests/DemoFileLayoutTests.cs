using System.Globalization;
using System.Text;
using ClosedXML.Excel;

namespace YieldBench.Scenario.Tests;

/// <summary>The demo files are laid out as a cellar keeps them, and their cells hold the generated values.</summary>
public class DemoFileLayoutTests
{
    private static readonly ScenarioData Demo = ScenarioGenerator.Demo();

    [Fact]
    public void Season_workbook_has_a_title_a_blank_row_the_header_on_row_3_the_lots_and_an_average_row()
    {
        // Given the committed 2023 workbook
        using var wb = new XLWorkbook(Path.Combine(RepoPaths.DemoHistory, "tallowmere-2023-lots.xlsx"));
        var ws = wb.Worksheet("Finished lots");
        var season = Demo.Seasons.Single(s => s.Profile.Year == 2023);
        int lastLotRow = 3 + season.Lots.Count;

        // Then row 1 is the title, row 2 is blank, row 3 is the header, the lots follow, then a blank row and "Average"
        Assert.StartsWith("Tallowmere Estate: 2023 harvest", ws.Cell(1, 1).GetString(), StringComparison.Ordinal);
        Assert.True(ws.Row(2).IsEmpty());
        Assert.Equal("Lot", ws.Cell(3, 1).GetString());
        Assert.Equal("Start Brix (°Bx)", ws.Cell(3, 9).GetString());
        Assert.Equal(season.Lots[0].Recorded.LotId, ws.Cell(4, 1).GetString());
        Assert.Equal(season.Lots[^1].Recorded.LotId, ws.Cell(lastLotRow, 1).GetString());
        Assert.True(ws.Row(lastLotRow + 1).IsEmpty());
        Assert.Equal("Average", ws.Cell(lastLotRow + 2, 1).GetString());

        // And the Average row's alcohol is the mean of the lots' alcohol, to two decimals
        double mean = Math.Round(season.Lots.Average(l => l.Recorded.FinalAlcohol.PercentVolume), 2);
        Assert.Equal(mean, ws.Cell(lastLotRow + 2, 13).GetDouble(), 10);
    }

    [Fact]
    public void Season_workbook_cells_hold_the_recorded_values_and_real_dates()
    {
        // Given the 2024 workbook (specific gravity season) and its generated lots
        using var wb = new XLWorkbook(Path.Combine(RepoPaths.DemoHistory, "tallowmere-2024-lots.xlsx"));
        var ws = wb.Worksheet("Finished lots");
        var lots = Demo.Seasons.Single(s => s.Profile.Year == 2024).Lots;

        // Then the header says "Must SG", and every row's SG, alcohol and inoculation time match the generated lot
        Assert.Equal("Must SG", ws.Cell(3, 9).GetString());
        for (int i = 0; i < lots.Count; i++)
        {
            var l = lots[i];
            int row = 4 + i;
            Assert.Equal(l.Recorded.LotId, ws.Cell(row, 1).GetString());
            Assert.Equal(l.RecordedStartingValue, ws.Cell(row, 9).GetDouble(), 10);
            Assert.Equal(l.Recorded.FinalAlcohol.PercentVolume, ws.Cell(row, 13).GetDouble(), 10);
            Assert.Equal(l.Recorded.InoculationDate!.Value, ws.Cell(row, 19).GetDateTime(), TimeSpan.FromSeconds(1));
        }
    }

    [Fact]
    public void Semicolon_file_uses_decimal_commas_that_parse_back_to_the_recorded_values()
    {
        // Given the 2025 CSV and a parser set up for decimal commas
        var bytes = File.ReadAllBytes(Path.Combine(RepoPaths.DemoHistory, "tallowmere-2025-lots.csv"));
        var comma = new NumberFormatInfo { NumberDecimalSeparator = "," };
        var lines = Encoding.UTF8.GetString(bytes.AsSpan(3)).Split("\r\n", StringSplitOptions.RemoveEmptyEntries);
        var lots = Demo.Seasons.Single(s => s.Profile.Year == 2025).Lots;

        // Then it starts with a UTF-8 BOM, has a header and one line per lot with 21 fields,
        // and each line's °Brix and alcohol parse back to the generated values
        Assert.Equal(Encoding.UTF8.GetPreamble(), bytes[..3]);
        Assert.Equal(lots.Count + 1, lines.Length);
        Assert.Equal(21, lines[0].Split(';').Length);
        for (int i = 0; i < lots.Count; i++)
        {
            var f = lines[i + 1].Split(';');
            Assert.Equal(21, f.Length);
            Assert.Equal(lots[i].RecordedStartingValue, double.Parse(f[8], NumberStyles.Float, comma), 10);
            Assert.Equal(lots[i].Recorded.FinalAlcohol.PercentVolume, double.Parse(f[12], NumberStyles.Float, comma), 10);
            Assert.Contains(",", f[12], StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Logs_workbook_has_a_long_sheet_per_season_and_a_sheet_per_probe_lot()
    {
        // Given the logs workbook
        using var wb = new XLWorkbook(Path.Combine(RepoPaths.DemoHistory, DemoDataWriter.LogsFileName));
        var probeIds = Demo.AllLots.Where(l => l.LogIsProbe).Select(l => l.Recorded.LotId).ToArray();

        // Then the sheets are the three season logs and one per probe lot
        Assert.Equal(["Logs 2023", "Logs 2024", "Logs 2025", .. probeIds], wb.Worksheets.Select(w => w.Name));

        // And the long sheets hold every hand reading; 2024's sugar column is SG
        int handReadings = Demo.AllLots.Where(l => l.Log is not null && !l.LogIsProbe).Sum(l => l.Log!.Readings.Count);
        int rows = new[] { "Logs 2023", "Logs 2024", "Logs 2025" }.Sum(n => wb.Worksheet(n).LastRowUsed()!.RowNumber() - 1);
        Assert.Equal(handReadings, rows);
        Assert.Equal("SG", wb.Worksheet("Logs 2024").Cell(1, 4).GetString());
        Assert.Equal("Brix", wb.Worksheet("Logs 2023").Cell(1, 4).GetString());
        Assert.Equal("Timestamp", wb.Worksheet(probeIds[0]).Cell(1, 1).GetString());
    }

    [Fact]
    public void Readme_lists_every_planted_lot_and_the_caution()
    {
        // Given the committed README
        string readme = File.ReadAllText(Path.Combine(RepoPaths.DemoData, "README.md"));

        // Then every planted lot id and its first expected code appear, and the label caution is stated
        foreach (var p in Demo.PlantedCases)
        {
            Assert.Contains($"| {p.LotId} | {p.Season} |", readme, StringComparison.Ordinal);
            if (p.ExpectedCodes.Count > 0)
            {
                Assert.Contains($"`{p.ExpectedCodes[0]}`", readme, StringComparison.Ordinal);
            }
        }

        Assert.Contains("not a label statement", readme, StringComparison.Ordinal);
    }
}
