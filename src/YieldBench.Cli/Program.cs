using YieldBench.Cli;

var context = CliContext.FromConsole();
YieldBenchApp.HandleUnobservedFaults(args, context);
return YieldBenchApp.Run(args, context);
