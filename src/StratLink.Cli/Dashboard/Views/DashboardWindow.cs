using StratLink.Quantities;
using System.Globalization;
using StratLink.Cli.Dashboard.Dialogs;
using StratLink.Cli.Dashboard.Drawing;
using StratLink.Cli.Dashboard.Editing;
using StratLink.Cli.Dashboard.Keys;
using StratLink.Cli.Dashboard.Results;
using StratLink.Cli.Dashboard.Session;
using StratLink.Model;
using StratLink.ProjectIO;
using StratLink.Workflows;
using Terminal.Gui.App;
using Terminal.Gui.Input;
using Terminal.Gui.ViewBase;
using Terminal.Gui.Views;

namespace StratLink.Cli.Dashboard.Views;

/// <summary>
/// The dashboard frame: header (site, file, saved and results state), the four screens, the
/// message and progress row, and the key line. Every key goes through <see cref="KeyTable"/>;
/// runs go to the background and their results replace the old ones only when complete.
/// </summary>
public sealed class DashboardWindow : Runnable
{
    private readonly IApplication _app;
    private readonly DashboardState _state;
    private readonly IDashboardWorkflows _workflows;
    private readonly IPrompts _prompts;
    private readonly RecoveryFile? _recovery;
    private readonly RecentProjects? _recent;
    private readonly HeaderBar _header;
    private readonly MessageBar _message;
    private readonly KeyLine _keys;
    private readonly Dictionary<Screen, View> _screens;
    private readonly Dictionary<DashCommand, Action> _handlers;
    private CancellationTokenSource? _run;
    private int _progressPending;
    private WorkProgress _latestProgress;

    public DashboardWindow(IApplication app, DashboardState state, IDashboardWorkflows workflows, IPrompts prompts,
        GlyphSet glyphs, RecoveryFile? recovery, RecentProjects? recent, ColourMode? colours = null)
    {
        _app = app;
        _state = state;
        _workflows = workflows;
        _prompts = prompts;
        _recovery = recovery;
        _recent = recent;
        Glyphs = glyphs;
        Width = Dim.Fill();
        Height = Dim.Fill();
        CanFocus = true;

        _header = new HeaderBar(state, glyphs) { X = 0, Y = 0, Width = Dim.Fill() };
        Logs = new CorrelationView(state, glyphs) { X = 0, Y = 2, Width = Dim.Fill(), Height = Dim.Fill(2) };
        Ages = new AgesView(state, glyphs) { X = 0, Y = 2, Width = Dim.Fill(), Height = Dim.Fill(2), Visible = false };
        Composite = new CompositeView(state, glyphs) { X = 0, Y = 2, Width = Dim.Fill(), Height = Dim.Fill(2), Visible = false };
        Findings = new FindingsView(state, glyphs) { X = 0, Y = 2, Width = Dim.Fill(), Height = Dim.Fill(2), Visible = false };
        _message = new MessageBar(glyphs) { X = 0, Y = Pos.AnchorEnd(2), Width = Dim.Fill() };
        _keys = new KeyLine(glyphs) { X = 0, Y = Pos.AnchorEnd(1), Width = Dim.Fill() };
        Add(_header, Logs, Ages, Composite, Findings, _message, _keys);
        ColourMode = colours ?? ColourModes.FromEnvironment(Environment.GetEnvironmentVariable);
        foreach (var view in SubViews.OfType<DashView>()) view.ColourMode = ColourMode;
        _header.ShownCores = () => (Logs.Slots.Count, _state.Project.Cores.Count);
        _screens = new() { [Screen.Logs] = Logs, [Screen.Ages] = Ages, [Screen.Composite] = Composite, [Screen.Findings] = Findings };

        _handlers = Handlers();
        _state.Changed += OnStateChanged;
        _state.ProjectEdited += OnProjectEdited;
        Show(_state.Loaded.Problems.HasErrors
            ? "The project has problems (4 lists them). F1 shows every key."
            : "F1 shows every key; ] selects a tie, t ties the cursors of two logs.");
    }

    public GlyphSet Glyphs { get; }

    /// <summary>Sixteen colours, or none when NO_COLOR is set (or the caller says so).</summary>
    public ColourMode ColourMode { get; }
    public CorrelationView Logs { get; }
    public AgesView Ages { get; }
    public CompositeView Composite { get; }
    public FindingsView Findings { get; }
    public Screen Current { get; private set; }
    public string Message => _message.Message;
    public MessageLevel MessageLevel => _message.Level;
    public bool RunInProgress => _run is not null;

    /// <summary>The background run, for tests and for waiting on exit; null when none has started.</summary>
    public Task? RunTask { get; private set; }

    protected override bool OnKeyDown(Key key)
    {
        var entry = KeyTable.Find(key, Current);
        if (entry is null) return false;
        _handlers[entry.Command]();
        return true;
    }

    /// <summary>Runs one command as its key would.</summary>
    public void Execute(DashCommand command) => _handlers[command]();

    public void ShowScreen(Screen screen)
    {
        Current = screen;
        foreach (var (s, v) in _screens) v.Visible = s == screen;
        _header.Current = screen;
        _keys.Current = screen;
        SetNeedsDraw();
    }

    private Dictionary<DashCommand, Action> Handlers() => new()
    {
        [DashCommand.Help] = () => _prompts.ShowText("StratLink keys", HelpText.Lines(Glyphs)),
        [DashCommand.ShowLogs] = () => ShowScreen(Screen.Logs),
        [DashCommand.ShowAges] = () => ShowScreen(Screen.Ages),
        [DashCommand.ShowComposite] = () => ShowScreen(Screen.Composite),
        [DashCommand.ShowFindings] = () => ShowScreen(Screen.Findings),
        [DashCommand.NextScreen] = () => ShowScreen((Screen)(((int)Current + 1) % Screens.All.Count)),
        [DashCommand.Back] = Back,
        [DashCommand.Run] = StartRun,
        [DashCommand.StopRun] = StopRun,
        [DashCommand.Undo] = () => Show(_state.Undo() is { } d ? $"Undone: {d}." : "Nothing to undo."),
        [DashCommand.Redo] = () => Show(_state.Redo() is { } d ? $"Redone: {d}." : "Nothing to redo."),
        [DashCommand.Save] = () => Save(),
        [DashCommand.Export] = Export,
        [DashCommand.Quit] = Quit,
        [DashCommand.CursorUp] = () => Navigable()?.MoveCursorRows(-1),
        [DashCommand.CursorDown] = () => Navigable()?.MoveCursorRows(1),
        [DashCommand.FineUp] = () => Navigable()?.MoveCursorRows(-0.25),
        [DashCommand.FineDown] = () => Navigable()?.MoveCursorRows(0.25),
        [DashCommand.PageUp] = () => Navigable()?.PageRows(-1),
        [DashCommand.PageDown] = () => Navigable()?.PageRows(1),
        [DashCommand.Top] = () => Navigable()?.ToEnd(bottom: false),
        [DashCommand.Bottom] = () => Navigable()?.ToEnd(bottom: true),
        [DashCommand.ZoomIn] = () => Zoom(true),
        [DashCommand.ZoomOut] = () => Zoom(false),
        [DashCommand.GoTo] = GoTo,
        [DashCommand.FitAll] = FitAll,
        [DashCommand.PreviousLog] = () => Logs.ShiftActive(-1),
        [DashCommand.NextLog] = () => Logs.ShiftActive(1),
        [DashCommand.NextSignal] = NextSignal,
        [DashCommand.NextCore] = () => Show(Logs.NextCore() is { } c ? $"Showing core {c}." : "Every core is shown already."),
        [DashCommand.MoreLogs] = () => Show(Logs.MoreLogs() ? $"{Logs.Slots.Count} logs." : $"No more logs: every core is shown, or {Logs.FittingLogs} fill the width (< and > show the others)."),
        [DashCommand.FewerLogs] = () => Show(Logs.FewerLogs() ? $"{Logs.Slots.Count} logs." : "Two logs stay."),
        [DashCommand.PreviousCores] = () => Show(Logs.PageCores(-1) ? CoresShown() : "These are the first cores of the site."),
        [DashCommand.NextCores] = () => Show(Logs.PageCores(1) ? CoresShown() : "These are the last cores of the site."),
        [DashCommand.TogglePartner] = () => Show(Logs.TogglePartner() is { } core
            ? $"New ties go from the active log to {core}; Space on it again goes back to the neighbouring log."
            : "New ties go to the neighbouring log."),
        [DashCommand.LineUp] = LineUp,
        [DashCommand.AddTie] = AddTie,
        [DashCommand.NextTie] = () => SelectTie(1),
        [DashCommand.PreviousTie] = () => SelectTie(-1),
        [DashCommand.MoveTie] = () => WithTie(id => Logs.ActiveSlot is { } s ? TieEdits.MoveTie(_state.Project, id, s.CoreId, s.Cursor) : null),
        [DashCommand.DeleteTie] = () => WithTie(id => TieEdits.DeleteTie(_state.Project, id)),
        [DashCommand.RenameTie] = () => WithTie(id => _prompts.AskText($"Rename tie {id}", "New name (letters, digits, . _ -):", id) is { } name
            ? TieEdits.RenameTie(_state.Project, id, name) : null),
        [DashCommand.TieKind] = () => WithTie(ChooseKind),
        [DashCommand.ListUp] = () => Findings.Move(-1),
        [DashCommand.ListDown] = () => Findings.Move(1),
        [DashCommand.ListPageUp] = () => Findings.Move(-Findings.PageSize),
        [DashCommand.ListPageDown] = () => Findings.Move(Findings.PageSize),
        [DashCommand.NextControl] = () => Ages.Move(1),
        [DashCommand.PreviousControl] = () => Ages.Move(-1),
        [DashCommand.ToggleExclude] = ToggleExclude,
        [DashCommand.ToggleStacked] = () => Show(Composite.ToggleStacked() ? "Every signal side by side." : "One signal (v shows the next)."),
        [DashCommand.FilterSeverity] = () => Show($"Findings shown: {Findings.CycleSeverity()}."),
        [DashCommand.FilterCore] = () => Show($"Findings shown: {Findings.CycleCore()}."),
        [DashCommand.ToggleAxis] = () => Show(Composite.ToggleAxis()
            ? (Composite.AgeAxis ? "Composite against age." : "Composite against composite depth.")
            : "No age model in these results: the composite stays on composite depth.", MessageLevel.Info),
        [DashCommand.GoToFinding] = GoToFinding,
        [DashCommand.Analyse] = StartAnalysis,
    };

    // ---- editing ----------------------------------------------------------------------------

    private void Apply(EditOutcome? outcome)
    {
        if (outcome is null) return;
        if (!outcome.Succeeded)
        {
            Show(Capitalise(outcome.Description) + ".", MessageLevel.Warning);
            return;
        }
        _state.Apply(outcome.Project!, outcome.Description);
        Logs.SelectedTie = outcome.SelectId is { } id && _state.Project.FindMarker(id) is not null ? id : null;
        Show($"{Capitalise(outcome.Description)}. u undoes it.");
    }

    private void WithTie(Func<string, EditOutcome?> edit)
    {
        if (Logs.SelectedTie is not { } id || _state.Project.FindMarker(id) is null)
        {
            Show("Select a tie first: ] and [ step through the ties of the active log.", MessageLevel.Warning);
            return;
        }
        Apply(edit(id));
    }

    private void AddTie()
    {
        if (Logs.ActiveSlot is not { } a || Logs.PartnerSlot is not { } b)
        {
            Show("Show two logs to tie them.", MessageLevel.Warning);
            return;
        }
        // A selected tie lacking one of the two cores is extended to it instead of making a new one.
        if (Logs.SelectedTie is { } id && _state.Project.FindMarker(id) is { } m)
        {
            bool hasA = m.DepthIn(a.CoreId) is not null, hasB = m.DepthIn(b.CoreId) is not null;
            if (hasA != hasB)
            {
                var missing = hasA ? b : a;
                Apply(TieEdits.MoveTie(_state.Project, id, missing.CoreId, missing.Cursor));
                return;
            }
        }
        Apply(TieEdits.AddTie(_state.Project, a.CoreId, a.Cursor, b.CoreId, b.Cursor));
    }

    private EditOutcome? ChooseKind(string id)
    {
        var kinds = Enum.GetValues<MarkerKind>();
        var current = _state.Project.FindMarker(id)!.Kind;
        int? pick = _prompts.Choose($"Kind of tie {id}", "", kinds.Select(k => k.Name()).ToList(), Array.IndexOf(kinds, current));
        return pick is int i ? TieEdits.SetKind(_state.Project, id, kinds[i]) : null;
    }

    private void SelectTie(int direction)
    {
        var m = Logs.SelectTie(direction);
        Show(m is null ? $"No tie {(direction > 0 ? "below" : "above")} the cursor in {Logs.ActiveSlot?.CoreId}." : Describe(m));
    }

    private string Describe(MarkerSpec m)
    {
        string unit = _state.Project.DepthUnit.Symbol();
        string depths = string.Join(", ", m.Depths.Select(d => $"{d.CoreId} {d.Depth.In(_state.Project.DepthUnit).ToString("0.##", CultureInfo.InvariantCulture)}"));
        return $"Tie {m.Id} ({m.Kind.Name()}): {depths} {unit}";
    }

    private void ToggleExclude()
    {
        if (Ages.SelectedControl is not { } control)
        {
            Show("The project has no age controls.", MessageLevel.Warning);
            return;
        }
        Apply(TieEdits.ToggleExclude(_state.Project, control.Id));
    }

    // ---- navigation -------------------------------------------------------------------------

    private void Back()
    {
        if (Current != Screen.Logs)
        {
            ShowScreen(Screen.Logs);
            return;
        }
        if (Logs.SelectedTie is not null)
        {
            Logs.SelectedTie = null;
            Logs.SetNeedsDraw();
            Show("No tie selected.");
            return;
        }
        Show("q quits; F1 shows every key.");
    }

    /// <summary>The plotting screen shown, which the navigation keys act on.</summary>
    private INavigable? Navigable() => Current switch
    {
        Screen.Logs => Logs,
        Screen.Ages => Ages,
        Screen.Composite => Composite,
        _ => null,
    };

    private void Zoom(bool zoomIn)
    {
        if (Navigable() is not { } nav) return;
        bool zoomed = nav.Zoom(zoomIn);
        Show(zoomed ? $"{Capitalise(nav.ScaleText)}." : $"{Capitalise(nav.ScaleText)}: {(zoomIn ? "the closest" : "the widest")} step already.");
    }

    private void GoTo()
    {
        if (Navigable() is not { } nav) return;
        if (_prompts.AskText("Go to", nav.JumpPrompt, "") is not { } text) return;
        if (JumpTarget.Parse(text) is not { } target)
        {
            Show($"Not a depth or an age: '{text}' (a number, with BP after it for an age).", MessageLevel.Warning);
            return;
        }
        if (nav.JumpTo(target) is { } why) Show(why, MessageLevel.Warning);
        else Show($"At {text.Trim()}; f fits the whole record again.");
    }

    private void FitAll()
    {
        if (Navigable() is not { } nav) return;
        nav.FitAll();
        Show($"The whole record: {nav.ScaleText}.");
    }

    private string CoresShown() => $"{Logs.Slots.Count} of {_state.Project.Cores.Count} cores shown: {string.Join(", ", Logs.Slots.Select(s => s.CoreId))}.";

    private void NextSignal()
    {
        string? name = Current == Screen.Composite ? Composite.NextSignal() : Logs.NextSignal();
        Show(name is null ? "No other signal to show." : $"Showing {name}.");
    }

    private void LineUp()
    {
        var alignment = _state.ResultsState == ResultsState.Current ? _state.Results?.Alignment : null;
        bool used = Logs.LineUp(alignment);
        Show(used ? "Cursors at the depths the alignment matches." : "Cursors at the same depth (no current alignment).");
    }

    private void GoToFinding()
    {
        if (Findings.SelectedFinding is not { } f) return;
        string? core = f.Core;
        double? depth = f.Depth;
        string? tie = f.Item is { } item && _state.Project.FindMarker(item) is { } m ? m.Id : null;
        if (core is null && tie is not null)
        {
            var first = _state.Project.FindMarker(tie)!.Depths.FirstOrDefault();
            core = first?.CoreId;
            depth = first?.Depth.In(_state.Project.DepthUnit);
        }
        if (core is null || _state.Project.FindCore(core) is null)
        {
            Show("This finding has no place in the logs" + (f.File is not null ? $" (see {Path.GetFileName(f.File)}{(f.Line is int l ? ":" + l : "")})." : "."), MessageLevel.Warning);
            return;
        }
        ShowScreen(Screen.Logs);
        Logs.GoTo(core, depth);
        if (tie is not null) Logs.SelectedTie = tie;
        Show($"{core}{(depth is double d ? " at " + d.ToString("0.##", CultureInfo.InvariantCulture) + " " + _state.Project.DepthUnit.Symbol() : "")}: {f.Message}");
    }

    // ---- runs -------------------------------------------------------------------------------

    private void StartRun()
    {
        if (Busy()) return;
        if (_workflows.RunUnavailable is { } why)
        {
            Show(Capitalise(why) + ".", MessageLevel.Warning);
            return;
        }
        var snapshot = _state.Snapshot();
        StartBackground((progress, ct) =>
        {
            var results = _workflows.Run(snapshot, progress, ct);
            return () => FinishRun(results);
        });
    }

    /// <summary>Analyses the composite screen's signal of the last results, in the background like a run.</summary>
    private void StartAnalysis()
    {
        if (Busy()) return;
        if (_state.Results is not { } results || Composite.CurrentSignal() is not { } signal)
        {
            Show("Nothing to analyse yet: r runs alignment, ages and composite first.", MessageLevel.Warning);
            return;
        }
        StartBackground((progress, ct) =>
        {
            var notes = _workflows.Analyse(results, signal.Name, progress, ct);
            return () => FinishAnalysis(results, signal.Name, notes);
        });
        Show($"Analysing {signal.Name}...");
    }

    private bool Busy()
    {
        if (_run is null) return false;
        Show("A run is going already; x stops it.", MessageLevel.Warning);
        return true;
    }

    /// <summary>
    /// Runs <paramref name="work"/> off the UI thread with the progress bar showing; the action it returns is
    /// applied on the UI thread only when the work completed and was not stopped meanwhile.
    /// </summary>
    private void StartBackground(Func<IProgress<WorkProgress>, CancellationToken, Action> work)
    {
        var cts = new CancellationTokenSource();
        _run = cts;
        var progress = new UiProgress(this);
        _message.ShowProgress(new WorkProgress("starting", 0));
        RunTask = Task.Run(() =>
        {
            try
            {
                var complete = work(progress, cts.Token);
                Ui(() => FinishBackground(cts, cts.IsCancellationRequested ? null : complete, cts.IsCancellationRequested ? StoppedMessage : null));
            }
            catch (OperationCanceledException)
            {
                Ui(() => FinishBackground(cts, null, StoppedMessage));
            }
            catch (Exception e)
            {
                Ui(() => FinishBackground(cts, null, "The run failed: " + e.Message));
            }
        });
    }

    private const string StoppedMessage = "Run stopped; the previous results stay.";

    private void FinishBackground(CancellationTokenSource cts, Action? complete, string? failure)
    {
        if (!ReferenceEquals(_run, cts)) return;
        _run = null;
        cts.Dispose();
        _message.ShowProgress(null);
        if (complete is null)
        {
            Show(failure ?? StoppedMessage, failure == StoppedMessage ? MessageLevel.Info : MessageLevel.Error);
            return;
        }
        complete();
    }

    private void FinishRun(RunResults results)
    {
        _state.SetResults(results);
        string skipped = results.Skipped.Count > 0 ? " Not run: " + string.Join("; ", results.Skipped) + "." : "";
        int findings = results.Checks?.Count ?? 0;
        Show($"Run finished at {results.FinishedAt.ToLocalTime():HH:mm:ss}: {findings} finding(s).{skipped}",
            results.Skipped.Count > 0 ? MessageLevel.Warning : MessageLevel.Info);
    }

    private void FinishAnalysis(RunResults analysed, string signal, IReadOnlyList<AnalysisNote> notes)
    {
        if (!ReferenceEquals(_state.Results, analysed) || analysed.Composite is not { } composite)
        {
            Show($"A newer run replaced the results while {signal} was analysed; p analyses it again.", MessageLevel.Warning);
            return;
        }
        var kept = composite.Analysis.Where(n => n.Signal != signal);
        _state.SetResults(analysed with { Composite = composite with { Analysis = [.. kept, .. notes] } });
        int shifts = notes.Count(n => n.CompositeDepth is not null);
        Show($"Analysed {signal}: {shifts} regime shift(s) marked, {notes.Count} note(s) under the plot.");
    }

    private void StopRun()
    {
        if (_run is null)
        {
            Show("Nothing is running.");
            return;
        }
        _run.Cancel();
        Show("Stopping the run...");
    }

    /// <summary>Progress from the worker: keeps the latest value and posts at most one redraw at a time to the UI thread.</summary>
    private sealed class UiProgress(DashboardWindow window) : IProgress<WorkProgress>
    {
        public void Report(WorkProgress value)
        {
            window._latestProgress = value;
            if (Interlocked.Exchange(ref window._progressPending, 1) == 1) return;
            window.Ui(() =>
            {
                Interlocked.Exchange(ref window._progressPending, 0);
                if (window._run is not null) window._message.ShowProgress(window._latestProgress);
            });
        }
    }

    /// <summary>Marshals to the UI thread; after shutdown there is no UI left to update.</summary>
    private void Ui(Action action)
    {
        try
        {
            _app.Invoke(action);
        }
        catch (NotInitializedException)
        {
        }
    }

    // ---- files ------------------------------------------------------------------------------

    private bool Save()
    {
        var project = _state.Project;
        try
        {
            ProjectWriter.Save(project, _state.FilePath);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            Show($"Could not save {_state.FilePath}: {e.Message}", MessageLevel.Error);
            return false;
        }
        _state.MarkSaved(project);
        TryDeleteRecovery();
        _recent?.Add(_state.FilePath);
        // Short enough for 80 columns with a long project name.
        Show($"Saved {Path.GetFileName(_state.FilePath)} (the previous version as .bak).");
        return true;
    }

    private void Export()
    {
        if (_workflows.ExportUnavailable is { } why)
        {
            Show(Capitalise(why) + ".", MessageLevel.Warning);
            return;
        }
        if (_state.Results is not { } results)
        {
            Show("Nothing to export yet: r runs alignment, ages and composite first.", MessageLevel.Warning);
            return;
        }
        string suggested = Path.Combine(Path.GetDirectoryName(Path.GetFullPath(_state.FilePath)) ?? ".", Path.GetFileNameWithoutExtension(_state.FilePath) + "-outputs");
        if (_prompts.AskText("Export", "Folder for the tables and figures:", suggested) is not { } folder || folder.Trim().Length == 0) return;
        try
        {
            string summary = _workflows.Export(_state.Loaded.WithProject(results.Project), results, folder.Trim(), CancellationToken.None);
            Show(summary + (_state.ResultsState == ResultsState.Stale ? " (from the last run: the inputs changed since)" : ""));
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or InvalidOperationException)
        {
            Show("Export failed: " + e.Message, MessageLevel.Error);
        }
    }

    private void Quit()
    {
        if (!_state.IsSaved)
        {
            int? pick = _prompts.Choose("Quit", "There are unsaved edits.",
                ["Save, then quit", "Quit without saving (the edits are lost)", "Stay"], 0);
            if (pick is null or 2) return;
            if (pick == 0 && !Save()) return;
            if (pick == 1) TryDeleteRecovery();
        }
        _run?.Cancel();
        RequestStop();
    }

    private void OnProjectEdited()
    {
        if (_recovery is null) return;
        try
        {
            if (_state.IsSaved) _recovery.Delete(); else _recovery.Write(_state.Project);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            Show($"Could not write the recovery file {_recovery.FilePath}: {e.Message}", MessageLevel.Warning);
        }
    }

    private void TryDeleteRecovery()
    {
        try
        {
            _recovery?.Delete();
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            Show($"Could not remove the recovery file: {e.Message}", MessageLevel.Warning);
        }
    }

    private void OnStateChanged()
    {
        if (Logs.SelectedTie is { } id && _state.Project.FindMarker(id) is null) Logs.SelectedTie = null;
        SetNeedsDraw();
        foreach (var v in SubViews) v.SetNeedsDraw();
    }

    private void Show(string text, MessageLevel level = MessageLevel.Info) => _message.Show(text, level);

    private static string Capitalise(string s) => s.Length == 0 ? s : char.ToUpperInvariant(s[0]) + s[1..];

    protected override void Dispose(bool disposing)
    {
        if (disposing)
        {
            _run?.Cancel();
            _state.Changed -= OnStateChanged;
            _state.ProjectEdited -= OnProjectEdited;
        }
        base.Dispose(disposing);
    }
}
