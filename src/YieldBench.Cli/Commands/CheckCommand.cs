using System.CommandLine;
using YieldBench.Intake;
using YieldBench.Reports.Data;
using YieldBench.Cli.CommandLine;
using YieldBench.Reports.Tables;

namespace YieldBench.Cli.Commands;

/// <summary><c>yieldbench check</c>: read inputs, print the header mapping, row accounting and every issue.</summary>
internal static class CheckCommand
{
    public static Command Create(CliContext context)
    {
        var inputs = new Argument<string[]>("inputs") { Description = "Lot and log files or folders (.xlsx, .xls, .ods, .csv, .txt, .tsv).", Arity = ArgumentArity.OneOrMore };
        var columns = new Option<string[]>("--column") { Description = "Map a header to a field: FIELD=HEADER (repeatable).", Arity = ArgumentArity.ZeroOrMore, AllowMultipleArgumentsPerToken = false };
        var mapping = new Option<string?>("--mapping") { Description = "A column-mapping file: one 'FIELD = HEADER' a line, '#' comments." };
        var season = UsageChecks.SeasonOption("Season (vintage year) for rows whose column, sheet name and file name give none.");
        var running = new Option<bool>("--running") { Description = "Read the inputs as lots still fermenting and their logs, as forecast --running does: a lots table needs lot, strain and starting sugar, no final alcohol." };
        var issuesCsv = new Option<string?>("--issues-csv") { Description = "Also write every issue to this CSV file (file, sheet, row, column, value, code, severity, message)." };
        var command = new Command("check", "Check input files without analysing them: header mapping, rows used and left out, and every problem found.");
        command.Arguments.Add(inputs);
        command.Options.Add(columns);
        command.Options.Add(mapping);
        command.Options.Add(season);
        command.Options.Add(running);
        command.Options.Add(issuesCsv);
        command.SetAction(parseResult =>
        {
            string[] paths = parseResult.GetValue(inputs) ?? [];
            string[] mappings = parseResult.GetValue(columns) ?? [];
            string? mappingFile = parseResult.GetValue(mapping);
            string? csvPath = parseResult.GetValue(issuesCsv);
            string? csvFull = csvPath is null ? null : Path.GetFullPath(csvPath, context.WorkingDirectory);
            string? usage = UsageChecks.Inputs("check", paths, context.WorkingDirectory)
                ?? UsageChecks.Columns("check", mappings)
                ?? UsageChecks.MappingFile("check", mappingFile, context.WorkingDirectory)
                ?? (csvFull is null ? null : UsageChecks.WritableFile("check", "--issues-csv", csvFull, csvPath!, paths.Select(p => Path.GetFullPath(p, context.WorkingDirectory)), IssueTableHeader()));
            if (usage is not null)
            {
                TextWrap.WriteLine(context.Error, usage);
                return ExitCodes.Usage;
            }

            var options = new IntakeOptions
            {
                ColumnMappings = mappings,
                MappingFile = mappingFile,
                Season = parseResult.GetValue(season),
                RunningLots = parseResult.GetValue(running),
                WorkingDirectory = context.WorkingDirectory,
            };
            var set = IntakeReader.Read(paths, options);
            IntakeReport.WriteText(set, context.Out);
            if (csvFull is not null)
            {
                // The one issue table review writes to data/intake-issues.csv: same columns, line ends and neutralising.
                CsvText.WriteFile(ReviewTables.IntakeIssues(set.Issues), csvFull);
                context.Out.WriteLine($"Issues written to {UsageChecks.Shown(csvPath!)}.");
            }

            // A log with one column per lot is a table too (kind "log, one column per lot").
            if (!set.Accounts.Any(a => a.Kind is "lots" or "running lots" || a.Kind.StartsWith("log", StringComparison.Ordinal)))
            {
                TextWrap.WriteLine(context.Error, "check: no table of lots or log readings was found in the inputs; the issues above say why.");
                return ExitCodes.InputProblems;
            }

            return IntakeReport.AnyRowLeftOut(set) ? ExitCodes.InputProblems : ExitCodes.Success;
        });
        return command;
    }

    /// <summary>The first line of the issue table, which marks a file this tool wrote.</summary>
    internal static string IssueTableHeader()
    {
        using var writer = new StringWriter();
        CsvText.Write(ReviewTables.IntakeIssues([]), writer);
        return writer.ToString().Split('\n')[0].TrimEnd('\r');
    }
}
