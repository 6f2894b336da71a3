using StratLink.Cli.Dashboard.Drawing;
using StratLink.Cli.Dashboard.Keys;

namespace StratLink.Cli.Dashboard.Views;

/// <summary>The bottom row: the keys that work on the shown screen, from the key table, as many as fit.</summary>
public sealed class KeyLine : DashView
{
    public KeyLine(GlyphSet glyphs) : base(glyphs) => Height = 1;

    public Screen Current { get; set; }

    protected override bool OnDrawingContent(Terminal.Gui.ViewBase.DrawContext? context)
    {
        var pal = Colors;
        ClearViewport(pal.Normal);
        Put(0, 0, " " + KeyTable.StatusLine(Current, Viewport.Width - 1), pal.Dim);
        return true;
    }
}
