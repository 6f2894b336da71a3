using StratLink.Checks;
using StratLink.Cli.Dashboard.Results;
using StratLink.ProjectIO;
using StratLink.Tables;
using StratLink.Workflows;

namespace StratLink.Cli.Dashboard;

/// <summary>The dashboard's workflows backed by the StratLink library, as far as this build provides them.</summary>
public sealed class LibraryWorkflows : IDashboardWorkflows
{
    public const string TablesNotRead = "dashboard.tables-not-read";

    public LoadedProject Load(string projectPath, CancellationToken cancellation)
    {
        var document = ProjectReader.Load(projectPath);
        var problems = new FindingList();
        problems.AddRange(document.Problems);
        problems.Add(Finding.Note(TablesNotRead, "the core tables are not read by this build, so the logs stay empty"));
        var project = document.Project ?? new Model.Project();
        return new LoadedProject(document, project, new Dictionary<string, CoreTable>(), problems);
    }

    public string? RunUnavailable => "the alignment is not part of this build yet";

    public RunResults Run(LoadedProject project, IProgress<WorkProgress> progress, CancellationToken cancellation) =>
        throw new InvalidOperationException(RunUnavailable);

    public string? ExportUnavailable => "export needs the build outputs writer, which is not part of this build yet";

    public string Export(LoadedProject project, RunResults results, string folder, CancellationToken cancellation) =>
        throw new InvalidOperationException(ExportUnavailable);
}
