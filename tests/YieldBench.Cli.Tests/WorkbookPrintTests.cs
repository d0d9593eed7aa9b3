using System.Diagnostics;
using System.Text.RegularExpressions;

namespace YieldBench.Cli.Tests;

/// <summary>
/// Skips a test that needs LibreOffice, with the reason, where it is not installed (unless
/// <see cref="LibreOffice.RequireVariable"/> is 1, as .ci/run sets it, so a missing LibreOffice fails there).
/// </summary>
public sealed class LibreOfficeFactAttribute : FactAttribute
{
    public LibreOfficeFactAttribute()
    {
        if (LibreOffice.Find() is null && Environment.GetEnvironmentVariable(LibreOffice.RequireVariable) != "1")
        {
            Skip = "No LibreOffice on PATH (soffice): install Debian's libreoffice-calc (apt-get install libreoffice-calc) to check how the workbook prints; .ci/run installs it.";
        }
    }
}

/// <summary>LibreOffice run headless to convert a workbook to PDF.</summary>
public static partial class LibreOffice
{
    /// <summary>Set to 1 to make a missing LibreOffice fail the tests that need it instead of skipping them.</summary>
    public const string RequireVariable = "YIELDBENCH_REQUIRE_LIBREOFFICE";

    /// <summary>The soffice (or libreoffice) program on PATH, or null.</summary>
    public static string? Find() =>
        (Environment.GetEnvironmentVariable("PATH") ?? string.Empty).Split(Path.PathSeparator, StringSplitOptions.RemoveEmptyEntries)
            .SelectMany(d => new[] { Path.Combine(d, "soffice"), Path.Combine(d, "libreoffice") })
            .FirstOrDefault(File.Exists);

    /// <summary>Converts <paramref name="workbook"/> to a PDF in <paramref name="folder"/> (with a profile of its own there) and returns the PDF's path.</summary>
    public static string ToPdf(string workbook, string folder)
    {
        string program = Find() ?? throw new InvalidOperationException("LibreOffice (soffice) is not on PATH.");
        var start = new ProcessStartInfo(program)
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
        };
        foreach (string a in new[] { "--headless", "-env:UserInstallation=" + new Uri(Path.Combine(folder, "profile")).AbsoluteUri, "--convert-to", "pdf", "--outdir", folder, workbook })
        {
            start.ArgumentList.Add(a);
        }

        using var process = Process.Start(start)!;
        var output = process.StandardOutput.ReadToEndAsync();
        var error = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(TimeSpan.FromMinutes(5)))
        {
            process.Kill(entireProcessTree: true);
            throw new TimeoutException("LibreOffice took more than 5 minutes to convert " + workbook);
        }

        string pdf = Path.Combine(folder, Path.GetFileNameWithoutExtension(workbook) + ".pdf");
        if (!File.Exists(pdf))
        {
            throw new InvalidOperationException($"LibreOffice wrote no PDF (exit {process.ExitCode}): {output.Result} {error.Result}");
        }

        return pdf;
    }

    /// <summary>The pages of a PDF: its page objects (/Type /Page, not /Pages), as LibreOffice writes them uncompressed.</summary>
    public static int Pages(byte[] pdf) => PageObject().Count(System.Text.Encoding.Latin1.GetString(pdf));

    [GeneratedRegex(@"/Type\s*/Page(?![s\w])")]
    private static partial Regex PageObject();
}

/// <summary>How the demo workbook prints (these share the demo review of the other review command tests).</summary>
public sealed partial class ReviewCommandTests
{
    [Fact]
    public void The_page_count_reads_page_objects_and_not_the_page_tree()
    {
        // Given a minimal PDF's objects: a page tree and two pages
        byte[] pdf = System.Text.Encoding.Latin1.GetBytes("1 0 obj << /Type /Pages /Kids [2 0 R 3 0 R] /Count 2 >> endobj 2 0 obj << /Type /Page >> endobj 3 0 obj <</Type/Page/Parent 1 0 R>> endobj");

        // Then two pages are counted
        Assert.Equal(2, LibreOffice.Pages(pdf));
    }

    [LibreOfficeFact]
    public void The_demo_workbook_prints_on_at_most_60_pages_in_LibreOffice()
    {
        // Given the demo review's workbook
        string folder = Directory.CreateTempSubdirectory("yb-print-").FullName;
        try
        {
            // When LibreOffice converts it to PDF (every sheet, with the workbook's own print setup)
            string pdf = LibreOffice.ToPdf(Path.Combine(demo.First, "report.xlsx"), folder);
            int pages = LibreOffice.Pages(File.ReadAllBytes(pdf));

            // Then it prints on at most 60 pages (each sheet at least one: 17 sheets with the demo's logs)
            Assert.InRange(pages, 17, 60);
        }
        finally
        {
            Directory.Delete(folder, recursive: true);
        }
    }
}
