namespace StratLink.Cli.Dashboard.Drawing;

/// <summary>
/// How much colour the dashboard uses: the sixteen named terminal colours (what every colour
/// terminal and the toolkit's 16-colour output can show), or none at all, with bold, underline and
/// reverse video as the only emphasis. Every meaning is carried by a glyph or a word as well, so
/// monochrome loses nothing but looks.
/// </summary>
public enum ColourMode
{
    Sixteen,
    Monochrome,
}

public static class ColourModes
{
    /// <summary>
    /// Monochrome when NO_COLOR is set to anything non-empty (the convention of no-color.org),
    /// otherwise the sixteen named colours.
    /// </summary>
    public static ColourMode FromEnvironment(Func<string, string?> getEnv) =>
        string.IsNullOrEmpty(getEnv("NO_COLOR")) ? ColourMode.Sixteen : ColourMode.Monochrome;
}
