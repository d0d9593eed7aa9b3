using System.Globalization;
using System.Text;
using ClosedXML.Excel;
using YieldBench.Core.Lots;
using YieldBench.Core.Units;

namespace YieldBench.Scenario;

/// <summary>
/// Writes the scenario's files as the invented cellar keeps them: a workbook per season (title row, blank row, header,
/// lots, blank row, "Average" row), one season as a semicolon CSV with decimal commas, and a workbook of fermentation
/// logs (one long sheet per season, and one sheet per probe-logged lot). Same scenario, same bytes.
/// </summary>
public static class DemoDataWriter
{
    /// <summary>File name of the fermentation-log workbook.</summary>
    public const string LogsFileName = "tallowmere-fermentation-logs.xlsx";

    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>The lot-file name of a season.</summary>
    public static string SeasonFileName(SeasonProfile season)
    {
        ArgumentNullException.ThrowIfNull(season);
        return season.Format == SeasonFileFormat.Workbook
            ? $"tallowmere-{season.Year}-lots.xlsx"
            : $"tallowmere-{season.Year}-lots.csv";
    }

    /// <summary>
    /// Subfolder of the demo folder holding the finished seasons (what <c>review</c> reads with no inputs). The harvest in
    /// progress sits in its own subfolder beside it, not inside it: a folder given to intake is read with its
    /// subfolders, and lots still fermenting are no finished lots for <c>review</c>.
    /// </summary>
    public const string HistoryFolderName = "history";

    /// <summary>Subfolder of the demo folder holding the harvest in progress (what <c>forecast</c> reads with no inputs, beside the history).</summary>
    public const string RunningFolderName = "running";

    /// <summary>File name of the harvest-in-progress workbook in <see cref="RunningFolderName"/>.</summary>
    public const string RunningFileName = "tallowmere-2026-harvest-in-progress.xlsx";

    /// <summary>Every file <see cref="Write"/> produces, as paths relative to the demo folder, in order.</summary>
    public static IReadOnlyList<string> FileNames(ScenarioData scenario) => Render(scenario).Select(f => f.Name).ToArray();

    /// <summary>Writes every demo file under <paramref name="directory"/> (created with its subfolders if missing); returns the paths written.</summary>
    public static IReadOnlyList<string> Write(ScenarioData scenario, string directory)
    {
        ArgumentNullException.ThrowIfNull(scenario);
        var written = new List<string>();
        foreach (var (name, bytes) in Render(scenario))
        {
            string path = Path.Combine(directory, name);
            Directory.CreateDirectory(Path.GetDirectoryName(path)!);
            File.WriteAllBytes(path, bytes);
            written.Add(path);
        }

        return written;
    }

    /// <summary>
    /// Every demo file's path relative to the demo folder and its bytes, without touching the disk: the README, the
    /// finished seasons and their logs in <see cref="HistoryFolderName"/>, the harvest in progress (when the scenario
    /// has one) in <see cref="RunningFolderName"/>.
    /// </summary>
    public static IReadOnlyList<(string Name, byte[] Bytes)> Render(ScenarioData scenario)
    {
        ArgumentNullException.ThrowIfNull(scenario);
        var files = new List<(string, byte[])>();
        foreach (var season in scenario.Seasons)
        {
            byte[] bytes = season.Profile.Format == SeasonFileFormat.Workbook
                ? SeasonWorkbook(scenario, season)
                : SeasonCsv(season);
            files.Add((Path.Combine(HistoryFolderName, SeasonFileName(season.Profile)), bytes));
        }

        files.Add((Path.Combine(HistoryFolderName, LogsFileName), LogsWorkbook(scenario)));
        if (scenario.Running is { } running)
        {
            files.Add((Path.Combine(RunningFolderName, RunningFileName), RunningWorkbook(scenario, running)));
        }

        files.Add(("README.md", Encoding.UTF8.GetBytes(Readme(scenario))));
        return files;
    }

    private static string[] Headers(SeasonProfile season) =>
    [
        "Lot", "Vintage", "Yeast", "Vessel", "Capacity (L)", "Variety", "Colour", "Block",
        season.Scale == SugarScale.SpecificGravity ? "Must SG" : "Start Brix (°Bx)",
        "Must volume (L)", "Water added (L)", "Sugar added (kg)", "Alcohol % v/v", "RS (g/L)", "YAN (mg N/L)", "pH",
        "TA (g/L)", "Peak temp (°C)", "Inoculated", "Dry date", "Notes",
    ];

    private static object?[] Values(GeneratedLot g)
    {
        var l = g.Recorded;
        return
        [
            l.LotId, l.Season, l.Strain, l.Vessel, l.VesselCapacityL, l.Variety, ColourName(l.Colour), l.Block,
            g.RecordedStartingValue, l.Additions.MustVolumeL, l.Additions.WaterAddedL, l.Additions.SugarAddedKg,
            l.FinalAlcohol.PercentVolume, l.ResidualSugarGl, l.YanMgL, l.Ph, l.TaGl, l.PeakFermentationTempC,
            l.InoculationDate, l.DryDate, l.Notes,
        ];
    }

    private static readonly string[] NumberFormats =
    [
        "@", "0", "@", "@", "0", "@", "@", "@", "", "0", "0", "0.0", "0.00", "0.0", "0", "0.00", "0.0", "0.0",
        "yyyy-mm-dd hh:mm", "yyyy-mm-dd", "@",
    ];

    private static readonly double[] Widths = [9, 8, 9, 15, 11, 18, 8, 12, 15, 14, 14, 14, 12, 9, 12, 6, 8, 13, 17, 11, 34];

    private static byte[] SeasonWorkbook(ScenarioData scenario, GeneratedSeason season)
    {
        using var wb = NewWorkbook(scenario.EstateName);
        var ws = wb.Worksheets.Add("Finished lots");
        var headers = Headers(season.Profile);
        ws.Cell(1, 1).Value = $"{scenario.EstateName}: {season.Profile.Year} harvest, finished lots (cellar record)";
        ws.Cell(1, 1).Style.Font.Bold = true;
        ws.Cell(1, 1).Style.Font.FontSize = 13;
        const int headerRow = 3;
        for (int c = 0; c < headers.Length; c++)
        {
            var cell = ws.Cell(headerRow, c + 1);
            cell.Value = headers[c];
            cell.Style.Font.Bold = true;
            cell.Style.Fill.BackgroundColor = XLColor.FromHtml("#DDE6EE");
            ws.Column(c + 1).Width = Widths[c];
        }

        string sugarFormat = season.Profile.Scale == SugarScale.SpecificGravity ? "0.000" : "0.0";
        int row = headerRow + 1;
        foreach (var lot in season.Lots)
        {
            var values = Values(lot);
            for (int c = 0; c < values.Length; c++)
            {
                SetCell(ws.Cell(row, c + 1), values[c], c == 8 ? sugarFormat : NumberFormats[c]);
            }

            row++;
        }

        // A blank row, then the cellar's own "Average" line under the numeric columns (values, as a pasted summary).
        row++;
        ws.Cell(row, 1).Value = "Average";
        ws.Cell(row, 1).Style.Font.Bold = true;
        int[] averaged = [4, 8, 9, 12, 13, 14, 15, 16, 17];
        foreach (int c in averaged)
        {
            var numbers = season.Lots.Select(l => Values(l)[c]).OfType<double>().ToArray();
            if (numbers.Length > 0)
            {
                int decimals = c == 8 && season.Profile.Scale == SugarScale.SpecificGravity ? 4 : 2;
                SetCell(ws.Cell(row, c + 1), Math.Round(numbers.Average(), decimals), c == 8 ? sugarFormat : NumberFormats[c]);
                ws.Cell(row, c + 1).Style.Font.Italic = true;
            }
        }

        ws.SheetView.FreezeRows(headerRow);
        return Save(wb);
    }

    private static byte[] SeasonCsv(GeneratedSeason season)
    {
        // Written as a European spreadsheet exports it: semicolons, decimal commas, ISO dates, UTF-8 with a BOM, CRLF.
        var comma = new NumberFormatInfo { NumberDecimalSeparator = ",", NumberGroupSeparator = "" };
        var sb = new StringBuilder();
        sb.Append(string.Join(';', Headers(season.Profile).Select(Quote))).Append("\r\n");
        foreach (var lot in season.Lots)
        {
            var values = Values(lot);
            var cells = new string[values.Length];
            for (int c = 0; c < values.Length; c++)
            {
                cells[c] = values[c] switch
                {
                    null => string.Empty,
                    string s => Quote(s),
                    int i => i.ToString(Inv),
                    double d => d.ToString(CsvFormat(c, season.Profile.Scale), comma),
                    DateTime t => t.ToString(c == 18 ? "yyyy-MM-dd HH:mm" : "yyyy-MM-dd", Inv),
                    var o => Quote(Convert.ToString(o, Inv) ?? string.Empty),
                };
            }

            sb.Append(string.Join(';', cells)).Append("\r\n");
        }

        return [.. Encoding.UTF8.GetPreamble(), .. Encoding.UTF8.GetBytes(sb.ToString())];
    }

    private static string CsvFormat(int column, SugarScale scale) => column switch
    {
        8 => scale == SugarScale.SpecificGravity ? "0.000" : "0.0",
        _ => NumberFormats[column] is "@" or "" ? "0.###" : NumberFormats[column],
    };

    private static string Quote(string s) =>
        s.IndexOfAny([';', '"', '\r', '\n']) >= 0 ? "\"" + s.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"" : s;

    private static byte[] LogsWorkbook(ScenarioData scenario)
    {
        using var wb = NewWorkbook(scenario.EstateName);
        foreach (var season in scenario.Seasons)
        {
            bool sg = season.Profile.Scale == SugarScale.SpecificGravity;
            var ws = wb.Worksheets.Add($"Logs {season.Profile.Year}");
            string[] headers = ["Lot", "Date", "Time", sg ? "SG" : "Brix", "Temp °C"];
            WriteHeader(ws, headers, [9, 11, 7, 8, 9]);
            int row = 2;
            foreach (var lot in season.Lots.Where(l => l.Log is not null && !l.LogIsProbe))
            {
                for (int k = 0; k < lot.Log!.Readings.Count; k++)
                {
                    var r = lot.Log.Readings[k];
                    ws.Cell(row, 1).Value = lot.Recorded.LotId;
                    ws.Cell(row, 1).Style.NumberFormat.Format = "@";
                    SetCell(ws.Cell(row, 2), r.Timestamp.Date, "yyyy-mm-dd");
                    SetCell(ws.Cell(row, 3), r.Timestamp.TimeOfDay.TotalDays, "hh:mm");
                    SetCell(ws.Cell(row, 4), lot.LogRecordedSugar![k], sg ? "0.000" : "0.0");
                    SetCell(ws.Cell(row, 5), r.TemperatureC, "0.0");
                    row++;
                }
            }

            ws.SheetView.FreezeRows(1);
        }

        foreach (var lot in scenario.AllLots.Where(l => l.LogIsProbe && l.Log is not null))
        {
            // A probe's export: one sheet named after the lot, a full timestamp per reading, °Brix to two decimals.
            var ws = wb.Worksheets.Add(lot.Recorded.LotId);
            WriteHeader(ws, ["Timestamp", "Brix", "Temp °C"], [17, 8, 9]);
            int row = 2;
            for (int k = 0; k < lot.Log!.Readings.Count; k++)
            {
                var r = lot.Log.Readings[k];
                SetCell(ws.Cell(row, 1), r.Timestamp, "yyyy-mm-dd hh:mm");
                SetCell(ws.Cell(row, 2), lot.LogRecordedSugar![k], "0.00");
                SetCell(ws.Cell(row, 3), r.TemperatureC, "0.0");
                row++;
            }

            ws.SheetView.FreezeRows(1);
        }

        return Save(wb);
    }

    private static byte[] RunningWorkbook(ScenarioData scenario, HarvestInProgress running)
    {
        // The cellar's working book of the harvest: the lots still fermenting (no final analysis yet) and their log.
        using var wb = NewWorkbook(scenario.EstateName);
        var lots = wb.Worksheets.Add("Lots in progress");
        string[] headers = ["Lot", "Vintage", "Yeast", "Vessel", "Capacity (L)", "Variety", "Colour", "Start Brix (°Bx)", "Must volume (L)", "YAN (mg N/L)", "Inoculated", "Notes"];
        string[] formats = ["@", "0", "@", "@", "0", "@", "@", "0.0", "0", "0", "yyyy-mm-dd hh:mm", "@"];
        WriteHeader(lots, headers, [9, 8, 9, 15, 11, 18, 8, 15, 14, 12, 17, 34]);
        int row = 2;
        foreach (var g in running.Lots)
        {
            var l = g.Recorded;
            object?[] values =
            [
                l.LotId, l.Season, l.Strain, l.Vessel, l.VesselCapacityL, l.Variety, ColourName(l.Colour),
                Math.Round(l.StartingSugar.Brix, 1), l.Additions.MustVolumeL, l.YanMgL, l.InoculationDate, l.Notes,
            ];
            for (int c = 0; c < values.Length; c++)
            {
                SetCell(lots.Cell(row, c + 1), values[c], formats[c]);
            }

            row++;
        }

        lots.SheetView.FreezeRows(1);
        var log = wb.Worksheets.Add($"Logs {running.Season}");
        WriteHeader(log, ["Lot", "Date", "Time", "Brix", "Temp °C"], [9, 11, 7, 8, 9]);
        row = 2;
        foreach (var g in running.Lots)
        {
            for (int k = 0; k < g.Log.Readings.Count; k++)
            {
                var r = g.Log.Readings[k];
                log.Cell(row, 1).Value = g.Recorded.LotId;
                log.Cell(row, 1).Style.NumberFormat.Format = "@";
                SetCell(log.Cell(row, 2), r.Timestamp.Date, "yyyy-mm-dd");
                SetCell(log.Cell(row, 3), r.Timestamp.TimeOfDay.TotalDays, "hh:mm");
                SetCell(log.Cell(row, 4), g.LogRecordedSugar[k], "0.0");
                SetCell(log.Cell(row, 5), r.TemperatureC, "0.0");
                row++;
            }
        }

        log.SheetView.FreezeRows(1);
        return Save(wb);
    }

    private static void WriteHeader(IXLWorksheet ws, string[] headers, double[] widths)
    {
        for (int c = 0; c < headers.Length; c++)
        {
            ws.Cell(1, c + 1).Value = headers[c];
            ws.Cell(1, c + 1).Style.Font.Bold = true;
            ws.Column(c + 1).Width = widths[c];
        }
    }

    private static void SetCell(IXLCell cell, object? value, string format)
    {
        switch (value)
        {
            case null:
                return;
            case string s:
                cell.Value = s;
                cell.DataType = XLDataType.Text;
                break;
            case int i:
                cell.Value = i;
                break;
            case double d:
                cell.Value = d;
                break;
            case DateTime t:
                cell.Value = t;
                break;
            default:
                throw new ArgumentException($"Unexpected cell value type {value.GetType().Name}.", nameof(value));
        }

        if (format.Length > 0 && format != "@")
        {
            cell.Style.NumberFormat.Format = format;
        }
    }

    private static XLWorkbook NewWorkbook(string estate)
    {
        var wb = new XLWorkbook();
        wb.Properties.Author = $"{estate} cellar";
        wb.Properties.LastModifiedBy = $"{estate} cellar";
        wb.Properties.Created = DeterministicPackage.FixedInstant;
        wb.Properties.Modified = DeterministicPackage.FixedInstant;
        return wb;
    }

    private static byte[] Save(XLWorkbook wb)
    {
        using var m = new MemoryStream();
        wb.SaveAs(m);
        return DeterministicPackage.Normalise(m.ToArray());
    }

    private static string ColourName(WineColour c) => c switch
    {
        WineColour.Red => "Red",
        WineColour.White => "White",
        WineColour.Rose => "Rosé",
        _ => string.Empty,
    };

    /// <summary>The demo-data README: what the files are, the invented estate, the true strain factors and every planted case.</summary>
    public static string Readme(ScenarioData scenario)
    {
        ArgumentNullException.ThrowIfNull(scenario);
        var sb = new StringBuilder();
        void L(string line = "") => sb.Append(line).Append('\n');
        L("# Demo data: an invented estate");
        L();
        L($"These files are generated. **{scenario.EstateName}**, its blocks, its cellar and the strain codes (`YB-…`) are");
        L("invented; no real winery, yeast product, person or measurement is behind them. They exist so that a new user can");
        L("run `yieldbench review` (and `yieldbench forecast`) with no inputs and see every part of the report work, and so");
        L("that tests can check the tool finds what was planted.");
        L();
        L($"- `{HistoryFolderName}/`: the finished seasons and their fermentation logs, what `review` reads with no inputs");
        L($"  (the same as `review demo-data/{HistoryFolderName}`).");
        L($"- `{RunningFolderName}/`: the harvest in progress, lots still fermenting; `forecast` with no inputs reads it with");
        L($"  the history (the same as `forecast demo-data/{HistoryFolderName} --running demo-data/{RunningFolderName}`). It is kept");
        L("  apart because a folder given to the tool is read with its subfolders, and lots still fermenting are no finished");
        L("  lots for `review`.");
        L();
        L("Regenerate (byte for byte; a test checks it):");
        L();
        L("```");
        L("dotnet run --project src/YieldBench.Scenario -- demo-data");
        L("```");
        L();
        L($"Seed {scenario.Seed.ToString(Inv)}. Source: `src/YieldBench.Scenario` (`ScenarioGenerator.Demo()` exposes the truth below).");
        L();
        L($"## Files in `{HistoryFolderName}/`");
        L();
        L("| file | what | how it is kept |");
        L("|---|---|---|");
        foreach (var s in scenario.Seasons)
        {
            int logs = s.Lots.Count(l => l.Log is not null);
            string how = s.Profile.Format == SeasonFileFormat.Workbook
                ? $"workbook, sheet \"Finished lots\": title row, blank row, header on row 3, a blank row and an \"Average\" row under the lots; starting sugar as {(s.Profile.Scale == SugarScale.SpecificGravity ? "specific gravity 20/20 (\"Must SG\", 3 decimals)" : "°Brix")}"
                : "semicolon-separated text, decimal commas, ISO dates, UTF-8 with BOM, CRLF line ends";
            L($"| `{SeasonFileName(s.Profile)}` | {s.Lots.Count} lots of {s.Profile.Year} ({logs} with a log) | {how} |");
        }

        L($"| `{LogsFileName}` | fermentation logs | sheets \"Logs YEAR\" in long format (Lot, Date, Time, Brix or SG, Temp °C; hand readings near 07:30 and 17:30, a few rounds missed); one sheet per probe-logged lot, named after the lot (Timestamp, Brix, Temp °C every 15 minutes) |");
        L();
        L("## The invented cellar");
        L();
        L("Seasons: 2023 warm (ripe reds, water add-backs), 2024 cool (chaptalized whites and Pinot Noir; recorded in SG),");
        L("2025 middling. Reds go to open-top bins, stainless tanks and a concrete egg; whites to tanks, barrels and");
        L("puncheons. The ripest reds tend to get YB-R31, so raw factor medians favour it partly because its fruit was riper");
        L("(the OIV table's sugar per °Brix rises with °Brix).");
        L();
        L($"True strain behaviour (dry lot, no vessel loss; factor at {Catalog.ReferenceBrix.ToString("0", Inv)} °Brix = OIV sugar g/L ÷ sugar per % v/v ÷ °Brix):");
        L();
        L("| strain | use | sugar per 1 % v/v (g/L) | factor at 24 °Brix (% v/v per °Brix) | lag (h) | max rate at 25 °C (°Brix/h) | lots |");
        L("|---|---|---|---|---|---|---|");
        foreach (var st in scenario.Strains)
        {
            int n = scenario.AllLots.Count(l => l.Recorded.Strain == st.Code);
            L($"| {st.Code} | {st.Description} | {st.SugarGlPerAbv.ToString("0.00", Inv)} | {st.TrueFactorAt(Catalog.ReferenceBrix).ToString("0.000", Inv)} | {st.LagHours.ToString("0", Inv)} | {st.MaxRateBrixPerHourAt25C.ToString("0.00", Inv)} | {n} |");
        }

        L();
        L("How the numbers are made (all choices of the invented scenario, not measurements):");
        L();
        L("- Starting sugar: normal around the season's mean for the colour plus the variety's offset (SD 1.1 °Brix). The");
        L("  sample written down adds sampling error of 0.20–0.45 °Brix SD by vessel (bins with skins worst); SG is rounded to");
        L("  0.001 (about ±0.13 °Brix).");
        L("- Additions: very ripe reds (> 26 °Brix) often get water added back to 24.6–25.2 °Brix, thin whites and Pinot Noir");
        L("  (< 20.8 °Brix) sucrose to 21.6–22.2 °Brix, by a mass balance on dissolved solids; the must volume is recorded.");
        L("- Alcohol: (fermentable sugar of the effective must by the OIV table − residual sugar) ÷ the strain's sugar per");
        L("  1 % v/v, less the vessel's ethanol loss (open-top bins 1.2 %, barrels 0.6 %, puncheons 0.5 %, eggs 0.3 %,");
        L("  tanks 0.2 %) and 0.4 % per °C of peak above 32 °C; the lab adds 0.07 % v/v SD. Residual sugar of dry lots");
        L("  0.8–3.2 g/L, read with 0.15 g/L SD. The world's chemistry is frozen in `ScenarioChemistry`, apart from the tool.");
        L("- Kinetics: °Brix follows the modified Gompertz curve of Zwietering et al. (1990) from the effective starting");
        L("  sugar down to about −1.5 to −2.1 °Brix (a dry wine on a hydrometer), with the strain's lag and maximum rate; the");
        L("  rate rises 7 % per °C of peak temperature (capped at 34 °C) and with nitrogen (YAN^0.35). Temperature climbs from");
        L("  the starting temperature to the peak in step with the consumption rate, four hours behind it. Hand readings add");
        L("  0.15 °Brix and 0.25 °C SD; the probe 0.03 °Brix and 0.08 °C.");
        L();
        L("## Planted cases (what a correct review shows)");
        L();
        L("| lot | season | case | expected flag codes | signature |");
        L("|---|---|---|---|---|");
        foreach (var p in scenario.PlantedCases)
        {
            string codes = p.ExpectedCodes.Count == 0 && p.ExpectedKineticsCodes.Count == 0
                ? "none (control)"
                : string.Join(", ", p.ExpectedCodes.Select(c => $"`{c}`").Concat(p.ExpectedKineticsCodes.Select(c => $"kinetics `{c}`")));
            L($"| {p.LotId} | {p.Season} | {KindText(p.Kind)} | {codes} | {p.ExpectedFinding} |");
        }

        L();
        L("Any one of the listed lot-flag codes counts as detection; a kinetics code is expected as listed. Probe-logged lots: " + string.Join(", ", scenario.AllLots.Where(l => l.LogIsProbe).Select(l => l.Recorded.LotId)) + " (records cross the end of September).");
        L();
        if (scenario.Running is { } running)
        {
            L($"## The harvest in progress ({running.Season})");
            L();
            L($"`{RunningFolderName}/{RunningFileName}` (beside `{HistoryFolderName}/`, so that `review` never takes its lots for finished ones) is the");
            L($"cellar's working book of the next season, caught on {running.Now.ToString("d MMMM yyyy", Inv)} after the evening round:");
            L("sheet \"Lots in progress\" lists the lots still fermenting (no final alcohol yet), sheet \"Logs " + running.Season.ToString(Inv) + "\" their readings so far.");
            L("`yieldbench forecast` with no inputs reads it with the three seasons above as history. Its lots are made the same way");
            L($"as the history's; {Catalog.TrialStrain.Code} is a strain on trial with no history (lag {Catalog.TrialStrain.LagHours.ToString("0", Inv)} h, maximum rate {Catalog.TrialStrain.MaxRateBrixPerHourAt25C.ToString("0.00", Inv)} °Brix/h at 25 °C).");
            L();
            L("| lot | strain | vessel | readings so far | what is planted |");
            L("|---|---|---|---|---|");
            foreach (var g in running.Lots)
            {
                L($"| {g.Recorded.LotId} | {g.Recorded.Strain} | {g.Recorded.Vessel} {g.Recorded.VesselCapacityL?.ToString("0", Inv)} L | {g.Log.Readings.Count} | {g.Story ?? "an ordinary lot"} |");
            }

            L();
        }

        L("## Cautions");
        L();
        L("A predicted or reviewed alcohol is not a label statement: labels need a lab analysis and the local rules. Fermentation");
        L("heat and CO2 are hazards in a cellar; see docs/cautions.md.");
        return sb.ToString();
    }

    private static string KindText(PlantedKind k) => k switch
    {
        PlantedKind.UnrecordedWater => "unrecorded water addition",
        PlantedKind.StuckFerment => "stuck ferment, high residual sugar",
        PlantedKind.TransposedDigits => "transposed digits in starting sugar",
        PlantedKind.UnderReadStartingSugar => "starting sugar under-read (before soak-up)",
        PlantedKind.OverheatedFerment => "overheated ferment",
        PlantedKind.MislabelledStrain => "mislabelled strain",
        PlantedKind.RecordedAdditionControl => "recorded addition (control)",
        _ => k.ToString(),
    };
}
