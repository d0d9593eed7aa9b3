using SharpFuzz;
using YieldBench.Fuzz;

// Under afl-fuzz (fuzz/run.sh): each input is read as one file. Without AFL: `--replay FILE…` reads saved inputs (a
// crash or hang afl-fuzz found) and prints what each gave; `--seed OUT-FOLDER FILE…` turns sample files into inputs.
if (args.Length > 1 && args[0] == "--replay")
{
    foreach (string file in args[1..])
    {
        using var stream = File.OpenRead(file);
        Console.WriteLine($"{file}: {Target.Describe(Target.Read(stream))}");
    }

    return 0;
}

if (args.Length > 2 && args[0] == "--seed")
{
    foreach (string file in args[2..])
    {
        Target.WriteSeed(file, args[1]);
    }

    return 0;
}

Fuzzer.OutOfProcess.Run(stream => Target.Read(stream));
return 0;
