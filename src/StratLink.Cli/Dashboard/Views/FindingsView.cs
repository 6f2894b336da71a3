using System.Globalization;
using StratLink.Checks;
using StratLink.Cli.Dashboard.Drawing;

namespace StratLink.Cli.Dashboard.Views;

/// <summary>Which findings the list shows by severity.</summary>
public enum SeverityFilter
{
    All,
    WarningsAndErrors,
    Errors,
}

/// <summary>
/// Problems found in the project file and tables, then the checks of the last run, one line each,
/// filtered by severity and by core; below the list, the selected finding in full (wrapped).
/// </summary>
public sealed class FindingsView : DashView
{
    private readonly DashboardState _state;

    public FindingsView(DashboardState state, GlyphSet glyphs) : base(glyphs) => _state = state;

    public ListSelection Selection { get; } = new();

    public SeverityFilter Severities { get; private set; }

    /// <summary>The core whose findings are shown, or null for every finding.</summary>
    public string? CoreFilter { get; private set; }

    /// <summary>Every finding, before the filters.</summary>
    public IReadOnlyList<Finding> AllItems =>
        [.. _state.Loaded.Problems, .. _state.Results?.Checks ?? []];

    /// <summary>The findings the filters let through, in list order.</summary>
    public IReadOnlyList<Finding> Items => AllItems.Where(Passes).ToList();

    public Finding? SelectedFinding
    {
        get
        {
            var items = Items;
            return items.Count == 0 ? null : items[Math.Clamp(Selection.Selected, 0, items.Count - 1)];
        }
    }

    public int PageSize => Math.Max(1, ListRows(Viewport.Height) - 1);

    public void Move(int delta)
    {
        Selection.Move(delta, Items.Count);
        SetNeedsDraw();
    }

    /// <summary>All, then warnings and errors, then errors only; returns the filters as the header says them.</summary>
    public string CycleSeverity()
    {
        Severities = (SeverityFilter)(((int)Severities + 1) % 3);
        Selection.Move(0, Items.Count);
        SetNeedsDraw();
        return FilterText();
    }

    /// <summary>Every core, then each core of the project in turn.</summary>
    public string CycleCore()
    {
        var cores = _state.Project.Cores.Select(c => c.Id).ToList();
        int i = CoreFilter is null ? -1 : cores.IndexOf(CoreFilter);
        CoreFilter = i + 1 < cores.Count ? cores[i + 1] : null;
        Selection.Move(0, Items.Count);
        SetNeedsDraw();
        return FilterText();
    }

    public string FilterText()
    {
        string severities = Severities switch
        {
            SeverityFilter.WarningsAndErrors => "warnings and errors",
            SeverityFilter.Errors => "errors",
            _ => "all",
        };
        return $"{severities}, {(CoreFilter is null ? "every core" : "core " + CoreFilter)}";
    }

    private bool Passes(Finding f)
    {
        bool severity = Severities switch
        {
            SeverityFilter.WarningsAndErrors => f.Severity is Severity.Warning or Severity.Error,
            SeverityFilter.Errors => f.Severity == Severity.Error,
            _ => true,
        };
        if (!severity) return false;
        if (CoreFilter is null) return true;
        // A finding about a tie belongs to every core the tie is in.
        return f.Core == CoreFilter
            || (f.Core is null && f.Item is { } item && _state.Project.FindMarker(item)?.DepthIn(CoreFilter) is not null);
    }

    public static string Line(Finding f)
    {
        string item = f.Item is not null ? $"[{f.Item}] " : f.Field is not null ? $"'{f.Field}' " : "";
        return $"{f.Severity.ToString().ToLowerInvariant(),-7} {Where(f),-16} {item}{f.Message}  ({f.Code})";
    }

    private static string Where(Finding f) => f.Core is not null
        ? f.Core + (f.Depth is double d ? " " + d.ToString("0.##", CultureInfo.InvariantCulture) : "")
        : f.File is not null ? Path.GetFileName(f.File) + (f.Line is int l ? ":" + l.ToString(CultureInfo.InvariantCulture) : "") : "";

    /// <summary>The finding in full: what and where on one line, then the message wrapped to <paramref name="width"/>.</summary>
    public static IReadOnlyList<string> Detail(Finding f, int width)
    {
        var head = new List<string> { f.Severity.ToString().ToLowerInvariant(), f.Code };
        if (Where(f) is { Length: > 0 } where) head.Add(where);
        if (f.Item is not null) head.Add("item " + f.Item);
        if (f.Field is not null) head.Add($"key '{f.Field}'");
        if (f.File is not null && f.Core is not null) head.Add(Path.GetFileName(f.File) + (f.Line is int l ? ":" + l.ToString(CultureInfo.InvariantCulture) : ""));
        var lines = Wrap(string.Join(" · ", head), width).ToList();
        lines.AddRange(Wrap(f.Message, width));
        return lines;
    }

    /// <summary>Words onto lines of at most <paramref name="width"/> characters; a longer word is split.</summary>
    public static IEnumerable<string> Wrap(string text, int width)
    {
        width = Math.Max(8, width);
        var line = new System.Text.StringBuilder();
        foreach (string raw in text.Split(' ', StringSplitOptions.RemoveEmptyEntries))
        {
            string word = raw;
            while (word.Length > width)
            {
                if (line.Length > 0) { yield return line.ToString(); line.Clear(); }
                yield return word[..width];
                word = word[width..];
            }
            if (line.Length > 0 && line.Length + 1 + word.Length > width)
            {
                yield return line.ToString();
                line.Clear();
            }
            if (line.Length > 0) line.Append(' ');
            line.Append(word);
        }
        if (line.Length > 0) yield return line.ToString();
    }

    /// <summary>Rows for the list (header included); the rest of the height goes to the detail pane.</summary>
    private static int ListRows(int height) => Math.Max(2, height - Math.Max(4, height * 2 / 5));

    protected override bool OnDrawingContent(Terminal.Gui.ViewBase.DrawContext? context)
    {
        var pal = Colors;
        ClearViewport(pal.Normal);
        var items = Items;
        int all = AllItems.Count;
        string checks = _state.Results?.Checks is null ? "checks not run yet" : $"{_state.Results.Checks.Count} from the checks";
        string counts = $" Findings: {_state.Loaded.Problems.Count} from the files, {checks}";
        // The longest header that fits: the filters are named again below when they hide everything.
        string[] headers = items.Count == all
            ? [counts + ". Enter shows the place in the logs.", counts + "."]
            : [counts + $"; {items.Count} shown ({FilterText()}).", counts + $"; {items.Count} shown."];
        Put(0, 0, Fit(headers.FirstOrDefault(t => t.Length <= Viewport.Width) ?? headers[^1], Viewport.Width), pal.Header);
        if (items.Count == 0)
        {
            string text = all == 0 ? "Nothing to report." : $"No finding passes the filters ({FilterText()}); l and c change them.";
            var lines = Wrap(text, Math.Max(1, Viewport.Width - 4)).ToList();
            for (int i = 0; i < lines.Count && 2 + i < Viewport.Height; i++) Put(2, 2 + i, lines[i], pal.Dim);
            return true;
        }
        // The detail pane takes the rows the selected finding needs (the list keeps three at least).
        var selected = items[Math.Clamp(Selection.Selected, 0, items.Count - 1)];
        var detail = Detail(selected, Viewport.Width - 2);
        int paneRows = Math.Clamp(detail.Count + 1, Viewport.Height - ListRows(Viewport.Height), Math.Max(2, Viewport.Height - 4));
        int listRows = Math.Max(1, Viewport.Height - 1 - paneRows);
        Selection.Fit(items.Count, listRows);
        for (int i = 0; i < listRows && Selection.First + i < items.Count; i++)
        {
            int index = Selection.First + i;
            var f = items[index];
            var attr = index == Selection.Selected ? pal.CursorRow
                : f.Severity == Severity.Error ? pal.Error
                : f.Severity == Severity.Warning ? pal.Warning : pal.Normal;
            string mark = index == Selection.Selected ? (Glyphs.Unicode ? "▶" : ">") : " ";
            Put(0, 1 + i, Fit(mark + Line(f), Viewport.Width), attr);
        }

        // The selected finding in full.
        int paneTop = 1 + listRows;
        string rule = $" finding {Selection.Selected + 1} of {items.Count} ";
        Put(0, paneTop, Fit((Glyphs.Unicode ? "──" : "--") + rule + new string(Glyphs.Unicode ? '─' : '-', Viewport.Width), Viewport.Width), pal.Dim);
        int room = Viewport.Height - paneTop - 1;
        for (int i = 0; i < detail.Count && i < room; i++)
        {
            bool last = i == room - 1 && detail.Count > room;
            Put(1, paneTop + 1 + i, last ? Fit(detail[i], Viewport.Width - 4) + (Glyphs.Unicode ? " …" : " ~") : detail[i], i == 0 ? pal.Strong : pal.Normal);
        }
        return true;
    }
}
