using System.CommandLine;
using System.CommandLine.Invocation;
using System.Reflection;

namespace YieldBench.Cli;

/// <summary>Builds the command tree and runs it; holds no domain logic.</summary>
public static class YieldBenchApp
{
    /// <summary>The tool's version (assembly informational version).</summary>
    public static string Version =>
        typeof(YieldBenchApp).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion.Split('+')[0] ?? "0.0.0";

    /// <summary>
    /// Parses and runs; returns the exit code. This is the one place an exception that stops a command is turned into
    /// what a user sees (<see cref="CommandLine.FaultReport"/>: a short message, the details in a file, exit code 3).
    /// </summary>
    public static int Run(string[] args, CliContext context)
    {
        ArgumentNullException.ThrowIfNull(args);
        ArgumentNullException.ThrowIfNull(context);
        try
        {
            return ParseAndInvoke(args, context);
        }
        catch (Exception e)
        {
            return CommandLine.FaultReport.Handle(e, args, context);
        }
    }

    /// <summary>
    /// Turns an exception on a thread of the tool's own that nothing caught (which would end the process with a stack
    /// trace) into the same short message and exit code 3; <c>Program</c> installs it for the real console.
    /// </summary>
    public static void HandleUnobservedFaults(string[] args, CliContext context) =>
        AppDomain.CurrentDomain.UnhandledException += (_, e) =>
        {
            CommandLine.FaultReport.Handle(e.ExceptionObject as Exception ?? new InvalidOperationException(e.ExceptionObject?.ToString()), args, context);
            Environment.Exit(ExitCodes.InternalError);
        };

    /// <summary>
    /// Says in one line that Ctrl-C or a stop signal ended the command, which then ends as the signal asks (exit code
    /// 130, or 143 for SIGTERM). Every file is written whole or not at all (reports through a staging folder, single
    /// files through a hidden partial file renamed into place), so there is nothing else to undo.
    /// </summary>
    public static void SayWhenStopped(CliContext context)
    {
        ArgumentNullException.ThrowIfNull(context);
        _stopSignals =
        [
            System.Runtime.InteropServices.PosixSignalRegistration.Create(System.Runtime.InteropServices.PosixSignal.SIGINT, _ => Stopped(context, "Ctrl-C")),
            System.Runtime.InteropServices.PosixSignalRegistration.Create(System.Runtime.InteropServices.PosixSignal.SIGTERM, _ => Stopped(context, "a stop signal")),
        ];
    }

    /// <summary>The line said when a signal stops the command.</summary>
    internal static string StoppedMessage(string by) =>
        $"yieldbench: stopped by {by}. Nothing half-written was left in place: a report folder keeps its previous report until a run finishes, and the next run clears away an unfinished copy.";

    private static System.Runtime.InteropServices.PosixSignalRegistration[]? _stopSignals;

    private static void Stopped(CliContext context, string by)
    {
        try
        {
            context.Error.WriteLine();
            CommandLine.TextWrap.WriteLine(context.Error, StoppedMessage(by));
            context.Error.Flush();
        }
        catch (Exception e) when (e is IOException or ObjectDisposedException)
        {
            // Standard error is gone: the exit code still says the command was stopped.
        }
    }

    private static int ParseAndInvoke(string[] args, CliContext context)
    {
        var root = new RootCommand(
            "YieldBench: post-harvest review of yeast-strain conversion, house conversion factors, odd lots and fermentation kinetics.");
        foreach (var option in root.Options.OfType<VersionOption>())
        {
            // The built-in action prints the entry assembly's version (a test host's, under test); print ours.
            option.Action = new PrintVersion(context);
        }

        foreach (var command in AllCommands(context))
        {
            root.Subcommands.Add(command);
        }

        var parse = root.Parse(args);
        if (CommandLine.Suggestions.Misspelt(parse, context.WorkingDirectory) is { } misspelt)
        {
            CommandLine.TextWrap.WriteLine(context.Error, misspelt);
            return ExitCodes.Usage;
        }

        if (parse.Errors.Count > 0)
        {
            // A word not understood says more than "Required command was not provided", which it causes.
            bool unmatched = parse.UnmatchedTokens.Count > 0;
            foreach (var error in parse.Errors.Where(e => !unmatched || e.Message != "Required command was not provided."))
            {
                CommandLine.TextWrap.WriteLine(context.Error, error.Message);
            }

            // A word left over right after an option's value is most often the rest of a value with a space in it.
            foreach (var token in parse.UnmatchedTokens)
            {
                int i = Array.IndexOf(args, token);
                if (i >= 2 && args[i - 2].StartsWith("--", StringComparison.Ordinal) && !args[i - 1].StartsWith('-'))
                {
                    CommandLine.TextWrap.WriteLine(context.Error, $"'{token}' follows the value of {args[i - 2]}: a value with a space in it is written in quotes, {args[i - 2]} \"{args[i - 1]} {token}\".");
                    break;
                }
            }

            string command = parse.CommandResult.Command == root ? "" : parse.CommandResult.Command.Name + " ";
            context.Error.WriteLine($"Run 'yieldbench {command}--help' for usage.");
            return ExitCodes.Usage;
        }

        return Invoke(parse, context);
    }

    /// <summary>
    /// Runs a parsed command; a fault inside it becomes a short message on standard error, the details in a file, and
    /// exit code 3.
    /// </summary>
    internal static int Invoke(ParseResult parse, CliContext context)
    {
        try
        {
            return parse.Invoke(new InvocationConfiguration { Output = context.Out, Error = context.Error, EnableDefaultExceptionHandler = false });
        }
        catch (Exception e)
        {
            return CommandLine.FaultReport.Handle(e, parse.Tokens.Select(t => t.Value), context);
        }
    }

    private static IEnumerable<Command> AllCommands(CliContext context)
    {
        yield return Commands.ReviewCommand.Create(context);
        yield return Commands.CheckCommand.Create(context);
        yield return Commands.TemplateCommand.Create(context);
        yield return Commands.PlanCommand.Create(context);
        yield return Commands.ForecastCommand.Create(context);
    }

    private sealed class PrintVersion(CliContext context) : SynchronousCommandLineAction
    {
        public override int Invoke(ParseResult parseResult)
        {
            context.Out.WriteLine(Version);
            return ExitCodes.Success;
        }
    }
}
