namespace StratLink.Export.Svg;

/// <summary>
/// How a shape is drawn. Figures stay readable in black and white: series differ by dash pattern,
/// line width and grey level, never by colour alone.
/// </summary>
public sealed record SvgStyle
{
    public string Stroke { get; init; } = "black";
    public double StrokeWidth { get; init; } = 1;

    /// <summary>SVG dash array, e.g. <c>6 3</c>; null draws a solid line.</summary>
    public string? Dash { get; init; }

    public string Fill { get; init; } = "none";
    public double? Opacity { get; init; }

    public static readonly SvgStyle Solid = new();
    public static readonly SvgStyle Thin = new() { StrokeWidth = 0.5 };
    public static readonly SvgStyle Dashed = new() { Dash = "6 3" };
    public static readonly SvgStyle Dotted = new() { Dash = "1.5 2.5" };
    public static readonly SvgStyle Grid = new() { Stroke = "#d0d0d0", StrokeWidth = 0.5 };

    public static SvgStyle Filled(string fill) => new() { Fill = fill, Stroke = "none", StrokeWidth = 0 };
}
