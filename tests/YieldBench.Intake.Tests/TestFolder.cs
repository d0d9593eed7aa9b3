using System.Text;
using YieldBench.Core.Lots;
using YieldBench.Intake;

namespace YieldBench.Intake.Tests;

/// <summary>A scratch folder for one test's input files, removed afterwards.</summary>
internal sealed class TestFolder : IDisposable
{
    public TestFolder()
    {
        Root = Path.Combine(Path.GetTempPath(), "yieldbench-intake-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Root);
    }

    public string Root { get; }

    public string PathOf(string name) => Path.Combine(Root, name);

    /// <summary>Writes a text file (UTF-8 without BOM unless given another encoding); returns its name.</summary>
    public string Text(string name, string content, Encoding? encoding = null)
    {
        File.WriteAllText(PathOf(name), content, encoding ?? new UTF8Encoding(false));
        return name;
    }

    public string Bytes(string name, byte[] content)
    {
        File.WriteAllBytes(PathOf(name), content);
        return name;
    }

    /// <summary>Reads the given files of this folder (names relative to it, as a user in the folder would give them).</summary>
    public SeasonSet Read(IntakeOptions? options, params string[] names) =>
        IntakeReader.Read(names, (options ?? new IntakeOptions()) with { WorkingDirectory = Root });

    public SeasonSet Read(params string[] names) => Read(null, names);

    public void Dispose()
    {
        try
        {
            Directory.Delete(Root, recursive: true);
        }
        catch (IOException)
        {
            // A scratch folder left behind in the temp directory harms nothing.
        }
    }
}
