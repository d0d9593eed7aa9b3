using System.Reflection;

namespace YieldBench.Core.Tests.Architecture;

/// <summary>Core holds domain math only: it may not depend on file formats, charts or consoles.</summary>
public class CoreDependencyTests
{
    private static readonly string[] Forbidden =
    [
        "ClosedXML", "DocumentFormat.OpenXml", "ExcelDataReader", "CsvHelper", "ScottPlot", "SkiaSharp",
        "System.CommandLine", "Microsoft.ML", "Spectre.Console", "System.Drawing",
    ];

    [Fact]
    public void Core_references_no_file_format_chart_console_or_learning_package()
    {
        // Given the Core assembly
        var core = typeof(YieldBench.Core.Units.SugarReading).Assembly;

        // When its references are listed
        var referenced = core.GetReferencedAssemblies().Select(a => a.Name ?? string.Empty).ToArray();

        // Then none is a forbidden package, and besides the runtime's own assemblies the only one is MathNet.Numerics
        var offending = referenced.Where(r => Forbidden.Any(f => r.StartsWith(f, StringComparison.OrdinalIgnoreCase))).ToArray();
        Assert.Empty(offending);
        var packages = referenced.Where(r => !IsRuntime(r)).ToArray();
        Assert.Equal(["MathNet.Numerics"], packages);
    }

    [Theory]
    [InlineData("System.Runtime", true)]
    [InlineData("System.Collections", true)]
    [InlineData("netstandard", true)]
    [InlineData("ClosedXML", false)]
    [InlineData("ScottPlot", false)]
    public void The_runtime_filter_passes_only_the_runtime_s_own_assemblies(string name, bool runtime) =>
        Assert.Equal(runtime, IsRuntime(name));

    private static bool IsRuntime(string name) =>
        name is "System" or "mscorlib" or "netstandard" || name.StartsWith("System.", StringComparison.Ordinal) || name.StartsWith("Microsoft.Win32.", StringComparison.Ordinal);

    [Fact]
    public void Core_project_file_lists_only_MathNet_as_a_package()
    {
        var dir = AppContext.BaseDirectory;
        while (dir is not null && !File.Exists(Path.Combine(dir, "YieldBench.sln")))
        {
            dir = Path.GetDirectoryName(dir);
        }

        Assert.NotNull(dir);
        var csproj = File.ReadAllText(Path.Combine(dir!, "src", "YieldBench.Core", "YieldBench.Core.csproj"));
        var packages = System.Text.RegularExpressions.Regex.Matches(csproj, "PackageReference Include=\"([^\"]+)\"")
            .Select(m => m.Groups[1].Value).ToArray();
        Assert.Equal(["MathNet.Numerics"], packages);
        Assert.DoesNotContain("ProjectReference", csproj, StringComparison.Ordinal);
    }
}
