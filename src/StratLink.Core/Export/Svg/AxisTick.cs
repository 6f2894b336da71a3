namespace StratLink.Export.Svg;

/// <summary>One tick of an axis: where it stands, its label, and an exponent written raised after the label (<c>10</c> with <c>-6</c>).</summary>
public readonly record struct AxisTick(double Value, string Label, string? Superscript = null);
