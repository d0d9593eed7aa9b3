using YieldBench.Bench;

return BenchProgram.Run(args, Console.Out, Console.Error);
