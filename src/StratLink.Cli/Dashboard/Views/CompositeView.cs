using StratLink.Quantities;
using System.Globalization;
using StratLink.Cli.Dashboard.Drawing;
using StratLink.Cli.Dashboard.Results;

namespace StratLink.Cli.Dashboard.Views;

/// <summary>
/// One signal's composite with its band, against composite depth or age, with the splice shown as
/// a strip naming the source core of each row, and the record analysis (regime shifts, cycles)
/// marked and listed when the run provides it.
/// </summary>
public sealed class CompositeView : DashView
{
    private const int Axis = 7;
    private const int Strip = 2;
    private readonly DashboardState _state;

    public CompositeView(DashboardState state, GlyphSet glyphs) : base(glyphs) => _state = state;

    public int SignalIndex { get; private set; }
    public bool AgeAxis { get; private set; }

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
        AgeAxis = !AgeAxis;
        SetNeedsDraw();
        return true;
    }

    public CompositeSignal? CurrentSignal() =>
        _state.Results?.Composite is { Signals.Count: > 0 } c ? c.Signals[Math.Min(SignalIndex, c.Signals.Count - 1)] : null;

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
        bool byAge = AgeAxis && signal.AgeMedianBP is not null;
        string unit = _state.Project.DepthUnit.Symbol();
        string axisName = byAge ? "age (cal BP)" : $"composite depth ({unit})";
        Put(0, 0, Fit($" Composite {signal.Name} (mean and 95% band) against {axisName}", vp.Width), pal.Header);

        int noteRows = Math.Min(4, Math.Max(1, composite.Analysis.Count(n => n.Signal == signal.Name)));
        // Title row above; value range, splice legend and the analysis notes below.
        int rows = vp.Height - 3 - noteRows;
        int plotLeft = Axis + Strip + 1;
        int cols = vp.Width - plotLeft - 2;
        if (rows < 2 || cols < 4) return true;

        double[] y = byAge ? signal.AgeMedianBP! : signal.CompositeDepth;
        var order = Enumerable.Range(0, y.Length).Where(i => !double.IsNaN(y[i])).OrderBy(i => y[i]).ToArray();
        if (order.Length == 0) return true;
        double[] ys = order.Select(i => y[i]).ToArray();
        double top = ys[0], bottom = ys[^1];
        if (!(bottom > top)) bottom = top + 1;
        double dot = (bottom - top) / (rows * 4);
        // Nudge ties in y (equal ages) apart so the binning sees an increasing axis.
        for (int i = 1; i < ys.Length; i++) if (ys[i] <= ys[i - 1]) ys[i] = ys[i - 1] + 1e-9;

        double[] Pick(double[] a) => order.Select(i => a[i]).ToArray();
        var mean = SignalBins.FromSorted(ys, Pick(signal.Mean), top, dot, rows * 4);
        var lo = SignalBins.FromSorted(ys, Pick(signal.Lo), top, dot, rows * 4);
        var hi = SignalBins.FromSorted(ys, Pick(signal.Hi), top, dot, rows * 4);
        double vMin = Finite(signal.Lo).DefaultIfEmpty(0).Min(), vMax = Finite(signal.Hi).DefaultIfEmpty(1).Max();
        if (!(vMax > vMin)) vMax = vMin + 1;
        int Col(double v) => Math.Clamp((int)Math.Round((v - vMin) / (vMax - vMin) * (cols - 1)), 0, cols - 1);

        var splice = composite.Splice;
        var coreIndex = splice.Select(s => s.Core).Distinct().ToList();
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
                Fill(plotLeft + Col(l), 1 + r, Col(h) - Col(l) + 1, Glyphs.Band, pal.Band);
            if (r % 4 == 0) Put(0, 1 + r, Number(top + r * 4 * dot).PadLeft(6)[^6..], pal.Dim);

            // Splice strip: the core the row's composite depth comes from.
            double rowMid = top + (r + 0.5) * 4 * dot;
            double depthMid = byAge ? DepthAtAge(signal, rowMid) : rowMid;
            var seg = splice.FirstOrDefault(s => depthMid >= s.From && depthMid <= s.To);
            if (seg is not null)
            {
                int ci = coreIndex.IndexOf(seg.Core);
                Put(Axis, 1 + r, SpliceLabel(ci), ci % 2 == 0 ? pal.ActiveHeader : pal.CursorRow);
            }
        }
        var canvas = new DotCanvas(cols, rows);
        CurvePlotter.DrawVertical(canvas, mean, vMin, vMax, _ => false);
        PutCanvas(plotLeft, 1, canvas, pal.Curve);

        foreach (var note in composite.Analysis.Where(n => n.Signal == signal.Name && n.CompositeDepth is not null))
        {
            double at = byAge ? AgeAtDepth(signal, note.CompositeDepth!.Value) : note.CompositeDepth!.Value;
            int r = (int)((at - top) / (dot * 4));
            if (r >= 0 && r < rows) Put(plotLeft + cols, 1 + r, Glyphs.Unicode ? "◀" : "<", pal.SelectedTie);
        }

        int footer = rows + 1;
        Put(plotLeft, footer, $"{Number(vMin)} .. {Number(vMax)} {signal.Name}{(signal.Standardised ? " (z-score)" : "")}", pal.Dim, cols);
        string legend = "splice: " + string.Join(" ", coreIndex.Select((c, i) => $"{SpliceLabel(i).Trim()}={c}"));
        Put(1, footer + 1, legend, pal.Normal, vp.Width - 1);
        var notes = composite.Analysis.Where(n => n.Signal == signal.Name).ToList();
        if (notes.Count == 0)
            Put(1, footer + 2, "Cycles and regime shifts: not analysed yet (p analyses this signal).", pal.Dim, vp.Width - 1);
        for (int i = 0; i < notes.Count && footer + 2 + i < vp.Height; i++)
            Put(1, footer + 2 + i, (notes[i].CompositeDepth is null ? "  " : Glyphs.Unicode ? "◀ " : "< ") + notes[i].Text, pal.Normal, vp.Width - 1);
        return true;
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
