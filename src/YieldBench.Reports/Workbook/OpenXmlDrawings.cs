using DocumentFormat.OpenXml;
using DocumentFormat.OpenXml.Packaging;
using DocumentFormat.OpenXml.Spreadsheet;
using A = DocumentFormat.OpenXml.Drawing;
using C = DocumentFormat.OpenXml.Drawing.Charts;
using Xdr = DocumentFormat.OpenXml.Drawing.Spreadsheet;

namespace YieldBench.Reports.Workbook;

/// <summary>One series of a native scatter chart: a name and the cell ranges it is bound to.</summary>
/// <param name="Name">Series name shown in the legend.</param>
/// <param name="XRange">X cells, e.g. <c>'Lots'!$F$2:$F$40</c>.</param>
/// <param name="YRange">Y cells.</param>
/// <param name="XCache">The values now in the X cells (the chart shows them before the application recalculates).</param>
/// <param name="YCache">The values now in the Y cells.</param>
/// <param name="ColourHex">Marker colour, RGB hex without '#'.</param>
public sealed record ScatterSeriesSpec(string Name, string XRange, string YRange, IReadOnlyList<double> XCache, IReadOnlyList<double> YCache, string ColourHex);

/// <summary>A native scatter chart to place on a sheet.</summary>
/// <param name="Title">Chart title.</param>
/// <param name="XTitle">X axis title.</param>
/// <param name="YTitle">Y axis title.</param>
/// <param name="Series">Series bound to cells.</param>
/// <param name="XBounds">X axis minimum and maximum (null: the application chooses).</param>
/// <param name="YBounds">Y axis minimum and maximum.</param>
public sealed record ScatterChartSpec(
    string Title, string XTitle, string YTitle, IReadOnlyList<ScatterSeriesSpec> Series, (double Min, double Max)? XBounds = null, (double Min, double Max)? YBounds = null);

/// <summary>Where a drawing goes: top-left cell (0-based column and row) and size in pixels at 96 dpi.</summary>
public sealed record DrawingPlace(int Column, int Row, int WidthPx, int HeightPx);

/// <summary>
/// Adds native charts and PNG pictures to a saved workbook with the Open XML SDK 2.20 (ClosedXML 0.95.4 has no
/// charts, and its picture support needs libgdiplus).
/// </summary>
public static class OpenXmlDrawings
{
    private const long EmuPerPixel = 9525;

    /// <summary>Adds a scatter chart (markers only, one series per spec) to a worksheet.</summary>
    public static void AddScatterChart(WorksheetPart sheet, ScatterChartSpec spec, DrawingPlace place, uint drawingId)
    {
        ArgumentNullException.ThrowIfNull(sheet);
        ArgumentNullException.ThrowIfNull(spec);
        ArgumentNullException.ThrowIfNull(place);
        var drawings = DrawingsFor(sheet);
        var chartPart = drawings.AddNewPart<ChartPart>(RelationshipId("ybChart", drawingId));

        // The chart is built without its cached points and fed as bytes with the points written in (a chart of
        // 100,000 lots caches 200,000 of them: as SDK elements they took seconds to build and save, and a part's root
        // element is saved again when the package closes).
        using var skeleton = new MemoryStream();
        BuildChartSpace(spec).Save(skeleton); // closes the stream; ToArray still reads it
        using var xml = new MemoryStream();
        WriteCachedPoints(skeleton.ToArray(), xml, spec.Series.SelectMany(s => new[] { s.XCache, s.YCache }).ToArray());
        using (var bytes = new MemoryStream(xml.GetBuffer(), 0, (int)xml.Length, writable: false))
        {
            chartPart.FeedData(bytes);
        }

        string relId = drawings.GetIdOfPart(chartPart);

        var frame = new Xdr.GraphicFrame(
            new Xdr.NonVisualGraphicFrameProperties(
                new Xdr.NonVisualDrawingProperties { Id = drawingId, Name = spec.Title, Description = spec.Title },
                new Xdr.NonVisualGraphicFrameDrawingProperties()),
            new Xdr.Transform(new A.Offset { X = 0, Y = 0 }, new A.Extents { Cx = 0, Cy = 0 }),
            new A.Graphic(new A.GraphicData(new C.ChartReference { Id = relId }) { Uri = "http://schemas.openxmlformats.org/drawingml/2006/chart" }))
        { Macro = string.Empty };
        drawings.WorksheetDrawing!.Append(Anchor(place, frame));
        drawings.WorksheetDrawing.Save();
    }

    /// <summary>Adds a PNG picture to a worksheet.</summary>
    public static void AddPicture(WorksheetPart sheet, byte[] png, string description, DrawingPlace place, uint drawingId) =>
        PlacePicture(sheet, png, description, place, drawingId);

    /// <summary>
    /// As <see cref="AddPicture"/>, returning the picture's part (<paramref name="png"/> may be a stand-in that the
    /// finished package replaces: nothing but the part's content depends on the bytes).
    /// </summary>
    internal static ImagePart PlacePicture(WorksheetPart sheet, byte[] png, string description, DrawingPlace place, uint drawingId)
    {
        ArgumentNullException.ThrowIfNull(sheet);
        ArgumentNullException.ThrowIfNull(png);
        ArgumentNullException.ThrowIfNull(place);
        var drawings = DrawingsFor(sheet);
        var image = drawings.AddImagePart(ImagePartType.Png, RelationshipId("ybImage", drawingId));
        using (var stream = new MemoryStream(png, writable: false))
        {
            image.FeedData(stream);
        }

        string relId = drawings.GetIdOfPart(image);
        var picture = new Xdr.Picture(
            new Xdr.NonVisualPictureProperties(
                new Xdr.NonVisualDrawingProperties { Id = drawingId, Name = "Picture " + drawingId.ToString(System.Globalization.CultureInfo.InvariantCulture), Description = description },
                new Xdr.NonVisualPictureDrawingProperties(new A.PictureLocks { NoChangeAspect = true })),
            new Xdr.BlipFill(new A.Blip { Embed = relId }, new A.Stretch(new A.FillRectangle())),
            new Xdr.ShapeProperties(
                new A.Transform2D(new A.Offset { X = 0, Y = 0 }, new A.Extents { Cx = place.WidthPx * EmuPerPixel, Cy = place.HeightPx * EmuPerPixel }),
                new A.PresetGeometry(new A.AdjustValueList()) { Preset = A.ShapeTypeValues.Rectangle }));
        drawings.WorksheetDrawing!.Append(Anchor(place, picture));
        drawings.WorksheetDrawing.Save();
        return image;
    }

    private static string RelationshipId(string prefix, uint drawingId) =>
        prefix + drawingId.ToString(System.Globalization.CultureInfo.InvariantCulture);

    private static Xdr.OneCellAnchor Anchor(DrawingPlace place, OpenXmlElement content) =>
        new(
            new Xdr.FromMarker(
                new Xdr.ColumnId(place.Column.ToString(System.Globalization.CultureInfo.InvariantCulture)),
                new Xdr.ColumnOffset("0"),
                new Xdr.RowId(place.Row.ToString(System.Globalization.CultureInfo.InvariantCulture)),
                new Xdr.RowOffset("0")),
            new Xdr.Extent { Cx = place.WidthPx * EmuPerPixel, Cy = place.HeightPx * EmuPerPixel },
            content,
            new Xdr.ClientData());

    private static DrawingsPart DrawingsFor(WorksheetPart sheet)
    {
        if (sheet.DrawingsPart is { } existing)
        {
            return existing;
        }

        // Fixed relationship ids: the SDK would draw random ones, and the same review must give the same bytes.
        var drawings = sheet.AddNewPart<DrawingsPart>("ybDrawing");
        drawings.WorksheetDrawing = new Xdr.WorksheetDrawing();
        drawings.WorksheetDrawing.AddNamespaceDeclaration("xdr", "http://schemas.openxmlformats.org/drawingml/2006/spreadsheetDrawing");
        drawings.WorksheetDrawing.AddNamespaceDeclaration("a", "http://schemas.openxmlformats.org/drawingml/2006/main");
        drawings.WorksheetDrawing.Save();

        // The worksheet gets its <drawing> by a streaming copy of its XML: loading it as SDK elements took seconds for
        // a sheet of a few thousand rows, and its elements would be saved again when the package closes.
        byte[] xml;
        using (var from = sheet.GetStream(FileMode.Open, FileAccess.Read))
        {
            xml = WithDrawing(from, sheet.GetIdOfPart(drawings));
        }

        using (var data = new MemoryStream(xml, writable: false))
        {
            sheet.FeedData(data);
        }

        return drawings;
    }

    // CT_Worksheet fixes the order of children: <drawing> comes before these, after everything else.
    private static readonly HashSet<string> AfterDrawing = new(StringComparer.Ordinal)
    {
        "legacyDrawing", "legacyDrawingHF", "drawingHF", "picture", "oleObjects", "controls", "webPublishItems", "tableParts", "extLst",
    };

    /// <summary>The worksheet XML <paramref name="worksheet"/> with a <c>&lt;drawing r:id="…"/&gt;</c> in its place.</summary>
    internal static byte[] WithDrawing(Stream worksheet, string relationshipId)
    {
        ArgumentNullException.ThrowIfNull(worksheet);
        ArgumentNullException.ThrowIfNull(relationshipId);
        const string Relationships = "http://schemas.openxmlformats.org/officeDocument/2006/relationships";
        using var output = new MemoryStream();
        using (var reader = System.Xml.XmlReader.Create(worksheet, new System.Xml.XmlReaderSettings { DtdProcessing = System.Xml.DtdProcessing.Prohibit, XmlResolver = null, CloseInput = false }))
        using (var writer = System.Xml.XmlWriter.Create(output, new System.Xml.XmlWriterSettings { Encoding = new System.Text.UTF8Encoding(false), CloseOutput = false, NewLineHandling = System.Xml.NewLineHandling.Entitize }))
        {
            bool placed = false;
            string rootPrefix = string.Empty;
            void Place()
            {
                writer.WriteStartElement(rootPrefix, "drawing", StreamedSheet.MainNamespace);
                writer.WriteAttributeString("r", "id", Relationships, relationshipId);
                writer.WriteEndElement();
                placed = true;
            }

            while (reader.Read())
            {
                if (reader.NodeType == System.Xml.XmlNodeType.XmlDeclaration)
                {
                    writer.WriteStartDocument(string.Equals(reader.GetAttribute("standalone"), "yes", StringComparison.Ordinal));
                    continue;
                }

                if (reader.Depth == 0 && reader.NodeType == System.Xml.XmlNodeType.Element)
                {
                    rootPrefix = reader.Prefix;
                }
                else if (!placed && reader.Depth == 1 && reader.NodeType == System.Xml.XmlNodeType.Element
                    && reader.NamespaceURI == StreamedSheet.MainNamespace && AfterDrawing.Contains(reader.LocalName))
                {
                    Place();
                }
                else if (!placed && reader.Depth == 0 && reader.NodeType == System.Xml.XmlNodeType.EndElement)
                {
                    Place();
                }

                StreamedSheet.CopyNode(reader, writer);
            }

            if (!placed)
            {
                throw new InvalidOperationException("The worksheet part has no root element to put a drawing in.");
            }
        }

        return output.ToArray();
    }

    private static C.ChartSpace BuildChartSpace(ScatterChartSpec spec)
    {
        const uint xAxisId = 500100;
        const uint yAxisId = 500200;
        var scatter = new C.ScatterChart(
            new C.ScatterStyle { Val = C.ScatterStyleValues.LineMarker },
            new C.VaryColors { Val = false });
        for (int i = 0; i < spec.Series.Count; i++)
        {
            scatter.Append(Series(spec.Series[i], (uint)i));
        }

        scatter.Append(new C.AxisId { Val = xAxisId }, new C.AxisId { Val = yAxisId });

        var plotArea = new C.PlotArea(
            new C.Layout(),
            scatter,
            ValueAxis(xAxisId, yAxisId, C.AxisPositionValues.Bottom, spec.XTitle, "0.0", spec.XBounds),
            ValueAxis(yAxisId, xAxisId, C.AxisPositionValues.Left, spec.YTitle, "0.0", spec.YBounds));

        var chart = new C.Chart(
            Title(spec.Title, 1400, bold: true),
            new C.AutoTitleDeleted { Val = false },
            plotArea,
            new C.Legend(new C.LegendPosition { Val = C.LegendPositionValues.Right }, new C.Overlay { Val = false }),
            new C.PlotVisibleOnly { Val = true },
            new C.DisplayBlanksAs { Val = C.DisplayBlanksAsValues.Gap });

        var space = new C.ChartSpace(
            new C.Date1904 { Val = false },
            new C.RoundedCorners { Val = false },
            chart);
        space.AddNamespaceDeclaration("c", "http://schemas.openxmlformats.org/drawingml/2006/chart");
        space.AddNamespaceDeclaration("a", "http://schemas.openxmlformats.org/drawingml/2006/main");
        space.AddNamespaceDeclaration("r", "http://schemas.openxmlformats.org/officeDocument/2006/relationships");
        return space;
    }

    private static C.ScatterChartSeries Series(ScatterSeriesSpec s, uint index)
    {
        var fill = new A.SolidFill(new A.RgbColorModelHex { Val = s.ColourHex });
        return new C.ScatterChartSeries(
            new C.Index { Val = index },
            new C.Order { Val = index },
            new C.SeriesText(new C.NumericValue(s.Name)),
            new C.ChartShapeProperties(new A.Outline(new A.NoFill())),
            new C.Marker(
                new C.Symbol { Val = C.MarkerStyleValues.Circle },
                new C.Size { Val = 6 },
                new C.ChartShapeProperties(fill, new A.Outline(new A.SolidFill(new A.RgbColorModelHex { Val = s.ColourHex })))),
            new C.XValues(NumberReference(s.XRange, s.XCache)),
            new C.YValues(NumberReference(s.YRange, s.YCache)),
            new C.Smooth { Val = false });
    }

    // The points themselves are added by WriteCachedPoints.
    private static C.NumberReference NumberReference(string range, IReadOnlyList<double> cache) =>
        new(new C.Formula(range), new C.NumberingCache(new C.FormatCode("General"), new C.PointCount { Val = (uint)cache.Count }));

    /// <summary>
    /// Copies the chart XML <paramref name="chart"/> to <paramref name="output"/>, writing into its number caches, in
    /// document order, the finite values of <paramref name="caches"/> as points (round-trip text, index kept).
    /// </summary>
    internal static void WriteCachedPoints(byte[] chart, Stream output, IReadOnlyList<IReadOnlyList<double>> caches)
    {
        ArgumentNullException.ThrowIfNull(chart);
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(caches);
        const string ChartNamespace = "http://schemas.openxmlformats.org/drawingml/2006/chart";
        using var reader = System.Xml.XmlReader.Create(new MemoryStream(chart, writable: false), new System.Xml.XmlReaderSettings { DtdProcessing = System.Xml.DtdProcessing.Prohibit, XmlResolver = null });
        using var writer = System.Xml.XmlWriter.Create(output, new System.Xml.XmlWriterSettings { Encoding = new System.Text.UTF8Encoding(false), CloseOutput = false, NewLineHandling = System.Xml.NewLineHandling.Entitize });
        int next = 0;
        Span<char> number = stackalloc char[32];
        while (reader.Read())
        {
            if (reader.NodeType == System.Xml.XmlNodeType.XmlDeclaration)
            {
                writer.WriteStartDocument();
                continue;
            }

            if (reader.NodeType == System.Xml.XmlNodeType.EndElement && reader.LocalName == "numCache" && reader.NamespaceURI == ChartNamespace)
            {
                if (next >= caches.Count)
                {
                    throw new InvalidOperationException("The chart has more number caches than series values.");
                }

                var cache = caches[next++];
                for (int i = 0; i < cache.Count; i++)
                {
                    if (double.IsFinite(cache[i]))
                    {
                        writer.WriteStartElement(reader.Prefix, "pt", ChartNamespace);
                        writer.WriteStartAttribute("idx");
                        writer.WriteValue(i);
                        writer.WriteEndAttribute();
                        writer.WriteStartElement(reader.Prefix, "v", ChartNamespace);
                        cache[i].TryFormat(number, out int n, "R", System.Globalization.CultureInfo.InvariantCulture);
                        writer.WriteRaw(number[..n].ToString());
                        writer.WriteEndElement();
                        writer.WriteEndElement();
                    }
                }
            }

            StreamedSheet.CopyNode(reader, writer);
        }

        if (next != caches.Count)
        {
            throw new InvalidOperationException($"The chart has {next} number caches for {caches.Count} series values.");
        }
    }

    private static C.ValueAxis ValueAxis(uint id, uint crossing, C.AxisPositionValues position, string title, string format, (double Min, double Max)? bounds)
    {
        var scaling = new C.Scaling(new C.Orientation { Val = C.OrientationValues.MinMax });
        if (bounds is { } b)
        {
            scaling.Append(new C.MaxAxisValue { Val = b.Max }, new C.MinAxisValue { Val = b.Min });
        }

        return new(
            new C.AxisId { Val = id },
            scaling,
            new C.Delete { Val = false },
            new C.AxisPosition { Val = position },
            new C.MajorGridlines(new C.ChartShapeProperties(new A.Outline(new A.SolidFill(new A.RgbColorModelHex { Val = "E5E5E5" })))),
            Title(title, 1000, bold: false),
            new C.NumberingFormat { FormatCode = format, SourceLinked = false },
            new C.MajorTickMark { Val = C.TickMarkValues.Outside },
            new C.MinorTickMark { Val = C.TickMarkValues.None },
            new C.TickLabelPosition { Val = C.TickLabelPositionValues.Low },
            new C.CrossingAxis { Val = crossing },
            new C.Crosses { Val = C.CrossesValues.AutoZero },
            new C.CrossBetween { Val = C.CrossBetweenValues.MidpointCategory });
    }

    private static C.Title Title(string text, int size, bool bold) =>
        new(
            new C.ChartText(new C.RichText(
                new A.BodyProperties(),
                new A.ListStyle(),
                new A.Paragraph(
                    new A.ParagraphProperties(new A.DefaultRunProperties { FontSize = size, Bold = bold }),
                    new A.Run(new A.RunProperties { Language = "en-GB", FontSize = size, Bold = bold }, new A.Text(text))))),
            new C.Overlay { Val = false });
}
