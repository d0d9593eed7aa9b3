using System.Text;

namespace YieldBench.Cli.Tests;

public sealed class CheckCommandTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "yieldbench-check-" + Guid.NewGuid().ToString("N"));

    public CheckCommandTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private (int Code, string Out, string Error) Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = YieldBenchApp.Run(args, new CliContext(output, error, IsTerminal: false, _dir));
        return (code, output.ToString().Replace("\r\n", "\n", StringComparison.Ordinal), error.ToString());
    }

    private void Write(string name, string text) => File.WriteAllText(Path.Combine(_dir, name), text, new UTF8Encoding(false));

    [Fact]
    public void Check_of_clean_inputs_prints_mapping_and_accounting_and_exits_zero()
    {
        // Given a clean lots file
        Write("lots-2023.csv", "Lot,Yeast,Brix,Alcohol % v/v\nA-01,QX-7,24.0,14.0\nA-02,QX-9,23.0,13.5\n");

        // When checked
        var (code, output, _) = Run("check", "lots-2023.csv");

        // Then it exits 0 and says what went where, naming the file once as given
        Assert.Equal(ExitCodes.Success, code);
        Assert.StartsWith("lots-2023.csv\n  69 bytes, sha256 ", output, StringComparison.Ordinal);
        Assert.Contains("  lots: 2 rows read = 2 lots used, 0 left out, 0 blank, 0 summary or heading.\n", output, StringComparison.Ordinal);
        Assert.Contains("    Brix           starting_sugar  °Brix\n", output, StringComparison.Ordinal);
        Assert.Single(output.Split('\n'), l => l.Contains("lots-2023.csv", StringComparison.Ordinal));
        Assert.Contains("Issues: 0 (0 errors, 0 warnings).", output, StringComparison.Ordinal);
        Assert.EndsWith("Result: 2 lots (2023), 0 fermentation logs with 0 readings; 0 rows left out.\n", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_of_a_board_with_one_column_per_lot_alone_finds_its_table_and_exits_zero()
    {
        // Given only a tank board: a date, then one column of readings per tank
        Write("board-2026.csv", "Date,Time,T1,T2\n2026-09-14,08:00,24.0,22.5\n2026-09-15,08:00,21.5,21.0\n");

        // When checked
        var (code, output, error) = Run("check", "board-2026.csv");

        // Then the board is a table: exit 0, no word of "no table", and its two logs counted
        Assert.Equal(ExitCodes.Success, code);
        Assert.Equal("", error);
        Assert.EndsWith("Result: 0 lots (no usable lot rows), 2 fermentation logs with 4 readings; 0 rows left out.\n", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_running_reads_lots_still_fermenting_and_without_it_the_refusal_names_the_option()
    {
        // Given a table of lots still fermenting (no column of the finished wine) and their log, times typed "8am"
        Write("harvest-2026.csv", "Lot,Yeast,Brix,Inoculated\nR1,QX-7,25.0,2026-09-20 08:00\n");
        Write("harvest-2026-log.csv", "Lot,Date,Time,Brix,Temp °F\nR1,2026-09-20,6pm,24.6,66\nR1,2026-09-21,8am,23.1,72\n");

        // When checked with --running, and without it
        var (code, output, _) = Run("check", "--running", "harvest-2026.csv", "harvest-2026-log.csv");
        var (plainCode, plainOutput, _) = Run("check", "harvest-2026.csv", "harvest-2026-log.csv");

        // Then with it every row is used and the result counts a running lot of 2026
        Assert.Equal(ExitCodes.Success, code);
        Assert.Contains("running lots: 1 rows read = 1 lots used", output, StringComparison.Ordinal);
        Assert.EndsWith("Result: 1 running lot (2026), 1 fermentation log with 2 readings; 0 rows left out.\n", output, StringComparison.Ordinal);

        // and without it the missing final alcohol is refused with the way to read such lots
        Assert.Equal(ExitCodes.InputProblems, plainCode);
        Assert.Contains("check --running FILES", string.Join(" ", plainOutput.Split('\n').Select(l => l.Trim())), StringComparison.Ordinal);
    }

    [Fact]
    public void Check_exits_one_and_names_the_place_when_a_row_is_left_out()
    {
        Write("lots-2023.csv", "Lot,Yeast,Brix,Alcohol % v/v\nA-01,QX-7,24.0,14.0\nA-02,QX-9,abc,13.5\n");
        var (code, output, _) = Run("check", "lots-2023.csv");
        Assert.Equal(ExitCodes.InputProblems, code);
        Assert.Contains(
            "  error row 3, column \"Brix\", value \"abc\": not-a-number: starting_sugar is not a number. Enter a\n      plain number such as 24.2 (a decimal comma is read too, in files that use it).\n",
            output,
            StringComparison.Ordinal);
        Assert.All(output.Split('\n'), l => Assert.True(l.Length <= 100, l));
        Assert.Contains("1 row left out.", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_writes_every_issue_to_a_csv_file_when_asked()
    {
        Write("lots-2023.csv", "Lot,Yeast,Brix,Alcohol % v/v,pH\nA-01,QX-7,24.0,14.0,\"3,4\"\nA-02,QX-9,abc,13.5,3.3\n");
        var (code, _, _) = Run("check", "lots-2023.csv", "--issues-csv", "issues.csv");
        Assert.Equal(ExitCodes.InputProblems, code);
        Assert.Equal(
            "file,sheet,row,column,value,code,severity,message\r\n" +
            "lots-2023.csv,,3,Brix,abc,not-a-number,error,\"starting_sugar is not a number. Enter a plain number such as 24.2 (a decimal comma is read too, in files that use it).\"\r\n",
            File.ReadAllText(Path.Combine(_dir, "issues.csv")));
    }

    [Fact]
    public void Check_and_review_write_the_same_issue_file_for_the_same_input_with_formula_text_neutralised()
    {
        // Given a lots file whose bad cells hold formula-like text
        Write("lots-2023.csv", "Lot,Yeast,Brix,Alcohol % v/v\nA-01,QX-7,24.0,14.0\nA-02,QX-9,=1+1,13.5\nA-03,QX-9,23.5,@SUM(A1)\nA-04,QX-7,23.0,13.6\n");

        // When it is checked with --issues-csv and reviewed
        Run("check", "lots-2023.csv", "--issues-csv", "issues.csv");
        Run("review", "lots-2023.csv", "--out", "report", "--quiet");
        byte[] fromCheck = File.ReadAllBytes(Path.Combine(_dir, "issues.csv"));
        byte[] fromReview = File.ReadAllBytes(Path.Combine(_dir, "report", "data", "intake-issues.csv"));

        // Then the two files are byte-identical, hold a severity column, end lines with CRLF and never start a cell with '='
        string text = Encoding.UTF8.GetString(fromCheck);
        Assert.Equal(fromCheck, fromReview);
        Assert.StartsWith("file,sheet,row,column,value,code,severity,message\r\n", text, StringComparison.Ordinal);
        Assert.Contains(",'=1+1,", text, StringComparison.Ordinal);
        Assert.Contains(",'@SUM(A1),", text, StringComparison.Ordinal);
        Assert.DoesNotContain(",=1+1", text, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_passes_column_mappings_and_the_season_to_intake()
    {
        Write("lots.csv", "Lot,Levure,Brix,Alcohol % v/v\nA-01,QX-7,24.0,14.0\n");
        var (code, output, _) = Run("check", "lots.csv", "--column", "strain=Levure", "--season", "2021");
        Assert.Equal(ExitCodes.Success, code);
        Assert.Contains("Result: 1 lot (2021)", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_without_inputs_is_a_usage_error()
    {
        var (code, _, error) = Run("check");
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains("Run 'yieldbench check --help' for usage.", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_refuses_a_season_that_is_not_a_year()
    {
        Write("lots.csv", "Lot,Yeast,Brix,ABV\nA-01,QX-7,24.0,14.0\n");
        var (code, _, error) = Run("check", "lots.csv", "--season", "23");
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Equal("--season 23 is not a year between 1900 and 2100; give the vintage, e.g. --season 2024.\nRun 'yieldbench check --help' for usage.\n", error.Replace("\r\n", "\n", StringComparison.Ordinal));
    }
}
