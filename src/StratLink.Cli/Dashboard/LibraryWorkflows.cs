using StratLink.Analysis;
using StratLink.Cli.Dashboard.Results;
using StratLink.Model;
using StratLink.Workflows;

namespace StratLink.Cli.Dashboard;

/// <summary>The dashboard's workflows backed by the StratLink library: the same build, analysis and outputs as the verbs.</summary>
public sealed class LibraryWorkflows : IDashboardWorkflows
{
    /// <summary>
    /// Periods checked unless told otherwise: the ~11-yr Schwabe and ~88-yr Gleissberg solar cycles, which
    /// are what solar-modulated records are usually tested for (common practice).
    /// </summary>
    public static readonly IReadOnlyList<double> DefaultPeriodsYears = [11, 88];

    private readonly Func<Project, AnalysisOptions> _analysisOptions;

    /// <param name="analysisOptions">Settings of the record analysis for a project; null = library defaults,
    /// the project's age-model seed and <see cref="DefaultPeriodsYears"/>.</param>
    public LibraryWorkflows(Func<Project, AnalysisOptions>? analysisOptions = null) =>
        _analysisOptions = analysisOptions ?? (p => AnalysisOptions.ForCompositeRecord(p.AgeModel.Seed, DefaultPeriodsYears));

    public LoadedProject Load(string projectPath, CancellationToken cancellation) => ProjectLoader.Load(projectPath, cancellation);

    public string? RunUnavailable => null;

    public RunResults Run(LoadedProject project, IProgress<WorkProgress> progress, CancellationToken cancellation)
    {
        var build = BuildWorkflow.Run(project, progress, cancellation);
        return RunResultsFromBuild.Read(build, DateTimeOffset.Now);
    }

    public IReadOnlyList<AnalysisNote> Analyse(RunResults results, string signal, IProgress<WorkProgress> progress, CancellationToken cancellation)
    {
        var build = results.Build ?? throw new InvalidOperationException("these results hold no build to analyse; r runs one");
        var options = _analysisOptions(build.Project.Project);
        var analysis = AnalysisWorkflow.Run(build, signal, useSplice: false, options, progress, cancellation);
        return AnalysisNotes.Read(build, analysis, useSplice: false);
    }

    public string? ExportUnavailable => null;

    public string Export(LoadedProject project, RunResults results, string folder, CancellationToken cancellation)
    {
        var build = results.Build ?? throw new InvalidOperationException("these results hold no build outputs; r runs one");
        cancellation.ThrowIfCancellationRequested();
        var files = BuildWorkflow.WriteOutputs(build, folder);
        return $"Exported {files.Count} files to {folder} (composite, splice, mappings, ages, checks, figures, run.json).";
    }
}
