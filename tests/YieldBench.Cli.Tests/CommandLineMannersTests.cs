using System.Text;

namespace YieldBench.Cli.Tests;

/// <summary>
/// Command-line mistakes are usage errors said on standard error before any work (exit 2); results go to standard
/// output and progress to standard error; lines fit 100 columns; input text never reaches the terminal raw.
/// </summary>
public sealed class CommandLineMannersTests : IDisposable
{
    private const string Lots = "Lot,Yeast,Brix,Alcohol % v/v\nA-01,QX-7,24.0,14.0\nA-02,QX-9,23.0,13.5\nA-03,QX-7,25.0,14.6\n";

    private readonly string _dir = Path.Combine(Path.GetTempPath(), "yb-manners-" + Guid.NewGuid().ToString("N"));

    public CommandLineMannersTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private (int Exit, string Out, string Error) Run(params string[] args)
    {
        var (exit, output, error) = Cli.Run(_dir, args);
        return (exit, output.Replace("\r\n", "\n", StringComparison.Ordinal), error.Replace("\r\n", "\n", StringComparison.Ordinal));
    }

    private void Write(string name, string text) => File.WriteAllText(Path.Combine(_dir, name), text, new UTF8Encoding(false));

    public static TheoryData<string[], string> UsageErrors() => new()
    {
        { ["review", "nothere.xlsx"], "review: the input 'nothere.xlsx' was not found" },
        { ["review", "nothere.xlsx", "--quiet"], "review: the input 'nothere.xlsx' was not found" },
        { ["check", "nothere.csv"], "check: the input 'nothere.csv' was not found" },
        { ["review", "lots-2023.csv", "--outt", "x"], "review: '--outt' is not an option of review" },
        { ["check", "lots-2023.csv", "-q"], "check: '-q' is not an option of check" },
        { ["review", "lots-2023.csv", "--season", "0"], "--season 0 is not a year between 1900 and 2100" },
        { ["review", "lots-2023.csv", "--season", "-5"], "--season -5 is not a year between 1900 and 2100" },
        { ["review", "lots-2023.csv", "--season", "203"], "--season 203 is not a year between 1900 and 2100" },
        { ["review", "lots-2023.csv", "--season", "99999"], "--season 99999 is not a year between 1900 and 2100" },
        { ["review", "lots-2023.csv", "--season", "99999999999"], "--season 99999999999 is not a year between 1900 and 2100" },
        { ["check", "lots-2023.csv", "--season", "twenty"], "--season twenty is not a year between 1900 and 2100" },
        { ["review", "lots-2023.csv", "--seed", "abc"], "--seed abc is not a whole number from -2147483648 to 2147483647; give one like --seed 7." },
        { ["review", "lots-2023.csv", "--seed", "1.5"], "--seed 1.5 is not a whole number" },
        { ["review", "lots-2023.csv", "--seed", "99999999999"], "--seed 99999999999 is not a whole number" },
        { ["review", "lots-2023.csv", "--threshold", "fourteen"], "--threshold fourteen is not a number; write it like --threshold 14.5 (a decimal comma is also read)." },
        { ["review", "lots-2023.csv", "--threshold", "14,5", "--out", "/dev/null"], "is a file, not a folder" }, // 14,5 is 14.5 (it was read as 145)
        { ["review", "lots-2023.csv", "--out", "/dev/null"], "is a file, not a folder" },
        { ["review", "lots-2023.csv", "--out", "lots-2023.csv"], "is also an input" },
        { ["review", "lots-2023.csv", "--out", "notes.txt"], "is a file, not a folder" },
        { ["review", "lots-2023.csv", "--out", "notes.txt/sub"], "lies under" },
        { ["check", "lots-2023.csv", "--issues-csv", "."], "--issues-csv '.' is a folder" },
        { ["check", "lots-2023.csv", "--issues-csv", "lots-2023.csv"], "is one of the inputs" },
        { ["check", "lots-2023.csv", "--issues-csv", "notes.txt"], "exists and was not written by this tool" },
        { ["check", "lots-2023.csv", "--issues-csv", "missing/issues.csv"], "the folder of --issues-csv 'missing/issues.csv' does not exist; create it first, or give a file in a folder that exists." },
        { ["template", "--out", "missing/lots-template.xlsx"], "template: the folder of 'missing/lots-template.xlsx' does not exist; create it first, or give a file in a folder that exists." },
        { ["check", "lots-2023.csv", "--column", "yeast_brand=Yeast"], "'yeast_brand' is not a field name. Use one of: block, colour," },
        { ["check", "lots-2023.csv", "--column", "strain"], "is not of the form FIELD = HEADER" },
        { ["review", "lots-2023.csv", "--mapping", "nope.txt"], "the mapping file 'nope.txt' was not found" },
        { ["template", "--out", "notes.txt.xlsx"], "already exists" },
        { ["revew", "lots-2023.csv"], "yieldbench: 'revew' is not a command; did you mean 'review'? Run 'yieldbench --help' for usage." },
        { ["chek", "lots-2023.csv"], "yieldbench: 'chek' is not a command; did you mean 'check'?" },
        { ["review", "lots-2023.csv", "--outt", "x"], "review: '--outt' is not an option of review; did you mean '--out'? Run 'yieldbench review --help' for usage." },
        { ["review", "lots-2023.csv", "--seeed", "3"], "did you mean '--seed'?" },
        { ["check", "lots-2023.csv", "--colum", "strain=Yeast"], "check: '--colum' is not an option of check; did you mean '--column'?" },
        { ["forecast", "--quite"], "forecast: '--quite' is not an option of forecast; did you mean '--quiet'?" },
        { ["forecast", "lots-2023.csv", "--running", "lots-2023.csv"], "forecast: --running 'lots-2023.csv' is also given as history, so finished lots would be read as running or running lots as finished; keep the lots still fermenting in a folder of their own, apart from the history." },
        { ["forecast", ".", "--running", "lots-2023.csv"], "forecast: --running 'lots-2023.csv' lies in the history's '.'" },
        { ["plan", "--factor", "0.59", "--strain", "QX", "7", "--sugar", "24"], "'7' follows the value of --strain: a value with a space in it is written in quotes, --strain \"QX 7\"." },
        { ["forecast", "lots-2023.csv", "--running", "."], "forecast: --running '.' holds the history's 'lots-2023.csv'" },
    };

    [Fact]
    public void A_word_far_from_every_name_gets_no_suggestion_and_a_word_not_understood_is_said_alone()
    {
        // Given a command that is no near miss
        var (exit, _, error) = Run("harvest-now");

        // Then the parser's own words say so, without the "required command" line it causes, and without a guess
        Assert.Equal(ExitCodes.Usage, exit);
        Assert.Equal("Unrecognized command or argument 'harvest-now'. Run 'yieldbench --help' for usage.", Cli.Flat(error).Trim());
        Assert.Null(CommandLine.Suggestions.Nearest("-q", ["--quiet", "-?"]));
        Assert.Equal(2, CommandLine.Suggestions.Distance("--quite", "--quiet"));
        Assert.Equal(3, CommandLine.Suggestions.Distance("kitten", "sitting"));
    }

    [Theory]
    [MemberData(nameof(UsageErrors))]
    public void A_command_line_mistake_is_a_usage_error_said_before_any_work(string[] args, string expected)
    {
        // Given a lots file, a note and a file named like a workbook
        Write("lots-2023.csv", Lots);
        Write("notes.txt", "my notes");
        Write("notes.txt.xlsx", "mine");

        // When the command runs
        var (exit, output, error) = Run(args);

        // Then it exits 2 with the reason on standard error, prints nothing on standard output, writes nothing, and the
        // user's files are untouched
        Assert.Equal(ExitCodes.Usage, exit);
        Assert.Equal(string.Empty, output);
        Assert.Contains(expected, Cli.Flat(error), StringComparison.Ordinal);
        Assert.DoesNotContain("System.", error, StringComparison.Ordinal); // no .NET type name (was 'System.Nullable`1[System.Int32]')
        Assert.All(error.Split('\n'), l => Assert.True(l.Length <= 100, l));
        Assert.Equal(["lots-2023.csv", "notes.txt", "notes.txt.xlsx"], Directory.GetFileSystemEntries(_dir).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        Assert.Equal("my notes", File.ReadAllText(Path.Combine(_dir, "notes.txt")));
    }

    [Fact]
    public void An_output_in_a_folder_that_takes_no_file_is_refused_before_any_work()
    {
        if (OperatingSystem.IsWindows())
        {
            return;
        }

        // Given /proc, which takes no new file even for root
        Write("lots-2023.csv", Lots);

        // When asked to write a report or an issue file there
        var review = Run("review", "lots-2023.csv", "--out", "/proc/yieldbench-report");
        var check = Run("check", "lots-2023.csv", "--issues-csv", "/proc/issues.csv");

        // Then both are usage errors naming the folder
        Assert.Equal((ExitCodes.Usage, "review: cannot write in '/proc' (read-only, or no permission); give another --out.\n"), (review.Exit, review.Error));
        Assert.Equal((ExitCodes.Usage, "check: cannot write in '/proc' (read-only, or no permission); give another --issues-csv.\n"), (check.Exit, check.Error));
    }

    [Fact]
    public void A_wrong_column_field_lists_every_field_name()
    {
        Write("lots-2023.csv", Lots);
        var (_, _, error) = Run("check", "lots-2023.csv", "--column", "yeast_brand=Yeast");
        string flat = Cli.Flat(error);
        foreach (var field in new[] { "lot_id", "strain", "starting_sugar", "starting_sg", "final_abv", "residual_sugar_gl", "must_volume_gal", "temp_f", "yan_mgl" })
        {
            Assert.Contains(field, flat, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Quiet_still_says_when_rows_were_left_out_and_when_no_lot_could_be_used()
    {
        // Given a file with one bad row, and a file with no usable lot
        Write("lots-2023.csv", Lots + "A-04,QX-9,abc,13.1\n");
        Write("bad-2023.csv", "Lot,Yeast,Brix,Alcohol % v/v\nB-1,QX-7,abc,14.0\n");

        // When each is reviewed with --quiet
        var some = Run("review", "lots-2023.csv", "--out", "a", "--quiet");
        var none = Run("review", "bad-2023.csv", "--out", "b", "--quiet");

        // Then standard output stays empty, and standard error says what happened; both exit 1
        Assert.Equal((ExitCodes.InputProblems, string.Empty), (some.Exit, some.Out));
        Assert.Equal("review: 1 input error(s): rows or files were left out; each is in a/data/intake-issues.csv with its fix.", Cli.Flat(some.Error).Trim());
        Assert.Equal((ExitCodes.InputProblems, string.Empty), (none.Exit, none.Out));
        Assert.Contains("review: no lot could be used, so nothing was reviewed (1 row(s) left out). The first problems: error bad-2023.csv, row 2, column \"Brix\", value \"abc\": not-a-number:", Cli.Flat(none.Error), StringComparison.Ordinal);
    }

    [Fact]
    public void Input_text_never_reaches_the_terminal_raw_and_paths_are_shown_relative_once()
    {
        // Given a lots file whose strain holds an escape sequence (which would turn a terminal red) and a bad cell
        // holding one, given by its absolute path
        Write("lots-2023.csv", Lots + "A-04,QX-7\u001b[31m,24.1,14.1\nA-05,QX-9,2\u001b[2J3,13.2\n");

        // When checked and reviewed
        var check = Run("check", Path.Combine(_dir, "lots-2023.csv"));
        var review = Run("review", "lots-2023.csv", "--out", "r");

        // Then no escape character is printed, the issue shows it written out, and the path is shown relative, once
        Assert.DoesNotContain('\u001b', check.Out + check.Error + review.Out + review.Error);
        Assert.Contains("value \"2<U+001B>[2J3\"", check.Out, StringComparison.Ordinal);
        Assert.Single(check.Out.Split('\n'), l => l.Contains("lots-2023.csv", StringComparison.Ordinal));
        Assert.StartsWith("lots-2023.csv\n", check.Out, StringComparison.Ordinal);
        Assert.All(check.Out.Split('\n'), l => Assert.True(l.Length <= 100, l));
    }

    [Fact]
    public void Additions_that_cannot_be_corrected_for_lack_of_a_volume_are_said_on_the_console()
    {
        Write("lots-2023.csv", "Lot,Yeast,Brix,Alcohol % v/v,Water added (L)\nA-01,QX-7,24.0,13.2,50\nA-02,QX-9,23.0,13.5,\nA-03,QX-7,25.0,14.6,\n");
        var (exit, output, _) = Run("review", "lots-2023.csv", "--out", "r");
        Assert.Equal(ExitCodes.Success, exit);
        Assert.Contains("Additions not corrected: 1 lot(s) record water or sugar added but no must volume, so their starting sugar could not be corrected", Cli.Flat(output), StringComparison.Ordinal);
    }

    [Fact]
    public void Exit_codes_are_those_the_readme_states()
    {
        // 0 done; 1 done but rows or files left out (or nothing usable); 2 the command line was not understood
        Write("lots-2023.csv", Lots);
        Write("bad-2023.csv", Lots + "A-04,QX-9,abc,13.1\n");
        Directory.CreateDirectory(Path.Combine(_dir, "empty"));
        Assert.Equal(ExitCodes.Success, Run("check", "lots-2023.csv").Exit);
        Assert.Equal(ExitCodes.InputProblems, Run("check", "bad-2023.csv").Exit);
        Assert.Equal(ExitCodes.InputProblems, Run("check", "empty").Exit);
        Assert.Equal(ExitCodes.Usage, Run("check").Exit);
        Assert.Equal(ExitCodes.Success, Run("review", "lots-2023.csv", "--out", "r1", "--quiet").Exit);
        Assert.Equal(ExitCodes.InputProblems, Run("review", "bad-2023.csv", "--out", "r2", "--quiet").Exit);
        Assert.Equal(ExitCodes.InputProblems, Run("review", "empty", "--out", "r3", "--quiet").Exit);
        Assert.Equal(ExitCodes.Success, Run("template", "--out", "t.xlsx").Exit);
        Assert.Equal(ExitCodes.Usage, Run("template", "--out", "t.xlsx").Exit);
        Assert.Equal(ExitCodes.Usage, Run("template", "--out", "t.csv").Exit);
        Assert.Equal(ExitCodes.Usage, Run("no-such-command").Exit);
    }

    [Fact]
    public void A_fault_inside_a_command_is_a_short_message_naming_a_details_file_with_exit_code_3_never_a_stack_trace()
    {
        // Given a command whose action fails with an exception (standing in for a fault of the tool)
        string logs = Directory.CreateDirectory(Path.Combine(_dir, "logs")).FullName;

        // When it runs through the app's own runner
        var (exit, error) = RunThrowing("broken", Fail, logs);

        // Then a short message says what failed, that it is the tool's fault, and where the details went, with exit code 3
        string details = Assert.Single(Directory.GetFiles(logs));
        Assert.Equal(ExitCodes.InternalError, exit);
        Assert.Equal($"yieldbench: an internal error stopped the command (InvalidOperationException: Sequence contains no elements). This is a fault of the tool, not of your files; please report it with the command line you gave. Details (for a bug report): {details}", Cli.Flat(error.ToString()).Trim());
        Assert.All(error.ToString().Split('\n'), l => Assert.True(l.Length <= 100 || !l.Trim().Contains(' ', StringComparison.Ordinal), l));
        Assert.DoesNotContain("   at ", error.ToString(), StringComparison.Ordinal);

        // And the details file holds the command line and the stack trace
        string text = File.ReadAllText(details);
        Assert.Contains("command line: yieldbench broken", text, StringComparison.Ordinal);
        Assert.Contains("   at ", text, StringComparison.Ordinal);
        Assert.Contains(nameof(Fail), text, StringComparison.Ordinal);
    }

    [Fact]
    public void A_file_that_cannot_be_written_mid_command_is_said_as_such_not_as_a_fault_of_the_tool()
    {
        // Given a command that fails because the disk is full, and a details folder that cannot be written either
        string logs = Path.Combine(_dir, "no", "such", "folder");

        // When it runs through the app's own runner
        var (exit, error) = RunThrowing("full", DiskFull, logs);

        // Then the message says what stopped and what to do, and that the details could not be saved; exit code 3
        string said = Cli.Flat(error.ToString()).Trim();
        Assert.Equal(ExitCodes.InternalError, exit);
        Assert.StartsWith("yieldbench: the command stopped because a file could not be read or written (No space left on device). Free space on the disk or fix the file's permissions, then run it again. (The details could not be saved: ", said, StringComparison.Ordinal);
        Assert.DoesNotContain("fault of the tool", said, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", error.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void A_fault_while_parsing_goes_through_the_same_handler()
    {
        // Given a null argument list (an exception before any command is chosen)
        var error = new StringWriter();
        string logs = Directory.CreateDirectory(Path.Combine(_dir, "parse-logs")).FullName;

        // When the app runs it
        int exit = YieldBenchApp.Run(["check", null!], new CliContext(TextWriter.Null, error, false, _dir) { FaultLogFolder = logs });

        // Then it is the short message with its details file, exit code 3
        Assert.Equal(ExitCodes.InternalError, exit);
        Assert.Contains("yieldbench: an internal error stopped the command", Cli.Flat(error.ToString()), StringComparison.Ordinal);
        Assert.Single(Directory.GetFiles(logs));
        Assert.DoesNotContain("   at ", error.ToString(), StringComparison.Ordinal);
    }

    /// <summary>Runs a one-command tree whose action is <paramref name="action"/> through the app's runner.</summary>
    private (int Exit, StringWriter Error) RunThrowing(string name, Func<int> action, string logs)
    {
        var root = new System.CommandLine.RootCommand();
        var command = new System.CommandLine.Command(name);
        command.SetAction((System.CommandLine.ParseResult _) => action());
        root.Subcommands.Add(command);
        var error = new StringWriter();
        int exit = YieldBenchApp.Invoke(root.Parse([name]), new CliContext(TextWriter.Null, error, false, _dir) { FaultLogFolder = logs });
        return (exit, error);
    }

    private static int Fail() => throw new InvalidOperationException("Sequence contains no elements");

    private static int DiskFull() => throw new IOException("No space left on device");

    [Fact]
    public void A_report_kept_inside_the_input_folder_is_not_read_back_as_input()
    {
        // Given a cellar folder and a review written into a folder inside it
        Directory.CreateDirectory(Path.Combine(_dir, "cellar"));
        Write(Path.Combine("cellar", "lots-2023.csv"), Lots);
        Assert.Equal(ExitCodes.Success, Run("review", "cellar", "--out", "cellar/report", "--quiet").Exit);

        // When the folder is checked and reviewed again
        var check = Run("check", "cellar");
        var again = Run("review", "cellar", "--out", "cellar/report", "--quiet");

        // Then the report folder is named as skipped (intake and the report writer agree on its mark), and only the
        // lots file is read
        Assert.Equal(YieldBench.Reports.Output.ReportFolder.ManifestName, YieldBench.Intake.IntakeReader.ReportManifestName);
        Assert.Equal(ExitCodes.Success, check.Exit);
        Assert.Contains("cellar/report\n  warning: file-skipped: The folder is a report this tool wrote", check.Out.ReplaceLineEndings("\n"), StringComparison.Ordinal);
        Assert.Contains("Result: 3 lots (2023)", check.Out, StringComparison.Ordinal);
        Assert.Equal(ExitCodes.Success, again.Exit);
    }
}
