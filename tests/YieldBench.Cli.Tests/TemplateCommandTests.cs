namespace YieldBench.Cli.Tests;

public sealed class TemplateCommandTests : IDisposable
{
    private readonly string _dir = Path.Combine(Path.GetTempPath(), "yieldbench-template-" + Guid.NewGuid().ToString("N"));

    public TemplateCommandTests() => Directory.CreateDirectory(_dir);

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private (int Code, string Out, string Error) Run(params string[] args)
    {
        var output = new StringWriter();
        var error = new StringWriter();
        int code = YieldBenchApp.Run(args, new CliContext(output, error, IsTerminal: false, _dir));
        return (code, output.ToString().Replace("\r\n", "\n", StringComparison.Ordinal), error.ToString().Replace("\r\n", "\n", StringComparison.Ordinal));
    }

    [Fact]
    public void Template_writes_a_workbook_that_check_reads_as_empty_and_clean()
    {
        // Given a fresh template
        var (code, output, _) = Run("template", "--out", "lots-template.xlsx");
        Assert.Equal(ExitCodes.Success, code);
        Assert.Equal("Wrote lots-template.xlsx: sheets 'Lots', 'Fermentation log' and 'Columns'. Fill in one row per lot; 'yieldbench check lots-template.xlsx' shows what would be read.", Cli.Flat(output).Trim());

        // When checked / Then no lots, no errors, exit 0
        var check = Run("check", "lots-template.xlsx");
        Assert.Equal(ExitCodes.Success, check.Code);
        Assert.Contains("Issues: 0 (0 errors, 0 warnings)", check.Out, StringComparison.Ordinal);
        Assert.Contains("sheet \"Columns\", not read", check.Out, StringComparison.Ordinal);
        Assert.Contains("Result: 0 lots (no usable lot rows)", check.Out, StringComparison.Ordinal);
    }

    [Fact]
    public void Template_refuses_to_overwrite_a_file_unless_forced()
    {
        // Given an existing file
        string path = Path.Combine(_dir, "mine.xlsx");
        File.WriteAllText(path, "keep me");

        // When a template is asked for there / Then it is refused and the file kept
        var (code, _, error) = Run("template", "--out", "mine.xlsx");
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Equal("template: 'mine.xlsx' already exists and was left as it is. Pass --force to replace it, or give\n  another name.\n", error);
        Assert.Equal("keep me", File.ReadAllText(path));

        // And with --force it is replaced by a workbook
        Assert.Equal(ExitCodes.Success, Run("template", "--out", "mine.xlsx", "--force").Code);
        Assert.Equal((byte)'P', File.ReadAllBytes(path)[0]);
    }

    [Fact]
    public void Template_needs_an_xlsx_name()
    {
        var (code, _, error) = Run("template", "--out", "lots.csv");
        Assert.Equal(ExitCodes.Usage, code);
        Assert.Equal("template: 'lots.csv' does not end in .xlsx; give a workbook name such as lots-template.xlsx.\n", error);
    }
}
