using System.Text;
using CsvHelper;

namespace YieldBench.Intake.Tests;

/// <summary>
/// The streaming CSV splitter gives exactly the records (and unclosed-quote findings) that CsvHelper gives when it
/// parses the whole text at once, including for malformed quoting, blank lines and every kind of line end.
/// </summary>
public class CsvRecordsTests
{
    private static List<(string[] Fields, string? Bad)> Reference(string text, char delimiter)
    {
        var records = new List<(string[], string?)>();
        using var parser = new CsvParser(new StringReader(text), CsvRecords.Configuration(delimiter));
        while (parser.Read())
        {
            records.Add((parser.Record ?? [], CsvRecords.QuoteProblem(parser.RawRecord)));
        }

        return records;
    }

    private static List<(string[] Fields, string? Bad)> Streamed(string text, char delimiter, int chunk)
    {
        var records = new List<(string[], string?)>();
        using var reader = new CsvRecords(new StringReader(text), delimiter, chunk);
        while (reader.Read())
        {
            records.Add((reader.Record.Cast<string>().ToArray(), reader.Bad));
        }

        return records;
    }

    private static void AssertSame(string text, char delimiter, int chunk)
    {
        var expected = Reference(text, delimiter);
        var actual = Streamed(text, delimiter, chunk);
        string shown = text.Replace("\r", "\\r", StringComparison.Ordinal).Replace("\n", "\\n", StringComparison.Ordinal);
        Assert.True(expected.Count == actual.Count, $"{shown}: {expected.Count} records expected, {actual.Count} read");
        for (int i = 0; i < expected.Count; i++)
        {
            Assert.True(expected[i].Fields.SequenceEqual(actual[i].Fields), $"{shown}: record {i}: {expected[i].Fields.Length} [{string.Join("|", expected[i].Fields)}] expected, {actual[i].Fields.Length} [{string.Join("|", actual[i].Fields)}] read");
            Assert.True(expected[i].Bad == actual[i].Bad, $"{shown}: record {i}: '{expected[i].Bad}' expected, '{actual[i].Bad}' read");
        }
    }

    [Theory]
    [InlineData("Lot,Yeast\nA-01,QX-7\n")]
    [InlineData("Lot,Yeast\r\nA-01,QX-7\r\n\r\n")]
    [InlineData("Lot,Yeast\rA-01,QX-7\r\rB")]
    [InlineData("Lot,Notes\nA-01,\"Whole berries, some stems\"\nA-02,\"two\nlines\"\n")]
    [InlineData("Lot,Notes\nA-01,\"say \"\"dry\"\"\",x\n")]
    [InlineData("Lot,Notes\nA-01,\"unclosed\nA-02,x\nA-03,y\n")]
    [InlineData("Lot,Notes\nA-01,mid\"quote,x\nA-02,\"a\"b,y\n\"\"\n\"a\" ,b\n")]
    [InlineData("\n\n,\n , \n")]
    [InlineData("")]
    [InlineData("a,\"b\r\nc\"\r\n")]
    public void Crafted_texts_split_as_csvhelper_splits_them(string text)
    {
        foreach (int chunk in new[] { 2, 3, 7, 1 << 16 })
        {
            AssertSame(text, ',', chunk);
        }
    }

    [Fact]
    public void Random_texts_split_as_csvhelper_splits_them()
    {
        var random = new Random(20240302);
        string[] pieces = ["a", "b", "1.5", " ", ",", ";", "\"", "\"\"", "\r", "\n", "\r\n", "\t"];
        var sb = new StringBuilder();
        for (int n = 0; n < 6000; n++)
        {
            sb.Clear();
            int length = random.Next(0, 40);
            for (int i = 0; i < length; i++)
            {
                sb.Append(pieces[random.Next(pieces.Length)]);
            }

            string text = sb.ToString();
            char delimiter = n % 3 == 0 ? ';' : ',';
            AssertSame(text, delimiter, 1 + random.Next(1, 9));
            AssertSame(text, delimiter, 1 << 16);
        }
    }
}
