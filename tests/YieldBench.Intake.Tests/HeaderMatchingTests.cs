using YieldBench.Core.Lots;

namespace YieldBench.Intake.Tests;

public class HeaderMatchingTests
{
    [Theory]
    [InlineData("Lot", "lot_id")]
    [InlineData("Lot #", "lot_id")]
    [InlineData("LOT NO.", "lot_id")]
    [InlineData("Vintage", "season")]
    [InlineData("Harvest year", "season")]
    [InlineData("Yeast", "strain")]
    [InlineData("Yeast strain", "strain")]
    [InlineData("Culture", "strain")]
    [InlineData("Start Brix (°Bx)", "starting_sugar")]
    [InlineData("Initial  BRIX", "starting_sugar")]
    [InlineData("Must SG", "starting_sugar")]
    [InlineData("Must sugar", "starting_sugar")]
    [InlineData("Baumé", "starting_sugar")]
    [InlineData("Oechsle (°Oe)", "starting_sugar")]
    [InlineData("Alcohol % v/v", "final_abv")]
    [InlineData("ABV (%)", "final_abv")]
    [InlineData("% v/v", "final_abv")]
    [InlineData("Alc.", "final_abv")]
    [InlineData("RS (g/L)", "residual_sugar_gl")]
    [InlineData("Residual sugar", "residual_sugar_gl")]
    [InlineData("YAN (mg N/L)", "yan_mgl")]
    [InlineData("pH", "ph")]
    [InlineData("TA (g/L)", "ta_gl")]
    [InlineData("Peak temp (°C)", "peak_temp_c")]
    [InlineData("Max. temperature °F", "peak_temp_c")]
    [InlineData("Capacity (L)", "vessel_capacity_l")]
    [InlineData("Vessel type", "vessel")]
    [InlineData("Fermenter", "vessel")]
    [InlineData("Water added (L)", "water_added_l")]
    [InlineData("Sugar added (kg)", "sugar_added_kg")]
    [InlineData("Must volume (L)", "must_volume_l")]
    [InlineData("Inoculated", "inoculation_date")]
    [InlineData("Dry date", "dry_date")]
    [InlineData("Final Brix", "final_sugar")]
    [InlineData("Style", "colour")]
    [InlineData("Notes", "notes")]
    [InlineData("Mostgewicht °Oe", "starting_sugar")]
    [InlineData("Mostgewicht °KMW", "starting_sugar")]
    [InlineData("Babo", "starting_sugar")]
    [InlineData("Start sugar °Bx", "starting_sugar")]
    [InlineData("Final sugar SG", "final_sugar")]
    [InlineData("Los", "lot_id")]
    [InlineData("Behälter", "vessel")]
    public void Lot_headers_match_their_field_whatever_the_case_spacing_punctuation_or_unit(string header, string field)
    {
        // Given a header as cellars write it / When it is matched / Then it names the field
        var f = ColumnRules.Find(header, TableKind.Lots);
        Assert.True(f is not null, header);
        Assert.Equal(field, f.Name);
    }

    [Theory]
    [InlineData("Timestamp", "timestamp")]
    [InlineData("Date", "date")]
    [InlineData("Time", "time")]
    [InlineData("Brix", "sugar")]
    [InlineData("SG", "sugar")]
    [InlineData("Temp °C", "temp_c")]
    [InlineData("Cap temp", "temp_c")]
    [InlineData("Sugar °Bx", "sugar")]
    public void Log_headers_match_their_field(string header, string field)
    {
        var f = ColumnRules.Find(header, TableKind.Log);
        Assert.True(f is not null, header);
        Assert.Equal(field, f.Name);
    }

    [Theory]
    [InlineData("Picker crew")]
    [InlineData("Sugar")]
    [InlineData("Sugar °Bx")]
    [InlineData("Alcohol SG")]
    public void Headers_that_name_no_lot_field_are_not_matched(string header)
    {
        // "Sugar" alone could be a starting or a final reading, with a scale or without; a scale word after a field that
        // is no sugar field does not make it one
        Assert.Null(ColumnRules.Find(header, TableKind.Lots));
    }

    [Fact]
    public void No_synonym_names_two_fields_of_the_same_table()
    {
        // Given every field's synonyms / Then none is claimed by two fields of one table (the index would hide one)
        foreach (var table in new[] { Fields.Lots, Fields.Log })
        {
            var clashes = table.SelectMany(f => f.Synonyms.Prepend(f.Name).Select(s => (Key: HeaderText.Normalise(s), f.Name)))
                .Distinct()
                .GroupBy(x => x.Key)
                .Where(g => g.Select(x => x.Name).Distinct().Count() > 1)
                .Select(g => g.Key + ": " + string.Join("/", g.Select(x => x.Name).Distinct()))
                .ToList();
            Assert.Empty(clashes);
        }
    }

    [Theory]
    [InlineData("Start Brix (°Bx)", "Sugar", "Brix")]
    [InlineData("Must SG", "Sugar", "SpecificGravity")]
    [InlineData("Must weight (°Oe)", "Sugar", "Oechsle")]
    [InlineData("Baumé", "Sugar", "Baume")]
    [InlineData("Sugar (g/L)", "Sugar", "SugarGramsPerLitre")]
    [InlineData("Initial sugar", "Sugar", "None")]
    [InlineData("Alcohol % v/v", "Alcohol", "PercentVolume")]
    [InlineData("Alcohol (g/L)", "Alcohol", "AlcoholGramsPerLitre")]
    [InlineData("Peak temp (°C)", "Temperature", "Celsius")]
    [InlineData("Peak temp °F", "Temperature", "Fahrenheit")]
    [InlineData("Capacity (gal)", "Volume", "UsGallon")]
    [InlineData("Capacity (hL)", "Volume", "Hectolitre")]
    [InlineData("Sugar added (lb)", "Mass", "Pound")]
    public void Units_are_read_from_the_header_text(string header, string kind, string unit)
    {
        Assert.Equal(Enum.Parse<ColumnUnit>(unit), HeaderText.UnitFromHeader(header, Enum.Parse<FieldKind>(kind)));
    }

    [Fact]
    public void A_lots_table_whose_only_sugar_header_is_a_bare_density_word_names_it_in_the_missing_column_message()
    {
        // Given a French lots table headed "Densité" (the must's density, but the word alone could be the wine's too)
        using var folder = new TestFolder();
        var lots = folder.Text("lots-2026.csv", "Lot;Millésime;Levure;Densité;Levurage\nV1;2026;QX-7;1094;13/09/2026 10:00\n");

        // When read as lots still fermenting
        var set = folder.Read(new IntakeOptions { RunningLots = true }, lots);

        // Then the missing starting sugar is reported with the mapping that would read that column
        var missing = Assert.Single(set.Issues, i => i.Code == IssueCodes.MissingColumn);
        Assert.EndsWith("The column 'Densité' names a sugar reading without saying whether it is the must's at the start or the wine's at the end; if it holds the must's, map it with --column starting_sugar=\"Densité\".", missing.Message, StringComparison.Ordinal);

        // and with that mapping the lot is read: 1094 as SG 1.094 (thousandths, from the values)
        var mapped = folder.Read(new IntakeOptions { RunningLots = true, ColumnMappings = ["starting_sugar=Densité"] }, lots);
        Assert.Equal(1.094, Assert.Single(mapped.RunningLots).StartingSugar.SpecificGravity, 1e-9);
    }

    [Fact]
    public void A_german_fermentation_log_with_datum_uhrzeit_and_temperatur_is_read()
    {
        // Given a German cellar's log (Tank, Datum, Uhrzeit, °Oe, Temperatur; semicolons and decimal commas) and its lots
        using var folder = new TestFolder();
        var lots = folder.Text("lose-2026.csv", "Los;Jahrgang;Hefe;Mostgewicht (°Oe)\nF3;2026;QX-7;93\n");
        var log = folder.Text("gaerprotokoll-2026.csv", "Tank;Datum;Uhrzeit;°Oe;Temperatur\nF3;14.09.2026;08:00;92;16,5\nF3;15.09.2026;17:30;88;18,0\n");

        // When read as lots still fermenting
        var set = folder.Read(new IntakeOptions { RunningLots = true }, lots, log);

        // Then the log is the lot's, at its dates and times; 92 °Oe is SG 1.092, 22.014119 °Brix by the NBS-fitted cubic
        // of docs/methods.md (python3: f=lambda S: ((182.4601*S-775.6821)*S+1262.7794)*S-669.5622; f(1.092))
        var readings = Assert.Single(set.Logs).Readings;
        Assert.Equal([new DateTime(2026, 9, 14, 8, 0, 0), new DateTime(2026, 9, 15, 17, 30, 0)], readings.Select(r => r.Timestamp));
        Assert.Equal(22.014119, readings[0].Sugar!.Value.Brix, 1e-6);
        Assert.Equal([16.5, 18.0], readings.Select(r => r.TemperatureC!.Value));
        Assert.DoesNotContain(set.Issues, i => i.Severity == IssueSeverity.Error);
    }

    [Theory]
    [InlineData("Cap temp (°C),Must temp (°C)", "31.5,26.0", "34.0,28.5")]
    [InlineData("Must temp (°C),Cap temp (°C)", "26.0,31.5", "28.5,34.0")]
    public void Beside_a_cap_temperature_the_musts_is_read_whichever_comes_first(string headers, string first, string second)
    {
        // Given a log with a cap and a must temperature column, in either order
        using var folder = new TestFolder();
        folder.Text("lots.csv", "Lot,Season,Strain,Brix,ABV\nC1,2025,QV-7,24.0,14.1\n");
        folder.Text("log.csv", $"Lot,Timestamp,Brix,{headers}\nC1,2025-09-10 08:00,22.0,{first}\nC1,2025-09-11 08:00,17.5,{second}\n");

        // When it is read
        var set = folder.Read("lots.csv", "log.csv");

        // Then the readings carry the must's temperatures (26.0 and 28.5 °C), and the cap column is named as not read
        Assert.Equal([26.0, 28.5], set.Logs.Single().Readings.Select(r => r.TemperatureC!.Value));
        var dup = Assert.Single(set.Issues, i => i.Code == IssueCodes.DuplicateColumn);
        Assert.Equal("Cap temp (°C)", dup.Column);
        Assert.StartsWith("This column is the cap's temperature; the must's, 'Must temp (°C)', was read instead", dup.Message, StringComparison.Ordinal);
    }
}
