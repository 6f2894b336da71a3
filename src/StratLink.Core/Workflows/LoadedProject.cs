using StratLink.Alignment;
using StratLink.Checks;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Tables;

namespace StratLink.Workflows;

/// <summary>A project with its core tables read: what every workflow starts from.</summary>
public sealed class LoadedProject
{
    public LoadedProject(ProjectDocument document, Project project, IReadOnlyDictionary<string, CoreTable> tables, FindingList problems)
    {
        Document = document;
        Project = project;
        Tables = tables;
        Problems = problems;
    }

    public ProjectDocument Document { get; }
    public Project Project { get; }

    /// <summary>Core id to its table, for every core whose table could be read.</summary>
    public IReadOnlyDictionary<string, CoreTable> Tables { get; }

    /// <summary>Problems of the file and the tables; <see cref="FindingList.HasErrors"/> stops a build.</summary>
    public FindingList Problems { get; }

    /// <summary>The dated target of the project's <c>target</c> section, when it could be read.</summary>
    public DatedTargetRecord? Target { get; init; }

    public string FilePath => Document.FilePath;

    /// <summary>The same tables with an edited project (dashboard edits that do not touch tables).</summary>
    public LoadedProject WithProject(Project edited) => new(Document with { Project = edited }, edited, Tables, Problems) { Target = Target };
}
