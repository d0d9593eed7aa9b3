using System.Text;

namespace YieldBench.Cli.CommandLine;

/// <summary>
/// A writer whose whole lines are wrapped to <see cref="TextWrap.Width"/> columns (<see cref="TextWrap.Lines"/>), for a
/// command that writes its sentences line by line; text written without a line end passes through as it is.
/// </summary>
internal sealed class WrappingWriter(TextWriter inner) : TextWriter
{
    public override Encoding Encoding => inner.Encoding;

    public override void Write(char value) => inner.Write(value);

    public override void Write(string? value) => inner.Write(value);

    public override void WriteLine() => inner.WriteLine();

    public override void WriteLine(string? value) => TextWrap.WriteLine(inner, value ?? string.Empty);

    public override void Flush() => inner.Flush();
}
