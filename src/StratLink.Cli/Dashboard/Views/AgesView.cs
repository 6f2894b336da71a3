using StratLink.AgeModelling;
using StratLink.Quantities;
using System.Globalization;
using StratLink.Cli.Dashboard.Drawing;
using StratLink.Cli.Dashboard.Results;
using StratLink.Model;

namespace StratLink.Cli.Dashboard.Views;

/// <summary>
/// The age-depth model on composite depth with its 95 % band, the controls with their error bars, the event
/// layers (marked beside the depth axis: they take no time) and the median accumulation rate along the right
/// edge, above (or, on wide screens, beside) the list of controls with their prior (given or calibrated) and
/// posterior (modelled) 95 % ranges and posterior outlier shares.
/// The plot scrolls and zooms along composite depth with the keys of every plotting screen.
/// </summary>
public sealed class AgesView : DashView, INavigable
{
    private readonly DashboardState _state;

    public AgesView(DashboardState state, GlyphSet glyphs) : base(glyphs) => _state = state;

    public ListSelection Selection { get; } = new();

    /// <summary>The plot's composite depth axis (project unit).</summary>
    public AxisWindow DepthAxis { get; } = new();

    public AgeControlSpec? SelectedControl =>
        _state.Project.Ages.Count == 0 ? null : _state.Project.Ages[Math.Clamp(Selection.Selected, 0, _state.Project.Ages.Count - 1)];

    public void Move(int delta)
    {
        Selection.Move(delta, _state.Project.Ages.Count);
        // The plot follows the selection to the control's depth when the run placed it.
        if (SelectedControl is { } a && _state.Results?.Controls.FirstOrDefault(c => c.Id == a.Id)?.CompositeDepth is double d && FitAxis())
            DepthAxis.MoveTo(d);
        SetNeedsDraw();
    }

    // ---- navigation (the same keys as the logs and the composite) ----------------------------

    public string ScaleText => $"{FormatNumber(DepthAxis.PerRow)} {_state.Project.DepthUnit.Symbol()} per row";

    public string JumpPrompt => $"Composite depth ({_state.Project.DepthUnit.Symbol()}), or an age with BP after it:";

    public void MoveCursorRows(double rows) => Navigate(() => DepthAxis.MoveRows(rows));
    public void PageRows(int direction) => Navigate(() => DepthAxis.Page(direction));
    public void ToEnd(bool bottom) => Navigate(() => DepthAxis.ToEnd(bottom));
    public void FitAll() => Navigate(DepthAxis.FitAll);

    public bool Zoom(bool zoomIn)
    {
        bool zoomed = false;
        Navigate(() => zoomed = DepthAxis.Zoom(zoomIn));
        return zoomed;
    }

    public string? JumpTo(JumpTarget target)
    {
        if (_state.Results?.Ages is not { } curve || !FitAxis()) return "Age model not run yet (r runs alignment, ages and composite).";
        double depth = target.Value;
        if (target.Axis == JumpAxis.Age)
        {
            if (AgeLookup.CompositeDepthAt(curve, _state.Project, target.Value) is not double d)
                return $"The age model does not reach {FormatNumber(target.Value)} cal BP.";
            depth = d;
        }
        DepthAxis.MoveTo(depth);
        SetNeedsDraw();
        return null;
    }

    private void Navigate(Action move)
    {
        if (!FitAxis()) return;
        move();
        SetNeedsDraw();
    }

    /// <summary>Gives the axis the model's extent and the plot's rows; false before there is a model.</summary>
    private bool FitAxis()
    {
        if (_state.Results?.Ages is not { } curve) return false;
        DepthAxis.SetExtent(curve.TopCompositeDepth, curve.BottomCompositeDepth, Math.Max(2, PlotArea().Height - 2));
        return true;
    }

    private System.Drawing.Rectangle PlotArea()
    {
        var vp = Viewport;
        return vp.Width >= 120
            ? new System.Drawing.Rectangle(0, 0, vp.Width / 2, vp.Height)
            : new System.Drawing.Rectangle(0, 0, vp.Width, vp.Height / 2);
    }

    private System.Drawing.Rectangle ListArea()
    {
        var vp = Viewport;
        return vp.Width >= 120
            ? new System.Drawing.Rectangle(vp.Width / 2 + 1, 0, vp.Width - vp.Width / 2 - 1, vp.Height)
            : new System.Drawing.Rectangle(0, vp.Height / 2, vp.Width, vp.Height - vp.Height / 2);
    }

    protected override bool OnDrawingContent(Terminal.Gui.ViewBase.DrawContext? context)
    {
        var pal = Colors;
        ClearViewport(pal.Normal);
        DrawPlot(PlotArea(), pal);
        DrawList(ListArea(), pal);
        return true;
    }

    private void DrawPlot(System.Drawing.Rectangle area, Palette pal)
    {
        string unit = _state.Project.DepthUnit.Symbol();
        Put(area.X, area.Y, Fit($" Age model: age (cal BP) across, composite depth ({unit}) down; E event layer", area.Width), pal.Header);
        var results = _state.Results;
        if (results?.Ages is not { } curve)
        {
            string why = results is null ? "Age model not run yet (r runs alignment, ages and composite)."
                : results.Skipped.FirstOrDefault(s => s.StartsWith("ages", StringComparison.Ordinal)) ?? "This run gave no age model.";
            Put(area.X + 2, area.Y + 2, why, pal.Dim, area.Width - 2);
            return;
        }
        const int axis = 7;
        // The rate column: median accumulation rate on event-free depth, every fourth row.
        int rateWidth = curve.Series is not null && area.Width >= 40 ? 7 : 0;
        int rows = area.Height - 2, cols = area.Width - axis - 1 - rateWidth;
        if (rows < 2 || cols < 4 || !FitAxis()) return;
        double top = DepthAxis.Top, bottom = DepthAxis.Bottom;
        double dotDepth = DepthAxis.PerRow / 4;
        var median = new double[rows * 4];
        var lo = new double[rows * 4];
        var hi = new double[rows * 4];
        double ageMin = double.PositiveInfinity, ageMax = double.NegativeInfinity;
        for (int y = 0; y < median.Length; y++)
        {
            double at = top + (y + 0.5) * dotDepth;
            if (at < curve.TopCompositeDepth || at > curve.BottomCompositeDepth)
            {
                (median[y], lo[y], hi[y]) = (double.NaN, double.NaN, double.NaN);
                continue;
            }
            var (m, l, h) = curve.Scale.AgeAt(_state.Project.CompositeDepthOf(at));
            (median[y], lo[y], hi[y]) = (m, l, h);
            ageMin = Math.Min(ageMin, l);
            ageMax = Math.Max(ageMax, h);
        }
        // Only the controls in the depth window widen the age scale, so zooming in on depth zooms the ages too.
        foreach (var c in results.Controls.Where(c => Drawable(c) && c.CompositeDepth is double d && d >= top && d <= bottom))
        {
            ageMin = Math.Min(ageMin, c.AgeLoBP);
            ageMax = Math.Max(ageMax, c.AgeHiBP);
        }
        if (!(ageMax > ageMin)) ageMax = ageMin + 1;
        int plotLeft = area.X + axis;
        int Col(double age) => Math.Clamp((int)Math.Round((age - ageMin) / (ageMax - ageMin) * (cols - 1)), 0, cols - 1);

        for (int r = 0; r < rows; r++)
        {
            double l = double.PositiveInfinity, h = double.NegativeInfinity;
            for (int k = 0; k < 4; k++)
                if (!double.IsNaN(lo[r * 4 + k])) { l = Math.Min(l, lo[r * 4 + k]); h = Math.Max(h, hi[r * 4 + k]); }
            if (!double.IsInfinity(l))
            {
                int c0 = Col(l), c1 = Col(h);
                Fill(plotLeft + c0, area.Y + 1 + r, c1 - c0 + 1, Glyphs.Band, pal.Band);
            }
            if (r % 4 == 0) Put(area.X, area.Y + 1 + r, FormatNumber(top + r * 4 * dotDepth).PadLeft(6)[^6..], pal.Dim);
            double rowTop = top + r * 4 * dotDepth, rowBottom = rowTop + 4 * dotDepth;
            if (curve.Events is { Count: > 0 } ev && Enumerable.Range(0, ev.Count).Any(k => ev.Tops[k] < rowBottom && ev.Bottoms[k] > rowTop))
                Put(area.X + axis - 1, area.Y + 1 + r, "E", pal.Tie);
            if (rateWidth > 0 && r % 4 == 0 && RateAt(curve.Series!, rowTop + 2 * dotDepth) is double rate)
                Put(area.X + area.Width - rateWidth + 1, area.Y + 1 + r, FormatRate(rate).PadLeft(rateWidth - 1)[^(rateWidth - 1)..], pal.Dim);
        }
        if (rateWidth > 0) Put(area.X + area.Width - rateWidth + 1, area.Y + area.Height - 1, $"{unit}/yr".PadLeft(rateWidth - 1), pal.Dim);
        var canvas = new DotCanvas(cols, rows);
        CurvePlotter.DrawProfile(canvas, median, ageMin, ageMax);
        PutCanvas(plotLeft, area.Y + 1, canvas, pal.Curve);

        foreach (var c in results.Controls.Where(Drawable))
        {
            if (c.CompositeDepth is not double d || d < top || d > bottom) continue;
            int r = Math.Clamp((int)((d - top) / (dotDepth * 4)), 0, rows - 1);
            bool excluded = _state.Project.Ages.FirstOrDefault(a => a.Id == c.Id)?.Exclude ?? false;
            var attr = excluded ? pal.Dim : pal.Tie;
            Fill(plotLeft + Col(c.AgeLoBP), area.Y + 1 + r, Col(c.AgeHiBP) - Col(c.AgeLoBP) + 1, Glyphs.ErrorBar, attr);
            Put(plotLeft + Col(c.AgeMedianBP), area.Y + 1 + r, excluded ? Glyphs.ExcludedControlMark : Glyphs.ControlMark, attr);
        }
        int cursorRow = DepthAxis.RowOf(DepthAxis.Cursor);
        if (cursorRow >= 0 && cursorRow < rows) Put(area.X + 6, area.Y + 1 + cursorRow, Glyphs.Unicode ? "▶" : ">", pal.Strong);
        string axisText = $"{FormatNumber(ageMin)} cal BP";
        string right = $"{FormatNumber(ageMax)} cal BP";
        Put(plotLeft, area.Y + area.Height - 1, axisText, pal.Dim);
        Put(plotLeft + Math.Max(axisText.Length + 1, cols - right.Length), area.Y + area.Height - 1, right, pal.Dim);
        // The cursor's depth and age between the axis ends.
        var (cm, cl, ch) = curve.Scale.AgeAt(_state.Project.CompositeDepthOf(DepthAxis.Cursor));
        string readout = $"{(Glyphs.Unicode ? "▶" : ">")} {FormatNumber(DepthAxis.Cursor)} {unit}: {FormatNumber(cm)} ({FormatNumber(cl)}..{FormatNumber(ch)})";
        int room = cols - axisText.Length - right.Length - 2;
        if (room > 8) Put(plotLeft + axisText.Length + 1 + Math.Max(0, (room - readout.Length) / 2), area.Y + area.Height - 1, readout, pal.Strong, room);
    }

    /// <summary>Median accumulation rate of the composite grid row nearest <paramref name="depth"/>; null off the grid or where undefined.</summary>
    private static double? RateAt(AgeModelling.AgeSeries series, double depth)
    {
        if (series.Count == 0 || depth < series.Depths[0] || depth > series.Depths[^1]) return null;
        int i = Array.BinarySearch(series.Depths, depth);
        if (i < 0) i = Math.Min(~i, series.Count - 1);
        double rate = series.RateMedian[i];
        return double.IsFinite(rate) ? rate : null;
    }

    private static string FormatRate(double v) => v.ToString(v >= 10 ? "0" : v >= 1 ? "0.0" : "0.###", CultureInfo.InvariantCulture);

    /// <summary>Controls the model could not place or date (unusable, undrawn) have no error bar to draw.</summary>
    private static bool Drawable(ControlOutcome c) => double.IsFinite(c.AgeLoBP) && double.IsFinite(c.AgeHiBP) && double.IsFinite(c.AgeMedianBP);

    private void DrawList(System.Drawing.Rectangle area, Palette pal)
    {
        var ages = _state.Project.Ages;
        Put(area.X, area.Y, Fit(" " + ListHeader(), area.Width), pal.Header);
        if (ages.Count == 0)
        {
            Put(area.X + 2, area.Y + 2, NoControlsText(), pal.Dim, area.Width - 2);
            return;
        }
        int rows = area.Height - 1;
        Selection.Fit(ages.Count, rows);
        for (int i = 0; i < rows && Selection.First + i < ages.Count; i++)
        {
            int index = Selection.First + i;
            var a = ages[index];
            string line = ListLine(a, _state.Results?.Controls.FirstOrDefault(c => c.Id == a.Id));
            var attr = index == Selection.Selected ? pal.CursorRow : a.Exclude ? pal.Dim : pal.Normal;
            Put(area.X, area.Y + 1 + i, Fit(" " + line, area.Width), attr);
        }
    }

    // A dated target adds its transferred ages at each run, though the file lists no control.
    private string NoControlsText()
    {
        if (_state.Project.Target is not { } target) return "The project has no age controls.";
        int transferred = _state.Results?.Controls.Count(c => c.Id.StartsWith(TargetAgeControls.IdPrefix, StringComparison.Ordinal)) ?? 0;
        string name = Path.GetFileName(target.Table);
        return transferred > 0
            ? $"No controls in the file: dated by {name} ({transferred} transferred ages)."
            : $"No controls in the file; a run dates the cores by {name}.";
    }

    /// <summary>Column heads; "use" says whether the age model takes the control in or leaves it out.</summary>
    public static string ListHeader() => $"{"use",-3} {"control",-10} {"kind",-8} {"where",-12} {"given",-14} {"prior 95%",-11} {"post 95%",-11} {"outl",4} flags";

    public string ListLine(AgeControlSpec a, ControlOutcome? outcome)
    {
        string where = a switch
        {
            CalendarAgeControl { Marker: string m } => "at " + m,
            CalendarAgeControl c => $"{c.Core} {FormatDepth(c.Depth)}",
            RadiocarbonAgeControl r => $"{r.Core} {FormatDepth(r.Depth)}",
            VarveCountControl v => $"{v.Core} {FormatDepth(v.AnchorDepth)}",
            _ => "",
        };
        string given = a switch
        {
            CalendarAgeControl c => $"{FormatNumber(c.Age.YearsBP)}±{FormatNumber(c.Error)} BP",
            RadiocarbonAgeControl r => $"{FormatNumber(r.C14Age.Years)}±{FormatNumber(r.C14Error)} 14C",
            VarveCountControl v => $"from {FormatNumber(v.AnchorAge.YearsBP)} BP",
            _ => "",
        };
        string range = outcome is null
            ? (_state.Results is null ? "not run yet" : "-")
            : outcome.Ranges95 ?? (Drawable(outcome) ? $"{FormatNumber(outcome.AgeLoBP)}..{FormatNumber(outcome.AgeHiBP)}" : "-");
        string posterior = outcome?.Posterior95 ?? "-";
        // The varve count that carries the chronology has no outlier share: "-".
        string share = outcome is null || double.IsNaN(outcome.OutlierShare) ? "-" : $"{Math.Round(100 * outcome.OutlierShare):0}%";
        // Sized so that the outlier share still shows at 80 columns; the flags follow on wider screens.
        return $"{(a.Exclude ? "out" : "in"),-3} {Cut(a.Id, 10),-10} {Cut(a.KindName, 8),-8} {Cut(where, 12),-12} {Cut(given, 14),-14} {Cut(range, 11),-11} "
            + $"{Cut(posterior, 11),-11} {share,4} {outcome?.Flags}";
    }

    private string FormatDepth(Quantities.CoreDepth? d) =>
        d is { } v ? FormatNumber(v.In(_state.Project.DepthUnit)) : "?";

    private static string FormatNumber(double v) =>
        v.ToString(Math.Abs(v) >= 100 ? "0" : "0.##", CultureInfo.InvariantCulture);

    // A cut text ends in a mark, so "coring-yea" is not read as a control's whole id.
    private string Cut(string s, int n) => s.Length > n ? s[..(n - 1)] + (Glyphs.Unicode ? "…" : "~") : s;
}
