namespace YieldBench.Cli.Tests;

/// <summary>Every command's work runs inside the app's one fault handler: a fault in any of them is the same short message.</summary>
public sealed class EveryCommandFaultTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("yieldbench-fault-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    /// <summary>Standard output closed under the command (a pipe whose reader went away): writing to it fails.</summary>
    private sealed class ClosedOutput : TextWriter
    {
        public override System.Text.Encoding Encoding => System.Text.Encoding.UTF8;

        public override void Write(char value) => throw new IOException("Broken pipe");

        public override void Write(string? value) => throw new IOException("Broken pipe");
    }

    public static TheoryData<string[]> EveryCommand() => new()
    {
        { ["review", "lots-2023.csv", "--out", "report"] },
        { ["review", "--out", "demo-report"] },
        { ["check", "lots-2023.csv"] },
        { ["template", "--out", "blank.xlsx"] },
        { ["plan", "--factor", "0.59", "--sugar", "24", "--target", "14"] },
        { ["forecast", "--out", "forecast"] },
    };

    [Theory]
    [MemberData(nameof(EveryCommand))]
    public void A_fault_in_any_command_is_the_short_message_with_a_details_file_and_exit_code_3(string[] args)
    {
        // Given a lots file, and a standard output that fails when written to
        File.WriteAllText(Path.Combine(_dir, "lots-2023.csv"), "Lot,Vintage,Yeast,Brix,Alcohol % v/v\nA-01,2023,QX-7,24.0,14.0\nA-02,2023,QX-9,23.1,13.4\n");
        string logs = Directory.CreateDirectory(Path.Combine(_dir, "logs")).FullName;
        var error = new StringWriter();

        // When the command runs and writes its first word of output
        int exit = YieldBenchApp.Run(args, new CliContext(new ClosedOutput(), error, false, _dir) { FaultLogFolder = logs });

        // Then the one handler says what stopped it, names the details file, and exits 3; no stack trace is printed
        string said = Cli.Flat(error.ToString());
        Assert.Equal(ExitCodes.InternalError, exit);
        Assert.Contains("yieldbench: the command stopped because a file could not be read or written (Broken pipe).", said, StringComparison.Ordinal);
        Assert.Contains("Details (for a bug report): " + Assert.Single(Directory.GetFiles(logs)), said, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", error.ToString(), StringComparison.Ordinal);
    }
}
