using StratLink.Cli.Dashboard.Results;
using StratLink.Workflows;

namespace StratLink.Cli.Dashboard;

/// <summary>The dashboard's workflows backed by the StratLink library, as far as this build provides them.</summary>
public sealed class LibraryWorkflows : IDashboardWorkflows
{
    public LoadedProject Load(string projectPath, CancellationToken cancellation) => ProjectLoader.Load(projectPath, cancellation);

    public string? RunUnavailable => "the alignment is not part of this build yet";

    public RunResults Run(LoadedProject project, IProgress<WorkProgress> progress, CancellationToken cancellation) =>
        throw new InvalidOperationException(RunUnavailable);

    public string? ExportUnavailable => "export needs the build outputs writer, which is not part of this build yet";

    public string Export(LoadedProject project, RunResults results, string folder, CancellationToken cancellation) =>
        throw new InvalidOperationException(ExportUnavailable);
}
