using System.CommandLine;
using YieldBench.Intake;

namespace YieldBench.Cli.Commands;

/// <summary><c>yieldbench template</c>: write the blank input workbook.</summary>
internal static class TemplateCommand
{
    public static Command Create(CliContext context)
    {
        var output = new Option<string>("--out") { Description = "Workbook to write (.xlsx).", Required = true };
        var force = new Option<bool>("--force") { Description = "Replace the file if it exists." };
        var command = new Command("template", "Write a blank input workbook: a lots sheet, a fermentation-log sheet and a sheet explaining each column.");
        command.Options.Add(output);
        command.Options.Add(force);
        command.SetAction(parseResult =>
        {
            string path = parseResult.GetValue(output)!;
            if (!path.EndsWith(".xlsx", StringComparison.OrdinalIgnoreCase))
            {
                context.Error.WriteLine($"template: '{path}' does not end in .xlsx; give a workbook name such as lots-template.xlsx.");
                return ExitCodes.Usage;
            }

            string full = Path.GetFullPath(path, context.WorkingDirectory);
            if (File.Exists(full) && !parseResult.GetValue(force))
            {
                context.Error.WriteLine($"template: '{path}' already exists and was left as it is. Pass --force to replace it.");
                return ExitCodes.InputProblems;
            }

            string? dir = Path.GetDirectoryName(full);
            if (dir is not null && !Directory.Exists(dir))
            {
                context.Error.WriteLine($"template: the folder of '{path}' does not exist.");
                return ExitCodes.Usage;
            }

            TemplateWriter.Write(full);
            context.Out.WriteLine($"Wrote {path}: sheets '{TemplateWriter.LotsSheet}', '{TemplateWriter.LogSheet}' and '{TemplateWriter.ColumnsSheet}'. Fill in one row per lot; 'yieldbench check {path}' shows what would be read.");
            return ExitCodes.Success;
        });
        return command;
    }
}
