using StratLink.Quantities;
using System.Globalization;
using StratLink.Alignment;
using StratLink.Cli.Dashboard.Drawing;
using StratLink.Model;
using StratLink.Tables;
using Attribute = Terminal.Gui.Drawing.Attribute;

namespace StratLink.Cli.Dashboard.Views;

/// <summary>
/// The site's cores side by side as vertical logs (depth down), as many as the width holds (every
/// core of a site of up to six at 80 columns), each with one signal drawn in braille dots on a robust
/// scale, gaps and disturbed intervals shaded, ties joining any two logs that hold them, the
/// alignment as thin correspondence lines, and a depth cursor per log. Above the logs a strip lists
/// every core with its depth span, the shown ones in brackets; below them a detail line describes
/// the selected tie. All logs share one zoom (depth per row).
/// </summary>
public sealed class CorrelationView : DashView, INavigable
{
    public const int MaxLogs = 8;
    public const int MinLogs = 2;

    /// <summary>Rows above the plot (site strip, log headers) and below it (readout, detail line).</summary>
    private const int HeadRows = 2;
    private const int FootRows = 2;

    private readonly DashboardState _state;
    private readonly List<LogSlot> _slots = [];
    private readonly Dictionary<(string Core, string Signal), RobustRange> _ranges = [];
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

    /// <summary>
    /// The log a new tie goes to: the chosen partner (<see cref="TogglePartner"/>) when it is shown
    /// and is not the active log, else the one right of the active log, or left of it for the last.
    /// </summary>
    public LogSlot? PartnerSlot
    {
        get
        {
            if (_slots.Count < 2) return null;
            var chosen = _slots.FirstOrDefault(s => s.CoreId == PartnerCore);
            if (chosen is not null && chosen != ActiveSlot) return chosen;
            return _slots[Active + 1 < _slots.Count ? Active + 1 : Active - 1];
        }
    }

    /// <summary>The core chosen as the partner of new ties, or null for the neighbouring log.</summary>
    public string? PartnerCore { get; private set; }

    /// <summary>How many logs fit across the current width (at least two).</summary>
    public int FittingLogs => Math.Min(MaxLogs, LogLayout.MostLogs(Viewport.Width));

    /// <summary>Depth per text row (project unit); 0 until the view has been laid out once.</summary>
    public double DepthPerRow { get; private set; }

    /// <summary>Id of the selected tie (marker), or null.</summary>
    public string? SelectedTie { get; set; }

    public int PlotRows => Math.Max(1, Viewport.Height - HeadRows - FootRows);

    public string ScaleText => $"{Format(DepthPerRow, DepthPerRow >= 1 ? 0 : 3)} {Project.DepthUnit.Symbol()} per row";

    public string JumpPrompt => $"Depth in {ActiveSlot?.CoreId} ({Project.DepthUnit.Symbol()}), or an age with BP after it:";

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
    public bool Zoom(bool zoomIn)
    {
        if (!EnsureFitted()) return false;
        double next = zoomIn ? NiceStep(DepthPerRow, -1) : NiceStep(DepthPerRow, +1);
        double maxRange = _slots.Select(s => CoreRange(s.CoreId)).Select(r => r.Bottom - r.Top).DefaultIfEmpty(1).Max();
        // Out no further than the whole longest core on screen, as fit all shows it.
        if (next < 0.001 || next > NiceAtLeast(Math.Max(maxRange, 1e-3) / PlotRows) * (1 + 1e-9)) return false;
        foreach (var slot in _slots)
        {
            double row = (slot.Cursor - slot.Top) / DepthPerRow;
            slot.Top = slot.Cursor - row * next;
        }
        DepthPerRow = next;
        foreach (var slot in _slots) KeepVisible(slot);
        SetNeedsDraw();
        return true;
    }

    /// <summary>The longest shown core fits the height; every log scrolled to its top, cursors kept.</summary>
    public void FitAll()
    {
        if (!EnsureFitted()) return;
        Fit();
        SetNeedsDraw();
    }

    /// <summary>A depth in the active core, or an age carried to it through the age model and the alignment.</summary>
    public string? JumpTo(JumpTarget target)
    {
        if (ActiveSlot is not { } slot || !EnsureFitted()) return "No log to move in.";
        double depth = target.Value;
        if (target.Axis == JumpAxis.Age)
        {
            var results = _state.Results;
            if (results?.Ages is not { } curve || results.Alignment?.Mappings.TryGetValue(slot.CoreId, out var mapping) != true)
                return "No age model in these results: r runs one; a plain number goes to a depth.";
            if (AgeLookup.CompositeDepthAt(curve, Project, target.Value) is not double composite)
                return $"The age model does not reach {Format(target.Value, 0)} cal BP.";
            depth = mapping!.Median.ToCoreValue(composite);
        }
        SetCursor(depth);
        return null;
    }

    /// <summary>Makes the active log the partner of new ties, or clears the choice when it was already.</summary>
    public string? TogglePartner()
    {
        if (ActiveSlot is not { } slot) return null;
        PartnerCore = PartnerCore == slot.CoreId ? null : slot.CoreId;
        SetNeedsDraw();
        return PartnerCore;
    }

    /// <summary>
    /// Shows the next (direction 1) or previous (-1) cores of the site in the logs, as many as are
    /// shown now, in the project's order; false when there is no further page.
    /// </summary>
    public bool PageCores(int direction)
    {
        var cores = Project.Cores.Select(c => c.Id).ToList();
        int k = _slots.Count;
        if (k == 0 || cores.Count <= k) return false;
        int first = cores.IndexOf(_slots[0].CoreId);
        int start = Math.Clamp(first + direction * k, 0, cores.Count - k);
        if (start == first) return false;
        for (int i = 0; i < k; i++) ShowCore(_slots[i], cores[start + i]);
        Active = Math.Min(Active, k - 1);
        SetNeedsDraw();
        return true;
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
        if (_slots.Count >= FittingLogs || ActiveSlot is not { } active) return false;
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
        // After the terminal narrowed: drop logs from the right (never the active one) until the rest fit.
        while (_slots.Count > Math.Max(MinLogs, FittingLogs))
        {
            int drop = Active == _slots.Count - 1 ? _slots.Count - 2 : _slots.Count - 1;
            _slots.RemoveAt(drop);
            if (drop < Active) Active--;
        }
        var layout = LogLayout.For(Viewport.Width, _slots.Count);
        int rows = PlotRows;
        DrawSiteStrip(pal);
        for (int i = 0; i < _slots.Count; i++) DrawLog(i, layout, rows, pal);
        DrawLinks(layout, rows, pal);
        Put(0, HeadRows + rows + 1, Fit(" " + DetailText(), Viewport.Width), SelectedTie is null ? pal.Dim : pal.Strong);
        context?.AddDrawnRectangle(ViewportToScreen(Viewport with { X = 0, Y = 0 }));
        return true;
    }

    /// <summary>Every core of the site with its depth span; the shown ones in brackets, the active one emphasised.</summary>
    private void DrawSiteStrip(Palette pal)
    {
        string unit = Project.DepthUnit.Symbol();
        string Entry(string id, bool span)
        {
            var (top, bottom) = CoreRange(id);
            string label = span ? $"{id} {Format(top, 0)}-{Format(bottom, 0)}" : id;
            return _slots.Any(s => s.CoreId == id) ? $"[{label}]" : $" {label} ";
        }
        var ids = Project.Cores.Select(c => c.Id).ToList();
        string head = $" {unit}:";
        // Spans for every core when they fit, else only for the cores not shown (the logs show the others').
        var entries = ids.Select(id => Entry(id, span: true)).ToList();
        if (head.Length + entries.Sum(e => e.Length + 1) > Viewport.Width)
            entries = ids.Select(id => Entry(id, span: _slots.All(s => s.CoreId != id))).ToList();
        Put(0, 0, head, pal.Dim);
        int x = head.Length + 1;
        for (int i = 0; i < ids.Count; i++)
        {
            var attr = ids[i] == ActiveSlot?.CoreId ? pal.Strong : _slots.Any(s => s.CoreId == ids[i]) ? pal.Normal : pal.Dim;
            Put(x, 0, entries[i], attr);
            x += entries[i].Length + 1;
        }
        if (x - 1 > Viewport.Width) Put(Viewport.Width - 1, 0, Glyphs.Unicode ? "…" : ">", pal.Strong);
    }

    private void DrawLog(int index, LogLayout layout, int rows, Palette pal)
    {
        var slot = _slots[index];
        var core = Project.FindCore(slot.CoreId);
        int left = layout.SlotLeft(index), plotLeft = layout.PlotLeft(index), width = layout.PlotWidth;
        double dpr = DepthPerRow;
        bool active = index == Active;
        bool partner = _slots.Count > 1 && slot == PartnerSlot && slot.CoreId == PartnerCore;

        string mark = active ? Glyphs.ActiveLog : partner ? Glyphs.PartnerLog : " ";
        string header = $"{slot.CoreId} {(Glyphs.Unicode ? "·" : "-")} {slot.Signal ?? "no signal"}";
        Put(left, 1, Fit(mark + header, layout.SlotWidth), active ? pal.ActiveHeader : pal.Header);

        // Shading first, so the curve is drawn over it.
        var background = new (string Glyph, Attribute Attr)?[rows];
        for (int r = 0; r < rows; r++)
        {
            double top = slot.Top + r * dpr, bottom = top + dpr;
            if (core is null) continue;
            if (core.Gaps.Any(g => Overlaps(g, top, bottom))) background[r] = (Glyphs.Gap, pal.Gap);
            else if (core.Disturbed.Any(g => Overlaps(g, top, bottom))) background[r] = (Glyphs.Disturbed, pal.Disturbed);
            else if (core.Events.Any(g => Overlaps(g, top, bottom))) background[r] = (Glyphs.EventLayer, pal.Disturbed);
            if (background[r] is { } b) Fill(plotLeft, HeadRows + r, width, b.Glyph, b.Attr);
        }

        DotCanvas? canvas = null;
        var table = Table(slot.CoreId);
        if (table is not null && slot.Signal is not null && table.Signals.TryGetValue(slot.Signal, out var values))
        {
            var range = ValueRange(slot.CoreId, slot.Signal, values);
            canvas = new DotCanvas(width, rows);
            var bins = SignalBins.FromSorted(table.Depths, values, slot.Top, dpr / 4, rows * 4);
            CurvePlotter.DrawVertical(canvas, bins, range.Min, range.Max, y => core?.IsInGap(slot.Top + (y + 0.5) * dpr / 4) ?? false);
            PutCanvas(plotLeft, HeadRows, canvas, pal.Curve);
        }
        else
        {
            string why = table is null ? "table not read" : "no signal";
            Put(plotLeft + Math.Max(0, (width - why.Length) / 2), HeadRows + rows / 2, why, pal.Dim, width);
        }

        // Depth axis: a label every fourth row, the cursor mark, tie marks.
        int decimals = dpr >= 1 ? 0 : dpr >= 0.1 ? 1 : 2;
        for (int r = 0; r < rows; r += 4)
            Put(left, HeadRows + r, Format(slot.Top + r * dpr, decimals).PadLeft(5)[^5..], pal.Dim);
        foreach (var m in Project.Markers)
        {
            if (m.DepthIn(slot.CoreId) is not { } d) continue;
            int r = RowOf(slot, d.In(Project.DepthUnit));
            bool selected = m.Id == SelectedTie;
            if (r >= 0 && r < rows) Put(left + 6, HeadRows + r, selected ? Glyphs.SelectedTieMark : Glyphs.TieMarkOf(m.Kind), selected ? pal.SelectedTie : pal.Tie);
        }

        int cursorRow = RowOf(slot, slot.Cursor);
        if (cursorRow >= 0 && cursorRow < rows)
        {
            Put(left + 5, HeadRows + cursorRow, Glyphs.Unicode ? "▶" : ">", active ? pal.Strong : pal.Dim);
            if (active)
            {
                var row = new System.Text.StringBuilder();
                for (int c = 0; c < width; c++)
                    row.Append(canvas is not null && canvas.IsInked(c, cursorRow)
                        ? canvas.CellRune(c, cursorRow, Glyphs.Unicode, Glyphs.CurveInk).ToString()
                        : background[cursorRow]?.Glyph ?? " ");
                Put(plotLeft, HeadRows + cursorRow, row.ToString(), pal.CursorRow);
            }
        }

        Put(left, HeadRows + rows, Fit(Readout(slot, table), layout.SlotWidth), active ? pal.Strong : pal.Normal);
    }

    /// <summary>
    /// Ties and alignment lines in the gutters. A tie joins each pair of successive shown logs that
    /// hold it, however far apart: the straight line between them is drawn in the gutters it crosses
    /// and marked where it passes a log. Alignment lines join neighbouring logs, and the active log
    /// to its partner when they are not neighbours.
    /// </summary>
    private void DrawLinks(LogLayout layout, int rows, Palette pal)
    {
        int width = Viewport.Width;
        var align = new DotCanvas(width, rows);
        var ties = new DotCanvas(width, rows);
        var selected = new DotCanvas(width, rows);
        var u = Project.DepthUnit;

        if (_state.Results?.Alignment is { } alignment)
        {
            var pairs = Enumerable.Range(0, _slots.Count - 1).Select(i => (i, i + 1)).ToList();
            if (PartnerSlot is { } p && ActiveSlot is { } act)
            {
                int ia = _slots.IndexOf(act), ib = _slots.IndexOf(p);
                if (Math.Abs(ia - ib) > 1) pairs.Add((Math.Min(ia, ib), Math.Max(ia, ib)));
            }
            foreach (var (i, j) in pairs)
            {
                LogSlot a = _slots[i], b = _slots[j];
                if (!alignment.Mappings.TryGetValue(a.CoreId, out var ma) || !alignment.Mappings.TryGetValue(b.CoreId, out var mb)) continue;
                // Every other row, and each line dotted, so alignment lines read apart from ties without colour.
                // Only depths both cores recovered: the mappings extrapolate past a core's ends, where nothing corresponds.
                var (topA, bottomA) = CoreRange(a.CoreId);
                var (topB, bottomB) = CoreRange(b.CoreId);
                for (int r = 1; r < rows; r += 2)
                {
                    double depthA = a.Top + (r + 0.5) * DepthPerRow;
                    double depthB = mb.Median.ToCoreValue(ma.Median.ToCompositeValue(depthA));
                    if (depthA < topA || depthA > bottomA || depthB < topB || depthB > bottomB) continue;
                    Across(align, layout, i, j, DotY(a, depthA), DotY(b, depthB), dotted: true);
                }
            }
        }

        var through = new List<(int Log, int Row, bool Selected)>();
        foreach (var m in Project.Markers)
        {
            var held = Enumerable.Range(0, _slots.Count).Where(i => m.DepthIn(_slots[i].CoreId) is not null).ToList();
            var target = m.Id == SelectedTie ? selected : ties;
            for (int k = 0; k + 1 < held.Count; k++)
            {
                int i = held[k], j = held[k + 1];
                double ya = DotY(_slots[i], m.DepthIn(_slots[i].CoreId)!.Value.In(u));
                double yb = DotY(_slots[j], m.DepthIn(_slots[j].CoreId)!.Value.In(u));
                Across(target, layout, i, j, ya, yb, dotted: false);
                for (int t = i + 1; t < j; t++)
                {
                    double x = (layout.PlotLeft(t) - 1) * 2;
                    double y = Interpolate(layout, i, j, ya, yb, x);
                    through.Add((t, (int)Math.Floor(y / 4), m.Id == SelectedTie));
                }
            }
        }
        PutCanvas(0, HeadRows, align, pal.Alignment);
        PutCanvas(0, HeadRows, ties, pal.Tie);
        PutCanvas(0, HeadRows, selected, pal.SelectedTie);
        foreach (var (log, row, sel) in through)
            if (row >= 0 && row < rows)
                Put(layout.SlotLeft(log) + 6, HeadRows + row, Glyphs.TieThrough, sel ? pal.SelectedTie : pal.Tie);
    }

    private double DotY(LogSlot slot, double depth) => (depth - slot.Top) * 4 / DepthPerRow;

    /// <summary>Dot column where log i's gutter starts and where log j's plot area starts, the ends of a link.</summary>
    private static (double X0, double X1) LinkEnds(LogLayout layout, int i, int j) =>
        (layout.GutterLeft(i) * 2, (layout.GutterLeft(j - 1) + layout.GutterWidth) * 2 - 1);

    private static double Interpolate(LogLayout layout, int i, int j, double ya, double yb, double x)
    {
        var (x0, x1) = LinkEnds(layout, i, j);
        return x1 > x0 ? ya + (yb - ya) * (x - x0) / (x1 - x0) : ya;
    }

    /// <summary>The straight line from log i's gutter to log j, drawn only inside the gutters between them.</summary>
    private static void Across(DotCanvas canvas, LogLayout layout, int i, int j, double ya, double yb, bool dotted)
    {
        for (int k = i; k < j; k++)
        {
            double gx0 = layout.GutterLeft(k) * 2, gx1 = (layout.GutterLeft(k) + layout.GutterWidth) * 2 - 1;
            LineClipped(canvas, gx0, Interpolate(layout, i, j, ya, yb, gx0), gx1, Interpolate(layout, i, j, ya, yb, gx1), dotted);
        }
    }

    /// <summary>A line clipped to the canvas rows, so ties far off screen cost nothing.</summary>
    private static void LineClipped(DotCanvas canvas, double x0, double y0, double x1, double y1, bool dotted)
    {
        double h = canvas.DotHeight - 1;
        if ((y0 < 0 && y1 < 0) || (y0 > h && y1 > h)) return;
        if (y0 != y1)
        {
            (double cx0, double cy0) = Clip(x0, y0, x1, y1, h);
            (double cx1, double cy1) = Clip(x1, y1, x0, y0, h);
            (x0, y0, x1, y1) = (cx0, cy0, cx1, cy1);
        }
        canvas.Line((int)Math.Round(x0), (int)Math.Round(y0), (int)Math.Round(x1), (int)Math.Round(y1), dotted ? 2 : 1);
    }

    private static (double X, double Y) Clip(double x, double y, double ox, double oy, double h)
    {
        double target = y < 0 ? 0 : y > h ? h : y;
        if (target == y) return (x, y);
        double t = (target - y) / (oy - y);
        return (x + t * (ox - x), target);
    }

    /// <summary>The selected tie's depths, uncertainty and leave-one-out misfit; else the active log's scale.</summary>
    public string DetailText()
    {
        if (SelectedTie is { } id && Project.FindMarker(id) is { } m)
        {
            // The run's check aligns without the tie and compares the signals' placing (a slower, signal-based leave-one-out).
            var flagged = _state.ResultsState == ResultsState.Current
                ? _state.Results?.Checks?.Where(f => f.Code == Checks.CheckCodes.TieMisfit && f.Item == m.Id && f.Core is not null).Select(f => f.Core!).ToList()
                : null;
            string signals = flagged is { Count: > 0 } ? $" | signals misplace it in {string.Join(", ", flagged)}" : "";
            string full = TieDetail.Line(Project, m, ActiveSlot?.CoreId, PartnerSlot?.CoreId) + signals + (signals.Length > 0 ? " (4 lists why)" : "");
            if (full.Length < Viewport.Width) return full;
            // The line is drawn after one blank column; where it would be cut, the misfits outrank the other cores' depths.
            string shorter = TieDetail.Line(Project, m, ActiveSlot?.CoreId, PartnerSlot?.CoreId, shortening: 1) + signals;
            return shorter.Length < Viewport.Width ? shorter : TieDetail.Line(Project, m, ActiveSlot?.CoreId, PartnerSlot?.CoreId, shortening: 2) + signals;
        }
        if (ActiveSlot is not { } slot || Table(slot.CoreId) is not { } table || slot.Signal is null
            || !table.Signals.TryGetValue(slot.Signal, out var values)) return "";
        var r = ValueRange(slot.CoreId, slot.Signal, values);
        string partner = PartnerSlot is { } p ? $"; t ties to {p.CoreId}" : "";
        return $"{slot.CoreId} {slot.Signal} {Number(r.Min)}..{Number(r.Max)} ({r.Describe()}){partner}";
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
        if (core?.Events.Any(e => e.ContainsValue(slot.Cursor)) == true) text += " (event layer)";
        return text;
    }

    // ---- helpers ----------------------------------------------------------------------------

    private bool EnsureFitted()
    {
        if (_fitted) return true;
        if (Viewport.Height < HeadRows + FootRows + 1 || Viewport.Width < 10 || _slots.Count == 0) return false;
        // Start with every core of the site shown, as many as the width holds.
        while (_slots.Count < FittingLogs && Project.Cores.FirstOrDefault(c => _slots.All(s => s.CoreId != c.Id)) is { } extra)
            _slots.Add(new LogSlot(extra.Id, DefaultSignal(extra.Id)));
        foreach (var slot in _slots) slot.Cursor = CoreRange(slot.CoreId).Top;
        Fit();
        _fitted = true;
        return true;
    }

    /// <summary>The depth per row that fits the longest shown core, each log scrolled to its top.</summary>
    private void Fit()
    {
        double range = _slots.Select(s => CoreRange(s.CoreId)).Select(r => r.Bottom - r.Top).Max();
        DepthPerRow = NiceAtLeast(Math.Max(range, 1e-3) / PlotRows);
        foreach (var slot in _slots)
        {
            slot.Top = CoreRange(slot.CoreId).Top;
            slot.Cursor = ClampToCore(slot.CoreId, slot.Cursor);
            KeepVisible(slot);
        }
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
    /// The value scale of a log: a robust range of the whole signal, so a few event-layer spikes do
    /// not squash the rest of the log (they are drawn clipped at the edge, and the share is shown).
    /// </summary>
    private RobustRange ValueRange(string core, string signal, double[] values)
    {
        if (_ranges.TryGetValue((core, signal), out var r)) return r;
        return _ranges[(core, signal)] = RobustRange.Of(values);
    }

    private static bool Overlaps(Quantities.DepthInterval interval, double top, double bottom)
    {
        double t = interval.Top.In(interval.Top.Unit), b = interval.Bottom.In(interval.Top.Unit);
        return t < bottom && b >= top;
    }

    private static string Number(double v) => v.ToString(Math.Abs(v) >= 100 ? "0" : "0.##", CultureInfo.InvariantCulture);

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
