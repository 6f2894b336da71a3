using System.Xml.Linq;

namespace StratLink.Export.Svg;

/// <summary>
/// One panel of a figure described declaratively: lines, shaded bands, vertical markers and spans, a
/// legend, and axes with ticks and titles (units in the title). Drawn through <see cref="PlotArea"/> and
/// <see cref="SvgCanvas"/> in <see cref="SvgStyle"/> styles; several panels stack with <see cref="Stack"/>.
/// </summary>
public sealed class SvgPlot
{
    private const double MarginLeft = 72, MarginRight = 16, MarginTop = 28, MarginBottom = 46;

    private readonly List<Action<PlotArea, XElement>> _layers = [];
    private readonly List<(string Label, SvgStyle Style)> _legend = [];
    private readonly List<double> _xs = [], _ys = [];

    public SvgPlot(string xLabel, string yLabel)
    {
        XLabel = xLabel;
        YLabel = yLabel;
    }

    public string XLabel { get; }
    public string YLabel { get; }
    public string? Title { get; init; }
    public bool LogX { get; init; }
    public bool LogY { get; init; }

    /// <summary>Draw the x axis from high to low values (e.g. age, oldest on the left).</summary>
    public bool ReverseX { get; init; }

    public double? XMin { get; init; }
    public double? XMax { get; init; }
    public double? YMin { get; init; }
    public double? YMax { get; init; }

    public SvgPlot Line(IReadOnlyList<double> x, IReadOnlyList<double> y, string? label, SvgStyle style)
    {
        Extend(x, y);
        _layers.Add((area, g) => area.Canvas.Path(area.Series(x, y), style, parent: g));
        if (label is not null) _legend.Add((label, style));
        return this;
    }

    /// <summary>Shaded area between <paramref name="lo"/> and <paramref name="hi"/> (NaN breaks it).</summary>
    public SvgPlot Band(IReadOnlyList<double> x, IReadOnlyList<double> lo, IReadOnlyList<double> hi, string? label, string fill = SvgStyle.BandGrey)
    {
        Extend(x, lo);
        Extend(x, hi);
        var style = SvgStyle.Filled(fill);
        _layers.Add((area, g) => area.Canvas.Path(area.BandOutline(x, lo, hi), style, parent: g, close: true));
        if (label is not null) _legend.Add((label, style));
        return this;
    }

    /// <summary>A shaded vertical span from <paramref name="x1"/> to <paramref name="x2"/> over the full height, behind everything else.</summary>
    public SvgPlot VerticalSpan(double x1, double x2, string? label, string fill = SvgStyle.SpanGrey)
    {
        Extend([x1, x2], []);
        var style = SvgStyle.Filled(fill);
        _layers.Insert(0, (area, g) =>
        {
            double a = area.Px(x1), b = area.Px(x2);
            area.Canvas.Rect(Math.Min(a, b), area.Top, Math.Max(Math.Abs(b - a), 1), area.Height, style, parent: g);
        });
        if (label is not null) _legend.Add((label, style));
        return this;
    }

    /// <summary>A vertical line at <paramref name="x"/> with a short text written upwards beside its top end.</summary>
    public SvgPlot VerticalMarker(double x, string? text, SvgStyle style)
    {
        Extend([x], []);
        _layers.Add((area, g) =>
        {
            double px = area.Px(x);
            area.Canvas.Line(px, area.Top, px, area.Bottom, style with { StrokeWidth = 0.8 }, "marker", parent: g);
            if (text is not null) area.Canvas.Text(px - 3, area.Top + 4, text, "end", -90, "marker-label", g, fontSize: 10);
        });
        return this;
    }

    /// <summary>The panels stacked top to bottom in one drawing, each <paramref name="panelHeight"/> pixels high.</summary>
    public static SvgCanvas Stack(IReadOnlyList<SvgPlot> panels, string title, double width = 800, double panelHeight = 320)
    {
        var canvas = new SvgCanvas(width, panelHeight * panels.Count, title);
        for (int i = 0; i < panels.Count; i++) panels[i].Render(canvas, i * panelHeight, width, panelHeight, $"panel{i}");
        return canvas;
    }

    /// <summary>Draws the panel into the full-width box from <paramref name="top"/> down.</summary>
    private void Render(SvgCanvas canvas, double top, double width, double height, string id)
    {
        double plotHeight = height - MarginTop - MarginBottom;
        var x = Pick(XMin, XMax, PlotArea.Extent(_xs, LogX));
        var yData = Pick(YMin, YMax, PlotArea.Extent(_ys, LogY));
        // Pad y to whole ticks so the curves never touch the frame between labels.
        var y = YMin is not null && YMax is not null || !(yData.Max >= yData.Min)
            ? yData
            : AxisTicks.PadToTicks(yData.Min, yData.Max, LogY, PlotArea.YTicksFor(plotHeight));
        var area = new PlotArea(canvas, MarginLeft, top + MarginTop, width - MarginLeft - MarginRight, plotHeight, x, y,
            xReversed: ReverseX, logX: LogX, logY: LogY);
        var panel = canvas.Group("panel", id);
        if (Title is not null)
            canvas.Text(area.Left, top + 18, Title, cssClass: "title", parent: panel, fontSize: 14).SetAttributeValue("font-weight", "bold");
        var data = area.ClippedGroup(id + "-clip", panel);
        foreach (var layer in _layers) layer(area, data);
        area.DrawAxes(XLabel, YLabel, grid: false, parent: panel);
        Legend(area, panel);
    }

    private static (double Min, double Max) Pick(double? min, double? max, (double Min, double Max) data) => (min ?? data.Min, max ?? data.Max);

    /// <summary>A boxed legend in the top right corner of the plot area.</summary>
    private void Legend(PlotArea area, XElement panel)
    {
        if (_legend.Count == 0) return;
        var canvas = area.Canvas;
        var g = canvas.Group("legend", parent: panel);
        double w = 46 + _legend.Max(l => SvgCanvas.TextWidth(l.Label)), h = 8 + 16 * _legend.Count;
        double x = area.Right - w - 6, y = area.Top + 6;
        canvas.Rect(x, y, w, h, new SvgStyle { Fill = "white", StrokeWidth = 0.5, Opacity = 0.9 }, parent: g);
        for (int i = 0; i < _legend.Count; i++) canvas.Key(x + 6, y + 16 + 16 * i, _legend[i].Style, _legend[i].Label, g);
    }

    private void Extend(IReadOnlyList<double> x, IReadOnlyList<double> y)
    {
        _xs.AddRange(x);
        _ys.AddRange(y);
    }
}
