using System.CommandLine;
using YieldBench.Cli.CommandLine;
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
                TextWrap.WriteLine(context.Error, $"template: '{UsageChecks.Shown(path)}' does not end in .xlsx; give a workbook name such as lots-template.xlsx.");
                return ExitCodes.Usage;
            }

            string full = Path.GetFullPath(path, context.WorkingDirectory);
            if (Directory.Exists(full))
            {
                TextWrap.WriteLine(context.Error, $"template: '{UsageChecks.Shown(path)}' is a folder; give a workbook name such as lots-template.xlsx.");
                return ExitCodes.Usage;
            }

            if (File.Exists(full) && !parseResult.GetValue(force))
            {
                TextWrap.WriteLine(context.Error, $"template: '{UsageChecks.Shown(path)}' already exists and was left as it is. Pass --force to replace it, or give another name.");
                return ExitCodes.Usage;
            }

            string? dir = Path.GetDirectoryName(full);
            if (dir is not null && !Directory.Exists(dir))
            {
                TextWrap.WriteLine(context.Error, $"template: the folder of '{UsageChecks.Shown(path)}' does not exist; create it first, or give a file in a folder that exists.");
                return ExitCodes.Usage;
            }

            try
            {
                TemplateWriter.Write(full);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                TextWrap.WriteLine(context.Error, $"template: '{UsageChecks.Shown(path)}' could not be written ({e.Message.TrimEnd('.')}); give another --out.");
                return ExitCodes.Usage;
            }

            TextWrap.WriteLine(context.Out, $"Wrote {UsageChecks.Shown(path)}: sheets '{TemplateWriter.LotsSheet}', '{TemplateWriter.LogSheet}' and '{TemplateWriter.ColumnsSheet}'. Fill in one row per lot; 'yieldbench check {path}' shows what would be read.");
            return ExitCodes.Success;
        });
        return command;
    }
}
