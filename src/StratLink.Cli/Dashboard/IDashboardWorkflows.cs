using StratLink.Cli.Dashboard.Results;
using StratLink.Workflows;

namespace StratLink.Cli.Dashboard;

/// <summary>
/// The library workflows as the dashboard uses them: load a project with its tables, run the
/// build on a snapshot in the background, analyse a composite signal, export the outputs. Tests substitute their own.
/// </summary>
public interface IDashboardWorkflows
{
    LoadedProject Load(string projectPath, CancellationToken cancellation);

    /// <summary>Null when a run is possible; otherwise the reason shown to the user.</summary>
    string? RunUnavailable { get; }

    /// <summary>Runs alignment, ages, composite and checks on <paramref name="project"/>; called off the UI thread.</summary>
    RunResults Run(LoadedProject project, IProgress<WorkProgress> progress, CancellationToken cancellation);

    /// <summary>
    /// Looks for cycles and regime shifts in <paramref name="signal"/>'s composite of <paramref name="results"/>;
    /// called off the UI thread. Throws <see cref="InvalidOperationException"/> with the reason when it cannot.
    /// </summary>
    IReadOnlyList<AnalysisNote> Analyse(RunResults results, string signal, IProgress<WorkProgress> progress, CancellationToken cancellation);

    /// <summary>Null when export is possible; otherwise the reason shown to the user.</summary>
    string? ExportUnavailable { get; }

    /// <summary>Writes the tables and figures of <paramref name="results"/> to <paramref name="folder"/>; returns a one-line summary.</summary>
    string Export(LoadedProject project, RunResults results, string folder, CancellationToken cancellation);
}
