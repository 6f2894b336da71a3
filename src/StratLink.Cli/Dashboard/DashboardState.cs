using StratLink.Cli.Dashboard.Results;
using StratLink.Model;
using StratLink.Workflows;

namespace StratLink.Cli.Dashboard;

/// <summary>Whether the last run's results describe the project as it is now.</summary>
public enum ResultsState
{
    NotRun,
    Current,
    Stale,
}

/// <summary>
/// The dashboard's model: the loaded project (tables read once), the project being edited, undo and
/// redo stacks of project snapshots (projects are immutable, so a snapshot is a reference), whether
/// the file holds the current project, and the results of the last complete run.
/// </summary>
public sealed class DashboardState
{
    private readonly Stack<Edit> _undo = new();
    private readonly Stack<Edit> _redo = new();
    private Project _saved;

    public DashboardState(LoadedProject loaded)
    {
        Loaded = loaded;
        Project = loaded.Project;
        _saved = loaded.Project;
    }

    public LoadedProject Loaded { get; }
    public Project Project { get; private set; }
    public string FilePath => Loaded.FilePath;
    public RunResults? Results { get; private set; }

    /// <summary>True while the file on disk holds the project being edited.</summary>
    public bool IsSaved => ReferenceEquals(Project, _saved);

    public ResultsState ResultsState =>
        Results is null ? ResultsState.NotRun : ReferenceEquals(Results.Project, Project) ? ResultsState.Current : ResultsState.Stale;

    public bool CanUndo => _undo.Count > 0;
    public bool CanRedo => _redo.Count > 0;
    public string? UndoDescription => _undo.Count > 0 ? _undo.Peek().Description : null;
    public string? RedoDescription => _redo.Count > 0 ? _redo.Peek().Description : null;

    /// <summary>Raised after every change of the project, the saved state or the results.</summary>
    public event Action? Changed;

    /// <summary>Raised after an edit, undo or redo changed the project (not after save or a run).</summary>
    public event Action? ProjectEdited;

    /// <summary>Makes <paramref name="edited"/> the current project; the previous one goes on the undo stack.</summary>
    public void Apply(Project edited, string description)
    {
        if (ReferenceEquals(edited, Project)) return;
        _undo.Push(new Edit(Project, description));
        _redo.Clear();
        Project = edited;
        RaiseEdited();
    }

    /// <summary>Steps back one edit; returns its description, or null when there is nothing to undo.</summary>
    public string? Undo()
    {
        if (_undo.Count == 0) return null;
        var edit = _undo.Pop();
        _redo.Push(new Edit(Project, edit.Description));
        Project = edit.Snapshot;
        RaiseEdited();
        return edit.Description;
    }

    public string? Redo()
    {
        if (_redo.Count == 0) return null;
        var edit = _redo.Pop();
        _undo.Push(new Edit(Project, edit.Description));
        Project = edit.Snapshot;
        RaiseEdited();
        return edit.Description;
    }

    /// <summary>Records that <paramref name="project"/> is what the file now holds.</summary>
    public void MarkSaved(Project project)
    {
        _saved = project;
        Changed?.Invoke();
    }

    /// <summary>Replaces the results; only ever called with a complete run.</summary>
    public void SetResults(RunResults results)
    {
        Results = results;
        Changed?.Invoke();
    }

    /// <summary>The loaded tables with the project as it is now: what a run works on.</summary>
    public LoadedProject Snapshot() => Loaded.WithProject(Project);

    private void RaiseEdited()
    {
        ProjectEdited?.Invoke();
        Changed?.Invoke();
    }

    private sealed record Edit(Project Snapshot, string Description);
}
