using YieldBench.Cli;

var context = CliContext.FromConsole();
YieldBenchApp.HandleUnobservedFaults(args, context);
YieldBenchApp.SayWhenStopped(context);
return YieldBenchApp.Run(args, context);
