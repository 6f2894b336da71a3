namespace StratLink.Export.Svg;

/// <summary>
/// How a shape is drawn. Figures stay readable in black and white: series differ by dash pattern,
/// line width and grey level, never by colour alone. The named dash patterns and greys are the
/// vocabulary every figure draws from.
/// </summary>
public sealed record SvgStyle
{
    /// <summary>Filled areas: confidence bands.</summary>
    public const string BandGrey = "#c8c8c8";

    /// <summary>Shaded spans behind the data: age ranges.</summary>
    public const string SpanGrey = "#dcdcdc";

    /// <summary>Flagged intervals: disturbed sediment.</summary>
    public const string PaleGrey = "#e4e4e4";

    /// <summary>A raw record behind its smoothed or fitted version.</summary>
    public const string MidGrey = "#777777";

    /// <summary>A secondary line that must still read as a line: the higher significance level, hatching.</summary>
    public const string DarkGrey = "#555555";

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
    public static readonly SvgStyle DashDot = new() { Dash = "8 3 2 3" };
    public static readonly SvgStyle Grid = new() { Stroke = "#d0d0d0", StrokeWidth = 0.5 };

    public static SvgStyle Filled(string fill) => new() { Fill = fill, Stroke = "none", StrokeWidth = 0 };

    /// <summary>True when the shape is an area (drawn with a fill) rather than a line.</summary>
    public bool IsArea => Fill != "none";
}
