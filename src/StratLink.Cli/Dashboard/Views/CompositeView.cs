using StratLink.Quantities;
using System.Globalization;
using StratLink.Cli.Dashboard.Drawing;
using StratLink.Cli.Dashboard.Results;

namespace StratLink.Cli.Dashboard.Views;

/// <summary>
/// The composite with its 95 % band, one signal or every signal side by side, against composite
/// depth or age, with the splice shown as a strip naming the source core of each row, and the record
/// analysis (regime shifts, cycles) marked and listed when the run provides it. The vertical axis
/// scrolls and zooms with the keys of every plotting screen; values are drawn on a robust range.
/// </summary>
public sealed class CompositeView : DashView, INavigable
{
    private const int Axis = 7;
    private const int Strip = 2;
    private readonly DashboardState _state;
    private readonly AxisWindow _depthAxis = new();
    private readonly AxisWindow _ageAxis = new();

    public CompositeView(DashboardState state, GlyphSet glyphs) : base(glyphs) => _state = state;

    public int SignalIndex { get; private set; }
    public bool AgeAxis { get; private set; }

    /// <summary>Every signal side by side instead of one.</summary>
    public bool Stacked { get; private set; }

    /// <summary>The axis shown: composite depth, or age when switched to it.</summary>
    public AxisWindow ShownAxis => AgeAxis ? _ageAxis : _depthAxis;

    public string? NextSignal()
    {
        if (_state.Results?.Composite is not { Signals.Count: > 0 } c) return null;
        SignalIndex = (SignalIndex + 1) % c.Signals.Count;
        SetNeedsDraw();
        return c.Signals[SignalIndex].Name;
    }

    /// <summary>Switches between depth and age; returns false (and stays on depth) when there is no age model.</summary>
    public bool ToggleAxis()
    {
        var s = CurrentSignal();
        if (!AgeAxis && s?.AgeMedianBP is null) return false;
        // The cursor stays at the same place of the record across the switch.
        double? keep = s is not null && FitAxis() ? ShownAxis.Cursor : null;
        AgeAxis = !AgeAxis;
        if (keep is double k && FitAxis()) ShownAxis.MoveTo(AgeAxis ? AgeAtDepth(s!, k) : DepthAtAge(s!, k));
        SetNeedsDraw();
        return true;
    }

    /// <summary>One signal or all of them; returns whether all are shown now (false when there is only one).</summary>
    public bool ToggleStacked()
    {
        Stacked = !Stacked && _state.Results?.Composite is { Signals.Count: > 1 };
        SetNeedsDraw();
        return Stacked;
    }

    public CompositeSignal? CurrentSignal() =>
        _state.Results?.Composite is { Signals.Count: > 0 } c ? c.Signals[Math.Min(SignalIndex, c.Signals.Count - 1)] : null;

    // ---- navigation (the same keys as the logs and the ages) ---------------------------------

    public string ScaleText => $"{Number(ShownAxis.PerRow)} {(AgeAxis ? "yr" : _state.Project.DepthUnit.Symbol())} per row";

    public string JumpPrompt => AgeAxis
        ? $"Age (cal BP), or a composite depth with {_state.Project.DepthUnit.Symbol()} after it:"
        : $"Composite depth ({_state.Project.DepthUnit.Symbol()}), or an age with BP after it:";

    public void MoveCursorRows(double rows) => Navigate(a => a.MoveRows(rows));
    public void PageRows(int direction) => Navigate(a => a.Page(direction));
    public void ToEnd(bool bottom) => Navigate(a => a.ToEnd(bottom));
    public void FitAll() => Navigate(a => a.FitAll());

    public bool Zoom(bool zoomIn)
    {
        bool zoomed = false;
        Navigate(a => zoomed = a.Zoom(zoomIn));
        return zoomed;
    }

    public string? JumpTo(JumpTarget target)
    {
        if (CurrentSignal() is not { } s || !FitAxis()) return "Composite not run yet (r runs alignment, ages and composite).";
        bool wantAge = target.Axis == JumpAxis.Age || (target.Axis == JumpAxis.Shown && AgeAxis);
        if (wantAge && s.AgeMedianBP is null) return "No age model in these results: a plain number goes to a composite depth.";
        double value = target.Value;
        if (wantAge && !AgeAxis) value = DepthAtAge(s, value);
        if (!wantAge && AgeAxis) value = AgeAtDepth(s, value);
        ShownAxis.MoveTo(value);
        SetNeedsDraw();
        return null;
    }

    private void Navigate(Action<AxisWindow> move)
    {
        if (!FitAxis()) return;
        move(ShownAxis);
        SetNeedsDraw();
    }

    /// <summary>Rows of the plot: the title row above; value range, splice legend and the analysis notes below.</summary>
    private int PlotRows(CompositeRecords composite, CompositeSignal signal)
    {
        int noteRows = Math.Min(4, Math.Max(1, composite.Analysis.Count(n => n.Signal == signal.Name)));
        return Viewport.Height - 3 - noteRows;
    }

    /// <summary>Gives the shown axis the record's extent and the plot's rows; false before there is a composite.</summary>
    private bool FitAxis()
    {
        if (_state.Results?.Composite is not { } composite || CurrentSignal() is not { } signal) return false;
        double[]? y = AgeAxis ? signal.AgeMedianBP : signal.CompositeDepth;
        if (y is null) return false;
        var finite = y.Where(double.IsFinite).ToArray();
        if (finite.Length == 0) return false;
        ShownAxis.SetExtent(finite.Min(), finite.Max(), Math.Max(2, PlotRows(composite, signal)));
        return true;
    }

    // ---- drawing ----------------------------------------------------------------------------

    protected override bool OnDrawingContent(Terminal.Gui.ViewBase.DrawContext? context)
    {
        var pal = Colors;
        ClearViewport(pal.Normal);
        var vp = Viewport;
        var composite = _state.Results?.Composite;
        var signal = CurrentSignal();
        if (composite is null || signal is null)
        {
            Put(0, 0, Fit(" Composite", vp.Width), pal.Header);
            string why = _state.Results is null ? "Composite not run yet (r runs alignment, ages and composite)."
                : _state.Results.Skipped.FirstOrDefault(s => s.StartsWith("composite", StringComparison.Ordinal)) ?? "This run gave no composite.";
            Put(2, 2, why, pal.Dim, vp.Width - 2);
            return true;
        }
        if (AgeAxis && signal.AgeMedianBP is null) AgeAxis = false;
        bool byAge = AgeAxis;
        string unit = _state.Project.DepthUnit.Symbol();
        string axisName = byAge ? "age (cal BP)" : $"composite depth ({unit})";
        var shown = Stacked ? composite.Signals.ToList() : [signal];
        string names = Stacked ? "all signals" : signal.Name;
        Put(0, 0, Fit($" Composite {names} (mean and 95% band) against {axisName}", vp.Width), pal.Header);

        int rows = PlotRows(composite, signal);
        int plotLeft = Axis + Strip + 1;
        int cols = vp.Width - plotLeft - 2;
        if (rows < 2 || cols < 4 || !FitAxis()) return true;
        var axis = ShownAxis;
        double top = axis.Top, dot = axis.PerRow / 4;

        // Panels side by side, one per signal shown, sharing the vertical axis.
        int panels = shown.Count;
        int panelWidth = Math.Max(4, (cols - (panels - 1)) / panels);
        var footerRanges = new List<string>();
        for (int p = 0; p < panels && p * (panelWidth + 1) + 4 <= cols; p++)
        {
            int left = plotLeft + p * (panelWidth + 1);
            int width = Math.Min(panelWidth, cols - p * (panelWidth + 1));
            var range = DrawPanel(shown[p], byAge, top, dot, rows, left, width, pal);
            footerRanges.Add($"{shown[p].Name} {Number(range.Min)}..{Number(range.Max)}{(shown[p].Standardised ? " (z)" : "")}");
            if (!Stacked) footerRanges[^1] += $" ({range.Describe()})";
        }

        var splice = composite.Splice;
        var coreIndex = splice.Select(s => s.Core).Distinct().ToList();
        // Ages past the record's ends have no composite depth (looking one up would repeat the end core's letter).
        var ages = byAge ? Finite(signal.AgeMedianBP!).ToList() : [];
        (double youngest, double oldest) = ages.Count > 0 ? (ages.Min(), ages.Max()) : (double.NegativeInfinity, double.PositiveInfinity);
        for (int r = 0; r < rows; r++)
        {
            if (r % 4 == 0) Put(0, 1 + r, Number(top + r * 4 * dot).PadLeft(6)[^6..], pal.Dim);
            // Splice strip: the core the row's composite depth comes from.
            double rowMid = top + (r + 0.5) * 4 * dot;
            if (rowMid < youngest || rowMid > oldest) continue;
            double depthMid = byAge ? DepthAtAge(signal, rowMid) : rowMid;
            var seg = splice.FirstOrDefault(s => depthMid >= s.From && depthMid <= s.To);
            if (seg is not null)
            {
                int ci = coreIndex.IndexOf(seg.Core);
                Put(Axis, 1 + r, SpliceLabel(ci), ci % 2 == 0 ? pal.ActiveHeader : pal.CursorRow);
            }
        }
        int cursorRow = axis.RowOf(axis.Cursor);
        if (cursorRow >= 0 && cursorRow < rows) Put(6, 1 + cursorRow, Glyphs.Unicode ? "▶" : ">", pal.Strong);

        foreach (var note in composite.Analysis.Where(n => n.Signal == signal.Name && n.CompositeDepth is not null))
        {
            double at = byAge ? AgeAtDepth(signal, note.CompositeDepth!.Value) : note.CompositeDepth!.Value;
            int r = (int)Math.Floor((at - top) / (dot * 4));
            if (r >= 0 && r < rows) Put(plotLeft + cols, 1 + r, Glyphs.Unicode ? "◀" : "<", pal.SelectedTie);
        }

        int footer = rows + 1;
        string cursor = $"{(Glyphs.Unicode ? "▶" : ">")} {Number(axis.Cursor)} {(byAge ? "cal BP" : unit)}";
        Put(1, footer, cursor, pal.Strong);
        int rangesLeft = Math.Max(plotLeft, cursor.Length + 3);
        Put(rangesLeft, footer, string.Join("  ", footerRanges), pal.Dim, vp.Width - rangesLeft);
        string legend = "splice: " + string.Join(" ", coreIndex.Select((c, i) => $"{SpliceLabel(i).Trim()}={c}"));
        Put(1, footer + 1, legend, pal.Normal, vp.Width - 1);
        var notes = composite.Analysis.Where(n => n.Signal == signal.Name).ToList();
        if (notes.Count == 0)
            Put(1, footer + 2, "Cycles and regime shifts: not analysed yet (p analyses this signal).", pal.Dim, vp.Width - 1);
        for (int i = 0; i < notes.Count && footer + 2 + i < vp.Height; i++)
            Put(1, footer + 2 + i, (notes[i].CompositeDepth is null ? "  " : Glyphs.Unicode ? "◀ " : "< ") + notes[i].Text, pal.Normal, vp.Width - 1);
        return true;
    }

    /// <summary>One signal's band and mean in a panel; returns the robust range it was drawn on.</summary>
    private RobustRange DrawPanel(CompositeSignal signal, bool byAge, double top, double dot, int rows, int left, int cols, Palette pal)
    {
        double[]? y = byAge ? signal.AgeMedianBP : signal.CompositeDepth;
        var range = RobustRange.Of(signal.Mean);
        if (y is null) return range;
        var order = Enumerable.Range(0, y.Length).Where(i => !double.IsNaN(y[i])).OrderBy(i => y[i]).ToArray();
        if (order.Length == 0) return range;
        double[] ys = order.Select(i => y[i]).ToArray();
        // Nudge ties in y (equal ages) apart so the binning sees an increasing axis.
        for (int i = 1; i < ys.Length; i++) if (ys[i] <= ys[i - 1]) ys[i] = ys[i - 1] + 1e-9;
        double[] Pick(double[] a) => order.Select(i => a[i]).ToArray();
        var mean = SignalBins.FromSorted(ys, Pick(signal.Mean), top, dot, rows * 4);
        var lo = SignalBins.FromSorted(ys, Pick(signal.Lo), top, dot, rows * 4);
        var hi = SignalBins.FromSorted(ys, Pick(signal.Hi), top, dot, rows * 4);
        double vMin = range.Min, vMax = range.Max;
        int Col(double v) => Math.Clamp((int)Math.Round((v - vMin) / (vMax - vMin) * (cols - 1)), 0, cols - 1);
        for (int r = 0; r < rows; r++)
        {
            double l = double.PositiveInfinity, h = double.NegativeInfinity;
            for (int k = 0; k < 4; k++)
            {
                int b = r * 4 + k;
                if (!double.IsNaN(lo.Min[b])) l = Math.Min(l, lo.Min[b]);
                if (!double.IsNaN(hi.Max[b])) h = Math.Max(h, hi.Max[b]);
            }
            if (!double.IsInfinity(l) && !double.IsInfinity(h))
                Fill(left + Col(l), 1 + r, Col(h) - Col(l) + 1, Glyphs.Band, pal.Band);
        }
        var canvas = new DotCanvas(cols, rows);
        CurvePlotter.DrawVertical(canvas, mean, vMin, vMax, _ => false);
        PutCanvas(left, 1, canvas, pal.Curve);
        return range;
    }

    private static string SpliceLabel(int index) => ((char)('A' + index % 26)).ToString() + " ";

    private static IEnumerable<double> Finite(double[] a) => a.Where(v => !double.IsNaN(v) && !double.IsInfinity(v));

    private static double DepthAtAge(CompositeSignal s, double age) => Interpolate(s.AgeMedianBP!, s.CompositeDepth, age);

    private static double AgeAtDepth(CompositeSignal s, double depth) => Interpolate(s.CompositeDepth, s.AgeMedianBP!, depth);

    /// <summary>Linear interpolation in a table whose x column increases (composite grid, ages along it).</summary>
    private static double Interpolate(double[] xs, double[] ys, double x)
    {
        int i = SignalBins.LowerBound(xs, x);
        if (i <= 0) return ys[0];
        if (i >= xs.Length) return ys[^1];
        double dx = xs[i] - xs[i - 1];
        return dx > 0 ? ys[i - 1] + (ys[i] - ys[i - 1]) * (x - xs[i - 1]) / dx : ys[i];
    }

    private static string Number(double v) => v.ToString(Math.Abs(v) >= 100 ? "0" : "0.##", CultureInfo.InvariantCulture);
}
