using System.CommandLine;
using YieldBench.Intake;
using YieldBench.Reports.Data;
using YieldBench.Reports.Tables;

namespace YieldBench.Cli.Commands;

/// <summary><c>yieldbench check</c>: read inputs, print the header mapping, row accounting and every issue.</summary>
internal static class CheckCommand
{
    public static Command Create(CliContext context)
    {
        var inputs = new Argument<string[]>("inputs") { Description = "Lot and log files or folders (.xlsx, .xls, .csv).", Arity = ArgumentArity.OneOrMore };
        var columns = new Option<string[]>("--column") { Description = "Map a header to a field: FIELD=HEADER (repeatable).", Arity = ArgumentArity.ZeroOrMore, AllowMultipleArgumentsPerToken = false };
        var mapping = new Option<string?>("--mapping") { Description = "A column-mapping file: one 'FIELD = HEADER' a line, '#' comments." };
        var season = new Option<int?>("--season") { Description = "Season (vintage year) for rows whose column, sheet name and file name give none." };
        var issuesCsv = new Option<string?>("--issues-csv") { Description = "Also write every issue to this CSV file (file, sheet, row, column, value, code, severity, message)." };
        var command = new Command("check", "Check input files without analysing them: header mapping, rows used and left out, and every problem found.");
        command.Arguments.Add(inputs);
        command.Options.Add(columns);
        command.Options.Add(mapping);
        command.Options.Add(season);
        command.Options.Add(issuesCsv);
        command.SetAction(parseResult =>
        {
            int? year = parseResult.GetValue(season);
            if (year is < 1900 or > 2100)
            {
                context.Error.WriteLine($"check: --season {year} is not a four-digit year between 1900 and 2100.");
                return ExitCodes.Usage;
            }

            string? csvPath = parseResult.GetValue(issuesCsv);
            string? csvFull = csvPath is null ? null : Path.GetFullPath(csvPath, context.WorkingDirectory);
            if (csvFull is not null && Path.GetDirectoryName(csvFull) is { } csvDir && !Directory.Exists(csvDir))
            {
                context.Error.WriteLine($"check: the folder of --issues-csv '{csvPath}' does not exist.");
                return ExitCodes.Usage;
            }

            var options = new IntakeOptions
            {
                ColumnMappings = parseResult.GetValue(columns) ?? [],
                MappingFile = parseResult.GetValue(mapping),
                Season = year,
                WorkingDirectory = context.WorkingDirectory,
            };
            var set = IntakeReader.Read(parseResult.GetValue(inputs) ?? [], options);
            IntakeReport.WriteText(set, context.Out);
            if (csvFull is not null)
            {
                // The one issue table review writes to data/intake-issues.csv: same columns, line ends and neutralising.
                CsvText.WriteFile(ReviewTables.IntakeIssues(set.Issues), csvFull);
                context.Out.WriteLine($"Issues written to {csvPath}.");
            }

            return IntakeReport.AnyRowLeftOut(set) ? ExitCodes.InputProblems : ExitCodes.Success;
        });
        return command;
    }
}
