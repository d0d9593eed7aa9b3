using YieldBench.Scenario;

return ScenarioProgram.Run(args, Console.Out, Console.Error);
