namespace YieldBench.Cli;

/// <summary>The command's exit codes.</summary>
public static class ExitCodes
{
    /// <summary>Success.</summary>
    public const int Success = 0;

    /// <summary>The inputs had problems, which were reported.</summary>
    public const int InputProblems = 1;

    /// <summary>The command line was not understood, or cannot be carried out (said before any work).</summary>
    public const int Usage = 2;

    /// <summary>A fault of the tool stopped the command (one line says what failed; no stack trace).</summary>
    public const int InternalError = 3;
}
