using System.Globalization;
using System.Runtime.InteropServices;
using System.Text;

namespace YieldBench.Cli.CommandLine;

/// <summary>
/// What a user sees when an exception stops a command: one short plain paragraph on standard error saying what stopped
/// and where a details file went; the stack trace goes only into that file, never to the terminal.
/// </summary>
internal static class FaultReport
{
    /// <summary>Writes the details file and the message; returns exit code 3.</summary>
    public static int Handle(Exception fault, IEnumerable<string> args, CliContext context)
    {
        string? log = TryWriteDetails(fault, args, context.FaultLogFolder, out string? logProblem);
        string what = UsageChecks.Shown(fault.Message.Split('\n')[0].Trim().TrimEnd('.'));
        string where = log is not null
            ? $" Details (for a bug report): {log}"
            : $" (The details could not be saved: {UsageChecks.Shown(logProblem ?? "unknown reason")}.)";
        string message = fault switch
        {
            IOException or UnauthorizedAccessException =>
                $"yieldbench: the command stopped because a file could not be read or written ({what}). Free space on the disk or fix the file's permissions, then run it again.{where}",
            OutOfMemoryException =>
                $"yieldbench: the command stopped because the computer ran out of memory. Close other programs, or give fewer files at a time.{where}",
            _ =>
                $"yieldbench: an internal error stopped the command ({fault.GetType().Name}: {what}). This is a fault of the tool, not of your files; please report it with the command line you gave.{where}",
        };
        try
        {
            TextWrap.WriteLine(context.Error, message);
            context.Error.Flush();
        }
        catch (Exception e) when (e is IOException or ObjectDisposedException)
        {
            // Standard error is gone (a closed pipe): the exit code still says what happened.
        }

        return ExitCodes.InternalError;
    }

    /// <summary>The path of a new details file in <paramref name="folder"/>, or null with the reason it could not be written.</summary>
    private static string? TryWriteDetails(Exception fault, IEnumerable<string> args, string folder, out string? problem)
    {
        problem = null;
        try
        {
            var text = new StringBuilder()
                .AppendLine(CultureInfo.InvariantCulture, $"yieldbench {YieldBenchApp.Version} on {RuntimeInformation.FrameworkDescription}, {RuntimeInformation.OSDescription}")
                .AppendLine(CultureInfo.InvariantCulture, $"time (UTC): {DateTime.UtcNow:yyyy-MM-dd HH:mm:ss}")
                .AppendLine(CultureInfo.InvariantCulture, $"command line: yieldbench {string.Join(' ', args.Select(Quoted))}")
                .AppendLine()
                .AppendLine(fault.ToString());
            string name = string.Create(CultureInfo.InvariantCulture, $"yieldbench-fault-{DateTime.UtcNow:yyyyMMdd-HHmmss}-{Environment.ProcessId}-{Guid.NewGuid().ToString("N")[..6]}.txt");
            string path = Path.Combine(folder, name);
            using (var stream = new FileStream(path, FileMode.CreateNew, FileAccess.Write))
            using (var writer = new StreamWriter(stream, new UTF8Encoding(false)))
            {
                writer.Write(text.ToString());
            }

            return path;
        }
        catch (Exception e)
        {
            // The handler itself must not fail: whatever stops the details file is said instead.
            problem = e.Message.TrimEnd('.');
            return null;
        }
    }

    private static string Quoted(string? arg) =>
        arg is null ? "(null)" : arg.Length > 0 && arg.All(c => char.IsLetterOrDigit(c) || "-_./=:,+".Contains(c)) ? arg : "'" + arg.Replace("'", "'\\''", StringComparison.Ordinal) + "'";
}
