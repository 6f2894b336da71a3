using StratLink.Cli.Dashboard.Drawing;
using Terminal.Gui.Drawing;
using Attribute = Terminal.Gui.Drawing.Attribute;

namespace StratLink.Cli.Dashboard.Views;

/// <summary>
/// The dashboard's colours, all on the theme's normal background so they read on dark and light
/// terminals; only the sixteen named colours, or none in <see cref="ColourMode.Monochrome"/>.
/// </summary>
public sealed record Palette
{
    public required Attribute Normal { get; init; }
    public required Attribute Dim { get; init; }
    public required Attribute Strong { get; init; }
    public required Attribute Curve { get; init; }
    public required Attribute Band { get; init; }
    public required Attribute Gap { get; init; }
    public required Attribute Disturbed { get; init; }
    public required Attribute Tie { get; init; }
    public required Attribute SelectedTie { get; init; }
    public required Attribute Alignment { get; init; }
    public required Attribute CursorRow { get; init; }
    public required Attribute Header { get; init; }
    public required Attribute ActiveHeader { get; init; }
    public required Attribute Warning { get; init; }
    public required Attribute Error { get; init; }

    public static Palette From(Attribute normal, ColourMode mode = ColourMode.Sixteen) =>
        mode == ColourMode.Monochrome ? Monochrome(normal) : Sixteen(normal);

    private static Palette Monochrome(Attribute normal)
    {
        Color fg = normal.Foreground, bg = normal.Background;
        Attribute Styled(TextStyle style) => new(fg, bg, style);
        return new Palette
        {
            Normal = normal,
            Dim = normal,
            Strong = Styled(TextStyle.Bold),
            Curve = normal,
            Band = normal,
            Gap = normal,
            Disturbed = normal,
            Tie = Styled(TextStyle.Bold),
            SelectedTie = Styled(TextStyle.Bold | TextStyle.Underline),
            Alignment = normal,
            CursorRow = Styled(TextStyle.Reverse),
            Header = Styled(TextStyle.Bold),
            ActiveHeader = Styled(TextStyle.Reverse | TextStyle.Bold),
            Warning = Styled(TextStyle.Bold),
            Error = Styled(TextStyle.Bold | TextStyle.Underline),
        };
    }

    private static Palette Sixteen(Attribute normal)
    {
        Color bg = normal.Background;
        return new Palette
        {
            Normal = normal,
            Dim = new Attribute(Color.DarkGray, bg),
            Strong = new Attribute(normal.Foreground, bg, TextStyle.Bold),
            Curve = new Attribute(Color.BrightGreen, bg),
            Band = new Attribute(Color.Cyan, bg),
            Gap = new Attribute(Color.DarkGray, bg),
            Disturbed = new Attribute(Color.Yellow, bg),
            Tie = new Attribute(Color.BrightYellow, bg),
            SelectedTie = new Attribute(Color.BrightMagenta, bg, TextStyle.Bold),
            Alignment = new Attribute(Color.Gray, bg),
            CursorRow = new Attribute(Color.White, Color.Blue),
            Header = new Attribute(normal.Foreground, bg, TextStyle.Bold),
            ActiveHeader = new Attribute(Color.Black, Color.BrightCyan),
            Warning = new Attribute(Color.BrightYellow, bg),
            Error = new Attribute(Color.BrightRed, bg, TextStyle.Bold),
        };
    }

    /// <summary>Every attribute of the palette, for checks over all of them.</summary>
    public IEnumerable<Attribute> All() =>
        [Normal, Dim, Strong, Curve, Band, Gap, Disturbed, Tie, SelectedTie, Alignment, CursorRow, Header, ActiveHeader, Warning, Error];
}
