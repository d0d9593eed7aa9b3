using System.Text;
using YieldBench.Core.Lots;

namespace YieldBench.Intake.Tests;

/// <summary>One broken input: how to make it, the options to read it with, and the issue it must produce.</summary>
internal sealed record CorpusCase(
    string Name,
    Func<TestFolder, string> Make,
    IntakeIssue Expected,
    int LotsStillRead,
    IntakeOptions? Options = null)
{
    public override string ToString() => Name;
}

/// <summary>
/// The corpus of broken inputs. Every case is made here by code (or copied from Corpus/ for the two legacy
/// .xls files), so the expected message and location sit beside the file that causes them.
/// </summary>
internal static class Corpus
{
    private const string Header = "Lot,Season,Yeast,Brix,Alcohol % v/v";
    private const string GoodRow = "A-01,2023,QX-7,24.0,14.0";

    private static string Csv(params string[] lines) => string.Join("\n", lines) + "\n";

    private static IntakeIssue E(string file, string? sheet, int? row, string? column, string? value, string code, string message) =>
        new(file, sheet, row, column, value, code, message, IssueSeverity.Error);

    private static IntakeIssue W(string file, string? sheet, int? row, string? column, string? value, string code, string message) =>
        new(file, sheet, row, column, value, code, message, IssueSeverity.Warning);

    private static string Committed(TestFolder f, string name)
    {
        File.Copy(Path.Combine(AppContext.BaseDirectory, "Corpus", name), f.PathOf(name));
        return name;
    }

    public static IReadOnlyList<CorpusCase> Cases { get; } =
    [
        new("empty file", f => f.Bytes("empty.csv", []),
            E("empty.csv", null, null, null, null, "empty-file", "The file is empty (0 bytes), or it is not an ordinary file (a device, a pipe or a socket); nothing was read. Export the sheet again as a file."), 0),
        new("binary file named csv", f => f.Bytes("binary.csv", [0x41, 0x42, 0x00, 0x01, 0x02, 0xFF]),
            E("binary.csv", null, null, null, null, "binary-file", "The file is named .csv but holds binary data (a zero byte at offset 2), not text. Export the sheet as CSV again, or give the workbook itself."), 0),
        new("text file named xlsx", f => f.Text("not-really.xlsx", "Lot,Yeast\nA,B\n"),
            W("not-really.xlsx", null, null, null, null, "content-differs-from-name", "The file is named .xlsx but holds text (a CSV or tab-separated table, as some programs export 'for Excel'); it was read as a CSV file. Rename it .csv, or open it in a spreadsheet program and save it as .xlsx."), 0),
        new("truncated zip", f => f.Bytes("truncated.xlsx", [0x50, 0x4B, 0x03, 0x04, 0x14, 0x00, 0x00, 0x00, 0x08, 0x00, 0x01, 0x02]),
            E("truncated.xlsx", null, null, null, null, "not-a-workbook", "The file is not a readable .xlsx workbook (its zip structure is missing or damaged). Open it in a spreadsheet program and save it again as .xlsx."), 0),
        new("zip bomb", f => { Workbooks.WriteZipBomb(f.PathOf("bomb.xlsx"), 4_000_000); return "bomb.xlsx"; },
            E("bomb.xlsx", null, null, null, null, "zip-bomb", "The workbook would expand from 3908 to 4000008 bytes, 1023.5 times its size, out of proportion for a spreadsheet (limit 200 times); it was not opened. Save the data again from the spreadsheet program."), 0),
        new("password-protected xls", f => Committed(f, "password-protected.xls"),
            E("password-protected.xls", null, null, null, null, "password-protected", "The workbook is protected by a password, so it cannot be read. Save a copy without the password and give that."), 0),
        new("encrypted xlsx package", f => f.Bytes("encrypted.xlsx", EncryptedPackageLookalike()),
            E("encrypted.xlsx", null, null, null, null, "password-protected", "The workbook is protected by a password, so it cannot be read. Save a copy without the password and give that."), 0),
        new("random bytes named xls", f => f.Bytes("random.xls", [0x13, 0x37, 0x42, 0x99, 0x01, 0x02, 0x03, 0x04, 0x05]),
            E("random.xls", null, null, null, null, "not-a-workbook", "The workbook could not be read (it is not an Excel 97–2003 file). Open it in a spreadsheet program and save it again as .xlsx."), 0),
        new("compound file that is no workbook", f => f.Bytes("not-excel.xls", EmptyCompoundFile()),
            E("not-excel.xls", null, null, null, null, "corrupt-workbook", "The workbook could not be read (Invalid byte order specified in header). Open it in a spreadsheet program and save it again as .xlsx."), 0),
        new("workbook with damaged sheet XML", f =>
            {
                Workbooks.WriteRaw(f.PathOf("damaged.xlsx"), ("Lots", [["Lot", "Yeast", "Brix", "ABV"], ["A-01", "QX-7", 24.0, 14.0]]));
                using (var zip = System.IO.Compression.ZipFile.Open(f.PathOf("damaged.xlsx"), System.IO.Compression.ZipArchiveMode.Update))
                {
                    zip.GetEntry("xl/worksheets/sheet1.xml")!.Delete();
                    using var w = new StreamWriter(zip.CreateEntry("xl/worksheets/sheet1.xml").Open());
                    w.Write("<worksheet><sheetData><row r=\"1\"><c r=\"A1\" t=\"inlineStr\"><is><t>Lot</t></is>");
                }

                return "damaged.xlsx";
            },
            E("damaged.xlsx", null, null, null, null, "corrupt-workbook", "The workbook could not be read (the XML of sheet 'Lots' is damaged: Unexpected end of file has occurred. The following elements are not closed: c, row, sheetData, worksheet. Line 1, position 77). Open it in a spreadsheet program and save it again as .xlsx."), 0),
        new("file over the size limit", f => f.Text("big.csv", Csv(Header, GoodRow)),
            E("big.csv", null, null, null, "61", "file-too-large", "The file is 61 bytes, above the limit of 40 bytes. Split it (for example one file per season)."), 0, new IntakeOptions { MaxFileBytes = 40 }),
        new("sheet over the row limit", f => f.Text("long.csv", Csv(Header, GoodRow, "A-02,2023,QX-7,24.0,14.0", "A-03,2023,QX-7,24.0,14.0")),
            E("long.csv", null, null, null, null, "too-many-rows", "The sheet has more than 3 rows, the limit; it was not read. Split it (for example one sheet per season)."), 0, new IntakeOptions { MaxRows = 3 }),
        new("unsupported file type", f => f.Text("lots.numbers", "x"),
            E("lots.numbers", null, null, null, null, "unsupported-file-type", "Files ending in '.numbers' are not read. Save the sheet as .xlsx, .ods or .csv."), 0),
        new("missing file", _ => "nowhere.csv",
            E("nowhere.csv", null, null, null, null, "file-not-found", "The file or folder was not found. Check the path."), 0),
        new("no header row", f => f.Text("prose.csv", Csv("These are our notes from harvest.", "Nothing tabular here.")),
            E("prose.csv", null, null, null, null, "no-table-found", "No header row naming lot or log columns was found (searched the first 50 rows of every sheet). Add a header row such as the one in 'yieldbench template', or map your headers with --column FIELD=HEADER."), 0),
        new("required column missing", f => f.Text("no-alcohol.csv", Csv("Lot,Season,Yeast,Brix", "A-01,2023,QX-7,24.0")),
            E("no-alcohol.csv", null, 1, null, null, "missing-column", "The sheet has no column for final_abv, which is required; none of its rows could be used. Add a column headed for example 'Final alcohol (% v/v)', 'alcohol', 'abv', or map one with --column final_abv=HEADER. If these lots are still fermenting (the sheet has no column of the finished wine), read them as lots still fermenting: yieldbench check --running FILES, or forecast HISTORY --running FILES."), 0),
        new("required value empty", f => f.Text("no-strain.csv", Csv(Header, GoodRow, "A-02,2023,,23.0,13.5")),
            E("no-strain.csv", null, 3, "Yeast", "", "missing-value", "strain is empty; it is required, so the row was left out. Fill it in."), 1),
        new("not a number", f => f.Text("text-brix.csv", Csv(Header, GoodRow, "A-02,2023,QX-7,twenty,13.5")),
            E("text-brix.csv", null, 3, "Brix", "twenty", "not-a-number", "starting_sugar is not a number. Enter a plain number such as 24.2 (a decimal comma is read too, in files that use it)."), 1),
        new("ambiguous thousands comma", f => f.Text("volume.csv", Csv("Lot,Season,Yeast,Brix,Alcohol % v/v,Must volume (L)", "A-01,2023,QX-7,24,14,3500", "A-02,2023,QX-7,23,13,\"4,200\"")),
            E("volume.csv", null, 3, "Must volume (L)", "4,200", "ambiguous-number", "must_volume_l could be 4200 (comma as thousands separator) or 4.200 (decimal comma). Write it without a thousands separator."), 1),
        new("thousands comma in a file of decimal points", f => f.Text("volume-us.csv", Csv(Header + ",Must volume (L)", GoodRow + ",3500", "A-02,2023,QX-7,23.0,13.5,\"4,200\"")),
            W("volume-us.csv", null, 3, "Must volume (L)", "4,200", "ambiguous-number", "1 value(s) of the column are written with a comma before groups of three digits (the first, '4,200' at row 3). The file separates its fields with commas and writes its decimals with a point, as spreadsheets set up for the US or UK export, so each such comma was read as a thousands separator ('4,200' = 4200). If one is a decimal comma, write the value with a point."), 2),
        new("starting sugar out of range", f => f.Text("high-brix.csv", Csv(Header, GoodRow, "A-02,2023,QX-7,42.5,13.5")),
            E("high-brix.csv", null, 3, "Brix", "42.5", "out-of-range", "starting_sugar 42.5 °Brix is outside the plausible range 10 to 40 °Brix. Check the value and its unit."), 1),
        new("alcohol out of range", f => f.Text("high-abv.csv", Csv(Header, GoodRow, "A-02,2023,QX-7,23.0,135")),
            E("high-abv.csv", null, 3, "Alcohol % v/v", "135", "out-of-range", "final_abv 135 % v/v is outside the plausible range 3 to 20 % v/v. Check the value and its unit."), 1),
        new("residual sugar out of range", f => f.Text("rs.csv", Csv(Header + ",RS (g/L)", GoodRow + ",1.2", "A-02,2023,QX-7,23.0,13.5,320")),
            E("rs.csv", null, 3, "RS (g/L)", "320", "out-of-range", "residual_sugar_gl 320 is outside the plausible range 0 to 300 g/L. Check the value and its unit."), 1),
        new("pH out of range keeps the lot", f => f.Text("ph.csv", Csv(Header + ",pH", GoodRow + ",3.4", "A-02,2023,QX-7,23.0,13.5,34")),
            W("ph.csv", null, 3, "pH", "34", "out-of-range", "ph 34 is outside the plausible range 2.5 to 4.5. Check the value and its unit. The value was left empty; the rest of the row was used."), 2),
        new("SG value in a Brix column", f => f.Text("mixed-scale.csv", Csv(Header, GoodRow, "A-02,2023,QX-7,1.095,13.5")),
            E("mixed-scale.csv", null, 3, "Brix", "1.095", "unit-differs-in-column", "starting_sugar looks like SG while the column holds °Brix. Convert it to °Brix, or move such values to a column of their own."), 1),
        new("Fahrenheit column headed Celsius", f => f.Text("fahrenheit.csv", Csv(Header + ",Peak temp (°C)", GoodRow + ",84", "A-02,2023,QX-7,23.0,13.5,88")),
            W("fahrenheit.csv", null, 1, "Peak temp (°C)", null, "temperature-in-fahrenheit", "The header says °C but the values (84 to 88) look like °F; they were converted from °F. Correct the header or the values."), 2),
        new("one Fahrenheit value in a Celsius column", f => f.Text("one-fahrenheit.csv", Csv(Header + ",Peak temp (°C)", GoodRow + ",29", "A-02,2023,QX-7,23.0,13.5,31", "A-03,2023,QX-7,23.0,13.5,86")),
            W("one-fahrenheit.csv", null, 4, "Peak temp (°C)", "86", "fahrenheit-in-celsius-column", "peak_temp_c is too hot for °C but would be 30 °C if it were °F. Enter it in °C. The value was left empty; the rest of the row was used."), 3),
        new("same lot twice in a season", f => f.Text("duplicate.csv", Csv(Header, GoodRow, "A-01,2023,QX-9,23.0,13.5")),
            E("duplicate.csv", null, 3, "Lot", "A-01", "duplicate-lot", "Lot 'A-01' of season 2023 was already read at duplicate.csv row 2; this row was left out. Give each lot its own id, or delete the repeated row."), 1),
        new("total row at the bottom", f => f.Text("total.csv", Csv(Header, GoodRow, "Total,,,24.0,14.0")),
            W("total.csv", null, 3, "Lot", "Total", "summary-row-skipped", "The row looks like a summary (average, total…), not a lot; it was skipped."), 1),
        new("error cell", f =>
            {
                Workbooks.WriteRaw(f.PathOf("errors.xlsx"), ("Lots 2023", [["Lot", "Yeast", "Brix", "Alcohol % v/v"], ["A-01", "QX-7", 24.0, 14.0], ["A-02", "QX-7", 23.0, new Err("#DIV/0!")]]));
                return "errors.xlsx";
            },
            E("errors.xlsx", "Lots 2023", 3, "Alcohol % v/v", "#DIV/0!", "error-cell", "final_abv holds a spreadsheet error (a formula that failed). Fix the formula or type the value."), 1),
        new("not a date", f => f.Text("date.csv", Csv(Header + ",Dry date", GoodRow + ",2023-03-20", "A-02,2023,QX-7,23.0,13.5,soon")),
            W("date.csv", null, 3, "Dry date", "soon", "not-a-date", "dry_date is not a date. Write dates as year-month-day, e.g. 2024-03-02 (a date cell, or 2024-03-02 14:30 with a time). The value was left empty; the rest of the row was used."), 2),
        new("ambiguous date", f => f.Text("ambiguous-date.csv", Csv(Header + ",Inoculated", GoodRow + ",03/04/2023")),
            W("ambiguous-date.csv", null, 2, "Inoculated", "03/04/2023", "ambiguous-date", "inoculation_date could be 2023-04-03 (day first) or 2023-03-04 (month first), and no other date in the column settles the order. Write it as year-month-day. The value was left empty; the rest of the row was used."), 1),
        new("no season anywhere", f => f.Text("lots.csv", Csv("Lot,Yeast,Brix,Alcohol % v/v", "A-01,QX-7,24.0,14.0")),
            E("lots.csv", null, 2, null, null, "no-season", "No season for this row: no season value, no four-digit year in the sheet or file name, and no --season. Add a season column, put the year in the sheet or file name, or pass --season YEAR."), 0),
        new("season not a year", f => f.Text("season.csv", Csv(Header, GoodRow, "A-02,last year,QX-7,23.0,13.5")),
            E("season.csv", null, 3, "Season", "last year", "not-a-year", "season is not a year. Enter the four-digit vintage year, e.g. 2024."), 1),
        new("unknown colour", f => f.Text("colour.csv", Csv(Header + ",Colour", GoodRow + ",orange")),
            W("colour.csv", null, 2, "Colour", "orange", "unknown-colour", "colour is not a colour read here (red, white, rosé). Use one of those words. The value was left empty; the rest of the row was used."), 1),
        new("unclosed quote", f => f.Text("quote.csv", Csv(Header + ",Notes", GoodRow + ",fine", "A-02,2023,QX-7,23.0,13.5,\"stuck at 2")),
            E("quote.csv", null, 3, null, null, "bad-csv-row", "The row could not be split into fields (a quote mark is not closed). Fix the quote marks in the row."), 1),
        new("unclosed quote before more rows", f => f.Text("quote-mid.csv", Csv(Header + ",Notes", "A-01,2023,QX-7,24.0,14.0,\"stuck at 2", "A-02,2023,QX-7,23.0,13.5,fine", "A-03,2023,QX-7,23.0,13.5,fine")),
            E("quote-mid.csv", null, 2, null, null, "bad-csv-row", "The row could not be split into fields (a quote mark is not closed, so the 2 line(s) after it were read into this row). Fix the quote marks in the row."), 0),
        new("negative water addition", f => f.Text("water.csv", Csv(Header + ",Water added (L)", GoodRow + ",0", "A-02,2023,QX-7,23.0,13.5,-40")),
            E("water.csv", null, 3, "Water added (L)", "-40", "out-of-range", "water_added_l -40 L is below zero. Enter 0 or leave it empty when nothing was added."), 1),
        new("log row without a reading", f => f.Text("log.csv", Csv("Lot,Season,Timestamp,Brix,Temp °C", "A-01,2023,2023-03-02 08:00,24.0,18", "A-01,2023,2023-03-03 08:00,,")),
            E("log.csv", null, 3, "Brix", null, "no-reading", "The row has neither a sugar nor a temperature reading, so it was left out. Fill one in, or delete the row."), 0),
        new("log row without a time", f => f.Text("log-time.csv", Csv("Lot,Season,Date,Brix", "A-01,2023,2023-03-02,24.0", "A-01,2023,,22.0")),
            E("log-time.csv", null, 3, "Date", "", "missing-timestamp", "The row has no date or timestamp, so it was left out. Fill in when the reading was taken."), 0),
        new("log of an unknown lot", f =>
f.Text("log-2023.csv", Csv("Lot,Date,Brix", "Z-99,2023-03-02,24.0", "Z-99,2023-03-03,21.5")),
            W("log-2023.csv", null, null, null, "Z-99", "log-without-lot", "The fermentation log of lot 'Z-99' (season 2023) matches no lot read. Check the lot id, or add the lot to the lots sheet."), 0),
        new("sugar unit only from values", f => f.Text("sg.csv", Csv("Lot,Season,Yeast,Initial sugar,Alcohol % v/v", "A-01,2023,QX-7,1.101,14.0", "A-02,2023,QX-7,1.095,13.5")),
            W("sg.csv", null, 1, "Initial sugar", null, "unit-from-values", "The header gives no unit; the values (1.095 to 1.101) look like SG, so they were read as SG. State the unit in the header, e.g. 'Starting sugar (SG)'."), 2),
        new("not UTF-8", f => f.Text("latin.csv", Csv(Header + ",Notes", GoodRow + ",levée rapide"), Encoding.Latin1),
            W("latin.csv", null, null, null, null, "encoding-assumed", "The file is not valid UTF-8; it was read as Windows-1252. If letters look wrong, save it again as UTF-8 CSV."), 1),
        new("column matching no field", f => f.Text("extra.csv", Csv(Header + ",Picker crew", GoodRow + ",North")),
            W("extra.csv", null, 1, "Picker crew", null, "column-not-used", "The column matches no field and was not read. If it holds one, map it with --column FIELD=HEADER (fields are listed in docs/input-format.md)."), 1),
        new("two columns for one field", f => f.Text("two-brix.csv", Csv(Header + ",Start Brix", GoodRow + ",24.1")),
            W("two-brix.csv", null, 1, "Start Brix", null, "duplicate-column", "This column maps to starting_sugar, as does the earlier column 'Brix'; only the earlier one was read. Rename one of them, or map the one you mean with --column starting_sugar=HEADER."), 1),
        new("mapping to an unknown field", f => f.Text("lots-2023b.csv", Csv(Header, GoodRow)),
            E("--column", null, null, null, "yeast_brand", "mapping-unknown-field", "'yeast_brand' is not a field name. Use one of: block, colour, date, dry_date, final_abv, final_alcohol_gl, final_baume, final_brix, final_kmw, final_oechsle, final_sg, final_sugar, final_sugar_gl, inoculation_date, lot_id, mean_temp_c, mean_temp_f, must_volume_gal, must_volume_hl, must_volume_kl, must_volume_l, notes, peak_temp_c, peak_temp_f, ph, residual_sugar_gl, season, starting_baume, starting_brix, starting_kmw, starting_oechsle, starting_sg, starting_sugar, starting_sugar_gl, strain, sugar, sugar_added_g, sugar_added_kg, sugar_added_lb, sugar_baume, sugar_brix, sugar_gl, sugar_kmw, sugar_oechsle, sugar_sg, ta_gl, temp_c, temp_f, time, timestamp, variety, vessel, vessel_capacity_gal, vessel_capacity_hl, vessel_capacity_kl, vessel_capacity_l, water_added_gal, water_added_hl, water_added_kl, water_added_l, yan_mgl (docs/input-format.md says what each holds)."), 1, new IntakeOptions { ColumnMappings = ["yeast_brand=Yeast"] }),
        new("volume without a unit", f => f.Text("volume-unit.csv", Csv(Header + ",Must volume", GoodRow + ",3500")),
            W("volume-unit.csv", null, 1, "Must volume", null, "unit-assumed", "The header gives no unit; values were read as L. State the unit in the header, e.g. 'Must volume (L)'."), 1),
        new("alcohol in grams per litre by its values", f => f.Text("abv-gl.csv", Csv("Lot,Season,Yeast,Brix,Alcohol", "A-01,2023,QX-7,24.0,110.5", "A-02,2023,QX-7,23.0,106.1")),
            W("abv-gl.csv", null, 1, "Alcohol", null, "unit-from-values", "The header gives no unit; the values (106.1 to 110.5) look like g/L ethanol, so they were read as g/L ethanol. State the unit in the header, e.g. 'Final alcohol (g/L)'."), 2),
        new("mapping file missing", f => f.Text("lots-2023c.csv", Csv(Header, GoodRow)),
            E("nomap.txt", null, null, null, null, "mapping-file-not-found", "The mapping file was not found. Check the path given to --mapping."), 1, new IntakeOptions { MappingFile = "nomap.txt" }),
        new("mapping line without an equals sign", f =>
            {
                f.Text("map.txt", "# mappings\nstrain Levure\n");
                return f.Text("lots-2023d.csv", Csv(Header, GoodRow));
            },
            E("map.txt", null, 2, null, "strain Levure", "mapping-not-understood", "The line is not of the form FIELD = HEADER. Write one mapping a line, e.g. 'strain = Levure'; '#' starts a comment."), 1, new IntakeOptions { MappingFile = "map.txt" }),
        new("mapped header absent", f => f.Text("lots-2023e.csv", Csv(Header, GoodRow)),
            W("--column", null, null, "Levure", "Levure", "mapped-header-not-found", "No sheet has this header, so the mapping to strain was not used. Check the spelling against the file's header row."), 1, new IntakeOptions { ColumnMappings = ["strain=Levure"] }),
        new("log time not a time of day", f => f.Text("log-clock.csv", Csv("Lot,Season,Date,Time,Brix", "A-01,2023,2023-03-02,08:00,24.0", "A-01,2023,2023-03-03,noon,22.0")),
            E("log-clock.csv", null, 3, "Time", "noon", "not-a-time", "time is not a time of day. Write it as 14:30 (24-hour clock)."), 0),
    ];

    /// <summary>
    /// The opening bytes of an OLE compound file whose directory names an "EncryptedPackage" stream, which is how an
    /// encrypted .xlsx is stored (MS-OFFCRYPTO 2.3.4.1). Only the structure intake looks at is made.
    /// </summary>
    private static byte[] EmptyCompoundFile()
    {
        var bytes = new byte[1536];
        byte[] magic = [0xD0, 0xCF, 0x11, 0xE0, 0xA1, 0xB1, 0x1A, 0xE1];
        magic.CopyTo(bytes, 0);
        return bytes;
    }

    private static byte[] EncryptedPackageLookalike()
    {
        var bytes = new byte[2048];
        byte[] magic = [0xD0, 0xCF, 0x11, 0xE0, 0xA1, 0xB1, 0x1A, 0xE1];
        magic.CopyTo(bytes, 0);
        Encoding.Unicode.GetBytes("EncryptedPackage").CopyTo(bytes, 1024);
        return bytes;
    }
}
