using System.Buffers.Binary;
using System.Text;

namespace YieldBench.Intake;

/// <summary>
/// Finds the formula errors (#DIV/0!, #N/A…) of an Excel 97–2003 workbook, which the spreadsheet reader gives as empty
/// cells: a second pass over the file reads its "Workbook" stream from the compound file (MS-CFB) and walks the BIFF8
/// records (MS-XLS) for formulas whose cached result is an error and for error constants. Read-only and defensive: a
/// file it cannot follow gives no error cells (the reader then reads or refuses it as before), never an exception.
/// </summary>
internal static class XlsErrorCells
{
    private const uint EndOfChain = 0xFFFFFFFE;
    private const uint FreeSector = 0xFFFFFFFF;

    /// <summary>The error cells of each sheet, by sheet name: 0-based row and column, and an <see cref="ErrorCell"/>.</summary>
    public static Dictionary<string, List<(int Row, int Col, object Cell)>> Find(string fullPath)
    {
        try
        {
            byte[] file;
            using (var stream = SourceFiles.OpenShared(fullPath))
            {
                file = new byte[stream.Length];
                stream.ReadExactly(file);
            }

            return WorkbookStream(file) is { } workbook ? ScanBiff(workbook) : [];
        }
        catch (Exception ex) when (ex is ArgumentException or IndexOutOfRangeException or OverflowException or EndOfStreamException or InvalidDataException)
        {
            // A damaged compound file: the spreadsheet reader reports it (or reads what it can) as before.
            return [];
        }
    }

    /// <summary>The bytes of the compound file's "Workbook" stream, or null when the file holds none that can be followed.</summary>
    internal static byte[]? WorkbookStream(byte[] file)
    {
        if (file.Length < 512 || !WorkbookSource.StartsWith(file, WorkbookSource.CompoundFileMagic))
        {
            return null;
        }

        int sectorShift = BinaryPrimitives.ReadUInt16LittleEndian(file.AsSpan(0x1E));
        int miniShift = BinaryPrimitives.ReadUInt16LittleEndian(file.AsSpan(0x20));
        if (sectorShift is not (9 or 12) || miniShift != 6)
        {
            return null;
        }

        int sectorSize = 1 << sectorShift, miniSize = 1 << miniShift;
        uint firstDir = U32(file, 0x30), miniCutoff = U32(file, 0x38), firstMiniFat = U32(file, 0x3C), firstDifat = U32(file, 0x44);
        long sectors = (file.Length / sectorSize) + 1;

        // The FAT's own sectors: 109 in the header, the rest in a chain of DIFAT sectors.
        var fatSectors = new List<uint>();
        for (int i = 0; i < 109; i++)
        {
            uint s = U32(file, 0x4C + (4 * i));
            if (s < sectors)
            {
                fatSectors.Add(s);
            }
        }

        for (uint d = firstDifat, steps = 0; d < sectors && steps < sectors; steps++)
        {
            int at = (int)((d + 1) * sectorSize);
            for (int i = 0; i < (sectorSize / 4) - 1; i++)
            {
                uint s = U32(file, at + (4 * i));
                if (s < sectors)
                {
                    fatSectors.Add(s);
                }
            }

            d = U32(file, at + sectorSize - 4);
        }

        var fat = new uint[fatSectors.Count * (sectorSize / 4)];
        for (int i = 0; i < fatSectors.Count; i++)
        {
            Buffer.BlockCopy(file, (int)((fatSectors[i] + 1) * sectorSize), fat, i * sectorSize, sectorSize);
        }

        if (!BitConverter.IsLittleEndian)
        {
            return null;
        }

        byte[] directory = Chain(file, fat, firstDir, sectorSize, sectorSize, long.MaxValue);
        byte[]? root = null;
        for (int e = 0; e + 128 <= directory.Length; e += 128)
        {
            int nameBytes = BinaryPrimitives.ReadUInt16LittleEndian(directory.AsSpan(e + 0x40));
            byte type = directory[e + 0x42];
            string name = nameBytes is >= 2 and <= 64 ? Encoding.Unicode.GetString(directory, e, nameBytes - 2) : "";
            uint start = U32(directory, e + 0x74);
            long size = (long)BinaryPrimitives.ReadUInt64LittleEndian(directory.AsSpan(e + 0x78)) & 0xFFFFFFFFL;
            if (type == 5)
            {
                root = Chain(file, fat, start, sectorSize, sectorSize, size);
            }
            else if (type == 2 && name == "Workbook")
            {
                if (size >= miniCutoff)
                {
                    return Chain(file, fat, start, sectorSize, sectorSize, size);
                }

                // A small stream lives in the mini stream (the root entry's data), in 64-byte mini sectors.
                byte[] miniFatBytes = Chain(file, fat, firstMiniFat, sectorSize, sectorSize, long.MaxValue);
                var miniFat = new uint[miniFatBytes.Length / 4];
                Buffer.BlockCopy(miniFatBytes, 0, miniFat, 0, miniFat.Length * 4);
                return root is null ? null : Chain(root, miniFat, start, miniSize, 0, size);
            }
        }

        return null;
    }

    /// <summary>
    /// The bytes of a sector chain from <paramref name="start"/>, up to <paramref name="size"/> bytes; sector s lies
    /// at <paramref name="offset"/> + s × <paramref name="unit"/> bytes of <paramref name="data"/> (the header's
    /// sector before the regular sectors). A chain that loops or leaves the data ends there.
    /// </summary>
    private static byte[] Chain(byte[] data, uint[] fat, uint start, int unit, int offset, long size)
    {
        using var bytes = new MemoryStream();
        uint s = start;
        for (int steps = 0; s != EndOfChain && s != FreeSector && s < fat.Length && steps <= fat.Length && bytes.Length < size; steps++)
        {
            long at = offset + ((long)s * unit);
            if (at < 0 || at + unit > data.Length)
            {
                break;
            }

            bytes.Write(data, (int)at, (int)Math.Min(unit, size - bytes.Length));
            s = fat[s];
        }

        return bytes.ToArray();
    }

    /// <summary>Walks the BIFF8 records: sheet names and stream positions (BOUNDSHEET8), then each sheet's error cells.</summary>
    internal static Dictionary<string, List<(int Row, int Col, object Cell)>> ScanBiff(byte[] w)
    {
        var result = new Dictionary<string, List<(int, int, object)>>(StringComparer.Ordinal);
        var sheetAt = new Dictionary<int, string>();
        string? sheet = null;
        for (int at = 0; at + 4 <= w.Length;)
        {
            int type = BinaryPrimitives.ReadUInt16LittleEndian(w.AsSpan(at));
            int length = BinaryPrimitives.ReadUInt16LittleEndian(w.AsSpan(at + 2));
            int body = at + 4;
            if (body + length > w.Length)
            {
                break;
            }

            if (sheetAt.TryGetValue(at, out var name))
            {
                sheet = name;
            }

            var data = w.AsSpan(body, length);
            switch (type)
            {
                case 0x0085 when length >= 8:
                    // BOUNDSHEET8: the position of the sheet's BOF record, its state and type, its name.
                    int position = (int)BinaryPrimitives.ReadUInt32LittleEndian(data);
                    int chars = data[6];
                    bool wide = (data[7] & 1) != 0;
                    int nameBytes = wide ? chars * 2 : chars;
                    if (8 + nameBytes <= length)
                    {
                        sheetAt[position] = wide ? Encoding.Unicode.GetString(data.Slice(8, nameBytes)) : Encoding.Latin1.GetString(data.Slice(8, nameBytes));
                    }

                    break;
                case 0x0006 when sheet is not null && length >= 14 && data[6] == 2 && data[12] == 0xFF && data[13] == 0xFF:
                    // FORMULA whose cached result is an error: its code is the third byte of the result.
                    Add(result, sheet, data, data[8]);
                    break;
                case 0x0205 when sheet is not null && length >= 8 && data[7] == 1:
                    // BOOLERR holding an error constant.
                    Add(result, sheet, data, data[6]);
                    break;
            }

            at = body + length;
        }

        return result;
    }

    private static void Add(Dictionary<string, List<(int, int, object)>> result, string sheet, ReadOnlySpan<byte> data, byte code)
    {
        int row = BinaryPrimitives.ReadUInt16LittleEndian(data), col = BinaryPrimitives.ReadUInt16LittleEndian(data[2..]);
        if (!result.TryGetValue(sheet, out var cells))
        {
            result[sheet] = cells = [];
        }

        cells.Add((row, col, new ErrorCell(ErrorText(code))));
    }

    /// <summary>The text a spreadsheet shows for a BIFF error code (MS-XLS 2.5.99 BErr).</summary>
    internal static string ErrorText(byte code) => code switch
    {
        0x00 => "#NULL!",
        0x07 => "#DIV/0!",
        0x0F => "#VALUE!",
        0x17 => "#REF!",
        0x1D => "#NAME?",
        0x24 => "#NUM!",
        0x2A => "#N/A",
        _ => "#ERROR",
    };

    private static uint U32(byte[] data, int at) => at >= 0 && at + 4 <= data.Length ? BinaryPrimitives.ReadUInt32LittleEndian(data.AsSpan(at)) : FreeSector;
}
