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

    /// <summary>Parses and runs; returns the exit code.</summary>
    public static int Run(string[] args, CliContext context)
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
        if (parse.Errors.Count > 0)
        {
            foreach (var error in parse.Errors)
            {
                context.Error.WriteLine(error.Message);
            }

            string command = parse.CommandResult.Command == root ? "" : parse.CommandResult.Command.Name + " ";
            context.Error.WriteLine($"Run 'yieldbench {command}--help' for usage.");
            return ExitCodes.Usage;
        }

        return Invoke(parse, context);
    }

    /// <summary>Runs a parsed command; a fault inside it becomes one line on standard error and exit code 3.</summary>
    internal static int Invoke(ParseResult parse, CliContext context)
    {
        try
        {
            return parse.Invoke(new InvocationConfiguration { Output = context.Out, Error = context.Error, EnableDefaultExceptionHandler = false });
        }
        catch (Exception e) when (e is not OutOfMemoryException)
        {
            // No stack trace reaches a user: one line saying what failed, and that it is the tool's fault.
            string what = e.Message.Split('\n')[0].Trim().TrimEnd('.');
            context.Error.WriteLine($"yieldbench: an internal error stopped the command ({e.GetType().Name}: {what}). This is a fault of the tool, not of your files; please report it with the command line you gave.");
            return ExitCodes.InternalError;
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
