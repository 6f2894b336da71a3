using System.Globalization;
using System.Text;
using System.Xml.Linq;
using StratLink.ProjectIO;

namespace StratLink.Export.Svg;

/// <summary>
/// A plain SVG 1.1 drawing built as XML (so it is always well formed), in pixel coordinates with y
/// downwards. Shapes take an optional CSS class and id so tests and style sheets can find them.
/// </summary>
public sealed class SvgCanvas
{
    public static readonly XNamespace Ns = "http://www.w3.org/2000/svg";

    private readonly XElement _root;
    private readonly XElement _defs;

    public SvgCanvas(double width, double height, string title)
    {
        Width = width;
        Height = height;
        _defs = new XElement(Ns + "defs");
        _root = new XElement(Ns + "svg",
            new XAttribute("width", Num(width)),
            new XAttribute("height", Num(height)),
            new XAttribute("viewBox", $"0 0 {Num(width)} {Num(height)}"),
            new XAttribute("font-family", "sans-serif"),
            new XAttribute("font-size", "11"),
            new XElement(Ns + "title", title),
            _defs,
            new XElement(Ns + "rect", new XAttribute("width", "100%"), new XAttribute("height", "100%"), new XAttribute("fill", "white")));
        Root = _root;
    }

    public double Width { get; }
    public double Height { get; }

    /// <summary>The element new shapes go into unless a group is given.</summary>
    public XElement Root { get; }

    /// <summary>A group (&lt;g&gt;) under <paramref name="parent"/> (the root when null).</summary>
    public XElement Group(string? cssClass = null, string? id = null, XElement? parent = null)
    {
        var g = Tagged(new XElement(Ns + "g"), cssClass, id);
        (parent ?? _root).Add(g);
        return g;
    }

    /// <summary>Defines a diagonal hatch fill usable as <c>url(#id)</c>: grey lines on white, readable in print.</summary>
    public string HatchPattern(string id, double spacing = 5, string stroke = SvgStyle.DarkGrey)
    {
        _defs.Add(new XElement(Ns + "pattern",
            new XAttribute("id", id),
            new XAttribute("patternUnits", "userSpaceOnUse"),
            new XAttribute("width", Num(spacing)),
            new XAttribute("height", Num(spacing)),
            new XAttribute("patternTransform", "rotate(45)"),
            new XElement(Ns + "rect", new XAttribute("width", Num(spacing)), new XAttribute("height", Num(spacing)), new XAttribute("fill", "white")),
            new XElement(Ns + "line", new XAttribute("x1", "0"), new XAttribute("y1", "0"), new XAttribute("x2", "0"), new XAttribute("y2", Num(spacing)),
                new XAttribute("stroke", stroke), new XAttribute("stroke-width", "1"))));
        return $"url(#{id})";
    }

    /// <summary>Defines a rectangular clip path; returns the value for a <c>clip-path</c> attribute.</summary>
    public string ClipRect(string id, double x, double y, double width, double height)
    {
        _defs.Add(new XElement(Ns + "clipPath", new XAttribute("id", id),
            new XElement(Ns + "rect", new XAttribute("x", Num(x)), new XAttribute("y", Num(y)), new XAttribute("width", Num(width)), new XAttribute("height", Num(height)))));
        return $"url(#{id})";
    }

    /// <summary>
    /// A legend key with its baseline at <paramref name="y"/>: a short line in the style, or a box when the style
    /// fills, then the label. Returns where the next key of a row may start.
    /// </summary>
    public double Key(double x, double y, SvgStyle style, string label, XElement? parent = null, double swatchWidth = 24)
    {
        if (style.IsArea) Rect(x, y - 8, swatchWidth, 10, style, parent: parent);
        else Line(x, y - 4, x + swatchWidth, y - 4, style, parent: parent);
        Text(x + swatchWidth + 6, y, label, parent: parent);
        return x + swatchWidth + 6 + TextWidth(label) + 24;
    }

    /// <summary>Rough width of a label at the default 11-pixel sans-serif font, for laying out legends.</summary>
    public static double TextWidth(string text) => 6.2 * text.Length;

    public XElement Line(double x1, double y1, double x2, double y2, SvgStyle style, string? cssClass = null, string? id = null, XElement? parent = null) =>
        Add(new XElement(Ns + "line",
            new XAttribute("x1", Num(x1)), new XAttribute("y1", Num(y1)), new XAttribute("x2", Num(x2)), new XAttribute("y2", Num(y2))), style, cssClass, id, parent);

    public XElement Rect(double x, double y, double width, double height, SvgStyle style, string? cssClass = null, string? id = null, XElement? parent = null) =>
        Add(new XElement(Ns + "rect",
            new XAttribute("x", Num(x)), new XAttribute("y", Num(y)), new XAttribute("width", Num(Math.Max(0, width))), new XAttribute("height", Num(Math.Max(0, height)))),
            style, cssClass, id, parent);

    /// <summary>
    /// One &lt;path&gt; through the points; a point with a NaN coordinate lifts the pen, so a series with
    /// holes stays one element. <paramref name="close"/> closes every sub-path (filled areas).
    /// </summary>
    public XElement Path(IEnumerable<(double X, double Y)> points, SvgStyle style, string? cssClass = null, string? id = null, XElement? parent = null, bool close = false) =>
        Add(new XElement(Ns + "path", new XAttribute("d", PathData(points, close))), style, cssClass, id, parent);

    public XElement Text(double x, double y, string text, string anchor = "start", double rotateDegrees = 0, string? cssClass = null, XElement? parent = null, double? fontSize = null)
    {
        var t = new XElement(Ns + "text", new XAttribute("x", Num(x)), new XAttribute("y", Num(y)), text);
        if (anchor != "start") t.Add(new XAttribute("text-anchor", anchor));
        if (rotateDegrees != 0) t.Add(new XAttribute("transform", $"rotate({Num(rotateDegrees)} {Num(x)} {Num(y)})"));
        if (fontSize is double size) t.Add(new XAttribute("font-size", Num(size)));
        Tagged(t, cssClass, null);
        (parent ?? _root).Add(t);
        return t;
    }

    public XDocument ToDocument() => new(new XDeclaration("1.0", "utf-8", null), new XElement(_root));

    /// <summary>The whole document as UTF-8 XML text, declaration first.</summary>
    public string ToXml()
    {
        var doc = ToDocument();
        return doc.Declaration + "\n" + doc.Root + "\n";
    }

    /// <summary>Writes the drawing through <see cref="AtomicFile"/>, so a reader never sees half a figure.</summary>
    public void Save(string path) => AtomicFile.WriteAllText(path, ToXml(), keepBackup: false);

    /// <summary>Coordinates with two decimals: a hundredth of a pixel, invariant culture.</summary>
    public static string Num(double v) => Math.Round(v, 2).ToString("0.##", CultureInfo.InvariantCulture);

    private static string PathData(IEnumerable<(double X, double Y)> points, bool close)
    {
        var sb = new StringBuilder();
        bool penDown = false;
        foreach (var (x, y) in points)
        {
            if (double.IsNaN(x) || double.IsNaN(y))
            {
                if (penDown && close) sb.Append('Z');
                penDown = false;
                continue;
            }
            sb.Append(penDown ? 'L' : 'M').Append(Num(x)).Append(',').Append(Num(y));
            penDown = true;
        }
        if (penDown && close) sb.Append('Z');
        return sb.ToString();
    }

    private XElement Add(XElement e, SvgStyle style, string? cssClass, string? id, XElement? parent)
    {
        e.Add(new XAttribute("fill", style.Fill));
        e.Add(new XAttribute("stroke", style.Stroke));
        if (style.StrokeWidth != 1) e.Add(new XAttribute("stroke-width", Num(style.StrokeWidth)));
        if (style.Dash is not null) e.Add(new XAttribute("stroke-dasharray", style.Dash));
        if (style.Opacity is double o) e.Add(new XAttribute("opacity", Num(o)));
        Tagged(e, cssClass, id);
        (parent ?? _root).Add(e);
        return e;
    }

    private static XElement Tagged(XElement e, string? cssClass, string? id)
    {
        if (cssClass is not null) e.Add(new XAttribute("class", cssClass));
        if (id is not null) e.Add(new XAttribute("id", id));
        return e;
    }
}
