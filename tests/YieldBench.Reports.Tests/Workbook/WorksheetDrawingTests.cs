using System.Text;
using System.Xml.Linq;
using YieldBench.Reports.Workbook;

namespace YieldBench.Reports.Tests.Workbook;

public sealed class WorksheetDrawingTests
{
    private const string Main = "http://schemas.openxmlformats.org/spreadsheetml/2006/main";
    private const string Rel = "http://schemas.openxmlformats.org/officeDocument/2006/relationships";

    private static string[] Children(string worksheetXml, out XElement drawing)
    {
        byte[] result = OpenXmlDrawings.WithDrawing(new MemoryStream(Encoding.UTF8.GetBytes(worksheetXml)), "ybDrawing");
        var root = XDocument.Parse(Encoding.UTF8.GetString(result)).Root!;
        drawing = root.Element(XName.Get("drawing", Main))!;
        return root.Elements().Select(e => e.Name.LocalName).ToArray();
    }

    [Fact]
    public void The_drawing_goes_before_the_table_parts_as_the_schema_orders_them()
    {
        // Given a worksheet as ClosedXML writes it, ending in tableParts
        string xml = $"<?xml version=\"1.0\" encoding=\"utf-8\"?><x:worksheet xmlns:r=\"{Rel}\" xmlns:x=\"{Main}\"><x:sheetData><x:row r=\"1\"><x:c r=\"A1\" t=\"inlineStr\"><x:is><x:t>a &amp; b</x:t></x:is></x:c></x:row></x:sheetData>"
            + "<x:pageMargins left=\"0.75\" right=\"0.75\" top=\"0.75\" bottom=\"0.5\" header=\"0.5\" footer=\"0.75\" /><x:headerFooter /><x:tableParts count=\"0\" /></x:worksheet>";

        // When the drawing is added
        var children = Children(xml, out var drawing);

        // Then it sits between headerFooter and tableParts with the relationship id, and the rest is unchanged
        Assert.Equal(["sheetData", "pageMargins", "headerFooter", "drawing", "tableParts"], children);
        Assert.Equal("ybDrawing", (string?)drawing.Attribute(XName.Get("id", Rel)));
    }

    [Fact]
    public void Without_later_elements_the_drawing_goes_last()
    {
        // Given a worksheet in the default namespace with nothing after its page setup
        string xml = $"<worksheet xmlns=\"{Main}\"><sheetData/><pageMargins left=\"1\" right=\"1\" top=\"1\" bottom=\"1\" header=\"0\" footer=\"0\"/></worksheet>";

        // When the drawing is added
        var children = Children(xml, out var drawing);

        // Then it is the last child
        Assert.Equal(["sheetData", "pageMargins", "drawing"], children);
        Assert.NotNull(drawing);
    }
}
