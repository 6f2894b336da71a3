namespace StratLink.Cli;

/// <summary>Where a command writes, so tests can run verbs in-process and read what they printed.</summary>
public sealed record CliContext(TextWriter Out, TextWriter Error, bool ErrorIsTerminal, CancellationToken Cancellation)
{
    public void Fail(string message) => Error.WriteLine("stratlink: " + message);
}
