using StratLink.Checks;
using StratLink.Workflows;

namespace StratLink.Cli.Commands;

/// <summary>Loads a project for a verb that runs the pipeline; input errors are printed and stop the verb.</summary>
internal static class LoadForRun
{
    /// <returns>The project, or null after printing its errors (the caller exits with <see cref="ExitCodes.Usage"/>).</returns>
    public static LoadedProject? Load(FileInfo file, CliContext ctx, string nothingDone)
    {
        var loaded = ProjectLoader.Load(file.FullName, ctx.Cancellation);
        if (!loaded.Problems.HasErrors) return loaded;
        foreach (var p in loaded.Problems.Where(p => p.Severity == Severity.Error)) ctx.Error.WriteLine(p.ToString());
        ctx.Fail($"the project has errors (above); {nothingDone}.");
        return null;
    }
}
