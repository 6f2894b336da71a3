using Terminal.Gui.Drivers;
using Terminal.Gui.Input;
using static StratLink.Cli.Dashboard.Keys.KeyChord;

namespace StratLink.Cli.Dashboard.Keys;

/// <summary>
/// The one table binding keys to commands. The key handler, the status line and the help screen
/// all read it, so they cannot disagree. Esc, F5, F6, F10 and Ctrl+Z are left alone or bound
/// harmlessly because the toolkit gives them meanings (quit, refresh, focus, menu, suspend).
/// </summary>
public static class KeyTable
{
    private static readonly Screen[] All = [];
    private static readonly Screen[] Logs = [Screen.Logs];
    private static readonly Screen[] Findings = [Screen.Findings];

    /// <summary>The plotting screens, which share one navigation model and its keys.</summary>
    private static readonly Screen[] Plots = [Screen.Logs, Screen.Ages, Screen.Composite];

    public static readonly IReadOnlyList<KeyEntry> Entries =
    [
        new(DashCommand.Help, All, "Keys", "Show this list of keys", 1, [Special(KeyCode.F1, "F1"), Char('?')]),
        new(DashCommand.ShowLogs, All, "Logs", "Logs: cores side by side, ties and alignment", 0, [Char('1')]),
        new(DashCommand.ShowAges, All, "Ages", "Ages: age-depth model and the age controls", 0, [Char('2')]),
        new(DashCommand.ShowComposite, All, "Composite", "Composite: the stacked records and the splice", 0, [Char('3')]),
        new(DashCommand.ShowFindings, All, "Findings", "Findings: problems in the files and the checks", 0, [Char('4')]),
        new(DashCommand.NextScreen, All, "Screen", "Next screen", 0, [Special(KeyCode.Tab, "Tab")]),
        new(DashCommand.Back, All, "Back", "Clear the selected tie, or go back to the logs", 0, [Special(KeyCode.Esc, "Esc")]),
        new(DashCommand.Run, All, "Run", "Run alignment, ages and composite in the background", 9, [Char('r')]),
        new(DashCommand.StopRun, All, "Stop", "Stop the run (the previous results stay)", 17, [Char('x')]),
        new(DashCommand.Undo, All, "Undo", "Undo the last edit", 11, [Char('u')]),
        new(DashCommand.Redo, All, "Redo", "Redo the edit undone last", 16, [Char('U')]),
        new(DashCommand.Save, All, "Save", "Save the project file (the old one is kept as .bak)", 10, [Char('s')]),
        new(DashCommand.Export, All, "Export", "Export the result tables and figures to a folder", 0, [Char('e')]),
        new(DashCommand.Quit, All, "Quit", "Quit (asks first when there are unsaved edits)", 8, [Char('q'), Special(KeyCode.Q | KeyCode.CtrlMask, "Ctrl+Q")]),

        new(DashCommand.CursorUp, Plots, "Up", "Move the cursor up one row (depth or age)", 0, [Special(KeyCode.CursorUp, "Up")]),
        new(DashCommand.CursorDown, Plots, "Down", "Move the cursor down one row", 0, [Special(KeyCode.CursorDown, "Down")]),
        new(DashCommand.FineUp, Plots, "Fine up", "Move the cursor up a quarter row (one dot)", 0, [Special(KeyCode.CursorUp | KeyCode.ShiftMask, "Shift+Up")]),
        new(DashCommand.FineDown, Plots, "Fine down", "Move the cursor down a quarter row (one dot)", 0, [Special(KeyCode.CursorDown | KeyCode.ShiftMask, "Shift+Down")]),
        new(DashCommand.PageUp, Plots, "Page up", "Move the cursor up one screen", 0, [Special(KeyCode.PageUp, "PgUp")]),
        new(DashCommand.PageDown, Plots, "Page down", "Move the cursor down one screen", 0, [Special(KeyCode.PageDown, "PgDn")]),
        new(DashCommand.Top, Plots, "Top", "Go to the top (the core's top, the youngest age)", 0, [Special(KeyCode.Home, "Home")]),
        new(DashCommand.Bottom, Plots, "Bottom", "Go to the bottom (the deepest part, the oldest age)", 0, [Special(KeyCode.End, "End")]),
        new(DashCommand.ZoomIn, Plots, "Zoom", "Zoom in (half the depth or age per row, around the cursor)", 2, [Char('+')], "+/-"),
        new(DashCommand.ZoomOut, Plots, "Zoom out", "Zoom out (twice the depth or age per row)", 0, [Char('-')]),
        new(DashCommand.GoTo, Plots, "Go to", "Go to a typed depth, or an age typed with BP after it", 3, [Char('g')]),
        new(DashCommand.FitAll, Plots, "Fit", "Fit all: the whole record on screen", 4, [Char('f')]),

        new(DashCommand.PreviousLog, Logs, "Left log", "Make the log on the left the active one", 0, [Special(KeyCode.CursorLeft, "Left")]),
        new(DashCommand.NextLog, Logs, "Right log", "Make the log on the right the active one", 0, [Special(KeyCode.CursorRight, "Right")]),
        new(DashCommand.NextSignal, [Screen.Logs, Screen.Composite], "Signal", "Show the next signal (in the active log)", 0, [Char('v')]),
        new(DashCommand.NextCore, Logs, "Core", "Show the next core not shown yet in the active log", 0, [Char('c')]),
        new(DashCommand.MoreLogs, Logs, "More logs", "Add a log (as many as the width holds)", 0, [Char('a')]),
        new(DashCommand.FewerLogs, Logs, "Fewer logs", "Remove the active log (two stay)", 0, [Char('d')]),
        new(DashCommand.PreviousCores, Logs, "Prev cores", "Show the previous cores of the site (when they do not all fit)", 0, [Char('<')]),
        new(DashCommand.NextCores, Logs, "Next cores", "Show the next cores of the site (when they do not all fit)", 0, [Char('>')]),
        new(DashCommand.TogglePartner, Logs, "Partner", "Make the active log the partner of new ties, wherever it is (again: back to the neighbouring log)", 7, [Special(KeyCode.Space, "Space")]),
        new(DashCommand.LineUp, Logs, "Line up", "Move the other logs' cursors to the depth matching this one (by the alignment when it is current, else the same depth)", 0, [Char('=')]),
        new(DashCommand.AddTie, Logs, "Tie", "Tie the cursor in this log to the cursor in the partner log (extends the selected tie when it lacks one of the two cores)", 5, [Char('t')]),
        new(DashCommand.NextTie, Logs, "Next tie", "Select the next tie below the cursor", 6, [Char(']')]),
        new(DashCommand.PreviousTie, Logs, "Prev tie", "Select the previous tie above the cursor", 0, [Char('[')]),
        new(DashCommand.MoveTie, Logs, "Move", "Move the selected tie to the cursor in this log", 12, [Char('m')]),
        new(DashCommand.DeleteTie, Logs, "Delete", "Delete the selected tie", 13, [Special(KeyCode.Delete, "Del"), Special(KeyCode.Backspace, "Backspace")]),
        new(DashCommand.RenameTie, Logs, "Name", "Rename the selected tie", 14, [Char('n')]),
        new(DashCommand.TieKind, Logs, "Kind", "Set the kind of the selected tie (tephra, turbidite, flood, event, other)", 15, [Char('k')]),

        new(DashCommand.NextControl, [Screen.Ages], "Next control", "Select the next age control (the plot follows it)", 5, [Char(']')]),
        new(DashCommand.PreviousControl, [Screen.Ages], "Prev control", "Select the previous age control", 0, [Char('[')]),
        new(DashCommand.ToggleExclude, [Screen.Ages], "Exclude", "Leave the selected age control out of the age model, or take it back in", 6, [Special(KeyCode.Space, "Space")]),
        new(DashCommand.ToggleAxis, [Screen.Composite], "Depth/age", "Plot the composite against composite depth or against age", 5, [Char('a')]),
        new(DashCommand.ToggleStacked, [Screen.Composite], "Stack", "One signal, or every signal side by side on the same axis", 6, [Char('m')]),
        new(DashCommand.Analyse, [Screen.Composite], "Analyse", AnalyseHelp, 7, [Char('p')]),

        new(DashCommand.ListUp, Findings, "Up", "Select the previous finding", 0, [Special(KeyCode.CursorUp, "Up")]),
        new(DashCommand.ListDown, Findings, "Down", "Select the next finding", 0, [Special(KeyCode.CursorDown, "Down")]),
        new(DashCommand.ListPageUp, Findings, "Page up", "Up one page", 0, [Special(KeyCode.PageUp, "PgUp")]),
        new(DashCommand.ListPageDown, Findings, "Page down", "Down one page", 0, [Special(KeyCode.PageDown, "PgDn")]),
        new(DashCommand.GoToFinding, Findings, "Go to", "Show the place of the selected finding in the logs", 2, [Special(KeyCode.Enter, "Enter")]),
        new(DashCommand.FilterSeverity, Findings, "Severity", "Show every finding, warnings and errors, or errors only", 3, [Char('l')]),
        new(DashCommand.FilterCore, Findings, "Core", "Show the findings of every core, or of one core in turn", 4, [Char('c')]),
    ];

    private static string AnalyseHelp =>
        "Analyse this signal in the background: periodogram against red noise at "
        + string.Join(" and ", LibraryWorkflows.DefaultPeriodsYears.Select(p => p.ToString(System.Globalization.CultureInfo.InvariantCulture)))
        + " yr and regime shifts, over the age-model members (x stops)";

    /// <summary>The command <paramref name="key"/> means on <paramref name="screen"/>; screen-specific rows win over global ones.</summary>
    public static KeyEntry? Find(Key key, Screen screen) =>
        Entries.FirstOrDefault(e => !e.Everywhere && e.AppliesTo(screen) && e.Keys.Any(k => k.Matches(key)))
        ?? Entries.FirstOrDefault(e => e.Everywhere && e.Keys.Any(k => k.Matches(key)));

    public static KeyEntry Entry(DashCommand command) => Entries.First(e => e.Command == command);

    /// <summary>The status line for a screen: as many "key label" items as fit in <paramref name="width"/>.</summary>
    public static string StatusLine(Screen screen, int width)
    {
        var items = Entries.Where(e => e.StatusOrder > 0 && e.AppliesTo(screen)).OrderBy(e => e.StatusOrder)
            .Select(e => $"{e.StatusKeys ?? e.Keys[0].Label} {e.Label}");
        var text = new System.Text.StringBuilder();
        foreach (string item in items)
        {
            int needed = text.Length == 0 ? item.Length : item.Length + 2;
            if (text.Length + needed > width) break;
            if (text.Length > 0) text.Append("  ");
            text.Append(item);
        }
        return text.ToString();
    }
}
