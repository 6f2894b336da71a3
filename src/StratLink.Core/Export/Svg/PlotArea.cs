using System.Xml.Linq;

namespace StratLink.Export.Svg;

/// <summary>
/// A rectangle of a canvas with a data range on each axis: maps data to pixels and draws the frame,
/// ticks and axis labels (with units). The y axis may run downwards, as depth does in core logs.
/// </summary>
public sealed class PlotArea
{
    public PlotArea(SvgCanvas canvas, double left, double top, double width, double height,
        (double Min, double Max) x, (double Min, double Max) y, bool yDownward = false)
    {
        Canvas = canvas;
        Left = left;
        Top = top;
        Width = width;
        Height = height;
        X = Widen(x);
        Y = Widen(y);
        YDownward = yDownward;
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

    public double Px(double x) => Left + (x - X.Min) / (X.Max - X.Min) * Width;

    public double Py(double y) => YDownward
        ? Top + (y - Y.Min) / (Y.Max - Y.Min) * Height
        : Bottom - (y - Y.Min) / (Y.Max - Y.Min) * Height;

    /// <summary>Frame, ticks with labels on the left and bottom, light grid lines, and the axis titles.</summary>
    /// <param name="yTickTarget">About how many y ticks; by default one per 50 pixels.</param>
    public XElement DrawAxes(string xLabel, string yLabel, bool grid = true, int? yTickTarget = null)
    {
        var g = Canvas.Group("axes");
        var xt = AxisTicks.Nice(X.Min, X.Max, Math.Max(2, (int)(Width / 80)));
        var yt = AxisTicks.Nice(Y.Min, Y.Max, yTickTarget ?? Math.Max(2, (int)(Height / 50)));
        double xs = xt.Count > 1 ? xt[1] - xt[0] : 1, ys = yt.Count > 1 ? yt[1] - yt[0] : 1;
        foreach (double t in xt)
        {
            double px = Px(t);
            if (grid) Canvas.Line(px, Top, px, Bottom, SvgStyle.Grid, parent: g);
            Canvas.Line(px, Bottom, px, Bottom + 4, SvgStyle.Solid, parent: g);
            Canvas.Text(px, Bottom + 15, AxisTicks.Label(t, xs), "middle", parent: g);
        }
        foreach (double t in yt)
        {
            double py = Py(t);
            if (grid) Canvas.Line(Left, py, Right, py, SvgStyle.Grid, parent: g);
            Canvas.Line(Left - 4, py, Left, py, SvgStyle.Solid, parent: g);
            Canvas.Text(Left - 6, py + 4, AxisTicks.Label(t, ys), "end", parent: g);
        }
        Canvas.Rect(Left, Top, Width, Height, SvgStyle.Solid, "frame", parent: g);
        Canvas.Text(Left + Width / 2, Bottom + 32, xLabel, "middle", cssClass: "axis-label", parent: g);
        Canvas.Text(Left - 46, Top + Height / 2, yLabel, "middle", -90, "axis-label", g);
        return g;
    }

    /// <summary>Ticks, labels and title of the y axis alone, on the left edge (for panels of several columns).</summary>
    public XElement DrawLeftAxis(string yLabel)
    {
        var g = Canvas.Group("axes");
        var yt = AxisTicks.Nice(Y.Min, Y.Max, Math.Max(2, (int)(Height / 50)));
        double ys = yt.Count > 1 ? yt[1] - yt[0] : 1;
        Canvas.Line(Left, Top, Left, Bottom, SvgStyle.Solid, parent: g);
        foreach (double t in yt)
        {
            double py = Py(t);
            Canvas.Line(Left - 4, py, Left, py, SvgStyle.Solid, parent: g);
            Canvas.Text(Left - 6, py + 4, AxisTicks.Label(t, ys), "end", parent: g);
        }
        Canvas.Text(Left - 46, Top + Height / 2, yLabel, "middle", -90, "axis-label", g);
        return g;
    }

    private static (double, double) Widen((double Min, double Max) r)
    {
        if (!double.IsFinite(r.Min) || !double.IsFinite(r.Max)) return (0, 1);
        if (r.Max > r.Min) return r;
        double pad = Math.Abs(r.Min) > 0 ? Math.Abs(r.Min) * 0.05 : 0.5;
        return (r.Min - pad, r.Max + pad);
    }
}
