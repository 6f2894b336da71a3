using System.Xml.Linq;

namespace StratLink.Export.Svg;

/// <summary>
/// A rectangle of a canvas with a data range on each axis: maps data to pixels and draws the frame,
/// ticks and axis labels (with units). Either axis may be logarithmic; the x axis may run from high to
/// low values (age, oldest on the left) and the y axis downwards (depth, as in core logs).
/// </summary>
public sealed class PlotArea
{
    public PlotArea(SvgCanvas canvas, double left, double top, double width, double height,
        (double Min, double Max) x, (double Min, double Max) y, bool yDownward = false,
        bool xReversed = false, bool logX = false, bool logY = false)
    {
        Canvas = canvas;
        Left = left;
        Top = top;
        Width = width;
        Height = height;
        LogX = logX;
        LogY = logY;
        X = Widen(x, logX);
        Y = Widen(y, logY);
        YDownward = yDownward;
        XReversed = xReversed;
    }

    public SvgCanvas Canvas { get; }
    public double Left { get; }
    public double Top { get; }
    public double Width { get; }
    public double Height { get; }
    public double Right => Left + Width;
    public double Bottom => Top + Height;
    public (double Min, double Max) X { get; }
    public (double Min, double Max) Y { get; }
    public bool YDownward { get; }
    public bool XReversed { get; }
    public bool LogX { get; }
    public bool LogY { get; }

    public double Px(double x)
    {
        double u = Fraction(x, X, LogX);
        return Left + Width * (XReversed ? 1 - u : u);
    }

    public double Py(double y)
    {
        double u = Fraction(y, Y, LogY);
        return YDownward ? Top + u * Height : Bottom - u * Height;
    }

    /// <summary>Whether a data point can be drawn: finite, and positive on a logarithmic axis.</summary>
    public bool Usable(double x, double y) => double.IsFinite(x) && double.IsFinite(y) && (!LogX || x > 0) && (!LogY || y > 0);

    /// <summary>The points in pixels, a NaN point wherever a value cannot be drawn (so <see cref="SvgCanvas.Path"/> lifts the pen).</summary>
    public IEnumerable<(double X, double Y)> Series(IReadOnlyList<double> x, IReadOnlyList<double> y)
    {
        for (int i = 0; i < x.Count; i++)
            yield return Usable(x[i], y[i]) ? (Px(x[i]), Py(y[i])) : (double.NaN, double.NaN);
    }

    /// <summary>
    /// Outline of the area between <paramref name="lo"/> and <paramref name="hi"/>, one closed sub-path per run of
    /// drawable rows (along the top edge, then back along the bottom edge); draw with <c>close: true</c>.
    /// </summary>
    public IEnumerable<(double X, double Y)> BandOutline(IReadOnlyList<double> x, IReadOnlyList<double> lo, IReadOnlyList<double> hi)
    {
        int r = 0;
        while (r < x.Count)
        {
            if (!Usable(x[r], lo[r]) || !Usable(x[r], hi[r])) { r++; continue; }
            int start = r;
            while (r < x.Count && Usable(x[r], lo[r]) && Usable(x[r], hi[r])) r++;
            if (r - start < 2) continue;
            for (int k = start; k < r; k++) yield return (Px(x[k]), Py(hi[k]));
            for (int k = r - 1; k >= start; k--) yield return (Px(x[k]), Py(lo[k]));
            yield return (double.NaN, double.NaN);
        }
    }

    /// <summary>A group whose content is clipped to the plot area.</summary>
    public XElement ClippedGroup(string clipId, XElement? parent = null)
    {
        var g = Canvas.Group(parent: parent);
        g.Add(new XAttribute("clip-path", Canvas.ClipRect(clipId, Left, Top, Width, Height)));
        return g;
    }

    /// <summary>Frame, ticks with labels on the left and bottom, light grid lines when asked, and the axis titles.</summary>
    /// <param name="yTickTarget">About how many y ticks; by default one per 50 pixels.</param>
    public XElement DrawAxes(string xLabel, string yLabel, bool grid = true, int? yTickTarget = null, XElement? parent = null)
    {
        var g = Canvas.Group("axes", parent: parent);
        foreach (var t in AxisTicks.For(X, LogX, XTickTarget))
        {
            double px = Px(t.Value);
            if (grid) Canvas.Line(px, Top, px, Bottom, SvgStyle.Grid, parent: g);
            Canvas.Line(px, Bottom, px, Bottom + 4, SvgStyle.Solid, parent: g);
            TickLabel(px, Bottom + 15, t, "middle", g);
        }
        DrawYTicks(g, grid, yTickTarget ?? YTickTarget);
        Canvas.Rect(Left, Top, Width, Height, SvgStyle.Solid, "frame", parent: g);
        Canvas.Text(Left + Width / 2, Bottom + 32, xLabel, "middle", cssClass: "axis-label", parent: g, fontSize: 12);
        YTitle(yLabel, g);
        return g;
    }

    /// <summary>Ticks, labels and title of the y axis alone, on the left edge (for panels of several columns).</summary>
    public XElement DrawLeftAxis(string yLabel)
    {
        var g = Canvas.Group("axes");
        Canvas.Line(Left, Top, Left, Bottom, SvgStyle.Solid, parent: g);
        DrawYTicks(g, grid: false, YTickTarget);
        YTitle(yLabel, g);
        return g;
    }

    /// <summary>Ticks the x axis would get: about one per 80 pixels.</summary>
    public int XTickTarget => Math.Max(2, (int)(Width / 80));

    /// <summary>Ticks the y axis gets by default: about one per 50 pixels.</summary>
    public int YTickTarget => YTicksFor(Height);

    public static int YTicksFor(double heightPx) => Math.Max(2, (int)(heightPx / 50));

    /// <summary>The finite values' smallest and largest (positive ones only when <paramref name="positiveOnly"/>); (+inf, -inf) when there are none.</summary>
    public static (double Min, double Max) Extent(IEnumerable<double> values, bool positiveOnly = false)
    {
        double min = double.PositiveInfinity, max = double.NegativeInfinity;
        foreach (double v in values)
        {
            if (!double.IsFinite(v) || (positiveOnly && v <= 0)) continue;
            if (v < min) min = v;
            if (v > max) max = v;
        }
        return (min, max);
    }

    private void DrawYTicks(XElement g, bool grid, int target)
    {
        foreach (var t in AxisTicks.For(Y, LogY, target))
        {
            double py = Py(t.Value);
            if (grid) Canvas.Line(Left, py, Right, py, SvgStyle.Grid, parent: g);
            Canvas.Line(Left - 4, py, Left, py, SvgStyle.Solid, parent: g);
            TickLabel(Left - 6, py + 4, t, "end", g);
        }
    }

    private void TickLabel(double x, double y, AxisTick tick, string anchor, XElement g)
    {
        var text = Canvas.Text(x, y, tick.Label, anchor, parent: g);
        if (tick.Superscript is not null)
            text.Add(new XElement(SvgCanvas.Ns + "tspan", new XAttribute("dy", "-5"), new XAttribute("font-size", "8"), tick.Superscript));
    }

    private void YTitle(string yLabel, XElement g) =>
        Canvas.Text(Left - 50, Top + Height / 2, yLabel, "middle", -90, "axis-label", g, fontSize: 12);

    private static double Fraction(double v, (double Min, double Max) r, bool log) => log
        ? (Math.Log10(v) - Math.Log10(r.Min)) / (Math.Log10(r.Max) - Math.Log10(r.Min))
        : (v - r.Min) / (r.Max - r.Min);

    /// <summary>A usable range: (0, 1) or (1, 10) without data, a single value widened around itself.</summary>
    private static (double, double) Widen((double Min, double Max) r, bool log)
    {
        bool usable = double.IsFinite(r.Min) && double.IsFinite(r.Max) && (!log || r.Min > 0);
        if (!usable) return log ? (1, 10) : (0, 1);
        if (r.Max > r.Min) return r;
        if (log) return (r.Min / 10, r.Max * 10);
        double pad = Math.Abs(r.Min) > 0 ? Math.Abs(r.Min) * 0.05 : 0.5;
        return (r.Min - pad, r.Max + pad);
    }
}
