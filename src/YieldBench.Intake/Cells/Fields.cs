namespace YieldBench.Intake;

/// <summary>What kind of value a field holds, which decides how cells are parsed and which units apply.</summary>
internal enum FieldKind
{
    Text,
    Season,
    Colour,
    Sugar,
    Alcohol,
    Temperature,
    Volume,
    Mass,
    Plain,
    Date,
    Time,
    DateTime,
}

/// <summary>Which table a field belongs to.</summary>
internal enum TableKind
{
    Lots,
    Log,
}

/// <summary>
/// One input field: its canonical snake_case name, kind, the unit it is held in, the plausible range (in that
/// unit), the header synonyms, and the text the template and docs show.
/// </summary>
internal sealed record FieldDef(
    string Name,
    TableKind Table,
    FieldKind Kind,
    bool Required,
    string Unit,
    double? Min,
    double? Max,
    string TemplateHeader,
    string Meaning,
    string Example,
    IReadOnlyList<string> Synonyms)
{
    /// <summary>True when a bad value leaves the whole row out (the value enters the conversion); otherwise the value is left empty.</summary>
    public bool Critical => Required || Name is "must_volume_l" or "water_added_l" or "sugar_added_kg" or "residual_sugar_gl" or "final_sugar" or "season"
        || Table == TableKind.Log;
}

/// <summary>The field catalogue: every field of the lots table and the fermentation-log table.</summary>
internal static class Fields
{
    private static readonly string[] LotIdWords =
    [
        "lot", "lot id", "lotid", "lot no", "lot nr", "lot num", "lot number", "lot code", "lot name", "lot ref",
        "lot reference", "wine lot", "batch", "batch id", "batch no", "batch number", "batch code", "id", "ferment id",
        "fermentation id", "fermentation lot", "lot label", "code", "los", "partie", "lote", "lotto", "partida",
        "sample id", "sample name", "sample code", "sample no",
    ];

    // In a fermentation log the tank a reading was taken from is how the cellar names the lot (a log has no vessel field).
    private static readonly string[] LogTankWords = ["tank", "tank no", "tank nr", "tank number", "tank id", "vessel", "vessel id", "fermenter", "fermentor", "cuve", "behalter", "deposito", "vasca", "cuba", "tina"];

    private static readonly string[] SeasonWords =
    [
        "season", "vintage", "year", "harvest", "harvest year", "vintage year", "crop year", "crush year", "season year", "millesime", "jahrgang",
        "anada", "cosecha", "vendimia", "annata", "vendemmia", "millesimo", "vendange",
    ];

    private static readonly string[] StartPrefixes =
    [
        "", "start", "starting", "initial", "init", "must", "juice", "harvest", "crush", "at crush", "original",
        "beginning", "begin", "pre ferment", "pre fermentation", "prefermentation", "incoming", "fruit", "grape",
        "receival", "intake", "inoculation", "pre", "mout", "mosto", "grado", "grados",
    ];

    private static readonly string[] SugarCores =
    [
        "brix", "bx", "sg", "specific gravity", "baume", "be", "oechsle", "oe", "kmw", "babo", "klosterneuburger", "degrees brix", "deg brix", "degre brix", "degres brix", "mostgewicht",
        "sugar", "sugars", "density", "gravity", "must weight", "sugar content", "densite",
        "densidad", "densita", "azucar", "azucares", "zuccheri", "zucchero",
    ];

    // Bare words that alone are too vague for a starting sugar (they could equally be a final reading).
    private static readonly HashSet<string> VagueBareSugar = ["sugar", "sugars", "density", "gravity", "sugar content", "densite", "densidad", "densita", "azucar", "azucares", "zuccheri", "zucchero"];

    private static readonly string[] StartSuffixes = ["start", "initial", "at crush", "crush", "must", "in", "harvest", "at harvest", "juice", "mout"];

    public static IReadOnlyList<FieldDef> Lots { get; } = BuildLotFields();

    public static IReadOnlyList<FieldDef> Log { get; } = BuildLogFields();

    public static IEnumerable<FieldDef> All => Lots.Concat(Log);

    public static FieldDef Lot(string name) => Lots.First(f => f.Name == name);

    public static FieldDef LogField(string name) => Log.First(f => f.Name == name);

    private static List<FieldDef> BuildLotFields()
    {
        var startingSugar = new List<string>();
        foreach (var p in StartPrefixes)
        {
            foreach (var c in SugarCores)
            {
                if (p.Length == 0 && VagueBareSugar.Contains(c))
                {
                    continue;
                }

                startingSugar.Add(p.Length == 0 ? c : $"{p} {c}");
            }
        }

        foreach (var c in SugarCores)
        {
            foreach (var s in StartSuffixes)
            {
                startingSugar.Add($"{c} {s}");
            }
        }

        startingSugar.AddRange(["starting sugar", "must sugar", "start sugar", "initial sugar", "potential sugar"]);

        // Must sugar written as potential alcohol (% vol at 16.83 g/L per % vol), as French, Spanish and Italian cellars do.
        startingSugar.AddRange(["potential alcohol", "potential abv", "potential alc", "degre potentiel", "degre probable", "alcool potentiel", "alcool probable",
            "tap", "tavp", "titre alcoometrique potentiel", "grado probable", "grado alcoholico probable", "alcohol probable", "grado potencial",
            "alcohol potencial", "alcol potenziale", "grado alcolico potenziale", "titolo alcolometrico potenziale"]);

        return
        [
            new("lot_id", TableKind.Lots, FieldKind.Text, true, "", null, null, "Lot", "The cellar's lot identifier, unique within a season.", "R23-014", LotIdWords),
            new("season", TableKind.Lots, FieldKind.Season, false, "", 1900, 2100, "Season", "Season (vintage year). May be left empty when the sheet or file name holds the year.", "2024", SeasonWords),
            new("strain", TableKind.Lots, FieldKind.Text, true, "", null, null, "Strain", "Yeast strain code as the cellar records it.", "QX-7",
                ["yeast", "strain", "culture", "yeast strain", "strain code", "yeast code", "yeast used", "yeast culture", "inoculum", "starter", "levure", "levures", "hefe", "hefestamm", "yeast name", "strain name", "yeast type", "levadura", "lievito", "lieviti", "ceppo"]),
            new("colour", TableKind.Lots, FieldKind.Colour, false, "", null, null, "Colour", "Wine colour: red, white or rosé (sets temperature defaults).", "red",
                ["colour", "color", "style", "type", "wine type", "wine colour", "wine color", "wine style", "colour style", "couleur", "farbe", "colore"]),
            new("vessel", TableKind.Lots, FieldKind.Text, false, "", null, null, "Vessel", "Vessel type (tank, barrel, bin, concrete…).", "tank",
                ["vessel", "vessel type", "tank", "tank type", "fermenter", "fermentor", "fermenter type", "fermentation vessel", "ferment vessel", "container", "vessel kind", "vessel material", "cuve", "tank nr", "tank no", "tank vessel", "vessel tank", "tank or vessel", "vessel or tank", "behalter", "gebinde", "fass", "deposito", "vasca", "cuba", "tina", "serbatoio"]),
            new("vessel_capacity_l", TableKind.Lots, FieldKind.Volume, false, "L", 0, null, "Vessel capacity (L)", "Capacity of the vessel.", "5000",
                ["capacity", "vessel capacity", "vessel size", "tank size", "tank capacity", "size", "vessel volume", "fermenter size", "fermenter capacity"]),
            new("variety", TableKind.Lots, FieldKind.Text, false, "", null, null, "Variety", "Grape variety.", "Syrah",
                ["variety", "varietal", "grape", "grape variety", "cultivar", "cepage", "grapes", "rebsorte", "sorte", "variedad", "vitigno", "varieta"]),
            new("block", TableKind.Lots, FieldKind.Text, false, "", null, null, "Block", "Vineyard block the fruit came from.", "North 3",
                ["block", "vineyard block", "vineyard", "site", "parcel", "plot", "source block", "vineyard site", "source"]),
            new("must_volume_l", TableKind.Lots, FieldKind.Volume, false, "L", 0, null, "Must volume (L)", "Must volume before any addition.", "4200",
                ["must volume", "volume", "juice volume", "must vol", "vol", "starting volume", "initial volume", "volume must", "must quantity", "juice vol", "volumen", "volume mosto", "volumen mosto"]),
            new("water_added_l", TableKind.Lots, FieldKind.Volume, false, "L", 0, null, "Water added (L)", "Water added before fermentation (add-back); 0 or empty when none.", "0",
                ["water added", "water", "water addition", "added water", "add back", "addback", "water add", "h2o added", "h2o add", "h2o", "dilution", "water addback", "eau ajoutee", "ajout eau", "ajout d eau", "wasserzugabe", "water back", "waterback", "agua anadida", "agua", "acqua aggiunta", "acqua"]),
            new("sugar_added_kg", TableKind.Lots, FieldKind.Mass, false, "kg", 0, null, "Sugar added (kg)", "Sucrose added before fermentation (chaptalization); 0 or empty when none.", "0",
                ["sugar added", "sugar addition", "added sugar", "sucrose added", "sugar add", "chaptalization", "chaptalisation", "chapt", "chaptal", "sucrose", "sucre ajoute", "azucar anadido", "chaptalizacion", "saccarosio", "zucchero aggiunto"]),
            new("starting_sugar", TableKind.Lots, FieldKind.Sugar, true, "°Brix", 10, 40, "Starting sugar (°Brix)", "Must sugar before any addition, in °Brix, SG, °Baumé, °Oechsle, °KMW or g/L (say which in the header).", "24.2", startingSugar),
            new("final_abv", TableKind.Lots, FieldKind.Alcohol, true, "% v/v", 3, 20, "Final alcohol (% v/v)", "The lab's final alcohol of the finished wine.", "13.9",
                ["alcohol", "abv", "alc", "final alcohol", "final abv", "final alc", "alcohol final", "abv final", "alcohol content", "alcohol by volume", "ethanol", "etoh", "alc vol", "lab alcohol", "alcohol lab", "measured alcohol", "actual alcohol", "wine alcohol", "finished alcohol", "pct v v", "pct vol", "pct alc", "pct abv", "pct alcohol", "v v", "alcool", "alkohol", "alcool final", "tav", "tav acquis", "titre alcoometrique", "grado alcoholico", "grado alcohol", "alcol", "alcol svolto", "grado alcolico", "titolo alcolometrico", "gradazione alcolica"]),
            new("residual_sugar_gl", TableKind.Lots, FieldKind.Plain, false, "g/L", 0, 300, "Residual sugar (g/L)", "Residual sugar (glucose + fructose) of the finished wine.", "1.8",
                ["rs", "residual sugar", "residual sugars", "residual", "res sugar", "final rs", "rs final", "glu fru", "glucose fructose", "gf", "g f", "reducing sugar", "reducing sugars", "r s", "sucres residuels", "sucre residuel", "restzucker", "azucares residuales", "azucar residual", "zuccheri residui", "zucchero residuo"]),
            new("final_sugar", TableKind.Lots, FieldKind.Sugar, false, "°Brix", -6, 40, "Final sugar (°Brix)", "Hydrometer reading of the finished wine, °Brix or SG.", "-1.8",
                ["final sugar", "final brix", "end brix", "final bx", "wine brix", "wine bx", "wine sg", "wine density", "wine gravity", "wine sugar", "finish brix", "finishing brix", "dry brix", "final sg", "end sg", "finish sg", "final density", "final gravity", "fg", "final hydrometer", "final reading", "brix final", "sg final", "brix end", "sg end"]),
            new("yan_mgl", TableKind.Lots, FieldKind.Plain, false, "mg N/L", 0, 1000, "YAN (mg N/L)", "Yeast assimilable nitrogen of the must.", "210",
                ["yan", "yeast assimilable nitrogen", "assimilable nitrogen", "nitrogen", "must yan", "juice yan", "yan must", "initial yan", "fan"]),
            new("ph", TableKind.Lots, FieldKind.Plain, false, "", 2.5, 4.5, "pH", "Must pH.", "3.45",
                ["ph", "must ph", "juice ph", "ph must", "initial ph", "starting ph"]),
            new("ta_gl", TableKind.Lots, FieldKind.Plain, false, "g/L", 2, 20, "TA (g/L)", "Must titratable acidity (as tartaric acid).", "6.2",
                ["ta", "titratable acidity", "total acidity", "acidity", "must ta", "juice ta", "ta must", "titratable acid", "initial ta", "starting ta"]),
            new("mean_temp_c", TableKind.Lots, FieldKind.Temperature, false, "°C", -5, 45, "Mean temp (°C)", "Mean fermentation temperature.", "24",
                ["mean temp", "mean temperature", "average temp", "average temperature", "avg temp", "avg temperature", "ferment temp", "fermentation temp", "fermentation temperature", "temp mean", "temp avg", "temp average", "mean ferment temp", "mean fermentation temp"]),
            new("peak_temp_c", TableKind.Lots, FieldKind.Temperature, false, "°C", -5, 45, "Peak temp (°C)", "Peak fermentation temperature.", "29.5",
                ["peak temp", "peak temperature", "max temp", "max temperature", "maximum temp", "maximum temperature", "temp max", "temp peak", "highest temp", "peak ferment temp", "peak fermentation temp", "peak"]),
            new("inoculation_date", TableKind.Lots, FieldKind.Date, false, "", null, null, "Inoculation date", "Date (and time) the yeast was added.", "2024-03-02",
                ["inoculated", "inoculation", "inoculation date", "date inoculated", "inoc", "inoc date", "inoculated on", "pitch date", "pitched", "date pitched", "yeast added", "ferment start", "fermentation start", "start date", "levurage", "date levurage", "date de levurage", "siembra", "fecha siembra", "fecha de siembra", "inoculacion", "fecha inoculacion", "inoculo", "data inoculo", "inoculazione", "data inoculazione"]),
            new("dry_date", TableKind.Lots, FieldKind.Date, false, "", null, null, "Dry date", "Date the lot was declared dry.", "2024-03-14",
                ["dry date", "dry", "date dry", "dry on", "went dry", "dryness date", "end date", "ferment end", "fermentation end", "finished", "date finished", "completion date"]),
            new("notes", TableKind.Lots, FieldKind.Text, false, "", null, null, "Notes", "Free-text notes.", "Punch-downs twice daily",
                ["notes", "note", "comments", "comment", "remarks", "remark", "observations", "memo", "notas", "observaciones", "remarques", "commentaires"]),
        ];
    }

    private static List<FieldDef> BuildLogFields() =>
    [
        new("lot_id", TableKind.Log, FieldKind.Text, false, "", null, null, "Lot", "Lot the reading belongs to (leave out on a sheet named after the lot); in a log, the tank a reading was taken from names its lot.", "R23-014", [.. LotIdWords, .. LogTankWords]),
        new("season", TableKind.Log, FieldKind.Season, false, "", 1900, 2100, "Season", "Season (vintage year); may be left empty when the sheet or file name holds it.", "2024", SeasonWords),
        new("timestamp", TableKind.Log, FieldKind.DateTime, false, "", null, null, "Timestamp", "Date and time of the reading (or use separate date and time columns).", "2024-03-04 08:30",
            ["timestamp", "time stamp", "date time", "datetime", "date and time", "reading time", "measured at", "logged at", "sampled at", "when"]),
        new("date", TableKind.Log, FieldKind.Date, false, "", null, null, "Date", "Date of the reading (with a time column, or alone).", "2024-03-04",
            ["date", "day", "sample date", "reading date", "log date", "measurement date", "fecha", "data", "datum", "jour", "dia", "giorno"]),
        new("time", TableKind.Log, FieldKind.Time, false, "", null, null, "Time", "Time of day of the reading.", "08:30",
            ["time", "hour", "sample time", "time of day", "clock", "hora", "ora", "heure", "uhrzeit", "zeit"]),
        new("sugar", TableKind.Log, FieldKind.Sugar, false, "°Brix", -6, 45, "Sugar (°Brix)", "Sugar reading: °Brix, SG, °Baumé, °Oechsle, °KMW or g/L (say which in the header).", "18.4",
            ["brix", "bx", "sg", "specific gravity", "baume", "be", "oechsle", "oe", "kmw", "babo", "sugar", "sugars", "density", "gravity", "must weight", "reading", "sugar reading", "brix reading", "sg reading", "hydrometer", "current brix", "degrees brix", "deg brix", "densite", "densidad", "densita", "grado baume"]),
        new("temp_c", TableKind.Log, FieldKind.Temperature, false, "°C", -5, 45, "Temperature (°C)", "Must or cap temperature at the reading.", "26.5",
            ["temp", "temperature", "must temp", "juice temp", "cap temp", "tank temp", "wine temp", "ferment temp", "fermentation temp", "must temperature", "t", "temperatura", "temperatur"]),
    ];
}
