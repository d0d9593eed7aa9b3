namespace YieldBench.Cli;

/// <summary>What a command needs from the outside world, injected so tests see exactly what a user sees.</summary>
/// <param name="Out">Standard output.</param>
/// <param name="Error">Standard error.</param>
/// <param name="IsTerminal">True when output goes to an interactive terminal (progress is shown only then).</param>
/// <param name="WorkingDirectory">Directory relative paths are resolved against.</param>
public sealed record CliContext(TextWriter Out, TextWriter Error, bool IsTerminal, string WorkingDirectory)
{
    /// <summary>
    /// The folder a details file goes to when a fault stops a command (the exception with its stack trace, the command
    /// line and the version, for a bug report); the system's temporary folder unless set.
    /// </summary>
    public string FaultLogFolder { get; init; } = Path.GetTempPath();

    /// <summary>The real console.</summary>
    public static CliContext FromConsole() =>
        new(Console.Out, Console.Error, !Console.IsOutputRedirected, Environment.CurrentDirectory);
}
