namespace YieldBench.Scenario;

/// <summary>The generator's command line: <c>demo-data [DIR]</c> rewrites the demo files; <c>summary</c> prints the truth.</summary>
public static class ScenarioProgram
{
    /// <summary>Runs the command; returns the exit code (0 done, 2 usage).</summary>
    public static int Run(string[] args, TextWriter output, TextWriter error)
    {
        ArgumentNullException.ThrowIfNull(args);
        ArgumentNullException.ThrowIfNull(output);
        ArgumentNullException.ThrowIfNull(error);
        if (args.Length >= 1 && args[0] == "demo-data")
        {
            string dir = args.Length >= 2 ? args[1] : "demo-data";
            foreach (var file in DemoDataWriter.Write(ScenarioGenerator.Demo(), dir))
            {
                output.WriteLine($"wrote {file}");
            }

            return 0;
        }

        if (args.Length == 1 && args[0] == "summary")
        {
            output.Write(DemoDataWriter.Readme(ScenarioGenerator.Demo()));
            return 0;
        }

        error.WriteLine("usage: demo-data [DIR]   rewrite the demo files (default folder: demo-data; the finished seasons go to its history/, the harvest in progress to its running/)");
        error.WriteLine("       summary           print what is planted where");
        return 2;
    }
}
