using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Intake.Tests;

public class ReadingTests
{
    private static readonly object?[] DemoHeader =
    [
        "Lot", "Vintage", "Yeast", "Vessel", "Capacity (L)", "Variety", "Block", "Must SG", "Water added (L)",
        "Sugar added (kg)", "Must volume (L)", "Alcohol % v/v", "RS (g/L)", "YAN (mg N/L)", "pH", "TA (g/L)",
        "Peak temp (°C)", "Inoculated", "Dry date", "Notes", "Colour",
    ];

    [Fact]
    public void A_cellar_workbook_with_a_title_row_a_picture_and_an_average_row_reads_every_field()
    {
        // Given a workbook laid out as cellars keep them, with a logo picture added through the Open XML SDK
        using var folder = new TestFolder();
        string path = folder.PathOf("Riverbend lots.xlsx");
        Workbooks.WriteClosedXml(path, ("2024", [
            ["Riverbend Cellars (invented) — finished lots"],
            [],
            DemoHeader,
            ["R24-01", 2024, "QX-7", "tank", 5000, "Syrah", "North 3", 1.10101, 100, 0, 4200, 14.1, 1.8, 210, 3.45, 6.2, 29.5, new DateTime(2024, 3, 2), new DateTime(2024, 3, 14), "Punch-downs twice daily", "red"],
            ["R24-02", 2024, "QX-9", "barrel", 225, "Chardonnay", "South 1", 1.09193, null, null, null, 13.2, 2.4, null, null, null, 18, "2024-03-05", null, null, "white"],
            ["Average", null, null, null, null, null, null, 1.0965, null, null, null, 13.65],
        ]));
        Workbooks.AddPicture(path);

        // When it is read
        var set = folder.Read("Riverbend lots.xlsx");

        // Then both lots are read with their values converted to the held units
        Assert.Equal(2, set.Lots.Count);
        var a = set.Lots[0];
        Assert.Equal(("R24-01", 2024, "QX-7", "tank", "Syrah", "North 3"), (a.LotId, a.Season, a.Strain, a.Vessel, a.Variety, a.Block));
        // SG 1.10101 is 24 °Brix in Zoecklein et al., Wine Analysis and Production, Appendix I, Table I-1.
        Assert.Equal(24.0, a.StartingSugar.Brix, 0.01);
        Assert.Equal(new RecordedSugar(1.10101, SugarScale.SpecificGravity), a.RecordedStartingSugar);
        Assert.Equal(14.1, a.FinalAlcohol.PercentVolume, 10);
        Assert.Equal(new Additions(4200, 100, 0), a.Additions);
        Assert.Equal((1.8, 210.0, 3.45, 6.2, 29.5), (a.ResidualSugarGl!.Value, a.YanMgL!.Value, a.Ph!.Value, a.TaGl!.Value, a.PeakFermentationTempC!.Value));
        Assert.Equal((new DateTime(2024, 3, 2), new DateTime(2024, 3, 14)), (a.InoculationDate, a.DryDate));
        Assert.Equal((5000.0, WineColour.Red, "Punch-downs twice daily"), (a.VesselCapacityL!.Value, a.Colour, a.Notes));
        Assert.Equal(new SourceRef("Riverbend lots.xlsx", "2024", 4), a.Source);
        Assert.Equal(22.0, set.Lots[1].StartingSugar.Brix, 0.01); // SG 1.09193 → 22 °Brix, same table
        Assert.Equal((WineColour.White, new DateTime(2024, 3, 5)), (set.Lots[1].Colour, set.Lots[1].InoculationDate));
        var acc = Assert.Single(set.Accounts);
        Assert.Equal(new SourceAccount("Riverbend lots.xlsx", "2024", "lots", 3, 2, 0, 0, 0, 1), acc);
        Assert.Equal(["summary-row-skipped"], set.Issues.Select(i => i.Code));
        Assert.Contains(new HeaderMapping("Riverbend lots.xlsx", "2024", "starting_sugar", "Must SG", "SG"), set.Mappings);
        Assert.Equal(64, Assert.Single(set.Files).Sha256.Length);
    }

    [Theory]
    [InlineData("Oechsle", 101.01, 24.0, 0.01)] // °Oe = (SG − 1) × 1000; SG 1.10101 = 24 °Bx (Zoecklein Table I-1)
    [InlineData("Baumé", 11.1, 20.0, 0.15)] // Asadi, Beet-Sugar Handbook, Table A.1: 20 % sucrose ≈ 11.1 °Bé (rounded)
    [InlineData("Must sugar (g/L)", 237.8, 24.0, 0.01)] // OIV must table (OIV-MA-AS2-02 Table II): 24.0 °Bx ↔ 237.8 g/L
    [InlineData("Brix", 23.4, 23.4, 1e-9)]
    public void Starting_sugar_in_any_scale_is_held_as_brix(string header, double value, double brix, double tolerance)
    {
        using var folder = new TestFolder();
        var name = folder.Text("lots-2023.csv", $"Lot,Yeast,{header},Alcohol % v/v\nA-01,QX-7,{value.ToString(System.Globalization.CultureInfo.InvariantCulture)},14.0\n");
        var lot = Assert.Single(folder.Read(name).Lots);
        Assert.Equal(brix, lot.StartingSugar.Brix, tolerance);
    }

    [Fact]
    public void Volumes_masses_temperatures_and_alcohol_in_other_units_are_converted()
    {
        // Given US gallons, pounds, °F and alcohol in g/L
        using var folder = new TestFolder();
        var name = folder.Text("lots-2023.csv",
            "Lot,Yeast,Brix,Alcohol (g/L),Must volume (gal),Sugar added (lb),Peak temp (°F)\n" +
            "A-01,QX-7,24.0,110.4936,100,10,86\n");

        // When read
        var lot = Assert.Single(folder.Read(name).Lots);

        // Then: 1 US gal = 3.785411784 L and 1 lb = 0.45359237 kg (both exact, NIST Handbook 44 App. C);
        // 86 °F = 30 °C; 14 % v/v × 7.8924 g/L per % = 110.4936 g/L (Council Directive 76/766/EEC density 0.78924).
        Assert.Equal(378.5411784, lot.Additions.MustVolumeL!.Value, 9);
        Assert.Equal(4.5359237, lot.Additions.SugarAddedKg!.Value, 9);
        Assert.Equal(30.0, lot.PeakFermentationTempC!.Value, 9);
        Assert.Equal(14.0, lot.FinalAlcohol.PercentVolume, 9);
    }

    [Fact]
    public void Season_comes_from_the_column_then_the_sheet_name_then_the_file_name_then_the_option()
    {
        // Given four sources of season at once
        using var folder = new TestFolder();
        string path = folder.PathOf("lots-2021.xlsx");
        object?[] header = ["Lot", "Season", "Yeast", "Brix", "ABV"];
        Workbooks.WriteClosedXml(path,
            ("Vintage 2022", [header, ["A-01", 2020, "QX-7", 24.0, 14.0], ["A-02", null, "QX-7", 24.0, 14.0]]),
            ("Lots", [header, ["A-03", null, "QX-7", 24.0, 14.0]]));
        folder.Text("lots.csv", "Lot,Yeast,Brix,ABV\nA-04,QX-7,24.0,14.0\n");

        // When read with --season 2019
        var set = folder.Read(new IntakeOptions { Season = 2019 }, "lots-2021.xlsx", "lots.csv");

        // Then the column wins, then the sheet name, then the file name, then the option
        Assert.Equal([new LotKey(2020, "A-01"), new LotKey(2022, "A-02"), new LotKey(2021, "A-03"), new LotKey(2019, "A-04")], set.Lots.Select(l => l.Key));
    }

    [Fact]
    public void A_semicolon_csv_with_decimal_commas_is_read()
    {
        using var folder = new TestFolder();
        var name = folder.Text("season 2022.csv", "Lot;Yeast;Start Brix (°Bx);Alcohol % v/v;TA (g/L)\nA-01;QX-7;24,3;14,1;6,25\n");
        var lot = Assert.Single(folder.Read(name).Lots);
        Assert.Equal((24.3, 14.1, 6.25, 2022), (lot.StartingSugar.Brix, lot.FinalAlcohol.PercentVolume, lot.TaGl!.Value, lot.Season));
    }

    [Fact]
    public void Formula_cells_are_read_by_their_cached_values()
    {
        using var folder = new TestFolder();
        Workbooks.WriteRaw(folder.PathOf("formulas.xlsx"), ("2023", [["Lot", "Yeast", "Brix", "Alcohol % v/v"], ["A-01", "QX-7", new Formula("22+2", 24.0), new Formula("ROUND(13.96,1)", 14.0)]]));
        var lot = Assert.Single(folder.Read("formulas.xlsx").Lots);
        Assert.Equal((24.0, 14.0), (lot.StartingSugar.Brix, lot.FinalAlcohol.PercentVolume));
    }

    [Fact]
    public void A_legacy_xls_workbook_is_read()
    {
        // Given an Excel 97–2003 file made with LibreOffice (see Corpus/README.md)
        using var folder = new TestFolder();
        File.Copy(Path.Combine(AppContext.BaseDirectory, "Corpus", "legacy-lots-2019.xls"), folder.PathOf("legacy-lots-2019.xls"));

        // When read / Then its three lots are there, SG converted
        var set = folder.Read("legacy-lots-2019.xls");
        Assert.Equal(["L19-01", "L19-02", "L19-03"], set.Lots.Select(l => l.LotId));
        Assert.Equal(SugarScales.BrixFromSpecificGravity(1.1010), set.Lots[0].StartingSugar.Brix, 9);
        Assert.All(set.Accounts, a => Assert.True(a.Balances));
    }

    [Fact]
    public void Long_format_logs_with_date_and_time_columns_join_to_their_lots()
    {
        // Given a lots sheet and a log sheet in one workbook, the log with separate date and time columns
        using var folder = new TestFolder();
        Workbooks.WriteClosedXml(folder.PathOf("cellar-2024.xlsx"),
            ("Lots", [["Lot", "Yeast", "Brix", "ABV"], ["A-01", "QX-7", 24.0, 14.0], ["A-02", "QX-9", 23.0, 13.4]]),
            ("Ferment log", [["Lot", "Date", "Time", "SG", "Temp °C"],
                ["A-01", new DateTime(2024, 3, 2), new TimeSpan(8, 0, 0), 1.101, 18.0],
                ["A-01", new DateTime(2024, 3, 3), new TimeSpan(8, 30, 0), 1.080, 24.5],
                ["A-01", new DateTime(2024, 3, 4), new TimeSpan(9, 0, 0), 1.050, null]]));

        // When read
        var set = folder.Read("cellar-2024.xlsx");

        // Then the log belongs to A-01 of 2024, readings in file order, and A-02's missing log is said
        var log = Assert.Single(set.Logs);
        Assert.Equal(("A-01", (int?)2024), (log.LotId, log.Season));
        Assert.Equal(new DateTime(2024, 3, 3, 8, 30, 0), log.Readings[1].Timestamp);
        Assert.Equal(SugarScales.BrixFromSpecificGravity(1.080), log.Readings[1].Sugar!.Value.Brix, 9);
        Assert.Null(log.Readings[2].TemperatureC);
        Assert.Same(log, set.LogFor(set.Lots[0]));
        Assert.Contains(set.Accounts, a => a == new SourceAccount("cellar-2024.xlsx", "Ferment log", "log", 3, 0, 3, 0, 0, 0));
        var missing = Assert.Single(set.Issues, i => i.Code == "lots-without-log");
        Assert.Equal("1 lot(s) of season 2024 have no fermentation log: A-02. Kinetics is shown only for lots with a log.", missing.Message);
    }

    [Fact]
    public void A_sheet_named_after_a_lot_is_that_lot_s_log()
    {
        using var folder = new TestFolder();
        Workbooks.WriteClosedXml(folder.PathOf("logs-2024.xlsx"),
            ("R24-01", [["Timestamp", "Brix", "Temp °C"], [new DateTime(2024, 3, 2, 8, 0, 0), 24.0, 17.5], ["2024-03-03 08:00", 20.5, 23.0]]));
        var set = folder.Read("logs-2024.xlsx");
        var log = Assert.Single(set.Logs);
        Assert.Equal(("R24-01", (int?)2024, 2), (log.LotId, log.Season, log.Readings.Count));
        Assert.Equal(new DateTime(2024, 3, 3, 8, 0, 0), log.Readings[1].Timestamp);
        Assert.Contains(set.Issues, i => i.Code == "log-without-lot" && i.Value == "R24-01");
    }

    [Fact]
    public void Explicit_mappings_from_options_and_a_mapping_file_take_headers_no_synonym_knows()
    {
        // Given headers in another language and a mapping file with comments
        using var folder = new TestFolder();
        folder.Text("lots-2023.csv", "Lot,Levure,Zucker,Alkohol\nA-01,QX-7,98,14.0\n");
        folder.Text("map.txt", "# our headers\nstarting_oechsle = Zucker   # must weight\nfinal_abv=Alkohol\n");

        // When read with the mapping file and a --column
        var set = folder.Read(new IntakeOptions { MappingFile = "map.txt", ColumnMappings = ["strain=Levure"] }, "lots-2023.csv");

        // Then the lot is read, the sugar as °Oechsle (98 °Oe = SG 1.098)
        var lot = Assert.Single(set.Lots);
        Assert.Equal(SugarScales.BrixFromSpecificGravity(1.098), lot.StartingSugar.Brix, 9);
        Assert.Contains(new HeaderMapping("lots-2023.csv", null, "starting_sugar", "Zucker", "°Oechsle"), set.Mappings);
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
    }

    [Fact]
    public void A_folder_means_its_spreadsheets_and_csv_files_in_name_order_without_lock_files()
    {
        using var folder = new TestFolder();
        Directory.CreateDirectory(folder.PathOf("in"));
        File.WriteAllText(folder.PathOf("in/b-2023.csv"), "Lot,Yeast,Brix,ABV\nB-01,QX-7,24,14\n");
        File.WriteAllText(folder.PathOf("in/a-2023.csv"), "Lot,Yeast,Brix,ABV\nA-01,QX-7,24,14\n");
        File.WriteAllText(folder.PathOf("in/readme.md"), "not data");
        File.WriteAllText(folder.PathOf("in/~$lots.xlsx"), "lock");
        var set = folder.Read("in");
        Assert.Equal(["A-01", "B-01"], set.Lots.Select(l => l.LotId));
        Assert.Contains(set.Issues, i => i.Code == "lock-file-skipped" && i.File == Path.Combine("in", "~$lots.xlsx"));
    }

    [Fact]
    public void Inputs_are_read_while_another_program_holds_them_open_and_are_left_unchanged()
    {
        // Given a file held open for writing by another program
        using var folder = new TestFolder();
        var name = folder.Text("lots-2023.csv", "Lot,Yeast,Brix,ABV\nA-01,QX-7,24,14\n");
        byte[] before = File.ReadAllBytes(folder.PathOf(name));
        using var other = new FileStream(folder.PathOf(name), FileMode.Open, FileAccess.ReadWrite, FileShare.ReadWrite);

        // When read / Then it is read and its bytes are the same
        Assert.Single(folder.Read(name).Lots);
        other.Dispose();
        Assert.Equal(before, File.ReadAllBytes(folder.PathOf(name)));
    }

    [Fact]
    public void Reading_the_same_inputs_twice_gives_the_same_result()
    {
        using var folder = new TestFolder();
        var name = folder.Text("lots-2023.csv", "Lot,Yeast,Brix,ABV,pH\nA-01,QX-7,24,14,9\nA-01,QX-7,24,14,3.3\n");
        var a = folder.Read(name);
        var b = folder.Read(name);
        Assert.Equal(a.Lots, b.Lots);
        Assert.Equal(a.Issues, b.Issues);
        Assert.Equal(a.Accounts, b.Accounts);
    }
}
