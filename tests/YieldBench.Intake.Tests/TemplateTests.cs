using ClosedXML.Excel;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Intake.Tests;

public class TemplateTests
{
    [Fact]
    public void The_untouched_template_reads_as_no_lots_and_no_errors()
    {
        // Given a fresh template
        using var folder = new TestFolder();
        TemplateWriter.Write(folder.PathOf("template.xlsx"));

        // When checked
        var set = folder.Read("template.xlsx");

        // Then nothing is read and nothing is wrong: the explanation sheet is listed as not read, with no warning
        // (a sheet-skipped warning told every filled-in template to map the guide's headers with --column)
        Assert.Empty(set.Lots);
        Assert.Empty(set.Logs);
        Assert.Empty(set.Issues);
        Assert.Contains(set.Accounts, a => a.Sheet == TemplateWriter.ColumnsSheet && a.Kind == "not read" && a.RowsRead == 0);
        Assert.Equal(TemplateWriter.LotHeaders.Count, set.Mappings.Count(m => m.Sheet == TemplateWriter.LotsSheet));
        Assert.False(IntakeReport.AnyRowLeftOut(set));
    }

    [Fact]
    public void A_sheet_named_Columns_that_is_not_the_templates_guide_is_still_said_to_be_skipped()
    {
        // Given a workbook with a lots sheet and a sheet of the cellar's own named "Columns" (not the guide's headers)
        using var folder = new TestFolder();
        Workbooks.WriteClosedXml(folder.PathOf("cellar.xlsx"),
            ("Lots", [["Lot", "Season", "Strain", "Brix", "ABV"], ["A-1", 2024, "QH-11", 24.0, 14.1]]),
            ("Columns", [["Tank", "Column of the press"], ["T1", "left"]]));

        // When read
        var set = folder.Read("cellar.xlsx");

        // Then that sheet is warned of as before
        var issue = Assert.Single(set.Issues);
        Assert.Equal(("sheet-skipped", "Columns"), (issue.Code, issue.Sheet));
    }

    [Fact]
    public void The_template_maps_every_header_to_its_own_field()
    {
        using var folder = new TestFolder();
        TemplateWriter.Write(folder.PathOf("template.xlsx"));
        var set = folder.Read("template.xlsx");
        Assert.Equal(Fields.Lots.Select(f => f.Name), set.Mappings.Where(m => m.Sheet == TemplateWriter.LotsSheet).Select(m => m.Field));
        Assert.Equal(["lot_id", "season", "timestamp", "sugar", "temp_c"], set.Mappings.Where(m => m.Sheet == TemplateWriter.LogSheet).Select(m => m.Field));
    }

    [Fact]
    public void The_template_carries_header_notes_a_colour_list_and_number_formats()
    {
        using var folder = new TestFolder();
        TemplateWriter.Write(folder.PathOf("template.xlsx"));
        using var wb = new XLWorkbook(folder.PathOf("template.xlsx"));
        var lots = wb.Worksheet(TemplateWriter.LotsSheet);
        int colourCol = TemplateWriter.LotHeaders.ToList().IndexOf("Colour") + 1;
        int sugarCol = TemplateWriter.LotHeaders.ToList().IndexOf("Starting sugar (°Brix)") + 1;
        Assert.Contains("Unit: °Brix. Required.", lots.Cell(1, sugarCol).Comment.Text, StringComparison.Ordinal);
        var validation = lots.Cell(2, colourCol).DataValidation;
        Assert.Equal(XLAllowedValues.List, validation.AllowedValues);
        Assert.Equal("\"red,white,rosé\"", validation.Value);
        Assert.Equal("0.0", lots.Cell(2, sugarCol).Style.NumberFormat.Format);
        Assert.Equal(["Lots", "Fermentation log", "Columns"], wb.Worksheets.Select(w => w.Name));
        Assert.Equal("starting_sugar", wb.Worksheet("Columns").Column(3).CellsUsed().Select(c => c.GetString()).First(s => s.StartsWith("starting", StringComparison.Ordinal)));
    }

    [Fact]
    public void A_filled_in_template_round_trips()
    {
        // Given the template filled in by a cellar
        using var folder = new TestFolder();
        string path = folder.PathOf("filled.xlsx");
        TemplateWriter.Write(path);
        using (var wb = new XLWorkbook(path))
        {
            var lots = wb.Worksheet(TemplateWriter.LotsSheet);
            Workbooks.Fill(lots,
                [.. TemplateWriter.LotHeaders],
                ["W24-07", 2024, "QX-3", "white", "tank", 3000, "Riesling", "East 2", 2500, 50, 10, 21.5, 12.4, 4.2, -1.1, 180, 3.2, 7.1, 15.5, 17.0, new DateTime(2024, 3, 9), new DateTime(2024, 3, 30), "cool ferment"]);
            Workbooks.Fill(wb.Worksheet(TemplateWriter.LogSheet),
                [.. TemplateWriter.LogHeaders],
                ["W24-07", 2024, new DateTime(2024, 3, 10, 7, 45, 0), 20.9, 14.5]);
            wb.Save();
        }

        // When read
        var set = folder.Read("filled.xlsx");

        // Then every value comes back as entered
        var lot = Assert.Single(set.Lots);
        Assert.Equal(new Lot
        {
            LotId = "W24-07", Season = 2024, Strain = "QX-3", Colour = WineColour.White, Vessel = "tank", VesselCapacityL = 3000,
            Variety = "Riesling", Block = "East 2", Additions = new Additions(2500, 50, 10), StartingSugar = SugarReading.FromBrix(21.5),
            RecordedStartingSugar = new RecordedSugar(21.5, SugarScale.Brix),
            FinalAlcohol = AlcoholContent.FromPercentVolume(12.4), ResidualSugarGl = 4.2, FinalSugar = SugarReading.FromBrix(-1.1), YanMgL = 180,
            Ph = 3.2, TaGl = 7.1, MeanFermentationTempC = 15.5, PeakFermentationTempC = 17.0, InoculationDate = new DateTime(2024, 3, 9),
            DryDate = new DateTime(2024, 3, 30), Notes = "cool ferment", Source = new SourceRef("filled.xlsx", "Lots", 2),
        }, lot);
        var reading = Assert.Single(Assert.Single(set.Logs).Readings);
        Assert.Equal((new DateTime(2024, 3, 10, 7, 45, 0), 20.9, 14.5), (reading.Timestamp, reading.Sugar!.Value.Brix, reading.TemperatureC!.Value));
        Assert.Equal(["log-too-short"], set.Issues.Select(i => i.Code)); // the guide sheet is no longer warned of
    }
}
