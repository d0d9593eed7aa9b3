using YieldBench.Cli;

return YieldBenchApp.Run(args, CliContext.FromConsole());
