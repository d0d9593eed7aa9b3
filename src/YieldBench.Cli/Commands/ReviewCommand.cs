using System.CommandLine;

namespace YieldBench.Cli.Commands;

/// <summary><c>yieldbench review</c>.</summary>
internal static class ReviewCommand
{
    public static Command Create(CliContext context)
    {
        var inputs = new Argument<string[]>("inputs") { Description = "Lot and log files or folders (.xlsx, .xls, .csv). None: the bundled demo data.", Arity = ArgumentArity.ZeroOrMore };
        var output = new Option<string>("--out") { Description = "Output folder.", DefaultValueFactory = _ => "yieldbench-report" };
        var command = new Command("review", "Review finished lots: conversion by strain, odd lots, house factor, kinetics; writes a workbook, charts and data files.");
        command.Arguments.Add(inputs);
        command.Options.Add(output);
        command.SetAction(_ =>
        {
            context.Error.WriteLine("review: the analysis and report stages are not built yet in this version; nothing was written.");
            return ExitCodes.InputProblems;
        });
        return command;
    }
}
