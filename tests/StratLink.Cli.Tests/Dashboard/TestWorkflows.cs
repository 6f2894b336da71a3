using StratLink.Cli.Dashboard;
using StratLink.Cli.Dashboard.Results;
using StratLink.Workflows;

namespace StratLink.Tests.Dashboard;

/// <summary>
/// Workflows for UI tests: <see cref="Run"/> either returns the given results at once or, when
/// <see cref="BlockUntilCancelled"/> is set, reports progress and waits for the cancellation.
/// </summary>
internal sealed class TestWorkflows(LoadedProject loaded) : IDashboardWorkflows
{
    public Func<LoadedProject, RunResults>? Results { get; set; }
    public bool BlockUntilCancelled { get; set; }
    public ManualResetEventSlim Started { get; } = new();
    public bool SawCancellation { get; private set; }

    public LoadedProject Load(string projectPath, CancellationToken cancellation) => loaded;

    public string? RunUnavailable => null;

    public RunResults Run(LoadedProject project, IProgress<WorkProgress> progress, CancellationToken cancellation)
    {
        progress.Report(new WorkProgress("alignment", 0.25));
        Started.Set();
        if (BlockUntilCancelled)
        {
            try
            {
                Task.Delay(Timeout.Infinite, cancellation).Wait(cancellation);
            }
            catch (OperationCanceledException)
            {
                SawCancellation = true;
                throw;
            }
        }
        return Results?.Invoke(project) ?? new RunResults { Project = project.Project, FinishedAt = DateTimeOffset.UnixEpoch };
    }

    /// <summary>Notes <see cref="Analyse"/> returns for any signal.</summary>
    public IReadOnlyList<AnalysisNote> Notes { get; set; } = [];

    public IReadOnlyList<AnalysisNote> Analyse(RunResults results, string signal, IProgress<WorkProgress> progress, CancellationToken cancellation)
    {
        progress.Report(new WorkProgress("spectrum", 0.5));
        return Notes.Select(n => n with { Signal = signal }).ToList();
    }

    public string? ExportUnavailable => "export is not available in tests";

    public string Export(LoadedProject project, RunResults results, string folder, CancellationToken cancellation) =>
        throw new InvalidOperationException(ExportUnavailable);
}
