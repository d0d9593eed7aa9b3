using System.Globalization;
using System.IO.Compression;
using System.Text;
using System.Xml;
using ExcelDataReader;

namespace YieldBench.Intake;

/// <summary>
/// Reads an .xlsx, .xlsm or .xls workbook into raw sheets with ExcelDataReader, after refusing what is not a
/// workbook, is encrypted or would expand out of proportion (checked in the zip directory before anything is
/// inflated). Formula errors, which the reader shows as empty cells, are found by a streaming pass over the sheet XML.
/// </summary>
internal static class WorkbookSource
{
    internal static readonly byte[] ZipMagic = [0x50, 0x4B, 0x03, 0x04];
    internal static readonly byte[] CompoundFileMagic = [0xD0, 0xCF, 0x11, 0xE0, 0xA1, 0xB1, 0x1A, 0xE1];

    /// <summary>Columns a sheet may span (that of the largest spreadsheets, 16,384); cells beyond are not read.</summary>
    public const int MaxColumns = 16_384;

    /// <summary>Cells (rows × declared columns) read from one sheet at most; a larger sheet is refused whole.</summary>
    public const long MaxCells = 50_000_000;

    static WorkbookSource() => Encoding.RegisterProvider(CodePagesEncodingProvider.Instance);

    internal static bool StartsWith(byte[] data, byte[] magic) => data.Length >= magic.Length && data.AsSpan(0, magic.Length).SequenceEqual(magic);

    public static RawFile Read(string file, string fullPath, string ext, byte[] head, IntakeOptions options, IssueSink sink)
    {
        bool isZip = StartsWith(head, ZipMagic);
        bool isCompound = StartsWith(head, CompoundFileMagic);
        if (isCompound && IsEncryptedPackage(fullPath))
        {
            // An encrypted .xlsx is an OLE compound file holding an "EncryptedPackage" stream (MS-OFFCRYPTO 2.3.4).
            sink.Error(file, null, null, null, null, IssueCodes.PasswordProtected, IntakeMessages.PasswordProtected());
            return SourceFiles.Refused;
        }

        if (ext is ".xlsx" or ".xlsm" && isCompound)
        {
            // An Excel 97–2003 workbook saved under a newer name: the reader tells the two apart by their content.
            sink.Warning(file, null, null, null, null, IssueCodes.ContentDiffersFromName, IntakeMessages.OldWorkbookNamedNew(ext));
        }
        else if (ext is ".xlsx" or ".xlsm" && !isZip)
        {
            sink.Error(file, null, null, null, null, IssueCodes.NotAWorkbook, IntakeMessages.NotAZip(ext));
            return SourceFiles.Refused;
        }

        if (ext == ".xls" && !isZip && !isCompound)
        {
            sink.Error(file, null, null, null, null, IssueCodes.NotAWorkbook, IntakeMessages.CorruptWorkbook("it is not an Excel 97–2003 file"));
            return SourceFiles.Refused;
        }

        Dictionary<string, List<(int Row, int Col, object Cell)>> unreadCells = [];
        Dictionary<string, HashSet<int>> hiddenColumns = [];
        if (isZip)
        {
            if (!CheckZip(file, fullPath, ext, options, sink, "xl/workbook.xml", "xl/workbook.bin"))
            {
                return SourceFiles.Refused;
            }

            unreadCells = FindUnreadCells(fullPath, hiddenColumns, out string? damage);
            if (damage is not null)
            {
                // The spreadsheet reader stops quietly at damaged XML; a half-read sheet must not pass as whole.
                sink.Error(file, null, null, null, null, IssueCodes.CorruptWorkbook, IntakeMessages.CorruptWorkbook(damage));
                return SourceFiles.Refused;
            }
        }
        else if (isCompound)
        {
            // An Excel 97–2003 workbook: the reader gives its formula errors as empty cells; a pass over its records
            // finds them, so an #DIV/0! residual sugar is not read as dry.
            unreadCells = XlsErrorCells.Find(fullPath);
        }

        var sheets = new List<RawSheet>();
        try
        {
            using var stream = SourceFiles.OpenShared(fullPath);
            using var reader = ExcelReaderFactory.CreateReader(stream);
            do
            {
                var rows = new List<object?[]>();
                bool tooMany = false, tooLarge = false;
                long visited = 0;

                // A damaged file can declare any width: no sheet of a spreadsheet program is wider than MaxColumns.
                int width = Math.Min(reader.FieldCount, MaxColumns);
                var buffer = new object?[width];
                while (reader.Read())
                {
                    if (rows.Count >= options.MaxRows)
                    {
                        tooMany = true;
                        break;
                    }

                    visited += width;
                    if (visited > MaxCells)
                    {
                        tooLarge = true;
                        break;
                    }

                    int last = -1;
                    for (int i = 0; i < width; i++)
                    {
                        object? cell = reader.GetValue(i);
                        if (cell is double d && IsPercentFormat(reader.GetNumberFormatString(i)))
                        {
                            // A percent-formatted 0.138 is shown as 13.8 %; read what the user sees, as text with its %.
                            cell = Math.Round(d * 100, 10).ToString("R", CultureInfo.InvariantCulture) + "%";
                        }

                        buffer[i] = cell;
                        last = cell is null ? last : i;
                    }

                    // Only up to the row's last cell: empty cells a wide sheet declares take no room.
                    rows.Add(buffer[..(last + 1)]);
                }

                if (tooLarge)
                {
                    rows.Clear();
                }

                string name = TextSettling.Settle(reader.Name ?? "", multiline: false, out _) is { Length: > 0 } n ? n : $"Sheet{sheets.Count + 1}";
                if (unreadCells.TryGetValue(reader.Name ?? "", out var unread))
                {
                    foreach (var (row, col, cell) in unread)
                    {
                        while (rows.Count <= row)
                        {
                            rows.Add([]);
                        }

                        if (rows[row].Length <= col)
                        {
                            var wider = new object?[col + 1];
                            rows[row].CopyTo(wider, 0);
                            rows[row] = wider;
                        }

                        rows[row][col] = cell;
                    }
                }

                bool hidden = !string.Equals(reader.VisibleState, "visible", StringComparison.OrdinalIgnoreCase) && !string.IsNullOrEmpty(reader.VisibleState);
                var sheet = new RawSheet(name, rows, decimalComma: false) { TooManyRows = tooMany, TooManyCells = tooLarge, Hidden = hidden };
                for (int i = 0; i < width; i++)
                {
                    // The reader gives a hidden column (or one of no width, hidden by dragging) a width of 0.
                    if (reader.GetColumnWidth(i) <= 0)
                    {
                        sheet.HiddenColumns.Add(i);
                    }
                }

                if (hiddenColumns.TryGetValue(reader.Name ?? "", out var hiddenHere))
                {
                    // .xlsx: the reader takes only hidden="1" for hidden; LibreOffice writes hidden="true".
                    sheet.HiddenColumns.UnionWith(hiddenHere);
                }

                foreach (var range in reader.MergeCells ?? [])
                {
                    sheet.Merged.Add(new CellSpan(range.FromRow, range.FromColumn, range.ToRow, range.ToColumn));
                }

                sheets.Add(sheet);
            }
            while (reader.NextResult());
        }
        catch (ExcelDataReader.Exceptions.InvalidPasswordException)
        {
            sink.Error(file, null, null, null, null, IssueCodes.PasswordProtected, IntakeMessages.PasswordProtected());
            return SourceFiles.Refused;
        }
        catch (Exception ex) when (ex is not OutOfMemoryException)
        {
            // The reader meets arbitrary bytes here: any failure inside it means the file is damaged, which is the
            // user's input problem to report, not a fault of ours to crash on.
            sink.Error(file, null, null, null, null, IssueCodes.CorruptWorkbook, IntakeMessages.CorruptWorkbook(ex.Message.TrimEnd('.')));
            return SourceFiles.Refused;
        }

        return new RawFile(sheets, false);
    }

    /// <summary>
    /// Checks a zip package from its central directory before anything in it is inflated: the sizes it claims (in
    /// total and in proportion, and compressed parts that together claim more bytes than the file holds, which only
    /// parts sharing their data do), and that it holds one of the parts <paramref name="anyOf"/> names.
    /// </summary>
    internal static bool CheckZip(string file, string fullPath, string ext, IntakeOptions options, IssueSink sink, params string[] anyOf)
    {
        try
        {
            using var fs = SourceFiles.OpenShared(fullPath);
            using var zip = new ZipArchive(fs, ZipArchiveMode.Read);
            long compressed = 0, uncompressed = 0;
            foreach (var entry in zip.Entries)
            {
                // Sizes come from the central directory; nothing is decompressed here.
                compressed += entry.CompressedLength;
                uncompressed += entry.Length;
            }

            if (compressed > fs.Length)
            {
                sink.Error(file, null, null, null, null, IssueCodes.ZipBomb, IntakeMessages.ZipPartsOverlap(compressed, fs.Length));
                return false;
            }

            if (uncompressed > options.MaxUncompressedBytes)
            {
                sink.Error(file, null, null, null, null, IssueCodes.ZipBomb, IntakeMessages.TooBigUncompressed(uncompressed, options.MaxUncompressedBytes));
                return false;
            }

            if (compressed > 0 && uncompressed / (double)compressed > options.MaxCompressionRatio)
            {
                sink.Error(file, null, null, null, null, IssueCodes.ZipBomb, IntakeMessages.ZipBomb(uncompressed, compressed, options.MaxCompressionRatio));
                return false;
            }

            if (!anyOf.Any(name => zip.GetEntry(name) is not null))
            {
                sink.Error(file, null, null, null, null, IssueCodes.NotAWorkbook, IntakeMessages.NotAZip(ext));
                return false;
            }

            return true;
        }
        catch (InvalidDataException)
        {
            sink.Error(file, null, null, null, null, IssueCodes.NotAWorkbook, IntakeMessages.NotAZip(ext));
            return false;
        }
    }

    private static bool IsEncryptedPackage(string fullPath)
    {
        // The compound file's directory holds stream names in UTF-16LE; look for the one encryption adds.
        byte[] needle = Encoding.Unicode.GetBytes("EncryptedPackage");
        using var fs = SourceFiles.OpenShared(fullPath);
        var buffer = new byte[Math.Min(fs.Length, 4L * 1024 * 1024)];
        fs.ReadExactly(buffer);
        return buffer.AsSpan().IndexOf(needle) >= 0;
    }

    /// <summary>
    /// Cells the spreadsheet reader shows as empty although they are not, in each worksheet of an .xlsx, by sheet name:
    /// formula errors (cells of type "e", as <see cref="ErrorCell"/>) and formulas with no stored result (an
    /// <c>f</c> element without a <c>v</c>, as <see cref="FormulaCell"/>). This pass lets us report them instead. It
    /// also collects each sheet's hidden columns (0-based) into <paramref name="hidden"/>.
    /// </summary>
    private static Dictionary<string, List<(int Row, int Col, object Cell)>> FindUnreadCells(string fullPath, Dictionary<string, HashSet<int>> hidden, out string? damage)
    {
        var result = new Dictionary<string, List<(int, int, object)>>(StringComparer.Ordinal);
        damage = null;
        string part = "xl/workbook.xml";
        try
        {
            using var fs = SourceFiles.OpenShared(fullPath);
            using var zip = new ZipArchive(fs, ZipArchiveMode.Read);
            var wb = zip.GetEntry("xl/workbook.xml");
            var rels = zip.GetEntry("xl/_rels/workbook.xml.rels");
            if (wb is null || rels is null)
            {
                return result;
            }

            var targets = new Dictionary<string, string>(StringComparer.Ordinal);
            using (var rs = rels.Open())
            using (var xr = XmlReader.Create(rs, SafeXml))
            {
                while (xr.Read())
                {
                    if (xr.NodeType == XmlNodeType.Element && xr.LocalName == "Relationship" && xr.GetAttribute("Id") is { } id && xr.GetAttribute("Target") is { } target)
                    {
                        targets[id] = target.StartsWith('/') ? target.TrimStart('/') : "xl/" + target;
                    }
                }
            }

            var sheets = new List<(string Name, string Path)>();
            using (var ws = wb.Open())
            using (var xr = XmlReader.Create(ws, SafeXml))
            {
                while (xr.Read())
                {
                    if (xr.NodeType == XmlNodeType.Element && xr.LocalName == "sheet" && xr.GetAttribute("name") is { } name)
                    {
                        string? rid = xr.GetAttribute("id", "http://schemas.openxmlformats.org/officeDocument/2006/relationships");
                        if (rid is not null && targets.TryGetValue(rid, out var path))
                        {
                            sheets.Add((name, path));
                        }
                    }
                }
            }

            foreach (var (name, path) in sheets)
            {
                part = $"sheet '{name}'";
                if (zip.GetEntry(path) is { } entry)
                {
                    using var es = entry.Open();
                    ScanCells(es, name, result, hidden);
                }
            }
        }
        catch (XmlException ex)
        {
            damage = $"the XML of {part} is damaged: {ex.Message.TrimEnd('.')}";
        }
        catch (InvalidDataException ex)
        {
            damage = $"{part} cannot be decompressed: {ex.Message.TrimEnd('.')}";
        }

        return result;
    }

    /// <summary>Streams one worksheet's XML, adding its error cells and formulas without a stored result, and its hidden columns.</summary>
    private static void ScanCells(Stream sheetXml, string sheet, Dictionary<string, List<(int, int, object)>> result, Dictionary<string, HashSet<int>> hidden)
    {
        using var xr = XmlReader.Create(sheetXml, SafeXml);
        string? reference = null;
        bool error = false, hasFormula = false, hasValue = false;
        string formula = "", value = "";
        bool advanced = false;
        while (advanced || xr.Read())
        {
            advanced = false;
            if (xr.NodeType == XmlNodeType.Element && xr.LocalName == "col" && xr.GetAttribute("hidden") is "1" or "true"
                && int.TryParse(xr.GetAttribute("min"), NumberStyles.None, CultureInfo.InvariantCulture, out int min)
                && int.TryParse(xr.GetAttribute("max"), NumberStyles.None, CultureInfo.InvariantCulture, out int max))
            {
                // <col min="6" max="6" hidden="true"/>: 1-based, up to the widest sheet's width.
                if (!hidden.TryGetValue(sheet, out var set))
                {
                    hidden[sheet] = set = [];
                }

                for (int i = Math.Max(min, 1); i <= Math.Min(max, MaxColumns); i++)
                {
                    set.Add(i - 1);
                }
            }
            else if (xr.NodeType == XmlNodeType.Element && xr.LocalName == "c")
            {
                reference = xr.GetAttribute("r");
                error = xr.GetAttribute("t") == "e";
                hasFormula = hasValue = false;
                formula = value = "";
                if (xr.IsEmptyElement)
                {
                    reference = null;
                }
            }
            else if (reference is not null && xr.NodeType == XmlNodeType.Element && xr.LocalName is "f" or "v")
            {
                bool isFormula = xr.LocalName == "f";
                bool empty = xr.IsEmptyElement;
                string text = empty ? "" : xr.ReadElementContentAsString();
                advanced = !empty; // reading the content moved the reader past the element's end
                if (isFormula)
                {
                    (hasFormula, formula) = (true, text);
                }
                else
                {
                    (hasValue, value) = (text.Length > 0, text);
                }
            }
            else if (reference is not null && xr.NodeType == XmlNodeType.EndElement && xr.LocalName == "c")
            {
                object? cell = error ? new ErrorCell(value.Length > 0 ? value : "#ERROR")
                    : hasFormula && !hasValue ? new FormulaCell(formula)
                    : null;
                if (cell is not null && TryParseReference(reference, out int row, out int col))
                {
                    if (!result.TryGetValue(sheet, out var list))
                    {
                        result[sheet] = list = [];
                    }

                    list.Add((row, col, cell));
                }

                reference = null;
            }
        }
    }

    internal static readonly XmlReaderSettings SafeXml = new() { DtdProcessing = DtdProcessing.Prohibit, XmlResolver = null, IgnoreWhitespace = true };

    /// <summary>"B4" → row 3, column 1 (both 0-based).</summary>
    internal static bool TryParseReference(string reference, out int row, out int col)
    {
        row = col = 0;
        int i = 0, c = 0;
        while (i < reference.Length && char.IsAsciiLetter(reference[i]))
        {
            c = (c * 26) + (char.ToUpperInvariant(reference[i]) - 'A' + 1);
            i++;
        }

        if (i == 0 || i == reference.Length || !int.TryParse(reference.AsSpan(i), NumberStyles.None, CultureInfo.InvariantCulture, out int r) || r < 1)
        {
            return false;
        }

        row = r - 1;
        col = c - 1;
        return true;
    }

    /// <summary>True when an Excel number format shows the value as a percentage (a % outside quotes and escapes).</summary>
    internal static bool IsPercentFormat(string? format)
    {
        if (string.IsNullOrEmpty(format))
        {
            return false;
        }

        bool quoted = false;
        for (int i = 0; i < format.Length; i++)
        {
            char c = format[i];
            if (c == '"')
            {
                quoted = !quoted;
            }
            else if (!quoted && c == '\\')
            {
                i++;
            }
            else if (!quoted && c == '%')
            {
                return true;
            }
        }

        return false;
    }
}
