namespace YieldBench.Scenario.Tests;

/// <summary>Finds the repository root (the folder holding YieldBench.sln) from the test's output folder.</summary>
internal static class RepoPaths
{
    public static string Root { get; } = FindRoot();

    public static string DemoData => Path.Combine(Root, "demo-data");

    public static string DemoHistory => Path.Combine(DemoData, DemoDataWriter.HistoryFolderName);

    private static string FindRoot()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "YieldBench.sln")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName ?? throw new InvalidOperationException("The tests must run inside the repository (YieldBench.sln not found above " + AppContext.BaseDirectory + ").");
    }
}
