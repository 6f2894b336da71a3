using System.Globalization;
using StratLink.Checks;
using StratLink.Cli.Dashboard.Drawing;

namespace StratLink.Cli.Dashboard.Views;

/// <summary>Problems found in the project file and tables, then the checks of the last run, one line each.</summary>
public sealed class FindingsView : DashView
{
    private readonly DashboardState _state;

    public FindingsView(DashboardState state, GlyphSet glyphs) : base(glyphs) => _state = state;

    public ListSelection Selection { get; } = new();

    public IReadOnlyList<Finding> Items =>
        [.. _state.Loaded.Problems, .. _state.Results?.Checks ?? []];

    public Finding? SelectedFinding => Items.Count == 0 ? null : Items[Math.Clamp(Selection.Selected, 0, Items.Count - 1)];

    public int PageSize => Math.Max(1, Viewport.Height - 3);

    public void Move(int delta)
    {
        Selection.Move(delta, Items.Count);
        SetNeedsDraw();
    }

    public static string Line(Finding f)
    {
        string where = f.Core is not null
            ? f.Core + (f.Depth is double d ? " " + d.ToString("0.##", CultureInfo.InvariantCulture) : "")
            : f.File is not null ? Path.GetFileName(f.File) + (f.Line is int l ? ":" + l.ToString(CultureInfo.InvariantCulture) : "") : "";
        string item = f.Item is not null ? $"[{f.Item}] " : f.Field is not null ? $"'{f.Field}' " : "";
        return $"{f.Severity.ToString().ToLowerInvariant(),-7} {where,-16} {item}{f.Message}  ({f.Code})";
    }

    protected override bool OnDrawingContent(Terminal.Gui.ViewBase.DrawContext? context)
    {
        var pal = Colors;
        ClearViewport(pal.Normal);
        var items = Items;
        string checks = _state.Results?.Checks is null ? "checks not run yet" : $"{_state.Results.Checks.Count} from the checks";
        Put(0, 0, Fit($" Findings: {_state.Loaded.Problems.Count} from the files, {checks}. Enter shows the place in the logs.", Viewport.Width), pal.Header);
        if (items.Count == 0)
        {
            Put(2, 2, "Nothing to report.", pal.Dim);
            return true;
        }
        int rows = Viewport.Height - 1;
        Selection.Fit(items.Count, rows);
        for (int i = 0; i < rows && Selection.First + i < items.Count; i++)
        {
            int index = Selection.First + i;
            var f = items[index];
            var attr = index == Selection.Selected ? pal.CursorRow
                : f.Severity == Severity.Error ? pal.Error
                : f.Severity == Severity.Warning ? pal.Warning : pal.Normal;
            Put(0, 1 + i, Fit(" " + Line(f), Viewport.Width), attr);
        }
        return true;
    }
}
