using Terminal.Gui.Drawing;
using Attribute = Terminal.Gui.Drawing.Attribute;

namespace StratLink.Cli.Dashboard.Views;

/// <summary>The dashboard's colours, all on the theme's normal background so they read on dark and light terminals.</summary>
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

    public static Palette From(Attribute normal)
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
}
