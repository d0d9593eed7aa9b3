using System.Globalization;
using System.IO.Compression;
using System.Security;
using System.Text;
using ClosedXML.Excel;
using DocumentFormat.OpenXml;
using DocumentFormat.OpenXml.Packaging;
using Xdr = DocumentFormat.OpenXml.Drawing.Spreadsheet;
using A = DocumentFormat.OpenXml.Drawing;

namespace YieldBench.Intake.Tests;

/// <summary>A cell holding a formula error, as a spreadsheet program saves it (type "e" with the cached error text).</summary>
internal sealed record Err(string Text);

/// <summary>A formula cell with its cached value.</summary>
internal sealed record Formula(string Expression, double Cached);

/// <summary>Test workbooks: a minimal raw .xlsx writer (for cells ClosedXML cannot save) and ClosedXML helpers.</summary>
internal static class Workbooks
{
    /// <summary>A 1×1 red PNG (67 bytes), for the embedded-picture test.</summary>
    public static readonly byte[] TinyPng = Convert.FromBase64String(
        "iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8DwHwAFBQIAX8jx0gAAAABJRU5ErkJggg==");

    /// <summary>Writes a minimal .xlsx by hand: inline strings, numbers, error cells and formulas with cached values.</summary>
    public static void WriteRaw(string path, params (string Name, object?[][] Rows)[] sheets)
    {
        using var fs = File.Create(path);
        using var zip = new ZipArchive(fs, ZipArchiveMode.Create);
        void Entry(string name, string text)
        {
            using var w = new StreamWriter(zip.CreateEntry(name).Open(), new UTF8Encoding(false));
            w.Write(text);
        }

        var types = new StringBuilder("<?xml version=\"1.0\" encoding=\"UTF-8\"?><Types xmlns=\"http://schemas.openxmlformats.org/package/2006/content-types\"><Default Extension=\"rels\" ContentType=\"application/vnd.openxmlformats-package.relationships+xml\"/><Default Extension=\"xml\" ContentType=\"application/xml\"/><Override PartName=\"/xl/workbook.xml\" ContentType=\"application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml\"/>");
        var wbSheets = new StringBuilder();
        var rels = new StringBuilder();
        for (int i = 0; i < sheets.Length; i++)
        {
            types.Append(CultureInfo.InvariantCulture, $"<Override PartName=\"/xl/worksheets/sheet{i + 1}.xml\" ContentType=\"application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml\"/>");
            wbSheets.Append(CultureInfo.InvariantCulture, $"<sheet name=\"{SecurityElement.Escape(sheets[i].Name)}\" sheetId=\"{i + 1}\" r:id=\"rId{i + 1}\"/>");
            rels.Append(CultureInfo.InvariantCulture, $"<Relationship Id=\"rId{i + 1}\" Type=\"http://schemas.openxmlformats.org/officeDocument/2006/relationships/worksheet\" Target=\"worksheets/sheet{i + 1}.xml\"/>");
            Entry($"xl/worksheets/sheet{i + 1}.xml", SheetXml(sheets[i].Rows));
        }

        types.Append("</Types>");
        Entry("[Content_Types].xml", types.ToString());
        Entry("_rels/.rels", "<?xml version=\"1.0\" encoding=\"UTF-8\"?><Relationships xmlns=\"http://schemas.openxmlformats.org/package/2006/relationships\"><Relationship Id=\"rId1\" Type=\"http://schemas.openxmlformats.org/officeDocument/2006/relationships/officeDocument\" Target=\"xl/workbook.xml\"/></Relationships>");
        Entry("xl/workbook.xml", $"<?xml version=\"1.0\" encoding=\"UTF-8\"?><workbook xmlns=\"http://schemas.openxmlformats.org/spreadsheetml/2006/main\" xmlns:r=\"http://schemas.openxmlformats.org/officeDocument/2006/relationships\"><sheets>{wbSheets}</sheets></workbook>");
        Entry("xl/_rels/workbook.xml.rels", $"<?xml version=\"1.0\" encoding=\"UTF-8\"?><Relationships xmlns=\"http://schemas.openxmlformats.org/package/2006/relationships\">{rels}</Relationships>");
    }

    private static string SheetXml(object?[][] rows)
    {
        var sb = new StringBuilder("<?xml version=\"1.0\" encoding=\"UTF-8\"?><worksheet xmlns=\"http://schemas.openxmlformats.org/spreadsheetml/2006/main\"><sheetData>");
        for (int r = 0; r < rows.Length; r++)
        {
            sb.Append(CultureInfo.InvariantCulture, $"<row r=\"{r + 1}\">");
            for (int c = 0; c < rows[r].Length; c++)
            {
                string reference = ColumnLetter(c) + (r + 1).ToString(CultureInfo.InvariantCulture);
                switch (rows[r][c])
                {
                    case null:
                        break;
                    case string s:
                        sb.Append(CultureInfo.InvariantCulture, $"<c r=\"{reference}\" t=\"inlineStr\"><is><t>{SecurityElement.Escape(s)}</t></is></c>");
                        break;
                    case double d:
                        sb.Append(CultureInfo.InvariantCulture, $"<c r=\"{reference}\"><v>{d.ToString("R", CultureInfo.InvariantCulture)}</v></c>");
                        break;
                    case int i:
                        sb.Append(CultureInfo.InvariantCulture, $"<c r=\"{reference}\"><v>{i.ToString(CultureInfo.InvariantCulture)}</v></c>");
                        break;
                    case Err e:
                        sb.Append(CultureInfo.InvariantCulture, $"<c r=\"{reference}\" t=\"e\"><f>1/0</f><v>{SecurityElement.Escape(e.Text)}</v></c>");
                        break;
                    case Formula f:
                        sb.Append(CultureInfo.InvariantCulture, $"<c r=\"{reference}\"><f>{SecurityElement.Escape(f.Expression)}</f><v>{f.Cached.ToString("R", CultureInfo.InvariantCulture)}</v></c>");
                        break;
                    default:
                        throw new ArgumentException("Unsupported test cell " + rows[r][c]);
                }
            }

            sb.Append("</row>");
        }

        sb.Append("</sheetData></worksheet>");
        return sb.ToString();
    }

    private static string ColumnLetter(int c) => c < 26 ? ((char)('A' + c)).ToString() : ColumnLetter((c / 26) - 1) + (char)('A' + (c % 26));

    /// <summary>Writes rows into a new ClosedXML worksheet (strings, numbers, DateTime, TimeSpan, null).</summary>
    public static void Fill(IXLWorksheet ws, params object?[][] rows)
    {
        for (int r = 0; r < rows.Length; r++)
        {
            for (int c = 0; c < rows[r].Length; c++)
            {
                var cell = ws.Cell(r + 1, c + 1);
                switch (rows[r][c])
                {
                    case null:
                        break;
                    case string s:
                        cell.SetValue(s);
                        break;
                    case double d:
                        cell.SetValue(d);
                        break;
                    case int i:
                        cell.SetValue(i);
                        break;
                    case DateTime dt:
                        cell.SetValue(dt);
                        cell.Style.NumberFormat.Format = dt.TimeOfDay == TimeSpan.Zero ? "yyyy-mm-dd" : "yyyy-mm-dd hh:mm";
                        break;
                    case TimeSpan ts:
                        cell.SetValue(ts);
                        cell.Style.NumberFormat.Format = "hh:mm";
                        break;
                    default:
                        throw new ArgumentException("Unsupported test cell " + rows[r][c]);
                }
            }
        }
    }

    /// <summary>Embeds a small PNG in the first worksheet with the Open XML SDK (ClosedXML's picture API needs libgdiplus).</summary>
    public static void AddPicture(string path)
    {
        using var doc = SpreadsheetDocument.Open(path, isEditable: true);
        var sheetPart = doc.WorkbookPart!.WorksheetParts.First();
        var drawingsPart = sheetPart.AddNewPart<DrawingsPart>();
        var imagePart = drawingsPart.AddImagePart(ImagePartType.Png);
        using (var ms = new MemoryStream(TinyPng))
        {
            imagePart.FeedData(ms);
        }

        string imageId = drawingsPart.GetIdOfPart(imagePart);
        var anchor = new Xdr.OneCellAnchor(
            new Xdr.FromMarker(new Xdr.ColumnId("8"), new Xdr.ColumnOffset("0"), new Xdr.RowId("0"), new Xdr.RowOffset("0")),
            new Xdr.Extent { Cx = 952500, Cy = 952500 },
            new Xdr.Picture(
                new Xdr.NonVisualPictureProperties(new Xdr.NonVisualDrawingProperties { Id = 2U, Name = "Cellar logo" }, new Xdr.NonVisualPictureDrawingProperties()),
                new Xdr.BlipFill(new A.Blip { Embed = imageId }, new A.Stretch(new A.FillRectangle())),
                new Xdr.ShapeProperties(new A.Transform2D(new A.Offset { X = 0, Y = 0 }, new A.Extents { Cx = 952500, Cy = 952500 }), new A.PresetGeometry { Preset = A.ShapeTypeValues.Rectangle })),
            new Xdr.ClientData());
        drawingsPart.WorksheetDrawing = new Xdr.WorksheetDrawing(anchor);
        drawingsPart.WorksheetDrawing.Save();
        sheetPart.Worksheet.Append(new DocumentFormat.OpenXml.Spreadsheet.Drawing { Id = sheetPart.GetIdOfPart(drawingsPart) });
        sheetPart.Worksheet.Save();
    }

    /// <summary>Makes a workbook with ClosedXML from named sheets of rows.</summary>
    public static void WriteClosedXml(string path, params (string Name, object?[][] Rows)[] sheets)
    {
        using var wb = new XLWorkbook();
        foreach (var (name, rows) in sheets)
        {
            Fill(wb.Worksheets.Add(name), rows);
        }

        wb.SaveAs(path);
    }

    /// <summary>A zip named .xlsx whose one entry expands about a thousand times (a "zip bomb" in miniature).</summary>
    public static void WriteZipBomb(string path, int zeroBytes)
    {
        using var fs = File.Create(path);
        using var zip = new ZipArchive(fs, ZipArchiveMode.Create);
        using (var w = new StreamWriter(zip.CreateEntry("[Content_Types].xml").Open()))
        {
            w.Write("<Types/>");
        }

        using var s = zip.CreateEntry("xl/worksheets/sheet1.xml", CompressionLevel.SmallestSize).Open();
        s.Write(new byte[zeroBytes]);
    }
}
