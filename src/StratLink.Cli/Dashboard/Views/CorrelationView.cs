using StratLink.Quantities;
using System.Globalization;
using StratLink.Alignment;
using StratLink.Cli.Dashboard.Drawing;
using StratLink.Model;
using StratLink.Tables;
using Attribute = Terminal.Gui.Drawing.Attribute;

namespace StratLink.Cli.Dashboard.Views;

/// <summary>
/// Two to four cores side by side as vertical logs (depth down), each with one signal drawn in
/// braille dots, gaps and disturbed intervals shaded, ties joining the logs, the alignment as thin
/// correspondence lines, and a depth cursor per log. All logs share one zoom (depth per row).
/// </summary>
public sealed class CorrelationView : DashView
{
    public const int MaxLogs = 4;
    public const int MinLogs = 2;

    private readonly DashboardState _state;
    private readonly List<LogSlot> _slots = [];
    private readonly Dictionary<(string Core, string Signal), (double Min, double Max)> _ranges = [];
    private bool _fitted;

    public CorrelationView(DashboardState state, GlyphSet glyphs) : base(glyphs)
    {
        _state = state;
        var cores = state.Project.Cores;
        foreach (var core in cores.Take(MinLogs)) _slots.Add(new LogSlot(core.Id, DefaultSignal(core.Id)));
    }

    public IReadOnlyList<LogSlot> Slots => _slots;
    public int Active { get; private set; }
    public LogSlot? ActiveSlot => _slots.Count > 0 ? _slots[Active] : null;

    /// <summary>The log a new tie goes to: the one right of the active log, or left of it for the last.</summary>
    public LogSlot? PartnerSlot => _slots.Count < 2 ? null : _slots[Active + 1 < _slots.Count ? Active + 1 : Active - 1];

    /// <summary>Depth per text row (project unit); 0 until the view has been laid out once.</summary>
    public double DepthPerRow { get; private set; }

    /// <summary>Id of the selected tie (marker), or null.</summary>
    public string? SelectedTie { get; set; }

    public int PlotRows => Math.Max(1, Viewport.Height - 2);

    private Project Project => _state.Project;

    // ---- navigation -------------------------------------------------------------------------

    public void MoveCursorRows(double rows)
    {
        if (ActiveSlot is not { } slot || !EnsureFitted()) return;
        slot.Cursor = ClampToCore(slot.CoreId, slot.Cursor + rows * DepthPerRow);
        KeepVisible(slot);
        SetNeedsDraw();
    }

    public void PageRows(int direction) => MoveCursorRows(direction * Math.Max(1, PlotRows - 1));

    public void ToEnd(bool bottom)
    {
        if (ActiveSlot is not { } slot || !EnsureFitted()) return;
        var (top, bot) = CoreRange(slot.CoreId);
        slot.Cursor = bottom ? bot : top;
        KeepVisible(slot);
        SetNeedsDraw();
    }

    public void SetCursor(double depth)
    {
        if (ActiveSlot is not { } slot || !EnsureFitted()) return;
        slot.Cursor = ClampToCore(slot.CoreId, depth);
        KeepVisible(slot);
        SetNeedsDraw();
    }

    public void ShiftActive(int delta)
    {
        if (_slots.Count == 0) return;
        Active = Math.Clamp(Active + delta, 0, _slots.Count - 1);
        SetNeedsDraw();
    }

    /// <summary>Halves (factor &lt; 1) or doubles the depth per row on the 1-2-5 ladder, keeping each cursor on its row.</summary>
    public void Zoom(bool zoomIn)
    {
        if (!EnsureFitted()) return;
        double next = zoomIn ? NiceStep(DepthPerRow, -1) : NiceStep(DepthPerRow, +1);
        double maxRange = _slots.Select(s => CoreRange(s.CoreId)).Select(r => r.Bottom - r.Top).DefaultIfEmpty(1).Max();
        if (next < 0.001 || next > Math.Max(maxRange, 1)) return;
        foreach (var slot in _slots)
        {
            double row = (slot.Cursor - slot.Top) / DepthPerRow;
            slot.Top = slot.Cursor - row * next;
        }
        DepthPerRow = next;
        foreach (var slot in _slots) KeepVisible(slot);
        SetNeedsDraw();
    }

    public string? NextSignal()
    {
        if (ActiveSlot is not { } slot) return null;
        var names = SignalsOf(slot.CoreId);
        if (names.Count == 0) return null;
        int i = slot.Signal is null ? -1 : names.IndexOf(slot.Signal);
        slot.Signal = names[(i + 1) % names.Count];
        SetNeedsDraw();
        return slot.Signal;
    }

    /// <summary>Shows the next core (one not shown in another log) in the active log.</summary>
    public string? NextCore()
    {
        if (ActiveSlot is not { } slot) return null;
        var cores = Project.Cores.Select(c => c.Id).ToList();
        int start = cores.IndexOf(slot.CoreId);
        for (int step = 1; step <= cores.Count; step++)
        {
            string candidate = cores[(start + step + cores.Count) % cores.Count];
            if (_slots.Any(s => s.CoreId == candidate)) continue;
            ShowCore(slot, candidate);
            return candidate;
        }
        return null;
    }

    public bool MoreLogs()
    {
        if (_slots.Count >= MaxLogs || ActiveSlot is not { } active) return false;
        var core = Project.Cores.FirstOrDefault(c => _slots.All(s => s.CoreId != c.Id));
        if (core is null) return false;
        var slot = new LogSlot(core.Id, DefaultSignal(core.Id)) { Top = active.Top, Cursor = ClampToCore(core.Id, active.Cursor) };
        _slots.Insert(Active + 1, slot);
        if (_fitted) KeepVisible(slot);
        SetNeedsDraw();
        return true;
    }

    public bool FewerLogs()
    {
        if (_slots.Count <= MinLogs) return false;
        _slots.RemoveAt(Active);
        Active = Math.Min(Active, _slots.Count - 1);
        SetNeedsDraw();
        return true;
    }

    /// <summary>
    /// Puts the other logs' cursors at the depth matching the active cursor: through the alignment
    /// when it is given, else at the same depth. Returns whether the alignment was used.
    /// </summary>
    public bool LineUp(AlignmentResult? alignment)
    {
        if (ActiveSlot is not { } active || !EnsureFitted()) return false;
        bool used = false;
        foreach (var slot in _slots.Where(s => s != active))
        {
            double depth = active.Cursor;
            if (alignment is not null && alignment.Mappings.TryGetValue(active.CoreId, out var from)
                && alignment.Mappings.TryGetValue(slot.CoreId, out var to))
            {
                depth = to.Median.ToCoreValue(from.Median.ToCompositeValue(active.Cursor));
                used = true;
            }
            slot.Cursor = ClampToCore(slot.CoreId, depth);
            KeepVisible(slot);
        }
        SetNeedsDraw();
        return used;
    }

    /// <summary>Shows <paramref name="coreId"/> (in its log, or in the active log) with the cursor at <paramref name="depth"/>.</summary>
    public void GoTo(string coreId, double? depth)
    {
        if (Project.FindCore(coreId) is null || _slots.Count == 0) return;
        int i = _slots.FindIndex(s => s.CoreId == coreId);
        if (i < 0) ShowCore(_slots[Active], coreId); else Active = i;
        if (depth is double d) SetCursor(d);
        SetNeedsDraw();
    }

    /// <summary>Selects the next tie below (direction 1) or above (-1) the active cursor and moves the cursor to it.</summary>
    public MarkerSpec? SelectTie(int direction)
    {
        if (ActiveSlot is not { } slot) return null;
        var ties = Project.Markers
            .Select(m => (Marker: m, Depth: m.DepthIn(slot.CoreId)))
            .Where(t => t.Depth is not null)
            .Select(t => (t.Marker, Depth: t.Depth!.Value.In(Project.DepthUnit)))
            .OrderBy(t => t.Depth)
            .ToList();
        const double eps = 1e-9;
        var pick = direction > 0
            ? ties.FirstOrDefault(t => t.Depth > slot.Cursor + eps)
            : ties.LastOrDefault(t => t.Depth < slot.Cursor - eps);
        if (pick.Marker is null) return null;
        SelectedTie = pick.Marker.Id;
        SetCursor(pick.Depth);
        return pick.Marker;
    }

    // ---- drawing ----------------------------------------------------------------------------

    protected override bool OnDrawingContent(Terminal.Gui.ViewBase.DrawContext? context)
    {
        var pal = Colors;
        ClearViewport(pal.Normal);
        if (_slots.Count == 0)
        {
            Put(1, 1, "This project has no cores.", pal.Normal);
            return true;
        }
        if (!EnsureFitted()) return true;
        var layout = LogLayout.For(Viewport.Width, _slots.Count);
        int rows = PlotRows;
        for (int i = 0; i < _slots.Count; i++) DrawLog(i, layout, rows, pal);
        for (int i = 0; i + 1 < _slots.Count; i++) DrawGutter(i, layout, rows, pal);
        context?.AddDrawnRectangle(ViewportToScreen(Viewport with { X = 0, Y = 0 }));
        return true;
    }

    private void DrawLog(int index, LogLayout layout, int rows, Palette pal)
    {
        var slot = _slots[index];
        var core = Project.FindCore(slot.CoreId);
        int left = layout.SlotLeft(index), plotLeft = layout.PlotLeft(index), width = layout.PlotWidth;
        double dpr = DepthPerRow;
        bool active = index == Active;

        string header = $"{slot.CoreId} {(Glyphs.Unicode ? "·" : "-")} {slot.Signal ?? "no signal"}";
        Put(left, 0, Fit(" " + header, layout.SlotWidth), active ? pal.ActiveHeader : pal.Header);

        // Shading first, so the curve is drawn over it.
        var background = new (string Glyph, Attribute Attr)?[rows];
        for (int r = 0; r < rows; r++)
        {
            double top = slot.Top + r * dpr, bottom = top + dpr;
            if (core is null) continue;
            if (core.Gaps.Any(g => Overlaps(g, top, bottom))) background[r] = (Glyphs.Gap, pal.Gap);
            else if (core.Disturbed.Any(g => Overlaps(g, top, bottom))) background[r] = (Glyphs.Disturbed, pal.Disturbed);
            if (background[r] is { } b) Fill(plotLeft, 1 + r, width, b.Glyph, b.Attr);
        }

        DotCanvas? canvas = null;
        var table = Table(slot.CoreId);
        if (table is not null && slot.Signal is not null && table.Signals.TryGetValue(slot.Signal, out var values))
        {
            var (min, max) = ValueRange(slot.CoreId, slot.Signal, values);
            canvas = new DotCanvas(width, rows);
            var bins = SignalBins.FromSorted(table.Depths, values, slot.Top, dpr / 4, rows * 4);
            CurvePlotter.DrawVertical(canvas, bins, min, max, y => core?.IsInGap(slot.Top + (y + 0.5) * dpr / 4) ?? false);
            PutCanvas(plotLeft, 1, canvas, pal.Curve);
        }
        else
        {
            string why = table is null ? "table not read" : "no signal";
            Put(plotLeft + Math.Max(0, (width - why.Length) / 2), 1 + rows / 2, why, pal.Dim, width);
        }

        // Depth axis: a label every fourth row, the cursor mark, tie marks.
        int decimals = dpr >= 1 ? 0 : dpr >= 0.1 ? 1 : 2;
        for (int r = 0; r < rows; r += 4)
            Put(left, 1 + r, Format(slot.Top + r * dpr, decimals).PadLeft(5)[^5..], pal.Dim);
        foreach (var m in Project.Markers)
        {
            if (m.DepthIn(slot.CoreId) is not { } d) continue;
            int r = RowOf(slot, d.In(Project.DepthUnit));
            if (r >= 0 && r < rows) Put(left + 6, 1 + r, Glyphs.TieMark, m.Id == SelectedTie ? pal.SelectedTie : pal.Tie);
        }

        int cursorRow = RowOf(slot, slot.Cursor);
        if (cursorRow >= 0 && cursorRow < rows)
        {
            Put(left + 5, 1 + cursorRow, Glyphs.Unicode ? "▶" : ">", active ? pal.Strong : pal.Dim);
            if (active)
            {
                var row = new System.Text.StringBuilder();
                for (int c = 0; c < width; c++)
                    row.Append(canvas is not null && canvas.IsInked(c, cursorRow)
                        ? canvas.CellRune(c, cursorRow, Glyphs.Unicode, Glyphs.CurveInk).ToString()
                        : background[cursorRow]?.Glyph ?? " ");
                Put(plotLeft, 1 + cursorRow, row.ToString(), pal.CursorRow);
            }
        }

        Put(left, rows + 1, Fit(Readout(slot, table), layout.SlotWidth), active ? pal.Strong : pal.Normal);
    }

    private void DrawGutter(int index, LogLayout layout, int rows, Palette pal)
    {
        LogSlot a = _slots[index], b = _slots[index + 1];
        int g = layout.GutterWidth;
        var align = new DotCanvas(g, rows);
        var ties = new DotCanvas(g, rows);
        var selected = new DotCanvas(g, rows);
        double dots = 4 / DepthPerRow;
        int xEnd = g * 2 - 1;

        if (_state.Results?.Alignment is { } alignment
            && alignment.Mappings.TryGetValue(a.CoreId, out var ma) && alignment.Mappings.TryGetValue(b.CoreId, out var mb))
        {
            for (int r = 1; r < rows; r += 2)
            {
                double depthA = a.Top + (r + 0.5) * DepthPerRow;
                double depthB = mb.Median.ToCoreValue(ma.Median.ToCompositeValue(depthA));
                LineClipped(align, 0, (depthA - a.Top) * dots, xEnd, (depthB - b.Top) * dots);
            }
        }
        foreach (var m in Project.Markers)
        {
            if (m.DepthIn(a.CoreId) is not { } da || m.DepthIn(b.CoreId) is not { } db) continue;
            var target = m.Id == SelectedTie ? selected : ties;
            LineClipped(target, 0, (da.In(Project.DepthUnit) - a.Top) * dots, xEnd, (db.In(Project.DepthUnit) - b.Top) * dots);
        }
        int x = layout.GutterLeft(index);
        PutCanvas(x, 1, align, pal.Alignment);
        PutCanvas(x, 1, ties, pal.Tie);
        PutCanvas(x, 1, selected, pal.SelectedTie);
    }

    /// <summary>A line clipped to the canvas rows, so ties far off screen cost nothing.</summary>
    private static void LineClipped(DotCanvas canvas, double x0, double y0, double x1, double y1)
    {
        double h = canvas.DotHeight - 1;
        if ((y0 < 0 && y1 < 0) || (y0 > h && y1 > h)) return;
        if (y0 != y1)
        {
            (double cx0, double cy0) = Clip(x0, y0, x1, y1, h);
            (double cx1, double cy1) = Clip(x1, y1, x0, y0, h);
            (x0, y0, x1, y1) = (cx0, cy0, cx1, cy1);
        }
        canvas.Line((int)Math.Round(x0), (int)Math.Round(y0), (int)Math.Round(x1), (int)Math.Round(y1));
    }

    private static (double X, double Y) Clip(double x, double y, double ox, double oy, double h)
    {
        double target = y < 0 ? 0 : y > h ? h : y;
        if (target == y) return (x, y);
        double t = (target - y) / (oy - y);
        return (x + t * (ox - x), target);
    }

    private string Readout(LogSlot slot, CoreTable? table)
    {
        string unit = Project.DepthUnit.Symbol();
        string text = $"{Format(slot.Cursor, 2)} {unit}";
        var core = Project.FindCore(slot.CoreId);
        if (core?.IsInGap(slot.Cursor) == true) return text + "  gap";
        if (table is not null && slot.Signal is not null && table.Signals.TryGetValue(slot.Signal, out var values))
        {
            int i = SignalBins.NearestSorted(table.Depths, slot.Cursor, DepthPerRow);
            text += i >= 0 && !double.IsNaN(values[i]) ? $"  {slot.Signal} {values[i].ToString("G4", CultureInfo.InvariantCulture)}" : "  no value";
        }
        if (core?.Disturbed.Any(d => d.ContainsValue(slot.Cursor)) == true) text += " (disturbed)";
        return text;
    }

    // ---- helpers ----------------------------------------------------------------------------

    private bool EnsureFitted()
    {
        if (_fitted) return true;
        if (Viewport.Height < 3 || Viewport.Width < 10 || _slots.Count == 0) return false;
        // Wide screens start with every core shown, up to four.
        if (Viewport.Width >= 120)
            while (_slots.Count < MaxLogs && Project.Cores.FirstOrDefault(c => _slots.All(s => s.CoreId != c.Id)) is { } extra)
                _slots.Add(new LogSlot(extra.Id, DefaultSignal(extra.Id)));
        double range = _slots.Select(s => CoreRange(s.CoreId)).Select(r => r.Bottom - r.Top).Max();
        DepthPerRow = NiceAtLeast(Math.Max(range, 1e-3) / PlotRows);
        foreach (var slot in _slots)
        {
            var (top, _) = CoreRange(slot.CoreId);
            slot.Top = top;
            slot.Cursor = top;
        }
        _fitted = true;
        return true;
    }

    private void KeepVisible(LogSlot slot)
    {
        int rows = PlotRows;
        int row = RowOf(slot, slot.Cursor);
        // Scrolling up keeps two rows of context above the cursor, but never scrolls above the core top.
        if (row < 0) slot.Top = Math.Max(Math.Min(CoreRange(slot.CoreId).Top, slot.Cursor), slot.Cursor - Math.Min(2, rows - 1) * DepthPerRow);
        else if (row >= rows) slot.Top = slot.Cursor - Math.Max(0, rows - 3) * DepthPerRow;
    }

    private int RowOf(LogSlot slot, double depth) => (int)Math.Floor((depth - slot.Top) / DepthPerRow);

    private void ShowCore(LogSlot slot, string coreId)
    {
        slot.CoreId = coreId;
        if (slot.Signal is null || !SignalsOf(coreId).Contains(slot.Signal)) slot.Signal = DefaultSignal(coreId);
        slot.Cursor = ClampToCore(coreId, slot.Cursor);
        if (_fitted) KeepVisible(slot);
        SetNeedsDraw();
    }

    private CoreTable? Table(string coreId) => _state.Loaded.Tables.TryGetValue(coreId, out var t) ? t : null;

    private List<string> SignalsOf(string coreId)
    {
        if (Table(coreId) is { } t) return t.SignalNames.ToList();
        return Project.FindCore(coreId)?.Signals.ToList() ?? [];
    }

    /// <summary>The first alignment signal the core has, else its first signal.</summary>
    private string? DefaultSignal(string coreId)
    {
        var names = SignalsOf(coreId);
        return Project.Alignment.Signals.Select(s => s.Signal).FirstOrDefault(names.Contains) ?? names.FirstOrDefault();
    }

    /// <summary>Depth range of a core: its table's, else what the project file says about it.</summary>
    public (double Top, double Bottom) CoreRange(string coreId)
    {
        if (Table(coreId) is { Count: > 0 } t) return (t.Depths[0], t.Depths[^1]);
        var core = Project.FindCore(coreId);
        var u = Project.DepthUnit;
        var known = Project.Markers.Select(m => m.DepthIn(coreId)).Where(d => d is not null).Select(d => d!.Value.In(u))
            .Concat(core?.Gaps.Select(g => g.Bottom.In(u)) ?? [])
            .Concat(core?.Disturbed.Select(g => g.Bottom.In(u)) ?? []);
        double bottom = known.DefaultIfEmpty(0).Max();
        return (0, Math.Max(bottom * 1.05, 1));
    }

    private double ClampToCore(string coreId, double depth)
    {
        var (top, bottom) = CoreRange(coreId);
        return Math.Clamp(depth, top, bottom);
    }

    /// <summary>
    /// The value scale of a log: the 0.5 to 99.5 percentiles of the signal, so a few event-layer
    /// spikes do not squash the rest of the log (they are drawn clipped at the edge).
    /// </summary>
    private (double Min, double Max) ValueRange(string core, string signal, double[] values)
    {
        if (_ranges.TryGetValue((core, signal), out var r)) return r;
        var finite = values.Where(v => !double.IsNaN(v) && !double.IsInfinity(v)).ToArray();
        Array.Sort(finite);
        double min = finite.Length == 0 ? 0 : Statistics.PercentileSorted(finite, 0.5);
        double max = finite.Length == 0 ? 1 : Statistics.PercentileSorted(finite, 99.5);
        if (!(max > min)) (min, max) = (min - 0.5, min + 0.5);
        return _ranges[(core, signal)] = (min, max);
    }

    private static bool Overlaps(Quantities.DepthInterval interval, double top, double bottom)
    {
        double t = interval.Top.In(interval.Top.Unit), b = interval.Bottom.In(interval.Top.Unit);
        return t < bottom && b >= top;
    }

    private static string Format(double value, int decimals) =>
        value.ToString("F" + decimals.ToString(CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);

    /// <summary>Smallest value of the 1-2-5 ladder at or above <paramref name="x"/>.</summary>
    public static double NiceAtLeast(double x)
    {
        double exp = Math.Pow(10, Math.Floor(Math.Log10(x)));
        foreach (double m in new[] { 1.0, 2.0, 5.0, 10.0 })
            if (m * exp >= x * (1 - 1e-9)) return m * exp;
        return 10 * exp;
    }

    /// <summary>The neighbour of <paramref name="x"/> (a ladder value) one step down (-1) or up (+1) the 1-2-5 ladder.</summary>
    public static double NiceStep(double x, int direction)
    {
        double nice = NiceAtLeast(x);
        double exp = Math.Pow(10, Math.Floor(Math.Log10(nice) + 1e-9));
        double mant = Math.Round(nice / exp);
        return (mant, direction) switch
        {
            (1, > 0) => 2 * exp,
            (2, > 0) => 5 * exp,
            (5, > 0) => 10 * exp,
            (1, < 0) => 0.5 * exp,
            (2, < 0) => 1 * exp,
            (5, < 0) => 2 * exp,
            _ => nice,
        };
    }
}
