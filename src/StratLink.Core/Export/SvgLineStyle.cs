namespace StratLink.Export;

/// <summary>Dash patterns, so curves stay distinct in black and white.</summary>
public enum SvgLineStyle
{
    Solid,
    Dashed,
    Dotted,
    DashDot,
}
