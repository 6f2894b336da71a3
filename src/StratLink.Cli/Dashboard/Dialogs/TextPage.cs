using StratLink.Cli.Dashboard.Drawing;
using StratLink.Cli.Dashboard.Views;
using Terminal.Gui.Drivers;
using Terminal.Gui.Input;

namespace StratLink.Cli.Dashboard.Dialogs;

/// <summary>Read-only lines that scroll with Up/Down/PgUp/PgDn/Home/End.</summary>
public sealed class TextPage : DashView
{
    private readonly IReadOnlyList<string> _lines;

    public TextPage(IReadOnlyList<string> lines, GlyphSet glyphs) : base(glyphs)
    {
        _lines = lines;
        CanFocus = true;
    }

    public int First { get; private set; }

    protected override bool OnKeyDown(Key key)
    {
        int page = Math.Max(1, Viewport.Height - 1);
        int delta = key.KeyCode switch
        {
            KeyCode.CursorUp => -1,
            KeyCode.CursorDown => 1,
            KeyCode.PageUp => -page,
            KeyCode.PageDown or KeyCode.Space => page,
            KeyCode.Home => -_lines.Count,
            KeyCode.End => _lines.Count,
            _ => 0,
        };
        if (delta == 0) return false;
        First = Math.Clamp(First + delta, 0, Math.Max(0, _lines.Count - Viewport.Height));
        SetNeedsDraw();
        return true;
    }

    protected override bool OnDrawingContent(Terminal.Gui.ViewBase.DrawContext? context)
    {
        var pal = Colors;
        ClearViewport(pal.Normal);
        for (int i = 0; i < Viewport.Height && First + i < _lines.Count; i++)
        {
            string line = _lines[First + i];
            Put(0, i, line, line.StartsWith("##", StringComparison.Ordinal) ? pal.Header : pal.Normal, Viewport.Width);
        }
        return true;
    }
}
