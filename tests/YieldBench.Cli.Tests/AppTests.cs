namespace YieldBench.Cli.Tests;

/// <summary>The command's shell: help, version and usage errors, seen as a user sees them.</summary>
public class AppTests
{
    private static (int Code, string Out, string Err) Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = YieldBenchApp.Run(args, new CliContext(output, error, IsTerminal: false, Environment.CurrentDirectory));
        return (code, output.ToString(), error.ToString());
    }

    [Fact]
    public void Help_lists_the_review_command_and_exits_zero()
    {
        var (code, output, _) = Run("--help");

        Assert.Equal(ExitCodes.Success, code);
        Assert.Contains("post-harvest review", output, StringComparison.Ordinal);
        Assert.Contains("review", output, StringComparison.Ordinal);
    }

    [Fact]
    public void Version_prints_the_assembly_version()
    {
        var (code, output, _) = Run("--version");

        Assert.Equal(ExitCodes.Success, code);
        Assert.Equal(YieldBenchApp.Version, output.Trim());
        Assert.Matches(@"^\d+\.\d+\.\d+", output.Trim());
    }

    [Fact]
    public void An_unknown_command_is_a_usage_error_with_exit_code_two()
    {
        var (code, _, error) = Run("harvest-now");

        Assert.Equal(ExitCodes.Usage, code);
        Assert.Contains("Unrecognized command or argument 'harvest-now'", error, StringComparison.Ordinal);
        Assert.Contains("yieldbench --help", error, StringComparison.Ordinal);
    }

    [Fact]
    public void No_command_at_all_is_a_usage_error()
    {
        var (code, _, _) = Run();

        Assert.Equal(ExitCodes.Usage, code);
    }
}
