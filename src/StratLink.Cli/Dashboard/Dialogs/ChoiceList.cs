using StratLink.Cli.Dashboard.Drawing;
using StratLink.Cli.Dashboard.Views;
using Terminal.Gui.Drivers;
using Terminal.Gui.Input;

namespace StratLink.Cli.Dashboard.Dialogs;

/// <summary>A focusable list of options: Up/Down select, Enter (or the option's number) chooses.</summary>
public sealed class ChoiceList : DashView
{
    private readonly IReadOnlyList<string> _options;
    private readonly ListSelection _selection = new();

    public ChoiceList(IReadOnlyList<string> options, int initial, GlyphSet glyphs) : base(glyphs)
    {
        _options = options;
        _selection.Move(initial, options.Count);
        CanFocus = true;
    }

    public int Selected => _selection.Selected;

    /// <summary>Raised with the chosen index.</summary>
    public event Action<int>? Chosen;

    protected override bool OnKeyDown(Key key)
    {
        switch (key.KeyCode)
        {
            case KeyCode.CursorUp: _selection.Move(-1, _options.Count); SetNeedsDraw(); return true;
            case KeyCode.CursorDown: _selection.Move(1, _options.Count); SetNeedsDraw(); return true;
            case KeyCode.Enter: Chosen?.Invoke(_selection.Selected); return true;
        }
        if (key.TryGetPrintableRune(out var r) && r.Value is >= '1' and <= '9' && r.Value - '1' < _options.Count)
        {
            Chosen?.Invoke(r.Value - '1');
            return true;
        }
        return false;
    }

    protected override bool OnDrawingContent(Terminal.Gui.ViewBase.DrawContext? context)
    {
        var pal = Colors;
        ClearViewport(pal.Normal);
        int rows = Viewport.Height;
        _selection.Fit(_options.Count, rows);
        for (int i = 0; i < rows && _selection.First + i < _options.Count; i++)
        {
            int index = _selection.First + i;
            string prefix = index < 9 ? $"{index + 1} " : "  ";
            Put(0, i, Fit(prefix + _options[index], Viewport.Width), index == _selection.Selected ? pal.CursorRow : pal.Normal);
        }
        return true;
    }
}
