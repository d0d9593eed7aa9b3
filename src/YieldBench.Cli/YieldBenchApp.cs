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

            context.Error.WriteLine("Run 'yieldbench --help' for usage.");
            return ExitCodes.Usage;
        }

        return parse.Invoke(new InvocationConfiguration { Output = context.Out, Error = context.Error });
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
