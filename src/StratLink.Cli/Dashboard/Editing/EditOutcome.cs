using StratLink.Model;

namespace StratLink.Cli.Dashboard.Editing;

/// <summary>The result of an edit: the new project with a description for undo, or why it was refused.</summary>
public sealed record EditOutcome(Project? Project, string Description, string? SelectId)
{
    public bool Succeeded => Project is not null;

    public static EditOutcome Done(Project project, string description, string? selectId) => new(project, description, selectId);
    public static EditOutcome Refused(string reason) => new(null, reason, null);
}
