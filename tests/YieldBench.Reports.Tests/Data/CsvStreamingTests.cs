using System.Globalization;
using System.Text;
using YieldBench.Reports.Data;
using YieldBench.Reports.Kinetics;
using YieldBench.Reports.Output;
using YieldBench.Reports.Tables;
using YieldBench.Reports.Tests.Fixtures;
using YieldBench.Reports.Tests.Kinetics;

namespace YieldBench.Reports.Tests.Data;

public sealed class CsvStreamingTests
{
    /// <summary>
    /// The CSV writer as it was before streaming (whole file built with LINQ per cell), kept as the oracle with the
    /// columns' stated precision added: the streaming writer must give the same characters for every table.
    /// </summary>
    private static class Oracle
    {
        private static readonly char[] InjectionLeads = ['=', '+', '-', '@', '\t', '\r'];

        public static string Write(ReportTable table)
        {
            var sb = new StringBuilder();
            AppendLine(sb, table.Columns.Select(c => Quote(c.Name)));
            foreach (var row in table.Rows)
            {
                AppendLine(sb, row.Select((cell, i) => Quote(Format(cell, table.Columns[i].Kind, table.Columns[i].CsvDecimals))));
            }

            return sb.ToString();
        }

        private static string Format(object? cell, CellKind kind, int? decimals) => cell switch
        {
            double d when decimals is { } n && double.IsFinite(d) => (Math.Round(d, n, MidpointRounding.AwayFromZero) + 0.0).ToString("F" + n.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture),
            null => string.Empty,
            string s => s.Length > 0 && Array.IndexOf(InjectionLeads, s[0]) >= 0 ? "'" + s : s,
            double d when double.IsNaN(d) || double.IsInfinity(d) => string.Empty,
            double d => d.ToString("R", CultureInfo.InvariantCulture),
            int i => i.ToString(CultureInfo.InvariantCulture),
            long l => l.ToString(CultureInfo.InvariantCulture),
            bool b => b ? "true" : "false",
            DateTime t => t.ToString(t.TimeOfDay == TimeSpan.Zero && kind != CellKind.DateTime ? "yyyy-MM-dd" : "yyyy-MM-ddTHH:mm:ss", CultureInfo.InvariantCulture),
            _ => throw new ArgumentException($"Unsupported cell type {cell.GetType().Name}.", nameof(cell)),
        };

        private static string Quote(string field) =>
            field.AsSpan().IndexOfAny(",\"\r\n") >= 0 ? "\"" + field.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"" : field;

        private static void AppendLine(StringBuilder sb, IEnumerable<string> fields)
        {
            sb.AppendJoin(',', fields);
            sb.Append("\r\n");
        }
    }

    /// <summary>A table of awkward cells: formula leads, quotes, separators, line breaks, non-ASCII, extreme numbers, dates.</summary>
    private static ReportTable Awkward()
    {
        var table = new ReportTable(
        [
            new("text", "Text", CellKind.Text),
            new("number", "Number", CellKind.Number),
            new("whole", "Whole", CellKind.Integer),
            new("big", "Big", CellKind.Integer),
            new("when", "When", CellKind.DateTime),
            new("day", "Day", CellKind.Text),
            new("ok", "OK", CellKind.Boolean),
            new("odd \"name\", with comma", "Odd", CellKind.Text),
        ]);
        string[] texts =
        [
            "=1+1", "+44 1234", "-2 L water", "@SUM(A1)", "\tcmd", "\rcarriage", "\r\n=SUM(A1)", "plain", "a=b", string.Empty,
            "x, y", "say \"dry\"\nthen", "\"", "\"\"", ",", "line1\r\nline2", "trailing\n", "Château d'Ys — 13,5 % vol",
            "grape 🍇 emoji", "lone \ud83d surrogate", "=\"quoted formula\",x", "'already apostrophe", "   spaces   ",
        ];
        double[] numbers = [0.1 + 0.2, -0.0, double.Epsilon, double.MaxValue, -1e-300, 1e21, 123456789.125, double.NaN, double.PositiveInfinity, double.NegativeInfinity, -7];
        for (int i = 0; i < texts.Length; i++)
        {
            table.Add(
            [
                texts[i],
                numbers[i % numbers.Length],
                i % 3 == 0 ? int.MinValue : i,
                i % 2 == 0 ? long.MaxValue : (long)-i,
                i % 4 == 0 ? new DateTime(2025, 9, 14) : new DateTime(2025, 9, 14, 6, 30, 59),
                i % 2 == 0 ? new DateTime(2024, 2, 29) : (object?)null,
                i % 2 == 0,
                i % 5 == 0 ? null : texts[texts.Length - 1 - i],
            ]);
        }

        return table;
    }

    [Fact]
    public void The_streaming_writer_gives_the_old_writer_s_characters_for_awkward_text_and_numbers()
    {
        // Given a table of awkward cells
        var table = Awkward();

        // When it is written by the streaming writer and by the old one
        string streamed = CsvText.Write(table);

        // Then the characters are identical (and the table really is awkward: quoted, neutralised, non-ASCII)
        Assert.Equal(Oracle.Write(table), streamed);
        Assert.Contains("\"'\r\n=SUM(A1)\"", streamed, StringComparison.Ordinal);
        Assert.Contains("\"\"\"\"", streamed, StringComparison.Ordinal);
        Assert.StartsWith("text,number,whole,big,when,day,ok,\"odd \"\"name\"\", with comma\"\r\n", streamed, StringComparison.Ordinal);
    }

    [Fact]
    public void The_streamed_file_has_the_old_file_s_bytes_for_awkward_tables_and_the_review_tables()
    {
        // Given awkward and real tables, and a text whose emoji straddles the writer's 64 K character buffer
        var review = SampleReview.Build();
        var (_, kinetics) = KineticsReportData.Build();
        var straddle = new ReportTable([new("t", "T", CellKind.Text)]);
        straddle.Add([new string('a', 65536 - 1 - 3) + "🍇 and more"]);
        var tables = new[]
        {
            Awkward(), straddle, ReviewTables.Lots(review), ReviewTables.Groups(review), ReviewTables.Flags(review),
            ReviewTables.IntakeIssues(review), KineticsTables.Lots(kinetics),
        };
        using var folder = new TempFolder();

        for (int i = 0; i < tables.Length; i++)
        {
            // When each is streamed to a file and, the old way, built as a string and written as UTF-8
            string streamedPath = folder[$"new-{i}.csv"], oldPath = folder[$"old-{i}.csv"];
            CsvText.WriteFile(tables[i], streamedPath);
            AtomicFile.WriteAllText(oldPath, Oracle.Write(tables[i]));

            // Then the files are byte for byte the same
            Assert.Equal(File.ReadAllBytes(oldPath), File.ReadAllBytes(streamedPath));
        }
    }

    [Fact]
    public void The_kinetics_file_writer_streams_the_same_bytes_as_the_text_writer()
    {
        // Given the kinetics review
        var (_, review) = KineticsReportData.Build();
        using var folder = new TempFolder();

        // When the per-lot file is written straight to disk and through a text writer
        KineticsCsv.WriteFile(review, folder["kinetics.csv"]);
        using var text = new StringWriter(CultureInfo.InvariantCulture);
        KineticsCsv.Write(review, text);

        // Then the file holds exactly the text's UTF-8 bytes, with no byte-order mark
        byte[] bytes = File.ReadAllBytes(folder["kinetics.csv"]);
        Assert.Equal(new UTF8Encoding(false).GetBytes(text.ToString()), bytes);
        Assert.Equal((byte)'s', bytes[0]);
    }
}
